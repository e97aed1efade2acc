/**
 * Surfaces: natural convection correlations (Churchill & Chu 1975, as printed in Incropera et
 * al., ch. 9), air properties from Incropera Table A.4 (from memory, references.md), radiation
 * with the CODATA 2018 Stefan–Boltzmann constant, and the IEC 60287-2-1 free-air iteration.
 * Hand-worked references show their arithmetic in the notes; every intermediate figure was
 * evaluated step by step from the published formula, not by the product's code.
 */
import type { VerificationCase } from '../types';

/** CODATA 2018 recommended value, exact in the 2019 SI (references.md). */
const SIGMA_CODATA_2018 = 5.670374419e-8;

const churchillChuCylinder: VerificationCase = {
  id: 'churchill-chu-horizontal-cylinder',
  title: 'Churchill–Chu, long horizontal cylinder: Nusselt number at Ra_D = 10⁶, Pr = 0.707',
  area: 'convection',
  source: { kind: 'textbook', citation: 'Churchill & Chu (1975); Incropera et al., eq. 9.34: Nu_D = {0.60 + 0.387Ra^⅙/[1 + (0.559/Pr)^(9/16)]^(8/27)}²' },
  inputs: [
    { name: 'Ra_D', value: 1e6 },
    { name: 'Pr', value: 0.707 },
  ],
  notes:
    '0.559/0.707 = 0.790665; ^(9/16) = 0.876235; (1 + 0.876235)^(8/27) = 1.20496; Ra^⅙ = 10; 0.387·10 = 3.87; ' +
    '3.87/1.20496 = 3.21171; (0.60 + 3.21171)² = 14.5292 (to 8 digits 14.529169).',
  quantities: [{ key: 'nusselt', label: 'Nu_D', unit: '', reference: 14.529169, tolerance: { kind: 'relative', value: 1e-6 } }],
  compute(lib) {
    return { values: { nusselt: lib.churchillChuHorizontalCylinder(1e6, 0.707) } };
  },
};

const churchillChuPlate: VerificationCase = {
  id: 'churchill-chu-vertical-plate',
  title: 'Churchill–Chu, vertical plate: Nusselt number at Ra_L = 10⁸, Pr = 0.707',
  area: 'convection',
  source: { kind: 'textbook', citation: 'Churchill & Chu (1975); Incropera et al., eq. 9.26: Nu_L = {0.825 + 0.387Ra^⅙/[1 + (0.492/Pr)^(9/16)]^(8/27)}²' },
  inputs: [
    { name: 'Ra_L', value: 1e8 },
    { name: 'Pr', value: 0.707 },
  ],
  notes:
    '0.492/0.707 = 0.695898; ^(9/16) = 0.815515; (1 + 0.815515)^(8/27) = 1.19328; Ra^⅙ = 21.5443; 0.387·21.5443 = 8.33766; ' +
    '8.33766/1.19328 = 6.98721; (0.825 + 6.98721)² = 61.0306 (to 8 digits 61.030577).',
  quantities: [{ key: 'nusselt', label: 'Nu_L', unit: '', reference: 61.030577, tolerance: { kind: 'relative', value: 1e-6 } }],
  compute(lib) {
    return { values: { nusselt: lib.churchillChuVerticalPlate(1e8, 0.707) } };
  },
};

// Film temperatures chosen to land on the 300 K and 350 K rows of the air table, so that the
// hand calculation needs no interpolation: (36.85 + 16.85)/2 + 273.15 = 300 K.
const cylinderInAir: VerificationCase = {
  id: 'horizontal-cylinder-coefficient-air',
  title: 'Horizontal cylinder in still air: convection coefficient at a 300 K film',
  area: 'convection',
  source: {
    kind: 'from memory',
    fromMemory: true,
    citation: 'Churchill & Chu (1975), Incropera eq. 9.34; air at 300 K from Incropera Table A.4 (from memory: k = 0.0263, ν = 15.89e-6, Pr = 0.707)',
  },
  inputs: [
    { name: 'diameter D', value: 0.04, unit: 'm' },
    { name: 'surface', value: 36.85, unit: '°C' },
    { name: 'air', value: 16.85, unit: '°C' },
    { name: 'g', value: 9.80665, unit: 'm/s²' },
  ],
  notes:
    'T_film = 300 K, β = 1/300 K⁻¹, α = ν/Pr = 15.89e-6/0.707 = 2.24752e-5 m²/s; Ra = gβΔT·D³/(να) = 9.80665·(1/300)·20·0.04³/(15.89e-6·2.24752e-5) = 117160.4; ' +
    'Ra^⅙ = 6.99515; Nu = {0.60 + 0.387·6.99515/1.20496}² = {0.60 + 2.24665}² = 8.10337; h = Nu·k/D = 8.10337·0.0263/0.04 = 5.32796 W/(m²·K).',
  quantities: [{ key: 'h', label: 'convection coefficient h', unit: 'W/(m²·K)', reference: 5.3279646, tolerance: { kind: 'relative', value: 1e-6 } }],
  compute(lib) {
    const e = lib.evaluateConvection({ kind: 'horizontal-cylinder', diameter: 0.04 }, 36.85, 16.85);
    return { values: { h: e.h }, details: [`Ra = ${e.rayleigh?.toPrecision(8)}, Nu = ${e.nusselt?.toPrecision(8)}, ${e.correlation}`] };
  },
};

const plateInAir: VerificationCase = {
  id: 'vertical-plate-coefficient-air',
  title: 'Vertical plate (bar on edge) in still air: convection coefficient at a 350 K film',
  area: 'convection',
  source: {
    kind: 'from memory',
    fromMemory: true,
    citation: 'Churchill & Chu (1975), Incropera eq. 9.26; air at 350 K from Incropera Table A.4 (from memory: k = 0.0300, ν = 20.92e-6, Pr = 0.700)',
  },
  inputs: [
    { name: 'height L', value: 0.1, unit: 'm' },
    { name: 'surface', value: 96.85, unit: '°C' },
    { name: 'air', value: 56.85, unit: '°C' },
    { name: 'g', value: 9.80665, unit: 'm/s²' },
  ],
  notes:
    'T_film = 350 K, β = 1/350 K⁻¹, α = 20.92e-6/0.700 = 2.98857e-5 m²/s; Ra = 9.80665·(1/350)·40·0.1³/(20.92e-6·2.98857e-5) = 1.792616e6; ' +
    '(0.492/0.700)^(9/16) = 0.820092; (1 + 0.820092)^(8/27) = 1.19417; Ra^⅙ = 11.0217; Nu = {0.825 + 0.387·11.0217/1.19417}² = {0.825 + 3.57189}² = 19.3324; h = 19.3324·0.0300/0.1 = 5.79971 W/(m²·K).',
  quantities: [{ key: 'h', label: 'convection coefficient h', unit: 'W/(m²·K)', reference: 5.799707, tolerance: { kind: 'relative', value: 1e-6 } }],
  compute(lib) {
    const e = lib.evaluateConvection({ kind: 'vertical-plate', height: 0.1 }, 96.85, 56.85);
    return { values: { h: e.h }, details: [`Ra = ${e.rayleigh?.toPrecision(8)}, Nu = ${e.nusselt?.toPrecision(8)}, ${e.correlation}`] };
  },
};

const radiationCoefficientCase: VerificationCase = {
  id: 'radiation-coefficient',
  title: 'Radiation coefficient h_r = εσ(T_s + T_sur)(T_s² + T_sur²) with σ from CODATA 2018',
  area: 'radiation',
  source: { kind: 'exact constant', citation: 'σ = 5.670374419e-8 W/(m²·K⁴), CODATA 2018 (exact in the 2019 SI); Incropera et al. §1.2.3 for h_r' },
  inputs: [
    { name: 'emissivity ε', value: 0.9 },
    { name: 'surface', value: 80, unit: '°C' },
    { name: 'surroundings', value: 30, unit: '°C' },
  ],
  notes:
    'T_s = 353.15 K, T_sur = 303.15 K; T_s + T_sur = 656.3 K; T_s² + T_sur² = 216614.845 K²; ' +
    'h_r = 0.9 · 5.670374419e-8 · 656.3 · 216614.845 = 7.255124452 W/(m²·K).',
  quantities: [
    { key: 'sigma', label: 'Stefan–Boltzmann constant used', unit: 'W/(m²·K⁴)', reference: SIGMA_CODATA_2018, tolerance: { kind: 'relative', value: 1e-12 } },
    { key: 'hr', label: 'radiation coefficient h_r', unit: 'W/(m²·K)', reference: 7.255124452, tolerance: { kind: 'relative', value: 1e-9 } },
  ],
  compute(lib) {
    return { values: { sigma: lib.stefanBoltzmann, hr: lib.radiationCoefficient({ emissivity: 0.9, surfaceC: 80, surroundingsC: 30 }) } };
  },
};

const radiativeFluxCase: VerificationCase = {
  id: 'radiative-flux',
  title: 'Net radiative flux εσ(T_s⁴ − T_sur⁴) of a grey surface',
  area: 'radiation',
  source: { kind: 'exact constant', citation: 'Incropera et al. §1.2.3; σ from CODATA 2018' },
  inputs: [
    { name: 'emissivity ε', value: 0.9 },
    { name: 'surface', value: 80, unit: '°C' },
    { name: 'surroundings', value: 30, unit: '°C' },
  ],
  notes: 'T_s⁴ = 353.15⁴ = 1.555381189e10 K⁴; T_sur⁴ = 303.15⁴ = 8.445595756e9 K⁴; q = 0.9 · 5.670374419e-8 · (difference) = 362.7562226 W/m² (= h_r·ΔT = 7.255124452·50).',
  quantities: [{ key: 'flux', label: 'net flux leaving', unit: 'W/m²', reference: 362.7562226, tolerance: { kind: 'relative', value: 1e-9 } }],
  compute(lib) {
    return { values: { flux: lib.radiativeFlux({ emissivity: 0.9, surfaceC: 80, surroundingsC: 30 }) } };
  },
};

// A plate heated on one face that loses heat only by radiation: in steady state the radiated
// flux equals the flux put in, so T_s = (q/(εσ) + T_sur⁴)^¼ exactly, and the heated face is
// hotter by qL/k. It checks the solver's linearised radiation boundary and outer iteration.
const plate = { thicknessM: 0.01, conductivity: 50, fluxIn: 500, emissivity: 0.8, surroundingsC: 20 };
const plateSurfaceK = (plate.fluxIn / (plate.emissivity * SIGMA_CODATA_2018) + (plate.surroundingsC + 273.15) ** 4) ** 0.25;
const radiatingPlate: VerificationCase = {
  id: 'radiating-plate-solver',
  title: 'Heat balance: a plate heated on one face and cooled by radiation alone',
  area: 'radiation',
  source: { kind: 'textbook', citation: 'Energy balance of a grey surface, Incropera et al. §1.3: q″ = εσ(T_s⁴ − T_sur⁴); conduction q″L/k across the plate (§3.1)' },
  inputs: [
    { name: 'thickness', value: plate.thicknessM, unit: 'm' },
    { name: 'conductivity', value: plate.conductivity, unit: 'W/(m·K)' },
    { name: 'flux into the heated face', value: plate.fluxIn, unit: 'W/m²' },
    { name: 'emissivity', value: plate.emissivity },
    { name: 'surroundings', value: plate.surroundingsC, unit: '°C' },
  ],
  notes: `T_s = (q/(εσ) + T_sur⁴)^¼ = (500/(0.8·σ) + 293.15⁴)^¼ = ${plateSurfaceK.toPrecision(9)} K; heated face T_s + qL/k = T_s + 0.1 K.`,
  quantities: [
    { key: 'surface', label: 'radiating surface temperature', unit: '°C', reference: plateSurfaceK - 273.15, tolerance: { kind: 'absolute', value: 1e-4 } },
    { key: 'heated', label: 'heated face temperature', unit: '°C', reference: plateSurfaceK - 273.15 + (plate.fluxIn * plate.thicknessM) / plate.conductivity, tolerance: { kind: 'absolute', value: 1e-4 } },
  ],
  compute(lib) {
    const r = lib.solveSteady({
      geometry: { kind: 'slab', layers: [{ thickness: plate.thicknessM, conductivity: plate.conductivity, cells: 10 }] },
      source: { kind: 'uniform', q: 0 },
      inner: { kind: 'flux', value: plate.fluxIn },
      outer: { kind: 'surface', ambient: plate.surroundingsC, emissivity: plate.emissivity },
    });
    if (!r.converged) throw new Error('the solver did not converge');
    return {
      values: { surface: r.faceTemperatures.outer, heated: r.faceTemperatures.inner },
      details: [`${r.iterations} outer iterations; h_r at the end ${r.surface.outer?.hRad.toPrecision(6)} W/(m²·K)`],
    };
  },
};

// IEC 60287-2-1 free air: Δθ = W·T_int + Δθs with W = πD_e·h·Δθs^(5/4) gives, for x = Δθs^¼,
// x⁴(1 + K_A·x) = Δθ (K_A = πD_e·h·T_int). The reference solves that equation by bisection.
const freeAir = { diameterM: 0.03, conductorRiseK: 60, internalKmPerW: 0.5, Z: 0.21, E: 3.94, g: 0.6 };
const freeAirCoefficient = freeAir.Z / freeAir.diameterM ** freeAir.g + freeAir.E;
const freeAirKA = Math.PI * freeAir.diameterM * freeAirCoefficient * freeAir.internalKmPerW;
function freeAirRootByBisection(): number {
  let lo = 0;
  let hi = freeAir.conductorRiseK ** 0.25;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid ** 4 * (1 + freeAirKA * mid) > freeAir.conductorRiseK) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}
const freeAirSurfaceRise = freeAirRootByBisection() ** 4;
const iecFreeAir: VerificationCase = {
  id: 'iec60287-free-air-surface-rise',
  title: 'IEC 60287-2-1 cable in free air: surface temperature rise Δθs',
  area: 'convection',
  source: {
    kind: 'from memory',
    fromMemory: true,
    citation: 'IEC 60287-2-1, cables in free air: h = Z/D_e^g + E and the (Δθs)^¼ iteration; single cable Z = 0.21, E = 3.94, g = 0.60 (from memory)',
  },
  inputs: [
    { name: 'external diameter D_e', value: freeAir.diameterM, unit: 'm' },
    { name: 'conductor rise Δθ', value: freeAir.conductorRiseK, unit: 'K' },
    { name: 'internal thermal resistance', value: freeAir.internalKmPerW, unit: 'K·m/W' },
    { name: 'Z, E, g', value: `${freeAir.Z}, ${freeAir.E}, ${freeAir.g}` },
  ],
  notes:
    `h = Z/D_e^g + E = ${freeAirCoefficient.toPrecision(6)} W/(m²·K^(5/4)); K_A = πD_e·h·T_int = ${freeAirKA.toPrecision(6)}; ` +
    `the fixed point satisfies x⁴(1 + K_A·x) = Δθ with x = Δθs^¼, solved here by bisection: Δθs = ${freeAirSurfaceRise.toPrecision(8)} K.`,
  quantities: [{ key: 'rise', label: 'surface rise Δθs', unit: 'K', reference: freeAirSurfaceRise, tolerance: { kind: 'relative', value: 1e-9 } }],
  compute(lib) {
    const r = lib.iecFreeAirSurfaceRise({
      externalDiameterM: freeAir.diameterM,
      conductorRiseK: freeAir.conductorRiseK,
      internalThermalResistanceKmPerW: freeAir.internalKmPerW,
      Z: freeAir.Z,
      E: freeAir.E,
      g: freeAir.g,
    });
    return { values: { rise: r.surfaceRiseK }, details: [`${r.iterations} iterations of the (Δθs)^¼ update`] };
  },
};

export const surfaceCases: VerificationCase[] = [
  churchillChuCylinder,
  churchillChuPlate,
  cylinderInAir,
  plateInAir,
  iecFreeAir,
  radiationCoefficientCase,
  radiativeFluxCase,
  radiatingPlate,
];

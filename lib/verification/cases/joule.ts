/**
 * A conductor whose resistance rises with temperature, R(T) = R₂₀[1 + α(T − 20)], behind a
 * constant thermal resistance R_th to an ambient T_a (references.md closed form, the structure of
 * IEC 60287-1-1 eq. (1) without dielectric or sheath losses):
 *   T_c = (T_a + I²R₂₀R_th(1 − 20α))/(1 − I²R₂₀αR_th),   runaway at I_r = 1/√(R₂₀αR_th).
 * The closed form takes the conductor as isothermal: the case idealises its conductivity
 * (k = 1e6 W/(m·K)) so that its own temperature drop, q'/(4πk) ≈ 1e-5 K, is negligible.
 */
import type { ProductLibrary } from '../library';
import type { VerificationCase } from '../types';

const c = {
  radiusM: 0.01,
  conductivity: 1e6,
  rho20: 1.7241e-8, // IEC 60287-1-1 Table 1, copper
  alpha20: 3.93e-3, // IEC 60287-1-1 Table 1, copper
  h: 10,
  ambientC: 30,
};
const areaM2 = Math.PI * c.radiusM ** 2;
const r20 = c.rho20 / areaM2; // Ω/m
const rTh = 1 / (2 * Math.PI * c.radiusM * c.h); // K·m/W, surface resistance (Incropera §3.3.1)
const runawayA = 1 / Math.sqrt(r20 * c.alpha20 * rTh);
function coreTemperature(currentA: number): number {
  const x = currentA * currentA * r20 * rTh;
  return (c.ambientC + x * (1 - 20 * c.alpha20)) / (1 - x * c.alpha20);
}

function solveAt(lib: ProductLibrary, currentA: number) {
  return lib.solveSteady({
    geometry: { kind: 'cylinder', layers: [{ thickness: c.radiusM, conductivity: c.conductivity, generating: true, cells: 20 }] },
    source: { kind: 'joule', current: currentA, area: areaM2, rho20: c.rho20, alpha20: c.alpha20 },
    inner: { kind: 'symmetry' },
    outer: { kind: 'surface', ambient: c.ambientC, h: c.h },
  });
}

const commonInputs = [
  { name: 'conductor radius', value: c.radiusM, unit: 'm' },
  { name: 'ρ₂₀ (copper, IEC 60287-1-1 Table 1)', value: c.rho20, unit: 'Ω·m' },
  { name: 'α₂₀ (copper, IEC 60287-1-1 Table 1)', value: c.alpha20, unit: '1/K' },
  { name: 'surface h (R_th = 1/(2πr h))', value: c.h, unit: 'W/(m²·K)' },
  { name: 'ambient T_a', value: c.ambientC, unit: '°C' },
  { name: 'conductor conductivity (idealised)', value: c.conductivity, unit: 'W/(m·K)' },
];
const arithmetic = `R₂₀ = ρ₂₀/(πr²) = ${r20.toPrecision(6)} Ω/m; R_th = ${rTh.toPrecision(6)} K·m/W; I_r = 1/√(R₂₀αR_th) = ${runawayA.toPrecision(7)} A.`;
const source = {
  kind: 'textbook' as const,
  citation: 'Closed form worked by hand: conductor with R(T) behind a constant R_th (IEC 60287-1-1 eq. (1) structure, W_d = 0, λ = 0)',
};

const designCurrentA = 1000;
const coreCase: VerificationCase = {
  id: 'joule-core-temperature',
  title: 'Conductor with R(T) behind a constant thermal resistance: core temperature at 1000 A',
  area: 'joule-runaway',
  source,
  inputs: [...commonInputs, { name: 'current', value: designCurrentA, unit: 'A' }],
  notes: `${arithmetic} I²R₂₀R_th = ${(designCurrentA ** 2 * r20 * rTh).toPrecision(6)} K; T_c = (T_a + I²R₂₀R_th(1 − 20α))/(1 − I²R₂₀αR_th) = ${coreTemperature(designCurrentA).toPrecision(8)} °C.`,
  quantities: [
    { key: 'hotSpot', label: 'conductor temperature', unit: '°C', reference: coreTemperature(designCurrentA), tolerance: { kind: 'absolute', value: 1e-3 } },
    {
      key: 'heat',
      label: 'Joule heat per metre I²R(T_c)',
      unit: 'W/m',
      reference: designCurrentA ** 2 * r20 * (1 + c.alpha20 * (coreTemperature(designCurrentA) - 20)),
      tolerance: { kind: 'relative', value: 1e-6 },
    },
  ],
  compute(lib) {
    const r = solveAt(lib, designCurrentA);
    if (!r.converged) throw new Error('the solver did not converge');
    return {
      values: { hotSpot: r.hotSpot.temperature, heat: r.heatGeneratedWPerM ?? Number.NaN },
      details: [`linearisation ${r.linearisation}, ${r.iterations} outer iterations`],
    };
  },
};

const onsetCase: VerificationCase = {
  id: 'joule-runaway-onset',
  title: 'Runaway onset current of a conductor with R(T) behind a constant thermal resistance',
  area: 'joule-runaway',
  source,
  inputs: [...commonInputs, { name: 'current solved (any steady one)', value: designCurrentA, unit: 'A' }],
  notes: `${arithmetic} The solver reports the onset of its discrete model beside every converged result with temperature-independent surroundings.`,
  quantities: [{ key: 'onset', label: 'runaway onset current', unit: 'A', reference: runawayA, tolerance: { kind: 'relative', value: 1e-4 } }],
  compute(lib) {
    const r = solveAt(lib, designCurrentA);
    return { values: { onset: r.runawayOnsetCurrentA ?? Number.NaN } };
  },
};

const beyondCurrentA = Math.round(1.05 * runawayA);
const beyondCase: VerificationCase = {
  id: 'joule-runaway-beyond-onset',
  title: 'Above the onset current: no steady state is reported, only the onset',
  area: 'joule-runaway',
  source,
  inputs: [...commonInputs, { name: 'current (5 % above onset)', value: beyondCurrentA, unit: 'A' }],
  notes: `${arithmetic} Above I_r the denominator 1 − I²R₂₀αR_th is negative: no steady state exists, so a correct solver reports no temperature at all.`,
  quantities: [
    { key: 'temperatures', label: 'temperatures reported', unit: 'nodes', reference: 0, tolerance: { kind: 'absolute', value: 0 } },
    { key: 'runaway', label: 'runaway reported (1 = yes)', unit: '', reference: 1, tolerance: { kind: 'absolute', value: 0 } },
    { key: 'onset', label: 'onset current reported with the runaway', unit: 'A', reference: runawayA, tolerance: { kind: 'relative', value: 1e-4 } },
  ],
  compute(lib) {
    const r = solveAt(lib, beyondCurrentA);
    return {
      values: { temperatures: r.temperatures.length, runaway: r.runaway && !r.converged ? 1 : 0, onset: r.runaway?.current ?? Number.NaN },
      details: [`converged: ${r.converged}; runaway criterion: ${r.runaway?.criterion ?? 'none'}`],
    };
  },
};

export const jouleCases: VerificationCase[] = [coreCase, onsetCase, beyondCase];

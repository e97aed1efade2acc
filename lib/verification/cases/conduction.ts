/**
 * Finite-volume heat balance against textbook closed forms (references.md, "Closed-form
 * solutions"): Incropera, DeWitt, Bergman & Lavine, *Fundamentals of Heat and Mass Transfer*,
 * §3.3.1 (conduction through cylindrical layers), §3.5.1 (plane wall with generation), §3.5.2
 * (solid cylinder with generation). Every field case shows its profile and a grid-convergence
 * study, whose observed order is compared with the second order of the cell-centred scheme.
 */
import type { ProductLibrary } from '../library';
import { convergenceStudy, maxNodalError, profileComparison, type FieldSolve } from '../field';
import type { VerificationCase } from '../types';

const CONVERGENCE_CELLS = [10, 20, 40, 80, 160];
const ORDER_TOLERANCE = { kind: 'absolute', value: 0.1 } as const;

function solved(result: { converged: boolean; positions: number[]; temperatures: number[] }): FieldSolve {
  if (!result.converged) throw new Error('the solver did not converge');
  return { positions: result.positions, temperatures: result.temperatures };
}

// ── Plane wall with uniform generation, faces at T1 and T2 (Incropera §3.5.1) ──────────────────
const wall = { halfThicknessM: 0.01, conductivity: 1, generation: 1e6, t1C: 20, t2C: 40, cells: 60 };
/** T(x) with x measured from the inner face (the solver's coordinate), ξ = x − L. */
function wallExact(x: number): number {
  const { halfThicknessM: L, conductivity: k, generation: q, t1C, t2C } = wall;
  const xi = x - L;
  return ((q * L * L) / (2 * k)) * (1 - (xi * xi) / (L * L)) + ((t2C - t1C) / 2) * (xi / L) + (t1C + t2C) / 2;
}
function solveWall(lib: ProductLibrary, cells: number) {
  return lib.solveSteady({
    geometry: { kind: 'slab', layers: [{ thickness: 2 * wall.halfThicknessM, conductivity: wall.conductivity, generating: true, cells }] },
    source: { kind: 'uniform', q: wall.generation },
    inner: { kind: 'temperature', value: wall.t1C },
    outer: { kind: 'temperature', value: wall.t2C },
  });
}

const planeWall: VerificationCase = {
  id: 'plane-wall-generation',
  title: 'Plane wall with uniform generation, faces at different temperatures',
  area: 'conduction',
  field: true,
  source: { kind: 'textbook', citation: 'Incropera et al., Fundamentals of Heat and Mass Transfer, §3.5.1 (plane wall with generation)' },
  inputs: [
    { name: 'thickness 2L', value: 2 * wall.halfThicknessM, unit: 'm' },
    { name: 'conductivity k', value: wall.conductivity, unit: 'W/(m·K)' },
    { name: "generation q'''", value: wall.generation, unit: 'W/m³' },
    { name: 'inner face T₁', value: wall.t1C, unit: '°C' },
    { name: 'outer face T₂', value: wall.t2C, unit: '°C' },
    { name: 'cells across', value: wall.cells },
  ],
  notes:
    "T(x) = q'''L²/(2k)·(1 − x²/L²) + (T₂ − T₁)/2·x/L + (T₁ + T₂)/2 on x ∈ [−L, L]; q'''L²/k = 100 K. " +
    'The half-cell boundary flux of a cell-centred scheme does not reproduce a parabola, so the nodal error is of second order and not zero: ' +
    'a few hundredths of a kelvin at 60 cells (Patankar 1980, second-order cell-centred scheme). Heat leaving both faces together equals 2Lq\'\'\' exactly.',
  quantities: [
    { key: 'maxError', label: 'largest nodal error against the closed form, 60 cells', unit: 'K', reference: 0, tolerance: { kind: 'absolute', value: 0.05 } },
    { key: 'heatOut', label: 'heat leaving both faces', unit: 'W/m²', reference: 2 * wall.halfThicknessM * wall.generation, tolerance: { kind: 'relative', value: 1e-6 } },
    { key: 'order', label: 'observed order of the nodal error', unit: '', reference: 2, tolerance: ORDER_TOLERANCE },
  ],
  compute(lib) {
    const result = solveWall(lib, wall.cells);
    const field = solved(result);
    const convergence = convergenceStudy(CONVERGENCE_CELLS, (n) => solved(solveWall(lib, n)), wallExact);
    return {
      values: {
        maxError: maxNodalError(field.positions, field.temperatures, wallExact),
        heatOut: result.heatBalance.leavingInner + result.heatBalance.leavingOuter,
        order: convergence.measuredOrder,
      },
      profile: profileComparison(field, wallExact, { from: 0, to: 2 * wall.halfThicknessM }, 'x from the inner face (m)', wall.cells),
      convergence,
      details: [`${result.iterations} outer iteration(s), energy residual ${result.energyResidual.toExponential(2)}`],
    };
  },
};

// ── Solid cylinder with uniform generation, surface at T_s (Incropera §3.5.2) ──────────────────
const rod = { radiusM: 0.01, conductivity: 1, generation: 2e6, surfaceC: 30, cells: 60 };
function rodExact(r: number): number {
  return rod.surfaceC + ((rod.generation * rod.radiusM ** 2) / (4 * rod.conductivity)) * (1 - (r * r) / rod.radiusM ** 2);
}
function solveRod(lib: ProductLibrary, cells: number) {
  return lib.solveSteady({
    geometry: { kind: 'cylinder', layers: [{ thickness: rod.radiusM, conductivity: rod.conductivity, generating: true, cells }] },
    source: { kind: 'uniform', q: rod.generation },
    inner: { kind: 'symmetry' },
    outer: { kind: 'temperature', value: rod.surfaceC },
  });
}

const solidCylinder: VerificationCase = {
  id: 'solid-cylinder-generation',
  title: 'Solid cylinder with uniform generation, surface at a fixed temperature',
  area: 'conduction',
  field: true,
  source: { kind: 'textbook', citation: 'Incropera et al., Fundamentals of Heat and Mass Transfer, §3.5.2 (radial systems with generation)' },
  inputs: [
    { name: 'radius r₀', value: rod.radiusM, unit: 'm' },
    { name: 'conductivity k', value: rod.conductivity, unit: 'W/(m·K)' },
    { name: "generation q'''", value: rod.generation, unit: 'W/m³' },
    { name: 'surface T_s', value: rod.surfaceC, unit: '°C' },
    { name: 'cells across the radius', value: rod.cells },
  ],
  notes: "T(r) = T_s + q'''r₀²/(4k)·(1 − r²/r₀²): centre rise 50 K. Heat per metre leaving the surface is q'''πr₀² exactly.",
  quantities: [
    { key: 'maxError', label: 'largest nodal error against the closed form, 60 cells', unit: 'K', reference: 0, tolerance: { kind: 'absolute', value: 0.05 } },
    { key: 'heatOut', label: 'heat per metre leaving the surface', unit: 'W/m', reference: rod.generation * Math.PI * rod.radiusM ** 2, tolerance: { kind: 'relative', value: 1e-6 } },
    { key: 'order', label: 'observed order of the nodal error', unit: '', reference: 2, tolerance: ORDER_TOLERANCE },
  ],
  compute(lib) {
    const result = solveRod(lib, rod.cells);
    const field = solved(result);
    const convergence = convergenceStudy(CONVERGENCE_CELLS, (n) => solved(solveRod(lib, n)), rodExact);
    return {
      values: {
        maxError: maxNodalError(field.positions, field.temperatures, rodExact),
        heatOut: result.heatBalance.leavingOuter,
        order: convergence.measuredOrder,
      },
      profile: profileComparison(field, rodExact, { from: 0, to: rod.radiusM }, 'radius r (m)', rod.cells),
      convergence,
    };
  },
};

// ── Generating core inside an insulating layer with a surface conductance (Incropera §3.3.1 + §3.5.2) ──
const core = { coreRadiusM: 0.01, coreConductivity: 1, insulationThicknessM: 0.005, insulationConductivity: 0.25, generation: 2e5, h: 10, ambientC: 30, cells: 40 };
const coreOuterRadius = core.coreRadiusM + core.insulationThicknessM;
const coreHeatPerMetre = core.generation * Math.PI * core.coreRadiusM ** 2;
const insulationResistance = Math.log(coreOuterRadius / core.coreRadiusM) / (2 * Math.PI * core.insulationConductivity);
const surfaceResistance = 1 / (2 * Math.PI * coreOuterRadius * core.h);
const coreInterfaceC = core.ambientC + coreHeatPerMetre * (insulationResistance + surfaceResistance);
function compositeExact(r: number): number {
  if (r <= core.coreRadiusM) {
    return coreInterfaceC + (core.generation * (core.coreRadiusM ** 2 - r * r)) / (4 * core.coreConductivity);
  }
  return coreInterfaceC - (coreHeatPerMetre * Math.log(r / core.coreRadiusM)) / (2 * Math.PI * core.insulationConductivity);
}
function solveComposite(lib: ProductLibrary, cells: number) {
  return lib.solveSteady({
    geometry: {
      kind: 'cylinder',
      layers: [
        { thickness: core.coreRadiusM, conductivity: core.coreConductivity, generating: true, cells },
        { thickness: core.insulationThicknessM, conductivity: core.insulationConductivity, cells: Math.max(1, Math.round(cells / 2)) },
      ],
    },
    source: { kind: 'uniform', q: core.generation },
    inner: { kind: 'symmetry' },
    outer: { kind: 'surface', ambient: core.ambientC, h: core.h },
  });
}

const compositeCylinder: VerificationCase = {
  id: 'composite-cylinder',
  title: 'Generating core in an insulating layer, surface conductance to ambient',
  area: 'conduction',
  field: true,
  source: {
    kind: 'textbook',
    citation: "Incropera et al., §3.5.2 (core with generation) in series with §3.3.1 (R' = ln(r₂/r₁)/(2πk), surface R' = 1/(2πr₂h))",
  },
  inputs: [
    { name: 'core radius r_c', value: core.coreRadiusM, unit: 'm' },
    { name: 'core conductivity', value: core.coreConductivity, unit: 'W/(m·K)' },
    { name: 'insulation thickness', value: core.insulationThicknessM, unit: 'm' },
    { name: 'insulation conductivity', value: core.insulationConductivity, unit: 'W/(m·K)' },
    { name: "generation q'''", value: core.generation, unit: 'W/m³' },
    { name: 'surface h', value: core.h, unit: 'W/(m²·K)' },
    { name: 'ambient', value: core.ambientC, unit: '°C' },
    { name: 'cells in the core (half as many in the insulation)', value: core.cells },
  ],
  notes:
    `q' = q'''πr_c² = ${coreHeatPerMetre.toPrecision(6)} W/m; R'_ins = ln(r₂/r_c)/(2πk) = ${insulationResistance.toPrecision(6)} K·m/W; ` +
    `R'_s = 1/(2πr₂h) = ${surfaceResistance.toPrecision(6)} K·m/W; interface T = T∞ + q'(R'_ins + R'_s) = ${coreInterfaceC.toPrecision(6)} °C; ` +
    "centre T = interface + q'''r_c²/(4k_c). The core conductivity is low on purpose, so that the core's own parabola (the only source of discretisation error) is large enough to measure.",
  quantities: [
    { key: 'maxError', label: 'largest nodal error against the closed form, 40 + 20 cells', unit: 'K', reference: 0, tolerance: { kind: 'absolute', value: 0.02 } },
    { key: 'surface', label: 'surface temperature', unit: '°C', reference: compositeExact(coreOuterRadius), tolerance: { kind: 'absolute', value: 1e-6 } },
    { key: 'order', label: 'observed order of the nodal error', unit: '', reference: 2, tolerance: ORDER_TOLERANCE },
  ],
  compute(lib) {
    const result = solveComposite(lib, core.cells);
    const field = solved(result);
    const convergence = convergenceStudy(CONVERGENCE_CELLS, (n) => solved(solveComposite(lib, n)), compositeExact);
    return {
      values: {
        maxError: maxNodalError(field.positions, field.temperatures, compositeExact),
        surface: result.surfaceTemperature,
        order: convergence.measuredOrder,
      },
      profile: profileComparison(field, compositeExact, { from: 0, to: coreOuterRadius }, 'radius r (m)', core.cells),
      convergence,
    };
  },
};

// ── Conduction only: two cylindrical layers and a surface (Incropera §3.3.1) ───────────────────
const pipe = { innerRadiusM: 0.01, layers: [{ t: 0.004, k: 0.25 }, { t: 0.003, k: 0.2 }], innerC: 90, h: 8, ambientC: 30 };
const pipeOuter = pipe.innerRadiusM + pipe.layers[0].t + pipe.layers[1].t;
const pipeResistance =
  Math.log((pipe.innerRadiusM + pipe.layers[0].t) / pipe.innerRadiusM) / (2 * Math.PI * pipe.layers[0].k) +
  Math.log(pipeOuter / (pipe.innerRadiusM + pipe.layers[0].t)) / (2 * Math.PI * pipe.layers[1].k) +
  1 / (2 * Math.PI * pipeOuter * pipe.h);
const pipeHeat = (pipe.innerC - pipe.ambientC) / pipeResistance;

const cylindricalLayers: VerificationCase = {
  id: 'cylindrical-layers-conduction',
  title: 'Two cylindrical layers and a surface conductance, no generation',
  area: 'conduction',
  source: { kind: 'textbook', citation: "Incropera et al., §3.3.1: R' = ln(r₂/r₁)/(2πk) per layer, R' = 1/(2πr h) at the surface, in series" },
  inputs: [
    { name: 'inner radius', value: pipe.innerRadiusM, unit: 'm' },
    { name: 'layer 1 thickness / conductivity', value: `${pipe.layers[0].t} m / ${pipe.layers[0].k} W/(m·K)` },
    { name: 'layer 2 thickness / conductivity', value: `${pipe.layers[1].t} m / ${pipe.layers[1].k} W/(m·K)` },
    { name: 'inner face', value: pipe.innerC, unit: '°C' },
    { name: 'surface h', value: pipe.h, unit: 'W/(m²·K)' },
    { name: 'ambient', value: pipe.ambientC, unit: '°C' },
  ],
  notes: `ΣR' = ${pipeResistance.toPrecision(6)} K·m/W, q' = (T_i − T∞)/ΣR'. The solver's face conductances are the same logarithms, so without a source the discrete answer is exact at any cell count (8 cells per layer here).`,
  quantities: [{ key: 'heat', label: 'heat per metre through the layers', unit: 'W/m', reference: pipeHeat, tolerance: { kind: 'relative', value: 1e-9 } }],
  compute(lib) {
    const result = lib.solveSteady({
      geometry: {
        kind: 'cylinder',
        innerRadius: pipe.innerRadiusM,
        layers: pipe.layers.map((l) => ({ thickness: l.t, conductivity: l.k, cells: 8 })),
      },
      source: { kind: 'uniform', q: 0 },
      inner: { kind: 'temperature', value: pipe.innerC },
      outer: { kind: 'surface', ambient: pipe.ambientC, h: pipe.h },
    });
    if (!result.converged) throw new Error('the solver did not converge');
    return { values: { heat: result.heatBalance.leavingOuter } };
  },
};

// ── Conduction only: composite slab (Incropera §3.1) ───────────────────────────────────────────
const slab = { layers: [{ t: 0.01, k: 401 }, { t: 0.002, k: 0.2 }], t1C: 80, t2C: 25 };
const slabResistance = slab.layers.reduce((sum, l) => sum + l.t / l.k, 0);
const slabFlux = (slab.t1C - slab.t2C) / slabResistance;
const slabInterface = slab.t1C - slabFlux * (slab.layers[0].t / slab.layers[0].k);

const compositeSlab: VerificationCase = {
  id: 'composite-slab-conduction',
  title: 'Two-layer wall (metal and coating), no generation',
  area: 'conduction',
  source: { kind: 'textbook', citation: "Incropera et al., §3.1.2: series resistances L/k per unit area, q'' = ΔT/ΣL/k" },
  inputs: [
    { name: 'layer 1 thickness / conductivity', value: `${slab.layers[0].t} m / ${slab.layers[0].k} W/(m·K)` },
    { name: 'layer 2 thickness / conductivity', value: `${slab.layers[1].t} m / ${slab.layers[1].k} W/(m·K)` },
    { name: 'inner face', value: slab.t1C, unit: '°C' },
    { name: 'outer face', value: slab.t2C, unit: '°C' },
  ],
  notes: `ΣL/k = ${slabResistance.toPrecision(6)} m²K/W; q'' = ${slabFlux.toPrecision(6)} W/m²; interface T = T₁ − q''·L₁/k₁ = ${slabInterface.toPrecision(8)} °C. Face conductances in series make a material interface exact.`,
  quantities: [
    { key: 'flux', label: 'heat flux through the wall', unit: 'W/m²', reference: slabFlux, tolerance: { kind: 'relative', value: 1e-9 } },
    { key: 'interface', label: 'temperature where the layers meet (last cell of layer 1, extrapolated linearly)', unit: '°C', reference: slabInterface, tolerance: { kind: 'absolute', value: 1e-6 } },
  ],
  compute(lib) {
    const result = lib.solveSteady({
      geometry: { kind: 'slab', layers: slab.layers.map((l) => ({ thickness: l.t, conductivity: l.k, cells: 10 })) },
      source: { kind: 'uniform', q: 0 },
      inner: { kind: 'temperature', value: slab.t1C },
      outer: { kind: 'temperature', value: slab.t2C },
    });
    if (!result.converged) throw new Error('the solver did not converge');
    // The profile is linear inside each layer: the last node of layer 1 plus the half cell's drop.
    const i = 9;
    const halfCell = slab.layers[0].t / 20;
    const flux = result.heatBalance.leavingOuter;
    return { values: { flux, interface: result.temperatures[i] - (flux * halfCell) / slab.layers[0].k } };
  },
};

export const conductionCases: VerificationCase[] = [planeWall, solidCylinder, compositeCylinder, cylindricalLayers, compositeSlab];

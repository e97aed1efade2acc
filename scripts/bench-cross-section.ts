/**
 * Cross-section benchmark (issue 20): prints figures, asserts nothing.
 *   npm run bench:cross-section
 *
 * Case: three circuits of single-core 240 mm² copper cables (illustrative dimensions), each a
 * touching trefoil at 1 m, 0.3 m apart, Joule losses R(T) (nonlinear), uniform soil 1 K·m/W,
 * 40 m × 20 m domain. Target: ≥ 50 000 cells solved in ≤ 1 s on one core, and the cost growing
 * no worse than about N^1.3 over three meshes.
 *
 * For each mesh: cells, unknowns, outer iterations, CG iterations, the time to prepare (mesh,
 * assembly, preconditioner setup) and to solve, and the ratio of the solve time (and of the
 * whole) to one matrix–vector product with K. Timings are medians of several runs; the machine
 * is shared, so its load average is printed beside them. Then the three preconditioners on the
 * middle mesh, and an ampacity search on it.
 *
 * Then the sheet's "Solve the cross-section" (lib/sheet/crossSectionField.ts) for three touching
 * trefoil circuits of the 240 mm² test cable 0.3 m apart at 0.8 m — the design point and the
 * ampacity search with the AC factors settled — on the sheet's mesh (the browser's) and on the
 * coarser mesh of a saved result (the server's). The same solve in the browser's worker is timed by
 * the browser test tests/e2e/cross-section-field.test.ts, which prints its figure ("browser figure —
 * three trefoil circuits …"): run it against a build as DEVELOPERS.md says.
 */
import os from 'node:os';
import { ampacityOfPrepared, prepareCrossSection, solvePrepared, type CrossSectionCable, type CrossSectionInput, type PreconditionerKind } from '../lib/thermal/crossSection';
import { multiply } from '../lib/thermal/crossSection/sparse';
import { defaultSheetInputs } from '../lib/sheet/schema';
import { fieldSettingsOf } from '../lib/sheet/crossSection';
import { solveSheetCrossSection } from '../lib/sheet/crossSectionField';

const DE = 0.036;

function cable(x: number, depth: number): CrossSectionCable {
  return {
    xM: x,
    depthM: depth,
    outerDiameterM: DE,
    conductor: { diameterM: 0.0184, r20OhmPerM: 0.0754e-3, alpha20PerK: 3.93e-3, acFactor: 1.02, currentA: 480 },
    coverings: [
      { outerDiameterM: 0.03, thermalResistivityKmPerW: 3.5 },
      { outerDiameterM: DE, thermalResistivityKmPerW: 5.0 },
    ],
    maxConductorTemperatureC: 90,
  };
}

function input(refinement: number, preconditioner: PreconditionerKind = 'amg'): CrossSectionInput {
  const h = (DE * Math.sqrt(3)) / 2;
  const cables = [-0.3, 0, 0.3].flatMap((x) => [cable(x, 1 - (2 * h) / 3), cable(x - DE / 2, 1 + h / 3), cable(x + DE / 2, 1 + h / 3)]);
  return {
    domain: { widthM: 40, depthM: 20 },
    soil: { thermalResistivityKmPerW: 1 },
    cables,
    surface: { kind: 'isothermal', temperatureC: 20 },
    deepGroundTemperatureC: 20,
    mesh: { cellsAcrossCable: 16, growthRatio: 1.15, refinement },
    options: { preconditioner },
  };
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : 0.5 * (s[s.length / 2 - 1] + s[s.length / 2]);
}

interface Row {
  cells: number;
  unknowns: number;
  outer: number;
  cg: number;
  prepareMs: number;
  solveMs: number;
  matvecMs: number;
  hottestC: number;
}

function measure(refinement: number, preconditioner: PreconditionerKind, runs: number): Row {
  const prepares: number[] = [];
  const solves: number[] = [];
  let row: Omit<Row, 'prepareMs' | 'solveMs' | 'matvecMs'> | undefined;
  let matrix: ReturnType<typeof prepareCrossSection>['system']['matrix'] | undefined;
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    const prepared = prepareCrossSection(input(refinement, preconditioner));
    const t1 = performance.now();
    const result = solvePrepared(prepared);
    const t2 = performance.now();
    if (!result.converged) throw new Error(result.message);
    prepares.push(t1 - t0);
    solves.push(t2 - t1);
    matrix = prepared.system.matrix;
    row = { cells: result.mesh.cells, unknowns: result.mesh.unknowns, outer: result.iterations.outer, cg: result.iterations.cg, hottestC: result.governing!.conductorC };
  }
  const x = new Float64Array(matrix!.n).fill(1);
  const y = new Float64Array(matrix!.n);
  const batch = 50;
  const samples: number[] = [];
  for (let s = 0; s < 7; s++) {
    const t = performance.now();
    for (let k = 0; k < batch; k++) multiply(matrix!, x, y);
    samples.push((performance.now() - t) / batch);
  }
  return { ...row!, prepareMs: median(prepares), solveMs: median(solves), matvecMs: median(samples) };
}

const fmt = (v: number, digits = 1) => v.toFixed(digits).padStart(9);

console.log(`cross-section benchmark — Node ${process.version}, load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')} on ${os.cpus().length} cores`);
console.log('three trefoil circuits (9 cables, Joule R(T)), AMG-preconditioned CG, medians of 5 runs\n');
console.log('  refinement     cells  unknowns  outer   CG   prepare ms  solve ms  total ms  matvec ms  solve/matvec  total/matvec  hottest °C');
const rows: Array<Row & { refinement: number }> = [];
for (const refinement of [0.7, 1.4, 2.8]) {
  const row = measure(refinement, 'amg', 5);
  rows.push({ ...row, refinement });
  const total = row.prepareMs + row.solveMs;
  console.log(
    `${fmt(refinement, 2)}  ${String(row.cells).padStart(9)} ${String(row.unknowns).padStart(9)} ${String(row.outer).padStart(5)} ${String(row.cg).padStart(5)}` +
      ` ${fmt(row.prepareMs)} ${fmt(row.solveMs)} ${fmt(total)} ${fmt(row.matvecMs, 3)} ${fmt(row.solveMs / row.matvecMs, 0)}     ${fmt(total / row.matvecMs, 0)}   ${fmt(row.hottestC, 3)}`,
  );
}
console.log('\ncost growth between meshes, exponent p in time ∝ N^p (target ≤ about 1.3):');
for (let k = 1; k < rows.length; k++) {
  const a = rows[k - 1];
  const b = rows[k];
  const ratio = Math.log(b.cells / a.cells);
  console.log(
    `  ${a.cells} → ${b.cells} cells: total p = ${(Math.log((b.prepareMs + b.solveMs) / (a.prepareMs + a.solveMs)) / ratio).toFixed(2)}, solve p = ${(Math.log(b.solveMs / a.solveMs) / ratio).toFixed(2)}, CG iterations ${a.cg} → ${b.cg}`,
  );
}
const target = rows.find((r) => r.cells >= 50_000);
if (target) console.log(`\ntarget: ${target.cells} cells in ${(target.prepareMs + target.solveMs).toFixed(0)} ms (prepare + solve; goal ≤ 1000 ms)`);

console.log('\npreconditioners on the middle mesh (one run each):');
console.log('  preconditioner   CG   prepare ms  solve ms  total ms');
for (const kind of ['amg', 'ic0', 'jacobi'] as const) {
  const row = measure(1.4, kind, 1);
  console.log(`  ${kind.padEnd(14)} ${String(row.cg).padStart(5)} ${fmt(row.prepareMs)} ${fmt(row.solveMs)} ${fmt(row.prepareMs + row.solveMs)}`);
}

const prepared = prepareCrossSection(input(1.4));
const t0 = performance.now();
const found = ampacityOfPrepared(prepared);
const t1 = performance.now();
console.log(
  `\nampacity on the middle mesh (prepared once): ${found.currentA.toFixed(1)} A per cable, governing cable ${found.governing.index}, ` +
    `${found.evaluations} solves in ${(t1 - t0).toFixed(0)} ms`,
);

// ───────────── the sheet's field (the same inputs as the browser test) ─────────────
const sheet = defaultSheetInputs('buried');
sheet.circuit = { ...sheet.circuit, designCurrentA: 300, lengthM: 90 };
sheet.installation = {
  ...sheet.installation,
  depthM: 0.8,
  soilResistivityKmPerW: 1.2,
  groundC: 20,
  circuitSpacingM: 0.3,
  otherCircuits: [
    { label: 'West pump', currentA: 280, sameCable: true, externalDiameterM: null, lossWPerM: null },
    { label: 'East pump', currentA: 260, sameCable: true, externalDiameterM: null, lossWPerM: null },
  ],
};
// The 240 mm² copper XLPE/PVC test cable of tests/helpers/sheetCandidates.ts (illustrative data).
sheet.candidates = [
  {
    id: 'cu-xlpe-240',
    label: '240 mm² Cu XLPE single-core (test)',
    kind: 'cable',
    material: 'copper',
    r20OhmPerM: 0.0754e-3,
    sectionMm2: 240,
    conductorDiameterM: 0.018,
    parallel: 1,
    layers: [
      { name: 'XLPE insulation', role: 'insulation', thicknessM: 1.7e-3, thermalResistivityKmPerW: 3.5, continuousLimitC: 90, shortCircuitLimitC: 250 },
      { name: 'PVC sheath', role: 'sheath', thicknessM: 1.9e-3, thermalResistivityKmPerW: 5.0 },
    ],
  },
];
sheet.chosenCandidateId = 'cu-xlpe-240';
console.log('\nthe sheet’s "Solve the cross-section": three trefoil circuits (9 cables), design point + ampacity, AC factors settled (medians of 3 runs)');
console.log('  mesh      cells  solves  total ms  ms per solve  field ampacity A  IEC ampacity A');
for (const mesh of ['sheet', 'saved'] as const) {
  const times: number[] = [];
  let last: ReturnType<typeof solveSheetCrossSection> | undefined;
  for (let r = 0; r < 3; r++) {
    const t = performance.now();
    last = solveSheetCrossSection(sheet, 'cu-xlpe-240', { settings: fieldSettingsOf(sheet, mesh), pictureColumns: mesh === 'sheet' ? 96 : 48 });
    times.push(performance.now() - t);
  }
  const ms = median(times);
  console.log(
    `  ${mesh.padEnd(6)} ${String(last!.mesh.cells).padStart(8)} ${String(last!.solves).padStart(7)} ${fmt(ms, 0)} ${fmt(ms / last!.solves, 0)}      ${fmt(last!.ampacity.fieldA ?? Number.NaN, 1)}        ${fmt(last!.ampacity.iecA, 1)}`,
  );
}
console.log('the browser figure (the same solve in the sheet’s Web Worker) is printed by tests/e2e/cross-section-field.test.ts');

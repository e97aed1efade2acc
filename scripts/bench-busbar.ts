/**
 * Bus-bar systems benchmark (issue 18): prints figures, asserts nothing.
 *   npm run bench:busbar
 *
 * 1. Filament method on a round copper conductor at 50 Hz against the Bessel-function skin
 *    effect (30 mm and 60 mm): filaments, R_ac/R_dc, error, time.
 * 2. A three-phase system of 4 × (100 × 10 mm) copper packs on edge: R_ac/R_dc of the phases and
 *    the share of the outer bar under filament refinement, with the time of one solve (target:
 *    ≤ 300 ms with the default filaments, in Node).
 * 3. One bar alone, 10 mm copper on edge, 20 … 120 mm wide, painted, 35 °C air, 65 °C: the
 *    plane-conductor AC factor against the filament one, and the ampacities they give.
 * 4. Packs of 1 … 4 bars against n × one bar: inner-face heat transfer and current sharing apart,
 *    bars on their own and bars tied per pack (the two bounds), with the time of a coupled rating.
 * 5. One bar per phase in a three-phase system at several phase spacings.
 *
 * Timing: median of several runs after a warm-up; the machine is shared, so treat the figures as
 * indicative.
 */
import { planeConductorRatio } from '../lib/electrical/resistance';
import { computeCurrentDistribution, isolatedBarAcFactor } from '../lib/electrical/busbar/currentDistribution';
import { solveFilaments, type Filament } from '../lib/electrical/busbar/filaments';
import { prepareBusbarSystem } from '../lib/electrical/busbar/geometry';
import { packRatingBreakdown, rateBusbarSystem, rateIsolatedBar } from '../lib/electrical/busbar/rating';

const MU0 = 4e-7 * Math.PI;
const RHO20 = 1.7241e-8; // copper, IEC 60287-1-1 Table 1
const ALPHA20 = 3.93e-3;
const COPPER = { rho20OhmM: RHO20, alpha20PerK: ALPHA20 };
const PAINTED = { ambientC: 35, emissivity: 0.9, limitC: 65 };

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : 0.5 * (sorted[mid - 1] + sorted[mid]);
}

function timeMs<T>(fn: () => T, runs = 5): { value: T; ms: number } {
  let value = fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    value = fn();
    times.push(performance.now() - start);
  }
  return { value, ms: median(times) };
}

// Bessel reference: Re[(ka/2)·J₀(ka)/J₁(ka)], k = (1 − j)/δ, J by its power series.
type C = [number, number];
const cmul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
function besselJ(nu: 0 | 1, z: C): C {
  let term: C = nu === 0 ? [1, 0] : [z[0] / 2, z[1] / 2];
  let sum: C = [...term];
  const q = cmul(z, z);
  for (let m = 1; m < 80; m++) {
    term = cmul(term, [-q[0] / 4, -q[1] / 4]);
    term = [term[0] / (m * (m + nu)), term[1] / (m * (m + nu))];
    sum = [sum[0] + term[0], sum[1] + term[1]];
  }
  return sum;
}
function besselRatio(radius: number): number {
  const delta = Math.sqrt(RHO20 / (Math.PI * 50 * MU0));
  const ka: C = [radius / delta, -radius / delta];
  const j0 = besselJ(0, ka);
  const j1 = besselJ(1, ka);
  const m = j1[0] ** 2 + j1[1] ** 2;
  const ratio: C = [(j0[0] * j1[0] + j0[1] * j1[1]) / m, (j0[1] * j1[0] - j0[0] * j1[1]) / m];
  return cmul([ka[0] / 2, ka[1] / 2], ratio)[0];
}

function roundConductor(radius: number, cells: number): { ratio: number; filaments: number } {
  const h = radius / cells;
  const filaments: Filament[] = [];
  for (let i = 0; i < cells; i++)
    for (let j = 0; j < cells; j++) {
      const cx = (i + 0.5) * h;
      const cy = (j + 0.5) * h;
      if (cx * cx + cy * cy <= radius * radius) filaments.push({ cxM: cx, cyM: cy, sizeXM: h, sizeYM: h, resistivityOhmM: RHO20, group: 0, tag: 0 });
    }
  const s = solveFilaments({ filaments, groupCurrents: [{ re: 1, im: 0 }], frequencyHz: 50, mirror: { x: true, y: true } });
  const area = 4 * filaments.length * h * h;
  return { ratio: s.totalLossWPerM / (RHO20 / area), filaments: 4 * filaments.length };
}

console.log(`Node ${process.version}\n`);
console.log('1. Round copper conductor, 50 Hz, 20 °C: filament method against the Bessel-function solution');
console.log('   D (mm) | cells/radius | filaments (solved) | R_ac/R_dc | Bessel  | error    | time (ms)');
for (const diameter of [0.03, 0.06]) {
  const reference = besselRatio(diameter / 2);
  for (const cells of [8, 12, 16, 24, 32, 40]) {
    const { value, ms } = timeMs(() => roundConductor(diameter / 2, cells), cells > 24 ? 1 : 3);
    console.log(
      `   ${(diameter * 1000).toFixed(0).padStart(6)} | ${String(cells).padStart(12)} | ${`${value.filaments} (${value.filaments / 4})`.padStart(18)} | ${value.ratio.toFixed(5)}   | ${reference.toFixed(5)} | ${(((value.ratio - reference) / reference) * 100).toFixed(3).padStart(6)} % | ${ms.toFixed(0).padStart(8)}`,
    );
  }
}

console.log('\n2. Three phases of 4 × (100 × 10 mm) copper on edge, gap 10 mm, phases 200 mm apart, 65 °C, 50 Hz');
console.log('   mesh (thickness × width) | filaments (solved) | R_ac/R_dc L1  L2     L3     | outer bar share L1 | time (ms)');
const four = prepareBusbarSystem({ barsPerPhase: 4, barWidthM: 0.1, barThicknessM: 0.01, gapM: 0.01, phaseSpacingM: 0.2, arrangement: 'edge', supportSpacingM: 1 });
const meshes: Array<{ cellsAcrossThickness?: number; cellsAlongWidth?: number } | undefined> = [
  { cellsAcrossThickness: 2, cellsAlongWidth: 10 },
  { cellsAcrossThickness: 3, cellsAlongWidth: 14 },
  undefined,
  { cellsAcrossThickness: 5, cellsAlongWidth: 28 },
  { cellsAcrossThickness: 6, cellsAlongWidth: 40 },
  { cellsAcrossThickness: 8, cellsAlongWidth: 56 },
];
for (const mesh of meshes) {
  const { value, ms } = timeMs(
    () => computeCurrentDistribution({ system: four, conductor: COPPER, barTemperaturesC: 65, excitation: { kind: 'three-phase', frequencyHz: 50, phaseCurrentA: 1 }, mesh }),
    mesh && (mesh.cellsAcrossThickness ?? 0) >= 6 ? 1 : 5,
  );
  const label = `${value.mesh.cellsAcrossThickness} × ${value.mesh.cellsAlongWidth}${mesh === undefined ? ' (default)' : ''}`;
  console.log(
    `   ${label.padEnd(25)} | ${`${value.filamentCount} (${value.unknowns})`.padStart(18)} | ${value.groups
      .slice(0, 3)
      .map((g) => g.acFactor!.toFixed(4))
      .join('  ')}  | ${value.bars[0].shareOfPhase.toFixed(4).padStart(18)} | ${ms.toFixed(0).padStart(8)}`,
  );
}

console.log('\n3. One bar alone, 10 mm thick copper on edge, painted (ε = 0.9), 35 °C air, 65 °C, 50 Hz');
console.log('   width (mm) | R_ac/R_dc plane | filaments | I DC (A) | I plane AC (A) | I filament AC (A) | edges as horizontal plates, DC (A)');
for (const w of [0.02, 0.03, 0.04, 0.05, 0.06, 0.08, 0.1, 0.12]) {
  const rho65 = RHO20 * (1 + ALPHA20 * 45);
  const plane = planeConductorRatio(0.01 / Math.sqrt(rho65 / (Math.PI * 50 * MU0)));
  const filament = isolatedBarAcFactor({ widthM: w, thicknessM: 0.01, resistivityOhmM: rho65, frequencyHz: 50 }).acFactor;
  const dc = rateIsolatedBar({ widthM: w, thicknessM: 0.01, arrangement: 'edge', conductor: COPPER, conditions: PAINTED, excitation: { kind: 'dc' } });
  const ac = rateIsolatedBar({ widthM: w, thicknessM: 0.01, arrangement: 'edge', conductor: COPPER, conditions: PAINTED, excitation: { kind: 'three-phase', frequencyHz: 50 } });
  const horizontal = rateIsolatedBar({ widthM: w, thicknessM: 0.01, arrangement: 'edge', conductor: COPPER, conditions: { ...PAINTED, edgeConvection: 'horizontal-plate' }, excitation: { kind: 'dc' } });
  console.log(
    `   ${(w * 1000).toFixed(0).padStart(10)} | ${plane.toFixed(4).padStart(15)} | ${filament.toFixed(4).padStart(9)} | ${dc.ampacityA.toFixed(0).padStart(8)} | ${(dc.ampacityA / Math.sqrt(plane)).toFixed(0).padStart(14)} | ${ac.ampacityA.toFixed(0).padStart(17)} | ${horizontal.ampacityA.toFixed(0).padStart(8)}`,
  );
}

console.log('\n4. Packs of n × (100 × 10 mm) copper on edge, gap 10 mm, phases 200 mm apart, painted, 35 °C, 65 °C, 50 Hz');
console.log('   n | n × one bar DC | pack DC | pack AC | heat-transfer factor | sharing factor | AC/(n × one bar) | tied per pack: AC | rating time (ms) | passes / factorisations');
for (const n of [1, 2, 3, 4]) {
  const system = prepareBusbarSystem({ barsPerPhase: n, barWidthM: 0.1, barThicknessM: 0.01, gapM: 0.01, phaseSpacingM: 0.2, arrangement: 'edge', supportSpacingM: 1 });
  const b = packRatingBreakdown({ system, conductor: COPPER, conditions: PAINTED, frequencyHz: 50 });
  const tied = rateBusbarSystem({ system, conductor: COPPER, conditions: { ...PAINTED, thermalNodes: 'per-pack' }, excitation: { kind: 'three-phase', frequencyHz: 50 } });
  const { ms } = timeMs(() => rateBusbarSystem({ system, conductor: COPPER, conditions: PAINTED, excitation: { kind: 'three-phase', frequencyHz: 50 } }), 3);
  console.log(
    `   ${n} | ${b.naivePackA.toFixed(0).padStart(14)} | ${b.systemDcA.toFixed(0).padStart(7)} | ${b.systemAcA.toFixed(0).padStart(7)} | ${b.heatTransferFactor.toFixed(3).padStart(20)} | ${b.currentSharingFactor.toFixed(3).padStart(14)} | ${(b.systemAcA / b.naivePackA).toFixed(3).padStart(16)} | ${tied.ampacityA.toFixed(0).padStart(17)} | ${ms.toFixed(0).padStart(16)} | ${`${b.ac.couplingPasses} / ${b.ac.factorisations}`.padStart(15)}`,
  );
  console.log(`     bar temperatures at the AC ampacity (°C): ${b.ac.heat.bars.map((x) => x.temperatureC.toFixed(1)).join(' ')}`);
  console.log(`     bar shares of the phase current:         ${b.ac.distribution.bars.map((x) => x.shareOfPhase.toFixed(3)).join(' ')}`);
}

console.log('\n5. One 100 × 10 mm copper bar per phase on edge in a three-phase system, painted, 35 °C, 65 °C, 50 Hz');
console.log('   phase spacing (mm) | R_ac/R_dc L1  L2     | ampacity (A) | hottest | alone: 1864 A, R_ac/R_dc 1.164');
for (const a of [0.1, 0.15, 0.2, 0.3, 0.5]) {
  const system = prepareBusbarSystem({ barsPerPhase: 1, barWidthM: 0.1, barThicknessM: 0.01, phaseSpacingM: a, arrangement: 'edge', supportSpacingM: 1 });
  const r = rateBusbarSystem({ system, conductor: COPPER, conditions: PAINTED, excitation: { kind: 'three-phase', frequencyHz: 50 } });
  console.log(
    `   ${(a * 1000).toFixed(0).padStart(18)} | ${r.distribution.groups[0].acFactor!.toFixed(4)}  ${r.distribution.groups[1].acFactor!.toFixed(4)} | ${r.ampacityA.toFixed(0).padStart(12)} | ${r.distribution.bars[r.heat.hottestBar].group}`,
  );
}

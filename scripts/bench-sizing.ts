/**
 * Benchmark of the sizing layer (`npm run bench:sizing`), issue 4:
 *   1. heat-balance solves per ampacity (target ≤ 30),
 *   2. median time of one ampacity,
 *   3. time to size 1,000 circuits × 12 candidates (compareCandidates),
 *   4. edit-to-result of a 6-candidate sizing sheet with its hot-spot curves (issue 16): the
 *      prepared pipeline (one ampacity search per candidate, curve points solved on the prepared
 *      model) beside the former path (a full evaluation, ampacity search included, per curve point).
 * Inputs are invented benchmark data (IEC 60228 resistances from memory); deterministic.
 */
import { loadavg } from 'node:os';
import {
  ampacity,
  compareCandidates,
  type BarCandidate,
  type CableCandidate,
  type Candidate,
  type Conditions,
  evaluateCandidate,
} from '../lib/electrical';
import { demoSheets } from '../db/seed/sheets';
import { computeSheetWithCurves } from '../lib/sheet/compute';
import { toConditions } from '../lib/sheet/toSizing';
import { toLibraryCandidate } from '../lib/sheet/candidates';
import type { SheetInputs } from '../lib/sheet/schema';

// IEC 60228 Table 2, class 2 copper, Ω/km at 20 °C (from memory, references.md).
const CU: Record<number, number> = {
  16: 1.15, 25: 0.727, 35: 0.524, 50: 0.387, 70: 0.268, 95: 0.193, 120: 0.153,
  150: 0.124, 185: 0.0991, 240: 0.0754, 300: 0.0601,
};

function cable(section: number, parallel = 1): CableCandidate {
  return {
    kind: 'cable',
    id: `cu${section}x${parallel}`,
    material: 'copper',
    sectionMm2: section,
    r20OhmPerM: CU[section] * 1e-3,
    conductorDiameterM: 1.2e-3 * Math.sqrt(section),
    parallel,
    layers: [
      { name: 'XLPE', role: 'insulation', thicknessM: 1.7e-3, thermalResistivityKmPerW: 3.5, continuousLimitC: 90, shortCircuitLimitC: 250 },
      { name: 'PVC sheath', role: 'sheath', thicknessM: 1.8e-3, thermalResistivityKmPerW: 5 },
    ],
    emissivity: 0.9,
    costs: { conductorPricePerKg: '9.50' },
  };
}

function bar(widthMm: number, thicknessMm: number, barsPerPhase: number): BarCandidate {
  const w = widthMm / 1000;
  const t = thicknessMm / 1000;
  return {
    kind: 'bar',
    id: `bar${widthMm}x${thicknessMm}x${barsPerPhase}`,
    material: 'copper',
    widthM: w,
    thicknessM: t,
    barsPerPhase,
    r20OhmPerM: 1.7241e-8 / (w * t),
    emissivity: 0.4,
    terminalLimitC: 105,
    shortCircuitLimitC: 200,
    costs: { conductorPricePerKg: '10.20' },
  };
}

/** Small deterministic generator (mulberry32) so every run sizes the same circuits. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const economics = { lossLoadFactor: 0.4, energyPricePerKWh: '0.15', discountRatePercent: 5, loadGrowthPercent: 1, years: 25 };

function cableCircuit(r: () => number): Conditions {
  const kind = r() < 0.7 ? 'cable-in-air' : 'buried';
  return {
    designCurrentA: 30 + 570 * r(),
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 10 + 190 * r(),
    powerFactor: 0.85 + 0.1 * r(),
    reactanceOhmPerM: 0.08e-3,
    maxVoltageDropPercent: 5,
    ambientC: 20 + 25 * r(),
    installation:
      kind === 'buried'
        ? { kind: 'buried', depthM: 0.7 + 0.3 * r(), soilResistivityKmPerW: 1 + 1.5 * r(), groundC: 15 + 10 * r(), spacingM: 0.1 }
        : { kind: 'cable-in-air', formation: 'flat', spacingM: 0.1 },
    ...(kind === 'cable-in-air' && r() < 0.2 ? { solar: { irradianceWPerM2: 800, absorptivity: 0.6 } } : {}),
    ...(kind === 'cable-in-air' && r() < 0.1 ? { windSpeedMPerS: 1 + 3 * r() } : {}),
    fault: { currentA: 5_000 + 20_000 * r(), durationS: 0.1 + 0.9 * r() },
    economics,
  };
}

function barCircuit(r: () => number): Conditions {
  return {
    designCurrentA: 600 + 3400 * r(),
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 5 + 30 * r(),
    powerFactor: 0.9,
    reactanceOhmPerM: 0.15e-3,
    ambientC: 30 + 10 * r(),
    installation: { kind: r() < 0.7 ? 'bar-on-edge' : 'bar-flat' },
    fault: { currentA: 20_000 + 40_000 * r(), durationS: 0.5 + 0.5 * r() },
    economics,
  };
}

const CABLE_SET: Candidate[] = [16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300].map((s) => cable(s)).concat([cable(240, 2)]);
const BAR_SET: Candidate[] = [
  bar(40, 5, 1), bar(50, 10, 1), bar(60, 10, 1), bar(80, 10, 1), bar(100, 10, 1), bar(120, 10, 1),
  bar(60, 10, 2), bar(80, 10, 2), bar(100, 10, 2), bar(120, 10, 2), bar(100, 10, 3), bar(120, 10, 3),
];

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}
function percentile(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(p * s.length))];
}

function main(): void {
  const r = rng(20240601);
  console.log(`Machine load average at start: ${loadavg().map((x) => x.toFixed(1)).join(' / ')} (wall times stretch with load; CPU times less so)`);

  // ── 1 & 2: solves and time per ampacity ──
  const solves: number[] = [];
  const rootEvaluations: number[] = [];
  const byKind = new Map<string, { solves: number[]; rootEvaluations: number[]; ms: number[] }>();
  const times: number[] = [];
  const cpuTimes: number[] = [];
  // warm-up (JIT)
  for (let i = 0; i < 20; i++) ampacity(CABLE_SET[i % CABLE_SET.length], cableCircuit(r));
  for (let i = 0; i < 400; i++) {
    const isBar = i % 4 === 3;
    const candidate = isBar ? BAR_SET[i % BAR_SET.length] : CABLE_SET[i % CABLE_SET.length];
    const conditions = isBar ? barCircuit(r) : cableCircuit(r);
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const a = ampacity(candidate, conditions);
    times.push(performance.now() - t0);
    const c1 = process.cpuUsage(c0);
    cpuTimes.push((c1.user + c1.system) / 1000);
    solves.push(a.solves);
    rootEvaluations.push(a.iterations);
    // A buried group's evaluation solves each cable twice (its heat is affine in its ambient) and a
    // pack's solves its bars together, so 1-D solves per ampacity differ by kind: print them apart.
    const kind = isBar
      ? (candidate.kind === 'bar' && (candidate.barsPerPhase ?? 1) > 1 ? 'bar pack' : 'single bar')
      : conditions.installation.kind === 'buried' ? 'buried group' : 'cables in air';
    const entry = byKind.get(kind) ?? { solves: [], rootEvaluations: [], ms: [] };
    entry.solves.push(a.solves);
    entry.rootEvaluations.push(a.iterations);
    entry.ms.push(times[times.length - 1]);
    byKind.set(kind, entry);
  }
  console.log('Ampacity (400 cases: cables in air/buried/sun/wind, bars on edge/flat)');
  console.log(`  solves per ampacity: median ${median(solves)}, 95th percentile ${percentile(solves, 0.95)}, max ${Math.max(...solves)} (target ≤ 30)`);
  console.log(`  root-finder evaluations per ampacity (each one current tried): median ${median(rootEvaluations)}, 95th percentile ${percentile(rootEvaluations, 0.95)}, max ${Math.max(...rootEvaluations)}`);
  for (const [kind, e] of byKind) {
    console.log(
      `    ${kind.padEnd(14)} ${String(e.solves.length).padStart(3)} cases: evaluations median ${median(e.rootEvaluations)} / max ${Math.max(...e.rootEvaluations)}, 1-D solves median ${median(e.solves)} / max ${Math.max(...e.solves)}, ${median(e.ms).toFixed(2)} ms median wall`,
    );
  }
  console.log(`  time per ampacity:   median ${median(times).toFixed(2)} ms wall (${median(cpuTimes).toFixed(2)} ms CPU), 95th percentile ${percentile(times, 0.95).toFixed(2)} ms wall`);

  // ── 3: 1,000 circuits × 12 candidates ──
  const circuits = Array.from({ length: 1000 }, (_, i) => (i % 5 === 4 ? { c: barCircuit(r), set: BAR_SET } : { c: cableCircuit(r), set: CABLE_SET }));
  let evaluations = 0;
  let failed = 0;
  let totalSolves = 0;
  let withPassing = 0;
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  for (const { c, set } of circuits) {
    const cmp = compareCandidates(set, c);
    for (const e of cmp.evaluations) {
      evaluations++;
      if (e.ok) totalSolves += e.solves;
      else failed++;
    }
    if (cmp.smallestPassingIndex !== null) withPassing++;
  }
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  console.log('Sizing 1,000 circuits × 12 candidates (800 cable circuits, 200 bus-bar circuits)');
  console.log(`  total ${seconds.toFixed(2)} s wall (${cpuSeconds.toFixed(2)} s CPU, one thread), ${((1000 * seconds) / 1000).toFixed(2)} ms per circuit, ${((1e6 * seconds) / evaluations).toFixed(0)} µs per candidate`);
  console.log(`  ${evaluations} evaluations, ${failed} could not be evaluated, ${totalSolves} heat-balance solves (${(totalSolves / evaluations).toFixed(1)} per candidate incl. ampacity)`);
  console.log(`  ${withPassing} circuits with at least one passing candidate`);
}

/** The chiller-feeder demo sheet with three more cables: six candidates, as a designer compares them. */
function sixCandidateSheet(): SheetInputs {
  const demo = demoSheets().find((d) => d.inputs.installation.kind === 'cable-in-air' && d.inputs.candidates.length === 3);
  if (!demo) throw new Error('no three-candidate demo sheet in air');
  const extra = demoSheets().flatMap((d) => d.inputs.candidates).filter((c) => c.kind === 'cable' && !demo.inputs.candidates.some((x) => x.id === c.id));
  const inputs: SheetInputs = { ...demo.inputs, candidates: [...demo.inputs.candidates, ...extra].slice(0, 6) };
  if (inputs.candidates.length !== 6) throw new Error(`expected 6 candidates, got ${inputs.candidates.length}`);
  return inputs;
}

/** The former edit path: compare, then one full evaluation (with its ampacity search) per curve point. */
function formerEditToResult(inputs: SheetInputs): number {
  const { computation } = computeSheetWithCurves(inputs, false);
  let points = 0;
  if (!computation.ok) return points;
  for (const e of computation.comparison.evaluations) {
    if (!e.ok || !(e.ampacityA > 0)) continue;
    const candidate = toLibraryCandidate(inputs.candidates.find((c) => c.id === e.id)!);
    const top = Math.max(e.ampacityA * 1.15, inputs.circuit.designCurrentA * 1.1);
    const currents = new Set<number>();
    for (let i = 1; i <= 8; i += 1) currents.add(Math.round((top * i) / 8));
    currents.add(Math.round(e.ampacityA));
    currents.add(inputs.circuit.designCurrentA);
    for (const currentA of [...currents].sort((a, b) => a - b)) {
      const r = evaluateCandidate(candidate, toConditions(inputs, currentA));
      points++;
      if (!r.ok || r.hotSpotC === null) break;
    }
  }
  return points;
}

function editToResult(): void {
  const inputs = sixCandidateSheet();
  const time = (fn: () => void, runs: number) => {
    for (let i = 0; i < 3; i++) fn(); // warm-up
    const ms: number[] = [];
    for (let i = 0; i < runs; i++) {
      const t0 = performance.now();
      fn();
      ms.push(performance.now() - t0);
    }
    return median(ms);
  };
  let points = 0;
  const now = time(() => {
    const r = computeSheetWithCurves(inputs, true);
    points = r.curves.reduce((n, c) => n + c.points.length, 0);
  }, 30);
  const before = time(() => formerEditToResult(inputs), 10);
  console.log('Edit-to-result of a 6-candidate sizing sheet with its hot-spot curves (one thread)');
  console.log(`  prepared pipeline: median ${now.toFixed(1)} ms (${points} curve points on the prepared models)`);
  console.log(`  former path (a full evaluation per curve point): median ${before.toFixed(1)} ms`);
  console.log(`  ratio ${(before / now).toFixed(1)}× (target ≥ 5×)`);
}

main();
editToResult();

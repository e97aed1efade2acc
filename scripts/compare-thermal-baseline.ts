/**
 * Refactoring check (issue 16): the same cases through a baseline copy of the library and through
 * this checkout, every number compared. Prints figures; asserts nothing.
 *
 *   git -C <repo> archive <commit> lib tests/helpers | tar -x -C /tmp/thermal-baseline
 *   ln -s <repo>/node_modules /tmp/thermal-baseline/node_modules
 *   npx tsx scripts/compare-thermal-baseline.ts /tmp/thermal-baseline
 *
 * Per case: the largest relative difference |a − b| / max(|a|, |b|) over every number of the
 * result (counters — iterations, tridiagonal solves, linearisation counts — and energy residuals,
 * which are round-off, are listed apart), and whether the strings (flag messages) are equal.
 * The fault run over time is expected to move (issue 16: the coverings are refined in time);
 * its cases are printed under their own heading.
 */
import path from 'node:path';

type Lib = {
  thermal: typeof import('../lib/thermal');
  sheet: typeof import('../lib/sheet');
};

async function load(root: string): Promise<Lib> {
  return {
    thermal: await import(path.join(root, 'lib/thermal/index.ts')),
    sheet: await import(path.join(root, 'lib/sheet/index.ts')),
  };
}

type Case = { name: string; run: (lib: Lib) => unknown; expectedToMove?: boolean };

const copperRho = 1.7241e-8; // IEC 60287-1-1 Table 1 (from memory); inputs only

function cylinder(extra: Record<string, unknown> = {}) {
  return {
    geometry: {
      kind: 'cylinder' as const,
      innerRadius: 0,
      layers: [
        { thickness: 0.005, conductivity: 390, generating: true, cells: 10, density: 8960, heatCapacity: 385 },
        { thickness: 0.002, conductivity: 0.3, cells: 10, density: 1400, heatCapacity: 1500 },
      ],
    },
    source: { kind: 'joule' as const, current: 100, area: Math.PI * 0.005 ** 2, rho20: copperRho, alpha20: 3.93e-3, acFactor: 1 },
    inner: { kind: 'symmetry' as const },
    outer: { kind: 'surface' as const, ambient: 25, h: 8, emissivity: 0.9 },
    ...extra,
  };
}

const cableInAir = {
  conductorDiameterM: 0.0175,
  currentA: 500,
  r20OhmPerM: 0.0754e-3,
  alpha20PerK: 3.93e-3,
  acFactor: 1.02,
  conductorConductivity: 390,
  layers: [
    { name: 'XLPE', thicknessM: 0.0026, thermalResistivityKmPerW: 3.5 },
    { name: 'PVC sheath', thicknessM: 0.0018, thermalResistivityKmPerW: 5.0 },
  ],
  outer: { kind: 'air' as const, ambientC: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' as const } },
};

const bar = {
  widthM: 0.1,
  thicknessM: 0.01,
  barsPerPhase: 1,
  currentA: 1500,
  r20OhmPerM: copperRho / 1e-3,
  alpha20PerK: 3.93e-3,
  conductivity: 390,
  orientation: 'edge' as const,
  ambientC: 35,
  emissivity: 0.4,
};

const heatCapacities = <P extends { geometry: { layers: object[] } }>(p: P): P => ({
  ...p,
  geometry: {
    ...p.geometry,
    layers: p.geometry.layers.map((l) => ({ ...l, density: 2000, heatCapacity: 1000 })),
  },
});

const cases: Case[] = [];
const steady = (name: string, problem: (lib: Lib) => unknown) =>
  cases.push({ name: `solveSteady: ${name}`, run: (lib) => lib.thermal.solveSteady(problem(lib) as never) });

steady('cylinder, Joule, fixed h + radiation', () => cylinder());
steady('cylinder, Joule, lagged', () => cylinder({ options: { linearisation: 'lagged' } }));
steady('cylinder, Joule, α = 0', () => ({ ...cylinder(), source: { ...cylinder().source, alpha20: 0 } }));
steady('cylinder, runaway (eigenvalue)', () => ({ ...cylinder({ outer: { kind: 'surface', ambient: 25, h: 8 } }), source: { ...cylinder().source, current: 3000 } }));
steady('cylinder, fixed h, below onset', () => ({ ...cylinder({ outer: { kind: 'surface', ambient: 25, h: 8 } }), source: { ...cylinder().source, current: 600 } }));
steady('cylinder, runaway (temperature limit)', () => ({ ...cylinder(), source: { ...cylinder().source, current: 20000 } }));
steady('hollow cylinder, inner temperature, natural convection + radiation', () => ({
  geometry: { kind: 'cylinder', innerRadius: 0.01, layers: [{ thickness: 0.004, conductivity: 0.3, generating: true, cells: 30 }] },
  source: { kind: 'uniform', q: 2e5 },
  inner: { kind: 'temperature', value: 60 },
  outer: { kind: 'surface', ambient: 20, emissivity: 0.8, convection: { kind: 'horizontal-cylinder' } },
}));
steady('slab, uniform, temperatures', () => ({
  geometry: { kind: 'slab', layers: [{ thickness: 0.02, conductivity: 2, generating: true, cells: 25 }, { thickness: 0.01, conductivity: 0.5, cells: 7 }] },
  source: { kind: 'uniform', q: 1e6 },
  inner: { kind: 'temperature', value: 40 },
  outer: { kind: 'temperature', value: 20 },
}));
steady('slab, flux in + surface fixed h', () => ({
  geometry: { kind: 'slab', layers: [{ thickness: 0.05, conductivity: 1.2, cells: 40 }] },
  source: { kind: 'uniform', q: 0 },
  inner: { kind: 'flux', value: 500 },
  outer: { kind: 'surface', ambient: 15, h: 12, absorbedFlux: 30 },
}));
steady('slab, vertical plate + horizontal plate, radiation to other surroundings', () => ({
  geometry: { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 390, generating: true, cells: 20 }] },
  source: { kind: 'joule', current: 2e5, area: 1, rho20: copperRho * 1e2, alpha20: 3.93e-3 },
  inner: { kind: 'surface', ambient: 30, emissivity: 0.5, surroundings: 10, convection: { kind: 'horizontal-plate', facing: 'down', length: 0.05 } },
  outer: { kind: 'surface', ambient: 30, emissivity: 0.5, convection: { kind: 'vertical-plate', height: 0.1 }, areaFactor: 1.1 },
}));
steady('slab, forced plate', () => ({
  geometry: { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 390, generating: true, cells: 20 }] },
  source: { kind: 'joule', current: 2e5, area: 1, rho20: copperRho * 1e2, alpha20: 3.93e-3 },
  inner: { kind: 'symmetry' },
  outer: { kind: 'surface', ambient: 30, emissivity: 0.2, convection: { kind: 'forced-plate', velocity: 1.5, length: 0.1 }, absorbedFlux: 100 },
}));
steady('slab, no drive (undriven start)', () => ({
  geometry: { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 390, generating: true, cells: 5 }] },
  source: { kind: 'joule', current: 0, area: 1, rho20: copperRho, alpha20: 3.93e-3 },
  inner: { kind: 'surface', ambient: 30, emissivity: 0.5, convection: { kind: 'vertical-plate', height: 0.1 } },
  outer: { kind: 'surface', ambient: 30, emissivity: 0.5, convection: { kind: 'vertical-plate', height: 0.1 } },
}));
for (const currentA of [0, 100, 500, 900, 1400]) steady(`cable in air at ${currentA} A`, (lib) => lib.thermal.cableProblem({ ...cableInAir, currentA }));
steady('cable in wind with sun', (lib) => lib.thermal.cableProblem({ ...cableInAir, outer: { kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'forced', windMps: 2 }, solarWPerM2: 1000, absorptivity: 0.6 } }));
steady('cable, IEC 60287 free-air coefficient', (lib) => lib.thermal.cableProblem({ ...cableInAir, outer: { kind: 'air', ambientC: 30, emissivity: 0, convection: { kind: 'iec-60287-free-air' } } }));
steady('cable buried', (lib) => lib.thermal.cableProblem({ ...cableInAir, outer: { kind: 'buried', soilResistivityKmPerW: 1.5, depthM: 0.8, groundC: 20 } }));
steady('bar on edge', (lib) => lib.thermal.busBarProblem(bar));
steady('bar flat with wind', (lib) => lib.thermal.busBarProblem({ ...bar, orientation: 'flat', windMps: 1 }));
steady('bar flat, coated, 3 per phase', (lib) => lib.thermal.busBarProblem({ ...bar, orientation: 'flat', barsPerPhase: 3, currentA: 3000, coating: { thicknessM: 2e-4, conductivity: 0.2, emissivity: 0.9 } }));

cases.push({
  name: 'solveTransient: cylinder, 5 steps',
  run: (lib) => lib.thermal.solveTransient({ ...cylinder(), initial: 25, timeStep: 5, steps: 5 } as never),
});
cases.push({
  name: 'solveTransient: cable in air, per-cell start',
  run: (lib) => {
    const p = heatCapacities(lib.thermal.cableProblem(cableInAir));
    const s = lib.thermal.solveSteady({ ...p, source: { ...p.source, current: 200 } } as never);
    return lib.thermal.solveTransient({ ...p, initial: s.temperatures, timeStep: 30, steps: 20 } as never);
  },
});
cases.push({
  name: 'overloadTimeToLimit: cable',
  run: (lib) => lib.thermal.overloadTimeToLimit({ problem: heatCapacities(lib.thermal.cableProblem({ ...cableInAir, currentA: 400 })) as never, overloadCurrentA: 900, limitC: 90, maxTimeS: 7200 }),
});
cases.push({
  name: 'dailyCycle: cable',
  run: (lib) =>
    lib.thermal.dailyCycle({
      problem: heatCapacities(lib.thermal.cableProblem(cableInAir)) as never,
      currentsA: Array.from({ length: 24 }, (_, h) => (h >= 8 && h < 20 ? 600 : 300)),
      limitC: 90,
    }),
});
const faultCable = (lib: Lib) => {
  const p = lib.thermal.cableProblem({ ...cableInAir, currentA: 300, conductorCells: 12, layers: cableInAir.layers.map((l) => ({ ...l, cells: 4 })) });
  return {
    ...p,
    geometry: {
      ...p.geometry,
      layers: p.geometry.layers.map((l) => (l.generating ? { ...l, density: 8960, heatCapacity: 3.45e6 / 8960 } : { ...l, density: 1000, heatCapacity: 2000 })),
    },
  };
};
cases.push({ name: 'faultHeating: cable, coarse mesh, from steady', expectedToMove: true, run: (lib) => lib.thermal.faultHeating({ problem: faultCable(lib) as never, faultCurrentA: 20e3, durationS: 1, steps: 400 }) });
cases.push({ name: 'faultHeating: cable, coarse mesh, from 90 °C', expectedToMove: true, run: (lib) => lib.thermal.faultHeating({ problem: faultCable(lib) as never, faultCurrentA: 20e3, durationS: 1, initialC: 90, steps: 400 }) });

const run = (o: Record<string, unknown> = {}) => ({
  lengthM: 2,
  widthM: 0.1,
  thicknessM: 0.01,
  currentA: 1500,
  r20OhmPerM: copperRho / 1e-3,
  alpha20PerK: 0,
  conductivityWPerMK: 390,
  orientation: 'edge' as const,
  ambientC: 35,
  emissivity: 0,
  fixedHWPerM2K: 8,
  start: { kind: 'terminal' as const, temperatureC: 45 },
  end: { kind: 'terminal' as const, temperatureC: 45 },
  ...o,
});
const barRun = (name: string, input: Record<string, unknown>) => cases.push({ name: `solveBarRun: ${name}`, run: (lib) => lib.thermal.solveBarRun(input as never) });
barRun('fin, fixed h, 200 cells', run());
barRun('fin, fixed h, 25 cells', run({ cells: 25 }));
barRun('joint in a long insulated run', run({ lengthM: 20, cells: 2001, start: { kind: 'insulated' }, end: { kind: 'insulated' }, joints: [{ positionM: 10, resistanceMicroOhm: 10 }] }));
barRun('assumed joint', run({ joints: [{ positionM: 0.5 }] }));
barRun('correlations, α > 0, insulated ends', (() => {
  const { fixedHWPerM2K: _f, ...r } = run({ lengthM: 5, alpha20PerK: 3.93e-3, emissivity: 0.4, start: { kind: 'insulated' }, end: { kind: 'insulated' }, cells: 20 });
  return r;
})());
barRun('correlations, flat, wind, terminals, two joints, 2 bars', (() => {
  const { fixedHWPerM2K: _f, ...r } = run({ orientation: 'flat', windMps: 0.5, barsPerPhase: 2, currentA: 3000, alpha20PerK: 3.93e-3, emissivity: 0.8, acFactor: 1.1, start: { kind: 'terminal', temperatureC: 90 }, end: { kind: 'terminal', temperatureC: 70 }, joints: [{ positionM: 0.7, resistanceMicroOhm: 8 }, { positionM: 1.5 }] });
  return r;
})());
barRun('no steady state', run({ currentA: 2e5, alpha20PerK: 3.93e-3 }));

// The whole sizing chain through lib/sheet (ampacity, hot spot, flags, curves).
for (const kind of ['bar-on-edge', 'bar-flat', 'cable-in-air', 'buried', 'enclosure'] as const) {
  cases.push({
    name: `computeSheet + hotSpotCurve: default ${kind} sheet`,
    run: (lib) => {
      const inputs = lib.sheet.defaultSheetInputs(kind);
      // The baseline (59a7b82) had hotSpotCurve; this checkout computes the curves with the sheet.
      const sheet = lib.sheet as unknown as {
        computeSheetWithCurves?: (i: typeof inputs, withCurves: boolean) => { computation: unknown; curves: unknown };
        hotSpotCurve?: (i: typeof inputs, e: never) => unknown;
      };
      if (sheet.computeSheetWithCurves) {
        const r = sheet.computeSheetWithCurves(inputs, true);
        return { c: r.computation, curves: r.curves };
      }
      const c = lib.sheet.computeSheet(inputs);
      if (!c.ok) return c;
      const curves = c.comparison.evaluations.filter((e) => e.ok).map((e) => sheet.hotSpotCurve!(inputs, e as never));
      return { c, curves };
    },
  });
}

async function sheetCases(): Promise<void> {
  const { testCable240, testCopperBar } = await import('../tests/helpers/sheetCandidates');
  const hourly = (day: number, night: number) => Array.from({ length: 24 }, (_, h) => (h >= 8 && h < 20 ? day : night));
  const cableSheet = (lib: Lib, fault: boolean) => {
    const inputs = lib.sheet.defaultSheetInputs('cable-in-air');
    inputs.candidates = [testCable240];
    inputs.chosenCandidateId = testCable240.id;
    inputs.overTime = { checked: true, overloadCurrentA: 900, overloadDurationS: 1800, dailyProfileA: hourly(500, 250), faultWithCoverings: fault };
    return inputs;
  };
  cases.push({ name: 'computeBeyondSteady: cable, overload + daily', run: (lib) => lib.sheet.computeBeyondSteady(cableSheet(lib, false), testCable240.id) });
  cases.push({ name: 'computeBeyondSteady: cable, fault with coverings', expectedToMove: true, run: (lib) => lib.sheet.computeBeyondSteady(cableSheet(lib, true), testCable240.id) });
  const bar100 = testCopperBar(100, 10, { emissivity: 0.4 });
  cases.push({
    name: 'computeBeyondSteady: bar along the run + over time',
    run: (lib) => {
      const inputs = lib.sheet.defaultSheetInputs('bar-on-edge');
      inputs.circuit = { ...inputs.circuit, designCurrentA: 1000 };
      inputs.environment = { ...inputs.environment, ambientC: 35 };
      inputs.candidates = [bar100];
      inputs.chosenCandidateId = bar100.id;
      inputs.overTime = { checked: true, overloadCurrentA: 1500, overloadDurationS: 1800, dailyProfileA: hourly(1100, 600), faultWithCoverings: false };
      inputs.alongRun = { checked: true, lengthM: 4, startEnd: 'terminal', startTemperatureC: 100, endEnd: 'insulated', endTemperatureC: 70, joints: [{ positionM: 2, resistanceMicroOhm: 12 }] };
      return lib.sheet.computeBeyondSteady(inputs, bar100.id);
    },
  });
}

const COUNTERS = new Set(['iterations', 'tridiagonalSolves', 'tangent', 'lagged', 'energyResidual', 'residual']);

interface Difference {
  worst: number;
  where: string;
  /** Hot-spot positions that moved: only meaningful where the field is not flat (listed apart). */
  positions: string[];
  strings: string[];
  counters: string[];
  shape: string[];
}

function compare(a: unknown, b: unknown, at: string, d: Difference): void {
  const key = at.slice(at.lastIndexOf('.') + 1);
  if (typeof a === 'number' && typeof b === 'number') {
    if (COUNTERS.has(key)) {
      if (a !== b) d.counters.push(`${at}: ${a} → ${b}`);
      return;
    }
    if (a === b || (Number.isNaN(a) && Number.isNaN(b))) return;
    if (/hotSpot\.position(M)?$/.test(at)) {
      d.positions.push(`${at}: ${a} → ${b}`);
      return;
    }
    const rel = Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));
    // Heat flows that are round-off of zero (≤ 1e-9 W) carry no relative meaning.
    const meaningful = Math.max(Math.abs(a), Math.abs(b)) > 1e-9;
    if (meaningful && rel > d.worst) {
      d.worst = rel;
      d.where = `${at} (${a} → ${b})`;
    }
    return;
  }
  if (typeof a === 'string' && typeof b === 'string') {
    if (a !== b) d.strings.push(`${at}:\n      ${a}\n    → ${b}`);
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) d.shape.push(`${at}: length ${a.length} → ${b.length}`);
    for (let i = 0; i < Math.min(a.length, b.length); i++) compare(a[i], b[i], `${at}[${i}]`, d);
    return;
  }
  if (a && b && typeof a === 'object' && typeof b === 'object') {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    for (const k of keys) {
      const ka = k in a;
      const kb = k in b;
      if (!ka || !kb) {
        d.shape.push(`${at}.${k}: ${ka ? 'removed' : 'added'}`);
        continue;
      }
      compare((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${at}.${k}`, d);
    }
    return;
  }
  if (a !== b) d.shape.push(`${at}: ${String(a)} → ${String(b)}`);
}

function outcome(lib: Lib, c: Case): unknown {
  try {
    return JSON.parse(JSON.stringify(c.run(lib), (_k, v) => (v === Infinity ? 'Infinity' : v === -Infinity ? '-Infinity' : v)));
  } catch (e) {
    return { threw: e instanceof Error ? `${e.name}: ${e.message}` : String(e) };
  }
}

async function main(): Promise<void> {
  const baselineRoot = process.argv[2];
  if (!baselineRoot) throw new Error('usage: tsx scripts/compare-thermal-baseline.ts <baseline root>');
  await sheetCases();
  const baseline = await load(path.resolve(baselineRoot));
  const current = await load(path.resolve(__dirname, '..'));
  let worstUnchanged = 0;
  for (const moving of [false, true]) {
    console.log(moving ? '\nExpected to move (fault over time):' : 'Expected equal to ≤ 1e-7 relative:');
    for (const c of cases.filter((x) => !!x.expectedToMove === moving)) {
      const d: Difference = { worst: 0, where: '', positions: [], strings: [], counters: [], shape: [] };
      const before = outcome(baseline, c);
      const after = outcome(current, c);
      compare(before, after, 'result', d);
      const threw = (o: unknown) => (o && typeof o === 'object' && 'threw' in o ? ` [threw: ${(o as { threw: string }).threw}]` : '');
      if (threw(before) || threw(after)) d.strings.push(`outcome:${threw(before)} →${threw(after)}`);
      if (!moving) worstUnchanged = Math.max(worstUnchanged, d.worst);
      const verdict = moving ? '' : d.worst <= 1e-7 && d.strings.length === 0 && d.shape.length === 0 ? 'ok  ' : 'DIFF';
      console.log(`  ${verdict} ${c.name}: max rel ${d.worst.toExponential(2)}${d.where ? ` at ${d.where}` : ''}`);
      for (const s of d.shape.slice(0, 6)) console.log(`      shape ${s}`);
      for (const s of d.positions.slice(0, 3)) console.log(`      hot-spot position (a flat field's hottest cell is round-off) ${s}`);
      for (const s of d.strings.slice(0, 4)) console.log(`      string ${s}`);
      if (d.worst === 0 && d.strings.length === 0 && d.shape.length === 0 && moving) console.log('      (unchanged)');
      if (d.counters.length) console.log(`      counters: ${d.counters.slice(0, 4).join('; ')}${d.counters.length > 4 ? ` (+${d.counters.length - 4})` : ''}`);
    }
  }
  console.log(`\nLargest relative difference over the unchanged cases: ${worstUnchanged.toExponential(2)} (bar: 1e-7)`);
}

void main();

/**
 * Property-based tests (fast-check). For thousands of random valid problems the solver returns
 * finite temperatures with the energy balance closed and the hot spot above ambient whenever the
 * source heats, or — for a Joule source only — a runaway report; never a NaN. For thousands of
 * random invalid problems it throws ThermalInputError naming the corrupted field.
 * (Physical basis of "hot spot above ambient": the maximum principle for conduction with a
 * non-negative source and surroundings at one temperature — Incropera ch. 3, from memory.)
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveSteady, ThermalInputError, type Boundary, type ConvectionSpec, type Layer, type Source, type ThermalProblem } from '@/lib/thermal';
import { findNaN } from './helpers';

const between = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
/** Log-uniform positive values, so that small and large magnitudes are both exercised. */
const logBetween = (min: number, max: number) => between(Math.log(min), Math.log(max)).map(Math.exp);

const layerArb: fc.Arbitrary<Layer> = fc.record({
  thickness: logBetween(1e-4, 0.05),
  conductivity: logBetween(0.05, 400),
  generating: fc.boolean(),
  cells: fc.integer({ min: 1, max: 40 }),
});

const sourceArb: fc.Arbitrary<Source> = fc.oneof(
  fc.record({ kind: fc.constant('uniform' as const), q: logBetween(1, 1e7) }),
  fc.record({
    kind: fc.constant('joule' as const),
    current: fc.oneof(fc.constant(0), logBetween(1e-3, 3000)),
    area: logBetween(1e-6, 1e-3),
    rho20: logBetween(1e-9, 1e-7),
    alpha20: between(0, 5e-3),
    acFactor: between(1, 1.5),
  }),
);

function convectionArb(cylinderOuter: boolean): fc.Arbitrary<ConvectionSpec> {
  const plates: fc.Arbitrary<ConvectionSpec>[] = [
    fc.record({ kind: fc.constant('vertical-plate' as const), height: logBetween(0.005, 2) }),
    fc.record({ kind: fc.constant('horizontal-plate' as const), facing: fc.constantFrom('up' as const, 'down' as const), length: logBetween(0.003, 1) }),
    fc.record({ kind: fc.constant('forced-plate' as const), velocity: logBetween(0.1, 20), length: logBetween(0.005, 2) }),
  ];
  const cylinders: fc.Arbitrary<ConvectionSpec>[] = [
    fc.constant({ kind: 'horizontal-cylinder' as const }),
    fc.record({ kind: fc.constant('forced-cylinder' as const), velocity: logBetween(0.1, 20) }),
  ];
  return fc.oneof(...(cylinderOuter ? [...plates, ...cylinders] : plates));
}

/** Absorbed (solar) flux: none most of the time, sometimes up to 1 kW/m². */
const absorbedArb = fc.oneof(fc.constant(0), logBetween(1e-3, 1000));

function surfaceArb(ambient: number, cylinderOuter: boolean): fc.Arbitrary<Boundary> {
  return fc.oneof(
    fc.record({ kind: fc.constant('surface' as const), ambient: fc.constant(ambient), h: logBetween(0.5, 200), emissivity: between(0, 1), absorbedFlux: absorbedArb }),
    fc.record({ kind: fc.constant('surface' as const), ambient: fc.constant(ambient), emissivity: between(0, 1), convection: convectionArb(cylinderOuter), absorbedFlux: absorbedArb }),
    cylinderOuter
      ? fc.constant<Boundary>({ kind: 'surface', ambient, convection: { kind: 'iec-60287-free-air' } })
      : fc.constant<Boundary>({ kind: 'surface', ambient, h: 10 }),
  );
}

/** A valid problem whose boundaries all refer to one ambient temperature. */
const problemArb: fc.Arbitrary<{ problem: ThermalProblem; ambient: number }> = fc
  .record({
    kind: fc.constantFrom('slab' as const, 'cylinder' as const),
    solid: fc.boolean(),
    innerRadius: logBetween(1e-3, 0.05),
    layers: fc.array(layerArb, { minLength: 1, maxLength: 4 }),
    generatingIndex: fc.nat(),
    source: sourceArb,
    ambient: between(-30, 50),
    innerChoice: fc.nat({ max: 3 }),
    inFlux: logBetween(1, 1e3),
  })
  .chain((p) =>
    fc.record({ outer: fc.oneof(surfaceArb(p.ambient, p.kind === 'cylinder'), fc.constant<Boundary>({ kind: 'temperature', value: p.ambient })), inner: surfaceArb(p.ambient, false) }).map(
      ({ outer, inner: innerSurface }) => {
        const layers = p.layers.map((l) => ({ ...l }));
        layers[p.generatingIndex % layers.length].generating = true;
        const solid = p.kind === 'cylinder' && p.solid;
        const innerOptions: Boundary[] = [
          { kind: 'symmetry' },
          { kind: 'temperature', value: p.ambient },
          innerSurface,
          { kind: 'flux', value: p.inFlux }, // heat entering: still a heating problem
        ];
        const inner = solid ? ({ kind: 'symmetry' } as Boundary) : innerOptions[p.innerChoice];
        const problem: ThermalProblem = {
          geometry: { kind: p.kind, ...(p.kind === 'cylinder' ? { innerRadius: solid ? 0 : p.innerRadius } : {}), layers },
          source: p.source,
          inner,
          outer,
        };
        return { problem, ambient: p.ambient };
      },
    ),
  );

describe('random valid problems', () => {
  it('converge to finite temperatures with a closed energy balance and a hot spot above ambient (or report runaway, Joule only)', () => {
    fc.assert(
      fc.property(problemArb, ({ problem, ambient }) => {
        const r = solveSteady(problem);
        expect(findNaN(r)).toBeUndefined();
        if (r.converged) {
          expect(r.temperatures.length).toBe(r.positions.length);
          for (const t of r.temperatures) expect(Number.isFinite(t)).toBe(true);
          expect(r.energyResidual).toBeLessThanOrEqual(1e-6);
          // Something heats the body unless it is a Joule source at 0 A with no sun and no flux in.
          const absorbed = [problem.inner, problem.outer].some((b) => b.kind === 'surface' && (b.absorbedFlux ?? 0) > 0);
          const heats = problem.source.kind === 'uniform' || problem.source.current > 0 || absorbed || problem.inner.kind === 'flux';
          if (heats) {
            expect(r.hotSpot.temperature).toBeGreaterThanOrEqual(ambient);
            // A rise can only fail to show when it is below a double's resolution at this
            // temperature (ulp ≈ 7e-15 K at 50 °C): a Joule source of next to nothing and no other heat in.
            const generated = r.heatGeneratedWPerM2 ?? r.heatGeneratedWPerM ?? 0;
            const onlyJoule = problem.source.kind === 'joule' && !absorbed && problem.inner.kind !== 'flux';
            if (r.hotSpot.temperature === ambient) expect(onlyJoule && generated < 1e-9).toBe(true);
          }
          else expect(Math.abs(r.hotSpot.temperature - ambient)).toBeLessThan(1e-9);
          expect(r.runaway).toBeUndefined();
        } else {
          // Only a temperature-dependent (Joule) source may fail to have a steady state.
          expect(problem.source.kind).toBe('joule');
          expect(r.runaway).toBeDefined();
          expect(r.temperatures).toEqual([]);
          expect(r.hotSpot.temperature).toBe(Infinity);
          const current = (problem.source as { current: number }).current;
          expect(r.runaway!.current!).toBeGreaterThanOrEqual(0);
          expect(r.runaway!.current!).toBeLessThanOrEqual(current);
        }
      }),
      { numRuns: 2000 },
    );
  }, 120_000);
});

type Mutation = { field: string; apply: (p: ThermalProblem) => void };

const badPositive = fc.constantFrom(0, -1e-3, NaN, Infinity, -Infinity);

const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  fc.tuple(fc.nat(), badPositive).map(([i, v]) => ({
    field: 'thickness',
    apply: (p: ThermalProblem) => {
      const j = i % p.geometry.layers.length;
      p.geometry.layers[j].thickness = v;
      (p as { __field?: string }).__field = `geometry.layers[${j}].thickness`;
    },
  })),
  fc.tuple(fc.nat(), badPositive).map(([i, v]) => ({
    field: 'conductivity',
    apply: (p: ThermalProblem) => {
      const j = i % p.geometry.layers.length;
      p.geometry.layers[j].conductivity = v;
      (p as { __field?: string }).__field = `geometry.layers[${j}].conductivity`;
    },
  })),
  fc.tuple(fc.nat(), fc.constantFrom(0, -3, 2.5, NaN)).map(([i, v]) => ({
    field: 'cells',
    apply: (p: ThermalProblem) => {
      const j = i % p.geometry.layers.length;
      p.geometry.layers[j].cells = v;
      (p as { __field?: string }).__field = `geometry.layers[${j}].cells`;
    },
  })),
  fc.constant<Mutation>({ field: 'geometry.layers', apply: (p) => (p.geometry.layers = []) }),
  fc.constantFrom(-0.01, 1.0001, NaN, 7).map((e) => ({
    field: 'outer.emissivity',
    apply: (p: ThermalProblem) => (p.outer = { kind: 'surface', ambient: 20, h: 5, emissivity: e }),
  })),
  fc.constantFrom(-273.16, -500, NaN).map((t) => ({ field: 'outer.ambient', apply: (p: ThermalProblem) => (p.outer = { kind: 'surface', ambient: t, h: 5 }) })),
  fc.constantFrom(-273.16, -1e4, Infinity).map((t) => ({ field: 'inner.value', apply: (p: ThermalProblem) => (p.inner = { kind: 'temperature', value: t }) })),
  fc.constantFrom(NaN, Infinity).map((q) => ({ field: 'source.q', apply: (p: ThermalProblem) => (p.source = { kind: 'uniform', q }) })),
  fc.constantFrom(-1, NaN).map((current) => ({
    field: 'source.current',
    apply: (p: ThermalProblem) => (p.source = { kind: 'joule', current, area: 1e-4, rho20: 1.7e-8, alpha20: 4e-3 }),
  })),
  fc.constantFrom(0, -1e-4, NaN).map((area) => ({
    field: 'source.area',
    apply: (p: ThermalProblem) => (p.source = { kind: 'joule', current: 10, area, rho20: 1.7e-8, alpha20: 4e-3 }),
  })),
  fc.constant<Mutation>({ field: 'geometry.kind', apply: (p) => ((p.geometry as { kind: string }).kind = 'sphere') }),
  fc.constantFrom(0, -5, 1.5).map((m) => ({ field: 'options.maxIterations', apply: (p: ThermalProblem) => (p.options = { maxIterations: m }) })),
);

describe('random invalid problems', () => {
  it('always throw ThermalInputError naming the corrupted field', () => {
    fc.assert(
      fc.property(problemArb, mutationArb, ({ problem }, mutation) => {
        const p = structuredClone(problem) as ThermalProblem & { __field?: string };
        mutation.apply(p);
        const expected = p.__field ?? mutation.field;
        delete p.__field;
        let thrown: unknown;
        try {
          solveSteady(p);
        } catch (e) {
          thrown = e;
        }
        expect(thrown).toBeInstanceOf(ThermalInputError);
        expect((thrown as ThermalInputError).field).toBe(expected);
      }),
      { numRuns: 2000 },
    );
  }, 120_000);
});

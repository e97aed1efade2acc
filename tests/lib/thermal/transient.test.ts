/**
 * Implicit-Euler step (physics.md §1: a_P gains ρcΔV/Δt, b gains ρcΔV/Δt·T_old) against hand
 * calculations, and its consistency with the steady solver. Material data for copper
 * (ρ = 8960 kg/m³, c = 385 J/(kg·K)) are common practice.
 */
import { describe, expect, it } from 'vitest';
import { solveSteady, solveTransient, ThermalInputError, type TransientProblem } from '@/lib/thermal';

describe('single implicit step vs hand calculation', () => {
  it('one cell between two fixed temperatures with a uniform source', () => {
    // δ = 0.01 m, k = 1: half-cell G = k/(δ/2) = 200 W/(m²·K); ρcδ/Δt = 1e6·0.01/10 = 1000;
    // T1 = (1000·20 + 200·50 + 200·30 + 1e5·0.01)/(1000 + 2·200) = 37000/1400 = 26.4285714
    const r = solveTransient({
      geometry: { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 1, generating: true, cells: 1, density: 1000, heatCapacity: 1000 }] },
      source: { kind: 'uniform', q: 1e5 },
      inner: { kind: 'temperature', value: 50 },
      outer: { kind: 'temperature', value: 30 },
      initial: 20,
      timeStep: 10,
    });
    expect(r.converged).toBe(true);
    expect(r.temperatures[0]).toBeCloseTo(26.4285714286, 9);
    expect(r.time).toBe(10);
    expect(r.history).toHaveLength(1);
  });

  it('adiabatic Joule-heated copper: the tangent S_p term sits inside the implicit step', () => {
    // J = 100 A / 1e-4 m² = 1e6 A/m²; q20 = J²ρ20 = 17241 W/m³; S_p = q20·α = 67.75713 W/(m³·K);
    // ρc/Δt = 8960·385/100 = 34496 W/(m³·K).
    // Implicit: 34496(T1 − 20) = 17241(1 + 3.93e-3(T1 − 20)) ⇒
    // T1 = (34496·20 + 17241(1 − 20·3.93e-3))/(34496 − 67.75713) = 20.5007807
    // (an explicit step would give 20 + 17241/34496 = 20.4997971).
    const problem = (linearisation: 'tangent' | 'lagged'): TransientProblem => ({
      geometry: { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 390, generating: true, cells: 1, density: 8960, heatCapacity: 385 }] },
      source: { kind: 'joule', current: 100, area: 1e-4, rho20: 1.7241e-8, alpha20: 3.93e-3 },
      inner: { kind: 'symmetry' },
      outer: { kind: 'symmetry' },
      initial: 20,
      timeStep: 100,
      options: { linearisation },
    });
    const tangent = solveTransient(problem('tangent'));
    expect(tangent.temperatures[0]).toBeCloseTo(20.5007807127, 9);
    expect(tangent.linearisation).toBe('tangent');
    expect(tangent.iterations).toBe(1);
    const lagged = solveTransient(problem('lagged'));
    expect(lagged.linearisation).toBe('lagged');
    expect(Math.abs(lagged.temperatures[0] - 20.5007807127)).toBeLessThan(1e-6); // the outer-iteration tolerance
    expect(lagged.iterations).toBeGreaterThan(1);
  });
});

describe('multi-step consistency', () => {
  const cable = (steps: number, timeStep: number): TransientProblem => ({
    geometry: {
      kind: 'cylinder',
      layers: [
        { thickness: 0.008, conductivity: 390, generating: true, cells: 10, density: 8960, heatCapacity: 385 },
        { thickness: 0.004, conductivity: 1 / 3.5, cells: 10, density: 1400, heatCapacity: 1500 },
      ],
    },
    source: { kind: 'joule', current: 400, area: Math.PI * 0.008 ** 2, rho20: 0.1e-3 * Math.PI * 0.008 ** 2, alpha20: 3.93e-3 },
    inner: { kind: 'symmetry' },
    outer: { kind: 'surface', ambient: 25, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' } },
    initial: 25,
    timeStep,
    steps,
  });

  it('each step closes generated = leaving + stored', () => {
    const r = solveTransient(cable(20, 60));
    expect(r.converged).toBe(true);
    expect(r.energyResidual).toBeLessThan(1e-6);
    expect(r.heatBalance.stored).toBeGreaterThan(0);
    // Heating from ambient: the hot spot rises monotonically step after step.
    const peaks = r.history.map((h) => Math.max(...h.temperatures));
    peaks.slice(1).forEach((p, i) => expect(p).toBeGreaterThan(peaks[i]));
  });

  it('long steps settle on the steady solution (implicit Euler is L-stable)', () => {
    const transient = solveTransient(cable(40, 1e5));
    const { initial: _i, timeStep: _t, steps: _s, ...steadyProblem } = cable(1, 1);
    const steady = solveSteady(steadyProblem);
    transient.temperatures.forEach((t, i) => expect(Math.abs(t - steady.temperatures[i])).toBeLessThan(1e-5));
  });
});

describe('transient input errors name the field', () => {
  const base = (): TransientProblem => ({
    geometry: { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 1, cells: 3, density: 1000, heatCapacity: 1000 }] },
    source: { kind: 'uniform', q: 0 },
    inner: { kind: 'symmetry' },
    outer: { kind: 'temperature', value: 20 },
    initial: 20,
    timeStep: 1,
  });
  const fieldOf = (p: unknown): string | undefined => {
    try {
      solveTransient(p as TransientProblem);
    } catch (e) {
      if (e instanceof ThermalInputError) return e.field;
      throw e;
    }
    return undefined;
  };
  it.each([
    ['geometry.layers[0].density', (p: TransientProblem) => delete p.geometry.layers[0].density],
    ['geometry.layers[0].heatCapacity', (p: TransientProblem) => delete p.geometry.layers[0].heatCapacity],
    ['timeStep', (p: TransientProblem) => (p.timeStep = 0)],
    ['steps', (p: TransientProblem) => (p.steps = 1.5)],
    ['initial', (p: TransientProblem) => (p.initial = [20, 20])],
    ['initial[1]', (p: TransientProblem) => (p.initial = [20, -300, 20])],
    ['initial', (p: TransientProblem) => (p.initial = NaN)],
  ])('%s', (field, mutate) => {
    const p = base();
    mutate(p);
    expect(fieldOf(p)).toBe(field);
  });
});

/**
 * Conductor with R(T) = R20[1 + α(T − 20)] behind a constant thermal resistance R_th to a fixed
 * temperature T_a (references.md, "the structure of IEC 60287-1-1 eq. (1) without dielectric or
 * sheath losses"):
 *   T_c = (T_a + I²R20·R_th(1 − 20α)) / (1 − I²R20·α·R_th),   runaway at I = 1/√(R20·α·R_th).
 * The closed form assumes negligible conductor ΔT; the test idealises the core with
 * k = 1e6 W/(m·K) so that assumption holds (core ΔT/rise ≈ 1/(4πk·R_th) ≈ 4e-7).
 */
import { describe, expect, it } from 'vitest';
import { solveSteady, type SolverOptions, type ThermalProblem } from '@/lib/thermal';
import { findNaN } from './helpers';

const rc = 0.01; // m
const ro = 0.015; // m
const kInsulation = 1 / 3.5; // XLPE ρ_T = 3.5 K·m/W (IEC 60287-2-1 Table 1, from memory)
const rTh = Math.log(ro / rc) / (2 * Math.PI * kInsulation); // K·m/W, Incropera §3.3.1
const r20 = 0.0754e-3; // Ω/m (IEC 60228, 240 mm² Cu max, from memory)
const alpha = 3.93e-3; // 1/K (IEC 60287-1-1 Table 1)
const tA = 30;
const area = Math.PI * rc * rc;
const iRunaway = 1 / Math.sqrt(r20 * alpha * rTh);

function closedForm(current: number): number {
  const x = current * current * r20 * rTh;
  return (tA + x * (1 - 20 * alpha)) / (1 - x * alpha);
}

function conductorProblem(current: number, options?: SolverOptions): ThermalProblem {
  return {
    geometry: {
      kind: 'cylinder',
      layers: [
        { thickness: rc, conductivity: 1e6, generating: true },
        { thickness: ro - rc, conductivity: kInsulation },
      ],
    },
    source: { kind: 'joule', current, area, rho20: r20 * area, alpha20: alpha },
    inner: { kind: 'symmetry' },
    outer: { kind: 'temperature', value: tA },
    ...(options ? { options } : {}),
  };
}

describe('conductor with R(T) behind a constant R_th (references.md closed form)', () => {
  it('matches T_c to 1e-4 of the rise from 10 % to 90 % of the runaway current (tangent form)', () => {
    for (const fraction of [0.1, 0.3, 0.5, 0.7, 0.8, 0.9]) {
      const current = fraction * iRunaway;
      const r = solveSteady(conductorProblem(current));
      const exact = closedForm(current);
      expect(r.converged).toBe(true);
      expect(r.linearisation).toBe('tangent');
      expect(Math.abs(r.hotSpot.temperature - exact)).toBeLessThanOrEqual(1e-4 * (exact - tA));
      // Joule heat per metre is I²R(T) of the catalogue resistance.
      expect(r.heatGeneratedWPerM! / (current * current * r20 * (1 + alpha * (exact - 20)))).toBeCloseTo(1, 4);
      expect(r.energyResidual).toBeLessThan(1e-6);
    }
  });

  it('the lagged form with under-relaxation reaches the same temperature and says so', () => {
    for (const fraction of [0.5, 0.9]) {
      const current = fraction * iRunaway;
      const r = solveSteady(conductorProblem(current, { linearisation: 'lagged', maxIterations: 1000 }));
      const exact = closedForm(current);
      expect(r.converged).toBe(true);
      expect(r.linearisation).toBe('lagged');
      expect(r.linearisationCounts.tangent).toBe(0);
      expect(r.iterations).toBeGreaterThan(5);
      expect(Math.abs(r.hotSpot.temperature - exact)).toBeLessThanOrEqual(1e-4 * (exact - tA));
    }
  });

  it('reports the exact onset current beside a converged result (within 2 %, in fact 1e-4)', () => {
    const r = solveSteady(conductorProblem(0.5 * iRunaway));
    expect(Math.abs(r.runawayOnsetCurrentA! / iRunaway - 1)).toBeLessThan(0.02);
    expect(Math.abs(r.runawayOnsetCurrentA! / iRunaway - 1)).toBeLessThan(1e-4);
  });

  it('above the runaway current: runaway with the onset current, no temperatures, nothing NaN', () => {
    for (const fraction of [1.0001, 1.05, 2, 10]) {
      const r = solveSteady(conductorProblem(fraction * iRunaway));
      expect(r.converged).toBe(false);
      expect(r.runaway).toBeDefined();
      expect(r.runaway!.criterion).toBe('eigenvalue');
      expect(Math.abs(r.runaway!.current! / iRunaway - 1)).toBeLessThan(0.02);
      expect(r.temperatures).toEqual([]);
      expect(r.hotSpot.temperature).toBe(Infinity);
      expect(r.hotSpot.position).toBeLessThanOrEqual(rc); // the unstable mode lives in the conductor
      expect(r.energyResidual).toBe(Infinity);
      expect(findNaN(r)).toBeUndefined();
      expect(r.flags.some((f) => f.code === 'thermal-runaway')).toBe(true);
    }
  });

  it('just below onset a (very hot) steady state still exists and is reported, flagged', () => {
    const current = 0.995 * iRunaway;
    const r = solveSteady(conductorProblem(current));
    expect(r.converged).toBe(true);
    const exact = closedForm(current);
    expect(Math.abs(r.hotSpot.temperature - exact)).toBeLessThanOrEqual(1e-4 * (exact - tA));
    expect(r.flags.some((f) => f.code === 'above-temperature-limit')).toBe(true);
  });
});

describe('an iteration that runs out of passes is not a runaway', () => {
  it('reports not converged, no runaway, no temperatures, the last iterate for diagnosis', () => {
    const r = solveSteady({
      ...conductorProblem(0.5 * iRunaway),
      outer: { kind: 'surface', ambient: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' } },
      options: { maxIterations: 1 },
    });
    expect(r.converged).toBe(false);
    expect(r.runaway).toBeUndefined();
    expect(r.temperatures).toEqual([]);
    expect(r.hotSpot.temperature).toBe(Infinity);
    expect(r.lastIterate).toHaveLength(80);
    expect(r.flags.some((f) => f.code === 'not-converged')).toBe(true);
    expect(findNaN(r)).toBeUndefined();
  });
});

describe('runaway with temperature-dependent surroundings (bisection on current)', () => {
  // Natural convection alone (no radiation): at large rises h stops growing (air properties held
  // at the table's end, β = 1/T_film falling), so Joule heating, growing linearly with T, wins.
  const problem = (current: number, temperatureLimit: number): ThermalProblem => ({
    ...conductorProblem(current),
    outer: { kind: 'surface', ambient: 30, convection: { kind: 'horizontal-cylinder' } },
    options: { temperatureLimit },
  });

  it('the reported current separates currents with a steady state below the limit from those without', () => {
    const limit = 250;
    const r = solveSteady(problem(3000, limit));
    expect(r.converged).toBe(false);
    expect(r.runaway?.criterion).toBe('temperature-limit');
    const onset = r.runaway!.current!;
    expect(onset).toBeGreaterThan(0);
    expect(onset).toBeLessThan(3000);
    expect(findNaN(r)).toBeUndefined();

    const below = solveSteady(problem(0.98 * onset, limit));
    expect(below.converged).toBe(true);
    expect(below.hotSpot.temperature).toBeLessThan(limit);
    expect(below.hotSpot.temperature).toBeGreaterThan(150); // close to the limit, not trivially far

    const above = solveSteady(problem(1.02 * onset, limit));
    expect(above.converged).toBe(false);
    expect(above.runaway).toBeDefined();
  });
});

/**
 * A prepared problem (lib/thermal prepare): validated and meshed once, solved at many currents,
 * AC factors and ambients.
 *
 * Outside references:
 *  - references.md closed form for a conductor with R(T) = R₂₀F[1 + α(T − 20)] behind a constant
 *    thermal resistance R_th to a fixed temperature T_a ("the structure of IEC 60287-1-1 eq. (1)
 *    without dielectric or sheath losses"):
 *      T_c = (T_a + I²R₂₀F·R_th(1 − 20α)) / (1 − I²R₂₀F·α·R_th),  runaway at I = 1/√(R₂₀F·α·R_th);
 *    the core is idealised with k = 1e6 W/(m·K) so its own ΔT is negligible, R_th = ln(r_o/r_c)/(2πk)
 *    (Incropera §3.3.1), as in runaway.test.ts.
 *  - physics.md §7: solveSteady is the contract; a prepared problem at (I, F, ambient) must give what
 *    solveSteady gives for the problem with those values put in (equal to ≤ 1e-7 relative; the
 *    code path is the same, so the results are asserted identical).
 */
import { describe, expect, it } from 'vitest';
import {
  busBarProblem,
  cableProblem,
  isThermalInputError,
  prepare,
  solveSteady,
  type JouleSource,
  type SurfaceBoundary,
  type ThermalProblem,
} from '@/lib/thermal';

const rc = 0.01;
const ro = 0.015;
const kInsulation = 1 / 3.5; // XLPE ρ_T = 3.5 K·m/W (IEC 60287-2-1 Table 1, from memory)
const rTh = Math.log(ro / rc) / (2 * Math.PI * kInsulation);
const r20 = 0.0754e-3; // Ω/m (IEC 60228, 240 mm² Cu max, from memory)
const alpha = 3.93e-3; // 1/K (IEC 60287-1-1 Table 1)
const area = Math.PI * rc * rc;

function closedForm(current: number, acFactor: number, tA: number): number {
  const x = current * current * r20 * acFactor * rTh;
  return (tA + x * (1 - 20 * alpha)) / (1 - x * alpha);
}

const conductor: ThermalProblem = {
  geometry: {
    kind: 'cylinder',
    layers: [
      { thickness: rc, conductivity: 1e6, generating: true },
      { thickness: ro - rc, conductivity: kInsulation },
    ],
  },
  source: { kind: 'joule', current: 100, area, rho20: r20 * area, alpha20: alpha },
  inner: { kind: 'symmetry' },
  outer: { kind: 'temperature', value: 30 },
};

function at(problem: ThermalProblem, currentA: number, acFactor: number, outer?: Partial<SurfaceBoundary> & { value?: number }): ThermalProblem {
  return {
    ...problem,
    source: { ...(problem.source as JouleSource), current: currentA, acFactor },
    ...(outer ? { outer: { ...problem.outer, ...outer } as ThermalProblem['outer'] } : {}),
  };
}

describe('prepared conductor behind R_th (references.md closed form)', () => {
  const prepared = prepare(conductor);
  const onset = (acFactor: number) => 1 / Math.sqrt(r20 * acFactor * alpha * rTh);

  it('matches T_c to 1e-4 of the rise at many currents and AC factors, in any order', () => {
    for (const [fraction, acFactor] of [[0.8, 1], [0.1, 1.3], [0.5, 1.02], [0.9, 1.1], [0.3, 1]] as const) {
      const current = fraction * onset(acFactor);
      const r = prepared.at(current, acFactor);
      const exact = closedForm(current, acFactor, 30);
      expect(r.converged).toBe(true);
      expect(Math.abs(r.hotSpot.temperature - exact)).toBeLessThanOrEqual(1e-4 * (exact - 30));
    }
  });

  it('the exact onset current 1/√(R₂₀F·α·R_th), per AC factor, beside each result and when asked', () => {
    for (const acFactor of [1, 1.25]) {
      expect(Math.abs(prepared.runawayOnsetCurrentA(acFactor)! / onset(acFactor) - 1)).toBeLessThan(1e-4);
      const r = prepared.at(0.5 * onset(acFactor), acFactor);
      expect(Math.abs(r.runawayOnsetCurrentA! / onset(acFactor) - 1)).toBeLessThan(1e-4);
    }
    // At and above the onset: runaway, no temperatures.
    const r = prepared.at(1.01 * onset(1.25), 1.25);
    expect(r.converged).toBe(false);
    expect(r.temperatures).toEqual([]);
    expect(r.runaway?.criterion).toBe('eigenvalue');
    expect(Math.abs(r.runaway!.current! / onset(1.25) - 1)).toBeLessThan(1e-4);
  });

  it('another outer ambient: the closed form with T_a replaced', () => {
    for (const tA of [10, 45]) {
      const current = 0.6 * onset(1);
      const r = prepared.at(current, 1, { outerAmbientC: tA });
      const exact = closedForm(current, 1, tA);
      expect(Math.abs(r.hotSpot.temperature - exact)).toBeLessThanOrEqual(1e-4 * (exact - tA));
      expect(r.faceTemperatures.outer).toBe(tA);
    }
  });

  it('validates once: a later change to the problem object is not seen', () => {
    const problem = structuredClone(conductor);
    const p = prepare(problem);
    const before = p.at(500, 1);
    problem.geometry.layers[1].thickness = -1;
    (problem.outer as { value: number }).value = 1e9;
    expect(p.at(500, 1)).toEqual(before);
  });
});

describe('prepare(problem).at(I, F, options) gives what solveSteady gives (physics.md §7)', () => {
  const cable = cableProblem({
    conductorDiameterM: 0.0175,
    currentA: 0,
    r20OhmPerM: 0.0754e-3,
    alpha20PerK: 3.93e-3,
    conductorConductivity: 390,
    layers: [
      { name: 'XLPE', thicknessM: 0.0026, thermalResistivityKmPerW: 3.5 },
      { name: 'PVC sheath', thicknessM: 0.0018, thermalResistivityKmPerW: 5.0 },
    ],
    outer: { kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' } },
  });
  const bar = busBarProblem({
    widthM: 0.1,
    thicknessM: 0.01,
    barsPerPhase: 1,
    currentA: 0,
    r20OhmPerM: 1.7241e-8 / 1e-3,
    alpha20PerK: 3.93e-3,
    conductivity: 390,
    orientation: 'edge',
    ambientC: 35,
    emissivity: 0.4,
  });

  it('a cable in air (natural convection and radiation) at currents up to past its temperature-limit runaway', () => {
    const p = prepare(cable);
    for (const [currentA, acFactor] of [[650, 1.02], [0, 1], [300, 1.3], [1200, 1.02], [12000, 1.02]] as const) {
      expect(p.at(currentA, acFactor)).toEqual(solveSteady(at(cable, currentA, acFactor)));
    }
    expect(p.at(12000, 1.02).runaway?.criterion).toBe('temperature-limit');
  });

  it('a bus bar with air on both faces, and each face at another ambient', () => {
    const p = prepare(bar);
    expect(p.at(1500, 1.05)).toEqual(solveSteady(at(bar, 1500, 1.05)));
    expect(p.at(1500, 1.05, { outerAmbientC: 42 })).toEqual(solveSteady(at(bar, 1500, 1.05, { ambient: 42 })));
    expect(p.at(1500, 1.05, { outerAmbientC: 42, innerAmbientC: 40 })).toEqual(
      solveSteady({ ...at(bar, 1500, 1.05, { ambient: 42 }), inner: { ...bar.inner, ambient: 40 } as SurfaceBoundary }),
    );
  });

  it('another ambient moves radiative surroundings left at the ambient, not ones given explicitly', () => {
    const p = prepare(cable);
    expect(p.at(700, 1, { outerAmbientC: 40 })).toEqual(solveSteady(at(cable, 700, 1, { ambient: 40 })));
    const withSurroundings: ThermalProblem = { ...cable, outer: { ...(cable.outer as SurfaceBoundary), surroundings: 30 } };
    const q = prepare(withSurroundings);
    expect(q.at(700, 1, { outerAmbientC: 40 })).toEqual(solveSteady(at(withSurroundings, 700, 1, { ambient: 40 })));
    expect(q.at(700, 1, { outerAmbientC: 40 }).hotSpot.temperature).not.toBe(p.at(700, 1, { outerAmbientC: 40 }).hotSpot.temperature);
  });

  it('solve() is solveSteady of the problem as given', () => {
    const given = at(cable, 480, 1.02);
    expect(prepare(given).solve()).toEqual(solveSteady(given));
  });
});

describe('input errors name the field', () => {
  const fieldOf = (fn: () => unknown): string | undefined => {
    try {
      fn();
    } catch (e) {
      if (isThermalInputError(e)) return e.field;
      throw e;
    }
    return undefined;
  };
  const p = prepare(conductor);

  it.each<[string, () => unknown]>([
    ['currentA', () => p.at(NaN, 1)],
    ['currentA', () => p.at(-1, 1)],
    ['acFactor', () => p.at(100, 0.9)],
    ['outerAmbientC', () => p.at(100, 1, { outerAmbientC: -300 })],
    ['innerAmbientC', () => p.at(100, 1, { innerAmbientC: 20 })], // the inner face is the axis (symmetry)
    ['source.kind', () => prepare({ ...conductor, source: { kind: 'uniform', q: 1e5 } }).at(100, 1)],
    ['geometry.layers[0].thickness', () => prepare({ ...conductor, geometry: { kind: 'cylinder', layers: [{ thickness: 0, conductivity: 1, generating: true }] } })],
  ])('%s', (field, fn) => {
    expect(fieldOf(fn)).toBe(field);
  });
});

/**
 * Bar run along its length (lib/thermal/barRun.ts) against the fin relations of Incropera et al.,
 * Fundamentals of Heat and Mass Transfer, §3.6 (fin equation d²θ/dx² − m²θ = 0, m² = hP/(kA_c)),
 * extended to uniform generation as written in shared/design/references.md:
 *   θ = T − T∞ − q'A⁻¹·A/(hP) = T − T∞ − q'/(hP),  θ(x) = θ_end·cosh(m(x − L/2))/cosh(mL/2)
 * for both ends at the same fixed temperature; and a point heat Q in a long fin, which splits
 * into two semi-infinite fins each taking Q/2 at the base: ΔT = (Q/2)/√(hPkA_c) (Incropera §3.6,
 * infinite-fin heat rate q_f = √(hPkA_c)·θ_b).
 * Copper: ρ₂₀ = 1.7241e-8 Ω·m (IEC 60287-1-1 Table 1), k = 390 W/(m·K) (common practice).
 */
import { describe, expect, it } from 'vitest';
import { busBarProblem, solveBarRun, solveSteady, type BarRunInput } from '@/lib/thermal';

const W = 0.1;
const T = 0.01;
const AREA = W * T;
const R20 = 1.7241e-8 / AREA;
const K = 390;
const AMBIENT = 35;
const H = 8;
/** Perimeter per bar with the edges lumped: 2(w + t). */
const P = 2 * (W + T);

function run(overrides: Partial<BarRunInput>): BarRunInput {
  return {
    lengthM: 2,
    widthM: W,
    thicknessM: T,
    currentA: 1500,
    r20OhmPerM: R20,
    alpha20PerK: 0,
    conductivityWPerMK: K,
    orientation: 'edge',
    ambientC: AMBIENT,
    emissivity: 0,
    fixedHWPerM2K: H,
    start: { kind: 'terminal', temperatureC: 45 },
    end: { kind: 'terminal', temperatureC: 45 },
    ...overrides,
  };
}

describe('fin with generation (references.md; Incropera §3.6)', () => {
  it('matches the closed form to second order (measured order ≥ 1.9)', () => {
    const L = 2;
    const qPerM = 1500 * 1500 * R20;
    const m = Math.sqrt((H * P) / (K * AREA));
    const thetaEnd = 45 - AMBIENT - qPerM / (H * P);
    const exact = (x: number) => AMBIENT + qPerM / (H * P) + (thetaEnd * Math.cosh(m * (x - L / 2))) / Math.cosh((m * L) / 2);
    const errors = [25, 50, 100, 200].map((cells) => {
      const r = solveBarRun(run({ cells }));
      expect(r.converged).toBe(true);
      let worst = 0;
      r.positionsM.forEach((x, i) => (worst = Math.max(worst, Math.abs(r.temperaturesC[i] - exact(x)))));
      return worst;
    });
    const orders = errors.slice(1).map((e, i) => Math.log2(errors[i] / e));
    for (const p of orders) expect(p).toBeGreaterThanOrEqual(1.9);
    expect(errors[errors.length - 1]).toBeLessThan(1e-3);
    // The hot spot is mid-run (symmetric ends, heat drained at both terminals).
    const fine = solveBarRun(run({ cells: 200 }));
    expect(Math.abs(fine.hotSpot.positionM - L / 2)).toBeLessThanOrEqual(L / 200);
    expect(fine.energyResidual).toBeLessThan(1e-9);
    expect(fine.heatIntoStartW).toBeGreaterThan(0);
  });
});

describe('bolted joint as point heat (Incropera §3.6, infinite fin)', () => {
  it('raises the local temperature by Q/(2√(hPkA_c))', () => {
    // mL/2 ≈ 21 for a 20 m run: each half is an infinite fin to e^-21.
    const L = 20;
    const cells = 2001; // the middle cell's centre sits at x = 10 m, the joint
    const ends = { start: { kind: 'insulated' as const }, end: { kind: 'insulated' as const } };
    const resistanceMicroOhm = 10;
    const plain = solveBarRun(run({ lengthM: L, cells, ...ends }));
    const jointed = solveBarRun(run({ lengthM: L, cells, ...ends, joints: [{ positionM: 10, resistanceMicroOhm }] }));
    const Q = 1500 * 1500 * resistanceMicroOhm * 1e-6;
    const expected = Q / (2 * Math.sqrt(H * P * K * AREA)); // ≈ 13.6 K
    const mid = Math.floor(cells / 2);
    const rise = jointed.temperaturesC[mid] - plain.temperaturesC[mid];
    expect(Math.abs(rise - expected)).toBeLessThan(0.01);
    expect(jointed.joints[0].temperatureC).toBeCloseTo(jointed.temperaturesC[mid], 12);
    expect(jointed.hotSpot.positionM).toBeCloseTo(10, 9);
    expect(jointed.flags.some((f) => f.code === 'joint-resistance-assumed')).toBe(false);
  });

  it('an unentered joint resistance takes the default and raises an assumption flag', () => {
    const r = solveBarRun(run({ joints: [{ positionM: 0.5 }] }));
    expect(r.joints[0].assumed).toBe(true);
    expect(r.flags.find((f) => f.code === 'joint-resistance-assumed')?.severity).toBe('warning');
  });
});

describe('consistency with the cross-section model', () => {
  it('a long run with insulated ends and no joints sits at the steady cross-section temperature (same correlations)', () => {
    // Nothing varies along the run, so axial conduction vanishes: each section is the
    // cross-section problem of busBarProblem (natural convection on a vertical plate, radiation).
    const common = { widthM: W, thicknessM: T, currentA: 1500, r20OhmPerM: R20, alpha20PerK: 3.93e-3, orientation: 'edge' as const, ambientC: AMBIENT, emissivity: 0.4 };
    const r = solveBarRun({ ...common, lengthM: 5, conductivityWPerMK: K, start: { kind: 'insulated' }, end: { kind: 'insulated' }, cells: 20 });
    const section = solveSteady(busBarProblem({ ...common, barsPerPhase: 1, conductivity: K }));
    expect(r.converged).toBe(true);
    // The section model resolves the (tiny) drop across the thickness; the run takes one
    // temperature per section: they agree to well under 0.01 K.
    for (const t of r.temperaturesC) expect(Math.abs(t - section.surfaceTemperature)).toBeLessThan(0.01);
    expect(r.energyResidual).toBeLessThan(1e-6);
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findLimitCurrent, type LimitEvaluation } from '@/lib/electrical';

/**
 * Reference (references.md, "Closed-form solutions"): a conductor with R(T) = R20[1 + α(T − 20)]
 * behind a constant thermal resistance R_th to ambient T_a:
 *   T_c = (T_a + I²R20·R_th(1 − 20α)) / (1 − I²R20·α·R_th),
 *   runaway at I = 1/√(R20·α·R_th), ampacity I = √((θmax − T_a)/(R(θmax)·R_th))
 * — the structure of IEC 60287-1-1 eq. (1) without dielectric or sheath losses.
 * This checks the root finder on its own, without the heat-balance solver.
 */
function model(r20: number, alpha: number, rth: number, ta: number, limit: number) {
  return (i: number): LimitEvaluation<number> => {
    const d = 1 - i * i * r20 * alpha * rth;
    if (d <= 0) return { kind: 'runaway' };
    const t = (ta + i * i * r20 * rth * (1 - 20 * alpha)) / d;
    return { kind: 'value', excessK: t - limit, riseK: t - ta, payload: t };
  };
}
const exactAmpacity = (r20: number, alpha: number, rth: number, ta: number, limit: number) =>
  Math.sqrt((limit - ta) / (r20 * (1 + alpha * (limit - 20)) * rth));

describe('bracketing root finder on the R(T)-behind-R_th closed form (references.md)', () => {
  it('finds √((θmax − Ta)/(R(θmax)·R_th)) to 0.1 A from below, within 30 evaluations', () => {
    const [r20, alpha, rth, ta, limit] = [1e-4, 3.93e-3, 1.0, 30, 90];
    const exact = exactAmpacity(r20, alpha, rth, ta, limit); // ≈ 686 A
    const root = findLimitCurrent(model(r20, alpha, rth, ta, limit), { guessA: 100 });
    expect(root.currentA).toBeLessThanOrEqual(exact);
    expect(exact - root.currentA).toBeLessThanOrEqual(0.1);
    expect(root.upperA).toBeGreaterThan(exact);
    expect(root.payload).toBeLessThanOrEqual(limit);
    expect(root.evaluations).toBeLessThanOrEqual(30);
  });

  it('holds for any data and any starting guess, including guesses beyond runaway (property, 300 runs)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e-2, noNaN: true }),
        fc.double({ min: 0, max: 4.5e-3, noNaN: true }),
        fc.double({ min: 0.05, max: 5, noNaN: true }),
        fc.double({ min: -20, max: 50, noNaN: true }),
        fc.double({ min: 1, max: 200, noNaN: true }),
        fc.double({ min: 0.01, max: 100, noNaN: true }),
        (r20, alpha, rth, ta, rise, guessScale) => {
          const limit = ta + rise;
          const exact = exactAmpacity(r20, alpha, rth, ta, limit);
          const root = findLimitCurrent(model(r20, alpha, rth, ta, limit), { guessA: exact * guessScale });
          expect(root.zero).toBe(false);
          expect(root.currentA).toBeLessThanOrEqual(exact * (1 + 1e-12));
          expect(exact - root.currentA).toBeLessThanOrEqual(0.1 + 1e-9);
          expect(root.evaluations).toBeLessThanOrEqual(30);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('reports zero current when the ambient is already at the limit', () => {
    const root = findLimitCurrent(model(1e-4, 3.93e-3, 1, 95, 90), { guessA: 500 });
    expect(root.zero).toBe(true);
    expect(root.currentA).toBe(0);
  });
});

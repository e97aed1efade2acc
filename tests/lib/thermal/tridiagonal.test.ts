/**
 * The Thomas algorithm and the Sturm-count eigenvalue bisection against an independent dense
 * reference from the npm registry: mathjs `lusolve` (LU with partial pivoting) and `eigs`
 * (references.md, "general-purpose reference libraries").
 */
import fc from 'fast-check';
import { eigs, lusolve } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { smallestGeneralizedEigenvalue, solveTridiagonal, ThermalInputError } from '@/lib/thermal';

function dense(lower: number[], diagonal: number[], upper: number[]): number[][] {
  const n = diagonal.length;
  return diagonal.map((d, i) => {
    const row = new Array<number>(n).fill(0);
    row[i] = d;
    if (i > 0) row[i - 1] = lower[i];
    if (i < n - 1) row[i + 1] = upper[i];
    return row;
  });
}

// Values on a grid of 1e-6 keep fast-check away from subnormal numbers, where relative error
// loses its meaning.
const gridDouble = (min: number, max: number) =>
  fc.integer({ min: Math.round(min * 1e6), max: Math.round(max * 1e6) }).map((v) => v / 1e6);
const entry = gridDouble(-10, 10);

/** Random strictly diagonally dominant tridiagonal system (any signs, not symmetric). */
const dominantSystem = fc.integer({ min: 1, max: 60 }).chain((n) =>
  fc.record({
    lower: fc.array(entry, { minLength: n, maxLength: n }),
    upper: fc.array(entry, { minLength: n, maxLength: n }),
    margin: fc.array(gridDouble(0.01, 5), { minLength: n, maxLength: n }),
    signs: fc.array(fc.boolean(), { minLength: n, maxLength: n }),
    rhs: fc.array(gridDouble(-1e3, 1e3), { minLength: n, maxLength: n }),
  }).map(({ lower, upper, margin, signs, rhs }) => {
    lower[0] = 0;
    upper[n - 1] = 0;
    const diagonal = margin.map((m, i) => (signs[i] ? 1 : -1) * (Math.abs(lower[i]) + Math.abs(upper[i]) + m));
    return { lower, diagonal, upper, rhs };
  }),
);

describe('solveTridiagonal (Thomas) vs mathjs lusolve', () => {
  it('agrees on 300 random strictly diagonally dominant systems to 1e-10 relative', () => {
    fc.assert(
      fc.property(dominantSystem, ({ lower, diagonal, upper, rhs }) => {
        const x = solveTridiagonal(lower, diagonal, upper, rhs);
        const reference = (lusolve(dense(lower, diagonal, upper), rhs) as number[][]).map((row) => row[0]);
        const scale = Math.max(1e-300, ...reference.map(Math.abs));
        const worst = Math.max(...reference.map((r, i) => Math.abs(x[i] - r)));
        expect(worst / scale).toBeLessThan(1e-10);
      }),
      { numRuns: 300 },
    );
  }, 60_000);

  it('refuses malformed systems with a named field', () => {
    expect(() => solveTridiagonal([0, 1], [2, 2], [1, 0], [1])).toThrow(ThermalInputError);
    expect(() => solveTridiagonal([0], [0], [0], [1])).toThrow(/diagonal\[0\]/);
    expect(() => solveTridiagonal([0, 1], [2, NaN], [1, 0], [1, 1])).toThrow(/diagonal\[1\]/);
    expect(() => solveTridiagonal([], [], [], [])).toThrow(ThermalInputError);
  });
});

describe('smallestGeneralizedEigenvalue (Sylvester-count bisection) vs mathjs eigs', () => {
  it('finds λ_min of K v = λ D v for random conductance matrices and positive D', () => {
    const system = fc.integer({ min: 2, max: 20 }).chain((n) =>
      fc.record({
        g: fc.array(gridDouble(0.01, 100), { minLength: n - 1, maxLength: n - 1 }),
        boundary: fc.tuple(gridDouble(0, 50), gridDouble(0.01, 50)),
        d: fc.array(gridDouble(0.01, 10), { minLength: n, maxLength: n }),
      }),
    );
    fc.assert(
      fc.property(system, ({ g, boundary, d }) => {
        const n = d.length;
        const kDiag = new Float64Array(n);
        for (let i = 0; i < n; i++) kDiag[i] = (i > 0 ? g[i - 1] : 0) + (i < n - 1 ? g[i] : 0);
        kDiag[0] += boundary[0];
        kDiag[n - 1] += boundary[1];
        const lambda = smallestGeneralizedEigenvalue(kDiag, Float64Array.from(g), Float64Array.from(d));
        // Reference: the symmetric standard problem D^-½ K D^-½.
        const s = d.map((v) => 1 / Math.sqrt(v));
        const m = Array.from({ length: n }, (_, i) =>
          Array.from({ length: n }, (_, j) => {
            const kij = i === j ? kDiag[i] : Math.abs(i - j) === 1 ? -g[Math.min(i, j)] : 0;
            return s[i] * kij * s[j];
          }),
        );
        const values = (eigs(m).values as number[]).map(Number);
        const reference = Math.min(...values);
        expect(Math.abs(lambda - reference)).toBeLessThan(1e-8 * Math.max(...values.map(Math.abs)));
      }),
      { numRuns: 100 },
    );
  }, 60_000);
});

import { complex, lusolve, matrix, type Complex as MathComplex, type Matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { factorComplexSymmetric, solveComplexGeneral, solveComplexSymmetric, solveRealGeneral } from '@/lib/electrical/busbar/complexDense';

/** Deterministic pseudo-random numbers in [−1, 1) (a 32-bit LCG, Numerical Recipes constants). */
function generator(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 31 - 1;
  };
}

function mathjsSolve(n: number, re: Float64Array, im: Float64Array, bRe: Float64Array, bIm: Float64Array) {
  const rows = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => complex(re[i * n + j], im[i * n + j])));
  const rhs = Array.from({ length: n }, (_, i) => [complex(bRe[i], bIm[i])]);
  const x = lusolve(matrix(rows), matrix(rhs)) as Matrix;
  return (x.toArray() as unknown as MathComplex[][]).map((row) => row[0]);
}

describe('complex symmetric L·D·Lᵀ solve — checked against mathjs lusolve (LU with pivoting)', () => {
  it.each([1, 2, 7, 40])('random Z = R + jX with R diagonal positive, X symmetric, n = %i', (n) => {
    const random = generator(1000 + n);
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j <= i; j++) {
        const x = random() * 3;
        im[i * n + j] = x;
        im[j * n + i] = x;
      }
      re[i * n + i] = 0.01 + Math.abs(random()); // small real parts: the hard case for no pivoting
    }
    const bRe = Float64Array.from({ length: n }, random);
    const bIm = Float64Array.from({ length: n }, random);
    const expected = mathjsSolve(n, re, im, bRe, bIm);
    const xRe = bRe.slice();
    const xIm = bIm.slice();
    solveComplexSymmetric(factorComplexSymmetric(n, re.slice(), im.slice()), xRe, xIm);
    const scale = Math.max(...expected.map((c) => Math.hypot(c.re, c.im)));
    for (let i = 0; i < n; i++) {
      expect(Math.abs(xRe[i] - expected[i].re) / scale).toBeLessThan(1e-9);
      expect(Math.abs(xIm[i] - expected[i].im) / scale).toBeLessThan(1e-9);
    }
  });

  it('refuses a matrix whose pivot vanishes (not of the positive-definite-real-part kind)', () => {
    // [[0, 1], [1, 0]]: the first pivot is zero; elimination without pivoting must stop, not divide by zero.
    expect(() => factorComplexSymmetric(2, new Float64Array([0, 1, 1, 0]), new Float64Array(4))).toThrow(/pivot 0/);
  });
});

describe('general complex solve with partial pivoting — checked against mathjs lusolve', () => {
  it.each([1, 3, 6])('random non-symmetric complex matrix, n = %i', (n) => {
    const random = generator(77 + n);
    const re = Float64Array.from({ length: n * n }, random);
    const im = Float64Array.from({ length: n * n }, random);
    // A zero leading entry forces a row exchange.
    re[0] = 0;
    im[0] = 0;
    const bRe = Float64Array.from({ length: n }, random);
    const bIm = Float64Array.from({ length: n }, random);
    if (n === 1) {
      re[0] = 0.5;
      im[0] = -0.25;
    }
    const expected = mathjsSolve(n, re, im, bRe, bIm);
    const x = solveComplexGeneral(n, re, im, bRe, bIm);
    for (let i = 0; i < n; i++) {
      expect(x.re[i]).toBeCloseTo(expected[i].re, 10);
      expect(x.im[i]).toBeCloseTo(expected[i].im, 10);
    }
  });

  it('refuses a singular matrix', () => {
    expect(() => solveComplexGeneral(2, [1, 2, 2, 4], [0, 0, 0, 0], [1, 1], [0, 0])).toThrow(/singular/);
  });
});

describe('real solve with several right-hand sides — checked against mathjs lusolve', () => {
  it('random 9 × 9 system, 3 right-hand sides, zero leading entry', () => {
    const random = generator(4242);
    const n = 9;
    const a = Float64Array.from({ length: n * n }, random);
    a[0] = 0;
    const b = Float64Array.from({ length: n * 3 }, random);
    const x = solveRealGeneral(n, a, b, 3);
    const rows = Array.from({ length: n }, (_, i) => Array.from(a.slice(i * n, i * n + n)));
    for (let c = 0; c < 3; c++) {
      const expected = (lusolve(rows, Array.from({ length: n }, (_, i) => b[i * 3 + c])) as number[][]).map((r) => r[0]);
      expected.forEach((v, i) => expect(x[i * 3 + c]).toBeCloseTo(v, 10));
    }
  });
});

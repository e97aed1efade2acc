/**
 * The tridiagonal (Thomas) solve against independent references computed inside the case:
 * Gaussian elimination with partial pivoting on the full matrix (Golub & Van Loan, Matrix
 * Computations, §3.4), and a manufactured system whose exact solution is known. (The vitest suite
 * also compares with mathjs `lusolve`, a reference library from the npm registry.)
 */
import type { VerificationCase } from '../types';

/** Small deterministic generator (mulberry32), so the page and the tests solve the same system. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface TridiagonalSystem {
  lower: number[];
  diagonal: number[];
  upper: number[];
  rhs: number[];
}

/** A random non-symmetric, strictly diagonally dominant system (well posed). */
export function randomTridiagonalSystem(n: number, seed: number): TridiagonalSystem {
  const random = seededRandom(seed);
  const lower: number[] = [];
  const upper: number[] = [];
  const diagonal: number[] = [];
  const rhs: number[] = [];
  for (let i = 0; i < n; i++) {
    lower.push(i === 0 ? 0 : -(0.1 + random()));
    upper.push(i === n - 1 ? 0 : -(0.1 + random()));
    diagonal.push(Math.abs(lower[i]) + Math.abs(upper[i]) + 0.05 + random());
    rhs.push(200 * random() - 100);
  }
  return { lower, diagonal, upper, rhs };
}

export function denseMatrix(system: TridiagonalSystem): number[][] {
  const n = system.diagonal.length;
  return Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => (j === i ? system.diagonal[i] : j === i - 1 ? system.lower[i] : j === i + 1 ? system.upper[i] : 0)),
  );
}

/** Dense Gaussian elimination with partial pivoting and back substitution. */
export function denseGaussianSolve(matrix: number[][], rhs: number[]): number[] {
  const n = rhs.length;
  const a = matrix.map((row, i) => [...row, rhs[i]]);
  for (let col = 0; col < n; col++) {
    let pivotRow = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r][col]) > Math.abs(a[pivotRow][col])) pivotRow = r;
    [a[col], a[pivotRow]] = [a[pivotRow], a[col]];
    for (let r = col + 1; r < n; r++) {
      const factor = a[r][col] / a[col][col];
      if (factor === 0) continue;
      for (let c = col; c <= n; c++) a[r][c] -= factor * a[col][c];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let sum = a[r][n];
    for (let c = r + 1; c < n; c++) sum -= a[r][c] * x[c];
    x[r] = sum / a[r][r];
  }
  return x;
}

function maxRelativeDifference(x: ArrayLike<number>, reference: number[]): number {
  const scale = Math.max(...reference.map(Math.abs));
  let worst = 0;
  for (let i = 0; i < reference.length; i++) {
    const d = Math.abs(x[i] - reference[i]) / scale;
    if (!(d <= worst)) worst = d;
  }
  return x.length === reference.length ? worst : Number.POSITIVE_INFINITY;
}

const SYSTEM_SIZE = 60;
const SYSTEM_SEEDS = [20240601, 7, 99991];

const thomasVsDense: VerificationCase = {
  id: 'tridiagonal-vs-dense-elimination',
  title: 'Tridiagonal solve against dense Gaussian elimination on random systems',
  area: 'linear-algebra',
  source: { kind: 'independent computation', citation: 'Gaussian elimination with partial pivoting on the full matrix (Golub & Van Loan, §3.4), written in the case' },
  inputs: [
    { name: 'unknowns', value: SYSTEM_SIZE },
    { name: 'systems (seeded, non-symmetric, diagonally dominant)', value: SYSTEM_SEEDS.length },
  ],
  notes: 'Largest |x_Thomas − x_dense| over all unknowns and systems, divided by the largest |x_dense| of its system.',
  quantities: [{ key: 'difference', label: 'largest relative difference', unit: '', reference: 0, tolerance: { kind: 'absolute', value: 1e-12 } }],
  compute(lib) {
    let worst = 0;
    for (const seed of SYSTEM_SEEDS) {
      const s = randomTridiagonalSystem(SYSTEM_SIZE, seed);
      const x = lib.solveTridiagonal(s.lower, s.diagonal, s.upper, s.rhs);
      const dense = denseGaussianSolve(denseMatrix(s), s.rhs);
      const d = maxRelativeDifference(x, dense);
      if (!(d <= worst)) worst = d;
    }
    return { values: { difference: worst } };
  },
};

// A = tridiag(−1, 2, −1), the 1-D Laplacian: symmetric positive definite but only weakly
// diagonally dominant, and its condition number grows as n², a harder test than the random set.
const LAPLACIAN_SIZE = 200;
const manufactured = Array.from({ length: LAPLACIAN_SIZE }, (_, i) => Math.sin(0.37 * (i + 1)) + 0.01 * (i + 1));
const manufacturedCase: VerificationCase = {
  id: 'tridiagonal-manufactured-solution',
  title: 'Tridiagonal solve of the 1-D Laplacian with a known solution',
  area: 'linear-algebra',
  source: { kind: 'independent computation', citation: 'Manufactured solution: b = A·x_exact for A = tridiag(−1, 2, −1) (e.g. Golub & Van Loan, §4.3)' },
  inputs: [
    { name: 'unknowns', value: LAPLACIAN_SIZE },
    { name: 'x_exact(i)', value: 'sin(0.37·i) + 0.01·i' },
  ],
  notes: 'The condition number of A is about 4n²/π² ≈ 1.6e4, so round-off allows a few units in the 12th digit.',
  quantities: [{ key: 'error', label: 'largest |x − x_exact|', unit: '', reference: 0, tolerance: { kind: 'absolute', value: 1e-9 } }],
  compute(lib) {
    const n = LAPLACIAN_SIZE;
    const lower = Array.from({ length: n }, (_, i) => (i === 0 ? 0 : -1));
    const upper = Array.from({ length: n }, (_, i) => (i === n - 1 ? 0 : -1));
    const diagonal = new Array<number>(n).fill(2);
    const rhs = manufactured.map((x, i) => 2 * x - (i > 0 ? manufactured[i - 1] : 0) - (i < n - 1 ? manufactured[i + 1] : 0));
    const x = lib.solveTridiagonal(lower, diagonal, upper, rhs);
    let worst = 0;
    for (let i = 0; i < n; i++) {
      const e = Math.abs(x[i] - manufactured[i]);
      if (!(e <= worst)) worst = e;
    }
    return { values: { error: worst } };
  },
};

export const linearAlgebraCases: VerificationCase[] = [thomasVsDense, manufacturedCase];

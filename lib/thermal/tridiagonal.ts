/**
 * Tridiagonal solve by the Thomas algorithm (Gaussian elimination without pivoting specialised
 * to three diagonals; e.g. Patankar 1980, §4.3-1 "TDMA"): O(N) work, typed arrays, no matrix.
 *
 * Row i reads  lower[i]·x[i−1] + diagonal[i]·x[i] + upper[i]·x[i+1] = rhs[i]
 * (lower[0] and upper[n−1] are ignored).
 */
import { ThermalInputError } from './errors';

/**
 * Solve in place into `x`, using `scratch` (length ≥ n) for the modified upper diagonal.
 * Returns the smallest pivot divided by the magnitude of its diagonal entry. For the symmetric
 * matrices the solver builds, all pivots positive ⇔ the matrix is positive definite (pivots
 * of LDLᵀ; Sylvester), which is what the caller checks before trusting a tangent linearisation.
 */
export function thomas(
  n: number,
  lower: Float64Array,
  diagonal: Float64Array,
  upper: Float64Array,
  rhs: Float64Array,
  x: Float64Array,
  scratch: Float64Array,
): number {
  // Typed arrays only: one element kind keeps V8's property access monomorphic in the hot loop.
  let pivot = diagonal[0];
  let minRatio = pivot / Math.abs(diagonal[0]);
  scratch[0] = upper[0] / pivot;
  x[0] = rhs[0] / pivot;
  for (let i = 1; i < n; i++) {
    const a = lower[i];
    pivot = diagonal[i] - a * scratch[i - 1];
    const ratio = pivot / Math.abs(diagonal[i]);
    if (ratio < minRatio || ratio !== ratio) minRatio = ratio;
    scratch[i] = upper[i] / pivot;
    x[i] = (rhs[i] - a * x[i - 1]) / pivot;
  }
  for (let i = n - 2; i >= 0; i--) x[i] -= scratch[i] * x[i + 1];
  return minRatio;
}

/**
 * Convenience wrapper: checks the shapes, solves, and refuses a system on which elimination
 * without pivoting broke down (a zero or non-finite pivot). Diagonally dominant systems never do.
 */
export function solveTridiagonal(
  lower: ArrayLike<number>,
  diagonal: ArrayLike<number>,
  upper: ArrayLike<number>,
  rhs: ArrayLike<number>,
): Float64Array {
  const n = diagonal.length;
  if (n === 0) throw new ThermalInputError('diagonal', 'must not be empty');
  for (const [name, arr] of [['lower', lower], ['upper', upper], ['rhs', rhs]] as const) {
    if (arr.length !== n) throw new ThermalInputError(name, `must have the same length as diagonal (${n})`);
  }
  for (let i = 0; i < n; i++) {
    for (const [name, arr] of [['lower', lower], ['diagonal', diagonal], ['upper', upper], ['rhs', rhs]] as const) {
      if (!Number.isFinite(arr[i])) throw new ThermalInputError(`${name}[${i}]`, 'must be a finite number');
    }
    if (diagonal[i] === 0) throw new ThermalInputError(`diagonal[${i}]`, 'must not be zero');
  }
  const x = new Float64Array(n);
  const scratch = new Float64Array(n);
  const minRatio = thomas(n, Float64Array.from(lower), Float64Array.from(diagonal), Float64Array.from(upper), Float64Array.from(rhs), x, scratch);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(x[i]) || minRatio === 0) {
      throw new ThermalInputError('diagonal', 'elimination without pivoting broke down (singular or far from diagonally dominant)');
    }
  }
  return x;
}

/**
 * Number of negative eigenvalues of the symmetric tridiagonal matrix with the given diagonal and
 * off-diagonal entries −offDiagonalMagnitude[j] between rows j and j+1: by Sylvester's law of
 * inertia it equals the number of negative pivots of LDLᵀ (the Sturm-sequence count used in
 * bisection eigenvalue methods, e.g. Golub & Van Loan §8.4). A zero pivot is nudged to a tiny
 * negative value, the usual convention.
 */
export function negativePivotCount(
  n: number,
  diagonal: ArrayLike<number>,
  offDiagonalMagnitude: ArrayLike<number>,
): number {
  let count = 0;
  let pivot = diagonal[0];
  if (pivot === 0) pivot = -Number.MIN_VALUE;
  if (pivot < 0) count++;
  for (let i = 1; i < n; i++) {
    const g = offDiagonalMagnitude[i - 1];
    pivot = diagonal[i] - (g * g) / pivot;
    if (pivot === 0) pivot = -Number.MIN_VALUE;
    if (pivot < 0) count++;
  }
  return count;
}

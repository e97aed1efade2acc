/**
 * Thermal runaway of a Joule-heated body behind temperature-independent surroundings.
 *
 * Principle (linear stability of the discrete heat balance): with boundary conductances fixed,
 * the tangent form of the discrete equations is exact and reads (K − S_p·D)·T = b, where K is
 * the symmetric conductance matrix (conduction + boundaries, positive definite), D the diagonal
 * of generating-cell volumes and S_p = J²ρ₂₀α₂₀F_ac. A steady state with finite, physically
 * ordered temperatures exists exactly while K − S_p·D stays positive definite, i.e. while
 * S_p < λ_min, the smallest eigenvalue of the pencil K v = λ D v. At S_p = λ_min the system is
 * singular (the temperature of the slowest mode grows without bound); above it the only
 * "solution" has temperatures below ambient — unphysical. So the onset current is
 *     I_c = A·√(λ_min / (ρ₂₀ α₂₀ F_ac)).
 * For a conductor of negligible internal ΔT behind a resistance R_th this is
 * λ_min = 1/(R_th·A) and I_c = 1/√(R₂₀ α R_th), the closed form in references.md.
 *
 * λ_min is found by bisection on λ with Sylvester's law of inertia: the number of negative LDLᵀ
 * pivots of K − λD equals the number of eigenvalues below λ. Each test is one O(N) sweep, and
 * bisection cannot miss or mis-order an eigenvalue the way a power iteration can.
 */
import { negativePivotCount, thomas } from './tridiagonal';

/**
 * Smallest λ with det(K − λD) = 0. `kDiagonal` is K's diagonal, `offDiagonal` the magnitudes of
 * its (negative) off-diagonal entries, `weights` D's diagonal (≥ 0, not all zero).
 */
export function smallestGeneralizedEigenvalue(
  kDiagonal: Float64Array,
  offDiagonal: Float64Array,
  weights: Float64Array,
): number {
  const n = kDiagonal.length;
  const shifted = new Float64Array(n);
  const countBelow = (lambda: number): number => {
    for (let i = 0; i < n; i++) shifted[i] = kDiagonal[i] - lambda * weights[i];
    return negativePivotCount(n, shifted, offDiagonal);
  };
  // Upper bound: the Rayleigh quotient of the all-ones vector, (1ᵀK1)/(1ᵀD1) ≥ λ_min.
  let sumK = 0;
  let sumD = 0;
  for (let i = 0; i < n; i++) {
    sumK += kDiagonal[i] - (i > 0 ? offDiagonal[i - 1] : 0) - (i < n - 1 ? offDiagonal[i] : 0);
    sumD += weights[i];
  }
  let hi = Math.max(sumK / sumD, Number.MIN_VALUE) * (1 + 1e-9);
  for (let guard = 0; countBelow(hi) === 0 && guard < 200; guard++) hi *= 2;
  let lo = 0;
  for (let iteration = 0; iteration < 200 && hi - lo > 1e-14 * hi; iteration++) {
    const mid = 0.5 * (lo + hi);
    if (countBelow(mid) > 0) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Index of the largest entry of the slowest mode, approximated by one shifted inverse-iteration
 * step (K − 0.999λ_min D)v = D·1: the response to a uniform source just below onset, which the
 * slow mode dominates. Used to say where a runaway would start.
 */
export function slowestModePeak(
  kDiagonal: Float64Array,
  offDiagonal: Float64Array,
  weights: Float64Array,
  lambdaMin: number,
): number {
  const n = kDiagonal.length;
  const diag = new Float64Array(n);
  const lower = new Float64Array(n);
  const upper = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    diag[i] = kDiagonal[i] - 0.999 * lambdaMin * weights[i];
    if (i > 0) lower[i] = -offDiagonal[i - 1];
    if (i < n - 1) upper[i] = -offDiagonal[i];
  }
  const v = new Float64Array(n);
  thomas(n, lower, diag, upper, weights, v, new Float64Array(n));
  let peak = 0;
  for (let i = 1; i < n; i++) if (v[i] > v[peak]) peak = i;
  return peak;
}

/** Onset current from λ_min, A. */
export function onsetCurrent(args: { lambdaMin: number; area: number; rho20: number; alpha20: number; acFactor: number }): number {
  return args.area * Math.sqrt(args.lambdaMin / (args.rho20 * args.alpha20 * args.acFactor));
}

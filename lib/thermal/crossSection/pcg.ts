/**
 * Preconditioned conjugate gradients (Hestenes & Stiefel 1952; the preconditioned form as in
 * Saad, "Iterative Methods for Sparse Linear Systems", 2nd ed., Alg. 9.1) for the symmetric
 * system of the cross-section.
 *
 * A curvature pᵀAp ≤ 0 can only happen when A is not positive definite: it is reported as a
 * breakdown, which solve.ts reads as "no steady state" (the tangent matrix K − diag(β) has lost
 * definiteness). The recursive residual is checked against the true one before returning.
 */
import { dot } from './sparse';

export interface Preconditioner {
  /** z = M⁻¹·r, M symmetric positive definite. */
  apply(r: Float64Array, z: Float64Array): void;
}

export interface CgOutcome {
  iterations: number;
  converged: boolean;
  /** pᵀAp ≤ 0 met: the matrix is not positive definite. */
  breakdown: boolean;
  /** ‖b − Ax‖ / ‖b‖ at the end (true residual). */
  relativeResidual: number;
}

export function conjugateGradient(
  multiply: (x: Float64Array, y: Float64Array) => void,
  b: Float64Array,
  x: Float64Array,
  preconditioner: Preconditioner,
  options: { relativeTolerance: number; maxIterations: number },
): CgOutcome {
  const n = b.length;
  const r = new Float64Array(n);
  const z = new Float64Array(n);
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  const bNorm = Math.sqrt(dot(b, b));
  if (bNorm === 0) {
    x.fill(0);
    return { iterations: 0, converged: true, breakdown: false, relativeResidual: 0 };
  }
  const goal = options.relativeTolerance * bNorm;
  const trueResidual = (): number => {
    multiply(x, q);
    for (let i = 0; i < n; i++) r[i] = b[i] - q[i];
    return Math.sqrt(dot(r, r));
  };
  let iterations = 0;
  let residual = trueResidual();
  // A restart from the true residual guards against the recursive one drifting below it.
  for (let restart = 0; restart < 4; restart++) {
    if (residual <= goal) return { iterations, converged: true, breakdown: false, relativeResidual: residual / bNorm };
    preconditioner.apply(r, z);
    p.set(z);
    let rz = dot(r, z);
    while (iterations < options.maxIterations) {
      multiply(p, q);
      const curvature = dot(p, q);
      if (!(curvature > 0)) return { iterations, converged: false, breakdown: true, relativeResidual: residual / bNorm };
      const alpha = rz / curvature;
      for (let i = 0; i < n; i++) {
        x[i] += alpha * p[i];
        r[i] -= alpha * q[i];
      }
      iterations++;
      residual = Math.sqrt(dot(r, r));
      if (residual <= goal) break;
      preconditioner.apply(r, z);
      const rzNext = dot(r, z);
      const beta = rzNext / rz;
      rz = rzNext;
      for (let i = 0; i < n; i++) p[i] = z[i] + beta * p[i];
    }
    residual = trueResidual();
    if (iterations >= options.maxIterations) break;
  }
  return { iterations, converged: residual <= goal, breakdown: false, relativeResidual: residual / bNorm };
}

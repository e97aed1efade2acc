/**
 * Simple preconditioners for the conductance matrix K, kept beside the multigrid one (amg.ts)
 * so that the benchmark can measure what each buys. All are built from K alone (no current), so
 * a prepared problem reuses them at every current and every outer pass.
 */
import type { Preconditioner } from './pcg';
import type { Csr } from './sparse';

/** Jacobi: M = diag(K). */
export function jacobiPreconditioner(a: Csr): Preconditioner {
  const inverse = new Float64Array(a.n);
  for (let i = 0; i < a.n; i++) inverse[i] = 1 / a.val[a.diag[i]];
  return {
    apply(r, z) {
      for (let i = 0; i < r.length; i++) z[i] = r[i] * inverse[i];
    },
  };
}

/**
 * Incomplete Cholesky without fill, IC(0) (Meijerink & van der Vorst, Math. Comp. 31, 1977: it
 * exists for every M-matrix, which K is). Computed as ILU(0) of the symmetric K in the row
 * (IKJ) form of Saad, Alg. 10.4: for a symmetric matrix its factors are L and U = D·Lᵀ, the
 * IC(0) factors, so M = L·U is symmetric positive definite.
 */
export function ic0Preconditioner(a: Csr): Preconditioner {
  const { n, rowPtr, col, diag } = a;
  const lu = Float64Array.from(a.val);
  const position = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) position[col[p]] = p;
    for (let p = rowPtr[i]; p < diag[i]; p++) {
      const kk = col[p];
      const factor = lu[p] / lu[diag[kk]];
      lu[p] = factor;
      for (let q = diag[kk] + 1; q < rowPtr[kk + 1]; q++) {
        const target = position[col[q]];
        if (target >= 0) lu[target] -= factor * lu[q];
      }
    }
    for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) position[col[p]] = -1;
    if (!(lu[diag[i]] > 0)) throw new Error(`IC(0) met a pivot ≤ 0 at row ${i}: the matrix is not an M-matrix`);
  }
  return {
    apply(r, z) {
      // L·y = r (unit lower), then U·z = y.
      for (let i = 0; i < n; i++) {
        let s = r[i];
        for (let p = rowPtr[i]; p < diag[i]; p++) s -= lu[p] * z[col[p]];
        z[i] = s;
      }
      for (let i = n - 1; i >= 0; i--) {
        let s = z[i];
        for (let p = diag[i] + 1; p < rowPtr[i + 1]; p++) s -= lu[p] * z[col[p]];
        z[i] = s / lu[diag[i]];
      }
    },
  };
}

/**
 * Small dense complex linear algebra for the filament method.
 *
 * The impedance matrix Z = R + jωL of a filament system is complex SYMMETRIC (Zᵀ = Z, not
 * Hermitian) and its Hermitian part (Z + Zᴴ)/2 = R is positive definite (R diagonal, positive).
 * Gaussian elimination without pivoting is safe for such matrices: every Schur complement keeps a
 * positive-definite Hermitian part, so every pivot has a positive real part (Golub & Van Loan,
 * *Matrix Computations*, §4.4 on matrices with positive-definite symmetric part — from memory).
 * The symmetric form A = L·D·Lᵀ halves the work of an LU: n³/6 complex multiply-adds.
 *
 * Matrices are row-major with separate real and imaginary Float64Arrays (length n²).
 */

export interface ComplexSymmetricFactor {
  readonly n: number;
  /** Strictly lower part: L (unit diagonal implied); diagonal: D. Row-major, n². */
  readonly re: Float64Array;
  readonly im: Float64Array;
}

/**
 * Factors a complex symmetric matrix in place as L·D·Lᵀ (only the lower triangle and diagonal are
 * read; the upper triangle is left as it was). Throws when a pivot vanishes, which cannot happen
 * when the Hermitian part is positive definite.
 */
export function factorComplexSymmetric(n: number, re: Float64Array, im: Float64Array): ComplexSymmetricFactor {
  if (re.length !== n * n || im.length !== n * n) throw new Error(`factorComplexSymmetric: arrays must hold ${n * n} entries`);
  // w_k = L_jk·d_k for the current row j: the dot products below all use it.
  const wr = new Float64Array(n);
  const wi = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const rowJ = j * n;
    let dr = re[rowJ + j];
    let di = im[rowJ + j];
    for (let k = 0; k < j; k++) {
      const lr = re[rowJ + k];
      const li = im[rowJ + k];
      const kk = k * n + k;
      const pr = re[kk];
      const pi = im[kk];
      const xr = lr * pr - li * pi;
      const xi = lr * pi + li * pr;
      wr[k] = xr;
      wi[k] = xi;
      dr -= lr * xr - li * xi;
      di -= lr * xi + li * xr;
    }
    const magnitude2 = dr * dr + di * di;
    if (!(magnitude2 > 0) || !Number.isFinite(magnitude2)) {
      throw new Error(`factorComplexSymmetric: pivot ${j} vanished (matrix not of the positive-definite-real-part kind)`);
    }
    re[rowJ + j] = dr;
    im[rowJ + j] = di;
    // 1/d_j
    const invR = dr / magnitude2;
    const invI = -di / magnitude2;
    for (let i = j + 1; i < n; i++) {
      const rowI = i * n;
      let sr = re[rowI + j];
      let si = im[rowI + j];
      for (let k = 0; k < j; k++) {
        const ar = re[rowI + k];
        const ai = im[rowI + k];
        sr -= ar * wr[k] - ai * wi[k];
        si -= ar * wi[k] + ai * wr[k];
      }
      re[rowI + j] = sr * invR - si * invI;
      im[rowI + j] = sr * invI + si * invR;
    }
  }
  return { n, re, im };
}

/** Solves L·D·Lᵀ x = b in place (b becomes x). */
export function solveComplexSymmetric(factor: ComplexSymmetricFactor, bRe: Float64Array, bIm: Float64Array): void {
  const { n, re, im } = factor;
  // Forward: L y = b.
  for (let i = 0; i < n; i++) {
    const row = i * n;
    let sr = bRe[i];
    let si = bIm[i];
    for (let k = 0; k < i; k++) {
      const lr = re[row + k];
      const li = im[row + k];
      sr -= lr * bRe[k] - li * bIm[k];
      si -= lr * bIm[k] + li * bRe[k];
    }
    bRe[i] = sr;
    bIm[i] = si;
  }
  // Diagonal: z = y / d.
  for (let i = 0; i < n; i++) {
    const dr = re[i * n + i];
    const di = im[i * n + i];
    const m2 = dr * dr + di * di;
    const yr = bRe[i];
    const yi = bIm[i];
    bRe[i] = (yr * dr + yi * di) / m2;
    bIm[i] = (yi * dr - yr * di) / m2;
  }
  // Back: Lᵀ x = z, column sweep so that L is read row by row.
  for (let i = n - 1; i >= 0; i--) {
    const row = i * n;
    const xr = bRe[i];
    const xi = bIm[i];
    for (let k = 0; k < i; k++) {
      const lr = re[row + k];
      const li = im[row + k];
      bRe[k] -= lr * xr - li * xi;
      bIm[k] -= lr * xi + li * xr;
    }
  }
}

/**
 * General dense complex solve A x = b by Gaussian elimination with partial pivoting, for the small
 * systems (a few unknowns) that couple the conductor groups. A and b are copied, not changed.
 */
export function solveComplexGeneral(
  n: number,
  aRe: ArrayLike<number>,
  aIm: ArrayLike<number>,
  bRe: ArrayLike<number>,
  bIm: ArrayLike<number>,
): { re: Float64Array; im: Float64Array } {
  const ar = Float64Array.from(aRe);
  const ai = Float64Array.from(aIm);
  const xr = Float64Array.from(bRe);
  const xi = Float64Array.from(bIm);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    let best = -1;
    for (let r = col; r < n; r++) {
      const m = ar[r * n + col] ** 2 + ai[r * n + col] ** 2;
      if (m > best) {
        best = m;
        pivot = r;
      }
    }
    if (!(best > 0)) throw new Error(`solveComplexGeneral: matrix is singular (column ${col})`);
    if (pivot !== col) {
      for (let c = 0; c < n; c++) {
        const p = pivot * n + c;
        const q = col * n + c;
        [ar[p], ar[q]] = [ar[q], ar[p]];
        [ai[p], ai[q]] = [ai[q], ai[p]];
      }
      [xr[pivot], xr[col]] = [xr[col], xr[pivot]];
      [xi[pivot], xi[col]] = [xi[col], xi[pivot]];
    }
    const pr = ar[col * n + col];
    const pi = ai[col * n + col];
    const pm = pr * pr + pi * pi;
    for (let r = col + 1; r < n; r++) {
      const er = ar[r * n + col];
      const ei = ai[r * n + col];
      // factor = e / p
      const fr = (er * pr + ei * pi) / pm;
      const fi = (ei * pr - er * pi) / pm;
      for (let c = col; c < n; c++) {
        const vr = ar[col * n + c];
        const vi = ai[col * n + c];
        ar[r * n + c] -= fr * vr - fi * vi;
        ai[r * n + c] -= fr * vi + fi * vr;
      }
      xr[r] -= fr * xr[col] - fi * xi[col];
      xi[r] -= fr * xi[col] + fi * xr[col];
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let sr = xr[r];
    let si = xi[r];
    for (let c = r + 1; c < n; c++) {
      const vr = ar[r * n + c];
      const vi = ai[r * n + c];
      sr -= vr * xr[c] - vi * xi[c];
      si -= vr * xi[c] + vi * xr[c];
    }
    const pr = ar[r * n + r];
    const pi = ai[r * n + r];
    const pm = pr * pr + pi * pi;
    xr[r] = (sr * pr + si * pi) / pm;
    xi[r] = (si * pr - sr * pi) / pm;
  }
  return { re: xr, im: xi };
}

/**
 * Real dense solve A·X = B (B with `columns` right-hand sides, row-major n × columns) by Gaussian
 * elimination with partial pivoting; A and B are copied. For the radiosity and Newton systems of
 * the pack heat balance (tens of unknowns).
 */
export function solveRealGeneral(n: number, a: ArrayLike<number>, b: ArrayLike<number>, columns = 1): Float64Array {
  const m = Float64Array.from(a);
  const x = Float64Array.from(b);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r * n + col]) > Math.abs(m[pivot * n + col])) pivot = r;
    if (!(Math.abs(m[pivot * n + col]) > 0)) throw new Error(`solveRealGeneral: matrix is singular (column ${col})`);
    if (pivot !== col) {
      for (let c = 0; c < n; c++) [m[pivot * n + c], m[col * n + c]] = [m[col * n + c], m[pivot * n + c]];
      for (let c = 0; c < columns; c++) [x[pivot * columns + c], x[col * columns + c]] = [x[col * columns + c], x[pivot * columns + c]];
    }
    const p = m[col * n + col];
    for (let r = col + 1; r < n; r++) {
      const f = m[r * n + col] / p;
      if (f === 0) continue;
      for (let c = col; c < n; c++) m[r * n + c] -= f * m[col * n + c];
      for (let c = 0; c < columns; c++) x[r * columns + c] -= f * x[col * columns + c];
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    for (let c = 0; c < columns; c++) {
      let s = x[r * columns + c];
      for (let k = r + 1; k < n; k++) s -= m[r * n + k] * x[k * columns + c];
      x[r * columns + c] = s / m[r * n + r];
    }
  }
  return x;
}

/**
 * Classical algebraic multigrid (Ruge & Stüben, "Algebraic multigrid", in Multigrid Methods,
 * SIAM 1987; the choices below follow K. Stüben, "A review of algebraic multigrid", J. Comput.
 * Appl. Math. 128, 2001) used as the preconditioner of the conjugate gradients.
 *
 * Why algebraic and not geometric: the grid is graded towards every cable, so far from the
 * cables the cells are long and thin (aspect ratios of 100 and more), and the nodes on the
 * cables' circles sit at uneven distances from their neighbours. A point smoother on a geometric hierarchy stalls on such
 * anisotropy; the algebraic coarsening follows the strong couplings instead (it coarsens along
 * the thin direction only), and it takes the circle nodes and the material jumps as they come.
 *
 *   strength:       j strongly influences i if −a_ij ≥ θ·max_k(−a_ik), θ = 0.25;
 *   C/F splitting:  Ruge–Stüben first pass (largest number of strongly dependent points first);
 *   interpolation:  direct, e_i = Σ_{j∈C_i} w_ij e_j, w_ij = −α_i a_ij/a_ii,
 *                   α_i = Σ_{k≠i} a_ik / Σ_{j∈C_i} a_ij (negative couplings; positive ones are
 *                   lumped onto the diagonal);
 *   coarse matrix:  Galerkin A_c = Pᵀ A P;
 *   cycle:          V(1,1), forward Gauss–Seidel before, backward after, so the cycle is a
 *                   symmetric positive definite operator (a valid CG preconditioner);
 *   coarsest:       dense Cholesky.
 */
import type { Preconditioner } from './pcg';
import { multiply, transpose, type Csr } from './sparse';

const STRENGTH_THRESHOLD = 0.25;
const COARSEST_SIZE = 200;
const MAX_LEVELS = 30;

interface Transfer {
  rowPtr: Int32Array;
  col: Int32Array;
  val: Float64Array;
}

interface Level {
  a: Csr;
  /** Interpolation to this level from the next coarser one (n × nc), and its transpose. */
  p?: Transfer;
  r?: Transfer;
  x: Float64Array;
  b: Float64Array;
  residual: Float64Array;
}

export interface AmgHierarchy extends Preconditioner {
  levels: number;
  /** Σ nnz(A_ℓ) / nnz(A_0) */
  operatorComplexity: number;
  /** Unknowns per level, finest first. */
  sizes: number[];
}

/** Strong dependencies S_i of every row (CSR pattern). */
function strength(a: Csr): { ptr: Int32Array; idx: Int32Array } {
  const { n, rowPtr, col, val } = a;
  const ptr = new Int32Array(n + 1);
  const idx: number[] = [];
  for (let i = 0; i < n; i++) {
    let largest = 0;
    for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) if (col[p] !== i && -val[p] > largest) largest = -val[p];
    const threshold = STRENGTH_THRESHOLD * largest;
    if (largest > 0) for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) if (col[p] !== i && -val[p] >= threshold) idx.push(col[p]);
    ptr[i + 1] = idx.length;
  }
  return { ptr, idx: Int32Array.from(idx) };
}

const UNDECIDED = 0;
const COARSE = 1;
const FINE = 2;

/** Ruge–Stüben first pass with bucket lists keyed on λ_i (points depending strongly on i). */
function splitting(n: number, s: { ptr: Int32Array; idx: Int32Array }): Uint8Array {
  const st = transpose(n, n, s.ptr, s.idx, new Float64Array(s.idx.length));
  const state = new Uint8Array(n);
  const lambda = new Int32Array(n);
  let maxLambda = 0;
  for (let i = 0; i < n; i++) {
    lambda[i] = st.rowPtr[i + 1] - st.rowPtr[i];
    if (lambda[i] > maxLambda) maxLambda = lambda[i];
  }
  const buckets = 2 * maxLambda + 2;
  const head = new Int32Array(buckets).fill(-1);
  const next = new Int32Array(n).fill(-1);
  const prev = new Int32Array(n).fill(-1);
  const insert = (i: number) => {
    const l = lambda[i];
    next[i] = head[l];
    prev[i] = -1;
    if (head[l] >= 0) prev[head[l]] = i;
    head[l] = i;
  };
  const remove = (i: number) => {
    if (prev[i] >= 0) next[prev[i]] = next[i];
    else head[lambda[i]] = next[i];
    if (next[i] >= 0) prev[next[i]] = prev[i];
  };
  let top = 0;
  for (let i = 0; i < n; i++) {
    if (s.ptr[i + 1] === s.ptr[i] && lambda[i] === 0) {
      state[i] = FINE; // no strong couplings at all: the smoother alone takes care of it
      continue;
    }
    insert(i);
    if (lambda[i] > top) top = lambda[i];
  }
  for (;;) {
    while (top >= 0 && head[top] < 0) top--;
    if (top < 0) break;
    const i = head[top];
    remove(i);
    state[i] = COARSE;
    for (let p = st.rowPtr[i]; p < st.rowPtr[i + 1]; p++) {
      const j = st.col[p];
      if (state[j] !== UNDECIDED) continue;
      state[j] = FINE;
      remove(j);
      for (let q = s.ptr[j]; q < s.ptr[j + 1]; q++) {
        const k = s.idx[q];
        if (state[k] !== UNDECIDED) continue;
        remove(k);
        lambda[k] = Math.min(lambda[k] + 1, buckets - 1);
        insert(k);
        if (lambda[k] > top) top = lambda[k];
      }
    }
    for (let p = s.ptr[i]; p < s.ptr[i + 1]; p++) {
      const j = s.idx[p];
      if (state[j] !== UNDECIDED || lambda[j] === 0) continue;
      remove(j);
      lambda[j]--;
      insert(j);
    }
  }
  return state;
}

function directInterpolation(a: Csr, s: { ptr: Int32Array; idx: Int32Array }, state: Uint8Array): { p: Transfer; coarse: number } {
  const { n, rowPtr, col, val, diag } = a;
  const coarseIndex = new Int32Array(n).fill(-1);
  let coarse = 0;
  for (let i = 0; i < n; i++) if (state[i] === COARSE) coarseIndex[i] = coarse++;
  const strong = new Uint8Array(n);
  const ptr = new Int32Array(n + 1);
  const pc: number[] = [];
  const pv: number[] = [];
  for (let i = 0; i < n; i++) {
    if (state[i] === COARSE) {
      pc.push(coarseIndex[i]);
      pv.push(1);
      ptr[i + 1] = pc.length;
      continue;
    }
    for (let q = s.ptr[i]; q < s.ptr[i + 1]; q++) strong[s.idx[q]] = 1;
    let sumNegative = 0;
    let sumPositive = 0;
    let sumCoarse = 0;
    for (let q = rowPtr[i]; q < rowPtr[i + 1]; q++) {
      const j = col[q];
      if (j === i) continue;
      const v = val[q];
      if (v < 0) {
        sumNegative += v;
        if (strong[j] && state[j] === COARSE) sumCoarse += v;
      } else sumPositive += v;
    }
    if (sumCoarse < 0) {
      const scale = -(sumNegative / sumCoarse) / (val[diag[i]] + sumPositive);
      for (let q = rowPtr[i]; q < rowPtr[i + 1]; q++) {
        const j = col[q];
        if (j !== i && val[q] < 0 && strong[j] && state[j] === COARSE) {
          pc.push(coarseIndex[j]);
          pv.push(scale * val[q]);
        }
      }
    }
    for (let q = s.ptr[i]; q < s.ptr[i + 1]; q++) strong[s.idx[q]] = 0;
    ptr[i + 1] = pc.length;
  }
  return { p: { rowPtr: ptr, col: Int32Array.from(pc), val: Float64Array.from(pv) }, coarse };
}

/** C = A·B for CSR A (rows × inner) and B (inner × cols), Gustavson's row-by-row product. */
function product(rows: number, cols: number, a: Transfer, b: Transfer): Transfer {
  const marker = new Int32Array(cols).fill(-1);
  const ptr = new Int32Array(rows + 1);
  const outCol: number[] = [];
  const outVal: number[] = [];
  for (let i = 0; i < rows; i++) {
    const start = outCol.length;
    for (let p = a.rowPtr[i]; p < a.rowPtr[i + 1]; p++) {
      const k = a.col[p];
      const v = a.val[p];
      for (let q = b.rowPtr[k]; q < b.rowPtr[k + 1]; q++) {
        const j = b.col[q];
        const at = marker[j];
        if (at < start) {
          marker[j] = outCol.length;
          outCol.push(j);
          outVal.push(v * b.val[q]);
        } else outVal[at] += v * b.val[q];
      }
    }
    ptr[i + 1] = outCol.length;
  }
  return { rowPtr: ptr, col: Int32Array.from(outCol), val: Float64Array.from(outVal) };
}

/** Sort each row's columns and locate the diagonal (the Csr contract). */
function toCsr(n: number, m: Transfer): Csr {
  const { rowPtr, col, val } = m;
  const diag = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    for (let p = rowPtr[i] + 1; p < rowPtr[i + 1]; p++) {
      const c = col[p];
      const v = val[p];
      let q = p - 1;
      while (q >= rowPtr[i] && col[q] > c) {
        col[q + 1] = col[q];
        val[q + 1] = val[q];
        q--;
      }
      col[q + 1] = c;
      val[q + 1] = v;
    }
    for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) if (col[p] === i) diag[i] = p;
    if (diag[i] < 0) throw new Error(`AMG: coarse row ${i} has no diagonal`);
  }
  return { n, rowPtr, col, val, diag };
}

function galerkin(a: Csr, p: Transfer, r: Transfer, coarse: number): Csr {
  const ap = product(a.n, coarse, a, p);
  return toCsr(coarse, product(coarse, coarse, r, ap));
}

function denseCholesky(a: Csr): (b: Float64Array, x: Float64Array) => void {
  const n = a.n;
  const l = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let p = a.rowPtr[i]; p < a.rowPtr[i + 1]; p++) l[i * n + a.col[p]] = a.val[p];
  for (let j = 0; j < n; j++) {
    let d = l[j * n + j];
    for (let k = 0; k < j; k++) d -= l[j * n + k] * l[j * n + k];
    if (!(d > 0)) throw new Error('AMG: the coarsest matrix is not positive definite');
    const root = Math.sqrt(d);
    l[j * n + j] = root;
    for (let i = j + 1; i < n; i++) {
      let s = l[i * n + j];
      for (let k = 0; k < j; k++) s -= l[i * n + k] * l[j * n + k];
      l[i * n + j] = s / root;
    }
  }
  return (b, x) => {
    for (let i = 0; i < n; i++) {
      let s = b[i];
      for (let k = 0; k < i; k++) s -= l[i * n + k] * x[k];
      x[i] = s / l[i * n + i];
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = x[i];
      for (let k = i + 1; k < n; k++) s -= l[k * n + i] * x[k];
      x[i] = s / l[i * n + i];
    }
  };
}

function gaussSeidelRow(rowPtr: Int32Array, col: Int32Array, val: Float64Array, diag: Int32Array, b: Float64Array, x: Float64Array, i: number): void {
  let s = b[i];
  const d = diag[i];
  // Columns are sorted: the entries before and after the diagonal, without a test per entry.
  for (let p = rowPtr[i]; p < d; p++) s -= val[p] * x[col[p]];
  for (let p = d + 1, end = rowPtr[i + 1]; p < end; p++) s -= val[p] * x[col[p]];
  x[i] = s / val[d];
}

function gaussSeidel(a: Csr, b: Float64Array, x: Float64Array, forward: boolean): void {
  const { n, rowPtr, col, val, diag } = a;
  if (forward) for (let i = 0; i < n; i++) gaussSeidelRow(rowPtr, col, val, diag, b, x, i);
  else for (let i = n - 1; i >= 0; i--) gaussSeidelRow(rowPtr, col, val, diag, b, x, i);
}

function applyTransfer(rows: number, m: Transfer, x: Float64Array, y: Float64Array, add: boolean): void {
  for (let i = 0; i < rows; i++) {
    let s = 0;
    for (let p = m.rowPtr[i]; p < m.rowPtr[i + 1]; p++) s += m.val[p] * x[m.col[p]];
    y[i] = add ? y[i] + s : s;
  }
}

export function amgPreconditioner(a: Csr): AmgHierarchy {
  const levels: Level[] = [];
  let current = a;
  let nnz = a.rowPtr[a.n];
  for (;;) {
    const level: Level = { a: current, x: new Float64Array(current.n), b: new Float64Array(current.n), residual: new Float64Array(current.n) };
    levels.push(level);
    if (current.n <= COARSEST_SIZE || levels.length >= MAX_LEVELS) break;
    const s = strength(current);
    const state = splitting(current.n, s);
    const { p, coarse } = directInterpolation(current, s, state);
    if (coarse === 0 || coarse >= current.n) break;
    const r = transpose(current.n, coarse, p.rowPtr, p.col, p.val);
    level.p = p;
    level.r = r;
    current = galerkin(current, p, r, coarse);
    nnz += current.rowPtr[current.n];
  }
  const last = levels[levels.length - 1];
  // Coarsening that stalled above the dense size would make the dense solve too dear; there a
  // few symmetric Gauss–Seidel sweeps stand in (still a symmetric positive definite operator).
  const coarseSolve =
    last.a.n <= 4 * COARSEST_SIZE
      ? denseCholesky(last.a)
      : (b: Float64Array, x: Float64Array) => {
          x.fill(0);
          for (let sweep = 0; sweep < 10; sweep++) {
            gaussSeidel(last.a, b, x, true);
            gaussSeidel(last.a, b, x, false);
          }
        };

  const cycle = (k: number): void => {
    const level = levels[k];
    if (k === levels.length - 1) {
      coarseSolve(level.b, level.x);
      return;
    }
    const { a: m, b, x, residual } = level;
    x.fill(0);
    gaussSeidel(m, b, x, true);
    multiply(m, x, residual);
    for (let i = 0; i < m.n; i++) residual[i] = b[i] - residual[i];
    const coarser = levels[k + 1];
    applyTransfer(coarser.a.n, level.r!, residual, coarser.b, false);
    cycle(k + 1);
    applyTransfer(m.n, level.p!, coarser.x, x, true);
    gaussSeidel(m, b, x, false);
  };

  return {
    levels: levels.length,
    operatorComplexity: nnz / a.rowPtr[a.n],
    sizes: levels.map((l) => l.a.n),
    apply(r, z) {
      levels[0].b.set(r);
      cycle(0);
      z.set(levels[0].x);
    },
  };
}

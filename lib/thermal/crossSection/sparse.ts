/**
 * Compressed sparse rows (CSR) for the symmetric conductance matrix: the cells form a
 * five-point pattern, a node on a circle joins two neighbours. Columns are sorted in each row.
 */

export interface Csr {
  n: number;
  rowPtr: Int32Array;
  col: Int32Array;
  val: Float64Array;
  /** Position of the diagonal entry of each row in `col`/`val`. */
  diag: Int32Array;
}

/** Collects symmetric conductances between nodes, then builds the CSR matrix in one pass. */
export class ConductanceCollector {
  private rows: Int32Array;
  private cols: Int32Array;
  private vals: Float64Array;
  private count = 0;
  private diagonal: Float64Array;

  /** Nodes may be added as they come: `nodes` and `expectedConnections` only size the first buffers. */
  constructor(nodes: number, expectedConnections = 2 * nodes) {
    this.diagonal = new Float64Array(nodes);
    this.rows = new Int32Array(2 * expectedConnections);
    this.cols = new Int32Array(2 * expectedConnections);
    this.vals = new Float64Array(2 * expectedConnections);
  }

  private grow(): void {
    const size = 2 * this.rows.length + 16;
    const rows = new Int32Array(size);
    const cols = new Int32Array(size);
    const vals = new Float64Array(size);
    rows.set(this.rows);
    cols.set(this.cols);
    vals.set(this.vals);
    this.rows = rows;
    this.cols = cols;
    this.vals = vals;
  }

  /** A conductance G between nodes u ≠ v: +G on both diagonals, −G off the diagonal. */
  private reach(u: number): void {
    if (u < this.diagonal.length) return;
    const grown = new Float64Array(Math.max(2 * this.diagonal.length, u + 1));
    grown.set(this.diagonal);
    this.diagonal = grown;
  }

  connect(u: number, v: number, g: number): void {
    this.reach(Math.max(u, v));
    this.diagonal[u] += g;
    this.diagonal[v] += g;
    if (this.count + 2 > this.rows.length) this.grow();
    const k = this.count;
    this.rows[k] = u;
    this.cols[k] = v;
    this.vals[k] = -g;
    this.rows[k + 1] = v;
    this.cols[k + 1] = u;
    this.vals[k + 1] = -g;
    this.count = k + 2;
  }

  /** A conductance from node u to a fixed temperature (a boundary): +G on its diagonal. */
  ground(u: number, g: number): void {
    this.reach(u);
    this.diagonal[u] += g;
  }

  /** The matrix over nodes 0 … n − 1. */
  build(n: number): Csr {
    this.reach(n - 1);
    const entries = this.count;
    // Counting sort of the off-diagonal entries by row …
    const start = new Int32Array(n + 1);
    for (let k = 0; k < entries; k++) start[this.rows[k] + 1]++;
    for (let i = 0; i < n; i++) start[i + 1] += start[i];
    const cursor = start.slice(0, n);
    const c0 = new Int32Array(entries);
    const v0 = new Float64Array(entries);
    for (let k = 0; k < entries; k++) {
      const p = cursor[this.rows[k]]++;
      c0[p] = this.cols[k];
      v0[p] = this.vals[k];
    }
    // … then each row sorted by column (insertion sort: every row is short),
    // duplicates summed and the diagonal put in its place.
    const rowPtr = new Int32Array(n + 1);
    const col = new Int32Array(entries + n);
    const val = new Float64Array(entries + n);
    const diag = new Int32Array(n);
    let out = 0;
    for (let i = 0; i < n; i++) {
      const a = start[i];
      const b = start[i + 1];
      for (let p = a + 1; p < b; p++) {
        const c = c0[p];
        const v = v0[p];
        let q = p - 1;
        while (q >= a && c0[q] > c) {
          c0[q + 1] = c0[q];
          v0[q + 1] = v0[q];
          q--;
        }
        c0[q + 1] = c;
        v0[q + 1] = v;
      }
      const rowStart = out;
      let diagonalPlaced = false;
      let p = a;
      while (p < b || !diagonalPlaced) {
        let c: number;
        let v: number;
        if (!diagonalPlaced && (p === b || c0[p] > i)) {
          c = i;
          v = this.diagonal[i];
          diagonalPlaced = true;
        } else {
          c = c0[p];
          v = v0[p];
          p++;
        }
        if (out > rowStart && col[out - 1] === c) val[out - 1] += v;
        else {
          if (c === i) diag[i] = out;
          col[out] = c;
          val[out] = v;
          out++;
        }
      }
      rowPtr[i + 1] = out;
    }
    return { n, rowPtr, col: col.slice(0, out), val: val.slice(0, out), diag };
  }
}

/** y = A·x */
export function multiply(a: Csr, x: Float64Array, y: Float64Array): void {
  const { n, rowPtr, col, val } = a;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let p = rowPtr[i], end = rowPtr[i + 1]; p < end; p++) s += val[p] * x[col[p]];
    y[i] = s;
  }
}

/** y = (A − diag(shift))·x : the tangent matrix without copying A. */
export function multiplyShifted(a: Csr, shift: Float64Array, x: Float64Array, y: Float64Array): void {
  multiply(a, x, y);
  for (let i = 0; i < a.n; i++) if (shift[i] !== 0) y[i] -= shift[i] * x[i];
}

export function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** Transpose of a (general, rectangular) CSR pattern with values. */
export function transpose(rows: number, cols: number, rowPtr: Int32Array, col: Int32Array, val: Float64Array): { rowPtr: Int32Array; col: Int32Array; val: Float64Array } {
  const tPtr = new Int32Array(cols + 1);
  for (let p = 0; p < rowPtr[rows]; p++) tPtr[col[p] + 1]++;
  for (let j = 0; j < cols; j++) tPtr[j + 1] += tPtr[j];
  const cursor = tPtr.slice(0, cols);
  const tCol = new Int32Array(rowPtr[rows]);
  const tVal = new Float64Array(rowPtr[rows]);
  for (let i = 0; i < rows; i++) {
    for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) {
      const q = cursor[col[p]]++;
      tCol[q] = i;
      tVal[q] = val[p];
    }
  }
  return { rowPtr: tPtr, col: tCol, val: tVal };
}

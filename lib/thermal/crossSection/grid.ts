/**
 * Tensor-product non-uniform grid graded towards each cable (physics.md §9): one list of faces
 * across, one down, cells cell-centred between them (Patankar 1980, §4.6 "practice B").
 *
 * Each axis has a target cell size s(ξ): D/cellsAcrossCable over a cable's span (1.5 radii
 * either side of its centre), growing linearly with slope (growthRatio − 1) away from it — so
 * neighbouring cells differ by about that ratio — and capped at maxCell. The faces are placed at
 * equal steps of ψ(ξ) = ∫dξ/s(ξ) between breakpoints (domain edges and region edges, so every
 * material interface is a face). The grid is therefore a smooth map of a uniform one, and
 * `refinement` = 2 halves every cell: the grid studies of the tests measure a clean order.
 */

export interface SizeTarget {
  centre: number;
  halfWidth: number;
  size: number;
}

export interface AxisSpec {
  lo: number;
  hi: number;
  breakpoints: number[];
  targets: SizeTarget[];
  growthRatio: number;
  maxCell: number;
  refinement: number;
}

export function targetSize(spec: AxisSpec, position: number): number {
  const slope = spec.growthRatio - 1;
  let s = spec.maxCell;
  for (const t of spec.targets) {
    const distance = Math.max(0, Math.abs(position - t.centre) - t.halfWidth);
    const local = t.size + slope * distance;
    if (local < s) s = local;
  }
  return s / spec.refinement;
}

/**
 * ψ along [a, b] sampled in steps of an eighth of the local cell size (Simpson on each step), so
 * that the inverse map is accurate far below the cell size.
 */
function psiTable(spec: AxisSpec, a: number, b: number): { xs: number[]; psis: number[] } {
  const xs = [a];
  const psis = [0];
  let x = a;
  let psi = 0;
  while (x < b) {
    const step = Math.min(targetSize(spec, x) / 8, b - x);
    const mid = x + step / 2;
    const end = x + step;
    psi += (step / 6) * (1 / targetSize(spec, x) + 4 / targetSize(spec, mid) + 1 / targetSize(spec, end));
    x = b - end < 1e-12 * (spec.hi - spec.lo) ? b : end;
    xs.push(x);
    psis.push(psi);
  }
  return { xs, psis };
}

function facesBetween(spec: AxisSpec, a: number, b: number, out: number[]): void {
  const { xs, psis } = psiTable(spec, a, b);
  const total = psis[psis.length - 1];
  const cells = Math.max(1, Math.ceil(total - 1e-9));
  let k = 0;
  for (let j = 1; j < cells; j++) {
    const target = (total * j) / cells;
    while (psis[k + 1] < target) k++;
    const t = (target - psis[k]) / (psis[k + 1] - psis[k]);
    out.push(xs[k] + t * (xs[k + 1] - xs[k]));
  }
  out.push(b);
}

/** Face positions from lo to hi, breakpoints included. */
export function gradedFaces(spec: AxisSpec): Float64Array {
  const span = spec.hi - spec.lo;
  const cuts = [spec.lo, ...spec.breakpoints.filter((p) => p > spec.lo && p < spec.hi), spec.hi].sort((p, q) => p - q);
  const unique: number[] = [];
  for (const c of cuts) if (unique.length === 0 || c - unique[unique.length - 1] > 1e-9 * span) unique.push(c);
  unique[unique.length - 1] = spec.hi;
  const faces: number[] = [spec.lo];
  for (let i = 0; i + 1 < unique.length; i++) facesBetween(spec, unique[i], unique[i + 1], faces);
  return Float64Array.from(faces);
}

export function centresOf(faces: Float64Array): Float64Array {
  const c = new Float64Array(faces.length - 1);
  for (let i = 0; i < c.length; i++) c[i] = 0.5 * (faces[i] + faces[i + 1]);
  return c;
}

/** Index of the cell whose [face_i, face_{i+1}) holds `position` (clamped to the ends). */
export function cellIndexAt(faces: Float64Array, position: number): number {
  let lo = 0;
  let hi = faces.length - 2;
  if (position <= faces[0]) return 0;
  if (position >= faces[hi + 1]) return hi;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (faces[mid] <= position) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** First index whose centre is ≥ position. */
export function firstCentreAtOrAbove(centres: Float64Array, position: number): number {
  let lo = 0;
  let hi = centres.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (centres[mid] < position) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

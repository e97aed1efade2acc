/**
 * The finite-volume terms of the cross-section, each a small function (physics.md §12): the
 * diffusion term of one face, the boundary terms, the sources S_u + S_p·T. They are the 2-D
 * counterparts of the 1-D solver's face conductance (series half-cell resistances, Patankar
 * 1980 §4.2-3), boundary half-cell and source linearisation; the assembly (assemble.ts) only
 * walks the faces and cells and adds what these return. Written per face so that a shared
 * assembly of named terms (the 1-D refactor on branch thermal-core) can take them over: a face
 * there is (node, node, conductance), a boundary (node, conductance, temperature), a source
 * (node, S_u·ΔV, S_p·ΔV) — the same triples these functions produce.
 *
 * Everything is per metre of cable length: a "face area" is a face length in m, conductances are
 * W/(K·m), heat W/m.
 */

/**
 * Shortest soil path kept, as a share of the node spacing. A circle node that falls on (or next
 * to) a cell centre would give an unbounded conductance; Gibou et al. (2002) bound the distance
 * the same way. The temperature error this makes is below share × spacing × local gradient.
 */
export const MIN_PATH_SHARE = 0.01;

/** A soil path along a grid line, from `start` to `end`, crossing the face at `face`. */
export interface SoilPath {
  start: number;
  end: number;
  face: number;
  /** Conductivity on the start side of the face and on the end side, W/(m·K). */
  kStart: number;
  kEnd: number;
  /** Node spacing (for the minimum path), m. */
  spacing: number;
}

/**
 * Diffusion term of one face: the conductance between its two nodes, the soil path's two parts
 * in series (harmonic mean across a material interface, exact for a 1-D flux), times the face
 * length. Where the segment crosses a circle it is cut into pieces at the circle's node
 * (circles.ts), each piece a path of its own.
 */
export function faceConductance(faceLengthM: number, path: SoilPath): number {
  let { start, end } = path;
  const minimum = MIN_PATH_SHARE * path.spacing;
  if (end - start < minimum) {
    const mid = 0.5 * (start + end);
    start = mid - minimum / 2;
    end = mid + minimum / 2;
  }
  const before = Math.max(0, Math.min(end, path.face) - start);
  const after = Math.max(0, end - Math.max(start, path.face));
  return faceLengthM / (before / path.kStart + after / path.kEnd);
}

export type BoundaryTerm =
  /** Fixed temperature at the face (isothermal surface, deep ground). */
  | { kind: 'temperature'; temperatureC: number }
  /** Convection to the air through a coefficient h, in series with the half cell. */
  | { kind: 'convective'; airC: number; h: number };

/**
 * Boundary term: conductance from a node to the boundary's temperature over the half cell (the
 * 1-D solver's k·A_b/(δ/2)), in series with 1/(h·A) for a convective face. `pathM` is the soil
 * path from the node (or the circle) to the face.
 */
export function boundaryConductance(faceLengthM: number, pathM: number, spacingM: number, k: number, term: BoundaryTerm): { conductance: number; temperatureC: number } {
  const path = Math.max(pathM, MIN_PATH_SHARE * spacingM);
  const resistance = path / k + (term.kind === 'convective' ? 1 / term.h : 0);
  return { conductance: faceLengthM / resistance, temperatureC: term.kind === 'convective' ? term.airC : term.temperatureC };
}

/**
 * A line source W (W/m) at a point, shared between the (up to) four cell centres around it with
 * bilinear weights: the shares add to W and their centroid is the point itself, so the far field
 * carries no displaced-source (dipole) error of the size of a cell. Beyond the outermost
 * centres the weight goes to the last one.
 */
export function lineSourceShares(xc: Float64Array, yc: Float64Array, x: number, y: number): Array<{ i: number; j: number; weight: number }> {
  const bracket = (centres: Float64Array, p: number): Array<{ index: number; weight: number }> => {
    const n = centres.length;
    if (p <= centres[0]) return [{ index: 0, weight: 1 }];
    if (p >= centres[n - 1]) return [{ index: n - 1, weight: 1 }];
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (centres[mid] <= p) lo = mid;
      else hi = mid;
    }
    const t = (p - centres[lo]) / (centres[hi] - centres[lo]);
    return [
      { index: lo, weight: 1 - t },
      { index: hi, weight: t },
    ];
  };
  const shares: Array<{ i: number; j: number; weight: number }> = [];
  for (const a of bracket(xc, x)) for (const b of bracket(yc, y)) if (a.weight * b.weight > 0) shares.push({ i: a.index, j: b.index, weight: a.weight * b.weight });
  return shares;
}

/** Overlap length of [a0, a1] and [b0, b1]. */
function overlap(a0: number, a1: number, b0: number, b1: number): number {
  return Math.max(0, Math.min(a1, b1) - Math.max(a0, b0));
}

/** A rectangle source: each cell gets W × (its overlap area / the rectangle's area); the shares add to W. */
export function rectangleSourceShares(
  xFaces: Float64Array,
  yFaces: Float64Array,
  rect: { xMin: number; xMax: number; top: number; bottom: number },
): Array<{ i: number; j: number; weight: number }> {
  const area = (rect.xMax - rect.xMin) * (rect.bottom - rect.top);
  const shares: Array<{ i: number; j: number; weight: number }> = [];
  for (let j = 0; j + 1 < yFaces.length; j++) {
    const oy = overlap(yFaces[j], yFaces[j + 1], rect.top, rect.bottom);
    if (oy === 0) continue;
    for (let i = 0; i + 1 < xFaces.length; i++) {
      const ox = overlap(xFaces[i], xFaces[i + 1], rect.xMin, rect.xMax);
      if (ox > 0) shares.push({ i, j, weight: (ox * oy) / area });
    }
  }
  return shares;
}

/**
 * Source term of a cable, S_u + S_p·T in rises above the reference: the cable's heat is a line
 * in its circle temperature (cableModel.ts), W = W(T_ref) + β·θ_s, so S_u = W(T_ref) goes to the
 * right-hand side and S_p = β comes off the matrix (spread over the circle nodes as β·s·sᵀ). Exact, not a linearisation, because
 * R(T) is linear in T.
 */
export function cableSourceTerm(heatAtReferenceW: number, slopeWPerK: number): { su: number; sp: number } {
  return { su: heatAtReferenceW, sp: slopeWPerK };
}

/**
 * Cell-centred finite-volume mesh in one dimension (Patankar 1980, §4.6 "practice B": faces
 * first, one node inside each cell). Each layer is split into its own number of equal cells so
 * that every material interface is a cell face. The face conductances of the mesh (diffusion
 * term, terms.ts) are computed here from its geometry: face j + 1 joins cells j and j + 1.
 */
import type { NormalizedGeometry } from './normalized';
import { freshArrays, type ArraySource } from './pool';
import { cylinderHalfCellResistance, faceConductance, slabHalfCellResistance } from './terms';
import type { GeometryKind, LayerBound } from './types';

export interface Mesh {
  kind: GeometryKind;
  cellCount: number;
  /** n + 1 face positions, m (x for a slab, r for a cylinder). */
  faces: Float64Array;
  /** n node positions, m. */
  nodes: Float64Array;
  /** Cell volume per m² of face (slab, m) or per metre of length (cylinder, m²). */
  volumes: Float64Array;
  /** n + 1 face areas per m² of face (slab: 1) or per metre of length (cylinder: 2πr). */
  faceAreas: Float64Array;
  conductivity: Float64Array;
  /** 1 for a cell of a generating layer, else 0. */
  generating: Float64Array;
  /** Index of the layer each cell belongs to. */
  layerOfCell: Float64Array;
  layerBounds: LayerBound[];
}

/**
 * Node position inside a cylindrical cell [rw, re]: the root-mean-square radius,
 * r_P² = (rw² + rw·re + re²)/3. Why not the midpoint: with the logarithmic face conductance the
 * flux a uniform source drives through a face r_f is carried exactly only if r_f² is the
 * logarithmic mean of r_P² and r_E². The midpoint misses it by a relative δ²/(12 r_f²), and those
 * errors pile up towards the axis into an O(δ² ln N) temperature error (measured order 1.83–1.89
 * for a solid cylinder). The RMS radius cancels that leading term (the logarithmic mean of
 * r_f² ∓ r_f δ + δ²/3 is r_f² + O(δ⁴/r_f²)), restoring a clean second order, while the
 * conduction-only logarithmic profile stays exact for any node placement.
 */
export function cylinderNode(rw: number, re: number): number {
  return Math.sqrt((rw * rw + rw * re + re * re) / 3);
}

export function cellCount(geometry: NormalizedGeometry): number {
  let n = 0;
  for (const layer of geometry.layers) n += layer.cells;
  return n;
}

/** Doubles a mesh of n cells takes from its ArraySource. */
export function meshStoreSize(n: number): number {
  return 2 * (n + 1) + 5 * n;
}

/**
 * Build the mesh; its arrays come from `arrays` (a solve's scratch, see pool.ts, so that a solve
 * allocates one buffer instead of a dozen).
 */
export function buildMesh(geometry: NormalizedGeometry, arrays: ArraySource = freshArrays): Mesh {
  const layers = geometry.layers;
  const n = cellCount(geometry);
  const faces = arrays.take(n + 1);
  const faceAreas = arrays.take(n + 1);
  const nodes = arrays.take(n);
  const volumes = arrays.take(n);
  const conductivity = arrays.take(n);
  const generating = arrays.take(n);
  const layerOfCell = arrays.take(n);
  const layerBounds: LayerBound[] = [];
  const cylinder = geometry.kind === 'cylinder';

  let start = cylinder ? geometry.innerRadius : 0;
  let cell = 0;
  faces[0] = start;
  for (let layerIndex = 0; layerIndex < layers.length; layerIndex++) {
    const layer = layers[layerIndex];
    const end = start + layer.thickness;
    for (let c = 0; c < layer.cells; c++, cell++) {
      const w = faces[cell];
      // Computing the east face from the layer start (not by repeated addition) lands the last
      // face of the layer exactly on the interface.
      const e = c === layer.cells - 1 ? end : start + (layer.thickness * (c + 1)) / layer.cells;
      faces[cell + 1] = e;
      nodes[cell] = cylinder ? cylinderNode(w, e) : 0.5 * (w + e);
      volumes[cell] = cylinder ? Math.PI * (e - w) * (e + w) : e - w;
      conductivity[cell] = layer.conductivity;
      generating[cell] = layer.generating ? 1 : 0;
      layerOfCell[cell] = layerIndex;
    }
    layerBounds.push(layer.name !== undefined ? { name: layer.name, from: start, to: end } : { from: start, to: end });
    start = end;
  }
  for (let f = 0; f <= n; f++) faceAreas[f] = cylinder ? 2 * Math.PI * faces[f] : 1;
  return { kind: geometry.kind, cellCount: n, faces, nodes, volumes, faceAreas, conductivity, generating, layerOfCell, layerBounds };
}

/**
 * The diffusion term's laws (terms.ts) as this module uses them: the half-cell resistance of each
 * geometry and the face conductance. Held in one local table so that the loop over every face of
 * a mesh calls them directly (a loader that turns each imported name into a getter would
 * otherwise add a call per face).
 */
const DIFFUSION = {
  slab: slabHalfCellResistance,
  cylinder: cylinderHalfCellResistance,
  face: faceConductance,
} as const;

/** Resistance from node `cell` to the face at `facePosition`: K/W per m² (slab) or per m (cylinder). */
export function halfCellResistance(mesh: Mesh, cell: number, facePosition: number): number {
  const k = mesh.conductivity[cell];
  const node = mesh.nodes[cell];
  return mesh.kind === 'slab' ? DIFFUSION.slab(Math.abs(facePosition - node), k) : DIFFUSION.cylinder(node, facePosition, k);
}

/**
 * Diffusion conductance of every interior face: between cell j and cell j + 1 for j = 0 … n − 2
 * (W/K per m² or per m), written into `out` when given (length ≥ n − 1).
 */
export function interiorConductances(mesh: Mesh, out?: Float64Array): Float64Array {
  const n = mesh.cellCount;
  const g = out ?? new Float64Array(Math.max(n - 1, 0));
  for (let j = 0; j < n - 1; j++) {
    const face = mesh.faces[j + 1];
    g[j] = DIFFUSION.face(halfCellResistance(mesh, j, face), halfCellResistance(mesh, j + 1, face));
  }
  return g;
}

/** Conductance of the half-cell between the boundary node and the boundary face. */
export function boundaryHalfCellConductance(mesh: Mesh, side: 'inner' | 'outer'): number {
  const n = mesh.cellCount;
  return side === 'inner' ? 1 / halfCellResistance(mesh, 0, mesh.faces[0]) : 1 / halfCellResistance(mesh, n - 1, mesh.faces[n]);
}

/**
 * The cell holding `position`: the one whose faces bracket it; a position on an interior face
 * belongs to the cell after it, the last face to the last cell.
 */
export function cellHolding(mesh: Mesh, position: number): number {
  const n = mesh.cellCount;
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (mesh.faces[mid] <= position) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

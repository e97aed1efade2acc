/**
 * Face conductances (physics.md §1). Between two nodes the two half-cells are resistances in
 * series, each with its own conductivity, so a material interface is exact (Patankar 1980,
 * §4.2-3, harmonic mean). In a cylinder each half-cell is the exact shell resistance
 * ln(r_outer/r_inner)/(2πk) per metre (Incropera §3.3.1), so conduction without a source is
 * reproduced exactly on any mesh.
 */
import type { Mesh } from './mesh';

/** Resistance from node `cell` to the face at `facePosition`: K/W per m² (slab) or per m (cylinder). */
export function halfCellResistance(mesh: Mesh, cell: number, facePosition: number): number {
  const k = mesh.conductivity[cell];
  const node = mesh.nodes[cell];
  if (mesh.kind === 'slab') return Math.abs(facePosition - node) / k;
  // The axis of a solid cylinder is a face of zero area: infinite resistance, no special case.
  if (facePosition === 0) return Infinity;
  return Math.abs(Math.log(facePosition / node)) / (2 * Math.PI * k);
}

/**
 * Conductance between cell j and cell j + 1 for j = 0 … n − 2 (W/K per m² or per m), written into
 * `out` when given (length ≥ n − 1).
 */
export function interiorConductances(mesh: Mesh, out?: Float64Array): Float64Array {
  const n = mesh.cellCount;
  const g = out ?? new Float64Array(Math.max(n - 1, 0));
  for (let j = 0; j < n - 1; j++) {
    const face = mesh.faces[j + 1];
    g[j] = 1 / (halfCellResistance(mesh, j, face) + halfCellResistance(mesh, j + 1, face));
  }
  return g;
}

/** Conductance of the half-cell between the boundary node and the boundary face. */
export function boundaryHalfCellConductance(mesh: Mesh, side: 'inner' | 'outer'): number {
  const n = mesh.cellCount;
  return side === 'inner'
    ? 1 / halfCellResistance(mesh, 0, mesh.faces[0])
    : 1 / halfCellResistance(mesh, n - 1, mesh.faces[n]);
}

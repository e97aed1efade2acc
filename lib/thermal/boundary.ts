/**
 * Boundary conditions as contributions a_B (to a_P) and b_B (to b) of the boundary cell
 * (physics.md §1). The boundary face carries no node: its conductance is over the half-cell
 * between the boundary node and the face.
 */
import { boundaryHalfCellConductance } from './coefficients';
import type { Mesh } from './mesh';
import { evaluateSurface, isLinearSurface, linearisationSlope, surfaceFlux, type SurfaceExchange } from './surface';
import type { NormalizedBoundary } from './validate';

export interface BoundarySide {
  side: 'inner' | 'outer';
  spec: NormalizedBoundary;
  cell: number;
  /** Face position, m. */
  position: number;
  /** Face area per m² of face (slab, 1) or per metre (cylinder, 2πr). */
  faceArea: number;
  /** Conductance node → face over the half-cell. */
  halfConductance: number;
  /** Area exchanging heat with the surroundings (face area × areaFactor). */
  exchangeArea: number;
}

export function boundarySide(mesh: Mesh, spec: NormalizedBoundary, side: 'inner' | 'outer'): BoundarySide {
  const n = mesh.cellCount;
  const faceArea = side === 'inner' ? mesh.faceAreas[0] : mesh.faceAreas[n];
  return {
    side,
    spec,
    cell: side === 'inner' ? 0 : n - 1,
    position: side === 'inner' ? mesh.faces[0] : mesh.faces[n],
    faceArea,
    halfConductance: boundaryHalfCellConductance(mesh, side),
    exchangeArea: faceArea * (spec.kind === 'surface' ? spec.areaFactor : 1),
  };
}

export interface BoundaryTerms {
  /** Added to a_P of the boundary cell, W/K (per m² or per m). */
  a: number;
  /** Added to b of the boundary cell, W (equations written for rises above the reference). */
  b: number;
  /** Surface only: linearisation point (rise above the reference), slope g, exchange there. */
  surfaceRise?: number;
  slope?: number;
  exchange?: SurfaceExchange;
}

/**
 * Contributions for the equations written in θ = T − T_ref (T_ref: the context's reference
 * temperature, usually the ambient), which keeps the digits of small rises.
 *
 * Surface: the half-cell conductance G in series with the exchange linearised about θs*,
 * q_s ≈ q* + g(θs − θs*). Eliminating the face temperature from
 *   G(θ_P − θs) = A_f [q* + g(θs − θs*)]
 * gives a heat flow a_B θ_P − b_B with a_B = G·A_f g/(G + A_f g),
 * b_B = G·A_f(g θs* − q*)/(G + A_f g): a conductance in series with h·A (physics.md §1).
 */
export function boundaryTerms(side: BoundarySide, surfaceRise: number, reference: number): BoundaryTerms {
  const spec = side.spec;
  const G = side.halfConductance;
  switch (spec.kind) {
    case 'temperature':
      return { a: G, b: G * (spec.value - reference) };
    case 'flux':
      return { a: 0, b: spec.value * side.faceArea };
    case 'symmetry':
      return { a: 0, b: 0 };
    case 'surface': {
      const exchange = evaluateSurface(spec, reference + surfaceRise, surfaceRise + (reference - spec.ambient));
      const g = linearisationSlope(exchange, isLinearSurface(spec));
      // The evaluation may have clamped an absurd iterate; linearise where it evaluated.
      const rise = exchange.surfaceC === reference + surfaceRise ? surfaceRise : exchange.surfaceC - reference;
      const af = side.exchangeArea;
      const denominator = G + af * g;
      return {
        a: (G * af * g) / denominator,
        b: (G * af * (g * rise - exchange.netFlux)) / denominator,
        surfaceRise: rise,
        slope: g,
        exchange,
      };
    }
  }
}

/** Surface rise above the reference implied by the node rise under the linearisation. */
export function linearisedSurfaceRise(side: BoundarySide, terms: BoundaryTerms, nodeRise: number): number {
  const G = side.halfConductance;
  const af = side.exchangeArea;
  const g = terms.slope!;
  return (G * nodeRise + af * (g * terms.surfaceRise! - terms.exchange!.netFlux)) / (G + af * g);
}

/** Temperature at the boundary face, °C (symmetry: the node's, zero gradient). */
export function faceTemperature(side: BoundarySide, nodeC: number, surfaceC: number): number {
  const spec = side.spec;
  switch (spec.kind) {
    case 'temperature':
      return spec.value;
    case 'flux':
      return side.halfConductance > 0 ? nodeC + (spec.value * side.faceArea) / side.halfConductance : nodeC;
    case 'symmetry':
      return nodeC;
    case 'surface':
      return surfaceC;
  }
}

/**
 * Heat leaving the body through the face (W per m² of slab face or per metre of cylinder),
 * from the boundary's own law — for a surface the non-linear exchange at the final Ts, not its
 * linearisation — so the energy balance checks the iteration rather than repeating it.
 * Rises are above `reference`.
 */
export function heatLeaving(side: BoundarySide, nodeRise: number, surfaceRise: number, reference: number): number {
  const spec = side.spec;
  switch (spec.kind) {
    case 'temperature':
      return side.halfConductance * (nodeRise - (spec.value - reference));
    case 'flux':
      return -spec.value * side.faceArea;
    case 'symmetry':
      return 0;
    case 'surface':
      return side.exchangeArea * surfaceFlux(spec, reference + surfaceRise, surfaceRise + (reference - spec.ambient)).netFlux;
  }
}

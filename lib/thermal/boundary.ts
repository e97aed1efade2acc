/**
 * The two boundary faces of a 1-D mesh: their geometry (BoundarySide), the boundary term each
 * contributes to its cell at a pass (terms.ts, chosen by the boundary's kind), and the exact law
 * of each for the results: face temperature and heat leaving (physics.md §1).
 */
import { boundaryHalfCellConductance, type Mesh } from './mesh';
import type { NormalizedBoundary } from './normalized';
import { evaluateSurface, isLinearSurface, linearisationSlope, surfaceFlux, type SurfaceExchange } from './surface';
import {
  fluxBoundary,
  linearisedSurfaceRise as surfaceRiseFromNode,
  surfaceBoundary,
  symmetryBoundary,
  temperatureBoundary,
  type Contribution,
} from './terms';

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

/** The same face with another boundary law (a prepared problem at another ambient). */
export function withSpec(side: BoundarySide, spec: NormalizedBoundary): BoundarySide {
  return { ...side, spec };
}

/** A boundary's contribution at one pass, and for a surface the linearisation behind it. */
export interface BoundaryTerms extends Contribution {
  /** Surface only: linearisation point (rise above the reference), slope g, exchange there. */
  surfaceRise?: number;
  slope?: number;
  exchange?: SurfaceExchange;
}

/**
 * The boundary term of `side` for equations in θ = T − T_ref (T_ref = `reference`, °C). A surface
 * is linearised about the surface rise `surfaceRise` (surface.ts chooses the slope).
 */
export function boundaryTerms(side: BoundarySide, surfaceRise: number, reference: number): BoundaryTerms {
  const spec = side.spec;
  const G = side.halfConductance;
  switch (spec.kind) {
    case 'temperature':
      return temperatureBoundary(G, spec.value - reference);
    case 'flux':
      return fluxBoundary(spec.value, side.faceArea);
    case 'symmetry':
      return symmetryBoundary();
    case 'surface': {
      const exchange = evaluateSurface(spec, reference + surfaceRise, surfaceRise + (reference - spec.ambient));
      const g = linearisationSlope(exchange, isLinearSurface(spec));
      // The evaluation may have clamped an absurd iterate; linearise where it evaluated.
      const rise = exchange.surfaceC === reference + surfaceRise ? surfaceRise : exchange.surfaceC - reference;
      const term = surfaceBoundary(G, side.exchangeArea, g, rise, exchange.netFlux);
      return { aP: term.aP, b: term.b, surfaceRise: rise, slope: g, exchange };
    }
  }
}

/** Surface rise above the reference implied by the node rise under the linearisation. */
export function linearisedSurfaceRise(side: BoundarySide, terms: BoundaryTerms, nodeRise: number): number {
  return surfaceRiseFromNode(side.halfConductance, side.exchangeArea, terms.slope!, terms.surfaceRise!, terms.exchange!.netFlux, nodeRise);
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

/** True when the boundary's conductance does not depend on temperature. */
export function isLinearBoundary(b: NormalizedBoundary): boolean {
  return b.kind !== 'surface' || isLinearSurface(b);
}

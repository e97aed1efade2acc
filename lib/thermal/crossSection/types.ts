/**
 * Public shapes of the cross-section solver (physics.md §9, issue 20). SI units: metres, watts per
 * metre of cable length, K·m/W for thermal resistivity, amperes, Ω/m; temperatures in °C.
 *
 * Coordinates: x is horizontal, measured from the domain's centre line (the domain spans
 * −widthM/2 … +widthM/2); depth is measured downwards from the ground surface (0 … depthM).
 * The shapes are meant to be filled from a cable arrangement (issue 17): one entry per cable with
 * its centre, outer diameter and its own radial model, one entry per backfill or layer.
 */

/** A rectangle of its own soil or fill (layer, backfill, concrete duct bank). */
export interface CrossSectionRegion {
  name?: string;
  /** m; omitted = the domain's left edge. */
  xMinM?: number;
  /** m; omitted = the domain's right edge. */
  xMaxM?: number;
  /** m below the surface, ≥ 0. */
  depthTopM: number;
  /** m below the surface, > depthTopM, ≤ domain depth. */
  depthBottomM: number;
  /** K·m/W, > 0. */
  thermalResistivityKmPerW: number;
}

/** One covering of a cable (insulation, screen bedding, sheath, jacket), listed inside out. */
export interface CrossSectionCovering {
  name?: string;
  /** m: outer diameter of this covering. */
  outerDiameterM: number;
  /** K·m/W, > 0. */
  thermalResistivityKmPerW: number;
}

/**
 * IEC 60287-2-1 constants U, V, Y of the air (or other medium) between a cable and its duct
 * wall: T4′ = U / (1 + 0.1·(V + Y·θm)·De), De in mm, θm the medium's mean temperature in °C.
 */
export interface DuctAirConstants {
  U: number;
  V: number;
  Y: number;
}

export type DuctKind =
  | 'metallic-conduit'
  | 'fibre-in-air'
  | 'fibre-in-concrete'
  | 'asbestos-cement-in-air'
  | 'asbestos-cement-in-concrete'
  | 'earthenware'
  | 'plastic';

/** A duct around one cable, concentric with it (the cable lying on the duct floor is not modelled). */
export interface CrossSectionDuct {
  /** m */
  innerDiameterM: number;
  /** m: this circle, not the cable's, is the one coupled to the soil. */
  outerDiameterM: number;
  /** K·m/W of the duct wall, > 0. */
  wallThermalResistivityKmPerW: number;
  /** The duct-air constants by kind (IEC 60287-2-1 table, from memory), or given. */
  air: DuctKind | DuctAirConstants;
}

export interface CrossSectionConductor {
  /** m: the diameter the first covering starts from. */
  diameterM: number;
  /** Ω/m at 20 °C (the catalogue's R₂₀). */
  r20OhmPerM: number;
  /** 1/K */
  alpha20PerK: number;
  /** R_ac/R_dc, ≥ 1 (default 1). Held constant. */
  acFactor?: number;
  /** A (r.m.s.), ≥ 0. */
  currentA: number;
}

export interface CrossSectionCable {
  name?: string;
  /** m, centre, from the domain's centre line. */
  xM: number;
  /** m, centre, below the surface. */
  depthM: number;
  /** m: the cable's own outer diameter De (equal to the last covering's). */
  outerDiameterM: number;
  conductor: CrossSectionConductor;
  /** Inside out, from the conductor to the outer surface; may be empty for a bare conductor. */
  coverings: CrossSectionCovering[];
  /**
   * Losses proportional to the conductor's (screen or armour losses as λ·W_c, IEC 60287-1-1),
   * generated at the outer face of covering `afterCovering` (0-based).
   */
  proportionalLosses?: Array<{ name?: string; factor: number; afterCovering: number }>;
  /** Fixed losses, W/m, at the outer face of covering `afterCovering` (0-based). */
  fixedLosses?: Array<{ name?: string; wattsPerM: number; afterCovering: number }>;
  /** Dielectric loss, W/m, generated inside covering `inCovering` (the insulation). */
  dielectricLoss?: { wattsPerM: number; inCovering: number };
  duct?: CrossSectionDuct;
  /** °C: the conductor's limit, needed for cables that take part in an ampacity search. */
  maxConductorTemperatureC?: number;
}

export type CrossSectionHeatSource =
  /** A line source (a pipe or a far cable treated as a line), W per metre. */
  | { kind: 'line'; name?: string; xM: number; depthM: number; wattsPerM: number }
  /** Heat spread evenly over a rectangle, W per metre in total. */
  | {
      kind: 'rectangle';
      name?: string;
      xMinM: number;
      xMaxM: number;
      depthTopM: number;
      depthBottomM: number;
      wattsPerM: number;
    };

export type GroundSurface =
  /** The IEC 60287 assumption: the surface is held at the ambient ground temperature. */
  | { kind: 'isothermal'; temperatureC: number }
  /** The surface exchanges heat with the air: q = h·(T_surface − T_air). */
  | { kind: 'convective'; airTemperatureC: number; heatTransferCoefficientWPerM2K: number };

export interface CrossSectionMeshOptions {
  /** Cells across a cable's (or duct's) diameter next to it, ≥ 4 (default 16). */
  cellsAcrossCable?: number;
  /** Ratio of neighbouring cell sizes away from the cables, 1 < r ≤ 2 (default 1.15). */
  growthRatio?: number;
  /** Largest cell, m (default: 1/20 of the smaller of domain width and depth). */
  maxCellM?: number;
  /** Cell size next to a heat source, m (default: maxCellM / 20). */
  sourceCellM?: number;
  /** Divides every cell size; 2 halves them all (grid studies). Default 1. */
  refinement?: number;
}

export type PreconditionerKind = 'amg' | 'ic0' | 'jacobi';

export interface CrossSectionOptions {
  /** Outer iteration stop: largest temperature change between passes, K (default 1e-6). */
  toleranceK?: number;
  /** Energy balance demanded, relative (default 1e-6). */
  energyTolerance?: number;
  maxOuterIterations?: number;
  /** Conjugate-gradient stop: residual norm relative to the right-hand side (default 1e-10). */
  cgRelativeTolerance?: number;
  maxCgIterations?: number;
  /** Default 'amg' (classical algebraic multigrid V-cycle); 'ic0' and 'jacobi' for comparison. */
  preconditioner?: PreconditionerKind;
}

export interface CrossSectionInput {
  domain: { widthM: number; depthM: number };
  /** The native soil, wherever no region says otherwise. */
  soil: { thermalResistivityKmPerW: number };
  /** Later regions override earlier ones where they overlap. */
  regions?: CrossSectionRegion[];
  cables: CrossSectionCable[];
  heatSources?: CrossSectionHeatSource[];
  surface: GroundSurface;
  /** °C held along the bottom of the domain. The sides are adiabatic. */
  deepGroundTemperatureC: number;
  mesh?: CrossSectionMeshOptions;
  options?: CrossSectionOptions;
}

// ---------------------------------------------------------------------------------------------
// Results
// ---------------------------------------------------------------------------------------------

export interface CableLosses {
  /** W/m: I²R(T)·F_ac */
  conductorWPerM: number;
  /** W/m: Σλ·W_c */
  proportionalWPerM: number;
  fixedWPerM: number;
  dielectricWPerM: number;
  totalWPerM: number;
}

export interface CableTemperatures {
  name?: string;
  index: number;
  currentA: number;
  /** °C, the hottest point of the cable. */
  conductorC: number;
  /** °C at the outer face of each covering, inside out. */
  coveringOuterC: number[];
  /** °C, the cable's outer surface. */
  surfaceC: number;
  /** °C, the duct's outer surface (the circle coupled to the soil), when in a duct. */
  ductOuterC?: number;
  /** K·m/W of the duct air at the solved mean air temperature, when in a duct. */
  ductAirResistanceKmPerW?: number;
  losses: CableLosses;
  limitC?: number;
  /** limit − conductor, K (negative: over the limit). */
  marginK?: number;
}

export interface CrossSectionField {
  nx: number;
  ny: number;
  /** nx + 1 face positions, m. */
  xFacesM: Float64Array;
  /** ny + 1 face depths, m. */
  depthFacesM: Float64Array;
  xCentresM: Float64Array;
  depthCentresM: Float64Array;
  /**
   * °C per cell, row by row from the surface down: index = row·nx + column. Cells inside a cable
   * circle carry the 2-D field of the soil there (the superposition's view); the cable's own
   * temperatures are in `cables`, so a plot should draw the circles over them.
   */
  temperaturesC: Float64Array;
  /** −1 for soil, else the index of the cable whose circle holds the cell's centre. */
  cableOfCell: Int32Array;
}

export interface CrossSectionMeshReport {
  nx: number;
  ny: number;
  cells: number;
  /** Cells plus the nodes on the cables' circles. */
  unknowns: number;
  smallestCellM: number;
  largestCellM: number;
}

export interface CrossSectionHeat {
  /** W/m, generated at the solved temperatures. */
  generatedWPerM: number;
  /** W/m leaving through the ground surface. */
  toSurfaceWPerM: number;
  /** W/m leaving through the bottom (negative: entering). */
  toBottomWPerM: number;
  /** |generated − leaving| / largest term. */
  energyResidual: number;
}

export interface CrossSectionIterations {
  outer: number;
  /** Conjugate-gradient iterations, all outer passes together. */
  cg: number;
  cgPerOuter: number[];
}

export type CrossSectionRunaway =
  /** A cable's own coverings cannot carry its heat away at any surface temperature. */
  | { kind: 'cable'; cable: number; message: string }
  /** The coupled field has no steady state (the tangent matrix is not positive definite). */
  | { kind: 'field'; message: string };

export interface CrossSectionConverged {
  converged: true;
  status: 'converged';
  cables: CableTemperatures[];
  /** The governing cable: largest excess over its limit where limits are given, else hottest (absent without cables). */
  governing?: { index: number; name?: string; conductorC: number; marginK?: number };
  heat: CrossSectionHeat;
  iterations: CrossSectionIterations;
  mesh: CrossSectionMeshReport;
  field: CrossSectionField;
  preconditioner: PreconditionerKind;
  /**
   * Largest warming of the side walls by the heat sources (their rise above the no-heat column
   * between surface and deep ground) over the largest circle rise: should be small, or the
   * adiabatic sides are too close.
   */
  sideRiseRatio: number;
  /** Assumptions a reviewer should see. */
  flags: CrossSectionFlag[];
}

export interface CrossSectionFailed {
  converged: false;
  /** 'runaway': no steady state exists; 'not-converged': the iteration stopped without an answer. */
  status: 'runaway' | 'not-converged';
  runaway?: CrossSectionRunaway;
  message: string;
  /** +Infinity: fails every "below the limit?" check. No temperatures are given. */
  governing: { conductorC: number };
  iterations: CrossSectionIterations;
  mesh: CrossSectionMeshReport;
  preconditioner: PreconditionerKind;
}

export interface CrossSectionFlag {
  code: 'CROSS_SECTION_SHALLOW_CIRCLE' | 'CROSS_SECTION_SIDE_BOUNDARY' | 'CROSS_SECTION_DUCT_CONSTANTS_FROM_MEMORY';
  severity: 'note' | 'review';
  message: string;
}

export type CrossSectionResult = CrossSectionConverged | CrossSectionFailed;

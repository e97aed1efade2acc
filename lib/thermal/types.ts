/**
 * Public shapes of the thermal library. The names in the problem and the core result fields are
 * the stable contract of physics.md §7; everything marked "extension" was added on top of it.
 * SI units throughout: metres, W/(m·K), W/m³, W/m², amperes, Ω·m; temperatures in °C.
 */

export type GeometryKind = 'slab' | 'cylinder';

export interface Layer {
  /** m, > 0 */
  thickness: number;
  /** W/(m·K), > 0 */
  conductivity: number;
  /** Whether the source acts in this layer (default false). */
  generating?: boolean;
  /** Finite-volume cells across the layer, positive integer (default 40). */
  cells?: number;
  /** kg/m³, needed only by solveTransient. */
  density?: number;
  /** J/(kg·K), needed only by solveTransient. */
  heatCapacity?: number;
  /** Extension: label used for plots and messages. */
  name?: string;
}

export interface Geometry {
  kind: GeometryKind;
  /** m, cylinder only; default 0 = solid cylinder starting on the axis. */
  innerRadius?: number;
  /** Listed from the inner face outwards. */
  layers: Layer[];
}

/**
 * How a surface exchanges heat by convection (extension; the contract leaves `convection` open).
 * Lengths in metres, velocities in m/s. `diameter` defaults to the cylinder's outer diameter when
 * the surface is the outer face of a cylinder.
 */
export type ConvectionSpec =
  /** Natural convection, Churchill & Chu (1975), characteristic length the diameter. */
  | { kind: 'horizontal-cylinder'; diameter?: number }
  /** Natural convection, Churchill & Chu (1975), characteristic length the height. */
  | { kind: 'vertical-plate'; height: number }
  /** Natural convection from a horizontal plate; `length` is area/perimeter (Incropera ch. 9). */
  | { kind: 'horizontal-plate'; facing: 'up' | 'down'; length: number }
  /** Cross-flow over a cylinder, Churchill & Bernstein (1977). */
  | { kind: 'forced-cylinder'; velocity: number; diameter?: number }
  /** Parallel flow over a flat plate of length `length` in the flow direction. */
  | { kind: 'forced-plate'; velocity: number; length: number }
  /**
   * IEC 60287-2-1 free-air coefficient h = Z/De^g + E, heat = h·(Δθs)^(5/4) per m². It already
   * contains radiation, so the surface must have no emissivity. Defaults: single cable.
   */
  | { kind: 'iec-60287-free-air'; diameter?: number; Z?: number; E?: number; g?: number };

export interface TemperatureBoundary {
  kind: 'temperature';
  /** °C */
  value: number;
}

export interface FluxBoundary {
  kind: 'flux';
  /** W/m² of face area flowing INTO the body (negative = heat drawn out). */
  value: number;
}

export interface SymmetryBoundary {
  kind: 'symmetry';
}

export interface SurfaceBoundary {
  kind: 'surface';
  /** Fluid (air) temperature, °C. */
  ambient: number;
  /** Fixed convective coefficient, W/(m²·K) (give either this or `convection`). */
  h?: number;
  /** Surface emissivity for radiation to the surroundings, 0..1 (default 0 = no radiation). */
  emissivity?: number;
  /** Temperature-dependent convection correlation. */
  convection?: ConvectionSpec;
  /** Extension: radiative surroundings temperature, °C (default: ambient). */
  surroundings?: number;
  /** Extension: absorbed (e.g. solar) flux, W per m² of this surface (default 0). */
  absorbedFlux?: number;
  /**
   * Extension: multiplies the face area for convection and radiation (default 1). The bus-bar
   * builder uses (w + t)/w to lump the narrow edges onto the wide faces (physics.md §3).
   */
  areaFactor?: number;
}

export type Boundary = TemperatureBoundary | FluxBoundary | SymmetryBoundary | SurfaceBoundary;

export interface UniformSource {
  kind: 'uniform';
  /** W/m³ in every generating layer. */
  q: number;
}

export interface JouleSource {
  kind: 'joule';
  /** A (rms), ≥ 0 */
  current: number;
  /** Conductor cross-section carrying the current, m². */
  area: number;
  /** Effective resistivity at 20 °C, Ω·m (R₂₀ per metre × area, physics.md §1). */
  rho20: number;
  /** Temperature coefficient at 20 °C, 1/K, ≥ 0. */
  alpha20: number;
  /** R_ac/R_dc ≥ 1 (default 1). */
  acFactor?: number;
}

export type Source = UniformSource | JouleSource;

export type Linearisation = 'lagged' | 'tangent';

export interface SolverOptions {
  /** Outer-iteration stop, K (default 1e-6). */
  tolerance?: number;
  /** Relative energy-balance closure required (default 1e-6). */
  energyTolerance?: number;
  /** Outer iterations allowed (default 200). */
  maxIterations?: number;
  /** Preferred Joule linearisation (default 'tangent'; falls back to 'lagged' when unsafe). */
  linearisation?: Linearisation;
  /** Under-relaxation factor for lagged passes, 0 < ω ≤ 1 (default 0.7). */
  relaxation?: number;
  /**
   * °C (default 2000). Joule source with temperature-dependent surroundings only: a steady state
   * hotter than this is not reported; the result is a runaway with criterion 'temperature-limit'
   * and the largest current whose steady hot spot stays below it. Also stops an iteration that
   * keeps climbing past it. Fixed surroundings use the exact eigenvalue criterion instead.
   */
  temperatureLimit?: number;
}

export type FlagSeverity = 'info' | 'warning';

/** Extension: an assumption or a validity warning a reviewer can accept or reject. */
export interface ThermalFlag {
  code: string;
  severity: FlagSeverity;
  message: string;
}

export interface ThermalProblem {
  geometry: Geometry;
  source: Source;
  /** Boundary at the inner face (x = 0 for a slab, r = innerRadius for a cylinder). */
  inner: Boundary;
  /** Boundary at the outer face. */
  outer: Boundary;
  options?: SolverOptions;
  /** Extension: assumptions made by whoever built the problem, copied into the result's flags. */
  assumptions?: ThermalFlag[];
  /**
   * Extension: heat released at a position (m, the mesh's coordinate: radius of a cylinder,
   * distance from the inner face of a slab), W per metre of cylinder or W per m² of slab face, ≥ 0.
   * The cell holding the position takes it — e.g. the losses in a cable's metallic screen, or the
   * dielectric loss spread over points of the insulation. Independent of temperature.
   */
  pointSources?: PointHeat[];
}

export interface PointHeat {
  position: number;
  heat: number;
}

export interface TransientProblem extends ThermalProblem {
  /** Starting temperatures, °C: one value for every cell, or one per cell. */
  initial: number | number[];
  /** Implicit-Euler time step, s. */
  timeStep: number;
  /** Number of steps (default 1). */
  steps?: number;
}

/** Extension: what a convection correlation returned at the final surface temperature. */
export interface ConvectionEvaluation {
  /** W/(m²·K), secant coefficient: q = h·(Ts − T∞). */
  h: number;
  correlation: string;
  nusselt?: number;
  rayleigh?: number;
  reynolds?: number;
  prandtl?: number;
  /** K */
  filmTemperatureK?: number;
  /** False when the dimensionless group is outside the correlation's stated range. */
  inRange: boolean;
  /** Stated validity range, for the message. */
  validRange?: string;
  /** False when the film temperature is outside the air-property table (clamped there). */
  airPropertiesInTable?: boolean;
}

/** Extension: how one surface boundary behaved at the final state. */
export interface SurfaceDiagnostics {
  /** °C */
  temperature: number;
  /** Convective coefficient (secant), W/(m²·K). */
  hConv: number;
  /** Radiative coefficient εσ(Ts+Tsur)(Ts²+Tsur²), W/(m²·K). */
  hRad: number;
  /** Net heat leaving per m² of surface (convection + radiation − absorbed), W/m². */
  heatFlux: number;
  correlation: string;
  rayleigh?: number;
  reynolds?: number;
  nusselt?: number;
  filmTemperatureK?: number;
  /** False if any correlation or property table was used outside its stated range. */
  inRange: boolean;
}

export interface LayerBound {
  name?: string;
  /** m, same coordinate as `positions` */
  from: number;
  to: number;
}

export interface RunawayReport {
  /**
   * A. 'eigenvalue' (surroundings independent of temperature): the exact current of the discrete
   * model at and above which no steady state exists. 'temperature-limit' (surroundings whose
   * conductance depends on temperature): the largest current, found by bisection to a relative
   * 1e-4, whose steady hot spot stays below options.temperatureLimit — a conservative onset.
   */
  current?: number;
  criterion: 'eigenvalue' | 'temperature-limit';
}

export interface HeatBalance {
  /** 'W/m' per metre of cylinder length, 'W/m²' per m² of slab face. */
  unit: 'W/m' | 'W/m²';
  generated: number;
  /** Heat leaving through the inner face (negative = entering). */
  leavingInner: number;
  /** Heat leaving through the outer face (negative = entering). */
  leavingOuter: number;
  /** Transient only: heat stored in the body over the last step, per second. */
  stored: number;
}

export interface SteadyResult {
  /** Node positions, m: distance from the inner face (slab) or radius (cylinder). */
  positions: number[];
  /**
   * Node temperatures, °C. EMPTY when `converged` is false (runaway or no convergence): the
   * solver never reports a temperature it could not establish.
   */
  temperatures: number[];
  /**
   * Hottest point among the nodes and the faces whose temperature is known. When no steady state
   * was established the temperature is +Infinity (so every "below the limit?" test fails safe)
   * and the position is where the growth concentrates: the peak of the unstable mode (eigenvalue
   * runaway), of the last bounded state (bisection), or of the last iterate.
   */
  hotSpot: { temperature: number; position: number };
  iterations: number;
  converged: boolean;
  /**
   * |generated − leaving − stored| divided by the largest flow (absorbed heat included, never
   * less than 1e-12 W); +Infinity when not converged.
   */
  energyResidual: number;
  runaway?: RunawayReport;

  // ---- extensions -------------------------------------------------------------------------
  geometry: GeometryKind;
  /** Outer face temperature, °C (+Infinity when not converged). */
  surfaceTemperature: number;
  /** Inner and outer face temperatures, °C. */
  faceTemperatures: { inner: number; outer: number };
  /** Cylinder only: heat generated per metre of length, W/m. */
  heatGeneratedWPerM?: number;
  /** Slab only: heat generated per m² of face, W/m². */
  heatGeneratedWPerM2?: number;
  heatBalance: HeatBalance;
  /** Joule linearisation used in the final pass ('lagged' for a uniform source, S_p = 0). */
  linearisation: Linearisation;
  /** How many outer passes used each linearisation. */
  linearisationCounts: { tangent: number; lagged: number };
  /** Tridiagonal (Thomas) solves performed, bisections included. */
  tridiagonalSolves: number;
  surface: { inner?: SurfaceDiagnostics; outer?: SurfaceDiagnostics };
  layerBounds: LayerBound[];
  /**
   * Joule source with temperature-independent surroundings: the exact current at which the
   * discrete model loses its steady state (A). Undefined otherwise.
   */
  runawayOnsetCurrentA?: number;
  flags: ThermalFlag[];
  /** Only when the iteration stopped without converging (not runaway): its last iterate, °C. */
  lastIterate?: number[];
}

export interface TransientResult extends SteadyResult {
  /** s, end of the last step */
  time: number;
  /** Node temperatures at the end of each step, °C. */
  history: { time: number; temperatures: number[] }[];
}

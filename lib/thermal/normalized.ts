/**
 * The shapes the solver works on after validation (validate.ts): the public shapes of types.ts
 * with every default filled in. They are derived from the public types, not written again, so a
 * field added to the contract reaches the solver's types by itself.
 */
import type {
  ConvectionSpec,
  FluxBoundary,
  GeometryKind,
  JouleSource,
  Layer,
  SolverOptions,
  SurfaceBoundary,
  SymmetryBoundary,
  TemperatureBoundary,
  ThermalFlag,
  UniformSource,
} from './types';

/** Every member of a union with its optional fields made required (distributes over the union). */
type Filled<T> = T extends unknown ? Required<T> : never;

export type NormalizedLayer = Omit<Layer, 'generating' | 'cells'> & Required<Pick<Layer, 'generating' | 'cells'>>;

export interface NormalizedGeometry {
  kind: GeometryKind;
  innerRadius: number;
  layers: NormalizedLayer[];
}

/** A convection spec with its defaults filled (a cylinder's diameter, the IEC constants). */
export type NormalizedConvection = Filled<ConvectionSpec>;

/** A surface with its defaults filled; `fixedH` is 0 when the surface has no fixed coefficient. */
export type NormalizedSurface = Required<Omit<SurfaceBoundary, 'h' | 'convection'>> & {
  fixedH: number;
  convection?: NormalizedConvection;
};

export type NormalizedBoundary = TemperatureBoundary | FluxBoundary | SymmetryBoundary | NormalizedSurface;

export type NormalizedJouleSource = Required<JouleSource>;

export type NormalizedSource = UniformSource | NormalizedJouleSource;

export type NormalizedOptions = Required<SolverOptions>;

/**
 * Heat lost sideways from every cell through surfaces around it (the bar run along its length,
 * physics.md §6: the fin term S_p = −hP/A_c). Not part of the §7 problem: built by barRun.ts.
 */
export interface SidewaysLoss {
  /** The surfaces around the section, each evaluated at the cell's temperature. */
  surfaces: NormalizedSurface[];
  /** m² of each surface per m³ of body: its share of the perimeter over the section, P_f/A_c (1/m). */
  areaPerVolume: number;
}

/** Heat put in at a point (a bolted joint): W per unit of face area of the mesh (per m² of a slab). */
export interface PointSource {
  /** m, same coordinate as the mesh: the cell holding it takes the heat. */
  position: number;
  heat: number;
}

export interface NormalizedProblem {
  geometry: NormalizedGeometry;
  source: NormalizedSource;
  inner: NormalizedBoundary;
  outer: NormalizedBoundary;
  options: NormalizedOptions;
  assumptions: ThermalFlag[];
  /** Extension for the bar run (barRun.ts); absent in §7 problems. */
  sideways?: SidewaysLoss;
  /** Extension for the bar run's joints (barRun.ts); absent in §7 problems. */
  pointSources?: PointSource[];
}

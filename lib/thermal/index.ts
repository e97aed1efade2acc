/**
 * lib/thermal — one-dimensional finite-volume heat balance of cables and bus bars
 * (physics.md §§1–3, contract §7). Plain TypeScript: no React, no database, no Node-only APIs.
 */
export { solveSteady, solveTransient } from './solve';
// A problem validated and meshed once, solved at many currents, AC factors and ambients.
export { prepare } from './prepare';
export type { PreparedProblem, PreparedSolveOptions } from './prepare';
export { ThermalInputError, isThermalInputError } from './errors';
export type {
  Boundary,
  ConvectionEvaluation,
  ConvectionSpec,
  FlagSeverity,
  FluxBoundary,
  Geometry,
  GeometryKind,
  HeatBalance,
  JouleSource,
  Layer,
  LayerBound,
  Linearisation,
  RunawayReport,
  SolverOptions,
  Source,
  SteadyResult,
  SurfaceBoundary,
  SurfaceDiagnostics,
  SymmetryBoundary,
  TemperatureBoundary,
  ThermalFlag,
  ThermalProblem,
  TransientProblem,
  TransientResult,
  UniformSource,
} from './types';

// Builders from catalogue-like data (physics.md §3).
export { busBarProblem, cableProblem } from './builders';
export type { BusBarCoating, BusBarInput, CableBuried, CableConvectionInput, CableInAir, CableInput, CableLayerInput } from './builders';

// Helpers: numerics, correlations, properties, IEC formulae.
export { solveTridiagonal } from './tridiagonal';
export { airProperties, AIR_TABLE_FROM_MEMORY, type AirProperties } from './air';
export {
  churchillBernstein,
  churchillChuHorizontalCylinder,
  churchillChuVerticalPlate,
  evaluateConvection,
  flatPlateAverage,
  horizontalPlateLowerHot,
  horizontalPlateUpperHot,
  iecFreeAirCoefficient,
  rayleighNumber,
} from './convection';
export { radiationCoefficient, radiativeFlux } from './radiation';
export {
  buriedExternalThermalResistance,
  iecFreeAirSurfaceRise,
  insulationThermalResistance,
  IEC_FREE_AIR_SINGLE_CABLE,
  type IecFreeAirResult,
} from './iec60287';
export { smallestGeneralizedEigenvalue } from './runaway';
export {
  ABSOLUTE_ZERO_C,
  DEFAULT_CELLS_PER_LAYER,
  DEFAULT_TEMPERATURE_LIMIT_C,
  KELVIN_OFFSET,
  STANDARD_GRAVITY,
  STEFAN_BOLTZMANN,
} from './constants';

// Beyond steady state (physics.md §6): runs over time and the bar run along its length.
export { dailyCycle, faultHeating, overloadTimeToLimit } from './transientRuns';
export type {
  DailyCycleInput,
  DailyCycleResult,
  FaultHeatingInput,
  FaultHeatingResult,
  HotSpotPoint,
  OverloadInput,
  OverloadOutcome,
  OverloadResult,
} from './transientRuns';
export { DEFAULT_JOINT_RESISTANCE_MICRO_OHM, solveBarRun } from './barRun';
export type { BarRunEnd, BarRunInput, BarRunJoint, BarRunResult } from './barRun';
export {
  ENCLOSURE_WALL_COEFFICIENTS_W_PER_M2K,
  SURFACE_FACTORS,
  effectiveCoolingSurface,
  enclosureAirTemperature,
} from './enclosure';
export type { EnclosureAirInput, EnclosureAirResult, EnclosureFace, EnclosureShape, EnclosureWall } from './enclosure';

// The ground around buried cables in two dimensions (physics.md §9, issue 20).
export * from './crossSection';

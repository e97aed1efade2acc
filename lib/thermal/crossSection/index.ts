/**
 * lib/thermal/crossSection — the ground around buried cables in two dimensions (physics.md §9,
 * issue 20). Pure TypeScript: no React, no database, no Node-only APIs.
 */
export { prepareCrossSection, solveCrossSection, solvePrepared, type PreparedCrossSection, type SolveOverrides } from './solve';
export { ampacityOfPrepared, crossSectionAmpacity, type CrossSectionAmpacity, type CrossSectionAmpacityOptions } from './ampacity';
export { DUCT_AIR_CONSTANTS, ductAirResistance } from './ductAir';
export type {
  CableLosses,
  CableTemperatures,
  CrossSectionCable,
  CrossSectionConductor,
  CrossSectionConverged,
  CrossSectionCovering,
  CrossSectionDuct,
  CrossSectionFailed,
  CrossSectionField,
  CrossSectionFlag,
  CrossSectionHeat,
  CrossSectionHeatSource,
  CrossSectionInput,
  CrossSectionIterations,
  CrossSectionMeshOptions,
  CrossSectionMeshReport,
  CrossSectionOptions,
  CrossSectionRegion,
  CrossSectionResult,
  CrossSectionRunaway,
  DuctAirConstants,
  DuctKind,
  GroundSurface,
  PreconditionerKind,
} from './types';

/**
 * Bus-bar systems (issue 18; physics.md §10): the geometry of a three-phase system of packs, the
 * current distribution by the filament method, the heat balance of every bar, the ampacity with
 * the two coupled, and the short-circuit forces of IEC 60865-1. Pure TypeScript, SI units.
 */
export { prepareBusbarSystem } from './geometry';
export type {
  BusbarArrangement,
  BusbarBar,
  BusbarGroup,
  BusbarGroupName,
  BusbarNeutralInput,
  BusbarRectangle,
  BusbarSystemInput,
  PreparedBusbarSystem,
} from './geometry';

export { computeCurrentDistribution, defaultMesh, isolatedBarAcFactor, prepareCurrentDistribution, skinDepth, solveCurrentDistribution, CURRENT_DISTRIBUTION_METHOD } from './currentDistribution';
export type {
  BarCurrentResult,
  BusbarConductorData,
  BusbarExcitation,
  CurrentDistributionInput,
  CurrentDistributionResult,
  FilamentMeshOptions,
  GroupCurrentResult,
} from './currentDistribution';

export { solveFilaments, meshRectangle, gradedBreaks } from './filaments';
export type { Complex, Filament, FilamentProblem, FilamentSolution, RectangleMesh } from './filaments';
export { logMeanDistance, logMeanDistanceGradientX, rectangularForceFactor } from './rectangleInductance';

export { preparePackHeat, solvePackHeat, packHeatOut } from './packHeat';
export type { BarHeatResult, PackHeatConditions, PackHeatGeometry, PackHeatResult, PreparedPackHeat } from './packHeat';
export { channelConvection, barCohenRohsenowNusselt, elenbaasNusselt, CHANNEL_RANGE } from './channelConvection';
export type { ChannelCorrelation, ChannelEvaluation } from './channelConvection';
export { parallelStripsViewFactor } from './viewFactors';

export { rateBusbarSystem, rateIsolatedBar, packRatingBreakdown } from './rating';
export type { BusbarRatingConditions, BusbarRatingInput, BusbarRatingResult, PackRatingBreakdown, RatingExcitation } from './rating';

export { shortCircuitForces, peakFactor, BEAM_FACTORS, DEFAULT_DYNAMIC_FACTORS, DEFAULT_YIELD_STRENGTH_PA, Q_RECTANGULAR } from './forces';
export type { DynamicFactors, ShortCircuitForceInput, ShortCircuitForceResult, SupportArrangement } from './forces';

export { BUSBAR_FLAG_CODES } from './flags';
export type { BusbarFlag, BusbarFlagCode, BusbarFlagSeverity } from './flags';

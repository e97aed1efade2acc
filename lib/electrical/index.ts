/**
 * `lib/electrical` — electrical checks and sizing for Ampwarden.
 *
 * Plain TypeScript: no React, Next.js, database or Node-only APIs (it runs in the browser).
 * SI units inside; temperatures in °C; sections in mm². Contract: physics.md §7.
 */
export { ElectricalInputError, SizingError } from './errors';
export { CONDUCTOR_MATERIALS, materialConstants, MU0 } from './materials';
export type { ConductorMaterial, ConductorMaterialConstants } from './materials';
export {
  resistanceAt,
  skinEffect,
  skinEffectFactor,
  proximityEffect,
  proximityEffectFactor,
  acResistance,
  barAcResistanceRatio,
  planeConductorRatio,
  jouleLossPerMetre,
  BAR_SKIN_METHOD,
} from './resistance';
export type {
  SkinEffectDetail,
  SkinEffectRange,
  ProximityEffectDetail,
  AcResistanceResult,
  BarAcRatioResult,
} from './resistance';
export { adiabaticK, shortCircuitFinalTemperature, minimumSection, shortCircuitWithstandCurrent } from './shortCircuit';
export { voltageDrop, ANNEX_G_DEFAULT_REACTANCE_OHM_PER_M } from './voltageDrop';
export type { VoltageDropResult } from './voltageDrop';
export { Money, toMoney, lossEnergyCost, conductorMass, materialCost } from './economics';
export type { MoneyInput, LossEnergyCostInput, LossEnergyCostResult } from './economics';
export { findLimitCurrent } from './sizing/rootFinder';
export type { LimitEvaluation, LimitRoot } from './sizing/rootFinder';

// ── Sizing (physics.md §5) ──
export { ampacity, evaluateCandidate, compareCandidates, AMPACITY_TOLERANCE_A, CROSS_CHECK_LIMIT_PERCENT, NEAR_RUNAWAY_RATIO } from './sizing/evaluate';
export { BEYOND_STEADY_FLAG_CODES, FLAG_CODES, FLAG_REGISTRY, makeFlag, RETIRED_FLAG_CODES } from './sizing/flags';
export type { BeyondSteadyFlagCode } from './sizing/flags';
export type { AssumptionFlag, FlagCode, FlagDefinition, FlagSeverity } from './sizing/flags';
export {
  DEFAULT_AIR_AMBIENT_BAR_C,
  DEFAULT_AIR_AMBIENT_CABLE_C,
  DEFAULT_GROUND_C,
  DEFAULT_SOIL_RESISTIVITY_KM_PER_W,
  DEFAULT_SOLAR_ABSORPTIVITY,
  ADIABATIC_MAX_DURATION_S,
} from './sizing/prepareConditions';
export type {
  AmpacityResult,
  BarCandidate,
  BarCoating,
  CableArrangement,
  CableCandidate,
  CableLayer,
  Candidate,
  CandidateCosts,
  CandidateEvaluation,
  CandidateEvaluationError,
  CandidateEvaluationOk,
  ClosedFormCheck,
  Comparison,
  Conditions,
  EconomicsInputs,
  GoverningLimit,
  HeatProfile,
  Installation,
  LimitSource,
  ProfileLayer,
  ShortCircuitCheck,
} from './sizing/types';
export { alongRunCheck, overTimeCheck, CONDUCTOR_VOLUMETRIC_HEAT_CAPACITY, COVERING_VOLUMETRIC_HEAT_CAPACITY } from './sizing/beyondSteady';
export type { AlongRunInputs, AlongRunResult, OverTimeInputs, OverTimeResult } from './sizing/beyondSteady';
export { enclosureAirCheck, ENCLOSURE_AIR_METHOD, rateInsideEnclosure } from './sizing/enclosureAir';
export type { EnclosureAirCheckResult, EnclosureAirInputs } from './sizing/enclosureAir';
export { SOLVER_VERSION } from './version';

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

/**
 * The sizing layer's inputs after validation (prepareConditions.ts, prepareCandidate.ts): every
 * default applied, every number checked once. Code after `prepare` trusts these types and
 * validates nothing again.
 */
import type { ConductorMaterial, ConductorMaterialConstants } from '../materials';
import type { BarCandidate, ProtectionConditions, BusbarSystemConditions, BuriedSurroundings, CableCandidate, CableScreen, Conditions, EconomicsInputs, GoverningLimit, OtherCircuit } from './types';

export type Placement = 'cable-in-air' | 'bar-on-edge' | 'bar-flat' | 'buried';

export interface PreparedConditions {
  source: Conditions;
  designCurrentA: number;
  frequencyHz: number;
  phases: 1 | 3;
  nominalVoltageV: number;
  lengthM: number;
  powerFactor: number;
  reactanceOhmPerM?: number;
  maxVoltageDropPercent?: number;
  /** Air or ground temperature the conductor sees (°C), and whether it was assumed. */
  ambientC: number;
  ambientAssumed: boolean;
  placement: Placement;
  enclosureFactor: number;
  /** User-entered factor for OTHER circuits (never the circuit's own cables). */
  groupingFactor: number;
  formation: 'trefoil' | 'flat' | 'flat-vertical';
  spacingM?: number;
  /** Parallel runs and other circuits, in one row beside the circuit. */
  circuitSpacingM?: number;
  circuitRow: 'horizontal' | 'vertical';
  otherCircuits: OtherCircuit[];
  transposed: boolean;
  duct?: NonNullable<BuriedSurroundings['duct']>;
  protection?: ProtectionConditions;
  /** Third-harmonic content of the phase current, as a fraction. */
  thirdHarmonicFraction: number;
  /** The bus-bar system a bar belongs to (phase spacing, supports), when described. */
  busbarSystem?: BusbarSystemConditions;
  backfill?: NonNullable<BuriedSurroundings['backfill']>;
  buried?: { depthM: number; soilResistivityKmPerW: number; soilAssumed: boolean; groundAssumed: boolean };
  windSpeedMPerS: number;
  solar?: { irradianceWPerM2: number; absorptivity: number; absorptivityAssumed: boolean };
  fault?: { currentA: number; durationS: number; initialFrom: 'limit' | 'operating' };
  userLimitC?: number;
  /** The designer's reason for a raised limit, trimmed; undefined when none was written. */
  userLimitJustification?: string;
  raiseMaterialLimit: boolean;
  surfaceCoefficientWPerM2K?: number;
  economics?: EconomicsInputs;
}

export interface PreparedLayer {
  name: string;
  role: string;
  thicknessM: number;
  conductivityWPerMK: number;
  /** Continuous limit of this layer (after any user override), °C; undefined for layers in contact. */
  limitC?: number;
  /** True when this layer is in contact with the conductor. */
  contact: boolean;
}

interface PreparedCommon {
  index: number;
  id: string;
  label: string;
  material: ConductorMaterial;
  constants: Readonly<ConductorMaterialConstants>;
  alpha20: number;
  /** R20 of one conductor (core or bar), Ω/m. */
  r20: number;
  /** Conductors of one phase sharing its current (parallel runs × bars per pack). */
  conductorsPerPhase: number;
  parallel: number;
  sectionPerConductorMm2: number;
  sectionPerPhaseMm2: number;
  /** The limit of whatever touches the conductor (covering, terminal, user). */
  contactLimit: GoverningLimit;
  /** Coverings from the conductor outwards (a bar's coating: one layer, on both faces). */
  layers: PreparedLayer[];
  emissivity: number;
  shortCircuitLimitC?: number;
  /** Conductor price and density inputs as entered (validated). */
  costs: CableCandidate['costs'];
}

export interface PreparedCable extends PreparedCommon {
  kind: 'cable';
  source: CableCandidate;
  cores: number;
  /** Loaded cores, modelled as one equivalent conductor. */
  loadedCores: number;
  /**
   * The neutral's heat over one phase core's (0 without harmonics): with third harmonics the
   * neutral of a four- or five-core cable gives off (3·h₃)² of a phase core's heat (IEC 60364-5-52
   * Annex E currents), carried by the equivalent conductor as a higher resistance.
   */
  neutralHeatShare: number;
  conductorDiameterM: number;
  outerDiameterM: number;
  ks?: number;
  kp?: number;
  /** Metallic screen or armour present. */
  hasMetallicLayer: boolean;
  /** The screen's electrical data (single-core cables), when given. */
  screen?: CableScreen;
  /** Index in `layers` of the layer with role 'screen' (where the screen loss is released). */
  screenLayerIndex?: number;
}

export interface PreparedBar extends PreparedCommon {
  kind: 'bar';
  source: BarCandidate;
  widthM: number;
  thicknessM: number;
  barsPerPhase: number;
  /** Clear gap between the bars of a pack, m (default the bar thickness). */
  barGapM: number;
  acResistanceRatio?: number;
  yieldStrengthPa?: number;
}

export type PreparedCandidate = PreparedCable | PreparedBar;

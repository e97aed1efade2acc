/**
 * Inputs and results of the sizing layer (physics.md §5). SI units; temperatures in °C;
 * sections in mm²; money as decimal strings (decimal.js inside).
 */
import type { ConductorMaterial } from '../materials';
import type { MoneyInput } from '../economics';
import type { AssumptionFlag } from './flags';
import type { HarmonicSizingResult, ProtectiveDevice } from '../protection';
import type { ProtectionResult } from './checks/protection';

// ───────────────────────────── Candidate ─────────────────────────────

/** One concentric covering of a cable, listed from the conductor outwards. */
export interface CableLayer {
  /** Plain name, e.g. 'XLPE insulation', 'PVC sheath'. */
  name: string;
  /** What the layer is; metallic screens and armour raise SHEATH_LOSSES_NOT_INCLUDED. */
  role?: 'insulation' | 'semiconductor' | 'screen' | 'bedding' | 'armour' | 'sheath' | 'jacket' | 'filler' | 'other';
  thicknessM: number;
  /** Thermal resistivity ρ_T, K·m/W (IEC 60287-2-1 Table 1 for common materials). */
  thermalResistivityKmPerW: number;
  /** Highest continuous temperature of this layer, °C. */
  continuousLimitC?: number;
  /** Highest short-circuit temperature of this layer, °C (the insulation's governs the fault check). */
  shortCircuitLimitC?: number;
}

export interface CandidateCosts {
  /** Conductor metal price per kg (decimal). */
  conductorPricePerKg?: MoneyInput;
  /** Price of one conductor (a cable, or a bar) per metre; replaces the per-kg metal price. */
  pricePerM?: MoneyInput;
  /** Density override, kg/m³ (default: copper 8890, aluminium 2703). */
  densityKgPerM3?: number;
}

interface CandidateCommon {
  /** Stable id within the comparison (e.g. the catalogue conductor id × arrangement). */
  id?: string;
  label?: string;
  material: ConductorMaterial;
  /** DC resistance at 20 °C of ONE conductor (one core or one bar), Ω/m: datasheet or IEC 60228 maximum. */
  r20OhmPerM: number;
  /** Override of α₂₀ (default IEC 60287-1-1 Table 1). */
  alpha20PerK?: number;
  /** Identical runs per phase sharing the current (parallel cables or parallel bar packs); default 1. */
  parallel?: number;
  catalogue?: { conductorId?: string; coveringIds?: string[] };
  /** Where the data came from; a note containing "from memory" raises DATA_FROM_MEMORY. */
  sourceNotes?: string[];
  /** Set when any of the data was recalled rather than read from a source. */
  dataFromMemory?: boolean;
  costs?: CandidateCosts;
}

export interface CableCandidate extends CandidateCommon {
  kind: 'cable';
  /** Nominal conductor section of one core, mm². */
  sectionMm2: number;
  /** Conductor diameter d_c, m (catalogue; sets the geometry and the proximity effect). */
  conductorDiameterM: number;
  /**
   * Number of cores (1–5). For more than one, the first layer is each core's insulation, the
   * 'filler'/'bedding' layers after it the inner covering, the rest the coverings over the whole
   * cable; the heat path between the cores is solved in two dimensions (MULTICORE_ROUND_CORES).
   * Default 1.
   */
  cores?: number;
  /** Coverings from the conductor outwards; the first is in contact with the conductor. */
  layers: CableLayer[];
  /** Emissivity of the outer surface (default 0.9, common for PVC/PE jackets; flagged). */
  emissivity?: number;
  /** IEC 60287-1-1 Table 2 factors (default 1 and 1: round conductor, extruded insulation). */
  ks?: number;
  kp?: number;
  /**
   * The electrical data of a single-core cable's metallic screen or sheath (the layer with role
   * 'screen' gives its place and thickness): with them the screen losses λ₁ of IEC 60287-1-1 §2.3
   * are computed for the circuit's bonding and formation; without them they are left out (flagged).
   */
  screen?: CableScreen;
}

export interface CableScreen {
  material: 'copper' | 'aluminium' | 'lead';
  /** Metallic cross-section, mm² (or the maker's r20OhmPerM). */
  sectionMm2?: number;
  r20OhmPerM?: number;
  /** Bonded at both ends (circulating currents), at one point, or cross-bonded (eddy currents only). */
  bonding: 'solid' | 'single-point' | 'cross-bonded';
}

export interface BarCoating {
  name?: string;
  thicknessM: number;
  thermalResistivityKmPerW: number;
  emissivity?: number;
  continuousLimitC?: number;
  shortCircuitLimitC?: number;
}

export interface BarCandidate extends CandidateCommon {
  kind: 'bar';
  widthM: number;
  thicknessM: number;
  /** Bars in one pack per phase (default 1). */
  barsPerPhase?: number;
  /** Clear gap between bars of a pack, m (information for the flag; default the bar thickness). */
  barGapM?: number;
  coating?: BarCoating;
  /** Emissivity of the bare surface (default 0.1 for bright copper/aluminium — low, so conservative; flagged). */
  emissivity?: number;
  /** R_ac/R_dc from the bar maker; without it the plane-conductor lower bound is used. */
  acResistanceRatio?: number;
  /** Limit of joints and terminals in contact with the bar, °C. */
  terminalLimitC?: number;
  /** Highest short-circuit temperature of the bar and its supports, °C. */
  shortCircuitLimitC?: number;
  /** 0.2 % proof strength R_p0.2 of the bar material, Pa (for the IEC 60865-1 stress check; a default per material otherwise, flagged). */
  yieldStrengthPa?: number;
}

export type Candidate = CableCandidate | BarCandidate;

// ───────────────────────────── Conditions ─────────────────────────────

/** Another circuit lying beside the one being sized (same route, trench or tray row). */
export interface OtherCircuit {
  /** Its current per phase, A. */
  currentA: number;
  /**
   * Its cable when it is not the candidate's own: the overall diameter and the heat ONE of its
   * cables gives off at that current, W/m (from that circuit's own rating; flagged as entered).
   * Absent: the same cable as the candidate, solved at its own current.
   */
  cable?: { externalDiameterM: number; lossWPerM: number };
}

export interface CableArrangement {
  /** How the circuit's single-core cables lie (default trefoil); 'flat' is a horizontal row. */
  formation?: 'trefoil' | 'flat' | 'flat-vertical';
  /** Axis-to-axis spacing between the circuit's cables, m (default touching: the cable diameter). */
  spacingM?: number;
  /**
   * Centre-to-centre distance between the circuit's parallel runs and the other circuits, which
   * lie in one row beside it, m (default: touching).
   */
  circuitSpacingM?: number;
  /** Direction of that row (default horizontal). */
  circuitRow?: 'horizontal' | 'vertical';
  otherCircuits?: OtherCircuit[];
  /** Flat formation: phases transposed along the route (screen losses). */
  transposed?: boolean;
}

/** Ducts and backfill of a buried circuit (IEC 60287-2-1 §4.2.7). */
export interface BuriedSurroundings {
  /** Every cable in its own duct. */
  duct?: { material: 'pvc' | 'pe' | 'earthenware' | 'fibre-in-air' | 'fibre-in-concrete' | 'metallic'; innerDiameterM: number; outerDiameterM: number };
  /** A rectangular backfill or concrete bank of its own resistivity, centred on the cables. */
  backfill?: { widthM: number; heightM: number; centreDepthM: number; resistivityKmPerW: number };
}

/** The three-phase system a bus bar is part of (physics.md §10; IEC 60865-1 for the forces). */
export interface BusbarSystemConditions {
  /** Centre of one phase's pack to the centre of the next, m. */
  phaseSpacingM: number;
  /** Span between supports, m. */
  supportSpacingM?: number;
  /** Distance between the spacers tying a pack's bars, m (default the support spacing). */
  spacerSpacingM?: number;
  /** How the bars are held (IEC 60865-1 Table 3): needed, with the support span and a fault, for the force check. */
  supports?: 'single-span-both-simply-supported' | 'single-span-fixed-and-simply-supported' | 'single-span-both-fixed' | 'continuous-two-spans' | 'continuous-three-or-more-spans';
  /** Rated bending strength of one support, N. */
  supportStrengthN?: number;
  /** R/X of the short-circuit impedance (peak factor κ, IEC 60909-0), or κ itself. */
  rOverX?: number;
  kappa?: number;
  /** Section modulus of a stiffened pack about its bending axis, m³ (IEC 60865-1; flagged); default the bars alone. */
  mainSectionModulusM3?: number;
  /**
   * 'per-bar' (default, cautious): each bar of a pack at its own temperature, heat between them by
   * radiation only. 'per-pack': the bars bonded by conducting spacers to one temperature (the
   * optimistic bound; flagged).
   */
  packNodes?: 'per-bar' | 'per-pack';
}

export type Installation =
  | ({ kind: 'cable-in-air' } & CableArrangement)
  | { kind: 'bar-on-edge'; system?: BusbarSystemConditions }
  | { kind: 'bar-flat'; system?: BusbarSystemConditions }
  | ({
      kind: 'buried';
      /** Depth of the cable axis, m. */
      depthM: number;
      /** Soil thermal resistivity, K·m/W (default 2.5, flagged). */
      soilResistivityKmPerW?: number;
      /** Undisturbed ground temperature at depth, °C (default 20, flagged; replaces ambientC). */
      groundC?: number;
    } & CableArrangement &
      BuriedSurroundings)
  | ({
      kind: 'enclosure';
      /** User-entered derating for the enclosure, 0 < f ≤ 1 (flagged). */
      deratingFactor: number;
      /** How the conductor lies inside. */
      inside: 'cable-in-air' | 'bar-on-edge' | 'bar-flat';
      system?: BusbarSystemConditions;
    } & CableArrangement);

export interface EconomicsInputs {
  lossLoadFactor: number;
  hoursPerYear?: number;
  energyPricePerKWh: MoneyInput;
  demandChargePerKWYear?: MoneyInput;
  loadGrowthPercent?: number;
  energyPriceGrowthPercent?: number;
  discountRatePercent: number;
  years: number;
}

export interface Conditions {
  /** Design current I_B per phase, A (r.m.s.). */
  designCurrentA: number;
  /** 0 for DC. */
  frequencyHz: number;
  phases: 1 | 3;
  /** U₀, line to neutral, V. */
  nominalVoltageV: number;
  /** Route length, m. */
  lengthM: number;
  /** cos φ of the load. */
  powerFactor: number;
  /** λ for the voltage drop, Ω/m (default Annex G 0.08e-3; flagged). */
  reactanceOhmPerM?: number;
  /** Allowed voltage drop, % of U₀ (optional; exceeding it fails the candidate). */
  maxVoltageDropPercent?: number;
  /** Air temperature around the conductor, °C (default 30, flagged). */
  ambientC?: number;
  installation: Installation;
  /** Wind or fan speed across the conductor, m/s (cooling credited; flagged). */
  windSpeedMPerS?: number;
  /** Sun on the conductor. */
  solar?: { irradianceWPerM2: number; absorptivity?: number };
  /** Prospective fault at the conductor; without it the short circuit is not checked (flagged). */
  fault?: { currentA: number; durationS: number; initialFrom?: 'limit' | 'operating' };
  /** A limit of the user's own, °C (a joint, a neighbouring device...). Caps the material limits. */
  temperatureLimitC?: number;
  /** When true, `temperatureLimitC` REPLACES the material limits even if higher (flagged). */
  raiseMaterialLimit?: boolean;
  /**
   * Why a raised limit is safe (the maker's evidence, a test report): shown to the reviewer. A
   * limit raised above a material rating without it is a blocker (USER_LIMIT_NOT_JUSTIFIED).
   */
  userLimitJustification?: string;
  /**
   * User-entered derating 0 < f ≤ 1 for heating by OTHER circuits that no method here covers
   * (cables in air near other circuits, trays). It never stands for the circuit's own cables, whose
   * mutual heating is always computed (flagged).
   */
  groupingFactor?: number;
  /** A fixed combined (convection + radiation) surface coefficient, W/(m²·K), replacing the correlations (flagged). */
  surfaceCoefficientWPerM2K?: number;
  economics?: EconomicsInputs;
  /** The circuit's protective device and earth-fault loop (physics.md §11); without it those checks are not run (flagged). */
  protection?: ProtectionConditions;
  /** Third-harmonic content of the phase current, % (IEC 60364-5-52 Annex E: the neutral of four- and five-core cables). */
  thirdHarmonicPercent?: number;
}

/** Protection of the circuit (IEC 60364-4-41, -4-43, -5-54; lib/electrical/protection). */
export interface ProtectionConditions {
  device: ProtectiveDevice;
  /** Ratings to search for the smallest coordinated device (an adjustable breaker's settings); default the standard series. */
  deviceSeriesA?: number[];
  systemEarthing?: 'TN' | 'TT';
  /** A final circuit (Table 41.1 times) or a distribution circuit (5 s TN, 1 s TT); default distribution. */
  circuit?: 'final' | 'distribution';
  /** Impedance of the source up to the circuit's origin (transformer and upstream cables), Ω. */
  source?: { resistanceOhm: number; reactanceOhm?: number } | { impedanceOhm: number };
  /** TT: R_A + R_B of the earth electrodes, Ω. */
  earthElectrodesOhm?: number;
  /** The protective conductor of the circuit (length: the route's). */
  protectiveConductor?: {
    sectionMm2: number;
    material?: ConductorMaterial;
    insulation?: 'pvc-70' | 'pvc-90' | 'thermosetting-90';
    arrangement?: 'in-cable-or-bunched' | 'separate';
  };
}

// ───────────────────────────── Results ─────────────────────────────

export type LimitSource = 'insulation' | 'coating' | 'terminal' | 'user' | 'layer';

export interface GoverningLimit {
  temperatureC: number;
  source: LimitSource;
  /** Layer name when a covering's limit governs. */
  layer?: string;
}

export interface ProfileLayer {
  name: string;
  startM: number;
  endM: number;
  limitC?: number;
  generating: boolean;
}

/** The heat-balance profile of one conductor, for plotting. */
export interface HeatProfile {
  geometry: 'slab' | 'cylinder';
  /** Cell centres, m (radius for a cylinder, distance from the inner face for a slab). */
  positionsM: number[];
  temperaturesC: number[];
  layers: ProfileLayer[];
  hotSpot: { temperatureC: number; positionM: number };
}

export interface ClosedFormCheck {
  /** Closed-form ampacity of the circuit, A. */
  currentA: number;
  method: string;
  /** 100·(solver − closed form)/closed form. */
  differencePercent: number;
  /** External thermal resistance used, K·m/W, and where it came from. */
  externalResistanceKmPerW: number;
  internalResistanceKmPerW: number;
}

export interface AmpacityResult {
  /** Ampacity of the circuit per phase, A (all parallel conductors, after derating). */
  current: number;
  /** Hot spot at that current (≤ the governing limit; the current is the lower end of a ≤ 0.1 A bracket). */
  hotSpot: { temperature: number; position: number };
  /** Root-finder evaluations. */
  iterations: number;
  /** Heat-balance solves, including any AC-factor refinement. */
  solves: number;
  /** Current in one conductor at the ampacity, A. */
  conductorCurrentA: number;
  governingLimit: GoverningLimit;
  acFactor: number;
  /** Bracket of the circuit current, A. */
  bracketA: [number, number];
  closedForm: ClosedFormCheck | null;
  profile: HeatProfile;
  /** Set when no current at all can flow (the limit is at or below the temperature without current). */
  zeroBecause?: string;
  /** Assumption flags raised by the inputs and the ampacity search. */
  flags: AssumptionFlag[];
}

export interface ShortCircuitCheck {
  checked: boolean;
  /** Why not, when not checked. */
  reason?: string;
  currentA?: number;
  durationS?: number;
  initialC?: number;
  finalC?: number | null;
  limitC?: number;
  kFactor?: number;
  /** Minimum section per phase for the fault, mm². */
  minimumSectionMm2?: number;
  sectionPerPhaseMm2?: number;
  withstands?: boolean;
}

/**
 * Third harmonics on a four- or five-core cable, two ways: the heat balance carries the neutral's
 * loss (the evaluation's ampacity is the rating with it), and the standard's own check, Annex E —
 * the sizing current over the rating with three loaded cores — stands beside it. Both must hold.
 */
export interface HarmonicCheckResult extends HarmonicSizingResult {
  /** The neutral's heat over one phase core's, (3·h₃)², carried in the heat balance. */
  neutralHeatShare: number;
  /** The cable's rating with three loaded cores and no harmonics, A: what Annex E's factors apply to. */
  ratingThreeLoadedCoresA: number;
  /** Annex E: sizing current ≤ the three-loaded-core rating. */
  annexEPasses: boolean;
}

export interface CandidateEvaluationOk {
  ok: true;
  index: number;
  id: string;
  label: string;
  kind: 'cable' | 'bar';
  /** True when no blocker flag was raised. */
  passes: boolean;
  designCurrentA: number;
  conductorCurrentA: number;
  ambientC: number;
  /** Hot spot at the design current, °C; null when there is no steady state (RUNAWAY). */
  hotSpotC: number | null;
  /** Temperature of the governing constraint (the hot spot, or a covering's inner face), °C. */
  governingTemperatureC: number | null;
  limit: GoverningLimit;
  /** Limit minus the governing temperature, K (negative when over the limit). */
  marginK: number | null;
  /** Margin as a share of the allowed rise (limit − ambient), %. */
  marginPercent: number | null;
  ampacityA: number;
  /**
   * Design current / ampacity. When no current at all is allowed (ampacity 0) but some is asked
   * for, Number.MAX_VALUE: a finite number that still reads as "over" to any `> 1` check
   * (OVER_LIMIT is raised too).
   */
  utilisation: number;
  acFactor: number;
  /** Mean conductor temperature at the design current, °C (null on runaway). */
  conductorC: number | null;
  /** AC resistance of one conductor (core or bar) at its solved temperature, Ω/m. */
  resistanceOhmPerM: number | null;
  /** Joule loss of one conductor, W/m. */
  lossPerConductorWPerM: number | null;
  /** Joule loss of the whole circuit per metre of route, W/m. */
  lossWPerM: number | null;
  /** Conductors counted for losses and mass. */
  loadedConductors: number;
  conductorsInstalled: number;
  sectionPerPhaseMm2: number;
  /** Runs per phase: parallel cables, or bars per phase × parallel packs (fewer are preferred among passing sizes). */
  runsPerPhase: number;
  voltageDrop: { volts: number; percent: number; limitPercent?: number };
  shortCircuit: ShortCircuitCheck;
  massKg: number;
  materialCost: string | null;
  lossCostPresentValue: string | null;
  lifeCycleCost: string | null;
  ampacity: AmpacityResult;
  /** Heat-balance profile at the design current (null on runaway); of the governing cable of a group. */
  profile: HeatProfile | null;
  /** The cross-section that was rated (cables only): where every cable lies and how hot it runs. */
  group?: GroupResult;
  /** A bus-bar pack at the design current: every bar's share of its phase current, loss and temperature. */
  pack?: PackResult;
  /** The short-circuit forces of IEC 60865-1 on a bus-bar system, when the supports are described and a fault entered. */
  forces?: ForcesResult;
  /** Overload coordination, automatic disconnection and the protective conductor (when a device is given). */
  protection?: ProtectionResult;
  /** The neutral under third harmonics (IEC 60364-5-52 Annex E), when a content is given for a four- or five-core cable. */
  harmonics?: HarmonicCheckResult;
  flags: AssumptionFlag[];
  solves: number;
  isSmallestPassing?: boolean;
  isLowestLifeCycleCostPassing?: boolean;
}

export interface GroupResultCable {
  /** Circuit index: the candidate's parallel runs first, then the other circuits. */
  circuit: number;
  /** Index of the cable inside its circuit. */
  index: number;
  position: 'alone' | 'trefoil' | 'flat-outer' | 'flat-centre' | 'pair';
  /** 'rated': a cable of the circuit being sized; 'same-cable': another circuit of the candidate's cable; 'fixed': another circuit given by its heat. */
  role: 'rated' | 'same-cable' | 'fixed';
  /** Centre, m: x across, y upward (the ground surface at y = 0 for buried cables). */
  xM: number;
  yM: number;
  externalDiameterM: number;
  /** The duct's outer diameter when in a duct, else D_e. */
  envelopeDiameterM: number;
  /** At the design current; null where not solved (a neighbour given by its heat) or on runaway. */
  conductorC: number | null;
  surfaceC: number | null;
  heatWPerM: number | null;
  /** Rise of its surroundings above the ground from the other cables, K (buried). */
  riseFromOthersK: number | null;
}

export interface GroupResult {
  placement: 'air' | 'buried' | 'ducts' | 'backfill';
  /** How the group was rated, in words (the surface law in air, superposition in the ground). */
  method: string;
  cables: GroupResultCable[];
  /** Index into `cables` of the cable that governs (the hottest against its limit), null on runaway. */
  governingCable: number | null;
  /** Axis spacing of the first run's cables, and centre spacing between circuits, m. */
  circuitAxisSpacingM: number | null;
  circuitSpacingM: number | null;
  depthM: number | null;
  bank?: { centreXM: number; centreDepthM: number; widthM: number; heightM: number };
}

export interface CandidateEvaluationError {
  ok: false;
  index: number;
  id: string;
  label: string;
  error: { code: string; message: string; field?: string };
}

export type CandidateEvaluation = CandidateEvaluationOk | CandidateEvaluationError;

export interface Comparison {
  evaluations: CandidateEvaluation[];
  /** The preferred passing candidate: fewest runs per phase, then least section per phase, then least mass (preferredSizeOrder). */
  smallestPassingIndex: number | null;
  lowestLifeCycleCostPassingIndex: number | null;
}

export interface PackResult {
  bars: Array<{ phase: string; positionInPack: number; shareOfPhase: number; currentA: number; lossWPerM: number; temperatureC: number; acFactor: number | null }>;
  hottest: { phase: string; positionInPack: number; temperatureC: number };
  /** The worst phase's R_ac/R_dc, the unequal sharing included. */
  acFactor: number;
  method: string;
}

export interface ForcesResult {
  method: string;
  kappa: number;
  peakCurrentA: number;
  mainForceN: number;
  totalStressPa: number;
  yieldStrengthPa: number;
  /** σ_tot/(q·R_p0.2): ≤ 1 passes. */
  stressRatio: number;
  subConductorStressRatio: number | null;
  supportForceAN: number;
  supportForceBN: number;
  /** Largest force over the rated support strength (null when none given). */
  supportForceRatio: number | null;
  passes: boolean;
  largestSupportSpacingM: number;
  largestSupportSpacingLimitedBy: string;
}

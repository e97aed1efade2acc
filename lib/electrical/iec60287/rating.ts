/**
 * The independent closed form: IEC 60287-1-1 eq. (1) (§1.4.1.1, 100 % load factor, from memory)
 *
 *   I = √{ [Δθ − W_d·(½T₁ + n(T₂ + T₃ + T₄)) − ΔT_ext − σD_eH·T₄] /
 *          [R·T₁ + n·R·(1 + λ₁)·T₂ + n·R·(1 + λ₁ + λ₂)·(T₃ + T₄)] }
 *
 * with its own T₁ (insulation), T₃ (jacket), R = R′(1 + y_s + y_p) at the conductor limit (from
 * lib/electrical/resistance.ts), λ₁ from the screens' bonding (./screens.ts), and T₄ from the
 * free-air iteration (./freeAir.ts) or the buried formulas and superposition (./buried.ts).
 * ΔT_ext is the rise caused by other cables whose losses do not scale with this current (the
 * "unequally loaded" form of IEC 60287-2-1 §4.2.3); the σD_eH·T₄ term is the sun on a cable in air.
 * No surface coefficient is ever taken from the finite-volume solver.
 */
import { acResistance, type AcResistanceResult } from '../resistance';
import { materialConstants, type ConductorMaterial } from '../materials';
import { ElectricalInputError, SizingError, requireInteger, requireNonNegative, requirePositive, requireRange, requireTemperature } from '../errors';
import {
  insulationThermalResistivity,
  SCREEN_MATERIAL_CONSTANTS,
  type FreeAirConstants,
  type InsulationMaterial,
  type ScreenMaterial,
} from './constants';
import { freeAirExternalResistance, freeAirRowFor, type FreeAirExternalResult } from './freeAir';
import {
  buriedCableExternalResistance,
  ductAirSpaceResistance,
  ductBankGeometricFactor,
  ductWallResistance,
  flatTouchingExternalResistance,
  imageLogRatio,
  trefoilTouchingExternalResistance,
  twoFlatTouchingExternalResistance,
} from './buried';
import { circulatingCurrentLossFactor, dielectricLoss, eddyCurrentLossFactor, screenResistance, type DielectricLossResult } from './screens';
import { cableCountOf, ductOf, placeCables, type Arrangement, type CablePosition, type ArrangementCircuit } from './arrangement';
import { parseArrangement } from './arrangementSchema';

// ───────────────────────── Equation (1) itself ─────────────────────────

export interface RatingEquationResult {
  currentA: number;
  /** The numerator, K: the rise left for the conductor losses. */
  numeratorK: number;
  /** The denominator, K·m/W·Ω/m. */
  denominator: number;
  /** True when the dielectric losses, the sun or other cables already use up the whole rise. */
  noMargin: boolean;
}

/** IEC 60287-1-1 eq. (1), see the file comment. All thermal resistances K·m/W, R in Ω/m. */
export function ratingEquation(args: {
  conductorRiseK: number;
  acResistanceOhmPerM: number;
  T1: number;
  T2?: number;
  T3: number;
  T4: number;
  cores?: number;
  lambda1?: number;
  lambda2?: number;
  dielectricLossWPerM?: number;
  /** Rise from other cables' fixed heat, K. */
  externalRiseK?: number;
  /** σ·D_e·H, W/m, for a cable in the sun. */
  absorbedSolarWPerM?: number;
}): RatingEquationResult {
  const dTheta = requirePositive(args?.conductorRiseK, 'conductorRiseK');
  const R = requirePositive(args.acResistanceOhmPerM, 'acResistanceOhmPerM');
  const T1 = requireNonNegative(args.T1, 'T1');
  const T2 = requireNonNegative(args.T2 ?? 0, 'T2');
  const T3 = requireNonNegative(args.T3, 'T3');
  const T4 = requireNonNegative(args.T4, 'T4');
  const n = requireInteger(args.cores ?? 1, 'cores', 1, 4);
  const l1 = requireNonNegative(args.lambda1 ?? 0, 'lambda1');
  const l2 = requireNonNegative(args.lambda2 ?? 0, 'lambda2');
  const wd = requireNonNegative(args.dielectricLossWPerM ?? 0, 'dielectricLossWPerM');
  const ext = requireNonNegative(args.externalRiseK ?? 0, 'externalRiseK');
  const sun = requireNonNegative(args.absorbedSolarWPerM ?? 0, 'absorbedSolarWPerM');
  const numeratorK = dTheta - wd * (0.5 * T1 + n * (T2 + T3 + T4)) - ext - sun * T4;
  const denominator = R * T1 + n * R * (1 + l1) * T2 + n * R * (1 + l1 + l2) * (T3 + T4);
  if (!(numeratorK > 0)) return { currentA: 0, numeratorK, denominator, noMargin: true };
  return { currentA: Math.sqrt(numeratorK / denominator), numeratorK, denominator, noMargin: false };
}

// ───────────────────────── The cable ─────────────────────────

export type ScreenBonding = 'solid' | 'single-point' | 'cross-bonded';

/** A single-core cable as IEC 60287 sees it. Diameters and thicknesses in m. */
export interface SingleCoreCable {
  conductor: {
    material: ConductorMaterial;
    /** DC resistance at 20 °C, Ω/m (catalogue: datasheet or the IEC 60228 maximum). */
    r20OhmPerM: number;
    diameterM: number;
    /** Skin and proximity constants k_s, k_p (IEC 60287-1-1 Table 2); default 1. */
    ks?: number;
    kp?: number;
  };
  insulation: {
    material: InsulationMaterial;
    /** t₁: conductor surface to screen, semiconducting layers included (as T₁ counts them). */
    thicknessM: number;
    /** Default: IEC 60287-2-1 Table 1 (from memory, constants.ts). */
    thermalResistivityKmPerW?: number;
  };
  screen?: {
    material: ScreenMaterial;
    /** Metallic cross-section, mm²; or give the maker's r20OhmPerM. */
    sectionMm2?: number;
    r20OhmPerM?: number;
    /** d, mean diameter of the screen, m. */
    meanDiameterM: number;
    /** t_s (sheath thickness; for wires, the wire diameter as a common-practice stand-in), m. */
    thicknessM: number;
    bonding: ScreenBonding;
  };
  jacket: { thicknessM: number; thermalResistivityKmPerW: number };
  externalDiameterM: number;
  /** T₂ (bedding between screen and armour), K·m/W; default 0 (no armour). */
  beddingThermalResistanceKmPerW?: number;
  /** λ₂ (armour), default 0. */
  armourLossFactor?: number;
}

export interface CableThermalResistances {
  /** T₁ = ρ_T/(2π)·ln(1 + 2t₁/d_c). */
  T1: number;
  T2: number;
  /** T₃ = ρ_T/(2π)·ln(1 + 2t₃/D′_a), D′_a = D_e − 2t₃. */
  T3: number;
  insulationResistivityKmPerW: number;
}

/** T₁, T₂, T₃ of a single-core cable, IEC 60287-2-1 §4.1 (ed. 1 §2.1; from memory). */
export function cableThermalResistances(cable: SingleCoreCable, voltageU0V: number): CableThermalResistances {
  validateCable(cable);
  const rhoI = cable.insulation.thermalResistivityKmPerW ?? insulationThermalResistivity(cable.insulation.material, voltageU0V);
  const T1 = (rhoI / (2 * Math.PI)) * Math.log(1 + (2 * cable.insulation.thicknessM) / cable.conductor.diameterM);
  const underJacket = cable.externalDiameterM - 2 * cable.jacket.thicknessM;
  const T3 = cable.jacket.thicknessM === 0 ? 0 : (cable.jacket.thermalResistivityKmPerW / (2 * Math.PI)) * Math.log(1 + (2 * cable.jacket.thicknessM) / underJacket);
  return { T1, T2: cable.beddingThermalResistanceKmPerW ?? 0, T3, insulationResistivityKmPerW: rhoI };
}

export function validateCable(cable: SingleCoreCable, field = 'cable'): void {
  if (!cable || typeof cable !== 'object') throw new ElectricalInputError(field, 'give the cable');
  materialConstants(cable.conductor?.material, `${field}.conductor.material`);
  requirePositive(cable.conductor.r20OhmPerM, `${field}.conductor.r20OhmPerM`);
  const dc = requirePositive(cable.conductor.diameterM, `${field}.conductor.diameterM`);
  const t1 = requirePositive(cable.insulation?.thicknessM, `${field}.insulation.thicknessM`);
  if (cable.insulation.thermalResistivityKmPerW !== undefined) requireRange(cable.insulation.thermalResistivityKmPerW, `${field}.insulation.thermalResistivityKmPerW`, 0.1, 20);
  // A cable may have no covering outside its insulation (t₃ = 0, T₃ = 0).
  const t3 = requireNonNegative(cable.jacket?.thicknessM, `${field}.jacket.thicknessM`);
  if (t3 > 0) requireRange(cable.jacket.thermalResistivityKmPerW, `${field}.jacket.thermalResistivityKmPerW`, 0.1, 20);
  const de = requirePositive(cable.externalDiameterM, `${field}.externalDiameterM`);
  if (de - 2 * t3 < dc + 2 * t1 - 1e-12) {
    throw new ElectricalInputError(`${field}.externalDiameterM`, 'is smaller than conductor, insulation and jacket together');
  }
  if (cable.screen) {
    if (!SCREEN_MATERIAL_CONSTANTS[cable.screen.material]) throw new ElectricalInputError(`${field}.screen.material`, `unknown screen material ${String(cable.screen.material)}`);
    if (cable.screen.r20OhmPerM === undefined) requirePositive(cable.screen.sectionMm2, `${field}.screen.sectionMm2`);
    const d = requirePositive(cable.screen.meanDiameterM, `${field}.screen.meanDiameterM`);
    requireNonNegative(cable.screen.thicknessM, `${field}.screen.thicknessM`);
    if (d < dc + 2 * t1 - 1e-12 || d > de) throw new ElectricalInputError(`${field}.screen.meanDiameterM`, 'must lie between the insulation and the outer surface');
    if (!['solid', 'single-point', 'cross-bonded'].includes(cable.screen.bonding)) {
      throw new ElectricalInputError(`${field}.screen.bonding`, "must be 'solid', 'single-point' or 'cross-bonded'");
    }
  }
  if (cable.beddingThermalResistanceKmPerW !== undefined) requireNonNegative(cable.beddingThermalResistanceKmPerW, `${field}.beddingThermalResistanceKmPerW`);
  if (cable.armourLossFactor !== undefined) requireNonNegative(cable.armourLossFactor, `${field}.armourLossFactor`);
}

// ───────────────────────── Screen losses by position ─────────────────────────

/** Electrical geometry of a circuit, as the screen-loss and proximity formulas need it. */
export interface CircuitGeometry {
  cableCount: number;
  /** Axis spacing s, m (null for a single cable). */
  axisSpacingM: number | null;
  formation: ArrangementCircuit['formation'];
  transposed: boolean;
}

export interface ScreenLossResult {
  lambda1: number;
  circulating: number;
  eddy: number;
  screenResistanceOhmPerM: number | null;
  basis: string;
}

/**
 * λ₁ of the cable at `position` of a circuit, IEC 60287-1-1 §2.3 (./screens.ts). Where the phase
 * order of an untransposed flat circuit is not known, both outer cables take the larger of the
 * two outer-cable values (conservative); a transposed cross-bonded flat circuit takes the larger
 * of the outer and centre eddy values for every cable (conservative).
 */
export function screenLossFactorAt(args: {
  cable: SingleCoreCable;
  position: CablePosition;
  circuit: CircuitGeometry;
  conductorAcResistanceOhmPerM: number;
  screenTemperatureC: number;
  frequencyHz: number;
}): ScreenLossResult {
  const screen = args.cable.screen;
  if (!screen) return { lambda1: 0, circulating: 0, eddy: 0, screenResistanceOhmPerM: null, basis: 'no metallic screen' };
  if (args.frequencyHz === 0) return { lambda1: 0, circulating: 0, eddy: 0, screenResistanceOhmPerM: null, basis: 'direct current: no currents induced in the screen' };
  const Rs = screenResistance({ material: screen.material, sectionMm2: screen.sectionMm2, r20OhmPerM: screen.r20OhmPerM, temperatureC: args.screenTemperatureC });
  const s = args.circuit.axisSpacingM;
  if (args.position === 'alone' || s === null) {
    throw new ElectricalInputError('cable.screen', 'the screen losses of a single-core cable laid alone depend on where its return conductor runs; lay the circuit out as a pair, trefoil or flat row');
  }
  const R = args.conductorAcResistanceOhmPerM;
  const common = { conductorResistanceOhmPerM: R, screenResistanceOhmPerM: Rs, frequencyHz: args.frequencyHz, axisSpacingM: s, meanDiameterM: screen.meanDiameterM };
  if (screen.bonding === 'solid') {
    if (args.position === 'trefoil' || args.position === 'pair') {
      const r = circulatingCurrentLossFactor({ ...common, formation: args.position });
      return { lambda1: r.all!, circulating: r.all!, eddy: 0, screenResistanceOhmPerM: Rs, basis: `bonded both ends, ${args.position}: λ₁′ = (R_s/R)/(1 + (R_s/X)²)` };
    }
    if (args.circuit.transposed) {
      const r = circulatingCurrentLossFactor({ ...common, formation: 'flat-transposed' });
      return { lambda1: r.all!, circulating: r.all!, eddy: 0, screenResistanceOhmPerM: Rs, basis: 'bonded both ends, flat, transposed: X₁ = 2ω·10⁻⁷·ln(2∛2·s/d)' };
    }
    const r = circulatingCurrentLossFactor({ ...common, formation: 'flat' });
    if (args.position === 'flat-centre') {
      return { lambda1: r.centre!, circulating: r.centre!, eddy: 0, screenResistanceOhmPerM: Rs, basis: 'bonded both ends, flat, not transposed: centre cable λ₁₂′' };
    }
    const outer = Math.max(r.outerLagging!, r.outerLeading!);
    return { lambda1: outer, circulating: outer, eddy: 0, screenResistanceOhmPerM: Rs, basis: 'bonded both ends, flat, not transposed: outer cable, the larger of λ₁₁′ and λ₁₃′ (phase order not known)' };
  }
  // Single-point or cross-bonded: no circulating current, eddy currents only.
  if (args.position === 'pair') {
    throw new ElectricalInputError('cable.screen.bonding', 'eddy-current losses of a two-cable circuit are not covered here (IEC 60287-1-1 gives trefoil and flat three-phase formulas)');
  }
  const rhoS = SCREEN_MATERIAL_CONSTANTS[screen.material];
  const rhoAtT = rhoS.rho20OhmM * (1 + rhoS.alpha20PerK * (args.screenTemperatureC - 20));
  const eddy = eddyCurrentLossFactor({
    ...common,
    formation: args.position === 'trefoil' ? 'trefoil' : 'flat',
    screenResistivityOhmM: rhoAtT,
    screenOuterDiameterM: screen.meanDiameterM + screen.thicknessM,
    screenThicknessM: screen.thicknessM,
  });
  const bondingWord = screen.bonding === 'single-point' ? 'bonded at one point' : 'cross-bonded (sections assumed balanced, λ₁′ = 0)';
  if (args.position === 'trefoil') {
    return { lambda1: eddy.trefoil!.lambda1, circulating: 0, eddy: eddy.trefoil!.lambda1, screenResistanceOhmPerM: Rs, basis: `${bondingWord}, trefoil: eddy currents λ₁″` };
  }
  const value =
    args.circuit.transposed && screen.bonding === 'cross-bonded'
      ? Math.max(eddy.centre!.lambda1, eddy.outer!.lambda1)
      : args.position === 'flat-centre'
        ? eddy.centre!.lambda1
        : eddy.outer!.lambda1;
  return { lambda1: value, circulating: 0, eddy: value, screenResistanceOhmPerM: Rs, basis: `${bondingWord}, flat ${args.position === 'flat-centre' ? 'centre' : 'outer'}: eddy currents λ₁″` };
}

// ───────────────────────── Per-circuit electrical data ─────────────────────────

export interface CircuitElectrical {
  ac: AcResistanceResult;
  thermal: CableThermalResistances;
  dielectric: DielectricLossResult;
  conductorMaxC: number;
}

function circuitElectrical(args: {
  cable: SingleCoreCable;
  circuit: CircuitGeometry;
  conductorMaxC: number;
  frequencyHz: number;
  voltageU0V: number;
}): CircuitElectrical {
  const { cable, circuit } = args;
  const mat = materialConstants(cable.conductor.material);
  const proximity =
    circuit.cableCount >= 2 && circuit.axisSpacingM !== null
      ? { conductorDiameter: cable.conductor.diameterM, spacing: circuit.axisSpacingM, cables: (circuit.cableCount === 2 ? 2 : 3) as 2 | 3 }
      : undefined;
  const ac = acResistance({
    r20: cable.conductor.r20OhmPerM,
    alpha20: mat.alpha20PerK,
    temperature: args.conductorMaxC,
    frequency: args.frequencyHz,
    ks: cable.conductor.ks,
    kp: cable.conductor.kp,
    proximity,
  });
  const thermal = cableThermalResistances(cable, args.voltageU0V);
  const dielectric = dielectricLoss({
    insulation: cable.insulation.material,
    voltageU0V: args.voltageU0V,
    frequencyHz: args.frequencyHz,
    conductorDiameterM: cable.conductor.diameterM,
    insulationDiameterM: cable.conductor.diameterM + 2 * cable.insulation.thicknessM,
  });
  return { ac, thermal, dielectric, conductorMaxC: args.conductorMaxC };
}

function acNotes(e: CircuitElectrical, label: string): string[] {
  const notes: string[] = [];
  if (e.ac.skinRange !== 'xs<=2.8') notes.push(`${label}: skin effect x_s = ${e.ac.xs.toFixed(2)} above 2.8, from the large-conductor expressions (from memory)`);
  if (!e.ac.proximityInRange) notes.push(`${label}: proximity x_p above 2.8, outside the stated range of the expression`);
  return notes;
}

const positionsOf = (circuit: CircuitGeometry): CablePosition[] => {
  if (circuit.cableCount === 1) return ['alone'];
  if (circuit.formation === 'trefoil') return ['trefoil'];
  if (circuit.cableCount === 2) return ['pair'];
  return ['flat-outer', 'flat-centre'];
};

const CONVERGENCE = 1e-10;
const MAX_OUTER = 200;

// ───────────────────────── Free air ─────────────────────────

export interface AirPositionRating {
  position: CablePosition;
  currentA: number;
  lambda1: number;
  screenBasis: string;
  screenTemperatureC: number | null;
  freeAir: FreeAirExternalResult;
  equation: RatingEquationResult;
}

export interface AirRatingResult {
  currentA: number;
  governing: CablePosition;
  positions: AirPositionRating[];
  electrical: CircuitElectrical;
  constants: Pick<FreeAirConstants, 'Z' | 'E' | 'g'>;
  assumptions: string[];
}

/**
 * Rating of one circuit in free air by eq. (1) with T₄* from the iteration of IEC 60287-2-1
 * §4.2.1 and the Z, E, g of its arrangement (`constants`). Each position in the circuit (outer,
 * centre…) is rated with its own λ₁; the lowest current governs. λ₁ depends on the screen
 * temperature, which depends on the current: iterated until the current settles.
 */
export function rateInFreeAir(args: {
  cable: SingleCoreCable;
  circuit: CircuitGeometry;
  constants: Pick<FreeAirConstants, 'Z' | 'E' | 'g'>;
  ambientC: number;
  conductorMaxC: number;
  frequencyHz: number;
  voltageU0V: number;
  sun?: { absorptionCoefficient: number; irradianceWPerM2: number };
}): AirRatingResult {
  validateCable(args?.cable);
  const ambient = requireTemperature(args.ambientC, 'ambientC');
  const thetaMax = requireTemperature(args.conductorMaxC, 'conductorMaxC');
  if (!(thetaMax > ambient)) throw new ElectricalInputError('conductorMaxC', 'must exceed the ambient');
  const e = circuitElectrical(args);
  const { T1, T2, T3 } = e.thermal;
  const R = e.ac.rac;
  const wd = e.dielectric.lossWPerM;
  const l2 = args.cable.armourLossFactor ?? 0;
  const de = args.cable.externalDiameterM;
  const positions = positionsOf(args.circuit).map((position): AirPositionRating => {
    let current = 0;
    let screenC = thetaMax;
    for (let k = 0; k < MAX_OUTER; k++) {
      const screen = screenLossFactorAt({ cable: args.cable, position, circuit: args.circuit, conductorAcResistanceOhmPerM: R, screenTemperatureC: screenC, frequencyHz: args.frequencyHz });
      const freeAir = freeAirExternalResistance({
        externalDiameterM: de,
        constants: args.constants,
        conductorRiseK: thetaMax - ambient,
        T1,
        T2,
        T3,
        lambda1: screen.lambda1,
        lambda2: l2,
        dielectricLossWPerM: wd,
        sun: args.sun,
      });
      const equation = ratingEquation({
        conductorRiseK: thetaMax - ambient,
        acResistanceOhmPerM: R,
        T1,
        T2,
        T3,
        T4: freeAir.T4,
        lambda1: screen.lambda1,
        lambda2: l2,
        dielectricLossWPerM: wd,
        absorbedSolarWPerM: args.sun ? args.sun.absorptionCoefficient * de * args.sun.irradianceWPerM2 : 0,
      });
      const next = equation.currentA;
      const settled = Math.abs(next - current) <= CONVERGENCE * Math.max(1, next);
      current = next;
      if (!args.cable.screen || settled) {
        return { position, currentA: current, lambda1: screen.lambda1, screenBasis: screen.basis, screenTemperatureC: args.cable.screen ? screenC : null, freeAir, equation };
      }
      screenC = thetaMax - (current * current * R + 0.5 * wd) * T1;
    }
    throw new SizingError('NOT_CONVERGED', 'the screen temperature and the current did not settle');
  });
  const governing = positions.reduce((a, b) => (b.currentA < a.currentA ? b : a));
  return {
    currentA: governing.currentA,
    governing: governing.position,
    positions,
    electrical: e,
    constants: args.constants,
    assumptions: acNotes(e, 'conductor'),
  };
}

// ───────────────────────── In the ground ─────────────────────────

export interface GroupCircuitData {
  cable: SingleCoreCable;
  voltageU0V: number;
  conductorMaxC: number;
  /**
   * A circuit with a given current whose cable is known only by its diameter and the heat one of
   * its cables gives off, W/m (entered from that circuit's own rating): used instead of the heat
   * at its conductor limit.
   */
  fixedHeatWPerM?: number;
}

export interface BuriedCableRating {
  circuit: number;
  index: number;
  position: CablePosition;
  /** The current at which THIS cable reaches its limit (with the others as stated). */
  currentA: number;
  lambda1: number;
  /** Heat given off at that current, W/m. */
  heatWPerM: number;
  /** Rise of its surface (duct outside: of the duct) from its own and its own circuit's heat, K. */
  ownCircuitRiseK: number;
  /** Rise from the other circuits, K. */
  otherCircuitsRiseK: number;
  /** Effective T₄ = (all external rise)/(own heat), K·m/W, including duct parts. */
  effectiveT4: number;
  /** T₄′ (cable to duct) when in a duct. */
  ductAirSpaceT4?: number;
  equation: RatingEquationResult;
}

export interface BuriedGroupRatingResult {
  currentA: number;
  governing: { circuit: number; index: number; position: CablePosition };
  cables: BuriedCableRating[];
  circuits: CircuitElectrical[];
  ownCircuitMethod: Array<'closed-form' | 'superposition' | 'fixed current'>;
  assumptions: string[];
}

/**
 * Rating of buried circuits by eq. (1), IEC 60287-2-1 §4.2.2–4.2.7 (from memory):
 * - every cable is a line source with its image (superposition, §4.2.3), in soil of ρ_soil, or in
 *   a backfill/duct bank of ρ_c with the correction N·(ρ_e − ρ_c)/(2π)·G_b of §4.2.7.4 applied to
 *   every cable pair (with unequal losses the N becomes the sum of the cables' heats);
 * - in ducts, each cable's own T₄ = T₄′ + T₄″ + T₄‴ (§4.2.7), the mutual terms at the duct centres;
 * - the circuits whose `currentA` is absent in the arrangement carry the unknown current (several
 *   such circuits are "equally loaded"); the others carry their own current, their losses taken at
 *   their conductor limit (an upper bound: they cannot run hotter than rated, so this is
 *   conservative for the circuit being rated);
 * - a touching trefoil or flat row directly buried takes its own-circuit part from the closed
 *   forms of §4.2.4 (`ownCircuitMethod` 'closed-form', the default; the standard's method for
 *   touching metallic-screened cables) or from the line-source superposition ('superposition',
 *   a few per cent more conservative);
 * - the ground surface is at `groundC`; every rated cable is rated at its own limit, the lowest
 *   current governs.
 */
export function rateBuriedArrangement(args: {
  arrangement: Arrangement;
  /** One entry per circuit of the arrangement, or one for all. */
  circuits: GroupCircuitData[] | GroupCircuitData;
  soilResistivityKmPerW: number;
  groundC: number;
  frequencyHz: number;
  ownCircuitMethod?: 'closed-form' | 'superposition';
}): BuriedGroupRatingResult {
  const arrangement = parseArrangement(args?.arrangement);
  const placement = arrangement.placement;
  if (placement.kind === 'air') throw new ElectricalInputError('arrangement.placement.kind', 'this rates cables in the ground; use rateArrangementInAir');
  const rhoSoil = requireRange(args.soilResistivityKmPerW, 'soilResistivityKmPerW', 0.1, 20);
  const ground = requireTemperature(args.groundC, 'groundC');
  // 0 Hz: direct current (no skin, proximity, screen or dielectric losses).
  const frequencyHz = requireRange(args.frequencyHz, 'frequencyHz', 0, 1000);
  const method = args.ownCircuitMethod ?? 'closed-form';
  const data = Array.isArray(args.circuits) ? args.circuits : arrangement.circuits.map(() => args.circuits as GroupCircuitData);
  if (data.length !== arrangement.circuits.length) throw new ElectricalInputError('circuits', `give one cable per circuit (${arrangement.circuits.length})`);
  const layout = placeCables(arrangement);
  const duct = ductOf(placement);
  const bank = placement.kind === 'backfill' ? placement.bank : undefined;
  const rhoEnv = bank ? bank.resistivityKmPerW : rhoSoil;
  const assumptions: string[] = ['Ground surface isothermal at the ground temperature (IEC 60287-2-1 image method)'];

  const geometry: CircuitGeometry[] = arrangement.circuits.map((c, i) => ({
    cableCount: cableCountOf(c),
    axisSpacingM: layout.circuitAxisSpacingM[i],
    formation: c.formation,
    transposed: c.transposed ?? false,
  }));
  const electrical = data.map((d, i) => {
    validateCable(d.cable, `circuits.${i}.cable`);
    const thetaMax = requireTemperature(d.conductorMaxC, `circuits.${i}.conductorMaxC`);
    if (!(thetaMax > ground)) throw new ElectricalInputError(`circuits.${i}.conductorMaxC`, 'must exceed the ground temperature');
    if (Math.abs(d.cable.externalDiameterM - arrangement.circuits[i].externalDiameterM) > 1e-9) {
      throw new ElectricalInputError(`circuits.${i}.cable.externalDiameterM`, 'differs from the diameter the arrangement was laid out with');
    }
    const e = circuitElectrical({ cable: d.cable, circuit: geometry[i], conductorMaxC: thetaMax, frequencyHz, voltageU0V: requireNonNegative(d.voltageU0V, `circuits.${i}.voltageU0V`) });
    assumptions.push(...acNotes(e, `circuit ${i + 1}`));
    return e;
  });
  const rated = arrangement.circuits.map((c) => c.currentA === undefined);
  if (!rated.some(Boolean)) throw new ElectricalInputError('arrangement.circuits', 'leave the current of the circuit to be rated empty');
  if (arrangement.circuits.some((c) => c.currentA !== undefined)) {
    assumptions.push('Circuits with a given current: losses taken at their conductor limit temperature (an upper bound)');
  }

  // Backfill / duct bank correction per unit heat, applied to every pair (§4.2.7.4).
  let bankPerWatt = 0;
  if (bank) {
    const { Gb } = ductBankGeometricFactor({ widthM: bank.widthM, heightM: bank.heightM, centreDepthM: bank.centreDepthM });
    // The bank's horizontal position does not enter G_b; it only sets the inside-the-bank check.
    bankPerWatt = ((rhoSoil - rhoEnv) / (2 * Math.PI)) * Gb;
  }

  // Which circuits take their own part from a closed form.
  const closedForm = arrangement.circuits.map((c, i) => {
    if (method !== 'closed-form' || duct || c.spacing !== 'touching') return null;
    const depth = -layout.circuitCentres[i].yM;
    const common = { soilResistivityKmPerW: rhoEnv, depthM: depth, externalDiameterM: c.externalDiameterM };
    if (c.formation === 'trefoil') return { T4: trefoilTouchingExternalResistance(common), name: 'trefoil touching, (1.5/π)ρ[ln(2u) − 0.630]' };
    if (c.formation === 'flat-horizontal' && cableCountOf(c) === 3) return { T4: flatTouchingExternalResistance(common), name: 'flat touching, 0.475ρ·ln(2u) − 0.346ρ' };
    if (c.formation === 'flat-horizontal' && cableCountOf(c) === 2) return { T4: twoFlatTouchingExternalResistance(common), name: 'two flat touching, (ρ/π)[ln(2u) − 0.451]' };
    return null;
  });
  const ownMethod = arrangement.circuits.map((_, i) => (!rated[i] ? 'fixed current' : closedForm[i] ? 'closed-form' : 'superposition') as BuriedGroupRatingResult['ownCircuitMethod'][number]);
  closedForm.forEach((cf, i) => {
    if (cf && rated[i]) assumptions.push(`Circuit ${i + 1}: own-circuit T₄ from IEC 60287-2-1 §4.2.4 ${cf.name} (cable surfaces treated as one isotherm)`);
  });

  // Mutual coefficients between cable centres (K per W/m), environment resistivity.
  const cables = layout.cables;
  const mutual = (j: number, k: number) => (rhoEnv / (2 * Math.PI)) * imageLogRatio(cables[j], cables[k], 'arrangement') + bankPerWatt;
  const selfOuter = (j: number) => {
    const envelope = cables[j].envelopeDiameterM;
    const outer = buriedCableExternalResistance({ soilResistivityKmPerW: rhoEnv, depthM: -cables[j].yM, externalDiameterM: envelope });
    const wall = duct ? ductWallResistance({ material: duct.material, innerDiameterM: duct.innerDiameterM, outerDiameterM: duct.outerDiameterM }) : 0;
    return outer + wall + bankPerWatt;
  };
  if (duct) {
    const outOfRange = arrangement.circuits.some((c) => !ductAirSpaceResistance({ material: duct.material, cableDiameterM: c.externalDiameterM, meanAirTemperatureC: 20 }).inStatedRange);
    if (outOfRange) assumptions.push('Duct air space T₄′: a cable diameter lies outside 25–100 mm, the stated range of the expression (from memory)');
  }

  // Per cable: heat per metre as a·I² + b (rated) or fixed.
  const screenState = cables.map((k) => electrical[k.circuit].conductorMaxC);
  const lambdaOf = (j: number, screenC: number) =>
    screenLossFactorAt({
      cable: data[cables[j].circuit].cable,
      position: cables[j].position,
      circuit: geometry[cables[j].circuit],
      conductorAcResistanceOhmPerM: electrical[cables[j].circuit].ac.rac,
      screenTemperatureC: screenC,
      frequencyHz,
    }).lambda1;
  const fixedHeat = (j: number, lambda1: number) => {
    const c = cables[j].circuit;
    if (data[c].fixedHeatWPerM !== undefined) return requireNonNegative(data[c].fixedHeatWPerM, `circuits.${c}.fixedHeatWPerM`);
    const I = arrangement.circuits[c].currentA!;
    const e = electrical[c];
    return I * I * e.ac.rac * (1 + lambda1 + (data[c].cable.armourLossFactor ?? 0)) + e.dielectric.lossWPerM;
  };

  const rateAt = (p: number): BuriedCableRating => {
    const cp = cables[p].circuit;
    const e = electrical[cp];
    const cableP = data[cp].cable;
    const { T1, T2, T3 } = e.thermal;
    const R = e.ac.rac;
    const wdP = e.dielectric.lossWPerM;
    const l2P = cableP.armourLossFactor ?? 0;
    const dTheta = e.conductorMaxC - ground;
    const screens = screenState.slice();
    let current = 0;
    let meanAirC = e.conductorMaxC - 10;
    for (let iter = 0; iter < MAX_OUTER; iter++) {
      const lambdas = cables.map((_, j) => lambdaOf(j, screens[j]));
      const aOf = (j: number) => electrical[cables[j].circuit].ac.rac * (1 + lambdas[j] + (data[cables[j].circuit].cable.armourLossFactor ?? 0));
      const bOf = (j: number) => electrical[cables[j].circuit].dielectric.lossWPerM;
      const ductAir = duct ? ductAirSpaceResistance({ material: duct.material, cableDiameterM: cableP.externalDiameterM, meanAirTemperatureC: meanAirC }).T4 : 0;
      // External rise at p = Σ coef·(a·I² + b) over rated cables + Σ coef·W over fixed ones.
      let coefA = 0; // multiplies I²
      let constB = 0; // K
      let ownA = 0;
      let ownB = 0;
      let otherA = 0;
      let otherB = 0;
      const cf = closedForm[cp];
      const ownCables = cables.map((k, j) => ({ k, j })).filter(({ k }) => k.circuit === cp);
      if (cf && rated[cp]) {
        // Closed form for the own circuit: every cable assumed to lose as much as its worst one.
        const worst = ownCables.reduce((best, { j }) => (aOf(j) > aOf(best) ? j : best), ownCables[0].j);
        ownA += cf.T4 * aOf(worst) + bankPerWatt * ownCables.reduce((s, { j }) => s + aOf(j), 0);
        ownB += cf.T4 * bOf(worst) + bankPerWatt * ownCables.reduce((s, { j }) => s + bOf(j), 0);
      }
      cables.forEach((k, j) => {
        const sameCircuit = k.circuit === cp;
        if (sameCircuit && cf && rated[cp]) return; // already in the closed form
        const coef = j === p ? selfOuter(p) + ductAir : mutual(p, j);
        if (rated[k.circuit]) {
          const a = coef * aOf(j);
          const b = coef * bOf(j);
          if (sameCircuit) {
            ownA += a;
            ownB += b;
          } else {
            otherA += a;
            otherB += b;
          }
        } else {
          otherB += coef * fixedHeat(j, lambdas[j]);
        }
      });
      coefA = ownA + otherA;
      constB = ownB + otherB;
      // Eq. (1) with the external part written out: Δθ − W_d(½T₁ + T₂ + T₃) − b-terms = I²·[R T₁ + R(1+λ₁)T₂ + R(1+λ₁+λ₂)T₃ + coefA].
      const l1P = lambdas[p];
      const numeratorK = dTheta - wdP * (0.5 * T1 + T2 + T3) - constB;
      const denominator = R * T1 + R * (1 + l1P) * T2 + R * (1 + l1P + l2P) * T3 + coefA;
      const equation: RatingEquationResult =
        numeratorK > 0
          ? { currentA: Math.sqrt(numeratorK / denominator), numeratorK, denominator, noMargin: false }
          : { currentA: 0, numeratorK, denominator, noMargin: true };
      const next = equation.currentA;
      const heat = next * next * aOf(p) + bOf(p);
      const settled = Math.abs(next - current) <= CONVERGENCE * Math.max(1, next);
      current = next;
      // New screen temperatures (each cable at its limit, its own current) and duct air temperature.
      cables.forEach((k, j) => {
        const ck = k.circuit;
        const ek = electrical[ck];
        const I = rated[ck] ? next : arrangement.circuits[ck].currentA!;
        screens[j] = ek.conductorMaxC - (I * I * ek.ac.rac + 0.5 * ek.dielectric.lossWPerM) * ek.thermal.T1;
      });
      const internalRise = (next * next * R + 0.5 * wdP) * T1 + (next * next * R * (1 + l1P) + wdP) * T2 + heat * T3;
      meanAirC = e.conductorMaxC - internalRise - 0.5 * heat * ductAir;
      if (settled && iter > 0) {
        const ownRise = next * next * ownA + ownB;
        const otherRise = next * next * otherA + otherB;
        return {
          circuit: cp,
          index: cables[p].index,
          position: cables[p].position,
          currentA: next,
          lambda1: l1P,
          heatWPerM: heat,
          ownCircuitRiseK: ownRise,
          otherCircuitsRiseK: otherRise,
          effectiveT4: heat > 0 ? (ownRise + otherRise) / heat : Number.NaN,
          ductAirSpaceT4: duct ? ductAir : undefined,
          equation,
        };
      }
    }
    throw new SizingError('NOT_CONVERGED', 'the losses of the buried group did not settle');
  };

  const ratings = cables.map((k, j) => (rated[k.circuit] ? rateAt(j) : null)).filter((r): r is BuriedCableRating => r !== null);
  const governing = ratings.reduce((a, b) => (b.currentA < a.currentA ? b : a));
  return {
    currentA: governing.currentA,
    governing: { circuit: governing.circuit, index: governing.index, position: governing.position },
    cables: ratings,
    circuits: electrical,
    ownCircuitMethod: ownMethod,
    assumptions,
  };
}

// ───────────────────────── In air, from an arrangement ─────────────────────────

export interface ArrangementAirRatingResult extends AirRatingResult {
  circuit: number;
  row: ReturnType<typeof freeAirRowFor>;
}

/**
 * Rating in free air of every circuit of the arrangement that carries the unknown current (its
 * `currentA` left empty), by the Table 2 row the arrangement falls under; the lowest governs.
 * Refuses (SizingError 'OUTSIDE_METHOD') an arrangement the table does not cover.
 */
export function rateArrangementInAir(args: {
  arrangement: Arrangement;
  circuits: GroupCircuitData[] | GroupCircuitData;
  ambientC: number;
  frequencyHz: number;
  sun?: { absorptionCoefficient: number; irradianceWPerM2: number };
}): ArrangementAirRatingResult {
  const arrangement = parseArrangement(args?.arrangement);
  const row = freeAirRowFor(arrangement);
  if (row.kind !== 'tabulated') throw new SizingError('OUTSIDE_METHOD', `Not covered by IEC 60287-2-1 free-air constants: ${row.reason}`);
  const data = Array.isArray(args.circuits) ? args.circuits : arrangement.circuits.map(() => args.circuits as GroupCircuitData);
  if (data.length !== arrangement.circuits.length) throw new ElectricalInputError('circuits', `give one cable per circuit (${arrangement.circuits.length})`);
  const layout = placeCables(arrangement);
  const results = arrangement.circuits
    .map((c, i) => ({ c, i }))
    .filter(({ c }) => c.currentA === undefined)
    .map(({ c, i }) => {
      if (Math.abs(data[i].cable.externalDiameterM - c.externalDiameterM) > 1e-9) {
        throw new ElectricalInputError(`circuits.${i}.cable.externalDiameterM`, 'differs from the diameter the arrangement was laid out with');
      }
      const r = rateInFreeAir({
        cable: data[i].cable,
        circuit: { cableCount: cableCountOf(c), axisSpacingM: layout.circuitAxisSpacingM[i], formation: c.formation, transposed: c.transposed ?? false },
        constants: row.constants,
        ambientC: args.ambientC,
        conductorMaxC: data[i].conductorMaxC,
        frequencyHz: args.frequencyHz,
        voltageU0V: data[i].voltageU0V,
        sun: args.sun,
      });
      return { ...r, circuit: i, row, assumptions: [...row.assumptions, ...r.assumptions] };
    });
  if (results.length === 0) throw new ElectricalInputError('arrangement.circuits', 'leave the current of the circuit to be rated empty');
  return results.reduce((a, b) => (b.currentA < a.currentA ? b : a));
}

/**
 * Losses in the metallic screens and sheaths of single-core cables, IEC 60287-1-1 §2.3, and
 * dielectric losses, §2.2 — formulas from memory (see each function). Units SI: resistances Ω/m,
 * diameters and spacings m; ω = 2πf.
 */
import { ElectricalInputError, requireNonNegative, requirePositive, requireRange, requireTemperature } from '../errors';
import { dielectricRow, SCREEN_MATERIAL_CONSTANTS, type DielectricRow, type InsulationMaterial, type ScreenMaterial } from './constants';

const omegaOf = (frequencyHz: number) => 2 * Math.PI * requireRange(frequencyHz, 'frequencyHz', 0, 1000, { minExclusive: true });

/**
 * Screen resistance per metre at its operating temperature, IEC 60287-1-1 §2.3 (from memory):
 * R_s = R_s0·[1 + α₂₀(θ_s − 20)], R_s0 = ρ₂₀/A (A the metallic cross-section) unless the maker's
 * R_s0 is given (wire screens: lay lengthens the wires a little).
 */
export function screenResistance(args: { material: ScreenMaterial; sectionMm2?: number; r20OhmPerM?: number; temperatureC: number }): number {
  const constants = SCREEN_MATERIAL_CONSTANTS[args?.material];
  if (!constants) throw new ElectricalInputError('material', `unknown screen material ${String(args?.material)}`);
  const theta = requireTemperature(args.temperatureC, 'temperatureC');
  const r20 =
    args.r20OhmPerM !== undefined
      ? requirePositive(args.r20OhmPerM, 'r20OhmPerM')
      : constants.rho20OhmM / (requirePositive(args.sectionMm2, 'sectionMm2') * 1e-6);
  return r20 * (1 + constants.alpha20PerK * (theta - 20));
}

/**
 * Reactance per metre of the screen, IEC 60287-1-1 §2.3.1 (from memory):
 * X = 2ω·10⁻⁷·ln(2s/d), s the axis spacing, d the screen's mean diameter.
 */
export function screenReactance(args: { frequencyHz: number; axisSpacingM: number; meanDiameterM: number }): number {
  const omega = omegaOf(args?.frequencyHz);
  const s = requirePositive(args.axisSpacingM, 'axisSpacingM');
  const d = requirePositive(args.meanDiameterM, 'meanDiameterM');
  if (!(2 * s > d)) throw new ElectricalInputError('axisSpacingM', 'spacing too small for the screen diameter');
  return 2 * omega * 1e-7 * Math.log((2 * s) / d);
}

export type SolidBondingFormation = 'trefoil' | 'pair' | 'flat-transposed' | 'flat';

export interface CirculatingLossResult {
  formation: SolidBondingFormation;
  /** λ₁′ for trefoil, a pair or a transposed flat circuit (the same for every cable). */
  all?: number;
  /** Flat, not transposed: outer cable carrying the lagging phase (λ₁₁′). */
  outerLagging?: number;
  /** Flat, not transposed: outer cable carrying the leading phase (λ₁₃′). */
  outerLeading?: number;
  /** Flat, not transposed: centre cable (λ₁₂′). */
  centre?: number;
  /** The reactances used, Ω/m. */
  X: number;
  X1?: number;
  Xm?: number;
  P?: number;
  Q?: number;
}

/**
 * λ₁′, circulating-current losses of screens bonded at both ends, IEC 60287-1-1 §2.3.1–2.3.3
 * (from memory), eddy currents λ₁″ being ignored for solid bonding (except large segmental
 * conductors, which this does not cover):
 *   trefoil or two cables: λ₁′ = (R_s/R)·1/[1 + (R_s/X)²], X = 2ω·10⁻⁷·ln(2s/d);
 *   flat, regularly transposed: the same with X₁ = 2ω·10⁻⁷·ln(2·∛2·s/d);
 *   flat, not transposed (centre cable at s from both outer ones), with
 *     X_m = 2ω·10⁻⁷·ln 2, P = X + X_m, Q = X − X_m/3:
 *     outer lagging  λ₁₁′ = (R_s/R)·[¾P²/(R_s² + P²) + ¼Q²/(R_s² + Q²) + 2R_s·P·Q·X_m/(√3·(R_s² + P²)(R_s² + Q²))],
 *     outer leading  λ₁₃′ = the same with − before the last term,
 *     centre         λ₁₂′ = (R_s/R)·Q²/(R_s² + Q²).
 * R is the conductor's AC resistance at its maximum operating temperature, R_s the screen's at its own.
 */
export function circulatingCurrentLossFactor(args: {
  formation: SolidBondingFormation;
  conductorResistanceOhmPerM: number;
  screenResistanceOhmPerM: number;
  frequencyHz: number;
  axisSpacingM: number;
  meanDiameterM: number;
}): CirculatingLossResult {
  const R = requirePositive(args?.conductorResistanceOhmPerM, 'conductorResistanceOhmPerM');
  const Rs = requirePositive(args.screenResistanceOhmPerM, 'screenResistanceOhmPerM');
  const omega = omegaOf(args.frequencyHz);
  const X = screenReactance({ frequencyHz: args.frequencyHz, axisSpacingM: args.axisSpacingM, meanDiameterM: args.meanDiameterM });
  const simple = (reactance: number) => (Rs / R) / (1 + (Rs / reactance) ** 2);
  switch (args.formation) {
    case 'trefoil':
    case 'pair':
      return { formation: args.formation, all: simple(X), X };
    case 'flat-transposed': {
      const X1 = 2 * omega * 1e-7 * Math.log((2 * Math.cbrt(2) * args.axisSpacingM) / args.meanDiameterM);
      return { formation: 'flat-transposed', all: simple(X1), X, X1 };
    }
    case 'flat': {
      const Xm = 2 * omega * 1e-7 * Math.log(2);
      const P = X + Xm;
      const Q = X - Xm / 3;
      const Rs2 = Rs * Rs;
      const base = (0.75 * P * P) / (Rs2 + P * P) + (0.25 * Q * Q) / (Rs2 + Q * Q);
      const cross = (2 * Rs * P * Q * Xm) / (Math.sqrt(3) * (Rs2 + P * P) * (Rs2 + Q * Q));
      return {
        formation: 'flat',
        outerLagging: (Rs / R) * (base + cross),
        outerLeading: (Rs / R) * (base - cross),
        centre: (Rs / R) * ((Q * Q) / (Rs2 + Q * Q)),
        X,
        Xm,
        P,
        Q,
      };
    }
    default:
      throw new ElectricalInputError('formation', `unknown formation ${String((args as { formation?: unknown }).formation)}`);
  }
}

export type EddyFormation = 'trefoil' | 'flat';

export interface EddyLossResult {
  /** m = ω/R_s·10⁻⁷. */
  m: number;
  /** β₁ = √(4πω/(10⁷ρ_s)), 1/m. */
  beta1: number;
  /** g_s = 1 + (t_s/D_s)^1.74·(β₁·D_s − 1.6). */
  gs: number;
  trefoil?: { lambda0: number; delta1: number; delta2: number; lambda1: number };
  centre?: { lambda0: number; delta1: number; delta2: number; lambda1: number };
  outer?: { lambda0: number; delta1: number; delta2: number; lambda1: number };
}

/**
 * λ₁″, eddy-current losses of screens bonded at one point or cross-bonded (λ₁′ = 0 for these,
 * cross-bonded sections assumed balanced), IEC 60287-1-1 §2.3.6 (from memory):
 *   λ₁″ = (R_s/R)·[g_s·λ₀·(1 + Δ₁ + Δ₂) + (β₁·t_s)⁴/12]      (the standard writes the last
 *         term (β₁t_s)⁴/(12·10¹²) with t_s in mm: the same thing),
 *   m = ω·10⁻⁷/R_s, β₁ = √(4πω/(10⁷·ρ_s)), g_s = 1 + (t_s/D_s)^1.74·(β₁·D_s − 1.6) (D_s in m
 *   here; the standard writes β₁·D_s·10⁻³ with D_s in mm),
 *   with r = d/(2s):
 *   trefoil:     λ₀ = 3·m²/(1 + m²)·r²,   Δ₁ = (1.14·m^2.45 + 0.33)·r^(0.92m + 1.66),  Δ₂ = 0;
 *   flat centre: λ₀ = 6·m²/(1 + m²)·r²,   Δ₁ = 0.86·m^3.08·r^(1.4m + 0.7),            Δ₂ = 0;
 *   flat outer:  λ₀ = 1.5·m²/(1 + m²)·r², Δ₁ = 4.7·m^0.7·r^(0.16m + 2),                Δ₂ = 21·m^3.3·r^(1.47m + 5.06).
 * The standard allows Δ₁, Δ₂ to be neglected for m ≤ 0.1; they are kept here (they are small).
 * ρ_s is the screen's resistivity at its operating temperature; D_s its outer diameter; t_s its
 * thickness (for a wire screen, the wire diameter is a common-practice stand-in; say so).
 */
export function eddyCurrentLossFactor(args: {
  formation: EddyFormation;
  conductorResistanceOhmPerM: number;
  screenResistanceOhmPerM: number;
  screenResistivityOhmM: number;
  frequencyHz: number;
  axisSpacingM: number;
  meanDiameterM: number;
  screenOuterDiameterM: number;
  screenThicknessM: number;
}): EddyLossResult {
  const R = requirePositive(args?.conductorResistanceOhmPerM, 'conductorResistanceOhmPerM');
  const Rs = requirePositive(args.screenResistanceOhmPerM, 'screenResistanceOhmPerM');
  const rhoS = requirePositive(args.screenResistivityOhmM, 'screenResistivityOhmM');
  const omega = omegaOf(args.frequencyHz);
  const s = requirePositive(args.axisSpacingM, 'axisSpacingM');
  const d = requirePositive(args.meanDiameterM, 'meanDiameterM');
  const Ds = requirePositive(args.screenOuterDiameterM, 'screenOuterDiameterM');
  const ts = requireNonNegative(args.screenThicknessM, 'screenThicknessM');
  if (!(2 * s > d)) throw new ElectricalInputError('axisSpacingM', 'spacing too small for the screen diameter');
  const m = (omega / Rs) * 1e-7;
  const beta1 = Math.sqrt((4 * Math.PI * omega) / (1e7 * rhoS));
  const gs = 1 + (ts / Ds) ** 1.74 * (beta1 * Ds - 1.6);
  const r = d / (2 * s);
  const thick = (beta1 * ts) ** 4 / 12;
  const lam = (lambda0: number, delta1: number, delta2: number) => ({
    lambda0,
    delta1,
    delta2,
    lambda1: (Rs / R) * (gs * lambda0 * (1 + delta1 + delta2) + thick),
  });
  const mm = (m * m) / (1 + m * m);
  if (args.formation === 'trefoil') {
    return { m, beta1, gs, trefoil: lam(3 * mm * r * r, (1.14 * m ** 2.45 + 0.33) * r ** (0.92 * m + 1.66), 0) };
  }
  if (args.formation === 'flat') {
    return {
      m,
      beta1,
      gs,
      centre: lam(6 * mm * r * r, 0.86 * m ** 3.08 * r ** (1.4 * m + 0.7), 0),
      outer: lam(1.5 * mm * r * r, 4.7 * m ** 0.7 * r ** (0.16 * m + 2), 21 * m ** 3.3 * r ** (1.47 * m + 5.06)),
    };
  }
  throw new ElectricalInputError('formation', `eddy losses are given for trefoil or flat three-phase circuits (got ${String(args.formation)})`);
}

// ───────────────────────── Dielectric losses, IEC 60287-1-1 §2.2 ─────────────────────────

export interface DielectricLossResult {
  /** Whether the standard counts W_d at this U₀ for this insulation (Table 3 threshold). */
  counts: boolean;
  reason: string;
  /** W_d to use, W/m: the computed value when it counts, else 0. */
  lossWPerM: number;
  /** ω·C·U₀²·tan δ whether or not it counts, W/m (for the report). */
  computedLossWPerM: number;
  capacitanceFPerM: number;
  row: DielectricRow;
}

/**
 * Dielectric loss per core, IEC 60287-1-1 §2.2 (from memory): W_d = ω·C·U₀²·tan δ,
 * C = ε/(18·ln(D_i/d_c))·10⁻⁹ F/m (D_i over the insulation excluding the screen, d_c over the
 * conductor including its screen). Counted only when U₀ is at or above the value of Table 3 for
 * the insulation (constants.ts); below it the standard lets W_d be neglected.
 */
export function dielectricLoss(args: {
  insulation: InsulationMaterial;
  voltageU0V: number;
  frequencyHz: number;
  conductorDiameterM: number;
  insulationDiameterM: number;
  permittivity?: number;
  tanDelta?: number;
}): DielectricLossResult {
  const U0 = requireNonNegative(args?.voltageU0V, 'voltageU0V');
  // Direct current: no alternating field, no dielectric loss.
  const omega = args.frequencyHz === 0 ? 0 : omegaOf(args.frequencyHz);
  const dc = requirePositive(args.conductorDiameterM, 'conductorDiameterM');
  const Di = requirePositive(args.insulationDiameterM, 'insulationDiameterM');
  if (!(Di > dc)) throw new ElectricalInputError('insulationDiameterM', 'must exceed the conductor diameter');
  const tableRow = dielectricRow(args.insulation, U0);
  if (!tableRow) throw new ElectricalInputError('insulation', `unknown insulation ${String(args.insulation)}`);
  const eps = args.permittivity === undefined ? tableRow.permittivity : requireRange(args.permittivity, 'permittivity', 1, 20);
  const tanDelta = args.tanDelta === undefined ? tableRow.tanDelta : requireRange(args.tanDelta, 'tanDelta', 0, 1);
  const C = (eps / (18 * Math.log(Di / dc))) * 1e-9;
  const computed = omega * C * U0 * U0 * tanDelta;
  const counts = U0 >= tableRow.thresholdU0V;
  const kV = (v: number) => `${(v / 1000).toPrecision(4)} kV`;
  const reason = counts
    ? `U₀ = ${kV(U0)} is at or above ${kV(tableRow.thresholdU0V)}, where IEC 60287-1-1 Table 3 counts dielectric losses for ${tableRow.description} (from memory)`
    : `U₀ = ${kV(U0)} is below ${kV(tableRow.thresholdU0V)}, under which IEC 60287-1-1 Table 3 lets dielectric losses of ${tableRow.description} be neglected (from memory)`;
  return { counts, reason, lossWPerM: counts ? computed : 0, computedLossWPerM: computed, capacitanceFPerM: C, row: { ...tableRow, permittivity: eps, tanDelta } };
}

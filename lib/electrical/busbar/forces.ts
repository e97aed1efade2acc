/**
 * Short-circuit forces and stresses of rigid bus bars, IEC 60865-1 (method of clause 5, rigid
 * conductors, the simplified route with the maximum dynamic factors, no natural-frequency
 * calculation). Equation wording and numbers are FROM MEMORY of IEC 60865-1 and IEC 60909-0; the
 * tests work a case by hand with each formula named. All SI: A, m, N, Pa.
 *
 *  peak current       i_p = κ·√2·I″k,  κ = 1.02 + 0.98·e^(−3R/X)             (IEC 60909-0 eq. 55)
 *  main conductors    F_m = (μ₀/2π)·(√3/2)·i_p²·l/a_m  (central conductor, three-phase, one plane)
 *                     a_m = a/k₁₂, k₁₂ Dwight's factor of the main conductors' cross-sections
 *  sub-conductors     F_s = (μ₀/2π)·(i_p/n)²·l_s/a_s,  1/a_s = Σ_{i=2}^{n} k_1i/a_1i
 *  bending stresses   σ_m = V_σ·V_r·β·F_m·l/(8Z),  σ_s = V_σs·V_rs·F_s·l_s/(16Z_s)
 *  strength           σ_tot = σ_m + σ_s ≤ q·R_p0.2 (q = 1.5 rectangular),  σ_s ≤ R_p0.2
 *  supports           F_d = V_F·V_r·α·F_m
 *
 * Dwight's factors k (IEC 60865-1 Figure 1) are computed exactly from the geometric mean distance
 * of rectangles (rectangleInductance.ts), not read from the figure. For a main conductor that is a
 * pack, k₁₂ is taken for the rectangle enclosing the pack with uniform current (flagged; it tends to
 * 1 when a is large against the pack, as it usually is).
 */
import { ElectricalInputError, requirePositive, requireRange } from '../errors';
import { MU0, type ConductorMaterial } from '../materials';
import type { BusbarFlag } from './flags';
import type { PreparedBusbarSystem } from './geometry';
import { rectangularForceFactor } from './rectangleInductance';

export type SupportArrangement =
  | 'single-span-both-simply-supported'
  | 'single-span-fixed-and-simply-supported'
  | 'single-span-both-fixed'
  | 'continuous-two-spans'
  | 'continuous-three-or-more-spans';

/**
 * Factors α (support A: end support, B: inner support) and β of IEC 60865-1 Table 3 by the type of
 * beam and support (from memory).
 */
export const BEAM_FACTORS: Readonly<Record<SupportArrangement, { alphaA: number; alphaB: number; beta: number; description: string }>> = Object.freeze({
  'single-span-both-simply-supported': { alphaA: 0.5, alphaB: 0.5, beta: 1.0, description: 'single span, both ends simply supported' },
  'single-span-fixed-and-simply-supported': { alphaA: 0.625, alphaB: 0.375, beta: 0.73, description: 'single span, one end fixed (A), the other simply supported (B)' },
  'single-span-both-fixed': { alphaA: 0.5, alphaB: 0.5, beta: 0.5, description: 'single span, both ends fixed' },
  'continuous-two-spans': { alphaA: 0.375, alphaB: 1.25, beta: 0.73, description: 'continuous beam, two equal spans, simple supports' },
  'continuous-three-or-more-spans': { alphaA: 0.4, alphaB: 1.1, beta: 0.73, description: 'continuous beam, three or more equal spans, simple supports' },
});

/** Plastic shape factor q of a rectangular section (IEC 60865-1 Table 4, from memory). */
export const Q_RECTANGULAR = 1.5;

/**
 * Maximum dynamic factors without calculating the natural frequency, three-phase short circuit
 * without three-phase automatic reclosing (IEC 60865-1 Table 2, from memory): V_σ·V_r = V_σs·V_rs = 1,
 * V_F·V_r = 2.7. With automatic reclosing the standard's factors differ and must be entered.
 */
export interface DynamicFactors {
  vSigmaVr: number;
  vSigmaSVrs: number;
  vFVr: number;
}

export const DEFAULT_DYNAMIC_FACTORS: Readonly<DynamicFactors> = Object.freeze({ vSigmaVr: 1.0, vSigmaSVrs: 1.0, vFVr: 2.7 });

/**
 * Default 0.2 % proof strength R_p0.2, Pa, when the catalogue gives none (flagged for review):
 * copper: Cu-ETP in the half-hard temper R240 of EN 13601, minimum 180 N/mm² (from memory; soft
 * R200 copper is far weaker); aluminium: pure aluminium bars EN AW-1350A, 70 N/mm² taken as a low
 * round figure for the half-hard tempers (from memory; alloy 6101B-T6 bars reach about 160 N/mm²).
 */
export const DEFAULT_YIELD_STRENGTH_PA: Readonly<Record<ConductorMaterial, { valuePa: number; source: string }>> = Object.freeze({
  copper: { valuePa: 180e6, source: 'Cu-ETP R240 (half-hard), EN 13601 minimum R_p0.2 = 180 N/mm², from memory' },
  aluminium: { valuePa: 70e6, source: 'EN AW-1350A half-hard, R_p0.2 ≈ 70 N/mm² as a low round figure, from memory' },
});

/** Peak factor κ from R/X, IEC 60909-0 eq. (55): κ = 1.02 + 0.98·e^(−3R/X). */
export function peakFactor(rOverX: number): number {
  const r = requireRange(rOverX, 'rOverX', 0, 10);
  return 1.02 + 0.98 * Math.exp(-3 * r);
}

export interface ShortCircuitForceInput {
  system: PreparedBusbarSystem;
  /** Initial symmetrical three-phase short-circuit current I″k3, A (RMS). */
  initialCurrentA: number;
  /** R/X of the short-circuit impedance; gives κ. Without it (and without `kappa`) κ = 2.0 (R/X → 0), flagged. */
  rOverX?: number;
  /** κ entered directly (1.02 … 2.0), instead of R/X. */
  kappa?: number;
  material: ConductorMaterial;
  /** R_p0.2 of the bar material, Pa (catalogue); a flagged default per material otherwise. */
  yieldStrengthPa?: number;
  supports: SupportArrangement;
  /** Rated (bending) strength of a support, N; without it the support forces are reported, not checked. */
  supportStrengthN?: number;
  /** Three-phase automatic reclosing: the standard's factors must then be entered in `dynamicFactors`. */
  autoReclosing?: boolean;
  dynamicFactors?: DynamicFactors;
  /** Section modulus of the main conductor about its bending axis, m³ (e.g. a pack with stiffening elements); flagged. */
  mainSectionModulusM3?: number;
}

export interface ShortCircuitForceResult {
  kappa: number;
  peakCurrentA: number;
  /** Dwight's factor of the main conductors and a_m = a/k₁₂, m. */
  mainForceFactor: number;
  mainEffectiveDistanceM: number;
  /** Force on the central main conductor over one support span, N. */
  mainForceN: number;
  /** Per metre, N/m. */
  mainForcePerMetreNPerM: number;
  /** Sub-conductors (null with one bar per phase). */
  subConductor: {
    /** k_1i and a_1i for i = 2 … n. */
    factors: { centreDistanceM: number; k: number }[];
    effectiveDistanceM: number;
    /** Over one spacer span l_s, N. */
    forceN: number;
    spacerSpacingM: number;
    sectionModulusM3: number;
    stressPa: number;
  } | null;
  mainSectionModulusM3: number;
  mainStressPa: number;
  totalStressPa: number;
  yieldStrengthPa: number;
  q: number;
  /** σ_tot / (q·R_p0.2). ≤ 1 passes. */
  stressRatio: number;
  /** σ_s / R_p0.2 (null without sub-conductors). ≤ 1 passes. */
  subConductorStressRatio: number | null;
  factors: { alphaA: number; alphaB: number; beta: number; vSigmaVr: number; vSigmaSVrs: number; vFVr: number };
  /** F_d at the end supports (A) and the inner supports (B), N. */
  supportForceAN: number;
  supportForceBN: number;
  /** max(F_d,A, F_d,B) / rated strength (null when none given). */
  supportForceRatio: number | null;
  passes: boolean;
  /** Largest support spacing that passes every check with the same spacers, m, and what limits it. */
  largestSupportSpacingM: number;
  largestSupportSpacingLimitedBy: 'bending stress' | 'sub-conductor stress' | 'support force';
  flags: BusbarFlag[];
  method: string;
}

const FORCE_CONSTANT = MU0 / (2 * Math.PI);

interface SpanStresses {
  mainStressPa: number;
  subStressPa: number;
}

export function shortCircuitForces(input: ShortCircuitForceInput): ShortCircuitForceResult {
  const { system } = input;
  const flags: BusbarFlag[] = [];
  const ik = requirePositive(input.initialCurrentA, 'initialCurrentA');
  let kappa: number;
  if (input.kappa !== undefined) {
    if (input.rOverX !== undefined) throw new ElectricalInputError('kappa', 'give either kappa or rOverX, not both');
    kappa = requireRange(input.kappa, 'kappa', 1.02, 2.0);
  } else if (input.rOverX !== undefined) {
    kappa = peakFactor(input.rOverX);
  } else {
    kappa = 2.0;
    flags.push({
      code: 'BUSBAR_KAPPA_DEFAULTED',
      severity: 'review',
      message: 'No R/X given: κ = 2.0, the upper limit of IEC 60909-0 eq. (55) as R/X → 0 (conservative).',
    });
  }
  if (input.material !== 'copper' && input.material !== 'aluminium') throw new ElectricalInputError('material', "must be 'copper' or 'aluminium'");
  let yieldStrengthPa: number;
  if (input.yieldStrengthPa !== undefined) {
    yieldStrengthPa = requireRange(input.yieldStrengthPa, 'yieldStrengthPa', 1e6, 1e9);
  } else {
    const d = DEFAULT_YIELD_STRENGTH_PA[input.material];
    yieldStrengthPa = d.valuePa;
    flags.push({ code: 'BUSBAR_YIELD_STRENGTH_DEFAULTED', severity: 'review', message: `R_p0.2 not given: ${d.source}.` });
  }
  const beam = BEAM_FACTORS[input.supports];
  if (!beam) throw new ElectricalInputError('supports', `must be one of ${Object.keys(BEAM_FACTORS).join(', ')}`);
  let dynamic: Readonly<DynamicFactors> = DEFAULT_DYNAMIC_FACTORS;
  if (input.dynamicFactors !== undefined) {
    dynamic = {
      vSigmaVr: requireRange(input.dynamicFactors.vSigmaVr, 'dynamicFactors.vSigmaVr', 0, 5),
      vSigmaSVrs: requireRange(input.dynamicFactors.vSigmaSVrs, 'dynamicFactors.vSigmaSVrs', 0, 5),
      vFVr: requireRange(input.dynamicFactors.vFVr, 'dynamicFactors.vFVr', 0, 10),
    };
  } else if (input.autoReclosing === true) {
    throw new ElectricalInputError('dynamicFactors', 'three-phase automatic reclosing: enter V_σ·V_r, V_σs·V_rs and V_F·V_r (IEC 60865-1 Table 2)');
  } else {
    flags.push({
      code: 'BUSBAR_DYNAMIC_FACTORS_DEFAULTED',
      severity: 'review',
      message: 'Dynamic factors not calculated: the maximum values without three-phase automatic reclosing, V_σ·V_r = V_σs·V_rs = 1, V_F·V_r = 2.7 (IEC 60865-1 Table 2, from memory).',
    });
  }
  const supportStrengthN = input.supportStrengthN === undefined ? null : requirePositive(input.supportStrengthN, 'supportStrengthN');
  if (supportStrengthN === null) {
    flags.push({ code: 'BUSBAR_SUPPORT_STRENGTH_NOT_GIVEN', severity: 'review', message: 'No rated support strength given: the support forces are reported, not checked.' });
  }

  // Peak current, IEC 60909-0 eq. (54)/(55).
  const peakCurrentA = kappa * Math.SQRT2 * ik;

  // Main conductors: a_m = a/k₁₂ for the pack envelopes, force along x (phases side by side).
  const a = system.phaseSpacingM;
  const mainForceFactor = rectangularForceFactor({ centreDistanceM: a, dimensionAlongForceM: system.packSizeXM, dimensionAcrossForceM: system.packSizeYM });
  const mainEffectiveDistanceM = a / mainForceFactor;
  if (system.barsPerPhase > 1) {
    flags.push({
      code: 'BUSBAR_MAIN_DISTANCE_FROM_ENVELOPE',
      severity: 'note',
      message: `a_m = a/k₁₂ with k₁₂ = ${mainForceFactor.toFixed(4)} for the rectangle enclosing each pack, uniform current (IEC 60865-1 Figure 1 computed exactly).`,
    });
  }
  const mainForcePerMetreNPerM = (FORCE_CONSTANT * (Math.sqrt(3) / 2) * peakCurrentA * peakCurrentA) / mainEffectiveDistanceM;
  const l = system.supportSpacingM;

  // Section moduli. Sub-conductor force is always normal to the wide faces: Z_s = b·d²/6 = w·t²/6.
  const w = system.barWidthM;
  const t = system.barThicknessM;
  const n = system.barsPerPhase;
  const subSectionModulus = (w * t * t) / 6;
  let mainSectionModulusM3: number;
  if (input.mainSectionModulusM3 !== undefined) {
    mainSectionModulusM3 = requirePositive(input.mainSectionModulusM3, 'mainSectionModulusM3');
    flags.push({ code: 'BUSBAR_SECTION_MODULUS_ENTERED', severity: 'review', message: `Main-conductor section modulus entered: ${mainSectionModulusM3.toExponential(4)} m³.` });
  } else if (system.arrangement === 'edge') {
    // Force normal to the wide faces: each bar bends about its weak axis; no composite action credited.
    mainSectionModulusM3 = n * subSectionModulus;
    if (n > 1) {
      flags.push({
        code: 'BUSBAR_SECTION_MODULUS_NO_STIFFENING',
        severity: 'note',
        message: 'Main-conductor section modulus n·w·t²/6: the bars bend each on its own (spacers, no stiffening elements). IEC 60865-1 allows larger values with stiffening elements; enter one to use them.',
      });
    }
  } else {
    // Bars laid flat, force in the plane of their width: each bends about its strong axis.
    mainSectionModulusM3 = (n * t * w * w) / 6;
  }

  // Sub-conductors: 1/a_s = Σ k_1i/a_1i (bar 1 an outer bar), F_s = (μ₀/2π)(i_p/n)²·l_s/a_s.
  let subFactors: { centreDistanceM: number; k: number }[] = [];
  let subEffectiveDistanceM = Number.POSITIVE_INFINITY;
  if (n > 1) {
    const pitch = t + system.gapM;
    subFactors = Array.from({ length: n - 1 }, (_, i) => {
      const centreDistanceM = (i + 1) * pitch;
      return { centreDistanceM, k: rectangularForceFactor({ centreDistanceM, dimensionAlongForceM: t, dimensionAcrossForceM: w }) };
    });
    subEffectiveDistanceM = 1 / subFactors.reduce((s, f) => s + f.k / f.centreDistanceM, 0);
  }
  const subForcePerMetre = n > 1 ? (FORCE_CONSTANT * (peakCurrentA / n) ** 2) / subEffectiveDistanceM : 0;

  const stressesAt = (span: number, spacer: number): SpanStresses => ({
    mainStressPa: (dynamic.vSigmaVr * beam.beta * mainForcePerMetreNPerM * span * span) / (8 * mainSectionModulusM3),
    subStressPa: n > 1 ? (dynamic.vSigmaSVrs * subForcePerMetre * spacer * spacer) / (16 * subSectionModulus) : 0,
  });
  const ls = system.spacerSpacingM;
  const { mainStressPa, subStressPa } = stressesAt(l, ls);
  const totalStressPa = mainStressPa + subStressPa;
  const allowed = Q_RECTANGULAR * yieldStrengthPa;
  const stressRatio = totalStressPa / allowed;
  const subConductorStressRatio = n > 1 ? subStressPa / yieldStrengthPa : null;
  const supportForceAN = dynamic.vFVr * beam.alphaA * mainForcePerMetreNPerM * l;
  const supportForceBN = dynamic.vFVr * beam.alphaB * mainForcePerMetreNPerM * l;
  const supportForceRatio = supportStrengthN === null ? null : Math.max(supportForceAN, supportForceBN) / supportStrengthN;

  // Largest support spacing: σ_m ∝ l²; the spacers stay where they are unless the span becomes
  // shorter than their spacing (then they sit at the supports, l_s = l).
  const mainCoefficient = (dynamic.vSigmaVr * beam.beta * mainForcePerMetreNPerM) / (8 * mainSectionModulusM3);
  const subCoefficient = n > 1 ? (dynamic.vSigmaSVrs * subForcePerMetre) / (16 * subSectionModulus) : 0;
  const spacersAtSupports = ls >= l;
  let byStress: number;
  let bySub = Number.POSITIVE_INFINITY;
  const fixedSpacerStress = subCoefficient * ls * ls;
  if (!spacersAtSupports && fixedSpacerStress < allowed && Math.sqrt((allowed - fixedSpacerStress) / mainCoefficient) >= ls) {
    byStress = Math.sqrt((allowed - fixedSpacerStress) / mainCoefficient);
    if (fixedSpacerStress > yieldStrengthPa) bySub = 0;
  } else {
    byStress = Math.sqrt(allowed / (mainCoefficient + subCoefficient));
    if (n > 1) bySub = Math.sqrt(yieldStrengthPa / subCoefficient);
  }
  const byForce = supportStrengthN === null ? Number.POSITIVE_INFINITY : supportStrengthN / (dynamic.vFVr * Math.max(beam.alphaA, beam.alphaB) * mainForcePerMetreNPerM);
  let largestSupportSpacingM = byStress;
  let largestSupportSpacingLimitedBy: ShortCircuitForceResult['largestSupportSpacingLimitedBy'] = 'bending stress';
  if (bySub < largestSupportSpacingM) {
    largestSupportSpacingM = bySub;
    largestSupportSpacingLimitedBy = 'sub-conductor stress';
  }
  if (byForce < largestSupportSpacingM) {
    largestSupportSpacingM = byForce;
    largestSupportSpacingLimitedBy = 'support force';
  }

  if (stressRatio > 1) {
    flags.push({
      code: 'BUSBAR_STRESS_EXCEEDED',
      severity: 'blocker',
      message: `σ_tot = ${(totalStressPa / 1e6).toFixed(1)} N/mm² exceeds q·R_p0.2 = ${(allowed / 1e6).toFixed(1)} N/mm² (IEC 60865-1).`,
    });
  }
  if (subConductorStressRatio !== null && subConductorStressRatio > 1) {
    flags.push({
      code: 'BUSBAR_SUB_CONDUCTOR_STRESS_EXCEEDED',
      severity: 'blocker',
      message: `σ_s = ${(subStressPa / 1e6).toFixed(1)} N/mm² exceeds R_p0.2 = ${(yieldStrengthPa / 1e6).toFixed(1)} N/mm²: spacers closer together.`,
    });
  }
  if (supportForceRatio !== null && supportForceRatio > 1) {
    flags.push({
      code: 'BUSBAR_SUPPORT_FORCE_EXCEEDED',
      severity: 'blocker',
      message: `Support force ${Math.max(supportForceAN, supportForceBN).toFixed(0)} N exceeds the rated ${supportStrengthN} N.`,
    });
  }
  const passes = stressRatio <= 1 && (subConductorStressRatio === null || subConductorStressRatio <= 1) && (supportForceRatio === null || supportForceRatio <= 1);
  return {
    kappa,
    peakCurrentA,
    mainForceFactor,
    mainEffectiveDistanceM,
    mainForceN: mainForcePerMetreNPerM * l,
    mainForcePerMetreNPerM,
    subConductor:
      n > 1
        ? {
            factors: subFactors,
            effectiveDistanceM: subEffectiveDistanceM,
            forceN: subForcePerMetre * ls,
            spacerSpacingM: ls,
            sectionModulusM3: subSectionModulus,
            stressPa: subStressPa,
          }
        : null,
    mainSectionModulusM3,
    mainStressPa,
    totalStressPa,
    yieldStrengthPa,
    q: Q_RECTANGULAR,
    stressRatio,
    subConductorStressRatio,
    factors: { alphaA: beam.alphaA, alphaB: beam.alphaB, beta: beam.beta, ...dynamic },
    supportForceAN,
    supportForceBN,
    supportForceRatio,
    passes,
    largestSupportSpacingM,
    largestSupportSpacingLimitedBy,
    flags,
    method: 'IEC 60865-1 rigid conductors, simplified method with the maximum dynamic factors; κ by IEC 60909-0 eq. (55)',
  };
}

/**
 * Conductor resistance: DC at temperature and AC effects.
 *
 * Sources: IEC 60287-1-1 §2.1 (resistance, skin and proximity effect of round conductors);
 * the plane-conductor skin-effect solution (e.g. P. L. Dowell, "Effects of eddy currents in
 * transformer windings", Proc. IEE 113(8), 1966, single layer m = 1; J. Lammeraner & M. Štafl,
 * "Eddy Currents", 1966) for rectangular bars.
 */
import {
  ElectricalInputError,
  requireFinite,
  requireNonNegative,
  requirePositive,
  requireRange,
  requireTemperature,
} from './errors';
import { MU0 } from './materials';

// ───────────────────────────── DC resistance ─────────────────────────────

/**
 * DC resistance per metre at a temperature, IEC 60287-1-1 eq. (2): R' = R₀[1 + α₂₀(θ − 20)].
 * `r20` in Ω/m (from the catalogue: datasheet or IEC 60228 maximum), `temperature` in °C.
 */
export function resistanceAt(args: { r20: number; alpha20: number; temperature: number }): number {
  const r20 = requirePositive(args?.r20, 'r20');
  const alpha20 = requireRange(args?.alpha20, 'alpha20', 0, 0.01);
  const temperature = requireTemperature(args?.temperature, 'temperature');
  if (1 + alpha20 * (temperature - 20) <= 0) {
    // Below −1/α + 20 the linear law gives a non-physical resistance; refuse rather than invent.
    throw new ElectricalInputError('temperature', `is below the range of the linear resistance law (${temperature} °C)`);
  }
  return dcResistance(r20, alpha20, temperature);
}

/**
 * The formulas of this module without input checks, for callers whose inputs were validated
 * once where they entered the library (the sizing layer's prepare step): R' = R₂₀[1 + α₂₀(θ − 20)].
 */
export function dcResistance(r20OhmPerM: number, alpha20PerK: number, temperatureC: number): number {
  return r20OhmPerM * (1 + alpha20PerK * (temperatureC - 20));
}

// ───────────────────────────── Skin effect (round) ─────────────────────────────

export type SkinEffectRange = 'xs<=2.8' | '2.8<xs<=3.8' | 'xs>3.8';

export interface SkinEffectDetail {
  /** x_s, dimensionless. */
  xs: number;
  /** Skin-effect factor y_s. */
  ys: number;
  /** Which IEC 60287-1-1 expression applied. Only the first is the main formula; the two
   *  others (large conductors) are recalled from memory and raise a flag in the sizing layer. */
  range: SkinEffectRange;
}

function checkFrequency(value: unknown, field = 'frequency'): number {
  // Up to 1 kHz: the IEC expressions are for power frequencies; 400 Hz aircraft/ground power is
  // the highest use we expect. Above that, refuse rather than extrapolate silently.
  return requireRange(value, field, 0, 1000);
}

/**
 * Skin effect in detail, IEC 60287-1-1 §2.1.2:
 * x_s² = 8πf·1e-7·k_s / R', y_s = x_s⁴ / (192 + 0.8 x_s⁴) for x_s ≤ 2.8.
 * For 2.8 < x_s ≤ 3.8: y_s = −0.136 − 0.0177x_s + 0.0563x_s²; for x_s > 3.8:
 * y_s = 0.354x_s − 0.733 (both from memory of the same clause).
 * `resistance` is the DC resistance per metre at the operating temperature, Ω/m.
 */
export function skinEffect(args: { resistance: number; frequency: number; ks?: number }): SkinEffectDetail {
  const resistance = requirePositive(args?.resistance, 'resistance');
  const frequency = checkFrequency(args?.frequency);
  const ks = args?.ks === undefined ? 1 : requireRange(args.ks, 'ks', 0, 1.5, { minExclusive: true });
  return skinEffectOf(resistance, frequency, ks);
}

/** `skinEffect` without input checks (validated inputs only). */
export function skinEffectOf(resistanceOhmPerM: number, frequencyHz: number, ks: number): SkinEffectDetail {
  const xs2 = (8 * Math.PI * frequencyHz * 1e-7 * ks) / resistanceOhmPerM;
  const xs = Math.sqrt(xs2);
  if (xs <= 2.8) {
    const xs4 = xs2 * xs2;
    return { xs, ys: xs4 / (192 + 0.8 * xs4), range: 'xs<=2.8' };
  }
  if (xs <= 3.8) return { xs, ys: -0.136 - 0.0177 * xs + 0.0563 * xs2, range: '2.8<xs<=3.8' };
  return { xs, ys: 0.354 * xs - 0.733, range: 'xs>3.8' };
}

/** Skin-effect factor y_s (IEC 60287-1-1 §2.1.2). k_s defaults to 1 (round conductor, Table 2). */
export function skinEffectFactor(args: { resistance: number; frequency: number; ks?: number }): number {
  return skinEffect(args).ys;
}

// ───────────────────────────── Proximity effect (round) ─────────────────────────────

export interface ProximityEffectDetail {
  xp: number;
  yp: number;
  /** IEC 60287-1-1 states the expression for x_p ≤ 2.8. */
  inRange: boolean;
}

/**
 * Proximity-effect factor y_p, IEC 60287-1-1 §2.1.4.1 (circular conductors):
 * x_p² = 8πf·1e-7·k_p / R', F = x_p⁴/(192 + 0.8x_p⁴),
 * three single-core cables: y_p = F·(d_c/s)²·[0.312(d_c/s)² + 1.18/(F + 0.27)];
 * two single-core cables (single phase) or a two-core cable: y_p = F·(d_c/s)²·2.9 (from memory).
 * `spacing` s is axis to axis (m); for a flat formation use s = √(s₁·s₂) as the standard says.
 * k_p defaults to 1: IEC 60287-1-1 Table 2 gives 1 for round conductors that are not dried and
 * impregnated (extruded insulation) and 0.8 only for dried-and-impregnated (paper) cables.
 */
export function proximityEffect(args: {
  resistance: number;
  frequency: number;
  conductorDiameter: number;
  spacing: number;
  kp?: number;
  cables?: 2 | 3;
}): ProximityEffectDetail {
  const resistance = requirePositive(args?.resistance, 'resistance');
  const frequency = checkFrequency(args?.frequency);
  const dc = requirePositive(args?.conductorDiameter, 'conductorDiameter');
  const s = requirePositive(args?.spacing, 'spacing');
  if (s < dc) throw new ElectricalInputError('spacing', `axis-to-axis spacing ${s} m is less than the conductor diameter ${dc} m`);
  const kp = args?.kp === undefined ? 1 : requireRange(args.kp, 'kp', 0, 1.5, { minExclusive: true });
  const cables = args?.cables ?? 3;
  if (cables !== 2 && cables !== 3) throw new ElectricalInputError('cables', `must be 2 or 3 (got ${String(cables)})`);
  return proximityEffectOf(resistance, frequency, dc, s, kp, cables);
}

/** `proximityEffect` without input checks (validated inputs only). */
export function proximityEffectOf(resistanceOhmPerM: number, frequencyHz: number, conductorDiameterM: number, spacingM: number, kp: number, cables: 2 | 3): ProximityEffectDetail {
  const xp2 = (8 * Math.PI * frequencyHz * 1e-7 * kp) / resistanceOhmPerM;
  const xp4 = xp2 * xp2;
  const f = xp4 / (192 + 0.8 * xp4);
  const ratio2 = (conductorDiameterM / spacingM) ** 2;
  const yp = cables === 3 ? f * ratio2 * (0.312 * ratio2 + 1.18 / (f + 0.27)) : f * ratio2 * 2.9;
  const xp = Math.sqrt(xp2);
  return { xp, yp, inRange: xp <= 2.8 };
}

/** Proximity-effect factor y_p (see `proximityEffect`). */
export function proximityEffectFactor(args: Parameters<typeof proximityEffect>[0]): number {
  return proximityEffect(args).yp;
}

// ───────────────────────────── AC resistance (round) ─────────────────────────────

export interface AcResistanceResult {
  /** DC resistance at the temperature, Ω/m. */
  rdc: number;
  /** AC resistance R = R'(1 + y_s + y_p), Ω/m. */
  rac: number;
  /** R_ac / R_dc = 1 + y_s + y_p. */
  acFactor: number;
  xs: number;
  ys: number;
  skinRange: SkinEffectRange;
  xp: number | null;
  yp: number;
  /** False when x_p > 2.8 (outside the stated range of the proximity expression). */
  proximityInRange: boolean;
}

/**
 * AC resistance of a round conductor at a temperature, IEC 60287-1-1 §2.1: R = R'(1 + y_s + y_p).
 * Proximity is included when `proximity` (conductor diameter and axis spacing of the circuit's
 * cables) is given; without it y_p = 0 (an isolated conductor).
 */
export function acResistance(args: {
  r20: number;
  alpha20: number;
  temperature: number;
  frequency: number;
  ks?: number;
  kp?: number;
  proximity?: { conductorDiameter: number; spacing: number; cables?: 2 | 3 };
}): AcResistanceResult {
  const rdc = resistanceAt({ r20: args?.r20, alpha20: args?.alpha20, temperature: args?.temperature });
  const frequency = checkFrequency(args.frequency);
  const ks = args.ks === undefined ? 1 : requireRange(args.ks, 'ks', 0, 1.5, { minExclusive: true });
  if (args.proximity) {
    // Checked by proximityEffect's own rules (diameter, spacing ≥ diameter, k_p, cables).
    proximityEffect({ resistance: rdc, frequency, conductorDiameter: args.proximity.conductorDiameter, spacing: args.proximity.spacing, kp: args.kp, cables: args.proximity.cables });
  }
  return acResistanceOf({
    r20OhmPerM: args.r20,
    alpha20PerK: args.alpha20,
    temperatureC: args.temperature,
    frequencyHz: frequency,
    ks,
    kp: args.kp ?? 1,
    ...(args.proximity ? { proximity: { conductorDiameterM: args.proximity.conductorDiameter, spacingM: args.proximity.spacing, cables: args.proximity.cables ?? 3 } } : {}),
  });
}

/** `acResistance` without input checks (validated inputs only). */
export function acResistanceOf(a: {
  r20OhmPerM: number;
  alpha20PerK: number;
  temperatureC: number;
  frequencyHz: number;
  ks: number;
  kp: number;
  proximity?: { conductorDiameterM: number; spacingM: number; cables: 2 | 3 };
}): AcResistanceResult {
  const rdc = dcResistance(a.r20OhmPerM, a.alpha20PerK, a.temperatureC);
  const skin = skinEffectOf(rdc, a.frequencyHz, a.ks);
  let xp: number | null = null;
  let yp = 0;
  let proximityInRange = true;
  if (a.proximity) {
    const p = proximityEffectOf(rdc, a.frequencyHz, a.proximity.conductorDiameterM, a.proximity.spacingM, a.kp, a.proximity.cables);
    xp = p.xp;
    yp = p.yp;
    proximityInRange = p.inRange;
  }
  const acFactor = 1 + skin.ys + yp;
  return { rdc, rac: rdc * acFactor, acFactor, xs: skin.xs, ys: skin.ys, skinRange: skin.range, xp, yp, proximityInRange };
}

// ───────────────────────────── Rectangular bars ─────────────────────────────

export const BAR_SKIN_METHOD =
  'plane-conductor skin effect (Dowell 1966, single layer; Lammeraner & Štafl 1966): ' +
  'R_ac/R_dc = (ξ/2)(sinh ξ + sin ξ)/(cosh ξ − cos ξ), ξ = t/δ';

export interface BarAcRatioResult {
  /** R_ac / R_dc. */
  ratio: number;
  /** Skin depth δ = √(ρ/(π f μ₀)), m (Infinity at DC). */
  skinDepthM: number;
  /** ξ = t/δ. */
  xi: number;
  method: string;
  /**
   * Always true for this method: it treats the bar as an infinitely wide plate, so it ignores
   * current crowding at the edges and the proximity of the other bars and phases, each of which
   * raises the true ratio.
   */
  lowerBound: true;
}

/**
 * AC/DC resistance ratio of a rectangular bar by the plane-conductor solution: the exact field
 * solution for a plate of thickness t carrying current with equal field on both faces. It is a
 * LOWER BOUND for a real bar (see `lowerBound`).
 * `resistance` is the bar's DC resistance per metre at the temperature (Ω/m); with the width and
 * thickness it gives the effective resistivity ρ = R·w·t (so catalogue R₂₀ drives it, not the
 * handbook resistivity).
 */
export function barAcResistanceRatio(args: {
  resistance: number;
  width: number;
  thickness: number;
  frequency: number;
}): BarAcRatioResult {
  const resistance = requirePositive(args?.resistance, 'resistance');
  const width = requirePositive(args?.width, 'width');
  const thickness = requirePositive(args?.thickness, 'thickness');
  const frequency = checkFrequency(args?.frequency);
  return barAcResistanceRatioOf(resistance, width, thickness, frequency);
}

/** `barAcResistanceRatio` without input checks (validated inputs only). */
export function barAcResistanceRatioOf(resistanceOhmPerM: number, widthM: number, thicknessM: number, frequencyHz: number): BarAcRatioResult {
  if (frequencyHz === 0) {
    return { ratio: 1, skinDepthM: Number.POSITIVE_INFINITY, xi: 0, method: BAR_SKIN_METHOD, lowerBound: true };
  }
  const rho = resistanceOhmPerM * widthM * thicknessM;
  const delta = Math.sqrt(rho / (Math.PI * frequencyHz * MU0));
  const xi = thicknessM / delta;
  return { ratio: planeConductorRatioOf(xi), skinDepthM: delta, xi, method: BAR_SKIN_METHOD, lowerBound: true };
}

/** (ξ/2)(sinh ξ + sin ξ)/(cosh ξ − cos ξ), evaluated without cancellation or overflow. */
export function planeConductorRatio(xi: number): number {
  return planeConductorRatioOf(requireNonNegative(xi, 'xi'));
}

function planeConductorRatioOf(xi: number): number {
  // Series 1 + ξ⁴/180 + O(ξ⁸) where cosh − cos loses digits; its next term is below 1e-13 here.
  if (xi < 0.02) return 1 + xi ** 4 / 180;
  // For large ξ the hyperbolic terms dominate: ratio → ξ/2 (two skin depths carry the current).
  if (xi > 40) return xi / 2;
  return ((xi / 2) * (Math.sinh(xi) + Math.sin(xi))) / (Math.cosh(xi) - Math.cos(xi));
}

/** Heat generated per metre by a current in a resistance per metre: I²R (W/m). */
export function jouleLossPerMetre(args: { current: number; resistance: number }): number {
  const current = requireFinite(args?.current, 'current');
  const resistance = requireNonNegative(args?.resistance, 'resistance');
  return current * current * resistance;
}

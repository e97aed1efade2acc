/**
 * Short-circuit withstand by the adiabatic method of IEC 60949:
 *   I²t = K²S²·ln((θ_f + β)/(θ_i + β))
 * with K and β from IEC 60949 Table 1 (copper K = 226 A·s½/mm², β = 234.5 K; aluminium
 * K = 148, β = 228 — from memory). The k factor tabulated in IEC 60364-5-54 is
 * K·√ln((β + θ_f)/(β + θ_i)).
 *
 * The adiabatic method ignores heat flowing out of the conductor during the fault, so it
 * over-estimates the final temperature (conservative); IEC 60364-4-43 limits its use to faults
 * up to 5 s (from memory) — the sizing layer flags longer durations.
 */
import { ElectricalInputError, requireNonNegative, requirePositive, requireTemperature } from './errors';
import { materialConstants, type ConductorMaterial } from './materials';

function initialAboveMinusBeta(initial: number, beta: number, field: string): void {
  if (initial + beta <= 0) throw new ElectricalInputError(field, `must be above −β = ${-beta} °C`);
}

/** k factor in A·s½/mm² for a conductor heated adiabatically from `initial` to `final` (°C). */
export function adiabaticK(args: { material: ConductorMaterial; initial: number; final: number }): number {
  const m = materialConstants(args?.material);
  const initial = requireTemperature(args?.initial, 'initial');
  const final = requireTemperature(args?.final, 'final');
  initialAboveMinusBeta(initial, m.betaK, 'initial');
  if (final <= initial) {
    throw new ElectricalInputError('final', `must be above the initial temperature (${final} ≤ ${initial} °C)`);
  }
  return m.adiabaticKConstant * Math.sqrt(Math.log((final + m.betaK) / (initial + m.betaK)));
}

/**
 * Final conductor temperature (°C) after `current` (A, r.m.s.) flows for `duration` (s) through
 * `section` (mm²) starting at `initial` (°C):
 *   θ_f = (θ_i + β)·exp(I²t / (K²S²)) − β.
 * Returns +Infinity only when the exponent overflows a double (a final temperature beyond
 * 1e300 °C: the conductor is destroyed); never NaN.
 */
export function shortCircuitFinalTemperature(args: {
  material: ConductorMaterial;
  current: number;
  duration: number;
  section: number;
  initial: number;
}): number {
  const m = materialConstants(args?.material);
  const current = requireNonNegative(args?.current, 'current');
  const duration = requireNonNegative(args?.duration, 'duration');
  const section = requirePositive(args?.section, 'section');
  const initial = requireTemperature(args?.initial, 'initial');
  initialAboveMinusBeta(initial, m.betaK, 'initial');
  const exponent = (current * current * duration) / (m.adiabaticKConstant ** 2 * section * section);
  const growth = Math.exp(exponent);
  if (!Number.isFinite(growth)) return Number.POSITIVE_INFINITY;
  return (initial + m.betaK) * growth - m.betaK;
}

/**
 * Smallest section (mm²) that carries `current` (A) for `duration` (s) from `initial` to `final`
 * (°C) adiabatically: S = I√t / k (IEC 60364-5-54 / IEC 60949).
 */
export function minimumSection(args: {
  material: ConductorMaterial;
  current: number;
  duration: number;
  initial: number;
  final: number;
}): number {
  const current = requireNonNegative(args?.current, 'current');
  const duration = requireNonNegative(args?.duration, 'duration');
  const k = adiabaticK({ material: args?.material, initial: args?.initial, final: args?.final });
  return (current * Math.sqrt(duration)) / k;
}

/** Largest fault current (A) a section (mm²) withstands for `duration` (s) between the two temperatures. */
export function shortCircuitWithstandCurrent(args: {
  material: ConductorMaterial;
  section: number;
  duration: number;
  initial: number;
  final: number;
}): number {
  const section = requirePositive(args?.section, 'section');
  const duration = requirePositive(args?.duration, 'duration');
  const k = adiabaticK({ material: args?.material, initial: args?.initial, final: args?.final });
  return (k * section) / Math.sqrt(duration);
}

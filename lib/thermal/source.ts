/**
 * Volumetric sources written as S = S_u + S_p·T_P (Patankar 1980, §4.2-5; physics.md §1).
 *
 * Joule heating: q'''(T) = J²·ρ₂₀·[1 + α₂₀(T − 20 °C)]·F_ac with J = I/A. Because ρ(T) is linear
 * in T the tangent form is exact, not an approximation:
 *   tangent: S_p = J²ρ₂₀α₂₀F_ac > 0,  S_u = q'''(T*) − S_p·T* = J²ρ₂₀F_ac(1 − 20α₂₀)
 *   lagged:  S_p = 0,                S_u = q'''(T*)
 * A positive S_p takes weight off the diagonal; iterate.ts decides when it is safe.
 */
import type { Linearisation } from './types';
import type { NormalizedSource } from './validate';

export interface JouleCoefficients {
  /** q''' at 20 °C, W/m³ */
  q20: number;
  /** dq'''/dT, W/(m³·K) */
  slope: number;
}

export function jouleCoefficients(
  source: Extract<NormalizedSource, { kind: 'joule' }>,
  currentA: number = source.current,
): JouleCoefficients {
  const j = currentA / source.area;
  const q20 = j * j * source.rho20 * source.acFactor;
  return { q20, slope: q20 * source.alpha20 };
}

/** q'''(T), W/m³ */
export function jouleHeatDensity(c: JouleCoefficients, temperatureC: number): number {
  return c.q20 + c.slope * (temperatureC - 20);
}

/** S_u (W/m³) and S_p (W/(m³·K)) for one generating cell at the current iterate T*. */
export function linearisedSource(
  source: NormalizedSource,
  joule: JouleCoefficients | undefined,
  mode: Linearisation,
  temperatureC: number,
): { su: number; sp: number } {
  if (source.kind === 'uniform') return { su: source.q, sp: 0 };
  const c = joule!;
  if (mode === 'tangent') return { su: c.q20 - 20 * c.slope, sp: c.slope };
  return { su: jouleHeatDensity(c, temperatureC), sp: 0 };
}

/** q''' actually generated at temperature T (W/m³), for the energy balance. */
export function sourceDensity(source: NormalizedSource, joule: JouleCoefficients | undefined, temperatureC: number): number {
  return source.kind === 'uniform' ? source.q : jouleHeatDensity(joule!, temperatureC);
}

/**
 * Heat generated over the cells at their temperatures (reference + rise, °C), W per m² of slab or
 * per metre of cylinder; `sourceVolumes` holds ΔV of generating cells and 0 elsewhere. One call
 * for the whole sweep, so that the per-cell density is a call within this module.
 */
export function generatedHeat(
  source: NormalizedSource,
  joule: JouleCoefficients | undefined,
  reference: number,
  rises: Float64Array,
  sourceVolumes: Float64Array,
): number {
  let generated = 0;
  for (let i = 0; i < rises.length; i++) {
    const v = sourceVolumes[i];
    if (v !== 0) generated += sourceDensity(source, joule, reference + rises[i]) * v;
  }
  return generated;
}

/**
 * Volumetric source laws (physics.md §1): what the source is at a temperature. How a pass
 * linearises it (S = S_u + S_p·θ, uniform / Joule tangent / Joule lagged) is in terms.ts.
 *
 * Joule heating: q'''(T) = J²·ρ₂₀·[1 + α₂₀(T − 20 °C)]·F_ac with J = I/A — a straight line in T,
 * so its tangent form is exact.
 */
import type { NormalizedJouleSource, NormalizedSource } from './normalized';
import type { JouleLine } from './terms';

export interface JouleCoefficients {
  /** q''' at 20 °C, W/m³ */
  q20: number;
  /** dq'''/dT, W/(m³·K) */
  slope: number;
}

export function jouleCoefficients(source: NormalizedJouleSource, currentA: number = source.current): JouleCoefficients {
  const j = currentA / source.area;
  const q20 = j * j * source.rho20 * source.acFactor;
  return { q20, slope: q20 * source.alpha20 };
}

/** The Joule line about the reference temperature (°C): q''' = q_ref + slope·θ. */
export function jouleLine(c: JouleCoefficients, referenceC: number): JouleLine {
  return { qRef: c.q20 + c.slope * (referenceC - 20), slope: c.slope };
}

/** q'''(T), W/m³ */
export function jouleHeatDensity(c: JouleCoefficients, temperatureC: number): number {
  return c.q20 + c.slope * (temperatureC - 20);
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

/**
 * The law of the heat lost sideways from a bar run (physics.md §6): every section of the bar
 * gives heat to the air through the surfaces around it, h(T)·P·(T − T∞) per metre, with h the
 * secant coefficient h_conv + h_rad of the same surface correlations as the cross-section model,
 * at the section's own temperature. A pass linearises it as the source term S_p = −hP/A_c
 * (terms.ts sidewaysLoss) with h held at the iterate (Picard); the energy balance evaluates it at
 * the final temperatures.
 */
import { ThermalInputError } from './errors';
import type { NormalizedSurface, SidewaysLoss } from './normalized';
import { isLinearSurface, surfaceFlux } from './surface';

/**
 * Rises smaller than this are evaluated at it: natural convection has h → 0 as ΔT → 0, and a
 * section exactly at the air temperature would otherwise cut its own heat path in the first pass.
 */
const SMALLEST_EVALUATED_RISE_K = 1e-9;

/**
 * The secant form needs the loss to vanish at T = T∞: radiative surroundings at the air
 * temperature and nothing absorbed (true of every surface busBarProblem builds). Anything else
 * is refused rather than approximated.
 */
export function requireSecantSurfaces(surfaces: NormalizedSurface[]): void {
  const ambient = surfaces[0]?.ambient;
  surfaces.forEach((s, i) => {
    if (s.ambient !== ambient) throw new ThermalInputError(`sideways.surfaces[${i}].ambient`, 'must be the same air temperature on every face');
    if (s.emissivity > 0 && s.surroundings !== s.ambient) throw new ThermalInputError(`sideways.surfaces[${i}].surroundings`, 'must equal the air temperature along a bar run');
    if (s.absorbedFlux !== 0) throw new ThermalInputError(`sideways.surfaces[${i}].absorbedFlux`, 'is not modelled along a bar run');
  });
}

/** The air temperature the section gives its heat to, °C. */
export function sidewaysAmbient(loss: SidewaysLoss): number {
  return loss.surfaces[0].ambient;
}

/**
 * hP/A_c at a rise θ = T − T∞ of the section, W/(m³·K): Σ over the surfaces of (h_conv + h_rad)
 * times their area per volume.
 */
export function sidewaysLossPerVolume(loss: SidewaysLoss, riseK: number): number {
  const rise = Math.abs(riseK) < SMALLEST_EVALUATED_RISE_K ? SMALLEST_EVALUATED_RISE_K : riseK;
  const ambient = sidewaysAmbient(loss);
  let sum = 0;
  for (const s of loss.surfaces) {
    const e = surfaceFlux(s, ambient + rise, rise);
    sum += (e.hConv + e.hRad) * loss.areaPerVolume;
  }
  return sum;
}

/** True when h does not depend on temperature (fixed coefficients, no radiation). */
export function isLinearSidewaysLoss(loss: SidewaysLoss): boolean {
  return loss.surfaces.every(isLinearSurface);
}

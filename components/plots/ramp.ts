/**
 * A perceptually uniform ramp for temperatures: viridis (van der Walt and Smith, matplotlib, 2015;
 * CC0), sampled at nine stops from the published colour map. Plotly also knows it by the name
 * 'Viridis', which the plots use for their colour scales; these stops colour things Plotly does
 * not (layer bands, legends).
 */
import { VIRIDIS_STOPS } from '@/lib/sheet/fieldPicture';

// The stops live in lib/ so that the server's PDF colours the cross-section's field with the same ramp.
export { VIRIDIS_STOPS };

/** The ramp colour of t in [0, 1] (nearest stop; enough for bands and swatches). */
export function rampColour(t: number): string {
  const clamped = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  return VIRIDIS_STOPS[Math.round(clamped * (VIRIDIS_STOPS.length - 1))];
}

/** Qualitative colours for candidates (distinct, not a temperature scale). */
export const CANDIDATE_COLOURS = ['#b8703d', '#2f3d4f', '#17776f', '#7b4624', '#6b7e94', '#a06b08', '#3b528b', '#a8402b'];

/**
 * A perceptually uniform ramp for temperatures: viridis (van der Walt and Smith, matplotlib, 2015;
 * CC0), sampled at nine stops from the published colour map. Plotly also knows it by the name
 * 'Viridis', which the plots use for their colour scales; these stops colour things Plotly does
 * not (layer bands, legends).
 */
import { VIRIDIS_STOPS, viridisColour } from '@/lib/sheet/fieldPicture';

// The stops live in lib/ so that the server's PDF colours the cross-section's field with the same ramp.
export { VIRIDIS_STOPS };

/** The ramp colour of t in [0, 1] (nearest stop; enough for bands and swatches). */
export function rampColour(t: number): string {
  const clamped = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  return VIRIDIS_STOPS[Math.round(clamped * (VIRIDIS_STOPS.length - 1))];
}

/**
 * The colour of candidate i of n on a plot: evenly spaced along the perceptually uniform ramp, so
 * that neighbours differ in lightness too (they stay apart in greyscale and for red-green colour
 * vision deficiency), where a hand-picked list had a copper and a brown side by side (issue 23).
 * The bright yellow end (t > 0.85) is left out: it is too faint on the white plot area.
 */
export function candidateColour(i: number, n: number): string {
  if (n <= 1) return viridisColour(0.3);
  return viridisColour((0.85 * (i % n)) / (n - 1));
}

/** Marker shapes, one per candidate, so that lines never differ by colour alone. */
export const CANDIDATE_MARKERS = ['circle', 'square', 'diamond', 'triangle-up', 'cross', 'triangle-down', 'x', 'star', 'pentagon', 'hexagon'] as const;

export function candidateMarker(i: number): (typeof CANDIDATE_MARKERS)[number] {
  return CANDIDATE_MARKERS[i % CANDIDATE_MARKERS.length];
}

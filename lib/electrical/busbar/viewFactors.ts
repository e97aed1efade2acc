/**
 * View factors between long parallel strips (two-dimensional enclosures), by Hottel's
 * crossed-strings method: F₁₂ = (Σ crossed strings − Σ uncrossed strings) / (2·L₁), exact for
 * unobstructed strips in two dimensions (Hottel & Sarofim, *Radiative Transfer*, 1967; Howell's
 * catalogue of configuration factors, case C-2 for directly opposed strips; Incropera et al.
 * Table 13.1 — from memory).
 */

/**
 * From strip 1 to strip 2, both normal to the same axis and facing each other across a clear
 * distance `distanceM`; each given by its interval along the strips' common direction.
 * Directly opposed equal strips of width w: F = √(1 + (S/w)²) − S/w.
 */
export function parallelStripsViewFactor(distanceM: number, from: { lo: number; hi: number }, to: { lo: number; hi: number }): number {
  const string = (p: number, q: number) => Math.hypot(distanceM, p - q);
  const crossed = string(from.lo, to.hi) + string(from.hi, to.lo);
  const uncrossed = string(from.lo, to.lo) + string(from.hi, to.hi);
  return (crossed - uncrossed) / (2 * (from.hi - from.lo));
}

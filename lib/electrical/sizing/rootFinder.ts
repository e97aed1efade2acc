/**
 * Bracketing root finder for the current at which a temperature reaches its limit.
 *
 * The map current → hot spot is monotone increasing (more current, more heat, everything else
 * fixed), so the root is bracketed and then refined by the Illinois variant of regula falsi
 * (Dowell & Jarratt, BIT 11, 1971) carried out in I² rather than I: the temperature rise is
 * close to proportional to I²R, which makes the interpolation nearly exact and the root is
 * found in a handful of solves. Every new point is kept at least ~tol/2 inside the bracket, so
 * the bracket closes from both sides instead of creeping in from one.
 *
 * The answer is the LOWER end of the final bracket (≤ 0.1 A wide by default): the reported
 * current never puts the hot spot above the limit.
 */
import { SizingError } from '../errors';

export type LimitEvaluation<T> =
  /** excessK = temperature − limit (of the governing term); riseK = temperature − reference. */
  | { kind: 'value'; excessK: number; riseK: number; payload: T }
  /** No steady state at this current; `runawayCurrentA` if the solver knows where it starts. */
  | { kind: 'runaway'; runawayCurrentA?: number };

export interface LimitRoot<T> {
  /** Lower end of the final bracket, A (hot spot ≤ limit there). */
  currentA: number;
  /** Upper end of the final bracket, A (hot spot > limit, or runaway). */
  upperA: number;
  excessK: number;
  payload: T;
  evaluations: number;
  /** True when even zero current leaves the temperature at or above the limit. */
  zero: boolean;
}

interface Point<T> {
  i: number;
  f: number;
  rise: number;
  payload: T;
}

export function findLimitCurrent<T>(
  evaluate: (currentA: number) => LimitEvaluation<T>,
  options: { guessA: number; toleranceA?: number; maxEvaluations?: number },
): LimitRoot<T> {
  const tol = options.toleranceA ?? 0.1;
  const maxEvaluations = options.maxEvaluations ?? 60;
  let evaluations = 0;
  const run = (i: number): LimitEvaluation<T> => {
    if (evaluations >= maxEvaluations) {
      throw new SizingError(
        'AMPACITY_NOT_FOUND',
        `the ampacity was not bracketed to ${tol} A within ${maxEvaluations} heat-balance solves`,
      );
    }
    evaluations++;
    return evaluate(i);
  };

  let lo: Point<T> | null = null; // f ≤ 0
  let hi: Point<T> | null = null; // f > 0, finite
  let runawayAbove = Number.POSITIVE_INFINITY; // smallest current known to run away

  const zeroCurrentCheck = (): LimitRoot<T> | null => {
    const e = run(0);
    if (e.kind === 'runaway') {
      throw new SizingError('RUNAWAY_AT_ZERO', 'the solver reports no steady state even without current');
    }
    const p = { i: 0, f: e.excessK, rise: e.riseK, payload: e.payload };
    if (p.f >= 0) {
      return { currentA: 0, upperA: 0, excessK: p.f, payload: p.payload, evaluations, zero: true };
    }
    lo = p;
    return null;
  };

  // ── Bracketing: predict with rise ∝ I², overshoot slightly so the next point lands across. ──
  let next = Number.isFinite(options.guessA) && options.guessA > 0 ? options.guessA : 100;
  while (lo === null || hi === null) {
    if (next < tol) {
      // The root is within one tolerance of zero (or there is none).
      if (lo === null) {
        const z = zeroCurrentCheck();
        if (z) return z;
      }
      if (hi === null) {
        // lo exists at 0 and every finite evaluation so far was above the limit or ran away:
        // fall through to the refinement with a bisection towards the known upper side.
        next = Math.min(runawayAbove, tol);
      }
      if (lo !== null && hi !== null) break;
    }
    const e = run(next);
    if (e.kind === 'runaway') {
      runawayAbove = Math.min(runawayAbove, next);
      const knownStart = e.runawayCurrentA;
      const loI = lo === null ? 0 : (lo as Point<T>).i;
      let candidate = (loI + next) / 2;
      if (knownStart !== undefined && Number.isFinite(knownStart) && knownStart > loI && knownStart < next) {
        candidate = Math.max(candidate, loI + 0.9 * (knownStart - loI));
      }
      next = candidate;
      if (next - loI <= tol && lo !== null) {
        // Runaway starts within a tolerance above the last good point: that point is the answer.
        return { currentA: loI, upperA: runawayAbove, excessK: (lo as Point<T>).f, payload: (lo as Point<T>).payload, evaluations, zero: false };
      }
      continue;
    }
    const p: Point<T> = { i: next, f: e.excessK, rise: e.riseK, payload: e.payload };
    if (p.f <= 0) {
      if (lo === null || p.i > lo.i) lo = p;
    } else if (hi === null || p.i < hi.i) {
      hi = p;
    }
    if (lo !== null && hi !== null) break;
    const allowed = p.rise - p.f; // limit − reference temperature
    let predicted: number;
    if (allowed > 0 && p.rise > 0 && p.i > 0) predicted = p.i * Math.sqrt(allowed / p.rise);
    else predicted = p.f <= 0 ? p.i * 2 : p.i / 2;
    if (p.f <= 0) {
      // Need more current: overshoot by 2 %, at least 1 % more, never past a known runaway.
      next = Math.max(predicted * 1.02, p.i * 1.01);
      if (next >= runawayAbove) next = (p.i + runawayAbove) / 2;
      if (next - p.i <= tol && runawayAbove < Number.POSITIVE_INFINITY) {
        return { currentA: p.i, upperA: runawayAbove, excessK: p.f, payload: p.payload, evaluations, zero: false };
      }
    } else {
      next = Math.min(predicted * 0.98, p.i * 0.99);
      if (allowed <= 0) next = 0; // limit at or below the reference temperature: check zero current
      // Most of the rise does not come from the current (the sun): I² prediction barely moves;
      // look at zero current, which either is the answer or brackets the root from below.
      if (lo === null && predicted > 0.9 * p.i) next = 0;
    }
  }

  // ── Refinement: Illinois regula falsi in I², keeping points away from the ends. ──
  let a = lo as Point<T>;
  let b = hi as Point<T>;
  let fa = a.f;
  let fb = b.f;
  let lastSide = 0;
  while (b.i - a.i > tol) {
    const xa = a.i * a.i;
    const xb = b.i * b.i;
    let i = Math.sqrt(xa - (fa * (xb - xa)) / (fb - fa));
    const margin = Math.min(0.45 * tol, (b.i - a.i) / 4);
    if (!(i > a.i + margin)) i = a.i + margin;
    if (!(i < b.i - margin)) i = b.i - margin;
    const e = run(i);
    if (e.kind === 'runaway') {
      // Cannot happen for a monotone map with a finite upper point; treat it as above the limit.
      b = { i, f: Math.max(b.f, 1), rise: b.rise, payload: b.payload };
      fb = b.f;
      lastSide = 1;
      continue;
    }
    const p: Point<T> = { i, f: e.excessK, rise: e.riseK, payload: e.payload };
    if (p.f <= 0) {
      a = p;
      fa = p.f;
      if (lastSide === -1) fb /= 2;
      lastSide = -1;
    } else {
      b = p;
      fb = p.f;
      if (lastSide === 1) fa /= 2;
      lastSide = 1;
    }
    if (p.f === 0) break;
  }
  return { currentA: a.i, upperA: b.i, excessK: a.f, payload: a.payload, evaluations, zero: false };
}

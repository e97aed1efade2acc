/**
 * Bracketing root finder for the current at which the governing conductor reaches its limit,
 * in the style of lib/electrical/sizing/rootFinder.ts (kept here because lib/thermal sits below
 * lib/electrical and must not import from it): the excess over the limit is close to linear in
 * I² (heat ∝ I²R), so the bracket is predicted in I² and closed by the Illinois variant of
 * regula falsi (Dowell & Jarratt, BIT 11, 1971) in I², bisection where the upper end has no
 * steady state. The answer is the LOWER end of the final bracket: never above the limit.
 */

export type LimitProbe<T> = { kind: 'value'; excessK: number; payload: T } | { kind: 'runaway' };

export interface LimitCurrent<T> {
  /** Lower end of the final bracket, A (at or below the limit there). */
  currentA: number;
  /** Upper end, A (above the limit, or no steady state). */
  upperA: number;
  payload: T;
  excessK: number;
  evaluations: number;
  /** True when even zero current leaves the governing conductor at or above its limit. */
  zero: boolean;
}

interface Point<T> {
  current: number;
  excess: number;
  payload: T;
}

export function findLimitCurrent<T>(
  evaluate: (currentA: number) => LimitProbe<T>,
  options: { guessA: number; toleranceA: number; maxEvaluations: number },
): LimitCurrent<T> {
  let evaluations = 0;
  const probe = (current: number): LimitProbe<T> => {
    if (evaluations >= options.maxEvaluations) {
      throw new Error(`the ampacity was not bracketed to ${options.toleranceA} A within ${options.maxEvaluations} solves`);
    }
    evaluations++;
    return evaluate(current);
  };
  const zero = probe(0);
  if (zero.kind === 'runaway') throw new Error('no steady state even without current');
  const base: Point<T> = { current: 0, excess: zero.excessK, payload: zero.payload };
  if (base.excess >= 0) return { currentA: 0, upperA: 0, payload: base.payload, excessK: base.excess, evaluations, zero: true };

  let lo = base;
  let hi: (Point<T> & { runaway: boolean }) | null = null;
  let next = options.guessA > 0 && Number.isFinite(options.guessA) ? options.guessA : 100;
  while (hi === null) {
    const e = probe(next);
    if (e.kind === 'runaway') {
      hi = { current: next, excess: Infinity, payload: lo.payload, runaway: true };
      break;
    }
    if (e.excessK > 0) {
      hi = { current: next, excess: e.excessK, payload: e.payload, runaway: false };
      break;
    }
    lo = { current: next, excess: e.excessK, payload: e.payload };
    // Secant in I² through (0, e₀) and this point, 2 % beyond, at least 10 % more current.
    const slope = (lo.excess - base.excess) / (lo.current * lo.current);
    const predicted = slope > 0 ? Math.sqrt(-base.excess / slope) : 2 * lo.current;
    next = Math.max(1.02 * predicted, 1.1 * lo.current);
  }

  let fLo = lo.excess;
  let fHi = hi.excess;
  let side = 0;
  while (hi.current - lo.current > options.toleranceA) {
    const width = hi.current - lo.current;
    let current: number;
    if (hi.runaway) current = lo.current + width / 2;
    else {
      const xa = lo.current * lo.current;
      const xb = hi.current * hi.current;
      current = Math.sqrt(xa - (fLo * (xb - xa)) / (fHi - fLo));
    }
    const margin = Math.min(0.45 * options.toleranceA, width / 4);
    if (!(current > lo.current + margin)) current = lo.current + margin;
    if (!(current < hi.current - margin)) current = hi.current - margin;
    const e = probe(current);
    if (e.kind === 'runaway') {
      hi = { current, excess: Infinity, payload: lo.payload, runaway: true };
      continue;
    }
    if (e.excessK <= 0) {
      lo = { current, excess: e.excessK, payload: e.payload };
      fLo = e.excessK;
      if (side === -1) fHi /= 2;
      side = -1;
    } else {
      const wasRunaway = hi.runaway;
      hi = { current, excess: e.excessK, payload: e.payload, runaway: false };
      fHi = e.excessK;
      if (side === 1 && !wasRunaway) fLo /= 2;
      side = 1;
    }
  }
  return { currentA: lo.current, upperA: hi.current, payload: lo.payload, excessK: lo.excess, evaluations, zero: false };
}

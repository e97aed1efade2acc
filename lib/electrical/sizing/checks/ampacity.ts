/**
 * Check: ampacity (physics.md §5) — the circuit current at which the hot spot, or any covering
 * with a limit of its own, reaches its limit, to 0.1 A from below, with the AC factor settled at
 * the conductor temperature it produces, and the closed form beside it.
 */
import type { SteadyResult } from '../../../thermal';
import { SizingError } from '../../errors';
import { fromModelCurrent, modelResistance, modelToConductorCurrent, solveAt, toModelCurrent, type SizingContext } from '../context';
import { MODEL_TEXT } from '../flagText';
import { FlagSet, fmt } from '../flags';
import { cableClosedForm } from '../closedForm';
import { closedFormCurrent, CLOSED_FORM_METHOD_BAR, profileOf, readLimits, type LimitReading } from '../model';
import { findLimitCurrent, type LimitEvaluation } from '../rootFinder';
import type { AmpacityResult } from '../types';

/** Ampacity tolerance on the circuit current, A (physics.md §5). */
export const AMPACITY_TOLERANCE_A = 0.1;
/** Solver/closed-form difference above which CROSS_CHECK_DIFFERENCE is raised, %. */
export const CROSS_CHECK_LIMIT_PERCENT = 3;
/** Relative change of R_ac/R_dc below which a solve is settled (≈1e-4 K on a 100 K rise). */
export const AC_FACTOR_SETTLED = 1e-6;

export interface SolvedPoint {
  result: SteadyResult;
  limits: LimitReading;
}

/** Raises CORRELATION_OUT_OF_RANGE when a surface correlation or the air table was stretched. */
export function correlationFlags(result: SteadyResult, flags: FlagSet, where: string): void {
  for (const side of ['inner', 'outer'] as const) {
    const d = result.surface?.[side];
    if (d && !d.inRange) {
      const group = d.rayleigh !== undefined ? `Ra = ${fmt(d.rayleigh)}` : d.reynolds !== undefined ? `Re = ${fmt(d.reynolds)}` : 'see the solver notes';
      flags.add('CORRELATION_OUT_OF_RANGE', MODEL_TEXT.correlationRange(d.correlation, group, side, where), { side });
    }
  }
  for (const tf of result.flags ?? []) {
    if (tf.code === 'correlation-out-of-range' || tf.code === 'air-properties-out-of-table') {
      flags.add('CORRELATION_OUT_OF_RANGE', `${tf.message} (${where})`, { solverCode: tf.code });
    }
  }
}

/**
 * Starting point of the search: an IEC-style estimate with a typical combined coefficient of
 * 10 W/(m²·K) in still air (only a starting point: the root finder brackets from here).
 */
function firstGuess(ctx: SizingContext): number {
  const { model, cand, cond } = ctx;
  const limit = cand.contactLimit.temperatureC;
  const dT = limit - model.referenceC;
  if (!(dT > 0)) return 1;
  const h = cond.surfaceCoefficientWPerM2K ?? (cond.windSpeedMPerS > 0 ? 25 : 10);
  let sumU = 0;
  for (const f of model.faces) {
    const H = (cond.placement === 'buried' && model.buriedT4 ? 1 / (model.buriedT4 * f.exchangeAreaPerM) : h) * f.exchangeAreaPerM;
    const C = f.coveringConductance;
    sumU += Number.isFinite(C) ? (C * H) / (C + H) : H;
  }
  const i = Math.sqrt((sumU * dT) / modelResistance(ctx, limit));
  return Number.isFinite(i) && i > 0 ? i : 1;
}

/** The closed form beside the solver: a cable's is independent (IEC 60287, closedForm.ts); a bar's uses the solver's surface state (model.ts). */
function closedFormOf(ctx: SizingContext, point: SolvedPoint): { modelCurrentA: number; method: string; externalResistanceKmPerW: number; internalResistanceKmPerW: number } | null {
  const { cand, cond, group } = ctx;
  if (cand.kind === 'cable' && group) {
    const perModelConductor = (t: number) => modelResistance(ctx, t);
    const cf = cableClosedForm(cand, cond, group, point.limits.governing, perModelConductor);
    return cf ? { modelCurrentA: cf.conductorCurrentA, method: cf.method, externalResistanceKmPerW: cf.externalResistanceKmPerW, internalResistanceKmPerW: cf.internalResistanceKmPerW } : null;
  }
  const cf = closedFormCurrent(ctx.model, point.result, point.limits.governing, (t) => modelResistance(ctx, t));
  return cf ? { ...cf, method: CLOSED_FORM_METHOD_BAR } : null;
}

function closedFormCheck(ctx: SizingContext, point: SolvedPoint, currentA: number): AmpacityResult['closedForm'] {
  const cf = closedFormOf(ctx, point);
  if (!cf || !(cf.modelCurrentA > 0)) return null;
  const cfCurrent = fromModelCurrent(ctx, cf.modelCurrentA);
  const differencePercent = (100 * (currentA - cfCurrent)) / cfCurrent;
  if (Math.abs(differencePercent) > CROSS_CHECK_LIMIT_PERCENT) {
    ctx.flags.add('CROSS_CHECK_DIFFERENCE', MODEL_TEXT.crossCheck(currentA, cfCurrent, differencePercent, CROSS_CHECK_LIMIT_PERCENT), { differencePercent });
  }
  return {
    currentA: cfCurrent,
    method: cf.method,
    differencePercent,
    externalResistanceKmPerW: cf.externalResistanceKmPerW,
    internalResistanceKmPerW: cf.internalResistanceKmPerW,
  };
}

/**
 * The one AC-factor loop: R_ac/R_dc depends (weakly) on the conductor temperature, so a solve is
 * repeated with the factor at the temperature it produced until the factor moves less than
 * AC_FACTOR_SETTLED, at most `maxRuns` times. `conductorCOf` returns null when there is nothing
 * to settle (no steady state, no current).
 */
export function withSettledAcFactor<T>(
  ctx: SizingContext,
  startFactor: number,
  maxRuns: number,
  run: (acFactor: number) => T,
  conductorCOf: (value: T) => number | null,
): { value: T; acFactor: number } {
  let acFactor = startFactor;
  for (let runs = 1; ; runs++) {
    const value = run(acFactor);
    const conductorC = conductorCOf(value);
    if (conductorC === null || runs >= maxRuns) return { value, acFactor };
    const settled = ctx.acFn(conductorC).factor;
    if (Math.abs(settled - acFactor) <= AC_FACTOR_SETTLED * acFactor) return { value, acFactor };
    acFactor = settled;
  }
}

export function ampacityCheck(ctx: SizingContext): AmpacityResult {
  const { cand, model } = ctx;
  let guess = firstGuess(ctx);
  const toleranceModelA = toModelCurrent(ctx, AMPACITY_TOLERANCE_A);
  let iterations = 0;
  const search = (acFactor: number) => {
    const evaluate = (i: number): LimitEvaluation<SolvedPoint> => {
      const r = solveAt(ctx, i, acFactor, 'coarse');
      if (!r.converged) {
        if (r.runaway) return { kind: 'runaway', runawayCurrentA: r.runaway.current };
        throw new SizingError('SOLVER_NOT_CONVERGED', `the heat balance did not converge at ${fmt(i)} A`);
      }
      const limits = readLimits(model, r, cand.contactLimit);
      return { kind: 'value', excessK: limits.excessK, riseK: limits.riseK, payload: { result: r, limits } };
    };
    const root = findLimitCurrent(evaluate, { guessA: guess, toleranceA: toleranceModelA });
    iterations += root.evaluations;
    guess = root.currentA;
    return root;
  };
  const { value: root, acFactor } = withSettledAcFactor(ctx, ctx.acFn(cand.contactLimit.temperatureC).factor, 4, search, (r) => (r.zero ? null : r.payload.limits.conductorC));
  const point = root.payload;
  ctx.acFn(point.limits.conductorC, ctx.flags); // raise the AC-method flags once, at the final state
  correlationFlags(point.result, ctx.flags, 'at the ampacity');
  const current = root.zero ? 0 : fromModelCurrent(ctx, root.currentA);
  const upper = fromModelCurrent(ctx, root.upperA);
  const result: AmpacityResult = {
    current,
    hotSpot: { temperature: point.result.hotSpot.temperature, position: point.result.hotSpot.position },
    iterations,
    solves: ctx.solves,
    conductorCurrentA: root.zero ? 0 : modelToConductorCurrent(ctx, root.currentA),
    governingLimit: point.limits.governing,
    acFactor,
    bracketA: [current, Number.isFinite(upper) ? upper : current],
    closedForm: root.zero ? null : closedFormCheck(ctx, point, current),
    profile: profileOf(model, point.result),
    flags: [],
  };
  if (root.zero) {
    result.zeroBecause = `at zero current the ${point.limits.governing.layer ?? point.limits.governing.source} is already at ${fmt(point.limits.temperatureC, 4)} °C, not below its ${fmt(point.limits.governing.temperatureC, 4)} °C limit`;
  }
  return result;
}

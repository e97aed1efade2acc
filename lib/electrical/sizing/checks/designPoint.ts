/**
 * Check: the candidate at the design current — hot spot, margin, conductor temperature, loss per
 * conductor, and the flags of the thermal result (over limit, margin under 10 %, near runaway,
 * soil drying, correlations out of range).
 */
import { dcResistance } from '../../resistance';
import { fromModelCurrent, solveAt, toModelCurrent, type SizingContext } from '../context';
import { RESULT_TEXT } from '../flagText';
import { heatPerMetre, readLimits } from '../model';
import { SizingError } from '../../errors';
import type { AmpacityResult, GoverningLimit } from '../types';
import { correlationFlags, withSettledAcFactor, type SolvedPoint } from './ampacity';

/** I/I_runaway at which NEAR_RUNAWAY is raised: the temperature dependence of R has doubled the rise. */
export const NEAR_RUNAWAY_RATIO = Math.SQRT1_2;
/** Surface temperature of a buried cable above which the soil may dry (IEC 60287 practice, 50 °C, from memory). */
export const SOIL_DRYING_SURFACE_C = 50;

export interface DesignPoint {
  /** The solve at the design current; null on runaway. */
  point: SolvedPoint | null;
  acFactor: number;
  runawayCurrentA?: number;
}

export interface ThermalAtDesign {
  limit: GoverningLimit;
  hotSpotC: number | null;
  governingTemperatureC: number | null;
  marginK: number | null;
  marginPercent: number | null;
  conductorC: number | null;
  resistanceOhmPerM: number | null;
  lossPerConductorWPerM: number | null;
}

/**
 * Solves the candidate at a circuit current, the AC factor settled at the conductor temperature
 * it produces. `startC` is where R_ac/R_dc is first evaluated.
 */
export function solveAtCircuitCurrent(ctx: SizingContext, circuitA: number, startC: number, mesh: 'coarse' | 'fine' = 'fine'): DesignPoint {
  const { cand, model } = ctx;
  const modelCurrent = toModelCurrent(ctx, circuitA);
  let runawayCurrentA: number | undefined;
  const run = (acFactor: number): SolvedPoint | null => {
    const r = solveAt(ctx, modelCurrent, acFactor, mesh);
    if (!r.converged) {
      if (r.runaway) {
        runawayCurrentA = r.runaway.current;
        return null;
      }
      throw new SizingError('SOLVER_NOT_CONVERGED', `the heat balance did not converge at the design current`);
    }
    return { result: r, limits: readLimits(model, r, cand.contactLimit) };
  };
  const { value: point, acFactor } = withSettledAcFactor(ctx, ctx.acFn(startC).factor, 5, run, (p) => (p ? p.limits.conductorC : null));
  return point ? { point, acFactor } : { point: null, acFactor, ...(runawayCurrentA !== undefined ? { runawayCurrentA } : {}) };
}

/** The design point, its AC factor started where the rise ∝ I² rule from the ampacity puts it. */
export function designPointCheck(ctx: SizingContext, amp: AmpacityResult): DesignPoint {
  const { model, cond } = ctx;
  const limitC = amp.governingLimit.temperatureC;
  const share = amp.current > 0 ? Math.min(4, (cond.designCurrentA / amp.current) ** 2) : 1;
  const estimateC = model.referenceC + (limitC - model.referenceC) * share;
  return solveAtCircuitCurrent(ctx, cond.designCurrentA, Number.isFinite(estimateC) ? estimateC : limitC);
}

/** Ratio of the design current to the runaway onset (exact, or the constant-R_th estimate). */
function runawayRatio(ctx: SizingContext, point: SolvedPoint): number {
  const { model, cand, cond } = ctx;
  const { result, limits } = point;
  const modelDesign = toModelCurrent(ctx, cond.designCurrentA);
  if (result.runawayOnsetCurrentA !== undefined && result.runawayOnsetCurrentA > 0) return modelDesign / result.runawayOnsetCurrentA;
  // The constant-R_th estimate (I/I_r)² = α·Δθ_Joule/(1 + α(θ − 20)) (references.md closed form)
  // is cautious because natural convection and radiation improve as the surface warms.
  const w = heatPerMetre(model, result);
  const sun = model.faces.reduce((s, f) => s + f.absorbedFlux * f.exchangeAreaPerM, 0);
  const rise = limits.conductorC - model.referenceC;
  const jouleRise = w + sun > 0 ? (rise * w) / (w + sun) : 0;
  const r2 = (cand.alpha20 * jouleRise) / (1 + cand.alpha20 * (limits.conductorC - 20));
  return r2 > 0 ? Math.sqrt(r2) : 0;
}

/** Reads the design point against its limit and raises the flags of the thermal result. */
export function thermalAtDesign(ctx: SizingContext, design: DesignPoint, amp: AmpacityResult): ThermalAtDesign {
  const { cand, cond, flags, model } = ctx;
  const limit = design.point?.limits.governing ?? amp.governingLimit;
  if (!design.point) {
    const onset = design.runawayCurrentA !== undefined ? fromModelCurrent(ctx, design.runawayCurrentA) : undefined;
    flags.add('RUNAWAY', RESULT_TEXT.runaway(cond.designCurrentA, onset));
    return { limit, hotSpotC: null, governingTemperatureC: null, marginK: null, marginPercent: null, conductorC: null, resistanceOhmPerM: null, lossPerConductorWPerM: null };
  }
  const { result, limits } = design.point;
  const marginK = -limits.excessK;
  const allowedK = limits.governing.temperatureC - model.referenceC;
  const marginPercent = allowedK > 0 ? (100 * marginK) / allowedK : marginK >= 0 ? 0 : -100;
  const resistanceOhmPerM = dcResistance(cand.r20, cand.alpha20, limits.conductorC) * design.acFactor;
  const designConductorA = cond.designCurrentA / cand.conductorsPerPhase;

  if (limits.excessK > 0) {
    flags.add('OVER_LIMIT', RESULT_TEXT.overLimit(cond.designCurrentA, limits.governing.layer ?? limits.governing.source, limits.governing.temperatureC, limits.temperatureC), { temperatureC: limits.temperatureC, limitC: limits.governing.temperatureC });
  } else if (marginPercent < 10) {
    flags.add('MARGIN_UNDER_10', RESULT_TEXT.marginUnder10(marginK, marginPercent, allowedK), { marginK, marginPercent });
  }
  const ratio = runawayRatio(ctx, design.point);
  if (ratio >= NEAR_RUNAWAY_RATIO) flags.add('NEAR_RUNAWAY', RESULT_TEXT.nearRunaway(ratio), { ratio });
  correlationFlags(result, flags, 'at the design current');
  // (The solver reports `converged` only once its energy balance closes to 1e-6, physics.md §1,
  // so a converged result needs no further residual check here.)
  if (cond.placement === 'buried' && result.surfaceTemperature > SOIL_DRYING_SURFACE_C) {
    flags.add('SOIL_DRYING_RISK', RESULT_TEXT.soilDrying(result.surfaceTemperature, SOIL_DRYING_SURFACE_C), { surfaceC: result.surfaceTemperature });
  }
  return {
    limit,
    hotSpotC: result.hotSpot.temperature,
    governingTemperatureC: limits.temperatureC,
    marginK,
    marginPercent,
    conductorC: limits.conductorC,
    resistanceOhmPerM,
    lossPerConductorWPerM: designConductorA * designConductorA * resistanceOhmPerM,
  };
}

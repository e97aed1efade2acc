/**
 * Ampacity, evaluation of one candidate at the design current, and comparison of candidates
 * (physics.md §5). The heat balance comes from `lib/thermal` (physics.md §7); this module only
 * decides what to solve and reads the answers honestly.
 */
import { solveSteady, type Boundary, type SteadyResult, type ThermalProblem } from '../../thermal';
import { ElectricalInputError, SizingError } from '../errors';
import { lossEnergyCost, Money, conductorMass } from '../economics';
import { resistanceAt } from '../resistance';
import { adiabaticK, minimumSection, shortCircuitFinalTemperature } from '../shortCircuit';
import { voltageDrop, ANNEX_G_DEFAULT_REACTANCE_OHM_PER_M } from '../voltageDrop';
import { acFactorFunction, type AcFactorFunction } from './acFactor';
import { FlagSet, fmt } from './flags';
import {
  buildThermalModel,
  closedFormCurrent,
  CLOSED_FORM_METHOD_BAR,
  CLOSED_FORM_METHOD_CABLE,
  profileOf,
  readLimits,
  heatPerMetre,
  type LimitReading,
  type Mesh,
  type ThermalModel,
} from './model';
import { findLimitCurrent, type LimitEvaluation } from './rootFinder';
import { prepareCandidate, prepareConditions, type PreparedCandidate, type PreparedConditions } from './prepare';
import type {
  AmpacityResult,
  Candidate,
  CandidateEvaluation,
  CandidateEvaluationOk,
  Comparison,
  Conditions,
  ShortCircuitCheck,
} from './types';
import type Decimal from 'decimal.js';

/** Ampacity tolerance on the circuit current, A (physics.md §5). */
export const AMPACITY_TOLERANCE_A = 0.1;
/** Solver/closed-form difference above which CROSS_CHECK_DIFFERENCE is raised, %. */
export const CROSS_CHECK_LIMIT_PERCENT = 3;
/** I/I_runaway at which NEAR_RUNAWAY is raised: the temperature dependence of R has doubled the rise. */
export const NEAR_RUNAWAY_RATIO = Math.SQRT1_2;
/** Relative change of R_ac/R_dc below which a solve is settled (≈1e-4 K on a 100 K rise). */
const AC_FACTOR_SETTLED = 1e-6;
/** Surface temperature of a buried cable above which the soil may dry (IEC 60287 practice, 50 °C, from memory). */
export const SOIL_DRYING_SURFACE_C = 50;

interface Context {
  cand: PreparedCandidate;
  cond: PreparedConditions;
  model: ThermalModel;
  acFn: AcFactorFunction;
  flags: FlagSet;
  solves: number;
}

function contextFor(candidate: Candidate, conditions: Conditions, index: number, flags: FlagSet): Context {
  const cond = prepareConditions(conditions, flags);
  const cand = prepareCandidate(candidate, index, cond, flags);
  return { cand, cond, model: buildThermalModel(cand, cond), acFn: acFactorFunction(cand, cond), flags, solves: 0 };
}

/** Circuit current per phase ↔ model current of one conductor (after derating). */
function deratingOf(ctx: Context): number {
  return ctx.cond.groupingFactor * ctx.cond.enclosureFactor;
}
function toModelCurrent(ctx: Context, circuitA: number): number {
  return (circuitA / ctx.cand.conductorsPerPhase / deratingOf(ctx)) * ctx.model.currentScale;
}
function fromModelCurrent(ctx: Context, modelA: number): number {
  return (modelA / ctx.model.currentScale) * ctx.cand.conductorsPerPhase * deratingOf(ctx);
}

/**
 * Without current and without sun there is no heat flow at all: the exact steady state is the
 * surroundings' temperature everywhere, whatever the surface law. A linear surface gives it in
 * one exact pass, where a convection correlation (h → 0 as ΔT → 0) leaves the solver nothing to
 * iterate on.
 */
function zeroFlowProblem(problem: ThermalProblem): ThermalProblem {
  const still = (b: Boundary): Boundary =>
    b.kind === 'surface' && !(b.absorbedFlux && b.absorbedFlux > 0)
      ? { kind: 'surface', ambient: b.ambient, h: 1, emissivity: 0, ...(b.areaFactor !== undefined ? { areaFactor: b.areaFactor } : {}) }
      : b;
  return { ...problem, inner: still(problem.inner), outer: still(problem.outer) };
}

function solve(ctx: Context, modelCurrentA: number, acFactor: number, mesh: Mesh): SteadyResult {
  ctx.solves++;
  try {
    const problem = ctx.model.problem(modelCurrentA, acFactor, mesh);
    const result = solveSteady(modelCurrentA === 0 ? zeroFlowProblem(problem) : problem);
    if (!result.converged && result.runaway && !(result.runaway.current !== undefined && result.runaway.current > 0)) {
      // "No steady state even at 0 A" is impossible physically (with no current the conductor
      // settles at the surroundings' temperature, or above it in the sun): this is the solver
      // failing to settle, not a runaway. Say so rather than report a runaway.
      throw new SizingError(
        'SOLVER_NOT_CONVERGED',
        `the heat-balance solver could not settle at ${fmt(modelCurrentA)} A (it reports no steady state even at 0 A, which cannot be true); no temperature is reported`,
      );
    }
    return result;
  } catch (e) {
    if (e instanceof Error && e.name === 'ThermalInputError') {
      const field = (e as Error & { field?: string }).field;
      throw new ElectricalInputError(`thermal.${field ?? 'problem'}`, e.message);
    }
    throw e;
  }
}

/** AC resistance of the MODEL conductor per metre at a temperature (for the closed form). */
function modelResistance(ctx: Context, temperatureC: number): number {
  const { model, cand } = ctx;
  return ((model.rho20 * (1 + cand.alpha20 * (temperatureC - 20))) / model.areaM2) * ctx.acFn(temperatureC).factor;
}

function firstGuess(ctx: Context): number {
  // IEC-style estimate with a typical combined coefficient of 10 W/(m²·K) in still air
  // (only a starting point: the root finder brackets from here).
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
  const r = modelResistance(ctx, limit);
  const i = Math.sqrt((sumU * dT) / r);
  return Number.isFinite(i) && i > 0 ? i : 1;
}

/** Raises CORRELATION_OUT_OF_RANGE when a surface correlation or the air table was stretched. */
function correlationFlags(result: SteadyResult, flags: FlagSet, where: string): void {
  for (const side of ['inner', 'outer'] as const) {
    const d = result.surface?.[side];
    if (d && !d.inRange) {
      const group = d.rayleigh !== undefined ? `Ra = ${fmt(d.rayleigh)}` : d.reynolds !== undefined ? `Re = ${fmt(d.reynolds)}` : 'see the solver notes';
      flags.add('CORRELATION_OUT_OF_RANGE', `The ${d.correlation} correlation was used outside its stated range (${group}) at the ${side} surface ${where}; the surface heat transfer there is an extrapolation.`, { side });
    }
  }
  for (const tf of result.flags ?? []) {
    if (tf.code === 'correlation-out-of-range' || tf.code === 'air-properties-out-of-table') {
      flags.add('CORRELATION_OUT_OF_RANGE', `${tf.message} (${where})`, { solverCode: tf.code });
    }
  }
}

interface SolvedPoint {
  result: SteadyResult;
  limits: LimitReading;
}

function ampacityOf(ctx: Context): AmpacityResult {
  const { cand, model, acFn } = ctx;
  let acFactor = acFn(cand.contactLimit.temperatureC).factor;
  let guess = firstGuess(ctx);
  const tolModel = (AMPACITY_TOLERANCE_A * model.currentScale) / (cand.conductorsPerPhase * deratingOf(ctx));
  let iterations = 0;
  for (let pass = 0; ; pass++) {
    const evaluate = (i: number): LimitEvaluation<SolvedPoint> => {
      const r = solve(ctx, i, acFactor, 'coarse');
      if (!r.converged) {
        if (r.runaway) return { kind: 'runaway', runawayCurrentA: r.runaway.current };
        throw new SizingError('SOLVER_NOT_CONVERGED', `the heat balance did not converge at ${fmt(i)} A`);
      }
      const limits = readLimits(model, r, cand.contactLimit);
      return { kind: 'value', excessK: limits.excessK, riseK: limits.riseK, payload: { result: r, limits } };
    };
    const root = findLimitCurrent(evaluate, { guessA: guess, toleranceA: tolModel });
    iterations += root.evaluations;
    const point = root.payload;
    // R_ac/R_dc depends (weakly) on the conductor temperature: re-run once it has moved.
    const newFactor = acFn(point.limits.conductorC).factor;
    if (!root.zero && Math.abs(newFactor - acFactor) > AC_FACTOR_SETTLED * acFactor && pass < 3) {
      acFactor = newFactor;
      guess = root.currentA;
      continue;
    }
    acFn(point.limits.conductorC, ctx.flags); // raise the AC-method flags once, at the final state
    correlationFlags(point.result, ctx.flags, 'at the ampacity');
    const current = root.zero ? 0 : fromModelCurrent(ctx, root.currentA);
    let closedForm: AmpacityResult['closedForm'] = null;
    if (!root.zero) {
      const cf = closedFormCurrent(model, point.result, point.limits.governing, (t) => modelResistance(ctx, t));
      if (cf && cf.modelCurrentA > 0) {
        const cfCurrent = fromModelCurrent(ctx, cf.modelCurrentA);
        const differencePercent = (100 * (current - cfCurrent)) / cfCurrent;
        closedForm = {
          currentA: cfCurrent,
          method: cand.kind === 'cable' ? CLOSED_FORM_METHOD_CABLE : CLOSED_FORM_METHOD_BAR,
          differencePercent,
          externalResistanceKmPerW: cf.externalResistanceKmPerW,
          internalResistanceKmPerW: cf.internalResistanceKmPerW,
        };
        if (Math.abs(differencePercent) > CROSS_CHECK_LIMIT_PERCENT) {
          ctx.flags.add('CROSS_CHECK_DIFFERENCE', `The solver's ampacity (${fmt(current, 4)} A) differs from the IEC 60287-style closed form (${fmt(cfCurrent, 4)} A) by ${fmt(differencePercent, 2)} %, more than ${CROSS_CHECK_LIMIT_PERCENT} %; the closed form takes the conductor as isothermal and its coverings as ideal cylinders, so a large difference means the heat path deserves a second look.`, { differencePercent });
        }
      }
    }
    const upper = fromModelCurrent(ctx, root.upperA);
    const result: AmpacityResult = {
      current,
      hotSpot: { temperature: point.result.hotSpot.temperature, position: point.result.hotSpot.position },
      iterations,
      solves: ctx.solves,
      conductorCurrentA: root.zero ? 0 : root.currentA / model.currentScale / deratingOf(ctx),
      governingLimit: point.limits.governing,
      acFactor,
      bracketA: [current, Number.isFinite(upper) ? upper : current],
      closedForm,
      profile: profileOf(model, point.result),
      flags: [],
    };
    if (root.zero) {
      result.zeroBecause = `at zero current the ${point.limits.governing.layer ?? point.limits.governing.source} is already at ${fmt(point.limits.temperatureC, 4)} °C, not below its ${fmt(point.limits.governing.temperatureC, 4)} °C limit`;
    }
    return result;
  }
}

/**
 * Ampacity of a candidate under given conditions (physics.md §7): the circuit current per phase
 * at which the hot spot (or any covering with a limit of its own) reaches its limit, to 0.1 A,
 * from below. Throws ElectricalInputError for bad input and SizingError when no honest answer
 * exists.
 */
export function ampacity(candidate: Candidate, conditions: Conditions): AmpacityResult {
  const flags = new FlagSet();
  const ctx = contextFor(candidate, conditions, 0, flags);
  const result = ampacityOf(ctx);
  result.flags = flags.list();
  return result;
}

// ───────────────────────────── Evaluate one candidate ─────────────────────────────

function designPoint(ctx: Context, amp: AmpacityResult): { point: SolvedPoint | null; acFactor: number; runawayCurrentA?: number } {
  const { cand, model, acFn, cond } = ctx;
  const modelCurrent = toModelCurrent(ctx, cond.designCurrentA);
  // Start R_ac/R_dc at the temperature the rise ∝ I² rule predicts from the ampacity, so that
  // one solve usually settles it.
  const limitC = amp.governingLimit.temperatureC;
  const share = amp.current > 0 ? Math.min(4, (cond.designCurrentA / amp.current) ** 2) : 1;
  const estimateC = model.referenceC + (limitC - model.referenceC) * share;
  let acFactor = acFn(Number.isFinite(estimateC) ? estimateC : limitC).factor;
  let point: SolvedPoint | null = null;
  for (let pass = 0; pass < 5; pass++) {
    const r = solve(ctx, modelCurrent, acFactor, 'fine');
    if (!r.converged) {
      if (r.runaway) return { point: null, acFactor, runawayCurrentA: r.runaway.current };
      throw new SizingError('SOLVER_NOT_CONVERGED', `the heat balance did not converge at the design current`);
    }
    point = { result: r, limits: readLimits(model, r, cand.contactLimit) };
    const next = acFn(point.limits.conductorC).factor;
    if (Math.abs(next - acFactor) <= AC_FACTOR_SETTLED * acFactor) break;
    acFactor = next;
  }
  return { point, acFactor };
}

function moneyString(d: Decimal | null): string | null {
  return d === null ? null : d.toFixed(2);
}

function evaluateInContext(ctx: Context, index: number): CandidateEvaluationOk {
  const { cand, cond, flags, model } = ctx;
  const amp = ampacityOf(ctx);
  const design = designPoint(ctx, amp);
  const limit = design.point?.limits.governing ?? amp.governingLimit;
  const phaseConductors = cond.phases === 3 ? 3 : 2;
  const designConductorA = cond.designCurrentA / cand.conductorsPerPhase; // real current in one conductor

  // ── Thermal result at the design current ──
  let hotSpotC: number | null = null;
  let governingTemperatureC: number | null = null;
  let marginK: number | null = null;
  let marginPercent: number | null = null;
  let conductorC: number | null = null;
  let resistanceOhmPerM: number | null = null;
  let lossPerConductorWPerM: number | null = null;
  if (design.point) {
    const { result, limits } = design.point;
    hotSpotC = result.hotSpot.temperature;
    governingTemperatureC = limits.temperatureC;
    marginK = -limits.excessK;
    const allowed = limits.governing.temperatureC - model.referenceC;
    marginPercent = allowed > 0 ? (100 * marginK) / allowed : marginK >= 0 ? 0 : -100;
    conductorC = limits.conductorC;
    resistanceOhmPerM = resistanceAt({ r20: cand.r20, alpha20: cand.alpha20, temperature: limits.conductorC }) * design.acFactor;
    lossPerConductorWPerM = designConductorA * designConductorA * resistanceOhmPerM;

    if (limits.excessK > 0) {
      flags.add('OVER_LIMIT', `At ${fmt(cond.designCurrentA, 4)} A the ${limits.governing.layer ?? limits.governing.source} limit of ${fmt(limits.governing.temperatureC, 4)} °C is exceeded: ${fmt(limits.temperatureC, 4)} °C.`, { temperatureC: limits.temperatureC, limitC: limits.governing.temperatureC });
    } else if (marginPercent < 10) {
      flags.add('MARGIN_UNDER_10', `The margin is ${fmt(marginK, 3)} K, ${fmt(marginPercent, 2)} % of the allowed rise of ${fmt(allowed, 3)} K — under 10 %, so errors in the inputs could take it over the limit.`, { marginK, marginPercent });
    }
    // Near runaway: the solver's exact onset when the surroundings are linear, else the
    // constant-R_th estimate (I/I_r)² = α·Δθ_Joule/(1 + α(θ − 20)) (references.md closed form),
    // which is cautious because natural convection and radiation improve as the surface warms.
    let ratio: number | undefined;
    const modelDesign = toModelCurrent(ctx, cond.designCurrentA);
    if (result.runawayOnsetCurrentA !== undefined && result.runawayOnsetCurrentA > 0) {
      ratio = modelDesign / result.runawayOnsetCurrentA;
    } else {
      const w = heatPerMetre(model, result);
      const sun = model.faces.reduce((s, f) => s + f.absorbedFlux * f.exchangeAreaPerM, 0);
      const rise = limits.conductorC - model.referenceC;
      const jouleRise = w + sun > 0 ? (rise * w) / (w + sun) : 0;
      const r2 = (cand.alpha20 * jouleRise) / (1 + cand.alpha20 * (limits.conductorC - 20));
      ratio = r2 > 0 ? Math.sqrt(r2) : 0;
    }
    if (ratio >= NEAR_RUNAWAY_RATIO) {
      flags.add('NEAR_RUNAWAY', `The design current is ${fmt(100 * ratio, 3)} % of the current at which no steady state exists; the rise of resistance with temperature has at least doubled the heating, so small changes in the inputs move the temperature a lot.`, { ratio });
    }
    correlationFlags(result, flags, 'at the design current');
    // (The solver reports `converged` only once its energy balance closes to 1e-6, physics.md §1,
    // so a converged result needs no further residual check here.)
    if (cond.placement === 'buried' && result.surfaceTemperature > SOIL_DRYING_SURFACE_C) {
      flags.add('SOIL_DRYING_RISK', `The cable surface reaches ${fmt(result.surfaceTemperature, 3)} °C; above about ${SOIL_DRYING_SURFACE_C} °C moist soil can dry out and its thermal resistivity rise (IEC 60287 two-zone practice, from memory), which is not modelled.`, { surfaceC: result.surfaceTemperature });
    }
  } else {
    flags.add('RUNAWAY', `At ${fmt(cond.designCurrentA, 4)} A there is no steady state: the conductor heats without bound${design.runawayCurrentA !== undefined ? ` (onset near ${fmt(fromModelCurrent(ctx, design.runawayCurrentA), 4)} A)` : ''}.`);
  }

  // ── Voltage drop (IEC 60364-5-52 Annex G) ──
  const dc = cond.frequencyHz === 0;
  if (!dc && cond.reactanceOhmPerM === undefined && cand.kind === 'cable') {
    flags.add('REACTANCE_ASSUMED', 'The voltage drop uses the Annex G default reactance of 0.08 mΩ/m per run.');
  }
  const reactance = dc ? 0 : cond.reactanceOhmPerM ?? ANNEX_G_DEFAULT_REACTANCE_OHM_PER_M / cand.parallel;
  const vd = voltageDrop({
    phases: cond.phases,
    current: cond.designCurrentA,
    length: cond.lengthM,
    section: cand.sectionPerPhaseMm2,
    material: cand.material,
    powerFactor: dc ? 1 : cond.powerFactor,
    reactance,
    nominalVoltage: cond.nominalVoltageV,
  });
  if (cond.maxVoltageDropPercent !== undefined && vd.percent > cond.maxVoltageDropPercent) {
    flags.add('VOLTAGE_DROP_EXCEEDED', `The voltage drop is ${fmt(vd.percent, 3)} % of U₀, above the allowed ${fmt(cond.maxVoltageDropPercent, 3)} %.`, { percent: vd.percent });
  }

  // ── Short circuit (IEC 60949 adiabatic) ──
  const shortCircuit = shortCircuitOf(ctx, hotSpotC);

  // ── Mass, costs, losses over the life ──
  const loadedConductors = cand.kind === 'cable' && cand.cores > 1 ? cand.loadedCores * cand.parallel : phaseConductors * cand.conductorsPerPhase;
  const conductorsInstalled = cand.kind === 'cable' && cand.cores > 1 ? cand.cores * cand.parallel : phaseConductors * cand.conductorsPerPhase;
  const density = cand.source.costs?.densityKgPerM3 ?? cand.constants.densityKgPerM3;
  const massKg = conductorMass({ sectionMm2: cand.sectionPerConductorMm2, lengthM: cond.lengthM, densityKgPerM3: density, conductors: conductorsInstalled });
  let materialCost: Decimal | null = null;
  const costs = cand.source.costs;
  if (costs?.pricePerM !== undefined) {
    const runs = cand.kind === 'cable' && cand.cores > 1 ? cand.parallel : conductorsInstalled;
    materialCost = new Money(costs.pricePerM as never).mul(cond.lengthM).mul(runs);
  } else if (costs?.conductorPricePerKg !== undefined) {
    materialCost = new Money(massKg).mul(new Money(costs.conductorPricePerKg as never));
  }
  const lossWPerM = lossPerConductorWPerM === null ? null : lossPerConductorWPerM * loadedConductors;
  let lossCost: Decimal | null = null;
  if (cond.economics && lossWPerM !== null) {
    lossCost = lossEnergyCost({ ...cond.economics, peakLossW: lossWPerM * cond.lengthM }).presentValue;
  }
  const lifeCycle = materialCost !== null && lossCost !== null ? materialCost.add(lossCost) : null;

  const ampacityA = amp.current;
  const list = flags.list();
  amp.flags = list;
  return {
    ok: true,
    index,
    id: cand.id,
    label: cand.label,
    kind: cand.kind,
    passes: !list.some((f) => f.severity === 'blocker'),
    designCurrentA: cond.designCurrentA,
    conductorCurrentA: designConductorA,
    ambientC: model.referenceC,
    hotSpotC,
    governingTemperatureC,
    limit,
    marginK,
    marginPercent,
    ampacityA,
    utilisation: ampacityA > 0 ? cond.designCurrentA / ampacityA : cond.designCurrentA > 0 ? Number.MAX_VALUE : 0,
    acFactor: design.acFactor,
    conductorC,
    resistanceOhmPerM,
    lossPerConductorWPerM,
    lossWPerM,
    loadedConductors,
    conductorsInstalled,
    sectionPerPhaseMm2: cand.sectionPerPhaseMm2,
    voltageDrop: cond.maxVoltageDropPercent === undefined ? vd : { ...vd, limitPercent: cond.maxVoltageDropPercent },
    shortCircuit,
    massKg,
    materialCost: moneyString(materialCost),
    lossCostPresentValue: moneyString(lossCost),
    lifeCycleCost: moneyString(lifeCycle),
    ampacity: amp,
    profile: design.point ? profileOf(model, design.point.result) : null,
    flags: list,
    solves: ctx.solves,
  };
}

function shortCircuitOf(ctx: Context, hotSpotC: number | null): ShortCircuitCheck {
  const { cand, cond, flags } = ctx;
  const fault = cond.fault;
  if (!fault) return { checked: false, reason: 'no fault current and duration entered' };
  const scLimit = cand.shortCircuitLimitC;
  if (scLimit === undefined) {
    flags.add('SHORT_CIRCUIT_NOT_CHECKED', `No short-circuit temperature limit is known for ${cand.kind === 'cable' ? 'the insulation' : 'the bar, its coating or supports'}, so the fault withstand was not checked.`);
    return { checked: false, reason: 'no short-circuit temperature limit for the covering', currentA: fault.currentA, durationS: fault.durationS };
  }
  const initialC = fault.initialFrom === 'operating' && hotSpotC !== null ? hotSpotC : cand.contactLimit.temperatureC;
  const perConductorA = fault.currentA / cand.conductorsPerPhase;
  const finalRaw = shortCircuitFinalTemperature({
    material: cand.material,
    current: perConductorA,
    duration: fault.durationS,
    section: cand.sectionPerConductorMm2,
    initial: initialC,
  });
  const finalC = Number.isFinite(finalRaw) ? finalRaw : null;
  const withstands = finalC !== null && finalC <= scLimit;
  const check: ShortCircuitCheck = {
    checked: true,
    currentA: fault.currentA,
    durationS: fault.durationS,
    initialC,
    finalC,
    limitC: scLimit,
    sectionPerPhaseMm2: cand.sectionPerPhaseMm2,
    withstands,
  };
  if (scLimit > initialC) {
    const kFactor = adiabaticK({ material: cand.material, initial: initialC, final: scLimit });
    const minimumMm2 = minimumSection({ material: cand.material, current: fault.currentA, duration: fault.durationS, initial: initialC, final: scLimit });
    // A limit a hair above the starting temperature leaves k ≈ 0 and no finite section: say so
    // in the flag instead of reporting an infinite section.
    if (kFactor > 0 && Number.isFinite(minimumMm2)) {
      check.kFactor = kFactor;
      check.minimumSectionMm2 = minimumMm2;
    }
  }
  if (!withstands) {
    flags.add('SHORT_CIRCUIT_EXCEEDED', `A fault of ${fmt(fault.currentA, 4)} A for ${fmt(fault.durationS, 3)} s heats the conductor from ${fmt(initialC, 4)} °C to ${finalC === null ? 'beyond any meaningful temperature' : `${fmt(finalC, 4)} °C`}, above the ${fmt(scLimit, 4)} °C short-circuit limit${check.minimumSectionMm2 !== undefined ? `; at least ${fmt(check.minimumSectionMm2, 4)} mm² per phase is needed` : `; the limit leaves no room for fault heating above ${fmt(initialC, 4)} °C, so no section suffices`}.`, { finalC: finalC ?? Number.MAX_VALUE, limitC: scLimit });
  }
  return check;
}

function errorResult(candidate: Candidate, index: number, e: unknown): CandidateEvaluation {
  const id = (candidate && typeof candidate === 'object' && typeof candidate.id === 'string' && candidate.id) || `candidate-${index + 1}`;
  const label = (candidate && typeof candidate === 'object' && typeof candidate.label === 'string' && candidate.label) || id;
  if (e instanceof ElectricalInputError) return { ok: false, index, id, label, error: { code: 'INVALID_INPUT', message: e.message, field: e.field } };
  if (e instanceof SizingError) return { ok: false, index, id, label, error: { code: e.code, message: e.message } };
  const message = e instanceof Error ? e.message : String(e);
  const field = e && typeof e === 'object' && 'field' in e ? String((e as { field: unknown }).field) : undefined;
  return { ok: false, index, id, label, error: field ? { code: 'INVALID_INPUT', message, field } : { code: 'EVALUATION_FAILED', message } };
}

/**
 * Evaluates one candidate at the design current. Never throws for a bad candidate or bad
 * conditions: it returns `{ ok: false, error }` saying why (with the field when one is to blame).
 */
export function evaluateCandidate(candidate: Candidate, conditions: Conditions, options: { index?: number } = {}): CandidateEvaluation {
  const index = options.index ?? 0;
  try {
    const flags = new FlagSet();
    const ctx = contextFor(candidate, conditions, index, flags);
    return evaluateInContext(ctx, index);
  } catch (e) {
    return errorResult(candidate, index, e);
  }
}

/**
 * Evaluates every candidate and marks the smallest passing one (least conductor section per
 * phase, then least mass) and the passing one with the lowest life-cycle cost (material plus the
 * present value of losses; only candidates whose cost is known). Bad conditions throw an
 * ElectricalInputError naming the field, since no candidate could be evaluated under them.
 */
export function compareCandidates(candidates: Candidate[], conditions: Conditions): Comparison {
  if (!Array.isArray(candidates)) throw new ElectricalInputError('candidates', 'must be a list');
  prepareConditions(conditions); // throws for bad conditions, before any work
  const evaluations = candidates.map((c, i) => evaluateCandidate(c, conditions, { index: i }));
  const passing = evaluations.filter((e): e is CandidateEvaluationOk => e.ok && e.passes);
  let smallest: CandidateEvaluationOk | null = null;
  for (const e of passing) {
    if (
      smallest === null ||
      e.sectionPerPhaseMm2 < smallest.sectionPerPhaseMm2 ||
      (e.sectionPerPhaseMm2 === smallest.sectionPerPhaseMm2 && e.massKg < smallest.massKg)
    ) smallest = e;
  }
  let cheapest: CandidateEvaluationOk | null = null;
  for (const e of passing) {
    if (e.lifeCycleCost === null) continue;
    if (cheapest === null || new Money(e.lifeCycleCost).lt(new Money(cheapest.lifeCycleCost as string))) cheapest = e;
  }
  for (const e of evaluations) {
    if (!e.ok) continue;
    e.isSmallestPassing = e === smallest;
    e.isLowestLifeCycleCostPassing = e === cheapest;
  }
  return {
    evaluations,
    smallestPassingIndex: smallest ? smallest.index : null,
    lowestLifeCycleCostPassingIndex: cheapest ? cheapest.index : null,
  };
}

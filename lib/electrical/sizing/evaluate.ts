/**
 * Sizing as a pipeline of named checks (physics.md §5): prepare the conditions once per
 * comparison, then for each candidate
 *   prepare → ampacity → design point → voltage drop → short circuit → costs,
 * each check a function in ./checks. The heat balance comes from `lib/thermal` (physics.md §7);
 * this module only decides what to solve and reads the answers honestly.
 */
import { ElectricalInputError, SizingError } from '../errors';
import { Money } from '../economics';
import { dcResistance } from '../resistance';
import { ampacityCheck, AMPACITY_TOLERANCE_A, CROSS_CHECK_LIMIT_PERCENT } from './checks/ampacity';
import { costsCheck } from './checks/costs';
import { designPointCheck, NEAR_RUNAWAY_RATIO, SOIL_DRYING_SURFACE_C, solveAtCircuitCurrent, thermalAtDesign } from './checks/designPoint';
import { forcesCheck } from './checks/forces';
import { harmonicsCheck, protectionCheck } from './checks/protection';
import { packAmpacityCheck, packAt, packThermalAtDesign } from './checks/pack';
import { shortCircuitCheck } from './checks/shortCircuit';
import { voltageDropCheck } from './checks/voltageDrop';
import { sizingContext, type SizingContext } from './context';
import { FlagSet } from './flags';
import { groupResultOf } from './cableGroup';
import type { GroupSteadyResult } from './groupSolve';
import { heatPerMetre, profileOf } from './model';
import { prepareConditions } from './prepareConditions';
import type { PreparedConditions } from './prepared';
import type { AmpacityResult, Candidate, CandidateEvaluation, CandidateEvaluationOk, Comparison, Conditions } from './types';

export { AMPACITY_TOLERANCE_A, CROSS_CHECK_LIMIT_PERCENT, NEAR_RUNAWAY_RATIO, SOIL_DRYING_SURFACE_C };

/**
 * Ampacity of a candidate under given conditions (physics.md §7): the circuit current per phase
 * at which the hot spot (or any covering with a limit of its own) reaches its limit, to 0.1 A,
 * from below. Throws ElectricalInputError for bad input and SizingError when no honest answer
 * exists.
 */
export function ampacity(candidate: Candidate, conditions: Conditions): AmpacityResult {
  const ctx = sizingContext(candidate, prepareConditions(conditions), 0);
  // The same model as the sheet's: a pack is rated as a system, never as n × one bar.
  const result = ctx.busbar?.pack ? packAmpacityCheck(ctx, ctx.busbar) : ampacityCheck(ctx);
  result.flags = ctx.flags.list();
  return result;
}

/** A candidate evaluated, with the context it was evaluated in (for further solves at other currents). */
export interface EvaluatedCandidate {
  evaluation: CandidateEvaluationOk;
  context: SizingContext;
}

/** The thermal checks of a bus-bar pack (system model) or of one conductor (finite-volume model). */
function thermalChecks(ctx: SizingContext) {
  if (ctx.busbar?.pack) {
    const amp = packAmpacityCheck(ctx, ctx.busbar);
    const at = packThermalAtDesign(ctx, ctx.busbar, amp);
    return { amp, thermal: at.thermal, acFactor: at.pack?.acFactor ?? amp.acFactor, profile: at.profile, pack: at.pack, point: null };
  }
  const amp = ampacityCheck(ctx);
  const design = designPointCheck(ctx, amp);
  const thermal = thermalAtDesign(ctx, design, amp);
  return { amp, thermal, acFactor: design.acFactor, profile: design.point ? profileOf(ctx.model, design.point.result) : null, pack: null, point: design.point };
}

function runChecks(ctx: SizingContext): CandidateEvaluationOk {
  const { cand, cond, flags, model } = ctx;
  const { amp, thermal, acFactor, profile, pack, point } = thermalChecks(ctx);
  const design = { point };
  const voltageDrop = voltageDropCheck(ctx);
  const shortCircuit = shortCircuitCheck(ctx, thermal.hotSpotC);
  const forces = forcesCheck(ctx);
  const protection = protectionCheck(ctx, amp.current, thermal.conductorC);
  const harmonics = harmonicsCheck(ctx, amp.current);
  const costs = costsCheck(ctx, thermal.lossPerConductorWPerM);

  const list = flags.list();
  amp.flags = list;
  const ampacityA = amp.current;
  const solved = design.point?.result as GroupSteadyResult | undefined;
  const group = ctx.group
    ? groupResultOf(
        ctx.group,
        solved?.group,
        design.point && thermal.lossPerConductorWPerM !== null ? { conductorC: design.point.limits.conductorC, surfaceC: design.point.result.surfaceTemperature, heatWPerM: heatPerMetre(model, design.point.result) } : null,
      )
    : undefined;
  return {
    ok: true,
    index: cand.index,
    id: cand.id,
    label: cand.label,
    kind: cand.kind,
    passes: !list.some((f) => f.severity === 'blocker'),
    designCurrentA: cond.designCurrentA,
    conductorCurrentA: cond.designCurrentA / cand.conductorsPerPhase,
    ambientC: model.referenceC,
    hotSpotC: thermal.hotSpotC,
    governingTemperatureC: thermal.governingTemperatureC,
    limit: thermal.limit,
    marginK: thermal.marginK,
    marginPercent: thermal.marginPercent,
    ampacityA,
    utilisation: ampacityA > 0 ? cond.designCurrentA / ampacityA : cond.designCurrentA > 0 ? Number.MAX_VALUE : 0,
    acFactor,
    conductorC: thermal.conductorC,
    resistanceOhmPerM: thermal.resistanceOhmPerM,
    lossPerConductorWPerM: thermal.lossPerConductorWPerM,
    lossWPerM: costs.lossWPerM,
    loadedConductors: costs.loadedConductors,
    conductorsInstalled: costs.conductorsInstalled,
    sectionPerPhaseMm2: cand.sectionPerPhaseMm2,
    runsPerPhase: cand.kind === 'bar' ? cand.barsPerPhase * cand.parallel : cand.parallel,
    voltageDrop,
    shortCircuit,
    massKg: costs.massKg,
    materialCost: costs.materialCost,
    lossCostPresentValue: costs.lossCostPresentValue,
    lifeCycleCost: costs.lifeCycleCost,
    ampacity: amp,
    profile,
    ...(group ? { group } : {}),
    ...(pack ? { pack } : {}),
    ...(forces ? { forces } : {}),
    ...(protection ? { protection } : {}),
    ...(harmonics ? { harmonics } : {}),
    flags: list,
    solves: ctx.solves,
  };
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

/** Evaluates one candidate under conditions already prepared; keeps the context for later solves. */
export function evaluatePrepared(candidate: Candidate, cond: PreparedConditions, index: number): { evaluation: CandidateEvaluation; context?: SizingContext } {
  try {
    const context = sizingContext(candidate, cond, index, new FlagSet());
    return { evaluation: runChecks(context), context };
  } catch (e) {
    return { evaluation: errorResult(candidate, index, e) };
  }
}

/**
 * Evaluates one candidate at the design current. Never throws for a bad candidate or bad
 * conditions: it returns `{ ok: false, error }` saying why (with the field when one is to blame).
 */
export function evaluateCandidate(candidate: Candidate, conditions: Conditions, options: { index?: number } = {}): CandidateEvaluation {
  const index = options.index ?? 0;
  let cond: PreparedConditions;
  try {
    cond = prepareConditions(conditions);
  } catch (e) {
    return errorResult(candidate, index, e);
  }
  return evaluatePrepared(candidate, cond, index).evaluation;
}

/**
 * Hot spot of an evaluated candidate at another circuit current, from the same prepared model
 * (no re-validation, no new ampacity search), on the search mesh: its coverings carry no source,
 * so their log/linear conductances are exact at any cell count and only the conductor's own small
 * parabola is discretised (the ampacity search relies on the same mesh). Null past runaway.
 */
export function hotSpotAtCurrent(ctx: SizingContext, evaluation: CandidateEvaluationOk, circuitA: number): number | null {
  if (ctx.busbar?.pack) return packAt(ctx, ctx.busbar, circuitA)?.state.heat.hottestC ?? null;
  const limitC = evaluation.limit.temperatureC;
  const share = evaluation.ampacityA > 0 ? Math.min(4, (circuitA / evaluation.ampacityA) ** 2) : 1;
  const startC = ctx.model.referenceC + (limitC - ctx.model.referenceC) * share;
  const solved = solveAtCircuitCurrent(ctx, circuitA, Number.isFinite(startC) ? startC : limitC, 'coarse');
  return solved.point ? solved.point.result.hotSpot.temperature : null;
}

/**
 * The hot spot and the circuit's loss per metre at the design current only — no ampacity search —
 * for checks that iterate on the surroundings (the air inside an enclosure). Throws
 * ElectricalInputError for bad input; `hotSpotC` null on runaway.
 */
export function designPointOnly(candidate: Candidate, conditions: Conditions): { hotSpotC: number | null; lossWPerM: number | null; limitC: number } {
  const ctx = sizingContext(candidate, prepareConditions(conditions), 0);
  const limitC = ctx.cand.contactLimit.temperatureC;
  if (ctx.busbar?.pack) {
    const at = packAt(ctx, ctx.busbar, ctx.cond.designCurrentA);
    if (!at) return { hotSpotC: null, lossWPerM: null, limitC };
    const derating = ctx.cond.groupingFactor * ctx.cond.enclosureFactor;
    const total = at.state.distribution.totalLossWPerM * derating * derating * ctx.cand.parallel;
    return { hotSpotC: at.state.heat.hottestC, lossWPerM: total, limitC };
  }
  const design = solveAtCircuitCurrent(ctx, ctx.cond.designCurrentA, limitC);
  if (!design.point) return { hotSpotC: null, lossWPerM: null, limitC };
  const { limits, result } = design.point;
  const conductorA = ctx.cond.designCurrentA / ctx.cand.conductorsPerPhase;
  const lossPerConductor = conductorA * conductorA * dcResistance(ctx.cand.r20, ctx.cand.alpha20, limits.conductorC) * design.acFactor;
  return { hotSpotC: result.hotSpot.temperature, lossWPerM: costsCheck(ctx, lossPerConductor).lossWPerM, limitC };
}

/**
 * The order in which passing sizes are preferred: fewer runs per phase first (parallel cables or
 * bars per phase cost joints, terminations and the risk of unequal sharing: common practice), then
 * the least conductor section per phase, then the least mass.
 */
export function preferredSizeOrder(a: Pick<CandidateEvaluationOk, 'runsPerPhase' | 'sectionPerPhaseMm2' | 'massKg'>, b: typeof a): number {
  return a.runsPerPhase - b.runsPerPhase || a.sectionPerPhaseMm2 - b.sectionPerPhaseMm2 || a.massKg - b.massKg;
}

/** Marks the preferred passing candidate (preferredSizeOrder) and the lowest life-cycle-cost passing one. */
export function markWinners(evaluations: CandidateEvaluation[]): Comparison {
  const passing = evaluations.filter((e): e is CandidateEvaluationOk => e.ok && e.passes);
  let smallest: CandidateEvaluationOk | null = null;
  for (const e of passing) if (smallest === null || preferredSizeOrder(e, smallest) < 0) smallest = e;
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

/** A comparison with the context of each candidate that could be evaluated (index → context). */
export interface PreparedComparison {
  comparison: Comparison;
  contexts: Map<number, SizingContext>;
}

/**
 * Evaluates every candidate and marks the smallest passing one (least conductor section per
 * phase, then least mass) and the passing one with the lowest life-cycle cost (material plus the
 * present value of losses; only candidates whose cost is known). Bad conditions throw an
 * ElectricalInputError naming the field, since no candidate could be evaluated under them.
 * The conditions are prepared once for all candidates.
 */
export function compareCandidatesPrepared(candidates: Candidate[], conditions: Conditions): PreparedComparison {
  if (!Array.isArray(candidates)) throw new ElectricalInputError('candidates', 'must be a list');
  const cond = prepareConditions(conditions); // throws for bad conditions, before any work
  const contexts = new Map<number, SizingContext>();
  const evaluations = candidates.map((c, i) => {
    const { evaluation, context } = evaluatePrepared(c, cond, i);
    if (context && evaluation.ok) contexts.set(i, context);
    return evaluation;
  });
  return { comparison: markWinners(evaluations), contexts };
}

export function compareCandidates(candidates: Candidate[], conditions: Conditions): Comparison {
  return compareCandidatesPrepared(candidates, conditions).comparison;
}

/**
 * One computation of a sizing sheet with the sizing library — the same function in the browser
 * (live result while typing) and on the server (the snapshot stored on save).
 */
import { compareCandidatesPrepared, hotSpotAtCurrent } from '../electrical/sizing/evaluate';
import { rateInsideEnclosure } from '../electrical/sizing/enclosureAir';
import { enclosureAirInputsOf } from './enclosureAir';
import type { SizingContext } from '../electrical/sizing/context';
import type { AssumptionFlag } from '../electrical/sizing/flags';
import type { CandidateEvaluationOk, Comparison } from '../electrical/sizing/types';
import type { SheetInputs } from './schema';
import { toCandidates, toConditions } from './toSizing';

// Re-exported: the sheet and the schedules stamp their results with it.
export { SOLVER_VERSION } from '../electrical/version';

export type SheetComputation =
  | { ok: true; comparison: Comparison }
  | { ok: false; error: { message: string; field?: string } };

function errorOf(error: unknown): { message: string; field?: string } {
  const message = error instanceof Error ? error.message : String(error);
  const field = error && typeof error === 'object' && 'field' in error ? String((error as { field: unknown }).field) : undefined;
  return field ? { message, field } : { message };
}

export function computeSheet(inputs: SheetInputs): SheetComputation {
  return computeSheetWithCurves(inputs, false).computation;
}

export interface CurvePoint {
  currentA: number;
  hotSpotC: number | null;
}
export interface HotSpotCurve {
  candidateId: string;
  label: string;
  ampacityA: number;
  points: CurvePoint[];
}

/**
 * Hot spot versus current for the plot: the candidate solved at fractions of its ampacity (and at
 * the design current) on the model prepared for its evaluation — no new ampacity search — so the
 * curve always shows where the limit is reached. A point past runaway has hotSpotC null and ends
 * the curve.
 */
function hotSpotCurveOf(context: SizingContext, evaluation: CandidateEvaluationOk, designCurrentA: number, steps = 8): HotSpotCurve {
  const curve: HotSpotCurve = { candidateId: evaluation.id, label: evaluation.label, ampacityA: evaluation.ampacityA, points: [] };
  if (!(evaluation.ampacityA > 0)) return curve;
  const top = Math.max(evaluation.ampacityA * 1.15, designCurrentA * 1.1);
  const currents = new Set<number>();
  for (let i = 1; i <= steps; i += 1) currents.add(Math.round((top * i) / steps));
  currents.add(Math.round(evaluation.ampacityA));
  currents.add(designCurrentA);
  for (const currentA of [...currents].sort((a, b) => a - b)) {
    let hotSpotC: number | null;
    try {
      hotSpotC = hotSpotAtCurrent(context, evaluation, currentA);
    } catch {
      break; // the solver gave no honest answer at this current: the curve ends here
    }
    curve.points.push({ currentA, hotSpotC });
    if (hotSpotC === null) break;
  }
  return curve;
}

/**
 * The sheet's comparison and, when asked, the hot-spot curve of every candidate that could be
 * evaluated — one computation for the browser (live result) and the server (snapshot).
 */
export function computeSheetWithCurves(inputs: SheetInputs, withCurves: boolean, onlyCandidateId?: string): { computation: SheetComputation; curves: HotSpotCurve[] } {
  let prepared: ReturnType<typeof compareCandidatesPrepared>;
  try {
    const candidates = toCandidates(inputs);
    const conditions = toConditions(inputs);
    prepared = compareCandidatesPrepared(candidates, conditions);
    // With the enclosure check on, the headline is rated in the air inside it, not in the room.
    const enclosure = enclosureAirInputsOf(inputs);
    if (enclosure) prepared = rateInsideEnclosure(prepared, candidates, conditions, enclosure);
  } catch (error) {
    return { computation: { ok: false, error: errorOf(error) }, curves: [] };
  }
  const curves: HotSpotCurve[] = [];
  if (withCurves) {
    for (const e of prepared.comparison.evaluations) {
      const context = e.ok ? prepared.contexts.get(e.index) : undefined;
      if (onlyCandidateId !== undefined && e.id !== onlyCandidateId) continue;
      if (e.ok && context) curves.push(hotSpotCurveOf(context, e, inputs.circuit.designCurrentA));
    }
  }
  return { computation: { ok: true, comparison: prepared.comparison }, curves };
}

/** The flags of one evaluation grouped by severity, blockers first. */
export function flagsBySeverity(flags: AssumptionFlag[]) {
  return {
    blocker: flags.filter((f) => f.severity === 'blocker'),
    review: flags.filter((f) => f.severity === 'review'),
    note: flags.filter((f) => f.severity === 'note'),
  };
}

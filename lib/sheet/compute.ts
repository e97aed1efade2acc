/**
 * One computation of a sizing sheet with the sizing library — the same function in the browser
 * (live result while typing) and on the server (the snapshot stored on save).
 */
import { compareCandidates, evaluateCandidate } from '../electrical/sizing/evaluate';
import type { AssumptionFlag } from '../electrical/sizing/flags';
import type { CandidateEvaluation, CandidateEvaluationOk, Comparison } from '../electrical/sizing/types';
import type { SheetInputs } from './schema';
import { toCandidates, toConditions } from './toSizing';

// Re-exported: the sheet and the schedules stamp their results with it.
export { SOLVER_VERSION } from '../electrical/version';

export type SheetComputation =
  | { ok: true; comparison: Comparison }
  | { ok: false; error: { message: string; field?: string } };

export function computeSheet(inputs: SheetInputs): SheetComputation {
  try {
    return { ok: true, comparison: compareCandidates(toCandidates(inputs), toConditions(inputs)) };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const field = error && typeof error === 'object' && 'field' in error ? String((error as { field: unknown }).field) : undefined;
    return { ok: false, error: field ? { message, field } : { message } };
  }
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
 * Hot spot versus current for the plot: the candidate evaluated at fractions of its ampacity
 * (and at the design current), so the curve always shows where the limit is reached. A point
 * past runaway has hotSpotC null and ends the curve.
 */
export function hotSpotCurve(inputs: SheetInputs, evaluation: CandidateEvaluationOk, steps = 8): HotSpotCurve {
  const candidate = inputs.candidates.find((c) => c.id === evaluation.id);
  const curve: HotSpotCurve = { candidateId: evaluation.id, label: evaluation.label, ampacityA: evaluation.ampacityA, points: [] };
  if (!candidate || !(evaluation.ampacityA > 0)) return curve;
  const top = Math.max(evaluation.ampacityA * 1.15, inputs.circuit.designCurrentA * 1.1);
  const currents = new Set<number>();
  for (let i = 1; i <= steps; i += 1) currents.add(Math.round((top * i) / steps));
  currents.add(Math.round(evaluation.ampacityA));
  currents.add(inputs.circuit.designCurrentA);
  for (const currentA of [...currents].sort((a, b) => a - b)) {
    const result: CandidateEvaluation = evaluateCandidate(candidate, toConditions(inputs, currentA));
    if (!result.ok) break;
    curve.points.push({ currentA, hotSpotC: result.hotSpotC });
    if (result.hotSpotC === null) break;
  }
  return curve;
}

/** The flags of one evaluation grouped by severity, blockers first. */
export function flagsBySeverity(flags: AssumptionFlag[]) {
  return {
    blocker: flags.filter((f) => f.severity === 'blocker'),
    review: flags.filter((f) => f.severity === 'review'),
    note: flags.filter((f) => f.severity === 'note'),
  };
}

/**
 * The result snapshot stored with a saved sheet (`sheets.result`): computed on the server from the
 * saved inputs — never taken from the client — with the solver version that produced it. Review
 * decisions (which flags need acknowledging, whether a blocker stands) read this snapshot.
 */
import type { AssumptionFlag } from '../electrical/sizing/flags';
import type { CandidateEvaluation, CandidateEvaluationOk } from '../electrical/sizing/types';
import { SOLVER_VERSION } from '../electrical/version';
import { computeSheetWithCurves, type HotSpotCurve } from './compute';
import { acrossPackPlot, hotSpotCurvePlot, type PackagePlot } from './packagePlots';
import { savedFieldCheck, type FieldCheckOutcome } from './crossSectionField';
import { optionalChecksReport, type OptionalCheckReport } from './optionalChecksReport';
import type { SheetInputs } from './schema';
import type { ApprovalReadiness } from './stateMachine';

export const SNAPSHOT_VERSION = 1 as const;

export interface ResultSnapshot {
  snapshotVersion: typeof SNAPSHOT_VERSION;
  solverVersion: string;
  computedAt: string;
  designCurrentA: number;
  /** Set when the conditions themselves were invalid (no candidate could be evaluated). */
  error: { message: string; field?: string } | null;
  evaluations: CandidateEvaluation[];
  smallestPassingId: string | null;
  lowestLifeCycleCostPassingId: string | null;
  chosenCandidateId: string | null;
  /**
   * The chosen candidate's flags: what the reviewer accepts or rejects — its steady evaluation's
   * and those of the optional checks switched on for it (over time, along the run, enclosure air).
   */
  chosenFlags: AssumptionFlag[];
  /** False when the chosen candidate fails its steady evaluation or an optional check. */
  chosenPasses: boolean | null;
  /** Optional checks switched on that could not be computed for the chosen candidate (absent in older snapshots). */
  optionalCheckFailures?: { check: string; message: string }[];
  /** The optional checks of the chosen candidate in words, as the PDF and the share link print them (absent in older snapshots). */
  optionalChecks?: OptionalCheckReport[];
  /**
   * The chosen candidate's cross-section solved in two dimensions, when the sheet's option is on
   * (lib/sheet/crossSectionField.ts, on the coarser mesh it names); absent when the option is off
   * and in snapshots older than the option.
   */
  crossSection?: FieldCheckOutcome;
  /**
   * The chosen candidate's plots for the calculation package: hot spot against current and, for a
   * bus-bar pack, each bar's temperature across the packs (absent in older snapshots; the checks
   * over time and along the run keep theirs in optionalChecks).
   */
  plots?: PackagePlot[];
}

/** The name of the two-dimensional cross-section among the optional checks (in the failures list). */
export const FIELD_CHECK_NAME = 'Cross-section in two dimensions';

/** The stored field result of the chosen candidate, or null (option off, or an older snapshot). */
export function savedCrossSection(snapshot: ResultSnapshot | null): FieldCheckOutcome | null {
  return snapshot?.crossSection ?? null;
}

/** The optional checks in words: from the snapshot when it has them, else computed from the saved inputs (older snapshots). */
export function savedOptionalChecks(snapshot: ResultSnapshot | null, inputs: SheetInputs): OptionalCheckReport[] {
  return snapshot?.optionalChecks ?? optionalChecksReport(inputs);
}

/** Flags and failures of the optional checks, from their reports. */
function optionalCheckOutcome(reports: OptionalCheckReport[]): { flags: AssumptionFlag[]; failures: { check: string; message: string }[] } {
  return {
    flags: reports.flatMap((r) => r.flags),
    failures: reports.filter((r) => r.notComputed !== undefined).map((r) => ({ check: r.check, message: r.notComputed! })),
  };
}

/** The stored size matters (one row per sheet): the ampacity search's profile duplicates the design one in shape, so it is dropped. */
function slim(evaluation: CandidateEvaluation): CandidateEvaluation {
  if (!evaluation.ok) return evaluation;
  const { profile: _dropped, ...ampacity } = evaluation.ampacity;
  return { ...evaluation, ampacity: { ...ampacity, profile: { geometry: _dropped.geometry, positionsM: [], temperaturesC: [], layers: _dropped.layers, hotSpot: _dropped.hotSpot } } };
}

function chosenPlots(chosen: CandidateEvaluationOk, curves: HotSpotCurve[]): PackagePlot[] {
  const curve = curves.find((c) => c.candidateId === chosen.id);
  return [curve ? hotSpotCurvePlot(curve, chosen) : null, acrossPackPlot(chosen)].filter((p): p is PackagePlot => p !== null);
}

export function buildSnapshot(inputs: SheetInputs, now = new Date()): ResultSnapshot {
  const chosenId = inputs.chosenCandidateId ?? undefined;
  const { computation, curves } = computeSheetWithCurves(inputs, chosenId !== undefined, chosenId);
  const evaluations = computation.ok ? computation.comparison.evaluations.map(slim) : [];
  const idAt = (index: number | null) => (index === null ? null : (evaluations[index]?.id ?? null));
  const chosen = evaluations.find((e) => e.id === inputs.chosenCandidateId) ?? null;
  const optionalChecks = optionalChecksReport(inputs);
  const optional = chosen && chosen.ok ? optionalCheckOutcome(optionalChecks) : { flags: [], failures: [] };
  const crossSection = chosen && chosen.ok ? savedFieldCheck(inputs) : undefined;
  if (crossSection) {
    if (crossSection.ok) optional.flags.push(...crossSection.report.reviewFlags);
    else optional.failures.push({ check: FIELD_CHECK_NAME, message: crossSection.message });
  }
  const chosenFlags = chosen && chosen.ok ? [...chosen.flags, ...optional.flags.filter((f) => !chosen.flags.some((c) => c.code === f.code))] : [];
  return {
    snapshotVersion: SNAPSHOT_VERSION,
    solverVersion: SOLVER_VERSION,
    computedAt: now.toISOString(),
    designCurrentA: inputs.circuit.designCurrentA,
    error: computation.ok ? null : computation.error,
    evaluations,
    smallestPassingId: computation.ok ? idAt(computation.comparison.smallestPassingIndex) : null,
    lowestLifeCycleCostPassingId: computation.ok ? idAt(computation.comparison.lowestLifeCycleCostPassingIndex) : null,
    chosenCandidateId: inputs.chosenCandidateId,
    chosenFlags,
    chosenPasses: chosen ? chosen.ok && chosen.passes && optional.failures.length === 0 && !optional.flags.some((f) => f.severity === 'blocker') : null,
    optionalCheckFailures: optional.failures,
    optionalChecks,
    ...(crossSection ? { crossSection } : {}),
    ...(chosen && chosen.ok ? { plots: chosenPlots(chosen, curves) } : {}),
  };
}

export function chosenEvaluation(snapshot: ResultSnapshot | null): CandidateEvaluationOk | null {
  if (!snapshot) return null;
  const chosen = snapshot.evaluations.find((e) => e.id === snapshot.chosenCandidateId);
  return chosen && chosen.ok ? chosen : null;
}

/**
 * What stands between the sheet and approval: blockers on the chosen candidate (a candidate that
 * failed to evaluate, or fails without a blocker flag, counts as a blocker too) and review flags
 * nobody has acknowledged.
 */
export function approvalReadiness(snapshot: ResultSnapshot | null, acknowledgedCodes: Iterable<string>): ApprovalReadiness {
  if (!snapshot || snapshot.chosenCandidateId === null) {
    return { hasChosenCandidate: false, blockerCodes: [], unacknowledgedReviewCodes: [] };
  }
  const chosen = snapshot.evaluations.find((e) => e.id === snapshot.chosenCandidateId);
  const blockerCodes: string[] = [];
  if (snapshot.error) blockerCodes.push('CONDITIONS_INVALID');
  else if (!chosen) blockerCodes.push('CHOSEN_CANDIDATE_MISSING');
  else if (!chosen.ok) blockerCodes.push('EVALUATION_FAILED');
  else {
    // chosenFlags holds the steady evaluation's flags and those of the optional checks.
    for (const flag of snapshot.chosenFlags) if (flag.severity === 'blocker') blockerCodes.push(flag.code);
    if ((snapshot.optionalCheckFailures ?? []).length > 0) blockerCodes.push('OPTIONAL_CHECK_NOT_COMPUTED');
    if (!chosen.passes && blockerCodes.length === 0) blockerCodes.push('CANDIDATE_FAILS');
  }
  const acknowledged = new Set(acknowledgedCodes);
  const unacknowledgedReviewCodes = snapshot.chosenFlags
    .filter((flag) => flag.severity === 'review' && !acknowledged.has(flag.code))
    .map((flag) => flag.code);
  return { hasChosenCandidate: true, blockerCodes, unacknowledgedReviewCodes };
}

/** A stored snapshot of an unknown future version is shown as "recompute needed", not misread. */
export function readSnapshot(raw: unknown): ResultSnapshot | null {
  if (!raw || typeof raw !== 'object') return null;
  const value = raw as Partial<ResultSnapshot>;
  if (value.snapshotVersion !== SNAPSHOT_VERSION || !Array.isArray(value.evaluations)) return null;
  return value as ResultSnapshot;
}

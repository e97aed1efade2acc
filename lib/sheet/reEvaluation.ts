/**
 * A saved sheet whose result snapshot an earlier solver made (before cable groups, solver 0.2.0:
 * every cable was rated alone) keeps that snapshot — review and approval read it as saved — but is
 * marked for re-evaluation, with the chosen candidate's figures computed now from the saved inputs
 * beside the saved ones. The sheet page, the share page and the PDF say it in the same words.
 *
 * A saved bus-bar result can come from the method since replaced (issue 18: a pack rated as that
 * many separate bars, a bar's AC factor as the plane-conductor lower bound) under the same solver
 * name: its flags say so (the retired codes MULTI_BAR_INNER_FACES, AC_FACTOR_LOWER_BOUND, which no
 * evaluation raises any more). Such a sheet is marked too — when the figure by the current method
 * differs from the saved one.
 * Pure TypeScript (browser and server).
 */
import { RETIRED_FLAG_CODES } from '../electrical/sizing/flags';
import type { CandidateEvaluationOk } from '../electrical/sizing/types';
import { SOLVER_VERSION } from '../electrical/version';
import { formatNumber } from '../units';
import { computeSheet } from './compute';
import type { SheetInputs } from './schema';
import { chosenEvaluation, type ResultSnapshot } from './snapshot';

export interface FiguresOfOneMethod {
  ampacityA: number;
  /** Null on runaway (no steady state at the design current). */
  hotSpotC: number | null;
}

export interface ReEvaluation {
  /** Why: an earlier solver made the result, or the chosen bars were rated by the method since replaced. */
  reason: 'earlier-solver' | 'replaced-bar-method';
  /** The saved result's retired flag codes that show the replaced bar method (empty otherwise). */
  replacedBarMethods: string[];
  /** The solver version that made the saved result. */
  savedSolverVersion: string;
  currentSolverVersion: string;
  /** The chosen candidate, when one is chosen. */
  chosenLabel: string | null;
  /** The saved figures of the chosen candidate (null when it had none). */
  saved: FiguresOfOneMethod | null;
  /** The same candidate now, from the saved inputs (null when nothing is chosen or it cannot be computed). */
  now: FiguresOfOneMethod | null;
  /** Why the figures of now are missing, in plain words. */
  nowMissing?: string;
}

/** The heading every view shows: plain words, no internal codes. */
export const RE_EVALUATION_HEADING = 'Saved with an earlier method — re-evaluate';

/** "0.1.0" from "ampwarden-sizing/0.1.0 (…)": the number people compare, without the module names. */
export function methodVersionNumber(solverVersion: string): string {
  return /\/(\d+(?:\.\d+)+)/.exec(solverVersion)?.[1] ?? /(\d+(?:\.\d+)+)/.exec(solverVersion)?.[1] ?? 'unknown';
}

/** Before 0.2.0 every cable was rated alone; before 0.3.0 bar packs and multi-core cables were approximated (lib/electrical/version.ts history). */
function earlierThan(solverVersion: string, minorWanted: number): boolean {
  const [major, minor] = methodVersionNumber(solverVersion).split('.').map(Number);
  return Number.isFinite(major) && Number.isFinite(minor) && (major < 0 || (major === 0 && minor < minorWanted));
}

/** What the replaced bar method did, in words, from the retired codes the saved result carries. */
function replacedBarWords(codes: readonly string[]): string {
  const parts: string[] = [];
  if (codes.includes('MULTI_BAR_INNER_FACES')) parts.push('rated a pack of bars per phase as that many separate bars sharing the current equally');
  if (codes.includes('AC_FACTOR_LOWER_BOUND')) parts.push('took a bar’s AC resistance as the plane-conductor lower bound');
  return parts.join(' and ');
}

/** The explanation under the heading. */
export function reEvaluationSentence(r: ReEvaluation): string {
  const keep = 'The saved result is kept as it was reviewed; open the sheet and save it again (a new revision if it is approved) to store a result by the current method.';
  const bars = replacedBarWords(r.replacedBarMethods);
  if (r.reason === 'replaced-bar-method') {
    return `This sheet’s saved result rated its bus bars by a method since replaced, which ${bars}; the bars are now rated as the system they form (each bar’s share of the current by the filament method, each bar’s own heat balance). ${keep}`;
  }
  const what = earlierThan(r.savedSolverVersion, 2)
    ? ', which rated each cable alone, not as the group it lies in'
    : bars
      ? `, which ${bars}`
      : earlierThan(r.savedSolverVersion, 3)
        ? ', which rated a pack of bars as separate bars and a multi-core cable as one round conductor'
        : '';
  return `This sheet’s saved result was computed by an earlier version of the method (version ${methodVersionNumber(r.savedSolverVersion)}; now ${methodVersionNumber(r.currentSolverVersion)})${what}. ${keep}`;
}

/** The retired codes a saved evaluation carries that show the replaced bar method. */
export function replacedBarMethodCodes(e: CandidateEvaluationOk | null): string[] {
  if (!e || e.kind !== 'bar') return [];
  const retired = new Set<string>(RETIRED_FLAG_CODES);
  return e.flags.map((f) => f.code).filter((code) => retired.has(code));
}

/** The same figures to the last digit a person reads (the solver is deterministic: unchanged inputs give the same numbers). */
function sameFigures(a: FiguresOfOneMethod | null, b: FiguresOfOneMethod | null): boolean {
  if (!a || !b) return false;
  const close = (x: number, y: number) => Math.abs(x - y) <= 1e-6 * Math.max(1, Math.abs(x), Math.abs(y));
  return close(a.ampacityA, b.ampacityA) && (a.hotSpotC === null ? b.hotSpotC === null : b.hotSpotC !== null && close(a.hotSpotC, b.hotSpotC));
}

const figures = (e: CandidateEvaluationOk): FiguresOfOneMethod => ({ ampacityA: e.ampacityA, hotSpotC: e.hotSpotC });

/**
 * Null when the snapshot is by the current solver (or there is none). Otherwise the mark, with the
 * chosen candidate computed now from the saved inputs (only that candidate: the rest of the sheet
 * is not recomputed here).
 */
export function reEvaluationOf(inputs: SheetInputs, snapshot: ResultSnapshot | null): ReEvaluation | null {
  if (!snapshot) return null;
  const savedChosen = chosenEvaluation(snapshot);
  const replacedBarMethods = replacedBarMethodCodes(savedChosen);
  const earlierSolver = snapshot.solverVersion !== SOLVER_VERSION;
  if (!earlierSolver && replacedBarMethods.length === 0) return null;
  const chosenId = inputs.chosenCandidateId ?? snapshot.chosenCandidateId;
  const candidate = inputs.candidates.find((c) => c.id === chosenId) ?? null;
  const base: ReEvaluation = {
    reason: earlierSolver ? 'earlier-solver' : 'replaced-bar-method',
    replacedBarMethods,
    savedSolverVersion: snapshot.solverVersion,
    currentSolverVersion: SOLVER_VERSION,
    chosenLabel: candidate?.label ?? savedChosen?.label ?? null,
    saved: savedChosen ? figures(savedChosen) : null,
    now: null,
  };
  if (!candidate) return { ...base, nowMissing: 'No candidate is chosen on this sheet.' };
  const computation = computeSheet({ ...inputs, candidates: [candidate], chosenCandidateId: candidate.id });
  if (!computation.ok) return { ...base, nowMissing: `The saved inputs cannot be computed by the current method: ${computation.error.message}` };
  const e = computation.comparison.evaluations[0];
  if (!e || !e.ok) return { ...base, nowMissing: `The chosen candidate cannot be computed by the current method: ${e && !e.ok ? e.error.message : 'no result'}` };
  const now = figures(e);
  // Rated by the replaced bar method under the current solver's name: marked only when the figure changes.
  if (!earlierSolver && sameFigures(base.saved, now)) return null;
  return { ...base, now };
}

/** "ampacity 512 A, hot spot 71.3 °C" (°C; a screen in other units converts before). */
export function figuresText(f: FiguresOfOneMethod | null, temperatureText: (c: number) => string = (c) => `${formatNumber(c, 4)} °C`): string {
  if (!f) return 'no figures';
  return `ampacity ${formatNumber(f.ampacityA, 4)} A, hot spot ${f.hotSpotC === null ? 'none (no steady state)' : temperatureText(f.hotSpotC)}`;
}

/** The two figures side by side, in one line: "Saved: …; by the current method: …". */
export function reEvaluationFiguresLine(r: ReEvaluation, temperatureText?: (c: number) => string): string {
  const who = r.chosenLabel ? ` (${r.chosenLabel})` : '';
  const now = r.now ? figuresText(r.now, temperatureText) : (r.nowMissing ?? 'not computed');
  return `Chosen candidate${who} — saved: ${figuresText(r.saved, temperatureText)}; by the current method, from the saved inputs: ${now}.`;
}

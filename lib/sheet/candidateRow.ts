/**
 * One candidate's result as people read it — the state in words, the figures of the comparison
 * and the marks — mapped once from the sizing library's evaluation. The candidate grid (on screen
 * and on a share link), the PDF and share tables, the candidate exports and the schedule results
 * all take their row from `candidateRow`, so they cannot say different things about one result.
 *
 * SI units and unrounded numbers, as the library gives them; a screen converts and rounds for its
 * user. Pure TypeScript (browser and server).
 */
import type { FlagSeverity } from '../electrical/sizing/flags';
import type { CandidateEvaluationOk, ShortCircuitCheck } from '../electrical/sizing/types';
import { formatNumber } from '../units';
import { governingCableOf, groupMethodWords } from './groupWords';
import { forcesVerdict, hottestBarText, largestSupportForceN, protectionVerdicts, type Verdict } from './systemWords';

/** The three result states of product.md (Visual identity); the screen adds icon and colour. */
export type ResultState = 'within' | 'tight' | 'over';

export const RESULT_WORDS: Readonly<Record<ResultState, string>> = {
  within: 'Within limit',
  tight: 'Margin under 10 %',
  over: 'Over limit',
};

/** The hot spot against its limit: runaway and over limit are 'over'; a margin under 10 % is 'tight'. */
export function thermalState(e: CandidateEvaluationOk): { state: ResultState; word: string } {
  if (e.hotSpotC === null) return { state: 'over', word: 'Runaway: no steady state' };
  if (e.marginK === null || e.marginK < 0) return { state: 'over', word: RESULT_WORDS.over };
  if (e.marginPercent !== null && e.marginPercent < 10) return { state: 'tight', word: RESULT_WORDS.tight };
  return { state: 'within', word: RESULT_WORDS.within };
}

/** Short words for the blocker flags of the checks beside the heat balance. */
const FAILURE_WORDS: Readonly<Record<string, string>> = {
  OVER_LIMIT: 'over limit',
  RUNAWAY: 'runaway',
  SHORT_CIRCUIT_EXCEEDED: 'short circuit',
  VOLTAGE_DROP_EXCEEDED: 'voltage drop',
  BUSBAR_NO_STEADY_STATE: 'runaway',
  BUSBAR_STRESS_EXCEEDED: 'bar stress under short circuit',
  BUSBAR_SUB_CONDUCTOR_STRESS_EXCEEDED: 'stress between the bars',
  BUSBAR_SUPPORT_FORCE_EXCEEDED: 'support force',
  PROTECTION_OVERLOAD_NOT_COORDINATED: 'overload protection',
  PROTECTION_DISCONNECTION_TOO_SLOW: 'disconnection time',
  PROTECTIVE_CONDUCTOR_TOO_SMALL: 'protective conductor',
  HARMONICS_OVER_RATING: 'harmonics',
};

/** What fails the candidate, from its blocker flags, in words ("short circuit", "voltage drop"…). */
export function failureReasons(e: CandidateEvaluationOk): string[] {
  return e.flags.filter((f) => f.severity === 'blocker').map((f) => FAILURE_WORDS[f.code] ?? f.title.toLowerCase());
}

/** "Fails: short circuit, voltage drop" from the blocker flags (the result strip's wording). */
export function failureWords(e: CandidateEvaluationOk): string {
  return `Fails: ${failureReasons(e).join(', ') || 'a check'}`;
}

/**
 * The state in words: the hot spot's state, and when the candidate fails, what fails it beyond the
 * hot spot ("Within limit; fails: short circuit", "Over limit; fails: voltage drop").
 */
function stateWord(e: CandidateEvaluationOk, thermal: { state: ResultState; word: string }): string {
  if (e.passes) return thermal.word;
  const thermalCodes = new Set(['OVER_LIMIT', 'RUNAWAY']);
  const others = e.flags.filter((f) => f.severity === 'blocker' && !thermalCodes.has(f.code)).map((f) => FAILURE_WORDS[f.code] ?? f.title.toLowerCase());
  if (others.length > 0) return `${thermal.word}; fails: ${others.join(', ')}`;
  return thermal.state === 'over' ? thermal.word : `${thermal.word}; fails a check`;
}

export type ShortCircuitWord = 'not checked' | 'passes' | 'fails';

export function shortCircuitWord(sc: ShortCircuitCheck): ShortCircuitWord {
  if (!sc.checked) return 'not checked';
  return sc.withstands ? 'passes' : 'fails';
}

export interface CandidateRow {
  id: string;
  label: string;
  kind: 'cable' | 'bar';
  passes: boolean;
  /** Shown state: the hot spot's state, or 'over' when any check fails the candidate. */
  stateKey: ResultState;
  /** The hot spot's own state, whatever the other checks say. */
  thermalState: ResultState;
  state: string;
  designCurrentA: number;
  sectionPerPhaseMm2: number;
  hotSpotC: number | null;
  limitC: number;
  /** The covering that sets the limit, or what kind of limit it is. */
  limitSource: string;
  marginK: number | null;
  marginPercent: number | null;
  ampacityA: number;
  /**
   * True when the candidate may carry no current at all (ampacity 0: its limit is at or below the
   * temperature it has without current). The utilisation is then not a number a person can read.
   */
  noCurrentAllowed: boolean;
  /** Design current / ampacity; null when no current is allowed. */
  utilisation: number | null;
  /** The same in per cent; null when no current is allowed. */
  utilisationPercent: number | null;
  /** "87.5 %", or "no current allowed". */
  utilisationText: string;
  lossWPerM: number | null;
  voltageDropV: number;
  voltageDropPercent: number;
  voltageDropLimitPercent: number | null;
  shortCircuit: ShortCircuitWord;
  massKg: number;
  materialCost: string | null;
  lifeCycleCost: string | null;
  flagCounts: Record<FlagSeverity, number>;
  flagCodes: string[];
  /** 'Smallest passing', 'Lowest cost passing'. */
  marks: string[];
  /**
   * The cable of the rated cross-section that governs, in words ("centre cable of this circuit",
   * "every cable of this circuit alike"); null for bars, a result without a group (a snapshot of an
   * earlier solver) or on runaway.
   */
  governingCable: string | null;
  /** That cable's conductor temperature at the design current, °C. */
  governingCableC: number | null;
  /** How the group was rated, in a few words ("in the ground: superposition with images, …"); null without a group. */
  groupMethod: string | null;
  /** A bus-bar pack: the bar that governs in words with its temperature ("L2, bar 1 of 3 (outer), 84.2 °C"); null for cables and single bars. */
  hottestBar: string | null;
  /** IEC 60865-1 forces of a bar candidate: passes, fails or not checked; null for cables. */
  forces: Verdict | null;
  /** σ_tot/(q·R_p0.2) (≤ 1 passes); null when the forces were not checked. */
  stressRatio: number | null;
  /** The larger of the end and inner support forces, N; null when not checked. */
  supportForceN: number | null;
  /** That force over the rated support strength; null when not checked or no rating was entered. */
  supportForceRatio: number | null;
  /** Largest support spacing that passes, m; null when not checked. */
  largestSupportSpacingM: number | null;
  /** The device's I_n (or setting I_r) checked for coordination, A; null without a device. */
  deviceCurrentA: number | null;
  /** Overload coordination, IEC 60364-4-43 §433.1; null without a device. */
  coordination: Verdict | null;
  /** Smallest rating of the device's series that coordinates, A; null when none or not searched. */
  smallestDeviceA: number | null;
  /** Automatic disconnection, IEC 60364-4-41 §411; null without a device. */
  disconnection: Verdict | null;
  /** Protective conductor section, IEC 60364-5-54 §543.1; null without a device. */
  protectiveConductor: Verdict | null;
  /** Third harmonics and the neutral, IEC 60364-5-52 Annex E; null when not given. */
  harmonics: Verdict | null;
}

/** Which candidates a comparison marked, when the evaluation itself no longer carries the mark (a saved snapshot). */
export interface ComparisonMarks {
  smallestPassingId?: string | null;
  lowestLifeCycleCostPassingId?: string | null;
}

const percentText = (value: number) => `${formatNumber(value, 3)} %`;

/**
 * The person-facing row of one evaluated candidate. `otherLabels` are the sheet's names of the
 * other circuits beside this one (for the governing cable's words when it is not this circuit's).
 */
export function candidateRow(e: CandidateEvaluationOk, marks: ComparisonMarks = {}, otherLabels: readonly string[] = []): CandidateRow {
  const thermal = thermalState(e);
  const noCurrentAllowed = !(e.ampacityA > 0);
  const utilisation = noCurrentAllowed ? null : e.utilisation;
  const flagCounts: Record<FlagSeverity, number> = { blocker: 0, review: 0, note: 0 };
  for (const f of e.flags) flagCounts[f.severity] += 1;
  const rowMarks: string[] = [];
  if (e.isSmallestPassing || (marks.smallestPassingId != null && marks.smallestPassingId === e.id)) rowMarks.push('Smallest passing');
  if (e.isLowestLifeCycleCostPassing || (marks.lowestLifeCycleCostPassingId != null && marks.lowestLifeCycleCostPassingId === e.id)) rowMarks.push('Lowest cost passing');
  const governing = e.group ? governingCableOf(e.group, otherLabels) : null;
  const protection = protectionVerdicts(e);
  return {
    id: e.id,
    label: e.label,
    kind: e.kind,
    passes: e.passes,
    stateKey: e.passes ? thermal.state : 'over',
    thermalState: thermal.state,
    state: stateWord(e, thermal),
    designCurrentA: e.designCurrentA,
    sectionPerPhaseMm2: e.sectionPerPhaseMm2,
    hotSpotC: e.hotSpotC,
    limitC: e.limit.temperatureC,
    limitSource: e.limit.layer ?? e.limit.source,
    marginK: e.marginK,
    marginPercent: e.marginPercent,
    ampacityA: e.ampacityA,
    noCurrentAllowed,
    utilisation,
    utilisationPercent: utilisation === null ? null : utilisation * 100,
    utilisationText: utilisation === null ? 'no current allowed' : percentText(utilisation * 100),
    lossWPerM: e.lossWPerM,
    voltageDropV: e.voltageDrop.volts,
    voltageDropPercent: e.voltageDrop.percent,
    voltageDropLimitPercent: e.voltageDrop.limitPercent ?? null,
    shortCircuit: shortCircuitWord(e.shortCircuit),
    massKg: e.massKg,
    materialCost: e.materialCost,
    lifeCycleCost: e.lifeCycleCost,
    flagCounts,
    flagCodes: e.flags.map((f) => f.code),
    marks: rowMarks,
    governingCable: governing?.words ?? null,
    governingCableC: governing?.conductorC ?? null,
    groupMethod: e.group ? groupMethodWords(e.group) : null,
    hottestBar: e.pack ? hottestBarText(e.pack) : null,
    forces: forcesVerdict(e),
    stressRatio: e.forces?.stressRatio ?? null,
    supportForceN: e.forces ? largestSupportForceN(e.forces) : null,
    supportForceRatio: e.forces?.supportForceRatio ?? null,
    largestSupportSpacingM: e.forces?.largestSupportSpacingM ?? null,
    deviceCurrentA: e.protection?.coordination?.deviceCurrentA ?? null,
    coordination: e.protection ? (protection?.coordination ?? null) : null,
    smallestDeviceA: e.protection?.smallestRating?.ratingA ?? null,
    disconnection: e.protection ? (protection?.disconnection ?? null) : null,
    protectiveConductor: e.protection ? (protection?.protectiveConductor ?? null) : null,
    harmonics: e.harmonics ? (protection?.harmonics ?? null) : null,
  };
}

/**
 * Sizing one schedule row: the smallest size of the allowed family that passes, with its hot
 * spot, margin, ampacity, voltage drop, short-circuit result and flags — or why none passes.
 * All the physics is lib/electrical's `evaluateCandidate`; this module only builds the
 * conditions from the row, lists the sizes in order and picks, exactly as `compareCandidates`
 * would pick the smallest passing one (least section per phase, then least mass).
 */
import { evaluateCandidate } from '../electrical/sizing/evaluate';
import type { AssumptionFlag } from '../electrical/sizing/flags';
import type { BusbarSystemConditions, CableArrangement, Candidate, CandidateEvaluationOk, Conditions, ProtectionConditions, ShortCircuitCheck } from '../electrical/sizing/types';
import type { ProtectiveDevice } from '../electrical/protection';
import { candidateRow } from '../sheet/candidateRow';
import type { Verdict } from '../sheet/systemWords';
import type { DeviceWord, SupportWord } from './columns';
import { candidateSectionMm2 } from './families';
import type { ScheduleRow } from './row';

/** Frequency used when the row leaves it empty (IEC 60038 50 Hz systems, common practice); noted on the result. */
export const DEFAULT_FREQUENCY_HZ = 50;

/**
 * The cable circuit's cross-section from the row (physics.md §8): its formation and spacing, and
 * the other circuits beside it — each with the same cable as the size being tried, at the row's
 * other-circuit current — in one horizontal row. Empty cells (and rows stored before these
 * columns existed) give trefoil, touching, nothing beside it.
 */
export function rowArrangement(row: ScheduleRow): CableArrangement {
  const arrangement: CableArrangement = { formation: row.formation ?? 'trefoil' };
  if (row.spacingMm != null) arrangement.spacingM = row.spacingMm / 1000;
  const others = row.otherCircuits ?? 0;
  if (others > 0 && row.otherCircuitCurrentA != null) {
    arrangement.otherCircuits = Array.from({ length: others }, () => ({ currentA: row.otherCircuitCurrentA as number }));
  }
  // The spacing between circuits places the size's parallel runs too.
  if (row.circuitSpacingMm != null) arrangement.circuitSpacingM = row.circuitSpacingMm / 1000;
  arrangement.circuitRow = 'horizontal';
  return arrangement;
}

/** The library's beam and support kinds (IEC 60865-1 Table 3) of the schedule's words. */
export const SUPPORTS_OF: Readonly<Record<SupportWord, NonNullable<BusbarSystemConditions['supports']>>> = {
  'simply supported': 'single-span-both-simply-supported',
  'fixed and simply supported': 'single-span-fixed-and-simply-supported',
  'both ends fixed': 'single-span-both-fixed',
  'continuous two spans': 'continuous-two-spans',
  'continuous three or more spans': 'continuous-three-or-more-spans',
};

/**
 * The bar system of the row (physics.md §10), when its phase spacing is given: the supports for
 * the IEC 60865-1 forces when given too. Empty cells (and rows stored before these columns
 * existed) give no system: the library assumes a phase spacing (flagged) and checks no forces.
 */
export function rowBusbarSystem(row: ScheduleRow): BusbarSystemConditions | undefined {
  if (row.phaseSpacingMm == null) return undefined;
  const system: BusbarSystemConditions = { phaseSpacingM: row.phaseSpacingMm / 1000 };
  if (row.supportSpanMm != null) system.supportSpacingM = row.supportSpanMm / 1000;
  if (row.supports != null) system.supports = SUPPORTS_OF[row.supports];
  if (row.supportStrengthN != null) system.supportStrengthN = row.supportStrengthN;
  return system;
}

/** The row's device as the library's data (lib/electrical/protection/device.ts). */
export function rowDevice(row: Pick<ScheduleRow, 'deviceType' | 'deviceRatingA'>): ProtectiveDevice | undefined {
  if (row.deviceType == null || row.deviceRatingA == null) return undefined;
  const ratedCurrentA = row.deviceRatingA;
  const word: DeviceWord = row.deviceType;
  if (word === 'gG fuse') return { kind: 'fuse-gG-iec60269', ratedCurrentA };
  return { kind: 'breaker-iec60898-1', curve: word === 'breaker B' ? 'B' : word === 'breaker C' ? 'C' : 'D', ratedCurrentA };
}

/**
 * The row's protection: the device alone, so each size is checked for overload coordination
 * against its own rating (IEC 60364-4-43 §433.1) with the smallest coordinated rating of the
 * standard series; without the source impedance and protective conductor the library does not
 * check disconnection and says so (DISCONNECTION_NOT_CHECKED).
 */
export function rowProtection(row: ScheduleRow): ProtectionConditions | undefined {
  const device = rowDevice(row);
  return device ? { device } : undefined;
}

export function rowConditions(row: ScheduleRow): Conditions {
  const arrangement = rowArrangement(row);
  const system = rowBusbarSystem(row);
  const conditions: Conditions = {
    designCurrentA: row.designCurrentA,
    frequencyHz: row.frequencyHz ?? DEFAULT_FREQUENCY_HZ,
    phases: row.phases,
    nominalVoltageV: row.nominalVoltageV,
    lengthM: row.lengthM,
    powerFactor: row.powerFactor,
    installation:
      row.installation === 'buried'
        ? { kind: 'buried', depthM: row.depthM as number, ...(row.ambientC !== null ? { groundC: row.ambientC } : {}), ...arrangement }
        : row.installation === 'cable-in-air'
          ? { kind: 'cable-in-air', ...arrangement }
          : { kind: row.installation, ...(system ? { system } : {}) },
  };
  if (row.installation !== 'buried' && row.ambientC !== null) conditions.ambientC = row.ambientC;
  if (row.faultCurrentKA !== null && row.clearingTimeS !== null) conditions.fault = { currentA: row.faultCurrentKA * 1000, durationS: row.clearingTimeS };
  if (row.maxVoltageDropPercent !== null) conditions.maxVoltageDropPercent = row.maxVoltageDropPercent;
  if (row.groupingFactor !== null && row.groupingFactor < 1) conditions.groupingFactor = row.groupingFactor;
  if (row.temperatureLimitC !== null) conditions.temperatureLimitC = row.temperatureLimitC;
  const protection = rowProtection(row);
  if (protection) conditions.protection = protection;
  return conditions;
}

/** Runs per phase (cables in parallel, or bars per phase for bar families) of a listed size. */
function runsOf(candidate: Candidate): number {
  return candidate.kind === 'bar' ? (candidate.barsPerPhase ?? 1) * (candidate.parallel ?? 1) : (candidate.parallel ?? 1);
}

/**
 * The smallest cable section run in parallel when a team sets none, mm². Parallel runs of small
 * cables multiply joints and terminations and share current less evenly; designers parallel
 * cables only once one cable per phase would be unwieldy (common practice, not a figure of a
 * standard: teams set their own).
 */
export const DEFAULT_MIN_PARALLEL_SECTION_MM2 = 50;

export interface FamilyOptions {
  /** Cables of a smaller section per cable are not run in parallel, mm² (bars are not limited). */
  minParallelSectionMm2?: number;
}

/**
 * The sizes a row may use, in the order they are preferred: fewer runs per phase first, then the
 * smallest section per phase (stable: catalogue order on equal sections) — as compareCandidates
 * prefers them (preferredSizeOrder). Cables below the minimum parallel section are used alone only.
 */
export function expandFamily(familyCandidates: readonly Candidate[], maxParallel: number, options: FamilyOptions = {}): Candidate[] {
  const minParallel = options.minParallelSectionMm2 ?? DEFAULT_MIN_PARALLEL_SECTION_MM2;
  const sizes: Array<{ candidate: Candidate; runs: number; order: number }> = [];
  let order = 0;
  for (let runs = 1; runs <= maxParallel; runs++) {
    for (const base of familyCandidates) {
      if (runs > 1 && base.kind === 'cable' && base.sectionMm2 < minParallel) continue;
      const id = `${base.id ?? base.label ?? 'size'}${runs > 1 ? ` ×${runs}` : ''}`;
      const label = runs > 1 ? `${runs} × ${base.label ?? base.id}` : (base.label ?? base.id ?? 'size');
      const candidate: Candidate =
        base.kind === 'bar' ? { ...base, id, label, barsPerPhase: (base.barsPerPhase ?? 1) * runs } : { ...base, id, label, parallel: (base.parallel ?? 1) * runs };
      sizes.push({ candidate, runs: runsOf(candidate), order: order++ });
    }
  }
  return sizes
    .sort((a, b) => a.runs - b.runs || candidateSectionMm2(a.candidate) - candidateSectionMm2(b.candidate) || a.order - b.order)
    .map((s) => s.candidate);
}

export interface ChosenSize {
  candidateId: string;
  label: string;
  kind: 'cable' | 'bar';
  runsPerPhase: number;
  sectionPerPhaseMm2: number;
  hotSpotC: number | null;
  limitC: number;
  limitSource: string;
  marginK: number | null;
  marginPercent: number | null;
  ampacityA: number;
  /** Design current / ampacity; null when no current is allowed (ampacity zero). */
  utilisation: number | null;
  voltageDropV: number;
  voltageDropPercent: number;
  voltageDropLimitPercent: number | null;
  shortCircuit: ShortCircuitCheck;
  lossWPerM: number | null;
  /** Joule loss of the whole circuit over its length at the design current, W. */
  lossW: number | null;
  massKg: number;
  materialCost: string | null;
  /** The governing cable of the rated cross-section and its conductor temperature, °C, and how the group was rated (candidateRow); null for bars. */
  governingCable?: string | null;
  governingCableC?: number | null;
  groupMethod?: string | null;
  /**
   * The bus-bar system and the protection as candidateRow reads them (absent in results stored
   * before they existed): the governing bar of a pack, the IEC 60865-1 forces, and the device's
   * overload coordination with the smallest coordinated rating.
   */
  hottestBar?: string | null;
  forces?: Verdict | null;
  stressRatio?: number | null;
  supportForceN?: number | null;
  supportForceRatio?: number | null;
  largestSupportSpacingM?: number | null;
  deviceCurrentA?: number | null;
  coordination?: Verdict | null;
  smallestDeviceA?: number | null;
  flags: AssumptionFlag[];
}

export type CircuitSizing =
  | {
      status: 'sized';
      chosen: ChosenSize;
      /** Sizes evaluated (smaller failing ones included). */
      evaluated: number;
      solves: number;
      /** Inputs the schedule assumed on the designer's behalf, in words. */
      assumptions: string[];
    }
  | {
      status: 'none_passes';
      reason: string;
      /** The largest size tried, with the blockers that failed it (null when every size was refused as input). */
      largest: ChosenSize | null;
      evaluated: number;
      solves: number;
      assumptions: string[];
    };

/** The stored result of a size: the person-facing figures of candidateRow (the same as a sheet's grid and PDF) and what the schedule adds. */
function chosenOf(e: CandidateEvaluationOk, candidate: Candidate, lengthM: number): ChosenSize {
  const row = candidateRow(e);
  return {
    candidateId: row.id,
    label: row.label,
    kind: row.kind,
    runsPerPhase: runsOf(candidate),
    sectionPerPhaseMm2: row.sectionPerPhaseMm2,
    hotSpotC: row.hotSpotC,
    limitC: row.limitC,
    limitSource: row.limitSource,
    marginK: row.marginK,
    marginPercent: row.marginPercent,
    ampacityA: row.ampacityA,
    utilisation: row.utilisation,
    voltageDropV: row.voltageDropV,
    voltageDropPercent: row.voltageDropPercent,
    voltageDropLimitPercent: row.voltageDropLimitPercent,
    shortCircuit: e.shortCircuit,
    lossWPerM: row.lossWPerM,
    lossW: row.lossWPerM === null ? null : row.lossWPerM * lengthM,
    massKg: row.massKg,
    materialCost: row.materialCost,
    governingCable: row.governingCable,
    governingCableC: row.governingCableC,
    groupMethod: row.groupMethod,
    hottestBar: row.hottestBar,
    forces: row.forces,
    stressRatio: row.stressRatio,
    supportForceN: row.supportForceN,
    supportForceRatio: row.supportForceRatio,
    largestSupportSpacingM: row.largestSupportSpacingM,
    deviceCurrentA: row.deviceCurrentA,
    coordination: row.coordination,
    smallestDeviceA: row.smallestDeviceA,
    flags: e.flags,
  };
}

function assumptionsOf(row: ScheduleRow, options: FamilyOptions): string[] {
  const notes: string[] = [];
  if (row.frequencyHz === null) notes.push(`Frequency left empty: ${DEFAULT_FREQUENCY_HZ} Hz assumed.`);
  if (row.maxParallel === 1) notes.push('One run per phase (max parallel runs empty or 1).');
  else {
    const min = options.minParallelSectionMm2 ?? DEFAULT_MIN_PARALLEL_SECTION_MM2;
    const whose = options.minParallelSectionMm2 === undefined ? ' (the default, common practice; a team admin can set another)' : " (the team's setting)";
    notes.push(`Fewer parallel runs preferred over a smaller section; cables under ${min} mm² are not run in parallel${whose}.`);
  }
  return notes;
}

/**
 * Sizes one circuit from its family: evaluates sizes in the preferred order (expandFamily) and
 * stops at the first that passes (no blocker flag); sizes of the same runs and section are all
 * evaluated and the lightest is taken, as compareCandidates does. Never throws for bad data: a
 * size the library refuses is skipped and reported when nothing passes.
 */
export function sizeCircuit(row: ScheduleRow, familyCandidates: readonly Candidate[], options: FamilyOptions = {}): CircuitSizing {
  const conditions = rowConditions(row);
  const sizes = expandFamily(familyCandidates, row.maxParallel, options);
  const assumptions = assumptionsOf(row, options);
  let evaluated = 0;
  let solves = 0;
  let best: { e: CandidateEvaluationOk; c: Candidate } | null = null;
  let largestOk: { e: CandidateEvaluationOk; c: Candidate } | null = null;
  const refusals: string[] = [];
  for (let i = 0; i < sizes.length; i++) {
    const candidate = sizes[i];
    if (best && (runsOf(candidate) !== runsOf(best.c) || candidateSectionMm2(candidate) !== candidateSectionMm2(best.c))) break;
    const e = evaluateCandidate(candidate, conditions, { index: i });
    evaluated++;
    if (!e.ok) {
      refusals.push(`${e.label}: ${e.error.message}${e.error.field ? ` (${e.error.field})` : ''}`);
      continue;
    }
    solves += e.solves;
    // The largest tried: the most runs and section (the last in the order that could be evaluated).
    largestOk = { e, c: candidate };
    if (e.passes && (best === null || e.massKg < best.e.massKg)) best = { e, c: candidate };
  }
  if (best) return { status: 'sized', chosen: chosenOf(best.e, best.c, row.lengthM), evaluated, solves, assumptions };
  if (sizes.length === 0) {
    return { status: 'none_passes', reason: 'The family has no sizes in the catalogue.', largest: null, evaluated, solves, assumptions };
  }
  if (!largestOk) {
    return {
      status: 'none_passes',
      reason: `Every size was refused by the sizing library: ${refusals.slice(0, 3).join('; ')}${refusals.length > 3 ? ` (and ${refusals.length - 3} more)` : ''}.`,
      largest: null,
      evaluated,
      solves,
      assumptions,
    };
  }
  const blockers = largestOk.e.flags.filter((f) => f.severity === 'blocker').map((f) => f.message);
  const runsHint = row.maxParallel < 8 ? ' Allow more parallel runs, choose a larger family, or change the installation.' : '';
  return {
    status: 'none_passes',
    reason: `No size of the family passes; even the largest, ${largestOk.e.label}, fails: ${blockers.join(' ') || 'see its flags.'}${runsHint}`,
    largest: chosenOf(largestOk.e, largestOk.c, row.lengthM),
    evaluated,
    solves,
    assumptions,
  };
}

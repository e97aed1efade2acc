/**
 * Results of a schedule as people read them: one flat line per circuit (grid and exports), the
 * filters (failing, flagged) and the totals (conductor mass, losses, cost).
 */
import { moneyNumber, withCurrency } from '../units/money';
import { Money } from '../electrical/economics';
import { shortCircuitWord, type ShortCircuitWord } from '../sheet/candidateRow';
import { formatNumber } from '../units';
import type { CircuitSizing } from './size';
import type { ScheduleRow } from './row';
import type { Table } from './files';
import type { Verdict } from '../sheet/systemWords';

export interface ResultLine {
  rowNumber: number;
  circuitTag: string;
  from: string;
  to: string;
  designCurrentA: number;
  lengthM: number;
  family: string;
  /** 'sized' | 'none_passes' | 'pending'. */
  status: 'sized' | 'none_passes' | 'pending';
  size: string | null;
  runsPerPhase: number | null;
  sectionPerPhaseMm2: number | null;
  hotSpotC: number | null;
  limitC: number | null;
  marginK: number | null;
  marginPercent: number | null;
  ampacityA: number | null;
  utilisation: number | null;
  voltageDropPercent: number | null;
  /** The same words as a sheet's candidate grid and PDF (candidateRow); null when not sized. */
  shortCircuit: ShortCircuitWord | null;
  shortCircuitFinalC: number | null;
  lossW: number | null;
  massKg: number | null;
  materialCost: string | null;
  /** The governing cable of the rated cross-section in words, with its conductor temperature ("centre cable of this circuit, 88.7 °C"); null for bars, unsized rows and rows sized before groups. */
  governingCable: string | null;
  /** How the group was rated, in a few words (candidateRow). */
  groupMethod: string | null;
  /** The row's bus-bar system as entered: phase spacing and support span, mm (null when not given). These and the fields below are always set by resultLine; optional for lines made before them. */
  phaseSpacingMm?: number | null;
  supportSpanMm?: number | null;
  /** A pack's governing bar with its temperature (candidateRow); null for cables, single bars and older results. */
  hottestBar?: string | null;
  /** IEC 60865-1 forces of the size shown: verdict, stress ratio σ_tot/(q·R_p0.2), larger support force (N), its ratio to the rated strength, largest passing span (m). */
  forces?: Verdict | null;
  stressRatio?: number | null;
  supportForceN?: number | null;
  supportForceRatio?: number | null;
  largestSupportSpacingM?: number | null;
  /** The row's device as entered ('breaker C', 'gG fuse') and its rating, A; null when none. */
  deviceType?: string | null;
  deviceRatingA?: number | null;
  /** Overload coordination of the size shown (IEC 60364-4-43 §433.1) and the smallest coordinated rating of the standard series, A. */
  coordination?: Verdict | null;
  smallestDeviceA?: number | null;
  blockerFlags: number;
  reviewFlags: number;
  noteFlags: number;
  /** Flag titles/messages, blockers first, for the grid's tooltip and the export. */
  flagText: string;
  /** Why none passes, or what the schedule assumed. */
  remark: string;
}

export function resultLine(row: ScheduleRow, familyLabel: string, sizing: CircuitSizing | null): ResultLine {
  const base = {
    rowNumber: row.rowNumber,
    circuitTag: row.circuitTag,
    from: row.from,
    to: row.to,
    designCurrentA: row.designCurrentA,
    lengthM: row.lengthM,
    family: familyLabel,
  };
  const chosen = sizing?.status === 'sized' ? sizing.chosen : sizing?.status === 'none_passes' ? sizing.largest : null;
  const flags = chosen?.flags ?? [];
  const count = (s: string) => flags.filter((f) => f.severity === s).length;
  const sc = chosen?.shortCircuit;
  const shown = sizing?.status === 'sized' ? chosen : null;
  return {
    ...base,
    status: sizing === null ? 'pending' : sizing.status,
    size: shown?.label ?? null,
    runsPerPhase: shown?.runsPerPhase ?? null,
    sectionPerPhaseMm2: shown?.sectionPerPhaseMm2 ?? null,
    hotSpotC: shown?.hotSpotC ?? null,
    limitC: shown?.limitC ?? null,
    marginK: shown?.marginK ?? null,
    marginPercent: shown?.marginPercent ?? null,
    ampacityA: shown?.ampacityA ?? null,
    utilisation: shown?.utilisation ?? null,
    voltageDropPercent: shown?.voltageDropPercent ?? null,
    shortCircuit: shown && sc ? shortCircuitWord(sc) : null,
    shortCircuitFinalC: shown && sc?.checked ? (sc.finalC ?? null) : null,
    lossW: shown?.lossW ?? null,
    massKg: shown?.massKg ?? null,
    materialCost: shown?.materialCost ?? null,
    governingCable: shown?.governingCable ? `${shown.governingCable}${shown.governingCableC != null ? `, ${formatNumber(shown.governingCableC, 3)} °C` : ''}` : null,
    groupMethod: shown?.groupMethod ?? null,
    phaseSpacingMm: row.phaseSpacingMm ?? null,
    supportSpanMm: row.supportSpanMm ?? null,
    hottestBar: shown?.hottestBar ?? null,
    forces: shown?.forces ?? null,
    stressRatio: shown?.stressRatio ?? null,
    supportForceN: shown?.supportForceN ?? null,
    supportForceRatio: shown?.supportForceRatio ?? null,
    largestSupportSpacingM: shown?.largestSupportSpacingM ?? null,
    deviceType: row.deviceType ?? null,
    deviceRatingA: row.deviceRatingA ?? null,
    // The largest size tried says why none passes; the coordination of a size shown is its own.
    coordination: shown?.coordination ?? null,
    smallestDeviceA: shown?.smallestDeviceA ?? null,
    blockerFlags: count('blocker'),
    reviewFlags: shown ? count('review') : 0,
    noteFlags: shown ? count('note') : 0,
    flagText: flags.map((f) => `[${f.severity}] ${f.message}`).join(' '),
    remark: sizing === null ? '' : sizing.status === 'none_passes' ? sizing.reason : sizing.assumptions.join(' '),
  };
}

/** Failing: no size passes. Flagged: the chosen size carries a flag a reviewer must accept. */
export const isFailing = (line: ResultLine) => line.status === 'none_passes';
export const isFlagged = (line: ResultLine) => line.status === 'sized' && line.reviewFlags > 0;

export interface ScheduleTotals {
  circuits: number;
  sized: number;
  failing: number;
  flagged: number;
  massKg: number;
  lossW: number;
  /** Sum of the known material costs (decimal string), and how many sized circuits had no price. */
  materialCost: string;
  circuitsWithoutCost: number;
}

export function totalsOf(lines: readonly ResultLine[]): ScheduleTotals {
  let massKg = 0;
  let lossW = 0;
  let cost = new Money(0);
  let withoutCost = 0;
  for (const line of lines) {
    if (line.status !== 'sized') continue;
    massKg += line.massKg ?? 0;
    lossW += line.lossW ?? 0;
    if (line.materialCost === null) withoutCost++;
    else cost = cost.add(new Money(line.materialCost));
  }
  return {
    circuits: lines.length,
    sized: lines.filter((l) => l.status === 'sized').length,
    failing: lines.filter(isFailing).length,
    flagged: lines.filter(isFlagged).length,
    massKg,
    lossW,
    materialCost: cost.toFixed(2),
    circuitsWithoutCost: withoutCost,
  };
}

const EXPORT_COLUMNS: Array<[string, (l: ResultLine) => string | number | null]> = [
  ['row', (l) => l.rowNumber],
  ['circuit tag', (l) => l.circuitTag],
  ['from', (l) => l.from],
  ['to', (l) => l.to],
  ['design current (A)', (l) => l.designCurrentA],
  ['length (m)', (l) => l.lengthM],
  ['conductor family', (l) => l.family],
  ['result', (l) => (l.status === 'sized' ? 'sized' : l.status === 'none_passes' ? 'no size passes' : 'not sized yet')],
  ['size', (l) => l.size],
  ['runs per phase', (l) => l.runsPerPhase],
  ['section per phase (mm²)', (l) => l.sectionPerPhaseMm2],
  ['hot spot (°C)', (l) => round(l.hotSpotC, 1)],
  ['limit (°C)', (l) => l.limitC],
  ['margin (K)', (l) => round(l.marginK, 1)],
  ['margin (%)', (l) => round(l.marginPercent, 1)],
  ['ampacity (A)', (l) => round(l.ampacityA, 1)],
  ['utilisation', (l) => round(l.utilisation, 3)],
  ['voltage drop (% of U0)', (l) => round(l.voltageDropPercent, 2)],
  ['short circuit', (l) => l.shortCircuit],
  ['short-circuit final (°C)', (l) => round(l.shortCircuitFinalC, 0)],
  ['losses (W)', (l) => round(l.lossW, 1)],
  ['conductor mass (kg)', (l) => round(l.massKg, 1)],
  // A number rounded to cents; the header names the currency (resultsTable).
  ['material cost', (l) => moneyNumber(l.materialCost)],
  ['governing cable', (l) => l.governingCable],
  ['group rated by', (l) => l.groupMethod],
  ['phase spacing (mm)', (l) => l.phaseSpacingMm ?? null],
  ['support span (mm)', (l) => l.supportSpanMm ?? null],
  ['governing bar', (l) => l.hottestBar ?? null],
  ['short-circuit forces', (l) => l.forces ?? null],
  ['stress ratio', (l) => round(l.stressRatio ?? null, 3)],
  ['support force (N)', (l) => round(l.supportForceN ?? null, 0)],
  ['support force / strength', (l) => round(l.supportForceRatio ?? null, 3)],
  ['largest support span (mm)', (l) => (l.largestSupportSpacingM == null ? null : round(l.largestSupportSpacingM * 1000, 0))],
  ['device type', (l) => l.deviceType ?? null],
  ['device rating (A)', (l) => l.deviceRatingA ?? null],
  ['overload coordination', (l) => l.coordination ?? null],
  ['smallest coordinated rating (A)', (l) => l.smallestDeviceA ?? null],
  ['flags needing review', (l) => l.reviewFlags],
  ['flags', (l) => l.flagText],
  ['remark', (l) => l.remark],
];

function round(value: number | null, digits: number): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

/** The caution every export carries (product.md "Cautions"). */
export const EXPORT_CAUTION =
  'Engineering aid only: results depend on the listed assumptions and flags; the installation must comply with IEC 60364 / national wiring rules and local authority requirements; every circuit must be checked and signed by a qualified, licensed engineer before use for construction.';

/** Headers of money columns, before the currency is added. */
const MONEY_COLUMNS = new Set(['material cost']);

/** `currency`: the team's (teams.currency), named in the money column's header; the XLSX writer formats that column as money. */
export function resultsTable(lines: readonly ResultLine[], currency = ''): Table {
  return {
    headers: EXPORT_COLUMNS.map(([h]) => (currency && MONEY_COLUMNS.has(h) ? withCurrency(h, currency) : h)),
    rows: lines.map((l) => EXPORT_COLUMNS.map(([, get]) => get(l))),
    moneyColumns: EXPORT_COLUMNS.flatMap(([h], i) => (MONEY_COLUMNS.has(h) ? [i] : [])),
  };
}

/**
 * One schedule row: the zod schema that turns the cells of a CSV/XLSX row into a typed circuit,
 * and the file-level checks (duplicate tags, unknown families, installation that does not suit
 * the family). Every problem names the spreadsheet row and the column header.
 */
import { z } from 'zod';
import { INPUT_BOUNDS } from '../inputBounds';
import { columnByField, DEVICE_WORDS, FORMATION_WORDS, headerOf, INSTALLATION_WORDS, normaliseHeader, SCHEDULE_COLUMNS, SUPPORT_WORDS, type ScheduleField } from './columns';
import { findFamily } from './families';
import { parseNumberCell } from '../units/parse';

export type ScheduleInstallation = 'cable-in-air' | 'buried' | 'bar-on-edge' | 'bar-flat';

const INSTALLATION_OF: Record<(typeof INSTALLATION_WORDS)[number], ScheduleInstallation> = {
  'cable in air': 'cable-in-air',
  buried: 'buried',
  'bar on edge': 'bar-on-edge',
  'bar flat': 'bar-flat',
};

/** A problem found in a file: spreadsheet row number (header = row 1) and the column header. */
export interface ScheduleProblem {
  row: number;
  /** Header of the column, or '' when the whole row is concerned. */
  column: string;
  message: string;
}

function isBlank(raw: unknown): boolean {
  return raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '');
}

/**
 * A number cell: numbers from XLSX as they are, text through the one parser (lib/units/parse)
 * with a point — a file whose decimal mark is the comma (semicolon-delimited) has its number
 * cells read with the comma when the file is read (lib/schedule/files.ts), so they arrive here
 * as numbers, or as text the comma reading refused, with its message.
 */
function parseNumber(raw: unknown): number | null | { error: string } {
  if (isBlank(raw)) return null;
  if (isCellRefusal(raw)) return { error: raw.refusedNumber };
  const parsed = parseNumberCell(raw, { decimalSeparator: '.', field: '' });
  if (parsed.ok) return parsed.value;
  return { error: cellWords(parsed.message, String(raw).trim()) };
}

/** The parser's message for a cell: the column's header names the field in the problem list. */
export function cellWords(parserMessage: string, shown: string): string {
  const detail = parserMessage.replace(/^[^:]*: /, '');
  return / is not a number$/.test(detail) ? `must be a number (got "${shown}")` : `must be a number: ${detail}`;
}

/**
 * A number cell the file-level reading refused (a semicolon file's decimal comma, lib/schedule/files):
 * a plain object, so that it survives the worker thread the file is read on.
 */
export interface CellRefusal {
  refusedNumber: string;
}
export function isCellRefusal(raw: unknown): raw is CellRefusal {
  return typeof raw === 'object' && raw !== null && typeof (raw as CellRefusal).refusedNumber === 'string';
}

/** A bound of lib/inputBounds (the one table), or a limit of the schedule's own. */
interface NumberBounds {
  min?: number;
  minExclusive?: boolean;
  max?: number;
  integer?: boolean;
}

/** A bound of the table in another unit (kA for A): both ends divided by `perUnit`. */
function inUnitOf(bound: NumberBounds & { min: number; max: number }, perUnit: number): NumberBounds {
  return { ...bound, min: bound.min / perUnit, max: bound.max / perUnit };
}

function numberCell(required: boolean, bounds: NumberBounds) {
  return z.unknown().transform((raw, ctx): number | null => {
    const parsed = parseNumber(raw);
    if (parsed !== null && typeof parsed === 'object') {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    if (parsed === null) {
      if (required) ctx.addIssue({ code: 'custom', message: 'is required' });
      return null;
    }
    const { min, max, minExclusive, integer } = bounds;
    if (integer && !Number.isInteger(parsed)) ctx.addIssue({ code: 'custom', message: `must be a whole number (got ${parsed})` });
    else if (min !== undefined && (minExclusive ? parsed <= min : parsed < min)) {
      ctx.addIssue({ code: 'custom', message: `must be ${minExclusive ? 'greater than' : 'at least'} ${min}${max !== undefined ? ` and at most ${max}` : ''} (got ${parsed})` });
    } else if (max !== undefined && parsed > max) {
      ctx.addIssue({ code: 'custom', message: `must be at most ${max} (got ${parsed})` });
    }
    return parsed;
  });
}

const required = (bounds: NumberBounds) => numberCell(true, bounds).transform((v) => v as number);
const optional = (bounds: NumberBounds) => numberCell(false, bounds);

function textCell(requiredCell: boolean, max: number) {
  return z.unknown().transform((raw, ctx): string => {
    const text = isBlank(raw) ? '' : String(raw).trim();
    if (requiredCell && text === '') ctx.addIssue({ code: 'custom', message: 'is required' });
    if (text.length > max) ctx.addIssue({ code: 'custom', message: `must be at most ${max} characters` });
    return text;
  });
}

const installationCell = z.unknown().transform((raw, ctx): ScheduleInstallation => {
  const word = isBlank(raw) ? '' : String(raw).trim().toLowerCase().replace(/[\s_-]+/g, ' ');
  if (word === '') {
    ctx.addIssue({ code: 'custom', message: 'is required' });
    return z.NEVER;
  }
  const value = INSTALLATION_OF[word as keyof typeof INSTALLATION_OF];
  if (!value) {
    ctx.addIssue({ code: 'custom', message: `must be one of: ${INSTALLATION_WORDS.join(', ')} (got "${String(raw).trim()}")` });
    return z.NEVER;
  }
  return value;
});

export type ScheduleFormation = 'trefoil' | 'flat' | 'flat-vertical';
const FORMATION_OF: Record<(typeof FORMATION_WORDS)[number], ScheduleFormation> = { trefoil: 'trefoil', flat: 'flat', 'flat vertical': 'flat-vertical' };

const formationCell = z.unknown().transform((raw, ctx): ScheduleFormation | null => {
  if (isBlank(raw)) return null;
  const word = String(raw).trim().toLowerCase().replace(/[\s_-]+/g, ' ');
  const value = FORMATION_OF[word as keyof typeof FORMATION_OF];
  if (!value) {
    ctx.addIssue({ code: 'custom', message: `must be one of: ${FORMATION_WORDS.join(', ')} (got "${String(raw).trim()}")` });
    return z.NEVER;
  }
  return value;
});

/** An optional cell of a fixed list of words (case, spaces, '-' and '_' do not matter); null when empty. */
function wordsCell<const W extends readonly string[]>(words: W) {
  return z.unknown().transform((raw, ctx): W[number] | null => {
    if (isBlank(raw)) return null;
    const word = String(raw).trim().toLowerCase().replace(/[\s_-]+/g, ' ');
    const canonical = words.find((w) => w.toLowerCase() === word);
    if (canonical === undefined) {
      ctx.addIssue({ code: 'custom', message: `must be one of: ${words.join(', ')} (got "${String(raw).trim()}")` });
      return z.NEVER;
    }
    return canonical as W[number];
  });
}

/** A bound of the table in mm for a value the table holds in m. */
const inMm = (bound: NumberBounds & { min: number; max: number }): NumberBounds => inUnitOf(bound, 1e-3);

/** Fields of the cross-section, which only cable families take. */
export const ARRANGEMENT_FIELDS = ['formation', 'spacingMm', 'otherCircuits', 'otherCircuitCurrentA', 'circuitSpacingMm'] as const satisfies readonly ScheduleField[];

/** Fields of the bus-bar system, which only bar families take (physics.md §10). */
export const BUSBAR_SYSTEM_FIELDS = ['phaseSpacingMm', 'supportSpanMm', 'supports', 'supportStrengthN'] as const satisfies readonly ScheduleField[];

/** Fields of the protective device (physics.md §11). */
export const DEVICE_FIELDS = ['deviceType', 'deviceRatingA'] as const satisfies readonly ScheduleField[];

/** The row as typed values, keyed by field. SI units; kA and the empty cells kept as entered (null). */
export const scheduleRowSchema = z
  .object({
    circuitTag: textCell(true, 64),
    from: textCell(false, 120),
    to: textCell(false, 120),
    designCurrentA: required(INPUT_BOUNDS.designCurrentA),
    nominalVoltageV: required(INPUT_BOUNDS.nominalVoltageV),
    phases: numberCell(true, { integer: true }).refine((v) => v === 1 || v === 3, 'must be 1 or 3').transform((v) => v as 1 | 3),
    frequencyHz: optional(INPUT_BOUNDS.frequencyHz),
    lengthM: required(INPUT_BOUNDS.lengthM),
    powerFactor: required(INPUT_BOUNDS.powerFactor),
    installation: installationCell,
    depthM: optional(INPUT_BOUNDS.depthM),
    // The ambient column is the ground temperature for buried rows; both have the same range.
    ambientC: optional(INPUT_BOUNDS.ambientC),
    faultCurrentKA: optional(inUnitOf(INPUT_BOUNDS.faultCurrentA, 1000)),
    clearingTimeS: optional(INPUT_BOUNDS.faultDurationS),
    family: textCell(true, 120),
    maxVoltageDropPercent: optional(INPUT_BOUNDS.maxVoltageDropPercent),
    // Not a validity bound: how many sizes the schedule tries per row (runs per phase), so its own.
    maxParallel: optional({ min: 1, max: 8, integer: true }),
    groupingFactor: optional(INPUT_BOUNDS.groupingFactor),
    temperatureLimitC: optional(INPUT_BOUNDS.temperatureLimitC),
    formation: formationCell,
    spacingMm: optional(inMm(INPUT_BOUNDS.spacingM)),
    // Not a validity bound of the library's own: the sheet's and the library's limit of other circuits in one row.
    otherCircuits: optional({ min: 0, max: 23, integer: true }),
    otherCircuitCurrentA: optional(INPUT_BOUNDS.otherCircuitCurrentA),
    circuitSpacingMm: optional(inMm(INPUT_BOUNDS.circuitSpacingM)),
    deviceType: wordsCell(DEVICE_WORDS),
    deviceRatingA: optional(INPUT_BOUNDS.deviceRatedCurrentA),
    phaseSpacingMm: optional(inMm(INPUT_BOUNDS.phaseSpacingM)),
    supportSpanMm: optional(inMm(INPUT_BOUNDS.supportSpacingM)),
    supports: wordsCell(SUPPORT_WORDS),
    supportStrengthN: optional(INPUT_BOUNDS.supportStrengthN),
  })
  .superRefine((row, ctx) => {
    if (row.installation === 'buried' && row.depthM === null) {
      ctx.addIssue({ code: 'custom', path: ['depthM'], message: 'is required when the installation is buried' });
    }
    if (row.installation !== 'buried' && row.depthM !== null) {
      ctx.addIssue({ code: 'custom', path: ['depthM'], message: 'applies only to buried cables; leave it empty' });
    }
    if ((row.otherCircuits ?? 0) > 0 && row.otherCircuitCurrentA === null) {
      ctx.addIssue({ code: 'custom', path: ['otherCircuitCurrentA'], message: `is required when there are other circuits (${headerOf('otherCircuits')})` });
    }
    if ((row.otherCircuits ?? 0) === 0 && row.otherCircuitCurrentA !== null) {
      ctx.addIssue({ code: 'custom', path: ['otherCircuitCurrentA'], message: `applies only when there are other circuits (${headerOf('otherCircuits')}); leave it empty` });
    }
    if ((row.deviceType === null) !== (row.deviceRatingA === null)) {
      const missing: ScheduleField = row.deviceType === null ? 'deviceType' : 'deviceRatingA';
      ctx.addIssue({ code: 'custom', path: [missing], message: `is required with the ${headerOf(missing === 'deviceType' ? 'deviceRatingA' : 'deviceType')} (give both, or leave both empty)` });
    }
    if ((row.supportSpanMm === null) !== (row.supports === null)) {
      const missing: ScheduleField = row.supportSpanMm === null ? 'supportSpanMm' : 'supports';
      ctx.addIssue({ code: 'custom', path: [missing], message: `is required with the ${headerOf(missing === 'supports' ? 'supportSpanMm' : 'supports')} (the forces need both)` });
    }
    if ((row.supportSpanMm !== null || row.supportStrengthN !== null) && row.phaseSpacingMm === null) {
      ctx.addIssue({ code: 'custom', path: ['phaseSpacingMm'], message: `is required with the ${headerOf(row.supportSpanMm !== null ? 'supportSpanMm' : 'supportStrengthN')}: the forces on the bars and supports need it` });
    }
    if ((row.faultCurrentKA === null) !== (row.clearingTimeS === null)) {
      const missing: ScheduleField = row.faultCurrentKA === null ? 'faultCurrentKA' : 'clearingTimeS';
      ctx.addIssue({ code: 'custom', path: [missing], message: `is required with the ${headerOf(missing === 'faultCurrentKA' ? 'clearingTimeS' : 'faultCurrentKA')} (give both, or leave both empty)` });
    }
  });

export type ScheduleRowInput = z.infer<typeof scheduleRowSchema>;

type ArrangementField = (typeof ARRANGEMENT_FIELDS)[number] | (typeof BUSBAR_SYSTEM_FIELDS)[number] | (typeof DEVICE_FIELDS)[number];

/**
 * A clean row ready to size: the typed values, its spreadsheet row number and the family key. The
 * cross-section's, the bus-bar system's and the device's fields are optional: rows stored before
 * they existed have none (read as trefoil touching with nothing beside it, the phase spacing
 * assumed and no device — what those rows were sized with).
 */
export interface ScheduleRow extends Omit<ScheduleRowInput, 'family' | 'maxParallel' | ArrangementField>, Partial<Pick<ScheduleRowInput, ArrangementField>> {
  rowNumber: number;
  /** Canonical family key (families.ts). */
  family: string;
  maxParallel: number;
}

/** Cells keyed by normalised header → an object keyed by field, for the schema. */
export function cellsToInput(values: Record<string, unknown>): Record<string, unknown> {
  const input: Record<string, unknown> = {};
  for (const column of SCHEDULE_COLUMNS) input[column.field] = values[normaliseHeader(column.header)] ?? null;
  return input;
}

export interface FamilyChoice {
  key: string;
  label: string;
  kind: 'cable' | 'bar';
}

export interface ValidatedSchedule {
  rows: ScheduleRow[];
  problems: ScheduleProblem[];
  /** Spreadsheet rows that have at least one problem. */
  badRows: number[];
}

function problemsOf(rowNumber: number, error: z.ZodError): ScheduleProblem[] {
  return error.issues.map((issue) => {
    const field = String(issue.path[0] ?? '');
    return { row: rowNumber, column: columnByField(field)?.header ?? field, message: issue.message };
  });
}

/**
 * Validates every record of a file against the schema and the team's families. A row with any
 * problem is left out of `rows`; nothing here sizes or stores anything.
 */
export function validateScheduleRecords(
  records: ReadonlyArray<{ row: number; values: Record<string, unknown> }>,
  families: readonly FamilyChoice[],
): ValidatedSchedule {
  const rows: ScheduleRow[] = [];
  const problems: ScheduleProblem[] = [];
  const firstRowOfTag = new Map<string, number>();
  for (const record of records) {
    const parsed = scheduleRowSchema.safeParse(cellsToInput(record.values));
    const rowProblems: ScheduleProblem[] = parsed.success ? [] : problemsOf(record.row, parsed.error);
    const tagCell = record.values[normaliseHeader(headerOf('circuitTag'))];
    const tag = isBlank(tagCell) ? '' : String(tagCell).trim();
    if (tag !== '') {
      const key = tag.toLowerCase();
      const earlier = firstRowOfTag.get(key);
      if (earlier !== undefined) rowProblems.push({ row: record.row, column: headerOf('circuitTag'), message: `"${tag}" is already used on row ${earlier}; each circuit tag must be unique` });
      else firstRowOfTag.set(key, record.row);
    }
    const familyCell = record.values[normaliseHeader(headerOf('family'))];
    let family: FamilyChoice | undefined;
    if (!isBlank(familyCell)) {
      family = findFamily(families, String(familyCell));
      if (!family) {
        const known = families.map((f) => f.label).join(', ');
        rowProblems.push({
          row: record.row,
          column: headerOf('family'),
          message: `"${String(familyCell).trim()}" is not a family of your catalogue${known ? ` (families: ${known})` : ' (the catalogue has no conductors yet)'}`,
        });
      }
    }
    if (parsed.success && family?.kind === 'bar' && parsed.data.temperatureLimitC === null) {
      rowProblems.push({ row: record.row, column: headerOf('temperatureLimitC'), message: 'is required for bar families: bare bars have no insulation limit, so give the limit of their joints and terminals' });
    }
    if (parsed.success && family) {
      const suits = family.kind === 'bar' ? parsed.data.installation.startsWith('bar-') : !parsed.data.installation.startsWith('bar-');
      if (!suits) {
        rowProblems.push({
          row: record.row,
          column: headerOf('installation'),
          message: family.kind === 'bar' ? `bars lie "bar on edge" or "bar flat", not "${parsed.data.installation.replace(/-/g, ' ')}"` : `cables are "cable in air" or "buried", not "${parsed.data.installation.replace(/-/g, ' ')}"`,
        });
      }
    }
    if (parsed.success && family?.kind === 'bar') {
      for (const field of ARRANGEMENT_FIELDS) {
        if (parsed.data[field] !== null) rowProblems.push({ row: record.row, column: headerOf(field), message: 'applies only to cable families; leave it empty for bars' });
      }
    }
    if (parsed.success && family?.kind === 'cable') {
      for (const field of BUSBAR_SYSTEM_FIELDS) {
        if (parsed.data[field] !== null) rowProblems.push({ row: record.row, column: headerOf(field), message: 'applies only to bar families; leave it empty for cables' });
      }
    }
    if (rowProblems.length > 0 || !parsed.success || !family) {
      problems.push(...rowProblems);
      continue;
    }
    rows.push({ ...parsed.data, rowNumber: record.row, family: family.key, maxParallel: parsed.data.maxParallel ?? 1 });
  }
  const badRows = [...new Set(problems.map((p) => p.row))].sort((a, b) => a - b);
  return { rows, problems, badRows };
}

/**
 * Schedule files: reading an uploaded CSV/XLSX into records (refusing what is not a schedule,
 * with words a designer can act on), and writing the template and the result exports.
 * Works on bytes (Uint8Array), so it runs in the browser and on the server alike.
 */
import ExcelJS from 'exceljs';
import { tableCsv } from '../files/csv';
import { columnProblems, FileRefusal, keyRowsByHeader, readSpreadsheet, type UploadRules } from '../files/spreadsheet';
import { columnByHeader, normaliseHeader, SCHEDULE_COLUMNS } from './columns';
import { cellWords, type CellRefusal } from './row';
import { parseNumber, type DecimalSeparator } from '../units/parse';

export const MAX_SCHEDULE_BYTES = 4 * 1024 * 1024;
export const MAX_SCHEDULE_ROWS = 5000;

/** The refusal of an upload, shared with the catalogue import (lib/files/spreadsheet.ts). */
export { FileRefusal as ScheduleFileRefusal };

const SCHEDULE_UPLOAD: UploadRules = {
  maxBytes: MAX_SCHEDULE_BYTES,
  maxRows: MAX_SCHEDULE_ROWS,
  what: 'schedule',
  rowNoun: 'circuits',
  typeAdvice: 'Download the template to start from.',
  sizeAdvice: 'Split it into smaller schedules.',
};

export interface ScheduleRecord {
  /** Spreadsheet row number: the header is row 1. */
  row: number;
  /** Cells keyed by normalised header. */
  values: Record<string, unknown>;
}

function toRecords(fileName: string, headerCells: unknown[], body: Array<{ row: number; cells: unknown[] }>): ScheduleRecord[] {
  const headers = headerCells.map(normaliseHeader);
  while (headers.length > 0 && headers[headers.length - 1] === '') headers.pop();
  if (headers.length === 0) {
    throw new FileRefusal(400, 'no_rows', `"${fileName}" has no header row. The first row must name the columns; download the template.`);
  }
  const parts = columnProblems(
    headers,
    SCHEDULE_COLUMNS.filter((c) => c.required).map((c) => ({ name: normaliseHeader(c.header), label: c.header })),
    (h) => columnByHeader(h) !== undefined,
  );
  if (parts.length) throw new FileRefusal(400, 'wrong_columns', `"${fileName}" does not have the columns of a schedule: ${parts.join('; ')}. Download the template for the expected columns.`);

  const records: ScheduleRecord[] = keyRowsByHeader(headers, body);
  if (records.length === 0) throw new FileRefusal(400, 'no_rows', `"${fileName}" has a header but no circuits.`);
  if (records.length > MAX_SCHEDULE_ROWS) {
    throw new FileRefusal(413, 'too_many_rows', `"${fileName}" has ${records.length} circuits; a schedule may hold at most ${MAX_SCHEDULE_ROWS}. Split it into smaller schedules.`);
  }
  return records;
}

/** Reads a schedule file into records, or throws ScheduleFileRefusal saying why not. */
export async function readScheduleFile(fileName: string, bytes: Uint8Array): Promise<ScheduleRecord[]> {
  const { headerCells, body, decimalSeparator } = await readSpreadsheet(fileName, bytes, SCHEDULE_UPLOAD);
  const records = toRecords(fileName, headerCells, body);
  return decimalSeparator === '.' ? records : records.map((r) => withNumbersRead(r, decimalSeparator));
}

/**
 * The number cells of a file written with another decimal mark, read with it by the one parser
 * (lib/units/parse): a number, or the refusal in words ("1.250" is ambiguous under a comma).
 * Text cells stay text.
 */
function withNumbersRead(record: ScheduleRecord, decimalSeparator: DecimalSeparator): ScheduleRecord {
  const values: Record<string, unknown> = { ...record.values };
  for (const column of SCHEDULE_COLUMNS) {
    if (column.type !== 'number' && column.type !== 'integer') continue;
    const key = normaliseHeader(column.header);
    const raw = values[key];
    if (typeof raw !== 'string' || raw.trim() === '') continue;
    const parsed = parseNumber(raw, { decimalSeparator, field: column.header });
    values[key] = parsed.ok ? parsed.value : ({ refusedNumber: cellWords(parsed.message, raw.trim()) } satisfies CellRefusal);
  }
  return { ...record, values };
}

// ── writing ──

export interface Table {
  headers: string[];
  rows: Array<Array<string | number | null>>;
  /** Columns (0-based) holding money: written as numbers with a two-decimal number format in XLSX. */
  moneyColumns?: number[];
}

/** Through the shared CSV writer (lib/files/csv.ts): a circuit tag such as "=cmd()" cannot run as a formula. */
export function tableToCsv(table: Table): string {
  return tableCsv(table.headers, table.rows);
}

export async function tableToXlsx(table: Table, sheetName: string, notes?: Array<[string, string]>): Promise<Uint8Array> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Ampwarden';
  const sheet = workbook.addWorksheet(sheetName.slice(0, 31));
  sheet.addRow(table.headers).font = { bold: true };
  for (const row of table.rows) sheet.addRow(row);
  sheet.columns.forEach((col) => (col.width = 18));
  for (const i of table.moneyColumns ?? []) sheet.getColumn(i + 1).numFmt = '#,##0.00';
  sheet.views = [{ state: 'frozen', ySplit: 1 }];
  if (notes) {
    const about = workbook.addWorksheet('About these columns');
    about.addRow(['column', 'meaning']).font = { bold: true };
    for (const [column, meaning] of notes) about.addRow([column, meaning]);
    about.columns = [{ width: 30 }, { width: 110 }];
  }
  const buffer = await workbook.xlsx.writeBuffer();
  return new Uint8Array(buffer as unknown as ArrayBuffer);
}

/** The template: every column, two example circuits; the family names come from the team's catalogue. */
export function templateTable(familyLabels: readonly string[]): Table {
  const cable = familyLabels.find((f) => !/bars$/.test(f)) ?? 'copper XLPE single-core';
  const bars = familyLabels.find((f) => /bars$/.test(f));
  const first = SCHEDULE_COLUMNS.map((c) => (c.field === 'family' ? cable : c.example === '' ? null : c.example));
  const second = SCHEDULE_COLUMNS.map((c) => {
    const values: Partial<Record<string, string | number | null>> = bars
      ? {
          circuitTag: 'B-201',
          from: 'TX-1',
          to: 'MSB-1',
          designCurrentA: 1600,
          lengthM: 12,
          installation: 'bar on edge',
          family: bars,
          depthM: null,
          ambientC: 40,
          faultCurrentKA: 35,
          clearingTimeS: 0.5,
          maxParallel: 2,
          temperatureLimitC: 105,
          formation: null,
          // The incoming breaker of a board this size is an adjustable one, sized on its sheet.
          deviceType: null,
          deviceRatingA: null,
          phaseSpacingMm: 200,
          supportSpanMm: 500,
          supports: 'continuous three or more spans',
        }
      : { circuitTag: 'F-102', to: 'EV chargers', designCurrentA: 160, lengthM: 85, installation: 'buried', depthM: 0.7, ambientC: 20, otherCircuits: 1, otherCircuitCurrentA: 120, circuitSpacingMm: 300, deviceRatingA: 160 };
    return c.field in values ? (values[c.field] ?? null) : c.example === '' ? null : c.example;
  });
  return { headers: SCHEDULE_COLUMNS.map((c) => c.header), rows: [first, second] };
}

export function templateNotes(familyLabels: readonly string[]): Array<[string, string]> {
  const notes: Array<[string, string]> = SCHEDULE_COLUMNS.map((c) => [
    c.header,
    `${c.required ? 'Required. ' : 'Optional. '}${c.hint}${c.options ? ` Allowed: ${c.options.join(', ')}.` : ''}`,
  ]);
  notes.push(['', `Families in your catalogue: ${familyLabels.length ? familyLabels.join(', ') : 'none yet — add conductors to the catalogue first'}.`]);
  notes.push(['', 'Only the first sheet is read; the header must be row 1. Values are SI units as named in each header.']);
  return notes;
}

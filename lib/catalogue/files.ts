/**
 * Catalogue files: reading uploaded CSV/XLSX into rows (with the refusals people need to read),
 * validating those rows against the kind's schema with row/column problems, and writing
 * templates and exports in the same column layout.
 *
 * Works on bytes (Uint8Array), not on Node buffers or browser Files, so it runs on either side.
 */
import ExcelJS from 'exceljs';
import { z } from 'zod';
import { tableCsv } from '../files/csv';
import { parseNumber, type DecimalSeparator } from '../units/parse';
import { columnProblems, FileRefusal, keyRowsByHeader, readSpreadsheet, type SpreadsheetFormat, type UploadRules } from '../files/spreadsheet';
import { CATALOGUE_COLUMNS, KIND_LABELS, columnByField, columnByHeader, type ColumnSpec } from './columns';
import { ROW_SCHEMAS, type CatalogueKind, type CatalogueRowByKind } from './schemas';

import { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS } from './limits';

export { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS };
export { FileRefusal };

export type ImportFormat = SpreadsheetFormat;

const CATALOGUE_UPLOAD: UploadRules = { maxBytes: MAX_IMPORT_BYTES, maxRows: MAX_IMPORT_ROWS, what: 'catalogue file', rowNoun: 'rows', sizeAdvice: 'Split it into smaller files.' };

export interface ImportProblem {
  /** Row number as a spreadsheet shows it: the header is row 1, the first data row is row 2. */
  row: number;
  /** File header of the column, or '' when the problem concerns the whole row. */
  column: string;
  message: string;
}

export interface RawRecord {
  row: number;
  values: Record<string, unknown>;
}

/** Header names (trimmed, lower case) and the non-blank rows keyed by them. */
function toTable(headers: unknown[], body: Array<{ row: number; cells: unknown[] }>): { headers: string[]; records: RawRecord[] } {
  const names = headers.map((h) => (h === null || h === undefined ? '' : String(h).trim().toLowerCase()));
  // Trailing empty header cells are spreadsheet noise, not columns.
  while (names.length > 0 && names[names.length - 1] === '') names.pop();
  return { headers: names, records: keyRowsByHeader(names, body) };
}

/**
 * The number cells of a file written with a decimal comma (a semicolon-delimited CSV), read by the
 * one parser (lib/units/parse) into the point notation the row schema reads, or left as the
 * refusal in words ("1.250" is ambiguous there) for parseDecimal to report on its column.
 */
function withDecimalsRead(kind: CatalogueKind, record: RawRecord, decimalSeparator: DecimalSeparator): RawRecord {
  const values: Record<string, unknown> = { ...record.values };
  for (const column of CATALOGUE_COLUMNS[kind]) {
    if (column.type !== 'decimal' && column.type !== 'integer') continue;
    const raw = values[column.header];
    if (typeof raw !== 'string' || raw.trim() === '') continue;
    const text = raw.trim();
    const parsed = parseNumber(text, { decimalSeparator, field: column.header, exponent: true });
    values[column.header] = parsed.ok ? text.replace(',', '.') : { refusedNumber: parsed.message.replace(/^[^:]*: /, '') };
  }
  return { ...record, values };
}

/** Reads a file into header names and raw records, refusing what is not a catalogue sheet of `kind`. */
export async function readCatalogueFile(kind: CatalogueKind, fileName: string, bytes: Uint8Array): Promise<RawRecord[]> {
  const { headerCells, body, decimalSeparator } = await readSpreadsheet(fileName, bytes, CATALOGUE_UPLOAD);
  const { headers, records: read } = toTable(headerCells, body);
  checkHeaders(kind, fileName, headers);
  const records = decimalSeparator === '.' ? read : read.map((r) => withDecimalsRead(kind, r, decimalSeparator));
  if (records.length === 0) throw new FileRefusal(400, 'no_rows', `"${fileName}" has a header but no data rows.`);
  if (records.length > MAX_IMPORT_ROWS) {
    throw new FileRefusal(413, 'too_many_rows', `"${fileName}" has ${records.length} rows; the limit is ${MAX_IMPORT_ROWS}. Split it into smaller files.`);
  }
  return records;
}

export function checkHeaders(kind: CatalogueKind, fileName: string, headers: string[]): void {
  const label = KIND_LABELS[kind].tab;
  if (headers.length === 0 || headers.every((h) => h === '')) {
    throw new FileRefusal(400, 'no_rows', `"${fileName}" has no header row. The first row must name the columns; download the ${label} template.`);
  }
  const columns = CATALOGUE_COLUMNS[kind];
  const parts = columnProblems(
    headers,
    columns.filter((c) => c.required).map((c) => ({ name: c.header, label: c.header })),
    (h) => columnByHeader(kind, h) !== undefined,
  );
  if (parts.length) {
    throw new FileRefusal(400, 'wrong_columns', `"${fileName}" does not have the columns of ${label}: ${parts.join('; ')}. Download the ${label} template for the expected columns.`);
  }
}

/** A record keyed by file header → an object keyed by row field. */
export function recordToInput(kind: CatalogueKind, values: Record<string, unknown>): Record<string, unknown> {
  const input: Record<string, unknown> = {};
  for (const column of CATALOGUE_COLUMNS[kind]) {
    const raw = values[column.header];
    input[column.field] = typeof raw === 'number' && column.type !== 'integer' ? String(raw) : raw ?? null;
  }
  return input;
}

/** zod issues of one row → problems naming the file column. */
export function issuesToProblems(kind: CatalogueKind, row: number, error: z.ZodError): ImportProblem[] {
  return error.issues.map((issue) => {
    const field = String(issue.path[0] ?? '');
    const column = columnByField(kind, field);
    return { row, column: column?.header ?? field, message: issue.message };
  });
}

export interface ValidatedRows<K extends CatalogueKind> {
  rows: Array<{ row: number; value: CatalogueRowByKind[K] }>;
  problems: ImportProblem[];
}

/** Validates every record; duplicate keys within the file are problems on their later rows. */
export function validateRecords<K extends CatalogueKind>(kind: K, records: RawRecord[]): ValidatedRows<K> {
  const schema = ROW_SCHEMAS[kind] as unknown as z.ZodType<CatalogueRowByKind[K]>;
  const rows: ValidatedRows<K>['rows'] = [];
  const problems: ImportProblem[] = [];
  const firstRowOfKey = new Map<string, number>();
  for (const record of records) {
    const result = schema.safeParse(recordToInput(kind, record.values));
    if (!result.success) {
      problems.push(...issuesToProblems(kind, record.row, result.error));
      continue;
    }
    const key = (result.data as { key: string }).key;
    const earlier = firstRowOfKey.get(key);
    if (earlier !== undefined) {
      problems.push({ row: record.row, column: 'key', message: `"${key}" is already used on row ${earlier} of this file` });
      continue;
    }
    firstRowOfKey.set(key, record.row);
    rows.push({ row: record.row, value: result.data });
  }
  return { rows, problems };
}

// ── writing ──

function cellFor(column: ColumnSpec, value: unknown): string | number | null {
  if (value === null || value === undefined || value === '') return null;
  if (column.type === 'integer') return Number(value);
  return String(value);
}

function tableOf(kind: CatalogueKind, rows: ReadonlyArray<Record<string, unknown>>): { headers: string[]; body: Array<Array<string | number | null>> } {
  const columns = CATALOGUE_COLUMNS[kind];
  return { headers: columns.map((c) => c.header), body: rows.map((row) => columns.map((c) => cellFor(c, row[c.field]))) };
}

/** CSV in the import layout (SI units, decimal strings exactly as stored), through the shared writer (formula cells made inert). */
export function writeCsv(kind: CatalogueKind, rows: ReadonlyArray<Record<string, unknown>>): string {
  const { headers, body } = tableOf(kind, rows);
  return tableCsv(headers, body);
}

/**
 * XLSX in the import layout: first sheet the rows (decimals as numbers so that spreadsheets can
 * compute with them), second sheet what each column means.
 */
export async function writeXlsx(kind: CatalogueKind, rows: ReadonlyArray<Record<string, unknown>>): Promise<Uint8Array> {
  const columns = CATALOGUE_COLUMNS[kind];
  const { headers, body } = tableOf(kind, rows);
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Ampwarden';
  const sheet = workbook.addWorksheet(KIND_LABELS[kind].tab.slice(0, 31));
  sheet.addRow(headers).font = { bold: true };
  for (const values of body) {
    sheet.addRow(values.map((v, i) => (columns[i].type === 'decimal' && typeof v === 'string' ? Number(v) : v)));
  }
  sheet.columns.forEach((col) => (col.width = 18));
  sheet.views = [{ state: 'frozen', ySplit: 1 }];
  const notes = workbook.addWorksheet('About these columns');
  notes.addRow(['column', 'required', 'meaning']).font = { bold: true };
  for (const column of columns) {
    const allowed = column.options ? ` Allowed: ${column.options.join(', ')}.` : '';
    notes.addRow([column.header, column.required ? 'yes' : 'no', column.hint + allowed]);
  }
  notes.addRow([]);
  notes.addRow(['', '', 'Values are in SI units as named in each header. Rows whose key exists replace that row; new keys add rows; nothing is deleted. Only the first sheet is read.']);
  notes.columns = [{ width: 30 }, { width: 10 }, { width: 100 }];
  const buffer = await workbook.xlsx.writeBuffer();
  return new Uint8Array(buffer as unknown as ArrayBuffer);
}


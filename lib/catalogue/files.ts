/**
 * Catalogue files: reading uploaded CSV/XLSX into rows (with the refusals people need to read),
 * validating those rows against the kind's schema with row/column problems, and writing
 * templates and exports in the same column layout.
 *
 * Works on bytes (Uint8Array), not on Node buffers or browser Files, so it runs on either side.
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { z } from 'zod';
import { CATALOGUE_COLUMNS, KIND_LABELS, columnByField, columnByHeader, type ColumnSpec } from './columns';
import { ROW_SCHEMAS, type CatalogueKind, type CatalogueRowByKind } from './schemas';

import { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS } from './limits';

export { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS };

export type ImportFormat = 'csv' | 'xlsx';

/** A file we will not read at all; `status` is the HTTP status the API answers with. */
export class FileRefusal extends Error {
  constructor(
    readonly status: 400 | 413 | 415,
    readonly code: 'empty_file' | 'file_too_large' | 'unsupported_type' | 'not_text' | 'wrong_columns' | 'no_rows' | 'too_many_rows' | 'unreadable',
    message: string,
  ) {
    super(message);
    this.name = 'FileRefusal';
  }
}

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

function formatBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.ceil(bytes / 1024)} KB`;
}

/** Which reader a file needs, from its name; the content is checked against it afterwards. */
export function detectFormat(fileName: string): ImportFormat {
  const lower = fileName.toLowerCase();
  if (lower.endsWith('.csv')) return 'csv';
  if (lower.endsWith('.xlsx')) return 'xlsx';
  throw new FileRefusal(415, 'unsupported_type', `Only CSV (.csv) and Excel workbook (.xlsx) files can be imported; "${fileName}" is neither.`);
}

/** Checks that apply before reading: size and that the content matches the name. */
export function checkFile(fileName: string, bytes: Uint8Array): ImportFormat {
  if (bytes.byteLength === 0) throw new FileRefusal(400, 'empty_file', `"${fileName}" is empty.`);
  if (bytes.byteLength > MAX_IMPORT_BYTES) {
    throw new FileRefusal(
      413,
      'file_too_large',
      `"${fileName}" is larger than the ${formatBytes(MAX_IMPORT_BYTES)} limit (${bytes.byteLength.toLocaleString('en')} bytes). Split it into smaller files.`,
    );
  }
  const format = detectFormat(fileName);
  const isZip = bytes.byteLength >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
  if (format === 'xlsx' && !isZip) {
    throw new FileRefusal(415, 'unsupported_type', `"${fileName}" is named .xlsx but is not an Excel workbook. Save it from your spreadsheet as "Excel Workbook (.xlsx)".`);
  }
  if (format === 'csv' && (isZip || bytes.includes(0))) {
    throw new FileRefusal(415, 'not_text', `"${fileName}" is named .csv but holds binary data, not text. Save it from your spreadsheet as "CSV UTF-8".`);
  }
  return format;
}

function decodeText(fileName: string, bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
  } catch {
    throw new FileRefusal(415, 'not_text', `"${fileName}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".`);
  }
}

function isBlank(value: unknown): boolean {
  return value === null || value === undefined || (typeof value === 'string' && value.trim() === '');
}

function toTable(headers: unknown[], body: Array<{ row: number; cells: unknown[] }>): { headers: string[]; records: RawRecord[] } {
  const names = headers.map((h) => (h === null || h === undefined ? '' : String(h).trim().toLowerCase()));
  // Trailing empty header cells are spreadsheet noise, not columns.
  while (names.length > 0 && names[names.length - 1] === '') names.pop();
  const records: RawRecord[] = [];
  for (const { row, cells } of body) {
    if (cells.every(isBlank)) continue;
    const values: Record<string, unknown> = {};
    names.forEach((name, i) => {
      if (name !== '') values[name] = cells[i] ?? null;
    });
    records.push({ row, values });
  }
  return { headers: names, records };
}

function readCsv(fileName: string, bytes: Uint8Array) {
  const text = decodeText(fileName, bytes);
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) throw new FileRefusal(400, 'unreadable', `"${fileName}" could not be read as CSV: ${fatal.message} (row ${(fatal.row ?? 0) + 1}).`);
  const [headerRow = [], ...body] = parsed.data;
  return toTable(headerRow, body.map((cells, i) => ({ row: i + 2, cells })));
}

function cellValue(value: ExcelJS.CellValue): unknown {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number' || typeof value === 'string' || typeof value === 'boolean') return value;
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'object') {
    if ('richText' in value) return value.richText.map((part) => part.text).join('');
    if ('result' in value) return cellValue((value as ExcelJS.CellFormulaValue).result as ExcelJS.CellValue);
    if ('text' in value) return (value as ExcelJS.CellHyperlinkValue).text;
    if ('error' in value) return `#${String((value as ExcelJS.CellErrorValue).error)}`;
  }
  return String(value);
}

async function readXlsx(fileName: string, bytes: Uint8Array) {
  const workbook = new ExcelJS.Workbook();
  try {
    // exceljs accepts an ArrayBuffer on both sides; its typings say Buffer.
    const arrayBuffer = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength);
    await workbook.xlsx.load(arrayBuffer as unknown as Parameters<typeof workbook.xlsx.load>[0]);
  } catch {
    throw new FileRefusal(415, 'unreadable', `"${fileName}" could not be opened as an Excel workbook. Save it again as "Excel Workbook (.xlsx)".`);
  }
  const sheet = workbook.worksheets[0];
  if (!sheet) throw new FileRefusal(400, 'no_rows', `"${fileName}" has no worksheet.`);
  const rows: Array<{ row: number; cells: unknown[] }> = [];
  let headers: unknown[] = [];
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: unknown[] = [];
    for (let c = 1; c <= row.cellCount; c++) cells.push(cellValue(row.getCell(c).value));
    if (rowNumber === 1) headers = cells;
    else rows.push({ row: rowNumber, cells });
  });
  return toTable(headers, rows);
}

/** Reads a file into header names and raw records, refusing what is not a catalogue sheet of `kind`. */
export async function readCatalogueFile(kind: CatalogueKind, fileName: string, bytes: Uint8Array): Promise<RawRecord[]> {
  const format = checkFile(fileName, bytes);
  const { headers, records } = format === 'csv' ? readCsv(fileName, bytes) : await readXlsx(fileName, bytes);
  checkHeaders(kind, fileName, headers);
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
  const missing = columns.filter((c) => c.required && !headers.includes(c.header)).map((c) => c.header);
  const unknown = headers.filter((h) => h !== '' && !columnByHeader(kind, h));
  const duplicated = headers.filter((h, i) => h !== '' && headers.indexOf(h) !== i);
  const parts: string[] = [];
  if (missing.length) parts.push(`missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`);
  if (unknown.length) parts.push(`column${unknown.length > 1 ? 's' : ''} not recognised: ${unknown.join(', ')}`);
  if (duplicated.length) parts.push(`column${duplicated.length > 1 ? 's' : ''} given twice: ${[...new Set(duplicated)].join(', ')}`);
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

/** CSV in the import layout (SI units, decimal strings exactly as stored). */
export function writeCsv(kind: CatalogueKind, rows: ReadonlyArray<Record<string, unknown>>): string {
  const { headers, body } = tableOf(kind, rows);
  return Papa.unparse({ fields: headers, data: body.map((r) => r.map((v) => v ?? '')) }, { newline: '\r\n' });
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


/**
 * Schedule files: reading an uploaded CSV/XLSX into records (refusing what is not a schedule,
 * with words a designer can act on), and writing the template and the result exports.
 * Works on bytes (Uint8Array), so it runs in the browser and on the server alike.
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { columnByHeader, normaliseHeader, SCHEDULE_COLUMNS } from './columns';

export const MAX_SCHEDULE_BYTES = 4 * 1024 * 1024;
export const MAX_SCHEDULE_ROWS = 5000;

export type ScheduleFileFormat = 'csv' | 'xlsx';

/** A file we will not read; `status` is the HTTP status the API answers with. */
export class ScheduleFileRefusal extends Error {
  constructor(
    readonly status: 400 | 413 | 415,
    readonly code: 'empty_file' | 'file_too_large' | 'unsupported_type' | 'not_text' | 'wrong_columns' | 'no_rows' | 'too_many_rows' | 'unreadable',
    message: string,
  ) {
    super(message);
    this.name = 'ScheduleFileRefusal';
  }
}

export interface ScheduleRecord {
  /** Spreadsheet row number: the header is row 1. */
  row: number;
  /** Cells keyed by normalised header. */
  values: Record<string, unknown>;
}

function formatBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.ceil(bytes / 1024)} KB`;
}

/** Size, name and content checks before any parsing. */
export function checkScheduleFile(fileName: string, bytes: Uint8Array): ScheduleFileFormat {
  if (bytes.byteLength === 0) throw new ScheduleFileRefusal(400, 'empty_file', `"${fileName}" is empty.`);
  if (bytes.byteLength > MAX_SCHEDULE_BYTES) {
    throw new ScheduleFileRefusal(413, 'file_too_large', `"${fileName}" is ${formatBytes(bytes.byteLength)}; a schedule file may be at most ${formatBytes(MAX_SCHEDULE_BYTES)}. Split it into smaller schedules.`);
  }
  const lower = fileName.toLowerCase();
  const format: ScheduleFileFormat | null = lower.endsWith('.csv') ? 'csv' : lower.endsWith('.xlsx') ? 'xlsx' : null;
  if (!format) throw new ScheduleFileRefusal(415, 'unsupported_type', `Only CSV (.csv) and Excel workbook (.xlsx) schedules can be read; "${fileName}" is neither. Download the template to start from.`);
  const isZip = bytes.byteLength >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
  if (format === 'xlsx' && !isZip) {
    throw new ScheduleFileRefusal(415, 'unsupported_type', `"${fileName}" is named .xlsx but is not an Excel workbook. Save it from your spreadsheet as "Excel Workbook (.xlsx)".`);
  }
  if (format === 'csv' && (isZip || bytes.includes(0))) {
    throw new ScheduleFileRefusal(415, 'not_text', `"${fileName}" is named .csv but holds binary data, not text. Save it from your spreadsheet as "CSV UTF-8".`);
  }
  return format;
}

function isBlank(value: unknown): boolean {
  return value === null || value === undefined || (typeof value === 'string' && value.trim() === '');
}

function toRecords(fileName: string, headerCells: unknown[], body: Array<{ row: number; cells: unknown[] }>): ScheduleRecord[] {
  const headers = headerCells.map(normaliseHeader);
  while (headers.length > 0 && headers[headers.length - 1] === '') headers.pop();
  if (headers.length === 0) {
    throw new ScheduleFileRefusal(400, 'no_rows', `"${fileName}" has no header row. The first row must name the columns; download the template.`);
  }
  const missing = SCHEDULE_COLUMNS.filter((c) => c.required && !headers.includes(normaliseHeader(c.header))).map((c) => c.header);
  const unknown = [...new Set(headers.filter((h) => h !== '' && !columnByHeader(h)))];
  const duplicated = [...new Set(headers.filter((h, i) => h !== '' && headers.indexOf(h) !== i))];
  const parts: string[] = [];
  if (missing.length) parts.push(`missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`);
  if (unknown.length) parts.push(`column${unknown.length > 1 ? 's' : ''} not recognised: ${unknown.join(', ')}`);
  if (duplicated.length) parts.push(`column${duplicated.length > 1 ? 's' : ''} given twice: ${duplicated.join(', ')}`);
  if (parts.length) throw new ScheduleFileRefusal(400, 'wrong_columns', `"${fileName}" does not have the columns of a schedule: ${parts.join('; ')}. Download the template for the expected columns.`);

  const records: ScheduleRecord[] = [];
  for (const { row, cells } of body) {
    if (cells.every(isBlank)) continue;
    const values: Record<string, unknown> = {};
    headers.forEach((name, i) => {
      if (name !== '') values[name] = cells[i] ?? null;
    });
    records.push({ row, values });
  }
  if (records.length === 0) throw new ScheduleFileRefusal(400, 'no_rows', `"${fileName}" has a header but no circuits.`);
  if (records.length > MAX_SCHEDULE_ROWS) {
    throw new ScheduleFileRefusal(413, 'too_many_rows', `"${fileName}" has ${records.length} circuits; a schedule may hold at most ${MAX_SCHEDULE_ROWS}. Split it into smaller schedules.`);
  }
  return records;
}

function readCsv(fileName: string, bytes: Uint8Array): ScheduleRecord[] {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
  } catch {
    throw new ScheduleFileRefusal(415, 'not_text', `"${fileName}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".`);
  }
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) throw new ScheduleFileRefusal(400, 'unreadable', `"${fileName}" could not be read as CSV: ${fatal.message} (row ${(fatal.row ?? 0) + 1}).`);
  const [headerRow = [], ...body] = parsed.data;
  return toRecords(fileName, headerRow, body.map((cells, i) => ({ row: i + 2, cells })));
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

async function readXlsx(fileName: string, bytes: Uint8Array): Promise<ScheduleRecord[]> {
  const workbook = new ExcelJS.Workbook();
  try {
    const arrayBuffer = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength);
    await workbook.xlsx.load(arrayBuffer as unknown as Parameters<typeof workbook.xlsx.load>[0]);
  } catch {
    throw new ScheduleFileRefusal(415, 'unreadable', `"${fileName}" could not be opened as an Excel workbook. Save it again as "Excel Workbook (.xlsx)".`);
  }
  const sheet = workbook.worksheets[0];
  if (!sheet) throw new ScheduleFileRefusal(400, 'no_rows', `"${fileName}" has no worksheet.`);
  let headers: unknown[] = [];
  const body: Array<{ row: number; cells: unknown[] }> = [];
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: unknown[] = [];
    for (let c = 1; c <= row.cellCount; c++) cells.push(cellValue(row.getCell(c).value));
    if (rowNumber === 1) headers = cells;
    else body.push({ row: rowNumber, cells });
  });
  return toRecords(fileName, headers, body);
}

/** Reads a schedule file into records, or throws ScheduleFileRefusal saying why not. */
export async function readScheduleFile(fileName: string, bytes: Uint8Array): Promise<ScheduleRecord[]> {
  const format = checkScheduleFile(fileName, bytes);
  return format === 'csv' ? readCsv(fileName, bytes) : readXlsx(fileName, bytes);
}

// ── writing ──

export interface Table {
  headers: string[];
  rows: Array<Array<string | number | null>>;
}

export function tableToCsv(table: Table): string {
  return Papa.unparse({ fields: table.headers, data: table.rows.map((r) => r.map((v) => v ?? '')) }, { newline: '\r\n' });
}

export async function tableToXlsx(table: Table, sheetName: string, notes?: Array<[string, string]>): Promise<Uint8Array> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Ampwarden';
  const sheet = workbook.addWorksheet(sheetName.slice(0, 31));
  sheet.addRow(table.headers).font = { bold: true };
  for (const row of table.rows) sheet.addRow(row);
  sheet.columns.forEach((col) => (col.width = 18));
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
      ? { circuitTag: 'B-201', from: 'TX-1', to: 'MSB-1', designCurrentA: 1600, lengthM: 12, installation: 'bar on edge', family: bars, depthM: null, ambientC: 40, faultCurrentKA: 35, clearingTimeS: 0.5, maxParallel: 2, temperatureLimitC: 105 }
      : { circuitTag: 'F-102', to: 'EV chargers', designCurrentA: 160, lengthM: 85, installation: 'buried', depthM: 0.7, ambientC: 20 };
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

/**
 * Uploaded spreadsheets (CSV or XLSX) read into a header row and body rows, with the refusals a
 * person can act on: empty, too large, a type we do not read, a name that lies about the content,
 * text that is not UTF-8, a workbook that will not open. Shared by the catalogue import and the
 * schedule upload, which then check their own columns and rows.
 *
 * Works on bytes (Uint8Array), not on Node buffers or browser Files, so it runs on either side.
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';

export type SpreadsheetFormat = 'csv' | 'xlsx';

export type FileRefusalCode = 'empty_file' | 'file_too_large' | 'unsupported_type' | 'not_text' | 'wrong_columns' | 'no_rows' | 'too_many_rows' | 'unreadable';

/** A file we will not read; `status` is the HTTP status the API answers with. */
export class FileRefusal extends Error {
  constructor(
    readonly status: 400 | 413 | 415,
    readonly code: FileRefusalCode,
    message: string,
  ) {
    super(message);
    this.name = 'FileRefusal';
  }
}

export function formatBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.ceil(bytes / 1024)} KB`;
}

export interface UploadRules {
  maxBytes: number;
  /** What the file is, for the messages: "schedule", "catalogue file". */
  what: string;
  /** Advice after a refusal for the wrong type, e.g. "Download the template to start from." */
  typeAdvice?: string;
  /** Advice after a refusal for size, e.g. "Split it into smaller schedules." */
  sizeAdvice: string;
}

/** Size, name and content checks before any parsing; returns the reader the file needs. */
export function checkSpreadsheetFile(fileName: string, bytes: Uint8Array, rules: UploadRules): SpreadsheetFormat {
  if (bytes.byteLength === 0) throw new FileRefusal(400, 'empty_file', `"${fileName}" is empty.`);
  if (bytes.byteLength > rules.maxBytes) {
    throw new FileRefusal(
      413,
      'file_too_large',
      `"${fileName}" is larger than the ${formatBytes(rules.maxBytes)} limit for a ${rules.what} (${bytes.byteLength.toLocaleString('en')} bytes). ${rules.sizeAdvice}`,
    );
  }
  const lower = fileName.toLowerCase();
  const format: SpreadsheetFormat | null = lower.endsWith('.csv') ? 'csv' : lower.endsWith('.xlsx') ? 'xlsx' : null;
  if (!format) {
    throw new FileRefusal(415, 'unsupported_type', `Only CSV (.csv) and Excel workbook (.xlsx) files can be read as a ${rules.what}; "${fileName}" is neither.${rules.typeAdvice ? ` ${rules.typeAdvice}` : ''}`);
  }
  const isZip = bytes.byteLength >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
  if (format === 'xlsx' && !isZip) {
    throw new FileRefusal(415, 'unsupported_type', `"${fileName}" is named .xlsx but is not an Excel workbook. Save it from your spreadsheet as "Excel Workbook (.xlsx)".`);
  }
  if (format === 'csv' && (isZip || bytes.includes(0))) {
    throw new FileRefusal(415, 'not_text', `"${fileName}" is named .csv but holds binary data, not text. Save it from your spreadsheet as "CSV UTF-8".`);
  }
  return format;
}

export interface SpreadsheetRows {
  headerCells: unknown[];
  /** Rows after the header, numbered as a spreadsheet shows them (the header is row 1). */
  body: Array<{ row: number; cells: unknown[] }>;
}

function readCsv(fileName: string, bytes: Uint8Array): SpreadsheetRows {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
  } catch {
    throw new FileRefusal(415, 'not_text', `"${fileName}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".`);
  }
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) throw new FileRefusal(400, 'unreadable', `"${fileName}" could not be read as CSV: ${fatal.message} (row ${(fatal.row ?? 0) + 1}).`);
  const [headerCells = [], ...body] = parsed.data;
  return { headerCells, body: body.map((cells, i) => ({ row: i + 2, cells })) };
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

async function readXlsx(fileName: string, bytes: Uint8Array): Promise<SpreadsheetRows> {
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
  let headerCells: unknown[] = [];
  const body: SpreadsheetRows['body'] = [];
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: unknown[] = [];
    for (let c = 1; c <= row.cellCount; c++) cells.push(cellValue(row.getCell(c).value));
    if (rowNumber === 1) headerCells = cells;
    else body.push({ row: rowNumber, cells });
  });
  return { headerCells, body };
}

/** Checks the file, then reads its first sheet into the header cells and the body rows. */
export async function readSpreadsheet(fileName: string, bytes: Uint8Array, rules: UploadRules): Promise<SpreadsheetRows> {
  const format = checkSpreadsheetFile(fileName, bytes, rules);
  return format === 'csv' ? readCsv(fileName, bytes) : readXlsx(fileName, bytes);
}

function isBlankCell(value: unknown): boolean {
  return value === null || value === undefined || (typeof value === 'string' && value.trim() === '');
}

/** The non-blank body rows as records keyed by the header names (an empty name drops its column). */
export function keyRowsByHeader(names: readonly string[], body: SpreadsheetRows['body']): Array<{ row: number; values: Record<string, unknown> }> {
  const records: Array<{ row: number; values: Record<string, unknown> }> = [];
  for (const { row, cells } of body) {
    if (cells.every(isBlankCell)) continue;
    const values: Record<string, unknown> = {};
    names.forEach((name, i) => {
      if (name !== '') values[name] = cells[i] ?? null;
    });
    records.push({ row, values });
  }
  return records;
}

/**
 * What is wrong with a header row, in words: missing required columns (named as the template
 * names them), unknown ones, repeated ones. `headers` and `required[].name` are compared as given.
 */
export function columnProblems(
  headers: readonly string[],
  required: ReadonlyArray<{ name: string; label: string }>,
  isKnown: (header: string) => boolean,
): string[] {
  const missing = required.filter((r) => !headers.includes(r.name)).map((r) => r.label);
  const unknown = [...new Set(headers.filter((h) => h !== '' && !isKnown(h)))];
  const duplicated = [...new Set(headers.filter((h, i) => h !== '' && headers.indexOf(h) !== i))];
  const parts: string[] = [];
  if (missing.length) parts.push(`missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`);
  if (unknown.length) parts.push(`column${unknown.length > 1 ? 's' : ''} not recognised: ${unknown.join(', ')}`);
  if (duplicated.length) parts.push(`column${duplicated.length > 1 ? 's' : ''} given twice: ${duplicated.join(', ')}`);
  return parts;
}

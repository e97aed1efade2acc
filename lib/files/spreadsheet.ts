/**
 * Uploaded spreadsheets (CSV or XLSX) read into a header row and body rows, with the refusals a
 * person can act on: empty, too large, a type we do not read, a name that lies about the content,
 * text that is not UTF-8, a workbook that will not open, and more rows or more unpacked data than
 * a schedule or catalogue file can need. Shared by the catalogue import and the schedule upload,
 * which then check their own columns and rows.
 *
 * The limits hold while the file is read, before anything big is built: a CSV stops at the first
 * row past the limit; a workbook's parts are inflated one by one with the unpacked bytes counted
 * (a small file can unpack to gigabytes — a "zip bomb") and its worksheets' rows and cells counted,
 * all before exceljs builds its model of the workbook. The server also runs this off the request
 * thread (server/files/uploadReader.ts), so that even a file within the limits cannot stall other
 * requests.
 *
 * Works on bytes (Uint8Array) and web-standard streams (DecompressionStream), not on Node buffers
 * or browser Files, so it runs on either side.
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { decimalSeparatorOfDelimiter, type DecimalSeparator } from '../units/parse';

export type SpreadsheetFormat = 'csv' | 'xlsx';

export type FileRefusalCode =
  | 'empty_file'
  | 'file_too_large'
  | 'unsupported_type'
  | 'not_text'
  | 'wrong_columns'
  | 'no_rows'
  | 'too_many_rows'
  | 'too_many_cells'
  | 'workbook_too_large'
  | 'too_complex'
  | 'unreadable';

/** A file we will not read; `status` is the HTTP status the API answers with. */
export class FileRefusal extends Error {
  constructor(
    readonly status: 400 | 413 | 415 | 422,
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

/** Unpacked size of all parts of a workbook together; a 5,000-row schedule needs a few MB. */
export const MAX_UNPACKED_BYTES = 24 * 1024 * 1024;
/** Cells a row of a workbook may average; the widest template has 16 columns. */
export const MAX_CELLS_PER_ROW = 64;
/** Parts (files) inside a workbook; one saved by a spreadsheet program has a dozen or two. */
export const MAX_ZIP_ENTRIES = 500;

export interface UploadRules {
  maxBytes: number;
  /** Body rows (after the header) the file may hold; checked while reading. */
  maxRows: number;
  /** What the file is, for the messages: "schedule", "catalogue file". */
  what: string;
  /** What its rows are, for the messages: "circuits", "rows". */
  rowNoun: string;
  /** Advice after a refusal for the wrong type, e.g. "Download the template to start from." */
  typeAdvice?: string;
  /** Advice after a refusal for size, e.g. "Split it into smaller schedules." */
  sizeAdvice: string;
  /** Unpacked bytes of a workbook (default MAX_UNPACKED_BYTES). */
  maxUnpackedBytes?: number;
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
  /** Rows after the header, numbered as a spreadsheet shows them (the header is row 1). Blank rows are left out. */
  body: Array<{ row: number; cells: unknown[] }>;
  /**
   * The decimal mark the file's text cells use (lib/units/parse): ',' for a semicolon-delimited CSV
   * (the usual export where the comma is the decimal mark, common practice), '.' otherwise. XLSX
   * numbers are numbers and need none.
   */
  decimalSeparator: DecimalSeparator;
}

/**
 * The delimiter of a CSV from its header line: ';' when the line holds more semicolons than commas
 * (outside quotes), else papaparse's own guess. The header decides because its cells are words:
 * a data row's decimal commas would count as delimiters.
 */
function csvDelimiterOf(text: string): ';' | undefined {
  const firstLine = text.split(/\r?\n/, 1)[0] ?? '';
  const unquoted = firstLine.replace(/"[^"]*"/g, '');
  const count = (ch: string) => unquoted.split(ch).length - 1;
  return count(';') > count(',') ? ';' : undefined;
}

function tooManyRows(fileName: string, rules: UploadRules): FileRefusal {
  return new FileRefusal(
    413,
    'too_many_rows',
    `"${fileName}" has more than ${rules.maxRows.toLocaleString('en')} ${rules.rowNoun}; a ${rules.what} may hold at most ${rules.maxRows.toLocaleString('en')}. ${rules.sizeAdvice}`,
  );
}

function readCsv(fileName: string, bytes: Uint8Array, rules: UploadRules): SpreadsheetRows {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
  } catch {
    throw new FileRefusal(415, 'not_text', `"${fileName}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".`);
  }
  let headerCells: unknown[] | null = null;
  const body: SpreadsheetRows['body'] = [];
  let rowNumber = 0;
  let refusal: FileRefusal | null = null;
  const delimiter = csvDelimiterOf(text);
  let seenDelimiter: string | undefined = delimiter;
  // Row by row (papaparse's step), so that the row limit stops the reading instead of following it.
  Papa.parse<string[]>(text, {
    header: false,
    skipEmptyLines: false,
    ...(delimiter ? { delimiter } : {}),
    step: (result, parser) => {
      rowNumber += 1;
      seenDelimiter ??= result.meta.delimiter;
      const quotes = result.errors.find((e) => e.type === 'Quotes');
      if (quotes) {
        refusal = new FileRefusal(400, 'unreadable', `"${fileName}" could not be read as CSV: ${quotes.message} (row ${rowNumber}).`);
        parser.abort();
        return;
      }
      if (headerCells === null) {
        headerCells = result.data;
        return;
      }
      if (result.data.every(isBlankCell)) return;
      if (body.length >= rules.maxRows) {
        refusal = tooManyRows(fileName, rules);
        parser.abort();
        return;
      }
      body.push({ row: rowNumber, cells: result.data });
    },
  });
  if (refusal) throw refusal;
  return { headerCells: headerCells ?? [], body, decimalSeparator: decimalSeparatorOfDelimiter(seenDelimiter, '.') };
}

// ── workbooks: the zip container, read with its limits before exceljs sees it ──

interface ZipEntry {
  name: string;
  method: number;
  compressedSize: number;
  localHeaderOffset: number;
}

function unreadableWorkbook(fileName: string): FileRefusal {
  return new FileRefusal(415, 'unreadable', `"${fileName}" could not be opened as an Excel workbook. Save it again as "Excel Workbook (.xlsx)".`);
}

/** The entries of the zip's central directory (APPNOTE.TXT §4.3.12, §4.3.16); zip64 is not needed for files this small. */
function zipEntries(fileName: string, bytes: Uint8Array): ZipEntry[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const END_OF_DIRECTORY = 0x06054b50;
  let end = -1;
  for (let at = bytes.byteLength - 22; at >= Math.max(0, bytes.byteLength - 22 - 0xffff); at -= 1) {
    if (view.getUint32(at, true) === END_OF_DIRECTORY) {
      end = at;
      break;
    }
  }
  if (end < 0) throw unreadableWorkbook(fileName);
  const count = view.getUint16(end + 10, true);
  const directoryOffset = view.getUint32(end + 16, true);
  if (count > MAX_ZIP_ENTRIES) {
    throw new FileRefusal(413, 'too_complex', `"${fileName}" holds ${count.toLocaleString('en')} parts; a workbook may hold at most ${MAX_ZIP_ENTRIES}. Save it again from your spreadsheet as "Excel Workbook (.xlsx)".`);
  }
  const entries: ZipEntry[] = [];
  let at = directoryOffset;
  for (let i = 0; i < count; i += 1) {
    if (at + 46 > bytes.byteLength || view.getUint32(at, true) !== 0x02014b50) throw unreadableWorkbook(fileName);
    const nameLength = view.getUint16(at + 28, true);
    const extraLength = view.getUint16(at + 30, true);
    const commentLength = view.getUint16(at + 32, true);
    if (at + 46 + nameLength > bytes.byteLength) throw unreadableWorkbook(fileName);
    entries.push({
      name: new TextDecoder().decode(bytes.subarray(at + 46, at + 46 + nameLength)),
      method: view.getUint16(at + 10, true),
      compressedSize: view.getUint32(at + 20, true),
      localHeaderOffset: view.getUint32(at + 42, true),
    });
    at += 46 + nameLength + extraLength + commentLength;
  }
  return entries;
}

/** The stored (still compressed) bytes of one entry, from its local header (APPNOTE.TXT §4.3.7). */
function entryData(fileName: string, bytes: Uint8Array, entry: ZipEntry): Uint8Array {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const at = entry.localHeaderOffset;
  if (at + 30 > bytes.byteLength || view.getUint32(at, true) !== 0x04034b50) throw unreadableWorkbook(fileName);
  const start = at + 30 + view.getUint16(at + 26, true) + view.getUint16(at + 28, true);
  if (start + entry.compressedSize > bytes.byteLength) throw unreadableWorkbook(fileName);
  return bytes.subarray(start, start + entry.compressedSize);
}

/** Inflates one entry chunk by chunk, handing each chunk on; stops as soon as `budget` bytes are exceeded. */
async function inflateEntry(fileName: string, data: Uint8Array, method: number, budget: number, onChunk: (chunk: Uint8Array) => void): Promise<number> {
  if (method === 0) {
    if (data.byteLength > budget) return data.byteLength;
    onChunk(data);
    return data.byteLength;
  }
  if (method !== 8) throw unreadableWorkbook(fileName);
  const source = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(data);
      controller.close();
    },
  });
  const reader = source.pipeThrough(new DecompressionStream('deflate-raw') as unknown as ReadableWritablePair<Uint8Array, Uint8Array>).getReader();
  let total = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return total;
      total += value.byteLength;
      if (total > budget) {
        await reader.cancel().catch(() => {});
        return total;
      }
      onChunk(value);
    }
  } catch (error) {
    if (error instanceof FileRefusal) throw error;
    throw unreadableWorkbook(fileName);
  }
}

/** Counts `<row …>` and `<c …>` start tags (with or without a namespace prefix) across chunk boundaries. */
class SheetTagCounter {
  rows = 0;
  cells = 0;
  private tail = '';
  private readonly decoder = new TextDecoder('latin1');
  private static readonly TAG = /<(?:[A-Za-z_][\w.-]{0,40}:)?(row|c)[\s>/]/g;

  add(chunk: Uint8Array): void {
    const text = this.tail + this.decoder.decode(chunk, { stream: true });
    const tailLength = this.tail.length;
    for (const match of text.matchAll(SheetTagCounter.TAG)) {
      // A tag wholly inside the carried tail was counted with the previous chunk.
      if ((match.index ?? 0) + match[0].length <= tailLength) continue;
      if (match[1] === 'row') this.rows += 1;
      else this.cells += 1;
    }
    this.tail = text.slice(-64);
  }
}

const WORKSHEET_PART = /^xl\/worksheets\/[^/]+\.xml$/i;

/** Inflates every part once within the limits, counting the worksheets' rows and cells; throws the refusal that applies. */
async function checkWorkbookLimits(fileName: string, bytes: Uint8Array, rules: UploadRules): Promise<void> {
  const maxUnpacked = rules.maxUnpackedBytes ?? MAX_UNPACKED_BYTES;
  const maxCells = (rules.maxRows + 1) * MAX_CELLS_PER_ROW;
  let unpacked = 0;
  let cells = 0;
  for (const entry of zipEntries(fileName, bytes)) {
    if (entry.name.endsWith('/')) continue;
    const counter = WORKSHEET_PART.test(entry.name) ? new SheetTagCounter() : null;
    const budget = maxUnpacked - unpacked;
    const size = await inflateEntry(fileName, entryData(fileName, bytes, entry), entry.method, budget, (chunk) => {
      if (!counter) return;
      counter.add(chunk);
      if (counter.rows > rules.maxRows + 1) throw tooManyRows(fileName, rules);
      if (cells + counter.cells > maxCells) {
        throw new FileRefusal(
          413,
          'too_many_cells',
          `"${fileName}" holds more than ${maxCells.toLocaleString('en')} cells; a ${rules.what} of ${rules.maxRows.toLocaleString('en')} ${rules.rowNoun} may hold at most that many (${MAX_CELLS_PER_ROW} a row). Delete unused columns, or ${rules.sizeAdvice.charAt(0).toLowerCase()}${rules.sizeAdvice.slice(1)}`,
        );
      }
    });
    unpacked += size;
    if (unpacked > maxUnpacked) {
      throw new FileRefusal(
        413,
        'workbook_too_large',
        `"${fileName}" unpacks to more than ${formatBytes(maxUnpacked)}, the limit for a ${rules.what} workbook. Save only the sheet with the table, or ${rules.sizeAdvice.charAt(0).toLowerCase()}${rules.sizeAdvice.slice(1)}`,
      );
    }
    cells += counter?.cells ?? 0;
  }
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

async function readXlsx(fileName: string, bytes: Uint8Array, rules: UploadRules): Promise<SpreadsheetRows> {
  await checkWorkbookLimits(fileName, bytes, rules);
  const workbook = new ExcelJS.Workbook();
  try {
    // exceljs accepts an ArrayBuffer on both sides; its typings say Buffer.
    const arrayBuffer = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength);
    await workbook.xlsx.load(arrayBuffer as unknown as Parameters<typeof workbook.xlsx.load>[0]);
  } catch {
    throw unreadableWorkbook(fileName);
  }
  const sheet = workbook.worksheets[0];
  if (!sheet) throw new FileRefusal(400, 'no_rows', `"${fileName}" has no worksheet.`);
  let headerCells: unknown[] = [];
  const body: SpreadsheetRows['body'] = [];
  sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
    const cells: unknown[] = [];
    for (let c = 1; c <= row.cellCount; c++) cells.push(cellValue(row.getCell(c).value));
    if (rowNumber === 1) headerCells = cells;
    else if (!cells.every(isBlankCell)) body.push({ row: rowNumber, cells });
  });
  if (body.length > rules.maxRows) throw tooManyRows(fileName, rules);
  return { headerCells, body, decimalSeparator: '.' };
}

/** Checks the file, then reads its first sheet into the header cells and the body rows, within the limits of `rules`. */
export async function readSpreadsheet(fileName: string, bytes: Uint8Array, rules: UploadRules): Promise<SpreadsheetRows> {
  const format = checkSpreadsheetFile(fileName, bytes, rules);
  return format === 'csv' ? readCsv(fileName, bytes, rules) : readXlsx(fileName, bytes, rules);
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

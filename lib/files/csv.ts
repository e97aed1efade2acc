/**
 * The one CSV writer of every Ampwarden export (catalogue, schedule template and results,
 * candidate comparison, verification report): RFC 4180 fields, CRLF line ends, and cells that a
 * spreadsheet would run as a formula made inert.
 *
 * CSV injection (OWASP, "CSV Injection"): a cell whose text begins with `=`, `+`, `-`, `@`, a tab
 * (0x09) or a carriage return (0x0D) is read as a formula by Excel, LibreOffice and others. Such a
 * cell is prefixed with a single quote, which those programs show as text, and the field is
 * quoted. Numbers written as numbers, and text that is exactly a plain decimal number ("-12.5",
 * "+3e-4"), cannot hold a formula and are left as they are, so negative values stay numbers.
 *
 * Pure and dependency-free, so that it runs in the browser and on the server alike.
 */
export type CsvCell = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const NEEDS_QUOTES = /[",\r\n]|^\s|\s$/;

/** True when a spreadsheet would treat this text as the start of a formula. */
export function startsLikeFormula(text: string): boolean {
  return FORMULA_START.test(text) && !PLAIN_NUMBER.test(text);
}

/** One field: empty for null, formula-leading text prefixed with `'`, quoted when it must be. */
export function csvField(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  let text = String(value);
  const formula = startsLikeFormula(text);
  if (formula) text = `'${text}`;
  return formula || NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows of cells as CSV text (CRLF between rows, none after the last). */
export function toCsv(rows: ReadonlyArray<ReadonlyArray<CsvCell>>): string {
  return rows.map((row) => row.map(csvField).join(',')).join('\r\n');
}

/** A header row and body rows as CSV text. */
export function tableCsv(headers: ReadonlyArray<string>, rows: ReadonlyArray<ReadonlyArray<CsvCell>>): string {
  return toCsv([headers, ...rows]);
}

/**
 * The candidate comparison of a saved sheet as CSV or XLSX, from the stored result snapshot (never
 * from a browser's live numbers): one row per candidate, SI units in the headers, amounts rounded
 * to cents. Lines above the table say which sheet, which solver and that the caution applies, and
 * list the inputs the candidates were rated for (the PDF's printed inputs, the same rows).
 */
import ExcelJS from 'exceljs';
import { CAUTION_TEXT } from '@/lib/caution';
import { CANDIDATE_EXPORT_COLUMNS, candidateExportHeaders, candidateRecords, formatDate, inputRows, MONEY_EXPORT_HEADERS } from '@/lib/sheet/sheetTables';
import type { SheetRecord } from '@/db/queries/sheets';
import { tableCsv, toCsv } from '@/lib/files/csv';
import { downloadResponse } from '@/server/http/download';
import { STATUS_LABELS } from '@/lib/sheet/stateMachine';

export type ExportFormat = 'csv' | 'xlsx';

function aboutLines(sheet: SheetRecord): [string, string][] {
  return [
    ['sizing sheet', `${sheet.circuitTag} — ${sheet.title}`],
    ['project', sheet.projectName],
    ['revision', `${sheet.revision} (saved version ${sheet.version}), ${STATUS_LABELS[sheet.status]}`],
    ['result computed', `${formatDate(sheet.result?.computedAt)} by ${sheet.solverVersion ?? 'unknown solver'}`],
    ['currency', `${sheet.teamCurrency} (the team's; amounts rounded to cents)`],
    ['units', 'SI, as each header names them; fault currents in kA'],
    ['caution', CAUTION_TEXT.join(' ')],
  ];
}

/** The inputs as the PDF prints them: section, quantity, value, unit. */
function inputLines(sheet: SheetRecord): string[][] {
  return [['input section', 'input', 'value', 'unit'], ...inputRows(sheet.inputs, sheet.teamCurrency).map((r) => [r.section, r.label, r.value, r.unit])];
}

export function candidateTable(sheet: SheetRecord): { headers: string[]; rows: (string | number | null)[][] } {
  const records = candidateRecords(sheet.inputs.candidates, sheet.result);
  return {
    headers: candidateExportHeaders(sheet.teamCurrency),
    rows: records.map((r) => CANDIDATE_EXPORT_COLUMNS.map((c) => c.value(r))),
  };
}

/** The about lines, an empty line, then the table (the shared CSV writer: RFC 4180, formula cells made inert). */
export function candidatesCsv(sheet: SheetRecord): string {
  const table = candidateTable(sheet);
  return `${toCsv(aboutLines(sheet))}\r\n\r\n${toCsv(inputLines(sheet))}\r\n\r\n${tableCsv(table.headers, table.rows)}\r\n`;
}

/** Sheet "Candidates" holds the table alone (so it sorts and filters); sheet "About" the rest. */
export async function candidatesXlsx(sheet: SheetRecord): Promise<Uint8Array> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Ampwarden';
  const table = candidateTable(sheet);
  const grid = workbook.addWorksheet('Candidates', { views: [{ state: 'frozen', ySplit: 1 }] });
  grid.addRow(table.headers).font = { bold: true };
  for (const row of table.rows) grid.addRow(row.map((v) => (v === null ? null : v)));
  // Money as numbers with a number format (sortable, summable), never as text.
  CANDIDATE_EXPORT_COLUMNS.forEach((c, i) => {
    if (MONEY_EXPORT_HEADERS.has(c.header)) grid.getColumn(i + 1).numFmt = '#,##0.00';
  });
  grid.columns.forEach((column, i) => {
    column.width = Math.min(40, Math.max(10, table.headers[i].length + 2));
  });
  const about = workbook.addWorksheet('About');
  for (const line of aboutLines(sheet)) about.addRow(line);
  about.getColumn(1).width = 18;
  about.getColumn(2).width = 120;
  const inputs = workbook.addWorksheet('Inputs');
  for (const line of inputLines(sheet)) inputs.addRow(line);
  inputs.getRow(1).font = { bold: true };
  inputs.columns.forEach((column, i) => {
    column.width = [18, 40, 24, 10][i] ?? 12;
  });
  return new Uint8Array(await workbook.xlsx.writeBuffer());
}

export function exportResponse(body: string | Uint8Array, stem: string, format: ExportFormat): Response {
  return downloadResponse(body, { fileName: `${stem}.${format}`, kind: format });
}

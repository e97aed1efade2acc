/**
 * The candidate comparison of a saved sheet as CSV or XLSX, from the stored result snapshot (never
 * from a browser's live numbers): one row per candidate, SI units in the headers, values unrounded.
 * A few lines above the table say which sheet, which solver and that the caution applies.
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { CAUTION_TEXT } from '@/lib/caution';
import { CANDIDATE_EXPORT_COLUMNS, candidateRecords, formatDate } from '@/lib/sheet/sheetTables';
import type { SheetRecord } from '@/db/queries/sheets';
import { STATUS_LABELS } from '@/lib/sheet/stateMachine';

export type ExportFormat = 'csv' | 'xlsx';

function aboutLines(sheet: SheetRecord): [string, string][] {
  return [
    ['sizing sheet', `${sheet.circuitTag} — ${sheet.title}`],
    ['project', sheet.projectName],
    ['revision', `${sheet.revision} (saved version ${sheet.version}), ${STATUS_LABELS[sheet.status]}`],
    ['result computed', `${formatDate(sheet.result?.computedAt)} by ${sheet.solverVersion ?? 'unknown solver'}`],
    ['caution', CAUTION_TEXT.join(' ')],
  ];
}

export function candidateTable(sheet: SheetRecord): { headers: string[]; rows: (string | number | null)[][] } {
  const records = candidateRecords(sheet.inputs.candidates, sheet.result);
  return {
    headers: CANDIDATE_EXPORT_COLUMNS.map((c) => c.header),
    rows: records.map((r) => CANDIDATE_EXPORT_COLUMNS.map((c) => c.value(r))),
  };
}

/** The about lines, an empty line, then the table (RFC 4180 quoting by papaparse). */
export function candidatesCsv(sheet: SheetRecord): string {
  const about = Papa.unparse(aboutLines(sheet), { newline: '\r\n' });
  const table = candidateTable(sheet);
  const body = Papa.unparse({ fields: table.headers, data: table.rows.map((row) => row.map((v) => v ?? '')) }, { newline: '\r\n' });
  return `${about}\r\n\r\n${body}\r\n`;
}

/** Sheet "Candidates" holds the table alone (so it sorts and filters); sheet "About" the rest. */
export async function candidatesXlsx(sheet: SheetRecord): Promise<Uint8Array> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Ampwarden';
  const table = candidateTable(sheet);
  const grid = workbook.addWorksheet('Candidates', { views: [{ state: 'frozen', ySplit: 1 }] });
  grid.addRow(table.headers).font = { bold: true };
  for (const row of table.rows) grid.addRow(row.map((v) => (v === null ? null : v)));
  grid.columns.forEach((column, i) => {
    column.width = Math.min(40, Math.max(10, table.headers[i].length + 2));
  });
  const about = workbook.addWorksheet('About');
  for (const line of aboutLines(sheet)) about.addRow(line);
  about.getColumn(1).width = 18;
  about.getColumn(2).width = 120;
  return new Uint8Array(await workbook.xlsx.writeBuffer());
}

export function exportResponse(body: string | Uint8Array, stem: string, format: ExportFormat): Response {
  const type = format === 'csv' ? 'text/csv; charset=utf-8' : 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
  // A BOM so that spreadsheet programs read the CSV (units such as mm², °C) as UTF-8.
  const payload = typeof body === 'string' ? `\uFEFF${body}` : body;
  return new Response(payload as BodyInit, {
    headers: { 'content-type': type, 'content-disposition': `attachment; filename="${stem}.${format}"`, 'cache-control': 'private, no-store' },
  });
}

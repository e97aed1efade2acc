// The PDF sizing sheet and the candidate exports of a saved sheet, read back: the PDF's text
// (extracted with unpdf) names the circuit, the chosen section, the hot spot and the limit of the
// saved snapshot, every flag code of the chosen candidate and the cautions, and a sheet that is not
// approved says "NOT APPROVED" on every page. The CSV and XLSX hold the saved snapshot's numbers.
import { flagTitle } from '@/lib/sheet/flagWords';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { getSheet, type SheetRecord } from '@/db/queries/sheets';
import { CAUTION_TEXT } from '@/lib/caution';
import { chosenEvaluation } from '@/lib/sheet';
import { formatNumber } from '@/lib/units';
import { renderSheetPdf } from '@/server/pdf/renderSheetPdf';
import { pdfSafeText } from '@/server/pdf/pdfText';
import { NOT_APPROVED_MARK } from '@/server/pdf/SizingSheetDocument';
import { candidatesCsv, candidatesXlsx } from '@/server/share/candidateExport';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { makeSharedSheet } from './shareFixtures';

afterAll(() => closeDb());

let sheet: SheetRecord;

beforeAll(async () => {
  const team = await createTestTeam('share-docs');
  const designer = (await createTestUser(team.id, 'designer')) as { id: string; role: 'designer' };
  const made = await makeSharedSheet(team.id, designer, 'Docs');
  sheet = (await getSheet(team.id, made.sheetId))!;
});

/** Text of each page, whitespace folded (line breaks in the PDF become spaces). */
async function pagesOf(pdf: Buffer): Promise<string[]> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: false });
  return (text as string[]).map((page) => page.replace(/\s+/g, ' '));
}

describe('the PDF sizing sheet', () => {
  it('names the circuit, the chosen section, the hot spot and limit, every flag code and the cautions; a draft says NOT APPROVED on every page', async () => {
    const pdf = await renderSheetPdf(sheet, new Date('2026-01-01T00:00:00Z'));
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const pages = await pagesOf(pdf);
    const all = pages.join(' ');
    const chosen = chosenEvaluation(sheet.result)!;
    expect(chosen.id).toBe('cu-xlpe-240');
    expect(all).toContain(sheet.circuitTag);
    expect(all).toContain(sheet.title);
    expect(all).toContain(sheet.projectName);
    expect(all).toContain(chosen.label);
    expect(all).toContain('240 mm²');
    expect(all).toContain(`Hot spot ${formatNumber(chosen.hotSpotC!, 4)} °C`);
    expect(all).toContain(`Limit ${formatNumber(chosen.limit.temperatureC, 4)} °C`);
    expect(all).toContain(`${formatNumber(chosen.ampacityA, 4)} A`);
    const codes = sheet.result!.chosenFlags.map((f) => f.code);
    expect(codes.length).toBeGreaterThan(0);
    // Each flag by its title, never its code (issue 22).
    for (const code of codes) expect(all).toContain(pdfSafeText(flagTitle(code)));
    for (const code of codes) expect(all).not.toContain(code);
    for (const line of CAUTION_TEXT) expect(all).toContain(line);
    expect(all).toContain('IEC 60949');
    expect(all).toContain('IEC 60364-5-52 Annex G');
    // More than one page, so "every page" means something.
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((page, i) => expect(page, `page ${i + 1}`).toContain(NOT_APPROVED_MARK));
    pages.forEach((page, i) => expect(page, `page ${i + 1}`).toContain(CAUTION_TEXT[2]));
  });

  it('an approved sheet carries no NOT APPROVED marking, and names its reviewer', async () => {
    const approved: SheetRecord = { ...sheet, status: 'approved', reviewerName: 'Test Reviewer (invented)', approvedAt: new Date('2026-01-02T10:00:00Z') };
    const pages = await pagesOf(await renderSheetPdf(approved));
    for (const page of pages) expect(page).not.toContain(NOT_APPROVED_MARK);
    expect(pages.join(' ')).toContain('Test Reviewer (invented)');
  });
});

describe('input warnings reach the reviewer', () => {
  it('a DC sheet (0 Hz) prints the input warning in the PDF, from the saved inputs (lib/sheet/inputWarnings)', async () => {
    const dc: SheetRecord = { ...sheet, inputs: { ...sheet.inputs, circuit: { ...sheet.inputs.circuit, frequencyHz: 0 } } };
    const text = (await pagesOf(await renderSheetPdf(dc))).join(' ');
    expect(text).toContain('Input warning — Frequency 0 Hz: the circuit is taken as DC');
    const ac = (await pagesOf(await renderSheetPdf(sheet))).join(' ');
    expect(ac).not.toContain('Input warning');
  });
});

describe('candidate exports', () => {
  it('CSV: the inputs, then one row per candidate with the saved snapshot’s numbers (unrounded, for traceability; amounts to cents)', () => {
    const csv = candidatesCsv(sheet);
    const [about, inputs, table] = csv.split('\r\n\r\n');
    expect(about).toContain(sheet.circuitTag);
    expect(about).toContain(CAUTION_TEXT[2]);
    // The inputs the candidates were rated for, as the PDF prints them.
    const inputLines = Papa.parse<string[]>(inputs.trim()).data;
    expect(inputLines[0]).toEqual(['input section', 'input', 'value', 'unit']);
    expect(inputLines).toContainEqual(['Circuit', 'Design current', String(sheet.inputs.circuit.designCurrentA), 'A']);
    // No cell of any block starts a spreadsheet formula (OWASP CSV injection; negative numbers aside).
    const everyCell = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data.flat();
    expect(everyCell.filter((cell) => /^[=+\-@\t\r]/.test(cell) && !/^[+-]?\d/.test(cell))).toEqual([]);
    const parsed = Papa.parse<Record<string, string>>(table.trim(), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.map((r) => r['candidate id'])).toEqual(['cu-xlpe-240', 'cu-pvc-50']);
    for (const row of parsed.data) {
      const e = sheet.result!.evaluations.find((x) => x.id === row['candidate id'])!;
      if (!e.ok) throw new Error('expected both candidates to evaluate');
      expect(Number(row['hot spot (°C)'])).toBe(e.hotSpotC);
      expect(Number(row['ampacity (A)'])).toBe(e.ampacityA);
      expect(Number(row['limit (°C)'])).toBe(e.limit.temperatureC);
      expect(row['flag codes'].split(' ').sort()).toEqual(e.flags.map((f) => f.code).sort());
      expect(row['assumption flags']).toBe(e.flags.map((f) => flagTitle(f.code)).join('; '));
      expect(row.chosen).toBe(e.id === 'cu-xlpe-240' ? 'yes' : 'no');
    }
    // The 50 mm² PVC cable at 400 A is far over its 70 °C limit: the export says so in words.
    expect(parsed.data[1].state).toMatch(/Over limit/);
  });

  it('XLSX: the same table on the "Candidates" sheet, the about lines on "About", the inputs on "Inputs"', async () => {
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await candidatesXlsx(sheet)) as never);
    const grid = workbook.getWorksheet('Candidates')!;
    const headers = (grid.getRow(1).values as unknown[]).slice(1);
    const col = (name: string) => headers.indexOf(name) + 1;
    expect(grid.rowCount).toBe(3);
    const e = chosenEvaluation(sheet.result)!;
    expect(grid.getRow(2).getCell(col('candidate id')).value).toBe('cu-xlpe-240');
    expect(grid.getRow(2).getCell(col('hot spot (°C)')).value).toBe(e.hotSpotC);
    expect(grid.getRow(2).getCell(col('section per phase (mm²)')).value).toBe(240);
    const about = workbook.getWorksheet('About')!;
    expect(String(about.getRow(1).getCell(2).value)).toContain(sheet.circuitTag);
    const inputs = workbook.getWorksheet('Inputs')!;
    expect((inputs.getRow(2).values as unknown[]).slice(1)).toEqual(['Circuit', 'Design current', String(sheet.inputs.circuit.designCurrentA), 'A']);
  });
});

// Bounded reading of uploads (issue 19, item 5): a workbook's unpacked size, a worksheet's rows and
// the cells are counted while its parts are inflated, before exceljs builds anything; a CSV stops
// at the first row past the limit. The workbooks are built here by hand (tests/helpers/zip.ts,
// ECMA-376 SpreadsheetML parts), including ones no spreadsheet program would write.
import { describe, expect, it } from 'vitest';
import { FileRefusal, MAX_UNPACKED_BYTES } from '@/lib/files/spreadsheet';
import { MAX_SCHEDULE_ROWS, readScheduleFile } from '@/lib/schedule';
import { SCHEDULE_COLUMNS } from '@/lib/schedule/columns';
import { MAX_IMPORT_ROWS, readCatalogueFile } from '@/lib/catalogue/files';
import { CATALOGUE_COLUMNS } from '@/lib/catalogue';
import { sheetXmlOf, workbookParts, zip } from '../../helpers/zip';

const headers = SCHEDULE_COLUMNS.map((c) => c.header);
const circuit = (i: number) => SCHEDULE_COLUMNS.map((c) => (c.field === 'circuitTag' ? `C-${i}` : c.example === '' ? '' : (c.example as string | number)));
const workbookOf = (rows: number) => zip(workbookParts(sheetXmlOf([headers, ...Array.from({ length: rows }, (_, i) => circuit(i))])));

async function refusalOf(promise: Promise<unknown>): Promise<FileRefusal> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof FileRefusal) return error;
    throw error;
  }
  throw new Error('expected the file to be refused');
}

describe('workbooks', () => {
  it(`reads a workbook of exactly ${MAX_SCHEDULE_ROWS} circuits`, async () => {
    const records = await readScheduleFile('full.xlsx', workbookOf(MAX_SCHEDULE_ROWS));
    expect(records).toHaveLength(MAX_SCHEDULE_ROWS);
    expect(records[0].row).toBe(2);
  });

  it(`refuses ${MAX_SCHEDULE_ROWS + 1} circuits with 413 too_many_rows naming the limit`, async () => {
    const refusal = await refusalOf(readScheduleFile('over.xlsx', workbookOf(MAX_SCHEDULE_ROWS + 1)));
    expect(refusal).toMatchObject({ status: 413, code: 'too_many_rows' });
    expect(refusal.message).toContain(MAX_SCHEDULE_ROWS.toLocaleString('en'));
  });

  it('a workbook of under 100 KB whose worksheet unpacks to 40 MB (a zip bomb) is refused 413 naming the unpacked limit', async () => {
    const header = sheetXmlOf([headers]).match(/<sheetData>(.*)<\/sheetData>/)![1];
    // Valid XML: the header row, then 40 MB of whitespace, which deflate squeezes about 1000:1.
    const xml = `<?xml version="1.0" encoding="UTF-8"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>${header}</sheetData>${' '.repeat(40 * 1024 * 1024)}</worksheet>`;
    const bomb = zip(workbookParts(xml));
    expect(bomb.byteLength).toBeLessThan(100 * 1024);
    const refusal = await refusalOf(readScheduleFile('bomb.xlsx', bomb));
    expect(refusal).toMatchObject({ status: 413, code: 'workbook_too_large' });
    expect(refusal.message).toContain(`${(MAX_UNPACKED_BYTES / 1024 / 1024).toFixed(1)} MB`);
  });

  it('a worksheet of two million cells in one row is refused 413 too_many_cells before exceljs reads it', async () => {
    const header = sheetXmlOf([headers]).match(/<sheetData>(.*)<\/sheetData>/)![1];
    const xml = `<?xml version="1.0" encoding="UTF-8"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>${header}<row r="2">${'<c><v>1</v></c>'.repeat(2_000_000)}</row></sheetData></worksheet>`;
    const refusal = await refusalOf(readScheduleFile('cells.xlsx', zip(workbookParts(xml))));
    expect(refusal).toMatchObject({ status: 413, code: 'too_many_cells' });
  });

  it('rows written with a namespace prefix (<x:row>) are counted too', async () => {
    const xml = sheetXmlOf([headers, ...Array.from({ length: MAX_SCHEDULE_ROWS + 1 }, (_, i) => circuit(i))])
      .replace('<worksheet xmlns=', '<x:worksheet xmlns:x=')
      .replace('</worksheet>', '</x:worksheet>')
      .replace(/<(\/?)(sheetData|row|c|v|is|t)([ >])/g, '<$1x:$2$3');
    const refusal = await refusalOf(readScheduleFile('prefixed.xlsx', zip(workbookParts(xml))));
    expect(refusal).toMatchObject({ status: 413, code: 'too_many_rows' });
  });

  it('a part stored with a compression method other than deflate or none is refused as unreadable', async () => {
    const bytes = workbookOf(1);
    // Central directory entries carry the method at offset 10 (APPNOTE.TXT §4.3.12); set the first to 99 (AES).
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    for (let at = bytes.byteLength - 22; at >= 0; at -= 1) {
      if (view.getUint32(at, true) === 0x06054b50) {
        view.setUint16(view.getUint32(at + 16, true) + 10, 99, true);
        break;
      }
    }
    expect(await refusalOf(readScheduleFile('aes.xlsx', bytes))).toMatchObject({ status: 415, code: 'unreadable' });
  });
});

describe('CSV', () => {
  const catalogueHeader = CATALOGUE_COLUMNS.coverings.map((c) => c.header).join(',');
  const covering = (i: number) => `cov-${i},Covering ${i},insulation,4.5,Supplier datasheet,180,350,Supplier datasheet,0.9,Supplier datasheet`;

  it(`stops at row ${MAX_IMPORT_ROWS + 1} of a catalogue file: 413 too_many_rows naming the limit`, async () => {
    const text = [catalogueHeader, ...Array.from({ length: MAX_IMPORT_ROWS + 1 }, (_, i) => covering(i))].join('\n');
    const refusal = await refusalOf(readCatalogueFile('coverings', 'many.csv', new TextEncoder().encode(text)));
    expect(refusal).toMatchObject({ status: 413, code: 'too_many_rows' });
    expect(refusal.message).toContain(MAX_IMPORT_ROWS.toLocaleString('en'));
  });

  it('blank lines do not count towards the limit, and rows keep their line numbers', async () => {
    const text = [catalogueHeader, '', ...Array.from({ length: MAX_IMPORT_ROWS }, (_, i) => `${covering(i)}\n`)].join('\n');
    const records = await readCatalogueFile('coverings', 'spaced.csv', new TextEncoder().encode(text));
    expect(records).toHaveLength(MAX_IMPORT_ROWS);
    // Line 1 header, line 2 blank, line 3 the first covering, line 4 blank, line 5 the second.
    expect(records.slice(0, 2).map((r) => r.row)).toEqual([3, 5]);
  });
});

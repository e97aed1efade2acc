// Reading and writing catalogue files: refusals with clear messages, row/column problems, and the
// round trip export → import (CSV and XLSX).
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { CATALOGUE_COLUMNS } from '@/lib/catalogue';
import { FileRefusal, MAX_IMPORT_BYTES, readCatalogueFile, validateRecords, writeCsv, writeXlsx } from '@/lib/catalogue/files';
import { STANDARD_COVERINGS } from '@/lib/catalogue/standardData';

const encode = (text: string) => new TextEncoder().encode(text);
const coveringHeader = CATALOGUE_COLUMNS.coverings.map((c) => c.header).join(',');
const goodCovering = 'silicone-rubber,Silicone rubber insulation,insulation,4.5,Supplier datasheet,180,350,Supplier datasheet,0.9,Supplier datasheet';

async function refusal(promise: Promise<unknown>): Promise<FileRefusal> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof FileRefusal) return error;
    throw error;
  }
  throw new Error('expected the file to be refused');
}

describe('refused files', () => {
  it('an empty file', async () => {
    const r = await refusal(readCatalogueFile('coverings', 'empty.csv', new Uint8Array()));
    expect(r.status).toBe(400);
    expect(r.message).toBe('"empty.csv" is empty.');
  });
  it('a file over the size limit', async () => {
    const r = await refusal(readCatalogueFile('coverings', 'big.csv', new Uint8Array(MAX_IMPORT_BYTES + 1).fill(65)));
    expect(r.status).toBe(413);
    expect(r.message).toBe(`"big.csv" is larger than the 2.0 MB limit for a catalogue file (2,097,153 bytes). Split it into smaller files.`);
  });
  it('a binary file named .csv', async () => {
    const r = await refusal(readCatalogueFile('coverings', 'photo.csv', new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46])));
    expect(r.status).toBe(415);
    expect(r.message).toMatch(/binary data, not text/);
  });
  it('text that is not UTF-8', async () => {
    const r = await refusal(readCatalogueFile('coverings', 'latin1.csv', new Uint8Array([0x6b, 0x65, 0x79, 0x0a, 0xe9, 0x0a])));
    expect(r.message).toMatch(/not UTF-8 text/);
  });
  it('a file named .xlsx that is not a workbook, and an unknown extension', async () => {
    expect((await refusal(readCatalogueFile('coverings', 'x.xlsx', encode('key,name\n')))).message).toMatch(/not an Excel workbook/);
    const pdf = await refusal(readCatalogueFile('coverings', 'x.pdf', encode('%PDF-1.7')));
    expect(pdf.status).toBe(415);
    expect(pdf.message).toMatch(/Only CSV \(\.csv\) and Excel workbook \(\.xlsx\)/);
  });
  it('wrong columns: names the missing and the unknown ones', async () => {
    const r = await refusal(readCatalogueFile('coverings', 'metals.csv', encode('key,name,colour\nx,y,z\n')));
    expect(r.code).toBe('wrong_columns');
    expect(r.message).toMatch(/missing columns: role, thermal_resistivity_km_per_w/);
    expect(r.message).toMatch(/column not recognised: colour/);
  });
  it('a header without rows', async () => {
    const r = await refusal(readCatalogueFile('coverings', 'head.csv', encode(`${coveringHeader}\n\n`)));
    expect(r.code).toBe('no_rows');
  });
});

describe('row problems name the row and the column', () => {
  it('reports a bad number and a duplicate key with spreadsheet row numbers', async () => {
    const text = [
      coveringHeader,
      goodCovering,
      'mica-tape,Mica tape,insulation,"4,5",Datasheet,,,Datasheet,,Datasheet',
      goodCovering,
      'bad key!,Thing,armour,-1,,,,x,2,y',
    ].join('\n');
    const records = await readCatalogueFile('coverings', 'c.csv', encode(text));
    const { rows, problems } = validateRecords('coverings', records);
    expect(rows.map((r) => r.row)).toEqual([2]);
    expect(problems).toContainEqual({ row: 3, column: 'thermal_resistivity_km_per_w', message: 'must use a point as the decimal separator (got "4,5")' });
    expect(problems).toContainEqual({ row: 4, column: 'key', message: '"silicone-rubber" is already used on row 2 of this file' });
    const row5 = problems.filter((p) => p.row === 5).map((p) => p.column);
    expect(row5).toEqual(expect.arrayContaining(['key', 'role', 'thermal_resistivity_km_per_w', 'resistivity_source', 'emissivity']));
  });
  it('skips blank lines but keeps the numbering of the file', async () => {
    const records = await readCatalogueFile('coverings', 'c.csv', encode(`${coveringHeader}\n\n${goodCovering}\n`));
    expect(records.map((r) => r.row)).toEqual([3]);
  });
});

describe('export → import round trip', () => {
  it('CSV keeps every value exactly', async () => {
    const csv = writeCsv('coverings', STANDARD_COVERINGS);
    const { rows, problems } = validateRecords('coverings', await readCatalogueFile('coverings', 'x.csv', encode(csv)));
    expect(problems).toEqual([]);
    expect(rows.map((r) => r.value.key)).toEqual(STANDARD_COVERINGS.map((c) => c.key));
    expect(rows[0].value.thermalResistivityKmPerW).toBe('5.0');
  });
  it('XLSX too (numbers as spreadsheet numbers)', async () => {
    const bytes = await writeXlsx('coverings', STANDARD_COVERINGS);
    const { rows, problems } = validateRecords('coverings', await readCatalogueFile('coverings', 'x.xlsx', bytes));
    expect(problems).toEqual([]);
    const xlpe = rows.find((r) => r.value.key === 'xlpe-insulation')!.value;
    expect(xlpe.thermalResistivityKmPerW).toBe('3.5');
    expect(xlpe.emissivity).toBeNull();
    expect(xlpe.shortCircuitLimitC).toBe('250');
  });
  it('an empty template has only the header', async () => {
    expect(writeCsv('materials', []).trim()).toBe(CATALOGUE_COLUMNS.materials.map((c) => c.header).join(','));
  });
});

describe('a semicolon-delimited catalogue file with decimal commas (issue 22)', () => {
  it('reads the numbers with the comma and keeps every value exactly; an ambiguous "1.250" is refused on its column', async () => {
    const csv = writeCsv('coverings', STANDARD_COVERINGS);
    // The same file as a spreadsheet set to a comma decimal mark writes it: ';' between cells, ',' in numbers.
    const cells = Papa.parse<string[]>(csv.trim(), { header: false }).data;
    const semicolon = Papa.unparse(
      cells.map((row, i) => row.map((c) => (i > 0 && /^-?\d+\.\d+$/.test(c) ? c.replace('.', ',') : c))),
      { delimiter: ';', newline: '\r\n' },
    );
    expect(semicolon).toMatch(/;\d+,\d+/);
    const { rows, problems } = validateRecords('coverings', await readCatalogueFile('coverings', 'x.csv', encode(semicolon)));
    expect(problems).toEqual([]);
    expect(rows[0].value.thermalResistivityKmPerW).toBe('5.0');

    const column = CATALOGUE_COLUMNS.coverings.findIndex((c) => c.header === 'thermal_resistivity_km_per_w');
    const edited = Papa.parse<string[]>(semicolon, { header: false, delimiter: ';' }).data;
    edited[1][column] = '1.250';
    const ambiguous = Papa.unparse(edited, { delimiter: ';', newline: '\r\n' });
    const bad = validateRecords('coverings', await readCatalogueFile('coverings', 'x.csv', encode(ambiguous)));
    expect(bad.problems).toContainEqual({ row: 2, column: 'thermal_resistivity_km_per_w', message: 'must be a number: 1.250 — use 1250 or 1,25 (the decimal separator is a comma)' });
  });
});

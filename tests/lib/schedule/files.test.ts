// lib/schedule files: refusals of what is not a schedule, and the template reading back clean.
import { describe, expect, it } from 'vitest';
import { MAX_SCHEDULE_BYTES, readScheduleFile, ScheduleFileRefusal, tableToCsv, tableToXlsx, templateNotes, templateTable, validateScheduleRecords } from '@/lib/schedule';

const text = (s: string) => new TextEncoder().encode(s);
const refusalOf = (p: Promise<unknown>) => p.then(() => null, (e: unknown) => e);

describe('reading schedule files', () => {
  it('refuses empty, oversize, wrong-type and mislabelled files with a clear word', async () => {
    expect(await refusalOf(readScheduleFile('a.csv', new Uint8Array()))).toMatchObject({ status: 400, code: 'empty_file' });
    expect(await refusalOf(readScheduleFile('a.csv', new Uint8Array(MAX_SCHEDULE_BYTES + 1).fill(65)))).toMatchObject({ status: 413, code: 'file_too_large' });
    expect(await refusalOf(readScheduleFile('a.ods', text('x')))).toMatchObject({ status: 415, code: 'unsupported_type' });
    expect(await refusalOf(readScheduleFile('a.xlsx', text('circuit tag\nA')))).toMatchObject({ status: 415, code: 'unsupported_type' });
    expect(await refusalOf(readScheduleFile('a.csv', new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0])))).toMatchObject({ status: 415, code: 'not_text' });
    expect(await refusalOf(readScheduleFile('a.csv', new Uint8Array([0x63, 0xff, 0xfe, 0x0a])))).toMatchObject({ status: 415, code: 'not_text' });
    expect(await refusalOf(readScheduleFile('a.xlsx', new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3])))).toMatchObject({ status: 415, code: 'unreadable' });
    const columns = (await refusalOf(readScheduleFile('a.csv', text('circuit tag,amps,amps\nA,1,2')))) as ScheduleFileRefusal;
    expect(columns).toBeInstanceOf(ScheduleFileRefusal);
    expect(columns.code).toBe('wrong_columns');
    expect(columns.message).toMatch(/missing columns: design current \(A\), voltage U0 \(V\), phases, length \(m\), power factor, installation, conductor family; column not recognised: amps; column given twice: amps/);
    const header = templateTable([]).headers.join(',');
    expect(await refusalOf(readScheduleFile('a.csv', text(`${header}\n,,,\n`)))).toMatchObject({ status: 400, code: 'no_rows' });
  });

  it('reads its own template back as clean rows, from CSV and from XLSX', async () => {
    const families = ['copper XLPE single-core', 'copper bars'];
    const choices = [
      { key: 'copper xlpe single-core', label: 'copper XLPE single-core', kind: 'cable' as const },
      { key: 'copper bars', label: 'copper bars', kind: 'bar' as const },
    ];
    const table = templateTable(families);
    for (const [name, bytes] of [
      ['template.csv', text(tableToCsv(table))],
      ['template.xlsx', await tableToXlsx(table, 'Schedule', templateNotes(families))],
    ] as const) {
      const records = await readScheduleFile(name, bytes);
      expect(records.map((r) => r.row)).toEqual([2, 3]);
      const { rows, problems } = validateScheduleRecords(records, choices);
      expect(problems, name).toEqual([]);
      expect(rows.map((r) => [r.circuitTag, r.family, r.installation])).toEqual([
        ['F-101', 'copper xlpe single-core', 'cable-in-air'],
        ['B-201', 'copper bars', 'bar-on-edge'],
      ]);
    }
  });
});

describe('a semicolon-delimited schedule with decimal commas (issue 22)', () => {
  const choices = [
    { key: 'copper xlpe single-core', label: 'copper XLPE single-core', kind: 'cable' as const },
    { key: 'copper bars', label: 'copper bars', kind: 'bar' as const },
  ];
  /** The template's own CSV rewritten as a spreadsheet set to a comma decimal mark writes it: ';' between cells, ',' in numbers. */
  function semicolonCsv(edit: (cells: string[], headers: string[]) => void = () => {}): string {
    const table = templateTable(choices.map((c) => c.label));
    const lines = [table.headers.join(';')];
    for (const row of table.rows) {
      const cells = row.map((v) => (v === null ? '' : typeof v === 'number' ? String(v).replace('.', ',') : v));
      edit(cells, table.headers);
      lines.push(cells.join(';'));
    }
    return lines.join('\r\n');
  }

  it('reads the numbers with the comma as the decimal mark: the same rows as the template itself', async () => {
    const table = templateTable(choices.map((c) => c.label));
    const reference = validateScheduleRecords(await readScheduleFile('t.csv', text(tableToCsv(table))), choices);
    const read = validateScheduleRecords(await readScheduleFile('semicolon.csv', text(semicolonCsv())), choices);
    expect(read.problems).toEqual([]);
    expect(read.rows).toEqual(reference.rows);
    // The template has a decimal somewhere, or this test would not test the comma.
    expect(table.rows.flat().some((v) => typeof v === 'number' && !Number.isInteger(v))).toBe(true);
  });

  it('refuses "1.250" in such a file as ambiguous, naming row and column', async () => {
    const csv = semicolonCsv((cells, headers) => {
      cells[headers.indexOf('length (m)')] = '1.250';
    });
    const { problems } = validateScheduleRecords(await readScheduleFile('semicolon.csv', text(csv)), choices);
    expect(problems.find((p) => p.row === 2 && p.column === 'length (m)')?.message).toContain('1.250 — use 1250 or 1,25');
  });
});

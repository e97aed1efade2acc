// lib/schedule row validation: every problem names the spreadsheet row and the column header.
import { describe, expect, it } from 'vitest';
import { normaliseHeader, SCHEDULE_COLUMNS, validateScheduleRecords, type FamilyChoice } from '@/lib/schedule';

const FAMILIES: FamilyChoice[] = [
  { key: 'copper xlpe single-core', label: 'copper XLPE single-core', kind: 'cable' },
  { key: 'copper bars', label: 'copper bars', kind: 'bar' },
];

const GOOD: Record<string, unknown> = {
  'circuit tag': 'F-1',
  from: 'MSB',
  to: 'Pump',
  'design current (a)': '120',
  'voltage u0 (v)': '230',
  phases: '3',
  'frequency (hz)': '',
  'length (m)': '35.5',
  'power factor': '0.9',
  installation: 'Cable in air',
  'burial depth (m)': '',
  'ambient (°c)': '',
  'fault current (ka)': '',
  'clearing time (s)': '',
  'conductor family': 'Copper XLPE single core',
  'max voltage drop (%)': '',
  'max parallel runs': '',
  'temperature limit (°c)': '',
  'grouping factor': '',
  formation: '',
  'axis spacing (mm)': '',
  'other circuits': '',
  'other circuit current (a)': '',
  'circuit spacing (mm)': '',
  'device type': '',
  'device rating (a)': '',
  'phase spacing (mm)': '',
  'support span (mm)': '',
  supports: '',
  'support strength (n)': '',
};

/** Cells keyed as the reader keys them: by normalised header (case and spaces do not matter). */
const record = (row: number, changes: Record<string, unknown> = {}) => ({
  row,
  values: { ...GOOD, 'circuit tag': `F-${row}`, ...Object.fromEntries(Object.entries(changes).map(([k, v]) => [normaliseHeader(k), v])) },
});

describe('schedule rows', () => {
  it('keys the fixture by the normalised headers of the template', () => {
    expect(Object.keys(GOOD).sort()).toEqual(SCHEDULE_COLUMNS.map((c) => normaliseHeader(c.header)).sort());
  });

  it('turns a clean row into typed SI values, with empty optional cells as null', () => {
    const { rows, problems } = validateScheduleRecords([record(2)], FAMILIES);
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({
      rowNumber: 2,
      circuitTag: 'F-2',
      designCurrentA: 120,
      lengthM: 35.5,
      phases: 3,
      installation: 'cable-in-air',
      family: 'copper xlpe single-core',
      frequencyHz: null,
      ambientC: null,
      maxParallel: 1,
    });
  });

  it('names row and column of each problem', () => {
    const { rows, problems, badRows } = validateScheduleRecords(
      [
        record(2),
        record(3, { 'design current (A)': 'lots' }),
        record(4, { 'length (m)': '12,5' }),
        record(5, { phases: '2' }),
        record(6, { installation: 'under water' }),
        record(7, { installation: 'buried' }),
        record(8, { 'conductor family': 'gold bars' }),
        record(9, { 'conductor family': 'copper bars', installation: 'bar on edge' }),
        record(10, { installation: 'bar flat' }),
        record(11, { 'fault current (kA)': '10' }),
        record(12, { 'circuit tag': 'f-2' }),
        record(13, { 'power factor': '1.2' }),
      ],
      FAMILIES,
    );
    expect(rows.map((r) => r.rowNumber)).toEqual([2]);
    expect(badRows).toEqual([3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13]);
    const at = (row: number) => problems.filter((p) => p.row === row).map((p) => `${p.column}: ${p.message}`);
    expect(at(3)).toEqual(['design current (A): must be a number (got "lots")']);
    // The one parser (lib/units/parse): a comma in a file read with a point is refused with the point to use.
    expect(at(4)).toEqual(['length (m): must be a number: 12,5 — the decimal separator is a point: write 12.5']);
    expect(at(5)).toEqual(['phases: must be 1 or 3']);
    expect(at(6)[0]).toMatch(/^installation: must be one of: cable in air, buried, bar on edge, bar flat/);
    expect(at(7)).toEqual(['burial depth (m): is required when the installation is buried']);
    expect(at(8)[0]).toMatch(/^conductor family: "gold bars" is not a family of your catalogue \(families: copper XLPE single-core, copper bars\)/);
    expect(at(9)[0]).toMatch(/^temperature limit \(°C\): is required for bar families/);
    expect(at(10)[0]).toMatch(/^installation: cables are "cable in air" or "buried"/);
    expect(at(11)[0]).toMatch(/^clearing time \(s\): is required with the fault current \(kA\)/);
    expect(at(12)[0]).toMatch(/^circuit tag: "f-2" is already used on row 2/);
    expect(at(13)).toEqual(['power factor: must be at most 1 (got 1.2)']);
  });

  it('accepts numbers as XLSX gives them and a bar family with its limit', () => {
    const { rows, problems } = validateScheduleRecords(
      [record(2, { 'design current (A)': 1600, 'conductor family': 'COPPER  BARS', installation: 'bar_on_edge', 'temperature limit (°C)': 105, 'max parallel runs': 3 })],
      FAMILIES,
    );
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({ designCurrentA: 1600, family: 'copper bars', installation: 'bar-on-edge', temperatureLimitC: 105, maxParallel: 3 });
  });
});

// Schedule rows carry the cross-section (issue 17): formation, axis spacing, the number of other
// circuits beside the row's circuit (the same cable), their current and the circuit spacing. The
// columns round-trip through the template (CSV and XLSX), a bad cell names its row and column,
// the sizer sizes with the group model (the conditions carry the arrangement) and the results
// say which cable governs. Outside fact checked: another loaded circuit in the same trench adds
// its heat to this one's surroundings (superposition, IEC 60287-2-1 §4.2.3), so the smallest size
// that passes can only stay or grow, never shrink.
import { describe, expect, it } from 'vitest';
import {
  normaliseHeader,
  readScheduleFile,
  resultLine,
  resultsTable,
  rowConditions,
  SCHEDULE_COLUMNS,
  scheduleRowToSheetInputs,
  sizeCircuit,
  tableToCsv,
  tableToXlsx,
  templateNotes,
  templateTable,
  validateScheduleRecords,
  type FamilyChoice,
} from '@/lib/schedule';
import { candidateSectionMm2 } from '@/lib/schedule/families';
import { row, SMALL_FAMILY } from './fixtures';

const text = (s: string) => new TextEncoder().encode(s);
const FAMILIES: FamilyChoice[] = [
  { key: 'copper xlpe single-core', label: 'copper XLPE single-core', kind: 'cable' },
  { key: 'copper bars', label: 'copper bars', kind: 'bar' },
];

describe('schedule: the cross-section columns', () => {
  it('the template has the five columns and reads back with them, from CSV and XLSX', async () => {
    const headers = SCHEDULE_COLUMNS.map((c) => c.header);
    for (const h of ['formation', 'axis spacing (mm)', 'other circuits', 'other circuit current (A)', 'circuit spacing (mm)']) expect(headers).toContain(h);
    const table = templateTable(['copper XLPE single-core', 'copper bars']);
    for (const [name, bytes] of [
      ['template.csv', text(tableToCsv(table))],
      ['template.xlsx', await tableToXlsx(table, 'Schedule', templateNotes(['copper XLPE single-core', 'copper bars']))],
    ] as const) {
      const { rows, problems } = validateScheduleRecords(await readScheduleFile(name, bytes), FAMILIES);
      expect(problems, name).toEqual([]);
      expect(rows[0]).toMatchObject({ formation: 'trefoil', spacingMm: null, otherCircuits: null, otherCircuitCurrentA: null, circuitSpacingMm: null });
      expect(rows[1]).toMatchObject({ installation: 'bar-on-edge', formation: null, otherCircuits: null });
    }
  });

  it('a cable row with a flat spaced formation beside one other circuit round-trips through CSV into the conditions', async () => {
    const header = SCHEDULE_COLUMNS.map((c) => c.header);
    const cells: Record<string, string> = {
      'circuit tag': 'EV-1',
      'design current (A)': '160',
      'voltage U0 (V)': '230',
      phases: '3',
      'length (m)': '85',
      'power factor': '0.9',
      installation: 'buried',
      'burial depth (m)': '0.8',
      'ambient (°C)': '20',
      'conductor family': 'copper XLPE single-core',
      formation: 'Flat',
      'axis spacing (mm)': '70',
      'other circuits': '1',
      'other circuit current (A)': '120',
      'circuit spacing (mm)': '300',
    };
    const csv = `${header.join(',')}\n${header.map((h) => cells[h] ?? '').join(',')}\n`;
    const { rows, problems } = validateScheduleRecords(await readScheduleFile('ev.csv', text(csv)), FAMILIES);
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({ formation: 'flat', spacingMm: 70, otherCircuits: 1, otherCircuitCurrentA: 120, circuitSpacingMm: 300 });
    expect(rowConditions(rows[0]).installation).toEqual({
      kind: 'buried',
      depthM: 0.8,
      groundC: 20,
      formation: 'flat',
      spacingM: 0.07,
      otherCircuits: [{ currentA: 120 }],
      circuitSpacingM: 0.3,
      circuitRow: 'horizontal',
    });
    // "Open as sizing sheet" carries the same arrangement.
    const sheet = scheduleRowToSheetInputs(rows[0], null, SMALL_FAMILY);
    expect(sheet.installation).toMatchObject({ formation: 'flat', spacingM: 0.07, circuitSpacingM: 0.3, otherCircuits: [{ currentA: 120, sameCable: true }] });
  });

  it('names row and column: unknown formation, other circuits without their current, arrangement on a bar row', () => {
    const base: Record<string, unknown> = Object.fromEntries(SCHEDULE_COLUMNS.map((c) => [normaliseHeader(c.header), '']));
    Object.assign(base, {
      'circuit tag': 'F-1',
      'design current (a)': '100',
      'voltage u0 (v)': '230',
      phases: '3',
      'length (m)': '30',
      'power factor': '0.9',
      installation: 'cable in air',
      'conductor family': 'copper XLPE single-core',
    });
    const rec = (r: number, changes: Record<string, string>) => ({ row: r, values: { ...base, 'circuit tag': `F-${r}`, ...changes } });
    const { problems, rows } = validateScheduleRecords(
      [
        rec(2, { formation: 'hexagonal' }),
        rec(3, { 'other circuits': '2' }),
        rec(4, { 'other circuit current (a)': '50' }),
        rec(5, { 'conductor family': 'copper bars', installation: 'bar on edge', 'temperature limit (°c)': '105', formation: 'flat' }),
        rec(6, { 'other circuits': '24', 'other circuit current (a)': '50' }),
        rec(7, { 'axis spacing (mm)': '0' }),
      ],
      FAMILIES,
    );
    expect(rows).toEqual([]);
    expect(problems.map((p) => [p.row, p.column])).toEqual([
      [2, 'formation'],
      [3, 'other circuit current (A)'],
      [4, 'other circuit current (A)'],
      [5, 'formation'],
      [6, 'other circuits'],
      [7, 'axis spacing (mm)'],
    ]);
  });
});

describe('schedule: sizing with the group model', () => {
  const alone = row({ designCurrentA: 70, installation: 'buried', depthM: 0.7, ambientC: 20 });
  const beside = row({ designCurrentA: 70, installation: 'buried', depthM: 0.7, ambientC: 20, otherCircuits: 2, otherCircuitCurrentA: 70, circuitSpacingMm: 100 });

  it('another loaded circuit beside it never lets a smaller size pass, and lowers the ampacity of the same size', () => {
    const a = sizeCircuit(alone, SMALL_FAMILY);
    const b = sizeCircuit(beside, SMALL_FAMILY);
    expect(a.status).toBe('sized');
    expect(b.status).toBe('sized');
    if (a.status !== 'sized' || b.status !== 'sized') return;
    expect(b.chosen.sectionPerPhaseMm2).toBeGreaterThanOrEqual(a.chosen.sectionPerPhaseMm2);
    const same = SMALL_FAMILY.find((c) => candidateSectionMm2(c) === b.chosen.sectionPerPhaseMm2)!;
    const aloneAtThatSize = sizeCircuit(alone, [same]);
    expect(aloneAtThatSize.status === 'sized' && aloneAtThatSize.chosen.ampacityA).toBeGreaterThan(b.chosen.ampacityA);
  });

  it('the result line and the export say which cable governs and how the group was rated', () => {
    const sized = sizeCircuit(beside, SMALL_FAMILY);
    const line = resultLine(beside, 'copper XLPE single-core', sized);
    expect(line.governingCable).toMatch(/ of this circuit( alike)?, [\d.]+ °C$/);
    expect(line.groupMethod).toBe('in the ground: superposition with images, IEC 60287-2-1 §4.2.3');
    const table = resultsTable([line]);
    expect(table.rows[0][table.headers.indexOf('governing cable')]).toBe(line.governingCable);
    expect(table.rows[0][table.headers.indexOf('group rated by')]).toBe(line.groupMethod);
  });

  it('a row stored before the columns existed sizes as a touching trefoil alone', () => {
    const { formation: _f, spacingMm: _s, otherCircuits: _o, otherCircuitCurrentA: _c, circuitSpacingMm: _g, ...old } = { ...alone, formation: null, spacingMm: null, otherCircuits: null, otherCircuitCurrentA: null, circuitSpacingMm: null };
    expect(rowConditions(old).installation).toEqual({ kind: 'buried', depthM: 0.7, groundC: 20, formation: 'trefoil', circuitRow: 'horizontal' });
  });
});

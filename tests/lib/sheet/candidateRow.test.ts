// candidateRow (lib/sheet/candidateRow.ts): one person-facing row per evaluated candidate, read by
// the candidate grid, the PDF/share tables and exports, and the schedule results. The checks below
// are about what the row says; every figure is compared with the evaluation the library returned,
// or with a definition worked by hand (utilisation = design current / ampacity, physics.md §5).
import { describe, expect, it } from 'vitest';
import { candidateRows } from '@/components/sheet/CandidateGrid';
import type { CandidateEvaluationOk } from '@/lib/electrical';
import { sizeCircuit } from '@/lib/schedule';
import { buildSnapshot, defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { candidateRow, shortCircuitWord } from '@/lib/sheet/candidateRow';
import { CANDIDATE_EXPORT_COLUMNS, candidateRecords, chosenResultRows } from '@/lib/sheet/sheetTables';
import { testCable240 } from '../../helpers/sheetCandidates';
import { row, SMALL_FAMILY } from '../schedule/fixtures';

function sheetWith(changes: (inputs: SheetInputs) => void): SheetInputs {
  const inputs: SheetInputs = { ...defaultSheetInputs('cable-in-air'), candidates: [testCable240], chosenCandidateId: testCable240.id };
  inputs.environment = { ...inputs.environment, ambientC: 30 };
  changes(inputs);
  return inputs;
}

function evaluationOf(inputs: SheetInputs): CandidateEvaluationOk {
  const e = buildSnapshot(inputs).evaluations[0];
  if (!e.ok) throw new Error(`expected an evaluation: ${e.error.message}`);
  return e;
}

/**
 * A candidate that may carry no current: an own limit of 25 °C in 30 °C air. Without current the
 * conductor sits at the air temperature, already above the limit, and any I²R loss only heats it
 * (maximum principle; physics.md §1) — so the ampacity is 0 A, worked by hand, not read from the
 * library.
 */
const noCurrentSheet = sheetWith((inputs) => {
  inputs.limits = { ...inputs.limits, temperatureLimitC: 25 };
});

describe('a candidate that may carry no current (issue 16: the grid showed a blank)', () => {
  const snapshot = buildSnapshot(noCurrentSheet);
  const e = snapshot.evaluations[0] as CandidateEvaluationOk;

  it('is what the case is about: ampacity 0 A with 400 A asked for', () => {
    expect(e.ok).toBe(true);
    expect(e.ampacityA).toBe(0);
    expect(e.designCurrentA).toBe(400);
  });

  it('the row says "no current allowed" and has no utilisation number', () => {
    const r = candidateRow(e);
    expect(r.noCurrentAllowed).toBe(true);
    expect(r.utilisation).toBeNull();
    expect(r.utilisationPercent).toBeNull();
    expect(r.utilisationText).toBe('no current allowed');
  });

  it('the grid (screen and share link) says it too, where it used to show a blank', () => {
    const [gridRow] = candidateRows(noCurrentSheet.candidates, snapshot.evaluations, snapshot.chosenCandidateId, 'si');
    expect(gridRow.utilisation).toBeNull();
    expect(gridRow.utilisationText).toBe('no current allowed');
  });

  it('the PDF result table and the candidate exports say the same', () => {
    expect(chosenResultRows(e, noCurrentSheet.circuit.lengthM).find((x) => x.label === 'Utilisation')?.value).toBe('no current allowed');
    const [record] = candidateRecords(noCurrentSheet.candidates, snapshot);
    expect(record.utilisationText).toBe('no current allowed');
    const exported = CANDIDATE_EXPORT_COLUMNS.find((c) => c.header === 'utilisation (%)')!.value(record);
    expect(exported).toBeNull();
  });

  it('the schedule stores no utilisation number for it either', () => {
    // 25 °C own limit in 30 °C air: no size of the family can carry any current.
    const sizing = sizeCircuit(row({ temperatureLimitC: 25, ambientC: 30 }), SMALL_FAMILY);
    expect(sizing.status).toBe('none_passes');
    if (sizing.status !== 'none_passes' || !sizing.largest) throw new Error('expected the largest size tried');
    expect(sizing.largest.ampacityA).toBe(0);
    expect(sizing.largest.utilisation).toBeNull();
  });
});

describe('an ordinary candidate', () => {
  const inputs = sheetWith(() => {});
  const e = evaluationOf(inputs);
  const r = candidateRow(e);

  it('takes its figures from the evaluation unchanged (SI, unrounded)', () => {
    expect(r).toMatchObject({
      id: 'cu-xlpe-240',
      hotSpotC: e.hotSpotC,
      limitC: 90, // XLPE continuous limit of the test cable (common practice, references.md)
      limitSource: 'XLPE insulation',
      marginK: e.marginK,
      ampacityA: e.ampacityA,
      lossWPerM: e.lossWPerM,
      voltageDropPercent: e.voltageDrop.percent,
      massKg: e.massKg,
    });
    expect(r.flagCodes.sort()).toEqual(e.flags.map((f) => f.code).sort());
  });

  it('utilisation is design current / ampacity (physics.md §5), and its text is the per cent to 3 figures', () => {
    expect(r.utilisation).toBeCloseTo(400 / e.ampacityA, 12);
    expect(r.utilisationPercent).toBeCloseTo((400 / e.ampacityA) * 100, 10);
    expect(r.utilisationText).toBe(`${Number(((400 / e.ampacityA) * 100).toPrecision(3))} %`);
  });

  it('the margin is limit minus hot spot (product.md vocabulary)', () => {
    expect(r.marginK).toBeCloseTo(90 - (e.governingTemperatureC as number), 9);
  });

  it('the grid shows the same figures as the PDF records, converted for an imperial user', () => {
    const snapshot = buildSnapshot(inputs);
    const [record] = candidateRecords(inputs.candidates, snapshot);
    const [si] = candidateRows(inputs.candidates, snapshot.evaluations, snapshot.chosenCandidateId, 'si');
    const [imperial] = candidateRows(inputs.candidates, snapshot.evaluations, snapshot.chosenCandidateId, 'imperial');
    expect(si.state).toBe(record.state);
    expect(si.utilisation).toBe(record.utilisationPercent);
    expect(si.hotSpot).toBe(record.hotSpotC);
    // °F = °C × 9/5 + 32 (definition of the Fahrenheit scale).
    expect(imperial.hotSpot).toBeCloseTo((record.hotSpotC as number) * 1.8 + 32, 9);
  });
});

describe('the state in words', () => {
  it('a candidate within its limit whose short circuit fails says both, in the grid and the PDF alike', () => {
    // 240 mm² Cu/XLPE from 90 °C to 250 °C: IEC 60949 adiabatic, k = 143 (IEC 60364-5-54, from
    // memory) → withstand 143 × 240 = 34.3 kA for 1 s; 200 kA for 1 s is far beyond it.
    const inputs = sheetWith((i) => {
      i.circuit = { ...i.circuit, designCurrentA: 300 };
      i.fault = { checked: true, currentA: 200_000, durationS: 1 };
    });
    const e = evaluationOf(inputs);
    expect(e.shortCircuit.withstands).toBe(false);
    const r = candidateRow(e);
    expect(r.passes).toBe(false);
    expect(r.shortCircuit).toBe('fails');
    expect(r.stateKey).toBe('over');
    expect(r.thermalState).not.toBe('over');
    expect(r.state).toMatch(/^(Within limit|Margin under 10 %); fails: short circuit$/);
    const snapshot = buildSnapshot(inputs);
    expect(candidateRows(inputs.candidates, snapshot.evaluations, null, 'si')[0].state).toBe(r.state);
    expect(chosenResultRows(e, inputs.circuit.lengthM)[0]).toEqual({ label: 'Result', value: r.state });
  });

  it('short-circuit words', () => {
    expect(shortCircuitWord({ checked: false })).toBe('not checked');
    expect(shortCircuitWord({ checked: true, withstands: true })).toBe('passes');
    expect(shortCircuitWord({ checked: true, withstands: false })).toBe('fails');
  });

  it('marks from a saved snapshot that names the smallest and the lowest-cost passing candidate', () => {
    const e = evaluationOf(sheetWith(() => {}));
    const bare = { ...e, isSmallestPassing: undefined, isLowestLifeCycleCostPassing: undefined };
    expect(candidateRow(bare).marks).toEqual([]);
    expect(candidateRow(bare, { smallestPassingId: e.id, lowestLifeCycleCostPassingId: e.id }).marks).toEqual(['Smallest passing', 'Lowest cost passing']);
    expect(candidateRow(bare, { smallestPassingId: 'another', lowestLifeCycleCostPassingId: null }).marks).toEqual([]);
  });
});

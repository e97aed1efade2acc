// The governing cable and the group's method as people read them (lib/sheet/groupWords via
// candidateRow — the one row of the grid, the PDF and share tables, the exports and the schedule),
// and the re-evaluation mark of a result saved by the isolated-cable solver (lib/sheet/reEvaluation).
// Outside facts checked: in a flat row the centre cable runs hottest, being heated from both sides
// (IEC 60287-2-1 §4.2.4.3 rates the centre cable of a flat formation, from memory); the free-air
// group law gives one surface law, so one temperature, for every cable of a touching trefoil
// (IEC 60287-2-1 §4.2.1.3 Table 2, from memory); the isolated-cable model rated a trefoil in free
// air about 22–24 % above IEC 60287 (issue 17's measurement), so the group rating is lower.
import { describe, expect, it } from 'vitest';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { SOLVER_VERSION } from '@/lib/electrical/version';
import { candidateRow } from '@/lib/sheet/candidateRow';
import { computeSheet } from '@/lib/sheet/compute';
import { cableTitle, drawingInputOf, governingCableOf, governingText, groupCableRows } from '@/lib/sheet/groupWords';
import { methodVersionNumber, RE_EVALUATION_HEADING, reEvaluationFiguresLine, reEvaluationOf, reEvaluationSentence } from '@/lib/sheet/reEvaluation';
import { defaultSheetInputs, readSheetInputs, type SheetInputs } from '@/lib/sheet/schema';
import { buildSnapshot, readSnapshot } from '@/lib/sheet/snapshot';
import { CANDIDATE_EXPORT_COLUMNS, candidateRecords, chosenResultRows } from '@/lib/sheet/sheetTables';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';
import storedV4 from '../../fixtures/sheet-v4-solver-0.1.0.json';

function evaluated(inputs: SheetInputs, index = 0): CandidateEvaluationOk {
  const c = computeSheet(inputs);
  if (!c.ok) throw new Error(c.error.message);
  const e = c.comparison.evaluations[index];
  if (!e.ok) throw new Error(e.error.message);
  return e;
}

function sheet(kind: 'buried' | 'cable-in-air', installation: Partial<SheetInputs['installation']> = {}): SheetInputs {
  const v = defaultSheetInputs(kind);
  v.circuit.designCurrentA = 300;
  v.candidates = [testCable240];
  v.chosenCandidateId = testCable240.id;
  v.installation = { ...v.installation, soilResistivityKmPerW: 1.2, groundC: 20, ...installation };
  if (kind === 'cable-in-air') v.environment.ambientC = 30;
  return v;
}

describe('candidateRow: the governing cable of the group', () => {
  it('flat spaced in the ground: the centre cable governs, at the highest conductor temperature of the circuit', () => {
    const e = evaluated(sheet('buried', { formation: 'flat', spacingM: 0.07 }));
    const row = candidateRow(e);
    expect(row.governingCable).toBe('centre cable of this circuit');
    const rated = e.group!.cables.filter((c) => c.role === 'rated').map((c) => c.conductorC as number);
    expect(row.governingCableC).toBe(Math.max(...rated));
    // The outer cables are cooler than the centre one (heated from one side only).
    expect(rated[0]).toBeLessThan(rated[1]);
    expect(rated[2]).toBeLessThan(rated[1]);
    expect(row.groupMethod).toBe('in the ground: superposition with images, IEC 60287-2-1 §4.2.3');
  });

  it('a touching trefoil in free air: one group law, every cable alike', () => {
    const e = evaluated(sheet('cable-in-air'));
    const row = candidateRow(e);
    expect(row.governingCable).toBe('every cable of this circuit alike');
    expect(row.groupMethod).toBe('group in free air: IEC 60287-2-1 §4.2.1 law');
    const temps = e.group!.cables.map((c) => c.conductorC as number);
    expect(Math.max(...temps) - Math.min(...temps)).toBeLessThan(0.05);
  });

  it('names another circuit by its label, and the governing line reads as the result strip prints it', () => {
    const inputs = sheet('buried', { formation: 'flat', spacingM: 0.07, otherCircuits: [{ label: 'EV-2', currentA: 250, sameCable: true, externalDiameterM: null, lossWPerM: null }], circuitSpacingM: 0.3 });
    const e = evaluated(inputs);
    const group = e.group!;
    const rows = groupCableRows(group, ['EV-2']);
    expect(rows.map((r) => r.cable)).toEqual([
      'left cable of this circuit',
      'centre cable of this circuit',
      'right cable of this circuit',
      'left cable of other circuit 1 (EV-2)',
      'centre cable of other circuit 1 (EV-2)',
      'right cable of other circuit 1 (EV-2)',
    ]);
    expect(rows.filter((r) => r.governs)).toHaveLength(1);
    const governing = governingCableOf(group, ['EV-2'])!;
    expect(governingText(governing, (c) => `${c.toFixed(1)} °C`)).toBe(`governing: ${governing.words}, ${(governing.conductorC as number).toFixed(1)} °C`);
    expect(cableTitle(group, governing.cable, ['EV-2'])).toContain('(governs)');
    // The drawing marks the same cable and draws every cable.
    const drawing = drawingInputOf(group);
    expect(drawing.governingCable).toBe(governing.cable);
    expect(drawing.cables).toHaveLength(6);
    expect(drawing.ratedCircuits).toEqual([0]);
  });

  it('bars, and results without a group (saved by the isolated-cable solver), have no governing cable', () => {
    const bars = defaultSheetInputs('bar-on-edge');
    bars.candidates = [testCopperBar(100, 10)];
    expect(candidateRow(evaluated(bars))).toMatchObject({ governingCable: null, governingCableC: null, groupMethod: null });
    const old = readSnapshot(storedV4.snapshot)!;
    const e = old.evaluations[0] as CandidateEvaluationOk;
    expect(e.group).toBeUndefined();
    expect(candidateRow(e)).toMatchObject({ governingCable: null, groupMethod: null });
  });

  it('the records, the export columns and the chosen-result rows carry the same words', () => {
    const inputs = sheet('buried', { formation: 'flat', spacingM: 0.07 });
    const snapshot = buildSnapshot(inputs);
    const [record] = candidateRecords(inputs.candidates, snapshot);
    const row = candidateRow(snapshot.evaluations[0] as CandidateEvaluationOk);
    expect([record.governingCable, record.governingCableC, record.groupMethod]).toEqual([row.governingCable, row.governingCableC, row.groupMethod]);
    expect(CANDIDATE_EXPORT_COLUMNS.find((c) => c.header === 'governing cable')!.value(record)).toBe('centre cable of this circuit');
    const chosen = chosenResultRows(snapshot.evaluations[0] as CandidateEvaluationOk, inputs.circuit.lengthM);
    expect(chosen.find((r) => r.label === 'Governing cable')?.value).toMatch(/^centre cable of this circuit, /);
  });
});

describe('a result saved by an earlier solver is marked for re-evaluation', () => {
  const inputs = readSheetInputs(JSON.parse(JSON.stringify(storedV4.inputs)), 4);
  const snapshot = readSnapshot(JSON.parse(JSON.stringify(storedV4.snapshot)))!;

  it('keeps the saved figures and gives the current ones beside them; the group rating is below the isolated one (issue 17)', () => {
    const r = reEvaluationOf(inputs, snapshot)!;
    expect(r).not.toBeNull();
    expect(methodVersionNumber(r.savedSolverVersion)).toBe('0.1.0');
    expect(r.saved).toEqual({ ampacityA: storedV4.snapshot.evaluations[0].ampacityA, hotSpotC: storedV4.snapshot.evaluations[0].hotSpotC });
    const now = evaluated(inputs);
    expect(r.now).toEqual({ ampacityA: now.ampacityA, hotSpotC: now.hotSpotC });
    expect(r.now!.ampacityA).toBeLessThan(r.saved!.ampacityA);
    // Plain words: no flag codes, no module names.
    const words = `${RE_EVALUATION_HEADING} ${reEvaluationSentence(r)} ${reEvaluationFiguresLine(r)}`;
    expect(words).toContain('Saved with an earlier method — re-evaluate');
    expect(words).not.toMatch(/lib\/|[A-Z]{3,}_[A-Z]/);
    expect(reEvaluationFiguresLine(r)).toContain(`ampacity ${r.saved!.ampacityA.toPrecision(4).replace(/\.?0+$/, '')} A`);
  });

  it('says what the earlier method did: 0.1 rated cables alone, 0.2 approximated packs and multi-core cables (lib/electrical/version.ts history)', () => {
    const base = { currentSolverVersion: SOLVER_VERSION, chosenLabel: null, saved: null, now: null, reason: 'earlier-solver' as const, replacedBarMethods: [] };
    expect(reEvaluationSentence({ ...base, savedSolverVersion: 'ampwarden-sizing/0.1.0 (x)' })).toContain('rated each cable alone');
    const v02 = reEvaluationSentence({ ...base, savedSolverVersion: 'ampwarden-sizing/0.2.0 (x)' });
    expect(v02).toContain('a pack of bars as separate bars');
    expect(v02).toContain('version 0.2.0; now 0.3.0');
  });

  it('is not shown for a result of the current solver', () => {
    const fresh = buildSnapshot(inputs);
    expect(fresh.solverVersion).toBe(SOLVER_VERSION);
    expect(reEvaluationOf(inputs, fresh)).toBeNull();
    expect(reEvaluationOf(inputs, null)).toBeNull();
  });
});

// The bus-bar system and the protection in words (lib/sheet/systemWords.ts, systemTables.ts): the
// pack table carries exactly the library's bars, in the library's order, the hottest marked; the
// printed inputs say what was entered and what was left to the method; the candidate exports carry
// candidateRow's figures. The reference for the current sharing is issue 18's done-when (the outer
// bars of a three-bar pack carry more than the middle one at 50 Hz), which the library's tests
// check against the filament method; here the words must not reorder or lose it.
import { describe, expect, it } from 'vitest';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { candidateRow } from '@/lib/sheet/candidateRow';
import { computeSheet } from '@/lib/sheet/compute';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet/schema';
import { CANDIDATE_EXPORT_COLUMNS, candidateRecords, inputRows } from '@/lib/sheet/sheetTables';
import { deviceWords, flagsOf, FORCES_FLAG_CODES, hottestBarText, packBarRows, packBarWords } from '@/lib/sheet/systemWords';
import { testCopperBar } from '../../helpers/sheetCandidates';

function packSheet(change: (i: SheetInputs) => void = () => {}): SheetInputs {
  const inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 2000, lengthM: 10 };
  inputs.environment = { ...inputs.environment, ambientC: 35 };
  inputs.candidates = [testCopperBar(100, 10, { barsPerPhase: 3, emissivity: 0.9 })];
  inputs.chosenCandidateId = inputs.candidates[0].id;
  inputs.busbarSystem.phaseSpacingM = 0.2;
  change(inputs);
  return inputs;
}

function evaluated(inputs: SheetInputs): CandidateEvaluationOk {
  const c = computeSheet(inputs);
  if (!c.ok || !c.comparison.evaluations[0].ok) throw new Error('must compute');
  return c.comparison.evaluations[0];
}

describe('the pack table', () => {
  it('every bar of the library, in its order, with its figures; the outer bars of L2 carry more than the middle one; the hottest governs', () => {
    const e = evaluated(packSheet());
    const rows = packBarRows(e.pack!);
    expect(rows.map((r) => [r.phase, r.positionInPack, r.temperatureC, r.shareOfPhase, r.acFactor])).toEqual(e.pack!.bars.map((b) => [b.phase, b.positionInPack, b.temperatureC, b.shareOfPhase, b.acFactor]));
    const l2 = rows.filter((r) => r.phase === 'L2');
    expect(l2.map((r) => r.bar)).toEqual(['bar 1 of 3 (outer)', 'bar 2 of 3 (inner)', 'bar 3 of 3 (outer)']);
    expect(l2[0].shareOfPhase).toBeGreaterThan(l2[1].shareOfPhase);
    expect(l2[2].shareOfPhase).toBeGreaterThan(l2[1].shareOfPhase);
    const governs = rows.filter((r) => r.governs);
    expect(governs).toHaveLength(1);
    expect([governs[0].phase, governs[0].positionInPack]).toEqual([e.pack!.hottest.phase, e.pack!.hottest.positionInPack]);
    expect(hottestBarText(e.pack!)).toBe(`${e.pack!.hottest.phase}, ${governs[0].bar}, ${Number(e.pack!.hottest.temperatureC.toPrecision(4))} °C`);
    expect(candidateRow(e).hottestBar).toBe(hottestBarText(e.pack!));
  });

  it('bar words', () => {
    expect(packBarWords(0, 1)).toBe('the bar');
    expect(packBarWords(1, 4)).toBe('bar 2 of 4 (inner)');
    expect(packBarWords(3, 4)).toBe('bar 4 of 4 (outer)');
  });

  it('without the supports the forces are not checked: the flag says so and the row says “not checked”', () => {
    const e = evaluated(packSheet((i) => void (i.fault = { checked: true, currentA: 30_000, durationS: 0.5 })));
    expect(e.forces).toBeUndefined();
    expect(flagsOf(e, FORCES_FLAG_CODES).map((f) => f.code)).toContain('FORCES_NOT_CHECKED');
    expect(candidateRow(e)).toMatchObject({ forces: 'not checked', stressRatio: null, supportForceN: null });
  });
});

describe('the printed inputs and the exports', () => {
  it('a bar sheet prints its system, entered or left to the method, and the protection as not described', () => {
    const rows = inputRows(packSheet((i) => Object.assign(i.busbarSystem, { supportSpacingM: 0.8, supports: 'continuous-two-spans', supportStrengthN: 10_000, peakFactorBy: 'kappa', kappa: 1.8 })));
    const value = (label: string) => rows.find((r) => r.label === label);
    expect(value('Phase spacing (centre to centre)')).toMatchObject({ value: '200', unit: 'mm' });
    expect(value('Support spacing')).toMatchObject({ value: '800', unit: 'mm' });
    expect(value('How the bars are held')?.value).toBe('Continuous over two spans');
    expect(value('Rated strength of a support')).toMatchObject({ value: '10000', unit: 'N' });
    expect(value('Peak factor κ')?.value).toBe('1.8');
    expect(value('Gap between the bars of a pack')?.value).toBe('each candidate’s own (the bar thickness)');
    expect(value('Protective device')?.value).toBe('not described (not checked)');
    // A cable sheet has no bus-bar rows.
    expect(inputRows(defaultSheetInputs('cable-in-air')).some((r) => r.section === 'Bus-bar system')).toBe(false);
  });

  it('a device in words, and the exports carry candidateRow’s protection figures', () => {
    const inputs = packSheet((i) => Object.assign(i.protection, { included: true, device: { ...i.protection.device, kind: 'breaker-iec60947-2', ratedCurrentA: 2500, settingCurrentA: 2000, instantaneousCurrentA: 20_000 } }));
    expect(deviceWords(inputs.protection.device)).toBe('2500 A circuit-breaker (IEC 60947-2), I_r 2000 A, I_i 20000 A');
    expect(deviceWords({ ...inputs.protection.device, kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 63 })).toBe('B 63 A circuit-breaker (IEC 60898-1)');
    expect(deviceWords({ ...inputs.protection.device, kind: 'fuse-gG-iec60269', ratedCurrentA: 250 })).toBe('gG 250 A fuse (IEC 60269)');
    const c = computeSheet(inputs);
    if (!c.ok) throw new Error('must compute');
    const [record] = candidateRecords(inputs.candidates, { evaluations: c.comparison.evaluations, chosenCandidateId: inputs.chosenCandidateId });
    const e = c.comparison.evaluations[0] as CandidateEvaluationOk;
    const cell = (header: string) => CANDIDATE_EXPORT_COLUMNS.find((col) => col.header === header)!.value(record);
    expect(cell('device I_n or I_r (A)')).toBe(2000);
    expect(cell('overload coordination')).toBe(e.protection!.coordination!.verdict === 'pass' ? 'passes' : 'fails');
    expect(cell('governing bar')).toBe(hottestBarText(e.pack!));
  });
});

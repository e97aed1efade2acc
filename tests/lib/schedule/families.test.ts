// Conductor families derived from catalogue candidates, and "open as sizing sheet".
import { describe, expect, it } from 'vitest';
import { sheetInputsSchema } from '@/lib/sheet';
import { familyLabelOf, findFamily, groupIntoFamilies, normaliseFamilyName, scheduleRowToSheetInputs, sizeCircuit } from '@/lib/schedule';
import { copperXlpe, row, SMALL_FAMILY } from './fixtures';

describe('conductor families', () => {
  it('names a family by metal, insulation and cores, or metal and bars', () => {
    expect(familyLabelOf(copperXlpe(16))).toBe('copper XLPE single-core');
    expect(familyLabelOf({ ...copperXlpe(16), material: 'aluminium', cores: 4 })).toBe('aluminium XLPE 4-core');
    expect(familyLabelOf({ kind: 'bar', material: 'copper', r20OhmPerM: 1e-5, widthM: 0.05, thicknessM: 0.005 })).toBe('copper bars');
  });

  it('groups candidates, smallest first, and matches what people type', () => {
    const families = groupIntoFamilies([copperXlpe(50), copperXlpe(16), { kind: 'bar', material: 'aluminium', r20OhmPerM: 1e-5, widthM: 0.05, thicknessM: 0.005 }]);
    expect(families.map((f) => [f.label, f.candidates.length])).toEqual([
      ['aluminium bars', 1],
      ['copper XLPE single-core', 2],
    ]);
    expect(families[1].candidates.map((c) => (c.kind === 'cable' ? c.sectionMm2 : 0))).toEqual([16, 50]);
    expect(normaliseFamilyName('  Aluminum   BARS ')).toBe('aluminium bars');
    expect(findFamily(families, 'COPPER xlpe single core')?.label).toBe('copper XLPE single-core');
    expect(findFamily(families, 'copper PVC single-core')).toBeUndefined();
  });
});

describe('open a schedule row as a sizing sheet', () => {
  it('carries the circuit and puts the chosen size with its neighbours on a valid sheet', () => {
    const r = row({ designCurrentA: 150, faultCurrentKA: 5, clearingTimeS: 0.2, maxVoltageDropPercent: 4 });
    const sizing = sizeCircuit(r, SMALL_FAMILY);
    expect(sizing.status).toBe('sized');
    const inputs = scheduleRowToSheetInputs(r, sizing, SMALL_FAMILY);
    expect(sheetInputsSchema.safeParse(inputs).success).toBe(true);
    expect(inputs.circuit).toMatchObject({ designCurrentA: 150, lengthM: 40, maxVoltageDropPercent: 4 });
    expect(inputs.fault).toEqual({ checked: true, currentA: 5000, durationS: 0.2 });
    if (sizing.status !== 'sized') return;
    expect(inputs.chosenCandidateId).toBe(sizing.chosen.candidateId);
    const ids = inputs.candidates.map((c) => c.id);
    expect(ids).toContain(sizing.chosen.candidateId);
    expect(ids.length).toBeLessThanOrEqual(5);
  });
});

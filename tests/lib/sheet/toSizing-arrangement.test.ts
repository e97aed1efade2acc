// lib/sheet/toSizing: the sheet's cross-section (version 5) → the library's Conditions.installation
// (lib/electrical/sizing/types.ts CableArrangement, BuriedSurroundings), and the library's refusal
// of an arrangement that does not fit, mapped back to the sheet's field (lib/sheet/arrangementCheck).
// The geometry of the refusal is worked by hand below (an outside check, not the library's word).
import { describe, expect, it } from 'vitest';
import { computeSheet } from '@/lib/sheet/compute';
import { arrangementRefusalOf, sheetFieldOf } from '@/lib/sheet/arrangementCheck';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet/schema';
import { toConditions, toInstallation } from '@/lib/sheet/toSizing';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';

function buried(change: (i: SheetInputs['installation']) => Partial<SheetInputs['installation']> = () => ({})): SheetInputs {
  const v = defaultSheetInputs('buried');
  v.candidates = [testCable240];
  v.chosenCandidateId = testCable240.id;
  v.installation = { ...v.installation, ...change(v.installation) };
  return v;
}

describe('toSizing: the cross-section', () => {
  it('the default sheet gives a touching trefoil alone: no spacing, no other circuits, no circuit spacing, no duct, no backfill', () => {
    const installation = toInstallation(buried());
    expect(installation).toEqual({ kind: 'buried', depthM: 0.7, formation: 'trefoil' });
  });

  it('maps formation, spacing, other circuits (same cable or given by diameter and heat), their row and spacing, transposition', () => {
    const inputs = buried(() => ({
      formation: 'flat',
      spacingM: 0.07,
      transposed: true,
      circuitSpacingM: 0.3,
      circuitRow: 'vertical',
      otherCircuits: [
        { label: 'EV-2', currentA: 120, sameCable: true, externalDiameterM: 0.03, lossWPerM: 12 },
        { label: '', currentA: 80, sameCable: false, externalDiameterM: 0.028, lossWPerM: 9.5 },
      ],
    }));
    expect(toInstallation(inputs)).toEqual({
      kind: 'buried',
      depthM: 0.7,
      formation: 'flat',
      spacingM: 0.07,
      transposed: true,
      circuitSpacingM: 0.3,
      circuitRow: 'vertical',
      // A same-cable neighbour carries only its current; the entered cable data are kept on the sheet but not used.
      otherCircuits: [{ currentA: 120 }, { currentA: 80, cable: { externalDiameterM: 0.028, lossWPerM: 9.5 } }],
    });
  });

  it('ducts and backfill only when ticked; an empty backfill centre depth is the depth of the cable axis', () => {
    const ticked = buried((i) => ({ duct: { ...i.duct, used: true, material: 'pe' }, backfill: { ...i.backfill, used: true, centreDepthM: null } }));
    expect(toInstallation(ticked)).toMatchObject({
      duct: { material: 'pe', innerDiameterM: 0.1, outerDiameterM: 0.11 },
      backfill: { widthM: 0.6, heightM: 0.4, centreDepthM: 0.7, resistivityKmPerW: 1 },
    });
    const unticked = toInstallation(buried((i) => ({ duct: { ...i.duct, used: false }, backfill: { ...i.backfill, used: false, centreDepthM: 1.2 } })));
    expect('duct' in unticked || 'backfill' in unticked).toBe(false);
    // In air there are no ducts or backfill to map, whatever the sheet keeps.
    const air = { ...ticked, installation: { ...ticked.installation, kind: 'cable-in-air' as const } };
    expect(toInstallation(air)).toEqual({ kind: 'cable-in-air', formation: 'trefoil' });
  });

  it('a circuit spacing with nothing beside the circuit and no parallel runs is not passed on; with parallel runs it is', () => {
    expect(toInstallation(buried(() => ({ circuitSpacingM: 0.25 })))).not.toHaveProperty('circuitSpacingM');
    const runs = buried(() => ({ circuitSpacingM: 0.25 }));
    runs.candidates = [{ ...testCable240, parallel: 2 }];
    expect(toInstallation(runs)).toMatchObject({ circuitSpacingM: 0.25, circuitRow: 'horizontal' });
  });

  it('bars keep their own installations, without any cable arrangement', () => {
    const bars = defaultSheetInputs('bar-on-edge');
    bars.installation.otherCircuits = [{ label: '', currentA: 100, sameCable: true, externalDiameterM: null, lossWPerM: null }];
    expect(toConditions(bars).installation).toEqual({ kind: 'bar-on-edge' });
  });
});

describe('an arrangement that does not fit is refused with the sheet field named', () => {
  // The cable: 18 mm conductor + 2 × 1.7 mm XLPE + 2 × 1.9 mm PVC = D_e 25.2 mm (testCable240).
  // Two touching trefoils side by side, apex up: the lower right cable of the first at x = +D_e/2
  // and the lower left cable of the second at x = s − D_e/2 lie at one height, s − D_e apart;
  // they touch when s − D_e = D_e, so the centres must be at least 2·D_e = 50.4 mm apart (the other
  // pairs need only s ≥ D_e). Worked by hand.
  const beside = (circuitSpacingM: number) => buried(() => ({ otherCircuits: [{ label: '', currentA: 200, sameCable: true, externalDiameterM: null, lossWPerM: null }], circuitSpacingM }));

  it('refuses circuits 50.2 mm apart and takes 50.6 mm (hand geometry: at least 2·D_e = 50.4 mm)', () => {
    const tooClose = computeSheet(beside(0.0502));
    expect(tooClose.ok).toBe(true);
    const refusal = arrangementRefusalOf(tooClose.ok ? tooClose.comparison.evaluations : []);
    expect(refusal?.field).toBe('installation.circuitSpacingM');
    expect(refusal?.libraryField).toBe('conditions.installation.circuitSpacingM');
    expect(refusal?.message).toMatch(/overlap/);
    expect(refusal?.message.startsWith('conditions.')).toBe(false);
    expect(refusal?.candidateLabel).toBe(testCable240.label);
    const apart = computeSheet(beside(0.0506));
    expect(apart.ok && arrangementRefusalOf(apart.comparison.evaluations)).toBe(null);
    expect(apart.ok && apart.comparison.evaluations[0].ok).toBe(true);
  });

  it('refuses an axis spacing under the cable diameter as an overlap (25.0 mm < D_e 25.2 mm), naming the spacing', () => {
    const c = computeSheet(buried(() => ({ formation: 'flat', spacingM: 0.025 })));
    expect(c.ok && arrangementRefusalOf(c.comparison.evaluations)?.field).toBe('installation.spacingM');
    const touching = computeSheet(buried(() => ({ formation: 'flat', spacingM: 0.0252 })));
    expect(touching.ok && arrangementRefusalOf(touching.comparison.evaluations)).toBe(null);
  });

  it('refuses a cable that does not fit its duct (bore 25 mm < D_e 25.2 mm), naming the duct', () => {
    const c = computeSheet(buried((i) => ({ duct: { ...i.duct, used: true, innerDiameterM: 0.025, outerDiameterM: 0.03 } })));
    expect(c.ok && arrangementRefusalOf(c.comparison.evaluations)?.field).toBe('installation.duct.innerDiameterM');
  });

  it('a bar on a cable installation is shown as not suiting it, not refused as an arrangement', () => {
    const v = buried();
    v.candidates = [testCable240, testCopperBar(100, 10)];
    const c = computeSheet(v);
    expect(c.ok && c.comparison.evaluations[1].ok).toBe(false);
    expect(c.ok && arrangementRefusalOf(c.comparison.evaluations)).toBe(null);
  });

  it('maps the library field paths to the form paths', () => {
    expect(sheetFieldOf('conditions.installation.otherCircuits[2].cable.lossWPerM')).toBe('installation.otherCircuits.2.lossWPerM');
    expect(sheetFieldOf('conditions.installation.otherCircuits[0].currentA')).toBe('installation.otherCircuits.0.currentA');
    expect(sheetFieldOf('conditions.installation.backfill')).toBe('installation.backfill');
    expect(sheetFieldOf('candidates[0].sectionMm2')).toBe(null);
  });
});

import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { prepareBusbarSystem, type BusbarSystemInput } from '@/lib/electrical/busbar/geometry';

const FOUR_BY_100x10: BusbarSystemInput = {
  barsPerPhase: 4,
  barWidthM: 0.1,
  barThicknessM: 0.01,
  gapM: 0.01,
  phaseSpacingM: 0.2,
  arrangement: 'edge',
  supportSpacingM: 1,
};

function refusedField(input: unknown): string {
  try {
    prepareBusbarSystem(input as BusbarSystemInput);
  } catch (e) {
    expect(e).toBeInstanceOf(ElectricalInputError);
    return (e as ElectricalInputError).field;
  }
  throw new Error('geometry was accepted');
}

describe('bus-bar system geometry', () => {
  it('lays out three packs of four bars on edge: pitch t + gap, packs centred at −a, 0, +a', () => {
    const s = prepareBusbarSystem(FOUR_BY_100x10);
    expect(s.bars).toHaveLength(12);
    // Pack of 4 × 10 mm with 10 mm gaps: 70 mm across; pitch 20 mm, bar centres at ±10 mm and ±30 mm.
    expect(s.packSizeXM).toBeCloseTo(0.07, 15);
    expect(s.phaseClearanceM).toBeCloseTo(0.13, 15);
    const l2 = s.bars.filter((b) => b.group === 'L2').map((b) => b.cxM);
    expect(l2.map((x) => Math.round(x * 1e6) / 1e6)).toEqual([-0.03, -0.01, 0.01, 0.03]);
    const l1 = s.bars.filter((b) => b.group === 'L1');
    expect(l1[0].cxM).toBeCloseTo(-0.23, 12);
    for (const b of s.bars) {
      expect(b.sizeXM).toBe(0.01);
      expect(b.sizeYM).toBe(0.1);
      expect(b.cyM).toBe(0);
    }
    expect(s.spacerSpacingM).toBe(1);
  });

  it('lays a flat pack out along y, symmetric about y = 0, and a neutral beyond L3', () => {
    const s = prepareBusbarSystem({
      ...FOUR_BY_100x10,
      barsPerPhase: 3,
      arrangement: 'flat',
      phaseSpacingM: 0.15,
      neutral: { role: 'neutral', bars: 1, thicknessM: 0.005, spacingM: 0.15 },
    });
    const l1 = s.bars.filter((b) => b.group === 'L1');
    expect(l1.map((b) => Math.round(b.cyM * 1e6) / 1e6)).toEqual([-0.02, 0, 0.02]);
    expect(l1.every((b) => b.sizeXM === 0.1 && b.sizeYM === 0.01)).toBe(true);
    const n = s.bars.filter((b) => b.group === 'N');
    expect(n).toHaveLength(1);
    expect(n[0].cxM).toBeCloseTo(0.3, 12);
    expect(n[0].sizeYM).toBe(0.005);
    expect(s.groups.map((g) => g.name)).toEqual(['L1', 'L2', 'L3', 'N']);
  });

  it('refuses bad geometry naming the field', () => {
    expect(refusedField({ ...FOUR_BY_100x10, gapM: 0 })).toBe('gapM');
    expect(refusedField({ ...FOUR_BY_100x10, gapM: -0.002 })).toBe('gapM');
    expect(refusedField({ ...FOUR_BY_100x10, gapM: undefined })).toBe('gapM');
    expect(refusedField({ ...FOUR_BY_100x10, supportSpacingM: 0 })).toBe('supportSpacingM');
    expect(refusedField({ ...FOUR_BY_100x10, supportSpacingM: -1 })).toBe('supportSpacingM');
    expect(refusedField({ ...FOUR_BY_100x10, barWidthM: Number.NaN })).toBe('barWidthM');
    expect(refusedField({ ...FOUR_BY_100x10, barThicknessM: 0.2 })).toBe('barThicknessM');
    expect(refusedField({ ...FOUR_BY_100x10, barsPerPhase: 2.5 })).toBe('barsPerPhase');
    expect(refusedField({ ...FOUR_BY_100x10, arrangement: 'diagonal' })).toBe('arrangement');
    // Packs 70 mm across at 70 mm centre to centre touch; at 60 mm they overlap.
    expect(refusedField({ ...FOUR_BY_100x10, phaseSpacingM: 0.07 })).toBe('phaseSpacingM');
    expect(refusedField({ ...FOUR_BY_100x10, phaseSpacingM: 0.06 })).toBe('phaseSpacingM');
    // Flat bars 100 mm wide at 90 mm centre to centre overlap.
    expect(refusedField({ ...FOUR_BY_100x10, arrangement: 'flat', phaseSpacingM: 0.09 })).toBe('phaseSpacingM');
    expect(refusedField({ ...FOUR_BY_100x10, spacerSpacingM: 2 })).toBe('spacerSpacingM');
    expect(refusedField({ ...FOUR_BY_100x10, neutral: { role: 'neutral', bars: 1, thicknessM: 0.01, spacingM: 0.04 } })).toBe('neutral.spacingM');
    expect(refusedField({ ...FOUR_BY_100x10, neutral: { role: 'neutral', bars: 2, thicknessM: 0.01, spacingM: 0.2 } })).toBe('neutral.gapM');
    expect(refusedField({ ...FOUR_BY_100x10, neutral: { role: 'earth', bars: 1, thicknessM: 0.01, spacingM: 0.2 } })).toBe('neutral.role');
  });
});

import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { harmonicNeutralSizing } from '@/lib/electrical/protection';

// IEC 60364-5-52 Annex E, Table E.52.1 (from memory): 0–15 % → 1.0 on the phase current;
// 15–33 % → 0.86 on the phase current; 33–45 % → 0.86 on the neutral current; > 45 % → 1.0
// on the neutral current; I_N = 3·h₃·I_B for a balanced load. A band holds its upper figure.

describe('third harmonics in four- and five-core cables, IEC 60364-5-52 Annex E', () => {
  it('0 %: the neutral carries nothing, the phase current sizes the cable unreduced', () => {
    const r = harmonicNeutralSizing({ designCurrentA: 39, thirdHarmonicFraction: 0, cores: 4 });
    expect(r.neutralCurrentA).toBe(0);
    expect(r.reductionFactor).toBe(1);
    expect(r.governing).toBe('phase');
    expect(r.sizingCurrentA).toBe(39);
  });

  // The worked example of Annex E (from memory): a 39 A three-phase load on a four-core cable.
  it('Annex E example, 20 %: 39/0.86 = 45.35 A on the phase current', () => {
    const r = harmonicNeutralSizing({ designCurrentA: 39, thirdHarmonicFraction: 0.2, cores: 4 });
    expect(r.governing).toBe('phase');
    expect(r.sizingCurrentA).toBeCloseTo(45.349, 3);
  });
  it('Annex E example, 40 %: I_N = 39·0.4·3 = 46.8 A, /0.86 = 54.42 A on the neutral current', () => {
    const r = harmonicNeutralSizing({ designCurrentA: 39, thirdHarmonicFraction: 0.4, cores: 4 });
    expect(r.neutralCurrentA).toBeCloseTo(46.8, 10);
    expect(r.governing).toBe('neutral');
    expect(r.sizingCurrentA).toBeCloseTo(54.419, 3);
  });
  it('Annex E example, 50 %: I_N = 58.5 A sizes the cable with factor 1', () => {
    const r = harmonicNeutralSizing({ designCurrentA: 39, thirdHarmonicFraction: 0.5, cores: 5 });
    expect(r.governing).toBe('neutral');
    expect(r.reductionFactor).toBe(1);
    expect(r.sizingCurrentA).toBeCloseTo(58.5, 10);
  });

  it('at each threshold the factor switches as tabulated, and from 33 % the neutral governs', () => {
    const at = (h: number) => harmonicNeutralSizing({ designCurrentA: 100, thirdHarmonicFraction: h, cores: 4 });
    const eps = 1e-6;
    expect([at(0.15).reductionFactor, at(0.15).governing]).toEqual([1.0, 'phase']);
    expect([at(0.15 + eps).reductionFactor, at(0.15 + eps).governing]).toEqual([0.86, 'phase']);
    expect([at(0.33).reductionFactor, at(0.33).governing]).toEqual([0.86, 'phase']);
    expect([at(0.33 + eps).reductionFactor, at(0.33 + eps).governing]).toEqual([0.86, 'neutral']);
    expect([at(0.45).reductionFactor, at(0.45).governing]).toEqual([0.86, 'neutral']);
    expect([at(0.45 + eps).reductionFactor, at(0.45 + eps).governing]).toEqual([1.0, 'neutral']);
    // Just above 33 %: I_N = 3·0.33·100 = 99 A, /0.86 = 115.12 A.
    expect(at(0.33 + eps).sizingCurrentA).toBeCloseTo(99 / 0.86, 3);
  });

  it('refuses three-core cables and a content outside 0–100 %, naming the field', () => {
    const field = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        return (e as ElectricalInputError).field;
      }
      return undefined;
    };
    expect(field(() => harmonicNeutralSizing({ designCurrentA: 10, thirdHarmonicFraction: 0.2, cores: 3 }))).toBe('cores');
    expect(field(() => harmonicNeutralSizing({ designCurrentA: 10, thirdHarmonicFraction: 1.2, cores: 4 }))).toBe('thirdHarmonicFraction');
    expect(field(() => harmonicNeutralSizing({ designCurrentA: -1, thirdHarmonicFraction: 0.2, cores: 4 }))).toBe('designCurrentA');
  });
});

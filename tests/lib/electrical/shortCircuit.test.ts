import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  adiabaticK,
  ElectricalInputError,
  minimumSection,
  shortCircuitFinalTemperature,
  shortCircuitWithstandCurrent,
} from '@/lib/electrical';

describe('adiabatic k factors — IEC 60364-5-54 table (from memory), via IEC 60949 K and β (from memory)', () => {
  const cases = [
    { name: 'Cu/PVC 70→160 °C', material: 'copper', initial: 70, final: 160, k: 115 },
    { name: 'Cu/XLPE 90→250 °C', material: 'copper', initial: 90, final: 250, k: 143 },
    { name: 'Al/PVC 70→160 °C', material: 'aluminium', initial: 70, final: 160, k: 76 },
    { name: 'Al/XLPE 90→250 °C', material: 'aluminium', initial: 90, final: 250, k: 94 },
  ] as const;
  for (const c of cases) {
    it(`${c.name}: k = ${c.k} within 1 %`, () => {
      const k = adiabaticK({ material: c.material, initial: c.initial, final: c.final });
      expect(Math.abs(k - c.k) / c.k).toBeLessThan(0.01);
    });
  }
});

describe('final temperature and minimum section — IEC 60949 adiabatic equation', () => {
  it('round trip: the minimum section for θi→θf heats to θf exactly (property, 200 runs)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('copper' as const, 'aluminium' as const),
        fc.double({ min: 100, max: 100_000, noNaN: true }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.double({ min: -20, max: 100, noNaN: true }),
        fc.double({ min: 5, max: 300, noNaN: true }),
        (material, current, duration, initial, rise) => {
          const final = initial + rise;
          const section = minimumSection({ material, current, duration, initial, final });
          const back = shortCircuitFinalTemperature({ material, current, duration, section, initial });
          expect(back).toBeCloseTo(final, 8);
          const i = shortCircuitWithstandCurrent({ material, section, duration, initial, final });
          expect(i / current).toBeCloseTo(1, 12);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('worked by hand: 10 kA for 0.5 s through 95 mm² copper from 90 °C', () => {
    // I²t/(K²S²) = 1e8·0.5/(226²·95²) = 5e7/(51076·9025) = 5e7/460960900 = 0.108469;
    // θf = (90 + 234.5)·e^0.108469 − 234.5 = 324.5·1.114570 − 234.5 = 127.18 °C.
    const f = shortCircuitFinalTemperature({ material: 'copper', current: 10_000, duration: 0.5, section: 95, initial: 90 });
    expect(f).toBeCloseTo(127.18, 1);
  });

  it('no current leaves the temperature unchanged; absurd faults give +Infinity, never NaN', () => {
    expect(shortCircuitFinalTemperature({ material: 'copper', current: 0, duration: 1, section: 10, initial: 70 })).toBe(70);
    const huge = shortCircuitFinalTemperature({ material: 'copper', current: 1e9, duration: 5, section: 1, initial: 70 });
    expect(huge).toBe(Number.POSITIVE_INFINITY);
  });

  it('bad input names the field', () => {
    const field = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        expect(e).toBeInstanceOf(ElectricalInputError);
        return (e as ElectricalInputError).field;
      }
      throw new Error('did not throw');
    };
    expect(field(() => adiabaticK({ material: 'steel' as never, initial: 70, final: 160 }))).toBe('material');
    expect(field(() => adiabaticK({ material: 'copper', initial: 160, final: 70 }))).toBe('final');
    expect(field(() => minimumSection({ material: 'copper', current: -1, duration: 1, initial: 70, final: 160 }))).toBe('current');
    expect(
      field(() => shortCircuitFinalTemperature({ material: 'copper', current: 1, duration: 1, section: 0, initial: 70 })),
    ).toBe('section');
  });
});

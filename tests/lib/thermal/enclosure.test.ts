import { describe, expect, it } from 'vitest';
import { effectiveCoolingSurface, enclosureAirTemperature, isThermalInputError, type EnclosureShape } from '@/lib/thermal';

/**
 * Enclosure air temperature (physics.md §6) by wall heat transfer P = k·A_e·ΔT.
 *
 * The effective cooling surface is checked against the installation-type formulas that enclosure
 * literature quotes from IEC TR 60890 / DIN VDE 0660-500 (from memory). Those formulas were
 * recalled as whole expressions, independently of the surface-factor table (1.4 / 0.7 / 0.9 / 0.5)
 * that lib/thermal/enclosure.ts sums face by face, so agreement checks both recollections against
 * each other and the face bookkeeping (which face is covered, the floor left out).
 */
const H = 2.0;
const W = 0.8;
const D = 0.6;
const shape = (s: Partial<EnclosureShape>): EnclosureShape => ({ heightM: H, widthM: W, depthM: D, backCovered: false, sidesCovered: 0, topCovered: false, ...s });

describe('effective cooling surface A_e (IEC TR 60890 installation types, from memory)', () => {
  const cases: [string, Partial<EnclosureShape>, number][] = [
    ['single enclosure, free-standing on all sides', {}, 1.8 * H * (W + D) + 1.4 * W * D],
    ['single enclosure against a wall', { backCovered: true }, 1.4 * W * (H + D) + 1.8 * D * H],
    ['first or last of a free-standing row', { sidesCovered: 1 }, 1.4 * D * (H + W) + 1.8 * W * H],
    ['first or last of a row against a wall', { sidesCovered: 1, backCovered: true }, 1.4 * H * (W + D) + 1.4 * W * D],
    ['middle of a free-standing row', { sidesCovered: 2 }, 1.8 * W * H + 1.4 * W * D + D * H],
    ['middle of a row against a wall', { sidesCovered: 2, backCovered: true }, 1.4 * W * (H + D) + D * H],
    ['middle of a row against a wall, roof covered', { sidesCovered: 2, backCovered: true, topCovered: true }, 1.4 * W * H + 0.7 * W * D + D * H],
  ];
  it.each(cases)('%s', (_name, s, expectedM2) => {
    expect(effectiveCoolingSurface(shape(s)).effectiveAreaM2).toBeCloseTo(expectedM2, 12);
  });

  it('leaves the floor out: A_e never counts W·D at the bottom', () => {
    const { faces } = effectiveCoolingSurface(shape({}));
    expect(faces.map((f) => f.face).sort()).toEqual(['back', 'front', 'sides', 'top']);
  });
});

describe('mean air rise ΔT = P / (k·A_e)', () => {
  it('500 W in a free-standing painted-steel enclosure 2.0 × 0.8 × 0.6 m: 15.9 K by hand', () => {
    // By hand: A_e = 1.8·2.0·1.4 + 1.4·0.48 = 5.712 m²; k = 5.5 W/(m²·K) for painted sheet steel
    // (common practice, from memory); ΔT = 500 / (5.5·5.712) = 15.915 K.
    const r = enclosureAirTemperature({ ...shape({}), wall: 'painted-steel', lossesW: 500, outsideAirC: 35 });
    expect(r.effectiveAreaM2).toBeCloseTo(5.712, 10);
    expect(r.airRiseK).toBeCloseTo(500 / (5.5 * 5.712), 10);
    expect(r.insideAirC).toBeCloseTo(35 + 15.915, 2);
  });

  it('a covered enclosure sheds less heat, so the same loss warms it more', () => {
    const open = enclosureAirTemperature({ ...shape({}), wall: 'painted-steel', lossesW: 300, outsideAirC: 25 });
    const boxedIn = enclosureAirTemperature({ ...shape({ backCovered: true, sidesCovered: 2, topCovered: true }), wall: 'painted-steel', lossesW: 300, outsideAirC: 25 });
    expect(boxedIn.airRiseK).toBeGreaterThan(open.airRiseK);
    // Aluminium walls (k = 12 W/(m²·K), common practice) shed more than painted steel (5.5).
    const aluminium = enclosureAirTemperature({ ...shape({}), wall: 'aluminium', lossesW: 300, outsideAirC: 25 });
    expect(aluminium.airRiseK / open.airRiseK).toBeCloseTo(5.5 / 12, 12);
  });

  it('names the field of a bad input', () => {
    const bad = () => enclosureAirTemperature({ ...shape({ depthM: 0 }), wall: 'painted-steel', lossesW: 100, outsideAirC: 25 });
    expect(bad).toThrow(/enclosure\.depthM/);
    try {
      enclosureAirTemperature({ ...shape({}), wall: 'painted-steel', lossesW: -5, outsideAirC: 25 });
      expect.unreachable('a negative loss must be refused');
    } catch (error) {
      expect(isThermalInputError(error) && error.field).toBe('enclosure.lossesW');
    }
  });
});

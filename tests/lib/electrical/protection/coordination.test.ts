import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { overloadCoordination, smallestCoordinatedRating, IEC_60898_1_PREFERRED_RATINGS_A } from '@/lib/electrical/protection';

// IEC 60364-4-43 §433.1: I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z. Every case below is worked by hand
// with I₂ by the device standard's rule (IEC 60898-1 1.45·I_n, IEC 60947-2 1.30·I_r,
// IEC 60269-1 gG 1.6·I_n from 16 A — all from memory).

const mcb = (ratedCurrentA: number) => ({ kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA }) as const;
const fuse = (ratedCurrentA: number) => ({ kind: 'fuse-gG-iec60269', ratedCurrentA }) as const;

describe('overload coordination, IEC 60364-4-43 §433.1', () => {
  it('C20 on I_B = 18 A, I_z = 24 A passes: 18 ≤ 20 ≤ 24, I₂ = 29 ≤ 34.8', () => {
    const r = overloadCoordination({ device: mcb(20), designCurrentA: 18, ampacityA: 24 });
    expect(r.verdict).toBe('pass');
    const [a, b, c] = r.inequalities;
    expect([a.left, a.right, a.holds]).toEqual([18, 20, true]);
    expect([b.left, b.right, b.holds]).toEqual([20, 24, true]);
    expect(c.left).toBeCloseTo(29, 10);
    expect(c.right).toBeCloseTo(34.8, 10);
    expect(c.holds).toBe(true);
  });

  it('C20 on a circuit rated 19 A fails I_n ≤ I_z, and with I₂ = 1.45·I_n also I₂ ≤ 1.45·I_z (29 > 27.55)', () => {
    const r = overloadCoordination({ device: mcb(20), designCurrentA: 18, ampacityA: 19 });
    expect(r.verdict).toBe('fail');
    expect(r.inequalities.map((l) => l.holds)).toEqual([true, false, false]);
    expect(r.inequalities[2].right).toBeCloseTo(27.55, 10);
  });

  it('a 25 A gG fuse on I_z = 27 A fails I₂: 1.6·25 = 40 > 1.45·27 = 39.15 (fuses need I_n ≤ 0.906·I_z)', () => {
    const r = overloadCoordination({ device: fuse(25), designCurrentA: 20, ampacityA: 27 });
    expect(r.inequalities[1].holds).toBe(true);
    expect(r.inequalities[2].left).toBeCloseTo(40, 10);
    expect(r.inequalities[2].right).toBeCloseTo(39.15, 10);
    expect(r.verdict).toBe('fail');
  });

  it('an adjustable breaker is judged on its setting I_r, I₂ = 1.30·I_r', () => {
    const device = { kind: 'breaker-iec60947-2', ratedCurrentA: 250, settingCurrentA: 200, instantaneousCurrentA: 2000 } as const;
    const r = overloadCoordination({ device, designCurrentA: 190, ampacityA: 205 });
    expect(r.deviceCurrentA).toBe(200);
    expect(r.conventionalOperatingCurrentA).toBeCloseTo(260, 10);
    expect(r.inequalities[2].right).toBeCloseTo(297.25, 10);
    expect(r.verdict).toBe('pass');
  });

  it('bad inputs are refused with the field named', () => {
    expect(() => overloadCoordination({ device: mcb(20), designCurrentA: 18, ampacityA: 0 })).toThrow(ElectricalInputError);
    let field: string | undefined;
    try {
      overloadCoordination({ device: mcb(-1), designCurrentA: 18, ampacityA: 24 });
    } catch (e) {
      field = (e as ElectricalInputError).field;
    }
    expect(field).toBe('device.ratedCurrentA');
  });
});

describe('smallest device rating that satisfies §433.1 — exact at the boundary', () => {
  it('IEC 60898-1 series, I_B = 25 A exactly, I_z = 30 A: 25 A (I₂ 36.25 ≤ 43.5); 20 A, one rating below, fails I_B ≤ I_n', () => {
    const r = smallestCoordinatedRating({ kind: 'breaker-iec60898-1', designCurrentA: 25, ampacityA: 30 });
    expect(r.ratingA).toBe(25);
    expect(overloadCoordination({ device: mcb(25), designCurrentA: 25, ampacityA: 30 }).verdict).toBe('pass');
    const below = overloadCoordination({ device: mcb(20), designCurrentA: 25, ampacityA: 30 });
    expect(below.verdict).toBe('fail');
    expect(below.inequalities[0].holds).toBe(false);
  });

  it('gG series at the I₂ boundary: I_z = 40/1.45 A makes 1.6·25 = 1.45·I_z exactly — 25 A passes; with I_z 0.1 % lower nothing does', () => {
    const Iz = 40 / 1.45; // 27.586 A
    const r = smallestCoordinatedRating({ kind: 'fuse-gG-iec60269', designCurrentA: 21, ampacityA: Iz });
    expect(r.ratingA).toBe(25);
    // One rating below (20 A) fails I_B = 21 ≤ I_n.
    expect(overloadCoordination({ device: fuse(20), designCurrentA: 21, ampacityA: Iz }).inequalities[0].holds).toBe(false);
    // Just under the boundary 25 A fails I₂ and 32 A fails I_n ≤ I_z: no fuse.
    const none = smallestCoordinatedRating({ kind: 'fuse-gG-iec60269', designCurrentA: 21, ampacityA: Iz * 0.999 });
    expect(none.ratingA).toBeUndefined();
  });

  it('small gG fuses carry larger factors: I_B = 3 A, I_z = 4.5 A — 4 A fails I₂ (7.6 > 6.525), 6 A exceeds I_z: none', () => {
    const r = smallestCoordinatedRating({ kind: 'fuse-gG-iec60269', designCurrentA: 3, ampacityA: 4.5 });
    expect(r.ratingA).toBeUndefined();
  });

  it('IEC 60947-2 needs the settings of its trip unit; the smallest setting ≥ I_B wins', () => {
    expect(() => smallestCoordinatedRating({ kind: 'breaker-iec60947-2', designCurrentA: 150, ampacityA: 180 })).toThrow(ElectricalInputError);
    const settings = [100, 125, 160, 200, 250];
    const r = smallestCoordinatedRating({ kind: 'breaker-iec60947-2', designCurrentA: 150, ampacityA: 180, series: settings });
    expect(r.ratingA).toBe(160);
  });

  it('property: the smallest IEC 60898-1 rating found passes and the one below it fails (500 random circuits)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 120, noNaN: true }), fc.double({ min: 1, max: 1.5, noNaN: true }), (IB, ratio) => {
        const Iz = IB * ratio;
        const r = smallestCoordinatedRating({ kind: 'breaker-iec60898-1', designCurrentA: IB, ampacityA: Iz });
        const series = IEC_60898_1_PREFERRED_RATINGS_A;
        if (r.ratingA === undefined) {
          for (const In of series) expect(overloadCoordination({ device: mcb(In), designCurrentA: IB, ampacityA: Iz }).verdict).toBe('fail');
          return;
        }
        expect(overloadCoordination({ device: mcb(r.ratingA), designCurrentA: IB, ampacityA: Iz }).verdict).toBe('pass');
        const k = series.indexOf(r.ratingA);
        if (k > 0) expect(overloadCoordination({ device: mcb(series[k - 1]), designCurrentA: IB, ampacityA: Iz }).verdict).toBe('fail');
      }),
      { numRuns: 500 },
    );
  });
});

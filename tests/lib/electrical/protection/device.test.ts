import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import {
  conventionalOperatingCurrentOf,
  currentToOperateWithin,
  instantaneousTripOf,
  operatingTimeAt,
  protectiveDeviceSchema,
  validateProtectiveDevice,
} from '@/lib/electrical/protection';

/** The field an ElectricalInputError names, or a failure if none is thrown. */
function refusedField(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(ElectricalInputError);
    return (e as ElectricalInputError).field;
  }
  throw new Error('expected the input to be refused');
}

// Illustrative time–current points (input data, not a maker's curve): two decades of current
// over two decades of time, so the log–log line is t = 10 s·(I/100 A)^−2, easy to work by hand.
const curve = [
  { currentA: 100, timeS: 10 },
  { currentA: 1000, timeS: 0.1 },
];

describe('protective device data — refused with the field named', () => {
  it('I_n ≤ 0 is refused naming device.ratedCurrentA', () => {
    expect(refusedField(() => validateProtectiveDevice({ kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 0 }))).toBe('device.ratedCurrentA');
    expect(refusedField(() => validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: -16 }))).toBe('device.ratedCurrentA');
  });

  it('a curve whose time rises with current is refused naming the point and field', () => {
    const bad = [
      { currentA: 50, timeS: 100 },
      { currentA: 100, timeS: 10 },
      { currentA: 200, timeS: 20 },
    ];
    expect(refusedField(() => validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: 25, timeCurrentCurve: bad }))).toBe(
      'device.timeCurrentCurve[2].timeS',
    );
  });

  it('a curve whose current does not rise is refused naming the point', () => {
    const bad = [
      { currentA: 100, timeS: 10 },
      { currentA: 100, timeS: 1 },
    ];
    expect(refusedField(() => validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: 25, timeCurrentCurve: bad }))).toBe(
      'device.timeCurrentCurve[1].currentA',
    );
  });

  it('a plateau (equal times, an instantaneous release) is accepted; a one-point curve is not', () => {
    const plateau = [
      { currentA: 100, timeS: 10 },
      { currentA: 1000, timeS: 0.02 },
      { currentA: 5000, timeS: 0.02 },
    ];
    expect(() => validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: 25, timeCurrentCurve: plateau })).not.toThrow();
    expect(refusedField(() => validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: 25, timeCurrentCurve: [curve[0]] }))).toBe(
      'device.timeCurrentCurve',
    );
  });

  it('IEC 60947-2: I_r above I_n, outside its range, or I_i not above I_r is refused naming the field', () => {
    const base = { kind: 'breaker-iec60947-2', ratedCurrentA: 250, settingCurrentA: 200, instantaneousCurrentA: 2000 } as const;
    expect(() => validateProtectiveDevice(base)).not.toThrow();
    expect(refusedField(() => validateProtectiveDevice({ ...base, settingCurrentA: 260 }))).toBe('device.settingCurrentA');
    expect(refusedField(() => validateProtectiveDevice({ ...base, settingRangeA: { minA: 100, maxA: 175 } }))).toBe('device.settingCurrentA');
    expect(refusedField(() => validateProtectiveDevice({ ...base, settingRangeA: { minA: 100, maxA: 300 } }))).toBe('device.settingRangeA.maxA');
    expect(refusedField(() => validateProtectiveDevice({ ...base, instantaneousCurrentA: 150 }))).toBe('device.instantaneousCurrentA');
  });

  it('an unknown kind or curve letter is refused', () => {
    expect(refusedField(() => validateProtectiveDevice({ kind: 'rcd', ratedCurrentA: 40 }))).toBe('device.kind');
    expect(refusedField(() => validateProtectiveDevice({ kind: 'breaker-iec60898-1', curve: 'K', ratedCurrentA: 16 }))).toBe('device.curve');
  });

  it('the same schema serves the forms: safeParse reports the path', () => {
    const r = protectiveDeviceSchema.safeParse({ kind: 'fuse-gG-iec60269', ratedCurrentA: Number.NaN });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].path).toEqual(['ratedCurrentA']);
  });
});

describe('conventional operating current I₂ (from memory, as each standard states it)', () => {
  it('IEC 60898-1: 1.45·I_n — 16 A → 23.2 A', () => {
    const d = validateProtectiveDevice({ kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 16 });
    expect(conventionalOperatingCurrentOf(d).currentA).toBeCloseTo(23.2, 10);
  });
  it('IEC 60947-2: 1.30·I_r — I_r = 200 A → 260 A', () => {
    const d = validateProtectiveDevice({ kind: 'breaker-iec60947-2', ratedCurrentA: 250, settingCurrentA: 200, instantaneousCurrentA: 2000 });
    expect(conventionalOperatingCurrentOf(d).currentA).toBeCloseTo(260, 10);
  });
  it('IEC 60269-1 gG: 2.1·I_n below 4 A, 1.9·I_n from 4 to below 16 A, 1.6·I_n from 16 A', () => {
    const i2 = (In: number) => conventionalOperatingCurrentOf(validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: In })).currentA;
    expect(i2(2)).toBeCloseTo(4.2, 10);
    expect(i2(4)).toBeCloseTo(7.6, 10);
    expect(i2(12)).toBeCloseTo(22.8, 10);
    expect(i2(16)).toBeCloseTo(25.6, 10);
    expect(i2(100)).toBeCloseTo(160, 10);
  });
  it('an entered I₂ replaces the rule', () => {
    const d = validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: 16, conventionalOperatingCurrentA: 30 });
    expect(conventionalOperatingCurrentOf(d)).toMatchObject({ currentA: 30, entered: true });
  });
});

describe('trip data', () => {
  it('IEC 60898-1 Table 7 (from memory): certain instantaneous trip at 5, 10, 20·I_n for B, C, D, within 0.1 s', () => {
    for (const [curveLetter, m] of [['B', 5], ['C', 10], ['D', 20]] as const) {
      const t = instantaneousTripOf(validateProtectiveDevice({ kind: 'breaker-iec60898-1', curve: curveLetter, ratedCurrentA: 32 }));
      expect(t?.currentA).toBeCloseTo(32 * m, 10);
      expect(t?.timeS).toBe(0.1);
    }
  });

  it('IEC 60947-2 (from memory): certain instantaneous trip at 1.2·I_i, its break time an assumption unless entered', () => {
    const d = validateProtectiveDevice({ kind: 'breaker-iec60947-2', ratedCurrentA: 250, settingCurrentA: 200, instantaneousCurrentA: 2000 });
    expect(instantaneousTripOf(d)).toMatchObject({ currentA: 2400, timeBasis: 'assumed' });
    const e = validateProtectiveDevice({ kind: 'breaker-iec60947-2', ratedCurrentA: 250, settingCurrentA: 200, instantaneousCurrentA: 2000, instantaneousTolerance: 0.1, instantaneousMaxTimeS: 0.03 });
    expect(instantaneousTripOf(e)).toMatchObject({ timeS: 0.03, timeBasis: 'entered' });
    expect(instantaneousTripOf(e)?.currentA).toBeCloseTo(2200, 9);
  });

  it('curve interpolated in log–log, worked by hand: t = 10·(I/100)^−2', () => {
    const fuse = validateProtectiveDevice({ kind: 'fuse-gG-iec60269', ratedCurrentA: 32, timeCurrentCurve: curve });
    // I = 10^2.5 = 316.23 A: log t = 1 + (−2)(0.5) = 0 → t = 1 s.
    const at = operatingTimeAt(fuse, 10 ** 2.5);
    expect(at.method).toBe('curve');
    expect(at.timeS).toBeCloseTo(1, 10);
    // 500 A: t = 10/25 = 0.4 s; and back: the current for 0.4 s is 500 A.
    expect(operatingTimeAt(fuse, 500).timeS).toBeCloseTo(0.4, 10);
    expect(currentToOperateWithin(fuse, 0.4)).toBeCloseTo(500, 8);
    // The ends: below the first point nothing is shown; above the last its time bounds it.
    expect(operatingTimeAt(fuse, 90)).toMatchObject({ timeS: undefined, method: 'below-curve' });
    expect(operatingTimeAt(fuse, 2000)).toMatchObject({ timeS: 0.1, method: 'curve-end' });
    expect(currentToOperateWithin(fuse, 0.05)).toBeUndefined();
    expect(currentToOperateWithin(fuse, 20)).toBe(100);
  });

  it('a breaker below its instantaneous band without a curve shows no operating time', () => {
    const mcb = validateProtectiveDevice({ kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 16 });
    expect(operatingTimeAt(mcb, 159.9)).toMatchObject({ timeS: undefined, method: 'no-data' });
    expect(operatingTimeAt(mcb, 160)).toMatchObject({ timeS: 0.1, method: 'instantaneous' });
  });
});

// lib/api/finite.ts: the numbers the calculation API sends — nine significant digits, never NaN
// or ±Infinity. Expected values are the decimal roundings worked by hand (round half away from
// zero at the ninth significant digit; IEEE 754 doubles print as their shortest decimal, as
// ECMAScript Number::toString specifies).
import { describe, expect, it } from 'vitest';
import { WIRE_SIGNIFICANT_DIGITS, roundForWire, toWire } from '@/lib/api';

describe('roundForWire', () => {
  it('keeps nine significant digits across the magnitudes a result holds', () => {
    expect(WIRE_SIGNIFICANT_DIGITS).toBe(9);
    expect(roundForWire(89.99995226385218)).toBe(89.9999523);
    expect(roundForWire(0.0002814582562299426)).toBe(0.000281458256);
    expect(roundForWire(391.327429116972)).toBe(391.327429);
    expect(roundForWire(-2.6001026899077755)).toBe(-2.60010269);
    expect(roundForWire(1.0014374070455574)).toBe(1.00143741);
    expect(roundForWire(123456789012.34)).toBe(123456789000);
    expect(roundForWire(6.02214076e23)).toBe(6.02214076e23);
    expect(roundForWire(1.234567891234e-30)).toBe(1.23456789e-30);
  });

  it('leaves zero, short integers and numbers already short unchanged', () => {
    for (const x of [0, -0, 1, 90, 230, 50, 0.1, 0.8, 12.5, 987654321, -400]) expect(Object.is(roundForWire(x), x), String(x)).toBe(true);
  });

  it('prints short: the rounded value has at most nine significant digits in JSON', () => {
    for (const x of [Math.PI, Math.E * 1e-5, 1 / 3, 2 / 3 * 1e7, 0.1 + 0.2, 1e-7 / 3]) {
      const digits = JSON.stringify(roundForWire(x)).replace(/e.*$/, '').replace(/[-.]/g, '').replace(/^0+/, '');
      expect(digits.length, String(x)).toBeLessThanOrEqual(9);
      expect(Math.abs(roundForWire(x) - x) / Math.abs(x)).toBeLessThanOrEqual(5e-9);
    }
  });
});

describe('toWire', () => {
  it('copies a result with its numbers rounded, dropping undefined as JSON does, and leaves the original alone', () => {
    const result = { a: 1 / 3, list: [2 / 3, { b: 'text', c: null, d: undefined }], flag: true };
    const wire = toWire(result);
    expect(wire).toEqual({ ok: true, value: { a: 0.333333333, list: [0.666666667, { b: 'text', c: null }], flag: true } });
    expect(result.a).toBe(1 / 3);
  });

  it('names the path of the first number that is not finite', () => {
    expect(toWire({ evaluations: [{ ok: true }, { profile: { temperaturesC: [20, Number.NaN] } }] })).toEqual({ ok: false, path: 'evaluations.1.profile.temperaturesC.1' });
    expect(toWire({ x: Number.POSITIVE_INFINITY })).toEqual({ ok: false, path: 'x' });
    expect(toWire(Number.NEGATIVE_INFINITY)).toEqual({ ok: false, path: '(root)' });
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decimalSeparatorOfLocale, parseNumber, parseNumberCell, type DecimalSeparator } from '@/lib/units/parse';

const point = (text: string) => parseNumber(text, { decimalSeparator: '.', field: 'Design current' });
const comma = (text: string) => parseNumber(text, { decimalSeparator: ',', field: 'Design current' });
const valueOf = (r: ReturnType<typeof point>) => (r.ok ? r.value : r.message);

describe('parseNumber under a point as the decimal separator', () => {
  it('reads plain decimals, signs, a leading or trailing point and the typographic minus', () => {
    expect(valueOf(point('1250'))).toBe(1250);
    expect(valueOf(point('1.25'))).toBe(1.25);
    expect(valueOf(point(' 0.5 '))).toBe(0.5);
    expect(valueOf(point('.5'))).toBe(0.5);
    expect(valueOf(point('5.'))).toBe(5);
    expect(valueOf(point('-3.5'))).toBe(-3.5);
    expect(valueOf(point('\u22123.5'))).toBe(-3.5);
    expect(valueOf(point('+7'))).toBe(7);
  });

  it('refuses "1,250" as ambiguous, naming the field and both readings (issue 22)', () => {
    const r = point('1,250');
    expect(r.ok).toBe(false);
    expect(valueOf(r)).toContain('Design current: 1,250 — use 1250 or 1.25');
  });

  it('refuses a comma that cannot be a grouping and says which separator to use', () => {
    expect(valueOf(point('1,25'))).toBe('Design current: 1,25 — the decimal separator is a point: write 1.25');
  });

  it('refuses thousands groupings of every kind', () => {
    for (const text of ['1,250,000', '1 250', '1\u00a0250', "1'250", '1_250', '1,250.5']) {
      const r = point(text);
      expect(r.ok, text).toBe(false);
      expect(valueOf(r), text).toMatch(/^Design current: /);
    }
  });

  it('refuses hex, binary, exponent forms, Infinity and NaN, all of which Number() accepts', () => {
    for (const text of ['0x4E2', '0X4e2', '0b101', '0o17', '1e3', '1.5E-3', '2e+2', 'Infinity', '-Infinity', 'NaN']) {
      expect(Number.isNaN(Number(text)) && !/nan/i.test(text), `Number() reads ${text}`).toBe(false);
      const r = point(text);
      expect(r.ok, text).toBe(false);
      expect(valueOf(r), text).toMatch(/^Design current: /);
    }
  });

  it('refuses an empty text as empty (an optional field may take it as "not entered")', () => {
    expect(point('')).toEqual({ ok: false, empty: true, message: 'Design current: enter a number' });
    expect(point('   ')).toMatchObject({ ok: false, empty: true });
  });

  it('refuses two points and words', () => {
    for (const text of ['1.2.3', 'abc', '12A', '--1', '.', '-']) expect(point(text).ok, text).toBe(false);
  });
});

describe('parseNumber under a comma as the decimal separator', () => {
  it('reads "1,25" as 1.25', () => {
    expect(valueOf(comma('1,25'))).toBe(1.25);
    expect(valueOf(comma('-0,5'))).toBe(-0.5);
    expect(valueOf(comma('1250'))).toBe(1250);
  });

  it('refuses "1.250" as ambiguous with both readings in the comma convention', () => {
    expect(valueOf(comma('1.250'))).toContain('Design current: 1.250 — use 1250 or 1,25');
  });

  it('refuses a point that cannot be a grouping', () => {
    expect(valueOf(comma('1.25'))).toBe('Design current: 1.25 — the decimal separator is a comma: write 1,25');
    expect(comma('1.250,5').ok).toBe(false);
  });
});

describe('parseNumber round trip', () => {
  it('reads back every finite number written with either separator without grouping', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.constantFrom<DecimalSeparator>('.', ','), (x, sep) => {
        // toFixed writes no exponent for |x| < 1e21.
        const text = x.toFixed(6).replace('.', sep);
        const r = parseNumber(text, { decimalSeparator: sep, field: 'x' });
        expect(r.ok).toBe(true);
        if (r.ok) expect(r.value).toBeCloseTo(Number(x.toFixed(6)), 9);
      }),
    );
  });
});

describe('parseNumberCell', () => {
  it('takes an XLSX number as it is and a text through the parser', () => {
    const o = { decimalSeparator: ',' as const, field: 'Length (m)' };
    expect(parseNumberCell(12.5, o)).toEqual({ ok: true, value: 12.5 });
    expect(parseNumberCell('12,5', o)).toEqual({ ok: true, value: 12.5 });
    expect(parseNumberCell(null, o)).toMatchObject({ ok: false, empty: true });
    expect(parseNumberCell(Number.POSITIVE_INFINITY, o).ok).toBe(false);
  });
});

describe('decimalSeparatorOfLocale', () => {
  it('follows Intl.NumberFormat: en-GB writes a point, de-DE and fr-FR a comma', () => {
    expect(decimalSeparatorOfLocale('en-GB')).toBe('.');
    expect(decimalSeparatorOfLocale('de-DE')).toBe(',');
    expect(decimalSeparatorOfLocale('fr-FR')).toBe(',');
  });
});

describe('parseNumber with exponents allowed (catalogue properties only)', () => {
  it('reads "1.72e-8" and "1,72e-8" under its separator, and still refuses hex and ambiguity', () => {
    expect(parseNumber('1.72e-8', { decimalSeparator: '.', field: 'ρ20', exponent: true })).toEqual({ ok: true, value: 1.72e-8 });
    expect(parseNumber('1,72e-8', { decimalSeparator: ',', field: 'ρ20', exponent: true })).toEqual({ ok: true, value: 1.72e-8 });
    expect(parseNumber('0x4E2', { decimalSeparator: '.', field: 'ρ20', exponent: true }).ok).toBe(false);
    expect(parseNumber('1,250e-3', { decimalSeparator: '.', field: 'ρ20', exponent: true }).ok).toBe(false);
  });
});

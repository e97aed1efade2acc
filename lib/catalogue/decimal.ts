/**
 * Decimal strings at the edge: catalogue numbers are `numeric` in PostgreSQL and arrive as
 * strings; they are validated and normalised here with decimal.js so that nothing is rounded
 * through binary floating point on the way in.
 */
import Decimal from 'decimal.js';
import { z } from 'zod';

export interface DecimalBounds {
  /** Smallest allowed value (inclusive unless `minExclusive`). */
  min?: number | string;
  minExclusive?: boolean;
  max?: number | string;
  maxExclusive?: boolean;
}

const NUMBER_PATTERN = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/** Parses a user-entered number; `null` for an empty cell; a message when it is not a number. */
export function parseDecimal(raw: unknown): { value: Decimal | null } | { error: string } {
  if (raw === null || raw === undefined) return { value: null };
  // A cell the file-level reading refused (a decimal-comma file's ambiguous "1.250", lib/catalogue/files).
  if (typeof raw === 'object' && typeof (raw as { refusedNumber?: unknown }).refusedNumber === 'string') return { error: `must be a number: ${(raw as { refusedNumber: string }).refusedNumber}` };
  if (typeof raw === 'number') {
    if (!Number.isFinite(raw)) return { error: 'must be a finite number' };
    return { value: new Decimal(raw) };
  }
  if (typeof raw !== 'string') return { error: 'must be a number' };
  const text = raw.trim().replace(/\u00a0|\s/g, '');
  if (text === '') return { value: null };
  if (/^[-+]?\d+,\d+$/.test(text)) return { error: `must use a point as the decimal separator (got "${raw.trim()}")` };
  if (!NUMBER_PATTERN.test(text)) return { error: `must be a number (got "${raw.trim()}")` };
  return { value: new Decimal(text) };
}

function describeBounds(bounds: DecimalBounds): string {
  const parts: string[] = [];
  if (bounds.min !== undefined) parts.push(`${bounds.minExclusive ? 'greater than' : 'at least'} ${bounds.min}`);
  if (bounds.max !== undefined) parts.push(`${bounds.maxExclusive ? 'less than' : 'at most'} ${bounds.max}`);
  return parts.join(' and ');
}

export function checkBounds(value: Decimal, bounds: DecimalBounds): string | null {
  const { min, max } = bounds;
  const tooLow = min !== undefined && (bounds.minExclusive ? value.lte(min) : value.lt(min));
  const tooHigh = max !== undefined && (bounds.maxExclusive ? value.gte(max) : value.gt(max));
  return tooLow || tooHigh ? `must be ${describeBounds(bounds)} (got ${value.toString()})` : null;
}

/** A required decimal, output as a plain decimal string (no exponent) ready for `numeric`. */
export function decimalField(bounds: DecimalBounds = {}) {
  return z.unknown().transform((raw, ctx) => {
    const parsed = parseDecimal(raw);
    if ('error' in parsed) {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    if (parsed.value === null) {
      ctx.addIssue({ code: 'custom', message: 'is required' });
      return z.NEVER;
    }
    const outOfRange = checkBounds(parsed.value, bounds);
    if (outOfRange) {
      ctx.addIssue({ code: 'custom', message: outOfRange });
      return z.NEVER;
    }
    return plainDecimalText(raw, parsed.value);
  });
}

/**
 * The stored text: a plain decimal as typed (so that '0.320' keeps the three figures a table
 * gives), anything else (exponents, numbers) in plain positional notation.
 */
function plainDecimalText(raw: unknown, value: Decimal): string {
  if (typeof raw === 'string') {
    const text = raw.trim().replace(/^\+/, '');
    if (/^-?\d+(\.\d+)?$/.test(text)) return text.replace(/^(-?)0+(?=\d)/, '$1');
  }
  return value.toFixed();
}

/** An optional decimal: an empty cell gives null. */
export function optionalDecimalField(bounds: DecimalBounds = {}) {
  return z.unknown().transform((raw, ctx): string | null => {
    const parsed = parseDecimal(raw);
    if ('error' in parsed) {
      ctx.addIssue({ code: 'custom', message: parsed.error });
      return z.NEVER;
    }
    if (parsed.value === null) return null;
    const outOfRange = checkBounds(parsed.value, bounds);
    if (outOfRange) {
      ctx.addIssue({ code: 'custom', message: outOfRange });
      return z.NEVER;
    }
    return plainDecimalText(raw, parsed.value);
  });
}

/** A decimal string (as PostgreSQL returns it) to a JavaScript number for the physics library. */
export function toNumber(value: string | null | undefined): number | undefined {
  if (value === null || value === undefined || value === '') return undefined;
  return new Decimal(value).toNumber();
}

/** Significant digits of every number the calculation API sends: far beyond what any input or method supports, a third shorter on the wire. */
export const WIRE_SIGNIFICANT_DIGITS = 9;

/** 10^k for k = 0…22, each exactly representable, so x·10^k / 10^k rounds to the nearest decimal. */
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);

/** x to WIRE_SIGNIFICANT_DIGITS significant digits (integers of up to that many digits are kept as they are). */
export function roundForWire(x: number): number {
  if (x === 0 || (Number.isInteger(x) && Math.abs(x) < 10 ** WIRE_SIGNIFICANT_DIGITS)) return x;
  const decimals = WIRE_SIGNIFICANT_DIGITS - 1 - Math.floor(Math.log10(Math.abs(x)));
  if (decimals > 22 || -decimals > 22) return Number(x.toPrecision(WIRE_SIGNIFICANT_DIGITS));
  if (decimals >= 0) return Math.round(x * POWERS_OF_TEN[decimals]) / POWERS_OF_TEN[decimals];
  return Math.round(x / POWERS_OF_TEN[-decimals]) * POWERS_OF_TEN[-decimals];
}

/** The path where a walk met a number that is not finite. */
class NonFinite {
  readonly path: string[] = [];
}

function copyForWire(value: unknown): unknown {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new NonFinite();
    return roundForWire(value);
  }
  if (value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) {
    const copy = new Array<unknown>(value.length);
    for (let index = 0; index < value.length; index += 1) {
      try {
        copy[index] = copyForWire(value[index]);
      } catch (error) {
        if (error instanceof NonFinite) error.path.unshift(String(index));
        throw error;
      }
    }
    return copy;
  }
  const copy: Record<string, unknown> = {};
  for (const key in value) {
    if (!Object.hasOwn(value, key)) continue;
    const item = (value as Record<string, unknown>)[key];
    if (item === undefined) continue;
    try {
      copy[key] = copyForWire(item);
    } catch (error) {
      if (error instanceof NonFinite) error.path.unshift(key);
      throw error;
    }
  }
  return copy;
}

/**
 * A calculation result as the API sends it: a copy with every number to WIRE_SIGNIFICANT_DIGITS
 * significant digits, or the path of the first number that is not finite (NaN or ±Infinity). The
 * API refuses to send such a result: JSON would turn it into null and a client would read "no
 * value" where the computation went wrong.
 */
export function toWire<T>(value: T): { ok: true; value: T } | { ok: false; path: string } {
  try {
    return { ok: true, value: copyForWire(value) as T };
  } catch (error) {
    if (error instanceof NonFinite) return { ok: false, path: error.path.join('.') || '(root)' };
    throw error;
  }
}

/** `candidates[0].layers[1].thicknessM` (the library's spelling) → `candidates.0.layers.1.thicknessM` (zod's). */
export function toDotPath(field: string): string {
  return field.replace(/\[(\d+)\]/g, '.$1').replace(/^\./, '');
}

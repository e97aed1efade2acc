/**
 * Typed errors for `lib/electrical`.
 *
 * Every rejected input names the offending field so that a form, an API route or a schedule
 * upload can point at it. Results never carry NaN: bad input is refused here instead.
 */
export class ElectricalInputError extends Error {
  /** Name of the offending field, as the caller spelt it (dotted path inside objects). */
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'ElectricalInputError';
    this.field = field;
  }
}

/**
 * A sizing computation that could not produce an honest answer (the solver did not converge,
 * no steady state, no temperature limit known...). Carries a stable code for the UI.
 */
export class SizingError extends Error {
  readonly code: string;

  constructor(code: string, message: string) {
    super(message);
    this.name = 'SizingError';
    this.code = code;
  }
}

export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ElectricalInputError(field, `must be a finite number (got ${String(value)})`);
  }
  return value;
}

export function requirePositive(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v <= 0) throw new ElectricalInputError(field, `must be greater than zero (got ${v})`);
  return v;
}

export function requireNonNegative(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v < 0) throw new ElectricalInputError(field, `must not be negative (got ${v})`);
  return v;
}

export function requireRange(
  value: unknown,
  field: string,
  min: number,
  max: number,
  opts: { minExclusive?: boolean; maxExclusive?: boolean } = {},
): number {
  const v = requireFinite(value, field);
  const belowMin = opts.minExclusive ? v <= min : v < min;
  const aboveMax = opts.maxExclusive ? v >= max : v > max;
  if (belowMin || aboveMax) {
    const lo = opts.minExclusive ? '(' : '[';
    const hi = opts.maxExclusive ? ')' : ']';
    throw new ElectricalInputError(field, `must lie in ${lo}${min}, ${max}${hi} (got ${v})`);
  }
  return v;
}

export function requireInteger(value: unknown, field: string, min: number, max: number): number {
  const v = requireRange(value, field, min, max);
  if (!Number.isInteger(v)) throw new ElectricalInputError(field, `must be a whole number (got ${v})`);
  return v;
}

/** Temperatures in °C: finite and above absolute zero. */
export function requireTemperature(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v <= -273.15) throw new ElectricalInputError(field, `must be above absolute zero (got ${v} °C)`);
  return v;
}

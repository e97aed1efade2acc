/**
 * Protective devices as data: circuit-breakers to IEC 60898-1 (curves B, C, D) and to
 * IEC 60947-2 (adjustable setting I_r, instantaneous setting I_i), gG fuses to IEC 60269.
 *
 * The zod schema is the one definition of what a device may be; `validateProtectiveDevice`
 * runs it and turns the first problem into an ElectricalInputError naming the field (dotted
 * path, e.g. `device.timeCurrentCurve[2].timeS`), so the library, the forms and the API refuse
 * the same things in the same words.
 *
 * Values from the device standards below were recalled, not read from the documents: each
 * says "from memory" where it stands.
 */
import { z } from 'zod';
import { ElectricalInputError } from '../errors';

// ───────────────────────────── Standard data (from memory) ─────────────────────────────

/**
 * Preferred rated currents of IEC 60898-1 (§5.3.2, from memory), A. Makers sell others
 * (0.5–4 A); pass your own series to `smallestCoordinatedRating` for those.
 */
export const IEC_60898_1_PREFERRED_RATINGS_A: readonly number[] = Object.freeze([
  6, 8, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125,
]);

/**
 * Rated currents of gG fuse-links, IEC 60269-1 §5.3.1 (from memory), A. National systems add
 * others (35 A, 13 A …): pass your own series for those.
 */
export const IEC_60269_GG_RATINGS_A: readonly number[] = Object.freeze([
  2, 4, 6, 8, 10, 12, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250,
]);

export type BreakerCurve = 'B' | 'C' | 'D';

/**
 * Instantaneous tripping ranges of IEC 60898-1 Table 7 (from memory), multiples of I_n: the
 * breaker must not trip at the lower bound within 0.1 s and must trip below 0.1 s at the upper
 * bound. Disconnection is shown only at the upper bound (common practice: the breaker is
 * certain to trip there, anywhere in the band it may or may not). D: the standard allows makers
 * up to 50·I_n (from memory); enter the maker's curve for such a breaker.
 */
export const IEC_60898_1_INSTANTANEOUS_MULTIPLES: Readonly<Record<BreakerCurve, { lower: number; upper: number }>> = Object.freeze({
  B: Object.freeze({ lower: 3, upper: 5 }),
  C: Object.freeze({ lower: 5, upper: 10 }),
  D: Object.freeze({ lower: 10, upper: 20 }),
});

/** IEC 60898-1 Table 7 (from memory): at the upper instantaneous bound the breaker trips in less than 0.1 s. */
export const IEC_60898_1_INSTANTANEOUS_TIME_S = 0.1;

/** IEC 60898-1 (from memory): conventional tripping current I_t = 1.45·I_n (within 1 h, 2 h above 63 A). */
export const IEC_60898_1_CONVENTIONAL_TRIPPING_FACTOR = 1.45;

/** IEC 60947-2 Table 6 (from memory): conventional tripping current 1.30·I_r (non-tripping 1.05·I_r), at the reference temperature. */
export const IEC_60947_2_CONVENTIONAL_TRIPPING_FACTOR = 1.3;

/**
 * IEC 60947-2 §8.3.3.1.2 (from memory): the instantaneous release operates within ±20 % of its
 * setting; disconnection is shown at (1 + 0.2)·I_i unless the maker states a tighter tolerance.
 */
export const IEC_60947_2_INSTANTANEOUS_TOLERANCE = 0.2;

/**
 * Conventional fusing current I_f of gG fuse-links, IEC 60269-1 Table 2 (from memory), as a
 * multiple of I_n: 2.1 below 4 A, 1.9 from 4 A to below 16 A, 1.6 from 16 A up (conventional
 * time 1 h up to 63 A, 2 h to 160 A, 3 h to 400 A, 4 h above — times not used here).
 */
export function gGConventionalFusingFactor(ratedCurrentA: number): number {
  if (ratedCurrentA < 4) return 2.1;
  if (ratedCurrentA < 16) return 1.9;
  return 1.6;
}

// ───────────────────────────── Schema ─────────────────────────────

const positiveNumber = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`).refine((v) => v > 0, `${what} must be greater than 0`);

/** One point of a time–current curve: the device operates within `timeS` at `currentA` (r.m.s. prospective). */
export const timeCurrentPointSchema = z.object({
  currentA: positiveNumber('Current'),
  timeS: positiveNumber('Time'),
});

/**
 * A time–current curve entered as points: the maker's maximum operating (total clearing) time,
 * currents strictly rising, times never rising (a plateau is allowed: instantaneous releases
 * show one). Interpolated straight in log–log between points.
 */
export const timeCurrentCurveSchema = z
  .array(timeCurrentPointSchema)
  .min(2, 'A time–current curve needs at least two points')
  .max(200, 'A time–current curve has at most 200 points')
  .superRefine((points, ctx) => {
    for (let i = 1; i < points.length; i++) {
      if (!(points[i].currentA > points[i - 1].currentA)) {
        ctx.addIssue({
          code: 'custom',
          path: [i, 'currentA'],
          message: `must be greater than the previous point's current (${points[i - 1].currentA} A): currents rise along the curve`,
        });
        return;
      }
      if (points[i].timeS > points[i - 1].timeS) {
        ctx.addIssue({
          code: 'custom',
          path: [i, 'timeS'],
          message: `must not exceed the previous point's time (${points[i - 1].timeS} s): the operating time falls as the current rises`,
        });
        return;
      }
    }
  });

const conventionalOperatingCurrent = positiveNumber('Conventional operating current').optional();

export const breakerIec60898Schema = z.object({
  kind: z.literal('breaker-iec60898-1'),
  curve: z.enum(['B', 'C', 'D']),
  ratedCurrentA: positiveNumber('Rated current'),
  /** Entered I₂; without it 1.45·I_n (IEC 60898-1, from memory). */
  conventionalOperatingCurrentA: conventionalOperatingCurrent,
  /** The maker's curve, used for currents below the instantaneous band. */
  timeCurrentCurve: timeCurrentCurveSchema.optional(),
});

export const breakerIec60947Schema = z
  .object({
    kind: z.literal('breaker-iec60947-2'),
    /** Rated current of the breaker (frame/trip unit), A. */
    ratedCurrentA: positiveNumber('Rated current'),
    /** Overload setting I_r, A: the I_n of IEC 60364-4-43 §433.1 for an adjustable device. */
    settingCurrentA: positiveNumber('Setting'),
    /** The setting range of the trip unit, A (within 0 < min ≤ max ≤ I_n). */
    settingRangeA: z.object({ minA: positiveNumber('Lowest setting'), maxA: positiveNumber('Highest setting') }).optional(),
    /** Instantaneous setting I_i, A. */
    instantaneousCurrentA: positiveNumber('Instantaneous setting'),
    /** Tolerance of I_i as a fraction; without it 0.2 (IEC 60947-2, from memory). */
    instantaneousTolerance: z.number().min(0).max(0.5).optional(),
    /** Largest break time of the instantaneous release stated by the maker, s. */
    instantaneousMaxTimeS: positiveNumber('Instantaneous break time').optional(),
    /** Entered I₂; without it 1.30·I_r (IEC 60947-2, from memory). */
    conventionalOperatingCurrentA: conventionalOperatingCurrent,
    timeCurrentCurve: timeCurrentCurveSchema.optional(),
  })
  .superRefine((d, ctx) => {
    if (d.settingCurrentA > d.ratedCurrentA) {
      ctx.addIssue({ code: 'custom', path: ['settingCurrentA'], message: `must not exceed the rated current ${d.ratedCurrentA} A (got ${d.settingCurrentA} A)` });
    }
    if (d.settingRangeA) {
      const { minA, maxA } = d.settingRangeA;
      if (minA > maxA) {
        ctx.addIssue({ code: 'custom', path: ['settingRangeA', 'minA'], message: `must not exceed the highest setting ${maxA} A` });
      } else if (maxA > d.ratedCurrentA) {
        ctx.addIssue({ code: 'custom', path: ['settingRangeA', 'maxA'], message: `must not exceed the rated current ${d.ratedCurrentA} A` });
      } else if (d.settingCurrentA < minA || d.settingCurrentA > maxA) {
        ctx.addIssue({ code: 'custom', path: ['settingCurrentA'], message: `must lie in the setting range [${minA}, ${maxA}] A (got ${d.settingCurrentA} A)` });
      }
    }
    if (d.instantaneousCurrentA <= d.settingCurrentA) {
      ctx.addIssue({ code: 'custom', path: ['instantaneousCurrentA'], message: `must be above the setting I_r = ${d.settingCurrentA} A` });
    }
  });

export const fuseGgSchema = z.object({
  kind: z.literal('fuse-gG-iec60269'),
  ratedCurrentA: positiveNumber('Rated current'),
  /** Entered I₂ (conventional fusing current); without it the IEC 60269-1 factor (from memory). */
  conventionalOperatingCurrentA: conventionalOperatingCurrent,
  /** The maker's time–current (operating) curve: needed to check disconnection. */
  timeCurrentCurve: timeCurrentCurveSchema.optional(),
});

export const protectiveDeviceSchema = z.discriminatedUnion('kind', [breakerIec60898Schema, breakerIec60947Schema, fuseGgSchema]);

export type TimeCurrentPoint = z.infer<typeof timeCurrentPointSchema>;
export type BreakerIec60898 = z.infer<typeof breakerIec60898Schema>;
export type BreakerIec60947 = z.infer<typeof breakerIec60947Schema>;
export type FuseGg = z.infer<typeof fuseGgSchema>;
export type ProtectiveDevice = z.infer<typeof protectiveDeviceSchema>;
export type ProtectiveDeviceKind = ProtectiveDevice['kind'];

/** `a.b[2].c` from a zod issue path under a root name. */
function dottedPath(root: string, path: readonly PropertyKey[]): string {
  let out = root;
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : `${out ? '.' : ''}${String(p)}`;
  return out;
}

/**
 * The device checked against the schema; the first problem becomes an ElectricalInputError
 * naming the field under `field` (e.g. `device.ratedCurrentA`).
 */
export function validateProtectiveDevice(device: unknown, field = 'device'): ProtectiveDevice {
  const parsed = protectiveDeviceSchema.safeParse(device);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new ElectricalInputError(dottedPath(field, issue.path), issue.message);
}

// ───────────────────────────── What the device does ─────────────────────────────

/** The current of IEC 60364-4-43 §433.1 that plays I_n: the setting I_r for an adjustable breaker. */
export function coordinationCurrentOf(device: ProtectiveDevice): number {
  return device.kind === 'breaker-iec60947-2' ? device.settingCurrentA : device.ratedCurrentA;
}

export interface ConventionalOperatingCurrent {
  currentA: number;
  /** Where the figure came from, in words a reviewer can check. */
  basis: string;
  entered: boolean;
}

/** I₂, the current that ensures effective operation of the device within the conventional time (IEC 60364-4-43 §433.1). */
export function conventionalOperatingCurrentOf(device: ProtectiveDevice): ConventionalOperatingCurrent {
  if (device.conventionalOperatingCurrentA !== undefined) {
    return { currentA: device.conventionalOperatingCurrentA, basis: 'entered', entered: true };
  }
  switch (device.kind) {
    case 'breaker-iec60898-1':
      return {
        currentA: IEC_60898_1_CONVENTIONAL_TRIPPING_FACTOR * device.ratedCurrentA,
        basis: 'IEC 60898-1 conventional tripping current 1.45·I_n (from memory)',
        entered: false,
      };
    case 'breaker-iec60947-2':
      return {
        currentA: IEC_60947_2_CONVENTIONAL_TRIPPING_FACTOR * device.settingCurrentA,
        basis: 'IEC 60947-2 conventional tripping current 1.30·I_r (from memory)',
        entered: false,
      };
    case 'fuse-gG-iec60269': {
      const factor = gGConventionalFusingFactor(device.ratedCurrentA);
      return {
        currentA: factor * device.ratedCurrentA,
        basis: `IEC 60269-1 conventional fusing current ${factor}·I_n for a gG fuse-link of ${device.ratedCurrentA} A (from memory)`,
        entered: false,
      };
    }
  }
}

export interface InstantaneousTrip {
  /** Current at and above which the breaker is certain to trip instantaneously, A. */
  currentA: number;
  /** Break time at or above that current, s (an upper bound). */
  timeS: number;
  /** Whether `timeS` is the standard's bound, the maker's figure, or an assumption a reviewer must accept. */
  timeBasis: 'standard' | 'entered' | 'assumed';
  basis: string;
}

/** The certain instantaneous trip of a breaker; undefined for a fuse. */
export function instantaneousTripOf(device: ProtectiveDevice): InstantaneousTrip | undefined {
  if (device.kind === 'breaker-iec60898-1') {
    const multiple = IEC_60898_1_INSTANTANEOUS_MULTIPLES[device.curve].upper;
    return {
      currentA: multiple * device.ratedCurrentA,
      timeS: IEC_60898_1_INSTANTANEOUS_TIME_S,
      timeBasis: 'standard',
      basis: `curve ${device.curve}: ${multiple}·I_n, the upper bound of the instantaneous band, tripping in < 0.1 s (IEC 60898-1 Table 7, from memory)`,
    };
  }
  if (device.kind === 'breaker-iec60947-2') {
    const tolerance = device.instantaneousTolerance ?? IEC_60947_2_INSTANTANEOUS_TOLERANCE;
    const entered = device.instantaneousMaxTimeS !== undefined;
    return {
      currentA: (1 + tolerance) * device.instantaneousCurrentA,
      timeS: device.instantaneousMaxTimeS ?? IEC_60898_1_INSTANTANEOUS_TIME_S,
      timeBasis: entered ? 'entered' : 'assumed',
      basis:
        `(1 + ${tolerance})·I_i, the instantaneous setting plus its tolerance` +
        (device.instantaneousTolerance === undefined ? ' (±20 %, IEC 60947-2, from memory)' : ' (entered)') +
        (entered
          ? `, breaking within the maker's ${device.instantaneousMaxTimeS} s`
          : '; break time taken as 0.1 s, the IEC 60898-1 instantaneous bound — an assumption: enter the maker\'s break time'),
    };
  }
  return undefined;
}

export interface OperatingTime {
  /** Operating time at the current, s; undefined when the data do not show the device operating. */
  timeS: number | undefined;
  /** How it was found. `curve-end`: above the last point, the last point's time is an upper bound. */
  method: 'instantaneous' | 'curve' | 'curve-end' | 'below-curve' | 'no-data';
  basis: string;
}

/** log–log interpolation of a validated curve at `currentA` (inside its current range). */
function interpolateLogLog(curve: readonly TimeCurrentPoint[], currentA: number): number {
  let k = 1;
  while (k < curve.length - 1 && curve[k].currentA < currentA) k++;
  const a = curve[k - 1];
  const b = curve[k];
  const s = Math.log(currentA / a.currentA) / Math.log(b.currentA / a.currentA);
  return Math.exp(Math.log(a.timeS) + s * Math.log(b.timeS / a.timeS));
}

/** Time from the entered curve at a current (log–log), with the curve's ends said plainly. */
export function curveTimeAt(curve: readonly TimeCurrentPoint[], currentA: number): OperatingTime {
  const first = curve[0];
  const last = curve[curve.length - 1];
  if (currentA < first.currentA) {
    return {
      timeS: undefined,
      method: 'below-curve',
      basis: `${fmt(currentA)} A is below the curve's first point (${first.currentA} A, ${first.timeS} s): operation is not shown`,
    };
  }
  if (currentA > last.currentA) {
    return {
      timeS: last.timeS,
      method: 'curve-end',
      basis: `above the curve's last point (${last.currentA} A): its time ${last.timeS} s is an upper bound`,
    };
  }
  return { timeS: interpolateLogLog(curve, currentA), method: 'curve', basis: 'entered time–current curve, interpolated in log–log' };
}

/**
 * Operating time of a validated device at a prospective current: the breaker's certain
 * instantaneous trip first, then the entered curve; nothing is guessed outside either.
 */
export function operatingTimeAt(device: ProtectiveDevice, currentA: number): OperatingTime {
  const instantaneous = instantaneousTripOf(device);
  if (instantaneous && currentA >= instantaneous.currentA) {
    return { timeS: instantaneous.timeS, method: 'instantaneous', basis: instantaneous.basis };
  }
  if (device.timeCurrentCurve) return curveTimeAt(device.timeCurrentCurve, currentA);
  if (instantaneous) {
    return {
      timeS: undefined,
      method: 'no-data',
      basis: `${fmt(currentA)} A is below the certain instantaneous trip (${fmt(instantaneous.currentA)} A) and no time–current curve is entered`,
    };
  }
  return { timeS: undefined, method: 'no-data', basis: 'no time–current curve is entered for the fuse' };
}

/**
 * Smallest current at which the device is shown to operate within `timeS`; undefined when its
 * data do not show it that fast at any current.
 */
export function currentToOperateWithin(device: ProtectiveDevice, timeS: number): number | undefined {
  const candidates: number[] = [];
  const instantaneous = instantaneousTripOf(device);
  if (instantaneous && instantaneous.timeS <= timeS) candidates.push(instantaneous.currentA);
  const curve = device.timeCurrentCurve;
  if (curve) {
    const c = curveCurrentFor(curve, timeS);
    if (c !== undefined) candidates.push(c);
  }
  return candidates.length ? Math.min(...candidates) : undefined;
}

/** Inverse of the curve: the smallest current whose operating time is ≤ `timeS` (log–log). */
function curveCurrentFor(curve: readonly TimeCurrentPoint[], timeS: number): number | undefined {
  // Above the first point's time the curve shows operation from its first point on, not below it.
  if (curve[0].timeS <= timeS) return curve[0].currentA;
  for (let k = 1; k < curve.length; k++) {
    const a = curve[k - 1];
    const b = curve[k];
    if (b.timeS <= timeS) {
      const s = Math.log(timeS / a.timeS) / Math.log(b.timeS / a.timeS);
      return Math.exp(Math.log(a.currentA) + s * Math.log(b.currentA / a.currentA));
    }
  }
  return undefined;
}

function fmt(v: number): string {
  return Number(v.toPrecision(4)).toString();
}

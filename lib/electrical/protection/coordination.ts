/**
 * Overload protection coordination, IEC 60364-4-43 §433.1:
 *   (433.1)  I_B ≤ I_n ≤ I_z
 *   (433.2)  I₂ ≤ 1.45·I_z
 * I_B design current, I_n rated current of the device (the setting I_r of an adjustable
 * device), I_z the continuous current-carrying capacity of the conductors in their
 * installation (here: the circuit's rated ampacity after every derating and the group model,
 * supplied by the caller), I₂ the current ensuring effective operation of the device within
 * the conventional time.
 */
import { ElectricalInputError, requireNonNegative, requirePositive } from '../errors';
import {
  conventionalOperatingCurrentOf,
  coordinationCurrentOf,
  gGConventionalFusingFactor,
  IEC_60269_GG_RATINGS_A,
  IEC_60898_1_CONVENTIONAL_TRIPPING_FACTOR,
  IEC_60898_1_PREFERRED_RATINGS_A,
  IEC_60947_2_CONVENTIONAL_TRIPPING_FACTOR,
  validateProtectiveDevice,
  type ProtectiveDeviceKind,
} from './device';

/** IEC 60364-4-43 §433.1 factor on I_z in the I₂ condition. */
export const OVERLOAD_I2_FACTOR = 1.45;

/**
 * Relative slack in the comparisons, so that a rating exactly at a boundary (I_n = I_B, or
 * 1.6·I_n = 1.45·I_z with I_z worked back from it) is not lost to the last bit of a double.
 * 1e-9 of the current is far below any figure an engineer reads.
 */
const BOUNDARY_RELATIVE_SLACK = 1e-9;

function atMost(a: number, b: number): boolean {
  return a <= b * (1 + BOUNDARY_RELATIVE_SLACK);
}

export interface InequalityLine {
  /** The inequality in words, e.g. 'I_B ≤ I_n'. */
  text: string;
  left: number;
  right: number;
  holds: boolean;
}

export interface OverloadCoordinationResult {
  clause: 'IEC 60364-4-43 §433.1';
  designCurrentA: number;
  /** I_n, or the setting I_r for an adjustable breaker. */
  deviceCurrentA: number;
  ampacityA: number;
  conventionalOperatingCurrentA: number;
  conventionalOperatingCurrentBasis: string;
  /** I_B ≤ I_n, I_n ≤ I_z and I₂ ≤ 1.45·I_z, each with its numbers. */
  inequalities: [InequalityLine, InequalityLine, InequalityLine];
  verdict: 'pass' | 'fail';
}

function coordinationLines(IB: number, In: number, Iz: number, I2: number, nLabel: string): OverloadCoordinationResult['inequalities'] {
  const limit = OVERLOAD_I2_FACTOR * Iz;
  return [
    { text: `I_B ≤ ${nLabel}`, left: IB, right: In, holds: atMost(IB, In) },
    { text: `${nLabel} ≤ I_z`, left: In, right: Iz, holds: atMost(In, Iz) },
    { text: 'I₂ ≤ 1.45·I_z', left: I2, right: limit, holds: atMost(I2, limit) },
  ];
}

/** The two conditions of §433.1 for one device, with each inequality's numbers. */
export function overloadCoordination(args: { device: unknown; designCurrentA: number; ampacityA: number }): OverloadCoordinationResult {
  const device = validateProtectiveDevice(args?.device, 'device');
  const IB = requireNonNegative(args?.designCurrentA, 'designCurrentA');
  const Iz = requirePositive(args?.ampacityA, 'ampacityA');
  const In = coordinationCurrentOf(device);
  const I2 = conventionalOperatingCurrentOf(device);
  const inequalities = coordinationLines(IB, In, Iz, I2.currentA, device.kind === 'breaker-iec60947-2' ? 'I_r' : 'I_n');
  return {
    clause: 'IEC 60364-4-43 §433.1',
    designCurrentA: IB,
    deviceCurrentA: In,
    ampacityA: Iz,
    conventionalOperatingCurrentA: I2.currentA,
    conventionalOperatingCurrentBasis: I2.basis,
    inequalities,
    verdict: inequalities.every((l) => l.holds) ? 'pass' : 'fail',
  };
}

export interface SmallestRatingResult {
  clause: 'IEC 60364-4-43 §433.1';
  kind: ProtectiveDeviceKind;
  /** The smallest rating (or setting, for IEC 60947-2) of the series that satisfies §433.1; undefined when none does. */
  ratingA: number | undefined;
  /** The coordination lines at that rating, or at the largest rating tried when none passes. */
  inequalities: OverloadCoordinationResult['inequalities'] | undefined;
  /** The series searched, ascending. */
  series: readonly number[];
  seriesBasis: string;
}

/** I₂ of a device of `kind` at rating (setting) `In`, by the standard's rule. */
function ruleI2(kind: ProtectiveDeviceKind, In: number): number {
  switch (kind) {
    case 'breaker-iec60898-1':
      return IEC_60898_1_CONVENTIONAL_TRIPPING_FACTOR * In;
    case 'breaker-iec60947-2':
      return IEC_60947_2_CONVENTIONAL_TRIPPING_FACTOR * In;
    case 'fuse-gG-iec60269':
      return gGConventionalFusingFactor(In) * In;
  }
}

function checkSeries(series: unknown, field: string): number[] {
  if (!Array.isArray(series) || series.length === 0) throw new ElectricalInputError(field, 'must be a non-empty list of ratings in A');
  const values = series.map((v, i) => requirePositive(v, `${field}[${i}]`));
  return [...values].sort((a, b) => a - b);
}

/**
 * The smallest rating of a series that satisfies §433.1 with I₂ by the standard's rule for the
 * kind (1.45·I_n IEC 60898-1, 1.30·I_r IEC 60947-2, the gG factor IEC 60269-1 — all from
 * memory). Series: the IEC 60898-1 preferred ratings, the IEC 60269 gG ratings, or, for an
 * IEC 60947-2 breaker, the settings of its trip unit (no standard series: must be given).
 * Every rating is tried (the gG factor falls with rating, so a larger fuse can pass where a
 * smaller one fails I₂).
 */
export function smallestCoordinatedRating(args: {
  kind: ProtectiveDeviceKind;
  designCurrentA: number;
  ampacityA: number;
  series?: readonly number[];
}): SmallestRatingResult {
  const kind = args?.kind;
  if (kind !== 'breaker-iec60898-1' && kind !== 'breaker-iec60947-2' && kind !== 'fuse-gG-iec60269') {
    throw new ElectricalInputError('kind', `must be 'breaker-iec60898-1', 'breaker-iec60947-2' or 'fuse-gG-iec60269' (got ${String(kind)})`);
  }
  const IB = requireNonNegative(args.designCurrentA, 'designCurrentA');
  const Iz = requirePositive(args.ampacityA, 'ampacityA');
  let series: readonly number[];
  let seriesBasis: string;
  if (args.series !== undefined) {
    series = checkSeries(args.series, 'series');
    seriesBasis = 'entered';
  } else if (kind === 'breaker-iec60898-1') {
    series = IEC_60898_1_PREFERRED_RATINGS_A;
    seriesBasis = 'IEC 60898-1 preferred rated currents (from memory)';
  } else if (kind === 'fuse-gG-iec60269') {
    series = IEC_60269_GG_RATINGS_A;
    seriesBasis = 'IEC 60269-1 gG rated currents (from memory)';
  } else {
    throw new ElectricalInputError('series', 'an IEC 60947-2 breaker has no standard series: give the settings of its trip unit');
  }
  const label = kind === 'breaker-iec60947-2' ? 'I_r' : 'I_n';
  let lines: OverloadCoordinationResult['inequalities'] | undefined;
  for (const In of series) {
    lines = coordinationLines(IB, In, Iz, ruleI2(kind, In), label);
    if (lines.every((l) => l.holds)) return { clause: 'IEC 60364-4-43 §433.1', kind, ratingA: In, inequalities: lines, series, seriesBasis };
  }
  return { clause: 'IEC 60364-4-43 §433.1', kind, ratingA: undefined, inequalities: lines, series, seriesBasis };
}

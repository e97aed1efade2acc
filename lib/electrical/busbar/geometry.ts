/**
 * The geometry of a three-phase bus-bar system as data (issue 18, physics.md §10).
 *
 * Cross-section coordinates, metres: x runs across the phases (L1 at x = −a, L2 at 0, L3 at +a,
 * an optional neutral/PE pack beyond L3), y is vertical, every bar is centred on y = 0's pack
 * centre line, so the whole system is mirror-symmetric about y = 0 (the current distribution
 * uses that to halve its unknowns).
 *
 * - `edge`: bars on edge — wide faces vertical (the width is the height), the bars of a pack side
 *   by side along x, the gap between wide faces.
 * - `flat`: bars laid flat — wide faces horizontal, the bars of a pack stacked along y, the gap
 *   between wide faces; the packs still side by side along x.
 *
 * In both, the gap of a pack is between wide faces, and the force between sub-conductors acts
 * normal to them.
 */
import { ElectricalInputError, requireInteger, requirePositive } from '../errors';

export type BusbarArrangement = 'edge' | 'flat';
export type BusbarGroupName = 'L1' | 'L2' | 'L3' | 'N' | 'PE';

export interface BusbarNeutralInput {
  /** A neutral or protective-earth pack beyond L3; in balanced operation its net current is zero. */
  role: 'neutral' | 'pe';
  /** Bars in the pack. */
  bars: number;
  /** Thickness of each of its bars, m; its width is the phase bars' width. */
  thicknessM: number;
  /** Clear gap between its bars, m (required when bars > 1). */
  gapM?: number;
  /** Centre of the L3 pack to the centre of this pack, m. */
  spacingM: number;
}

/** Plain data, SI units. Validated by `prepareBusbarSystem`. */
export interface BusbarSystemInput {
  /** Bars in parallel per phase (a pack), 1 … 8. */
  barsPerPhase: number;
  /** The larger cross-section dimension of one bar, m. */
  barWidthM: number;
  /** The smaller cross-section dimension of one bar, m. */
  barThicknessM: number;
  /** Clear gap between the wide faces of neighbouring bars of a pack, m (required when barsPerPhase > 1). */
  gapM?: number;
  /** Phase spacing, centre of one pack to the centre of the next, m. */
  phaseSpacingM: number;
  arrangement: BusbarArrangement;
  /** Distance between the supports of the run (the span of the beam), m. */
  supportSpacingM: number;
  /** Distance between spacers tying the bars of a pack together, m; defaults to the support spacing. */
  spacerSpacingM?: number;
  neutral?: BusbarNeutralInput;
}

export interface BusbarRectangle {
  /** Centre, m. */
  cxM: number;
  cyM: number;
  /** Extent along x and along y, m. */
  sizeXM: number;
  sizeYM: number;
}

export interface BusbarBar extends BusbarRectangle {
  /** Position in `PreparedBusbarSystem.bars`. */
  index: number;
  group: BusbarGroupName;
  /** Position in `PreparedBusbarSystem.groups`. */
  groupIndex: number;
  /** 0 … n − 1 from −x (edge) or from −y (flat). */
  positionInPack: number;
  widthM: number;
  thicknessM: number;
}

export interface BusbarGroup {
  name: BusbarGroupName;
  /** Indices into `bars`. */
  barIndices: number[];
  /** Pack centre along x, m. */
  centreXM: number;
  barThicknessM: number;
  gapM: number;
}

export interface PreparedBusbarSystem {
  readonly input: Readonly<BusbarSystemInput>;
  readonly arrangement: BusbarArrangement;
  readonly barsPerPhase: number;
  readonly barWidthM: number;
  readonly barThicknessM: number;
  /** 0 when there is one bar per phase. */
  readonly gapM: number;
  readonly phaseSpacingM: number;
  readonly supportSpacingM: number;
  readonly spacerSpacingM: number;
  readonly groups: readonly BusbarGroup[];
  readonly bars: readonly BusbarBar[];
  /** Overall extent of one phase pack along x and y, m. */
  readonly packSizeXM: number;
  readonly packSizeYM: number;
  /** Clear distance between neighbouring phase packs, m. */
  readonly phaseClearanceM: number;
}

const MAX_BARS_PER_PACK = 8;

function packExtents(arrangement: BusbarArrangement, bars: number, widthM: number, thicknessM: number, gapM: number) {
  const stack = bars * thicknessM + (bars - 1) * gapM;
  return arrangement === 'edge' ? { sizeXM: stack, sizeYM: widthM } : { sizeXM: widthM, sizeYM: stack };
}

function requireGap(value: unknown, bars: number, field: string): number {
  if (bars === 1) {
    if (value !== undefined) requirePositive(value, field);
    return 0;
  }
  if (value === undefined) throw new ElectricalInputError(field, `is required with ${bars} bars in a pack`);
  // A gap of zero is one solid bar, not a pack; a negative gap is bars overlapping.
  return requirePositive(value, field);
}

function layPack(
  arrangement: BusbarArrangement,
  group: BusbarGroupName,
  groupIndex: number,
  centreXM: number,
  bars: number,
  widthM: number,
  thicknessM: number,
  gapM: number,
  firstIndex: number,
): BusbarBar[] {
  const pitch = thicknessM + gapM;
  const out: BusbarBar[] = [];
  for (let k = 0; k < bars; k++) {
    const offset = (k - (bars - 1) / 2) * pitch;
    const edge = arrangement === 'edge';
    out.push({
      index: firstIndex + k,
      group,
      groupIndex,
      positionInPack: k,
      cxM: edge ? centreXM + offset : centreXM,
      cyM: edge ? 0 : offset,
      sizeXM: edge ? thicknessM : widthM,
      sizeYM: edge ? widthM : thicknessM,
      widthM,
      thicknessM,
    });
  }
  return out;
}

/**
 * Validates the geometry (every refusal names its field) and lays the bars out. Refused: non-finite
 * or non-positive dimensions, a gap ≤ 0 in a pack, a support or spacer spacing ≤ 0, a thickness
 * larger than the width (dimensions swapped), packs of neighbouring phases (or the neutral) that
 * touch or overlap.
 */
export function prepareBusbarSystem(input: BusbarSystemInput): PreparedBusbarSystem {
  if (input === null || typeof input !== 'object') throw new ElectricalInputError('system', 'must be an object');
  const arrangement = input.arrangement;
  if (arrangement !== 'edge' && arrangement !== 'flat') {
    throw new ElectricalInputError('arrangement', `must be 'edge' or 'flat' (got ${String(arrangement)})`);
  }
  const barsPerPhase = requireInteger(input.barsPerPhase, 'barsPerPhase', 1, MAX_BARS_PER_PACK);
  const barWidthM = requirePositive(input.barWidthM, 'barWidthM');
  const barThicknessM = requirePositive(input.barThicknessM, 'barThicknessM');
  if (barThicknessM > barWidthM) {
    throw new ElectricalInputError('barThicknessM', `must not exceed the width (${barThicknessM} m > ${barWidthM} m): width and thickness swapped?`);
  }
  const gapM = requireGap(input.gapM, barsPerPhase, 'gapM');
  const phaseSpacingM = requirePositive(input.phaseSpacingM, 'phaseSpacingM');
  const supportSpacingM = requirePositive(input.supportSpacingM, 'supportSpacingM');
  const spacerSpacingM = input.spacerSpacingM === undefined ? supportSpacingM : requirePositive(input.spacerSpacingM, 'spacerSpacingM');
  if (spacerSpacingM > supportSpacingM) {
    throw new ElectricalInputError('spacerSpacingM', `must not exceed the support spacing (${spacerSpacingM} m > ${supportSpacingM} m)`);
  }

  const pack = packExtents(arrangement, barsPerPhase, barWidthM, barThicknessM, gapM);
  const phaseClearanceM = phaseSpacingM - pack.sizeXM;
  if (!(phaseClearanceM > 0)) {
    throw new ElectricalInputError(
      'phaseSpacingM',
      `${phaseSpacingM} m centre to centre leaves the packs (${pack.sizeXM} m across) touching or overlapping`,
    );
  }

  const groups: BusbarGroup[] = [];
  const bars: BusbarBar[] = [];
  (['L1', 'L2', 'L3'] as const).forEach((name, i) => {
    const centreXM = (i - 1) * phaseSpacingM;
    const laid = layPack(arrangement, name, i, centreXM, barsPerPhase, barWidthM, barThicknessM, gapM, bars.length);
    groups.push({ name, barIndices: laid.map((b) => b.index), centreXM, barThicknessM, gapM });
    bars.push(...laid);
  });

  if (input.neutral !== undefined) {
    const n = input.neutral;
    if (n === null || typeof n !== 'object') throw new ElectricalInputError('neutral', 'must be an object');
    if (n.role !== 'neutral' && n.role !== 'pe') throw new ElectricalInputError('neutral.role', `must be 'neutral' or 'pe' (got ${String(n.role)})`);
    const nBars = requireInteger(n.bars, 'neutral.bars', 1, MAX_BARS_PER_PACK);
    const nThickness = requirePositive(n.thicknessM, 'neutral.thicknessM');
    if (nThickness > barWidthM) throw new ElectricalInputError('neutral.thicknessM', `must not exceed the bar width ${barWidthM} m`);
    const nGap = requireGap(n.gapM, nBars, 'neutral.gapM');
    const nSpacing = requirePositive(n.spacingM, 'neutral.spacingM');
    const nPack = packExtents(arrangement, nBars, barWidthM, nThickness, nGap);
    if (!(nSpacing - (pack.sizeXM + nPack.sizeXM) / 2 > 0)) {
      throw new ElectricalInputError('neutral.spacingM', `${nSpacing} m from L3 leaves the neutral pack touching or overlapping L3`);
    }
    const name: BusbarGroupName = n.role === 'neutral' ? 'N' : 'PE';
    const centreXM = phaseSpacingM + nSpacing;
    const laid = layPack(arrangement, name, 3, centreXM, nBars, barWidthM, nThickness, nGap, bars.length);
    groups.push({ name, barIndices: laid.map((b) => b.index), centreXM, barThicknessM: nThickness, gapM: nGap });
    bars.push(...laid);
  }

  return Object.freeze({
    input: Object.freeze({ ...input }),
    arrangement,
    barsPerPhase,
    barWidthM,
    barThicknessM,
    gapM,
    phaseSpacingM,
    supportSpacingM,
    spacerSpacingM,
    groups,
    bars,
    packSizeXM: pack.sizeXM,
    packSizeYM: pack.sizeYM,
    phaseClearanceM,
  });
}

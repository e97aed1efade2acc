/**
 * Third-harmonic currents in four- and five-core cables, IEC 60364-5-52 Annex E.
 *
 * In a balanced three-phase circuit the third harmonics of the three phases are in phase and
 * add in the neutral: I_N = 3·h₃·I_B (h₃ the third-harmonic content of the phase current as a
 * fraction, as Annex E writes it). The neutral, a fourth loaded conductor in the cable, heats
 * it; Table E.52.1 (from memory) gives the reduction factor and which current sizes the cable:
 *
 *   h₃ (of the phase current)   factor   size on
 *   0 – 15 %                    1.0      phase current
 *   15 – 33 %                   0.86     phase current
 *   33 – 45 %                   0.86     neutral current
 *   > 45 %                      1.0      neutral current
 *
 * A band includes its upper figure (15 % is in the first, 33 % in the second, 45 % in the
 * third): our reading of the table's "0 – 15, 15 – 33 …", said so. The sizing current is
 * I_B/factor or I_N/factor; the cable's tabulated (or modelled three-loaded-core) rating must
 * reach it. Applies to four- and five-core cables whose neutral is of the phase conductors'
 * material and section, in three-phase circuits; other triplen harmonics are not counted.
 */
import { ElectricalInputError, requireNonNegative, requireRange } from '../errors';

export interface HarmonicBand {
  /** Upper bound of the band as a fraction (inclusive); Infinity for the last. */
  upToFraction: number;
  factor: number;
  sizeOn: 'phase' | 'neutral';
}

/** IEC 60364-5-52 Table E.52.1 (from memory). */
export const ANNEX_E_BANDS: readonly HarmonicBand[] = Object.freeze([
  Object.freeze({ upToFraction: 0.15, factor: 1.0, sizeOn: 'phase' as const }),
  Object.freeze({ upToFraction: 0.33, factor: 0.86, sizeOn: 'phase' as const }),
  Object.freeze({ upToFraction: 0.45, factor: 0.86, sizeOn: 'neutral' as const }),
  Object.freeze({ upToFraction: Number.POSITIVE_INFINITY, factor: 1.0, sizeOn: 'neutral' as const }),
]);

export interface HarmonicSizingResult {
  clause: 'IEC 60364-5-52 Annex E';
  designCurrentA: number;
  thirdHarmonicFraction: number;
  /** 3·h₃·I_B, A. */
  neutralCurrentA: number;
  reductionFactor: number;
  governing: 'phase' | 'neutral';
  /** The current the cable must carry as rated: I_B/factor or I_N/factor, A. */
  sizingCurrentA: number;
  basis: string;
}

/** The Annex E band of a third-harmonic fraction (upper figure inclusive). */
export function annexEBand(thirdHarmonicFraction: number): HarmonicBand {
  const h = requireRange(thirdHarmonicFraction, 'thirdHarmonicFraction', 0, 1);
  return ANNEX_E_BANDS.find((b) => h <= b.upToFraction) as HarmonicBand;
}

export function harmonicNeutralSizing(args: {
  designCurrentA: number;
  /** Third-harmonic content of the phase current, as a fraction 0–1 (0.2 for 20 %). */
  thirdHarmonicFraction: number;
  cores: number;
}): HarmonicSizingResult {
  const IB = requireNonNegative(args?.designCurrentA, 'designCurrentA');
  const h = requireRange(args.thirdHarmonicFraction, 'thirdHarmonicFraction', 0, 1);
  if (args.cores !== 4 && args.cores !== 5) {
    throw new ElectricalInputError('cores', `Annex E applies to four- and five-core cables (got ${String(args.cores)})`);
  }
  const band = annexEBand(h);
  const neutralCurrentA = 3 * h * IB;
  const base = band.sizeOn === 'phase' ? IB : neutralCurrentA;
  const percent = Number((h * 100).toPrecision(6));
  return {
    clause: 'IEC 60364-5-52 Annex E',
    designCurrentA: IB,
    thirdHarmonicFraction: h,
    neutralCurrentA,
    reductionFactor: band.factor,
    governing: band.sizeOn,
    sizingCurrentA: base / band.factor,
    basis: `Table E.52.1 (from memory): ${percent} % third harmonic — factor ${band.factor} on the ${band.sizeOn} current`,
  };
}

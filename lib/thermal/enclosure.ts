/**
 * Air temperature inside a closed enclosure from the losses inside it (physics.md §6).
 *
 * Method — wall heat transfer, common practice in enclosure climate sizing (from memory):
 *   P = k · A_e · ΔT_air
 * with
 *   - A_e the effective cooling surface of IEC TR 60890: each face's area times a surface factor b
 *     for how free it is to shed heat — exposed top 1.4, covered top 0.7, exposed side 0.9,
 *     covered side (against a wall or a neighbour) 0.5, floor 0 (IEC TR 60890 Table of surface
 *     factors, from memory; the same factors give the installation-type formulas that enclosure
 *     literature quotes, e.g. free-standing A = 1.8·H·(W + D) + 1.4·W·D);
 *   - k the overall heat transfer coefficient of the wall, W/(m²·K), for the wall material
 *     (common-practice values, from memory): painted sheet steel 5.5, stainless steel 3.7,
 *     aluminium 12, plastic (polycarbonate, polyester) 3.5.
 * The answer is one mean air temperature. It is not the IEC TR 60890 calculation (that gives the
 * rise at mid-height and at the top with an enclosure constant and a distribution factor read from
 * its figures): air at the top of a tall enclosure is warmer than this mean, which the caller must
 * say. Sealed enclosures only: ventilation openings, fans and solar gain are outside this method.
 */
import { ThermalInputError } from './errors';

export const ENCLOSURE_WALL_COEFFICIENTS_W_PER_M2K = {
  'painted-steel': 5.5,
  'stainless-steel': 3.7,
  aluminium: 12,
  plastic: 3.5,
} as const;
export type EnclosureWall = keyof typeof ENCLOSURE_WALL_COEFFICIENTS_W_PER_M2K;

/** IEC TR 60890 surface factors b (from memory). */
export const SURFACE_FACTORS = { topExposed: 1.4, topCovered: 0.7, sideExposed: 0.9, sideCovered: 0.5 } as const;

export interface EnclosureShape {
  heightM: number;
  widthM: number;
  depthM: number;
  /** The back stands against a wall. */
  backCovered: boolean;
  /** Side faces against a wall or a neighbouring enclosure in a row: 0, 1 or 2. */
  sidesCovered: 0 | 1 | 2;
  /** The roof is covered (by a shelf, a floor above, cable trays laid on it). */
  topCovered: boolean;
}

export interface EnclosureFace {
  face: 'front' | 'back' | 'sides' | 'top';
  areaM2: number;
  surfaceFactor: number;
  effectiveAreaM2: number;
}

/** The effective cooling surface A_e = Σ b·A₀ (floor excluded) and its parts. */
export function effectiveCoolingSurface(shape: EnclosureShape): { effectiveAreaM2: number; faces: EnclosureFace[] } {
  for (const [name, value] of [
    ['heightM', shape.heightM],
    ['widthM', shape.widthM],
    ['depthM', shape.depthM],
  ] as const) {
    if (!(Number.isFinite(value) && value > 0)) throw new ThermalInputError(`enclosure.${name}`, 'must be a positive length in metres');
  }
  const { heightM: h, widthM: w, depthM: d } = shape;
  const b = SURFACE_FACTORS;
  const sideArea = h * d;
  const faces: EnclosureFace[] = [
    { face: 'front', areaM2: h * w, surfaceFactor: b.sideExposed, effectiveAreaM2: b.sideExposed * h * w },
    { face: 'back', areaM2: h * w, surfaceFactor: shape.backCovered ? b.sideCovered : b.sideExposed, effectiveAreaM2: (shape.backCovered ? b.sideCovered : b.sideExposed) * h * w },
    {
      face: 'sides',
      areaM2: 2 * sideArea,
      // Mixed when one side is covered: the mean of the two factors over both sides.
      surfaceFactor: ((2 - shape.sidesCovered) * b.sideExposed + shape.sidesCovered * b.sideCovered) / 2,
      effectiveAreaM2: ((2 - shape.sidesCovered) * b.sideExposed + shape.sidesCovered * b.sideCovered) * sideArea,
    },
    { face: 'top', areaM2: w * d, surfaceFactor: shape.topCovered ? b.topCovered : b.topExposed, effectiveAreaM2: (shape.topCovered ? b.topCovered : b.topExposed) * w * d },
  ];
  return { effectiveAreaM2: faces.reduce((sum, f) => sum + f.effectiveAreaM2, 0), faces };
}

export interface EnclosureAirInput extends EnclosureShape {
  wall: EnclosureWall;
  /** Heat released inside, W. */
  lossesW: number;
  /** Air around the enclosure, °C. */
  outsideAirC: number;
}

export interface EnclosureAirResult {
  effectiveAreaM2: number;
  faces: EnclosureFace[];
  wallCoefficientWPerM2K: number;
  airRiseK: number;
  /** Mean air temperature inside, °C. */
  insideAirC: number;
  /** Heat the enclosure sheds per kelvin of rise, W/K (k·A_e). */
  conductanceWPerK: number;
}

export function enclosureAirTemperature(input: EnclosureAirInput): EnclosureAirResult {
  const { effectiveAreaM2, faces } = effectiveCoolingSurface(input);
  if (!(Number.isFinite(input.lossesW) && input.lossesW >= 0)) throw new ThermalInputError('enclosure.lossesW', 'must be zero or more watts');
  if (!Number.isFinite(input.outsideAirC)) throw new ThermalInputError('enclosure.outsideAirC', 'must be a temperature in °C');
  const k = ENCLOSURE_WALL_COEFFICIENTS_W_PER_M2K[input.wall];
  if (k === undefined) throw new ThermalInputError('enclosure.wall', `must be one of ${Object.keys(ENCLOSURE_WALL_COEFFICIENTS_W_PER_M2K).join(', ')}`);
  const conductanceWPerK = k * effectiveAreaM2;
  const airRiseK = input.lossesW / conductanceWPerK;
  return { effectiveAreaM2, faces, wallCoefficientWPerM2K: k, airRiseK, insideAirC: input.outsideAirC + airRiseK, conductanceWPerK };
}

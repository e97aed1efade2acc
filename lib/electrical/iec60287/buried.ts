/**
 * External thermal resistance of buried cables, IEC 60287-2-1 §4.2.2–§4.2.7 (ed. 1: §2.2.2–
 * §2.2.7). Formulas from memory; each is checked in the tests against an independent
 * calculation (superposition of line sources with images, the logarithmic capacity of touching
 * circles or of a rectangle computed numerically).
 *
 * Coordinates as in ./arrangement.ts: x horizontal, y upward, ground surface at y = 0, so a
 * cable centre has y < 0. The ground surface is isothermal at the ambient ground temperature
 * (Kennelly's hypothesis, which the standard's image method assumes).
 */
import { ElectricalInputError, requireFinite, requireNonNegative, requirePositive, requireRange } from '../errors';
import {
  DUCT_AIR_SPACE_CONSTANTS,
  DUCT_AIR_SPACE_DIAMETER_RANGE_M,
  DUCT_BANK_MAX_SIDE_RATIO,
  DUCT_WALL_RESISTIVITY,
  type DuctMaterial,
} from './constants';

const TWO_PI = 2 * Math.PI;

/** ln(u + √(u² − 1)) = arccosh(u), u = 2L/D_e > 1: the exact single-cable geometric factor. */
function arccoshOfDepthRatio(depthM: number, diameterM: number, field: string): number {
  const u = (2 * depthM) / diameterM;
  if (!(u > 1)) throw new ElectricalInputError(field, `the axis must lie deeper than the radius (u = 2L/D = ${u.toPrecision(4)} must exceed 1)`);
  return Math.log(u + Math.sqrt(u * u - 1));
}

/**
 * One isolated buried cable, IEC 60287-2-1 §4.2.2 (ed. 1 §2.2.2; the brief's §4.2.3.2):
 * T₄ = ρ/(2π)·ln(u + √(u² − 1)), u = 2L/D_e, L the depth of the axis. Exact for a cylinder whose
 * surface is isothermal under an isothermal ground surface; ≈ ρ/(2π)·ln(2u) when u > 10.
 */
export function buriedCableExternalResistance(args: { soilResistivityKmPerW: number; depthM: number; externalDiameterM: number }): number {
  const rho = requirePositive(args?.soilResistivityKmPerW, 'soilResistivityKmPerW');
  const L = requirePositive(args.depthM, 'depthM');
  const de = requirePositive(args.externalDiameterM, 'externalDiameterM');
  return (rho / TWO_PI) * arccoshOfDepthRatio(L, de, 'depthM');
}

export interface Point {
  xM: number;
  yM: number;
}

/**
 * ln(d′_pk / d_pk): d_pk from the centre of cable p to the centre of cable k, d′_pk from p to the
 * image of k mirrored in the ground surface (IEC 60287-2-1 §4.2.3, from memory).
 */
export function imageLogRatio(p: Point, k: Point, field = 'cables'): number {
  if (!(p.yM < 0) || !(k.yM < 0)) throw new ElectricalInputError(field, 'buried cable centres must lie below the ground surface (y < 0)');
  const d = Math.hypot(p.xM - k.xM, p.yM - k.yM);
  if (!(d > 0)) throw new ElectricalInputError(field, 'two cables share one centre');
  const dImage = Math.hypot(p.xM - k.xM, p.yM + k.yM);
  return Math.log(dImage / d);
}

export interface HeatedPoint extends Point {
  /** Total heat the cable gives off, W/m (conductor, screen, armour and dielectric). */
  heatWPerM: number;
}

/**
 * Rise of the surface of cable p caused by every OTHER cable, IEC 60287-2-1 §4.2.3 (groups of
 * buried cables not touching, from memory): ΔT_p = Σ_{k≠p} W_k·ρ/(2π)·ln(d′_pk/d_pk).
 * Each cable is a line source; the rise is the mean over p's surface (a line source outside a
 * circle has the value at the circle's centre as its mean over the circle).
 */
export function mutualHeatingRise(args: { soilResistivityKmPerW: number; cables: HeatedPoint[]; at: number }): number {
  const rho = requirePositive(args?.soilResistivityKmPerW, 'soilResistivityKmPerW');
  const cables = args.cables;
  if (!Array.isArray(cables) || cables.length === 0) throw new ElectricalInputError('cables', 'give at least one cable');
  const p = cables[args.at];
  if (!p) throw new ElectricalInputError('at', `no cable ${String(args.at)}`);
  let sum = 0;
  cables.forEach((k, i) => {
    if (i === args.at) return;
    const w = requireNonNegative(k.heatWPerM, `cables.${i}.heatWPerM`);
    sum += w * imageLogRatio(p, k, `cables.${i}`);
  });
  return (rho / TWO_PI) * sum;
}

/**
 * T₄ of cable p in a group of EQUALLY loaded cables (same losses), IEC 60287-2-1 §4.2.3:
 * T₄ = ρ/(2π)·[ln(u_p + √(u_p² − 1)) + Σ_{k≠p} ln(d′_pk/d_pk)].
 */
export function equallyLoadedGroupExternalResistance(args: {
  soilResistivityKmPerW: number;
  cables: Array<Point & { externalDiameterM: number }>;
  at: number;
}): number {
  const rho = requirePositive(args?.soilResistivityKmPerW, 'soilResistivityKmPerW');
  const p = args.cables?.[args.at];
  if (!p) throw new ElectricalInputError('at', `no cable ${String(args.at)}`);
  const self = buriedCableExternalResistance({ soilResistivityKmPerW: rho, depthM: -p.yM, externalDiameterM: p.externalDiameterM });
  let mutual = 0;
  args.cables.forEach((k, i) => {
    if (i !== args.at) mutual += imageLogRatio(p, k, `cables.${i}`);
  });
  return self + (rho / TWO_PI) * mutual;
}

// ───────────── Closed forms for equally loaded groups, IEC 60287-2-1 §4.2.4 (from memory) ─────────────

function depthRatio(args: { soilResistivityKmPerW: number; depthM: number; externalDiameterM: number }) {
  const rho = requirePositive(args?.soilResistivityKmPerW, 'soilResistivityKmPerW');
  const L = requirePositive(args.depthM, 'depthM');
  const de = requirePositive(args.externalDiameterM, 'externalDiameterM');
  const u = (2 * L) / de;
  if (!(u > 1)) throw new ElectricalInputError('depthM', 'the group must lie below the ground surface (u = 2L/D_e > 1)');
  return { rho, u };
}

/**
 * Three single-core cables in trefoil, touching, equally loaded, IEC 60287-2-1 §4.2.4 (ed. 1
 * §2.2.4; from memory): T₄ = (1.5/π)·ρ·[ln(2u) − 0.630], u = 2L/D_e, L the depth of the
 * trefoil's centre. The constant is ln(D_eq/D_e) of the three touching circles' equivalent
 * (logarithmic-capacity) diameter: the group's surfaces are treated as one isotherm, as metallic
 * screens make them. The tests check 0.630 against a numerical capacity.
 */
export function trefoilTouchingExternalResistance(args: { soilResistivityKmPerW: number; depthM: number; externalDiameterM: number }): number {
  const { rho, u } = depthRatio(args);
  return (1.5 / Math.PI) * rho * (Math.log(2 * u) - 0.63);
}

/**
 * Three single-core cables flat, touching, equally loaded — the centre (hottest) cable,
 * IEC 60287-2-1 §4.2.4 (from memory): T₄ = 0.475·ρ·ln(2u) − 0.346·ρ.
 */
export function flatTouchingExternalResistance(args: { soilResistivityKmPerW: number; depthM: number; externalDiameterM: number }): number {
  const { rho, u } = depthRatio(args);
  return 0.475 * rho * Math.log(2 * u) - 0.346 * rho;
}

/**
 * Two single-core cables flat, touching, equally loaded, IEC 60287-2-1 §4.2.4 (from memory):
 * T₄ = (ρ/π)·[ln(2u) − 0.451]; 0.451 = ln(π/2), the equivalent diameter of two touching circles.
 */
export function twoFlatTouchingExternalResistance(args: { soilResistivityKmPerW: number; depthM: number; externalDiameterM: number }): number {
  const { rho, u } = depthRatio(args);
  return (rho / Math.PI) * (Math.log(2 * u) - 0.451);
}

/**
 * Three cables flat, spaced s₁ axis to axis, equally loaded — centre cable, IEC 60287-2-1 §4.2.3
 * (from memory): T₄ = ρ/(2π)·ln{(u + √(u² − 1))·[1 + (2L/s₁)²]}. It is the superposition exactly:
 * each neighbour adds ln(d′/d) = ½·ln(1 + (2L/s₁)²).
 */
export function flatSpacedCentreExternalResistance(args: {
  soilResistivityKmPerW: number;
  depthM: number;
  externalDiameterM: number;
  axisSpacingM: number;
}): number {
  const rho = requirePositive(args?.soilResistivityKmPerW, 'soilResistivityKmPerW');
  const L = requirePositive(args.depthM, 'depthM');
  const de = requirePositive(args.externalDiameterM, 'externalDiameterM');
  const s = requirePositive(args.axisSpacingM, 'axisSpacingM');
  if (s < de) throw new ElectricalInputError('axisSpacingM', 'cables overlap (axis spacing below D_e)');
  return (rho / TWO_PI) * (arccoshOfDepthRatio(L, de, 'depthM') + Math.log(1 + ((2 * L) / s) ** 2));
}

// ───────────────────── Cables in ducts, IEC 60287-2-1 §4.2.7 (from memory) ─────────────────────

export interface DuctAirSpaceResult {
  /** T₄′, K·m/W. */
  T4: number;
  U: number;
  V: number;
  Y: number;
  /** False when D_e lies outside 25–100 mm, the stated range of the expression. */
  inStatedRange: boolean;
}

/**
 * T₄′, between a cable and the inside of its duct, IEC 60287-2-1 §4.2.7.2 (from memory):
 * T₄′ = U / [1 + 0.1·(V + Y·θ_m)·D_e], D_e in MILLIMETRES, θ_m the mean temperature of the air
 * in the duct (°C); U, V, Y by duct material (constants.ts). Stated for 25 mm ≤ D_e ≤ 100 mm.
 */
export function ductAirSpaceResistance(args: {
  material: DuctMaterial;
  cableDiameterM: number;
  meanAirTemperatureC: number;
}): DuctAirSpaceResult {
  const constants = DUCT_AIR_SPACE_CONSTANTS[args?.material];
  if (!constants) throw new ElectricalInputError('material', `no U, V, Y known for duct material ${String(args?.material)}`);
  const de = requirePositive(args.cableDiameterM, 'cableDiameterM');
  const theta = requireRange(args.meanAirTemperatureC, 'meanAirTemperatureC', -40, 250);
  const { U, V, Y } = constants;
  const T4 = U / (1 + 0.1 * (V + Y * theta) * de * 1000);
  const inStatedRange = de >= DUCT_AIR_SPACE_DIAMETER_RANGE_M.min - 1e-12 && de <= DUCT_AIR_SPACE_DIAMETER_RANGE_M.max + 1e-12;
  return { T4, U, V, Y, inStatedRange };
}

/** T₄″, the duct wall, IEC 60287-2-1 §4.2.7.3 (from memory): ρ/(2π)·ln(D_o/D_d). */
export function ductWallResistance(args: {
  material?: DuctMaterial;
  wallResistivityKmPerW?: number;
  innerDiameterM: number;
  outerDiameterM: number;
}): number {
  const rho =
    args?.wallResistivityKmPerW !== undefined
      ? requireNonNegative(args.wallResistivityKmPerW, 'wallResistivityKmPerW')
      : DUCT_WALL_RESISTIVITY[args?.material as DuctMaterial];
  if (rho === undefined) throw new ElectricalInputError('material', `no wall resistivity known for duct material ${String(args?.material)}`);
  const di = requirePositive(args.innerDiameterM, 'innerDiameterM');
  const dout = requirePositive(args.outerDiameterM, 'outerDiameterM');
  if (!(dout > di)) throw new ElectricalInputError('outerDiameterM', 'must exceed the inner diameter');
  return (rho / TWO_PI) * Math.log(dout / di);
}

/** T₄‴, outside the duct, IEC 60287-2-1 §4.2.7.4: the buried formula at the duct's outer diameter. */
export function ductExternalResistance(args: { soilResistivityKmPerW: number; depthM: number; ductOuterDiameterM: number }): number {
  return buriedCableExternalResistance({
    soilResistivityKmPerW: args?.soilResistivityKmPerW,
    depthM: args?.depthM,
    externalDiameterM: args?.ductOuterDiameterM,
  });
}

// ─────────────── Backfill and duct banks, IEC 60287-2-1 §4.2.7.4 (from memory) ───────────────

/**
 * Equivalent radius of a rectangular bank (Neher–McGrath, as in IEC 60287-2-1 §4.2.7.4, from
 * memory): ln r_b = ½·(x/y)·(4/π − x/y)·ln(1 + y²/x²) + ln(x/2).
 *
 * Which side is x: I recall the clause calling x and y the shorter and longer sides, but with
 * x the SHORTER side the expression gives a radius that SHRINKS as the bank gets longer (0.72 m
 * for 1 × 3 m, 0.66 m for 1 × 10 m), which cannot be a bank's equivalent radius. With x the
 * LONGER side it reproduces the rectangle's logarithmic-capacity radius (checked numerically in
 * the tests: within 0.5 % at 3:1, 3 % at 2:1, 7 % below it for a square). This function uses
 * x = the longer side. Read the clause before relying on the labelling.
 * Stated for side ratios below 3 (from memory); refused above.
 */
export function ductBankEquivalentRadius(args: { widthM: number; heightM: number }): number {
  const w = requirePositive(args?.widthM, 'widthM');
  const hgt = requirePositive(args.heightM, 'heightM');
  const x = Math.max(w, hgt);
  const y = Math.min(w, hgt);
  if (x / y > DUCT_BANK_MAX_SIDE_RATIO + 1e-12) {
    throw new ElectricalInputError(w >= hgt ? 'widthM' : 'heightM', `side ratio ${(x / y).toFixed(2)} exceeds ${DUCT_BANK_MAX_SIDE_RATIO}, the stated range of the equivalent-radius formula`);
  }
  const q = x / y;
  return Math.exp(0.5 * q * (4 / Math.PI - q) * Math.log(1 + 1 / (q * q)) + Math.log(x / 2));
}

/** G_b = ln(u + √(u² − 1)), u = L_G/r_b, L_G the depth of the bank's centre, IEC 60287-2-1 §4.2.7.4. */
export function ductBankGeometricFactor(args: { widthM: number; heightM: number; centreDepthM: number }): { Gb: number; equivalentRadiusM: number; u: number } {
  const rb = ductBankEquivalentRadius(args);
  const LG = requirePositive(args.centreDepthM, 'centreDepthM');
  const u = LG / rb;
  if (!(u > 1)) throw new ElectricalInputError('centreDepthM', `the bank's equivalent circle (r_b ${rb.toPrecision(3)} m) reaches the ground surface`);
  return { Gb: Math.log(u + Math.sqrt(u * u - 1)), equivalentRadiusM: rb, u };
}

/**
 * Correction to T₄ of each cable in a backfill or duct bank, IEC 60287-2-1 §4.2.7.4 (from memory):
 * ΔT₄ = N/(2π)·(ρ_e − ρ_c)·G_b, N the number of equally loaded cables in the bank, ρ_e the soil
 * and ρ_c the backfill (concrete) resistivity; T₄ itself is first computed as if all the ground
 * had ρ_c. Negative when the backfill is worse than the soil.
 */
export function backfillCorrection(args: { loadedCables: number; soilResistivityKmPerW: number; backfillResistivityKmPerW: number; Gb: number }): number {
  const N = requirePositive(args?.loadedCables, 'loadedCables');
  const rhoE = requirePositive(args.soilResistivityKmPerW, 'soilResistivityKmPerW');
  const rhoC = requirePositive(args.backfillResistivityKmPerW, 'backfillResistivityKmPerW');
  const Gb = requireFinite(args.Gb, 'Gb');
  return (N / TWO_PI) * (rhoE - rhoC) * Gb;
}

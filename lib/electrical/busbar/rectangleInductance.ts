/**
 * Partial inductance per metre of long parallel conductors of rectangular cross-section, from the
 * geometric mean distance (GMD) of two rectangles.
 *
 * For conductors much longer than their cross-section (a bus-bar run), the partial self and
 * mutual inductances per metre are L'_ij = (μ₀/2π)·(ln D_ref − ln g_ij), where ln g_ij = ⟨ln r⟩
 * is the mean of ln|p − q| over p in rectangle i and q in rectangle j (Maxwell's geometric mean
 * distance; Grover, *Inductance Calculations*, 1946, ch. on GMD — from memory). The same
 * expression is the long-conductor limit of the exact mutual inductance of parallel rectangular
 * bars of Hoer & Love (J. Res. NBS 69C, 1965): their terms in d/ℓ vanish as ℓ → ∞ and the
 * constant ln(2ℓ) − 1 becomes ln D_ref. The constant D_ref drops out of a current distribution
 * whenever the currents are solved with each conductor group's total imposed (every filament
 * sees the same added voltage jω·(μ₀/2π)·ln D_ref·ΣI), so it is a conditioning choice only.
 *
 * Exact integral. With x-differences u and y-differences v of the corner coordinates,
 *   ∬∬ ln r = Σᵢ Σⱼ sᵢ sⱼ G(uᵢ, vⱼ),  ∂⁴G/∂u²∂v² = ln √(u² + v²),
 *   G(u, v) = (6u²v² − u⁴ − v⁴)/48 · ln(u² + v²) + (u³v/6)·atan(v/u) + (uv³/6)·atan(u/v) − (25/48)u²v².
 * G was derived for this module (fourfold antiderivative of ln r) and checked against Maxwell's
 * exact GMD of a rectangle to itself, which it reproduces term by term; the tests check it
 * against that formula, the thin-strip limit and direct quadrature.
 *
 * Far apart (centre distance more than 4 times the largest side), the multipole expansion
 *   ⟨ln r⟩ = ln|z| − Re[⟨w²⟩/(2z²) + ⟨w⁴⟩/(4z⁴) + ⟨w⁶⟩/(6z⁶)] + O(|w/z|⁸),
 * z the complex centre offset, w = ζᵢ − ζⱼ the offsets inside the two rectangles, is used instead:
 * it avoids the cancellation of the 16-term sum and costs one complex power. Its leading term is
 * the filament formula ln D (the two-filament mutual inductance (μ₀/2π)·ln(D_ref/D)).
 */
import type { BusbarRectangle } from './geometry';

/** Far-field switch: centre distance / largest side. The truncation error there is below 1e-7. */
export const MULTIPOLE_DISTANCE_RATIO = 4;

function primitive(u: number, v: number): number {
  const u2 = u * u;
  const v2 = v * v;
  const r2 = u2 + v2;
  if (r2 === 0) return 0;
  let g = ((6 * u2 * v2 - u2 * u2 - v2 * v2) / 48) * Math.log(r2) - (25 / 48) * u2 * v2;
  if (u !== 0) g += ((u2 * u * v) / 6) * Math.atan(v / u);
  if (v !== 0) g += ((u * v2 * v) / 6) * Math.atan(u / v);
  return g;
}

/** ∂G/∂u, for the force between rectangles (derivative of `primitive`). */
function primitiveDu(u: number, v: number): number {
  const u2 = u * u;
  const v2 = v * v;
  const r2 = u2 + v2;
  if (r2 === 0) return 0;
  let g = ((3 * u * v2 - u2 * u) / 12) * Math.log(r2) - (22 * u * v2 + u2 * u) / 24;
  if (u !== 0) g += ((u2 * v) / 2) * Math.atan(v / u);
  if (v !== 0) g += ((v2 * v) / 6) * Math.atan(u / v);
  return g;
}

// The four differences of corner coordinates along one axis and their signs (+, −, −, +):
// (hi_a − lo_b, lo_a − lo_b, hi_a − hi_b, lo_a − hi_b).
function signedSum(
  f: (u: number, v: number) => number,
  cxA: number,
  cyA: number,
  sxA: number,
  syA: number,
  cxB: number,
  cyB: number,
  sxB: number,
  syB: number,
): number {
  const ax1 = cxA - sxA / 2;
  const ax2 = cxA + sxA / 2;
  const ay1 = cyA - syA / 2;
  const ay2 = cyA + syA / 2;
  const bx1 = cxB - sxB / 2;
  const bx2 = cxB + sxB / 2;
  const by1 = cyB - syB / 2;
  const by2 = cyB + syB / 2;
  const u0 = ax2 - bx1;
  const u1 = ax1 - bx1;
  const u2 = ax2 - bx2;
  const u3 = ax1 - bx2;
  const row = (v: number) => f(u0, v) - f(u1, v) - f(u2, v) + f(u3, v);
  return row(ay2 - by1) - row(ay1 - by1) - row(ay2 - by2) + row(ay1 - by2);
}

/** ⟨ln r⟩ by the exact 16-term sum; rectangles by centre and size, m. */
export function logMeanDistanceExactOf(
  cxA: number,
  cyA: number,
  sxA: number,
  syA: number,
  cxB: number,
  cyB: number,
  sxB: number,
  syB: number,
): number {
  return signedSum(primitive, cxA, cyA, sxA, syA, cxB, cyB, sxB, syB) / (sxA * syA * sxB * syB);
}

/** ⟨ln r⟩ by the exact 16-term sum (r in metres). */
export function logMeanDistanceExact(a: BusbarRectangle, b: BusbarRectangle): number {
  return logMeanDistanceExactOf(a.cxM, a.cyM, a.sizeXM, a.sizeYM, b.cxM, b.cyM, b.sizeXM, b.sizeYM);
}

/** Complex moments ⟨ζ²⟩, ⟨ζ⁴⟩, ⟨ζ⁶⟩ of a uniform rectangle about its centre (all real). */
export function rectangleMoments(sizeX: number, sizeY: number): [number, number, number] {
  const a2 = sizeX * sizeX;
  const b2 = sizeY * sizeY;
  const x2 = a2 / 12;
  const y2 = b2 / 12;
  const x4 = (a2 * a2) / 80;
  const y4 = (b2 * b2) / 80;
  const x6 = (a2 * a2 * a2) / 448;
  const y6 = (b2 * b2 * b2) / 448;
  return [x2 - y2, x4 - 6 * x2 * y2 + y4, x6 - 15 * x4 * y2 + 15 * x2 * y4 - y6];
}

/**
 * ⟨ln r⟩ by the multipole expansion to sixth order, from the centre offset z = (zr, zi) and the
 * rectangles' moments (`rectangleMoments`); for well separated rectangles only.
 */
export function logMeanDistanceMultipoleOf(
  zr: number,
  zi: number,
  a2: number,
  a4: number,
  a6: number,
  b2: number,
  b4: number,
  b6: number,
): number {
  const w2 = a2 + b2;
  const w4 = a4 + 6 * a2 * b2 + b4;
  const w6 = a6 + 15 * a4 * b2 + 15 * a2 * b4 + b6;
  // Real parts of 1/z², 1/z⁴, 1/z⁶.
  const m2 = zr * zr + zi * zi;
  const inv2r = (zr * zr - zi * zi) / (m2 * m2);
  const inv2i = (-2 * zr * zi) / (m2 * m2);
  const inv4r = inv2r * inv2r - inv2i * inv2i;
  const inv4i = 2 * inv2r * inv2i;
  const inv6r = inv4r * inv2r - inv4i * inv2i;
  return 0.5 * Math.log(m2) - (w2 * inv2r) / 2 - (w4 * inv4r) / 4 - (w6 * inv6r) / 6;
}

/** ⟨ln r⟩ by the multipole expansion to sixth order; for well separated rectangles only. */
export function logMeanDistanceMultipole(a: BusbarRectangle, b: BusbarRectangle): number {
  const [a2, a4, a6] = rectangleMoments(a.sizeXM, a.sizeYM);
  const [b2, b4, b6] = rectangleMoments(b.sizeXM, b.sizeYM);
  return logMeanDistanceMultipoleOf(a.cxM - b.cxM, a.cyM - b.cyM, a2, a4, a6, b2, b4, b6);
}

/** ⟨ln r⟩ between two axis-aligned rectangles (ln of their geometric mean distance, r in metres). */
export function logMeanDistance(a: BusbarRectangle, b: BusbarRectangle): number {
  const dx = a.cxM - b.cxM;
  const dy = a.cyM - b.cyM;
  const limit = MULTIPOLE_DISTANCE_RATIO * Math.max(a.sizeXM, a.sizeYM, b.sizeXM, b.sizeYM);
  if (dx * dx + dy * dy > limit * limit) return logMeanDistanceMultipole(a, b);
  return logMeanDistanceExact(a, b);
}

/**
 * ∂⟨ln r⟩/∂X_a: the derivative of the log-mean distance when rectangle a moves along +x. The force
 * per metre on a, uniform currents I_a and I_b in the same direction, is
 * F_x = −(μ₀/2π)·I_a·I_b·∂⟨ln r⟩/∂X_a (negative: attraction towards b when a lies at larger x).
 */
export function logMeanDistanceGradientX(a: BusbarRectangle, b: BusbarRectangle): number {
  const sum = signedSum(primitiveDu, a.cxM, a.cyM, a.sizeXM, a.sizeYM, b.cxM, b.cyM, b.sizeXM, b.sizeYM);
  return sum / (a.sizeXM * a.sizeYM * b.sizeXM * b.sizeYM);
}

/**
 * Dwight's shape factor k for two equal, parallel rectangular conductors side by side along the
 * force direction (uniform current density): the force between them divided by the force between
 * two filaments at their centres, k = D·∂⟨ln r⟩/∂D. This is the factor IEC 60865-1 reads from its
 * Figure 1 (k_12, k_1s) as a function of a/d and b/d, with d the dimension in the force direction
 * and b the dimension across it (from memory of the figure's axes); here it is computed exactly.
 */
export function rectangularForceFactor(args: { centreDistanceM: number; dimensionAlongForceM: number; dimensionAcrossForceM: number }): number {
  const { centreDistanceM: a, dimensionAlongForceM: d, dimensionAcrossForceM: b } = args;
  const one: BusbarRectangle = { cxM: a, cyM: 0, sizeXM: d, sizeYM: b };
  const two: BusbarRectangle = { cxM: 0, cyM: 0, sizeXM: d, sizeYM: b };
  return a * logMeanDistanceGradientX(one, two);
}

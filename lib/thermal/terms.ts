/**
 * The finite-volume terms (physics.md §1; Patankar 1980, ch. 4), each for ONE face or ONE cell,
 * each a small function of plain numbers — no mesh layout, no matrix storage — so that the 1-D
 * assembly (assembly.ts), the bar run and a 2-D mesh build their equations from the same pieces.
 *
 * The discrete equation of cell P is a_P θ_P = Σ_nb a_nb θ_nb + b, written for the unknowns
 * θ = T − T_ref (rises above the solve's reference temperature, see reference.ts), in W per unit of
 * the mesh's face area (per m² of slab face, per metre of cylinder, per m² of a bar's section).
 * A cell term returns its Contribution: what it adds to a_P and to b of its cell. A face term
 * (diffusion) returns the conductance G that couples its two cells: a_P of each gains G and the
 * off-diagonal entry between them is −G.
 */

/** What one term adds to the equation of its cell: a_P += aP, b += b. */
export interface Contribution {
  /** W/K */
  aP: number;
  /** W */
  b: number;
}

// ───────────────────────────── Diffusion (per face) ─────────────────────────────

/** Resistance of a slab half-cell: node to face at `distanceM`, K/W per m² of face. */
export function slabHalfCellResistance(distanceM: number, conductivity: number): number {
  return distanceM / conductivity;
}

/**
 * Resistance of a cylindrical half-cell between radii r_P (node) and r_f (face), K/W per metre:
 * the exact shell resistance |ln(r_f/r_P)|/(2πk) (Incropera §3.3.1), so conduction without a
 * source is reproduced exactly on any mesh. The axis (r_f = 0) is a face of zero area: infinite
 * resistance, no special case.
 */
export function cylinderHalfCellResistance(nodeRadiusM: number, faceRadiusM: number, conductivity: number): number {
  if (faceRadiusM === 0) return Infinity;
  return Math.abs(Math.log(faceRadiusM / nodeRadiusM)) / (2 * Math.PI * conductivity);
}

/**
 * Diffusion through one face: the two half-cells in series, G = 1/(R_P + R_N), so that a material
 * interface on the face is exact (Patankar 1980, §4.2-3, the harmonic mean).
 */
export function faceConductance(ownerResistance: number, neighbourResistance: number): number {
  return 1 / (ownerResistance + neighbourResistance);
}

// ───────────────────────────── Sources (per cell) ─────────────────────────────

/**
 * A source linearised about the current iterate (Patankar 1980, §4.2-5): S ≈ S_u + S_p·θ_P,
 * S_u in W/m³ at θ = 0 (at the reference temperature), S_p in W/(m³·K). In absolute temperature
 * the same line reads S = (S_u − S_p·T_ref) + S_p·T.
 */
export interface SourceTerm {
  su: number;
  sp: number;
}

/** Joule heating q'''(T) = q_ref + slope·θ, a straight line in T because ρ(T) is (source.ts). */
export interface JouleLine {
  /** q''' at the reference temperature, W/m³. */
  qRef: number;
  /** dq'''/dT = J²ρ₂₀α₂₀F_ac, W/(m³·K). */
  slope: number;
}

/** Uniform heat density q: S_u = q, S_p = 0. */
export function uniformSource(q: number): SourceTerm {
  return { su: q, sp: 0 };
}

/**
 * Joule heating in tangent form: S_p = J²ρ₂₀α₂₀F_ac > 0, S_u = q'''(T_ref). Exact, not an
 * approximation (q''' is linear in T), but S_p > 0 weakens the diagonal: iterate.ts uses it only
 * while the matrix stays positive definite.
 */
export function jouleTangent(joule: JouleLine): SourceTerm {
  return { su: joule.qRef, sp: joule.slope };
}

/** Joule heating lagged at the iterate θ*: S_p = 0, S_u = q'''(T*). */
export function jouleLagged(joule: JouleLine, riseK: number): SourceTerm {
  return { su: joule.qRef + joule.slope * riseK, sp: 0 };
}

/**
 * Heat lost sideways from a bar run (the fin term, Incropera §3.6; physics.md §1):
 * S = −(hP/A_c)(T − T∞), i.e. S_p = −hP/A_c ≤ 0 and S_u = hP·T∞/A_c in absolute temperature —
 * written about the reference, S_u = (hP/A_c)(T∞ − T_ref). `lossPerVolume` is hP/A_c in
 * W/(m³·K) (h the secant coefficient at the cell's temperature), `ambientRiseK` is T∞ − T_ref.
 */
export function sidewaysLoss(lossPerVolume: number, ambientRiseK: number): SourceTerm {
  return { su: lossPerVolume * ambientRiseK, sp: -lossPerVolume };
}

/** A linearised source over a cell of volume ΔV: a_P −= S_p·ΔV, b += S_u·ΔV. */
export function sourceContribution(source: SourceTerm, volume: number): Contribution {
  return { aP: -source.sp * volume, b: source.su * volume };
}

/** Heat put into a cell at a point (a bolted joint), W: b += Q, a_P unchanged. */
export function pointHeat(heat: number): Contribution {
  return { aP: 0, b: heat };
}

// ───────────────────────────── Heat capacity (per cell) ─────────────────────────────

/** ρcΔV/Δt of a cell, W/K: what implicit Euler adds to a_P. */
export function capacityRate(density: number, heatCapacity: number, volume: number, timeStepS: number): number {
  return (density * heatCapacity * volume) / timeStepS;
}

/** Implicit Euler (physics.md §1): a_P += ρcΔV/Δt, b += ρcΔV/Δt·θ_P_old. */
export function capacityContribution(rate: number, previousRiseK: number): Contribution {
  return { aP: rate, b: rate * previousRiseK };
}

// ───────────────────────────── Boundaries (per boundary face) ─────────────────────────────
// G is the half-cell conductance from the boundary cell's node to the face (the face carries no
// node, physics.md §1), W/K per unit area of the mesh.

/** Fixed temperature θ_B on the face: heat G(θ_P − θ_B) leaves, so a_P += G, b += G·θ_B. */
export function temperatureBoundary(halfConductance: number, faceRiseK: number): Contribution {
  return { aP: halfConductance, b: halfConductance * faceRiseK };
}

/** Fixed flux q INTO the body over a face of area A: b += q·A. */
export function fluxBoundary(inwardFlux: number, faceArea: number): Contribution {
  return { aP: 0, b: inwardFlux * faceArea };
}

/** Symmetry (zero flux): nothing. */
export function symmetryBoundary(): Contribution {
  return { aP: 0, b: 0 };
}

/**
 * Surface exchange (convection + radiation, physics.md §2) linearised about the surface rise θs*:
 * q_s ≈ q* + g(θs − θs*) per m² leaving over the exchange area A. Eliminating the face temperature
 * from G(θ_P − θs) = A[q* + g(θs − θs*)] leaves a heat flow a_B θ_P − b_B with
 * a_B = G·Ag/(G + Ag) and b_B = G·A(gθs* − q*)/(G + Ag): the half-cell conductance in series with
 * the surface conductance g·A.
 */
export function surfaceBoundary(
  halfConductance: number,
  exchangeArea: number,
  slope: number,
  surfaceRiseK: number,
  netFlux: number,
): Contribution {
  const denominator = halfConductance + exchangeArea * slope;
  return {
    aP: (halfConductance * exchangeArea * slope) / denominator,
    b: (halfConductance * exchangeArea * (slope * surfaceRiseK - netFlux)) / denominator,
  };
}

/** Surface rise implied by the node rise under that linearisation (the eliminated face value). */
export function linearisedSurfaceRise(
  halfConductance: number,
  exchangeArea: number,
  slope: number,
  surfaceRiseK: number,
  netFlux: number,
  nodeRiseK: number,
): number {
  return (halfConductance * nodeRiseK + exchangeArea * (slope * surfaceRiseK - netFlux)) / (halfConductance + exchangeArea * slope);
}

/**
 * Each finite-volume term of lib/thermal/terms.ts alone, against values worked by hand from the
 * formulas they implement: Patankar, Numerical Heat Transfer and Fluid Flow (1980) ch. 4 — the
 * discrete equation a_P θ_P = Σ a_nb θ_nb + b, the series (harmonic) face conductance §4.2-3, the
 * source S = S_u + S_p·T §4.2-5, implicit Euler §4.3; the shell resistance ln(r₂/r₁)/(2πk) and the
 * fin equation of Incropera et al., Fundamentals of Heat and Mass Transfer, §3.3.1 and §3.6; the
 * Joule density q''' = J²ρ₂₀[1 + α₂₀(T − 20)]F_ac of physics.md §1. Unknowns are rises θ = T − T_ref.
 */
import { describe, expect, it } from 'vitest';
import {
  capacityContribution,
  capacityRate,
  cylinderHalfCellResistance,
  faceConductance,
  fluxBoundary,
  jouleLagged,
  jouleTangent,
  linearisedSurfaceRise,
  pointHeat,
  sidewaysLoss,
  slabHalfCellResistance,
  sourceContribution,
  surfaceBoundary,
  symmetryBoundary,
  temperatureBoundary,
  uniformSource,
} from '@/lib/thermal/terms';

describe('diffusion (per face)', () => {
  it('slab half-cell: δ/k (5 mm of k = 2 W/(m·K): 0.0025 K·m²/W)', () => {
    expect(slabHalfCellResistance(0.005, 2)).toBeCloseTo(0.0025, 15);
  });

  it('cylinder half-cell: ln(r_f/r_P)/(2πk), Incropera §3.3.1 (r 10 → 20 mm, k = 1/(2π): ln 2)', () => {
    expect(cylinderHalfCellResistance(0.01, 0.02, 1 / (2 * Math.PI))).toBeCloseTo(Math.LN2, 14);
    // Inward half-cell (face inside the node) has the same magnitude.
    expect(cylinderHalfCellResistance(0.02, 0.01, 1 / (2 * Math.PI))).toBeCloseTo(Math.LN2, 14);
    // The axis is a face of zero area.
    expect(cylinderHalfCellResistance(0.001, 0, 390)).toBe(Infinity);
  });

  it('face conductance: resistances in series, 1/(0.0025 + 0.0075) = 100 W/(m²·K) (Patankar §4.2-3)', () => {
    expect(faceConductance(0.0025, 0.0075)).toBeCloseTo(100, 12);
    expect(faceConductance(Infinity, 0.01)).toBe(0);
  });
});

describe('sources (per cell)', () => {
  // J = 100 A / 1e-4 m² = 1e6 A/m², ρ₂₀ = 1.7241e-8 Ω·m (IEC 60287-1-1 copper, from memory),
  // α₂₀ = 3.93e-3 /K, F_ac = 1: q₂₀ = J²ρ₂₀ = 17 241 W/m³, slope = q₂₀α₂₀ = 67.757 13 W/(m³·K).
  const q20 = 1e12 * 1.7241e-8;
  const slope = q20 * 3.93e-3;
  // About T_ref = 30 °C: q(30) = 17 241·(1 + 3.93e-3·10) = 17 918.571 3 W/m³.
  const line = { qRef: 17241 * 1.0393, slope };

  it('uniform: S_u = q, S_p = 0', () => {
    expect(uniformSource(2.5e5)).toEqual({ su: 2.5e5, sp: 0 });
  });

  it('Joule tangent: S_p = J²ρ₂₀α₂₀F_ac, S_u = q(T_ref) (exact: q is linear in T)', () => {
    const t = jouleTangent(line);
    expect(t.sp).toBeCloseTo(67.75713, 5);
    expect(t.su).toBeCloseTo(17918.5713, 4);
  });

  it('Joule lagged at θ* = 40 K (T* = 70 °C): S_u = q(70 °C) = 17 241·1.196 5 = 20 628.856 5 W/m³, S_p = 0', () => {
    const l = jouleLagged(line, 40);
    expect(l.sp).toBe(0);
    expect(l.su).toBeCloseTo(20628.8565, 4);
    // Both linearisations agree at the point they are taken about (Patankar §4.2-5).
    const t = jouleTangent(line);
    expect(t.su + t.sp * 40).toBeCloseTo(l.su, 8);
  });

  it('sideways loss: S_p = −hP/A_c, S_u = hP·T∞/A_c in absolute temperature (Incropera §3.6; physics.md §1)', () => {
    // h = 8 W/(m²·K), P = 0.22 m, A_c = 1e-3 m²: hP/A_c = 1 760 W/(m³·K). T∞ = 35 °C, T_ref = 20 °C.
    const s = sidewaysLoss(1760, 35 - 20);
    expect(s.sp).toBe(-1760);
    expect(s.su).toBeCloseTo(1760 * 15, 9);
    // Back to absolute temperature: S_u,abs = S_u − S_p·T_ref = 1 760·35 = 61 600 W/m³.
    expect(s.su - s.sp * 20).toBeCloseTo(61600, 9);
    // The loss vanishes at the air temperature: S_u + S_p·(T∞ − T_ref) = 0.
    expect(s.su + s.sp * 15).toBeCloseTo(0, 9);
  });

  it('a source over a cell: a_P −= S_p·ΔV, b += S_u·ΔV', () => {
    expect(sourceContribution({ su: 1e5, sp: 50 }, 0.01)).toEqual({ aP: -0.5, b: 1000 });
    expect(sourceContribution({ su: 0, sp: -1760 }, 0.5)).toEqual({ aP: 880, b: 0 });
  });

  it('point heat (a joint): b += Q', () => {
    expect(pointHeat(22.5)).toEqual({ aP: 0, b: 22.5 });
  });
});

describe('heat capacity (per cell)', () => {
  it('ρcΔV/Δt: copper 8 960 kg/m³ × 385 J/(kg·K) × 1e-3 m³ / 0.5 s = 6 899.2 W/K; implicit Euler adds it to a_P and rate·θ_old to b', () => {
    const rate = capacityRate(8960, 385, 1e-3, 0.5);
    expect(rate).toBeCloseTo(6899.2, 9);
    expect(capacityContribution(rate, 12)).toEqual({ aP: rate, b: rate * 12 });
  });
});

describe('boundaries (per boundary face)', () => {
  it('fixed temperature: a_P += G, b += G·θ_B (G = 400 W/(m²·K), θ_B = 20 K)', () => {
    expect(temperatureBoundary(400, 20)).toEqual({ aP: 400, b: 8000 });
  });

  it('flux into the body: b += q·A (500 W/m² over 2π·0.01 m² per metre)', () => {
    const c = fluxBoundary(500, 2 * Math.PI * 0.01);
    expect(c.aP).toBe(0);
    expect(c.b).toBeCloseTo(31.415926536, 8);
  });

  it('symmetry: nothing', () => {
    expect(symmetryBoundary()).toEqual({ aP: 0, b: 0 });
  });

  it('surface: half-cell conductance in series with h·A, 1/(1/400 + 1/10) = 9.756 1 W/(m²·K) (Incropera §3.1 series circuit)', () => {
    // Linear surface h = 10 at θs* = 5 K: q* = 50 W/m², slope 10. b = G·A(gθs* − q*)/(G + Ag) = 0.
    const linear = surfaceBoundary(400, 1, 10, 5, 50);
    expect(linear.aP).toBeCloseTo(400 / 41, 12);
    expect(linear.b).toBeCloseTo(0, 12);
    // With 30 W/m² absorbed (net q* = 50 − 30 = 20 W/m² leaving at θs* = 5 K): the absorbed heat
    // enters through the same series circuit, b = 400·(50 − 20)/410 = 29.268 3 W/m².
    const sunlit = surfaceBoundary(400, 1, 10, 5, 20);
    expect(sunlit.aP).toBeCloseTo(400 / 41, 12);
    expect(sunlit.b).toBeCloseTo(12000 / 410, 10);
  });

  it('the face temperature eliminated by the surface term: the series divider θs = θ_P·G/(G + hA) (no absorbed heat)', () => {
    // θ_P = 11 K, G = 100, hA = 10: θs = 10 K.
    expect(linearisedSurfaceRise(100, 1, 10, 5, 50, 11)).toBeCloseTo(10, 12);
  });
});

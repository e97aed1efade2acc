import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { peakFactor, shortCircuitForces, type ShortCircuitForceInput } from '@/lib/electrical/busbar/forces';
import { prepareBusbarSystem } from '@/lib/electrical/busbar/geometry';

const MU0_OVER_2PI = 2e-7;

/**
 * Dwight's factor from its definition, independently of the library's closed form: the force
 * between two uniform rectangular conductors over the force between filaments at their centres,
 * k = a·⟨(x₁ − x₂)/r²⟩, the mean taken by composite Gauss–Legendre quadrature (8 points per panel).
 */
function dwightByQuadrature(a: number, d: number, b: number): number {
  const gl = [
    [-0.9602898564975363, 0.1012285362903763],
    [-0.7966664774136267, 0.2223810344533745],
    [-0.525532409916329, 0.3137066458778873],
    [-0.1834346424956498, 0.362683783378362],
    [0.1834346424956498, 0.362683783378362],
    [0.525532409916329, 0.3137066458778873],
    [0.7966664774136267, 0.2223810344533745],
    [0.9602898564975363, 0.1012285362903763],
  ]; // 8-point Gauss–Legendre (Abramowitz & Stegun Table 25.4)
  const rule = (centre: number, size: number, panels: number) => {
    const out: [number, number][] = [];
    for (let p = 0; p < panels; p++) {
      const lo = centre - size / 2 + (p * size) / panels;
      const h = size / panels;
      for (const [x, w] of gl) out.push([lo + ((x + 1) * h) / 2, (w * h) / 2 / size]);
    }
    return out;
  };
  const panelsAcross = Math.max(1, Math.ceil(b / (a - d)));
  const x1 = rule(a, d, 2);
  const x2 = rule(0, d, 2);
  const y = rule(0, b, panelsAcross);
  let mean = 0;
  for (const [xa, wa] of x1) for (const [xb, wb] of x2) for (const [ya, wya] of y) for (const [yb, wyb] of y) {
    const dx = xa - xb;
    const dy = ya - yb;
    mean += wa * wb * wya * wyb * (dx / (dx * dx + dy * dy));
  }
  return a * mean;
}

const SYSTEM = prepareBusbarSystem({
  barsPerPhase: 2,
  barWidthM: 0.1,
  barThicknessM: 0.01,
  gapM: 0.01,
  phaseSpacingM: 0.2,
  arrangement: 'edge',
  supportSpacingM: 1.0,
  spacerSpacingM: 0.5,
});

const CASE: ShortCircuitForceInput = {
  system: SYSTEM,
  initialCurrentA: 50e3,
  rOverX: 0.1,
  material: 'copper',
  yieldStrengthPa: 250e6,
  supports: 'continuous-three-or-more-spans',
  supportStrengthN: 8000,
};

describe('peak factor κ, IEC 60909-0 eq. (55)', () => {
  it('κ = 1.02 + 0.98·e^(−3R/X): 1.7460 at R/X = 0.1 (by hand: 1.02 + 0.98·0.740818), 2.0 at R/X = 0, → 1.02 for large R/X', () => {
    expect(peakFactor(0.1)).toBeCloseTo(1.7460018, 6);
    expect(peakFactor(0)).toBe(2);
    expect(peakFactor(5)).toBeCloseTo(1.02, 6);
  });
});

describe('IEC 60865-1 forces and stresses, a case worked by hand', () => {
  /*
   * Three phases in one plane, each a pack of two 100 × 10 mm copper bars on edge, gap 10 mm,
   * a = 0.2 m, supports every l = 1.0 m (continuous beam, ≥ 3 spans), spacers every l_s = 0.5 m,
   * I″k3 = 50 kA, R/X = 0.1, R_p0.2 = 250 N/mm² (entered), supports rated 8 kN.
   *
   *  κ     = 1.02 + 0.98·e^(−0.3) = 1.746002                                  (IEC 60909-0 eq. 55)
   *  i_p   = κ·√2·I″k = 1.746002·1.414214·50 kA = 123.461 kA                   (IEC 60909-0 eq. 54)
   *  k₁₂   = Dwight's factor of the 30 × 100 mm pack envelopes at 0.2 m = 0.9650 (quadrature below)
   *  a_m   = a/k₁₂ = 0.2/0.9650 = 0.20725 m
   *  F_m   = (μ₀/2π)(√3/2)·i_p²·l/a_m = 2e-7·0.866025·(123 461)²·1/0.20725 = 12 739 N
   *  Z     = 2·b·d²/6 = 2·0.1·0.01²/6 = 3.3333e-6 m³ (the bars bend on their own)
   *  σ_m   = V_σV_r·β·F_m·l/(8Z) = 1·0.73·12 739·1/(8·3.3333e-6) = 348.7 N/mm²
   *  k₁₂,s = Dwight's factor of two 10 × 100 mm bars at 20 mm = 0.4207 (quadrature below)
   *  a_s   = a₁₂/k₁₂ = 0.02/0.4207 = 0.04754 m
   *  F_s   = (μ₀/2π)(i_p/n)²·l_s/a_s = 2e-7·(61 730)²·0.5/0.04754 = 8 015 N
   *  σ_s   = V_σsV_rs·F_s·l_s/(16Z_s) = 8 015·0.5/(16·1.6667e-6) = 150.3 N/mm²
   *  σ_tot = 499.0 N/mm² > q·R_p0.2 = 1.5·250 = 375 N/mm²: fails (ratio 1.331); σ_s < R_p0.2 passes
   *  F_d   = V_FV_r·α·F_m: A 2.7·0.4·12 739 = 13 758 N, B 2.7·1.1·12 739 = 37 835 N > 8 kN: fails
   *  l_max: stress √((375 − 150.3)/348.7)·1 m = 0.803 m; support 8000/(2.7·1.1·12 739 N/m) = 0.2114 m
   */
  const r = shortCircuitForces(CASE);

  it('reproduces every step', () => {
    const kappa = 1.02 + 0.98 * Math.exp(-0.3);
    const ip = kappa * Math.SQRT2 * 50e3;
    const k12 = dwightByQuadrature(0.2, 0.03, 0.1);
    const am = 0.2 / k12;
    const fm = (MU0_OVER_2PI * (Math.sqrt(3) / 2) * ip * ip * 1.0) / am;
    const z = (2 * 0.1 * 0.01 ** 2) / 6;
    const sigmaM = (1 * 0.73 * fm * 1.0) / (8 * z);
    const ks = dwightByQuadrature(0.02, 0.01, 0.1);
    const as = 0.02 / ks;
    const fs = (MU0_OVER_2PI * (ip / 2) ** 2 * 0.5) / as;
    const zs = (0.1 * 0.01 ** 2) / 6;
    const sigmaS = (fs * 0.5) / (16 * zs);

    expect(k12).toBeCloseTo(0.965, 3);
    expect(ks).toBeCloseTo(0.4207, 4);
    expect(r.kappa).toBeCloseTo(kappa, 12);
    expect(r.peakCurrentA).toBeCloseTo(ip, 6);
    expect(r.mainForceFactor).toBeCloseTo(k12, 6);
    expect(r.mainEffectiveDistanceM).toBeCloseTo(am, 6);
    expect(r.mainForceN / fm).toBeCloseTo(1, 6);
    expect(r.mainForceN).toBeCloseTo(12739, -1);
    expect(r.mainSectionModulusM3).toBeCloseTo(z, 15);
    expect(r.mainStressPa / sigmaM).toBeCloseTo(1, 6);
    expect(r.subConductor!.factors[0].k).toBeCloseTo(ks, 6);
    expect(r.subConductor!.effectiveDistanceM).toBeCloseTo(as, 6);
    expect(r.subConductor!.forceN / fs).toBeCloseTo(1, 6);
    expect(r.subConductor!.stressPa / sigmaS).toBeCloseTo(1, 6);
    expect(r.totalStressPa / 1e6).toBeCloseTo(499.0, 0);
    expect(r.stressRatio).toBeCloseTo((sigmaM + sigmaS) / (1.5 * 250e6), 6);
    expect(r.subConductorStressRatio).toBeCloseTo(sigmaS / 250e6, 6);
    expect(r.supportForceAN).toBeCloseTo(2.7 * 0.4 * fm, 2);
    expect(r.supportForceBN).toBeCloseTo(2.7 * 1.1 * fm, 2);
    expect(r.passes).toBe(false);
    expect(r.flags.map((f) => f.code)).toEqual(expect.arrayContaining(['BUSBAR_STRESS_EXCEEDED', 'BUSBAR_SUPPORT_FORCE_EXCEEDED']));
    expect(r.largestSupportSpacingLimitedBy).toBe('support force');
    expect(r.largestSupportSpacingM).toBeCloseTo(8000 / (2.7 * 1.1 * fm), 6);
  });

  it('the largest support spacing is exactly at the limit it names', () => {
    const atForce = shortCircuitForces({ ...CASE, system: prepareBusbarSystem({ ...SYSTEM.input, supportSpacingM: r.largestSupportSpacingM, spacerSpacingM: r.largestSupportSpacingM }) });
    expect(atForce.supportForceRatio).toBeCloseTo(1, 9);
    const free = shortCircuitForces({ ...CASE, supportStrengthN: undefined });
    expect(free.largestSupportSpacingLimitedBy).toBe('bending stress');
    // By hand: √((375 − 150.28)/348.73)·1 m = 0.8027 m (spacers stay 0.5 m apart).
    expect(free.largestSupportSpacingM).toBeCloseTo(0.8027, 3);
    const atStress = shortCircuitForces({ ...CASE, supportStrengthN: undefined, system: prepareBusbarSystem({ ...SYSTEM.input, supportSpacingM: free.largestSupportSpacingM }) });
    expect(atStress.stressRatio).toBeCloseTo(1, 9);
  });

  it('stresses and forces scale as I″k²: at 30 kA the same system passes (σ_tot × 0.36 = 179.6 N/mm²)', () => {
    const lower = shortCircuitForces({ ...CASE, initialCurrentA: 30e3, supportStrengthN: 15000 });
    expect(lower.totalStressPa / r.totalStressPa).toBeCloseTo(0.36, 9);
    expect(lower.supportForceBN / r.supportForceBN).toBeCloseTo(0.36, 9);
    expect(lower.passes).toBe(true);
  });

  it('bars laid flat bend about their strong axis under the main force: Z = n·t·w²/6', () => {
    const flat = shortCircuitForces({ ...CASE, system: prepareBusbarSystem({ ...SYSTEM.input, arrangement: 'flat' }) });
    expect(flat.mainSectionModulusM3).toBeCloseTo((2 * 0.01 * 0.1 ** 2) / 6, 15);
  });

  it('defaults are flagged; automatic reclosing without entered factors is refused, naming the field', () => {
    const d = shortCircuitForces({ ...CASE, rOverX: undefined, yieldStrengthPa: undefined });
    expect(d.kappa).toBe(2);
    expect(d.yieldStrengthPa).toBe(180e6);
    expect(d.flags.map((f) => f.code)).toEqual(expect.arrayContaining(['BUSBAR_KAPPA_DEFAULTED', 'BUSBAR_YIELD_STRENGTH_DEFAULTED', 'BUSBAR_DYNAMIC_FACTORS_DEFAULTED']));
    const field = (input: ShortCircuitForceInput) => {
      try {
        shortCircuitForces(input);
      } catch (e) {
        expect(e).toBeInstanceOf(ElectricalInputError);
        return (e as ElectricalInputError).field;
      }
      throw new Error('accepted');
    };
    expect(field({ ...CASE, autoReclosing: true })).toBe('dynamicFactors');
    expect(field({ ...CASE, initialCurrentA: 0 })).toBe('initialCurrentA');
    expect(field({ ...CASE, kappa: 1.9 })).toBe('kappa');
    expect(field({ ...CASE, rOverX: undefined, kappa: 2.1 })).toBe('kappa');
    expect(field({ ...CASE, supports: 'cantilever' as never })).toBe('supports');
  });
});

import { describe, expect, it } from 'vitest';
import { evaluateCandidate, type CableCandidate, type CandidateEvaluationOk, type Conditions } from '@/lib/electrical';

/**
 * Multi-core cables through the sizing layer (issue 21, item 5): the heat path between the cores
 * and the sheath is the two-dimensional one of lib/electrical/multicore, not one round conductor
 * of the loaded cores' section. The references are outside the project: an independent
 * finite-difference solution of the cores-in-sheath problem (scipy, quoted in
 * tests/lib/electrical/multicore.test.ts: G = 0.8318 for the build below), the IEC 60287-2-1
 * formula for a concentric covering, and a surface coefficient fixed by the test.
 */
const ok = (e: ReturnType<typeof evaluateCandidate>): CandidateEvaluationOk => {
  if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
  return e;
};

const mm = 1e-3;
const RHO = 3.5;
// The build of the finite-difference check: d_c 11 mm, insulation 1.1 mm, inner covering 1.0 mm,
// sheath 1.8 mm, ρ_T 3.5 K·m/W throughout (dimensions illustrative, not a maker's).
const threeCore: CableCandidate = {
  kind: 'cable',
  id: 'three-core-95',
  label: 'Cu/XLPE 3×95 mm² (illustrative build)',
  material: 'copper',
  sectionMm2: 95,
  r20OhmPerM: 0.193e-3,
  conductorDiameterM: 11 * mm,
  cores: 3,
  layers: [
    { name: 'XLPE insulation', role: 'insulation', thicknessM: 1.1 * mm, thermalResistivityKmPerW: RHO, continuousLimitC: 90 },
    { name: 'inner covering', role: 'bedding', thicknessM: 1.0 * mm, thermalResistivityKmPerW: RHO },
    { name: 'sheath', role: 'sheath', thicknessM: 1.8 * mm, thermalResistivityKmPerW: RHO },
  ],
  emissivity: 0.9,
};

const H_W_PER_M2K = 10;
const dcConditions = (currentA: number): Conditions => ({
  designCurrentA: currentA,
  frequencyHz: 0,
  phases: 3,
  nominalVoltageV: 230,
  lengthM: 10,
  powerFactor: 1,
  ambientC: 30,
  installation: { kind: 'cable-in-air' },
  surfaceCoefficientWPerM2K: H_W_PER_M2K,
});

describe('a three-core cable is rated on its own heat path', () => {
  it('the hot spot at 200 A DC is θ_a + W_c·ρG/(2π) + 3W_c·(T₃ + 1/(hπD)) with G = 0.8318 from the finite-difference check, within 0.5 % of the rise', () => {
    // Geometry (laid up touching, worked by hand): s = 6.6/sin 60° = 7.621 mm, bore R = 7.621 +
    // 6.6 + 1.0 = 15.221 mm, D = 2R + 3.6 = 34.042 mm. T₃ = ρ/(2π)·ln(1 + 2·1.8/30.442)
    // (IEC 60287-2-1 §4.1.4). Conductor self-heating W/(4πk) for the equivalent conductor.
    const R = 6.6 / Math.sin(Math.PI / 3) + 6.6 + 1.0;
    const D = (2 * R + 3.6) * mm;
    const T3 = (RHO / (2 * Math.PI)) * Math.log(1 + 3.6 / (2 * R));
    const surface = 1 / (H_W_PER_M2K * Math.PI * D);
    const G = 0.8318;
    const current = 200;
    // DC resistance of a core at θ: R₂₀(1 + α(θ − 20)), α = 3.93e-3 (IEC 60287-1-1 Table 1); fixed point by hand.
    let theta = 60;
    for (let i = 0; i < 200; i++) {
      const Wc = current * current * 0.193e-3 * (1 + 3.93e-3 * (theta - 20));
      theta = 30 + Wc * ((RHO * G) / (2 * Math.PI)) + 3 * Wc * (T3 + surface) + (3 * Wc) / (4 * Math.PI * 400);
    }
    const e = ok(evaluateCandidate(threeCore, dcConditions(current)));
    expect(Math.abs((e.hotSpotC! - 30) / (theta - 30) - 1)).toBeLessThan(0.005);
  });

  it('says how it modelled the cable: the round-core flag with T₁ and the diameter, no approximation flag', () => {
    const e = ok(evaluateCandidate(threeCore, dcConditions(150)));
    const codes = e.flags.map((f) => f.code);
    expect(codes).toContain('MULTICORE_ROUND_CORES');
    expect(codes).not.toContain('MULTICORE_APPROXIMATION');
    const flag = e.flags.find((f) => f.code === 'MULTICORE_ROUND_CORES')!;
    expect(flag.message).toMatch(/overall diameter 34(\.0\d*)? mm/);
  });

  it('the one-conductor approximation it replaces ran hotter for this build: more than 10 % of the rise, so the change is not cosmetic', () => {
    // The former model: one conductor of d_c·√3 = 19.05 mm inside the listed coverings
    // (1.1 + 1.0 + 1.8 mm): T₁+T₃ = ρ/(2π)·ln(D'/d) with D' = 26.85 mm, surface πD'.
    const dEq = 11 * Math.sqrt(3);
    const Dold = dEq + 2 * 3.9;
    const Wc = 150 * 150 * 0.193e-3 * (1 + 3.93e-3 * 40);
    const oldRise = 3 * Wc * ((RHO / (2 * Math.PI)) * Math.log(Dold / dEq) + 1 / (H_W_PER_M2K * Math.PI * Dold * mm));
    const e = ok(evaluateCandidate(threeCore, dcConditions(150)));
    expect(oldRise / (e.hotSpotC! - 30)).toBeGreaterThan(1.1);
  });
});

describe('a multi-core cable beside other circuits of the same cable', () => {
  it('buried with two neighbours at 100 A: the solver and the IEC 60287 superposition closed form agree within 3 % (no cross-check flag)', () => {
    // Regression: the closed form ran the neighbours' equivalent conductor at their circuit current
    // instead of n times it, a third of their heat, and answered 208 A where the solver gave 137 A.
    const buried = (currentA: number): Conditions => ({
      designCurrentA: 150,
      frequencyHz: 50,
      phases: 3,
      nominalVoltageV: 230,
      lengthM: 50,
      powerFactor: 0.9,
      installation: { kind: 'buried', depthM: 0.7, soilResistivityKmPerW: 2.5, groundC: 20, otherCircuits: [{ currentA }, { currentA }], circuitSpacingM: 0.2 },
    });
    const e = ok(evaluateCandidate(threeCore, buried(100)));
    expect(e.flags.map((f) => f.code)).not.toContain('CROSS_CHECK_DIFFERENCE');
    // Hotter neighbours rate it lower.
    const hotter = ok(evaluateCandidate(threeCore, buried(200)));
    expect(hotter.ampacityA).toBeLessThan(e.ampacityA);
  });
});

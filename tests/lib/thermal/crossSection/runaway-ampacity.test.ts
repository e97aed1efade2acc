/**
 * Runaway and ampacity of one buried cable. Outside reference (references.md): a conductor with
 * R(T) = R₂₀[1 + α(T − 20)] behind a constant thermal resistance R_th to ambient T_a has
 *   T_c = (T_a + I²R₂₀R_th(1 − 20α)) / (1 − I²R₂₀αR_th),   runaway at I = 1/√(R₂₀αR_th),
 *   ampacity I = √((θ_max − T_a)/(R(θ_max)·R_th))  (IEC 60287-1-1 eq. (1) without λ or W_d).
 * R_th = T1 + T3 + T4 with T4 = ρ/(2π)·ln(u + √(u² − 1)) (IEC 60287-2-1), the coverings'
 * ρ/(2π)·ln(D_out/D_in); F_ac multiplies R₂₀.
 */
import { describe, expect, it } from 'vitest';
import { crossSectionAmpacity, solveCrossSection, type CrossSectionInput } from '@/lib/thermal/crossSection';
import { CABLE_D, CONDUCTOR_D, COPPER_ALPHA, INSULATION_D, PVC_RHO, R20_240_OHM_PER_M, XLPE_RHO, exampleCable, layerResistance, superpositionRise, trefoil, uniformGround } from './helpers';

const RHO = 1.5;
const DEPTH = 0.9;
const AMBIENT = 20;
const F_AC = 1.02;
const R20 = R20_240_OHM_PER_M * F_AC;

function t4(depth: number, de: number, rho: number): number {
  const u = (2 * depth) / de;
  return (rho / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
}

const bare = (currentA: number): CrossSectionInput =>
  uniformGround(RHO, [
    {
      xM: 0,
      depthM: DEPTH,
      outerDiameterM: CONDUCTOR_D,
      conductor: { diameterM: CONDUCTOR_D, r20OhmPerM: R20_240_OHM_PER_M, alpha20PerK: COPPER_ALPHA, acFactor: F_AC, currentA },
      coverings: [],
      maxConductorTemperatureC: 90,
    },
  ]);

describe('runaway of a bare conductor in the ground (closed form, references.md)', () => {
  const rth = t4(DEPTH, CONDUCTOR_D, RHO);
  const onset = 1 / Math.sqrt(R20 * COPPER_ALPHA * rth);

  it('below the onset: the conductor temperature of the closed form, within 1 % of the rise', () => {
    const current = 0.7 * onset;
    const result = solveCrossSection(bare(current));
    if (!result.converged) throw new Error(result.message);
    const k = current * current * R20;
    const expected = (AMBIENT + k * rth * (1 - 20 * COPPER_ALPHA)) / (1 - k * COPPER_ALPHA * rth);
    expect(Math.abs((result.cables[0].conductorC - AMBIENT) / (expected - AMBIENT) - 1)).toBeLessThan(0.01);
  });

  it('2 % below the onset a steady state exists; 2 % above it the solver says runaway and gives no temperature', () => {
    const below = solveCrossSection(bare(0.98 * onset));
    expect(below.converged).toBe(true);
    const above = solveCrossSection(bare(1.02 * onset));
    if (above.converged) throw new Error('expected no steady state');
    expect(above.status).toBe('runaway');
    expect(above.runaway?.kind).toBe('field');
    expect(above.governing.conductorC).toBe(Number.POSITIVE_INFINITY);
    expect('cables' in above).toBe(false);
    expect('field' in above).toBe(false);
  });

  it('a cable whose own coverings cannot pass the heat is refused as runaway inside the cable', () => {
    // Covering resistance 5/(2π)·ln(40) = 2.94 K·m/W: onset inside at 1/√(R₂₀αA) ≈ 1.0 kA.
    const input = bare(3000);
    input.cables[0].outerDiameterM = 40 * CONDUCTOR_D;
    input.cables[0].coverings = [{ outerDiameterM: 40 * CONDUCTOR_D, thermalResistivityKmPerW: 5 }];
    const result = solveCrossSection(input);
    expect(result.status).toBe('runaway');
    expect(result.converged ? undefined : result.runaway).toMatchObject({ kind: 'cable', cable: 0 });
  });
});

describe('ampacity (IEC 60287-1-1 eq. (1) without λ1 or W_d)', () => {
  it('bare conductor: within 0.5 % of √((θ_max − T_a)/(R(θ_max)·T4))', () => {
    const rth = t4(DEPTH, CONDUCTOR_D, RHO);
    const expected = Math.sqrt((90 - AMBIENT) / (R20 * (1 + COPPER_ALPHA * 70) * rth));
    const found = crossSectionAmpacity(bare(500));
    expect(Math.abs(found.currentA / expected - 1)).toBeLessThan(0.005);
    expect(found.upperA - found.currentA).toBeLessThanOrEqual(0.1 + 1e-9);
    expect(found.result.governing!.marginK).toBeGreaterThanOrEqual(0);
  });

  it('cable with insulation and sheath: within 0.5 % of √((θ_max − T_a)/(R(θ_max)·(T1 + T3 + T4)))', () => {
    const rth = layerResistance(XLPE_RHO, CONDUCTOR_D, INSULATION_D) + layerResistance(PVC_RHO, INSULATION_D, CABLE_D) + t4(DEPTH, CABLE_D, RHO);
    const expected = Math.sqrt((90 - AMBIENT) / (R20 * (1 + COPPER_ALPHA * 70) * rth));
    const found = crossSectionAmpacity(uniformGround(RHO, [exampleCable(0, DEPTH, 400)]));
    expect(Math.abs(found.currentA / expected - 1)).toBeLessThan(0.005);
  });

  it('three trefoil circuits: the governing conductor sits within 0.05 K below 90 °C, and the IEC superposition at that current agrees within 2 %', () => {
    const centres = [-0.3, 0, 0.3].flatMap((x) => trefoil(x, 1.0, CABLE_D));
    const found = crossSectionAmpacity(uniformGround(1.0, centres.map((c) => exampleCable(c.x, c.depth, 400))));
    const governing = found.result.cables[found.governing.index];
    expect(governing.conductorC).toBeLessThanOrEqual(90);
    expect(governing.conductorC).toBeGreaterThan(89.95);
    // IEC: surface rise by superposition at the solved losses, plus W_c·(T1 + T3).
    const watts = found.result.cables.map((c) => c.losses.totalWPerM);
    const internal = layerResistance(XLPE_RHO, CONDUCTOR_D, INSULATION_D) + layerResistance(PVC_RHO, INSULATION_D, CABLE_D);
    const iec = superpositionRise(centres, CABLE_D, watts, 1.0).map((rise, k) => rise + watts[k] * internal);
    expect(Math.abs((governing.conductorC - 20) / iec[found.governing.index] - 1)).toBeLessThan(0.02);
  });
});

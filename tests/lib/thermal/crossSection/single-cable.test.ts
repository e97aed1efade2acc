/**
 * One cable below an isothermal ground surface.
 *
 * Outside reference: the exact external resistance of an isothermal cylinder below an isothermal
 * plane, T4 = ρ/(2π)·ln(u + √(u² − 1)), u = 2L/De (IEC 60287-2-1, buried cable; references.md).
 * The solver's cable is an even ring source in soil (circles.ts), whose exact mean surface rise
 * is W·ρ/(2π)·ln(2u) (line source and its image, Kennelly; the mean-value theorem on the circle):
 * the grid order is measured against that limit, and by Richardson differences of three grids.
 */
import { describe, expect, it } from 'vitest';
import { solveCrossSection, type CrossSectionConverged, type CrossSectionInput } from '@/lib/thermal/crossSection';

function oneCable(depthM: number, diameterM: number, rho: number, mesh: CrossSectionInput['mesh'] = {}, domain = { widthM: 400, depthM: 200 }): CrossSectionInput {
  return {
    domain,
    soil: { thermalResistivityKmPerW: rho },
    // A bare conductor with temperature-independent resistance: a fixed 30 W/m at its surface.
    cables: [{ xM: 0.3, depthM, outerDiameterM: diameterM, conductor: { diameterM, r20OhmPerM: 30 / 1000 ** 2, alpha20PerK: 0, currentA: 1000 }, coverings: [] }],
    surface: { kind: 'isothermal', temperatureC: 15 },
    deepGroundTemperatureC: 15,
    mesh,
  };
}

function externalResistance(input: CrossSectionInput): { t4: number; result: CrossSectionConverged } {
  const result = solveCrossSection(input);
  if (!result.converged) throw new Error(result.message);
  const cable = result.cables[0];
  return { t4: (cable.surfaceC - 15) / cable.losses.totalWPerM, result };
}

const isothermalExact = (u: number, rho: number) => (rho / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
const ringExact = (u: number, rho: number) => (rho / (2 * Math.PI)) * Math.log(2 * u);

describe('one cable below an isothermal surface (exact T4 = ρ/(2π)·ln(u + √(u² − 1)), IEC 60287-2-1)', () => {
  for (const [depth, diameter, rho] of [
    [0.8, 0.036, 1.0],
    [1.2, 0.2, 2.5],
    [0.5, 0.1, 0.8],
  ] as const) {
    it(`L = ${depth} m, De = ${diameter} m, ρ = ${rho}: within 1 % of the exact T4 on the default mesh`, () => {
      const u = (2 * depth) / diameter;
      const { t4, result } = externalResistance(oneCable(depth, diameter, rho));
      expect(Math.abs(t4 / isothermalExact(u, rho) - 1)).toBeLessThan(0.01);
      expect(result.heat.energyResidual).toBeLessThan(1e-6);
      expect(result.flags.map((f) => f.code)).not.toContain('CROSS_SECTION_SIDE_BOUNDARY');
    });
  }

  it('measured grid order about 2 (errors against the ring-source limit ρ/(2π)·ln(2u), and Richardson)', () => {
    const depth = 1;
    const diameter = 0.1;
    const u = (2 * depth) / diameter;
    const t = [0.5, 1, 2].map((refinement) => externalResistance(oneCable(depth, diameter, 1, { cellsAcrossCable: 8, growthRatio: 1.2, refinement })).t4);
    const errors = t.map((v) => Math.abs(v / ringExact(u, 1) - 1));
    const orderAgainstExact = [Math.log2(errors[0] / errors[1]), Math.log2(errors[1] / errors[2])];
    const richardson = Math.log2(Math.abs(t[0] - t[1]) / Math.abs(t[1] - t[2]));
    for (const order of [...orderAgainstExact, richardson]) {
      expect(order).toBeGreaterThan(1.75);
      expect(order).toBeLessThan(2.3);
    }
  });

  it('the far boundaries do not matter: 50 m × 25 m and a domain four times as large agree within 0.1 % (same largest cell)', () => {
    const small = externalResistance(oneCable(1, 0.05, 1, { maxCellM: 1 }, { widthM: 50, depthM: 25 })).t4;
    const large = externalResistance(oneCable(1, 0.05, 1, { maxCellM: 1 }, { widthM: 200, depthM: 100 })).t4;
    expect(Math.abs(small / large - 1)).toBeLessThan(1e-3);
  });

  it('a shallow, large circle (u < 4) is flagged: there the ring and the isothermal cylinder part by more than 0.8 %', () => {
    const { t4, result } = externalResistance(oneCable(0.3, 0.2, 1));
    expect(result.flags.map((f) => f.code)).toContain('CROSS_SECTION_SHALLOW_CIRCLE');
    // u = 3: the ring's limit is ln 6 = 1.7918, the isothermal exact arccosh 3 = 1.7627 (1.65 % apart).
    expect(Math.abs(t4 / ringExact(3, 1) - 1)).toBeLessThan(0.01);
  });
});

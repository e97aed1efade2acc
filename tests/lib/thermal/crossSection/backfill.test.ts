/**
 * A trefoil in a rectangular backfill of its own resistivity. Outside reference: the
 * geometric-factor method of IEC 60287-2-1 §4.2.7.4 (from memory, not read from the standard):
 * the external resistance is computed as if all the ground had the backfill's resistivity ρ_c,
 * then (N/2π)·(ρ_e − ρ_c)·G_b is added, with
 *   G_b = ln(u + √(u² − 1)), u = L_G/r_b, L_G the depth of the backfill's centre,
 *   ln r_b = ½·(x/y)·(4/π − x/y)·ln(1 + y²/x²) + ln(x/2), x < y the sides of the rectangle,
 * stated for y/x < 3 (from memory). For N equally loaded cables, N·W is the backfill's total
 * heat; with the (nearly equal) solved losses this test uses ΣW_k.
 */
import { describe, expect, it } from 'vitest';
import { solveCrossSection } from '@/lib/thermal/crossSection';
import { CABLE_D, exampleCable, superpositionRise, trefoil } from './helpers';

function geometricFactor(width: number, height: number, centreDepth: number): number {
  const x = Math.min(width, height);
  const y = Math.max(width, height);
  const lnRb = 0.5 * (x / y) * (4 / Math.PI - x / y) * Math.log(1 + (y * y) / (x * x)) + Math.log(x / 2);
  const u = centreDepth / Math.exp(lnRb);
  return Math.log(u + Math.sqrt(u * u - 1));
}

describe('trefoil in a backfill (IEC 60287-2-1 §4.2.7.4 geometric factor, from memory)', () => {
  for (const [width, height, rhoSoil, rhoFill] of [
    [1.0, 0.5, 2.0, 1.0],
    [0.8, 0.5, 2.5, 1.0],
    [0.6, 0.6, 1.0, 2.0],
  ] as const) {
    it(`${width} m × ${height} m (y/x = ${(Math.max(width, height) / Math.min(width, height)).toFixed(1)} < 3), soil ${rhoSoil}, backfill ${rhoFill} K·m/W: surface rises within 3 %`, () => {
      const centres = trefoil(0, 1.0, CABLE_D);
      const result = solveCrossSection({
        domain: { widthM: 100, depthM: 50 },
        soil: { thermalResistivityKmPerW: rhoSoil },
        regions: [{ name: 'backfill', xMinM: -width / 2, xMaxM: width / 2, depthTopM: 1 - height / 2, depthBottomM: 1 + height / 2, thermalResistivityKmPerW: rhoFill }],
        cables: centres.map((c) => exampleCable(c.x, c.depth, 450)),
        surface: { kind: 'isothermal', temperatureC: 20 },
        deepGroundTemperatureC: 20,
      });
      if (!result.converged) throw new Error(result.message);
      const watts = result.cables.map((c) => c.losses.totalWPerM);
      const total = watts.reduce((a, b) => a + b, 0);
      const inFill = superpositionRise(centres, CABLE_D, watts, rhoFill);
      const correction = (total * (rhoSoil - rhoFill) * geometricFactor(width, height, 1.0)) / (2 * Math.PI);
      result.cables.forEach((cable, k) => expect(Math.abs((cable.surfaceC - 20) / (inFill[k] + correction) - 1)).toBeLessThan(0.03));
      expect(result.heat.energyResidual).toBeLessThan(1e-6);
    });
  }
});

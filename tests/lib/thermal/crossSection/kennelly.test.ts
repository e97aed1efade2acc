/**
 * Line sources below an isothermal surface. Outside reference: Kennelly's image solution for a
 * half-space (as used by IEC 60287-2-1 §4.2.3): the rise at a point is
 *   ΔT = Σ_k W_k·ρ/(2π)·ln(d′_k/d_k),
 * d_k the distance to source k, d′_k to its image mirrored in the surface.
 */
import { describe, expect, it } from 'vitest';
import { solveCrossSection } from '@/lib/thermal/crossSection';

const RHO = 1.2;
const SOURCES = [
  { kind: 'line' as const, xM: -0.4, depthM: 1.0, wattsPerM: 35 },
  { kind: 'line' as const, xM: 0.5, depthM: 1.5, wattsPerM: 20 },
  { kind: 'line' as const, xM: 1.3, depthM: 0.7, wattsPerM: 12 },
];

function kennelly(x: number, depth: number): number {
  let rise = 0;
  for (const s of SOURCES) {
    const d = Math.hypot(x - s.xM, depth - s.depthM);
    const dImage = Math.hypot(x - s.xM, depth + s.depthM);
    rise += ((s.wattsPerM * RHO) / (2 * Math.PI)) * Math.log(dImage / d);
  }
  return rise;
}

describe("line sources below an isothermal surface (Kennelly's image solution)", () => {
  it('the field matches within 0.1 K everywhere 0.2 m or more from the sources (within 6 m of them)', () => {
    const result = solveCrossSection({
      domain: { widthM: 200, depthM: 100 },
      soil: { thermalResistivityKmPerW: RHO },
      cables: [],
      heatSources: SOURCES,
      surface: { kind: 'isothermal', temperatureC: 12 },
      deepGroundTemperatureC: 12,
      mesh: { sourceCellM: 0.01, growthRatio: 1.1 },
    });
    if (!result.converged) throw new Error(result.message);
    const { nx, ny, xCentresM, depthCentresM, temperaturesC } = result.field;
    let worst = 0;
    let checked = 0;
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const x = xCentresM[i];
        const depth = depthCentresM[j];
        const near = SOURCES.some((s) => Math.hypot(x - s.xM, depth - s.depthM) < 0.2);
        if (near || Math.abs(x) > 6 || depth > 6) continue;
        worst = Math.max(worst, Math.abs(temperaturesC[j * nx + i] - 12 - kennelly(x, depth)));
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(1000);
    expect(worst).toBeLessThan(0.1);
    expect(result.heat.energyResidual).toBeLessThan(1e-6);
    // All the heat leaves through the surface or the bottom; here it is 67 W/m.
    expect(result.heat.generatedWPerM).toBeCloseTo(67, 9);
  });
});

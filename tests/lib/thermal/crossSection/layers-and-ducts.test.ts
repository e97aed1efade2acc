/**
 * Layered ground with a convective surface, and cables in ducts with screen and dielectric
 * losses. Outside references:
 *  • layered slab, 1-D conduction with a uniform source layer, convective top and fixed bottom
 *    (Incropera §3.5, solved here by hand: flux piecewise linear, T by exact integration);
 *  • IEC 60287-1-1 eq. (1): θ_c − θ_s = (W_c + ½W_d)·T1 + (W_c(1 + λ1) + W_d)·T3 for a cable
 *    whose screen (λ1) lies between insulation (T1) and sheath (T3);
 *  • IEC 60287-2-1 cables in ducts (from memory): T4 = T4′ + T4″ + T4‴,
 *    T4′ = U/(1 + 0.1(V + Yθm)De) with De in mm and θm the mean air temperature, plastic ducts
 *    U = 1.87, V = 0.312, Y = 0.0037 (from memory), T4″ = ρ_d/(2π)·ln(D_o/D_i),
 *    T4‴ = ρ/(2π)·ln(u + √(u² − 1)), u = 2L/D_o.
 */
import { describe, expect, it } from 'vitest';
import { solveCrossSection, type CrossSectionInput } from '@/lib/thermal/crossSection';
import { CABLE_D, CONDUCTOR_D, COPPER_ALPHA, INSULATION_D, PVC_RHO, R20_240_OHM_PER_M, XLPE_RHO, exampleCable, layerResistance, uniformGround } from './helpers';

describe('layered ground, convective surface, a source layer across the width (exact 1-D solution)', () => {
  const layers = [
    { top: 0, bottom: 0.5, rho: 2.0 },
    { top: 0.5, bottom: 1.0, rho: 1.0 },
    { top: 1.0, bottom: 1.2, rho: 1.0 },
    { top: 1.2, bottom: 3.0, rho: 0.8 },
    { top: 3.0, bottom: 6.0, rho: 1.5 },
  ];
  const width = 4;
  const watts = 12;
  const h = 8;
  const air = 30;
  const deep = 11;
  const input: CrossSectionInput = {
    domain: { widthM: width, depthM: 6 },
    soil: { thermalResistivityKmPerW: 1 },
    regions: layers.map((l) => ({ depthTopM: l.top, depthBottomM: l.bottom, thermalResistivityKmPerW: l.rho })),
    cables: [],
    heatSources: [{ kind: 'rectangle', xMinM: -width / 2, xMaxM: width / 2, depthTopM: 1.0, depthBottomM: 1.2, wattsPerM: watts }],
    surface: { kind: 'convective', airTemperatureC: air, heatTransferCoefficientWPerM2K: h },
    deepGroundTemperatureC: deep,
    mesh: { maxCellM: 0.05 },
  };
  const q = watts / width / 0.2; // W/m³

  /** Downward flux F(y) = F0 + q·(overlap of [0, y] with the source layer); T(y) = T(0) − ∫F/k. */
  const exact = () => {
    const source = (y: number) => q * Math.max(0, Math.min(y, 1.2) - 1.0);
    const rhoAt = (y: number) => layers.find((l) => y >= l.top && y <= l.bottom)!.rho;
    const breaks = [0, 0.5, 1.0, 1.2, 3.0, 6.0];
    // ∫_0^y F·ρ dy for F = F0·a + source: trapezoid is exact on each piece (F linear, ρ constant).
    const integral = (y: number, f0: number) => {
      let s = 0;
      for (let b = 0; b + 1 < breaks.length && breaks[b] < y; b++) {
        const lo = breaks[b];
        const hi = Math.min(breaks[b + 1], y);
        const rho = rhoAt(0.5 * (lo + hi));
        s += rho * (hi - lo) * (f0 + source(lo) + f0 + source(hi)) / 2;
      }
      return s;
    };
    // T(0) = air − F0/h (upward loss h(T0 − air) = −F0); T(6) = T(0) − ∫ = deep: linear in F0.
    const t6 = (f0: number) => air - f0 / h - integral(6, f0);
    const f0 = (deep - t6(0)) / (t6(1) - t6(0));
    return { temperature: (y: number) => air - f0 / h - integral(y, f0), f0 };
  };

  it('every cell within 2 mK of the exact profile with 2.5 cm cells, second order; heat to the air and to the deep ground as in 1-D', () => {
    // The source cells' quadratic profile meets the half-cell fluxes at the layer's faces with an
    // error of about q·δ²/(8k) (references.md, plane wall): second order, as measured here.
    const { temperature, f0 } = exact();
    const worstError = (maxCellM: number) => {
      const result = solveCrossSection({ ...input, mesh: { maxCellM } });
      if (!result.converged) throw new Error(result.message);
      const { nx, ny, depthCentresM, temperaturesC } = result.field;
      let worst = 0;
      for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) worst = Math.max(worst, Math.abs(temperaturesC[j * nx + i] - temperature(depthCentresM[j])));
      return { worst, result };
    };
    const coarse = worstError(0.05);
    const { worst, result } = worstError(0.025);
    expect(worst).toBeLessThan(2e-3);
    expect(Math.log2(coarse.worst / worst)).toBeGreaterThan(1.8);
    expect(result.heat.toSurfaceWPerM).toBeCloseTo(-f0 * width, 4);
    expect(result.heat.toSurfaceWPerM + result.heat.toBottomWPerM).toBeCloseTo(watts, 6);
    expect(result.heat.energyResidual).toBeLessThan(1e-6);
  });
});

describe("a cable's own radial model (IEC 60287-1-1 eq. (1))", () => {
  it('screen loss λ1 after the insulation and dielectric loss in it: θ_c − θ_s as eq. (1), losses as W_c(1 + λ1) + W_d', () => {
    const lambda1 = 0.12;
    const wd = 0.4;
    const cable = exampleCable(0, 1.0, 500, {
      proportionalLosses: [{ name: 'screen', factor: lambda1, afterCovering: 0 }],
      dielectricLoss: { wattsPerM: wd, inCovering: 0 },
    });
    const result = solveCrossSection(uniformGround(1.2, [cable]));
    if (!result.converged) throw new Error(result.message);
    const c = result.cables[0];
    const wc = 500 ** 2 * R20_240_OHM_PER_M * 1.02 * (1 + COPPER_ALPHA * (c.conductorC - 20));
    const t1 = layerResistance(XLPE_RHO, CONDUCTOR_D, INSULATION_D);
    const t3 = layerResistance(PVC_RHO, INSULATION_D, CABLE_D);
    expect(c.losses.conductorWPerM).toBeCloseTo(wc, 9);
    expect(c.losses.totalWPerM).toBeCloseTo(wc * (1 + lambda1) + wd, 9);
    expect(c.conductorC - c.surfaceC).toBeCloseTo((wc + wd / 2) * t1 + (wc * (1 + lambda1) + wd) * t3, 9);
    expect(c.coveringOuterC[0]).toBeCloseTo(c.conductorC - (wc + wd / 2) * t1, 9);
  });
});

describe('cable in a plastic duct (IEC 60287-2-1 cables in ducts, constants from memory)', () => {
  const duct = { innerDiameterM: 0.1, outerDiameterM: 0.11, wallThermalResistivityKmPerW: 3.5 };
  const depth = 0.9;
  const rho = 1.0;
  const current = 400;

  function iec(U: number, V: number, Y: number): number {
    const t1 = layerResistance(XLPE_RHO, CONDUCTOR_D, INSULATION_D);
    const t3 = layerResistance(PVC_RHO, INSULATION_D, CABLE_D);
    const t4pp = layerResistance(3.5, 0.1, 0.11);
    const u = (2 * depth) / 0.11;
    const t4ppp = (rho / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
    let conductor = 60;
    let meanAir = 40;
    for (let pass = 0; pass < 300; pass++) {
      const t4p = U / (1 + 0.1 * (V + Y * meanAir) * CABLE_D * 1000);
      const w = current ** 2 * R20_240_OHM_PER_M * 1.02 * (1 + COPPER_ALPHA * (conductor - 20));
      const ductOuter = 20 + w * t4ppp;
      const ductInner = ductOuter + w * t4pp;
      const surface = ductInner + w * t4p;
      meanAir = (surface + ductInner) / 2;
      conductor = surface + w * (t1 + t3);
    }
    return conductor;
  }

  it('the named plastic duct: conductor rise within 1 % of the IEC sum, and flagged as constants from memory', () => {
    const result = solveCrossSection(uniformGround(rho, [exampleCable(0, depth, current, { duct: { ...duct, air: 'plastic' } })]));
    if (!result.converged) throw new Error(result.message);
    expect(Math.abs((result.cables[0].conductorC - 20) / (iec(1.87, 0.312, 0.0037) - 20) - 1)).toBeLessThan(0.01);
    expect(result.flags.map((f) => f.code)).toContain('CROSS_SECTION_DUCT_CONSTANTS_FROM_MEMORY');
    expect(result.iterations.outer).toBeGreaterThan(2); // T4′(θm) is iterated
  });

  it('given constants (metallic conduit, from memory 5.2, 1.4, 0.011): within 1 %', () => {
    const result = solveCrossSection(uniformGround(rho, [exampleCable(0, depth, current, { duct: { ...duct, air: { U: 5.2, V: 1.4, Y: 0.011 } } })]));
    if (!result.converged) throw new Error(result.message);
    expect(Math.abs((result.cables[0].conductorC - 20) / (iec(5.2, 1.4, 0.011) - 20) - 1)).toBeLessThan(0.01);
  });
});

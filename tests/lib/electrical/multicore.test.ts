import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { concentricCoveringThermalResistance, effectiveInternalLayer, isothermalCirclesInSheath, multicoreCableThermal } from '@/lib/electrical/multicore';
import { solveSteady } from '@/lib/thermal';

// Internal thermal resistance of multi-core cables by two-dimensional conduction between
// isothermal conductors and an isothermal sheath (lib/electrical/multicore.ts). Each check
// below is against a closed form from outside the project, worked by hand in its comment.

const mm = 1e-3;

describe('isothermal conductors inside an isothermal sheath', () => {
  it('one eccentric conductor: the exact eccentric-cylinder shape factor, ρ/(2π)·arccosh((R² + r² − e²)/(2Rr)) (Incropera Table 4.1, from memory)', () => {
    // R = 15 mm, r = 5.5 mm, e = 7.5 mm, ρ = 3.5 K·m/W: (225 + 30.25 − 56.25)/(2·15·5.5) = 199/165 = 1.2060606;
    // arccosh = ln(1.2060606 + √(1.2060606² − 1)) = 0.6314248; × 3.5/(2π) = 0.5570423 → 0.3517303 K·m/W.
    const r = isothermalCirclesInSheath({ circles: [{ xM: 7.5 * mm, yM: 0, radiusM: 5.5 * mm }], radiusM: 15 * mm, thermalResistivityKmPerW: 3.5 });
    expect(r.matrixKmPerW[0][0]).toBeCloseTo(0.3517303, 6);
  });

  it('a very eccentric, nearly touching conductor still matches the exact form to 1e-6 (relative)', () => {
    // R = 20, r = 9, e = 10.5 (gap 0.5 mm): arccosh((400 + 81 − 110.25)/(360)) = arccosh(1.0298611) = 0.2437772.
    const r = isothermalCirclesInSheath({ circles: [{ xM: 0, yM: -10.5 * mm, radiusM: 9 * mm }], radiusM: 20 * mm, thermalResistivityKmPerW: 2 * Math.PI });
    expect(Math.abs(r.matrixKmPerW[0][0] / Math.acosh(370.75 / 360) - 1)).toBeLessThan(1e-6);
  });

  it('a concentric conductor is the single-core T₁ = ρ_T/(2π)·ln(1 + 2t₁/d_c) of IEC 60287-2-1', () => {
    // d_c = 6 mm, t₁ = 7 mm, ρ = 3.5: 0.5570423·ln(1 + 14/6) = 0.5570423·1.2039728 = 0.6706638 K·m/W.
    const r = isothermalCirclesInSheath({ circles: [{ xM: 0, yM: 0, radiusM: 3 * mm }], radiusM: 10 * mm, thermalResistivityKmPerW: 3.5 });
    expect(r.matrixKmPerW[0][0]).toBeCloseTo(0.6706638, 7);
  });

  it('thin conductors tend to the line-source closed form for three cores, ρ/(2π)·ln[(R⁶ − s⁶)/(3s²R³r_c)]', () => {
    // Derived by images: a line source at distance s from the axis has its image at R²/s; the
    // rise of core 1 is the sum of its own term ln((R² − s²)/(R·r_c)) and, for each of the two
    // others 120° away, ln(√(s⁴ + s²R² + R⁴)/(√3·s·R)); with (R² − s²)(R⁴ + R²s² + s⁴) = R⁶ − s⁶
    // the sum is ln[(R⁶ − s⁶)/(3s²R³r_c)]. R = 10, s = 4, r_c = 0.05 mm, ρ = 2π:
    // (1e6 − 4096)/(3·16·1000·0.05) = 995904/2400 = 414.96 → ln = 6.028182. The finite conductor
    // differs by O((r_c/(s√3))²) ≈ 5e-5.
    const circles = [0, 1, 2].map((j) => ({ xM: 4 * mm * Math.cos((2 * Math.PI * j) / 3), yM: 4 * mm * Math.sin((2 * Math.PI * j) / 3), radiusM: 0.05 * mm }));
    const r = isothermalCirclesInSheath({ circles, radiusM: 10 * mm, thermalResistivityKmPerW: 2 * Math.PI });
    const rowSum = r.matrixKmPerW[0].reduce((s, v) => s + v, 0);
    expect(Math.abs(rowSum / 6.028182 - 1)).toBeLessThan(1e-3);
  });

  it('reciprocity (Green): M_ij = M_ji for an unsymmetric layout', () => {
    const r = isothermalCirclesInSheath({
      circles: [
        { xM: 3 * mm, yM: 1 * mm, radiusM: 2 * mm },
        { xM: -4 * mm, yM: 2 * mm, radiusM: 3 * mm },
        { xM: 0, yM: -5 * mm, radiusM: 1.5 * mm },
      ],
      radiusM: 10 * mm,
      thermalResistivityKmPerW: 3.5,
    });
    for (let i = 0; i < 3; i++) for (let j = 0; j < i; j++) expect(r.matrixKmPerW[i][j] / r.matrixKmPerW[j][i]).toBeCloseTo(1, 7);
  });

  it('overlapping conductors or one outside the sheath are refused, naming the circle', () => {
    const field = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        expect(e).toBeInstanceOf(ElectricalInputError);
        return (e as ElectricalInputError).field;
      }
      return 'not refused';
    };
    expect(field(() => isothermalCirclesInSheath({ circles: [{ xM: 0, yM: 0, radiusM: 3 * mm }, { xM: 5 * mm, yM: 0, radiusM: 3 * mm }], radiusM: 20 * mm, thermalResistivityKmPerW: 3.5 }))).toBe('circles[1]');
    expect(field(() => isothermalCirclesInSheath({ circles: [{ xM: 8 * mm, yM: 0, radiusM: 3 * mm }], radiusM: 10 * mm, thermalResistivityKmPerW: 3.5 }))).toBe('circles[0]');
  });
});

describe('a multi-core cable', () => {
  // A three-core 95 mm² XLPE cable of LV build (dimensions illustrative, not a maker's): d_c = 11 mm,
  // insulation 1.1 mm, inner covering 1.0 mm, sheath 1.8 mm, ρ = 3.5 K·m/W throughout.
  const threeCore = {
    cores: 3,
    conductorDiameterM: 11 * mm,
    insulationThicknessM: 1.1 * mm,
    insulationResistivityKmPerW: 3.5,
    innerCoveringThicknessM: 1.0 * mm,
    coreLossesWPerM: [10, 10, 10],
    outerLayers: [{ name: 'sheath', thicknessM: 1.8 * mm, thermalResistivityKmPerW: 3.5 }],
  };

  it('geometry: cores touching on a circle of s = 6.6/sin 60° = 7.621 mm; sheath bore R = 7.621 + 6.6 + 1.0 = 15.221 mm', () => {
    const r = multicoreCableThermal(threeCore);
    expect(r.radiusUnderSheathM / mm).toBeCloseTo(6.6 / Math.sin(Math.PI / 3) + 7.6, 9);
    expect(r.outerDiameterM / mm).toBeCloseTo(2 * (15.221) + 3.6, 2);
  });

  it('T₁ per core against an independent 2-D finite-difference solution: G = 2πT₁/ρ = 0.832 within 0.5 %', () => {
    // Independent check (not from the standard): a finite-difference solution of the same problem
    // on a square grid (scipy sparse solve, conductors at θ = 1, sheath circle at θ = 0; the total
    // heat flow gives G = 2π·n/Q): h = 2R/800 → 0.83833, 2R/1600 → 0.83505, first-order Richardson
    // 2·0.83505 − 0.83833 = 0.8318. The line sources alone would give ln[(R⁶ − s⁶)/(3s²R³r_c)] =
    // 1.287, 55 % high: the multipoles matter for LV cables.
    const r = multicoreCableThermal(threeCore);
    const G = (2 * Math.PI * (r.perCoreT1KmPerW[0] as number)) / 3.5;
    expect(Math.abs(G / 0.8318 - 1)).toBeLessThan(0.005);
    expect(r.settledRelative).toBeLessThan(1e-6);
  });

  it('four cores, same build: G = 0.913 within 0.5 % of the same finite-difference check', () => {
    // h = 2R/800 → 0.91985, 2R/1600 → 0.91646; Richardson 2·0.91646 − 0.91985 = 0.9131.
    const r = multicoreCableThermal({ ...threeCore, cores: 4, coreLossesWPerM: [10, 10, 10, 10] });
    const G = (2 * Math.PI * (r.perCoreT1KmPerW[0] as number)) / 3.5;
    expect(Math.abs(G / 0.9131 - 1)).toBeLessThan(0.005);
  });

  it('T₃ of the sheath, IEC 60287-2-1 §4.1.4: ρ/(2π)·ln(1 + 2t₃/D) = 0.5570423·ln(1 + 3.6/30.442) = 0.06226 K·m/W', () => {
    const r = multicoreCableThermal(threeCore);
    expect(r.outerLayerResistancesKmPerW[0].kmPerW).toBeCloseTo(0.0622616, 5);
    expect(concentricCoveringThermalResistance({ innerDiameterM: 30.442 * mm, thicknessM: 1.8 * mm, thermalResistivityKmPerW: 3.5 })).toBeCloseTo(0.0622616, 7);
  });

  it('losses superpose: a four-core cable with a loaded neutral (harmonics) — rises are M·W and the hottest core is found', () => {
    const four = { ...threeCore, cores: 4 };
    const phases = multicoreCableThermal({ ...four, coreLossesWPerM: [10, 10, 10, 0] });
    const neutral = multicoreCableThermal({ ...four, coreLossesWPerM: [0, 0, 0, 14] });
    const both = multicoreCableThermal({ ...four, coreLossesWPerM: [10, 10, 10, 14] });
    for (let i = 0; i < 4; i++) expect(both.coreRiseK[i]).toBeCloseTo(phases.coreRiseK[i] + neutral.coreRiseK[i], 9);
    expect(both.hottestCore).toBe(3);
    expect(both.perCoreT1KmPerW[3]).toBeCloseTo(both.coreRiseK[3] / 14, 12);
    expect(phases.perCoreT1KmPerW[3]).toBeUndefined();
  });

  it('mapped into the one-conductor radial model (lib/thermal), the effective layer reproduces the hottest core', () => {
    // Outside reference: conduction in cylindrical layers (Incropera §3.3.1) and a solid
    // cylinder with uniform generation (§3.5.2): T_hot = T_surface + W·(R_int + T₃) + W/(4πk_cu).
    const m = multicoreCableThermal(threeCore);
    const d = 11 * mm * Math.sqrt(3);
    const layer = effectiveInternalLayer({ internalResistanceForTotalKmPerW: m.internalResistanceForTotalKmPerW, radiusUnderSheathM: m.radiusUnderSheathM, conductorDiameterM: d });
    const W = m.totalLossWPerM;
    const solved = solveSteady({
      geometry: {
        kind: 'cylinder',
        innerRadius: 0,
        layers: [
          { thickness: d / 2, conductivity: 401, generating: true, cells: 40 },
          { thickness: layer.thicknessM, conductivity: 1 / layer.thermalResistivityKmPerW, cells: 80 },
          { thickness: 1.8 * mm, conductivity: 1 / 3.5, cells: 40 },
        ],
      },
      source: { kind: 'uniform', q: W / ((Math.PI * d * d) / 4) },
      inner: { kind: 'symmetry' },
      outer: { kind: 'temperature', value: 30 },
    });
    const expected = 30 + m.hottestRiseOverSurfaceK + W / (4 * Math.PI * 401);
    expect(solved.hotSpot.temperature).toBeCloseTo(expected, 3);
    // The other mapping (IEC 60853-2 style, from memory): keep ρ and shrink the conductor.
    expect((3.5 / (2 * Math.PI)) * Math.log((2 * m.radiusUnderSheathM) / m.equivalentConductorDiameterM)).toBeCloseTo(m.internalResistanceForTotalKmPerW, 12);
  });

  it('fillers of another resistivity: the larger is used over the whole medium and said so (an upper bound)', () => {
    const r = multicoreCableThermal({ ...threeCore, fillerResistivityKmPerW: 6 });
    expect(r.mediumResistivityKmPerW).toBe(6);
    expect(r.mediumResistivityBasis).toMatch(/upper bound/);
  });

  it('refusals name the field', () => {
    const field = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        return (e as ElectricalInputError).field;
      }
      return 'not refused';
    };
    expect(field(() => multicoreCableThermal({ ...threeCore, cores: 6 }))).toBe('cores');
    expect(field(() => multicoreCableThermal({ ...threeCore, coreLossesWPerM: [1, 2] }))).toBe('coreLossesWPerM');
    expect(field(() => multicoreCableThermal({ ...threeCore, coreLossesWPerM: [0, 0, 0] }))).toBe('coreLossesWPerM');
    expect(field(() => multicoreCableThermal({ ...threeCore, insulationThicknessM: 0 }))).toBe('insulationThicknessM');
  });
});

import { describe, expect, it } from 'vitest';
import {
  FREE_AIR_CONSTANTS,
  freeAirExternalResistance,
  freeAirHeatTransferCoefficient,
  freeAirRowFor,
  parseArrangement,
  type Arrangement,
} from '@/lib/electrical/iec60287';

// Assumed construction (NOT a catalogue check value): 240 mm² Cu, 0.6/1 kV XLPE, PVC sheath,
// d_c = 18.0 mm, t₁ = 1.7 mm, t₃ = 1.8 mm (IEC 60502-1 nominal thicknesses, from memory),
// D_e = 18.0 + 3.4 + 3.6 = 25.0 mm.
// T₁ = 3.5/(2π)·ln(1 + 3.4/18.0) = 0.557042·0.173019 = 0.0963790 K·m/W (IEC 60287-2-1 §4.1.2)
// T₃ = 5.0/(2π)·ln(1 + 3.6/21.4) = 0.795775·0.155485 = 0.123731 K·m/W
const De = 0.025;
const T1 = 0.096379;
const T3 = 0.1237310;

describe('free-air surface coefficient h = Z/D_e^g + E — IEC 60287-2-1 §4.2.1, Table 2 (from memory)', () => {
  it('single cable, D_e = 25 mm: h = 0.21/0.025^0.6 + 3.94 = 5.86068', () => {
    // 0.025^0.6 = e^{0.6·ln 0.025} = e^{−2.213328} = 0.109320; 0.21/0.109320 = 1.920981.
    expect(freeAirHeatTransferCoefficient({ externalDiameterM: De, ...FREE_AIR_CONSTANTS.single })).toBeCloseTo(5.86068, 4);
  });
  it('trefoil, D_e = 25 mm: h = 0.96/0.025^0.2 + 1.25 = 3.25763', () => {
    // 0.025^0.2 = e^{−0.737776} = 0.478176; 0.96/0.478176 = 2.007628.
    expect(freeAirHeatTransferCoefficient({ externalDiameterM: De, ...FREE_AIR_CONSTANTS['trefoil-touching'] })).toBeCloseTo(3.25763, 4);
  });
});

describe('T₄* and the (Δθ_s)^¼ iteration — IEC 60287-2-1 §4.2.1, worked by hand', () => {
  // Δθ = 60 K (90 °C conductor in 30 °C air), no screen, no dielectric loss: T_int = T₁ + T₃ = 0.220110.
  it('single cable: Δθ_s = 47.399 K, T₄* = 0.82798 K·m/W', () => {
    // K_A = π·0.025·5.86068·0.220110 = 0.101316. Fixed point x⁴(1 + K_A·x) = 60 with x = Δθ_s^¼:
    // x = 2.62387 → x⁴ = 47.3993, 1 + K_A·x = 1.265840, product 60.000. Δθ_s = 47.399 K;
    // T₄* = 1/(π·0.025·5.86068·2.62387) = 1/1.207775 = 0.827978 K·m/W.
    const r = freeAirExternalResistance({ externalDiameterM: De, constants: FREE_AIR_CONSTANTS.single, conductorRiseK: 60, T1, T3 });
    expect(r.KA).toBeCloseTo(0.101316, 5);
    expect(r.surfaceRiseK).toBeCloseTo(47.3993, 3);
    expect(r.T4).toBeCloseTo(0.827978, 5);
    // The converged value satisfies the clause's fixed point exactly.
    const x = r.surfaceRiseK ** 0.25;
    expect(x ** 4 * (1 + r.KA * x)).toBeCloseTo(60, 9);
  });

  it('trefoil touching: Δθ_s = 52.114 K, T₄* = 1.45469 K·m/W', () => {
    // h = 3.25763; K_A = π·0.025·3.25763·0.220110 = 0.0563159; x = 2.68683 → x⁴ = 52.1145,
    // 1 + K_A·x = 1.151310, product 60.000. T₄* = 1/(π·0.025·3.25763·2.68683) = 1/0.687434 = 1.45469.
    const r = freeAirExternalResistance({ externalDiameterM: De, constants: FREE_AIR_CONSTANTS['trefoil-touching'], conductorRiseK: 60, T1, T3 });
    expect(r.KA).toBeCloseTo(0.0563159, 6);
    expect(r.surfaceRiseK).toBeCloseTo(52.1145, 3);
    expect(r.T4).toBeCloseTo(1.45469, 4);
  });

  it('the heat the surface law carries off equals the heat through T_int (the balance the iteration solves)', () => {
    const r = freeAirExternalResistance({ externalDiameterM: De, constants: FREE_AIR_CONSTANTS['trefoil-touching'], conductorRiseK: 60, T1, T3 });
    // W = (Δθ − Δθ_s)/T_int must equal π·D_e·h·Δθ_s^(5/4).
    expect((60 - r.surfaceRiseK) / r.internalResistanceKmPerW).toBeCloseTo(r.surfaceHeatWPerM, 8);
  });

  it('in the sun: Δθ_ds = σ·D_e·H·T_int is added to the driving rise and the balance includes the absorbed sun', () => {
    // σ = 0.6 (PVC, Table 4 from memory), H = 1000 W/m²: σD_eH = 15 W/m; Δθ_ds = 15·0.220110 = 3.30165 K.
    const sun = { absorptionCoefficient: 0.6, irradianceWPerM2: 1000 };
    const r = freeAirExternalResistance({ externalDiameterM: De, constants: FREE_AIR_CONSTANTS.single, conductorRiseK: 60, T1, T3, sun });
    expect(r.solarRiseK).toBeCloseTo(3.30165, 4);
    const x = r.surfaceRiseK ** 0.25;
    expect(x ** 4 * (1 + r.KA * x)).toBeCloseTo(63.30165, 4);
    // Surface: W_cable + σD_eH = πD_e·h·Δθ_s^(5/4), W_cable = (Δθ − Δθ_s)/T_int.
    expect((60 - r.surfaceRiseK) / r.internalResistanceKmPerW + 15).toBeCloseTo(r.surfaceHeatWPerM, 8);
    expect(r.surfaceRiseK).toBeGreaterThan(47.3993);
  });

  it('dielectric term Δθ_d = W_d·[(1/(1 + λ₁ + λ₂) − ½)T₁ − n·T₂·λ₂/(1 + λ₁ + λ₂)]', () => {
    // W_d = 0.5 W/m, λ₁ = 0.1, λ₂ = 0, T₂ = 0: Δθ_d = 0.5·(1/1.1 − 0.5)·0.096379 = 0.0197139 K.
    const r = freeAirExternalResistance({ externalDiameterM: De, constants: FREE_AIR_CONSTANTS.single, conductorRiseK: 60, T1, T3, lambda1: 0.1, dielectricLossWPerM: 0.5 });
    expect(r.dielectricRiseK).toBeCloseTo(0.0197139, 6);
    // T_int = [T₁ + T₃·1.1]/1.1 = (0.096379 + 0.136104)/1.1 = 0.211348.
    expect(r.internalResistanceKmPerW).toBeCloseTo(0.211348, 5);
  });
});

describe('which row of Table 2 an arrangement in air is (IEC 60287-2-1 §4.2.1, from memory)', () => {
  const air = (circuits: Arrangement['circuits'], extra: Partial<Arrangement> = {}) =>
    freeAirRowFor(parseArrangement({ circuits, placement: { kind: 'air' }, ...extra }));
  const row = (r: ReturnType<typeof freeAirRowFor>) => (r.kind === 'tabulated' ? r.arrangement : `outside: ${r.reason}`);

  it('tabulated rows', () => {
    expect(row(air([{ externalDiameterM: De, formation: 'single', spacing: 'touching' }]))).toBe('single');
    expect(row(air([{ externalDiameterM: De, formation: 'trefoil', spacing: 'touching' }]))).toBe('trefoil-touching');
    expect(row(air([{ externalDiameterM: De, formation: 'flat-horizontal', spacing: 'touching' }]))).toBe('three-touching-horizontal');
    expect(row(air([{ externalDiameterM: De, formation: 'flat-horizontal', cableCount: 2, spacing: 'touching' }]))).toBe('two-touching-horizontal');
    expect(row(air([{ externalDiameterM: De, formation: 'flat-vertical', spacing: 'touching' }]))).toBe('three-touching-vertical');
    // Clearance D_e: axis spacing 2·D_e.
    expect(row(air([{ externalDiameterM: De, formation: 'flat-vertical', spacing: 'spaced', axisSpacingM: 2 * De }]))).toBe('three-spaced-vertical');
    expect(row(air([{ externalDiameterM: De, formation: 'flat-vertical', cableCount: 2, spacing: 'spaced', axisSpacingM: 2 * De }]))).toBe('two-spaced-vertical');
  });

  it('horizontal clearance ≥ 0.75·D_e counts as isolated; below it (but spaced) is outside the table', () => {
    expect(row(air([{ externalDiameterM: De, formation: 'flat-horizontal', spacing: 'spaced', axisSpacingM: 1.75 * De }]))).toBe('single');
    expect(row(air([{ externalDiameterM: De, formation: 'flat-horizontal', spacing: 'spaced', axisSpacingM: 1.5 * De }]))).toMatch(/^outside/);
    // Two spaced rows side by side: outer cables 0.2 − 2·0.05 − 0.025 = 0.075 m apart = 3·D_e clearance.
    expect(
      row(
        air(
          [
            { externalDiameterM: De, formation: 'flat-horizontal', spacing: 'spaced', axisSpacingM: 0.05 },
            { externalDiameterM: De, formation: 'flat-horizontal', spacing: 'spaced', axisSpacingM: 0.05 },
          ],
          { circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.2 } },
        ),
      ),
    ).toBe('single');
  });

  it('refuses what the table does not cover: spaced trefoil, several trefoils, vertical clearance below D_e', () => {
    expect(row(air([{ externalDiameterM: De, formation: 'trefoil', spacing: 'spaced', axisSpacingM: 2 * De }]))).toMatch(/spaced trefoil/);
    expect(
      row(
        air(
          [
            { externalDiameterM: De, formation: 'trefoil', spacing: 'touching' },
            { externalDiameterM: De, formation: 'trefoil', spacing: 'touching' },
          ],
          { circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.3 } },
        ),
      ),
    ).toMatch(/several circuits/);
    expect(row(air([{ externalDiameterM: De, formation: 'flat-vertical', spacing: 'spaced', axisSpacingM: 1.5 * De }]))).toMatch(/^outside/);
  });

  it('a vertical clearance above D_e uses the D_e row and says so', () => {
    const r = air([{ externalDiameterM: De, formation: 'flat-vertical', spacing: 'spaced', axisSpacingM: 3 * De }]);
    expect(r.kind).toBe('tabulated');
    if (r.kind === 'tabulated') expect(r.assumptions.join(' ')).toMatch(/clearance 2\.00·D_e rated with the row tabulated for a clearance of D_e/);
  });
});

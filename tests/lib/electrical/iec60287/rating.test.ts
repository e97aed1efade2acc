import { describe, expect, it } from 'vitest';
import { ElectricalInputError, SizingError } from '@/lib/electrical';
import {
  cableThermalResistances,
  ductAirSpaceResistance,
  ratingEquation,
  rateArrangementInAir,
  rateBuriedArrangement,
  type Arrangement,
  type SingleCoreCable,
} from '@/lib/electrical/iec60287';

// ASSUMED construction (not a catalogue value): 240 mm² Cu, 0.6/1 kV XLPE, PVC sheath, no metallic
// screen; d_c = 18.0 mm, t₁ = 1.7 mm, t₃ = 1.8 mm (IEC 60502-1 nominal thicknesses, from memory),
// D_e = 25.0 mm; R₂₀ = 0.0754 Ω/km (IEC 60228 maximum, from memory).
const lv240: SingleCoreCable = {
  conductor: { material: 'copper', r20OhmPerM: 0.0754e-3, diameterM: 0.018 },
  insulation: { material: 'xlpe', thicknessM: 0.0017 },
  jacket: { thicknessM: 0.0018, thermalResistivityKmPerW: 5.0 },
  externalDiameterM: 0.025,
};
const lv = { cable: lv240, voltageU0V: 230, conductorMaxC: 90 };

// Hand values common to the cases below (IEC 60287-1-1 §2.1, IEC 60287-2-1 §4.1):
// T₁ = 3.5/(2π)·ln(1 + 3.4/18) = 0.0963790; T₃ = 5/(2π)·ln(1 + 3.6/21.4) = 0.1237310 K·m/W.
// R′(90 °C) = 0.0754e-3·1.2751 = 9.614254e-5 Ω/m; y_s = 0.0088350;
// y_p (three cables, s = D_e = 25 mm, d_c/s = 0.72): F = 0.0088350, (d_c/s)² = 0.5184,
// y_p = 0.0088350·0.5184·(0.161741 + 4.233627) = 0.0201231; R = 9.614254e-5·1.0289581 = 9.892665e-5 Ω/m.
const T1 = 0.096379;
const T3 = 0.123731;
const Rtrefoil = 9.892665e-5;

const one = (circuit: Arrangement['circuits'][number], placement: Arrangement['placement']): Arrangement => ({ circuits: [circuit], placement });
const trefoil: Arrangement['circuits'][number] = { externalDiameterM: 0.025, formation: 'trefoil', spacing: 'touching' };

describe('eq. (1) of IEC 60287-1-1 — the equation alone', () => {
  it('T₁ and T₃ of the assumed cable', () => {
    const t = cableThermalResistances(lv240, 230);
    expect(t.T1).toBeCloseTo(T1, 6);
    expect(t.T3).toBeCloseTo(T3, 6);
  });
  it('reduces to √(Δθ/(R·ΣT)) without screen, armour or dielectric losses, and reports no margin honestly', () => {
    const r = ratingEquation({ conductorRiseK: 70, acResistanceOhmPerM: 1e-4, T1: 0.1, T3: 0.1, T4: 0.8 });
    expect(r.currentA).toBeCloseTo(Math.sqrt(70 / (1e-4 * 1.0)), 9);
    const none = ratingEquation({ conductorRiseK: 10, acResistanceOhmPerM: 1e-4, T1: 0.1, T3: 0.1, T4: 0.8, externalRiseK: 12 });
    expect(none.noMargin).toBe(true);
    expect(none.currentA).toBe(0);
  });
  it('with λ₁ and W_d: numerator Δθ − W_d(½T₁ + T₃ + T₄), denominator R[T₁ + (1 + λ₁)(T₃ + T₄)]', () => {
    // Δθ = 65, R = 1e-4, T₁ = 0.3, T₃ = 0.08, T₄ = 2, λ₁ = 0.05, W_d = 1:
    // numerator 65 − (0.15 + 2.08) = 62.77; denominator 1e-4·(0.3 + 1.05·2.08) = 2.484e-4; I = √252697.3 = 502.6901 A.
    const r = ratingEquation({ conductorRiseK: 65, acResistanceOhmPerM: 1e-4, T1: 0.3, T3: 0.08, T4: 2, lambda1: 0.05, dielectricLossWPerM: 1 });
    expect(r.numeratorK).toBeCloseTo(62.77, 10);
    expect(r.currentA).toBeCloseTo(502.6901, 3);
  });
});

describe('240 mm² Cu XLPE in free air, 30 °C, 90 °C — eq. (1) with T₄* of IEC 60287-2-1 §4.2.1, worked by hand', () => {
  it('trefoil touching: T₄* = 1.45469 K·m/W, I = √(60/(9.892665e-5·1.674800)) = 601.78 A', () => {
    // T₄* from the iteration (free-air.test.ts): 1.454685. ΣT = 0.096379 + 0.123731 + 1.454685 = 1.674795.
    const r = rateArrangementInAir({ arrangement: one(trefoil, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50 });
    expect(r.row.kind === 'tabulated' && r.row.arrangement).toBe('trefoil-touching');
    expect(r.electrical.ac.rac).toBeCloseTo(Rtrefoil, 10);
    expect(r.positions[0].freeAir.T4).toBeCloseTo(1.454685, 5);
    expect(r.currentA).toBeCloseTo(601.78, 1);
  });
  it('single isolated cable (no proximity): T₄* = 0.827978, R = 9.614254e-5·1.008835 = 9.699196e-5, I = 768.26 A', () => {
    const r = rateArrangementInAir({ arrangement: one({ externalDiameterM: 0.025, formation: 'single', spacing: 'touching' }, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50 });
    expect(r.positions[0].freeAir.T4).toBeCloseTo(0.827978, 5);
    expect(r.currentA).toBeCloseTo(768.26, 1);
  });
  it('flat touching horizontal (Z, E, g = 0.62, 1.95, 0.25): T₄* = 1.353691, I = 620.79 A', () => {
    // h = 0.62/0.025^0.25 + 1.95 = 3.509217; K_A = 0.0606652; x = 2.680281; T₄* = 1/(π·0.025·3.509217·2.680281) = 1.353691.
    const r = rateArrangementInAir({ arrangement: one({ externalDiameterM: 0.025, formation: 'flat-horizontal', spacing: 'touching' }, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50 });
    expect(r.positions[0].freeAir.T4).toBeCloseTo(1.353691, 5);
    expect(r.currentA).toBeCloseTo(620.79, 1);
  });
  it('the rating does not depend on any solver: the conductor heat I²R equals the free-air law π·D_e·h·Δθ_s^(5/4)', () => {
    const r = rateArrangementInAir({ arrangement: one(trefoil, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50 });
    expect(r.currentA ** 2 * r.electrical.ac.rac).toBeCloseTo(r.positions[0].freeAir.surfaceHeatWPerM, 6);
  });

  it('in the sun (σ = 0.6, H = 1000 W/m²): eq. (1) with −σD_eH·T₄* closes the surface balance I²R + σD_eH = π·D_e·h·Δθ_s^(5/4)', () => {
    const sun = { absorptionCoefficient: 0.6, irradianceWPerM2: 1000 };
    const shaded = rateArrangementInAir({ arrangement: one(trefoil, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50 });
    const r = rateArrangementInAir({ arrangement: one(trefoil, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50, sun });
    expect(r.currentA ** 2 * r.electrical.ac.rac + 0.6 * 0.025 * 1000).toBeCloseTo(r.positions[0].freeAir.surfaceHeatWPerM, 6);
    expect(r.currentA).toBeLessThan(shaded.currentA);
  });

  it('comparison: IEC 60364-5-52 Table B.52.12, Cu XLPE 240 mm², method F (from memory: trefoil 641 A, flat touching 661 A)', () => {
    // Published table values recalled, not read; the table's constructions are not known here.
    // Expectation was a few per cent; the assumed construction gives −6.1 % for both (601.8 A and
    // 620.8 A). Much of it may be D_e: the table's cables are probably thicker than the nominal
    // 25.0 mm assumed (πD_e·h grows ≈ as D_e^0.8 for a trefoil; +2 mm ≈ +4 % current). The band
    // below records that deviation; it is not evidence of agreement within 2 %.
    const tre = rateArrangementInAir({ arrangement: one(trefoil, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50 }).currentA;
    const flat = rateArrangementInAir({ arrangement: one({ externalDiameterM: 0.025, formation: 'flat-horizontal', spacing: 'touching' }, { kind: 'air' }), circuits: lv, ambientC: 30, frequencyHz: 50 }).currentA;
    expect(Math.abs(tre / 641 - 1)).toBeLessThan(0.08);
    expect(Math.abs(flat / 661 - 1)).toBeLessThan(0.08);
  });

  it('refuses an arrangement the free-air table does not cover (OUTSIDE_METHOD)', () => {
    const arrangement: Arrangement = { circuits: [trefoil, trefoil], circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.2 }, placement: { kind: 'air' } };
    try {
      rateArrangementInAir({ arrangement, circuits: lv, ambientC: 30, frequencyHz: 50 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(SizingError);
      expect((e as SizingError).code).toBe('OUTSIDE_METHOD');
    }
  });
});

describe('240 mm² Cu XLPE buried, ρ = 1.0 K·m/W, ground 20 °C, centre at 0.8 m — eq. (1), worked by hand', () => {
  const buried = { kind: 'buried', depthM: 0.8 } as const;
  it('trefoil touching, closed form of IEC 60287-2-1 §4.2.4: T₄ = 2.015871, I = √(70/(9.892665e-5·2.235981)) = 562.55 A', () => {
    const r = rateBuriedArrangement({ arrangement: one(trefoil, buried), circuits: lv, soilResistivityKmPerW: 1, groundC: 20, frequencyHz: 50 });
    expect(r.ownCircuitMethod).toEqual(['closed-form']);
    expect(r.cables[0].effectiveT4).toBeCloseTo(2.015871, 5);
    expect(r.currentA).toBeCloseTo(562.55, 1);
  });
  it('the same by line-source superposition (§4.2.3): hottest cable T₄ = 2.098192 (a base cable), I = 552.47 A', () => {
    const r = rateBuriedArrangement({ arrangement: one(trefoil, buried), circuits: lv, soilResistivityKmPerW: 1, groundC: 20, frequencyHz: 50, ownCircuitMethod: 'superposition' });
    expect(r.governing.index).not.toBe(2); // the apex cable is shallower and cooler
    expect(r.cables.find((k) => k.index === r.governing.index)!.effectiveT4).toBeCloseTo(2.098192, 5);
    expect(r.currentA).toBeCloseTo(552.47, 1);
  });

  it('two circuits in one trench, 0.3 m apart, equally loaded: the hotter circuit drops to 480.48 A (hand superposition)', () => {
    // Governing: circuit 1's base cable nearest circuit 2, at (0.0125, −0.807217). To circuit 2's
    // cables (base at 0.2875 and 0.3125, apex at 0.3): d = 0.275, 0.3, 0.288314 m; images d′ =
    // 1.637688, 1.642071, 1.618522 m; Σ ln(d′/d) = 1.784270 + 1.699931 + 1.725218 = 5.209419;
    // extra T₄ = 5.209419/(2π) = 0.829105 K·m/W.
    // I = √(70/(9.892665e-5·(0.220110 + 2.015871 + 0.829105))) = √(70/3.032186e-4) = 480.48 A
    // against 562.55 A alone: the factor 0.8541 the superposition gives.
    const arrangement: Arrangement = { circuits: [trefoil, trefoil], circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.3 }, placement: buried };
    const r = rateBuriedArrangement({ arrangement, circuits: lv, soilResistivityKmPerW: 1, groundC: 20, frequencyHz: 50 });
    expect(r.currentA).toBeCloseTo(480.48, 1);
    const gov = r.cables.find((k) => k.circuit === r.governing.circuit && k.index === r.governing.index)!;
    // The two inner base cables (circuit 1 right, circuit 2 left) are mirror images: both govern.
    expect([gov.circuit, gov.index]).toSatisfy(([c, i]: number[]) => (c === 0 && i === 1) || (c === 1 && i === 0));
    expect(gov.otherCircuitsRiseK / gov.heatWPerM).toBeCloseTo(0.829105, 5);
    expect(r.currentA / 562.5464).toBeCloseTo(0.8541, 4);
  });

  it('two circuits, the neighbour at a given 400 A: its heat 400²·R = 15.82826 W/m per cable raises the governing cable by 13.1233 K → 507.08 A', () => {
    // ΔT = 15.82826·0.829105 = 13.12329 K (losses of the neighbour at its 90 °C limit, an upper bound);
    // I = √((70 − 13.12329)/(9.892665e-5·2.235981)) = 507.08 A.
    const arrangement: Arrangement = { circuits: [trefoil, { ...trefoil, currentA: 400 }], circuitSpacing: { direction: 'horizontal', axisSpacingM: 0.3 }, placement: buried };
    const r = rateBuriedArrangement({ arrangement, circuits: lv, soilResistivityKmPerW: 1, groundC: 20, frequencyHz: 50 });
    expect(r.governing.circuit).toBe(0);
    expect(r.governing.index).toBe(1);
    expect(r.cables.find((k) => k.index === 1)!.otherCircuitsRiseK).toBeCloseTo(13.12329, 4);
    expect(r.currentA).toBeCloseTo(507.08, 1);
    expect(r.assumptions.join(' ')).toMatch(/conductor limit temperature/);
  });

  it('one cable alone in a PVC duct 50/56 mm: T₄′ + T₄″ + T₄‴ with θ_m iterated — 641.16 A', () => {
    // T₄″ = 6/(2π)·ln(56/50) = 0.108221; T₄‴ = ln(u + √(u² − 1))/(2π), u = 1.6/0.056 = 28.5714: 0.643821.
    // T₄′ = 1.87/[1 + 0.1·(0.312 + 0.0037·θ_m)·25]; iterating θ_m = 90 − W(T₁ + T₃) − ½W·T₄′
    // settles at θ_m = 65.605 °C, T₄′ = 0.783462. R = 9.699196e-5 (no proximity);
    // I = √(70/(9.699196e-5·(0.220110 + 0.783462 + 0.108221 + 0.643821))) = 641.16 A.
    const arrangement = one({ externalDiameterM: 0.025, formation: 'single', spacing: 'touching' }, { kind: 'ducts', depthM: 0.8, duct: { material: 'pvc', innerDiameterM: 0.05, outerDiameterM: 0.056 } });
    const r = rateBuriedArrangement({ arrangement, circuits: lv, soilResistivityKmPerW: 1, groundC: 20, frequencyHz: 50 });
    expect(r.cables[0].ductAirSpaceT4).toBeCloseTo(0.783462, 5);
    expect(ductAirSpaceResistance({ material: 'pvc', cableDiameterM: 0.025, meanAirTemperatureC: 65.6046 }).T4).toBeCloseTo(0.783462, 5);
    expect(r.currentA).toBeCloseTo(641.16, 1);
  });

  it('trefoil in a 0.5 × 0.5 m backfill of 1.0 K·m/W in soil of 2.5: T₄ = 2.015871 + 3/(2π)·1.5·G_b → 451.22 A', () => {
    // r_b = 0.25·e^{½(4/π − 1)ln 2} = 0.274832 m; G_b = arccosh(0.8/0.274832) = 1.730697;
    // correction 3/(2π)·1.5·1.730697 = 1.239520; T₄ = 3.255391; I = √(70/(9.892665e-5·3.475501)) = 451.22 A
    // (the same trefoil in soil of 2.5 throughout: 366.78 A).
    const arrangement = one(trefoil, { kind: 'backfill', depthM: 0.8, bank: { widthM: 0.5, heightM: 0.5, centreDepthM: 0.8, resistivityKmPerW: 1.0 } });
    const r = rateBuriedArrangement({ arrangement, circuits: lv, soilResistivityKmPerW: 2.5, groundC: 20, frequencyHz: 50 });
    expect(r.cables[0].effectiveT4).toBeCloseTo(3.255391, 5);
    expect(r.currentA).toBeCloseTo(451.22, 1);
  });

  it('refuses a circuit table that does not match the arrangement, and an arrangement with nothing to rate', () => {
    expect(() =>
      rateBuriedArrangement({ arrangement: one({ ...trefoil, externalDiameterM: 0.03 }, buried), circuits: lv, soilResistivityKmPerW: 1, groundC: 20, frequencyHz: 50 }),
    ).toThrow(ElectricalInputError);
    expect(() =>
      rateBuriedArrangement({ arrangement: one({ ...trefoil, currentA: 100 }, buried), circuits: lv, soilResistivityKmPerW: 1, groundC: 20, frequencyHz: 50 }),
    ).toThrow(/leave the current/);
  });
});

// ASSUMED construction (not a check value): 12/20 kV, 240 mm² Cu XLPE, 35 mm² Cu wire screen
// (screens.test.ts): d_c = 18.4 mm, t₁ = 6.5 mm, d = 32.5 mm, PE jacket 2.5 mm (ρ = 3.5), D_e = 38.5 mm.
const mv240: SingleCoreCable = {
  conductor: { material: 'copper', r20OhmPerM: 0.0754e-3, diameterM: 0.0184 },
  insulation: { material: 'xlpe', thicknessM: 0.0065 },
  screen: { material: 'copper', sectionMm2: 35, meanDiameterM: 0.0325, thicknessM: 0.0008, bonding: 'solid' },
  jacket: { thicknessM: 0.0025, thermalResistivityKmPerW: 3.5 },
  externalDiameterM: 0.0385,
};
const mvTrefoil: Arrangement['circuits'][number] = { externalDiameterM: 0.0385, formation: 'trefoil', spacing: 'touching' };

describe('12/20 kV trefoil, screens bonded at both ends — eq. (1) with λ₁′ iterated on the screen temperature', () => {
  // T₁ = 3.5/(2π)·ln(1 + 13/18.4) = 0.297715; T₃ = 3.5/(2π)·ln(1 + 5/33.5) = 0.0774917; R = 9.782684e-5.
  // λ₁′ = (R_s/R)/(1 + (R_s/X)²), X = 5.419658e-5, R_s = 4.926e-4·[1 + 0.00393(θ_s − 20)],
  // θ_s = 90 − I²R·T₁ (W_d not counted at 12 kV). Iterating by hand (three passes suffice):
  it('buried, ρ = 1.5, 1.0 m: T₄ = (1.5/π)·1.5·[ln(103.896) − 0.630] = 2.874380; λ₁′ = 0.048351 at θ_s = 83.857 °C; I = 459.27 A', () => {
    // I = √(70/(R·T₁ + R·(1 + λ₁′)·(T₃ + T₄))) = √(70/(9.782684e-5·(0.297715 + 1.048351·2.951872))) = 459.27 A.
    const r = rateBuriedArrangement({
      arrangement: one(mvTrefoil, { kind: 'buried', depthM: 1.0 }),
      circuits: { cable: mv240, voltageU0V: 12000, conductorMaxC: 90 },
      soilResistivityKmPerW: 1.5,
      groundC: 20,
      frequencyHz: 50,
    });
    expect(r.cables[0].lambda1).toBeCloseTo(0.048351, 5);
    expect(r.currentA).toBeCloseTo(459.27, 1);
  });
  it('in air, 30 °C: h = 3.091531, T₄* = 1.035541, λ₁′ = 0.049272 at θ_s = 77.81 °C, I = 646.91 A', () => {
    const r = rateArrangementInAir({ arrangement: one(mvTrefoil, { kind: 'air' }), circuits: { cable: mv240, voltageU0V: 12000, conductorMaxC: 90 }, ambientC: 30, frequencyHz: 50 });
    expect(r.positions[0].freeAir.h).toBeCloseTo(3.091531, 5);
    expect(r.positions[0].lambda1).toBeCloseTo(0.049272, 5);
    expect(r.positions[0].screenTemperatureC).toBeCloseTo(77.81, 1);
    expect(r.currentA).toBeCloseTo(646.91, 1);
  });
  it('flat in air, spaced 77 mm (clearance D_e ≥ 0.75·D_e: isolated cables), not transposed: the outer cable governs with the larger of λ₁₁′, λ₁₃′', () => {
    const r = rateArrangementInAir({
      arrangement: one({ externalDiameterM: 0.0385, formation: 'flat-horizontal', spacing: 'spaced', axisSpacingM: 0.077 }, { kind: 'air' }),
      circuits: { cable: mv240, voltageU0V: 12000, conductorMaxC: 90 },
      ambientC: 30,
      frequencyHz: 50,
    });
    expect(r.row.kind === 'tabulated' && r.row.arrangement).toBe('single');
    expect(r.governing).toBe('flat-outer');
    const outer = r.positions.find((p) => p.position === 'flat-outer')!;
    const centre = r.positions.find((p) => p.position === 'flat-centre')!;
    // At 80 °C the hand values were 0.284161 (lagging) and 0.114928 (centre); at the settled screen
    // temperatures they are close to these and keep their order.
    expect(outer.lambda1).toBeGreaterThan(0.25);
    expect(centre.lambda1).toBeLessThan(0.13);
    expect(outer.screenBasis).toMatch(/larger of λ₁₁′ and λ₁₃′/);
  });

  it('single-point bonding lowers λ₁ to the eddy value and raises the rating', () => {
    const solid = rateBuriedArrangement({ arrangement: one(mvTrefoil, { kind: 'buried', depthM: 1.0 }), circuits: { cable: mv240, voltageU0V: 12000, conductorMaxC: 90 }, soilResistivityKmPerW: 1.5, groundC: 20, frequencyHz: 50 });
    const single = rateBuriedArrangement({
      arrangement: one(mvTrefoil, { kind: 'buried', depthM: 1.0 }),
      circuits: { cable: { ...mv240, screen: { ...mv240.screen!, bonding: 'single-point' } }, voltageU0V: 12000, conductorMaxC: 90 },
      soilResistivityKmPerW: 1.5,
      groundC: 20,
      frequencyHz: 50,
    });
    expect(single.cables[0].lambda1).toBeLessThan(0.012);
    expect(single.currentA).toBeGreaterThan(solid.currentA);
  });
  it('a screened single-core cable laid alone is refused (its screen losses depend on the unknown return path)', () => {
    expect(() =>
      rateBuriedArrangement({
        arrangement: one({ externalDiameterM: 0.0385, formation: 'single', spacing: 'touching' }, { kind: 'buried', depthM: 1.0 }),
        circuits: { cable: mv240, voltageU0V: 12000, conductorMaxC: 90 },
        soilResistivityKmPerW: 1.5,
        groundC: 20,
        frequencyHz: 50,
      }),
    ).toThrow(/return conductor/);
  });
});

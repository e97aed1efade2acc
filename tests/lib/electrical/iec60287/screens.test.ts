import { describe, expect, it } from 'vitest';
import { acResistance, CONDUCTOR_MATERIALS, ElectricalInputError } from '@/lib/electrical';
import {
  circulatingCurrentLossFactor,
  dielectricLoss,
  eddyCurrentLossFactor,
  screenResistance,
  screenReactance,
} from '@/lib/electrical/iec60287';

// ASSUMED construction (not a check value from any table): 12/20 kV single-core, 240 mm² Cu
// (R₂₀ = 0.0754 Ω/km, IEC 60228 maximum, from memory), d_c = 18.4 mm, XLPE with its semiconducting
// layers t₁ = 6.5 mm (D_i = 31.4 mm), 35 mm² copper wire screen of 0.8 mm wires with a mean
// diameter d = 32.5 mm, PE jacket 2.5 mm, D_e = 38.5 mm. Trefoil touching: s = 38.5 mm. 50 Hz.
const f = 50;
const dc = 0.0184;
const d = 0.0325;
const s = 0.0385;

// R at 90 °C (IEC 60287-1-1 §2.1, with lib/electrical/resistance.ts): R′ = 0.0754e-3·1.2751 =
// 9.614254e-5 Ω/m; x_s² = 8π·50·1e-7/R′ = 1.307056, y_s = 1.708396/(192 + 1.366717) = 0.0088350;
// y_p (trefoil, d_c/s = 0.477922, ratio² = 0.228409): 0.0088350·0.228409·(0.071264 + 4.233627)
// = 0.0086838; R = 9.614254e-5·1.0175188 = 9.782684e-5 Ω/m.
const R = acResistance({
  r20: 0.0754e-3,
  alpha20: CONDUCTOR_MATERIALS.copper.alpha20PerK,
  temperature: 90,
  frequency: f,
  proximity: { conductorDiameter: dc, spacing: s, cables: 3 },
}).rac;

describe('screen resistance and reactance — IEC 60287-1-1 §2.3 (from memory)', () => {
  it('R_s = ρ₂₀/A·[1 + α₂₀(θ − 20)]: 35 mm² copper at 80 °C = 4.926e-4·1.2358 = 6.087551e-4 Ω/m', () => {
    // ρ₂₀ = 1.7241e-8 Ω·m (IEC 60287-1-1 Table 1): 1.7241e-8/35e-6 = 4.926000e-4 Ω/m.
    expect(screenResistance({ material: 'copper', sectionMm2: 35, temperatureC: 80 })).toBeCloseTo(6.0875508e-4, 10);
  });
  it('X = 2ω·10⁻⁷·ln(2s/d) = 6.283185e-5·ln(2.369231) = 6.283185e-5·0.862565 = 5.419658e-5 Ω/m', () => {
    expect(screenReactance({ frequencyHz: f, axisSpacingM: s, meanDiameterM: d })).toBeCloseTo(5.419658e-5, 10);
  });
});

describe('λ₁′ of a solidly bonded trefoil — IEC 60287-1-1 §2.3.1, worked by hand', () => {
  it('λ₁′ = (R_s/R)/[1 + (R_s/X)²] = 6.222782/(1 + 11.232353²) = 0.0489344 for the assumed 240/35 mm² construction', () => {
    // R = 9.782684e-5 Ω/m (above), R_s(80 °C) = 6.087551e-4: R_s/R = 6.222782; R_s/X = 11.232353;
    // 1 + 126.16575 = 127.16575; λ₁′ = 0.0489344.
    expect(R).toBeCloseTo(9.782684e-5, 10);
    const Rs = screenResistance({ material: 'copper', sectionMm2: 35, temperatureC: 80 });
    const r = circulatingCurrentLossFactor({ formation: 'trefoil', conductorResistanceOhmPerM: R, screenResistanceOhmPerM: Rs, frequencyHz: f, axisSpacingM: s, meanDiameterM: d });
    expect(r.all).toBeCloseTo(0.0489344, 6);
  });

  it('flat, not transposed, s = 77 mm: outer lagging, outer leading and centre by the P, Q, X_m formulas', () => {
    // Same cable, flat spaced s = 0.077 m. R (y_p at s = 0.077) = 9.719809e-5 Ω/m.
    // X = 6.283185e-5·ln(2·0.077/0.0325) = 9.774830e-5; X_m = 6.283185e-5·ln 2 = 4.355172e-5;
    // P = X + X_m = 1.413000e-4; Q = X − X_m/3 = 8.323106e-5; R_s = 6.087551e-4.
    // ¾P²/(R_s² + P²) = 0.75·1.996570e-8/(3.705827e-7 + 1.996570e-8) = 0.0383434;
    // ¼Q²/(R_s² + Q²) = 0.25·6.927409e-9/3.775101e-7 = 0.0045876; sum 0.0429310;
    // cross = 2R_s·P·Q·X_m/(√3(R_s² + P²)(R_s² + Q²)) = 0.0048862;
    // R_s/R = 6.263036: lagging 6.263036·0.0478172 = 0.284161; leading 6.263036·0.0380448 = 0.253573;
    // centre (R_s/R)·Q²/(R_s² + Q²) = 6.263036·0.0183503 = 0.114928.
    const Rf = acResistance({ r20: 0.0754e-3, alpha20: 3.93e-3, temperature: 90, frequency: f, proximity: { conductorDiameter: dc, spacing: 0.077, cables: 3 } }).rac;
    expect(Rf).toBeCloseTo(9.719809e-5, 10);
    const Rs = screenResistance({ material: 'copper', sectionMm2: 35, temperatureC: 80 });
    const r = circulatingCurrentLossFactor({ formation: 'flat', conductorResistanceOhmPerM: Rf, screenResistanceOhmPerM: Rs, frequencyHz: f, axisSpacingM: 0.077, meanDiameterM: d });
    expect(r.P).toBeCloseTo(1.413e-4, 9);
    expect(r.Q).toBeCloseTo(8.323106e-5, 10);
    expect(r.outerLagging).toBeCloseTo(0.284161, 5);
    expect(r.outerLeading).toBeCloseTo(0.253573, 5);
    expect(r.centre).toBeCloseTo(0.114928, 5);
    // Regularly transposed: X₁ = 6.283185e-5·ln(2·∛2·0.077/0.0325) = 1.122655e-4;
    // λ₁′ = 6.263036/(1 + (6.087551e-4/1.122655e-4)²) = 6.263036/30.40304 = 0.206000.
    const t = circulatingCurrentLossFactor({ formation: 'flat-transposed', conductorResistanceOhmPerM: Rf, screenResistanceOhmPerM: Rs, frequencyHz: f, axisSpacingM: 0.077, meanDiameterM: d });
    expect(t.all).toBeCloseTo(0.2060003, 5);
  });
});

describe('λ₁″ eddy currents of single-point / cross-bonded screens — IEC 60287-1-1 §2.3.6 (from memory)', () => {
  it('trefoil, the assumed 240/35 mm² cable at 80 °C: m, β₁, g_s, λ₀, Δ₁ and λ₁″ by hand', () => {
    // ρ_s(80 °C) = 1.7241e-8·1.2358 = 2.130643e-8 Ω·m; m = ω·1e-7/R_s = 3.141593e-5/6.087551e-4 = 0.0516068;
    // β₁ = √(4π·314.1593/(1e7·2.130643e-8)) = √(3947.842/0.2130643) = 136.1208 /m;
    // D_s = d + t_s = 0.0333 m, t_s = 0.0008 m: g_s = 1 + (0.0008/0.0333)^1.74·(136.1208·0.0333 − 1.6) = 1.0044628;
    // r = d/(2s) = 0.422078; λ₀ = 3·m²/(1 + m²)·r² = 3·0.0026564·0.178150 = 0.0014196;
    // Δ₁ = (1.14·m^2.45 + 0.33)·r^(0.92m + 1.66) = (0.0008258 + 0.33)·0.229268 = 0.0758458;
    // (β₁t_s)⁴/12 = 0.1088966⁴/12 = 1.17226e-5;
    // λ₁″ = 6.222782·[1.0044628·0.0014196·1.0758458 + 1.17226e-5] = 0.0096192.
    const Rs = screenResistance({ material: 'copper', sectionMm2: 35, temperatureC: 80 });
    const r = eddyCurrentLossFactor({
      formation: 'trefoil',
      conductorResistanceOhmPerM: R,
      screenResistanceOhmPerM: Rs,
      screenResistivityOhmM: 1.7241e-8 * (1 + 3.93e-3 * 60),
      frequencyHz: f,
      axisSpacingM: s,
      meanDiameterM: d,
      screenOuterDiameterM: d + 0.0008,
      screenThicknessM: 0.0008,
    });
    expect(r.m).toBeCloseTo(0.0516068, 6);
    expect(r.beta1).toBeCloseTo(136.1208, 3);
    expect(r.gs).toBeCloseTo(1.0044628, 6);
    expect(r.trefoil!.lambda0).toBeCloseTo(0.0014196, 6);
    expect(r.trefoil!.delta1).toBeCloseTo(0.0758458, 6);
    expect(r.trefoil!.lambda1).toBeCloseTo(0.0096192, 6);
    // Eddy losses are far below the circulating losses of the same screen bonded at both ends.
    expect(r.trefoil!.lambda1).toBeLessThan(0.0489344 / 4);
  });

  it('flat: centre and outer differ as the clause says (outer has the Δ₂ term, centre the larger λ₀)', () => {
    const Rs = screenResistance({ material: 'copper', sectionMm2: 35, temperatureC: 80 });
    const r = eddyCurrentLossFactor({
      formation: 'flat',
      conductorResistanceOhmPerM: R,
      screenResistanceOhmPerM: Rs,
      screenResistivityOhmM: 2.130643e-8,
      frequencyHz: f,
      axisSpacingM: 0.077,
      meanDiameterM: d,
      screenOuterDiameterM: 0.0333,
      screenThicknessM: 0.0008,
    });
    // λ₀ centre/outer = 6/1.5 = 4 exactly.
    expect(r.centre!.lambda0 / r.outer!.lambda0).toBeCloseTo(4, 12);
    expect(r.centre!.delta2).toBe(0);
    expect(r.outer!.delta2).toBeGreaterThan(0);
  });
});

describe('dielectric losses — IEC 60287-1-1 §2.2 and Table 3 (from memory)', () => {
  it('C = ε/(18·ln(D_i/d_c))·1e-9 and W_d = ωCU₀²tanδ; XLPE at U₀ = 12 kV computed but not counted (threshold 127 kV)', () => {
    // ln(31.4/18.4) = 0.534466; C = 2.5/(18·0.534466)·1e-9 = 2.598690e-10 F/m;
    // W_d = 314.1593·2.598690e-10·(12e3)²·0.004 = 0.0470248 W/m.
    const r = dielectricLoss({ insulation: 'xlpe', voltageU0V: 12000, frequencyHz: f, conductorDiameterM: dc, insulationDiameterM: 0.0314 });
    expect(r.capacitanceFPerM).toBeCloseTo(2.59869e-10, 15);
    expect(r.computedLossWPerM).toBeCloseTo(0.0470248, 6);
    expect(r.counts).toBe(false);
    expect(r.lossWPerM).toBe(0);
    expect(r.reason).toMatch(/below 127\.0 kV/);
  });
  it('PVC at U₀ = 6.35 kV counts (threshold 6 kV); EPR at 63.5 kV counts, at 36 kV not', () => {
    const pvc = dielectricLoss({ insulation: 'pvc', voltageU0V: 6350, frequencyHz: f, conductorDiameterM: 0.0184, insulationDiameterM: 0.0284 });
    expect(pvc.counts).toBe(true);
    // ε = 8, tan δ = 0.1: C = 8/(18·ln(28.4/18.4))·1e-9 = 1.023975e-9 F/m;
    // W_d = 314.1593·1.023975e-9·6350²·0.1 = 1.297139 W/m.
    expect(pvc.lossWPerM).toBeCloseTo(1.297139, 6);
    expect(dielectricLoss({ insulation: 'epr', voltageU0V: 63500, frequencyHz: f, conductorDiameterM: 0.03, insulationDiameterM: 0.06 }).counts).toBe(true);
    expect(dielectricLoss({ insulation: 'epr', voltageU0V: 36000, frequencyHz: f, conductorDiameterM: 0.03, insulationDiameterM: 0.06 }).counts).toBe(false);
  });
  it('refuses an insulation diameter not above the conductor, naming the field', () => {
    try {
      dielectricLoss({ insulation: 'xlpe', voltageU0V: 1000, frequencyHz: f, conductorDiameterM: 0.02, insulationDiameterM: 0.02 });
      expect.unreachable();
    } catch (e) {
      expect((e as ElectricalInputError).field).toBe('insulationDiameterM');
    }
  });
});

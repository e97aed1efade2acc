import { describe, expect, it } from 'vitest';
import {
  acResistance,
  barAcResistanceRatio,
  ElectricalInputError,
  planeConductorRatio,
  proximityEffectFactor,
  resistanceAt,
  skinEffect,
  skinEffectFactor,
  CONDUCTOR_MATERIALS,
} from '@/lib/electrical';

describe('resistance at temperature — IEC 60287-1-1 eq. (2), worked by hand', () => {
  it('copper 240 mm², R20 = 0.0754 Ω/km (IEC 60228 Table 2, from memory) at 90 °C', () => {
    // 1 + 0.00393·(90 − 20) = 1.2751; 0.0754 Ω/km × 1.2751 = 0.09614254 Ω/km.
    const r = resistanceAt({ r20: 0.0754e-3, alpha20: CONDUCTOR_MATERIALS.copper.alpha20PerK, temperature: 90 });
    expect(r).toBeCloseTo(0.09614254e-3, 12);
  });

  it('aluminium 240 mm², R20 = 0.125 Ω/km (IEC 60228, from memory) at 90 °C', () => {
    // 1 + 0.00403·70 = 1.2821; 0.125 × 1.2821 = 0.1602625 Ω/km.
    const r = resistanceAt({ r20: 0.125e-3, alpha20: CONDUCTOR_MATERIALS.aluminium.alpha20PerK, temperature: 90 });
    expect(r).toBeCloseTo(0.1602625e-3, 12);
  });

  it('returns R20 at 20 °C and rejects bad input naming the field', () => {
    expect(resistanceAt({ r20: 1e-4, alpha20: 3.93e-3, temperature: 20 })).toBe(1e-4);
    const bad = (args: Parameters<typeof resistanceAt>[0], field: string) => {
      try {
        resistanceAt(args);
        expect.unreachable('should have thrown');
      } catch (e) {
        expect(e).toBeInstanceOf(ElectricalInputError);
        expect((e as ElectricalInputError).field).toBe(field);
      }
    };
    bad({ r20: -1, alpha20: 3.93e-3, temperature: 20 }, 'r20');
    bad({ r20: 1e-4, alpha20: Number.NaN, temperature: 20 }, 'alpha20');
    bad({ r20: 1e-4, alpha20: 3.93e-3, temperature: Number.POSITIVE_INFINITY }, 'temperature');
    bad({ r20: 1e-4, alpha20: 3.93e-3, temperature: -260 }, 'temperature');
  });
});

describe('skin effect — IEC 60287-1-1 §2.1.2', () => {
  it('240 mm² copper at 90 °C, 50 Hz, R20 = 0.0754 Ω/km: y_s ≈ 0.0088 (worked by hand, references.md)', () => {
    const resistance = resistanceAt({ r20: 0.0754e-3, alpha20: 3.93e-3, temperature: 90 });
    const ys = skinEffectFactor({ resistance, frequency: 50 });
    expect(Math.abs(ys - 0.0088)).toBeLessThan(0.00005);
  });

  it('is zero at DC, grows with frequency and with section (lower resistance)', () => {
    expect(skinEffectFactor({ resistance: 1e-4, frequency: 0 })).toBe(0);
    expect(skinEffectFactor({ resistance: 1e-4, frequency: 60 })).toBeGreaterThan(
      skinEffectFactor({ resistance: 1e-4, frequency: 50 }),
    );
    expect(skinEffectFactor({ resistance: 0.5e-4, frequency: 50 })).toBeGreaterThan(
      skinEffectFactor({ resistance: 1e-4, frequency: 50 }),
    );
  });

  it('the three IEC expressions nearly meet at x_s = 2.8 and 3.8 (from memory of IEC 60287-1-1 — checks the recall)', () => {
    // x_s² = 8πf·1e-7/R' → R' = 8πf·1e-7/x_s².
    const at = (xs: number) => skinEffect({ resistance: (8 * Math.PI * 50e-7) / (xs * xs), frequency: 50 });
    const below28 = at(2.8 - 1e-9);
    const above28 = at(2.8 + 1e-9);
    expect(below28.range).toBe('xs<=2.8');
    expect(above28.range).toBe('2.8<xs<=3.8');
    expect(Math.abs(below28.ys - above28.ys)).toBeLessThan(0.002);
    const below38 = at(3.8 - 1e-9);
    const above38 = at(3.8 + 1e-9);
    expect(above38.range).toBe('xs>3.8');
    expect(Math.abs(below38.ys - above38.ys)).toBeLessThan(0.003);
  });
});

describe('proximity effect — IEC 60287-1-1 §2.1.4.1, three single-core cables', () => {
  it('matches the formula worked by hand for 240 mm² Cu at 90 °C, 50 Hz, d_c/s = 0.5', () => {
    // R' = 0.09614254e-3 Ω/m; x_p² = 8π·50·1e-7/R' = 1.2566371e-4/9.614254e-5 = 1.307056;
    // x_p⁴ = 1.708396; F = 1.708396/(192 + 0.8·1.708396) = 1.708396/193.366717 = 0.00883500;
    // (d_c/s)² = 0.25; y_p = F·0.25·(0.312·0.25 + 1.18/(F + 0.27))
    //      = 0.00220875·(0.078 + 1.18/0.278835) = 0.00220875·4.309893 = 0.0095195.
    const resistance = resistanceAt({ r20: 0.0754e-3, alpha20: 3.93e-3, temperature: 90 });
    const yp = proximityEffectFactor({ resistance, frequency: 50, conductorDiameter: 0.0184, spacing: 0.0368 });
    expect(yp).toBeCloseTo(0.0095195, 6);
  });

  it('falls as spacing grows and refuses a spacing below the conductor diameter', () => {
    const base = { resistance: 1e-4, frequency: 50, conductorDiameter: 0.02 };
    expect(proximityEffectFactor({ ...base, spacing: 0.06 })).toBeLessThan(proximityEffectFactor({ ...base, spacing: 0.03 }));
    expect(() => proximityEffectFactor({ ...base, spacing: 0.01 })).toThrow(ElectricalInputError);
  });

  it('acResistance combines R\'(1 + y_s + y_p)', () => {
    const r = acResistance({
      r20: 0.0754e-3,
      alpha20: 3.93e-3,
      temperature: 90,
      frequency: 50,
      proximity: { conductorDiameter: 0.0184, spacing: 0.0368 },
    });
    expect(r.rac).toBeCloseTo(r.rdc * (1 + r.ys + r.yp), 15);
    expect(r.acFactor).toBeGreaterThan(1.018);
    expect(r.acFactor).toBeLessThan(1.019);
  });
});

describe('rectangular bar AC/DC ratio — plane-conductor solution (Dowell 1966, m = 1)', () => {
  it('equals (ξ/2)(sinh ξ + sin ξ)/(cosh ξ − cos ξ) at ξ = 1, worked by hand', () => {
    // sinh 1 = 1.1752012, sin 1 = 0.8414710, cosh 1 = 1.5430806, cos 1 = 0.5403023:
    // 0.5·2.0166722/1.0027783 = 1.0055424.
    expect(planeConductorRatio(1)).toBeCloseTo(1.0055424, 6);
  });

  it('tends to 1 + ξ⁴/180 for thin bars and ξ/2 for thick ones (limits of the same expression)', () => {
    expect(planeConductorRatio(0)).toBe(1);
    expect(planeConductorRatio(0.019)).toBeCloseTo(1 + 0.019 ** 4 / 180, 14);
    // Continuity across the switch-over points used to avoid cancellation/overflow.
    expect(Math.abs(planeConductorRatio(0.0199999) - planeConductorRatio(0.0200001))).toBeLessThan(1e-12);
    expect(Math.abs(planeConductorRatio(39.9999) - planeConductorRatio(40.0001))).toBeLessThan(1e-3);
  });

  it('is marked a lower bound and uses the catalogue resistance for the skin depth', () => {
    // 100 × 10 mm copper bar, R at temperature from R20 = ρ20/A.
    const resistance = resistanceAt({ r20: 1.7241e-8 / (0.1 * 0.01), alpha20: 3.93e-3, temperature: 70 });
    const res = barAcResistanceRatio({ resistance, width: 0.1, thickness: 0.01, frequency: 50 });
    // δ = √(ρ/(π f μ0)) with ρ = R·w·t.
    const rho = resistance * 0.1 * 0.01;
    expect(res.skinDepthM).toBeCloseTo(Math.sqrt(rho / (Math.PI * 50 * 4 * Math.PI * 1e-7)), 12);
    expect(res.lowerBound).toBe(true);
    expect(res.ratio).toBeGreaterThan(1);
    expect(barAcResistanceRatio({ resistance, width: 0.1, thickness: 0.01, frequency: 0 }).ratio).toBe(1);
  });
});

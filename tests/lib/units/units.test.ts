import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  awgDiameterMm,
  awgLabel,
  awgNumber,
  awgToMm2,
  btuPerLbFToJoulePerKgKelvin,
  celsiusCmPerWattToKelvinMetrePerWatt,
  celsiusToFahrenheit,
  convertFromSi,
  convertToSi,
  fahrenheitRiseToKelvinRise,
  fahrenheitToCelsius,
  feetToMetres,
  formatQuantity,
  inchesToMm,
  kcmilToMm2,
  kelvinRiseToFahrenheitRise,
  kgPerMetreToLbPerFoot,
  kgPerM3ToLbPerFt3,
  lbPerFootToKgPerMetre,
  metresToFeet,
  mm2ToAwgNumber,
  mm2ToKcmil,
  mmToInches,
  ohmPerKftToOhmPerKm,
  ohmPerKmToOhmPerKft,
  QUANTITIES,
  wattPerFootToWattPerMetre,
  wattPerMetreKelvinToBtuPerHourFootF,
  wattPerMetreToWattPerFoot,
  type Quantity,
} from '@/lib/units';

describe('temperature — definition of the Fahrenheit scale (°F = °C × 9/5 + 32)', () => {
  it('water freezes at 32 °F and boils at 212 °F; the scales meet at −40', () => {
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(fahrenheitToCelsius(212)).toBe(100);
  });
  it('90 °C (XLPE continuous limit) is 194 °F; a 50 K rise is a 90 °F rise (no offset)', () => {
    expect(celsiusToFahrenheit(90)).toBeCloseTo(194, 12);
    expect(kelvinRiseToFahrenheitRise(50)).toBeCloseTo(90, 12);
    expect(fahrenheitRiseToKelvinRise(90)).toBeCloseTo(50, 12);
  });
});

describe('length and area — exact definitions (1 in = 25.4 mm, 1 ft = 0.3048 m)', () => {
  it('converts lengths', () => {
    expect(mmToInches(25.4)).toBe(1);
    expect(inchesToMm(4)).toBeCloseTo(101.6, 12);
    expect(metresToFeet(0.3048)).toBe(1);
    expect(feetToMetres(1000)).toBeCloseTo(304.8, 10);
  });
  it('1 kcmil = 0.5067 mm²; 500 kcmil = 253.4 mm² (NEC Chapter 9 Table 8, from memory)', () => {
    expect(kcmilToMm2(1)).toBeCloseTo(0.506707, 6);
    expect(kcmilToMm2(500)).toBeCloseTo(253.4, 1);
    expect(kcmilToMm2(250)).toBeCloseTo(127, 0);
    expect(mm2ToKcmil(kcmilToMm2(750))).toBeCloseTo(750, 9);
  });
});

describe('AWG — ASTM B258 definition d = 0.127 mm × 92^((36 − n)/39)', () => {
  it('reads the labels', () => {
    expect(awgNumber('14')).toBe(14);
    expect(awgNumber('1/0')).toBe(0);
    expect(awgNumber('4/0')).toBe(-3);
    expect(awgNumber('0000')).toBe(-3);
    expect(awgLabel(-3)).toBe('4/0');
    expect(awgLabel(12)).toBe('12');
    expect(() => awgNumber('5/0')).toThrow(RangeError);
  });
  it('gauge 36 is 0.005 in and gauge 0000 is 0.46 in (the two defining points)', () => {
    expect(mmToInches(awgDiameterMm(36))).toBeCloseTo(0.005, 9);
    expect(mmToInches(awgDiameterMm('4/0'))).toBeCloseTo(0.46, 9);
  });
  it('matches the areas of NEC Chapter 9 Table 8 (from memory): 14 AWG 4110 cmil, 10 AWG 10380 cmil, 1/0 105600 cmil, 4/0 211600 cmil', () => {
    // Table 8 lists areas in circular mils rounded to 3–4 significant figures.
    expect(mm2ToKcmil(awgToMm2(14))).toBeCloseTo(4.11, 2);
    expect(mm2ToKcmil(awgToMm2(10))).toBeCloseTo(10.38, 1);
    expect(mm2ToKcmil(awgToMm2('1/0'))).toBeCloseTo(105.6, 0);
    expect(mm2ToKcmil(awgToMm2('4/0'))).toBeCloseTo(211.6, 0);
    expect(awgToMm2('4/0')).toBeCloseTo(107.2, 1);
  });
  it('area → gauge number inverts gauge → area', () => {
    fc.assert(fc.property(fc.integer({ min: -3, max: 40 }), (n) => Math.abs(mm2ToAwgNumber(awgToMm2(n)) - n) < 1e-9));
  });
});

describe('per-length and thermal quantities — exact factors', () => {
  it('Ω/km ↔ Ω/kft: 1000 ft = 0.3048 km', () => {
    // IEC 60228 copper 240 mm²: 0.0754 Ω/km → 0.02298 Ω/kft.
    expect(ohmPerKmToOhmPerKft(0.0754)).toBeCloseTo(0.02298192, 10);
    expect(ohmPerKftToOhmPerKm(0.3048)).toBeCloseTo(1, 12);
  });
  it('W/m ↔ W/ft and kg/m ↔ lb/ft (1 lb/ft = 1.488164 kg/m)', () => {
    expect(wattPerMetreToWattPerFoot(100)).toBeCloseTo(30.48, 10);
    expect(wattPerFootToWattPerMetre(30.48)).toBeCloseTo(100, 10);
    expect(lbPerFootToKgPerMetre(1)).toBeCloseTo(1.488164, 6);
    expect(kgPerMetreToLbPerFoot(1.488164)).toBeCloseTo(1, 6);
  });
  it('1 W/(m·K) = 0.5778 BTU/(h·ft·°F); 1 lb/ft³ = 16.018 kg/m³; 1 BTU/(lb·°F) = 4186.8 J/(kg·K) (handbook factors, from memory)', () => {
    expect(wattPerMetreKelvinToBtuPerHourFootF(1)).toBeCloseTo(0.5778, 4);
    expect(kgPerM3ToLbPerFt3(16.018463)).toBeCloseTo(1, 6);
    expect(btuPerLbFToJoulePerKgKelvin(1)).toBeCloseTo(4186.8, 6);
  });
  it('soil rho 90 °C·cm/W is 0.9 K·m/W', () => {
    expect(celsiusCmPerWattToKelvinMetrePerWatt(90)).toBeCloseTo(0.9, 12);
  });
  it('every quantity round-trips through the imperial unit', () => {
    const quantities = Object.keys(QUANTITIES) as Quantity[];
    fc.assert(
      fc.property(fc.constantFrom(...quantities), fc.double({ min: -1e6, max: 1e6, noNaN: true }), (quantity, value) => {
        const back = convertToSi(convertFromSi(value, quantity, 'imperial'), quantity, 'imperial');
        return Math.abs(back - value) <= 1e-9 * Math.max(1, Math.abs(value));
      }),
    );
  });
});

describe('formatQuantity', () => {
  it('shows SI values in the chosen system with the unit', () => {
    expect(formatQuantity(90, 'temperature', 'si')).toBe('90 °C');
    expect(formatQuantity(90, 'temperature', 'imperial')).toBe('194 °F');
    expect(formatQuantity('25.4', 'lengthMm', 'imperial')).toBe('1 in');
    expect(formatQuantity('0.0754', 'resistanceOhmPerKm', 'si')).toBe('0.0754 Ω/km');
    expect(formatQuantity(253.35, 'areaMm2', 'imperial', { digits: 3 })).toBe('500 kcmil');
    expect(formatQuantity(3.5, 'thermalResistivityKmPerW', 'si', { withUnit: false })).toBe('3.5');
  });
  it('gives an empty string for missing values', () => {
    expect(formatQuantity(null, 'temperature', 'si')).toBe('');
    expect(formatQuantity('', 'temperature', 'si')).toBe('');
    expect(formatQuantity('abc', 'temperature', 'si')).toBe('');
  });
});

// Conversions of the sheet form. Check values are exact definitions: 1 ft = 0.3048 m and
// 1 in = 25.4 mm (international yard and pound agreement, 1959); °F = °C × 9/5 + 32 (definition
// of the Fahrenheit scale: water freezes at 32 °F and boils at 212 °F); 1 K·m/W = 100 °C·cm/W.
import { describe, expect, it } from 'vitest';
import { displayText, displayUnit, fromDisplay, SHEET_FIELD_UNITS, toDisplay, type SheetNumericField } from '@/lib/sheet';

describe('sheet form units', () => {
  it('shows SI unchanged in SI, with the SI unit', () => {
    expect(toDisplay('circuit.lengthM', 85, 'si')).toBe(85);
    expect(displayUnit('circuit.lengthM', 'si')).toBe('m');
    expect(displayUnit('environment.ambientC', 'si')).toBe('°C');
  });

  it('length in feet: 0.3048 m is 1 ft exactly', () => {
    expect(toDisplay('circuit.lengthM', 0.3048, 'imperial')).toBeCloseTo(1, 12);
    expect(fromDisplay('circuit.lengthM', 1000, 'imperial')).toBeCloseTo(304.8, 9);
    expect(displayUnit('installation.depthM', 'imperial')).toBe('ft');
  });

  it('temperatures: 100 °C is 212 °F and 0 °C is 32 °F', () => {
    expect(toDisplay('environment.ambientC', 100, 'imperial')).toBeCloseTo(212, 12);
    expect(toDisplay('limits.temperatureLimitC', 0, 'imperial')).toBeCloseTo(32, 12);
    expect(fromDisplay('installation.groundC', 212, 'imperial')).toBeCloseTo(100, 12);
  });

  it('cable spacing is stored in m and shown in mm or inches: 25.4 mm is 1 in', () => {
    expect(toDisplay('installation.spacingM', 0.0254, 'si')).toBeCloseTo(25.4, 12);
    expect(toDisplay('installation.spacingM', 0.0254, 'imperial')).toBeCloseTo(1, 12);
    expect(fromDisplay('installation.spacingM', 2, 'imperial')).toBeCloseTo(0.0508, 12);
  });

  it('soil thermal resistivity: 1 K·m/W is 100 °C·cm/W', () => {
    expect(toDisplay('installation.soilResistivityKmPerW', 1.2, 'imperial')).toBeCloseTo(120, 9);
    expect(fromDisplay('installation.soilResistivityKmPerW', 90, 'imperial')).toBeCloseTo(0.9, 12);
  });

  it('reactance is stored in Ω/m and shown in Ω/km (= mΩ/m) or Ω per 1000 ft', () => {
    expect(toDisplay('circuit.reactanceOhmPerM', 0.08e-3, 'si')).toBeCloseTo(0.08, 12);
    // 1000 ft = 0.3048 km, so 0.08 Ω/km is 0.08 × 0.3048 Ω/kft.
    expect(toDisplay('circuit.reactanceOhmPerM', 0.08e-3, 'imperial')).toBeCloseTo(0.08 * 0.3048, 12);
  });

  it('wind speed in ft/s: 0.3048 m/s is 1 ft/s', () => {
    expect(toDisplay('environment.windSpeedMPerS', 0.3048, 'imperial')).toBeCloseTo(1, 12);
    expect(displayUnit('environment.windSpeedMPerS', 'imperial')).toBe('ft/s');
  });

  it('every field goes there and back without drift in both systems', () => {
    for (const field of Object.keys(SHEET_FIELD_UNITS) as SheetNumericField[]) {
      for (const system of ['si', 'imperial'] as const) {
        const stored = 37.25;
        expect(fromDisplay(field, toDisplay(field, stored, system), system)).toBeCloseTo(stored, 9);
      }
    }
  });

  it('field text is rounded for reading and empty for values not entered', () => {
    expect(displayText('circuit.powerFactor', 0.1 + 0.2, 'si')).toBe('0.3');
    expect(displayText('environment.ambientC', null, 'imperial')).toBe('');
    expect(displayText('environment.ambientC', 30, 'imperial')).toBe('86');
  });
});

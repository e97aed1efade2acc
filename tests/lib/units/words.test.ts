import { describe, expect, it } from 'vitest';
import { formatQuantity, nameInSystem, quantitiesInWords } from '@/lib/units';
import { displayText } from '@/lib/sheet/formUnits';

describe('imperial finished (issue 22)', () => {
  it('a temperature difference reads "°F rise", never as a temperature: 43.2 K = 77.8 °F rise (× 1.8, no offset)', () => {
    expect(formatQuantity(43.2, 'temperatureRise', 'imperial')).toBe('77.8 °F rise');
    expect(formatQuantity(43.2, 'temperatureRise', 'si')).toBe('43.2 K');
  });

  it('a converted field value is rounded to four figures: 6 m reads 19.69 ft, not 19.685 ft (1 ft = 0.3048 m)', () => {
    expect(displayText('circuit.lengthM', 6, 'imperial')).toBe('19.69');
    // SI shows what was typed.
    expect(displayText('circuit.lengthM', 6.12345, 'si')).toBe('6.12345');
  });

  it('help texts and names read in US customary units with the SI figure kept in brackets', () => {
    expect(quantitiesInWords('0.7 m: the reference laying depth of IEC 60364-5-52 tables', 'imperial')).toBe('2.3 ft (0.7 m): the reference laying depth of IEC 60364-5-52 tables');
    expect(quantitiesInWords('Left empty: 30 °C in air', 'imperial')).toBe('Left empty: 86 °F (30 °C) in air');
    expect(quantitiesInWords('limits terminal rises to 70 K', 'imperial')).toBe('limits terminal rises to 126 °F rise (70 K)');
    // 240 mm² / 0.506 707 mm² per kcmil (π/4 × 0.0254² × 1000) = 474 kcmil.
    expect(quantitiesInWords('Cu XLPE 240 mm² single-core', 'imperial')).toBe('Cu XLPE 474 kcmil (240 mm²) single-core');
    // Units inside other units and standard numbers stay as they are.
    expect(quantitiesInWords('1000 W/m²: full sun (IEC 60287-2-1)', 'imperial')).toBe('1000 W/m²: full sun (IEC 60287-2-1)');
    expect(quantitiesInWords('0.7 m', 'si')).toBe('0.7 m');
  });

  it('catalogue names stay as written, with the size in US customary units after them (1 in = 25.4 mm)', () => {
    expect(nameInSystem('1 × 60 × 10 mm Copper bar', 'imperial')).toBe('1 × 60 × 10 mm Copper bar (2.36 × 0.394 in)');
    expect(nameInSystem('95 mm² copper XLPE/PVC single-core', 'imperial')).toBe('95 mm² copper XLPE/PVC single-core (187 kcmil)');
    expect(nameInSystem('95 mm² copper XLPE/PVC single-core', 'si')).toBe('95 mm² copper XLPE/PVC single-core');
  });
});

describe('the fault current in kA (issue 22)', () => {
  it('the stored bound in A reads in the field’s kA: 500 000 A is 500 kA', async () => {
    const { messageInDisplayUnit, displayText, fromDisplay } = await import('@/lib/sheet/formUnits');
    expect(messageInDisplayUnit('fault.currentA', 'Fault current must be at most 500000 A')).toBe('Fault current must be at most 500 kA');
    expect(messageInDisplayUnit('circuit.designCurrentA', 'Design current must be at most 100000 A')).toBe('Design current must be at most 100000 A');
    expect(displayText('fault.currentA', 25_000, 'si')).toBe('25');
    expect(fromDisplay('fault.currentA', 25, 'si')).toBe(25_000);
  });
});

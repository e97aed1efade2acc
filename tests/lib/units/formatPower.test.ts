import { describe, expect, it } from 'vitest';
import { formatPower, lossPerLengthWords } from '@/lib/units';

// Issue 23: a loss of 0.646 mW was shown as "0.000000646 kW". The unit follows the size; the
// prefixes are the SI ones (BIPM, The International System of Units, 9th ed., Table 7).
describe('formatPower picks the unit by the size of the power', () => {
  it('0.000646 W is 0.646 mW, not 0.000000646 kW', () => {
    expect(formatPower(0.000646)).toBe('0.646 mW');
  });

  it('watts, kilowatts and megawatts as the figure grows', () => {
    expect(formatPower(12.34)).toBe('12.3 W');
    expect(formatPower(1)).toBe('1 W');
    expect(formatPower(12_100)).toBe('12.1 kW');
    expect(formatPower(2_500_000)).toBe('2.5 MW');
    expect(formatPower(0.25)).toBe('250 mW');
  });

  it('a figure that rounds up to the next prefix takes it (999.96 W is 1 kW)', () => {
    expect(formatPower(999.96)).toBe('1 kW');
    expect(formatPower(0.99996)).toBe('1 W');
  });

  it('zero, negative and not-a-number', () => {
    expect(formatPower(0)).toBe('0 W');
    expect(formatPower(-1500)).toBe('-1.5 kW');
    expect(formatPower(Number.NaN)).toBe('');
  });

  it('per metre: SI picks its prefix, imperial stays in W/ft', () => {
    expect(lossPerLengthWords(0.00123, 'si')).toBe('1.23 mW/m');
    expect(lossPerLengthWords(243, 'si')).toBe('243 W/m');
    // 1 W/m × 0.3048 m/ft (the international foot, exact).
    expect(lossPerLengthWords(1, 'imperial')).toBe('0.305 W/ft');
  });
});

import { describe, expect, it } from 'vitest';
import { inputWarnings } from '@/lib/sheet/inputWarnings';
import { defaultSheetInputs } from '@/lib/sheet/schema';

describe('inputWarnings: accepted inputs that must not pass without a word (issue 22)', () => {
  const base = defaultSheetInputs();

  it('says nothing about the default inputs', () => {
    expect(inputWarnings(base)).toEqual([]);
  });

  it('names the frequency as DC at 0 Hz, the power factor at 0 and the route length at 0 m', () => {
    const w = inputWarnings({ ...base, circuit: { ...base.circuit, frequencyHz: 0, powerFactor: 0, lengthM: 0 } });
    expect(w.map((x) => x.field)).toEqual(['circuit.frequencyHz', 'circuit.powerFactor', 'circuit.lengthM']);
    expect(w[0].message).toMatch(/^Frequency 0 Hz: the circuit is taken as DC/);
    expect(w[1].message).toMatch(/^Power factor 0:/);
    expect(w[2].message).toMatch(/^Route length 0 m:/);
  });

  it('names an own limit at or below the ambient, in the user’s units', () => {
    const inputs = { ...base, environment: { ...base.environment, ambientC: 45 }, limits: { ...base.limits, temperatureLimitC: 40 } };
    const [w] = inputWarnings(inputs);
    expect(w.field).toBe('limits.temperatureLimitC');
    expect(w.message).toContain('Your own limit (40 °C) is not above the ambient (45 °C)');
    expect(inputWarnings(inputs, 'imperial')[0].message).toContain('(104 °F) is not above the ambient (113 °F)');
    expect(inputWarnings({ ...inputs, limits: { ...inputs.limits, temperatureLimitC: 46 } })).toEqual([]);
  });
});

import { describe, expect, it } from 'vitest';
import { ElectricalInputError, voltageDrop } from '@/lib/electrical';

describe('voltage drop — worked by hand from IEC 60364-5-52 Annex G', () => {
  // Case: copper, 35 mm², 50 m, I_B = 100 A, cosφ = 0.85, λ = 0.08 mΩ/m, U0 = 230 V.
  // ρ1 = 0.0225 Ω·mm²/m (Annex G). sinφ = √(1 − 0.7225) = √0.2775 = 0.5267827.
  // Resistive term: 0.0225·50/35 = 0.03214286 Ω; ×0.85 = 0.02732143 Ω.
  // Reactive term:  0.08e-3·50 = 0.004 Ω;       ×0.5267827 = 0.00210713 Ω.
  // Sum 0.02942856 Ω × 100 A = 2.942856 V.
  // Three-phase (b = 1): u = 2.942856 V, 100·2.942856/230 = 1.279503 %.
  // Single-phase (b = 2): u = 5.885712 V, 2.559005 %.
  const base = { current: 100, length: 50, section: 35, material: 'copper' as const, powerFactor: 0.85, nominalVoltage: 230 };

  it('three-phase', () => {
    const r = voltageDrop({ ...base, phases: 3 });
    expect(r.volts).toBeCloseTo(2.942856, 5);
    expect(r.percent).toBeCloseTo(1.279503, 5);
  });

  it('single-phase is twice the three-phase drop (b = 2)', () => {
    const r = voltageDrop({ ...base, phases: 1 });
    expect(r.volts).toBeCloseTo(5.885712, 5);
    expect(r.percent).toBeCloseTo(2.559005, 5);
  });

  it('aluminium with an explicit reactance, worked by hand', () => {
    // ρ1 = 0.036 Ω·mm²/m; 0.036·120/95 = 0.04547368 Ω ×0.9 = 0.04092632 Ω;
    // sinφ = √0.19 = 0.4358899; 0.1e-3·120 = 0.012 Ω ×0.4358899 = 0.00523068 Ω;
    // sum 0.04615699 Ω × 150 A = 6.923549 V; /230 → 3.010239 %.
    const r = voltageDrop({
      phases: 3,
      current: 150,
      length: 120,
      section: 95,
      material: 'aluminium',
      powerFactor: 0.9,
      reactance: 0.1e-3,
      nominalVoltage: 230,
    });
    expect(r.volts).toBeCloseTo(6.923549, 5);
    expect(r.percent).toBeCloseTo(3.010239, 4);
  });

  it('refuses a wrong phase count or power factor, naming the field', () => {
    const field = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        expect(e).toBeInstanceOf(ElectricalInputError);
        return (e as ElectricalInputError).field;
      }
      throw new Error('did not throw');
    };
    expect(field(() => voltageDrop({ ...base, phases: 2 as never }))).toBe('phases');
    expect(field(() => voltageDrop({ ...base, phases: 3, powerFactor: 1.2 }))).toBe('powerFactor');
    expect(field(() => voltageDrop({ ...base, phases: 3, nominalVoltage: 0 }))).toBe('nominalVoltage');
  });
});

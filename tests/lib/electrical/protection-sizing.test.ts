import { describe, expect, it } from 'vitest';
import { evaluateCandidate, type CandidateEvaluationOk } from '@/lib/electrical';
import { cableConditions, xlpeCable } from './fixtures';

/**
 * The protection checks through the sizing layer (issue 21, physics.md §11): I_z is the circuit's
 * rated ampacity as built (the group model included), and the loop runs through the candidate's
 * own conductor. Each figure is worked by hand from the standard's formula.
 */
const ok = (e: ReturnType<typeof evaluateCandidate>): CandidateEvaluationOk => {
  if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
  return e;
};

describe('overload coordination with I_z the group rating (IEC 60364-4-43 §433.1)', () => {
  it('25 mm² in trefoil in air at I_B = 80 A: I_B ≤ I_n ≤ I_z and I₂ = 1.45·I_n ≤ 1.45·I_z by hand; the smallest coordinated breaker is 80 A', () => {
    const conditions = cableConditions({ designCurrentA: 80, installation: { kind: 'cable-in-air' }, protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 100 } } });
    const e = ok(evaluateCandidate(xlpeCable(25), conditions));
    const Iz = e.ampacityA;
    const p = e.protection!;
    expect(p.coordination!.ampacityA).toBe(Iz);
    const [ib, iz, i2] = p.coordination!.inequalities;
    expect(ib.holds).toBe(80 <= 100);
    expect(iz.holds).toBe(100 <= Iz);
    // IEC 60898-1: I₂ = 1.45·I_n (from memory); the condition I₂ ≤ 1.45·I_z is then I_n ≤ I_z again.
    expect(i2.left).toBeCloseTo(1.45 * 100, 9);
    expect(i2.right).toBeCloseTo(1.45 * Iz, 9);
    expect(p.coordination!.verdict).toBe(100 <= Iz ? 'pass' : 'fail');
    // IEC 60898-1 preferred ratings …63, 80, 100, 125 A: the smallest with I_B ≤ I_n ≤ I_z is 80 A (I_z lies above 80 A here).
    expect(Iz).toBeGreaterThan(80);
    expect(p.smallestRating!.ratingA).toBe(80);
  });

  it('a device above I_z is a blocker, and the sheet says which inequality fails', () => {
    // 16 mm² in trefoil in air rates well under 125 A.
    const e = ok(evaluateCandidate(xlpeCable(16), cableConditions({ designCurrentA: 60, installation: { kind: 'cable-in-air' }, protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 125 } } })));
    if (e.ampacityA >= 125) throw new Error(`the test needs I_z below 125 A (got ${e.ampacityA})`);
    expect(e.passes).toBe(false);
    const flag = e.flags.find((f) => f.code === 'PROTECTION_OVERLOAD_NOT_COORDINATED');
    expect(flag?.message).toMatch(/I_n ≤ I_z fails/);
  });
});

describe('automatic disconnection through the candidate (IEC 60364-4-41 §411)', () => {
  it('Z_s = Z_source + (R_phase + R_pe) at the fault-end temperature, I_a = c_min·U₀/Z_s (c_min 0.95, IEC 60909-0), worked by hand', () => {
    const lengthM = 120;
    const source = { resistanceOhm: 0.01, reactanceOhm: 0.02 };
    const cable = xlpeCable(95);
    const e = ok(evaluateCandidate(cable, cableConditions({ lengthM, protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 160 }, source, protectiveConductor: { sectionMm2: 50 } } })));
    const d = e.protection!.disconnection!;
    // Both conductors at the XLPE short-circuit limit of 250 °C (the end of the fault: the largest
    // resistance, the smallest current — cautious): R = R₂₀[1 + α(250 − 20)] (IEC 60287-1-1 eq. 2).
    const hot = 1 + 3.93e-3 * (250 - 20);
    const rPhase = cable.r20OhmPerM * hot * lengthM;
    const rPe = (1.7241e-8 / 50e-6) * hot * lengthM; // ρ₂₀ of copper over 50 mm² (IEC 60287-1-1 Table 1)
    const zs = Math.hypot(source.resistanceOhm + rPhase + rPe, source.reactanceOhm);
    expect(d.loop.impedanceOhm).toBeCloseTo(zs, 9);
    expect(d.faultCurrentA).toBeCloseTo((0.95 * 230) / zs, 6);
    // A C-curve breaker operates instantaneously from 10·I_n = 1600 A (IEC 60898-1, upper end of the band).
    expect(d.verdict).toBe(d.faultCurrentA >= 1600 ? 'pass' : 'fail');
  });
});

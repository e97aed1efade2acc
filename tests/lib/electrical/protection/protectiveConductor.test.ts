import { describe, expect, it } from 'vitest';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { protectiveConductorSection } from '@/lib/electrical/protection';

// IEC 60364-5-54 §543.1.2: S = √(I²t)/k, k = K·√ln((β + θ_f)/(β + θ_i)) with IEC 60949 K = 226,
// β = 234.5 K for copper (from memory); temperatures of Tables A.54.2 / A.54.3 (from memory).
// §543.1.3 / Table 54.3 (from memory): S ≤ 16 → S; 16 < S ≤ 35 → 16; S > 35 → S/2.
// With fault data the calculation governs (§543.1.1 asks the conductor to withstand the fault);
// without them the table does.

const base = {
  material: 'copper' as const,
  lineMaterial: 'copper' as const,
  insulation: 'pvc-70' as const,
  arrangement: 'in-cable-or-bunched' as const,
};

function refusedField(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(ElectricalInputError);
    return (e as ElectricalInputError).field;
  }
  throw new Error('expected the input to be refused');
}

describe('protective conductor, IEC 60364-5-54 §543.1', () => {
  it('adiabatic, a PVC core of the cable: 2 kA for 0.4 s — k = 115.00, S = 1264.9/115.00 = 11.00 mm²; the table asks 16 for a 25 mm² line: adiabatic governs', () => {
    // k = 226·√ln(394.5/304.5) = 226·√0.258985 = 115.0045 (Table A.54.3 lists 115, from memory).
    // √(I²t) = 2000·√0.4 = 1264.911; S = 1264.911/115.0045 = 10.9988 mm².
    const r = protectiveConductorSection({ ...base, faultCurrentA: 2000, disconnectionTimeS: 0.4, lineSectionMm2: 25 });
    expect(r.adiabatic?.kAs05PerMm2).toBeCloseTo(115.0045, 3);
    expect(r.adiabatic?.minimumMm2).toBeCloseTo(10.9988, 3);
    expect(r.adiabatic?.nextStandardMm2).toBe(16);
    expect(r.table?.minimumMm2).toBe(16);
    expect(r.governing).toBe('adiabatic');
    expect(r.requiredMinimumMm2).toBeCloseTo(10.9988, 3);
    expect(r.note).toMatch(/accepts/);
  });

  it('an installed 10 mm² PE fails both methods there; 16 mm² passes', () => {
    const at = (installedSectionMm2: number) =>
      protectiveConductorSection({ ...base, faultCurrentA: 2000, disconnectionTimeS: 0.4, lineSectionMm2: 25, installedSectionMm2 });
    expect(at(10).installed).toMatchObject({ meetsAdiabatic: false, meetsTable: false, verdict: 'fail' });
    expect(at(11).installed).toMatchObject({ meetsAdiabatic: true, meetsTable: false, verdict: 'pass' });
    expect(at(16).installed).toMatchObject({ meetsAdiabatic: true, meetsTable: true, verdict: 'pass' });
  });

  it('Table 54.3 at its boundaries: 16 → 16, 25 → 16, 35 → 16, 50 → 25, 95 → 47.5 (next standard 50)', () => {
    const table = (lineSectionMm2: number) =>
      protectiveConductorSection({ ...base, faultCurrentA: 20_000, disconnectionTimeS: 1, lineSectionMm2 }).table;
    expect(table(10)?.minimumMm2).toBe(10);
    expect(table(16)?.minimumMm2).toBe(16);
    expect(table(25)?.minimumMm2).toBe(16);
    expect(table(35)?.minimumMm2).toBe(16);
    expect(table(50)?.minimumMm2).toBe(25);
    expect(table(95)).toMatchObject({ minimumMm2: 47.5, nextStandardMm2: 50 });
  });

  it('the table does not override the numbers: 20 kA for 1 s on a 95 mm² line needs 173.9 mm², though the table admits 47.5', () => {
    // S = 20000·1/115.0045 = 173.91 mm². A 50 mm² PE would reach (70 + 234.5)·e^(4e8/(226²·50²)) − 234.5 ≈ 6980 °C.
    const r = protectiveConductorSection({ ...base, faultCurrentA: 20_000, disconnectionTimeS: 1, lineSectionMm2: 95, installedSectionMm2: 50 });
    expect(r.adiabatic?.minimumMm2).toBeCloseTo(173.906, 2);
    expect(r.table?.minimumMm2).toBe(47.5);
    expect(r.governing).toBe('adiabatic');
    expect(r.requiredMinimumMm2).toBeCloseTo(173.906, 2);
    expect(r.installed).toMatchObject({ meetsTable: true, meetsAdiabatic: false, verdict: 'fail' });
    expect(r.note).toMatch(/calculation governs/);
  });

  it('a PE below the table but above the calculation is accepted (the calculated route): 1.5 mm² PE of a 2.5 mm² circuit', () => {
    // C16 fault of 217.3 A cleared in 0.1 s, PVC core 70 → 160 °C: S = 217.313·√0.1/115.0045 = 0.5976 mm².
    const r = protectiveConductorSection({ ...base, faultCurrentA: 217.313, disconnectionTimeS: 0.1, lineSectionMm2: 2.5, installedSectionMm2: 1.5 });
    expect(r.adiabatic?.minimumMm2).toBeCloseTo(0.59756, 4);
    expect(r.installed).toMatchObject({ meetsTable: false, meetsAdiabatic: true, verdict: 'pass' });
  });

  it('without fault data only Table 54.3 applies, and it governs', () => {
    const r = protectiveConductorSection({ ...base, lineSectionMm2: 70, installedSectionMm2: 35 });
    expect(r.adiabatic).toBeUndefined();
    expect(r).toMatchObject({ governing: 'table', requiredMinimumMm2: 35 });
    expect(r.installed?.verdict).toBe('pass');
  });

  it('k factors of Tables A.54.2 / A.54.3 (from memory) within 1 %: separate Cu/PVC 143, Cu/XLPE core 143, separate Cu/XLPE 176', () => {
    const k = (insulation: 'pvc-70' | 'thermosetting-90', arrangement: 'separate' | 'in-cable-or-bunched') =>
      protectiveConductorSection({ ...base, insulation, arrangement, faultCurrentA: 1000, disconnectionTimeS: 0.2, lineSectionMm2: 16 }).adiabatic?.kAs05PerMm2 as number;
    expect(Math.abs(k('pvc-70', 'separate') / 143 - 1)).toBeLessThan(0.01);
    expect(Math.abs(k('thermosetting-90', 'in-cable-or-bunched') / 143 - 1)).toBeLessThan(0.01);
    expect(Math.abs(k('thermosetting-90', 'separate') / 176 - 1)).toBeLessThan(0.01);
  });

  it('PVC above 300 mm² ends at 140 °C: 20 kA for 4 s needs 389.1 mm² (k 70→140 °C = 102.80; Table A.54.3 lists 103, from memory)', () => {
    // √(I²t) = 40000; at 160 °C S = 347.8 > 300, so θ_f = 140: k = 226·√ln(374.5/304.5) = 102.804, S = 389.09.
    const r = protectiveConductorSection({ ...base, faultCurrentA: 20_000, disconnectionTimeS: 4, lineSectionMm2: 400 });
    expect(r.adiabatic?.finalC).toBe(140);
    expect(r.adiabatic?.minimumMm2).toBeCloseTo(389.09, 1);
  });

  it('a separate copper PE is never below 4 mm² unprotected, 2.5 mm² protected (§543.1.3, from memory)', () => {
    // 217.3 A for 0.1 s, 30 → 160 °C: S = 68.72/142.895 = 0.481 mm², below both floors.
    const r = (mechanicallyProtected: boolean) =>
      protectiveConductorSection({ ...base, arrangement: 'separate', mechanicallyProtected, faultCurrentA: 217.313, disconnectionTimeS: 0.1, lineSectionMm2: 2.5 });
    expect(r(false).adiabatic?.minimumMm2).toBeCloseTo(0.48091, 4);
    expect(r(false)).toMatchObject({ requiredMinimumMm2: 4, governing: 'mechanical' });
    expect(r(true)).toMatchObject({ requiredMinimumMm2: 2.5, governing: 'mechanical' });
  });

  it('a PE of another material than the line conductor has no table value here; the adiabatic method governs, and without fault data it is refused', () => {
    const r = protectiveConductorSection({ ...base, lineMaterial: 'aluminium', faultCurrentA: 2000, disconnectionTimeS: 0.4, lineSectionMm2: 25 });
    expect(r.table).toBeUndefined();
    expect(r.governing).toBe('adiabatic');
    expect(refusedField(() => protectiveConductorSection({ ...base, lineMaterial: 'aluminium', lineSectionMm2: 25 }))).toBe('faultCurrentA');
  });

  it('the device let-through I²t replaces I²t when entered', () => {
    const r = protectiveConductorSection({ ...base, faultCurrentA: 2000, disconnectionTimeS: 0.01, energyA2s: 1e5, lineSectionMm2: 25 });
    expect(r.adiabatic?.minimumMm2).toBeCloseTo(Math.sqrt(1e5) / 115.0045, 4);
  });

  it('beyond 5 s the adiabatic formula is refused, naming the field', () => {
    expect(refusedField(() => protectiveConductorSection({ ...base, faultCurrentA: 500, disconnectionTimeS: 6, lineSectionMm2: 25 }))).toBe('disconnectionTimeS');
    expect(refusedField(() => protectiveConductorSection({ ...base, insulation: 'paper' as never, faultCurrentA: 500, disconnectionTimeS: 1, lineSectionMm2: 25 }))).toBe(
      'insulation',
    );
  });
});

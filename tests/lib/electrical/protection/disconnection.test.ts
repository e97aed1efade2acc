import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { automaticDisconnection, earthFaultLoopImpedance, requiredDisconnectionTime, type LoopConductor } from '@/lib/electrical/protection';

// IEC 60364-4-41 §411.4.4 (TN): Z_s·I_a ≤ U₀; fault current c·U₀/Z_s with c_min = 0.95
// (IEC 60909-0 Table 1, from memory); conductors at their end-of-fault temperature,
// R(θ) = R₂₀[1 + α₂₀(θ − 20)] (IEC 60287-1-1, α₂₀ = 3.93e-3 for copper).
// Conductor data: IEC 60228 class 2 copper maximum R₂₀ (references.md, from memory):
// 2.5 mm² 7.41 Ω/km, 16 mm² 1.15 Ω/km. PVC cores 70 → 160 °C (common practice).

function refusedField(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(ElectricalInputError);
    return (e as ElectricalInputError).field;
  }
  throw new Error('expected the input to be refused');
}

const copperPvc = (r20OhmPerM: number, lengthM: number): LoopConductor => ({ material: 'copper', r20OhmPerM, lengthM, initialC: 70, finalC: 160 });

describe('required disconnection time — IEC 60364-4-41 Table 41.1 (a.c., from memory), §411.3.2.3 and §411.3.2.4', () => {
  const t = (systemEarthing: 'TN' | 'TT', u0: number, circuit: 'final' | 'distribution' = 'final', ratedCurrentA = 16, table41_1MaxRatedCurrentA?: number) =>
    requiredDisconnectionTime({ systemEarthing, nominalVoltageToEarthV: u0, circuit, ratedCurrentA, table41_1MaxRatedCurrentA }).timeS;
  it('TN final circuits ≤ 32 A: 0.8 / 0.4 / 0.2 / 0.1 s by U₀ band', () => {
    expect([t('TN', 120), t('TN', 230), t('TN', 400), t('TN', 480)]).toEqual([0.8, 0.4, 0.2, 0.1]);
  });
  it('TT final circuits ≤ 32 A: 0.3 / 0.2 / 0.07 / 0.04 s', () => {
    expect([t('TT', 110), t('TT', 230), t('TT', 277), t('TT', 690)]).toEqual([0.3, 0.2, 0.07, 0.04]);
  });
  it('distribution circuits and final circuits above the Table 41.1 limit: 5 s TN, 1 s TT', () => {
    expect([t('TN', 230, 'distribution'), t('TT', 230, 'distribution'), t('TN', 230, 'final', 40)]).toEqual([5, 1, 5]);
    // The 2017 amendment's 63 A limit for socket-outlet circuits (from memory), when chosen.
    expect(t('TN', 230, 'final', 40, 63)).toBe(0.4);
  });
  it('U₀ ≤ 50 V is outside Table 41.1: refused naming the field', () => {
    expect(refusedField(() => t('TN', 50))).toBe('nominalVoltageToEarthV');
  });
});

describe('earth-fault loop and disconnection, worked by hand', () => {
  // Final circuit, TN-S 230 V: source 0.30 + j0.18 Ω; 30 m of 2.5 mm² copper phase and 2.5 mm² PE.
  // R(160 °C) = 7.41e-3·(1 + 0.00393·140) = 0.011486982 Ω/m → 0.34460946 Ω per conductor.
  // R = 0.30 + 2·0.34460946 = 0.98921892 Ω, X = 0.18 Ω, Z_s = √(R² + X²) = 1.0054621 Ω.
  // I_a = 0.95·230/1.0054621 = 217.313 A. C16: certain trip at 10·16 = 160 A in < 0.1 s ≤ 0.4 s.
  // Z_s,max = 0.95·230/160 = 1.365625 Ω.
  const base = {
    systemEarthing: 'TN' as const,
    nominalVoltageToEarthV: 230,
    circuit: 'final' as const,
    source: { resistanceOhm: 0.3, reactanceOhm: 0.18 },
    phaseConductor: copperPvc(7.41e-3, 30),
    protectiveConductor: copperPvc(7.41e-3, 30),
  };

  it('C16: Z_s = 1.00546 Ω, I_a = 217.31 A, trips instantaneously within 0.4 s — pass', () => {
    const r = automaticDisconnection({ ...base, device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 16 } });
    expect(r.loop.phase.resistanceOhm).toBeCloseTo(0.34460946, 7);
    expect(r.loop.impedanceOhm).toBeCloseTo(1.0054621, 6);
    expect(r.faultCurrentA).toBeCloseTo(217.313, 2);
    expect(r.required.timeS).toBe(0.4);
    expect(r.operating).toMatchObject({ timeS: 0.1, method: 'instantaneous' });
    expect(r.maxLoopImpedanceOhm).toBeCloseTo(1.365625, 9);
    expect(r.verdict).toBe('pass');
  });

  it('D16 needs 320 A: below it, without a curve, disconnection is not shown — fail', () => {
    const r = automaticDisconnection({ ...base, device: { kind: 'breaker-iec60898-1', curve: 'D', ratedCurrentA: 16 } });
    expect(r.operating.timeS).toBeUndefined();
    expect(r.maxLoopImpedanceOhm).toBeCloseTo((0.95 * 230) / 320, 9);
    expect(r.verdict).toBe('fail');
  });

  it('the mean temperature (115 °C) and c = 1 are offered: Z_s = 0.928212 Ω; I_a = 230/1.0054621 = 228.751 A', () => {
    // R(115 °C) = 7.41e-3·(1 + 0.00393·95) = 0.0101765235 Ω/m; R = 0.3 + 60·0.0101765235 = 0.91059141; Z = 0.92821157.
    const avg = earthFaultLoopImpedance({ ...base, resistanceTemperature: 'average' });
    expect(avg.phase.temperatureC).toBe(115);
    expect(avg.impedanceOhm).toBeCloseTo(0.92821157, 7);
    const c1 = automaticDisconnection({ ...base, voltageFactor: 1, device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 16 } });
    expect(c1.faultCurrentA).toBeCloseTo(228.7505, 3);
  });

  it('a source known only as |Z| = 0.35 Ω is added arithmetically (upper bound): Z_s = 1.0392189 Ω, said so', () => {
    const r = automaticDisconnection({ ...base, source: { impedanceOhm: 0.35 }, device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 16 } });
    expect(r.loop.impedanceOhm).toBeCloseTo(1.0392189, 6);
    expect(r.loop.resistanceOhm).toBeUndefined();
    expect(r.assumptions.length).toBeGreaterThan(0);
  });

  it('TT with R_A + R_B = 10 Ω: Z_s = 10.9907 Ω, I_a = 19.88 A — a C16 cannot disconnect (an RCD is needed)', () => {
    const r = automaticDisconnection({ ...base, systemEarthing: 'TT', earthElectrodesOhm: 10, device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 16 } });
    expect(r.loop.impedanceOhm).toBeCloseTo(10.990693, 5);
    expect(r.faultCurrentA).toBeCloseTo(19.8805, 3);
    expect(r.required.timeS).toBe(0.2);
    expect(r.verdict).toBe('fail');
  });

  it('distribution circuit with a gG fuse and its curve, TN 230 V: 5 s allowed, operates in 0.187 s', () => {
    // 50 m of 16 mm² Cu phase and PE: R(160) = 1.15e-3·1.5502·50 = 0.0891365 Ω each; source 0.05 + j0.03.
    // R = 0.228273, X = 0.03 → Z_s = 0.2302359 Ω; I_a = 218.5/0.2302359 = 949.027 A.
    // Illustrative curve (input, not a maker's): t = 20 s·(I/200 A)^−3 between 200 A and 2000 A.
    // t(949.027) = 20·(4.745134)^−3 = 0.187191 s. For 5 s: I = 200·4^⅓ = 317.480 A → Z_s,max = 0.688232 Ω.
    const r = automaticDisconnection({
      systemEarthing: 'TN',
      nominalVoltageToEarthV: 230,
      circuit: 'distribution',
      source: { resistanceOhm: 0.05, reactanceOhm: 0.03 },
      phaseConductor: copperPvc(1.15e-3, 50),
      protectiveConductor: copperPvc(1.15e-3, 50),
      device: { kind: 'fuse-gG-iec60269', ratedCurrentA: 63, timeCurrentCurve: [{ currentA: 200, timeS: 20 }, { currentA: 2000, timeS: 0.02 }] },
    });
    expect(r.required.timeS).toBe(5);
    expect(r.faultCurrentA).toBeCloseTo(949.027, 2);
    expect(r.operating.timeS).toBeCloseTo(0.187191, 5);
    expect(r.currentToDisconnectA).toBeCloseTo(317.4802, 3);
    expect(r.maxLoopImpedanceOhm).toBeCloseTo(0.688232, 5);
    expect(r.verdict).toBe('pass');
  });

  it('TT at U₀ = 400 V allows 0.07 s: the IEC 60898-1 bound (< 0.1 s) does not show it, whatever the current', () => {
    const r = automaticDisconnection({ ...base, nominalVoltageToEarthV: 400, systemEarthing: 'TT', earthElectrodesOhm: 0.01, device: { kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 6 } });
    expect(r.required.timeS).toBe(0.07);
    expect(r.operating.method).toBe('instantaneous');
    expect(r.maxLoopImpedanceOhm).toBeUndefined();
    expect(r.verdict).toBe('fail');
  });

  it('an IEC 60947-2 breaker without its maker\'s break time: the 0.1 s taken is listed as an assumption', () => {
    // I_a = 217.313 A ≥ 1.2·I_i = 1.2·150 = 180 A.
    const r = automaticDisconnection({ ...base, device: { kind: 'breaker-iec60947-2', ratedCurrentA: 32, settingCurrentA: 25, instantaneousCurrentA: 150 } });
    expect(r.operating).toMatchObject({ method: 'instantaneous', timeS: 0.1 });
    expect(r.maxLoopImpedanceOhm).toBeCloseTo((0.95 * 230) / 180, 9);
    expect(r.assumptions.some((a) => /break time/.test(a))).toBe(true);
    expect(r.verdict).toBe('pass');
  });

  it('property: the verdict agrees with Z_s ≤ Z_s,max for any cable length (C32, 300 runs)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 400, noNaN: true }), (lengthM) => {
        const r = automaticDisconnection({
          ...base,
          phaseConductor: copperPvc(1.83e-3, lengthM),
          protectiveConductor: copperPvc(1.83e-3, lengthM),
          device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 32 },
        });
        expect(r.verdict === 'pass').toBe(r.loop.impedanceOhm <= (r.maxLoopImpedanceOhm as number));
      }),
      { numRuns: 300 },
    );
  });

  it('refusals name the field: a fuse without its curve, TT without electrodes, bad conductor data', () => {
    expect(refusedField(() => automaticDisconnection({ ...base, device: { kind: 'fuse-gG-iec60269', ratedCurrentA: 16 } }))).toBe('device.timeCurrentCurve');
    expect(refusedField(() => automaticDisconnection({ ...base, systemEarthing: 'TT', device: { kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 16 } }))).toBe(
      'earthElectrodesOhm',
    );
    expect(
      refusedField(() =>
        automaticDisconnection({ ...base, protectiveConductor: { ...copperPvc(7.41e-3, 30), finalC: 60 }, device: { kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 16 } }),
      ),
    ).toBe('protectiveConductor.finalC');
    expect(refusedField(() => automaticDisconnection({ ...base, device: { kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 0 } }))).toBe('device.ratedCurrentA');
  });
});

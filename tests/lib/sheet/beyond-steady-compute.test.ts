/**
 * computeBeyondSteady, the sheet glue of the optional checks (lib/sheet/beyondSteady.ts): which
 * parts run for which inputs, how the sheet's fields reach the library, and how a check that
 * cannot run is reported. The physical checks are outside facts:
 *   - heat leaving the conductor during a fault can only lower its end temperature below the
 *     adiabatic one (IEC 60949's reason for its non-adiabatic factor ε ≥ 1, from memory), and the
 *     model kept adiabatic is the IEC 60949 adiabatic heating up to the inputs that differ;
 *   - the maximum principle of the steady fin equation k·A·T'' − h·P·(T − T_air) + q = 0: with
 *     the start terminal held hotter than anything the bar reaches on its own, the hottest point
 *     of the run is that terminal (textbook, e.g. Incropera ch. 3 fins, from memory).
 */
import { describe, expect, it } from 'vitest';
import { computeBeyondSteady } from '@/lib/sheet/beyondSteady';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';

const bar = testCopperBar(100, 10, { emissivity: 0.4 });

const cable240 = testCable240;

const hourly = (day: number, night: number) => Array.from({ length: 24 }, (_, h) => (h >= 8 && h < 20 ? day : night));

function cableSheet(): SheetInputs {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.candidates = [cable240];
  inputs.chosenCandidateId = cable240.id;
  inputs.overTime = { checked: true, overloadCurrentA: 900, overloadDurationS: 1800, dailyProfileA: hourly(500, 250), faultWithCoverings: true };
  return inputs;
}

function barSheet(): SheetInputs {
  const inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 1000 };
  inputs.environment = { ...inputs.environment, ambientC: 35 };
  inputs.candidates = [bar];
  inputs.chosenCandidateId = bar.id;
  inputs.alongRun = { checked: true, lengthM: 4, startEnd: 'terminal', startTemperatureC: 100, endEnd: 'insulated', endTemperatureC: 70, joints: [{ positionM: 2, resistanceMicroOhm: 12 }] };
  return inputs;
}

describe('computeBeyondSteady', () => {
  it('answers null for a candidate that is not on the sheet, and nothing when both checks are off', () => {
    const inputs = cableSheet();
    expect(computeBeyondSteady(inputs, 'not-on-this-sheet')).toBeNull();
    inputs.overTime.checked = false;
    expect(computeBeyondSteady(inputs, cable240.id)).toEqual({ candidateId: cable240.id });
  });

  it('runs the overload for the entered current and duration, the daily load, and the fault only when the fault section is checked; the fault with heat leaving ends below the adiabatic figure', () => {
    const inputs = cableSheet();
    const r = computeBeyondSteady(inputs, cable240.id)!.overTime!;
    if (!r.ok) throw new Error(r.message);
    expect(r.result.overload).toMatchObject({ currentA: 900, durationS: 1800 });
    expect(r.result.daily!.series.length).toBeGreaterThan(24);
    // The day's heavy hours are 08–20 h: the peak of a repeated day falls within them.
    expect(r.result.daily!.peakTimeS).toBeGreaterThan(8 * 3600);
    expect(r.result.daily!.peakTimeS).toBeLessThanOrEqual(20 * 3600);
    const fault = r.result.fault!;
    // Heat leaving the conductor can only lower the end temperature below the same model kept adiabatic.
    expect(fault.finalC).toBeLessThan(fault.adiabaticModelC);
    expect(fault.finalC).toBeGreaterThan(fault.initialC);
    // The model kept adiabatic is the IEC 60949 adiabatic heating of the same conductor, to within the
    // inputs that differ: the model heats with the candidate's R20 (the IEC 60228 maximum, above the
    // nominal ρ20/S) times the AC factor, IEC 60949 with ρ20/S on DC. Those differ by a few per cent,
    // so the rises agree to 5 %, not exactly.
    expect(fault.iecAdiabaticC).not.toBeNull();
    const iecRiseK = fault.iecAdiabaticC! - fault.initialC;
    expect(Math.abs(fault.adiabaticModelC - fault.iecAdiabaticC!)).toBeLessThan(0.05 * iecRiseK);

    const withoutFault = computeBeyondSteady({ ...inputs, fault: { ...inputs.fault, checked: false } }, cable240.id)!.overTime!;
    if (!withoutFault.ok) throw new Error(withoutFault.message);
    expect(withoutFault.result.fault).toBeUndefined();
    expect(withoutFault.result.flags.map((f) => f.code)).not.toContain('FAULT_HEAT_INTO_COVERINGS');

    const noProfile = computeBeyondSteady({ ...inputs, overTime: { ...inputs.overTime, dailyProfileA: [] } }, cable240.id)!.overTime!;
    if (!noProfile.ok) throw new Error(noProfile.message);
    expect(noProfile.result.daily).toBeUndefined();
  });

  it('the run along the length is refused for a cable, with a sentence saying why, while the over-time check still runs', () => {
    const inputs = cableSheet();
    inputs.alongRun = { ...inputs.alongRun, checked: true };
    const r = computeBeyondSteady(inputs, cable240.id)!;
    expect(r.alongRun).toEqual({ ok: false, message: 'The run along the length is for bars; this candidate is a cable.' });
    expect(r.overTime!.ok).toBe(true);
  });

  it('a bar run takes the sheet’s terminal temperature and insulated end: the hot terminal is the hottest point (maximum principle), the entered joint is not assumed', () => {
    const r = computeBeyondSteady(barSheet(), bar.id)!.alongRun!;
    if (!r.ok) throw new Error(r.message);
    const { hotSpot, temperaturesC, positionsM, joints } = r.result;
    // The bar alone at 1000 A stays well under the 100 °C terminal (its steady hot spot is below it).
    expect(Math.max(...temperaturesC.slice(Math.floor(temperaturesC.length / 2)))).toBeLessThan(100);
    expect(hotSpot.temperatureC).toBeCloseTo(100, 6);
    expect(hotSpot.positionM).toBeCloseTo(0, 6);
    // Cell centres span the entered 4 m run.
    expect(positionsM[positionsM.length - 1]).toBeGreaterThan(3.9);
    expect(positionsM[positionsM.length - 1]).toBeLessThan(4);
    // Insulated end: no heat through it, so the profile is flat there (zero slope, to the mesh).
    const n = temperaturesC.length;
    const endSlopeKPerM = (temperaturesC[n - 1] - temperaturesC[n - 2]) / (positionsM[n - 1] - positionsM[n - 2]);
    const midSlopeKPerM = Math.abs((temperaturesC[1] - temperaturesC[0]) / (positionsM[1] - positionsM[0]));
    expect(Math.abs(endSlopeKPerM)).toBeLessThan(0.05 * midSlopeKPerM);
    expect(joints).toHaveLength(1);
    expect(joints[0]).toMatchObject({ positionM: 2, resistanceMicroOhm: 12, assumed: false });
    expect(r.result.flags.map((f) => f.code)).not.toContain('JOINT_RESISTANCE_ASSUMED');
  });

  it('a check the library refuses comes back as a failure naming the field, not as an exception', () => {
    // 23 hourly values cannot make a day of equal hours (the sheet schema refuses them too; here the glue is fed them directly).
    const inputs = cableSheet();
    inputs.overTime.dailyProfileA = hourly(500, 250).slice(0, 23);
    const r = computeBeyondSteady(inputs, cable240.id)!.overTime!;
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.field).toBe('currentsA');
    expect(r.message).toMatch(/24/);
  });
});

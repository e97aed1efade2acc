// The sheet's bus-bar system and protection (inputs version 6) → the sizing library, and back to
// words (issues 18 and 21). The mapping is checked field by field; the figures through the library
// are checked against the standards' formulas worked by hand in the comments (IEC 60909-0 κ,
// IEC 60364-4-43 §433.1, IEC 60364-4-41 §411 with IEC 60287-1-1 resistances), and the sheet's
// evaluation is shown to be the library's for the same data (one model, not two).
import { describe, expect, it } from 'vitest';
import { evaluateCandidate } from '@/lib/electrical';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { arrangementRefusalOf } from '@/lib/sheet/arrangementCheck';
import { candidateRow } from '@/lib/sheet/candidateRow';
import { computeSheet } from '@/lib/sheet/compute';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet/schema';
import { toBusbarSystem, toProtection, withSheetBarGap } from '@/lib/sheet/systemToSizing';
import { forcesLines, packBarRows, protectionLines, protectionVerdicts } from '@/lib/sheet/systemWords';
import { toCandidates, toConditions } from '@/lib/sheet/toSizing';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';

function barSheet(change: (inputs: SheetInputs) => void = () => {}): SheetInputs {
  const inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 2000, lengthM: 10, reactanceOhmPerM: 0.15e-3 };
  inputs.environment = { ...inputs.environment, ambientC: 35, solarAbsorptivity: null };
  inputs.fault = { checked: true, currentA: 40_000, durationS: 0.5 };
  inputs.candidates = [testCopperBar(100, 10, { barsPerPhase: 3, emissivity: 0.9 })];
  inputs.chosenCandidateId = inputs.candidates[0].id;
  change(inputs);
  return inputs;
}

const firstOk = (inputs: SheetInputs): CandidateEvaluationOk => {
  const c = computeSheet(inputs);
  if (!c.ok) throw new Error(c.error.message);
  const e = c.comparison.evaluations[0];
  if (!e.ok) throw new Error(`${e.error.field}: ${e.error.message}`);
  return e;
};

const described = (i: SheetInputs) =>
  void Object.assign(i.busbarSystem, { phaseSpacingM: 0.2, supportSpacingM: 0.5, supports: 'continuous-three-or-more-spans', supportStrengthN: 25_000, peakFactorBy: 'r-over-x', rOverX: 0.1 });

describe('the bus-bar system to the library', () => {
  it('nothing entered: no system object (the library assumes the phase spacing and flags it)', () => {
    const inputs = barSheet();
    expect(toBusbarSystem(inputs)).toBeUndefined();
    expect(toConditions(inputs).installation).toEqual({ kind: 'bar-on-edge' });
  });

  it('every entered field, as entered; the peak factor by the way chosen', () => {
    const inputs = barSheet(described);
    expect(toConditions(inputs).installation).toEqual({
      kind: 'bar-on-edge',
      system: { phaseSpacingM: 0.2, supportSpacingM: 0.5, supports: 'continuous-three-or-more-spans', supportStrengthN: 25_000, rOverX: 0.1 },
    });
    inputs.busbarSystem.peakFactorBy = 'kappa';
    inputs.busbarSystem.packNodes = 'per-pack';
    inputs.busbarSystem.spacerSpacingM = 0.25;
    expect(toBusbarSystem(inputs)).toEqual({ phaseSpacingM: 0.2, supportSpacingM: 0.5, spacerSpacingM: 0.25, supports: 'continuous-three-or-more-spans', supportStrengthN: 25_000, kappa: 1.8, packNodes: 'per-pack' });
    inputs.busbarSystem.peakFactorBy = 'assumed';
    expect(toBusbarSystem(inputs)).not.toHaveProperty('kappa');
    expect(toBusbarSystem(inputs)).not.toHaveProperty('rOverX');
  });

  it('bars inside an enclosure take the system; cables never do', () => {
    const enclosed = barSheet((i) => {
      described(i);
      Object.assign(i.installation, { kind: 'enclosure', enclosureInside: 'bar-flat', enclosureDerating: 0.9 });
    });
    expect(toConditions(enclosed).installation).toMatchObject({ kind: 'enclosure', inside: 'bar-flat', system: { phaseSpacingM: 0.2 } });
    const cable = barSheet((i) => {
      described(i);
      i.installation.kind = 'cable-in-air';
    });
    expect(toConditions(cable).installation).not.toHaveProperty('system');
  });

  it('the sheet’s gap applies to packs only; a single bar keeps its own data', () => {
    const inputs = barSheet((i) => {
      i.busbarSystem.barGapM = 0.015;
      i.candidates.push(testCopperBar(80, 10));
    });
    const [pack, single] = toCandidates(inputs);
    expect(pack).toMatchObject({ barsPerPhase: 3, barGapM: 0.015 });
    expect(single).toEqual(inputs.candidates[1]);
    expect(withSheetBarGap(testCable240, inputs)).toBe(testCable240);
  });

  it('the sheet’s evaluation of a three-bar pack is the library’s for the same data (one model)', () => {
    const inputs = barSheet(described);
    const sheet = firstOk(inputs);
    const library = evaluateCandidate(toCandidates(inputs)[0], toConditions(inputs));
    if (!library.ok) throw new Error(library.error.message);
    expect(sheet.ampacityA).toBe(library.ampacityA);
    expect(sheet.pack).toEqual(library.pack);
    expect(sheet.forces).toEqual(library.forces);
    // Every bar of the three phases in the table, the hottest marked once.
    const rows = packBarRows(sheet.pack!);
    expect(rows).toHaveLength(9);
    const governing = rows.filter((r) => r.governs);
    expect(governing).toHaveLength(1);
    expect(governing[0].temperatureC).toBe(Math.max(...rows.map((r) => r.temperatureC)));
  });

  it('κ from R/X = 0.1 by IEC 60909-0 eq. (55): κ = 1.02 + 0.98·e^(−0.3) = 1.74600; i_p = κ·√2·40 kA = 98.77 kA', () => {
    const e = firstOk(barSheet(described));
    const kappa = 1.02 + 0.98 * Math.exp(-3 * 0.1);
    expect(e.forces!.kappa).toBeCloseTo(kappa, 9);
    expect(e.forces!.peakCurrentA).toBeCloseTo(kappa * Math.SQRT2 * 40_000, 3);
    const shown = forcesLines(e.forces!, 0.5);
    expect(shown[0].value).toBe(`98.77 kA (κ = 1.746)`);
    // The verdict lines say what the library decided.
    expect(shown.find((l) => l.label.startsWith('Bending stress'))!.verdict).toBe(e.forces!.stressRatio <= 1 ? 'passes' : 'fails');
    const row = candidateRow(e);
    expect([row.forces, row.stressRatio, row.supportForceN]).toEqual([e.forces!.passes ? 'passes' : 'fails', e.forces!.stressRatio, Math.max(e.forces!.supportForceAN, e.forces!.supportForceBN)]);
  });

  it('packs that overlap are refused on the phase spacing field: 3 × 10 mm bars with 10 mm gaps are 50 mm across, more than 40 mm centre to centre', () => {
    const inputs = barSheet((i) => void (i.busbarSystem.phaseSpacingM = 0.04));
    const c = computeSheet(inputs);
    if (!c.ok) throw new Error(c.error.message);
    const refusal = arrangementRefusalOf(c.comparison.evaluations);
    expect(refusal?.field).toBe('busbarSystem.phaseSpacingM');
    expect(refusal?.candidateLabel).toBe(inputs.candidates[0].label);
    // 50 mm across: the same sheet at 51 mm is accepted.
    const fits = computeSheet(barSheet((i) => void (i.busbarSystem.phaseSpacingM = 0.051)));
    if (!fits.ok) throw new Error(fits.error.message);
    expect(arrangementRefusalOf(fits.comparison.evaluations)).toBeNull();
  });
});

function cableSheet(change: (inputs: SheetInputs) => void = () => {}): SheetInputs {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 300, lengthM: 120 };
  inputs.environment = { ...inputs.environment, ambientC: 30 };
  inputs.candidates = [testCable240];
  inputs.chosenCandidateId = testCable240.id;
  change(inputs);
  return inputs;
}

describe('the protection to the library and its verdicts', () => {
  it('no device: nothing checked, no protection part', () => {
    const inputs = cableSheet();
    expect(toProtection(inputs)).toBeUndefined();
    expect(firstOk(inputs).protection).toBeUndefined();
    expect(protectionVerdicts(firstOk(inputs))).toBeNull();
  });

  it('a 315 A gG fuse at I_B = 300 A: §433.1 worked by hand — I_B ≤ I_n ≤ I_z and I₂ = 1.6·I_n = 504 A ≤ 1.45·I_z (IEC 60269-1 factor 1.6, from memory)', () => {
    const inputs = cableSheet((i) => Object.assign(i.protection, { included: true, device: { ...i.protection.device, kind: 'fuse-gG-iec60269', ratedCurrentA: 315 } }));
    expect(toProtection(inputs)).toEqual({ device: { kind: 'fuse-gG-iec60269', ratedCurrentA: 315 }, systemEarthing: 'TN', circuit: 'distribution' });
    const e = firstOk(inputs);
    const Iz = e.ampacityA;
    const [ib, iz, i2] = e.protection!.coordination!.inequalities;
    expect([ib.left, ib.right, ib.holds]).toEqual([300, 315, true]);
    expect([iz.left, iz.right, iz.holds]).toEqual([315, Iz, 315 <= Iz]);
    expect(i2.left).toBeCloseTo(1.6 * 315, 9);
    expect(i2.right).toBeCloseTo(1.45 * Iz, 9);
    // 240 mm² in trefoil in free air rates well above 347.6 A = 504/1.45, so both conditions hold.
    expect(Iz).toBeGreaterThan(504 / 1.45);
    expect(protectionVerdicts(e)!.coordination).toBe('passes');
    const row = candidateRow(e);
    expect([row.deviceCurrentA, row.coordination]).toEqual([315, 'passes']);
    // The smallest rating of the IEC 60269 gG series (… 250, 315, 400 …, from memory) with I_n ≥ I_B = 300 A is 315 A.
    expect(row.smallestDeviceA).toBe(315);
    const lines = protectionLines(e);
    expect(lines[0]).toEqual({ label: 'I_B ≤ I_n (IEC 60364-4-43 §433.1)', value: '300 A ≤ 315 A', verdict: 'passes' });
  });

  it('a device above I_z fails I_n ≤ I_z: a blocker, the verdict and the row say so', () => {
    const probe = firstOk(cableSheet());
    // The next gG rating above I_z (IEC 60269 series from memory: … 500, 630, 800 …).
    const above = [400, 500, 630, 800, 1000].find((r) => r > probe.ampacityA)!;
    const e = firstOk(cableSheet((i) => Object.assign(i.protection, { included: true, device: { ...i.protection.device, kind: 'fuse-gG-iec60269', ratedCurrentA: above } })));
    expect(e.protection!.coordination!.inequalities[1]).toMatchObject({ text: 'I_n ≤ I_z', left: above, holds: false });
    expect(e.passes).toBe(false);
    expect(e.flags.find((f) => f.code === 'PROTECTION_OVERLOAD_NOT_COORDINATED')?.severity).toBe('blocker');
    expect(candidateRow(e)).toMatchObject({ coordination: 'fails', stateKey: 'over' });
    expect(candidateRow(e).state).toContain('overload protection');
  });

  it('the earth-fault loop through the candidate (IEC 60364-4-41 §411): Z_s = |R_s + (R_ph + R_pe)(250 °C) + jX_s|, by hand', () => {
    const inputs = cableSheet((i) => {
      Object.assign(i.protection, {
        included: true,
        device: { ...i.protection.device, kind: 'fuse-gG-iec60269', ratedCurrentA: 315, timeCurrentCurve: [{ currentA: 1000, timeS: 100 }, { currentA: 2500, timeS: 5 }, { currentA: 6000, timeS: 0.1 }] },
        sourceBy: 'r-and-x',
        sourceResistanceOhm: 0.01,
        sourceReactanceOhm: 0.02,
      });
      i.protection.protectiveConductor = { entered: true, sectionMm2: 120, material: 'same', insulation: 'thermosetting-90', arrangement: 'in-cable-or-bunched' };
    });
    expect(toProtection(inputs)).toMatchObject({ source: { resistanceOhm: 0.01, reactanceOhm: 0.02 }, protectiveConductor: { sectionMm2: 120, insulation: 'thermosetting-90', arrangement: 'in-cable-or-bunched' } });
    expect(toProtection(inputs)!.protectiveConductor).not.toHaveProperty('material');
    const e = firstOk(inputs);
    const d = e.protection!.disconnection!;
    // Both conductors at the XLPE short-circuit limit 250 °C: R = R₂₀[1 + α₂₀(250 − 20)], α₂₀ = 3.93e-3 /K (IEC 60287-1-1 Table 1);
    // the protective conductor R₂₀ = ρ₂₀/S with ρ₂₀ = 1.7241e-8 Ω·m (same table) over 120 mm².
    const hot = 1 + 3.93e-3 * (250 - 20);
    const rPhase = 0.0754e-3 * hot * 120;
    const rPe = (1.7241e-8 / 120e-6) * hot * 120;
    const zs = Math.hypot(0.01 + rPhase + rPe, 0.02);
    expect(d.loop.impedanceOhm).toBeCloseTo(zs, 9);
    // I_a = c_min·U₀/Z_s with c_min = 0.95 (IEC 60909-0 low voltage, from memory).
    expect(d.faultCurrentA).toBeCloseTo((0.95 * 230) / zs, 6);
    // The fuse's time at I_a, log–log between the entered points (2500 A, 5 s) and (6000 A, 0.1 s):
    // t = exp(ln 5 + s·ln(0.1/5)), s = ln(I_a/2500)/ln(6000/2500); within 5 s, the distribution-circuit time of §411.3.2.3 (from memory).
    const s = Math.log(d.faultCurrentA / 2500) / Math.log(6000 / 2500);
    expect(d.faultCurrentA).toBeGreaterThan(2500);
    expect(d.faultCurrentA).toBeLessThan(6000);
    expect(d.operating.timeS).toBeCloseTo(Math.exp(Math.log(5) + s * Math.log(0.1 / 5)), 9);
    expect(d.required.timeS).toBe(5);
    const v = protectionVerdicts(e)!;
    expect(v.disconnection).toBe('passes');
    expect(v.protectiveConductor).toBe(e.protection!.protectiveConductor!.installed!.verdict === 'pass' ? 'passes' : 'fails');
    expect(protectionLines(e).find((l) => l.label.startsWith('Earth-fault loop'))!.value).toContain(`${(zs * 1000).toPrecision(4).replace(/\.?0+$/, '')} mΩ`);
  });

  it('an adjustable breaker: its setting is I_n of §433.1, its trip-unit settings the series searched', () => {
    const inputs = cableSheet((i) =>
      Object.assign(i.protection, { included: true, device: { ...i.protection.device, kind: 'breaker-iec60947-2', ratedCurrentA: 400, settingCurrentA: 320, instantaneousCurrentA: 3200, settingStepsA: [400, 250, 320] } }),
    );
    expect(toProtection(inputs)).toEqual({
      device: { kind: 'breaker-iec60947-2', ratedCurrentA: 400, settingCurrentA: 320, instantaneousCurrentA: 3200 },
      deviceSeriesA: [250, 320, 400],
      systemEarthing: 'TN',
      circuit: 'distribution',
    });
    const e = firstOk(inputs);
    expect(e.protection!.coordination!.deviceCurrentA).toBe(320);
    // I₂ = 1.30·I_r (IEC 60947-2, from memory) = 416 A.
    expect(e.protection!.coordination!.conventionalOperatingCurrentA).toBeCloseTo(1.3 * 320, 9);
  });

  it('third harmonics: a four-core cable’s neutral by Annex E, I_N = 3·h₃·I_B = 3·0.4·300 A = 360 A (the 33–45 % band sizes on the neutral, factor 0.86, from memory)', () => {
    const four = { ...testCable240, id: 'cu-xlpe-4c-240', cores: 4 };
    const inputs = cableSheet((i) => {
      i.candidates = [four];
      i.chosenCandidateId = four.id;
      i.harmonics.thirdHarmonicPercent = 40;
    });
    expect(toConditions(inputs).thirdHarmonicPercent).toBe(40);
    const e = firstOk(inputs);
    expect(e.harmonics!.neutralCurrentA).toBeCloseTo(360, 9);
    expect(e.harmonics!.sizingCurrentA).toBeCloseTo(360 / 0.86, 9);
    // Annex E against the rating with three loaded cores; the heat balance (with the neutral's
    // loss) against the design current: both must hold for 'passes'.
    const threeLoaded = e.harmonics!.ratingThreeLoadedCoresA;
    expect(threeLoaded).toBeGreaterThan(e.ampacityA);
    expect(protectionVerdicts(e)!.harmonics).toBe(360 / 0.86 <= threeLoaded && 300 <= e.ampacityA ? 'passes' : 'fails');
    expect(toConditions(cableSheet((i) => void (i.harmonics.thirdHarmonicPercent = 0)))).not.toHaveProperty('thirdHarmonicPercent');
  });
});

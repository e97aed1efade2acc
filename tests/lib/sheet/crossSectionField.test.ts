// lib/sheet/crossSectionField.ts — "Solve the cross-section" for a sheet's candidate — and its part of
// the saved snapshot (lib/sheet/snapshot.ts). Outside references, each worked by hand here:
// - the losses: W_c = I²·R₂₀[1 + α(θ − 20)]·(1 + y_s + y_p), IEC 60287-1-1 §2.1 (from memory), the
//   factor of the circuit's own cables at the governing cable's conductor temperature, as the
//   sizing library settles it (lib/electrical/sizing/groupSolve.ts);
// - the drop through the coverings: θ_c − θ_s = W_c·(T₁ + T₃), T = ρ/(2π)·ln(D_out/D_in),
//   IEC 60287-1-1 eq. (1) without dielectric and screen losses;
// - the surface rises: IEC 60287-2-1 §4.2.3 superposition (Kennelly's images) at the field's losses;
// - the ampacity: the current at which the governing conductor reaches its 90 °C limit (XLPE,
//   common practice): below it at the field's ampacity, above it 0.2 A higher;
// - the picture: bilinear sampling of a field linear in depth is exact, and its isotherms are the
//   horizontal lines depth = (T − a)/b; the colour ramp's ends are viridis' published end colours.
import { describe, expect, it } from 'vitest';
import { multicoreCableThermal } from '@/lib/electrical/multicore';
import { computeSheet } from '@/lib/sheet/compute';
import { crossSectionInputOf } from '@/lib/sheet/crossSection';
import { FIELD_CAUTION, fieldCableRows, fieldReportSentences, savedFieldCheck, solveSheetCrossSection, type FieldReport } from '@/lib/sheet/crossSectionField';
import { isotherms, samplePicture, viridisColour } from '@/lib/sheet/fieldPicture';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet/schema';
import { approvalReadiness, buildSnapshot, FIELD_CHECK_NAME, readSnapshot, savedCrossSection } from '@/lib/sheet/snapshot';
import type { CrossSectionField } from '@/lib/thermal/crossSection';
import { testCable240 } from '../../helpers/sheetCandidates';

const DE = 0.0252;
const R20 = 0.0754e-3;
const ALPHA = 3.93e-3;

function buried(extra: Partial<SheetInputs['installation']> = {}): SheetInputs {
  const v = defaultSheetInputs('buried');
  v.circuit = { ...v.circuit, designCurrentA: 300 };
  v.installation = { ...v.installation, depthM: 0.8, soilResistivityKmPerW: 1.2, groundC: 20, ...extra };
  v.candidates = [testCable240];
  v.chosenCandidateId = testCable240.id;
  return v;
}

/** IEC 60287-1-1 §2.1 (from memory), three single cores at axis spacing s, k_s = k_p = 1, 50 Hz. */
function iecAcFactor(temperatureC: number, s: number, dc = 0.018): number {
  const rPrime = R20 * (1 + ALPHA * (temperatureC - 20));
  const x2 = ((8 * Math.PI * 50) / rPrime) * 1e-7;
  const f = (x2 * x2) / (192 + 0.8 * x2 * x2);
  const ratio = dc / s;
  return 1 + f + f * ratio * ratio * (0.312 * ratio * ratio + 1.18 / (f + 0.27));
}

const layer = (rho: number, dIn: number, dOut: number) => (rho / (2 * Math.PI)) * Math.log(dOut / dIn);
/** XLPE 18 → 21.4 mm at 3.5 K·m/W, PVC 21.4 → 25.2 mm at 5.0 K·m/W (the test cable's data). */
const T1_PLUS_T3 = layer(3.5, 0.018, 0.0214) + layer(5.0, 0.0214, 0.0252);

describe('solving the cross-section of a touching trefoil alone (isothermal surface)', () => {
  const inputs = buried();
  const report = solveSheetCrossSection(inputs, testCable240.id);
  const iec = computeSheet(inputs);
  if (!iec.ok || !iec.comparison.evaluations[0].ok) throw new Error('the sheet must compute');
  const evaluation = iec.comparison.evaluations[0];

  it('converges, and each conductor’s loss is I²R(θ)·F_ac with F_ac of IEC 60287-1-1 §2.1 at the governing cable’s temperature', () => {
    expect(report.status).toBe('converged');
    const governingC = report.governing!.conductorC;
    const factor = iecAcFactor(governingC, DE);
    report.cables.forEach((c) => {
      const expected = 300 * 300 * R20 * (1 + ALPHA * (c.conductorC! - 20)) * factor;
      expect(c.heatWPerM! / expected - 1).toBeCloseTo(0, 5);
    });
  });

  it('conductor − surface = W_c·(T₁ + T₃) (IEC 60287-1-1 eq. 1) and the surface rises follow the IEC 60287-2-1 superposition within 0.5 %', () => {
    report.cables.forEach((c) => expect(c.conductorC! - c.surfaceC!).toBeCloseTo(c.heatWPerM! * T1_PLUS_T3, 6));
    const m = crossSectionInputOf(inputs, testCable240.id, { surface: 'isothermal', heatTransferCoefficientWPerM2K: 10, mesh: 'sheet' });
    const cables = m.input.cables;
    const watts = report.cables.map((c) => c.heatWPerM!);
    cables.forEach((p, ip) => {
      let rise = 0;
      cables.forEach((k, ik) => {
        if (ip === ik) {
          const u = (2 * p.depthM) / DE;
          rise += ((watts[ik] * 1.2) / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
        } else {
          rise += ((watts[ik] * 1.2) / (2 * Math.PI)) * Math.log(Math.hypot(p.xM - k.xM, p.depthM + k.depthM) / Math.hypot(p.xM - k.xM, p.depthM - k.depthM));
        }
      });
      expect(Math.abs((report.cables[ip].surfaceC! - 20) / rise - 1)).toBeLessThan(0.005);
    });
  });

  it('sets every cable beside the rating’s own figure for it (evaluation.group), and the ampacity beside the rating’s', () => {
    report.cables.forEach((c, k) => {
      expect(c.iecConductorC).toBe(evaluation.group!.cables[k].conductorC);
      expect(c.differenceK).toBeCloseTo(c.conductorC! - c.iecConductorC!, 12);
    });
    expect(report.ampacity.iecA).toBe(evaluation.ampacityA);
    expect(report.ampacity.differencePercent).toBeCloseTo((100 * (report.ampacity.fieldA! - evaluation.ampacityA)) / evaluation.ampacityA, 10);
    // The governing cable is the hottest of the circuit's own (all three are the circuit's here).
    expect(report.governing!.conductorC).toBe(Math.max(...report.cables.map((c) => c.conductorC!)));
    expect(report.limitC).toBe(90);
  });

  it('the field’s ampacity brings the governing conductor to its 90 °C limit: below it there, above it 0.2 A higher', () => {
    const at = (currentA: number) => solveSheetCrossSection({ ...inputs, circuit: { ...inputs.circuit, designCurrentA: currentA } }, testCable240.id, { pictureColumns: 0 });
    const fieldA = report.ampacity.fieldA!;
    expect(at(fieldA).governing!.conductorC).toBeLessThanOrEqual(90 + 1e-6);
    expect(at(fieldA + 0.2).governing!.conductorC).toBeGreaterThan(90);
  });

  it('words for the PDF carry the figures; the caution is stated; the report is plain JSON', () => {
    const words = fieldReportSentences(report);
    expect(words.results.join(' ')).toContain(`${report.ampacity.fieldA!.toPrecision(4).replace(/\.?0+$/, '')} A`);
    expect(words.method).toContain(`${report.mesh.cells} cells`);
    const rows = fieldCableRows(report);
    expect(rows.filter((r) => r.governs)).toHaveLength(1);
    expect(FIELD_CAUTION).toContain('IEC 60287 rating');
    expect(JSON.parse(JSON.stringify(report))).toEqual(report);
  });
});

describe('one three-core cable buried alone', () => {
  // Three round cores of 11.5 mm, XLPE 1.7 mm, touching on one circle under a PVC sheath of 1.9 mm
  // (the candidate's data). Inside the sheath: the multi-core heat path of lib/electrical/multicore
  // (checked on its own against IEC 60287-2-1 geometry in tests/lib/electrical/multicore*.test.ts);
  // the sheath T₃ = ρ/(2π)·ln(D_e/D_s) and the single-cable T₄ = ρ/(2π)·ln(u + √(u² − 1)),
  // u = 2L/D_e, of IEC 60287-2-1 §2.2.3 (from memory), worked by hand. D_e by hand: the cores'
  // circle has radius s = 7.45 mm / sin 60° = 8.6025 mm, so the sheath's bore is 2·(s + 7.45) =
  // 32.105 mm and D_e = 32.105 + 2·1.9 = 35.905 mm.
  const threeCore = { ...testCable240, id: 'cu-3c-95', label: '3 × 95 mm² (test)', cores: 3, sectionMm2: 95, r20OhmPerM: 0.193e-3, conductorDiameterM: 0.0115 };
  const inputs = defaultSheetInputs('buried');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 180 };
  inputs.installation = { ...inputs.installation, depthM: 0.8, soilResistivityKmPerW: 1.2, groundC: 20 };
  inputs.candidates = [threeCore];
  inputs.chosenCandidateId = threeCore.id;
  const report = solveSheetCrossSection(inputs, threeCore.id, { pictureColumns: 0 });

  it('the field and the rating both within 0.5 % of IEC 60287 eq. (1) with the multi-core internal path and the single-cable T₄, at the field’s loss', () => {
    const m = multicoreCableThermal({
      cores: 3,
      conductorDiameterM: 0.0115,
      insulationThicknessM: 0.0017,
      insulationResistivityKmPerW: 3.5,
      innerCoveringThicknessM: 0,
      coreLossesWPerM: [1, 1, 1],
      outerLayers: [{ thicknessM: 0.0019, thermalResistivityKmPerW: 5.0 }],
    });
    const de = 2 * (0.00745 / Math.sin(Math.PI / 3) + 0.00745) + 2 * 0.0019;
    expect(Math.abs(m.outerDiameterM / de - 1)).toBeLessThan(1e-9);
    const u = (2 * 0.8) / de;
    const t4 = (1.2 / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
    const w = report.cables[0].heatWPerM!;
    const rise = w * (m.internalResistanceForTotalKmPerW + layer(5.0, de - 2 * 0.0019, de) + t4);
    expect(Math.abs((report.cables[0].conductorC! - 20) / rise - 1)).toBeLessThan(0.005);
    // The rating's figure for the cable alone (its group carries it: lib/electrical/sizing/cableGroup.ts groupResultOf).
    expect(report.cables[0].iecConductorC).not.toBeNull();
    expect(Math.abs((report.cables[0].iecConductorC! - 20) / rise - 1)).toBeLessThan(0.005);
    expect(report.governingDifferenceK).not.toBeNull();
  });
});

describe('the picture of the field', () => {
  // A field linear in depth: T = 20 + 10·depth on a 3 × 4 grid of cells 1 m × 0.5 m.
  const field: CrossSectionField = {
    nx: 3,
    ny: 4,
    xFacesM: Float64Array.from([-1.5, -0.5, 0.5, 1.5]),
    depthFacesM: Float64Array.from([0, 0.5, 1, 1.5, 2]),
    xCentresM: Float64Array.from([-1, 0, 1]),
    depthCentresM: Float64Array.from([0.25, 0.75, 1.25, 1.75]),
    temperaturesC: Float64Array.from([0.25, 0.75, 1.25, 1.75].flatMap((d) => [0, 0, 0].map(() => 20 + 10 * d))),
    cableOfCell: new Int32Array(12).fill(-1),
  };

  it('samples a field linear in depth exactly (bilinear between centres), and its isotherms are horizontal lines at (T − 20)/10', () => {
    const picture = samplePicture(field, { xMinM: -1, xMaxM: 1, depthTopM: 0.25, depthBottomM: 1.75 }, 20, 0);
    for (let r = 0; r < picture.rows; r++) {
      const depth = 0.25 + ((r + 0.5) / picture.rows) * 1.5;
      for (let c = 0; c < picture.columns; c++) expect(picture.temperaturesC[r * picture.columns + c]).toBeCloseTo(20 + 10 * depth, 2);
    }
    const [iso] = isotherms(picture, [30]);
    expect(iso.segments.length).toBeGreaterThan(0);
    for (const [, d1, , d2] of iso.segments) {
      expect(d1).toBeCloseTo(1, 2);
      expect(d2).toBeCloseTo(1, 2);
    }
  });

  it('the ramp runs from viridis’ first to its last published colour (van der Walt and Smith, 2015)', () => {
    expect(viridisColour(0)).toBe('#440154');
    expect(viridisColour(1)).toBe('#fde725');
  });
});

describe('the field in the saved snapshot', () => {
  it('is stored when the option is on, reads back through JSON, and is absent when off and in an older snapshot', () => {
    const on = buried();
    on.crossSection = { checked: true, surface: 'isothermal', heatTransferCoefficientWPerM2K: 10 };
    const snapshot = buildSnapshot(on, new Date('2026-01-01T00:00:00Z'));
    const part = savedCrossSection(snapshot);
    if (!part?.ok) throw new Error(`the field must compute: ${JSON.stringify(part)}`);
    // The server's coarser mesh, said in the result.
    expect(part.report.mesh.name).toBe('saved');
    expect(part.report.mesh.cells).toBeGreaterThan(1000);
    expect(part.report.picture!.columns).toBe(48);
    const read = readSnapshot(JSON.parse(JSON.stringify(snapshot)));
    expect(savedCrossSection(read)).toEqual(part);
    // Off: no part. An older snapshot (written before the option) reads, without it.
    expect(buildSnapshot(buried()).crossSection).toBeUndefined();
    const { crossSection: _none, ...older } = JSON.parse(JSON.stringify(snapshot));
    const olderRead = readSnapshot(older);
    expect(olderRead).not.toBeNull();
    expect(savedCrossSection(olderRead)).toBeNull();
  });

  it('a field hotter than the rating allows raises CROSS_SECTION_FIELD_HOTTER (review) among the chosen flags, exactly when its own figures say so', () => {
    // A convective surface lets less heat out than the isothermal one IEC assumes (the field runs hotter).
    const inputs = buried({ otherCircuits: [{ label: '', currentA: 300, sameCable: true, externalDiameterM: null, lossWPerM: null }], circuitSpacingM: 0.3 });
    inputs.crossSection = { checked: true, surface: 'convective', heatTransferCoefficientWPerM2K: 5 };
    const snapshot = buildSnapshot(inputs);
    const part = savedCrossSection(snapshot);
    if (!part?.ok) throw new Error('the field must compute');
    const r: FieldReport = part.report;
    const hotter = r.status !== 'converged' || (r.governing !== null && r.governing.marginK < 0) || (r.ampacity.differencePercent !== null && r.ampacity.differencePercent < -3);
    expect(snapshot.chosenFlags.some((f) => f.code === 'CROSS_SECTION_FIELD_HOTTER')).toBe(hotter);
    expect(r.reviewFlags.every((f) => f.severity === 'review')).toBe(true);
    if (hotter) expect(approvalReadiness(snapshot, []).unacknowledgedReviewCodes).toContain('CROSS_SECTION_FIELD_HOTTER');
  });

  it('on, but the installation is not buried: not computed, and approval is blocked as for any optional check that could not run', () => {
    const inputs = buried();
    inputs.installation = { ...inputs.installation, kind: 'cable-in-air' };
    inputs.crossSection = { checked: true, surface: 'isothermal', heatTransferCoefficientWPerM2K: 10 };
    const outcome = savedFieldCheck(inputs);
    expect(outcome).toEqual({ ok: false, message: expect.stringContaining('buried'), field: 'installation.kind' });
    const snapshot = buildSnapshot(inputs);
    expect(snapshot.optionalCheckFailures).toContainEqual({ check: FIELD_CHECK_NAME, message: outcome!.ok ? '' : outcome!.message });
    expect(approvalReadiness(snapshot, []).blockerCodes).toContain('OPTIONAL_CHECK_NOT_COMPUTED');
  });
});

// lib/sheet/crossSection.ts: a sheet's buried candidate → the input of the 2-D cross-section solver
// (lib/thermal/crossSection). Outside references, each worked by hand here:
// - positions: a touching trefoil is an equilateral triangle of side D_e about its centroid, apex up
//   (apex s/√3 above, base s/(2√3) below the centroid); a flat row at ±s; circuits one circuit
//   spacing apart centre to centre — the geometry IEC 60287-2-1 rates; and the same positions as
//   the sizing library's own layout (evaluation.group, the IEC rating's);
// - coverings: D = d_c + 2·Σt (plain geometry);
// - R_ac/R_dc: IEC 60287-1-1 §2.1 skin and proximity formulae (from memory), three single cores;
// - duct: IEC 60287-2-1 Table 4 constants of plastic ducts U 1.87, V 0.312, Y 0.0037 and PVC wall
//   6.0 K·m/W of Table 1 (both from memory);
// - the field end to end: each cable's surface rise against the IEC 60287-2-1 §4.2.3 superposition
//   (Kennelly's images) worked here at the field's own losses.
import { describe, expect, it } from 'vitest';
import { computeSheet } from '@/lib/sheet/compute';
import { crossSectionInputOf, type FieldSettings } from '@/lib/sheet/crossSection';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet/schema';
import { solveCrossSection, type CrossSectionCable } from '@/lib/thermal/crossSection';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';

const ISOTHERMAL: FieldSettings = { surface: 'isothermal', heatTransferCoefficientWPerM2K: 10, mesh: 'sheet' };
/** testCable240: d_c 18 mm, XLPE 1.7 mm, PVC 1.9 mm → D_e = 18 + 2·(1.7 + 1.9) = 25.2 mm. */
const DE = 0.0252;

function buried(change: (i: SheetInputs['installation']) => Partial<SheetInputs['installation']> = () => ({})): SheetInputs {
  const v = defaultSheetInputs('buried');
  v.circuit = { ...v.circuit, designCurrentA: 300 };
  v.installation = { ...v.installation, depthM: 0.8, soilResistivityKmPerW: 1.2, groundC: 20, ...change(v.installation) };
  v.candidates = [testCable240];
  v.chosenCandidateId = testCable240.id;
  return v;
}

function libraryGroup(inputs: SheetInputs) {
  const computed = computeSheet(inputs);
  if (!computed.ok || !computed.comparison.evaluations[0].ok) throw new Error('the sheet must compute');
  return computed.comparison.evaluations[0].group!;
}

/** IEC 60287-1-1 §2.1 (from memory): R_ac/R_dc = 1 + y_s + y_p for three single cores at axis spacing s, k_s = k_p = 1. */
function iecAcFactor(r20: number, alpha: number, temperatureC: number, frequencyHz: number, dc: number, s: number): number {
  const rPrime = r20 * (1 + alpha * (temperatureC - 20));
  const x4 = ((8 * Math.PI * frequencyHz) / rPrime) * 1e-7 * ((8 * Math.PI * frequencyHz) / rPrime) * 1e-7;
  const f = x4 / (192 + 0.8 * x4);
  const ratio = dc / s;
  return 1 + f + f * ratio * ratio * (0.312 * ratio * ratio + 1.18 / (f + 0.27));
}

/** IEC 60287-2-1 §4.2.3 worked by hand: ΔT_p = W_p·ρ/(2π)·ln(u + √(u² − 1)) + Σ_k W_k·ρ/(2π)·ln(d′_pk/d_pk). */
function superposition(cables: CrossSectionCable[], watts: number[], rho: number): number[] {
  return cables.map((p, ip) =>
    cables.reduce((sum, k, ik) => {
      if (ip === ik) {
        const u = (2 * p.depthM) / (p.duct?.outerDiameterM ?? p.outerDiameterM);
        return sum + ((watts[ik] * rho) / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
      }
      const d = Math.hypot(p.xM - k.xM, p.depthM - k.depthM);
      const image = Math.hypot(p.xM - k.xM, p.depthM + k.depthM);
      return sum + ((watts[ik] * rho) / (2 * Math.PI)) * Math.log(image / d);
    }, 0),
  );
}

describe('the sheet’s buried candidate as the cross-section solver sees it', () => {
  it('a touching trefoil alone: positions of the equilateral triangle, centred; the same as the sizing library’s layout', () => {
    const inputs = buried();
    const m = crossSectionInputOf(inputs, testCable240.id, ISOTHERMAL);
    const cables = m.input.cables;
    expect(cables).toHaveLength(3);
    // Worked by hand: base cables at ∓D_e/2, D_e/(2√3) below the centroid; the apex D_e/√3 above it.
    const expected = [
      { x: -DE / 2, depth: 0.8 + DE / (2 * Math.sqrt(3)) },
      { x: DE / 2, depth: 0.8 + DE / (2 * Math.sqrt(3)) },
      { x: 0, depth: 0.8 - DE / Math.sqrt(3) },
    ];
    cables.forEach((c, k) => {
      expect(c.xM).toBeCloseTo(expected[k].x, 12);
      expect(c.depthM).toBeCloseTo(expected[k].depth, 12);
      expect(c.outerDiameterM).toBeCloseTo(DE, 12);
    });
    // The rating's own layout, in its coordinates (y up): the same places.
    const group = libraryGroup(inputs);
    group.cables.forEach((g, k) => {
      expect(cables[k].xM + m.centreXM).toBeCloseTo(g.xM, 12);
      expect(cables[k].depthM).toBeCloseTo(-g.yM, 12);
    });
  });

  it('each cable’s own model from the candidate: conductor, coverings d + 2Σt, R₂₀, α, the conductor limit, the design current', () => {
    const m = crossSectionInputOf(buried(), testCable240.id, ISOTHERMAL);
    const c = m.input.cables[0];
    expect(c.conductor.diameterM).toBeCloseTo(0.018, 12);
    expect(c.conductor.r20OhmPerM).toBeCloseTo(0.0754e-3, 15);
    // IEC 60287-1-1 Table 1: copper α₂₀ = 3.93e-3 /K (from memory).
    expect(c.conductor.alpha20PerK).toBeCloseTo(3.93e-3, 9);
    expect(c.conductor.currentA).toBe(300);
    expect(c.coverings.map((v) => v.outerDiameterM)).toEqual([expect.closeTo(0.018 + 2 * 0.0017, 12), expect.closeTo(0.018 + 2 * (0.0017 + 0.0019), 12)]);
    expect(c.coverings.map((v) => v.thermalResistivityKmPerW)).toEqual([expect.closeTo(3.5, 9), expect.closeTo(5.0, 9)]);
    // XLPE's continuous limit (the candidate's data; 90 °C is common practice for XLPE).
    expect(c.maxConductorTemperatureC).toBe(90);
    // No screen data, low voltage: no screen or dielectric loss to carry.
    expect(c.proportionalLosses).toBeUndefined();
    expect(c.dielectricLoss).toBeUndefined();
  });

  it('R_ac/R_dc is IEC 60287-1-1 §2.1 for a touching trefoil (s = D_e) at the temperature it is taken at', () => {
    const m = crossSectionInputOf(buried(), testCable240.id, ISOTHERMAL);
    const factor = m.input.cables[0].conductor.acFactor!;
    // The mapping starts at the rating's governing conductor temperature; the same formula at 40 and 90 °C brackets it.
    const at = (t: number) => iecAcFactor(0.0754e-3, 3.93e-3, t, 50, 0.018, DE);
    expect(m.acFactorAt(40)).toBeCloseTo(at(40), 9);
    expect(m.acFactorAt(90)).toBeCloseTo(at(90), 9);
    expect(factor).toBeLessThanOrEqual(at(20));
    expect(factor).toBeGreaterThanOrEqual(at(90));
  });

  it('a flat spaced row beside two other circuits: positions 70 mm and 300 mm apart, each circuit’s current, the entered one as its heat', () => {
    const inputs = buried(() => ({
      formation: 'flat',
      spacingM: 0.07,
      circuitSpacingM: 0.3,
      otherCircuits: [
        { label: 'Pump house', currentA: 200, sameCable: true, externalDiameterM: null, lossWPerM: null },
        { label: 'Lighting', currentA: 80, sameCable: false, externalDiameterM: 0.03, lossWPerM: 20 },
      ],
    }));
    const m = crossSectionInputOf(inputs, testCable240.id, ISOTHERMAL);
    const cables = m.input.cables;
    // By hand: circuit centres at 0, 0.3 and 0.6 m; each circuit's cables at −0.07, 0, +0.07 about it.
    const xs = [0, 0.3, 0.6].flatMap((c) => [c - 0.07, c, c + 0.07]);
    // The domain's centre line: the middle of the envelopes, from −0.07 − D_e/2 to 0.67 + 0.015.
    const centre = (-0.07 - DE / 2 + 0.67 + 0.015) / 2;
    expect(m.centreXM).toBeCloseTo(centre, 12);
    cables.forEach((c, k) => {
      expect(c.xM + m.centreXM).toBeCloseTo(xs[k], 12);
      expect(c.depthM).toBeCloseTo(0.8, 12);
    });
    const group = libraryGroup(inputs);
    group.cables.forEach((g, k) => expect(cables[k].xM + m.centreXM).toBeCloseTo(g.xM, 12));
    expect(cables.slice(0, 3).map((c) => c.conductor.currentA)).toEqual([300, 300, 300]);
    expect(cables.slice(3, 6).map((c) => c.conductor.currentA)).toEqual([200, 200, 200]);
    // The entered circuit: its diameter, no current, its 20 W/m per cable released at its surface, no limit of ours.
    for (const c of cables.slice(6)) {
      expect(c.outerDiameterM).toBe(0.03);
      expect(c.conductor.currentA).toBe(0);
      expect(c.fixedLosses).toEqual([expect.objectContaining({ wattsPerM: 20, afterCovering: 0 })]);
      expect(c.maxConductorTemperatureC).toBeUndefined();
    }
    expect(m.rated).toEqual([0, 1, 2]);
    // Only the circuit's own cables carry the limit: the others are another circuit's business.
    expect(cables.slice(3, 6).every((c) => c.maxConductorTemperatureC === undefined)).toBe(true);
  });

  it('the ground: soil resistivity, ground temperature at the surface and the bottom; the convective surface with its h and air at the ground temperature', () => {
    const inputs = buried();
    const iso = crossSectionInputOf(inputs, testCable240.id, ISOTHERMAL).input;
    expect(iso.soil.thermalResistivityKmPerW).toBe(1.2);
    expect(iso.surface).toEqual({ kind: 'isothermal', temperatureC: 20 });
    expect(iso.deepGroundTemperatureC).toBe(20);
    // Deep and wide enough: 50 × the cable depth, and twice that wide (lib/sheet/crossSection.ts DOMAIN_DEPTH_PER_CABLE_DEPTH).
    expect(iso.domain.depthM).toBeGreaterThanOrEqual(50 * 0.8);
    expect(iso.domain.widthM).toBeGreaterThanOrEqual(2 * iso.domain.depthM);
    const conv = crossSectionInputOf(inputs, testCable240.id, { ...ISOTHERMAL, surface: 'convective', heatTransferCoefficientWPerM2K: 12 }).input;
    expect(conv.surface).toEqual({ kind: 'convective', airTemperatureC: 20, heatTransferCoefficientWPerM2K: 12 });
  });

  it('ducts carry the IEC 60287-2-1 plastic-duct constants and the PVC wall; a backfill is a region centred on the cables', () => {
    const inputs = buried((i) => ({
      duct: { ...i.duct, used: true, material: 'pvc', innerDiameterM: 0.1, outerDiameterM: 0.11 },
      backfill: { ...i.backfill, used: true, widthM: 0.6, heightM: 0.4, centreDepthM: null, resistivityKmPerW: 0.9 },
    }));
    const m = crossSectionInputOf(inputs, testCable240.id, ISOTHERMAL);
    for (const c of m.input.cables) {
      expect(c.duct).toEqual({ innerDiameterM: 0.1, outerDiameterM: 0.11, wallThermalResistivityKmPerW: 6.0, air: { U: 1.87, V: 0.312, Y: 0.0037 } });
    }
    // Ducts touching in trefoil: side 0.11 m; the backfill 0.6 m × 0.4 m about the cables' middle, centred at the axis depth 0.8 m.
    expect(m.input.cables[2].depthM).toBeCloseTo(0.8 - 0.11 / Math.sqrt(3), 12);
    expect(m.input.regions).toEqual([{ name: 'backfill', xMinM: expect.closeTo(-0.3, 12), xMaxM: expect.closeTo(0.3, 12), depthTopM: expect.closeTo(0.6, 12), depthBottomM: expect.closeTo(1.0, 12), thermalResistivityKmPerW: 0.9 }]);
  });

  it('the field it gives: every surface rise within 0.5 % of the IEC 60287-2-1 superposition at the field’s own losses', () => {
    const inputs = buried(() => ({
      formation: 'flat',
      spacingM: 0.07,
      circuitSpacingM: 0.3,
      otherCircuits: [
        { label: '', currentA: 200, sameCable: true, externalDiameterM: null, lossWPerM: null },
        { label: '', currentA: 80, sameCable: false, externalDiameterM: 0.03, lossWPerM: 20 },
      ],
    }));
    const m = crossSectionInputOf(inputs, testCable240.id, ISOTHERMAL);
    const result = solveCrossSection(m.input);
    if (!result.converged) throw new Error(result.message);
    const watts = result.cables.map((c) => c.losses.totalWPerM);
    expect(watts.slice(6)).toEqual([20, 20, 20]);
    const rises = superposition(m.input.cables, watts, 1.2);
    result.cables.forEach((c, k) => expect(Math.abs((c.surfaceC - 20) / rises[k] - 1)).toBeLessThan(0.005));
  });
});

describe('bad input is refused with the sheet’s field named', () => {
  const fieldOf = (run: () => unknown): string | undefined => {
    try {
      run();
    } catch (error) {
      return (error as { field?: string }).field;
    }
    return 'not refused';
  };

  it('not buried, a bar, a candidate not on the sheet, a surface coefficient out of range, overlapping circuits', () => {
    const air = { ...buried(), installation: { ...buried().installation, kind: 'cable-in-air' as const } };
    expect(fieldOf(() => crossSectionInputOf(air, testCable240.id, ISOTHERMAL))).toBe('installation.kind');
    const withBar = buried();
    withBar.candidates = [testCable240, testCopperBar(60, 10)];
    expect(fieldOf(() => crossSectionInputOf(withBar, withBar.candidates[1].id, ISOTHERMAL))).toBe('candidates.1.kind');
    expect(fieldOf(() => crossSectionInputOf(buried(), 'no-such-candidate', ISOTHERMAL))).toBe('candidateId');
    expect(fieldOf(() => crossSectionInputOf(buried(), testCable240.id, { ...ISOTHERMAL, surface: 'convective', heatTransferCoefficientWPerM2K: 0 }))).toBe('crossSection.heatTransferCoefficientWPerM2K');
    // Two touching trefoils of D_e 25.2 mm need their centres at least 2·D_e = 50.4 mm apart (worked by hand): 30 mm overlaps.
    const overlapping = buried(() => ({ circuitSpacingM: 0.03, otherCircuits: [{ label: '', currentA: 100, sameCable: true, externalDiameterM: null, lossWPerM: null }] }));
    expect(fieldOf(() => crossSectionInputOf(overlapping, testCable240.id, ISOTHERMAL))).toBe('installation.circuitSpacingM');
  });
});

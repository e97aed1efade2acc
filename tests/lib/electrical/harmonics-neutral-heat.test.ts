import { describe, expect, it } from 'vitest';
import { evaluateCandidate, type CableCandidate, type CandidateEvaluationOk, type Conditions } from '@/lib/electrical';
import { multicoreCableThermal } from '@/lib/electrical/multicore';

/**
 * Third harmonics in a four-core cable (issue 21 item 4, IEC 60364-5-52 Annex E): the neutral
 * carries I_N = 3·h₃·I_B and its loss enters the heat balance — a fourth loaded core giving off
 * (3·h₃)² of a phase core's heat — while the standard's own check (the sizing current over the
 * Annex E factor against the three-loaded-core rating) stands beside it.
 *
 * Reference worked here: with DC and a fixed surface coefficient every thermal resistance is
 * linear, and the hottest core sits at the limit in both states, so the rating with the neutral's
 * heat over the rating without is, exactly,
 *   I_h / I_0 = √[ 3·(M₀ + T_c + T_out) / ((3 + 9h²)·(M_h + T_c + T_out)) ],
 * M the hottest core's rise over the sheath bore per W/m of the cable's total loss for the loss
 * shares [1, 1, 1, 9h²] (lib/electrical/multicore, itself checked against an independent
 * finite-difference solution in tests/lib/electrical/multicore.test.ts), T_c = 1/(4πk_Cu) the
 * equivalent conductor's own rise, T_out = T₃ + 1/(h·π·D) (IEC 60287-2-1 §4.1.4 for T₃).
 */
const ok = (e: ReturnType<typeof evaluateCandidate>): CandidateEvaluationOk => {
  if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
  return e;
};
const mm = 1e-3;
const RHO = 3.5;
const H = 10;
// An illustrative four-core build (not a maker's): d_c 11 mm, XLPE 1.1 mm, inner covering 1.0 mm, sheath 1.8 mm.
const fourCore: CableCandidate = {
  kind: 'cable',
  id: 'four-core-95',
  label: 'Cu/XLPE 4×95 mm² (illustrative build)',
  material: 'copper',
  sectionMm2: 95,
  r20OhmPerM: 0.193e-3,
  conductorDiameterM: 11 * mm,
  cores: 4,
  layers: [
    { name: 'XLPE insulation', role: 'insulation', thicknessM: 1.1 * mm, thermalResistivityKmPerW: RHO, continuousLimitC: 90 },
    { name: 'inner covering', role: 'bedding', thicknessM: 1.0 * mm, thermalResistivityKmPerW: RHO },
    { name: 'sheath', role: 'sheath', thicknessM: 1.8 * mm, thermalResistivityKmPerW: RHO },
  ],
  emissivity: 0.9,
};
const conditions = (thirdHarmonicPercent: number, designCurrentA = 150): Conditions => ({
  designCurrentA,
  frequencyHz: 0,
  phases: 3,
  nominalVoltageV: 230,
  lengthM: 10,
  powerFactor: 1,
  ambientC: 30,
  installation: { kind: 'cable-in-air' },
  surfaceCoefficientWPerM2K: H,
  ...(thirdHarmonicPercent > 0 ? { thirdHarmonicPercent } : {}),
});

function expectedRatio(h: number): number {
  const build = (neutral: number) =>
    multicoreCableThermal({
      cores: 4,
      conductorDiameterM: 11 * mm,
      insulationThicknessM: 1.1 * mm,
      insulationResistivityKmPerW: RHO,
      fillerResistivityKmPerW: RHO,
      innerCoveringThicknessM: 1.0 * mm,
      coreLossesWPerM: [1, 1, 1, neutral],
      outerLayers: [{ thicknessM: 1.8 * mm, thermalResistivityKmPerW: RHO }],
    });
  const share = (3 * h) ** 2;
  const without = build(0);
  const withNeutral = build(share);
  const tOut = without.outerLayerResistancesKmPerW.reduce((s, l) => s + l.kmPerW, 0) + 1 / (H * Math.PI * without.outerDiameterM);
  const tConductor = 1 / (4 * Math.PI * 401); // copper k = 401 W/(m·K) (handbook value, from memory); < 0.1 % of the total
  return Math.sqrt((3 * (without.internalResistanceForTotalKmPerW + tConductor + tOut)) / ((3 + share) * (withNeutral.internalResistanceForTotalKmPerW + tConductor + tOut)));
}

describe("the neutral's heat is in the heat balance of a four-core cable", () => {
  const none = ok(evaluateCandidate(fourCore, conditions(0)));

  it('at 0 % third harmonic the neutral carries nothing: no harmonics result, the three-loaded-core rating', () => {
    expect(none.harmonics).toBeUndefined();
    expect(none.flags.map((f) => f.code)).not.toContain('HARMONICS_NEUTRAL_HEAT');
  });

  for (const percent of [20, 40]) {
    it(`at ${percent} %: the rating falls by the ratio worked from the loss shares [1, 1, 1, (3·h₃)²] (within 0.05 %), and Annex E is checked against the three-loaded-core rating`, () => {
      const h = percent / 100;
      const e = ok(evaluateCandidate(fourCore, conditions(percent)));
      const r = e.harmonics!;
      expect(r.neutralHeatShare).toBeCloseTo((3 * h) ** 2, 12);
      expect(r.ratingThreeLoadedCoresA).toBeCloseTo(none.ampacityA, 9);
      expect(Math.abs(e.ampacityA / none.ampacityA / expectedRatio(h) - 1)).toBeLessThan(0.0005);
      expect(e.ampacityA).toBeLessThan(none.ampacityA);
      // Annex E beside it: I_B or I_N over the table's factor against the three-loaded-core rating.
      expect(r.annexEPasses).toBe(r.sizingCurrentA <= none.ampacityA);
      expect(e.flags.map((f) => f.code)).toContain('HARMONICS_NEUTRAL_HEAT');
    });
  }

  it('a sizing current above the three-loaded-core rating is the HARMONICS_OVER_RATING blocker', () => {
    // 50 % (> 45 %): Annex E sizes on I_N = 1.5·I_B with factor 1.0.
    const designA = (none.ampacityA / 1.5) * 1.05;
    const e = ok(evaluateCandidate(fourCore, conditions(50, designA)));
    expect(e.harmonics!.sizingCurrentA).toBeCloseTo(1.5 * designA, 9);
    expect(e.harmonics!.annexEPasses).toBe(false);
    expect(e.flags.find((f) => f.code === 'HARMONICS_OVER_RATING')?.severity).toBe('blocker');
  });
});

import { describe, expect, it } from 'vitest';
import { acResistance, evaluateCandidate, type CandidateEvaluationOk, type Conditions } from '@/lib/electrical';
import { computeSheet } from '@/lib/sheet/compute';
import { defaultSheetInputs } from '@/lib/sheet/schema';
import { cableConditions, xlpeCable } from './fixtures';

/**
 * Cables that heat each other (issue 17, physics.md §8), through the sizing layer. The fixture
 * cable: Cu 240 mm², d_c = 1.2·√240 mm (common practice), XLPE 1.7 mm (ρ_T 3.5) and PVC 1.8 mm
 * (ρ_T 5.0) (IEC 60287-2-1 Table 1, from memory), 90 °C; D_e = d_c + 7 mm.
 */
const ok = (e: ReturnType<typeof evaluateCandidate>): CandidateEvaluationOk => {
  if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
  return e;
};
const cable = xlpeCable(240);
const dc = cable.conductorDiameterM;
const De = dc + 2 * (1.7e-3 + 1.8e-3);
// T₁ = ρ/(2π)·ln(1 + 2t₁/d_c), T₃ = ρ/(2π)·ln(1 + 2t₃/D_a) (IEC 60287-2-1 §4.1, from memory).
const T1 = (3.5 / (2 * Math.PI)) * Math.log(1 + (2 * 1.7e-3) / dc);
const T3 = (5.0 / (2 * Math.PI)) * Math.log(1 + (2 * 1.8e-3) / (dc + 2 * 1.7e-3));
/** R_ac at 90 °C, IEC 60287-1-1 §2.1 (three single-core cables, axis spacing s). */
const rAc = (spacingM: number) => acResistance({ r20: cable.r20OhmPerM, alpha20: 3.93e-3, temperature: 90, frequency: 50, proximity: { conductorDiameter: dc, spacing: spacingM, cables: 3 } }).rac;

/**
 * IEC 60287-2-1 §4.2.1 free air (from memory): h = Z/D_e^g + E; (Δθ_s)^¼ iterated from 2 as
 * [(Δθ)/(1 + K_A(Δθ_s)^¼)]^¼ with K_A = π·D_e·h·(T₁ + T₃) (no screen, no dielectric loss);
 * T₄* = 1/(π·D_e·h·(Δθ_s)^¼); then eq. (1) I = √(Δθ/(R(T₁ + T₃ + T₄*))).
 */
function freeAirByHand(Z: number, E: number, g: number, R: number, ambientC: number): number {
  const h = Z / De ** g + E;
  const KA = Math.PI * De * h * (T1 + T3);
  const dTheta = 90 - ambientC;
  let root = 2;
  for (let i = 0; i < 200; i++) root = (dTheta / (1 + KA * root)) ** 0.25;
  const T4 = 1 / (Math.PI * De * h * root);
  return Math.sqrt(dTheta / (R * (T1 + T3 + T4)));
}

describe('groups in free air: the solver with the group surface law against IEC 60287-1-1 eq. (1) (issue 17)', () => {
  it('three cables in trefoil, touching (Table 2 row 3: Z 0.96, E 1.25, g 0.2): solver, closed form and the hand calculation agree', () => {
    const e = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air' } })));
    const byHand = freeAirByHand(0.96, 1.25, 0.2, rAc(De), 30);
    expect(Math.abs(e.ampacity.closedForm!.currentA - byHand) / byHand).toBeLessThan(1e-3);
    expect(Math.abs(e.ampacity.closedForm!.differencePercent)).toBeLessThan(2);
    expect(e.flags.map((f) => f.code)).toContain('CABLE_GROUP_RATED');
  });

  it('three cables flat, touching (row 4: Z 0.62, E 1.95, g 0.25): within 2 %', () => {
    const e = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air', formation: 'flat' } })));
    const byHand = freeAirByHand(0.62, 1.95, 0.25, rAc(De), 30);
    expect(Math.abs(e.ampacity.closedForm!.currentA - byHand) / byHand).toBeLessThan(1e-3);
    expect(Math.abs(e.ampacity.closedForm!.differencePercent)).toBeLessThan(2);
  });

  it('three cables flat, spaced by at least 0.75·D_e (the table footnote: each an isolated cable): the correlations and radiation, within 3 % of the single-cable law', () => {
    const e = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air', formation: 'flat', spacingM: 2 * De } })));
    const byHand = freeAirByHand(0.21, 3.94, 0.6, rAc(2 * De), 30);
    expect(Math.abs(e.ampacity.closedForm!.currentA - byHand) / byHand).toBeLessThan(1e-3);
    expect(Math.abs(e.ampacity.closedForm!.differencePercent)).toBeLessThan(3);
  });

  it('the group rates well below the same cables taken one by one (the issue: 22–24 % too high before)', () => {
    const group = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air' } }))).ampacityA;
    const alone = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air', formation: 'flat', spacingM: 10 } }))).ampacityA;
    expect(group / alone).toBeLessThan(0.85);
  });

  it('other circuits beside it in air need a grouping factor: without one the candidate fails; with one the factor applies and the group law stays', () => {
    const near: Conditions['installation'] = { kind: 'cable-in-air', otherCircuits: [{ currentA: 300 }] };
    const without = ok(evaluateCandidate(cable, cableConditions({ installation: near })));
    expect(without.passes).toBe(false);
    expect(without.flags.map((f) => f.code)).toContain('OTHER_CIRCUITS_NOT_COVERED');
    const withFactor = ok(evaluateCandidate(cable, cableConditions({ installation: near, groupingFactor: 0.8 })));
    expect(withFactor.flags.map((f) => f.code)).not.toContain('OTHER_CIRCUITS_NOT_COVERED');
    expect(withFactor.flags.map((f) => f.code)).toEqual(expect.arrayContaining(['GROUPING_DERATING_ENTERED', 'MUTUAL_HEATING_NOT_MODELLED', 'CABLE_GROUP_RATED']));
    const own = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air' } }))).ampacityA;
    expect(Math.abs(withFactor.ampacityA - 0.8 * own)).toBeLessThan(0.2);
  });
});

describe('groups in the ground (IEC 60287-2-1 §4.2.3–4.2.4)', () => {
  const soil = { depthM: 0.8, soilResistivityKmPerW: 1, groundC: 20 };
  // One cable alone: T₄ = ρ/(2π)·ln(u + √(u² − 1)), u = 2L/D_e.
  const u = (2 * soil.depthM) / De;

  it('trefoil touching: the closed form (1.5/π)ρ[ln(2u) − 0.630] by hand, the solver within 2 %', () => {
    const e = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'buried', ...soil } })));
    const T4 = (1.5 / Math.PI) * 1 * (Math.log(2 * u) - 0.63);
    const byHand = Math.sqrt((90 - 20) / (rAc(De) * (T1 + T3 + T4)));
    expect(Math.abs(e.ampacity.closedForm!.currentA - byHand) / byHand).toBeLessThan(1e-3);
    expect(Math.abs(e.ampacity.closedForm!.differencePercent)).toBeLessThan(2);
    expect(e.group!.governingCable).not.toBeNull();
  });

  it('flat touching: the closed form 0.475ρ·ln(2u) − 0.346ρ (centre cable) by hand, the solver within 2 %', () => {
    const e = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'buried', ...soil, formation: 'flat' } })));
    const T4 = 0.475 * Math.log(2 * u) - 0.346;
    const byHand = Math.sqrt((90 - 20) / (rAc(De) * (T1 + T3 + T4)));
    expect(Math.abs(e.ampacity.closedForm!.currentA - byHand) / byHand).toBeLessThan(1e-3);
    expect(Math.abs(e.ampacity.closedForm!.differencePercent)).toBeLessThan(2);
    // The centre cable governs a flat row.
    const g = e.group!.cables[e.group!.governingCable!];
    expect(g.position === 'flat-centre' || e.group!.cables.filter((c) => c.role === 'rated').every((c) => c.conductorC === g.conductorC)).toBe(true);
  });

  it('flat spaced 0.2 m: superposition with images for the centre cable, ρ/(2π)·ln{(u + √(u² − 1))·[1 + (2L/s)²]}, by hand, the solver within 2 %', () => {
    const s = 0.2;
    const e = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'buried', ...soil, formation: 'flat', spacingM: s } })));
    const T4 = (1 / (2 * Math.PI)) * Math.log((u + Math.sqrt(u * u - 1)) * (1 + ((2 * soil.depthM) / s) ** 2));
    const byHand = Math.sqrt((90 - 20) / (rAc(s) * (T1 + T3 + T4)));
    expect(Math.abs(e.ampacity.closedForm!.currentA - byHand) / byHand).toBeLessThan(5e-3);
    expect(Math.abs(e.ampacity.closedForm!.differencePercent)).toBeLessThan(2);
    const g = e.group!.cables[e.group!.governingCable!];
    expect(g.position).toBe('flat-centre');
  });

  it('two circuits in one trench: the hotter circuit loses what the superposition of the neighbour\'s heat gives, worked by hand', () => {
    // The neighbour: a trefoil 0.4 m to the side whose cables give off 25 W/m each (entered).
    // Its three centres: the same trefoil pattern as ours (apex up), centroid at (0.4 m, −0.8 m).
    const w = 25;
    const inst: Conditions['installation'] = { kind: 'buried', ...soil, otherCircuits: [{ currentA: 300, cable: { externalDiameterM: De, lossWPerM: w } }], circuitSpacingM: 0.4 };
    const alone = ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'buried', ...soil } })));
    const two = ok(evaluateCandidate(cable, cableConditions({ installation: inst })));
    // Trefoil of side D_e about its centroid: apex at D_e/√3 above, base at D_e/(2√3) below, ±D_e/2.
    const pattern = [
      [-De / 2, -De / (2 * Math.sqrt(3))],
      [De / 2, -De / (2 * Math.sqrt(3))],
      [0, De / Math.sqrt(3)],
    ];
    const ours = pattern.map(([x, y]) => [x, y - soil.depthM]);
    const theirs = pattern.map(([x, y]) => [x + 0.4, y - soil.depthM]);
    // The rise at each of our cables from the neighbour's heat, ΔT = Σ W·ρ/(2π)·ln(d′/d) (ρ = 1);
    // the sizing takes the largest (the member that gets the most heat governs, cautious).
    const rise = Math.max(
      ...ours.map(([xp, yp]) => theirs.reduce((sum, [xk, yk]) => sum + (w / (2 * Math.PI)) * Math.log(Math.hypot(xp - xk, yp + yk) / Math.hypot(xp - xk, yp - yk)), 0)),
    );
    const T4 = (1.5 / Math.PI) * (Math.log(2 * u) - 0.63);
    const byHand = Math.sqrt((90 - 20 - rise) / (rAc(De) * (T1 + T3 + T4)));
    expect(Math.abs(two.ampacityA - byHand) / byHand).toBeLessThan(0.01);
    expect(two.ampacityA).toBeLessThan(alone.ampacityA);
    expect(two.flags.map((f) => f.code)).toContain('OTHER_CIRCUIT_HEAT_ENTERED');
  });

  it('a neighbour with the same cable is solved at its own current: the rating falls as its current rises', () => {
    const at = (currentA: number) => ok(evaluateCandidate(cable, cableConditions({ installation: { kind: 'buried', ...soil, otherCircuits: [{ currentA }], circuitSpacingM: 0.3 } }))).ampacityA;
    const a100 = at(100);
    const a400 = at(400);
    expect(a400).toBeLessThan(a100);
  });
});

describe('screens bonded at both ends (IEC 60287-1-1 §2.3)', () => {
  it('a screened trefoil in air: the solver with the screen loss as heat at the screen agrees with eq. (1) with λ₁ within 2 %', () => {
    const c = xlpeCable(240);
    c.layers = [c.layers[0], { name: 'copper wire screen', role: 'screen', thicknessM: 0.8e-3, thermalResistivityKmPerW: 0.0025 }, c.layers[1]];
    c.screen = { material: 'copper', sectionMm2: 35, bonding: 'solid' };
    const screened = ok(evaluateCandidate(c, cableConditions({ installation: { kind: 'cable-in-air' } })));
    // The same build without the screen's electrical data: no screen loss (and flagged for it).
    const { screen: _none, ...noData } = c;
    const unscreened = ok(evaluateCandidate(noData, cableConditions({ installation: { kind: 'cable-in-air' } })));
    expect(screened.flags.map((f) => f.code)).toContain('SCREEN_LOSSES_INCLUDED');
    expect(screened.flags.map((f) => f.code)).not.toContain('SHEATH_LOSSES_NOT_INCLUDED');
    expect(unscreened.flags.map((f) => f.code)).toContain('SHEATH_LOSSES_NOT_INCLUDED');
    expect(Math.abs(screened.ampacity.closedForm!.differencePercent)).toBeLessThan(2);
    expect(screened.ampacityA).toBeLessThan(unscreened.ampacityA);
  });
});

describe('bad arrangements are refused with the field named', () => {
  it('circuits that overlap', () => {
    const e = evaluateCandidate(cable, cableConditions({ installation: { kind: 'buried', depthM: 0.8, otherCircuits: [{ currentA: 100 }], circuitSpacingM: 0.01 } }));
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.field).toBe('conditions.installation.circuitSpacingM');
  });
  it('a buried cable reaching above the ground', () => {
    const e = evaluateCandidate(cable, cableConditions({ installation: { kind: 'buried', depthM: 0.015 } }));
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.field).toBe('conditions.installation.depthM');
  });
  it('a spacing of zero', () => {
    const e = evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air', formation: 'flat', spacingM: 0 } }));
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.field).toBe('conditions.installation.spacingM');
  });
  it('cables spaced closer than their diameter (they would overlap)', () => {
    const e = evaluateCandidate(cable, cableConditions({ installation: { kind: 'cable-in-air', formation: 'flat', spacingM: 0.5 * De } }));
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.field).toBe('conditions.installation.spacingM');
  });
});

describe('the default sheet', () => {
  it('a new sheet for cables in air lays three single-core cables in trefoil, touching, and its ampacity is never above the IEC method for that arrangement', () => {
    const inputs = { ...defaultSheetInputs('cable-in-air'), candidates: [{ ...cable, id: 'c240', label: '240 mm² test', parallel: 1 } as never], chosenCandidateId: 'c240' };
    expect(inputs.installation.formation).toBe('trefoil');
    expect(inputs.installation.spacingM).toBeNull();
    const r = computeSheet(inputs);
    if (!r.ok) throw new Error(r.error.message);
    const e = r.comparison.evaluations[0];
    if (!e.ok) throw new Error(e.error.message);
    expect(e.ampacity.closedForm).not.toBeNull();
    expect(e.ampacityA).toBeLessThanOrEqual(e.ampacity.closedForm!.currentA);
  });
});

import { describe, expect, it } from 'vitest';
import { ampacity, evaluateCandidate, type BarCandidate, type CandidateEvaluationOk, type Conditions } from '@/lib/electrical';
import { packRatingBreakdown, prepareBusbarSystem, rateIsolatedBar } from '@/lib/electrical/busbar';
import { barConditions, copperBar } from './fixtures';

/**
 * Bus-bar packs through the sizing layer (issue 18, physics.md §10). The reference for "n times
 * one bar" is one bar alone in the same air (rateIsolatedBar: Churchill & Chu plate, radiation,
 * its own filament R_ac/R_dc), the breakdown of the pack's shortfall (inner faces, current
 * sharing) comes from the bus-bar module's own decomposition; these tests check that the sheet's
 * evaluation carries exactly that model, and that it is far from the old n × one bar.
 */
const ok = (e: ReturnType<typeof evaluateCandidate>): CandidateEvaluationOk => {
  if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
  return e;
};

// Painted copper 100 × 10 mm on edge, 35 °C air, 65 °C limit (issue 18's example), phases 200 mm apart.
const painted = (bars: number) => copperBar(0.1, 0.01, { barsPerPhase: bars, barGapM: 0.01, emissivity: 0.9, terminalLimitC: 65 });
const conditions = (extra: Record<string, unknown> = {}) =>
  barConditions({ ambientC: 35, designCurrentA: 1500, installation: { kind: 'bar-on-edge', system: { phaseSpacingM: 0.2, ...extra } } });

describe('a pack of n bars is rated as a pack, not n × one bar', () => {
  it('four 100 × 10 mm bars per phase rate well below four times one bar, and the pack result says which bar governs', () => {
    const one = rateIsolatedBar({ widthM: 0.1, thicknessM: 0.01, arrangement: 'edge', conductor: { rho20OhmM: 1.7241e-8, alpha20PerK: 3.93e-3 }, conditions: { ambientC: 35, emissivity: 0.9, limitC: 65 }, excitation: { kind: 'three-phase', frequencyHz: 50 } });
    const pack = ok(evaluateCandidate(painted(4), conditions()));
    expect(pack.ampacityA).toBeLessThan(0.75 * 4 * one.ampacityA);
    expect(pack.pack).toBeDefined();
    expect(pack.pack!.bars).toHaveLength(12);
    expect(pack.flags.map((f) => f.code)).toContain('PACK_RATED_AS_SYSTEM');
    expect(pack.flags.map((f) => f.code)).not.toContain('MULTI_BAR_INNER_FACES');
    // The outer bars of each pack carry more than the inner ones at 50 Hz (skin and proximity).
    const l2 = pack.pack!.bars.filter((b) => b.phase === 'L2').sort((a, b) => a.positionInPack - b.positionInPack);
    expect(l2[0].shareOfPhase).toBeGreaterThan(l2[1].shareOfPhase);
    expect(l2[3].shareOfPhase).toBeGreaterThan(l2[2].shareOfPhase);
    // The hot spot reported is the hottest bar's.
    expect(pack.hotSpotC).toBeCloseTo(Math.max(...pack.pack!.bars.map((b) => b.temperatureC)), 9);
  });

  it("the sheet's pack ampacity is the bus-bar module's for the same system (one model, not two)", () => {
    const system = prepareBusbarSystem({ barsPerPhase: 3, barWidthM: 0.1, barThicknessM: 0.01, gapM: 0.01, phaseSpacingM: 0.2, arrangement: 'edge', supportSpacingM: 1 });
    const breakdown = packRatingBreakdown({ system, conductor: { rho20OhmM: 1.7241e-8, alpha20PerK: 3.93e-3 }, conditions: { ambientC: 35, emissivity: 0.9, limitC: 65 }, frequencyHz: 50 });
    const e = ok(evaluateCandidate(painted(3), conditions()));
    // The sheet reports the lower end of a 0.1 A bracket.
    expect(Math.abs(e.ampacityA - breakdown.systemAcA)).toBeLessThan(0.2);
    expect(breakdown.systemAcA).toBeLessThan(0.8 * 3 * breakdown.singleBarAcA);
  });

  it('at DC a pack shares equally and rates higher than at 50 Hz (the sharing factor is the AC part)', () => {
    const ac = ok(evaluateCandidate(painted(3), conditions())).ampacityA;
    const dc = ok(evaluateCandidate(painted(3), { ...conditions(), frequencyHz: 0 })).ampacityA;
    expect(dc).toBeGreaterThan(ac);
  });
});

describe('bad bus-bar geometry is refused with the field named', () => {
  it('a gap of zero between the bars of a pack', () => {
    const e = evaluateCandidate(copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0 }), conditions());
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.field).toBe('candidates[0].barGapM');
  });
  it('a support spacing of zero', () => {
    const e = evaluateCandidate(painted(2), conditions({ supportSpacingM: 0 }));
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.field).toBe('conditions.installation.system.supportSpacingM');
  });
  it('phases so close that the packs overlap', () => {
    const e = evaluateCandidate(painted(4), { ...conditions(), installation: { kind: 'bar-on-edge', system: { phaseSpacingM: 0.05 } } });
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.error.field).toMatch(/^conditions\.installation\.system\./);
  });
});

describe('the ampacity call rates a pack with the same model as the sheet', () => {
  // Regression: /api/v1/ampacity (and the verification page) called ampacity(), which rated a pack
  // as bars in one slab and answered 5,250 A where the sheet's system model gives 3,376 A.
  it("ampacity() of four 100 × 10 mm bars per phase is the evaluation's pack ampacity", () => {
    const e = ok(evaluateCandidate(painted(4), conditions()));
    const a = ampacity(painted(4), conditions());
    expect(a.current).toBeCloseTo(e.ampacityA, 6);
  });
});

describe('short-circuit forces on the supports (IEC 60865-1) travel with the evaluation', () => {
  it('a 50 kA fault on 100 × 10 mm bars on 1 m supports fails the bending check, and the largest span that passes is shorter', () => {
    const e = ok(evaluateCandidate(copperBar(0.1, 0.01), barConditions({ fault: { currentA: 50_000, durationS: 0.5 }, installation: { kind: 'bar-on-edge', system: { phaseSpacingM: 0.2, supportSpacingM: 1, supports: 'continuous-three-or-more-spans', rOverX: 0.1 } } })));
    expect(e.forces).toBeDefined();
    expect(e.forces!.passes).toBe(false);
    expect(e.passes).toBe(false);
    expect(e.forces!.largestSupportSpacingM).toBeLessThan(1);
    // κ = 1.02 + 0.98·e^(−3·0.1) = 1.7460 (IEC 60909-0), i_p = κ·√2·50 kA = 123.46 kA.
    expect(e.forces!.kappa).toBeCloseTo(1.02 + 0.98 * Math.exp(-0.3), 9);
    expect(e.forces!.peakCurrentA).toBeCloseTo((1.02 + 0.98 * Math.exp(-0.3)) * Math.SQRT2 * 50_000, 3);
  });
});

describe('dimensions too small to be a bar are refused with the field named (lib/inputBounds)', () => {
  // Found by fuzzing the API: a 1e-300 m thickness or pack gap made the filament matrix singular
  // (an unexplained failure), and r20 = 1e-300 Ω/m rated a pack at 3e150 A.
  const field = (e: ReturnType<typeof evaluateCandidate>) => (e.ok ? 'not refused' : e.error.field);
  it('thickness, pack gap and resistance below their bounds', () => {
    expect(field(evaluateCandidate(copperBar(0.1, 1e-300, { r20OhmPerM: 1.7e-5 }), conditions()))).toBe('candidates[0].thicknessM');
    expect(field(evaluateCandidate(copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 1e-300 }), conditions()))).toBe('candidates[0].barGapM');
    expect(field(evaluateCandidate(copperBar(0.1, 0.01, { r20OhmPerM: 1e-300 }), conditions()))).toBe('candidates[0].r20OhmPerM');
  });
});

describe('a pack whose limit is its ambient carries nothing, and says so', () => {
  // Found by fuzzing the API: a terminal limit of 5e-324 °C in 0 °C air left the pack's heat
  // balance without a temperature difference and the solve failed on a singular matrix.
  it('ampacity 0 with the reason, not a failure', () => {
    const e = ok(evaluateCandidate(copperBar(0.05, 0.005, { barsPerPhase: 4, barGapM: 0.005, terminalLimitC: 5e-324 }), barConditions({ ambientC: 0, designCurrentA: 10, fault: undefined })));
    expect(e.ampacityA).toBe(0);
    expect(e.passes).toBe(false);
  });
});

describe('a single bar far above its rating', () => {
  // Found in a browser test: a 60 × 10 mm copper bar at 3000 A (its rating is about 1950 A) could
  // not be evaluated, because the R_ac/R_dc of the filament method was extrapolated along a straight
  // line to the hundreds of °C the design point reaches, below 1 (an AC resistance below the DC
  // one, which no conductor has). The ratio is now held at its value at the limit above the limit.
  const bar60: BarCandidate = { kind: 'bar', id: 'b60', label: '60 × 10 mm Cu', material: 'copper', widthM: 0.06, thicknessM: 0.01, r20OhmPerM: 1.7241e-8 / (0.06 * 0.01), emissivity: 0.9, terminalLimitC: 105 };
  const at = (designCurrentA: number): Conditions => ({ designCurrentA, frequencyHz: 50, phases: 3, nominalVoltageV: 400, lengthM: 10, powerFactor: 0.9, ambientC: 35, installation: { kind: 'bar-on-edge' } });
  it('evaluates at 1.5 and 2.5 times its rating: it fails with its hot spot and an AC factor of at least 1', () => {
    for (const currentA of [3000, 5000]) {
      const e = evaluateCandidate(bar60, at(currentA));
      if (!e.ok) throw new Error(`${currentA} A: ${e.error.message}`);
      expect(e.passes).toBe(false);
      expect(e.hotSpotC!).toBeGreaterThan(105);
      expect(e.acFactor).toBeGreaterThanOrEqual(1);
    }
  });
});

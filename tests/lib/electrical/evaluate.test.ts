import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  compareCandidates,
  ElectricalInputError,
  evaluateCandidate,
  lossEnergyCost,
  Money,
  resistanceAt,
  shortCircuitFinalTemperature,
  voltageDrop,
  type Candidate,
  type CandidateEvaluationOk,
} from '@/lib/electrical';
import { barConditions, cableConditions, copperBar, xlpeCable } from './fixtures';

function ok(e: ReturnType<typeof evaluateCandidate>): CandidateEvaluationOk {
  if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
  return e;
}

/** Walks a result and fails on any NaN or infinite number (physics.md: never NaN out). */
function expectAllFinite(value: unknown, path = 'result'): void {
  if (typeof value === 'number') {
    expect(Number.isFinite(value), `${path} = ${value}`).toBe(true);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => expectAllFinite(v, `${path}[${i}]`));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) expectAllFinite(v, `${path}.${k}`);
  }
}

describe('evaluateCandidate: every figure consistent with the pure functions', () => {
  const economics = { lossLoadFactor: 0.35, energyPricePerKWh: '0.12', discountRatePercent: 6, loadGrowthPercent: 1, years: 30 };
  const conditions = cableConditions({ designCurrentA: 320, economics });
  const cable = xlpeCable(150, { costs: { conductorPricePerKg: '9.80' } });
  const e = ok(evaluateCandidate(cable, conditions));

  it('hot spot, margin, utilisation', () => {
    expect(e.hotSpotC!).toBeGreaterThan(30);
    expect(e.hotSpotC!).toBeLessThan(90);
    expect(e.marginK!).toBeCloseTo(90 - e.hotSpotC!, 9);
    expect(e.marginPercent!).toBeCloseTo((100 * e.marginK!) / (90 - 30), 9);
    expect(e.utilisation).toBeCloseTo(320 / e.ampacityA, 12);
    expect(e.limit).toEqual({ temperatureC: 90, source: 'insulation', layer: 'XLPE insulation' });
  });

  it('loss per metre is I²·R(θ)·R_ac/R_dc at the solved conductor temperature (IEC 60287-1-1 eq. 2)', () => {
    const r = resistanceAt({ r20: cable.r20OhmPerM, alpha20: 3.93e-3, temperature: e.conductorC! }) * e.acFactor;
    expect(e.resistanceOhmPerM!).toBeCloseTo(r, 15);
    expect(e.lossPerConductorWPerM!).toBeCloseTo(320 * 320 * r, 9);
    expect(e.lossWPerM!).toBeCloseTo(3 * 320 * 320 * r, 9);
    expect(e.acFactor).toBeGreaterThan(1);
  });

  it('voltage drop is Annex G with the section per phase', () => {
    const vd = voltageDrop({ phases: 3, current: 320, length: 60, section: 150, material: 'copper', powerFactor: 0.9, reactance: 0.08e-3, nominalVoltage: 230 });
    expect(e.voltageDrop.volts).toBeCloseTo(vd.volts, 12);
    expect(e.voltageDrop.percent).toBeCloseTo(vd.percent, 12);
  });

  it('short circuit from the continuous limit (90 °C) against the XLPE 250 °C limit', () => {
    const f = shortCircuitFinalTemperature({ material: 'copper', current: 10_000, duration: 0.2, section: 150, initial: 90 });
    expect(e.shortCircuit.checked).toBe(true);
    expect(e.shortCircuit.finalC).toBeCloseTo(f, 9);
    expect(e.shortCircuit.withstands).toBe(f <= 250);
    expect(e.shortCircuit.minimumSectionMm2!).toBeCloseTo((10_000 * Math.sqrt(0.2)) / e.shortCircuit.kFactor!, 9);
  });

  it('mass, material cost and life-cycle cost (decimal money)', () => {
    // 3 conductors × 150 mm² × 60 m × 8890 kg/m³.
    expect(e.massKg).toBeCloseTo(3 * 150e-6 * 60 * 8890, 9);
    expect(e.materialCost).toBe(new Money(e.massKg).mul('9.80').toFixed(2));
    const pv = lossEnergyCost({ ...economics, peakLossW: e.lossWPerM! * 60 }).presentValue;
    expect(e.lossCostPresentValue).toBe(pv.toFixed(2));
    expect(e.lifeCycleCost).toBe(new Money(e.massKg).mul('9.80').add(pv).toFixed(2));
  });

  it('returns the heat-balance profile for plotting', () => {
    const p = e.profile!;
    expect(p.geometry).toBe('cylinder');
    expect(p.positionsM.length).toBe(p.temperaturesC.length);
    expect(p.layers.map((l) => l.name)).toEqual(['conductor', 'XLPE insulation', 'PVC sheath']);
    expect(Math.max(...p.temperaturesC)).toBeLessThanOrEqual(p.hotSpot.temperatureC + 1e-12);
    // Temperature falls outwards through the coverings.
    for (let i = 1; i < p.temperaturesC.length; i++) expect(p.temperaturesC[i]).toBeLessThanOrEqual(p.temperaturesC[i - 1] + 1e-9);
    expectAllFinite(e);
  });
});

describe('evaluateCandidate: honest failures', () => {
  it('runaway gives no temperature, fails, and still reports the ampacity', () => {
    const bar = copperBar(0.05, 0.005, { terminalLimitC: undefined, acResistanceRatio: 1 });
    const e = ok(evaluateCandidate(bar, barConditions({ surfaceCoefficientWPerM2K: 10, temperatureLimitC: 300, designCurrentA: 6000 })));
    expect(e.hotSpotC).toBeNull();
    expect(e.profile).toBeNull();
    expect(e.passes).toBe(false);
    expect(e.flags[0].code).toBe('RUNAWAY');
    expect(e.ampacityA).toBeGreaterThan(0);
    expectAllFinite(e);
  });

  it('a bad candidate returns an error naming the field; bad conditions too', () => {
    const bad = evaluateCandidate({ ...xlpeCable(95), r20OhmPerM: -1 }, cableConditions());
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error.field).toBe('candidates[0].r20OhmPerM');
    const badCond = evaluateCandidate(xlpeCable(95), cableConditions({ designCurrentA: Number.NaN }));
    expect(badCond.ok).toBe(false);
    if (!badCond.ok) expect(badCond.error.field).toBe('conditions.designCurrentA');
    const wrongPlace = evaluateCandidate(copperBar(0.1, 0.01), cableConditions());
    expect(wrongPlace.ok).toBe(false);
    if (!wrongPlace.ok) expect(wrongPlace.error.field).toBe('conditions.installation.kind');
  });
});

describe('compareCandidates', () => {
  const sizes = [70, 95, 120, 150, 185, 240, 300];
  const candidates: Candidate[] = sizes.map((s) => xlpeCable(s, { costs: { conductorPricePerKg: '9.50' } }));
  const economics = { lossLoadFactor: 0.5, energyPricePerKWh: '0.20', discountRatePercent: 5, years: 30 };
  const conditions = cableConditions({ designCurrentA: 400, economics, fault: { currentA: 12_000, durationS: 0.3 } });

  it('marks the smallest passing and the lowest life-cycle-cost passing candidates; a broken one still comes back', () => {
    const withBroken: Candidate[] = [...candidates, { ...xlpeCable(95), id: 'broken', layers: [] }];
    const cmp = compareCandidates(withBroken, conditions);
    expect(cmp.evaluations).toHaveLength(withBroken.length);
    const broken = cmp.evaluations[withBroken.length - 1];
    expect(broken.ok).toBe(false);
    if (!broken.ok) expect(broken.error.field).toBe(`candidates[${withBroken.length - 1}].layers`);

    const oks = cmp.evaluations.filter((e): e is CandidateEvaluationOk => e.ok);
    const passing = oks.filter((e) => e.passes);
    expect(passing.length).toBeGreaterThan(0);
    expect(oks.some((e) => !e.passes)).toBe(true); // the 70 mm² cable cannot carry 400 A here
    for (const e of oks) expect(e.passes).toBe(e.hotSpotC !== null && e.hotSpotC <= 90 && e.shortCircuit.withstands === true);
    const smallest = passing.reduce((a, b) => (b.sectionPerPhaseMm2 < a.sectionPerPhaseMm2 ? b : a));
    expect(cmp.smallestPassingIndex).toBe(smallest.index);
    expect(oks.filter((e) => e.isSmallestPassing).map((e) => e.index)).toEqual([smallest.index]);
    const cheapest = passing.reduce((a, b) => (new Money(b.lifeCycleCost!).lt(a.lifeCycleCost!) ? b : a));
    expect(cmp.lowestLifeCycleCostPassingIndex).toBe(cheapest.index);
    // Over 30 years at 0.20 per kWh a bigger section than the smallest pays for itself.
    expect(cheapest.sectionPerPhaseMm2).toBeGreaterThan(smallest.sectionPerPhaseMm2);
  });

  it('with no passing candidate neither mark is set', () => {
    const cmp = compareCandidates(candidates.slice(0, 2), cableConditions({ designCurrentA: 2000 }));
    expect(cmp.smallestPassingIndex).toBeNull();
    expect(cmp.lowestLifeCycleCostPassingIndex).toBeNull();
  });

  it('bad conditions throw naming the field', () => {
    expect(() => compareCandidates(candidates, cableConditions({ phases: 2 as never }))).toThrow(ElectricalInputError);
  });
});

describe('physical sense (common practice)', () => {
  it('a four-core cable (three loaded cores) carries less than one single core of the same section', () => {
    const single = ok(evaluateCandidate(xlpeCable(95), cableConditions({ installation: { kind: 'cable-in-air', spacingM: 0.2 } }))).ampacityA;
    const four = ok(evaluateCandidate(xlpeCable(95, { cores: 4 }), cableConditions())).ampacityA;
    expect(four).toBeLessThan(single);
  });

  it('sun raises the hot spot; wind lowers it for a cable alone and is not credited to a group (the IEC 60287-2-1 free-air law is for still air)', () => {
    const still = ok(evaluateCandidate(xlpeCable(95), cableConditions())).hotSpotC!;
    const sunny = ok(evaluateCandidate(xlpeCable(95), cableConditions({ solar: { irradianceWPerM2: 1000, absorptivity: 0.6 } }))).hotSpotC!;
    const windyGroup = ok(evaluateCandidate(xlpeCable(95), cableConditions({ windSpeedMPerS: 1 }))).hotSpotC!;
    expect(sunny).toBeGreaterThan(still);
    expect(Math.abs(windyGroup - still)).toBeLessThan(1e-9);
    // One three-core cable lies alone: its own correlations, forced convection with the wind.
    const alone = xlpeCable(95, { cores: 3 });
    const stillAlone = ok(evaluateCandidate(alone, cableConditions())).hotSpotC!;
    const windyAlone = ok(evaluateCandidate(alone, cableConditions({ windSpeedMPerS: 1 }))).hotSpotC!;
    expect(windyAlone).toBeLessThan(stillAlone);
  });
});

describe('never NaN (property, 25 runs)', () => {
  // Currents from 10 A: lib/thermal does not yet settle a sunlit conductor carrying almost no
  // current (reported to its author); that case has its own test below.
  it('random but valid inputs give finite numbers or an explained error', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(25, 95, 240),
        fc.oneof(fc.constant(0), fc.double({ min: 10, max: 1500, noNaN: true })),
        fc.double({ min: -20, max: 70, noNaN: true }),
        fc.constantFrom<'cable-in-air' | 'buried'>('cable-in-air', 'buried'),
        fc.boolean(),
        (section, current, ambient, kind, sun) => {
          const installation = kind === 'buried' ? { kind, depthM: 0.8, soilResistivityKmPerW: 1.2, groundC: Math.min(ambient, 35), spacingM: 0.1 } : { kind, spacingM: 0.1 };
          const e = evaluateCandidate(
            xlpeCable(section),
            cableConditions({ designCurrentA: current, ambientC: ambient, installation, ...(sun && kind !== 'buried' ? { solar: { irradianceWPerM2: 900, absorptivity: 0.5 } } : {}) }),
          );
          if (e.ok) expectAllFinite(e);
          else expect(e.error.message.length).toBeGreaterThan(5);
        },
      ),
      { numRuns: 25 },
    );
  }, 60_000);

  it('a sunlit conductor without current: a temperature or an explained solver error, never a false runaway', () => {
    const e = evaluateCandidate(xlpeCable(95), cableConditions({ designCurrentA: 0, solar: { irradianceWPerM2: 900, absorptivity: 0.5 } }));
    if (e.ok) {
      expect(e.hotSpotC!).toBeGreaterThan(30);
      expect(e.flags.some((f) => f.code === 'RUNAWAY')).toBe(false);
      expectAllFinite(e);
    } else {
      expect(e.error.code).toBe('SOLVER_NOT_CONVERGED');
    }
  });
});

describe('short circuit with no room above the starting temperature', () => {
  it('reports no minimum section (never Infinity) and says why in the flag', () => {
    // A short-circuit limit within rounding of the 90 °C start: ln((θf + β)/(θi + β)) is 0 in
    // double precision, so k = 0 and S = I√t/k has no finite value (IEC 60949 adiabatic form).
    const cable = xlpeCable(95);
    cable.layers = cable.layers.map((l) => (l.role === 'insulation' ? { ...l, shortCircuitLimitC: 90 + 2e-14 } : l));
    const e = ok(evaluateCandidate(cable, cableConditions()));
    expect(e.shortCircuit.withstands).toBe(false);
    expect(e.shortCircuit.minimumSectionMm2).toBeUndefined();
    expect(JSON.stringify(e)).not.toMatch(/Infinity|NaN/);
    const flag = e.flags.find((f) => f.code === 'SHORT_CIRCUIT_EXCEEDED');
    expect(flag?.message).toMatch(/no section suffices/);
  });
});

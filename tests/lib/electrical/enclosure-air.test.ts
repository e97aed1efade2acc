import { describe, expect, it } from 'vitest';
import { enclosureAirCheck, evaluateCandidate, FLAG_REGISTRY, rateInsideEnclosure, type EnclosureAirInputs } from '@/lib/electrical';
import { compareCandidatesPrepared } from '@/lib/electrical/sizing/evaluate';
import { enclosureAirTemperature } from '@/lib/thermal';
import { barConditions, copperBar } from './fixtures';

/**
 * "Inside the enclosure" (physics.md §6): the air inside from the losses released in it, solved
 * together with the conductor whose loss heats it. The air model itself is checked in
 * tests/lib/thermal/enclosure.test.ts; here the checks are the coupled balance — the answer must
 * satisfy P(T_air) = k·A_e·(T_air − T_out) with P evaluated independently at that air — and the
 * flags a reviewer sees.
 */
const bar = copperBar(0.06, 0.01);
const inputs = (extra: Partial<EnclosureAirInputs> = {}): EnclosureAirInputs => ({
  shape: { heightM: 2.0, widthM: 0.8, depthM: 0.6, backCovered: true, sidesCovered: 0, topCovered: false },
  wall: 'painted-steel',
  outsideAirC: 35,
  routeLengthInsideM: 2,
  otherLossesW: 200,
  ...extra,
});

describe('enclosure air and conductor solved together', () => {
  it('the answer satisfies the heat balance of the enclosure with the loss at that air temperature', () => {
    const conditions = barConditions({ designCurrentA: 800, ambientC: 40 });
    const r = enclosureAirCheck(bar, conditions, inputs());
    expect(r.converged).toBe(true);
    const atAir = evaluateCandidate(bar, { ...conditions, ambientC: r.insideAirC });
    if (!atAir.ok) throw new Error(atAir.error.message);
    const loss = atAir.lossWPerM! * 2 + 200;
    const balance = enclosureAirTemperature({ ...inputs().shape, wall: 'painted-steel', lossesW: loss, outsideAirC: 35 });
    // Fixed-point tolerance 0.01 K.
    expect(Math.abs(balance.insideAirC - r.insideAirC)).toBeLessThan(0.02);
    expect(r.totalLossesW).toBeCloseTo(r.conductorLossesW + 200, 9);
    expect(Math.abs(r.hotSpotC! - atAir.hotSpotC!)).toBeLessThan(0.05);
    // Warmer air raises R and so the loss: it is above the loss at the outside air.
    const atOutside = evaluateCandidate(bar, { ...conditions, ambientC: 35 });
    if (!atOutside.ok) throw new Error(atOutside.error.message);
    expect(r.conductorLossesW).toBeGreaterThan(atOutside.lossWPerM! * 2);
  });

  it('with no route inside, the air is the closed form P/(k·A_e) of the other losses alone', () => {
    const r = enclosureAirCheck(bar, barConditions({ designCurrentA: 800 }), inputs({ routeLengthInsideM: 0 }));
    const alone = enclosureAirTemperature({ ...inputs().shape, wall: 'painted-steel', lossesW: 200, outsideAirC: 35 });
    expect(r.insideAirC).toBeCloseTo(alone.insideAirC, 9);
    expect(r.conductorLossesW).toBe(0);
  });
});

describe('flags of the enclosure check', () => {
  const codes = (r: { flags: { code: string }[] }) => r.flags.map((f) => f.code);

  it('always says the air is an estimate to verify (review)', () => {
    const r = enclosureAirCheck(bar, barConditions({ designCurrentA: 400, ambientC: 60 }), inputs({ otherLossesW: 0, outsideAirC: 20 }));
    expect(codes(r)).toContain('ENCLOSURE_AIR_ESTIMATED');
    expect(FLAG_REGISTRY.ENCLOSURE_AIR_ESTIMATED.severity).toBe('review');
    // 20 °C outside with a small loss stays under the 60 °C the sheet assumed: no "above" flag.
    expect(r.insideAirC).toBeLessThan(60);
    expect(codes(r)).not.toContain('ENCLOSURE_AIR_ABOVE_AMBIENT');
    expect(r.passes).toBe(true);
  });

  it('says so when the air inside is warmer than the ambient the sheet sized with', () => {
    const r = enclosureAirCheck(bar, barConditions({ designCurrentA: 800, ambientC: 40 }), inputs({ otherLossesW: 600 }));
    expect(r.insideAirC).toBeGreaterThan(40);
    expect(codes(r)).toContain('ENCLOSURE_AIR_ABOVE_AMBIENT');
  });

  it('fails a candidate that passes in the sheet ambient but not in the estimated inside air (blocker)', () => {
    const conditions = barConditions({ designCurrentA: 1200, ambientC: 40 });
    const steady = evaluateCandidate(bar, conditions);
    if (!steady.ok) throw new Error(steady.error.message);
    expect(steady.hotSpotC!).toBeLessThan(steady.limit.temperatureC);
    const r = enclosureAirCheck(bar, conditions, inputs({ otherLossesW: 600 }));
    expect(r.converged).toBe(true);
    expect(r.hotSpotC!).toBeGreaterThan(r.limitC);
    expect(r.passes).toBe(false);
    expect(codes(r)).toContain('ENCLOSURE_HOT_SPOT_OVER_LIMIT');
    expect(FLAG_REGISTRY.ENCLOSURE_HOT_SPOT_OVER_LIMIT.severity).toBe('blocker');
  });

  it('stops when the air itself reaches the limit and says so', () => {
    const r = enclosureAirCheck(bar, barConditions({ designCurrentA: 1400, ambientC: 40 }), inputs({ otherLossesW: 1500 }));
    expect(r.insideAirC).toBeGreaterThanOrEqual(r.limitC);
    expect(r.passes).toBe(false);
    expect(r.hotSpotC).toBeNull();
    expect(r.flags.find((f) => f.code === 'ENCLOSURE_HOT_SPOT_OVER_LIMIT')?.message).toMatch(/air inside alone/);
  });

  it('refuses a buried circuit and names bad fields', () => {
    expect(() => enclosureAirCheck(bar, barConditions({ installation: { kind: 'buried', depthM: 0.7 } } as never), inputs())).toThrow(/buried/);
    expect(() => enclosureAirCheck(bar, barConditions(), inputs({ otherLossesW: -1 }))).toThrow(/other losses/i);
    expect(() => enclosureAirCheck(bar, barConditions(), inputs({ outsideAirC: 150 }))).toThrow(/around the enclosure/);
  });
});

describe('with the enclosure check on, the headline is rated in the air inside (issue 22)', () => {
  // Reference: the same library's steady evaluation with the ambient set to the inside air the
  // coupled balance found (that balance is checked against P = k·A_e·ΔT above).
  const conditions = barConditions({ designCurrentA: 1200, ambientC: 40 });
  const wide = copperBar(0.1, 0.01);

  it('each candidate is rated at its own inside air: ampacity and hot spot are the evaluation at that ambient, said in a note', () => {
    const candidates = [bar, wide];
    const rated = rateInsideEnclosure(compareCandidatesPrepared(candidates, conditions), candidates, conditions, inputs({ otherLossesW: 600 }));
    for (const [i, c] of candidates.entries()) {
      const air = enclosureAirCheck(c, conditions, inputs({ otherLossesW: 600 }));
      const e = rated.comparison.evaluations[i];
      if (!e.ok) throw new Error(e.error.message);
      expect(e.ambientC).toBeCloseTo(air.insideAirC, 9);
      const direct = evaluateCandidate(c, { ...conditions, ambientC: air.insideAirC });
      if (!direct.ok) throw new Error(direct.error.message);
      expect(e.ampacityA).toBe(direct.ampacityA);
      expect(e.hotSpotC).toBe(direct.hotSpotC);
      expect(e.flags.map((f) => f.code)).toContain('ENCLOSURE_AIR_RATED');
      expect(e.flags.find((f) => f.code === 'ENCLOSURE_AIR_RATED')!.message).toMatch(/the room around it 40 °C/);
    }
  });

  it('a bar that passes in the 40 °C room but not in the inside air is no longer passing, nor the preferred size', () => {
    const room = compareCandidatesPrepared([bar], conditions);
    const inRoom = room.comparison.evaluations[0];
    expect(inRoom.ok && inRoom.passes).toBe(true);
    const rated = rateInsideEnclosure(room, [bar], conditions, inputs({ otherLossesW: 600 }));
    const e = rated.comparison.evaluations[0];
    expect(e.ok && e.passes).toBe(false);
    expect(rated.comparison.smallestPassingIndex).toBeNull();
  });

  it('when the air alone reaches the limit, the room figures stay with the blocker', () => {
    const hot = barConditions({ designCurrentA: 1400, ambientC: 40 });
    const rated = rateInsideEnclosure(compareCandidatesPrepared([bar], hot), [bar], hot, inputs({ otherLossesW: 1500 }));
    const e = rated.comparison.evaluations[0];
    if (!e.ok) throw new Error(e.error.message);
    expect(e.passes).toBe(false);
    expect(e.flags.filter((f) => f.code === 'ENCLOSURE_HOT_SPOT_OVER_LIMIT')).toHaveLength(1);
  });
});

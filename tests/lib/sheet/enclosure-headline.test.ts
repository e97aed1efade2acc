// Issue 22: "the enclosure check says the inside air is 54 °C while the headline still rates at
// the 35 °C room". With the check on, the sheet's headline evaluation is rated in the air the
// enclosure check finds (that balance is checked against P = k·A_e·ΔT in
// tests/lib/electrical/enclosure-air.test.ts); with it off, in the room.
import { describe, expect, it } from 'vitest';
import { computeSheet } from '@/lib/sheet/compute';
import { computeEnclosureAir } from '@/lib/sheet/enclosureAir';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet/schema';
import { testCopperBar } from '../../helpers/sheetCandidates';

const bar = testCopperBar(60, 10);

function inputs(checked: boolean): SheetInputs {
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 1200, lengthM: 10 };
  i.environment = { ...i.environment, ambientC: 40 };
  i.candidates = [bar];
  i.chosenCandidateId = bar.id;
  i.enclosureAir = { ...i.enclosureAir, checked, otherLossesW: 600, routeLengthInsideM: 2, outsideAirC: 35, backCovered: true, sidesCovered: 1 };
  return i;
}

const first = (i: SheetInputs) => {
  const c = computeSheet(i);
  if (!c.ok) throw new Error(c.error.message);
  const e = c.comparison.evaluations[0];
  if (!e.ok) throw new Error(e.error.message);
  return e;
};

describe('the headline with the enclosure check', () => {
  it('on: rated in the inside air the check reports, and a bar that passes in the room fails there', () => {
    const air = computeEnclosureAir(inputs(true), bar.id);
    if (!air?.ok) throw new Error('the enclosure check must compute');
    const inside = first(inputs(true));
    const room = first(inputs(false));
    expect(air.result.insideAirC).toBeGreaterThan(40);
    expect(inside.ambientC).toBeCloseTo(air.result.insideAirC, 9);
    expect(inside.hotSpotC!).toBeCloseTo(air.result.hotSpotC!, 1);
    expect(inside.ampacityA).toBeLessThan(room.ampacityA);
    expect(room.passes).toBe(true);
    expect(inside.passes).toBe(false);
    expect(inside.flags.map((f) => f.code)).toContain('ENCLOSURE_AIR_RATED');
  });

  it('off: rated in the room, no enclosure flag', () => {
    const room = first(inputs(false));
    expect(room.ambientC).toBe(40);
    expect(room.flags.map((f) => f.code)).not.toContain('ENCLOSURE_AIR_RATED');
  });
});

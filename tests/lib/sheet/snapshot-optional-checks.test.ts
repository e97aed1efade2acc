/**
 * The saved result snapshot carries the flags of the optional checks switched on for the chosen
 * candidate, so a reviewer must acknowledge their review flags and their blockers stop approval,
 * exactly like the steady evaluation's (product.md: a sheet with a blocker cannot be approved).
 * The physics behind the flags is tested in tests/lib/electrical; here the check is the wiring.
 */
import { describe, expect, it } from 'vitest';
import { approvalReadiness, buildSnapshot, defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';

const bar = testCopperBar(60, 10, { emissivity: 0.9 });

function sheet(enclosure: Partial<SheetInputs['enclosureAir']>): SheetInputs {
  const inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 1000 };
  inputs.environment = { ...inputs.environment, ambientC: 40 };
  inputs.fault = { ...inputs.fault, checked: false };
  inputs.candidates = [bar];
  inputs.chosenCandidateId = bar.id;
  inputs.enclosureAir = { ...inputs.enclosureAir, ...enclosure };
  return inputs;
}

const codes = (flags: { code: string }[]) => flags.map((f) => f.code);

describe('optional checks in the saved snapshot', () => {
  it('a check left off adds nothing', () => {
    const snapshot = buildSnapshot(sheet({ checked: false }));
    expect(codes(snapshot.chosenFlags)).not.toContain('ENCLOSURE_AIR_ESTIMATED');
    expect(snapshot.optionalCheckFailures).toEqual([]);
  });

  it('a check switched on adds its review flags, which the reviewer must acknowledge', () => {
    const snapshot = buildSnapshot(sheet({ checked: true, otherLossesW: 0, routeLengthInsideM: 1, outsideAirC: 20 }));
    expect(codes(snapshot.chosenFlags)).toContain('ENCLOSURE_AIR_ESTIMATED');
    expect(snapshot.chosenPasses).toBe(true);
    expect(approvalReadiness(snapshot, []).unacknowledgedReviewCodes).toContain('ENCLOSURE_AIR_ESTIMATED');
    expect(approvalReadiness(snapshot, ['ENCLOSURE_AIR_ESTIMATED']).unacknowledgedReviewCodes).not.toContain('ENCLOSURE_AIR_ESTIMATED');
  });

  it('a failing check makes its blocker stand against approval and the chosen candidate fail', () => {
    // 1500 W in a small boxed-in enclosure heats its air past what the bar can stand at 1000 A.
    const snapshot = buildSnapshot(
      sheet({ checked: true, otherLossesW: 1500, heightM: 1.2, widthM: 0.6, depthM: 0.4, backCovered: true, sidesCovered: 2, topCovered: true }),
    );
    expect(codes(snapshot.chosenFlags)).toContain('ENCLOSURE_HOT_SPOT_OVER_LIMIT');
    expect(snapshot.chosenPasses).toBe(false);
    expect(approvalReadiness(snapshot, []).blockerCodes).toContain('ENCLOSURE_HOT_SPOT_OVER_LIMIT');
  });

  it('a check switched on that cannot be computed is a blocker of its own, with the reason kept', () => {
    // The run along the length is for bars: on a cable it cannot be computed.
    const inputs = defaultSheetInputs('cable-in-air');
    const cable = testCable240;
    inputs.candidates = [cable];
    inputs.chosenCandidateId = cable.id;
    inputs.alongRun = { ...inputs.alongRun, checked: true };
    const snapshot = buildSnapshot(inputs);
    expect(snapshot.evaluations[0].ok).toBe(true);
    expect(snapshot.optionalCheckFailures).toEqual([{ check: 'Along the run', message: 'The run along the length is for bars; this candidate is a cable.' }]);
    expect(snapshot.chosenPasses).toBe(false);
    expect(approvalReadiness(snapshot, []).blockerCodes).toContain('OPTIONAL_CHECK_NOT_COMPUTED');
  });
});

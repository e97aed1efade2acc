// Issue 22, "results that match the checks": nothing is chosen for the designer, and a sheet is not
// submitted for review while no candidate is chosen or while the chosen one has a blocker — the
// refusal names the blockers by title; a sheet saved with a chosen candidate keeps it when read.
import { describe, expect, it } from 'vitest';
import { approvalReadiness, availableActions, buildSnapshot, decide, defaultSheetInputs, readSheetInputs, type Actor } from '@/lib/sheet';
import { testCable240 } from '../../helpers/sheetCandidates';
import storedV5 from '../../fixtures/sheet-v5-demo.json';

const designer: Actor = { userId: 'author-1', can: (p) => p === 'sheet:write' || p === 'sheet:submit' };
const draft = { status: 'draft' as const, authorId: 'author-1' };

function cableSheet(designCurrentA: number, chosen: boolean) {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.circuit = { ...inputs.circuit, designCurrentA };
  inputs.candidates = [testCable240];
  inputs.chosenCandidateId = chosen ? testCable240.id : null;
  return inputs;
}

describe('explicit candidate choice before submission', () => {
  it('a new sheet chooses nothing', () => {
    expect(defaultSheetInputs('buried').chosenCandidateId).toBeNull();
  });

  it('refuses to submit while no candidate is chosen, and says so (the button stays, disabled with the reason)', () => {
    const readiness = approvalReadiness(buildSnapshot(cableSheet(300, false)), []);
    const decision = decide('submit', draft, designer, readiness);
    expect(decision).toMatchObject({ allowed: false, code: 'not_ready' });
    expect(decision.allowed ? '' : decision.reason).toBe('Choose a candidate before submitting the sheet: none is chosen yet.');
    expect(availableActions(draft, designer, readiness)).toContain('submit');
  });

  it('refuses to submit a chosen candidate with a blocker, naming the blocker by its title', () => {
    // 240 mm² in air carries well under 1500 A (its ampacity is a few hundred amperes): the hot spot is over the limit.
    const snapshot = buildSnapshot(cableSheet(1500, true));
    const readiness = approvalReadiness(snapshot, []);
    expect(readiness.blockerCodes).toContain('OVER_LIMIT');
    const decision = decide('submit', draft, designer, readiness);
    expect(decision).toMatchObject({ allowed: false, code: 'blocked' });
    expect(decision.allowed ? '' : decision.reason).toContain('The chosen candidate has a blocker, so the sheet cannot be submitted: Hot spot above the temperature limit');
    expect(decision.allowed ? '' : decision.reason).not.toMatch(/[A-Z]{2,}_[A-Z_]{2,}/);
  });

  it('allows submission of a chosen candidate without a blocker', () => {
    const readiness = approvalReadiness(buildSnapshot(cableSheet(300, true)), []);
    expect(readiness.blockerCodes).toEqual([]);
    expect(decide('submit', draft, designer, readiness)).toEqual({ allowed: true });
  });

  it('a stored sheet of an earlier version keeps the candidate it chose', () => {
    const fixture = storedV5 as unknown as { schemaVersion: number; barSheet: { chosenCandidateId: string | null }; cableSheet: { chosenCandidateId: string | null } };
    for (const raw of [fixture.barSheet, fixture.cableSheet]) {
      expect(raw.chosenCandidateId).not.toBeNull();
      expect(readSheetInputs(raw, fixture.schemaVersion).chosenCandidateId).toBe(raw.chosenCandidateId);
    }
  });
});

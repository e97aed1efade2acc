// A saved bus-bar result of the method since replaced (issue 18: a pack rated as n separate bars,
// flagged MULTI_BAR_INNER_FACES; a bar's AC factor the plane-conductor lower bound, flagged
// AC_FACTOR_LOWER_BOUND — codes no evaluation raises any more, lib/electrical/sizing/flags.ts) is
// marked for re-evaluation when the current method's figure differs, with both figures; a result
// by the current method is not marked. The sheet is the real version-5 demo bus-bar run
// (tests/fixtures/sheet-v5-demo.json). The saved "old" figure is shaped as the issue describes the
// old method — n × one bar alone (rateIsolatedBar, the bus-bar module's single bar) — a stand-in
// for the stored number; the check is that the mark shows it as saved and the current figure as
// computed by the library now.
import { describe, expect, it } from 'vitest';
import { rateIsolatedBar } from '@/lib/electrical/busbar';
import { makeFlag } from '@/lib/electrical/sizing/flags';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { computeSheet } from '@/lib/sheet/compute';
import { reEvaluationOf, reEvaluationSentence, replacedBarMethodCodes } from '@/lib/sheet/reEvaluation';
import { readSheetInputs } from '@/lib/sheet/schema';
import { buildSnapshot, type ResultSnapshot } from '@/lib/sheet/snapshot';
import storedV5 from '../../fixtures/sheet-v5-demo.json';

const inputs = readSheetInputs(JSON.parse(JSON.stringify(storedV5.barSheet)), 5);

/** The snapshot as the replaced method would have stored it for the chosen pack. */
function oldMethodSnapshot(): ResultSnapshot {
  const snapshot = buildSnapshot(inputs, new Date('2026-11-01T00:00:00Z'));
  const chosen = snapshot.evaluations.find((e) => e.id === inputs.chosenCandidateId) as CandidateEvaluationOk;
  const bar = inputs.candidates.find((c) => c.id === chosen.id)!;
  if (bar.kind !== 'bar') throw new Error('the demo run is a bar');
  const one = rateIsolatedBar({
    widthM: bar.widthM,
    thicknessM: bar.thicknessM,
    arrangement: 'edge',
    conductor: { rho20OhmM: bar.r20OhmPerM * bar.widthM * bar.thicknessM, alpha20PerK: 3.93e-3 },
    conditions: { ambientC: 35, emissivity: 0.4, limitC: 105 },
    excitation: { kind: 'three-phase', frequencyHz: 50 },
  });
  const old: CandidateEvaluationOk = {
    ...chosen,
    ampacityA: (bar.barsPerPhase ?? 1) * one.ampacityA,
    pack: undefined,
    flags: [...chosen.flags.filter((f) => f.code !== 'PACK_RATED_AS_SYSTEM'), makeFlag('MULTI_BAR_INNER_FACES', 'Inner faces of the pack treated as free (old method).')],
  };
  return { ...snapshot, evaluations: snapshot.evaluations.map((e) => (e.id === old.id ? old : e)) };
}

describe('a saved bar result of the replaced method', () => {
  it('is marked, with the saved figure and the current method’s beside it', () => {
    const saved = oldMethodSnapshot();
    const mark = reEvaluationOf(inputs, saved);
    expect(mark).not.toBeNull();
    expect(mark!.reason).toBe('replaced-bar-method');
    expect(mark!.replacedBarMethods).toEqual(['MULTI_BAR_INNER_FACES']);
    const savedChosen = saved.evaluations.find((e) => e.id === inputs.chosenCandidateId) as CandidateEvaluationOk;
    expect(mark!.saved).toEqual({ ampacityA: savedChosen.ampacityA, hotSpotC: savedChosen.hotSpotC });
    const now = computeSheet({ ...inputs, candidates: inputs.candidates.filter((c) => c.id === inputs.chosenCandidateId) });
    if (!now.ok || !now.comparison.evaluations[0].ok) throw new Error('the demo run must compute');
    expect(mark!.now).toEqual({ ampacityA: now.comparison.evaluations[0].ampacityA, hotSpotC: now.comparison.evaluations[0].hotSpotC });
    // The pack model rates the two bars below twice one bar (inner faces and current sharing).
    expect(mark!.now!.ampacityA).toBeLessThan(mark!.saved!.ampacityA);
    expect(reEvaluationSentence(mark!)).toContain('rated a pack of bars per phase as that many separate bars');
  });

  it('is not marked when the figure by the current method is the saved one', () => {
    const saved = oldMethodSnapshot();
    const current = buildSnapshot(inputs);
    const chosenNow = current.evaluations.find((e) => e.id === inputs.chosenCandidateId) as CandidateEvaluationOk;
    const sameFigure = { ...saved, evaluations: saved.evaluations.map((e) => (e.id === chosenNow.id && e.ok ? { ...e, ampacityA: chosenNow.ampacityA, hotSpotC: chosenNow.hotSpotC } : e)) };
    expect(replacedBarMethodCodes(sameFigure.evaluations.find((e) => e.id === chosenNow.id) as CandidateEvaluationOk)).toEqual(['MULTI_BAR_INNER_FACES']);
    expect(reEvaluationOf(inputs, sameFigure)).toBeNull();
  });

  it('a result by the current method is not marked', () => {
    expect(reEvaluationOf(inputs, buildSnapshot(inputs))).toBeNull();
  });
});

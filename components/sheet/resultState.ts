import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';

/** The three result states of product.md (Visual identity): word, icon and colour together. */
export type ResultState = 'within' | 'tight' | 'over';

export const RESULT_STATES: Record<ResultState, { word: string; icon: string; box: string; text: string }> = {
  within: { word: 'Within limit', icon: '✔', box: 'border-within bg-within-light', text: 'text-within-dark' },
  tight: { word: 'Margin under 10 %', icon: '▲', box: 'border-tight bg-tight-light', text: 'text-tight-dark' },
  over: { word: 'Over limit', icon: '✖', box: 'border-over bg-over-light', text: 'text-over-dark' },
};

export function thermalState(e: CandidateEvaluationOk): { state: ResultState; word: string } {
  if (e.hotSpotC === null) return { state: 'over', word: 'Runaway: no steady state' };
  if (e.marginK === null || e.marginK < 0) return { state: 'over', word: 'Over limit' };
  if (e.marginPercent !== null && e.marginPercent < 10) return { state: 'tight', word: 'Margin under 10 %' };
  return { state: 'within', word: 'Within limit' };
}

const FAILURE_WORDS: Record<string, string> = {
  OVER_LIMIT: 'over limit',
  RUNAWAY: 'runaway',
  SHORT_CIRCUIT_EXCEEDED: 'short circuit',
  VOLTAGE_DROP_EXCEEDED: 'voltage drop',
};

/** "Fails: short circuit, voltage drop" from the blocker flags. */
export function failureWords(e: CandidateEvaluationOk): string {
  const reasons = e.flags.filter((f) => f.severity === 'blocker').map((f) => FAILURE_WORDS[f.code] ?? f.title.toLowerCase());
  return `Fails: ${reasons.join(', ') || 'a check'}`;
}

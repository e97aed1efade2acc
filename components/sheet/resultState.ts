import { RESULT_WORDS, type ResultState } from '@/lib/sheet/candidateRow';

export type { ResultState };

/**
 * The look of the three result states of product.md (Visual identity): word, icon and colour
 * together, never colour alone. The words and which state a result is in: lib/sheet/candidateRow.
 */
export const RESULT_STATES: Record<ResultState, { word: string; icon: string; box: string; text: string }> = {
  within: { word: RESULT_WORDS.within, icon: '✔', box: 'border-within bg-within-light', text: 'text-within-dark' },
  tight: { word: RESULT_WORDS.tight, icon: '▲', box: 'border-tight bg-tight-light', text: 'text-tight-dark' },
  over: { word: RESULT_WORDS.over, icon: '✖', box: 'border-over bg-over-light', text: 'text-over-dark' },
};

'use client';
/** "Saved with an earlier method — re-evaluate", with the saved and the current figures of the chosen candidate side by side. */
import { figuresText, RE_EVALUATION_HEADING, reEvaluationSentence, type ReEvaluation } from '@/lib/sheet/reEvaluation';
import { formatQuantity, type UnitSystem } from '@/lib/units';

export function ReEvaluationNotice({ reEvaluation, units }: { reEvaluation: ReEvaluation; units: UnitSystem }) {
  const t = (c: number) => formatQuantity(c, 'temperature', units, { digits: 4 });
  return (
    <section role="note" aria-labelledby="re-evaluation-heading" className="rounded-md border-2 border-tight bg-tight-light px-3 py-2 text-body text-tight-dark" data-testid="re-evaluation">
      <h2 id="re-evaluation-heading" className="font-semibold">
        <span aria-hidden="true">▲ </span>
        {RE_EVALUATION_HEADING}
      </h2>
      <p className="text-ink-800">{reEvaluationSentence(reEvaluation)}</p>
      <dl className="mt-1 grid gap-x-4 gap-y-0.5 sm:grid-cols-[auto_minmax(0,1fr)]">
        <dt className="text-ink-600">Chosen candidate</dt>
        <dd className="text-ink-900">{reEvaluation.chosenLabel ?? 'none chosen'}</dd>
        <dt className="text-ink-600">Saved (earlier method)</dt>
        <dd className="num text-ink-900" data-testid="re-evaluation-saved">
          {figuresText(reEvaluation.saved, t)}
        </dd>
        <dt className="text-ink-600">Now (current method, from the saved inputs)</dt>
        <dd className="num font-semibold text-ink-900" data-testid="re-evaluation-now">
          {reEvaluation.now ? figuresText(reEvaluation.now, t) : (reEvaluation.nowMissing ?? 'not computed')}
        </dd>
      </dl>
    </section>
  );
}

'use client';
/**
 * The short-circuit forces of IEC 60865-1 on the bus-bar system (lib/sheet/systemWords): the
 * stress ratio, the support force against its rating, the largest support spacing that passes,
 * the verdict in words and icon, and the flags of the check beside it — or why it was not checked.
 */
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import type { SheetInputs } from '@/lib/sheet/schema';
import { flagsOf, FORCES_FLAG_CODES, forcesLines, forcesNotCheckedReason } from '@/lib/sheet/systemWords';
import { CheckFlagList } from './checkParts';
import { RESULT_STATES } from './resultState';

export function ForcesPanel({ evaluation, inputs }: { evaluation: CandidateEvaluationOk; inputs: SheetInputs }) {
  const f = evaluation.forces;
  const look = f ? RESULT_STATES[f.passes ? 'within' : 'over'] : null;
  return (
    <section aria-labelledby="forces-heading" className="panel p-3" data-testid="forces-panel">
      <h2 id="forces-heading" className="text-body font-semibold">Forces under short circuit (IEC 60865-1)</h2>
      {f && look ? (
        <>
          <p className={`mt-1 inline-flex items-center gap-1 rounded border px-1.5 text-caption leading-5 ${look.box} ${look.text}`} data-testid="forces-verdict">
            <span aria-hidden="true">{look.icon}</span>
            {f.passes ? 'Bars and supports withstand the fault' : 'Fails under the fault'}
          </p>
          <dl className="mt-1 text-body">
            {forcesLines(f, inputs.busbarSystem.supportSpacingM).map((line) => (
              <div key={line.label} className="flex items-baseline justify-between gap-2 border-b border-ink-50 py-1 last:border-0">
                <dt className="text-ink-600">{line.label}</dt>
                <dd className="num text-right text-ink-900">
                  {line.value}{' '}
                  {line.verdict === 'passes' ? <span className="text-within-dark">✔ passes</span> : line.verdict === 'fails' ? <span className="font-semibold text-over-dark">✖ fails</span> : null}
                </dd>
              </div>
            ))}
          </dl>
          <p className="mt-1 text-[0.6875rem] leading-4 text-ink-500">{f.method}</p>
        </>
      ) : (
        <p className="mt-1 text-caption text-tight-dark" data-testid="forces-verdict">▲ {forcesNotCheckedReason(inputs)}</p>
      )}
      <CheckFlagList flags={flagsOf(evaluation, FORCES_FLAG_CODES)} testId="forces-flags" />
    </section>
  );
}

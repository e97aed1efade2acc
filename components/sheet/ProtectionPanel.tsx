'use client';
/**
 * The rest of the circuit check (lib/sheet/systemWords): overload coordination, automatic
 * disconnection, the protective conductor and the neutral under harmonics, each with its numbers
 * and verdict in words and icon, the smallest device that coordinates, and the flags beside them.
 */
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import type { SheetInputs } from '@/lib/sheet/schema';
import { deviceWords, flagsOf, PROTECTION_FLAG_CODES, protectionLines, protectionVerdicts, type Verdict } from '@/lib/sheet/systemWords';
import { CheckFlagList } from './checkParts';

const VERDICT_LOOK: Record<Verdict, { icon: string; cls: string }> = {
  passes: { icon: '✔', cls: 'border-within bg-within-light text-within-dark' },
  fails: { icon: '✖', cls: 'border-over bg-over-light text-over-dark' },
  'not checked': { icon: '▲', cls: 'border-tight bg-tight-light text-tight-dark' },
};

export function ProtectionPanel({ evaluation, inputs }: { evaluation: CandidateEvaluationOk; inputs: SheetInputs }) {
  const verdicts = protectionVerdicts(evaluation);
  if (!verdicts) return null;
  const names: Array<[keyof typeof verdicts, string]> = [
    ['coordination', 'Overload coordination'],
    ['disconnection', 'Disconnection in time'],
    ['protectiveConductor', 'Protective conductor'],
    ['harmonics', 'Harmonics and neutral'],
  ];
  const smallest = evaluation.protection?.smallestRating;
  return (
    <section aria-labelledby="protection-heading" className="panel p-3" data-testid="protection-panel">
      <h2 id="protection-heading" className="text-body font-semibold">
        Protection{inputs.protection.included ? `: ${deviceWords(inputs.protection.device)}` : ''}
      </h2>
      <ul className="mt-1 flex flex-wrap gap-1.5" aria-label="Verdicts">
        {names.map(([key, label]) => {
          const v = verdicts[key];
          const look = VERDICT_LOOK[v];
          return (
            <li key={key} className={`inline-flex items-center gap-1 rounded border px-1.5 text-caption leading-5 ${look.cls}`} data-testid={`protection-verdict-${key}`}>
              <span aria-hidden="true">{look.icon}</span>
              {label}: {v}
            </li>
          );
        })}
      </ul>
      {smallest ? (
        <p className="mt-1 text-caption text-ink-700" data-testid="protection-smallest">
          Smallest device that coordinates with I_z = {Math.round(evaluation.ampacityA * 10) / 10} A: {smallest.ratingA === undefined ? 'none of the series' : `${smallest.ratingA} A`} ({smallest.seriesBasis})
        </p>
      ) : null}
      <dl className="mt-1 text-body">
        {protectionLines(evaluation).map((line, i) => (
          <div key={`${line.label}-${i}`} className="flex items-baseline justify-between gap-2 border-b border-ink-50 py-1 last:border-0">
            <dt className="text-ink-600">{line.label}</dt>
            <dd className="num text-right text-ink-900">
              {line.value}{' '}
              {line.verdict === 'passes' ? <span className="text-within-dark">✔ passes</span> : line.verdict === 'fails' ? <span className="font-semibold text-over-dark">✖ fails</span> : null}
            </dd>
          </div>
        ))}
      </dl>
      <CheckFlagList flags={flagsOf(evaluation, PROTECTION_FLAG_CODES)} testId="protection-flags" />
    </section>
  );
}

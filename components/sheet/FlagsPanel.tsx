'use client';
import { useState } from 'react';
import type { AssumptionFlag } from '@/lib/electrical/sizing/flags';

const SEVERITY = {
  blocker: { word: 'Blocker', icon: '✖', className: 'border-over bg-over-light text-over-dark' },
  review: { word: 'Review', icon: '▲', className: 'border-tight bg-tight-light text-tight-dark' },
  note: { word: 'Note', icon: 'i', className: 'border-ink-200 bg-ink-50 text-ink-600' },
} as const;

export interface Acknowledgement {
  flagCode: string;
  comment: string;
  reviewerName: string | null;
}

/**
 * The assumption flags of the candidate in focus, directly under the result strip. In review the
 * reviewer acknowledges each `review` flag with a comment; blockers cannot be acknowledged.
 */
export function FlagsPanel({
  flags,
  acknowledgements,
  canAcknowledge,
  onAcknowledge,
  pendingCode,
  heading,
}: {
  flags: AssumptionFlag[];
  acknowledgements: Acknowledgement[];
  canAcknowledge: boolean;
  onAcknowledge: (code: string, comment: string) => void;
  pendingCode: string | null;
  heading: string;
}) {
  const [drafts, setDrafts] = useState<Record<string, string>>({});
  const ackByCode = new Map(acknowledgements.map((a) => [a.flagCode, a]));
  const counts = { blocker: 0, review: 0, note: 0 };
  for (const f of flags) counts[f.severity] += 1;
  return (
    <section aria-labelledby="flags-heading" className="panel p-3" data-testid="flags-panel">
      <h2 id="flags-heading" className="flex flex-wrap items-baseline gap-x-3 text-body font-semibold">
        {heading}
        <span className="text-caption font-normal text-ink-500">
          {counts.blocker} blocker · {counts.review} review · {counts.note} note
        </span>
      </h2>
      {flags.length === 0 ? (
        <p className="mt-1 text-caption text-ink-500">No assumption flags.</p>
      ) : (
        <ul className="mt-2 space-y-1.5">
          {flags.map((flag) => {
            const look = SEVERITY[flag.severity];
            const ack = ackByCode.get(flag.code);
            return (
              <li key={flag.code} className="flex items-start gap-2 text-body" data-testid={`flag-${flag.code}`} data-severity={flag.severity}>
                <span className={`mt-0.5 inline-flex min-w-[4.9rem] shrink-0 items-center gap-1 rounded border px-1.5 text-caption font-semibold ${look.className}`}>
                  <span aria-hidden="true">{look.icon}</span>
                  {look.word}
                </span>
                <div className="min-w-0 flex-1">
                  <p>
                    <span className="font-medium">{flag.title}.</span> <span className="text-ink-700">{flag.message}</span>
                  </p>
                  {flag.severity === 'review' && ack ? (
                    <p className="text-caption text-within-dark" data-testid={`ack-${flag.code}`}>
                      ✔ Acknowledged by {ack.reviewerName ?? 'a reviewer'}: “{ack.comment}”
                    </p>
                  ) : null}
                  {flag.severity === 'review' && canAcknowledge && !ack ? (
                    <form
                      className="mt-1 flex gap-2"
                      onSubmit={(e) => {
                        e.preventDefault();
                        const comment = (drafts[flag.code] ?? '').trim();
                        if (comment.length >= 3) onAcknowledge(flag.code, comment);
                      }}
                    >
                      <label className="sr-only" htmlFor={`ack-comment-${flag.code}`}>Why is this acceptable?</label>
                      <input
                        id={`ack-comment-${flag.code}`}
                        data-testid={`ack-input-${flag.code}`}
                        className="field-input mt-0 py-0.5 text-caption"
                        placeholder="Why this is acceptable (required)"
                        value={drafts[flag.code] ?? ''}
                        onChange={(e) => setDrafts((d) => ({ ...d, [flag.code]: e.target.value }))}
                      />
                      <button type="submit" className="btn-quiet shrink-0 py-0.5 text-caption" disabled={pendingCode === flag.code || (drafts[flag.code] ?? '').trim().length < 3} data-testid={`ack-button-${flag.code}`}>
                        Acknowledge
                      </button>
                    </form>
                  ) : null}
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}

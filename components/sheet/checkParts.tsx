'use client';
/** The list of an optional check's flags, shared by the sheet's check panels and the share view. */
import { flagTitle, SEVERITY_WORDS } from '@/lib/sheet/flagWords';
import type { AssumptionFlag } from '@/lib/electrical/sizing/flags';

/** A check's flags, worst first as the library orders them; says so when there are none. */
export function CheckFlagList({ flags, testId }: { flags: AssumptionFlag[]; testId: string }) {
  if (flags.length === 0) return <p className="text-caption text-ink-500">No flags from this check.</p>;
  return (
    <ul className="mt-1 space-y-1 text-caption" data-testid={testId}>
      {flags.map((f) => (
        <li key={f.code} data-flag-code={f.code} className={f.severity === 'blocker' ? 'text-over-dark' : f.severity === 'review' ? 'text-tight-dark' : 'text-ink-600'}>
          <span className="font-medium">{f.title ?? flagTitle(f.code)}</span> ({SEVERITY_WORDS[f.severity]}): {f.message}
        </li>
      ))}
    </ul>
  );
}

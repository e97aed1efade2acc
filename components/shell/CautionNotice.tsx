import { CAUTION_TEXT } from '@/lib/caution';

/** The standing caution as a note (its words: lib/caution.ts); on every sheet, print and share view. */
export function CautionNotice({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      role="note"
      aria-label="Caution"
      className={`rounded-md border border-tight/40 bg-tight-light/60 text-ink-900 ${compact ? 'px-3 py-2 text-caption' : 'px-4 py-3 text-body'}`}
    >
      <p className="flex items-start gap-2">
        <span aria-hidden="true" className="mt-0.5 font-bold text-tight-dark">
          ⚠
        </span>
        <span>
          <strong className="font-semibold">Caution. </strong>
          {CAUTION_TEXT.join(' ')}
        </span>
      </p>
    </aside>
  );
}

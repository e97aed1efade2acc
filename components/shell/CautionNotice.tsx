/**
 * The standing caution (../shared/design/product.md, "Cautions"). Shown on every sheet, print and
 * share view; the wording is ours and must not be shortened away.
 */
export const CAUTION_TEXT = [
  'Ampwarden is an engineering aid. Its results depend on the assumptions listed with them.',
  'The installation must comply with the applicable wiring rules and standards (IEC 60364 and national codes) and with local authority requirements.',
  'A qualified, licensed engineer must check and sign this sizing sheet before it is used for construction.',
] as const;

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

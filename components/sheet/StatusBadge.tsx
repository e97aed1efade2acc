import { STATUS_LABELS, type SheetStatus } from '@/lib/sheet/stateMachine';

const STYLE: Record<SheetStatus, { icon: string; className: string }> = {
  draft: { icon: '✎', className: 'border-ink-200 bg-ink-50 text-ink-700' },
  in_review: { icon: '◔', className: 'border-copper-400 bg-copper-300/20 text-copper-700' },
  approved: { icon: '✔', className: 'border-within bg-within-light text-within-dark' },
  returned: { icon: '↩', className: 'border-tight bg-tight-light text-tight-dark' },
};

/** A review state as word and icon as well as colour. */
export function StatusBadge({ status }: { status: SheetStatus }) {
  const style = STYLE[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-caption font-medium ${style.className}`} data-status={status}>
      <span aria-hidden="true">{style.icon}</span>
      {STATUS_LABELS[status]}
    </span>
  );
}

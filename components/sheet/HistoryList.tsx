'use client';

import { flagTitle } from '@/lib/sheet/flagWords';
import { sectionWords } from '@/lib/sheet/revisionWords';

export interface HistoryItem {
  id: string;
  action: string;
  actorName: string | null;
  at: string;
  detail: Record<string, unknown>;
}

const WORDS: Record<string, string> = {
  'sheet.create': 'created the sheet',
  'sheet.save': 'saved',
  'sheet.submit': 'submitted it for review',
  'sheet.withdraw': 'withdrew it from review',
  'sheet.approve': 'approved it',
  'sheet.return': 'returned it',
  'sheet.flag.acknowledge': 'acknowledged a flag',
  'sheet.revise': 'started a new revision',
  'sheet.share.create': 'made a read-only link',
  'sheet.share.revoke': 'revoked a read-only link',
};

function describe(item: HistoryItem): string {
  const d = item.detail;
  if (item.action === 'sheet.save') {
    const changed = Array.isArray(d.changed) && d.changed.length > 0 ? ` (${(d.changed as string[]).map(sectionWords).join(', ')})` : ' (no input changed)';
    return `saved version ${String(d.toVersion ?? '')}${changed}`;
  }
  if (item.action === 'sheet.flag.acknowledge') return `acknowledged “${flagTitle(String(d.flagCode))}”: “${String(d.comment ?? '')}”`;
  if (item.action === 'sheet.create' && d.revisionOf) return `created revision ${String(d.revision)} from an approved sheet`;
  if (item.action === 'sheet.revise') return `started revision ${String(d.newRevision)}`;
  if (item.action === 'sheet.share.create') return `made a read-only link valid until ${String(d.expiresAt ?? '').slice(0, 16).replace('T', ' ')}`;
  if (item.action === 'sheet.email') return `e-mailed a read-only link${d.pdfAttached ? ' and the PDF' : ''} to ${String(d.to)}${typeof d.message === 'string' && d.message ? `: “${d.message}”` : ''}`;
  if (item.action === 'sheet.email.failed') return `tried to e-mail ${String(d.to)}, but the message could not be sent (the link was revoked)`;
  return WORDS[item.action] ?? item.action;
}

/** Every transition and save of the sheet, from the audit log. */
export function HistoryList({ items, loading }: { items: HistoryItem[]; loading: boolean }) {
  return (
    <section aria-labelledby="history-heading" className="panel p-3" data-testid="sheet-history">
      <h2 id="history-heading" className="text-body font-semibold">History</h2>
      {loading && items.length === 0 ? <p className="text-caption text-ink-500" role="status">Loading the history…</p> : null}
      <ol className="mt-1 space-y-1 text-body">
        {items.map((item) => (
          <li key={item.id} className="flex gap-3">
            <time className="num shrink-0 text-caption leading-5 text-ink-500" dateTime={item.at}>{item.at.slice(0, 16).replace('T', ' ')}</time>
            <span>
              <span className="font-medium">{item.actorName ?? 'Someone'}</span> {describe(item)}
              {typeof item.detail.comment === 'string' && item.action !== 'sheet.flag.acknowledge' ? <span className="block text-caption text-ink-700">“{item.detail.comment}”</span> : null}
            </span>
          </li>
        ))}
      </ol>
    </section>
  );
}

'use client';
/** One catalogue item's history, as the audit log recorded it: who, when, and each value from → to. */
import { useQuery } from '@tanstack/react-query';
import { columnByField } from '@/lib/catalogue/columns';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import type { UnitSystem } from '@/lib/units';
import { fetchItemHistory, historyQueryKey, type CatalogueHistoryAnswer } from './api';
import { formatDecimalCell, headerOf } from './columnDefs';

const ACTION_WORDS: Record<CatalogueHistoryAnswer['action'], string> = {
  created: 'Added',
  edited: 'Edited',
  imported: 'Imported',
  deleted: 'Removed',
  other: 'Changed',
};

export function ItemHistory({ kind, units, item, onClose }: { kind: CatalogueKind; units: UnitSystem; item: { id: string; key: string }; onClose: () => void }) {
  const history = useQuery({ queryKey: historyQueryKey(kind, item.id), queryFn: () => fetchItemHistory(kind, item.id) });

  const shown = (field: string, value: unknown) => {
    if (value === null || value === undefined || value === '') return '—';
    const column = columnByField(kind, field);
    return column?.type === 'decimal' ? formatDecimalCell(value, column, units) : String(value);
  };

  return (
    <section aria-labelledby="item-history-title" className="panel grid gap-2 p-4">
      <div className="flex items-start gap-3">
        <h2 id="item-history-title" className="font-semibold text-ink-900">
          History of {item.key}
        </h2>
        <button type="button" className="btn-quiet ml-auto" onClick={onClose}>
          Close
        </button>
      </div>
      {history.isPending ? <p role="status">Loading the history…</p> : null}
      {history.isError ? <p role="alert">The history could not be loaded: {history.error.message}</p> : null}
      {history.data?.length === 0 ? (
        <p className="text-ink-600">No recorded changes: this item came with the standard catalogue or before changes were recorded per item.</p>
      ) : null}
      {history.data?.length ? (
        <ol className="grid gap-2">
          {[...history.data].reverse().map((entry, i) => (
            <li key={`${entry.at}-${i}`} className="border-t border-ink-100 pt-2">
              <p className="text-body text-ink-800">
                <span className="font-semibold">{ACTION_WORDS[entry.action]}</span> by {entry.actorName ?? 'a removed member'} on{' '}
                <time dateTime={entry.at}>{new Date(entry.at).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' })} UTC</time>
                {entry.fileName ? ` from ${entry.fileName}` : ''}
              </p>
              {Object.keys(entry.changes).length ? (
                <table className="mt-1 text-caption">
                  <thead className="sr-only">
                    <tr>
                      <th>Field</th>
                      <th>Before</th>
                      <th>After</th>
                    </tr>
                  </thead>
                  <tbody>
                    {Object.entries(entry.changes).map(([field, change]) => {
                      const column = columnByField(kind, field);
                      return (
                        <tr key={field}>
                          <th scope="row" className="pr-3 text-left font-normal text-ink-600">
                            {column ? headerOf(column, units) : field}
                          </th>
                          <td className="num pr-2 text-ink-600">{entry.action === 'created' ? '' : shown(field, change.from)}</td>
                          <td className="num text-ink-900">
                            {entry.action === 'created' ? '' : '→ '}
                            {shown(field, change.to)}
                          </td>
                        </tr>
                      );
                    })}
                  </tbody>
                </table>
              ) : null}
            </li>
          ))}
        </ol>
      ) : null}
    </section>
  );
}

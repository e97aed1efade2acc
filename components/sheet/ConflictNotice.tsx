'use client';
import type { SheetInputs } from '@/lib/sheet/schema';

export interface Conflict {
  message: string;
  currentVersion: number;
  changedSections: string[];
  current: { inputs: SheetInputs; title: string; circuitTag: string; status: string };
}

function leaves(value: unknown, prefix = ''): Map<string, string> {
  const out = new Map<string, string>();
  if (value !== null && typeof value === 'object') {
    if (Array.isArray(value) && value.every((v) => v && typeof v === 'object' && 'id' in v)) {
      out.set(prefix, (value as { id: string; label?: string }[]).map((v) => v.label ?? v.id).join('; ') || '(none)');
      return out;
    }
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) for (const [p, s] of leaves(v, prefix ? `${prefix}.${k}` : k)) out.set(p, s);
    return out;
  }
  out.set(prefix, value === null ? 'not entered' : String(value));
  return out;
}

/** Shows what the newer save changed, field by field, against the user's own edits. */
export function ConflictNotice({ conflict, mine, onTakeTheirs, onKeepMine, busy }: { conflict: Conflict; mine: SheetInputs; onTakeTheirs: () => void; onKeepMine: () => void; busy: boolean }) {
  const theirs = leaves(conflict.current.inputs);
  const own = leaves(mine);
  const differences = [...new Set([...theirs.keys(), ...own.keys()])].filter((k) => theirs.get(k) !== own.get(k));
  return (
    <section role="alert" aria-labelledby="conflict-heading" className="panel border-2 border-over bg-over-light/50 p-3" data-testid="conflict-notice">
      <h2 id="conflict-heading" className="font-semibold text-over-dark">Not saved: someone saved a newer version</h2>
      <p className="text-body">{conflict.message}</p>
      <p className="mt-1 text-caption text-ink-700">Sections that differ: {conflict.changedSections.join(', ') || 'none'}.</p>
      {differences.length > 0 ? (
        <table className="mt-2 w-full text-caption">
          <thead>
            <tr className="text-left text-ink-500">
              <th className="pr-2 font-medium">Field</th>
              <th className="pr-2 font-medium">Saved (version {conflict.currentVersion})</th>
              <th className="font-medium">Yours</th>
            </tr>
          </thead>
          <tbody>
            {differences.slice(0, 20).map((path) => (
              <tr key={path} className="align-top">
                <td className="num pr-2">{path}</td>
                <td className="pr-2">{theirs.get(path) ?? '—'}</td>
                <td>{own.get(path) ?? '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      <div className="mt-2 flex flex-wrap gap-2">
        <button type="button" className="btn-quiet" onClick={onTakeTheirs} disabled={busy}>Load the saved version (drop mine)</button>
        <button type="button" className="btn-danger" onClick={onKeepMine} disabled={busy}>Save mine over it</button>
      </div>
    </section>
  );
}

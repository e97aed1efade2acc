'use client';
/**
 * Asked when an admin changes a cited value in the grid: where does the new value come from?
 * The edit is sent only with a source (the server refuses it without one, lib/catalogue/citations.ts),
 * so a row never keeps citing a table for a figure that table did not give.
 */
import { useId, useState, type FormEvent } from 'react';
import { columnByField } from '@/lib/catalogue/columns';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import type { UnitSystem } from '@/lib/units';
import { formatDecimalCell, headerOf } from './columnDefs';

export interface PendingEdit {
  id: string;
  key: string;
  field: string;
  value: unknown;
  sourceField: string;
  currentSource: string;
  /** The stored row the edit applies to (for the whole-row check). */
  row: Record<string, unknown>;
}

export function SourcePrompt({
  kind,
  units,
  edit,
  onConfirm,
  onCancel,
}: {
  kind: CatalogueKind;
  units: UnitSystem;
  edit: PendingEdit;
  /** Returns the reason when the row is still refused, or null when the edit was sent. */
  onConfirm: (source: string) => string | null;
  onCancel: () => void;
}) {
  const id = useId();
  const [source, setSource] = useState('');
  const [error, setError] = useState<string | null>(null);
  const column = columnByField(kind, edit.field);
  const sourceColumn = columnByField(kind, edit.sourceField);
  const what = column ? headerOf(column, units) : edit.field;
  const from = column ? formatDecimalCell(edit.row[edit.field], column, units) || String(edit.row[edit.field] ?? '') : String(edit.row[edit.field] ?? '');
  const to = column ? formatDecimalCell(edit.value, column, units) || String(edit.value ?? '') : String(edit.value ?? '');

  function submit(event: FormEvent) {
    event.preventDefault();
    if (source.trim() === '') {
      setError("Say where the new value comes from: standard and table, datasheet, handbook, or 'from memory'.");
      return;
    }
    setError(onConfirm(source.trim()));
  }

  return (
    <div role="dialog" aria-labelledby={`${id}-title`} className="panel grid gap-2 border-copper-500 p-4">
      <h2 id={`${id}-title`} className="font-semibold text-ink-900">
        Source of the new value
      </h2>
      <p className="text-body text-ink-700">
        {edit.key} · {what}: <span className="num">{from || '—'}</span> → <span className="num">{to || '—'}</span>. A changed value needs its citation; the
        row now cites &ldquo;{edit.currentSource || 'nothing'}&rdquo;.
      </p>
      <form onSubmit={submit} noValidate className="grid gap-2">
        <div>
          <label htmlFor={`${id}-source`} className="field-label">
            {sourceColumn?.label ?? 'Source'} for the new value
          </label>
          <textarea
            id={`${id}-source`}
            className="field-input"
            rows={2}
            value={source}
            autoFocus
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : undefined}
            onChange={(e) => setSource(e.target.value)}
          />
          {error ? (
            <p id={`${id}-error`} role="alert" className="mt-0.5 text-caption text-over-dark">
              {error}
            </p>
          ) : null}
        </div>
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn-primary">
            Save with this source
          </button>
          {edit.currentSource ? (
            <button type="button" className="btn-quiet" onClick={() => setSource(edit.currentSource)}>
              Same source as before
            </button>
          ) : null}
          <button type="button" className="btn-quiet" onClick={onCancel}>
            Cancel the change
          </button>
        </div>
      </form>
    </div>
  );
}

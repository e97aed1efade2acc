'use client';
/** One catalogue part in the grid: search, filters, column chooser, and in-place edits for admins. */
import { useCallback, useMemo, useRef, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AgGridReact } from 'ag-grid-react';
import type { CellEditRequestEvent, ColDef, ICellRendererParams, ModelUpdatedEvent } from 'ag-grid-community';
import { DataGrid } from '@/components/grid/DataGrid';
import { CATALOGUE_COLUMNS, KIND_LABELS, columnByField } from '@/lib/catalogue/columns';
import { ROW_SCHEMAS, type CatalogueKind, type StoredRow } from '@/lib/catalogue/schemas';
import { citingField } from '@/lib/catalogue/citations';
import type { UnitSystem } from '@/lib/units';
import { ApiFailure, catalogueQueryKey, fetchCatalogue, patchCatalogueRow } from './api';
import { columnDefsFor, headerOf, toStoredValue, type GridRow } from './columnDefs';
import { EmptyCatalogue } from './EmptyCatalogue';
import { useReferenceOptions } from './referenceOptions';
import { SourcePrompt, type PendingEdit } from './SourcePrompt';
import { ItemHistory } from './ItemHistory';

/** "128 items", or "2 of 128 items" when the search or a column filter hides some. */
export function countLabel(shown: number, total: number): string {
  const noun = (n: number) => (n === 1 ? 'item' : 'items');
  return shown === total ? `${total} ${noun(total)}` : `${shown} of ${total} ${noun(total)}`;
}
import { useNumberFormat } from '@/components/providers/NumberFormatProvider';

type Notice = { tone: 'saved' | 'refused'; text: string } | null;

export function CatalogueTable({ kind, units, canEdit, search }: { kind: CatalogueKind; units: UnitSystem; canEdit: boolean; search: string }) {
  const queryClient = useQueryClient();
  const gridRef = useRef<AgGridReact<GridRow>>(null);
  const [notice, setNotice] = useState<Notice>(null);
  const [hidden, setHidden] = useState<Set<string>>(() => new Set(CATALOGUE_COLUMNS[kind].filter((c) => c.hiddenByDefault).map((c) => c.field)));
  const rows = useQuery({ queryKey: catalogueQueryKey(kind), queryFn: () => fetchCatalogue(kind) });
  const referenceOptions = useReferenceOptions(kind, canEdit);
  const [shown, setShown] = useState<number | null>(null);
  const [pending, setPending] = useState<PendingEdit | null>(null);
  const [historyOf, setHistoryOf] = useState<{ id: string; key: string } | null>(null);
  const { decimalSeparator: separator, currency } = useNumberFormat();
  const columnDefs = useMemo((): ColDef<GridRow>[] => {
    const history: ColDef<GridRow> = {
      colId: 'history',
      headerName: 'History',
      pinned: 'right',
      width: 100,
      minWidth: 90,
      sortable: false,
      filter: false,
      floatingFilter: false,
      editable: false,
      suppressHeaderMenuButton: true,
      cellRenderer: (p: ICellRendererParams<GridRow>) =>
        p.data ? (
          <button
            type="button"
            className="text-caption text-copper-700 underline"
            aria-label={`History of ${String(p.data.key)}`}
            onClick={() => setHistoryOf({ id: p.data!.id, key: String(p.data!.key) })}
          >
            History
          </button>
        ) : null,
    };
    return [...columnDefsFor(kind, units, canEdit, referenceOptions, separator, currency), history];
  }, [kind, units, canEdit, referenceOptions, separator, currency]);
  const onModelUpdated = useCallback((event: ModelUpdatedEvent<GridRow>) => setShown(event.api.getDisplayedRowCount()), []);

  const save = useMutation({
    mutationFn: (edit: { id: string; key: string; field: string; value: unknown; changes?: Record<string, unknown> }) =>
      patchCatalogueRow(kind, edit.id, edit.changes ?? { [edit.field]: edit.value }),
    onSuccess: (row, edit) => {
      queryClient.setQueryData<StoredRow<CatalogueKind>[]>(catalogueQueryKey(kind), (old) => old?.map((r) => (r.id === row.id ? row : r)));
      // Keys and names show up in the other parts (a conductor's metal, a build's conductor).
      for (const other of ['materials', 'conductors', 'coverings', 'builds'] as const) if (other !== kind) void queryClient.invalidateQueries({ queryKey: catalogueQueryKey(other) });
      const column = columnByField(kind, edit.field);
      setNotice({ tone: 'saved', text: `Saved ${column ? headerOf(column, units) : edit.field} of ${row.key}.` });
    },
    onError: (error, edit) => {
      const column = columnByField(kind, edit.field);
      const where = `${edit.key} · ${column ? headerOf(column, units) : edit.field}`;
      setNotice({ tone: 'refused', text: `Not saved (${where}): ${error instanceof ApiFailure ? error.message : String(error)}` });
    },
  });

  function onCellEditRequest(event: CellEditRequestEvent<GridRow>) {
    const field = event.colDef.colId ?? event.colDef.field;
    const column = field ? columnByField(kind, field) : undefined;
    if (!column || !event.data) return;
    const typed = toStoredValue(event.newValue, column, units, separator);
    if ('refusal' in typed) {
      setNotice({ tone: 'refused', text: `Not saved (${String(event.data.key)} · ${headerOf(column, units, currency)}): ${typed.refusal}` });
      return;
    }
    const value = typed.value;
    const current = event.data[column.field];
    if ((current ?? '') === (value ?? '')) return;
    // The same schema the server applies: refuse at once with the field and the reason.
    const { id: _id, updatedAt: _updatedAt, ...stored } = event.data;
    const check = ROW_SCHEMAS[kind].safeParse({ ...stored, [column.field]: value });
    const key = String(event.data.key);
    if (!check.success) {
      const issue = check.error.issues.find((i) => i.path[0] === column.field) ?? check.error.issues[0];
      const issueColumn = columnByField(kind, String(issue.path[0] ?? column.field));
      setNotice({ tone: 'refused', text: `Not saved (${key} · ${issueColumn ? headerOf(issueColumn, units) : column.label}): ${issue.message}` });
      return;
    }
    // A changed value names where the new value comes from before it is sent (the server refuses it otherwise).
    const sourceField = citingField(kind, column.field);
    if (sourceField) {
      setNotice(null);
      setPending({ id: event.data.id, key, field: column.field, value, sourceField, currentSource: String(event.data[sourceField] ?? ''), row: stored });
      return;
    }
    save.mutate({ id: event.data.id, key, field: column.field, value });
  }

  function confirmSource(edit: PendingEdit, source: string) {
    const changes = { [edit.field]: edit.value, [edit.sourceField]: source };
    const check = ROW_SCHEMAS[kind].safeParse({ ...edit.row, ...changes });
    if (!check.success) {
      const issue = check.error.issues[0];
      const issueColumn = columnByField(kind, String(issue.path[0] ?? edit.field));
      return `${issueColumn ? headerOf(issueColumn, units) : edit.field} ${issue.message}`;
    }
    setPending(null);
    save.mutate({ id: edit.id, key: edit.key, field: edit.field, value: edit.value, changes });
    return null;
  }

  function toggleColumn(field: string, visible: boolean) {
    gridRef.current?.api.setColumnsVisible([field], visible);
    setHidden((old) => {
      const next = new Set(old);
      if (visible) next.delete(field);
      else next.add(field);
      return next;
    });
  }

  if (rows.isPending) return <p className="panel p-6 text-ink-600" role="status">Loading {KIND_LABELS[kind].tab.toLowerCase()}…</p>;
  if (rows.isError) {
    return (
      <div className="panel p-6" role="alert">
        <p className="font-semibold text-over">The catalogue could not be loaded.</p>
        <p className="mt-1 text-ink-600">{rows.error.message}</p>
        <button type="button" className="btn-quiet mt-3" onClick={() => void rows.refetch()}>
          Try again
        </button>
      </div>
    );
  }
  if (rows.data.length === 0) return <EmptyCatalogue kind={kind} canEdit={canEdit} />;

  return (
    <div className="grid gap-2">
      <div className="flex flex-wrap items-center gap-3 text-caption text-ink-600">
        <span>
          <span className="font-medium text-ink-800" data-testid="catalogue-count">{countLabel(shown ?? rows.data.length, rows.data.length)}</span> · {canEdit ? 'double-click a cell to edit it; every change is checked and recorded' : 'read only: admins edit the catalogue'}
          {' · '}values in {units === 'si' ? 'SI units' : 'US customary units'}
        </span>
        <details className="relative ml-auto">
          <summary className="btn-quiet cursor-pointer list-none">Columns</summary>
          <fieldset className="panel absolute right-0 z-20 mt-1 max-h-96 w-72 overflow-auto p-3">
            <legend className="sr-only">Columns shown</legend>
            {CATALOGUE_COLUMNS[kind].map((column) => (
              <label key={column.field} className="flex items-center gap-2 py-0.5 text-body text-ink-800">
                <input type="checkbox" checked={!hidden.has(column.field)} onChange={(e) => toggleColumn(column.field, e.target.checked)} />
                {headerOf(column, units, currency)}
              </label>
            ))}
          </fieldset>
        </details>
      </div>
      <div aria-live="polite" className="min-h-6">
        {notice ? (
          <p role={notice.tone === 'refused' ? 'alert' : 'status'} className={`rounded-md px-3 py-1.5 text-body ${notice.tone === 'refused' ? 'bg-over-light text-over-dark' : 'bg-within-light text-within-dark'}`}>
            {notice.tone === 'refused' ? '✕ ' : '✓ '}
            {notice.text}
          </p>
        ) : null}
      </div>
      {pending ? (
        <SourcePrompt
          key={`${pending.id}-${pending.field}`}
          kind={kind}
          units={units}
          edit={pending}
          onConfirm={(source) => confirmSource(pending, source)}
          onCancel={() => {
            setPending(null);
            setNotice({ tone: 'refused', text: `Not saved (${pending.key}): a changed value needs its source.` });
          }}
        />
      ) : null}
      <DataGrid<GridRow>
        ref={gridRef}
        label={`${KIND_LABELS[kind].tab} of the catalogue`}
        rowData={rows.data as unknown as GridRow[]}
        columnDefs={columnDefs}
        getRowId={(p) => p.data.id}
        quickFilterText={search}
        readOnlyEdit
        onCellEditRequest={onCellEditRequest}
        singleClickEdit={false}
        stopEditingWhenCellsLoseFocus
        onModelUpdated={onModelUpdated}
      />
      {historyOf ? <ItemHistory key={historyOf.id} kind={kind} units={units} item={historyOf} onClose={() => setHistoryOf(null)} /> : null}
    </div>
  );
}

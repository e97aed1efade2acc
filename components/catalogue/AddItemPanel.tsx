'use client';
/**
 * The add-an-item form for admins: one field per catalogue column, in the user's units, checked
 * with the kind's row schema (ROW_SCHEMAS, the very schema every imported row goes through) before
 * it is sent, and again by the server, whose refusals land on the field they name.
 */
import { useId, useState, type FormEvent } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { CATALOGUE_COLUMNS, KIND_LABELS, type ColumnSpec } from '@/lib/catalogue/columns';
import { ROW_SCHEMAS, type CatalogueKind } from '@/lib/catalogue/schemas';
import type { UnitSystem } from '@/lib/units';
import { ApiFailure, createCatalogueItem } from './api';
import { headerOf, toStoredValue } from './columnDefs';
import { useNumberFormat } from '@/components/providers/NumberFormatProvider';
import type { DecimalSeparator } from '@/lib/units/parse';
import { useReferenceOptions } from './referenceOptions';

type Errors = Record<string, string>;

function initialValues(kind: CatalogueKind): Record<string, string> {
  return Object.fromEntries(CATALOGUE_COLUMNS[kind].map((c) => [c.field, c.type === 'enum' && c.required ? (c.options?.[0] ?? '') : '']));
}

/**
 * What the form sends: typed text → the stored form (SI decimals, whole numbers, empty optional
 * values as null/''), read by the one number rule with the user's separator; a number the rule
 * refuses is returned as that field's message instead.
 */
function storedRow(kind: CatalogueKind, values: Record<string, string>, units: UnitSystem, separator: DecimalSeparator): { row: Record<string, unknown>; refusals: Errors } {
  const row: Record<string, unknown> = {};
  const refusals: Errors = {};
  for (const column of CATALOGUE_COLUMNS[kind]) {
    const typed = values[column.field] ?? '';
    if (column.type === 'decimal') {
      const stored = toStoredValue(typed.trim(), column, units, separator);
      if ('refusal' in stored) refusals[column.field] = stored.refusal;
      else row[column.field] = stored.value;
    } else row[column.field] = column.type === 'integer' && typed.trim() === '' ? null : typed;
  }
  return { row, refusals };
}

export function AddItemPanel({ kind, units, onClose, onAdded }: { kind: CatalogueKind; units: UnitSystem; onClose: () => void; onAdded: (key: string) => void }) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const formId = useId();
  const label = KIND_LABELS[kind];
  const columns = CATALOGUE_COLUMNS[kind];
  const referenceOptions = useReferenceOptions(kind, true);
  const [values, setValues] = useState<Record<string, string>>(() => initialValues(kind));
  const [errors, setErrors] = useState<Errors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const { decimalSeparator: separator } = useNumberFormat();

  const add = useMutation({
    mutationFn: (row: Record<string, unknown>) => createCatalogueItem(kind, row),
    onSuccess: (row) => {
      void queryClient.invalidateQueries({ queryKey: ['catalogue'] });
      // The tab counts come from the server render.
      router.refresh();
      onAdded(String(row.key));
    },
    onError: (error) => {
      if (error instanceof ApiFailure && error.issues.length) {
        setErrors(Object.fromEntries(error.issues.map((i) => [i.path.split('.')[0], i.message])));
        setFailure('Not added: correct the fields marked below.');
      } else setFailure(`Not added: ${error instanceof ApiFailure ? error.message : String(error)}`);
    },
  });

  function submit(event: FormEvent) {
    event.preventDefault();
    setFailure(null);
    const { row, refusals } = storedRow(kind, values, units, separator);
    const check = ROW_SCHEMAS[kind].safeParse(row);
    if (!check.success || Object.keys(refusals).length > 0) {
      const found: Errors = { ...refusals };
      for (const issue of check.success ? [] : check.error.issues) {
        const field = String(issue.path[0] ?? '');
        found[field] ??= issue.message;
      }
      setErrors(found);
      setFailure('Not added: correct the fields marked below.');
      return;
    }
    setErrors({});
    add.mutate(row);
  }

  function field(column: ColumnSpec) {
    const id = `${formId}-${column.field}`;
    const error = errors[column.field];
    const common = {
      id,
      name: column.field,
      value: values[column.field] ?? '',
      'aria-invalid': error ? true : undefined,
      'aria-describedby': error ? `${id}-error` : `${id}-hint`,
      className: 'field-input',
      onChange: (e: { target: { value: string } }) => setValues((old) => ({ ...old, [column.field]: e.target.value })),
    };
    const options = column.type === 'enum' ? [...(column.options ?? [])] : column.type === 'reference' ? (referenceOptions[column.references!] ?? []) : null;
    return (
      <div key={column.field} className={/source|note/i.test(column.field) ? 'sm:col-span-2' : undefined}>
        <label htmlFor={id} className="field-label">
          {headerOf(column, units)}
          {column.required ? '' : ' (optional)'}
        </label>
        {options ? (
          <select {...common}>
            {column.type === 'reference' || !column.required ? <option value="">—</option> : null}
            {options.map((o) => (
              <option key={o} value={o}>
                {o}
              </option>
            ))}
          </select>
        ) : (
          <input {...common} type="text" inputMode={column.type === 'decimal' || column.type === 'integer' ? 'decimal' : undefined} />
        )}
        {error ? (
          <p id={`${id}-error`} className="mt-0.5 text-caption text-over-dark">
            {headerOf(column, units)} {error}
          </p>
        ) : (
          <p id={`${id}-hint`} className="mt-0.5 text-caption text-ink-500">
            {column.hint}
          </p>
        )}
      </div>
    );
  }

  return (
    <section aria-labelledby={`${formId}-title`} className="panel grid gap-3 p-4">
      <div className="flex items-start gap-3">
        <div>
          <h2 id={`${formId}-title`} className="font-semibold text-ink-900">
            Add a {label.singular}
          </h2>
          <p className="mt-1 max-w-3xl text-ink-600">
            The same checks as a row of an imported file. Every value names its source: a standard and table, a datasheet, a handbook, or &ldquo;from memory&rdquo;, which
            raises a flag for the reviewer.
          </p>
        </div>
        <button type="button" className="btn-quiet ml-auto" onClick={onClose}>
          Close
        </button>
      </div>
      <form noValidate onSubmit={submit} aria-label={`New ${label.singular}`} className="grid gap-3">
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">{columns.map(field)}</div>
        {failure ? (
          <p role="alert" className="rounded-md bg-over-light px-3 py-1.5 text-body text-over-dark">
            ✕ {failure}
          </p>
        ) : null}
        <div>
          <button type="submit" className="btn-primary" disabled={add.isPending}>
            {add.isPending ? 'Adding…' : `Add the ${label.singular}`}
          </button>
        </div>
      </form>
    </section>
  );
}

'use client';
/**
 * Import for admins, in two steps: check the file (the server reads it, keeps it, and lists every
 * problem by row and column), then import it — every row in one transaction, or nothing.
 */
import { useId, useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { CATALOGUE_COLUMNS, KIND_LABELS } from '@/lib/catalogue/columns';
import { MAX_IMPORT_BYTES } from '@/lib/catalogue/limits';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import { ApiFailure, commitPreviewedImport, uploadForPreview, type ImportPreviewAnswer } from './api';
import { RecentImports, recentImportsQueryKey } from './RecentImports';

const SAMPLE_COLUMNS = 6;

export function ImportPanel({ kind, onClose }: { kind: CatalogueKind; onClose: () => void }) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const inputId = useId();
  const label = KIND_LABELS[kind];
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [preview, setPreview] = useState<ImportPreviewAnswer | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const check = useMutation({
    mutationFn: (chosen: File) => uploadForPreview(kind, chosen),
    onSuccess: (answer) => {
      setPreview(answer);
      void queryClient.invalidateQueries({ queryKey: recentImportsQueryKey });
    },
    onError: (error) => setFileError(error instanceof ApiFailure ? error.message : 'The file could not be sent.'),
  });
  const commit = useMutation({
    mutationFn: (importId: string) => commitPreviewedImport(importId),
    onSuccess: (result) => {
      setDone(`Imported: ${result.inserted} new row${result.inserted === 1 ? '' : 's'}, ${result.updated} replaced.`);
      setPreview(null);
      setFile(null);
      void queryClient.invalidateQueries({ queryKey: ['catalogue'] });
      // The tab counts come from the server render.
      router.refresh();
    },
    onError: (error) => {
      if (error instanceof ApiFailure && error.problems.length && preview) setPreview({ ...preview, problems: error.problems });
      else setFileError(error instanceof ApiFailure ? error.message : 'The import failed; nothing was changed.');
    },
  });

  function choose(chosen: File | null) {
    setPreview(null);
    setDone(null);
    setFileError(null);
    setFile(chosen);
    if (!chosen) return;
    // The server checks again; these save a round trip for the obvious cases.
    if (!/\.(csv|xlsx)$/i.test(chosen.name)) setFileError(`Only CSV (.csv) and Excel workbook (.xlsx) files can be imported; "${chosen.name}" is neither.`);
    else if (chosen.size === 0) setFileError(`"${chosen.name}" is empty.`);
    else if (chosen.size > MAX_IMPORT_BYTES) setFileError(`"${chosen.name}" is ${(chosen.size / 1024 / 1024).toFixed(1)} MB; the limit is ${MAX_IMPORT_BYTES / 1024 / 1024} MB.`);
  }

  const columns = CATALOGUE_COLUMNS[kind];
  const sampleColumns = columns.slice(0, SAMPLE_COLUMNS);

  return (
    <section aria-labelledby={`${inputId}-title`} className="panel grid gap-3 p-4">
      <div className="flex items-start gap-3">
        <div>
          <h2 id={`${inputId}-title`} className="font-semibold text-ink-900">
            Import {label.tab.toLowerCase()} from a file
          </h2>
          <p className="mt-1 max-w-3xl text-ink-600">
            One row per {label.singular}, columns as in the template, values in SI units. A row whose key already exists replaces that row; new keys add rows;
            nothing is deleted. The file is checked first; nothing changes until you import it, and then every row goes in or none does.
          </p>
        </div>
        <button type="button" className="btn-quiet ml-auto" onClick={onClose}>
          Close
        </button>
      </div>
      <p className="text-body">
        Template:{' '}
        <a className="text-copper-600 underline" href={`/api/catalogue/${kind}/template?format=xlsx`} download>
          Excel (.xlsx)
        </a>{' '}
        ·{' '}
        <a className="text-copper-600 underline" href={`/api/catalogue/${kind}/template?format=csv`} download>
          CSV
        </a>
      </p>
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (file && !fileError) check.mutate(file);
        }}
      >
        <div>
          <label htmlFor={inputId} className="field-label">
            File (CSV or XLSX, up to {MAX_IMPORT_BYTES / 1024 / 1024} MB)
          </label>
          <input
            id={inputId}
            name="file"
            type="file"
            accept=".csv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            className="field-input"
            aria-invalid={fileError ? true : undefined}
            aria-describedby={fileError ? `${inputId}-error` : undefined}
            onChange={(e) => choose(e.target.files?.[0] ?? null)}
          />
        </div>
        <button type="submit" className="btn-quiet" disabled={!file || Boolean(fileError) || check.isPending}>
          {check.isPending ? 'Checking…' : 'Check the file'}
        </button>
      </form>
      {fileError ? (
        <p id={`${inputId}-error`} role="alert" className="field-error text-body">
          {fileError}
        </p>
      ) : null}
      {done ? (
        <p role="status" className="rounded-md bg-within-light px-3 py-1.5 text-within-dark">
          ✓ {done}
        </p>
      ) : null}
      {preview ? (
        <div className="grid gap-2">
          <p role="status">
            <strong>{preview.fileName}</strong>: <span className="num">{preview.rowCount}</span> rows — <span className="num">{preview.newCount}</span> new,{' '}
            <span className="num">{preview.replaceCount}</span> replacing rows with the same key.
          </p>
          {preview.problems.length > 0 ? (
            <div role="alert" className="grid gap-2">
              <p className="font-semibold text-over">
                ✕ {preview.problems.length} problem{preview.problems.length === 1 ? '' : 's'}: nothing will be imported until every row is right. Fix the file and check it again.
              </p>
              <table className="w-full max-w-4xl text-left text-body">
                <caption className="sr-only">Problems in the file</caption>
                <thead className="text-caption text-ink-500">
                  <tr>
                    <th scope="col" className="py-1 pr-3">Row</th>
                    <th scope="col" className="py-1 pr-3">Column</th>
                    <th scope="col" className="py-1">What is wrong</th>
                  </tr>
                </thead>
                <tbody>
                  {preview.problems.slice(0, 200).map((p, i) => (
                    <tr key={i} className="border-t border-ink-100">
                      <td className="num py-1 pr-3">{p.row}</td>
                      <td className="py-1 pr-3 font-mono text-caption">{p.column || '—'}</td>
                      <td className="py-1">{p.message}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {preview.problems.length > 200 ? <p className="text-caption text-ink-600">…and {preview.problems.length - 200} more.</p> : null}
            </div>
          ) : (
            <>
              <table className="w-full text-left text-body">
                <caption className="text-left text-caption text-ink-600">First rows as they will be stored</caption>
                <thead className="text-caption text-ink-500">
                  <tr>
                    <th scope="col" className="py-1 pr-3">Row</th>
                    {sampleColumns.map((c) => (
                      <th key={c.field} scope="col" className="py-1 pr-3">
                        {c.header}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {preview.sample.slice(0, 10).map((r) => (
                    <tr key={r.row} className="border-t border-ink-100">
                      <td className="num py-1 pr-3">{r.row}</td>
                      {sampleColumns.map((c) => (
                        <td key={c.field} className="py-1 pr-3">
                          {String(r.value[c.field] ?? '')}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
              <div>
                <button type="button" className="btn-primary" disabled={commit.isPending} onClick={() => commit.mutate(preview.importId)}>
                  {commit.isPending ? 'Importing…' : `Import ${preview.rowCount} row${preview.rowCount === 1 ? '' : 's'}`}
                </button>
              </div>
            </>
          )}
        </div>
      ) : null}
      <RecentImports />
    </section>
  );
}

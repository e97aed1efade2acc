'use client';
/** What an empty catalogue part says: what belongs here, and how to fill it. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { KIND_LABELS } from '@/lib/catalogue/columns';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import { addStandardRows, ApiFailure } from './api';

export function EmptyCatalogue({ kind, canEdit }: { kind: CatalogueKind; canEdit: boolean }) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const label = KIND_LABELS[kind];
  const add = useMutation({
    mutationFn: addStandardRows,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: ['catalogue'] });
      router.refresh();
    },
  });
  return (
    <div className="panel p-6">
      <h2 className="font-semibold text-ink-900">No {label.tab.toLowerCase()} yet</h2>
      <p className="mt-1 max-w-2xl text-ink-600">{label.blurb}</p>
      {canEdit ? (
        <>
          <p className="mt-3 max-w-2xl text-ink-600">
            Start from the standard rows — IEC 60228 sections, AWG and kcmil sizes, common bars, the usual insulation and finishes, each with its source — then
            edit them to your suppliers&apos; data, or import your own file with <strong>Import a file</strong> above (download the template first).
          </p>
          <button type="button" className="btn-primary mt-4" disabled={add.isPending} onClick={() => add.mutate()}>
            {add.isPending ? 'Adding…' : 'Add the standard rows'}
          </button>
          {add.isError ? (
            <p role="alert" className="field-error">
              {add.error instanceof ApiFailure ? add.error.message : 'The standard rows could not be added.'}
            </p>
          ) : null}
        </>
      ) : (
        <p className="mt-3 text-ink-600">An admin of your team fills the catalogue: ask them to add the standard rows or import your suppliers&apos; data.</p>
      )}
    </div>
  );
}

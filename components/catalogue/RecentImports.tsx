'use client';
/** The team's recent imports, each with the original file as it was uploaded (admins). */
import { useQuery } from '@tanstack/react-query';
import { KIND_LABELS } from '@/lib/catalogue/columns';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import { ApiFailure } from './api';

interface ImportSummary {
  id: string;
  kind: CatalogueKind;
  fileName: string;
  sizeBytes: number;
  status: 'previewed' | 'committed';
  rowCount: number;
  createdAt: string;
  committedAt: string | null;
}

async function fetchImports(): Promise<ImportSummary[]> {
  const response = await fetch('/api/catalogue/imports', { cache: 'no-store' });
  if (!response.ok) throw new ApiFailure(response.status, `Recent imports could not be read (${response.status}).`);
  return ((await response.json()) as { imports: ImportSummary[] }).imports;
}

export const recentImportsQueryKey = ['catalogue', 'imports'] as const;

export function RecentImports() {
  const imports = useQuery({ queryKey: recentImportsQueryKey, queryFn: fetchImports });
  if (imports.isPending) return null;
  if (imports.isError) return <p className="text-caption text-over">{imports.error.message}</p>;
  if (imports.data.length === 0) return <p className="text-caption text-ink-600">No files imported yet. Each file you check is kept here with what became of it.</p>;
  return (
    <details className="text-body">
      <summary className="cursor-pointer text-ink-700">Recent files ({imports.data.length})</summary>
      <table className="mt-2 w-full max-w-4xl text-left">
        <caption className="sr-only">Recent catalogue files</caption>
        <thead className="text-caption text-ink-500">
          <tr>
            <th scope="col" className="py-1 pr-3">File</th>
            <th scope="col" className="py-1 pr-3">Part</th>
            <th scope="col" className="py-1 pr-3">Rows</th>
            <th scope="col" className="py-1 pr-3">Outcome</th>
            <th scope="col" className="py-1">Checked</th>
          </tr>
        </thead>
        <tbody>
          {imports.data.map((item) => (
            <tr key={item.id} className="border-t border-ink-100">
              <td className="py-1 pr-3">
                <a className="text-copper-600 underline" href={`/api/catalogue/imports/${item.id}/file`} download>
                  {item.fileName}
                </a>
              </td>
              <td className="py-1 pr-3">{KIND_LABELS[item.kind].tab}</td>
              <td className="num py-1 pr-3">{item.rowCount}</td>
              <td className="py-1 pr-3">{item.status === 'committed' ? 'imported' : 'checked, not imported'}</td>
              <td className="num py-1">{item.createdAt.slice(0, 16).replace('T', ' ')}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}

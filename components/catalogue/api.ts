/** The catalogue API as the browser calls it (react-query query and mutation functions). */
import type { CatalogueKind, StoredRow } from '@/lib/catalogue/schemas';
import type { ImportProblem } from '@/lib/catalogue/files';

export class ApiFailure extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues: Array<{ path: string; message: string }> = [],
    readonly problems: ImportProblem[] = [],
    readonly fieldPath?: string,
  ) {
    super(message);
  }
}

async function failureOf(response: Response): Promise<ApiFailure> {
  const body = (await response.json().catch(() => null)) as {
    error?: { message?: string; issues?: Array<{ path: string; message: string }>; problems?: ImportProblem[]; fieldPath?: string };
  } | null;
  const message = body?.error?.message ?? `The server answered ${response.status}.`;
  return new ApiFailure(response.status, message, body?.error?.issues ?? [], body?.error?.problems ?? [], body?.error?.fieldPath);
}

export const catalogueQueryKey = (kind: CatalogueKind) => ['catalogue', kind] as const;

export async function fetchCatalogue<K extends CatalogueKind>(kind: K): Promise<StoredRow<K>[]> {
  const response = await fetch(`/api/catalogue/${kind}`, { cache: 'no-store' });
  if (!response.ok) throw await failureOf(response);
  return ((await response.json()) as { rows: StoredRow<K>[] }).rows;
}

export async function patchCatalogueRow<K extends CatalogueKind>(kind: K, id: string, changes: Record<string, unknown>): Promise<StoredRow<K>> {
  const response = await fetch(`/api/catalogue/${kind}/${id}`, {
    method: 'PATCH',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ changes }),
  });
  if (!response.ok) throw await failureOf(response);
  return ((await response.json()) as { row: StoredRow<K> }).row;
}

export interface ImportPreviewAnswer {
  importId: string;
  kind: CatalogueKind;
  fileName: string;
  rowCount: number;
  newCount: number;
  replaceCount: number;
  problems: ImportProblem[];
  sample: Array<{ row: number; value: Record<string, unknown> }>;
}

export async function uploadForPreview(kind: CatalogueKind, file: File): Promise<ImportPreviewAnswer> {
  const form = new FormData();
  form.set('kind', kind);
  form.set('file', file);
  const response = await fetch('/api/catalogue/imports', { method: 'POST', body: form });
  if (!response.ok) throw await failureOf(response);
  return (await response.json()) as ImportPreviewAnswer;
}

export async function commitPreviewedImport(importId: string): Promise<{ inserted: number; updated: number }> {
  const response = await fetch(`/api/catalogue/imports/${importId}/commit`, { method: 'POST' });
  if (!response.ok) throw await failureOf(response);
  return (await response.json()) as { inserted: number; updated: number };
}

export async function addStandardRows(): Promise<Record<CatalogueKind, number>> {
  const response = await fetch('/api/catalogue/standard', { method: 'POST' });
  if (!response.ok) throw await failureOf(response);
  return ((await response.json()) as { added: Record<CatalogueKind, number> }).added;
}

/** Adds one item: the whole row in SI; the server checks it with the same row schema as an imported row. */
export async function createCatalogueItem<K extends CatalogueKind>(kind: K, row: Record<string, unknown>): Promise<StoredRow<K>> {
  const response = await fetch(`/api/catalogue/${kind}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ row }),
  });
  if (!response.ok) throw await failureOf(response);
  return ((await response.json()) as { row: StoredRow<K> }).row;
}

export interface CatalogueHistoryAnswer {
  at: string;
  action: 'created' | 'edited' | 'imported' | 'deleted' | 'other';
  actorName: string | null;
  fileName?: string;
  changes: Record<string, { from: unknown; to: unknown }>;
}

export const historyQueryKey = (kind: CatalogueKind, id: string) => ['catalogue', kind, 'history', id] as const;

export async function fetchItemHistory(kind: CatalogueKind, id: string): Promise<CatalogueHistoryAnswer[]> {
  const response = await fetch(`/api/catalogue/${kind}/${id}/history`, { cache: 'no-store' });
  if (!response.ok) throw await failureOf(response);
  return ((await response.json()) as { entries: CatalogueHistoryAnswer[] }).entries;
}

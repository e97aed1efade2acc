/** Shared pieces of the catalogue route handlers: the kind from the path and our errors as API errors. */
import { ApiError } from '@/server/http/api';
import { downloadResponse } from '@/server/http/download';
import { isCatalogueKind, type CatalogueKind } from '@/lib/catalogue/schemas';
import { KIND_LABELS } from '@/lib/catalogue/columns';
import { FileRefusal } from '@/lib/catalogue/files';
import { CatalogueConflictError, CatalogueNotFoundError, ImportProblemsError } from '@/db/queries/catalogue';

export function kindFrom(params: Record<string, string>): CatalogueKind {
  const kind = params.kind;
  if (!isCatalogueKind(kind)) throw new ApiError(404, 'not_found', `No catalogue part called "${kind}".`);
  return kind;
}

export function formatFrom(req: Request): 'csv' | 'xlsx' {
  const format = new URL(req.url).searchParams.get('format') ?? 'csv';
  if (format !== 'csv' && format !== 'xlsx') throw new ApiError(400, 'invalid_input', 'format must be csv or xlsx.', 'format');
  return format;
}

/** Our data-layer errors, as the API answers them; anything else is rethrown for apiHandler. */
export function catalogueErrorResponse(error: unknown): Response {
  if (error instanceof CatalogueNotFoundError) throw new ApiError(404, 'not_found', error.message);
  if (error instanceof CatalogueConflictError) throw new ApiError(409, 'conflict', error.message);
  if (error instanceof FileRefusal) throw new ApiError(error.status, error.code, error.message, 'file');
  if (error instanceof ImportProblemsError) {
    return Response.json({ error: { code: 'import_has_problems', message: error.message, problems: error.problems } }, { status: 422 });
  }
  throw error;
}

/** A catalogue file through the shared download helper (BOM on CSV, RFC 6266 file name). */
export function fileResponse(body: Uint8Array | string, fileName: string, format: 'csv' | 'xlsx'): Response {
  return downloadResponse(body, { fileName, kind: format });
}

export function fileBaseName(kind: CatalogueKind): string {
  return KIND_LABELS[kind].file;
}

import { ApiError, apiHandler } from '@/server/http/api';
import { isCatalogueKind } from '@/lib/catalogue/schemas';
import { MAX_IMPORT_BYTES } from '@/lib/catalogue/files';
import { listImports, previewImport } from '@/db/queries/catalogue';
import { readCatalogueFileOffThread } from '@/server/files/uploadReader';
import { catalogueErrorResponse } from '../_shared/catalogueApi';

export const dynamic = 'force-dynamic';

/** Room for the multipart envelope around a file at the limit. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

/**
 * Step 1 of an import (admins): multipart form with `kind` and `file` (CSV or XLSX). Answers the
 * preview — row count, new and replaced keys, and every problem with its row and column. Nothing
 * in the catalogue changes until the import is committed.
 */
export const POST = apiHandler({ permission: 'catalogue:write' }, async (req, { user }) => {
  const declared = Number(req.headers.get('content-length') ?? '0');
  if (declared > MAX_IMPORT_BYTES + MULTIPART_OVERHEAD_BYTES) {
    throw new ApiError(413, 'file_too_large', `The upload is larger than the ${(MAX_IMPORT_BYTES / 1024 / 1024).toFixed(1)} MB limit (${declared.toLocaleString('en')} bytes). Split the file.`, 'file');
  }
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new ApiError(400, 'invalid_input', 'Send the file as multipart/form-data with the fields "kind" and "file".', 'file');
  }
  const kind = form.get('kind');
  if (!isCatalogueKind(kind)) throw new ApiError(400, 'invalid_input', 'kind must be one of materials, conductors, coverings, builds.', 'kind');
  const file = form.get('file');
  if (!(file instanceof File)) throw new ApiError(400, 'invalid_input', 'Choose a CSV or XLSX file to import.', 'file');
  try {
    const preview = await previewImport(
      user!.teamId,
      user!.id,
      kind,
      { fileName: file.name || 'upload', mediaType: file.type, bytes: new Uint8Array(await file.arrayBuffer()) },
      readCatalogueFileOffThread,
    );
    return Response.json(preview, { status: 201 });
  } catch (error) {
    return catalogueErrorResponse(error);
  }
});

/** Recent imports of the team (admins). */
export const GET = apiHandler({ permission: 'catalogue:write' }, async (_req, { user }) => {
  return Response.json({ imports: await listImports(user!.teamId) });
});

import { ApiError, apiHandler } from '@/server/http/api';
import { downloadResponse } from '@/server/http/download';
import { getImportFile } from '@/db/queries/catalogue';

export const dynamic = 'force-dynamic';

/** The original file of an import, byte for byte (admins). */
export const GET = apiHandler({ permission: 'catalogue:write' }, async (_req, { user, params }) => {
  const file = await getImportFile(user!.teamId, params.importId);
  if (!file) throw new ApiError(404, 'not_found', 'No such import.');
  return downloadResponse(new Uint8Array(file.content), { fileName: file.fileName, kind: 'original' });
});

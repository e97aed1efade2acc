import { ApiError, apiHandler } from '@/server/http/api';
import { getImportFile } from '@/db/queries/catalogue';

export const dynamic = 'force-dynamic';

/** The original file of an import, byte for byte (admins). */
export const GET = apiHandler({ permission: 'catalogue:write' }, async (_req, { user, params }) => {
  const file = await getImportFile(user!.teamId, params.importId);
  if (!file) throw new ApiError(404, 'not_found', 'No such import.');
  const safeName = file.fileName.replace(/["\\\r\n]/g, '_');
  return new Response(new Uint8Array(file.content), {
    headers: { 'content-type': 'application/octet-stream', 'content-disposition': `attachment; filename="${safeName}"`, 'cache-control': 'no-store' },
  });
});

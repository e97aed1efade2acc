import { apiHandler } from '@/server/http/api';
import { commitImport } from '@/db/queries/catalogue';
import { readCatalogueFileOffThread } from '@/server/files/uploadReader';
import { catalogueErrorResponse } from '../../../_shared/catalogueApi';

export const dynamic = 'force-dynamic';

/**
 * Step 2 (admins): writes every row of the previewed file in one transaction, or nothing —
 * 422 with the problems (row, column, message) when any row is wrong.
 */
export const POST = apiHandler({ permission: 'catalogue:write' }, async (_req, { user, params }) => {
  try {
    return Response.json(await commitImport(user!.teamId, user!.id, params.importId, readCatalogueFileOffThread));
  } catch (error) {
    return catalogueErrorResponse(error);
  }
});

import { apiHandler } from '@/server/http/api';
import { rowPatchSchema } from '@/lib/catalogue/schemas';
import { deleteCatalogueRow, updateCatalogueRow } from '@/db/queries/catalogue';
import { catalogueErrorResponse, kindFrom } from '../../_shared/catalogueApi';
import { readJsonBody } from '@/server/http/body';

export const dynamic = 'force-dynamic';

/**
 * An edit of one row (admins): `{ changes: { field: value } }` in SI. The whole row is validated
 * again on the server; a bad value answers 400 naming the field.
 */
export const PATCH = apiHandler({ permission: 'catalogue:write' }, async (req, { user, params }) => {
  const kind = kindFrom(params);
  const body = await readJsonBody(req, rowPatchSchema, { optional: true });
  try {
    const row = await updateCatalogueRow(user!.teamId, user!.id, kind, params.id, body.changes);
    return Response.json({ row });
  } catch (error) {
    return catalogueErrorResponse(error);
  }
});

/** Removes a row that nothing else uses (admins). */
export const DELETE = apiHandler({ permission: 'catalogue:write' }, async (_req, { user, params }) => {
  const kind = kindFrom(params);
  try {
    await deleteCatalogueRow(user!.teamId, user!.id, kind, params.id);
    return new Response(null, { status: 204 });
  } catch (error) {
    return catalogueErrorResponse(error);
  }
});

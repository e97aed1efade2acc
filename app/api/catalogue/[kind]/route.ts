import { apiHandler } from '@/server/http/api';
import { createCatalogueRow, listCatalogue } from '@/db/queries/catalogue';
import { rowCreateSchema } from '@/lib/catalogue/schemas';
import { readJsonBody } from '@/server/http/body';
import { catalogueErrorResponse, kindFrom } from '../_shared/catalogueApi';

export const dynamic = 'force-dynamic';

/** The team's rows of one catalogue part, in the row form of lib/catalogue (decimal strings, SI). */
export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const kind = kindFrom(params);
  const rows = await listCatalogue(user!.teamId, kind);
  return Response.json({ kind, rows });
});

/**
 * Adds one item (admins): `{ row: { field: value } }` in SI, checked by the same row schema as an
 * imported row; a bad value answers 400 naming the field, a taken key too.
 */
export const POST = apiHandler({ permission: 'catalogue:write' }, async (req, { user, params }) => {
  const kind = kindFrom(params);
  const body = await readJsonBody(req, rowCreateSchema);
  try {
    const row = await createCatalogueRow(user!.teamId, user!.id, kind, body.row);
    return Response.json({ row }, { status: 201 });
  } catch (error) {
    return catalogueErrorResponse(error);
  }
});

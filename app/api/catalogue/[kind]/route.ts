import { apiHandler } from '@/server/http/api';
import { listCatalogue } from '@/db/queries/catalogue';
import { kindFrom } from '../_shared/catalogueApi';

export const dynamic = 'force-dynamic';

/** The team's rows of one catalogue part, in the row form of lib/catalogue (decimal strings, SI). */
export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const kind = kindFrom(params);
  const rows = await listCatalogue(user!.teamId, kind);
  return Response.json({ kind, rows });
});

import { ApiError, apiHandler } from '@/server/http/api';
import { catalogueRowHistory } from '@/db/queries/catalogue';
import { kindFrom } from '../../../_shared/catalogueApi';

export const dynamic = 'force-dynamic';

/** One item's edit history from the audit log (everyone of the team reads it, as they read the item). */
export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const kind = kindFrom(params);
  const entries = await catalogueRowHistory(user!.teamId, kind, params.id);
  if (!entries) throw new ApiError(404, 'not_found', 'No such catalogue row.');
  return Response.json({ entries });
});

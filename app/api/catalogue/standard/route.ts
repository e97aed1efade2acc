import { apiHandler } from '@/server/http/api';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';

export const dynamic = 'force-dynamic';

/**
 * Adds the standard rows the team does not have yet (admins): keys the team already has are left
 * as they are, so it never overwrites the team's own edits.
 */
export const POST = apiHandler({ permission: 'catalogue:write' }, async (_req, { user }) => {
  const added = await copyStandardCatalogueToTeam(user!.teamId, undefined, user!.id);
  return Response.json({ added });
});

import { apiHandler } from '@/server/http/api';
import { listPendingInvitations, listTeamMembers } from '@/db/queries/members';

export const dynamic = 'force-dynamic';

/** The team's members and open invitations (admins only). */
export const GET = apiHandler({ permission: 'members:manage' }, async (_req, { user }) => {
  const [members, invitations] = await Promise.all([listTeamMembers(user!.teamId), listPendingInvitations(user!.teamId)]);
  return Response.json({ members, invitations });
});

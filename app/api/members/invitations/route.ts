import { apiHandler } from '@/server/http/api';
import { inviteMember, inviteSchema } from '@/server/auth/members';
import { readJsonBody } from '@/server/http/body';

export const dynamic = 'force-dynamic';

/** Invites an e-mail address with a role and sends the link (admins only). */
export const POST = apiHandler({ permission: 'members:manage' }, async (req, { user }) => {
  const input = await readJsonBody(req, inviteSchema, { optional: true });
  const invitation = await inviteMember(user!, input);
  return Response.json({ invitation }, { status: 201 });
});

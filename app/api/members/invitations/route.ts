import { apiHandler } from '@/server/http/api';
import { inviteMember, inviteSchema } from '@/server/auth/members';

export const dynamic = 'force-dynamic';

/** Invites an e-mail address with a role and sends the link (admins only). */
export const POST = apiHandler({ permission: 'members:manage' }, async (req, { user }) => {
  const input = inviteSchema.parse(await req.json().catch(() => ({})));
  const invitation = await inviteMember(user!, input);
  return Response.json({ invitation }, { status: 201 });
});

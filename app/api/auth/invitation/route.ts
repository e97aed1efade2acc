import { apiHandler } from '@/server/http/api';
import { acceptInvitation, acceptInvitationSchema } from '@/server/auth/members';
import { readJsonBody } from '@/server/http/body';

export const dynamic = 'force-dynamic';

/** Sets the password of an invited member once; 410 when the link was used or has expired. */
export const POST = apiHandler({ permission: 'public' }, async (req) => {
  const input = await readJsonBody(req, acceptInvitationSchema, { optional: true });
  const user = await acceptInvitation(input);
  return Response.json({ email: user.email, role: user.role }, { status: 201 });
});

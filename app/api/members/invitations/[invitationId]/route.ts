import { z } from 'zod';
import { ApiError, apiHandler } from '@/server/http/api';
import { revokeInvitation } from '@/server/auth/members';

export const dynamic = 'force-dynamic';

/** Withdraws an open invitation; its link stops working (admins only). */
export const DELETE = apiHandler({ permission: 'members:manage' }, async (_req, { user, params }) => {
  const id = z.uuid().safeParse(params.invitationId);
  if (!id.success) throw new ApiError(404, 'not_found', 'No open invitation with that id in your team.');
  await revokeInvitation(user!, id.data);
  return new Response(null, { status: 204 });
});

import { z } from 'zod';
import { ApiError, apiHandler } from '@/server/http/api';
import { changeMember, memberChangeSchema } from '@/server/auth/members';
import { readJsonBody } from '@/server/http/body';

export const dynamic = 'force-dynamic';

/** Changes a member's role and/or deactivates or reactivates them (admins only). */
export const PATCH = apiHandler({ permission: 'members:manage' }, async (req, { user, params }) => {
  const id = z.uuid().safeParse(params.userId);
  if (!id.success) throw new ApiError(404, 'not_found', 'No member with that id in your team.');
  const change = await readJsonBody(req, memberChangeSchema, { optional: true });
  const member = await changeMember(user!, id.data, change);
  return Response.json({ member });
});

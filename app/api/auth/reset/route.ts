import { apiHandler } from '@/server/http/api';
import { resetPassword, resetPasswordSchema } from '@/server/auth/members';
import { readJsonBody } from '@/server/http/body';

export const dynamic = 'force-dynamic';

/** Saves a new password from a reset link once; 410 when the link was used or has expired. */
export const POST = apiHandler({ permission: 'public' }, async (req) => {
  const input = await readJsonBody(req, resetPasswordSchema, { optional: true });
  const user = await resetPassword(input);
  return Response.json({ email: user.email });
});

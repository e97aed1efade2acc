import { after } from 'next/server';
import { apiHandler } from '@/server/http/api';
import { requestPasswordReset, resetRequestSchema } from '@/server/auth/members';
import { allowResetMail } from '@/server/limits/resetMail';
import { clientAddressFrom } from '@/server/limits/signIn';
import { readJsonBody } from '@/server/http/body';

export const dynamic = 'force-dynamic';

/** Mails a reset link when the address has an account; the answer is the same either way. */
export const POST = apiHandler({ permission: 'public' }, async (req) => {
  const { email } = await readJsonBody(req, resetRequestSchema, { optional: true });
  if (await allowResetMail(email, clientAddressFrom(req.headers))) {
    // After the answer is sent, so that its timing does not tell whether the address has an account.
    after(() => requestPasswordReset(email).catch((error: unknown) => console.error('ampwarden: password reset mail failed', error)));
  }
  return Response.json({ message: 'If that address belongs to an Ampwarden account, a link to choose a new password is on its way.' }, { status: 202 });
});

/**
 * Checks an e-mail and password for next-auth's Credentials provider, with the sign-in limits.
 * Kept apart from the next-auth options so that it can be tested on its own.
 */
import { z } from 'zod';
import { findSignInRow } from '@/db/queries/members';
import { checkSignInAllowed, clearAccountFailures, recordFailedSignIn } from '@/server/limits/signIn';
import type { Role } from '@/lib/auth/permissions';
import { verifyPassword } from '@/lib/auth/password';

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address.').max(320),
  password: z.string().min(1, 'Enter your password.').max(200),
});

export type SignInOutcome =
  | { ok: true; user: { id: string; teamId: string; role: Role; name: string; email: string; sessionEpoch: number } }
  | { ok: false; reason: 'invalid' }
  | { ok: false; reason: 'limited'; retryAfterS: number };

/** The code next-auth hands to the sign-in page for a limited attempt: `limited:<seconds>`. */
export const LIMITED_PREFIX = 'limited:';

export async function verifySignIn(input: unknown, clientAddress: string): Promise<SignInOutcome> {
  const parsed = signInSchema.safeParse(input);
  if (!parsed.success) return { ok: false, reason: 'invalid' };
  const { email, password } = parsed.data;

  const before = await checkSignInAllowed(email, clientAddress);
  if (before.limited) return { ok: false, reason: 'limited', retryAfterS: before.retryAfterS };

  const row = await findSignInRow(email);
  const passwordMatches = await verifyPassword(password, row?.passwordHash ?? null);
  // A deactivated member is refused like a wrong password, so that the answer tells nobody which accounts exist.
  if (!row || !passwordMatches || !row.active) {
    const after = await recordFailedSignIn(email, clientAddress);
    return after.limited ? { ok: false, reason: 'limited', retryAfterS: after.retryAfterS } : { ok: false, reason: 'invalid' };
  }
  await clearAccountFailures(email);
  return {
    ok: true,
    user: { id: row.id, teamId: row.teamId, role: row.role, name: row.name, email: row.email, sessionEpoch: row.sessionEpoch },
  };
}

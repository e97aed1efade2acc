'use server';
/** The sizing sheet's own settings of the signed-in user: the comparison grid's column picker, remembered per user. */
import { updateUserPreferences } from '@/db/queries/preferences';
import { candidateGridColumnsSchema } from '@/lib/user/preferences';
import { authorizeAction } from '@/server/auth/actions';

export async function saveCandidateGridColumnsAction(columns: unknown): Promise<{ ok: true } | { ok: false; message: string }> {
  // Every role that reads sheets compares candidates, so every role may keep its own columns.
  const user = await authorizeAction('team:read');
  const parsed = candidateGridColumnsSchema.safeParse(columns);
  if (!parsed.success) return { ok: false, message: parsed.error.issues[0]?.message ?? 'Not a column choice' };
  const saved = await updateUserPreferences(user.teamId, user.id, { candidateGridColumns: parsed.data });
  return saved ? { ok: true } : { ok: false, message: 'Your account was not found.' };
}

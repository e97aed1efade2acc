'use server';

import { revalidatePath } from 'next/cache';
import { authorizeAction } from './actions';
import { decimalSeparatorSchema, setDecimalSeparator, setUnitSystem, unitSystemSchema } from './members';
import { updateUserPreferences } from '@/db/queries/preferences';
import { candidateGridColumnsSchema } from '@/lib/user/preferences';

/** The SI / imperial switch of the user menu; stored in users.unit_system. */
export async function setUnitSystemAction(unitSystem: unknown): Promise<{ unitSystem: 'si' | 'imperial' }> {
  const user = await authorizeAction('authenticated');
  const parsed = unitSystemSchema.parse(unitSystem);
  await setUnitSystem(user, parsed);
  revalidatePath('/', 'layout');
  return { unitSystem: parsed };
}

/**
 * The comparison grid's column picker on a sizing sheet, remembered per user (users.preferences).
 * Every signed-in role compares candidates, so every role may keep its own columns.
 */
export async function saveCandidateGridColumnsAction(columns: unknown): Promise<{ ok: true } | { ok: false; message: string }> {
  const user = await authorizeAction('authenticated');
  const parsed = candidateGridColumnsSchema.safeParse(columns);
  if (!parsed.success) return { ok: false, message: parsed.error.issues[0]?.message ?? 'Not a column choice' };
  const saved = await updateUserPreferences(user.teamId, user.id, { candidateGridColumns: parsed.data });
  return saved ? { ok: true } : { ok: false, message: 'Your account was not found.' };
}

/** The decimal separator switch of the user menu; stored in users.decimal_separator (null = the browser's). */
export async function setDecimalSeparatorAction(choice: unknown): Promise<{ decimalSeparator: '.' | ',' | null }> {
  const user = await authorizeAction('authenticated');
  const parsed = decimalSeparatorSchema.parse(choice);
  await setDecimalSeparator(user, parsed);
  revalidatePath('/', 'layout');
  return { decimalSeparator: parsed === 'browser' ? null : parsed };
}

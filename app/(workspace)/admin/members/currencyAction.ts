'use server';
/** Admin → the team's currency (teams.currency): named with every amount; changing it relabels, it converts nothing. */
import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { setTeamCurrency } from '@/db/queries/members';
import { authorizeAction } from '@/server/auth/actions';
import { CURRENCY_PATTERN } from '@/lib/units/money';

const currencySchema = z
  .string()
  .trim()
  .transform((v) => v.toUpperCase())
  .pipe(z.string().regex(CURRENCY_PATTERN, 'Enter a three-letter ISO 4217 currency code, such as EUR or USD.'));

export async function setTeamCurrencyAction(currency: unknown): Promise<{ currency: string } | { error: string }> {
  const user = await authorizeAction('members:manage');
  const parsed = currencySchema.safeParse(currency);
  if (!parsed.success) return { error: parsed.error.issues[0]?.message ?? 'Not a currency code.' };
  await setTeamCurrency(user, parsed.data);
  revalidatePath('/', 'layout');
  return { currency: parsed.data };
}

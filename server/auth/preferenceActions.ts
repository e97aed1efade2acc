'use server';

import { revalidatePath } from 'next/cache';
import { authorizeAction } from './actions';
import { decimalSeparatorSchema, setDecimalSeparator, setUnitSystem, unitSystemSchema } from './members';

/** The SI / imperial switch of the user menu; stored in users.unit_system. */
export async function setUnitSystemAction(unitSystem: unknown): Promise<{ unitSystem: 'si' | 'imperial' }> {
  const user = await authorizeAction('authenticated');
  const parsed = unitSystemSchema.parse(unitSystem);
  await setUnitSystem(user, parsed);
  revalidatePath('/', 'layout');
  return { unitSystem: parsed };
}

/** The decimal separator switch of the user menu; stored in users.decimal_separator (null = the browser's). */
export async function setDecimalSeparatorAction(choice: unknown): Promise<{ decimalSeparator: '.' | ',' | null }> {
  const user = await authorizeAction('authenticated');
  const parsed = decimalSeparatorSchema.parse(choice);
  await setDecimalSeparator(user, parsed);
  revalidatePath('/', 'layout');
  return { decimalSeparator: parsed === 'browser' ? null : parsed };
}

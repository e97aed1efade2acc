'use server';

import { revalidatePath } from 'next/cache';
import { authorizeAction } from './actions';
import { setUnitSystem, unitSystemSchema } from './members';

/** The SI / imperial switch of the user menu; stored in users.unit_system. */
export async function setUnitSystemAction(unitSystem: unknown): Promise<{ unitSystem: 'si' | 'imperial' }> {
  const user = await authorizeAction('authenticated');
  const parsed = unitSystemSchema.parse(unitSystem);
  await setUnitSystem(user, parsed);
  revalidatePath('/', 'layout');
  return { unitSystem: parsed };
}

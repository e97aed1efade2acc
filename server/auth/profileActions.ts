'use server';

import { revalidatePath } from 'next/cache';
import { setProfessionalProfile } from '@/db/queries/profile';
import { professionalProfileSchema, type ProfessionalProfile } from '@/lib/auth/profile';
import { authorizeAction } from './actions';

/** Saves the signed-in person's own licence or registration and jurisdiction (the profile form). */
export async function saveProfessionalProfileAction(input: unknown): Promise<{ ok: true; profile: ProfessionalProfile } | { ok: false; message: string }> {
  const user = await authorizeAction('authenticated');
  const parsed = professionalProfileSchema.safeParse(input);
  if (!parsed.success) return { ok: false, message: parsed.error.issues.map((i) => `${i.path.join('.') === 'licenceNumber' ? 'Licence or registration number' : 'Jurisdiction'}: ${i.message}`).join('; ') };
  await setProfessionalProfile(user.teamId, user.id, parsed.data);
  revalidatePath('/profile');
  return { ok: true, profile: parsed.data };
}

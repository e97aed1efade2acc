/**
 * The professional part of a person's profile (issue 22): the licence or registration number and
 * the jurisdiction that issued it, printed with a reviewer's approval in the calculation package.
 * Validated here so that the form and the server action read one rule.
 */
import { z } from 'zod';

export const PROFILE_TEXT_MAX = 120;

export const professionalProfileSchema = z.object({
  licenceNumber: z.string().trim().max(PROFILE_TEXT_MAX, `At most ${PROFILE_TEXT_MAX} characters`),
  licenceJurisdiction: z.string().trim().max(PROFILE_TEXT_MAX, `At most ${PROFILE_TEXT_MAX} characters`),
});

export type ProfessionalProfile = z.infer<typeof professionalProfileSchema>;

/** "Licence PE-12345 (State of Example)"; or says plainly that none was entered. */
export function licenceWords(profile: Partial<ProfessionalProfile> | null | undefined): string {
  const number = profile?.licenceNumber?.trim() ?? '';
  const where = profile?.licenceJurisdiction?.trim() ?? '';
  if (!number && !where) return 'no licence or registration entered on the profile';
  return `${number || 'number not entered'}${where ? ` (${where})` : ' (jurisdiction not entered)'}`;
}

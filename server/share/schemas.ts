import { z } from 'zod';
import { SHARE_MAX_DAYS, SHARE_MIN_DAYS } from '@/db/queries/shares';

export const expiresInDaysSchema = z
  .number({ error: 'Expiry must be a number of days' })
  .int('Expiry must be a whole number of days')
  .min(SHARE_MIN_DAYS, `A link lasts at least ${SHARE_MIN_DAYS} day`)
  .max(SHARE_MAX_DAYS, `A link lasts at most ${SHARE_MAX_DAYS} days`);

export const createShareBodySchema = z.object({ expiresInDays: expiresInDaysSchema.default(14) });

export const emailSheetBodySchema = z.object({
  to: z.string().trim().toLowerCase().pipe(z.email({ error: 'Enter one e-mail address, such as colleague@example.com' })).refine((v) => v.length <= 254, 'The address is too long'),
  message: z.string().trim().max(2000, 'The message must be at most 2000 characters').default(''),
  attachPdf: z.boolean().default(false),
  expiresInDays: expiresInDaysSchema.default(14),
});
export type EmailSheetBody = z.infer<typeof emailSheetBodySchema>;

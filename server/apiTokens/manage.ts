/**
 * Creating team API tokens: the token is made here, shown to the admin once, and only its hash
 * is stored. Used by the admin page's server actions and by the tests and load scripts.
 */
import { z } from 'zod';
import { DEFAULT_REQUESTS_PER_MINUTE, MAX_REQUESTS_PER_MINUTE } from '@/lib/api/limits';
import { API_TOKEN_SCOPES, insertApiToken } from '@/db/queries/apiTokens';
import { newApiToken } from './tokens';

export const createTokenInputSchema = z.object({
  name: z.string({ error: 'Name is required' }).trim().min(1, 'Name is required').max(100, 'Name must be at most 100 characters'),
  scopes: z
    .array(z.enum(API_TOKEN_SCOPES, { error: 'Scopes are read and calc' }))
    .min(1, 'Choose at least one scope')
    .transform((scopes) => [...new Set(scopes)]),
  requestsPerMinute: z.coerce
    .number({ error: 'Requests per minute must be a number' })
    .int('Requests per minute must be a whole number')
    .min(1, 'Requests per minute must be at least 1')
    .max(MAX_REQUESTS_PER_MINUTE, `Requests per minute must be at most ${MAX_REQUESTS_PER_MINUTE}`)
    .default(DEFAULT_REQUESTS_PER_MINUTE),
  /** Days until the token stops working; empty = no expiry. */
  expiresInDays: z.coerce.number().int('Days must be a whole number').min(1, 'At least 1 day').max(3650, 'At most 3650 days').nullable().default(null),
});
export type CreateTokenInput = z.input<typeof createTokenInputSchema>;

export interface CreatedToken {
  id: string;
  /** The token itself: shown once, never stored. */
  token: string;
  prefix: string;
}

export async function createTeamApiToken(teamId: string, actorId: string | null, input: CreateTokenInput): Promise<CreatedToken> {
  const parsed = createTokenInputSchema.parse(input);
  const { token, hash, prefix } = newApiToken();
  const expiresAt = parsed.expiresInDays === null ? null : new Date(Date.now() + parsed.expiresInDays * 24 * 60 * 60 * 1000);
  const { id } = await insertApiToken(teamId, actorId, {
    name: parsed.name,
    scopes: parsed.scopes,
    requestsPerMinute: parsed.requestsPerMinute,
    expiresAt,
    tokenHash: hash,
    prefix,
  });
  return { id, token, prefix };
}

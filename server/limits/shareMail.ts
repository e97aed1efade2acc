/**
 * A limit on sending sheets by e-mail: 20 messages per member per hour, so that a member's
 * account (or a script holding their session) cannot turn Ampwarden into a mail cannon. Counted
 * per user id in PostgreSQL with the other limits, so every app instance counts the same sends.
 */
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { getPool } from '@/db/client';

export const SHARE_MAIL_LIMIT = { points: 20, durationS: 60 * 60 } as const;

const holder = globalThis as unknown as { ampwardenShareMailLimiter?: RateLimiterPostgres };

function limiter(): RateLimiterPostgres {
  holder.ampwardenShareMailLimiter ??= new RateLimiterPostgres({
    storeClient: getPool(),
    storeType: 'pool',
    tableName: 'sign_in_limits',
    tableCreated: true,
    keyPrefix: 'share-mail-user',
    points: SHARE_MAIL_LIMIT.points,
    duration: SHARE_MAIL_LIMIT.durationS,
  });
  return holder.ampwardenShareMailLimiter;
}

/** Counts one e-mail about to be sent by this user; the seconds until the next is allowed when over the limit, else null. */
export async function shareMailRetryAfterS(userId: string): Promise<number | null> {
  try {
    await limiter().consume(userId);
    return null;
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) return Math.max(1, Math.ceil(rejection.msBeforeNext / 1000));
    throw rejection;
  }
}

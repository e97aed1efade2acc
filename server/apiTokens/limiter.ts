/**
 * Per-token request limits, kept in PostgreSQL (rate-limiter-flexible's RateLimiterPostgres on the
 * app's pool, table api_token_limits from migration 0004) so that every app instance counts the
 * same requests. Each token has its own rate (requests per minute, chosen by the admin).
 */
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { getPool } from '@/db/client';

const holder = globalThis as unknown as { ampwardenApiTokenLimiters?: Map<number, RateLimiterPostgres> };

function limiterFor(requestsPerMinute: number): RateLimiterPostgres {
  holder.ampwardenApiTokenLimiters ??= new Map();
  let limiter = holder.ampwardenApiTokenLimiters.get(requestsPerMinute);
  if (!limiter) {
    limiter = new RateLimiterPostgres({
      storeClient: getPool(),
      storeType: 'pool',
      tableName: 'api_token_limits',
      tableCreated: true,
      keyPrefix: 'apitoken',
      points: requestsPerMinute,
      duration: 60,
    });
    holder.ampwardenApiTokenLimiters.set(requestsPerMinute, limiter);
  }
  return limiter;
}

export interface TokenRateState {
  allowed: boolean;
  limit: number;
  remaining: number;
  /** Seconds until the window resets. */
  resetS: number;
}

/** Counts one request against the token; says whether it may proceed. Database errors propagate (→ 503). */
export async function consumeTokenRequest(tokenId: string, requestsPerMinute: number): Promise<TokenRateState> {
  const limiter = limiterFor(requestsPerMinute);
  const state = (res: RateLimiterRes, allowed: boolean): TokenRateState => ({
    allowed,
    limit: requestsPerMinute,
    remaining: Math.max(0, res.remainingPoints),
    resetS: Math.max(1, Math.ceil(res.msBeforeNext / 1000)),
  });
  try {
    return state(await limiter.consume(tokenId), true);
  } catch (rejection) {
    // consume() rejects with a RateLimiterRes once the points are used up; anything else is a real error.
    if (rejection instanceof RateLimiterRes) return state(rejection, false);
    throw rejection;
  }
}

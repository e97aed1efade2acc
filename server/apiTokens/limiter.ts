/**
 * Per-token request limits: each token has its own rate (requests per minute, chosen by the
 * admin), counted in PostgreSQL in a fixed one-minute window (table api_token_limits) so that every
 * app instance counts the same requests. The count itself is taken in the same statement that
 * authenticates the token (db/queries/apiTokens.ts authoriseTokenRequest); this module reads it.
 */
import type { TokenWindowCount } from '@/db/queries/apiTokens';

export interface TokenRateState {
  allowed: boolean;
  limit: number;
  remaining: number;
  /** Seconds until the window resets. */
  resetS: number;
}

/** Whether the request just counted may proceed, and the figures for the X-RateLimit headers. */
export function rateState(requestsPerMinute: number, window: TokenWindowCount): TokenRateState {
  return {
    allowed: window.requests <= requestsPerMinute,
    limit: requestsPerMinute,
    remaining: Math.max(0, requestsPerMinute - window.requests),
    resetS: Math.max(1, Math.ceil((window.windowEndsAtMs - window.countedAtMs) / 1000)),
  };
}

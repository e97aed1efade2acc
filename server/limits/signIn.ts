/**
 * Sign-in attempt limits, kept in PostgreSQL (rate-limiter-flexible's RateLimiterPostgres on the
 * app's pool, table sign_in_limits from the migration) so that every app instance counts the same
 * failures. Only failed attempts are counted; a successful sign-in clears the account's count.
 */
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { getPool } from '@/db/client';

/** Per account: 5 failures in 15 minutes lock that e-mail address for 15 minutes. */
export const ACCOUNT_LIMIT = { points: 5, durationS: 15 * 60, blockDurationS: 15 * 60 } as const;
/** Per client address: 30 failures in an hour (many accounts tried from one place) lock it for an hour. */
export const ADDRESS_LIMIT = { points: 30, durationS: 60 * 60, blockDurationS: 60 * 60 } as const;

const holder = globalThis as unknown as { ampwardenSignInLimiters?: { account: RateLimiterPostgres; address: RateLimiterPostgres } };

function limiters() {
  if (!holder.ampwardenSignInLimiters) {
    const common = { storeClient: getPool(), storeType: 'pool', tableName: 'sign_in_limits', tableCreated: true } as const;
    holder.ampwardenSignInLimiters = {
      account: new RateLimiterPostgres({
        ...common,
        keyPrefix: 'signin-account',
        points: ACCOUNT_LIMIT.points,
        duration: ACCOUNT_LIMIT.durationS,
        blockDuration: ACCOUNT_LIMIT.blockDurationS,
      }),
      address: new RateLimiterPostgres({
        ...common,
        keyPrefix: 'signin-address',
        points: ADDRESS_LIMIT.points,
        duration: ADDRESS_LIMIT.durationS,
        blockDuration: ADDRESS_LIMIT.blockDurationS,
      }),
    };
  }
  return holder.ampwardenSignInLimiters;
}

export function accountKey(email: string): string {
  return email.trim().toLowerCase();
}

export interface LimitState {
  limited: boolean;
  /** Seconds until another attempt is allowed (0 when not limited). */
  retryAfterS: number;
}

function stateOf(res: RateLimiterRes | null, points: number): LimitState {
  if (!res || res.consumedPoints < points) return { limited: false, retryAfterS: 0 };
  return { limited: true, retryAfterS: Math.max(1, Math.ceil(res.msBeforeNext / 1000)) };
}

/** Whether this account or address may try now, without counting anything. */
export async function checkSignInAllowed(email: string, clientAddress: string): Promise<LimitState> {
  const { account, address } = limiters();
  const [a, b] = await Promise.all([account.get(accountKey(email)), address.get(clientAddress)]);
  return worst(stateOf(a, ACCOUNT_LIMIT.points), stateOf(b, ADDRESS_LIMIT.points));
}

/** Counts one failed attempt against both keys; says whether the caller is now locked out. */
export async function recordFailedSignIn(email: string, clientAddress: string): Promise<LimitState> {
  const { account, address } = limiters();
  const results = await Promise.all(
    [
      [account, accountKey(email), ACCOUNT_LIMIT.points],
      [address, clientAddress, ADDRESS_LIMIT.points],
    ].map(async ([limiter, key, points]) => {
      try {
        return stateOf(await (limiter as RateLimiterPostgres).consume(key as string), points as number);
      } catch (rejection) {
        // consume() rejects with a RateLimiterRes once the points are used up; anything else is a real error.
        if (rejection instanceof RateLimiterRes) return stateOf(rejection, points as number);
        throw rejection;
      }
    }),
  );
  return worst(results[0], results[1]);
}

export async function clearAccountFailures(email: string): Promise<void> {
  await limiters().account.delete(accountKey(email));
}

function worst(a: LimitState, b: LimitState): LimitState {
  return { limited: a.limited || b.limited, retryAfterS: Math.max(a.retryAfterS, b.retryAfterS) };
}

/** The client address of a request: the socket address unless it is a configured proxy (server/http/clientAddress.ts). */
export { clientAddressFrom } from '@/server/http/clientAddress';

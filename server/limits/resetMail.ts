/**
 * Limits on password-reset mail, so that the public form cannot be used to flood someone's inbox
 * or to send mail in bulk: 3 per address per hour, 20 per client address per hour. Same
 * PostgreSQL store as the sign-in limits.
 */
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { getPool } from '@/db/client';

const holder = globalThis as unknown as { ampwardenResetLimiters?: { email: RateLimiterPostgres; address: RateLimiterPostgres } };

function limiters() {
  holder.ampwardenResetLimiters ??= {
    email: new RateLimiterPostgres({ storeClient: getPool(), storeType: 'pool', tableName: 'sign_in_limits', tableCreated: true, keyPrefix: 'reset-email', points: 3, duration: 3600 }),
    address: new RateLimiterPostgres({ storeClient: getPool(), storeType: 'pool', tableName: 'sign_in_limits', tableCreated: true, keyPrefix: 'reset-address', points: 20, duration: 3600 }),
  };
  return holder.ampwardenResetLimiters;
}

/** Counts one request; false when this e-mail or client address has asked too often. */
export async function allowResetMail(email: string, clientAddress: string): Promise<boolean> {
  try {
    await limiters().address.consume(clientAddress);
    await limiters().email.consume(email.trim().toLowerCase());
    return true;
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) return false;
    throw rejection;
  }
}

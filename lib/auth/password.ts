import bcrypt from 'bcryptjs';
import { z } from 'zod';

/**
 * bcrypt cost 11 (OWASP asks for at least 10): about 0.2 s per hash in bcryptjs on an idle core
 * here, several times that under load, so higher costs make every sign-in slow. The one cost for
 * every hash — members', the demo seed's and the stand-in compared when an account does not
 * exist — so that the time a sign-in takes tells nobody which accounts exist.
 */
export const BCRYPT_COST = 11;

export const passwordSchema = z
  .string()
  .min(12, 'Use at least 12 characters.')
  .max(200, 'Use at most 200 characters.');

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

// Compared against when the account does not exist, so that a wrong e-mail costs as long as a wrong password.
let unusedHash: Promise<string> | undefined;

/** The stand-in hash for accounts that do not exist (same cost as every other). */
export function unusedPasswordHash(): Promise<string> {
  unusedHash ??= bcrypt.hash('no account has this password', BCRYPT_COST);
  return unusedHash;
}

export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const matches = await bcrypt.compare(password, hash ?? (await unusedPasswordHash()));
  return hash !== null && matches;
}

/** True when a stored hash was made with another cost (an older seed, an earlier setting). */
export function needsRehash(hash: string): boolean {
  try {
    return bcrypt.getRounds(hash) !== BCRYPT_COST;
  } catch {
    return false;
  }
}

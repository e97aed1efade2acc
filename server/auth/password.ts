import bcrypt from 'bcryptjs';
import { z } from 'zod';

/** bcrypt cost 12: about a quarter of a second per hash in bcryptjs on these machines. */
const BCRYPT_COST = 12;

export const passwordSchema = z
  .string()
  .min(12, 'Use at least 12 characters.')
  .max(200, 'Use at most 200 characters.');

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

// Compared against when the account does not exist, so that a wrong e-mail costs as long as a wrong password.
let unusedHash: Promise<string> | undefined;

export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  unusedHash ??= bcrypt.hash('no account has this password', BCRYPT_COST);
  const matches = await bcrypt.compare(password, hash ?? (await unusedHash));
  return hash !== null && matches;
}

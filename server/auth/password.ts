import bcrypt from 'bcryptjs';
import { z } from 'zod';

/**
 * bcrypt cost 11 (OWASP asks for at least 10): about 0.2 s per hash in bcryptjs on an idle core
 * here, several times that under load, so higher costs make every sign-in slow.
 */
const BCRYPT_COST = 11;

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

import { createHash, randomBytes } from 'node:crypto';

/**
 * API tokens: `awt_` and 32 random bytes (256 bits) in base64url. The prefix marks them in logs and
 * secret scanners; only the SHA-256 hash is stored, and the first characters as a visible prefix.
 */
export const API_TOKEN_PREFIX = 'awt_';
const TOKEN_PATTERN = /^awt_[A-Za-z0-9_-]{43}$/;
/** Characters kept in clear so that admins can tell tokens apart ("awt_Xy3k…"). */
export const VISIBLE_PREFIX_CHARS = 10;

export function newApiToken(): { token: string; hash: string; prefix: string } {
  const token = `${API_TOKEN_PREFIX}${randomBytes(32).toString('base64url')}`;
  return { token, hash: hashApiToken(token), prefix: token.slice(0, VISIBLE_PREFIX_CHARS) };
}

export function hashApiToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Cheap shape check before any database look-up. */
export function looksLikeApiToken(token: string): boolean {
  return TOKEN_PATTERN.test(token);
}

import { createHash, randomBytes } from 'node:crypto';

/** A link token: 32 random bytes (256 bits), URL-safe. Only its hash is stored. */
export function newLinkToken(): string {
  return randomBytes(32).toString('base64url');
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Cheap shape check before any database look-up. */
export function looksLikeLinkToken(token: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(token);
}

export const INVITATION_LIFETIME_MS = 72 * 60 * 60 * 1000;
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

/**
 * Link tokens of invitations, password resets and share links: 32 random bytes (256 bits),
 * base64url, 43 characters. Only the SHA-256 hash of a token is stored, so a database leak does
 * not leak working links.
 *
 * Pure TypeScript that runs in the browser and on the server (DEVELOPERS.md, layer rule): the
 * randomness is the Web Crypto CSPRNG (`crypto.getRandomValues`, a global in browsers and in
 * Node.js 20), the hash is @noble/hashes' SHA-256 (audited, no dependencies), not node:crypto. The
 * hash is the same hex digest of the UTF-8 text that node:crypto gave before, so stored hashes still
 * match (tests/lib/auth/linkTokens.test.ts checks it against node:crypto).
 */
import { sha256 } from '@noble/hashes/sha2';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils';

const TOKEN_BYTES = 32;
const BASE64URL = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';

/** RFC 4648 §5 base64url without padding. */
function base64url(bytes: Uint8Array): string {
  let out = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const chunk = (bytes[i] << 16) | ((bytes[i + 1] ?? 0) << 8) | (bytes[i + 2] ?? 0);
    const chars = Math.min(4, Math.ceil(((bytes.length - i) * 8) / 6));
    for (let c = 0; c < chars; c++) out += BASE64URL[(chunk >> (18 - 6 * c)) & 63];
  }
  return out;
}

/** A link token: 32 random bytes (256 bits), URL-safe. Only its hash is stored. */
export function newLinkToken(): string {
  const bytes = new Uint8Array(TOKEN_BYTES);
  globalThis.crypto.getRandomValues(bytes);
  return base64url(bytes);
}

/** SHA-256 of the token's UTF-8 text, lower-case hex (what the database stores). */
export function hashLinkToken(token: string): string {
  return bytesToHex(sha256(utf8ToBytes(token)));
}

/** Cheap shape check before any database look-up. */
export function looksLikeLinkToken(token: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(token);
}

/** What a link (invitation, password reset) is worth when someone opens it. */
export type LinkState = 'valid' | 'used' | 'expired' | 'unknown';

export const INVITATION_LIFETIME_MS = 72 * 60 * 60 * 1000;
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

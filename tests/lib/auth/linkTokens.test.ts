// Link tokens (lib/auth/linkTokens.ts): the hash must equal the node:crypto SHA-256 hex digest the
// stored hashes were made with, and a token must be 32 random bytes in base64url.
import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hashLinkToken, looksLikeLinkToken, newLinkToken } from '@/lib/auth/linkTokens';

describe('hashLinkToken: SHA-256 hex of the UTF-8 text', () => {
  // FIPS 180-4 / FIPS 180-2 Appendix B examples (one-block "abc", two-block 448-bit message), and
  // the digest of the empty message (all three also agree with node:crypto on this machine).
  it.each([
    ['abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    ['abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq', '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1'],
    ['', 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'],
  ])('FIPS 180 example %j', (message, digest) => {
    expect(hashLinkToken(message)).toBe(digest);
  });

  it('equals node:crypto (OpenSSL) on 500 random texts, Unicode included — stored hashes still match', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 200 }), (text) => {
        expect(hashLinkToken(text)).toBe(createHash('sha256').update(text, 'utf8').digest('hex'));
      }),
      { numRuns: 500 },
    );
  });
});

describe('newLinkToken', () => {
  it('is 32 bytes in base64url (43 characters, RFC 4648 §5): Node decodes it back to 32 bytes and re-encodes it unchanged', () => {
    for (let i = 0; i < 200; i++) {
      const token = newLinkToken();
      expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(looksLikeLinkToken(token)).toBe(true);
      const bytes = Buffer.from(token, 'base64url');
      expect(bytes.length).toBe(32);
      expect(bytes.toString('base64url')).toBe(token);
    }
  });

  it('never repeats in 2000 draws and uses every base64url character (a stuck or biased source fails)', () => {
    const tokens = new Set(Array.from({ length: 2000 }, () => newLinkToken()));
    expect(tokens.size).toBe(2000);
    const seen = new Set([...tokens].join(''));
    expect(seen.size).toBe(64);
  });

  it('looksLikeLinkToken refuses other shapes', () => {
    for (const bad of ['', 'a'.repeat(42), 'a'.repeat(44), `${'a'.repeat(42)}=`, `${'a'.repeat(42)}+`, `${'a'.repeat(42)}/`]) expect(looksLikeLinkToken(bad)).toBe(false);
  });
});

// Share links against the real PostgreSQL server: the token is 256 random bits stored only as its
// SHA-256 hash; a valid link opens exactly its own sheet; revoked and expired links are refused and
// say so; a link of team A's sheet shows nothing of team B and team B's members cannot list, make or
// revoke links of team A's sheets; random guesses never open anything. Rules: issue 8, product.md.
import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { sheetShares } from '@/db/schema';
import { createMailedShare, createShare, listShares, openShare, revokeShare } from '@/db/queries/shares';
import { sheetHistory } from '@/db/queries/sheets';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { makeSharedSheet } from './shareFixtures';

afterAll(() => closeDb());

let teamA: { id: string };
let teamB: { id: string };
let designerA: { id: string; role: 'designer' };
let adminB: { id: string; role: 'admin' };
let sheetA: Awaited<ReturnType<typeof makeSharedSheet>>;
let sheetB: Awaited<ReturnType<typeof makeSharedSheet>>;

beforeAll(async () => {
  teamA = await createTestTeam('share-a');
  teamB = await createTestTeam('share-b');
  designerA = (await createTestUser(teamA.id, 'designer')) as typeof designerA;
  adminB = (await createTestUser(teamB.id, 'admin')) as typeof adminB;
  sheetA = await makeSharedSheet(teamA.id, designerA, 'Alpha');
  sheetB = await makeSharedSheet(teamB.id, adminB, 'Bravo');
});

describe('the token', () => {
  it('is 32 random bytes in base64url (256 bits, over the 128 asked for) and only its SHA-256 hash is stored', async () => {
    const share = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 7 }))!;
    expect(share.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(share.token, 'base64url')).toHaveLength(32);
    const [row] = await getDb().select().from(sheetShares).where(eq(sheetShares.id, share.id));
    expect(row.tokenHash).toBe(createHash('sha256').update(share.token, 'utf8').digest('hex'));
    expect(JSON.stringify(row)).not.toContain(share.token);
    // Seven days from now, to the minute.
    expect(Math.abs(row.expiresAt.getTime() - (Date.now() + 7 * 86_400_000))).toBeLessThan(60_000);
  });

  it('differs every time (no two of 50 links share a token)', async () => {
    const tokens = new Set<string>();
    for (let i = 0; i < 50; i += 1) tokens.add((await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 1, audit: false }))!.token);
    expect(tokens.size).toBe(50);
  });
});

describe('opening a link', () => {
  it('a valid link opens its own sheet, read from the saved snapshot, and stamps when it was opened', async () => {
    const share = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 1 }))!;
    const opened = await openShare(share.token);
    expect(opened.state).toBe('open');
    if (opened.state !== 'open') return;
    expect(opened.sheet.id).toBe(sheetA.sheetId);
    expect(opened.sheet.teamId).toBe(teamA.id);
    expect(opened.sheet.circuitTag).toBe(sheetA.circuitTag);
    expect(opened.sheet.result?.chosenCandidateId).toBe('cu-xlpe-240');
    const listed = (await listShares(teamA.id, sheetA.sheetId))!.find((s) => s.id === share.id)!;
    expect(listed.state).toBe('active');
    expect(listed.lastOpenedAt).not.toBeNull();
  });

  it('a revoked link is refused and says so; revoking twice keeps the first moment', async () => {
    const share = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 30 }))!;
    const first = (await revokeShare(teamA.id, designerA.id, sheetA.sheetId, share.id))!;
    const opened = await openShare(share.token);
    expect(opened.state).toBe('revoked');
    const second = (await revokeShare(teamA.id, designerA.id, sheetA.sheetId, share.id))!;
    expect(second.revokedAt.getTime()).toBe(first.revokedAt.getTime());
    expect((await listShares(teamA.id, sheetA.sheetId))!.find((s) => s.id === share.id)!.state).toBe('revoked');
    const history = await sheetHistory(teamA.id, sheetA.sheetId);
    expect(history.filter((h) => h.action === 'sheet.share.revoke' && h.detail.shareId === share.id)).toHaveLength(1);
  });

  it('an expired link is refused and says so, the moment its time is up', async () => {
    const made = new Date(Date.now() - 3 * 86_400_000);
    const share = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 2, now: made }))!;
    expect((await openShare(share.token)).state).toBe('expired');
    const fresh = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 1 }))!;
    expect((await openShare(fresh.token, { now: new Date(fresh.expiresAt.getTime() - 1000), touch: false })).state).toBe('open');
    expect((await openShare(fresh.token, { now: fresh.expiresAt, touch: false })).state).toBe('expired');
  });

  it('a sheet that is deleted takes its links with it: the token answers "invalid" like any wrong one', async () => {
    const doomed = await makeSharedSheet(teamA.id, designerA, 'Doomed');
    const share = (await createShare(teamA.id, designerA.id, doomed.sheetId, { expiresInDays: 1 }))!;
    const { sheets } = await import('@/db/schema');
    await getDb().delete(sheets).where(eq(sheets.id, doomed.sheetId));
    expect(await openShare(share.token)).toEqual({ state: 'invalid' });
  });
});

describe('team isolation', () => {
  it('a link of team A’s sheet opens that sheet only: nothing of team B is in what it returns', async () => {
    const share = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 1 }))!;
    const opened = await openShare(share.token);
    const text = JSON.stringify(opened);
    for (const secret of [teamB.id, sheetB.sheetId, sheetB.projectId, sheetB.circuitTag, sheetB.title, sheetB.projectName, adminB.id]) expect(text).not.toContain(secret);
  });

  it('team B cannot list, make or revoke links of team A’s sheet: each answers “no such sheet/link” (null), like a sheet that never existed', async () => {
    const share = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 1 }))!;
    const missing = '00000000-0000-4000-8000-000000000000';
    expect(await listShares(teamB.id, sheetA.sheetId)).toBeNull();
    expect(await listShares(teamB.id, missing)).toBeNull();
    expect(await createShare(teamB.id, adminB.id, sheetA.sheetId, { expiresInDays: 1 })).toBeNull();
    expect(await revokeShare(teamB.id, adminB.id, sheetA.sheetId, share.id)).toBeNull();
    expect(await revokeShare(teamB.id, adminB.id, sheetB.sheetId, share.id)).toBeNull();
    expect(await revokeShare(teamA.id, designerA.id, sheetA.sheetId, missing)).toBeNull();
    expect((await openShare(share.token)).state).toBe('open');
    // Team B's own list never shows team A's links.
    const bShares = (await listShares(teamB.id, sheetB.sheetId))!;
    expect(bShares.some((s) => s.id === share.id)).toBe(false);
  });
});

describe('guessing', () => {
  it('1,000 random well-formed tokens and a set of near misses open nothing, all with the one same answer', async () => {
    const real = (await createShare(teamA.id, designerA.id, sheetA.sheetId, { expiresInDays: 1 }))!;
    const [row] = await getDb().select({ tokenHash: sheetShares.tokenHash }).from(sheetShares).where(eq(sheetShares.id, real.id));
    const flip = (c: string) => (c === 'A' ? 'B' : 'A');
    const nearMisses = [
      real.token.slice(0, -1) + flip(real.token.at(-1)!),
      flip(real.token[0]) + real.token.slice(1),
      real.token.toUpperCase() === real.token ? real.token.toLowerCase() : real.token.toUpperCase(),
      real.token.slice(0, 42),
      `${real.token}A`,
      row.tokenHash, // the stored hash is not a key
      real.id,
      '',
      ' '.repeat(43),
      "'; drop table sheet_shares; --",
      '../'.repeat(15),
    ].filter((t) => t !== real.token);
    const random = Array.from({ length: 1000 }, () => randomBytes(32).toString('base64url'));
    const answers = [];
    for (const token of [...nearMisses, ...random]) answers.push(await openShare(token, { touch: false }));
    expect(answers.every((a) => a.state === 'invalid')).toBe(true);
    expect(new Set(answers.map((a) => JSON.stringify(a)))).toEqual(new Set([JSON.stringify({ state: 'invalid' })]));
    expect((await openShare(real.token)).state).toBe('open');
  });
});

describe('the record of a mailed link', () => {
  it('the recipient and the message are in the sheet’s history with the link they received', async () => {
    const sent = (await createMailedShare(teamA.id, designerA.id, sheetA.sheetId, { to: 'colleague@test.example', message: 'Please check the ambient.', pdfAttached: true, expiresInDays: 7 }))!;
    const entry = (await sheetHistory(teamA.id, sheetA.sheetId)).find((h) => h.action === 'sheet.email' && h.detail.shareId === sent.id)!;
    expect(entry.detail).toMatchObject({ to: 'colleague@test.example', message: 'Please check the ambient.', pdfAttached: true });
    expect(JSON.stringify(entry.detail)).not.toContain(sent.token);
    expect((await openShare(sent.token)).state).toBe('open');
    expect(await createMailedShare(teamB.id, adminB.id, sheetA.sheetId, { to: 'x@test.example', message: '', pdfAttached: false, expiresInDays: 1 })).toBeNull();
  });
});

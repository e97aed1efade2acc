/**
 * Share links of sizing sheets: create (the token is returned once and stored only as its SHA-256
 * hash), list, revoke, open by token, and the record of a sheet sent by e-mail. Team functions take
 * the team id first; `openShare` is the one door without a team: it finds the link by the hash of
 * the token alone and then reads exactly that link's sheet of that link's team.
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { sheetShares, users } from '../schema';
import { recordAudit } from './audit';
import { getSheet, isUuid, type SheetRecord } from './sheets';
import { hashLinkToken, looksLikeLinkToken, newLinkToken } from '../../lib/auth/linkTokens';

export const SHARE_MIN_DAYS = 1;
export const SHARE_MAX_DAYS = 90;
const DAY_MS = 24 * 60 * 60 * 1000;

export interface ShareListItem {
  id: string;
  sheetId: string;
  createdAt: Date;
  createdByName: string | null;
  expiresAt: Date;
  revokedAt: Date | null;
  lastOpenedAt: Date | null;
  state: 'active' | 'expired' | 'revoked';
}

export function shareState(row: { expiresAt: Date; revokedAt: Date | null }, now = new Date()): ShareListItem['state'] {
  if (row.revokedAt) return 'revoked';
  return row.expiresAt.getTime() <= now.getTime() ? 'expired' : 'active';
}

async function sheetExists(teamId: string, sheetId: string, tx: Executor): Promise<boolean> {
  return (await getSheet(teamId, sheetId, tx)) !== null;
}

export interface CreatedShare {
  id: string;
  /** The only time the token exists outside the link: it is not stored. */
  token: string;
  expiresAt: Date;
}

/**
 * Creates a link valid for `expiresInDays` (1–90). Returns null when the sheet is not the team's.
 * `audit: false` lets the e-mail record the link under its own history entry instead.
 */
export async function createShare(
  teamId: string,
  actorId: string,
  sheetId: string,
  options: { expiresInDays: number; now?: Date; audit?: boolean },
  tx?: Executor,
): Promise<CreatedShare | null> {
  const run = async (db: Executor) => {
    if (!(await sheetExists(teamId, sheetId, db))) return null;
    const days = Math.min(SHARE_MAX_DAYS, Math.max(SHARE_MIN_DAYS, options.expiresInDays));
    const now = options.now ?? new Date();
    const expiresAt = new Date(now.getTime() + days * DAY_MS);
    const token = newLinkToken();
    const [row] = await db
      .insert(sheetShares)
      .values({ teamId, sheetId, tokenHash: hashLinkToken(token), createdBy: actorId, createdAt: now, expiresAt })
      .returning({ id: sheetShares.id });
    if (options.audit !== false) {
      await recordAudit(db, {
        teamId,
        actorId,
        action: 'sheet.share.create',
        entity: 'sheet',
        entityId: sheetId,
        detail: { shareId: row.id, expiresAt: expiresAt.toISOString(), days },
      });
    }
    return { id: row.id, token, expiresAt };
  };
  return tx ? run(tx) : getDb().transaction(run);
}

export async function listShares(teamId: string, sheetId: string, now = new Date()): Promise<ShareListItem[] | null> {
  const db = getDb();
  if (!(await sheetExists(teamId, sheetId, db))) return null;
  const rows = await db
    .select({
      id: sheetShares.id,
      sheetId: sheetShares.sheetId,
      createdAt: sheetShares.createdAt,
      createdByName: users.name,
      expiresAt: sheetShares.expiresAt,
      revokedAt: sheetShares.revokedAt,
      lastOpenedAt: sheetShares.lastOpenedAt,
    })
    .from(sheetShares)
    .leftJoin(users, eq(users.id, sheetShares.createdBy))
    .where(and(eq(sheetShares.teamId, teamId), eq(sheetShares.sheetId, sheetId)))
    .orderBy(desc(sheetShares.createdAt));
  return rows.map((row) => ({ ...row, state: shareState(row, now) }));
}

/** Revokes one link of the team's sheet. Null when there is no such link (or it is another team's). */
export async function revokeShare(teamId: string, actorId: string, sheetId: string, shareId: string): Promise<{ id: string; revokedAt: Date } | null> {
  if (!isUuid(shareId) || !isUuid(sheetId)) return null;
  return getDb().transaction(async (tx) => {
    const [current] = await tx
      .select({ id: sheetShares.id, revokedAt: sheetShares.revokedAt })
      .from(sheetShares)
      .where(and(eq(sheetShares.teamId, teamId), eq(sheetShares.sheetId, sheetId), eq(sheetShares.id, shareId)))
      .for('update');
    if (!current) return null;
    // Revoking twice keeps the first moment: the link stopped working then.
    if (current.revokedAt) return { id: current.id, revokedAt: current.revokedAt };
    const revokedAt = new Date();
    await tx.update(sheetShares).set({ revokedAt, revokedBy: actorId }).where(eq(sheetShares.id, shareId));
    await recordAudit(tx, { teamId, actorId, action: 'sheet.share.revoke', entity: 'sheet', entityId: sheetId, detail: { shareId } });
    return { id: shareId, revokedAt };
  });
}

export type OpenedShare =
  | { state: 'invalid' }
  | { state: 'revoked'; revokedAt: Date }
  | { state: 'expired'; expiresAt: Date }
  | { state: 'open'; shareId: string; expiresAt: Date; sheet: SheetRecord };

/**
 * What a link holder may see. A malformed token, a token nobody issued and a token whose sheet is
 * gone all answer `invalid` — the same answer, so that a guess learns nothing. Revoked and expired
 * links say so (the holder had a real link and deserves to know why it stopped).
 */
export async function openShare(token: string, options: { now?: Date; touch?: boolean } = {}): Promise<OpenedShare> {
  if (typeof token !== 'string' || !looksLikeLinkToken(token)) return { state: 'invalid' };
  const now = options.now ?? new Date();
  const db = getDb();
  const [share] = await db
    .select({ id: sheetShares.id, teamId: sheetShares.teamId, sheetId: sheetShares.sheetId, expiresAt: sheetShares.expiresAt, revokedAt: sheetShares.revokedAt })
    .from(sheetShares)
    .where(eq(sheetShares.tokenHash, hashLinkToken(token)));
  if (!share) return { state: 'invalid' };
  if (share.revokedAt) return { state: 'revoked', revokedAt: share.revokedAt };
  if (share.expiresAt.getTime() <= now.getTime()) return { state: 'expired', expiresAt: share.expiresAt };
  const sheet = await getSheet(share.teamId, share.sheetId, db);
  if (!sheet) return { state: 'invalid' };
  if (options.touch !== false) {
    // At most one write a minute per link: opening a page should not turn into a write storm.
    await db
      .update(sheetShares)
      .set({ lastOpenedAt: now })
      .where(and(eq(sheetShares.id, share.id), sql`(${sheetShares.lastOpenedAt} is null or ${sheetShares.lastOpenedAt} < ${new Date(now.getTime() - 60_000)})`));
  }
  return { state: 'open', shareId: share.id, expiresAt: share.expiresAt, sheet };
}

/**
 * Creates the link the e-mail carries and records the message and its recipient in the sheet's
 * history, in one transaction. The mail is sent after the commit; `markMailFailed` records a
 * failure to send so the history never claims a message that did not leave.
 */
export async function createMailedShare(
  teamId: string,
  actorId: string,
  sheetId: string,
  input: { to: string; message: string; pdfAttached: boolean; expiresInDays: number },
): Promise<CreatedShare | null> {
  return getDb().transaction(async (tx) => {
    const share = await createShare(teamId, actorId, sheetId, { expiresInDays: input.expiresInDays, audit: false }, tx);
    if (!share) return null;
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'sheet.email',
      entity: 'sheet',
      entityId: sheetId,
      detail: { to: input.to, message: input.message, pdfAttached: input.pdfAttached, shareId: share.id, expiresAt: share.expiresAt.toISOString() },
    });
    return share;
  });
}

/** The mail did not leave: the link it carried is revoked and the history says so. */
export async function markMailFailed(teamId: string, actorId: string, sheetId: string, shareId: string, to: string, reason: string): Promise<void> {
  await getDb().transaction(async (tx) => {
    await tx
      .update(sheetShares)
      .set({ revokedAt: new Date(), revokedBy: actorId })
      .where(and(eq(sheetShares.teamId, teamId), eq(sheetShares.id, shareId)));
    await recordAudit(tx, { teamId, actorId, action: 'sheet.email.failed', entity: 'sheet', entityId: sheetId, detail: { to, shareId, reason } });
  });
}

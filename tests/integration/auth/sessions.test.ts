// Sign-out ends the session (issue 19, item 1), checked against the real database: a session id
// listed as revoked opens nothing, other sessions of the same member go on; a session from before
// session ids ends every session of its epoch; a session lasts eight hours from sign-in at most.
// (The replay of a real cookie over HTTP: tests/e2e/hardening.test.ts.)
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { auditLog, revokedSessions, users } from '@/db/schema';
import { endSession } from '@/db/queries/members';
import { SESSION_MAX_AGE_S } from '@/server/auth/cookies';
import { resolveSessionUser, sessionEndsAt, type SessionClaims } from '@/server/auth/session';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';

afterAll(() => closeDb());

let teamId: string;
beforeAll(async () => {
  teamId = (await createTestTeam('sessions')).id;
});

const now = () => Math.floor(Date.now() / 1000);

describe('signing out', () => {
  it('revokes that session only: the same claims open nothing afterwards, another session of the member still works', async () => {
    const member = await createTestUser(teamId, 'designer');
    const mine: SessionClaims = { sub: member.id, teamId, role: 'designer', epoch: member.sessionEpoch, sid: randomUUID(), authAt: now() };
    const other: SessionClaims = { ...mine, sid: randomUUID() };
    expect((await resolveSessionUser(mine))?.id).toBe(member.id);
    await endSession({ userId: member.id, epoch: mine.epoch, sessionId: mine.sid, expiresAt: sessionEndsAt(mine) });
    expect(await resolveSessionUser(mine)).toBeNull();
    expect((await resolveSessionUser(other))?.id).toBe(member.id);
    const [row] = await getDb().select().from(revokedSessions).where(eq(revokedSessions.sessionId, mine.sid!));
    expect(row.expiresAt.getTime()).toBe((mine.authAt! + SESSION_MAX_AGE_S) * 1000);
    const audit = await getDb().select().from(auditLog).where(and(eq(auditLog.entityId, member.id), eq(auditLog.action, 'session.sign_out')));
    expect(audit).toHaveLength(1);
  });

  it('a session without an id (issued before ids) ends every session of its epoch', async () => {
    const member = await createTestUser(teamId, 'viewer');
    const legacy: SessionClaims = { sub: member.id, teamId, role: 'viewer', epoch: member.sessionEpoch };
    expect(await resolveSessionUser(legacy)).not.toBeNull();
    await endSession({ userId: member.id, epoch: legacy.epoch, expiresAt: sessionEndsAt(legacy) });
    expect(await resolveSessionUser(legacy)).toBeNull();
    const [after] = await getDb().select({ epoch: users.sessionEpoch }).from(users).where(eq(users.id, member.id));
    expect(after.epoch).toBe(member.sessionEpoch + 1);
  });

  it(`a session ends ${SESSION_MAX_AGE_S / 3600} h after sign-in however often its cookie is refreshed`, async () => {
    const member = await createTestUser(teamId, 'designer');
    const old: SessionClaims = { sub: member.id, teamId, role: 'designer', epoch: member.sessionEpoch, sid: randomUUID(), authAt: now() - SESSION_MAX_AGE_S - 1 };
    expect(await resolveSessionUser(old)).toBeNull();
    expect(await resolveSessionUser({ ...old, authAt: now() - SESSION_MAX_AGE_S + 60 })).not.toBeNull();
  });
});

// Sign-in attempts are limited per account and per client address, in PostgreSQL (issue 6).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, like } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { signInLimits, users } from '@/db/schema';
import { verifySignIn } from '@/server/auth/credentials';
import { ACCOUNT_LIMIT, ADDRESS_LIMIT, clientAddressFrom, recordFailedSignIn } from '@/server/limits/signIn';
import { PEER_ADDRESS_HEADER, trustedProxies } from '@/server/http/clientAddress';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../../helpers/fixtures';

let teamId: string;
const address = () => `198.51.100.${Math.floor(Math.random() * 250) + 1}-${randomUUID().slice(0, 6)}`;

beforeAll(async () => {
  teamId = (await createTestTeam('limits')).id;
});
afterAll(() => closeDb());

describe('sign-in limits', () => {
  it(`locks an account after ${ACCOUNT_LIMIT.points} wrong passwords, even for the right one, and says for how long`, async () => {
    const user = await createTestUser(teamId, 'designer');
    const from = address();
    const outcomes = [];
    for (let i = 0; i < ACCOUNT_LIMIT.points; i += 1) outcomes.push(await verifySignIn({ email: user.email, password: 'wrong password' }, from));
    expect(outcomes.slice(0, -1).every((o) => !o.ok && o.reason === 'invalid')).toBe(true);
    expect(outcomes.at(-1)).toMatchObject({ ok: false, reason: 'limited' });

    const withRightPassword = await verifySignIn({ email: user.email, password: TEST_PASSWORD }, address());
    expect(withRightPassword.ok).toBe(false);
    if (!withRightPassword.ok && withRightPassword.reason === 'limited') {
      expect(withRightPassword.retryAfterS).toBeGreaterThan(ACCOUNT_LIMIT.blockDurationS - 60);
      expect(withRightPassword.retryAfterS).toBeLessThanOrEqual(ACCOUNT_LIMIT.blockDurationS);
    } else {
      throw new Error(`expected the account to be locked, got ${JSON.stringify(withRightPassword)}`);
    }
    // The count lives in PostgreSQL, where every app instance sees it.
    const rows = await getDb().select().from(signInLimits).where(like(signInLimits.key, `%${user.email}`));
    expect(rows).toHaveLength(1);
    expect(rows[0].points).toBeGreaterThanOrEqual(ACCOUNT_LIMIT.points);
  });

  it('counts e-mail addresses without regard to case or spaces', async () => {
    const user = await createTestUser(teamId, 'viewer');
    const from = address();
    for (let i = 0; i < ACCOUNT_LIMIT.points; i += 1) {
      await verifySignIn({ email: i % 2 ? ` ${user.email.toUpperCase()} ` : user.email, password: 'wrong password' }, from);
    }
    expect(await verifySignIn({ email: user.email, password: TEST_PASSWORD }, address())).toMatchObject({ ok: false, reason: 'limited' });
  });

  it('forgets earlier failures after a successful sign-in', async () => {
    const user = await createTestUser(teamId, 'viewer');
    const from = address();
    for (let i = 0; i < ACCOUNT_LIMIT.points - 1; i += 1) await verifySignIn({ email: user.email, password: 'wrong' }, from);
    expect((await verifySignIn({ email: user.email, password: TEST_PASSWORD }, from)).ok).toBe(true);
    for (let i = 0; i < ACCOUNT_LIMIT.points - 1; i += 1) await verifySignIn({ email: user.email, password: 'wrong' }, from);
    expect((await verifySignIn({ email: user.email, password: TEST_PASSWORD }, from)).ok).toBe(true);
  });

  it(`locks a client address after ${ADDRESS_LIMIT.points} failures spread over many accounts, and only that address`, async () => {
    const from = address();
    // The first failures are counted straight into the store (each real attempt costs a bcrypt comparison);
    // the last one goes through the whole sign-in check.
    for (let i = 0; i < ADDRESS_LIMIT.points - 1; i += 1) await recordFailedSignIn(`nobody-${randomUUID().slice(0, 8)}@test.example`, from);
    const last = await verifySignIn({ email: `nobody-${randomUUID().slice(0, 8)}@test.example`, password: 'guess' }, from);
    expect(last).toMatchObject({ ok: false, reason: 'limited' });
    const user = await createTestUser(teamId, 'reviewer');
    expect(await verifySignIn({ email: user.email, password: TEST_PASSWORD }, from)).toMatchObject({ ok: false, reason: 'limited' });
    expect((await verifySignIn({ email: user.email, password: TEST_PASSWORD }, address())).ok).toBe(true);
  });

  it('refuses a deactivated member with the right password, in the same words as a wrong password', async () => {
    const user = await createTestUser(teamId, 'designer');
    await getDb().update(users).set({ active: false }).where(eq(users.id, user.id));
    expect(await verifySignIn({ email: user.email, password: TEST_PASSWORD }, address())).toEqual({ ok: false, reason: 'invalid' });
  });

  // Issue 19 item 2 replaced the earlier rule (the last X-Forwarded-For entry, which a client can
  // write itself): the socket address counts unless the socket is a configured proxy.
  it('takes the socket address; forwarded headers only from a configured proxy', () => {
    expect(clientAddressFrom(new Headers({ [PEER_ADDRESS_HEADER]: '127.0.0.1', 'x-forwarded-for': '203.0.113.9' }), trustedProxies(''))).toBe('127.0.0.1');
    expect(clientAddressFrom({ [PEER_ADDRESS_HEADER]: '127.0.0.1', 'x-forwarded-for': '203.0.113.9' }, trustedProxies('127.0.0.1'))).toBe('203.0.113.9');
    expect(clientAddressFrom({ [PEER_ADDRESS_HEADER]: '192.0.2.8', 'x-real-ip': '192.0.2.4' }, trustedProxies(''))).toBe('192.0.2.8');
  });
});

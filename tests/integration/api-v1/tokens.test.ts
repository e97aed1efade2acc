// Issue 11: team API tokens on /api/v1 — hashed storage, scopes, revocation, team isolation, rate limits.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { apiTokens, auditLog } from '@/db/schema';
import { listApiTokens, revokeApiToken } from '@/db/queries/apiTokens';
import { createTeamApiToken } from '@/server/apiTokens/manage';
import { hashApiToken } from '@/server/apiTokens/tokens';
import { EXAMPLE_EVALUATE_REQUEST, evaluateResponseSchema, flagsResponseSchema } from '@/lib/api';
import { FLAG_CODES } from '@/lib/electrical';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { ENDPOINTS, getRequest, jsonRequest, readError } from './helpers';

let teamId: string;
let otherTeamId: string;
let adminId: string;
let calcToken: string;
let readToken: string;
let otherTeamToken: string;

beforeAll(async () => {
  const team = await createTestTeam('api-tokens');
  const other = await createTestTeam('api-tokens-other');
  teamId = team.id;
  otherTeamId = other.id;
  adminId = (await createTestUser(teamId, 'admin')).id;
  calcToken = (await createTeamApiToken(teamId, adminId, { name: 'CAD bridge', scopes: ['read', 'calc'] })).token;
  readToken = (await createTeamApiToken(teamId, adminId, { name: 'Read only', scopes: ['read'] })).token;
  otherTeamToken = (await createTeamApiToken(otherTeamId, null, { name: 'Their script', scopes: ['calc'] })).token;
});
afterAll(() => closeDb());

describe('API token storage', () => {
  it('stores only the SHA-256 hash and a short prefix, never the token, and audits the creation', async () => {
    const created = await createTeamApiToken(teamId, adminId, { name: 'Stored check', scopes: ['calc'], requestsPerMinute: 30 });
    expect(created.token).toMatch(/^awt_[A-Za-z0-9_-]{43}$/);
    const [row] = await getDb().select().from(apiTokens).where(eq(apiTokens.id, created.id));
    expect(row.tokenHash).toBe(hashApiToken(created.token));
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(created.token.startsWith(row.prefix)).toBe(true);
    expect(row.prefix.length).toBeLessThan(12);
    // The token text appears nowhere in the row.
    expect(JSON.stringify(row)).not.toContain(created.token.slice(4));
    const audit = await getDb().select().from(auditLog).where(eq(auditLog.entityId, created.id));
    expect(audit.map((entry) => entry.action)).toEqual(['apitoken.create']);
    expect(JSON.stringify(audit)).not.toContain(created.token.slice(4));
  });

  it('refuses a token with no scope or a bad rate, naming the field', async () => {
    await expect(createTeamApiToken(teamId, adminId, { name: 'x', scopes: [] })).rejects.toThrow(/at least one scope/);
    await expect(createTeamApiToken(teamId, adminId, { name: 'x', scopes: ['calc'], requestsPerMinute: 0 })).rejects.toThrow(/at least 1/);
  });

  it("lists a team's tokens without their hashes, and another team's token cannot be revoked from here", async () => {
    const list = await listApiTokens(teamId);
    expect(list.length).toBeGreaterThanOrEqual(2);
    expect(JSON.stringify(list)).not.toMatch(/[0-9a-f]{64}/);
    const theirs = await listApiTokens(otherTeamId);
    expect(await revokeApiToken(teamId, adminId, theirs[0].id)).toBe(false);
    expect((await listApiTokens(otherTeamId))[0].revokedAt).toBeNull();
    expect(await revokeApiToken(teamId, adminId, 'not-a-uuid')).toBe(false);
  });
});

describe('bearer authentication on /api/v1', () => {
  it('no token → 401 with a WWW-Authenticate challenge; a malformed or unknown one → 401', async () => {
    const none = await ENDPOINTS.evaluate(jsonRequest('evaluate', null, EXAMPLE_EVALUATE_REQUEST));
    expect(none.status).toBe(401);
    expect(none.headers.get('www-authenticate')).toMatch(/^Bearer/);
    expect((await readError(none)).error.code).toBe('unauthenticated');
    for (const header of ['Basic abc', 'Bearer', 'Bearer awt_short', `Bearer awt_${'A'.repeat(43)}`]) {
      const req = new Request('http://127.0.0.1/api/v1/evaluate', { method: 'POST', headers: { authorization: header, 'content-type': 'application/json' }, body: '{}' });
      const answer = await ENDPOINTS.evaluate(req);
      expect(answer.status, header).toBe(401);
      await readError(answer);
    }
  });

  it('a calc token evaluates; the answer matches the documented schema and carries the caution and flags', async () => {
    const response = await ENDPOINTS.evaluate(jsonRequest('evaluate', calcToken, EXAMPLE_EVALUATE_REQUEST));
    expect(response.status).toBe(200);
    expect(Number(response.headers.get('x-ratelimit-limit'))).toBeGreaterThan(0);
    const body = evaluateResponseSchema.parse(await response.json());
    expect(body.evaluations).toHaveLength(2);
    expect(body.caution).toMatch(/licensed engineer/);
    for (const evaluation of body.evaluations) {
      expect(evaluation.ok).toBe(true);
      if (evaluation.ok) expect(evaluation.flags.length).toBeGreaterThan(0);
    }
  });

  it('a read-only token is refused on calculations (403) but reads the flag list', async () => {
    const refused = await ENDPOINTS.evaluate(jsonRequest('evaluate', readToken, EXAMPLE_EVALUATE_REQUEST));
    expect(refused.status).toBe(403);
    expect((await readError(refused)).error.message).toMatch(/calc scope/);
    const flags = await ENDPOINTS.flags(getRequest('flags', readToken));
    expect(flags.status).toBe(200);
    const body = flagsResponseSchema.parse(await flags.json());
    expect(body.flags.map((flag) => flag.code)).toEqual([...FLAG_CODES]);
  });

  it("a calc-only token is refused on the read endpoint (403); another team's token works for its own team", async () => {
    const refused = await ENDPOINTS.flags(getRequest('flags', otherTeamToken));
    expect(refused.status).toBe(403);
    const theirs = await ENDPOINTS.evaluate(jsonRequest('evaluate', otherTeamToken, EXAMPLE_EVALUATE_REQUEST));
    expect(theirs.status).toBe(200);
  });

  it('a revoked token stops working at once (401 token_revoked), and last use was stamped while it worked', async () => {
    const created = await createTeamApiToken(teamId, adminId, { name: 'Soon revoked', scopes: ['calc'] });
    expect((await ENDPOINTS.evaluate(jsonRequest('evaluate', created.token, EXAMPLE_EVALUATE_REQUEST))).status).toBe(200);
    const [used] = await getDb().select().from(apiTokens).where(eq(apiTokens.id, created.id));
    expect(used.lastUsedAt).not.toBeNull();
    expect(await revokeApiToken(teamId, adminId, created.id)).toBe(true);
    const after = await ENDPOINTS.evaluate(jsonRequest('evaluate', created.token, EXAMPLE_EVALUATE_REQUEST));
    expect(after.status).toBe(401);
    expect((await readError(after)).error.code).toBe('token_revoked');
    const audit = await getDb().select().from(auditLog).where(eq(auditLog.entityId, created.id));
    expect(audit.map((entry) => entry.action).sort()).toEqual(['apitoken.create', 'apitoken.revoke']);
  });

  it('an expired token answers 401 token_expired', async () => {
    const created = await createTeamApiToken(teamId, adminId, { name: 'Expired', scopes: ['calc'], expiresInDays: 1 });
    await getDb().update(apiTokens).set({ expiresAt: sql`now() - interval '1 second'` }).where(eq(apiTokens.id, created.id));
    const answer = await ENDPOINTS.evaluate(jsonRequest('evaluate', created.token, EXAMPLE_EVALUATE_REQUEST));
    expect(answer.status).toBe(401);
    expect((await readError(answer)).error.code).toBe('token_expired');
  });

  it('per-token rate limit: the request over the rate gets 429 with Retry-After; another token is unaffected', async () => {
    const slow = await createTeamApiToken(teamId, adminId, { name: 'Three a minute', scopes: ['read'], requestsPerMinute: 3 });
    const statuses: number[] = [];
    let last: Response | null = null;
    for (let i = 0; i < 4; i += 1) {
      last = await ENDPOINTS.flags(getRequest('flags', slow.token));
      statuses.push(last.status);
    }
    expect(statuses).toEqual([200, 200, 200, 429]);
    expect(Number(last!.headers.get('retry-after'))).toBeGreaterThan(0);
    expect((await readError(last!)).error.code).toBe('rate_limited');
    expect((await ENDPOINTS.flags(getRequest('flags', readToken))).status).toBe(200);
    // The count lives in PostgreSQL, shared by every app instance.
    const rows = await getDb().execute(sql`select points from api_token_limits where key like ${'apitoken:%'}`);
    expect(rows.rows.length).toBeGreaterThan(0);
  });

  it('the window: remaining counts down, a new minute starts afresh, and refused requests (revoked, wrong scope) are not counted', async () => {
    const created = await createTeamApiToken(teamId, adminId, { name: 'Window check', scopes: ['read'], requestsPerMinute: 5 });
    const key = `apitoken:${created.id}`;
    const points = async () => (await getDb().execute<{ points: number }>(sql`select points from api_token_limits where key = ${key}`)).rows[0]?.points ?? null;
    const first = await ENDPOINTS.flags(getRequest('flags', created.token));
    const second = await ENDPOINTS.flags(getRequest('flags', created.token));
    expect([first.headers.get('x-ratelimit-remaining'), second.headers.get('x-ratelimit-remaining')]).toEqual(['4', '3']);
    const resetS = Number(second.headers.get('x-ratelimit-reset'));
    expect(resetS).toBeGreaterThanOrEqual(59);
    expect(resetS).toBeLessThanOrEqual(60);
    // A request on a scope the token lacks is refused before it is counted.
    expect((await ENDPOINTS.evaluate(jsonRequest('evaluate', created.token, EXAMPLE_EVALUATE_REQUEST))).status).toBe(403);
    expect(await points()).toBe(2);
    // The window ended (moved into the past): the next request starts a new one at 1.
    await getDb().execute(sql`update api_token_limits set expire = expire - 61000 where key = ${key}`);
    const fresh = await ENDPOINTS.flags(getRequest('flags', created.token));
    expect(fresh.headers.get('x-ratelimit-remaining')).toBe('4');
    expect(await points()).toBe(1);
    // A revoked token is refused and not counted.
    await revokeApiToken(teamId, adminId, created.id);
    expect((await ENDPOINTS.flags(getRequest('flags', created.token))).status).toBe(401);
    expect(await points()).toBe(1);
  });

  it('concurrent requests are counted exactly: 24 at once on a rate of 10 → 10 answered, 14 refused with 429', async () => {
    const created = await createTeamApiToken(teamId, adminId, { name: 'Burst check', scopes: ['read'], requestsPerMinute: 10 });
    const answers = await Promise.all(Array.from({ length: 24 }, () => ENDPOINTS.flags(getRequest('flags', created.token))));
    const statuses = answers.map((answer) => answer.status);
    expect(statuses.filter((status) => status === 200)).toHaveLength(10);
    expect(statuses.filter((status) => status === 429)).toHaveLength(14);
  });
});

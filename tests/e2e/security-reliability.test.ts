// Issue 11, security: cross-site requests to server actions and route handlers refused (Next checks
// the Origin of every server action; apiHandler refuses a foreign Origin on state changes), session
// fixation has no hold (a planted session cookie is replaced at sign-in and opens nothing), uploads of
// the wrong type or size refused. (The dependency audit is `npm run audit:prod`: it needs the
// registry's advisory endpoint, which is not reachable from every machine that runs the tests.)
import { createRequire } from 'node:module';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, isNull } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { apiTokens } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { createTeamApiToken } from '@/server/apiTokens/manage';
import { appUrl } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { pagePathOfWorker, readActionManifest, signInOverHttp, httpClient, type HttpClient } from './auth-http';

const requireFromRoot = createRequire(path.resolve('package.json'));
const EVIL_ORIGIN = 'https://attacker.example';

let teamId: string;
let admin: { id: string; email: string };
let adminClient: HttpClient;
let designerClient: HttpClient;
let projectId: string;

beforeAll(async () => {
  const team = await createTestTeam('security');
  teamId = team.id;
  const adminRow = await createTestUser(teamId, 'admin');
  admin = { id: adminRow.id, email: adminRow.email };
  const designer = await createTestUser(teamId, 'designer');
  const signedAdmin = await signInOverHttp(admin.email, TEST_PASSWORD);
  const signedDesigner = await signInOverHttp(designer.email, TEST_PASSWORD);
  if (!signedAdmin.signedIn || !signedDesigner.signedIn) throw new Error('test users could not sign in');
  adminClient = signedAdmin.client;
  designerClient = signedDesigner.client;
  projectId = (await createProject(teamId, adminRow.id, { name: `Security ${randomUUID().slice(0, 8)}` })).id;
});
afterAll(() => closeDb());

/** A server action called as a forged cross-site form post would call it (Next's wire format). */
async function callActionFrom(origin: string, client: HttpClient, file: string, name: string, args: unknown[]): Promise<Response> {
  const action = readActionManifest().find((a) => a.filename === file && a.exportedName === name);
  if (!action) throw new Error(`the build has no action ${file}#${name}`);
  const { encodeReply } = requireFromRoot('next/dist/compiled/react-server-dom-webpack/client.node.js') as { encodeReply(value: unknown): Promise<string | FormData> };
  const body = await encodeReply(args);
  const headers: Record<string, string> = { origin, 'next-action': action.id, accept: 'text/x-component', cookie: client.jar.header() };
  if (typeof body === 'string') headers['content-type'] = 'text/plain;charset=UTF-8';
  return fetch(appUrl(pagePathOfWorker(action.workers[0])), { method: 'POST', headers, body, redirect: 'manual' });
}

function form(fields: Record<string, string>): FormData {
  const data = new FormData();
  for (const [key, value] of Object.entries(fields)) data.set(key, value);
  return data;
}

const ACTIONS_FILE = 'app/(workspace)/admin/tokens/actions.ts';

describe('CSRF', () => {
  it('a server action posted from another origin with the admin cookie is refused and does nothing; the same post from our origin works', async () => {
    const target = await createTeamApiToken(teamId, admin.id, { name: 'csrf target', scopes: ['calc'] });
    const forged = await callActionFrom(EVIL_ORIGIN, adminClient, ACTIONS_FILE, 'revokeApiTokenAction', [{}, form({ tokenId: target.id })]);
    // Next compares Origin with Host before running any action and refuses the request.
    console.log(`forged cross-site server action: HTTP ${forged.status}, ${(await forged.clone().text()).slice(0, 120)}`);
    expect(forged.status).toBeGreaterThanOrEqual(400);
    const [afterForged] = await getDb().select({ revokedAt: apiTokens.revokedAt }).from(apiTokens).where(eq(apiTokens.id, target.id));
    expect(afterForged.revokedAt).toBeNull();

    const countActive = async () => (await getDb().select({ id: apiTokens.id }).from(apiTokens).where(and(eq(apiTokens.teamId, teamId), isNull(apiTokens.revokedAt)))).length;
    const before = await countActive();
    const forgedCreate = await callActionFrom(EVIL_ORIGIN, adminClient, ACTIONS_FILE, 'createApiTokenAction', [{}, form({ name: 'planted by attacker', scopes: 'calc' })]);
    expect(forgedCreate.status).toBeGreaterThanOrEqual(400);
    expect(await forgedCreate.text()).not.toMatch(/awt_[A-Za-z0-9_-]{43}/);
    expect(await countActive()).toBe(before);

    // The control: the very same call from Ampwarden's own origin is carried out.
    const genuine = await callActionFrom(new URL(appUrl()).origin, adminClient, ACTIONS_FILE, 'revokeApiTokenAction', [{}, form({ tokenId: target.id })]);
    expect(genuine.status).toBe(200);
    const [afterGenuine] = await getDb().select({ revokedAt: apiTokens.revokedAt }).from(apiTokens).where(eq(apiTokens.id, target.id));
    expect(afterGenuine.revokedAt).not.toBeNull();
  });

  it('a state-changing route handler call from another origin is refused with 403 cross_site', async () => {
    const name = `csrf project ${randomUUID().slice(0, 8)}`;
    const forged = await designerClient.request('/api/projects', { method: 'POST', body: { name }, headers: { origin: EVIL_ORIGIN } });
    expect(forged.status).toBe(403);
    expect(((await forged.json()) as { error: { code: string } }).error.code).toBe('cross_site');
    const list = (await (await designerClient.request('/api/projects')).json()) as { projects: { name: string }[] };
    expect(list.projects.some((p) => p.name === name)).toBe(false);
  });

  it('the session cookie is HttpOnly and SameSite=Lax, so other sites neither read nor send it on their posts', async () => {
    const client = httpClient();
    const csrf = (await (await client.request('/api/auth/csrf')).json()) as { csrfToken: string };
    const response = await client.request('/api/auth/callback/credentials', {
      method: 'POST',
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email: admin.email, password: TEST_PASSWORD, json: 'true' }).toString(),
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    const sessionLine = response.headers.getSetCookie().find((line) => line.includes('session-token='));
    expect(sessionLine).toBeDefined();
    expect(sessionLine).toMatch(/HttpOnly/i);
    expect(sessionLine).toMatch(/SameSite=Lax/i);
  });
});

describe('session fixation', () => {
  it('a session cookie planted before sign-in opens nothing and is replaced by a new one at sign-in', async () => {
    const victim = await createTestUser(teamId, 'designer');
    const planted = `planted-${randomUUID()}`;
    const client = httpClient();
    // The attacker's cookie in the victim's browser (set by a sibling site or an injected header).
    const headers = { cookie: `next-auth.session-token=${planted}` };
    expect((await fetch(appUrl('/api/projects'), { headers })).status).toBe(401);
    const csrfResponse = await fetch(appUrl('/api/auth/csrf'), { headers });
    client.jar.store(csrfResponse);
    const csrf = (await csrfResponse.json()) as { csrfToken: string };
    const signIn = await fetch(appUrl('/api/auth/callback/credentials'), {
      method: 'POST',
      headers: {
        cookie: `${client.jar.header()}; next-auth.session-token=${planted}`,
        origin: new URL(appUrl()).origin,
        'content-type': 'application/x-www-form-urlencoded',
      },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email: victim.email, password: TEST_PASSWORD, json: 'true' }).toString(),
      redirect: 'manual',
    });
    client.jar.store(signIn);
    const issued = client.jar.get('next-auth.session-token');
    expect(issued).toBeDefined();
    expect(issued).not.toBe(planted);
    // The victim's new session works; the planted value still opens nothing.
    expect((await client.request('/api/projects')).status).toBe(200);
    expect((await fetch(appUrl('/api/projects'), { headers })).status).toBe(401);
  });

  it("an attacker's own valid session planted in a victim's browser is replaced by the victim's at sign-in", async () => {
    const attacker = await createTestUser(teamId, 'viewer');
    const victim = await createTestUser(teamId, 'designer');
    const attackerSession = await signInOverHttp(attacker.email, TEST_PASSWORD);
    const attackerToken = attackerSession.client.jar.get('next-auth.session-token')!;
    const victimClient = httpClient(attackerSession.client.jar.clone());
    const csrf = (await (await victimClient.request('/api/auth/csrf')).json()) as { csrfToken: string };
    await victimClient.request('/api/auth/callback/credentials', {
      method: 'POST',
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email: victim.email, password: TEST_PASSWORD, json: 'true' }).toString(),
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    expect(victimClient.jar.get('next-auth.session-token')).not.toBe(attackerToken);
    const session = (await (await victimClient.request('/api/auth/session')).json()) as { user?: { email?: string } };
    expect(session.user?.email).toBe(victim.email);
  });
});

describe('uploads and bodies of the wrong type or size', () => {
  async function newSchedule(): Promise<string> {
    const response = await designerClient.request('/api/schedules', { method: 'POST', body: { projectId, name: `upload ${randomUUID().slice(0, 8)}` } });
    expect(response.status).toBe(201);
    const body = (await response.json()) as { schedule?: { id: string }; id?: string };
    return body.schedule?.id ?? body.id!;
  }
  async function upload(scheduleId: string, fileName: string, bytes: Uint8Array<ArrayBuffer>, type: string): Promise<Response> {
    const data = new FormData();
    data.set('file', new File([bytes], fileName, { type }));
    return fetch(appUrl(`/api/schedules/${scheduleId}/file`), { method: 'POST', headers: { cookie: designerClient.jar.header(), origin: new URL(appUrl()).origin }, body: data });
  }

  it('schedule uploads: an executable, a PNG named .csv and a fake .xlsx get 415; an oversize file 413; each a JSON error', async () => {
    const scheduleId = await newSchedule();
    const png = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 73, 72, 68, 82, 0, 0, 0, 1]);
    const cases: [string, Uint8Array<ArrayBuffer>, string, number][] = [
      ['setup.exe', Uint8Array.from([0x4d, 0x5a, 0x90, 0, 3, 0, 0, 0]), 'application/x-msdownload', 415],
      ['circuits.csv', png, 'text/csv', 415],
      ['circuits.xlsx', new TextEncoder().encode('tag,current\nA1,100\n'), 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', 415],
      ['huge.csv', new Uint8Array(5 * 1024 * 1024).fill(0x41), 'text/csv', 413],
    ];
    for (const [fileName, bytes, type, status] of cases) {
      const response = await upload(scheduleId, fileName, bytes, type);
      expect(response.status, fileName).toBe(status);
      const body = (await response.json()) as { error: { code: string; message: string } };
      expect(body.error.message.length, fileName).toBeGreaterThan(10);
    }
  });

  it('the calculation API: a body of another type gets 415 and one over the size limit 413, over HTTP', async () => {
    const { token } = await createTeamApiToken(teamId, admin.id, { name: 'http limits', scopes: ['calc'] });
    const wrongType = await fetch(appUrl('/api/v1/evaluate'), { method: 'POST', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/xml' }, body: '<circuit/>' });
    expect(wrongType.status).toBe(415);
    const big = await fetch(appUrl('/api/v1/evaluate'), { method: 'POST', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' }, body: `{"pad":"${'x'.repeat(300 * 1024)}"}` });
    expect(big.status).toBe(413);
    expect(((await big.json()) as { error: { code: string } }).error.code).toBe('payload_too_large');
  });
});

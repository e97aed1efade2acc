// Issue 19 over HTTP against the production build: sessions that end at sign-out, limits that
// count the socket address, an admin-only local mailbox, bodies that answer 400 in words, real 404
// pages, file names of any script in downloads, exports that cannot run formulas, uploads refused
// while they are read, PDFs rendered once per saved state, and limits on anonymous PDFs and on
// sharing by e-mail. A second `next start` of the same build runs with the settings a production
// installation has (no dev mailbox) and with a trusted proxy configured.
import { randomUUID } from 'node:crypto';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { like, or, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { signInLimits } from '@/db/schema';
import { SHARE_MAIL_LIMIT } from '@/server/limits/shareMail';
import { SHARE_PDF_LIMIT } from '@/server/limits/sharePdf';
import { SCHEDULE_COLUMNS } from '@/lib/schedule/columns';
import { CATALOGUE_COLUMNS } from '@/lib/catalogue';
import { appUrl } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { testCable240 } from '../helpers/sheetCandidates';
import { sheetXmlOf, workbookParts, zip } from '../helpers/zip';
import { httpClient, signInOverHttp, type HttpClient } from './auth-http';
import { AppProcess } from './reliability-helpers';

interface CaughtMessage {
  to: string[];
  subject: string;
  text: string;
}

let teamId: string;
let admin: { id: string; email: string };
let designer: { id: string; email: string };
let adminClient: HttpClient;
let designerClient: HttpClient;
let reviewerClient: HttpClient;
let otherAdminClient: HttpClient;
let projectId: string;
let sheetId: string;
/** The same build with a production installation's settings: no dev mailbox; 127.0.0.1 as a trusted proxy. */
let productionLike: AppProcess;

async function signedIn(email: string): Promise<HttpClient> {
  const answer = await signInOverHttp(email, TEST_PASSWORD);
  if (!answer.signedIn) throw new Error(`${email} could not sign in: ${answer.error}`);
  return answer.client;
}

async function json<T>(response: Response): Promise<T> {
  return (await response.json()) as T;
}

beforeAll(async () => {
  teamId = (await createTestTeam('hardening')).id;
  admin = await createTestUser(teamId, 'admin');
  designer = await createTestUser(teamId, 'designer');
  const reviewer = await createTestUser(teamId, 'reviewer');
  const otherTeam = await createTestTeam('hardening-other');
  const otherAdmin = await createTestUser(otherTeam.id, 'admin');
  [adminClient, designerClient, reviewerClient, otherAdminClient] = await Promise.all([admin.email, designer.email, reviewer.email, otherAdmin.email].map(signedIn));
  const project = await json<{ project: { id: string } }>(await designerClient.request('/api/projects', { method: 'POST', body: { name: `Hardening ${randomUUID().slice(0, 8)}` } }));
  projectId = project.project.id;
  const sheet = await json<{ sheet: { id: string } }>(await designerClient.request(`/api/projects/${projectId}/sheets`, { method: 'POST', body: { circuitTag: 'H-1', title: 'Hardening feeder' } }));
  sheetId = sheet.sheet.id;
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set: run through npm test');
  productionLike = await AppProcess.start(databaseUrl, { AMPWARDEN_DEV_MAILBOX: '', AMPWARDEN_TRUSTED_PROXIES: '127.0.0.1' });
}, 180_000);

afterAll(async () => {
  productionLike?.stop();
  await closeDb();
});

async function sheetVersion(): Promise<number> {
  return (await json<{ sheet: { version: number } }>(await designerClient.request(`/api/sheets/${sheetId}`))).sheet.version;
}

describe('sign-out ends the session (item 1)', () => {
  it('a copy of the cookie taken before signing out opens nothing afterwards; another session of the member goes on', async () => {
    const session = await signedIn(designer.email);
    const other = await signedIn(designer.email);
    const copied = session.jar.header();
    expect((await fetch(appUrl('/api/projects'), { headers: { cookie: copied } })).status).toBe(200);

    const csrf = await json<{ csrfToken: string }>(await session.request('/api/auth/csrf'));
    const signOut = await session.request('/api/auth/signout', {
      method: 'POST',
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, json: 'true' }).toString(),
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    expect(signOut.status).toBeLessThan(400);

    // The replayed cookie: the API says "sign in first", a page sends to the sign-in page.
    expect((await fetch(appUrl('/api/projects'), { headers: { cookie: copied } })).status).toBe(401);
    const page = await fetch(appUrl('/projects'), { headers: { cookie: copied }, redirect: 'manual' });
    expect(page.status).toBeGreaterThanOrEqual(300);
    expect(page.status).toBeLessThan(400);
    expect(page.headers.get('location')).toMatch(/\/sign-in/);
    expect((await other.request('/api/projects')).status).toBe(200);
  });
});

describe('per-address limits count the socket address (item 2)', () => {
  const spoofed = () => `203.0.113.${Math.floor(Math.random() * 200) + 20}`;
  const points = async (key: string) => (await getDb().select({ points: signInLimits.points }).from(signInLimits).where(sql`${signInLimits.key} = ${key}`))[0]?.points ?? 0;

  async function failSignIn(base: string, xff: string) {
    const client = httpClient();
    const csrfResponse = await fetch(`${base}/api/auth/csrf`);
    client.jar.store(csrfResponse);
    const csrf = await json<{ csrfToken: string }>(csrfResponse);
    await fetch(`${base}/api/auth/callback/credentials`, {
      method: 'POST',
      headers: { cookie: client.jar.header(), origin: base, 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': xff },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email: `nobody-${randomUUID().slice(0, 8)}@test.example`, password: 'guess', json: 'true' }).toString(),
      redirect: 'manual',
    });
  }

  it('a client that writes its own X-Forwarded-For is still counted under its socket address, for sign-in and reset mail', async () => {
    const signInBefore = await points('signin-address:127.0.0.1');
    const resetBefore = await points('reset-address:127.0.0.1');
    const addresses = [spoofed(), spoofed(), spoofed()];
    try {
      for (const xff of addresses) await failSignIn(new URL(appUrl()).origin, xff);
      for (const xff of addresses.slice(0, 2)) {
        const reset = await fetch(appUrl('/api/auth/reset-request'), { method: 'POST', headers: { 'content-type': 'application/json', 'x-forwarded-for': xff }, body: JSON.stringify({ email: `nobody-${randomUUID().slice(0, 8)}@test.example` }) });
        expect(reset.status).toBe(202);
      }
      const spoofedRows = await getDb()
        .select()
        .from(signInLimits)
        .where(or(...addresses.map((a) => like(signInLimits.key, `%:${a}`))));
      expect(spoofedRows).toEqual([]);
      expect(await points('signin-address:127.0.0.1')).toBe(signInBefore + 3);
      expect(await points('reset-address:127.0.0.1')).toBe(resetBefore + 2);
    } finally {
      // Give the shared loopback address its points back, so that later tests are not limited by these.
      await getDb().execute(sql`update ${signInLimits} set points = greatest(points - 3, 0) where key = 'signin-address:127.0.0.1'`);
      await getDb().execute(sql`update ${signInLimits} set points = greatest(points - 2, 0) where key = 'reset-address:127.0.0.1'`);
    }
  });

  it('behind a configured proxy (AMPWARDEN_TRUSTED_PROXIES) the address that proxy saw is counted', async () => {
    const address = spoofed();
    try {
      await failSignIn(productionLike.url, address);
      expect(await points(`signin-address:${address}`)).toBe(1);
    } finally {
      await getDb().delete(signInLimits).where(sql`${signInLimits.key} = ${`signin-address:${address}`}`);
    }
  });
});

describe('/dev/mailbox (item 7)', () => {
  it('anonymous visitors are sent to sign in and a designer gets 403; an admin sees their own team’s mail only', async () => {
    const ours = `mailbox-ours-${randomUUID().slice(0, 8)}@test.example`;
    const theirs = `mailbox-theirs-${randomUUID().slice(0, 8)}@test.example`;
    expect((await adminClient.request('/api/members/invitations', { method: 'POST', body: { email: ours, role: 'viewer' } })).status).toBe(201);
    expect((await otherAdminClient.request('/api/members/invitations', { method: 'POST', body: { email: theirs, role: 'viewer' } })).status).toBe(201);
    // Both invitations reached the catcher.
    for (let i = 0; i < 100; i += 1) {
      const all = await json<CaughtMessage[]>(await fetch(`${process.env.MAIL_CATCHER_URL}/messages`));
      if ([ours, theirs].every((a) => all.some((m) => m.to.includes(a)))) break;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }

    const anonymous = await fetch(appUrl('/dev/mailbox'), { redirect: 'manual' });
    expect(anonymous.status).toBeGreaterThanOrEqual(300);
    expect(anonymous.status).toBeLessThan(400);
    expect(anonymous.headers.get('location')).toMatch(/\/sign-in/);
    expect(await anonymous.text()).not.toContain('/invite/');
    expect((await designerClient.request('/dev/mailbox')).status).toBe(403);

    const page = await adminClient.request('/dev/mailbox');
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain(ours);
    expect(html).not.toContain(theirs);
  });

  it('a production server that was not told to enable it answers 404, even to an admin', async () => {
    const response = await fetch(`${productionLike.url}/dev/mailbox`, { headers: { cookie: adminClient.jar.header() }, redirect: 'manual' });
    expect(response.status).toBe(404);
    expect(await response.text()).not.toContain('/invite/');
  });
});

describe('request bodies answer 400 naming the problem (Low)', () => {
  it('malformed JSON, U+0000 in text and an integer past the integer column, on every session route', async () => {
    const version = await sheetVersion();
    const routes: Array<{ client: HttpClient; path: string; method: string; valid: Record<string, unknown>; textField: string; intField?: string }> = [
      { client: designerClient, path: `/api/sheets/${sheetId}`, method: 'PUT', valid: { expectedVersion: version, title: 'x' }, textField: 'title', intField: 'expectedVersion' },
      { client: designerClient, path: `/api/sheets/${sheetId}/candidates`, method: 'POST', valid: { expectedVersion: version, candidate: testCable240 }, textField: 'candidate', intField: 'expectedVersion' },
      { client: designerClient, path: `/api/sheets/${sheetId}/transitions`, method: 'POST', valid: { action: 'submit', comment: 'x' }, textField: 'comment', intField: 'expectedVersion' },
      { client: reviewerClient, path: `/api/sheets/${sheetId}/flags/AMBIENT_ASSUMED/acknowledgement`, method: 'PUT', valid: { comment: 'Accepted here.' }, textField: 'comment' },
      { client: designerClient, path: '/api/projects', method: 'POST', valid: { name: 'x' }, textField: 'name' },
      { client: designerClient, path: '/api/schedules', method: 'POST', valid: { projectId, name: 'x' }, textField: 'name' },
    ];
    for (const route of routes) {
      const malformed = await route.client.request(route.path, { method: route.method, body: '{"title": "unfinished', headers: { 'content-type': 'application/json' } });
      expect(malformed.status, `${route.path} malformed`).toBe(400);
      expect((await json<{ error: { code: string } }>(malformed)).error.code, route.path).toBe('invalid_json');

      const nul = await route.client.request(route.path, { method: route.method, body: { ...route.valid, [route.textField]: 'bad\u0000text' } });
      expect(nul.status, `${route.path} U+0000`).toBe(400);
      const nulBody = await json<{ error: { code: string; message: string } }>(nul);
      expect(nulBody.error.message, route.path).toContain(route.textField);

      if (route.intField) {
        const huge = await route.client.request(route.path, { method: route.method, body: { ...route.valid, [route.intField]: 3_000_000_000 } });
        expect(huge.status, `${route.path} out-of-range integer`).toBe(400);
        expect((await json<{ error: { code: string; message: string } }>(huge)).error.message, route.path).toMatch(/expectedVersion/);
      }
    }
  });
});

describe('unknown or foreign ids answer a real 404 (Low)', () => {
  it('sheet, project and schedule pages of a random id, a malformed id, or another team’s sheet', async () => {
    for (const path of [`/sheets/${randomUUID()}`, `/projects/${randomUUID()}`, `/schedules/${randomUUID()}`, '/sheets/not-an-id']) {
      expect((await designerClient.request(path)).status, path).toBe(404);
    }
    expect((await otherAdminClient.request(`/sheets/${sheetId}`)).status).toBe(404);
    expect((await otherAdminClient.request(`/projects/${projectId}`)).status).toBe(404);
    // The control: the team's own sheet opens.
    expect((await designerClient.request(`/sheets/${sheetId}`)).status).toBe(200);
  });
});

describe('downloads carry any file name (Low: RFC 6266 filename*)', () => {
  it('an imported file named in Polish, with a dash above U+00FF, downloads whole under its name', async () => {
    const name = 'Kabelliste Łódź – Schaltanlage.csv';
    const header = CATALOGUE_COLUMNS.coverings.map((c) => c.header).join(',');
    const good = new FormData();
    good.set('kind', 'coverings');
    good.set('file', new File([`${header}\nh-cov,Hardening covering,insulation,4.5,Supplier datasheet,180,350,Supplier datasheet,0.9,Supplier datasheet\n`], name, { type: 'text/csv' }));
    const kept = await fetch(appUrl('/api/catalogue/imports'), { method: 'POST', body: good, headers: { cookie: adminClient.jar.header(), origin: new URL(appUrl()).origin } });
    expect(kept.status).toBe(201);
    const { importId } = await json<{ importId: string }>(kept);
    const download = await adminClient.request(`/api/catalogue/imports/${importId}/file`);
    expect(download.status).toBe(200);
    const disposition = download.headers.get('content-disposition')!;
    expect(decodeURIComponent(disposition.split("filename*=UTF-8''")[1])).toBe(name);
    expect(await download.text()).toContain('Hardening covering');
  });
});

describe('CSV exports cannot run formulas (item 4)', () => {
  it('a candidate named "=HYPERLINK(…)" reaches the candidates CSV as text', async () => {
    const label = '=HYPERLINK("http://attacker.example","240 mm²")';
    const added = await designerClient.request(`/api/sheets/${sheetId}/candidates`, { method: 'POST', body: { expectedVersion: await sheetVersion(), candidate: { ...testCable240, id: 'formula', label }, choose: true } });
    expect(added.status).toBe(201);
    const csv = await (await designerClient.request(`/api/sheets/${sheetId}/candidates/export?format=csv`)).text();
    // Every block of the file (about lines, inputs, the candidates' table): no cell may start a formula.
    const cells = Papa.parse<string[]>(csv.replace(/^\uFEFF/, ''), { skipEmptyLines: true }).data.flat();
    expect(cells).toContain(`'${label}`);
    expect(cells.some((cell) => /^[=+\-@\t\r]/.test(cell) && !/^[+-]?\d/.test(cell))).toBe(false);
  });
});

describe('uploads are read within limits, off the request thread (item 5)', () => {
  const headers = SCHEDULE_COLUMNS.map((c) => c.header);
  const circuit = (i: number) => SCHEDULE_COLUMNS.map((c) => (c.field === 'circuitTag' ? `U-${i}` : c.example === '' ? '' : (c.example as string | number)));

  async function newSchedule(): Promise<string> {
    const created = await json<{ schedule: { id: string } }>(await designerClient.request('/api/schedules', { method: 'POST', body: { projectId, name: `uploads ${randomUUID().slice(0, 6)}` } }));
    return created.schedule.id;
  }
  async function upload(scheduleId: string, fileName: string, bytes: Uint8Array): Promise<Response> {
    const data = new FormData();
    data.set('file', new File([bytes as Uint8Array<ArrayBuffer>], fileName));
    return fetch(appUrl(`/api/schedules/${scheduleId}/file`), { method: 'POST', headers: { cookie: designerClient.jar.header(), origin: new URL(appUrl()).origin }, body: data });
  }

  it('a small workbook that unpacks to 40 MB is refused 413 naming the unpacked limit; more than 5,000 circuits 413 naming that limit; a good one is read', async () => {
    const scheduleId = await newSchedule();
    const header = sheetXmlOf([headers]).match(/<sheetData>(.*)<\/sheetData>/)![1];
    const bomb = zip(workbookParts(`<?xml version="1.0" encoding="UTF-8"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>${header}</sheetData>${' '.repeat(40 * 1024 * 1024)}</worksheet>`));
    const refused = await upload(scheduleId, 'bomb.xlsx', bomb);
    expect(refused.status).toBe(413);
    const refusal = await json<{ error: { code: string; message: string } }>(refused);
    expect(refusal.error.code).toBe('workbook_too_large');
    expect(refusal.error.message).toMatch(/24\.0 MB/);

    const many = zip(workbookParts(sheetXmlOf([headers, ...Array.from({ length: 5001 }, (_, i) => circuit(i))])));
    const tooMany = await upload(scheduleId, 'many.xlsx', many);
    expect(tooMany.status).toBe(413);
    expect((await json<{ error: { code: string; message: string } }>(tooMany)).error).toMatchObject({ code: 'too_many_rows', message: expect.stringContaining('5,000') });

    const good = await upload(scheduleId, 'good.xlsx', zip(workbookParts(sheetXmlOf([headers, circuit(1), circuit(2)]))));
    expect(good.status).toBe(200);
    expect((await json<{ preview: { fileRowCount: number } }>(good)).preview.fileRowCount).toBe(2);
  });
});

describe('PDFs (Low)', () => {
  it('the same saved state gives the same PDF bytes (rendered once); a save makes a new one', async () => {
    const first = new Uint8Array(await (await designerClient.request(`/api/sheets/${sheetId}/pdf`)).arrayBuffer());
    const again = new Uint8Array(await (await designerClient.request(`/api/sheets/${sheetId}/pdf`)).arrayBuffer());
    expect(first.byteLength).toBeGreaterThan(1000);
    expect(Buffer.from(again).equals(Buffer.from(first))).toBe(true);
    const version = await sheetVersion();
    const current = await json<{ sheet: { inputs: Record<string, unknown> } }>(await designerClient.request(`/api/sheets/${sheetId}`));
    expect((await designerClient.request(`/api/sheets/${sheetId}`, { method: 'PUT', body: { expectedVersion: version, inputs: current.sheet.inputs, title: 'Hardening feeder (saved again)' } })).status).toBe(200);
    const after = new Uint8Array(await (await designerClient.request(`/api/sheets/${sheetId}/pdf`)).arrayBuffer());
    expect(Buffer.from(after).equals(Buffer.from(first))).toBe(false);
  });

  it(`anonymous share-link PDFs: ${SHARE_PDF_LIMIT.points} per address in ${SHARE_PDF_LIMIT.durationS / 60} minutes, then 429 with Retry-After`, async () => {
    const { token } = await json<{ token: string }>(await designerClient.request(`/api/sheets/${sheetId}/shares`, { method: 'POST', body: { expiresInDays: 1 } }));
    expect(token).toBeTruthy();
    const key = sql`${signInLimits.key} = 'share-pdf-address:127.0.0.1'`;
    await getDb().delete(signInLimits).where(key);
    try {
      for (let i = 0; i < SHARE_PDF_LIMIT.points; i += 1) expect((await fetch(appUrl(`/share/${token}/pdf`))).status, `PDF ${i + 1}`).toBe(200);
      const limited = await fetch(appUrl(`/share/${token}/pdf`));
      expect(limited.status).toBe(429);
      expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    } finally {
      await getDb().delete(signInLimits).where(key);
    }
  });
});

describe('sharing by e-mail (Low)', () => {
  it(`${SHARE_MAIL_LIMIT.points} messages per member per hour, then 429 with Retry-After`, async () => {
    const sender = await createTestUser(teamId, 'designer');
    const client = await signedIn(sender.email);
    for (let i = 0; i < SHARE_MAIL_LIMIT.points; i += 1) {
      const sent = await client.request(`/api/sheets/${sheetId}/email`, { method: 'POST', body: { to: `recipient-${i}-${randomUUID().slice(0, 6)}@test.example` } });
      expect(sent.status, `message ${i + 1}`).toBe(201);
    }
    const limited = await client.request(`/api/sheets/${sheetId}/email`, { method: 'POST', body: { to: `one-too-many-${randomUUID().slice(0, 6)}@test.example` } });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    // Per member: a colleague still sends.
    expect((await designerClient.request(`/api/sheets/${sheetId}/email`, { method: 'POST', body: { to: `colleague-${randomUUID().slice(0, 6)}@test.example` } })).status).toBe(201);
  });
});

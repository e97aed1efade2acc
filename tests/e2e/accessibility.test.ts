// Issue 11, accessibility: axe-core (WCAG 2.1 A/AA rules and best practices) on the main pages of
// the production build in Chromium — signed in as an admin so that every page opens, and as a
// stranger for the landing, sign-in and read-only share pages — once each page has settled (plots
// drawn, grids filled, verification run). Any serious or critical finding fails the test.
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule, getSchedule, previewScheduleUpload, queueSchedule } from '@/db/queries/schedules';
import { createShare } from '@/db/queries/shares';
import { createTeamApiToken } from '@/server/apiTokens/manage';
import { enqueueScheduleBatches, stopWebBoss } from '@/server/jobs/boss';
import { startScheduleWorker, type RunningWorker } from '@/server/jobs/scheduleWorker';
import { appUrl, launchBrowser } from '../helpers/browser';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { circuitRows, scheduleCsv, seedSmallCatalogue, waitFor } from '../integration/schedules/helpers';
import { makeSharedSheet } from '../integration/share/shareFixtures';
import { signInOverHttp } from './auth-http';

const axeSource = fs.readFileSync(path.join(path.dirname(createRequire(path.resolve('package.json')).resolve('axe-core')), 'axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  impact: 'minor' | 'moderate' | 'serious' | 'critical' | null;
  help: string;
  nodes: { target: string[]; failureSummary?: string }[];
}

interface AuditedPage {
  name: string;
  path: string;
  signedIn: boolean;
  /** Selectors that exist once the page has settled (client-side results, plots, grids), so axe sees what a user sees. */
  ready?: string[];
}

let browser: Browser;
let signedIn: BrowserContext;
let anonymous: BrowserContext;
let worker: RunningWorker | undefined;
const pages = new Map<string, AuditedPage>();

const PLOTS_DRAWN = '[data-testid="profile-plot"] .js-plotly-plot .main-svg';
const GRID_ROWS = '.ag-row .ag-cell';

beforeAll(async () => {
  const team = await createTestTeam('a11y');
  const admin = await createTestUser(team.id, 'admin');
  await seedSmallCatalogue(team.id);
  // A sheet with two candidates, a chosen one and flags, so the result strip, plots, grid and flags
  // are on the page; the same sheet is shared read-only.
  const sheet = await makeSharedSheet(team.id, { id: admin.id, role: 'admin' }, 'Accessibility');
  const share = await createShare(team.id, admin.id, sheet.sheetId, { expiresInDays: 7 });
  if (!share) throw new Error('the sheet could not be shared');
  // Two schedules of that project: one previewed with a bad row (problems and clean rows shown),
  // one sized to the end by a worker (results grid, totals), including a circuit no size passes.
  const rows = circuitRows(6, 'A11Y');
  const previewed = await createSchedule(team.id, admin.id, { projectId: sheet.projectId, name: `Feeders with a typo ${randomUUID().slice(0, 4)}` });
  await previewScheduleUpload(team.id, admin.id, previewed.id, {
    fileName: 'feeders.csv',
    mediaType: 'text/csv',
    bytes: scheduleCsv([...rows, { ...rows[0], circuitTag: 'A11Y-BAD', designCurrentA: 'about 90' }]),
  });
  const sized = await createSchedule(team.id, admin.id, { projectId: sheet.projectId, name: `Feeders sized ${randomUUID().slice(0, 4)}` });
  const preview = await previewScheduleUpload(team.id, admin.id, sized.id, {
    fileName: 'feeders.csv',
    mediaType: 'text/csv',
    // 900 A is beyond a single 95 mm² cable, the largest of the small catalogue: no size passes.
    bytes: scheduleCsv([...rows, { ...rows[1], circuitTag: 'A11Y-HEAVY', designCurrentA: 900 }]),
  });
  if (preview.problems.length > 0) throw new Error(`the schedule file has problems: ${JSON.stringify(preview.problems)}`);
  await queueSchedule(team.id, admin.id, sized.id, { dropBadRows: false }, enqueueScheduleBatches);
  worker = await startScheduleWorker({ workerId: 'a11y-test' });
  await waitFor('the schedule to be sized', async () => (await getSchedule(team.id, sized.id))?.status === 'done', 90_000, 250);
  // Sized: the worker has nothing more to do here, and must not hold the CPU while the pages are audited.
  await worker.stop();
  worker = undefined;
  // A token in the list, so the table of the tokens page is checked as well.
  await createTeamApiToken(team.id, admin.id, { name: 'Drawing office bridge', scopes: ['calc'] });
  const session = await signInOverHttp(admin.email, TEST_PASSWORD);
  if (!session.signedIn) throw new Error(`the admin could not sign in: ${session.error}`);
  browser = await launchBrowser();
  signedIn = await browser.newContext();
  const cookieName = session.client.jar.get('next-auth.session-token') ? 'next-auth.session-token' : '__Secure-next-auth.session-token';
  await signedIn.addCookies([{ name: cookieName, value: session.client.jar.get(cookieName)!, url: appUrl('/') }]);
  anonymous = await browser.newContext();
  for (const page of [
    { name: 'landing', path: '/', signedIn: false },
    { name: 'sign-in', path: '/sign-in', signedIn: false },
    { name: 'projects', path: '/projects', signedIn: true },
    { name: 'project', path: `/projects/${sheet.projectId}`, signedIn: true },
    { name: 'sizing sheet', path: `/sheets/${sheet.sheetId}`, signedIn: true, ready: [PLOTS_DRAWN] },
    { name: 'shared sheet', path: `/share/${share.token}`, signedIn: false, ready: [PLOTS_DRAWN] },
    { name: 'schedule preview', path: `/schedules/${previewed.id}`, signedIn: true, ready: ['[aria-label="Problems in the file"]'] },
    { name: 'schedule results', path: `/schedules/${sized.id}`, signedIn: true, ready: [GRID_ROWS] },
    { name: 'catalogue', path: '/catalogue', signedIn: true, ready: [GRID_ROWS] },
    // Every check has run and the field cases' plots are drawn.
    { name: 'verification', path: '/verification', signedIn: true, ready: ['[data-testid="verification-summary"][data-state="done"]', '[data-testid^="field-plots-"] .js-plotly-plot .main-svg'] },
    { name: 'members', path: '/admin/members', signedIn: true },
    { name: 'API tokens', path: '/admin/tokens', signedIn: true },
    { name: 'API guide', path: '/api-docs', signedIn: true },
  ]) {
    pages.set(page.name, page);
  }
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await stopWebBoss();
  await closeDb();
});

async function audit(context: BrowserContext, entry: AuditedPage): Promise<{ status: number; violations: AxeViolation[] }> {
  const page = await context.newPage();
  try {
    const response = await page.goto(appUrl(entry.path), { waitUntil: 'load', timeout: 60_000 });
    await page.waitForLoadState('networkidle', { timeout: 15_000 }).catch(() => {});
    // The verification page runs every check in the browser first: allow a loaded machine its time.
    for (const selector of entry.ready ?? []) await page.waitForSelector(selector, { state: 'attached', timeout: 180_000 });
    await page.screenshot({ path: `test-results/screenshots/a11y-${entry.name.replace(/\s+/g, '-')}.png`, fullPage: true, timeout: 20_000 }).catch(() => {});
    // Evaluated through the DevTools protocol, so the page's Content-Security-Policy does not block it.
    await page.evaluate(axeSource);
    const violations = (await page.evaluate(async () => {
      const axe = (window as unknown as { axe: { run(context: Document, options: unknown): Promise<{ violations: unknown[] }> } }).axe;
      const result = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice'] }, resultTypes: ['violations'] });
      return result.violations;
    })) as AxeViolation[];
    return { status: response?.status() ?? 0, violations };
  } finally {
    await page.close();
  }
}

const PAGE_NAMES = [
  'landing',
  'sign-in',
  'projects',
  'project',
  'sizing sheet',
  'shared sheet',
  'schedule preview',
  'schedule results',
  'catalogue',
  'verification',
  'members',
  'API tokens',
  'API guide',
];

describe('axe-core on the main pages (Chromium): no serious or critical issue', () => {
  it.each(PAGE_NAMES)('%s', { timeout: 300_000 }, async (name) => {
    const entry = pages.get(name)!;
    fs.mkdirSync('test-results/screenshots', { recursive: true });
    const { status, violations } = await audit(entry.signedIn ? signedIn : anonymous, entry);
    expect(status, `${entry.name} (${entry.path}) did not open`).toBe(200);
    const grave = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    const findings = grave.map(
      (violation) =>
        `${entry.name} (${entry.path}) — ${violation.id} [${violation.impact}]: ${violation.help}; ${violation.nodes.length} node(s), e.g. ${violation.nodes
          .slice(0, 3)
          .map((n) => `${n.target.join(' ')} (${(n.failureSummary ?? '').replace(/\s+/g, ' ').slice(0, 200)})`)
          .join(' | ')}`,
    );
    console.log(`axe-core ${entry.name}: ${violations.length} finding(s) [${violations.map((v) => `${v.id}:${v.impact}`).join(', ')}], ${grave.length} serious/critical${findings.length ? `\n  ${findings.join('\n  ')}` : ''}`);
    expect(findings, 'serious or critical axe-core findings').toEqual([]);
  });
});

/**
 * The role × endpoint matrix: every route handler (app/**\/route.ts, each exported method) and
 * every server action ('use server' module export) with the HTTP status expected for each caller.
 *
 * - endpoint-coverage.test.ts (integration) fails when an endpoint has no entry or an entry has
 *   no endpoint, by reading the source tree;
 * - tests/e2e/auth-endpoint-matrix.test.ts calls every entry as every actor against the
 *   production build at APP_URL (real sign-in through next-auth, real cookies) and compares.
 *
 * Actors: `anonymous` (no cookie), the four roles of team A, and `otherAdmin`, an admin of team B
 * who must get 404 — never 403, never data — for team A's rows. Calls run in the order of ACTORS
 * (admin last), each `request` builds its own rows when the call changes them.
 *
 * When you add an endpoint or a server action, add its entry here.
 */

import { defaultSheetInputs } from '@/lib/sheet';
import { freshCatalogueCovering, freshCatalogueImport } from '../catalogue/matrixRows';
import { EXAMPLE_AMPACITY_REQUEST, EXAMPLE_EVALUATE_REQUEST } from '@/lib/api/examples';

export const ACTORS = ['anonymous', 'viewer', 'designer', 'reviewer', 'otherAdmin', 'admin'] as const;
export type Actor = (typeof ACTORS)[number];
export type SignedInActor = Exclude<Actor, 'anonymous'>;
export type Expectation = Record<Actor, number>;

/** Rows the entries can point at; built per run by the e2e test (tests/e2e/auth-http.ts). */
export interface MatrixContext {
  teamId: string;
  otherTeamId: string;
  users: Record<SignedInActor, { id: string; email: string }>;
  /** A project of team A. */
  projectId: string;
  /** A draft sheet of team A, authored by the designer. */
  sheetId: string;
  /** A new draft sheet of team A (authored by the designer) with its current version. */
  freshSheet(): Promise<{ id: string; version: number }>;
  /** A new active member of team A. */
  freshMember(role: 'admin' | 'designer' | 'reviewer' | 'viewer'): Promise<{ id: string }>;
  /** A new open invitation of team A. */
  freshInvitation(): Promise<{ id: string }>;
  /** A name no other call uses. */
  unique(label: string): string;
}

export interface RouteRequest {
  path: string;
  body?: unknown;
  headers?: Record<string, string>;
}

export interface RouteEntry {
  kind: 'route';
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** The route as the file tree names it, route groups left out: `/api/projects/[projectId]`. */
  route: string;
  expect: Expectation;
  request(ctx: MatrixContext, actor: Actor): RouteRequest | Promise<RouteRequest>;
  /** Optional check of the answer body (team isolation of lists): returns what is wrong, or null. */
  check?(body: unknown, actor: Actor, ctx: MatrixContext): string | null;
}

export interface ActionEntry {
  kind: 'action';
  /** The 'use server' module, relative to the repository root. */
  file: string;
  name: string;
  expect: Expectation;
  /** The action's arguments (FormData allowed), encoded as React's client would encode them. */
  args(ctx: MatrixContext, actor: Actor): unknown[] | Promise<unknown[]>;
  /** Optional check of the answer (e.g. where redirect() pointed): returns what is wrong, or null. */
  check?(answer: { status: number; redirect: string | null; text: string }, actor: Actor, ctx: MatrixContext): string | null;
}

export type MatrixEntry = RouteEntry | ActionEntry;

export function entryKey(entry: MatrixEntry): string {
  return entry.kind === 'route' ? `${entry.method} ${entry.route}` : `action ${entry.file}#${entry.name}`;
}

const everyone = (status: number): Expectation => ({ anonymous: status, viewer: status, designer: status, reviewer: status, otherAdmin: status, admin: status });
const signedIn = (anonymous: number, rest: Omit<Expectation, 'anonymous'>): Expectation => ({ anonymous, ...rest });

/** Fails when an answer lists a row of team A to the admin of team B. */
function noTeamARows(field: string, idOf: (ctx: MatrixContext) => string) {
  return (body: unknown, actor: Actor, ctx: MatrixContext): string | null => {
    if (actor !== 'otherAdmin') return null;
    const list = (body as Record<string, unknown> | null)?.[field];
    if (!Array.isArray(list)) return `expected a list in "${field}"`;
    return list.some((row) => (row as { id?: string }).id === idOf(ctx)) ? `team A's row ${idOf(ctx)} is listed to team B` : null;
  };
}

function formData(fields: Record<string, string>): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.set(name, value);
  return form;
}

const BOGUS_LINK_TOKEN = 'A'.repeat(43);

/** One draft schedule of team A per run (no file yet), created directly in the database. */
const scheduleOfTeamA = new Map<string, Promise<string>>();
function teamASchedule(ctx: MatrixContext): Promise<string> {
  let pending = scheduleOfTeamA.get(ctx.teamId);
  if (!pending) {
    pending = import('@/db/queries/schedules').then(async ({ createSchedule }) => (await createSchedule(ctx.teamId, ctx.users.designer.id, { projectId: ctx.projectId, name: ctx.unique('matrix schedule') })).id);
    scheduleOfTeamA.set(ctx.teamId, pending);
  }
  return pending;
}

/**
 * Team API tokens for the /api/v1 rows, made once per run. The API takes tokens, not sessions (the
 * signed-in actors' cookies ride along and open nothing), so there the actors stand for token holders:
 * anonymous → no token (401); viewer → team A's read-only token (403 on calculations); designer → team
 * A's calc-only token (403 on the read endpoint); reviewer → team A's revoked token (401); otherAdmin →
 * team B's own read+calc token (200: a calculation touches no team's rows); admin → no token, only the
 * admin's session cookie (401).
 */
const v1TokensOfRun = new Map<string, Promise<Partial<Record<Actor, string>>>>();
function v1Tokens(ctx: MatrixContext): Promise<Partial<Record<Actor, string>>> {
  let pending = v1TokensOfRun.get(ctx.teamId);
  if (!pending) {
    pending = Promise.all([import('@/server/apiTokens/manage'), import('@/db/queries/apiTokens')]).then(async ([{ createTeamApiToken }, { revokeApiToken }]) => {
      const make = (teamId: string, by: string, scopes: ('read' | 'calc')[]) => createTeamApiToken(teamId, by, { name: ctx.unique('matrix token'), scopes });
      const readOnly = await make(ctx.teamId, ctx.users.admin.id, ['read']);
      const calcOnly = await make(ctx.teamId, ctx.users.admin.id, ['calc']);
      const revoked = await make(ctx.teamId, ctx.users.admin.id, ['read', 'calc']);
      await revokeApiToken(ctx.teamId, ctx.users.admin.id, revoked.id);
      const teamB = await make(ctx.otherTeamId, ctx.users.otherAdmin.id, ['read', 'calc']);
      return { viewer: readOnly.token, designer: calcOnly.token, reviewer: revoked.token, otherAdmin: teamB.token };
    });
    v1TokensOfRun.set(ctx.teamId, pending);
  }
  return pending;
}
async function v1Request(ctx: MatrixContext, actor: Actor, path: string, body?: unknown): Promise<RouteRequest> {
  const token = (await v1Tokens(ctx))[actor];
  return { path, body, headers: token ? { authorization: `Bearer ${token}` } : undefined };
}

/** A fresh active API token of team A, to revoke. */
async function freshApiToken(ctx: MatrixContext): Promise<string> {
  const { createTeamApiToken } = await import('@/server/apiTokens/manage');
  return (await createTeamApiToken(ctx.teamId, ctx.users.admin.id, { name: ctx.unique('matrix revoke'), scopes: ['calc'] })).id;
}

/** A fresh read-only link to team A's matrix sheet (made by the designer), for the rows that revoke or open one. */
async function freshShare(ctx: MatrixContext): Promise<{ id: string; token: string }> {
  const { createShare } = await import('@/db/queries/shares');
  const share = await createShare(ctx.teamId, ctx.users.designer.id, ctx.sheetId, { expiresInDays: 1 });
  if (!share) throw new Error('the matrix sheet of team A was not found');
  return share;
}

export const ENDPOINT_MATRIX: MatrixEntry[] = [
  // ── sign-in machinery and public account pages ──────────────────────────────────────────────
  { kind: 'route', method: 'GET', route: '/api/auth/[...nextauth]', expect: everyone(200), request: () => ({ path: '/api/auth/session' }) },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/auth/[...nextauth]',
    // Without next-auth's CSRF token a sign-out is not carried out; next-auth answers with a redirect to its page.
    expect: everyone(302),
    request: () => ({ path: '/api/auth/signout', body: {} }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/auth/invitation',
    expect: everyone(404),
    request: (ctx) => ({ path: '/api/auth/invitation', body: { token: BOGUS_LINK_TOKEN, name: ctx.unique('name'), password: 'a long enough password' } }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/auth/reset-request',
    expect: everyone(202),
    request: (ctx) => ({ path: '/api/auth/reset-request', body: { email: `${ctx.unique('nobody')}@test.example` } }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/auth/reset',
    expect: everyone(404),
    request: () => ({ path: '/api/auth/reset', body: { token: BOGUS_LINK_TOKEN, password: 'a long enough password' } }),
  },
  { kind: 'route', method: 'GET', route: '/api/health', expect: everyone(200), request: () => ({ path: '/api/health' }) },

  // ── members (admins only) ──────────────────────────────────────────────────────────────────────
  {
    kind: 'route',
    method: 'GET',
    route: '/api/members',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/members' }),
    check: noTeamARows('members', (ctx) => ctx.users.admin.id),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/members/invitations',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 201, admin: 201 }),
    request: (ctx) => ({ path: '/api/members/invitations', body: { email: `${ctx.unique('invitee')}@test.example`, role: 'viewer' } }),
  },
  {
    kind: 'route',
    method: 'DELETE',
    route: '/api/members/invitations/[invitationId]',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 404, admin: 204 }),
    request: async (ctx) => ({ path: `/api/members/invitations/${(await ctx.freshInvitation()).id}` }),
  },
  {
    kind: 'route',
    method: 'PATCH',
    route: '/api/members/[userId]',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/members/${(await ctx.freshMember('viewer')).id}`, body: { role: 'designer' } }),
  },

  // ── projects and sheets ────────────────────────────────────────────────────────────────────────
  {
    kind: 'route',
    method: 'GET',
    route: '/api/projects',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/projects' }),
    check: noTeamARows('projects', (ctx) => ctx.projectId),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/projects',
    expect: signedIn(401, { viewer: 403, designer: 201, reviewer: 403, otherAdmin: 201, admin: 201 }),
    request: (ctx) => ({ path: '/api/projects', body: { name: ctx.unique('project') } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/projects/[projectId]',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: (ctx) => ({ path: `/api/projects/${ctx.projectId}` }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/projects/[projectId]/sheets',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: (ctx) => ({ path: `/api/projects/${ctx.projectId}/sheets` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/projects/[projectId]/sheets',
    expect: signedIn(401, { viewer: 403, designer: 201, reviewer: 403, otherAdmin: 404, admin: 201 }),
    request: (ctx) => ({ path: `/api/projects/${ctx.projectId}/sheets`, body: { circuitTag: ctx.unique('C').slice(0, 30), title: 'Matrix sheet', installation: 'cable-in-air' } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/sheets/[sheetId]',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}` }),
  },
  {
    kind: 'route',
    method: 'PUT',
    route: '/api/sheets/[sheetId]',
    expect: signedIn(401, { viewer: 403, designer: 200, reviewer: 403, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => {
      const sheet = await ctx.freshSheet();
      return { path: `/api/sheets/${sheet.id}`, body: { expectedVersion: sheet.version, title: 'Matrix sheet, saved', inputs: defaultSheetInputs('cable-in-air') } };
    },
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/sheets/[sheetId]/candidates',
    // The body is checked before the sheet is looked up: a malformed candidate is refused with 400 for every
    // role allowed to edit, and the role check comes first of all.
    expect: signedIn(401, { viewer: 403, designer: 400, reviewer: 403, otherAdmin: 400, admin: 400 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/candidates`, body: { expectedVersion: 1, candidate: { kind: 'not-a-kind' } } }),
  },
  {
    kind: 'route',
    method: 'PUT',
    route: '/api/sheets/[sheetId]/flags/[flagCode]/acknowledgement',
    // A draft sheet has nothing to acknowledge: reviewers and admins get 409 (wrong state), team B 404.
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 409, otherAdmin: 404, admin: 409 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/flags/ANY_FLAG/acknowledgement`, body: { comment: 'Matrix check comment' } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/sheets/[sheetId]/history',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/history` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/sheets/[sheetId]/revisions',
    // Only approved sheets start a revision: a draft answers 409 to those allowed to edit.
    expect: signedIn(401, { viewer: 403, designer: 409, reviewer: 403, otherAdmin: 404, admin: 409 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/revisions` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/sheets/[sheetId]/transitions',
    // The state machine decides per action: a draft cannot be withdrawn, so those whose role may submit get
    // past the role check to 409 (wrong state); the others 403; team B 404.
    expect: signedIn(401, { viewer: 403, designer: 409, reviewer: 403, otherAdmin: 404, admin: 409 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/transitions`, body: { action: 'withdraw' } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/sheets/review-queue',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 200, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/sheets/review-queue' }),
    check: noTeamARows('sheets', (ctx) => ctx.sheetId),
  },

  // ── sharing: read-only links, the PDF sizing sheet, e-mail, candidate exports (issue 8) ─────────
  {
    kind: 'route',
    method: 'GET',
    route: '/api/sheets/[sheetId]/shares',
    expect: signedIn(401, { viewer: 403, designer: 200, reviewer: 403, otherAdmin: 404, admin: 200 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/shares` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/sheets/[sheetId]/shares',
    expect: signedIn(401, { viewer: 403, designer: 201, reviewer: 403, otherAdmin: 404, admin: 201 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/shares`, body: { expiresInDays: 1 } }),
  },
  {
    kind: 'route',
    method: 'DELETE',
    route: '/api/sheets/[sheetId]/shares/[shareId]',
    expect: signedIn(401, { viewer: 403, designer: 200, reviewer: 403, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/shares/${(await freshShare(ctx)).id}` }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/sheets/[sheetId]/pdf',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/pdf` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/sheets/[sheetId]/email',
    expect: signedIn(401, { viewer: 403, designer: 201, reviewer: 403, otherAdmin: 404, admin: 201 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/email`, body: { to: `${ctx.unique('colleague')}@test.example`, message: 'Matrix check', attachPdf: false, expiresInDays: 1 } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/sheets/[sheetId]/candidates/export',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: (ctx) => ({ path: `/api/sheets/${ctx.sheetId}/candidates/export?format=csv` }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/share/[token]/pdf',
    // A link holder needs no session: a valid link opens for everyone, whoever else they are.
    expect: everyone(200),
    request: async (ctx) => ({ path: `/share/${(await freshShare(ctx)).token}/pdf` }),
  },

  // ── verification report (no team data; any signed-in member; CSV here, the PDF is checked in tests/e2e/verification.test.ts) ──
  {
    kind: 'route',
    method: 'GET',
    route: '/api/verification/report',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/verification/report?format=csv' }),
  },

  // ── calculation API v1: bearer team tokens only; a browser session opens none of it ───────────
  // The actors stand for token holders here (see v1Tokens): no token, team A's read-only token, team A's
  // calc-only token, team A's revoked token, team B's own token, and the admin's session cookie alone.
  {
    kind: 'route',
    method: 'POST',
    route: '/api/v1/evaluate',
    expect: { anonymous: 401, viewer: 403, designer: 200, reviewer: 401, otherAdmin: 200, admin: 401 },
    request: (ctx, actor) => v1Request(ctx, actor, '/api/v1/evaluate', EXAMPLE_EVALUATE_REQUEST),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/v1/ampacity',
    expect: { anonymous: 401, viewer: 403, designer: 200, reviewer: 401, otherAdmin: 200, admin: 401 },
    request: (ctx, actor) => v1Request(ctx, actor, '/api/v1/ampacity', EXAMPLE_AMPACITY_REQUEST),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/v1/flags',
    expect: { anonymous: 401, viewer: 200, designer: 403, reviewer: 401, otherAdmin: 200, admin: 401 },
    request: (ctx, actor) => v1Request(ctx, actor, '/api/v1/flags'),
  },
  { kind: 'route', method: 'GET', route: '/api/v1/openapi.json', expect: everyone(200), request: () => ({ path: '/api/v1/openapi.json' }) },

  // ── schedules ──────────────────────────────────────────────────────────────────────────────────
  {
    kind: 'route',
    method: 'POST',
    route: '/api/schedules',
    expect: signedIn(401, { viewer: 403, designer: 201, reviewer: 403, otherAdmin: 404, admin: 201 }),
    request: (ctx) => ({ path: '/api/schedules', body: { projectId: ctx.projectId, name: ctx.unique('schedule') } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/schedules/template',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/schedules/template?format=csv' }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/schedules/[scheduleId]',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/schedules/[scheduleId]/file',
    // A JSON body is not a file upload: 400 for those allowed to upload; team B 404 before the body is read.
    expect: signedIn(401, { viewer: 403, designer: 400, reviewer: 403, otherAdmin: 404, admin: 400 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/file`, body: { file: 'not a file' } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/schedules/[scheduleId]/file',
    // The schedule has no file yet.
    expect: signedIn(401, { viewer: 404, designer: 404, reviewer: 404, otherAdmin: 404, admin: 404 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/file` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/schedules/[scheduleId]/queue',
    // Nothing uploaded yet: 409 for those allowed to queue.
    expect: signedIn(401, { viewer: 403, designer: 409, reviewer: 403, otherAdmin: 404, admin: 409 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/queue`, body: { dropBadRows: false } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/schedules/[scheduleId]/progress',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/progress` }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/schedules/[scheduleId]/results',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/results` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/schedules/[scheduleId]/rows/[rowNumber]/sheet',
    // The draft schedule has no rows: 404 for those allowed to create sheets.
    expect: signedIn(401, { viewer: 403, designer: 404, reviewer: 403, otherAdmin: 404, admin: 404 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/rows/2/sheet` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/schedules/[scheduleId]/sheets',
    // "Make sizing sheets" for chosen rows: the draft schedule has no row 2, so 404 for those allowed to create sheets.
    expect: signedIn(401, { viewer: 403, designer: 404, reviewer: 403, otherAdmin: 404, admin: 404 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/sheets`, body: { rowNumbers: [2] } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/schedules/[scheduleId]/sheets/[batchId]',
    expect: signedIn(401, { viewer: 404, designer: 404, reviewer: 404, otherAdmin: 404, admin: 404 }),
    request: async (ctx) => ({ path: `/api/schedules/${await teamASchedule(ctx)}/sheets/00000000-0000-4000-8000-000000000000` }),
  },

  // ── catalogue (issue 5): everyone of the team reads; admins write ─────────────────────────────
  {
    kind: 'route',
    method: 'GET',
    route: '/api/catalogue/[kind]',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/catalogue/coverings' }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/catalogue/[kind]',
    // An admin of team B adds to team B's own catalogue: nothing of team A is touched.
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 201, admin: 201 }),
    request: (ctx) => ({
      path: '/api/catalogue/coverings',
      body: {
        row: {
          key: ctx.unique('matrix-added').toLowerCase().replace(/[^a-z0-9._-]+/g, '-'),
          name: 'Matrix covering, added',
          role: 'sheath',
          thermalResistivityKmPerW: '5.0',
          resistivitySource: 'Matrix test row',
          limitsSource: 'Matrix test row',
          emissivitySource: 'Matrix test row',
        },
      },
    }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/catalogue/[kind]/[id]/history',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/catalogue/coverings/${(await freshCatalogueCovering(ctx.teamId)).id}/history` }),
  },
  {
    kind: 'route',
    method: 'PATCH',
    route: '/api/catalogue/[kind]/[id]',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/catalogue/coverings/${(await freshCatalogueCovering(ctx.teamId)).id}`, body: { changes: { name: 'Matrix covering, renamed' } } }),
  },
  {
    kind: 'route',
    method: 'DELETE',
    route: '/api/catalogue/[kind]/[id]',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 404, admin: 204 }),
    request: async (ctx) => ({ path: `/api/catalogue/coverings/${(await freshCatalogueCovering(ctx.teamId)).id}` }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/catalogue/[kind]/template',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/catalogue/conductors/template?format=csv' }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/catalogue/[kind]/export',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/catalogue/materials/export?format=xlsx' }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/catalogue/imports',
    // The matrix sends JSON; an import is multipart, so those allowed get 400 (the role check comes first).
    // Real uploads are covered by tests/e2e/catalogue.test.ts.
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 400, admin: 400 }),
    request: () => ({ path: '/api/catalogue/imports', body: { kind: 'coverings' } }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/catalogue/imports',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/catalogue/imports' }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/catalogue/imports/[importId]/commit',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/catalogue/imports/${(await freshCatalogueImport(ctx.teamId, ctx.users.admin.id)).id}/commit` }),
  },
  {
    kind: 'route',
    method: 'GET',
    route: '/api/catalogue/imports/[importId]/file',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 404, admin: 200 }),
    request: async (ctx) => ({ path: `/api/catalogue/imports/${(await freshCatalogueImport(ctx.teamId, ctx.users.admin.id)).id}/file` }),
  },
  {
    kind: 'route',
    method: 'POST',
    route: '/api/catalogue/standard',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 200, admin: 200 }),
    request: () => ({ path: '/api/catalogue/standard' }),
  },

  // ── server actions ─────────────────────────────────────────────────────────────────────────────
  {
    kind: 'action',
    file: 'server/auth/preferenceActions.ts',
    name: 'setUnitSystemAction',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    args: () => ['si'],
  },
  {
    kind: 'action',
    file: 'server/auth/profileActions.ts',
    name: 'saveProfessionalProfileAction',
    // Every signed-in person edits their own licence and jurisdiction (issue 22), nobody else's.
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    args: () => [{ licenceNumber: 'PE-0001 (test)', licenceJurisdiction: 'Invented Province (test)' }],
  },
  {
    kind: 'action',
    file: 'server/auth/preferenceActions.ts',
    name: 'saveCandidateGridColumnsAction',
    // Each user's own row (the session's): team B's admin stores team B's admin's choice, nothing of team A.
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    args: () => [{ mass: false }],
    check: ({ status, text }) => (status === 200 && !text.includes('"ok":true') ? `the choice was not stored: ${text.slice(0, 200)}` : null),
  },
  {
    kind: 'action',
    file: 'server/auth/preferenceActions.ts',
    name: 'setDecimalSeparatorAction',
    // Every signed-in person sets their own separator (users.decimal_separator); 'browser' clears it.
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    args: () => ['browser'],
  },
  {
    kind: 'action',
    file: 'app/(workspace)/admin/members/currencyAction.ts',
    name: 'setTeamCurrencyAction',
    // Admins set their own team's currency (the session's team); the others are refused.
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 200, admin: 200 }),
    args: () => ['EUR'],
  },
  {
    kind: 'action',
    file: 'app/(workspace)/projects/actions.ts',
    name: 'createProjectAction',
    // Success ends in redirect() to the new project, which a fetch-style action call answers with 200 and an
    // x-action-redirect header (303 is for a form posted without JavaScript).
    expect: signedIn(401, { viewer: 403, designer: 200, reviewer: 403, otherAdmin: 200, admin: 200 }),
    args: (ctx) => [{}, formData({ name: ctx.unique('action project'), site: '', description: '' })],
  },
  {
    kind: 'action',
    file: 'app/(workspace)/projects/actions.ts',
    name: 'createSheetAction',
    // Team B names team A's project: the action answers its form state "No such project." (200) and creates
    // nothing; the e2e test checks that no redirect to a new sheet came back.
    expect: signedIn(401, { viewer: 403, designer: 200, reviewer: 403, otherAdmin: 200, admin: 200 }),
    args: (ctx) => [{}, formData({ projectId: ctx.projectId, circuitTag: ctx.unique('A').slice(0, 30), title: 'Action sheet', installation: 'cable-in-air' })],
    check: ({ status, redirect }, actor) => {
      if (status !== 200) return null;
      if (actor === 'otherAdmin') return redirect ? `team B was sent on to ${redirect}` : null;
      return redirect?.includes('/sheets/') ? null : `expected a redirect to the new sheet, got ${redirect}`;
    },
  },
  {
    kind: 'action',
    file: 'app/(workspace)/admin/tokens/actions.ts',
    name: 'createApiTokenAction',
    // Team B's admin makes a token of team B (the session's team), never one of team A.
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 200, admin: 200 }),
    args: (ctx) => [{}, formData({ name: ctx.unique('action token'), scopes: 'calc', requestsPerMinute: '60', expiresInDays: '' })],
    check: ({ status, text }) => (status === 200 && !/awt_[A-Za-z0-9_-]{43}/.test(text) ? 'the new token was not shown once' : null),
  },
  {
    kind: 'action',
    file: 'app/(workspace)/admin/tokens/actions.ts',
    name: 'revokeApiTokenAction',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 404, admin: 200 }),
    args: async (ctx) => [{}, formData({ tokenId: await freshApiToken(ctx) })],
  },
  {
    kind: 'action',
    file: 'app/(workspace)/admin/members/teamSettingsActions.ts',
    name: 'setMinParallelSectionAction',
    // The team's own setting (the session's team): team B's admin clears team B's, never team A's.
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 200, admin: 200 }),
    args: () => [{}, formData({ minParallelSectionMm2: '' })],
    check: ({ status, text }) => (status === 200 && !text.includes('default again') ? `the setting was not cleared: ${text.slice(0, 200)}` : null),
  },
  // Notifications (issue 23): each member reads and marks only their own; another team's id changes nothing.
  {
    kind: 'action',
    file: 'app/(workspace)/notifications/actions.ts',
    name: 'markReadAction',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    args: () => [formData({ id: '00000000-0000-4000-8000-000000000000' })],
  },
  {
    kind: 'action',
    file: 'app/(workspace)/notifications/actions.ts',
    name: 'markAllReadAction',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    args: () => [],
  },
  {
    kind: 'action',
    file: 'app/(workspace)/notifications/actions.ts',
    name: 'saveSettingsAction',
    expect: signedIn(401, { viewer: 200, designer: 200, reviewer: 200, otherAdmin: 200, admin: 200 }),
    args: () => [{}, formData({ 'sheet_submitted.email': 'on', 'sheet_submitted.inApp': 'on', 'sheet_returned.email': 'on', 'sheet_returned.inApp': 'on', 'sheet_approved.email': 'on', 'sheet_approved.inApp': 'on' })],
  },
  // Documents (issue 23): the kind's write right, restore for admins; team B finds nothing of team A (form state, 200).
  {
    kind: 'action',
    file: 'app/(workspace)/documents/actions.ts',
    name: 'documentAction',
    expect: signedIn(401, { viewer: 403, designer: 200, reviewer: 403, otherAdmin: 200, admin: 200 }),
    args: async (ctx) => [{}, formData({ op: 'rename', kind: 'sheet', id: (await ctx.freshSheet()).id, name: ctx.unique('renamed') })],
    check: ({ status, text }, actor) => {
      if (status !== 200) return null;
      if (actor === 'otherAdmin') return /Renamed to/.test(text) ? 'team B renamed a sheet of team A' : null;
      return /Renamed to/.test(text) ? null : 'the sheet was not renamed';
    },
  },
  {
    kind: 'action',
    file: 'app/(workspace)/documents/actions.ts',
    name: 'restoreFormAction',
    expect: signedIn(401, { viewer: 403, designer: 403, reviewer: 403, otherAdmin: 200, admin: 200 }),
    args: async (ctx) => {
      const { deleteDocument } = await import('@/db/queries/documents');
      const sheet = await ctx.freshSheet();
      await deleteDocument(ctx.teamId, { userId: ctx.users.designer.id, role: 'designer' }, 'sheet', sheet.id);
      return [formData({ kind: 'sheet', id: sheet.id })];
    },
  },
];

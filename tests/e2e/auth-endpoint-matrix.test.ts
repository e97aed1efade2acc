// The role × endpoint matrix against the production build (issue 6): every route handler method
// and every server action, called as anonymous, viewer, designer, reviewer, admin of team A and
// as the admin of team B, each signed in through next-auth's credentials callback.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/db/client';
import { invitations } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { createSheet } from '@/db/queries/sheets';
import { defaultSheetInputs } from '@/lib/sheet';
import { can } from '@/lib/auth/permissions';
import { hashLinkToken, newLinkToken } from '@/lib/auth/linkTokens';
import { createTestTeam, createTestUser, TEST_PASSWORD } from '../helpers/fixtures';
import { ACTORS, ENDPOINT_MATRIX, entryKey, type Actor, type MatrixContext, type SignedInActor } from '../integration/security/endpoint-matrix';
import { callAction, httpClient, readActionManifest, signInOverHttp, type HttpClient } from './auth-http';

let ctx: MatrixContext;
const clients = new Map<Actor, HttpClient>();

beforeAll(async () => {
  const team = await createTestTeam('matrix-a');
  const otherTeam = await createTestTeam('matrix-b');
  const users = {
    viewer: await createTestUser(team.id, 'viewer'),
    designer: await createTestUser(team.id, 'designer'),
    reviewer: await createTestUser(team.id, 'reviewer'),
    admin: await createTestUser(team.id, 'admin'),
    otherAdmin: await createTestUser(otherTeam.id, 'admin'),
  } satisfies Record<SignedInActor, unknown>;
  const designerActor = { userId: users.designer.id, can: (p: Parameters<typeof can>[1]) => can('designer', p) };
  const project = await createProject(team.id, users.admin.id, { name: `Matrix project ${randomUUID().slice(0, 8)}` });
  const freshSheet = async () => {
    const sheet = await createSheet(team.id, designerActor, {
      projectId: project.id,
      circuitTag: `M-${randomUUID().slice(0, 8)}`,
      title: 'Matrix sheet',
      inputs: defaultSheetInputs('cable-in-air'),
    });
    return { id: sheet.id, version: sheet.version };
  };
  ctx = {
    teamId: team.id,
    otherTeamId: otherTeam.id,
    users: Object.fromEntries(Object.entries(users).map(([actor, u]) => [actor, { id: u.id, email: u.email }])) as MatrixContext['users'],
    projectId: project.id,
    sheetId: (await freshSheet()).id,
    freshSheet,
    freshMember: async (role) => ({ id: (await createTestUser(team.id, role)).id }),
    freshInvitation: async () => {
      const [row] = await getDb()
        .insert(invitations)
        .values({ teamId: team.id, email: `invited-${randomUUID().slice(0, 8)}@test.example`, role: 'viewer', tokenHash: hashLinkToken(newLinkToken()), expiresAt: new Date(Date.now() + 3_600_000) })
        .returning({ id: invitations.id });
      return row;
    },
    unique: (label) => `${label}-${randomUUID().slice(0, 8)}`,
  };
  clients.set('anonymous', httpClient());
  for (const [actor, user] of Object.entries(users)) {
    const answer = await signInOverHttp(user.email, TEST_PASSWORD);
    if (!answer.signedIn) throw new Error(`${actor} could not sign in: ${answer.error}`);
    clients.set(actor as Actor, answer.client);
  }
});

afterAll(() => closeDb());

describe('role × endpoint matrix over HTTP', () => {
  const actions = readActionManifest();

  it('the build has exactly the server actions the matrix lists', () => {
    const built = actions.map((a) => `action ${a.filename}#${a.exportedName}`).sort();
    const listed = ENDPOINT_MATRIX.filter((e) => e.kind === 'action').map(entryKey).sort();
    expect(built).toEqual(listed);
  });

  it.each(ENDPOINT_MATRIX.map((entry) => [entryKey(entry), entry] as const))('%s', async (_key, entry) => {
    const got: Partial<Record<Actor, number>> = {};
    const problems: string[] = [];
    for (const actor of ACTORS) {
      const client = clients.get(actor)!;
      let response: Response;
      if (entry.kind === 'route') {
        const request = await entry.request(ctx, actor);
        response = await client.request(request.path, { method: entry.method, body: request.body, headers: request.headers });
      } else {
        const action = actions.find((a) => a.filename === entry.file && a.exportedName === entry.name);
        if (!action) throw new Error(`the build has no action ${entry.file}#${entry.name}`);
        response = await callAction(client, action, await entry.args(ctx, actor));
      }
      got[actor] = response.status;
      const text = await response.text();
      if (entry.kind === 'route' && entry.check && response.ok) {
        const problem = entry.check(JSON.parse(text), actor, ctx);
        if (problem) problems.push(`${actor}: ${problem}`);
      }
      if (entry.kind === 'action' && entry.check) {
        const problem = entry.check({ status: response.status, redirect: response.headers.get('x-action-redirect'), text }, actor, ctx);
        if (problem) problems.push(`${actor}: ${problem}`);
      }
      // Answers to another team's ids say nothing about the row.
      if (actor === 'otherAdmin' && response.status === 404) {
        for (const id of [ctx.projectId, ctx.sheetId]) if (text.includes(id)) problems.push(`otherAdmin: 404 answer mentions ${id}`);
      }
    }
    expect({ statuses: got, problems }).toEqual({ statuses: entry.expect, problems: [] });
  });
});

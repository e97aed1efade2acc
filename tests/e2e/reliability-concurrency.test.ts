// Issue 11, concurrent edits: many saves of one sizing sheet at the same moment against the
// production build. Exactly one save per version wins, the rest get 409 with what changed; writers
// that re-read and retry on 409 lose nothing (every one of their edits is in the final sheet).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { sheets } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { createSheet } from '@/db/queries/sheets';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { can } from '@/lib/auth/permissions';
import { appUrl } from '../helpers/browser';
import { createTestTeam, createTestUser } from '../helpers/fixtures';
import { sessionCookie } from './reliability-helpers';

let cookie: string;
let sheetId: string;

beforeAll(async () => {
  const team = await createTestTeam('concurrency');
  const designer = await createTestUser(team.id, 'designer');
  cookie = await sessionCookie({ id: designer.id, teamId: team.id, role: 'designer', email: designer.email, name: designer.name });
  const project = await createProject(team.id, designer.id, { name: `Concurrency ${randomUUID().slice(0, 8)}` });
  const actor = { userId: designer.id, can: (p: Parameters<typeof can>[1]) => can('designer', p) };
  const sheet = await createSheet(team.id, actor, { projectId: project.id, circuitTag: 'CC-1', title: 'Concurrent saves', inputs: defaultSheetInputs('cable-in-air') });
  sheetId = sheet.id;
});
afterAll(() => closeDb());

async function readSheet(): Promise<{ version: number; inputs: SheetInputs }> {
  const response = await fetch(appUrl(`/api/sheets/${sheetId}`), { headers: { cookie } });
  expect(response.status).toBe(200);
  return ((await response.json()) as { sheet: { version: number; inputs: SheetInputs } }).sheet;
}

async function save(expectedVersion: number, inputs: SheetInputs): Promise<{ status: number; body: Record<string, unknown> }> {
  const response = await fetch(appUrl(`/api/sheets/${sheetId}`), {
    method: 'PUT',
    headers: { cookie, 'content-type': 'application/json', origin: new URL(appUrl()).origin },
    body: JSON.stringify({ expectedVersion, inputs }),
  });
  return { status: response.status, body: (await response.json()) as Record<string, unknown> };
}

describe('many parallel saves of one sheet', () => {
  it('20 saves from the same version: exactly one wins, 19 get 409 version_conflict, the winner is what is stored', async () => {
    const start = await readSheet();
    const attempts = await Promise.all(
      Array.from({ length: 20 }, (_, i) => save(start.version, { ...start.inputs, notes: `parallel writer ${i}` }).then((answer) => ({ i, ...answer }))),
    );
    const won = attempts.filter((a) => a.status === 200);
    const refused = attempts.filter((a) => a.status === 409);
    console.log(`parallel saves: ${won.length} saved, ${refused.length} refused with 409, others ${attempts.length - won.length - refused.length}`);
    expect(won).toHaveLength(1);
    expect(refused).toHaveLength(19);
    for (const answer of refused) {
      const error = answer.body.error as { code: string; currentVersion?: number; message: string };
      expect(error.code).toBe('version_conflict');
      expect(error.message).toMatch(/not saved/);
    }
    const [row] = await getDb().select({ version: sheets.version, inputs: sheets.inputs }).from(sheets).where(eq(sheets.id, sheetId));
    expect(row.version).toBe(start.version + 1);
    expect((row.inputs as SheetInputs).notes).toBe(`parallel writer ${won[0].i}`);
  });

  it('10 writers that re-read and retry on 409: no lost update — every edit is in the final sheet', async () => {
    const start = await readSheet();
    let conflicts = 0;
    const writers = Array.from({ length: 10 }, async (_, i) => {
      for (let attempt = 0; attempt < 60; attempt += 1) {
        const current = await readSheet();
        const notes = `${current.inputs.notes}[edit ${i}]`;
        const answer = await save(current.version, { ...current.inputs, notes });
        if (answer.status === 200) return attempt;
        expect(answer.status).toBe(409);
        conflicts += 1;
      }
      throw new Error(`writer ${i} never got its save in`);
    });
    await Promise.all(writers);
    const end = await readSheet();
    console.log(`retrying writers: 10 edits saved after ${conflicts} conflicts (409)`);
    expect(end.version).toBe(start.version + 10);
    for (let i = 0; i < 10; i += 1) expect(end.inputs.notes).toContain(`[edit ${i}]`);
    expect(end.inputs.notes.match(/\[edit \d+\]/g)).toHaveLength(10);
  });
});

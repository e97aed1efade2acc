// Issue 19 against the real PostgreSQL server: (item 3) who edited and who submitted each revision
// is recorded, and nobody approves a revision they edited or submitted — not even an admin; (Low)
// a save that loses the race is answered with the row as it is after the winning save.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { Client } from 'pg';
import { closeDb, getDb } from '@/db/client';
import { sheetContributions } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { acknowledgeFlag, createSheet, getSheet, listReviewQueue, saveSheet, SheetOperationError, transitionSheet } from '@/db/queries/sheets';
import { defaultSheetInputs, type Actor, type SheetInputs } from '@/lib/sheet';
import { can, type Role } from '@/lib/auth/permissions';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCable240 } from '../../helpers/sheetCandidates';

afterAll(() => closeDb());

const actor = (user: { id: string; role: Role }): Actor => ({ userId: user.id, can: (p) => can(user.role, p) });

async function refusal(promise: Promise<unknown>): Promise<SheetOperationError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  if (!(error instanceof SheetOperationError)) throw new Error(`expected a refusal, got ${String(error)}`);
  return error;
}

function inputs(): SheetInputs {
  const base = defaultSheetInputs('cable-in-air');
  return { ...base, candidates: [testCable240], chosenCandidateId: testCable240.id };
}

let teamId: string;
let projectId: string;
const people = {} as Record<'designer' | 'admin' | 'reviewer', { id: string; role: Role }>;

beforeAll(async () => {
  teamId = (await createTestTeam('independence')).id;
  people.designer = await createTestUser(teamId, 'designer');
  people.admin = await createTestUser(teamId, 'admin');
  people.reviewer = await createTestUser(teamId, 'reviewer');
  projectId = (await createProject(teamId, people.designer.id, { name: `Independence ${Date.now()}` })).id;
});

async function newSheet(by = people.designer) {
  return (await createSheet(teamId, actor(by), { projectId, circuitTag: `I-${Math.random().toString(36).slice(2, 7)}`, title: 'Feeder', inputs: inputs() })).id;
}

async function acknowledgeAll(sheetId: string, by: { id: string; role: Role }) {
  const sheet = (await getSheet(teamId, sheetId))!;
  for (const flag of sheet.result!.chosenFlags.filter((f) => f.severity === 'review')) {
    await acknowledgeFlag(teamId, actor(by), sheetId, flag.code, 'Accepted: checked against the site survey.');
  }
}

describe('revision authorship', () => {
  it('an admin who rewrote a designer’s sheet may not acknowledge its flags or approve it; a reviewer who took no part may', async () => {
    const id = await newSheet();
    const created = (await getSheet(teamId, id))!;
    expect(created.editorIds).toEqual([people.designer.id]);
    // The admin replaces the inputs (another ambient) while the sheet is a draft …
    await saveSheet(teamId, actor(people.admin), id, { expectedVersion: created.version, inputs: { ...created.inputs, environment: { ...created.inputs.environment, ambientC: 35 } } });
    // … the designer submits it …
    await transitionSheet(teamId, actor(people.designer), id, 'submit');
    const submitted = (await getSheet(teamId, id))!;
    expect(new Set(submitted.editorIds)).toEqual(new Set([people.designer.id, people.admin.id]));
    expect(submitted.submitterIds).toEqual([people.designer.id]);
    // … and the admin, holding every right, may not sign it off.
    const reviewFlag = submitted.result!.chosenFlags.find((f) => f.severity === 'review');
    if (reviewFlag) expect(await refusal(acknowledgeFlag(teamId, actor(people.admin), id, reviewFlag.code, 'mine'))).toMatchObject({ status: 403, code: 'own_sheet' });
    await acknowledgeAll(id, people.reviewer);
    expect(await refusal(transitionSheet(teamId, actor(people.admin), id, 'approve'))).toMatchObject({ status: 403, code: 'own_sheet' });
    expect((await listReviewQueue(teamId, people.admin.id)).map((s) => s.id)).not.toContain(id);
    expect((await listReviewQueue(teamId, people.reviewer.id)).map((s) => s.id)).toContain(id);
    await transitionSheet(teamId, actor(people.reviewer), id, 'approve');
    expect((await getSheet(teamId, id))!.status).toBe('approved');
  });

  it('whoever submitted a revision may not approve it', async () => {
    const id = await newSheet();
    await transitionSheet(teamId, actor(people.admin), id, 'submit');
    await acknowledgeAll(id, people.reviewer);
    expect(await refusal(transitionSheet(teamId, actor(people.admin), id, 'approve'))).toMatchObject({ status: 403, code: 'own_sheet' });
    await transitionSheet(teamId, actor(people.reviewer), id, 'approve');
  });

  it('the migration fills in the record of earlier sheets from the author and the audit log', async () => {
    const id = await newSheet();
    const sheet = (await getSheet(teamId, id))!;
    await saveSheet(teamId, actor(people.admin), id, { expectedVersion: sheet.version, inputs: sheet.inputs });
    await transitionSheet(teamId, actor(people.designer), id, 'submit');
    await getDb().delete(sheetContributions).where(eq(sheetContributions.sheetId, id));
    // The backfill statements of the migration, as written there.
    const migration = fs.readFileSync(path.resolve('drizzle/0007_session-revocation-and-sheet-contributions.sql'), 'utf8');
    const backfill = migration.slice(migration.indexOf('-- Backfill')).split('--> statement-breakpoint').map((s) => s.trim()).filter(Boolean);
    expect(backfill.length).toBe(2);
    for (const statement of backfill) await getDb().execute(sql.raw(statement));
    const after = (await getSheet(teamId, id))!;
    expect(new Set(after.editorIds)).toEqual(new Set([people.designer.id, people.admin.id]));
    expect(after.submitterIds).toEqual([people.designer.id]);
  });
});

describe('a save that loses the race', () => {
  it('is answered 409 with the row as the winning save left it, not as this save first read it', async () => {
    const id = await newSheet();
    const start = (await getSheet(teamId, id))!;
    // The winning save, by hand in a transaction of its own: row locked, not yet committed.
    const winner = new Client({ connectionString: process.env.DATABASE_URL });
    await winner.connect();
    try {
      await winner.query('begin');
      await winner.query(`update sheets set title = 'Their title', version = version + 1 where id = $1`, [id]);
      // This save reads version N (the winner has not committed), then waits on the row lock in its guarded UPDATE …
      const losing = saveSheet(teamId, actor(people.designer), id, { expectedVersion: start.version, inputs: start.inputs, title: 'My title' }).then(
        () => null,
        (e: unknown) => e,
      );
      // Watched from outside the winner's transaction (pg_stat_activity is a snapshot per transaction).
      let waited = false;
      for (let i = 0; i < 400 && !waited; i += 1) {
        const rows = await getDb().execute(sql`select 1 from pg_stat_activity where wait_event_type = 'Lock' and query ilike 'update "sheets"%' and datname = current_database()`);
        waited = rows.rows.length > 0;
        if (!waited) await new Promise((resolve) => setTimeout(resolve, 25));
      }
      expect(waited).toBe(true);
      // … then the winner commits, and the guarded UPDATE finds the version moved on.
      await winner.query('commit');
      const error = await losing;
      expect(error).toBeInstanceOf(SheetOperationError);
      const conflict = error as SheetOperationError;
      expect(conflict.status).toBe(409);
      expect(conflict.detail).toMatchObject({ currentVersion: start.version + 1, current: { title: 'Their title' } });
    } finally {
      await winner.end();
    }
  });
});

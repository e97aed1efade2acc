// The sizing sheet's review workflow against the real PostgreSQL server (no mocks): every allowed
// and refused transition by role, the optimistic lock under concurrent saves, frozen approved
// sheets, and team isolation. Rules: ../shared/design/product.md (People and roles; review rules).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { auditLog, sheets } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import {
  acknowledgeFlag,
  createSheet,
  getSheet,
  listReviewQueue,
  listSheetsForProject,
  reviseSheet,
  saveSheet,
  sheetHistory,
  SheetOperationError,
  transitionSheet,
} from '@/db/queries/sheets';
import { demoSingleCore } from '@/db/seed/sheets';
import { defaultSheetInputs, SHEET_SCHEMA_VERSION, type Actor, type SheetInputs } from '@/lib/sheet';
import { can, type Role } from '@/lib/auth/permissions';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';

afterAll(() => closeDb());

const actor = (user: { id: string; role: Role }): Actor => ({ userId: user.id, can: (p) => can(user.role, p) });

async function refusal(promise: Promise<unknown>): Promise<{ status: number; code: string }> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof SheetOperationError) return { status: error.status, code: error.code };
    throw error;
  }
  throw new Error('expected the operation to be refused, but it succeeded');
}

const cable240 = demoSingleCore({
  id: 'cu-xlpe-240',
  material: 'copper',
  sectionMm2: 240,
  r20OhmPerKm: 0.0754,
  conductorDiameterMm: 18.0,
  insulation: 'XLPE',
  insulationMm: 1.7,
  sheathMm: 1.9,
  parallel: 1,
  pricePerM: '25.00',
});
const cable50 = demoSingleCore({
  id: 'cu-pvc-50',
  material: 'copper',
  sectionMm2: 50,
  r20OhmPerKm: 0.387,
  conductorDiameterMm: 8.2,
  insulation: 'PVC',
  insulationMm: 1.4,
  sheathMm: 1.6,
  parallel: 1,
  pricePerM: '9.80',
});

/** 400 A on 240 mm² copper XLPE in air: within its limit, with review flags (ambient assumed, data from memory...). */
function passingInputs(): SheetInputs {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.candidates = [cable240, cable50];
  inputs.chosenCandidateId = cable240.id;
  return inputs;
}

/** The same circuit with 50 mm² PVC chosen: 400 A is far above what it carries, so OVER_LIMIT (a blocker) stands. */
function blockedInputs(): SheetInputs {
  return { ...passingInputs(), chosenCandidateId: cable50.id };
}

let team: Awaited<ReturnType<typeof createTestTeam>>;
let otherTeam: Awaited<ReturnType<typeof createTestTeam>>;
let projectId: string;
const people = {} as Record<'author' | 'designer2' | 'reviewer' | 'reviewer2' | 'admin' | 'viewer' | 'otherAdmin', { id: string; role: Role }>;

beforeAll(async () => {
  team = await createTestTeam('sheets');
  otherTeam = await createTestTeam('sheets-other');
  people.author = await createTestUser(team.id, 'designer');
  people.designer2 = await createTestUser(team.id, 'designer');
  people.reviewer = await createTestUser(team.id, 'reviewer');
  people.reviewer2 = await createTestUser(team.id, 'reviewer');
  people.admin = await createTestUser(team.id, 'admin');
  people.viewer = await createTestUser(team.id, 'viewer');
  people.otherAdmin = await createTestUser(otherTeam.id, 'admin');
  projectId = (await createProject(team.id, people.author.id, { name: 'Workflow test project' })).id;
});

async function newSheet(inputs: SheetInputs = passingInputs(), author = people.author) {
  const created = await createSheet(team.id, actor(author), { projectId, circuitTag: `T-${Math.random().toString(36).slice(2, 7)}`, title: 'Test feeder', inputs });
  return created.id;
}

async function acknowledgeAll(sheetId: string, by = people.reviewer) {
  const sheet = await getSheet(team.id, sheetId);
  const reviewCodes = sheet!.result!.chosenFlags.filter((f) => f.severity === 'review').map((f) => f.code);
  for (const code of reviewCodes) await acknowledgeFlag(team.id, actor(by), sheetId, code, 'Accepted: checked against the site survey.');
  return reviewCodes;
}

describe('creating and editing', () => {
  it('designers and admins create sheets; reviewers and viewers may not', async () => {
    expect(await newSheet(passingInputs(), people.author)).toMatch(/-/);
    expect(await newSheet(passingInputs(), people.admin)).toMatch(/-/);
    for (const who of [people.reviewer, people.viewer]) {
      expect(await refusal(createSheet(team.id, actor(who), { projectId, circuitTag: 'X', title: 'X', inputs: passingInputs() }))).toEqual({ status: 403, code: 'forbidden' });
    }
  });

  it('stores the server’s own result snapshot with the solver version on save', async () => {
    const id = await newSheet();
    const before = (await getSheet(team.id, id))!;
    const inputs = { ...before.inputs, circuit: { ...before.inputs.circuit, designCurrentA: 500 } };
    const saved = await saveSheet(team.id, actor(people.author), id, { expectedVersion: before.version, inputs });
    const after = (await getSheet(team.id, id))!;
    expect(after.version).toBe(before.version + 1);
    expect(saved.version).toBe(after.version);
    expect(after.result?.designCurrentA).toBe(500);
    expect(after.result?.solverVersion).toBe(after.solverVersion);
    // More current in the same conductor cannot make it cooler (I²R grows with current).
    const hot = (s: typeof after) => s.result!.evaluations.find((e) => e.id === cable240.id)!;
    const [h0, h1] = [hot(before), hot(after)];
    expect(h0.ok && h1.ok && h1.hotSpotC! > h0.hotSpotC!).toBe(true);
  });

  it('reviewers and viewers may not save a sheet; another designer of the team may', async () => {
    const id = await newSheet();
    const sheet = (await getSheet(team.id, id))!;
    for (const who of [people.reviewer, people.viewer]) {
      expect(await refusal(saveSheet(team.id, actor(who), id, { expectedVersion: sheet.version, inputs: sheet.inputs }))).toEqual({ status: 403, code: 'forbidden' });
    }
    await saveSheet(team.id, actor(people.designer2), id, { expectedVersion: sheet.version, inputs: sheet.inputs });
  });
});

describe('the optimistic lock', () => {
  it('two concurrent saves from the same version: exactly one wins, the other gets 409 and nothing is lost', async () => {
    const id = await newSheet();
    const start = (await getSheet(team.id, id))!;
    const mine = { ...start.inputs, circuit: { ...start.inputs.circuit, designCurrentA: 410 } };
    const theirs = { ...start.inputs, circuit: { ...start.inputs.circuit, lengthM: 77 } };
    const results = await Promise.allSettled([
      saveSheet(team.id, actor(people.author), id, { expectedVersion: start.version, inputs: mine }),
      saveSheet(team.id, actor(people.designer2), id, { expectedVersion: start.version, inputs: theirs }),
    ]);
    const fulfilled = results.filter((r) => r.status === 'fulfilled');
    const rejected = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
    expect(fulfilled).toHaveLength(1);
    expect(rejected).toHaveLength(1);
    const error = rejected[0].reason as SheetOperationError;
    expect(error).toBeInstanceOf(SheetOperationError);
    expect([error.status, error.code]).toEqual([409, 'version_conflict']);
    // The loser is told what the winner changed.
    expect(error.detail?.changedSections).toEqual(['circuit']);
    const end = (await getSheet(team.id, id))!;
    expect(end.version).toBe(start.version + 1);
    const winnerIsMine = results[0].status === 'fulfilled';
    expect(end.inputs.circuit).toEqual(winnerIsMine ? mine.circuit : theirs.circuit);
    // Exactly one save was recorded.
    const saves = await getDb().select().from(auditLog).where(and(eq(auditLog.entityId, id), eq(auditLog.action, 'sheet.save')));
    expect(saves).toHaveLength(1);
  });

  it('a save naming an older version is refused after a later save', async () => {
    const id = await newSheet();
    const start = (await getSheet(team.id, id))!;
    await saveSheet(team.id, actor(people.author), id, { expectedVersion: start.version, inputs: start.inputs });
    expect(await refusal(saveSheet(team.id, actor(people.author), id, { expectedVersion: start.version, inputs: start.inputs }))).toEqual({ status: 409, code: 'version_conflict' });
  });
});

describe('review transitions by role', () => {
  it('submit: the author (designer) and admins may; reviewers and viewers may not; only from draft or returned', async () => {
    const id = await newSheet();
    for (const who of [people.reviewer, people.viewer]) {
      expect(await refusal(transitionSheet(team.id, actor(who), id, 'submit'))).toEqual({ status: 403, code: 'forbidden' });
    }
    await transitionSheet(team.id, actor(people.author), id, 'submit');
    expect((await getSheet(team.id, id))!.status).toBe('in_review');
    expect(await refusal(transitionSheet(team.id, actor(people.author), id, 'submit'))).toEqual({ status: 409, code: 'wrong_state' });
    const byAdmin = await newSheet();
    await transitionSheet(team.id, actor(people.admin), byAdmin, 'submit');
  });

  it('a sheet without a chosen candidate cannot be submitted', async () => {
    const id = await newSheet({ ...passingInputs(), chosenCandidateId: null });
    expect(await refusal(transitionSheet(team.id, actor(people.author), id, 'submit'))).toEqual({ status: 409, code: 'not_ready' });
  });

  it('in review the sheet cannot be edited; only the author withdraws it', async () => {
    const id = await newSheet();
    await transitionSheet(team.id, actor(people.author), id, 'submit');
    const sheet = (await getSheet(team.id, id))!;
    expect(await refusal(saveSheet(team.id, actor(people.author), id, { expectedVersion: sheet.version, inputs: sheet.inputs }))).toEqual({ status: 409, code: 'wrong_state' });
    expect(await refusal(transitionSheet(team.id, actor(people.designer2), id, 'withdraw'))).toEqual({ status: 403, code: 'forbidden' });
    expect(await refusal(transitionSheet(team.id, actor(people.reviewer), id, 'withdraw'))).toEqual({ status: 403, code: 'forbidden' });
    await transitionSheet(team.id, actor(people.author), id, 'withdraw');
    expect((await getSheet(team.id, id))!.status).toBe('draft');
    expect(await refusal(transitionSheet(team.id, actor(people.author), id, 'withdraw'))).toEqual({ status: 409, code: 'wrong_state' });
  });

  it('approve and return are refused to designers and viewers, and outside review', async () => {
    const draft = await newSheet();
    expect(await refusal(transitionSheet(team.id, actor(people.reviewer), draft, 'approve'))).toEqual({ status: 409, code: 'wrong_state' });
    expect(await refusal(transitionSheet(team.id, actor(people.reviewer), draft, 'return', { comment: 'x' }))).toEqual({ status: 409, code: 'wrong_state' });
    await transitionSheet(team.id, actor(people.author), draft, 'submit');
    for (const who of [people.author, people.designer2, people.viewer]) {
      expect(await refusal(transitionSheet(team.id, actor(who), draft, 'approve'))).toEqual({ status: 403, code: 'forbidden' });
      expect(await refusal(transitionSheet(team.id, actor(who), draft, 'return', { comment: 'x' }))).toEqual({ status: 403, code: 'forbidden' });
      expect(await refusal(acknowledgeFlag(team.id, actor(who), draft, 'DATA_FROM_MEMORY', 'ok'))).toEqual({ status: 403, code: 'forbidden' });
    }
  });

  it('the author may not approve, return or acknowledge their own sheet, even holding the reviewer right (admin)', async () => {
    const id = await newSheet(passingInputs(), people.admin);
    await transitionSheet(team.id, actor(people.admin), id, 'submit');
    expect(await refusal(acknowledgeFlag(team.id, actor(people.admin), id, 'DATA_FROM_MEMORY', 'mine'))).toEqual({ status: 403, code: 'own_sheet' });
    expect(await refusal(transitionSheet(team.id, actor(people.admin), id, 'approve'))).toEqual({ status: 403, code: 'own_sheet' });
    expect(await refusal(transitionSheet(team.id, actor(people.admin), id, 'return', { comment: 'x' }))).toEqual({ status: 403, code: 'own_sheet' });
    // The queue leaves one's own sheets out.
    expect((await listReviewQueue(team.id, people.admin.id)).map((s) => s.id)).not.toContain(id);
    expect((await listReviewQueue(team.id, people.reviewer.id)).map((s) => s.id)).toContain(id);
    // Another reviewer approves it.
    await acknowledgeAll(id, people.reviewer);
    await transitionSheet(team.id, actor(people.reviewer), id, 'approve');
    expect((await getSheet(team.id, id))!.status).toBe('approved');
  });

  it('approval needs every review flag acknowledged; acknowledgements are by reviewers with a comment', async () => {
    const id = await newSheet();
    await transitionSheet(team.id, actor(people.author), id, 'submit');
    const sheet = (await getSheet(team.id, id))!;
    const reviewCodes = sheet.result!.chosenFlags.filter((f) => f.severity === 'review').map((f) => f.code);
    expect(reviewCodes.length).toBeGreaterThan(0);
    expect(await refusal(transitionSheet(team.id, actor(people.reviewer), id, 'approve'))).toEqual({ status: 409, code: 'not_ready' });
    // All but one acknowledged: still refused.
    for (const code of reviewCodes.slice(1)) await acknowledgeFlag(team.id, actor(people.reviewer), id, code, 'Accepted.');
    expect(await refusal(transitionSheet(team.id, actor(people.reviewer), id, 'approve'))).toEqual({ status: 409, code: 'not_ready' });
    // A code the chosen candidate does not carry, and a note, cannot be acknowledged.
    expect(await refusal(acknowledgeFlag(team.id, actor(people.reviewer), id, 'SOIL_DRYING_RISK', 'n/a'))).toEqual({ status: 404, code: 'not_found' });
    const note = sheet.result!.chosenFlags.find((f) => f.severity === 'note');
    if (note) expect(await refusal(acknowledgeFlag(team.id, actor(people.reviewer), id, note.code, 'n/a'))).toEqual({ status: 409, code: 'not_acknowledgeable' });
    await acknowledgeFlag(team.id, actor(people.reviewer2), id, reviewCodes[0], 'Accepted by the second reviewer.');
    await transitionSheet(team.id, actor(people.reviewer), id, 'approve', { comment: 'Fine.' });
    const approved = (await getSheet(team.id, id))!;
    expect(approved.status).toBe('approved');
    expect(approved.reviewerId).toBe(people.reviewer.id);
    expect(approved.approvedAt).not.toBeNull();
  });

  it('a sheet whose chosen candidate has a blocker is not submitted (issue 22), nor one with no candidate chosen', async () => {
    const id = await newSheet(blockedInputs());
    const refused = await transitionSheet(team.id, actor(people.author), id, 'submit').then(
      () => null,
      (e: SheetOperationError) => ({ status: e.status, code: e.code, message: e.message }),
    );
    expect(refused).toMatchObject({ status: 409, code: 'blocked' });
    expect(refused!.message).toContain('Hot spot above the temperature limit');
    expect(refused!.message).not.toContain('OVER_LIMIT');
    expect((await getSheet(team.id, id))!.status).toBe('draft');
    const none = await newSheet({ ...blockedInputs(), chosenCandidateId: null });
    expect(await refusal(transitionSheet(team.id, actor(people.author), none, 'submit'))).toEqual({ status: 409, code: 'not_ready' });
  });

  it('a blocker flag prevents approval, and cannot be acknowledged away', async () => {
    const id = await newSheet(blockedInputs());
    // In review with a blocker, as a sheet submitted before submission checked for blockers would be.
    await getDb().update(sheets).set({ status: 'in_review' }).where(and(eq(sheets.teamId, team.id), eq(sheets.id, id)));
    const sheet = (await getSheet(team.id, id))!;
    const blockers = sheet.result!.chosenFlags.filter((f) => f.severity === 'blocker').map((f) => f.code);
    expect(blockers).toContain('OVER_LIMIT');
    await acknowledgeAll(id);
    expect(await refusal(acknowledgeFlag(team.id, actor(people.reviewer), id, 'OVER_LIMIT', 'Looks fine to me'))).toEqual({ status: 409, code: 'not_acknowledgeable' });
    expect(await refusal(transitionSheet(team.id, actor(people.reviewer), id, 'approve'))).toEqual({ status: 409, code: 'blocked' });
    expect(await refusal(transitionSheet(team.id, actor(people.admin), id, 'approve'))).toEqual({ status: 409, code: 'blocked' });
    expect((await getSheet(team.id, id))!.status).toBe('in_review');
  });

  it('return needs a comment; the author edits and resubmits; the review starts afresh', async () => {
    const id = await newSheet();
    await transitionSheet(team.id, actor(people.author), id, 'submit');
    await acknowledgeAll(id);
    expect(await refusal(transitionSheet(team.id, actor(people.reviewer), id, 'return', { comment: '  ' }))).toEqual({ status: 409, code: 'comment_required' });
    await transitionSheet(team.id, actor(people.reviewer), id, 'return', { comment: 'Enter the measured ambient.' });
    const returned = (await getSheet(team.id, id))!;
    expect(returned.status).toBe('returned');
    const inputs = { ...returned.inputs, environment: { ...returned.inputs.environment, ambientC: 32 } };
    await saveSheet(team.id, actor(people.author), id, { expectedVersion: returned.version, inputs });
    await transitionSheet(team.id, actor(people.author), id, 'submit');
    const resubmitted = (await getSheet(team.id, id))!;
    expect(resubmitted.status).toBe('in_review');
    expect(resubmitted.acknowledgements).toEqual([]);
    // With the ambient entered, the ambient flag is gone from what the reviewer must accept.
    expect(resubmitted.result!.chosenFlags.map((f) => f.code)).not.toContain('AMBIENT_ASSUMED');
    const history = await sheetHistory(team.id, id);
    expect(history.map((h) => h.action)).toEqual([
      'sheet.create',
      'sheet.submit',
      ...Array(history.filter((h) => h.action === 'sheet.flag.acknowledge').length).fill('sheet.flag.acknowledge'),
      'sheet.return',
      'sheet.save',
      'sheet.submit',
    ]);
    expect(history.find((h) => h.action === 'sheet.return')?.detail.comment).toBe('Enter the measured ambient.');
  });
});

describe('approved sheets are frozen', () => {
  it('refuses saves and transitions; a new revision is a draft that points back; the approved one is unchanged', async () => {
    const id = await newSheet();
    await transitionSheet(team.id, actor(people.author), id, 'submit');
    await acknowledgeAll(id);
    await transitionSheet(team.id, actor(people.reviewer), id, 'approve');
    const approved = (await getSheet(team.id, id))!;
    const [rawBefore] = await getDb().select().from(sheets).where(eq(sheets.id, id));

    expect(await refusal(saveSheet(team.id, actor(people.author), id, { expectedVersion: approved.version, inputs: approved.inputs }))).toEqual({ status: 409, code: 'wrong_state' });
    for (const action of ['submit', 'withdraw', 'approve', 'return'] as const) {
      const who = action === 'approve' || action === 'return' ? people.reviewer : people.author;
      expect(await refusal(transitionSheet(team.id, actor(who), id, action, { comment: 'x' }))).toEqual({ status: 409, code: 'wrong_state' });
    }
    expect(await refusal(acknowledgeFlag(team.id, actor(people.reviewer), id, 'DATA_FROM_MEMORY', 'again'))).toEqual({ status: 409, code: 'wrong_state' });
    expect(await refusal(reviseSheet(team.id, actor(people.reviewer), id))).toEqual({ status: 403, code: 'forbidden' });
    expect(await refusal(reviseSheet(team.id, actor(people.viewer), id))).toEqual({ status: 403, code: 'forbidden' });

    const revision = await reviseSheet(team.id, actor(people.designer2), id);
    const next = (await getSheet(team.id, revision.id))!;
    expect(next).toMatchObject({ status: 'draft', revision: 2, previousRevisionId: id, authorId: people.designer2.id });
    expect(next.inputs).toEqual(approved.inputs);
    // Only the newest revision may be revised again.
    expect(await refusal(reviseSheet(team.id, actor(people.author), id))).toEqual({ status: 409, code: 'wrong_state' });

    const [rawAfter] = await getDb().select().from(sheets).where(eq(sheets.id, id));
    expect(rawAfter.inputs).toEqual(rawBefore.inputs);
    expect(rawAfter.result).toEqual(rawBefore.result);
    expect(rawAfter.version).toBe(rawBefore.version);
    expect(rawAfter.status).toBe('approved');
  });
});

describe('team isolation', () => {
  it('another team’s admin finds nothing and changes nothing: every operation answers 404', async () => {
    const id = await newSheet();
    const sheet = (await getSheet(team.id, id))!;
    const intruder = actor(people.otherAdmin);
    expect(await getSheet(otherTeam.id, id)).toBeNull();
    expect(await listSheetsForProject(otherTeam.id, projectId)).toEqual([]);
    expect(await sheetHistory(otherTeam.id, id)).toEqual([]);
    expect(await refusal(saveSheet(otherTeam.id, intruder, id, { expectedVersion: sheet.version, inputs: sheet.inputs }))).toEqual({ status: 404, code: 'not_found' });
    expect(await refusal(transitionSheet(otherTeam.id, intruder, id, 'submit'))).toEqual({ status: 404, code: 'not_found' });
    expect(await refusal(createSheet(otherTeam.id, intruder, { projectId, circuitTag: 'X', title: 'X', inputs: passingInputs() }))).toEqual({ status: 404, code: 'not_found' });
    await transitionSheet(team.id, actor(people.author), id, 'submit');
    expect(await refusal(acknowledgeFlag(otherTeam.id, intruder, id, 'DATA_FROM_MEMORY', 'x'))).toEqual({ status: 404, code: 'not_found' });
    expect(await refusal(transitionSheet(otherTeam.id, intruder, id, 'approve'))).toEqual({ status: 404, code: 'not_found' });
    expect((await listReviewQueue(otherTeam.id, people.otherAdmin.id)).map((s) => s.id)).not.toContain(id);
    expect(await getSheet(team.id, 'not-a-uuid')).toBeNull();
    expect((await getSheet(team.id, id))!.status).toBe('in_review');
  });
});

describe('migrate on read', () => {
  it('a stored version-1 sheet opens as the current version', async () => {
    const [row] = await getDb()
      .insert(sheets)
      .values({
        teamId: team.id,
        projectId,
        circuitTag: 'OLD-1',
        title: 'Sheet saved by the first schema',
        schemaVersion: 1,
        authorId: people.author.id,
        inputs: {
          schemaVersion: 1,
          designCurrentA: 300,
          voltageV: 230,
          phases: 3,
          frequencyHz: 50,
          lengthM: 40,
          powerFactor: 0.85,
          faultCurrentA: 10000,
          faultDurationS: 0.2,
          ambientC: 25,
          sunIrradianceWPerM2: 800,
          installation: { kind: 'cable-in-air' },
          candidates: [cable240],
          chosenCandidateId: cable240.id,
        },
      })
      .returning({ id: sheets.id });
    const sheet = (await getSheet(team.id, row.id))!;
    expect(sheet.storedSchemaVersion).toBe(1);
    expect(sheet.inputs.schemaVersion).toBe(SHEET_SCHEMA_VERSION);
    expect(sheet.inputs.circuit).toMatchObject({ designCurrentA: 300, nominalVoltageV: 230, powerFactor: 0.85 });
    expect(sheet.inputs.fault).toEqual({ checked: true, currentA: 10000, durationS: 0.2 });
    expect(sheet.inputs.environment).toMatchObject({ ambientC: 25, outdoorSun: true, irradianceWPerM2: 800 });
    expect(sheet.inputs.candidates[0].id).toBe(cable240.id);
    // Saving writes the current version.
    await saveSheet(team.id, actor(people.author), row.id, { expectedVersion: sheet.version, inputs: sheet.inputs });
    const [raw] = await getDb().select().from(sheets).where(eq(sheets.id, row.id));
    expect(raw.schemaVersion).toBe(SHEET_SCHEMA_VERSION);
  });
});

// Saving bus-bar systems (issue 18): packs that do not fit the phase spacing are refused on the
// save with the field named and nothing written (hand geometry: three 10 mm bars with 10 mm gaps
// are 3·10 + 2·10 = 50 mm across, so phases 40 mm apart overlap and 60 mm fit); a real version-5
// bar sheet (tests/fixtures/sheet-v5-demo.json, by commit 5f3d82f) reads as version 6 with its
// stored JSON and snapshot kept.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { auditLog, sheets } from '@/db/schema';
import { createProject } from '@/db/queries/projects';
import { createSheet, getSheet, saveSheet, SheetOperationError } from '@/db/queries/sheets';
import { defaultSheetInputs, SHEET_SCHEMA_VERSION } from '@/lib/sheet';
import { buildSnapshot } from '@/lib/sheet/snapshot';
import { readSheetInputs } from '@/lib/sheet/schema';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCopperBar } from '../../helpers/sheetCandidates';
import { actorOf } from '../share/shareFixtures';
import storedV5 from '../../fixtures/sheet-v5-demo.json';

afterAll(() => closeDb());

let teamId: string;
let designer: { id: string; role: 'designer' };
let projectId: string;
const tag = (label: string) => `${label}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase();

beforeAll(async () => {
  const team = await createTestTeam('systems');
  teamId = team.id;
  designer = (await createTestUser(team.id, 'designer')) as { id: string; role: 'designer' };
  projectId = (await createProject(team.id, designer.id, { name: 'Bus-bar hall (test)', site: 'Invented site' })).id;
});

describe('saving a bus-bar system that does not fit', () => {
  it('refuses phases 40 mm apart for packs 50 mm across, naming busbarSystem.phaseSpacingM, and writes nothing; 60 mm saves', async () => {
    const inputs = defaultSheetInputs('bar-on-edge');
    inputs.candidates = [testCopperBar(100, 10, { barsPerPhase: 3 })];
    inputs.chosenCandidateId = inputs.candidates[0].id;
    const created = await createSheet(teamId, actorOf(designer), { projectId, circuitTag: tag('PCK'), title: 'Overlapping packs', inputs });
    const before = (await getSheet(teamId, created.id))!;
    const auditBefore = await getDb().select().from(auditLog).where(and(eq(auditLog.teamId, teamId), eq(auditLog.entityId, created.id)));

    const overlapping = structuredClone(before.inputs);
    overlapping.busbarSystem.phaseSpacingM = 0.04;
    let refused: unknown = null;
    try {
      await saveSheet(teamId, actorOf(designer), created.id, { expectedVersion: before.version, inputs: overlapping });
    } catch (error) {
      refused = error;
    }
    expect(refused).toBeInstanceOf(SheetOperationError);
    const e = refused as SheetOperationError;
    expect([e.status, e.code, e.detail?.fieldPath]).toEqual([400, 'invalid_arrangement', 'busbarSystem.phaseSpacingM']);
    expect(e.message).toContain('the bus-bar system does not fit as entered');
    const after = (await getSheet(teamId, created.id))!;
    expect([after.version, after.inputs]).toEqual([before.version, before.inputs]);
    const auditAfter = await getDb().select().from(auditLog).where(and(eq(auditLog.teamId, teamId), eq(auditLog.entityId, created.id)));
    expect(auditAfter.length).toBe(auditBefore.length);

    overlapping.busbarSystem.phaseSpacingM = 0.06;
    const saved = await saveSheet(teamId, actorOf(designer), created.id, { expectedVersion: before.version, inputs: overlapping });
    expect(saved.version).toBe(before.version + 1);
    expect((await getSheet(teamId, created.id))!.inputs.busbarSystem.phaseSpacingM).toBe(0.06);
  });
});

describe('a stored version-5 bar sheet', () => {
  it('reads as version 6 with no system or device described, its stored JSON and snapshot kept', async () => {
    const snapshot = buildSnapshot(readSheetInputs(JSON.parse(JSON.stringify(storedV5.barSheet)), 5));
    const [row] = await getDb()
      .insert(sheets)
      .values({ teamId, projectId, circuitTag: tag('V5'), title: 'Saved at version 5', inputs: storedV5.barSheet, result: snapshot, schemaVersion: 5, solverVersion: snapshot.solverVersion, authorId: designer.id })
      .returning({ id: sheets.id });
    const sheet = (await getSheet(teamId, row.id))!;
    expect(sheet.storedSchemaVersion).toBe(5);
    expect(sheet.inputs.schemaVersion).toBe(SHEET_SCHEMA_VERSION);
    expect(sheet.inputs.busbarSystem.phaseSpacingM).toBeNull();
    expect(sheet.inputs.protection.included).toBe(false);
    expect(sheet.result?.evaluations).toEqual(snapshot.evaluations);
    const [raw] = await getDb().select({ inputs: sheets.inputs }).from(sheets).where(eq(sheets.id, row.id));
    expect(raw.inputs).toEqual(storedV5.barSheet);
  });
});

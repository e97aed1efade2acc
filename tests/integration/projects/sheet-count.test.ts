// The projects list counts each project's sizing sheets (issue 23: it said "0 sizing sheets" for a
// project with nine, for every role). Against the real PostgreSQL server.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/db/client';
import { createProject, listProjects } from '@/db/queries/projects';
import { createSheet, listSheetsForProject } from '@/db/queries/sheets';
import { deleteDocument, setArchived } from '@/db/queries/documents';
import { defaultSheetInputs, type Actor } from '@/lib/sheet';
import { can } from '@/lib/auth/permissions';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';

afterAll(() => closeDb());

let teamId: string;
let busyId: string;
let emptyId: string;
let otherTeamId: string;
let designerId: string;

beforeAll(async () => {
  const team = await createTestTeam('sheet-count');
  const other = await createTestTeam('sheet-count-other');
  teamId = team.id;
  otherTeamId = other.id;
  const designer = await createTestUser(team.id, 'designer');
  designerId = designer.id;
  const actor: Actor = { userId: designer.id, can: (p) => can('designer', p) };
  busyId = (await createProject(team.id, designer.id, { name: 'Nine circuits' })).id;
  emptyId = (await createProject(team.id, designer.id, { name: 'No circuits' })).id;
  for (let i = 1; i <= 9; i++) {
    await createSheet(team.id, actor, { projectId: busyId, circuitTag: `C${i}`, title: `Feeder ${i}`, inputs: defaultSheetInputs('cable-in-air') });
  }
  const otherDesigner = await createTestUser(other.id, 'designer');
  const otherProject = (await createProject(other.id, otherDesigner.id, { name: 'Elsewhere' })).id;
  await createSheet(other.id, { userId: otherDesigner.id, can: (p) => can('designer', p) }, { projectId: otherProject, circuitTag: 'X1', title: 'Other team feeder', inputs: defaultSheetInputs('cable-in-air') });
});

describe('the projects list', () => {
  it('counts the nine sheets of a project and none for an empty one', async () => {
    const list = await listProjects(teamId);
    expect(list.find((p) => p.id === busyId)?.sheetCount).toBe(9);
    expect(list.find((p) => p.id === emptyId)?.sheetCount).toBe(0);
  });

  it('lists only the team’s own projects, each counted from its own sheets', async () => {
    const list = await listProjects(otherTeamId);
    expect(list.map((p) => p.name)).toEqual(['Elsewhere']);
    expect(list[0].sheetCount).toBe(1);
  });
});

describe('the count follows the project page', () => {
  it('leaves out archived and deleted sheets', async () => {
    const [first, second] = await listSheetsForProject(teamId, busyId);
    await setArchived(teamId, { userId: designerId, role: 'designer' }, 'sheet', first.id, true);
    await deleteDocument(teamId, { userId: designerId, role: 'designer' }, 'sheet', second.id);
    const list = await listProjects(teamId);
    expect(list.find((p) => p.id === busyId)?.sheetCount).toBe(7);
  });
});

// Issue 22: "a minimum section for parallel runs (team setting, default from common practice,
// said so)". The team's setting is frozen with a schedule when it is queued, the worker sizes with
// it, and each result is the sizing library's for that row with the same option (lib/schedule
// sizeCircuit, an independent path). A 250 A three-phase circuit buried at 0.7 m in the small
// XLPE family (16–95 mm²) gets 2 × 70 mm² with the default 50 mm² and 2 × 95 mm² once the team
// asks for at least 95 mm² in parallel.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule, getSchedule, listScheduleRows, previewScheduleUpload, queueSchedule, scheduleFamilies } from '@/db/queries/schedules';
import { setTeamMinParallelSection, teamSizingOptions } from '@/db/queries/teams';
import { DEFAULT_MIN_PARALLEL_SECTION_MM2, sizeCircuit } from '@/lib/schedule';
import { enqueueScheduleBatches, stopWebBoss } from '@/server/jobs/boss';
import { startScheduleWorker, type RunningWorker } from '@/server/jobs/scheduleWorker';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { circuitRows, scheduleCsv, seedSmallCatalogue, waitFor } from './helpers';

let worker: RunningWorker | undefined;
let teamId: string;
let userId: string;
let projectId: string;

beforeAll(async () => {
  const team = await createTestTeam('sched-team-settings');
  teamId = team.id;
  userId = (await createTestUser(teamId, 'designer')).id;
  projectId = (await createProject(teamId, userId, { name: 'Parallel runs' })).id;
  await seedSmallCatalogue(teamId);
  worker = await startScheduleWorker({ workerId: 'team-settings-test' });
});

afterAll(async () => {
  await worker?.stop();
  await stopWebBoss();
  await closeDb();
});

const feeder = () => [
  { ...circuitRows(1)[0], circuitTag: 'PAR-1', phases: 3, designCurrentA: 250, installation: 'buried', depthM: 0.7, ambientC: 20, faultCurrentKA: null, clearingTimeS: null, family: 'copper XLPE single-core', maxVoltageDropPercent: null, maxParallel: 4 },
];

async function sizeOnce(name: string) {
  const { id } = await createSchedule(teamId, userId, { projectId, name });
  const preview = await previewScheduleUpload(teamId, userId, id, { fileName: `${name}.csv`, mediaType: 'text/csv', bytes: scheduleCsv(feeder()) });
  expect(preview.problems).toEqual([]);
  await queueSchedule(teamId, userId, id, { dropBadRows: false }, enqueueScheduleBatches);
  await waitFor(`${name} to complete`, async () => (await getSchedule(teamId, id))?.status === 'done', 60_000, 200);
  const [row] = await listScheduleRows(teamId, id);
  const families = (await scheduleFamilies(teamId, id))!;
  return { row, candidates: families[row.input.family].candidates };
}

describe("the team's smallest section for parallel runs", () => {
  it('unset: the default of 50 mm² (common practice), said so in the assumptions, gives 2 × 70 mm²', { timeout: 90_000 }, async () => {
    expect(await teamSizingOptions(teamId)).toEqual({});
    const { row, candidates } = await sizeOnce('default');
    expect(row.sizing!.status).toBe('sized');
    if (row.sizing!.status !== 'sized') return;
    expect(row.sizing!.chosen.label).toMatch(/^2 × 70 mm²/);
    expect(row.sizing).toEqual(JSON.parse(JSON.stringify(sizeCircuit(row.input, candidates))));
    expect(row.sizing!.assumptions.join(' ')).toContain(`${DEFAULT_MIN_PARALLEL_SECTION_MM2} mm²`);
    expect(row.sizing!.assumptions.join(' ')).toContain('the default, common practice');
  });

  it('set to 95 mm²: frozen with the schedule when queued, the worker sizes with it, 2 × 95 mm²', { timeout: 90_000 }, async () => {
    await setTeamMinParallelSection(teamId, 95);
    const { row, candidates } = await sizeOnce('team-95');
    if (row.sizing!.status !== 'sized') throw new Error('not sized');
    expect(row.sizing!.chosen.label).toMatch(/^2 × 95 mm²/);
    expect(row.sizing).toEqual(JSON.parse(JSON.stringify(sizeCircuit(row.input, candidates, { minParallelSectionMm2: 95 }))));
    expect(row.sizing!.assumptions.join(' ')).toContain("the team's setting");
  });

  it('refuses a section outside the bounds, naming the field, and clears back to the default with null', async () => {
    await expect(setTeamMinParallelSection(teamId, 0.5)).rejects.toThrow(/minParallelSectionMm2: must be/);
    expect(await teamSizingOptions(teamId)).toEqual({ minParallelSectionMm2: 95 });
    await setTeamMinParallelSection(teamId, null);
    expect(await teamSizingOptions(teamId)).toEqual({});
  });
});

// Issue 9: a file with bad rows queues nothing until corrected (or until the bad rows are
// dropped), and its problems name the spreadsheet row and the column header.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSchedule, getSchedule, listSchedulesForProject, previewScheduleUpload, queueSchedule, ScheduleOperationError } from '@/db/queries/schedules';
import { scheduleRows } from '@/db/schema';
import { ScheduleFileRefusal, scheduleStateWords } from '@/lib/schedule';
import { enqueueScheduleBatches, SCHEDULE_QUEUE, stopWebBoss } from '@/server/jobs/boss';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { circuitRows, scheduleCsv, seedSmallCatalogue } from './helpers';

afterAll(async () => {
  await stopWebBoss();
  await closeDb();
});

async function rowsStored(scheduleId: string) {
  const [{ n }] = await getDb().select({ n: sql<number>`count(*)::int` }).from(scheduleRows).where(eq(scheduleRows.scheduleId, scheduleId));
  return n;
}

async function jobsQueued(scheduleId: string) {
  // pg-boss makes its schema when a queue first starts; before that nothing can have been queued.
  const exists = await getDb().execute(sql`select to_regclass('pgboss.job') is not null as present`);
  if (!(exists.rows[0] as { present: boolean }).present) return 0;
  const result = await getDb().execute(sql`select count(*)::int as n from pgboss.job where name = ${SCHEDULE_QUEUE} and data->>'scheduleId' = ${scheduleId}`);
  return Number((result.rows[0] as { n: number }).n);
}

describe('schedule upload and preview', () => {
  let teamId: string;
  let userId: string;
  let projectId: string;

  beforeAll(async () => {
    teamId = (await createTestTeam('sched-upload')).id;
    userId = (await createTestUser(teamId, 'designer')).id;
    projectId = (await createProject(teamId, userId, { name: 'Schedule uploads' })).id;
    await seedSmallCatalogue(teamId);
  });

  function badFile() {
    const rows = circuitRows(6, 'B');
    rows[1] = { ...rows[1], designCurrentA: 'abc' }; // spreadsheet row 3
    rows[3] = { ...rows[3], family: 'unobtainium XLPE single-core' }; // row 5
    rows[4] = { ...rows[4], installation: 'buried', depthM: null }; // row 6
    rows[5] = { ...rows[5], faultCurrentKA: 4, clearingTimeS: null }; // row 7
    return rows;
  }

  it('names row and column for every problem, and queues nothing while they remain', async () => {
    const { id } = await createSchedule(teamId, userId, { projectId, name: 'with problems' });
    const preview = await previewScheduleUpload(teamId, userId, id, { fileName: 'bad.csv', mediaType: 'text/csv', bytes: scheduleCsv(badFile()) });
    expect(preview.fileRowCount).toBe(6);
    expect(preview.cleanRowCount).toBe(2);
    expect(preview.badRows).toEqual([3, 5, 6, 7]);
    expect(preview.problems).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ row: 3, column: 'design current (A)', message: expect.stringContaining('must be a number') }),
        expect.objectContaining({ row: 5, column: 'conductor family', message: expect.stringContaining('not a family of your catalogue') }),
        expect.objectContaining({ row: 6, column: 'burial depth (m)', message: expect.stringContaining('required when the installation is buried') }),
        expect.objectContaining({ row: 7, column: 'clearing time (s)' }),
      ]),
    );

    const refusal = await queueSchedule(teamId, userId, id, { dropBadRows: false }, enqueueScheduleBatches).catch((e) => e);
    expect(refusal).toBeInstanceOf(ScheduleOperationError);
    expect(refusal).toMatchObject({ status: 409, code: 'file_has_problems' });
    expect(await rowsStored(id)).toBe(0);
    expect(await jobsQueued(id)).toBe(0);
    expect((await getSchedule(teamId, id))?.status).toBe('draft');

    // The corrected file replaces the first; now it queues every row.
    const fixed = await previewScheduleUpload(teamId, userId, id, { fileName: 'fixed.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(6, 'B')) });
    expect(fixed.problems).toEqual([]);
    const queued = await queueSchedule(teamId, userId, id, { dropBadRows: false }, enqueueScheduleBatches);
    expect(queued).toMatchObject({ rows: 6, droppedRows: [] });
    expect(await rowsStored(id)).toBe(6);
    expect(await jobsQueued(id)).toBe(queued.jobs);
    expect((await getSchedule(teamId, id))?.status).toBe('queued');

    // Queued is final: another file or a second queue is refused.
    await expect(previewScheduleUpload(teamId, userId, id, { fileName: 'again.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(2)) })).rejects.toMatchObject({ status: 409 });
    await expect(queueSchedule(teamId, userId, id, { dropBadRows: false }, enqueueScheduleBatches)).rejects.toMatchObject({ status: 409, code: 'already_queued' });
  });

  it('queues only the clean rows when the designer drops the bad ones', async () => {
    const { id } = await createSchedule(teamId, userId, { projectId, name: 'drop bad rows' });
    await previewScheduleUpload(teamId, userId, id, { fileName: 'bad.csv', mediaType: 'text/csv', bytes: scheduleCsv(badFile()) });
    const queued = await queueSchedule(teamId, userId, id, { dropBadRows: true }, enqueueScheduleBatches);
    expect(queued).toMatchObject({ rows: 2, droppedRows: [3, 5, 6, 7] });
    const stored = await getDb().select({ row: scheduleRows.rowNumber }).from(scheduleRows).where(eq(scheduleRows.scheduleId, id));
    expect(stored.map((r) => r.row).sort()).toEqual([2, 4]);
  });

  it('refuses files that are not schedules, and stores nothing for them', async () => {
    const { id } = await createSchedule(teamId, userId, { projectId, name: 'refusals' });
    const attempt = (fileName: string, bytes: Uint8Array) => previewScheduleUpload(teamId, userId, id, { fileName, mediaType: 'application/octet-stream', bytes }).catch((e) => e);
    expect(await attempt('circuits.pdf', new TextEncoder().encode('%PDF-1.7'))).toMatchObject({ status: 415, code: 'unsupported_type' });
    expect(await attempt('circuits.xlsx', new TextEncoder().encode('circuit tag,from\nA,B'))).toMatchObject({ status: 415 });
    expect(await attempt('circuits.csv', new Uint8Array(5 * 1024 * 1024).fill(65))).toMatchObject({ status: 413, code: 'file_too_large' });
    expect(await attempt('circuits.csv', new TextEncoder().encode('tag,amps\nA,10\n'))).toMatchObject({ status: 400, code: 'wrong_columns' });
    const refusal = await attempt('circuits.csv', new TextEncoder().encode('tag,amps\nA,10\n'));
    expect(refusal).toBeInstanceOf(ScheduleFileRefusal);
    expect(refusal.message).toContain('missing columns: circuit tag');
    expect((await getSchedule(teamId, id))?.fileName).toBeNull();
  });

  it("answers 404 for another team's schedule", async () => {
    const { id } = await createSchedule(teamId, userId, { projectId, name: 'private' });
    const other = await createTestTeam('sched-other');
    const otherUser = await createTestUser(other.id, 'admin');
    expect(await getSchedule(other.id, id)).toBeNull();
    await expect(previewScheduleUpload(other.id, otherUser.id, id, { fileName: 'x.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(1)) })).rejects.toMatchObject({ status: 404 });
    await expect(queueSchedule(other.id, otherUser.id, id, { dropBadRows: true }, enqueueScheduleBatches)).rejects.toMatchObject({ status: 404 });
  });

  it('a refused upload clears the file before it and its preview, and the project list says the file was refused (issue 23)', async () => {
    const { id } = await createSchedule(teamId, userId, { projectId, name: 'refused after a good file' });
    const stateOf = async () => {
      const listed = (await listSchedulesForProject(teamId, projectId)).find((s) => s.id === id)!;
      return scheduleStateWords(listed).words;
    };
    expect(await stateOf()).toBe('waiting for a file');
    await previewScheduleUpload(teamId, userId, id, { fileName: 'good.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(3)) });
    // A checked file is not "waiting for a file".
    expect(await stateOf()).toBe('file checked: 3 circuits ready to size');
    await expect(
      previewScheduleUpload(teamId, userId, id, { fileName: 'photo.csv', mediaType: 'text/csv', bytes: new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46]) }),
    ).rejects.toBeInstanceOf(ScheduleFileRefusal);
    const after = (await getSchedule(teamId, id))!;
    expect([after.fileName, after.fileRowCount, after.cleanRowCount, after.problems]).toEqual([null, 0, 0, []]);
    expect(after.uploadRefusal).toMatchObject({ fileName: 'photo.csv', message: expect.stringMatching(/binary/) });
    expect(await stateOf()).toBe('file refused (photo.csv): upload a corrected one');
    // Nothing of the old file can be queued any more.
    await expect(queueSchedule(teamId, userId, id, { dropBadRows: true }, enqueueScheduleBatches)).rejects.toBeInstanceOf(ScheduleOperationError);
    // A good file afterwards clears the refusal.
    await previewScheduleUpload(teamId, userId, id, { fileName: 'fixed.csv', mediaType: 'text/csv', bytes: scheduleCsv(circuitRows(2)) });
    expect((await getSchedule(teamId, id))!.uploadRefusal).toBeNull();
    expect(await stateOf()).toBe('file checked: 2 circuits ready to size');
  });
});

/**
 * Schedules: create, preview an uploaded file, queue the clean rows (rows and jobs in ONE
 * transaction), progress, results, and the worker's idempotent result writes. Every function
 * that a request calls takes the team id first and never touches another team's rows.
 */
import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import type { PoolClient } from 'pg';
import { getDb, getPool, type Db, type Executor } from '../client';
import * as schema from '../schema';
import { projects, scheduleRows, schedules } from '../schema';
import { recordAudit } from './audit';
import { teamSizingOptions } from './teams';
import { listBuilds, listConductors, listCoverings, listMaterials } from './catalogue';
import { barToCandidate, buildLayers, cableBuildToCandidate } from '../../lib/catalogue';
import type { Candidate } from '../../lib/electrical';
import {
  groupIntoFamilies,
  readScheduleFile,
  ScheduleFileRefusal,
  resultLine,
  validateScheduleRecords,
  type CircuitSizing,
  type ConductorFamily,
  type FamilyOptions,
  type ResultLine,
  type ScheduleProblem,
  type ScheduleRecord,
  type ScheduleRow,
} from '../../lib/schedule';
import { SOLVER_VERSION } from '../../lib/electrical/version';

export class ScheduleOperationError extends Error {
  constructor(
    readonly status: 404 | 409,
    readonly code: string,
    message: string,
    readonly detail?: Record<string, unknown>,
  ) {
    super(message);
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const notFound = () => new ScheduleOperationError(404, 'not_found', 'No such schedule.');

// ───────────────────────── families from the catalogue ─────────────────────────

/** Every catalogue cable build and bar of the team as candidates, grouped into families. */
export async function loadTeamFamilies(teamId: string, tx: Executor = getDb()): Promise<ConductorFamily[]> {
  const [materials, conductors, coverings, builds] = await Promise.all([
    listMaterials(teamId, tx),
    listConductors(teamId, tx),
    listCoverings(teamId, tx),
    listBuilds(teamId, tx),
  ]);
  const materialByKey = new Map(materials.map((m) => [m.key, m]));
  const conductorByKey = new Map(conductors.map((c) => [c.key, c]));
  const coveringByKey = new Map(coverings.map((c) => [c.key, c]));
  const candidates: Candidate[] = [];
  for (const build of builds) {
    const conductor = conductorByKey.get(build.conductorKey);
    const material = conductor && materialByKey.get(conductor.materialKey);
    if (!conductor || !material || conductor.shape !== 'round') continue;
    const layers = buildLayers(build).flatMap((l) => {
      const covering = coveringByKey.get(l.coveringKey);
      return covering ? [{ covering, thicknessMm: l.thicknessMm, source: l.source }] : [];
    });
    if (layers.length === 0) continue;
    try {
      candidates.push(cableBuildToCandidate({ build, conductor, material, layers }));
    } catch {
      // A build whose data cannot make a candidate is not offered (the catalogue page shows why).
    }
  }
  for (const conductor of conductors) {
    const material = materialByKey.get(conductor.materialKey);
    if (!material || conductor.shape !== 'rectangular') continue;
    try {
      candidates.push(barToCandidate({ conductor, material }));
    } catch {
      // as above
    }
  }
  return groupIntoFamilies(candidates);
}

// ───────────────────────── schedules ─────────────────────────

export async function createSchedule(teamId: string, actorId: string, input: { projectId: string; name: string }) {
  if (!UUID.test(input.projectId)) throw new ScheduleOperationError(404, 'not_found', 'No such project.');
  return getDb().transaction(async (tx) => {
    const [project] = await tx.select({ id: projects.id }).from(projects).where(and(eq(projects.teamId, teamId), eq(projects.id, input.projectId)));
    if (!project) throw new ScheduleOperationError(404, 'not_found', 'No such project.');
    const [schedule] = await tx.insert(schedules).values({ teamId, projectId: input.projectId, name: input.name, createdBy: actorId }).returning({ id: schedules.id });
    await recordAudit(tx, { teamId, actorId, action: 'schedule.create', entity: 'schedule', entityId: schedule.id, detail: { name: input.name, projectId: input.projectId } });
    return schedule;
  });
}

export interface ScheduleSummary {
  id: string;
  projectId: string;
  projectName: string;
  name: string;
  status: 'draft' | 'queued' | 'done';
  fileName: string | null;
  sizeBytes: number | null;
  fileRowCount: number;
  /** Clean rows of the previewed file. */
  cleanRowCount: number;
  problems: ScheduleProblem[];
  /** The last upload the server refused, while no file has been read since. */
  uploadRefusal: { fileName: string; message: string; at: string } | null;
  rowCount: number;
  droppedRows: number[];
  solverVersion: string | null;
  createdAt: Date;
  queuedAt: Date | null;
  completedAt: Date | null;
}

export async function getSchedule(teamId: string, scheduleId: string, tx: Executor = getDb()): Promise<ScheduleSummary | null> {
  if (!UUID.test(scheduleId)) return null;
  const [row] = await tx
    .select({
      id: schedules.id,
      projectId: schedules.projectId,
      projectName: projects.name,
      name: schedules.name,
      status: schedules.status,
      fileName: schedules.fileName,
      sizeBytes: schedules.sizeBytes,
      fileRowCount: schedules.fileRowCount,
      cleanRowCount: sql<number>`jsonb_array_length(${schedules.previewRows})`,
      problems: schedules.problems,
      uploadRefusal: schedules.uploadRefusal,
      rowCount: schedules.rowCount,
      droppedRows: schedules.droppedRows,
      solverVersion: schedules.solverVersion,
      createdAt: schedules.createdAt,
      queuedAt: schedules.queuedAt,
      completedAt: schedules.completedAt,
    })
    .from(schedules)
    .innerJoin(projects, eq(projects.id, schedules.projectId))
    // A deleted schedule, or one of a deleted project, is not found (issue 23: soft delete).
    .where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId), isNull(schedules.deletedAt), isNull(projects.deletedAt)));
  if (!row) return null;
  return { ...row, problems: row.problems as ScheduleProblem[], uploadRefusal: row.uploadRefusal ?? null, droppedRows: row.droppedRows as number[] };
}

export async function listSchedulesForProject(teamId: string, projectId: string) {
  if (!UUID.test(projectId)) return [];
  return getDb()
    .select({
      id: schedules.id,
      name: schedules.name,
      status: schedules.status,
      rowCount: schedules.rowCount,
      fileName: schedules.fileName,
      fileRowCount: schedules.fileRowCount,
      cleanRowCount: sql<number>`jsonb_array_length(${schedules.previewRows})`,
      problemCount: sql<number>`jsonb_array_length(${schedules.problems})`,
      uploadRefusal: schedules.uploadRefusal,
      createdAt: schedules.createdAt,
      sized: sql<number>`(select count(*)::int from ${scheduleRows} r where r.schedule_id = "schedules"."id" and r.status <> 'pending')`,
    })
    .from(schedules)
    .where(and(eq(schedules.teamId, teamId), eq(schedules.projectId, projectId), isNull(schedules.archivedAt), isNull(schedules.deletedAt)))
    .orderBy(desc(schedules.createdAt));
}

export interface SchedulePreviewInput {
  fileName: string;
  mediaType: string;
  bytes: Uint8Array;
  rows: ScheduleRow[];
  problems: ScheduleProblem[];
  fileRowCount: number;
}

/** Stores an uploaded file and what the preview found; allowed until the schedule is queued. */
export async function storeSchedulePreview(teamId: string, actorId: string, scheduleId: string, input: SchedulePreviewInput) {
  if (!UUID.test(scheduleId)) throw notFound();
  return getDb().transaction(async (tx) => {
    const [current] = await tx.select({ status: schedules.status }).from(schedules).where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId), isNull(schedules.deletedAt))).for('update');
    if (!current) throw notFound();
    if (current.status !== 'draft') throw new ScheduleOperationError(409, 'already_queued', 'This schedule has been queued; its file can no longer be replaced. Start a new schedule for another file.');
    await tx
      .update(schedules)
      .set({
        fileName: input.fileName,
        mediaType: input.mediaType,
        sizeBytes: input.bytes.byteLength,
        content: Buffer.from(input.bytes),
        previewRows: input.rows,
        problems: input.problems,
        fileRowCount: input.fileRowCount,
        uploadRefusal: null,
        updatedAt: new Date(),
      })
      .where(eq(schedules.id, scheduleId));
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'schedule.upload',
      entity: 'schedule',
      entityId: scheduleId,
      detail: { fileName: input.fileName, sizeBytes: input.bytes.byteLength, rows: input.fileRowCount, clean: input.rows.length, problems: input.problems.length },
    });
  });
}

/**
 * A refused upload of a draft schedule: the file before it and its preview are cleared (the page
 * and the project list must not go on offering the old file as if it were the one just sent) and
 * the refusal is kept for both to show. Audited; a queued schedule is left as it is.
 */
export async function recordRefusedUpload(teamId: string, actorId: string, scheduleId: string, refusal: { fileName: string; message: string }) {
  if (!UUID.test(scheduleId)) return;
  await getDb().transaction(async (tx) => {
    const [current] = await tx.select({ status: schedules.status, fileName: schedules.fileName }).from(schedules).where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId))).for('update');
    if (!current || current.status !== 'draft') return;
    await tx
      .update(schedules)
      .set({
        fileName: null,
        mediaType: null,
        sizeBytes: null,
        content: null,
        previewRows: [],
        problems: [],
        fileRowCount: 0,
        uploadRefusal: { ...refusal, at: new Date().toISOString() },
        updatedAt: new Date(),
      })
      .where(eq(schedules.id, scheduleId));
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'schedule.upload_refused',
      entity: 'schedule',
      entityId: scheduleId,
      detail: { fileName: refusal.fileName, message: refusal.message, clearedFile: current.fileName },
    });
  });
}

export async function getScheduleFile(teamId: string, scheduleId: string) {
  if (!UUID.test(scheduleId)) return null;
  const [row] = await getDb()
    .select({ fileName: schedules.fileName, mediaType: schedules.mediaType, content: schedules.content })
    .from(schedules)
    .where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId)));
  return row?.content ? row : null;
}

/** Runs `work` in one transaction on one pool client, giving drizzle and raw SQL the same connection (pg-boss inserts its jobs through it). */
export async function withClientTransaction<T>(work: (db: Db, client: PoolClient) => Promise<T>): Promise<T> {
  const client = await getPool().connect();
  try {
    await client.query('BEGIN');
    const result = await work(drizzle(client, { schema }), client);
    await client.query('COMMIT');
    return result;
  } catch (error) {
    await client.query('ROLLBACK').catch(() => {});
    throw error;
  } finally {
    client.release();
  }
}

export type EnqueueBatches = (
  executeSql: (text: string, values: unknown[]) => Promise<{ rows: unknown[] }>,
  teamId: string,
  scheduleId: string,
  rowNumbers: readonly number[],
) => Promise<number>;

/**
 * Queues a previewed schedule: copies the clean rows into schedule_rows, freezes the families
 * they use and inserts the row-batch jobs — all in one transaction. With problems in the file,
 * nothing is queued unless `dropBadRows` says to leave the bad rows out.
 */
export async function queueSchedule(
  teamId: string,
  actorId: string,
  scheduleId: string,
  options: { dropBadRows: boolean },
  enqueue: EnqueueBatches,
) {
  if (!UUID.test(scheduleId)) throw notFound();
  const families = await loadTeamFamilies(teamId);
  const sizingOptions = await teamSizingOptions(teamId);
  return withClientTransaction(async (db, client) => {
    const [schedule] = await db
      .select({ status: schedules.status, previewRows: schedules.previewRows, problems: schedules.problems, fileName: schedules.fileName })
      .from(schedules)
      .where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId), isNull(schedules.deletedAt)))
      .for('update');
    if (!schedule) throw notFound();
    if (schedule.status !== 'draft') throw new ScheduleOperationError(409, 'already_queued', 'This schedule is already queued.');
    if (!schedule.fileName) throw new ScheduleOperationError(409, 'no_file', 'Upload a schedule file first.');
    const rows = schedule.previewRows as ScheduleRow[];
    const problems = schedule.problems as ScheduleProblem[];
    const badRows = [...new Set(problems.map((p) => p.row))].sort((a, b) => a - b);
    if (badRows.length > 0 && !options.dropBadRows) {
      throw new ScheduleOperationError(409, 'file_has_problems', `${badRows.length} row${badRows.length === 1 ? ' has' : 's have'} problems: correct the file and upload it again, or leave those rows out.`, { badRows });
    }
    if (rows.length === 0) throw new ScheduleOperationError(409, 'no_clean_rows', 'No row of the file is clean: nothing to size.');
    const used: Record<string, { label: string; kind: 'cable' | 'bar'; candidates: Candidate[] }> = {};
    for (const row of rows) {
      const family = families.find((f) => f.key === row.family);
      if (!family) {
        throw new ScheduleOperationError(409, 'family_gone', `Row ${row.rowNumber}: the family "${row.family}" is no longer in your catalogue. Upload the file again.`);
      }
      used[family.key] ??= { label: family.label, kind: family.kind, candidates: family.candidates };
    }
    const chunk = 500;
    for (let i = 0; i < rows.length; i += chunk) {
      await db
        .insert(scheduleRows)
        .values(rows.slice(i, i + chunk).map((row) => ({ teamId, scheduleId, rowNumber: row.rowNumber, circuitTag: row.circuitTag, input: row })))
        .onConflictDoNothing({ target: [scheduleRows.scheduleId, scheduleRows.rowNumber] });
    }
    const now = new Date();
    await db
      .update(schedules)
      .set({ status: 'queued', families: used, sizingOptions, rowCount: rows.length, droppedRows: badRows, previewRows: [], solverVersion: SOLVER_VERSION, queuedAt: now, updatedAt: now })
      .where(eq(schedules.id, scheduleId));
    const jobs = await enqueue((text, values) => client.query(text, values as unknown[]), teamId, scheduleId, rows.map((r) => r.rowNumber));
    await recordAudit(db, { teamId, actorId, action: 'schedule.queue', entity: 'schedule', entityId: scheduleId, detail: { rows: rows.length, droppedRows: badRows, jobs } });
    return { rows: rows.length, droppedRows: badRows, jobs };
  });
}

export interface ScheduleProgress {
  status: 'draft' | 'queued' | 'done';
  total: number;
  done: number;
  failing: number;
  queuedAt: string | null;
  completedAt: string | null;
  /** Rows per second since the first row was stored (null before two rows are stored). */
  ratePerSecond: number | null;
  secondsLeft: number | null;
  /** Seconds since a row was last stored (or since queueing, before the first row). */
  secondsSinceActivity: number | null;
}

export async function scheduleProgress(teamId: string, scheduleId: string): Promise<ScheduleProgress | null> {
  if (!UUID.test(scheduleId)) return null;
  const [row] = await getDb()
    .select({
      status: schedules.status,
      total: schedules.rowCount,
      queuedAt: schedules.queuedAt,
      completedAt: schedules.completedAt,
      done: sql<number>`(select count(*)::int from ${scheduleRows} r where r.schedule_id = "schedules"."id" and r.status <> 'pending')`,
      failing: sql<number>`(select count(*)::int from ${scheduleRows} r where r.schedule_id = "schedules"."id" and r.status = 'none_passes')`,
      idleS: sql<number | null>`(select extract(epoch from (now() - coalesce(max(r.sized_at), "schedules"."queued_at")))::float8 from ${scheduleRows} r where r.schedule_id = "schedules"."id")`,
      elapsedS: sql<number | null>`(select extract(epoch from (max(r.sized_at) - "schedules"."queued_at"))::float8 from ${scheduleRows} r where r.schedule_id = "schedules"."id" and r.sized_at is not null)`,
    })
    .from(schedules)
    .where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId)));
  if (!row) return null;
  const rate = row.done > 0 && row.elapsedS !== null && row.elapsedS > 0 ? row.done / row.elapsedS : null;
  return {
    status: row.status,
    total: row.total,
    done: row.done,
    failing: row.failing,
    queuedAt: row.queuedAt?.toISOString() ?? null,
    completedAt: row.completedAt?.toISOString() ?? null,
    ratePerSecond: rate,
    secondsLeft: rate ? (row.total - row.done) / rate : null,
    secondsSinceActivity: row.idleS,
  };
}

export interface StoredScheduleRow {
  rowNumber: number;
  input: ScheduleRow;
  sizing: CircuitSizing | null;
  solverMs: number | null;
  sizedBy: string | null;
}

export async function listScheduleRows(teamId: string, scheduleId: string): Promise<StoredScheduleRow[]> {
  if (!UUID.test(scheduleId)) return [];
  const rows = await getDb()
    .select({ rowNumber: scheduleRows.rowNumber, input: scheduleRows.input, result: scheduleRows.result, solverMs: scheduleRows.solverMs, sizedBy: scheduleRows.sizedBy })
    .from(scheduleRows)
    .where(and(eq(scheduleRows.teamId, teamId), eq(scheduleRows.scheduleId, scheduleId)))
    .orderBy(asc(scheduleRows.rowNumber));
  return rows.map((r) => ({ rowNumber: r.rowNumber, input: r.input as ScheduleRow, sizing: (r.result as CircuitSizing | null) ?? null, solverMs: r.solverMs, sizedBy: r.sizedBy }));
}

/** The families frozen on a queued schedule. */
export async function scheduleFamilies(teamId: string, scheduleId: string) {
  if (!UUID.test(scheduleId)) return null;
  const [row] = await getDb().select({ families: schedules.families }).from(schedules).where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId)));
  return row ? (row.families as Record<string, { label: string; kind: 'cable' | 'bar'; candidates: Candidate[] }>) : null;
}

export async function listScheduleResults(teamId: string, scheduleId: string): Promise<ResultLine[]> {
  const [rows, families] = await Promise.all([listScheduleRows(teamId, scheduleId), scheduleFamilies(teamId, scheduleId)]);
  return rows.map((r) => resultLine(r.input, families?.[r.input.family]?.label ?? r.input.family, r.sizing));
}

export async function getScheduleRow(teamId: string, scheduleId: string, rowNumber: number) {
  if (!UUID.test(scheduleId) || !Number.isInteger(rowNumber)) return null;
  const [row] = await getDb()
    .select({ input: scheduleRows.input, result: scheduleRows.result, projectId: schedules.projectId, families: schedules.families, scheduleName: schedules.name })
    .from(scheduleRows)
    .innerJoin(schedules, eq(schedules.id, scheduleRows.scheduleId))
    .where(and(eq(scheduleRows.teamId, teamId), eq(scheduleRows.scheduleId, scheduleId), eq(scheduleRows.rowNumber, rowNumber), isNull(schedules.deletedAt)));
  if (!row) return null;
  const input = row.input as ScheduleRow;
  const family = (row.families as Record<string, { label: string; kind: 'cable' | 'bar'; candidates: Candidate[] }>)[input.family];
  return { input, sizing: (row.result as CircuitSizing | null) ?? null, projectId: row.projectId, scheduleName: row.scheduleName, family: family ?? null };
}

// ───────────────────────── worker side (no team from a session: the job carries it) ─────────────────────────

export async function loadScheduleForWorker(scheduleId: string) {
  const [row] = await getDb()
    .select({ teamId: schedules.teamId, status: schedules.status, families: schedules.families, sizingOptions: schedules.sizingOptions })
    .from(schedules)
    .where(eq(schedules.id, scheduleId));
  if (!row) return null;
  return {
    teamId: row.teamId,
    status: row.status,
    families: row.families as Record<string, { label: string; kind: 'cable' | 'bar'; candidates: Candidate[] }>,
    sizingOptions: row.sizingOptions as FamilyOptions,
  };
}

/** Rows of a batch that still need sizing (a retried batch skips what an earlier attempt stored). */
export async function pendingRows(scheduleId: string, rowNumbers: readonly number[]) {
  if (rowNumbers.length === 0) return [];
  const rows = await getDb()
    .select({ teamId: scheduleRows.teamId, rowNumber: scheduleRows.rowNumber, circuitTag: scheduleRows.circuitTag, input: scheduleRows.input })
    .from(scheduleRows)
    .where(and(eq(scheduleRows.scheduleId, scheduleId), inArray(scheduleRows.rowNumber, [...rowNumbers]), eq(scheduleRows.status, 'pending')))
    .orderBy(asc(scheduleRows.rowNumber));
  return rows.map((r) => ({ ...r, input: r.input as ScheduleRow }));
}

export interface RowResultWrite {
  teamId: string;
  scheduleId: string;
  rowNumber: number;
  circuitTag: string;
  input: ScheduleRow;
  sizing: CircuitSizing;
  solverMs: number;
  sizedBy: string;
}

/**
 * Stores results idempotently: an upsert on (schedule_id, row_number) that only fills a row
 * still pending. A retried batch, or two workers racing on one row, can never store a circuit
 * twice nor overwrite a stored result. Returns the row numbers this call actually stored.
 */
export async function storeRowResults(results: readonly RowResultWrite[]): Promise<number[]> {
  if (results.length === 0) return [];
  const now = new Date();
  const stored = await getDb()
    .insert(scheduleRows)
    .values(
      results.map((r) => ({
        teamId: r.teamId,
        scheduleId: r.scheduleId,
        rowNumber: r.rowNumber,
        circuitTag: r.circuitTag,
        input: r.input,
        status: r.sizing.status,
        result: r.sizing,
        solverMs: r.solverMs,
        sizedBy: r.sizedBy,
        sizedAt: now,
      })),
    )
    .onConflictDoUpdate({
      target: [scheduleRows.scheduleId, scheduleRows.rowNumber],
      set: {
        status: sql`excluded.status`,
        result: sql`excluded.result`,
        solverMs: sql`excluded.solver_ms`,
        sizedBy: sql`excluded.sized_by`,
        sizedAt: sql`excluded.sized_at`,
      },
      setWhere: sql`${scheduleRows.status} = 'pending'`,
    })
    .returning({ rowNumber: scheduleRows.rowNumber });
  return stored.map((s) => s.rowNumber);
}

/** Marks the schedule done once no row is pending (any worker may be the one that finishes). */
export async function completeScheduleIfDone(scheduleId: string): Promise<boolean> {
  const done = await getDb()
    .update(schedules)
    .set({ status: 'done', completedAt: new Date(), updatedAt: new Date() })
    .where(
      and(
        eq(schedules.id, scheduleId),
        eq(schedules.status, 'queued'),
        sql`not exists (select 1 from ${scheduleRows} r where r.schedule_id = "schedules"."id" and r.status = 'pending')`,
      ),
    )
    .returning({ id: schedules.id });
  return done.length > 0;
}

/**
 * Reads an uploaded file, validates every row against the team's families and stores the file
 * with what was found. Throws ScheduleFileRefusal (lib/schedule) for files that are not a
 * schedule at all; row problems are stored, not thrown.
 */
export async function previewScheduleUpload(
  teamId: string,
  actorId: string,
  scheduleId: string,
  file: { fileName: string; mediaType: string; bytes: Uint8Array },
  // The route passes the off-thread reader (server/files/uploadReader.ts); scripts and tests read in place.
  read: (fileName: string, bytes: Uint8Array) => Promise<ScheduleRecord[]> = readScheduleFile,
) {
  const summary = await getSchedule(teamId, scheduleId);
  if (!summary) throw notFound();
  if (summary.status !== 'draft') throw new ScheduleOperationError(409, 'already_queued', 'This schedule has been queued; its file can no longer be replaced. Start a new schedule for another file.');
  let records: ScheduleRecord[];
  try {
    records = await read(file.fileName, file.bytes);
  } catch (error) {
    if (error instanceof ScheduleFileRefusal) await recordRefusedUpload(teamId, actorId, scheduleId, { fileName: file.fileName, message: error.message });
    throw error;
  }
  const families = await loadTeamFamilies(teamId);
  const validated = validateScheduleRecords(records, families);
  await storeSchedulePreview(teamId, actorId, scheduleId, { ...file, rows: validated.rows, problems: validated.problems, fileRowCount: records.length });
  return { fileRowCount: records.length, cleanRowCount: validated.rows.length, problems: validated.problems, badRows: validated.badRows };
}

/** The first clean rows of a previewed file, for the preview table. */
export async function previewRowsOf(teamId: string, scheduleId: string, limit = 200): Promise<ScheduleRow[]> {
  if (!UUID.test(scheduleId)) return [];
  const [row] = await getDb()
    .select({ rows: sql<ScheduleRow[]>`coalesce((select jsonb_agg(e) from (select e from jsonb_array_elements(${schedules.previewRows}) e limit ${limit}) s), '[]'::jsonb)` })
    .from(schedules)
    .where(and(eq(schedules.teamId, teamId), eq(schedules.id, scheduleId)));
  return row?.rows ?? [];
}

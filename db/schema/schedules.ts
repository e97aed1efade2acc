/**
 * Schedules: an uploaded list of circuits sized in one batch (issue 9).
 *
 * `schedules` keeps the original file as sent (bytea) with what the preview found; queueing
 * copies the clean rows into `schedule_rows` — one row per circuit, unique on
 * (schedule_id, row_number), with its result columns — so that a circuit is stored exactly once
 * however often a crashed job is retried. The family candidates used are frozen on the schedule
 * when it is queued, so a catalogue edit mid-run cannot size half the rows from other data.
 */
import { sql } from 'drizzle-orm';
import { check, customType, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { projects, sheets, teams, users } from './core';

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });

/** draft: no file yet, or a previewed file not queued; queued: rows stored and jobs sent; done: every row sized. */
export const scheduleStatusEnum = pgEnum('schedule_status', ['draft', 'queued', 'done']);
export const scheduleRowStatusEnum = pgEnum('schedule_row_status', ['pending', 'sized', 'none_passes']);

export const schedules = pgTable(
  'schedules',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    projectId: uuid('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    status: scheduleStatusEnum('status').notNull().default('draft'),
    fileName: text('file_name'),
    mediaType: text('media_type'),
    sizeBytes: integer('size_bytes'),
    /** The file exactly as uploaded. */
    content: bytea('content'),
    /** Clean rows of the previewed file (lib/schedule ScheduleRow[]), waiting to be queued. */
    previewRows: jsonb('preview_rows').notNull().default([]),
    /** Problems of the previewed file: [{ row, column, message }]. */
    problems: jsonb('problems').notNull().default([]),
    /** Rows of the file the preview read (clean and bad). */
    fileRowCount: integer('file_row_count').notNull().default(0),
    /**
     * The last upload that was refused ({ fileName, message, at }), null after a file was read.
     * A refused upload also clears the file before it, so that nobody sizes the old file thinking it is the new one.
     */
    uploadRefusal: jsonb('upload_refusal').$type<{ fileName: string; message: string; at: string } | null>().default(null),
    /** Family key → { label, kind, candidates } frozen when queued. */
    families: jsonb('families').notNull().default({}),
    /** The team's sizing options (lib/schedule FamilyOptions) frozen when queued, so a re-run sizes alike. */
    sizingOptions: jsonb('sizing_options').notNull().default({}),
    /** Rows queued for sizing. */
    rowCount: integer('row_count').notNull().default(0),
    /** Bad rows the designer chose to leave out when queueing. */
    droppedRows: jsonb('dropped_rows').notNull().default([]),
    solverVersion: text('solver_version'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    queuedAt: timestamp('queued_at', { withTimezone: true }),
    completedAt: timestamp('completed_at', { withTimezone: true }),
    /** Archived: kept as it is, hidden from the normal lists (issue 23); null = in use. */
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    /** Deleted: hidden everywhere, restorable by an admin for 30 days, then purged; null = not deleted. */
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
    deletedBy: uuid('deleted_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('schedules_team_idx').on(t.teamId), index('schedules_project_idx').on(t.projectId)],
);

export const scheduleRows = pgTable(
  'schedule_rows',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    scheduleId: uuid('schedule_id').notNull().references(() => schedules.id, { onDelete: 'cascade' }),
    /** Spreadsheet row number in the uploaded file (header = 1). */
    rowNumber: integer('row_number').notNull(),
    circuitTag: text('circuit_tag').notNull(),
    /** The clean row (lib/schedule ScheduleRow). */
    input: jsonb('input').notNull(),
    status: scheduleRowStatusEnum('status').notNull().default('pending'),
    /** lib/schedule CircuitSizing. */
    result: jsonb('result'),
    /** Wall time of sizeCircuit for this row, ms (the solver's share of the work). */
    solverMs: doublePrecision('solver_ms'),
    /** Which worker process stored the result (host:pid), for tracing shared work. */
    sizedBy: text('sized_by'),
    sizedAt: timestamp('sized_at', { withTimezone: true }),
  },
  (t) => [
    uniqueIndex('schedule_rows_schedule_row_unique').on(t.scheduleId, t.rowNumber),
    index('schedule_rows_team_idx').on(t.teamId),
    check('schedule_rows_row_number', sql`${t.rowNumber} >= 2`),
    check('schedule_rows_result_when_sized', sql`(${t.status} = 'pending') = (${t.result} is null)`),
  ],
);

/**
 * "Make sizing sheets" for a chosen set of schedule rows (issue 23), done in the background: one
 * batch per request, one item per row. A worker fills an item's sheet_id in the same transaction
 * that creates the sheet, so a retried job never makes a row's sheet twice; a row that cannot be
 * made into a sheet keeps its reason in `error`.
 */
export const sheetBatchStatusEnum = pgEnum('schedule_sheet_batch_status', ['queued', 'done']);

export const scheduleSheetBatches = pgTable(
  'schedule_sheet_batches',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    scheduleId: uuid('schedule_id').notNull().references(() => schedules.id, { onDelete: 'cascade' }),
    requestedBy: uuid('requested_by').references(() => users.id, { onDelete: 'set null' }),
    status: sheetBatchStatusEnum('status').notNull().default('queued'),
    total: integer('total').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    completedAt: timestamp('completed_at', { withTimezone: true }),
  },
  (t) => [index('schedule_sheet_batches_team_schedule_idx').on(t.teamId, t.scheduleId)],
);

export const scheduleSheetBatchItems = pgTable(
  'schedule_sheet_batch_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    batchId: uuid('batch_id').notNull().references(() => scheduleSheetBatches.id, { onDelete: 'cascade' }),
    rowNumber: integer('row_number').notNull(),
    sheetId: uuid('sheet_id').references(() => sheets.id, { onDelete: 'set null' }),
    error: text('error'),
    doneAt: timestamp('done_at', { withTimezone: true }),
  },
  (t) => [uniqueIndex('schedule_sheet_batch_items_row_unique').on(t.batchId, t.rowNumber), index('schedule_sheet_batch_items_team_idx').on(t.teamId)],
);

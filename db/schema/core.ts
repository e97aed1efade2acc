import { sql } from 'drizzle-orm';
import {
  boolean,
  check,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { ROLES } from '../../lib/auth/permissions';
import type { UserPreferences } from '../../lib/user/preferences';

/**
 * Roles and what they may do: ../shared/design/product.md, "People and roles". The list is
 * lib/auth/permissions' ROLES, so the database enum and the rights table cannot drift apart; a new
 * role there needs a migration (`npm run db:generate`).
 */
export const roleEnum = pgEnum('role', ROLES);
export const sheetStatusEnum = pgEnum('sheet_status', ['draft', 'in_review', 'approved', 'returned']);
export const unitSystemEnum = pgEnum('unit_system', ['si', 'imperial']);

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow();

/** A team (organisation). Every other row belongs to exactly one. */
export const teams = pgTable('teams', {
  id: uuid('id').primaryKey().defaultRandom(),
  slug: text('slug').notNull().unique(),
  name: text('name').notNull(),
  /** Schedules: the smallest cable section run in parallel, mm²; null = the library's default (common practice). */
  minParallelSectionMm2: numeric('min_parallel_section_mm2'),
  /**
   * ISO 4217 code of the team's money (issue 22): shown beside every amount — the candidate grid,
   * the PDF, the share page, the exports. Prices in the catalogue and the sheet's economics are in
   * it; changing it relabels, it does not convert.
   */
  currency: text('currency').notNull().default('EUR'),
  createdAt: createdAt(),
}, (t) => [check('teams_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`)]);

export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    name: text('name').notNull(),
    role: roleEnum('role').notNull(),
    passwordHash: text('password_hash'),
    active: boolean('active').notNull().default(true),
    unitSystem: unitSystemEnum('unit_system').notNull().default('si'),
    /**
     * A reviewer's professional licence or registration number and the jurisdiction that issued
     * it, printed beside their approval in the calculation package (issue 22); empty until the
     * person enters them on their profile.
     */
    licenceNumber: text('licence_number').notNull().default(''),
    licenceJurisdiction: text('licence_jurisdiction').notNull().default(''),
    /**
     * The decimal separator the user types ('.' or ','), lib/units/parse; null until they choose,
     * and then the browser's locale decides (Intl.NumberFormat).
     */
    decimalSeparator: text('decimal_separator', { enum: ['.', ','] }),
    /** Bumped on deactivation or password change so that older sessions stop working. */
    sessionEpoch: integer('session_epoch').notNull().default(0),
    /** The user's own screen settings (lib/user/preferences.ts), e.g. the comparison grid's columns. */
    preferences: jsonb('preferences').$type<UserPreferences>().notNull().default({}),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('users_email_unique').on(sql`lower(${t.email})`),
    index('users_team_idx').on(t.teamId),
    check('users_decimal_separator', sql`${t.decimalSeparator} is null or ${t.decimalSeparator} in ('.', ',')`),
  ],
);

/** A job site or building. */
export const projects = pgTable(
  'projects',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    site: text('site').notNull().default(''),
    description: text('description').notNull().default(''),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    /** Archived: kept as it is, hidden from the normal lists (issue 23); null = in use. */
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    /** Deleted: hidden everywhere, restorable by an admin for 30 days, then purged; null = not deleted. */
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
    deletedBy: uuid('deleted_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('projects_team_idx').on(t.teamId), uniqueIndex('projects_team_name_unique').on(t.teamId, t.name)],
);

/**
 * A sizing sheet: one circuit, its candidates, the result snapshot and its review history.
 * `inputs` and `result` are JSON validated by zod schemas that carry their own schemaVersion;
 * `version` is the optimistic-lock counter (a save names the version it started from).
 */
export const sheets = pgTable(
  'sheets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    projectId: uuid('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    circuitTag: text('circuit_tag').notNull(),
    title: text('title').notNull(),
    status: sheetStatusEnum('status').notNull().default('draft'),
    revision: integer('revision').notNull().default(1),
    /** The sheet this one revises (an approved sheet is frozen; editing makes a new revision). */
    previousRevisionId: uuid('previous_revision_id'),
    inputs: jsonb('inputs').notNull(),
    result: jsonb('result'),
    schemaVersion: integer('schema_version').notNull().default(1),
    solverVersion: text('solver_version'),
    version: integer('version').notNull().default(1),
    authorId: uuid('author_id').notNull().references(() => users.id),
    reviewerId: uuid('reviewer_id').references(() => users.id),
    approvedAt: timestamp('approved_at', { withTimezone: true }),
    /** A duplicate names the sheet and revision it was copied from; its own history starts fresh. */
    duplicatedFromId: uuid('duplicated_from_id'),
    duplicatedFromRevision: integer('duplicated_from_revision'),
    /** Archived: kept as it is, hidden from the normal lists (issue 23); null = in use. */
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    /** Deleted: hidden everywhere, restorable by an admin for 30 days, then purged; null = not deleted. */
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
    deletedBy: uuid('deleted_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('sheets_team_idx').on(t.teamId), index('sheets_project_idx').on(t.projectId)],
);

/** Every change that matters: who did what to which row, with a JSON detail. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').references(() => teams.id, { onDelete: 'cascade' }),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: text('entity_id'),
    detail: jsonb('detail').notNull().default({}),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_team_entity_idx').on(t.teamId, t.entity, t.entityId)],
);

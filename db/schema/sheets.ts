import { index, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { sheets, teams, users } from './core';

/**
 * A reviewer's acknowledgement of one `review` flag on a sheet, with the comment that says why the
 * assumption is acceptable. Cleared when the sheet is submitted again, because the flags belong to
 * the result snapshot that was reviewed.
 */
export const sheetFlagAcknowledgements = pgTable(
  'sheet_flag_acknowledgements',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    sheetId: uuid('sheet_id').notNull().references(() => sheets.id, { onDelete: 'cascade' }),
    flagCode: text('flag_code').notNull(),
    comment: text('comment').notNull(),
    reviewerId: uuid('reviewer_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('sheet_flag_ack_unique').on(t.sheetId, t.flagCode), index('sheet_flag_ack_team_idx').on(t.teamId)],
);

export const sheetContributionEnum = pgEnum('sheet_contribution', ['edited', 'submitted']);

/**
 * Who worked on each revision of a sheet: everyone who saved its inputs (`edited`, the author
 * included) and everyone who submitted it for review (`submitted`). Nobody may approve a revision
 * they edited or submitted (lib/sheet/stateMachine.ts), so approval needs a second person even
 * when an admin, who holds every right, rewrote the sheet. One row per person and kind, with when
 * it first and last happened; a new revision starts with its own rows.
 */
export const sheetContributions = pgTable(
  'sheet_contributions',
  {
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    sheetId: uuid('sheet_id').notNull().references(() => sheets.id, { onDelete: 'cascade' }),
    userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    kind: sheetContributionEnum('kind').notNull(),
    firstAt: timestamp('first_at', { withTimezone: true }).notNull().defaultNow(),
    lastAt: timestamp('last_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('sheet_contributions_unique').on(t.sheetId, t.userId, t.kind), index('sheet_contributions_team_idx').on(t.teamId)],
);

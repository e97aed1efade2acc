import { index, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
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

import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { sheets, teams, users } from './core';

/**
 * A read-only link to one sizing sheet for someone outside the team. The link's token (32 random
 * bytes, base64url) is never stored: only its SHA-256 hash, so that a copy of the database opens no
 * sheet. A link works until it expires or is revoked; the team id rides along so that every query
 * of the team's own screens filters by it like any other row.
 */
export const sheetShares = pgTable(
  'sheet_shares',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    sheetId: uuid('sheet_id').notNull().references(() => sheets.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    revokedBy: uuid('revoked_by').references(() => users.id, { onDelete: 'set null' }),
    lastOpenedAt: timestamp('last_opened_at', { withTimezone: true }),
  },
  (t) => [index('sheet_shares_team_sheet_idx').on(t.teamId, t.sheetId)],
);

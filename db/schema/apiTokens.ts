import { sql } from 'drizzle-orm';
import { bigint, index, integer, pgTable, text, timestamp, uuid, varchar } from 'drizzle-orm/pg-core';
import { teams, users } from './core';

/**
 * A team's API token for the calculation API (/api/v1). The token itself is shown once when an
 * admin creates it and never stored: only its SHA-256 hash (a copy of the database hands out no
 * access). `prefix` is the first characters of the token, kept so that admins can tell tokens apart.
 * Scopes: 'read' (reference data) and 'calc' (calculations). Revoking stamps revoked_at; the row
 * stays for the audit trail.
 */
export const apiTokens = pgTable(
  'api_tokens',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    prefix: text('prefix').notNull(),
    scopes: text('scopes').array().notNull().default(sql`'{}'::text[]`),
    requestsPerMinute: integer('requests_per_minute').notNull().default(120),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }),
    lastUsedAt: timestamp('last_used_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    revokedBy: uuid('revoked_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('api_tokens_team_idx').on(t.teamId)],
);

/**
 * Per-token request counts, one row per token and one-minute window (db/queries/apiTokens.ts
 * authoriseTokenRequest counts them; the columns keep the layout of rate-limiter-flexible's
 * Postgres store, which counted them first), shared by every app instance. UNLOGGED (migration
 * 0016, which drizzle's schema cannot express): counts of one-minute windows need no crash safety.
 */
export const apiTokenLimits = pgTable('api_token_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: integer('points').notNull().default(0),
  expire: bigint('expire', { mode: 'number' }),
});

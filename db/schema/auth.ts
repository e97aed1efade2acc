import { bigint, index, integer, pgTable, text, timestamp, uuid, varchar } from 'drizzle-orm/pg-core';
import { roleEnum, teams, users } from './core';

/**
 * An invitation to join a team with a role. The link's token is never stored: only its SHA-256
 * hash, so that a copy of the database does not hand out accounts. Accepting creates the user and
 * stamps accepted_at in the same transaction; a revoked, accepted or expired row is refused.
 */
export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: roleEnum('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedUserId: uuid('accepted_user_id').references(() => users.id, { onDelete: 'set null' }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('invitations_team_idx').on(t.teamId)],
);

/** A password-reset link: SHA-256 of the token only, single use (used_at), short-lived. */
export const passwordResetTokens = pgTable(
  'password_reset_tokens',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
  },
  (t) => [index('password_reset_tokens_user_idx').on(t.userId)],
);

/**
 * The store of rate-limiter-flexible's RateLimiterPostgres for sign-in attempts (per account and
 * per client address), shared by every app instance. Columns exactly as that library expects
 * (key, points, expire in epoch milliseconds); created here so that no request races to create it.
 */
export const signInLimits = pgTable('sign_in_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: integer('points').notNull().default(0),
  expire: bigint('expire', { mode: 'number' }),
});

/**
 * Sessions ended by signing out before their JWT expired. A session cookie carries its own id
 * (`sid`, server/auth/options.ts); getSessionUser refuses an id listed here, so a copy of the
 * cookie stops working the moment its owner signs out. A row is needed only until the session
 * would have ended anyway (`expires_at`), and is deleted after that.
 */
export const revokedSessions = pgTable(
  'revoked_sessions',
  {
    sessionId: uuid('session_id').primaryKey(),
    userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  },
  (t) => [index('revoked_sessions_expires_idx').on(t.expiresAt)],
);

import { boolean, index, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { sheets, teams, users } from './core';
import { NOTIFICATION_KINDS } from '../../lib/notifications/kinds';

/**
 * What a member is told about (issue 23): a sheet submitted for review (to the team's reviewers),
 * returned or approved (to its author). The list is lib/notifications/kinds' NOTIFICATION_KINDS.
 */
export const notificationKindEnum = pgEnum('notification_kind', NOTIFICATION_KINDS);

/**
 * One in-app notification for one member. The team id rides along so that every query filters by
 * it like any other row; `link` is a path inside the app (the sheet).
 */
export const notifications = pgTable(
  'notifications',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    kind: notificationKindEnum('kind').notNull(),
    sheetId: uuid('sheet_id').references(() => sheets.id, { onDelete: 'cascade' }),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    title: text('title').notNull(),
    body: text('body').notNull().default(''),
    link: text('link').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    readAt: timestamp('read_at', { withTimezone: true }),
  },
  (t) => [index('notifications_team_user_idx').on(t.teamId, t.userId, t.createdAt)],
);

/**
 * A member's choice per kind: by e-mail, in the app. No row means both on (the default), so that
 * existing members are told without a backfill.
 */
export const notificationSettings = pgTable(
  'notification_settings',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    kind: notificationKindEnum('kind').notNull(),
    email: boolean('email').notNull().default(true),
    inApp: boolean('in_app').notNull().default(true),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('notification_settings_user_kind').on(t.userId, t.kind)],
);

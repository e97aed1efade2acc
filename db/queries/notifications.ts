/**
 * Notifications (issue 23): in-app rows and the members' choices per kind. Every function takes
 * the team id first; a member only ever reads or marks their own rows.
 *
 * The in-app rows of a review action are written in the action's own transaction (they exist
 * exactly when the action does); mail goes out after the commit, from server/notifications, so
 * that a mail server that is down never undoes a review decision.
 */
import { and, desc, eq, inArray, isNull, ne, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { notifications, notificationSettings, users } from '../schema';
import { ROLES, can } from '../../lib/auth/permissions';
import {
  DEFAULT_CHOICE,
  NOTIFICATION_KINDS,
  notificationTitle,
  type NotificationChoice,
  type NotificationKind,
} from '../../lib/notifications/kinds';

/** A mail to send after the commit: who, and what about. */
export interface MailNotice {
  kind: NotificationKind;
  to: string;
  recipientName: string;
  title: string;
  sheetId: string;
  /** Path inside the app; the mail turns it into a full link. */
  link: string;
}

export interface TransitionForNotice {
  kind: NotificationKind;
  actorId: string;
  actorName: string;
  sheet: { id: string; authorId: string; circuitTag: string; title: string; revision: number };
}

const REVIEWER_ROLES = ROLES.filter((role) => can(role, 'sheet:review'));

/** Who is told of this action: the team's reviewers on submit, the author on return/approve; never the one who acted. */
async function recipientsOf(tx: Executor, teamId: string, event: TransitionForNotice) {
  const base = and(eq(users.teamId, teamId), eq(users.active, true), ne(users.id, event.actorId));
  const who =
    event.kind === 'sheet_submitted'
      ? and(base, inArray(users.role, [...REVIEWER_ROLES]))
      : and(base, eq(users.id, event.sheet.authorId));
  return tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(who);
}

async function choicesOf(tx: Executor, teamId: string, userIds: string[], kind: NotificationKind): Promise<Map<string, NotificationChoice>> {
  if (userIds.length === 0) return new Map();
  const rows = await tx
    .select({ userId: notificationSettings.userId, email: notificationSettings.email, inApp: notificationSettings.inApp })
    .from(notificationSettings)
    .where(and(eq(notificationSettings.teamId, teamId), eq(notificationSettings.kind, kind), inArray(notificationSettings.userId, userIds)));
  return new Map(rows.map((r) => [r.userId, { email: r.email, inApp: r.inApp }]));
}

/** Writes the in-app rows of a review action (inside its transaction) and answers the mail to send after it. */
export async function recordTransitionNotices(tx: Executor, teamId: string, event: TransitionForNotice): Promise<MailNotice[]> {
  const recipients = await recipientsOf(tx, teamId, event);
  const choices = await choicesOf(tx, teamId, recipients.map((r) => r.id), event.kind);
  const title = notificationTitle(event.kind, event.sheet, event.actorName);
  const link = `/sheets/${event.sheet.id}`;
  const inApp = recipients.filter((r) => (choices.get(r.id) ?? DEFAULT_CHOICE).inApp);
  if (inApp.length > 0) {
    await tx.insert(notifications).values(
      inApp.map((r) => ({ teamId, userId: r.id, kind: event.kind, sheetId: event.sheet.id, actorId: event.actorId, title, link })),
    );
  }
  return recipients
    .filter((r) => (choices.get(r.id) ?? DEFAULT_CHOICE).email)
    .map((r) => ({ kind: event.kind, to: r.email, recipientName: r.name, title, sheetId: event.sheet.id, link }));
}

export async function listNotifications(teamId: string, userId: string, limit = 100) {
  return getDb()
    .select({
      id: notifications.id,
      kind: notifications.kind,
      title: notifications.title,
      body: notifications.body,
      link: notifications.link,
      createdAt: notifications.createdAt,
      readAt: notifications.readAt,
    })
    .from(notifications)
    .where(and(eq(notifications.teamId, teamId), eq(notifications.userId, userId)))
    .orderBy(desc(notifications.createdAt), desc(notifications.id))
    .limit(limit);
}

export async function unreadNotificationCount(teamId: string, userId: string): Promise<number> {
  const [row] = await getDb()
    .select({ count: sql<number>`count(*)::int` })
    .from(notifications)
    .where(and(eq(notifications.teamId, teamId), eq(notifications.userId, userId), isNull(notifications.readAt)));
  return row?.count ?? 0;
}

/** Marks one of the member's own notifications read (another member's or team's id changes nothing). */
export async function markNotificationRead(teamId: string, userId: string, notificationId: string): Promise<boolean> {
  const updated = await getDb()
    .update(notifications)
    .set({ readAt: new Date() })
    .where(and(eq(notifications.teamId, teamId), eq(notifications.userId, userId), eq(notifications.id, notificationId), isNull(notifications.readAt)))
    .returning({ id: notifications.id });
  return updated.length > 0;
}

export async function markAllNotificationsRead(teamId: string, userId: string): Promise<number> {
  const updated = await getDb()
    .update(notifications)
    .set({ readAt: new Date() })
    .where(and(eq(notifications.teamId, teamId), eq(notifications.userId, userId), isNull(notifications.readAt)))
    .returning({ id: notifications.id });
  return updated.length;
}

export async function getNotificationSettings(teamId: string, userId: string): Promise<Record<NotificationKind, NotificationChoice>> {
  const rows = await getDb()
    .select({ kind: notificationSettings.kind, email: notificationSettings.email, inApp: notificationSettings.inApp })
    .from(notificationSettings)
    .where(and(eq(notificationSettings.teamId, teamId), eq(notificationSettings.userId, userId)));
  const settings = Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, { ...DEFAULT_CHOICE }])) as Record<NotificationKind, NotificationChoice>;
  for (const row of rows) settings[row.kind] = { email: row.email, inApp: row.inApp };
  return settings;
}

export async function saveNotificationSettings(teamId: string, userId: string, settings: Record<NotificationKind, NotificationChoice>): Promise<void> {
  await getDb().transaction(async (tx) => {
    for (const kind of NOTIFICATION_KINDS) {
      const choice = settings[kind];
      await tx
        .insert(notificationSettings)
        .values({ teamId, userId, kind, email: choice.email, inApp: choice.inApp })
        .onConflictDoUpdate({ target: [notificationSettings.userId, notificationSettings.kind], set: { email: choice.email, inApp: choice.inApp, updatedAt: new Date() } });
    }
  });
}

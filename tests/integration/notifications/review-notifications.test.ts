// Review notifications (issue 23) against the real PostgreSQL server and the local mail catcher:
// submit tells the team's reviewers (the roles holding sheet:review), return and approve tell the
// author; nobody of another team, nor the one who acted, hears of it; each member's settings are
// honoured per kind and channel; a mail server that is down does not undo the decision.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { getSheet } from '@/db/queries/sheets';
import {
  getNotificationSettings,
  listNotifications,
  markAllNotificationsRead,
  markNotificationRead,
  saveNotificationSettings,
  unreadNotificationCount,
} from '@/db/queries/notifications';
import { transitionSheetAndNotify } from '@/server/notifications/mail';
import type { Role } from '@/lib/auth/permissions';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { acknowledgeEveryReviewFlag, actorOf, newSubmittableSheet } from '../../helpers/reviewSteps';

// Links in mail need the app's public address; the integration step of `npm test` has no app running.
process.env.NEXTAUTH_URL ??= 'http://127.0.0.1:3000';

afterAll(() => closeDb());

type Person = { id: string; role: Role; email: string };
const people = {} as Record<'author' | 'designer2' | 'reviewer' | 'reviewer2' | 'admin' | 'viewer' | 'retired' | 'otherReviewer' | 'otherAdmin', Person>;
let teamId: string;
let otherTeamId: string;
let projectId: string;

interface Caught {
  to: string[];
  subject: string;
  text: string;
}

async function caughtMail(): Promise<Caught[]> {
  const catcher = process.env.MAIL_CATCHER_URL;
  if (!catcher) throw new Error('MAIL_CATCHER_URL is not set: run through npm test');
  return (await (await fetch(`${catcher}/messages`)).json()) as Caught[];
}

/** Mail about this sheet to each address, waiting a little for the SMTP round trip. */
async function mailAbout(sheetId: string, subjectPart: string): Promise<Caught[]> {
  // sendMail resolves once the catcher accepted the message, so one read is enough.
  return (await caughtMail()).filter((m) => m.text.includes(`/sheets/${sheetId}`) && m.subject.includes(subjectPart));
}

const recipientsOf = (mail: Caught[]) => mail.flatMap((m) => m.to).sort();
async function inAppAbout(person: Person, sheetId: string) {
  return (await listNotifications(teamId, person.id)).filter((n) => n.link === `/sheets/${sheetId}`);
}

beforeAll(async () => {
  const team = await createTestTeam('notify');
  const other = await createTestTeam('notify-other');
  teamId = team.id;
  otherTeamId = other.id;
  people.author = await createTestUser(teamId, 'designer');
  people.designer2 = await createTestUser(teamId, 'designer');
  people.reviewer = await createTestUser(teamId, 'reviewer');
  people.reviewer2 = await createTestUser(teamId, 'reviewer');
  people.admin = await createTestUser(teamId, 'admin');
  people.viewer = await createTestUser(teamId, 'viewer');
  people.retired = await createTestUser(teamId, 'reviewer', { active: false });
  people.otherReviewer = await createTestUser(otherTeamId, 'reviewer');
  people.otherAdmin = await createTestUser(otherTeamId, 'admin');
  projectId = (await createProject(teamId, people.author.id, { name: 'Notification test project' })).id;
});

describe('who is told', () => {
  it('a submission reaches the team’s active reviewers and admins in the app and by mail, with a link to the sheet', async () => {
    const sheetId = await newSubmittableSheet(teamId, projectId, people.author);
    const outcome = await transitionSheetAndNotify(teamId, actorOf(people.author), sheetId, 'submit');
    expect(outcome.mail).toEqual({ sent: 3, failed: 0 });
    for (const who of [people.reviewer, people.reviewer2, people.admin]) {
      const items = await inAppAbout(who, sheetId);
      expect(items).toHaveLength(1);
      expect(items[0].kind).toBe('sheet_submitted');
      expect(items[0].readAt).toBeNull();
      expect(items[0].title).toMatch(/submitted .* for review/);
    }
    for (const who of [people.author, people.designer2, people.viewer, people.retired]) expect(await inAppAbout(who, sheetId)).toHaveLength(0);
    const mail = await mailAbout(sheetId, 'submitted');
    expect(recipientsOf(mail)).toEqual([people.reviewer.email, people.reviewer2.email, people.admin.email].sort());
    expect(mail[0].text).toContain(`${process.env.NEXTAUTH_URL}/sheets/${sheetId}`);
  });

  it('nobody of another team hears of it, not even its admins and reviewers', async () => {
    const sheetId = await newSubmittableSheet(teamId, projectId, people.author);
    await transitionSheetAndNotify(teamId, actorOf(people.author), sheetId, 'submit');
    for (const who of [people.otherReviewer, people.otherAdmin]) {
      expect(await listNotifications(otherTeamId, who.id)).toHaveLength(0);
      // Asking with the wrong team id finds nothing either.
      expect(await listNotifications(teamId, who.id)).toHaveLength(0);
    }
    expect(recipientsOf(await mailAbout(sheetId, 'submitted'))).not.toContain(people.otherReviewer.email);
    expect(recipientsOf(await mailAbout(sheetId, 'submitted'))).not.toContain(people.otherAdmin.email);
  });

  it('a return and an approval reach the author, not the reviewer who decided', async () => {
    const returned = await newSubmittableSheet(teamId, projectId, people.author);
    await transitionSheetAndNotify(teamId, actorOf(people.author), returned, 'submit');
    await transitionSheetAndNotify(teamId, actorOf(people.reviewer), returned, 'return', { comment: 'Enter the measured ambient.' });
    const toAuthor = await inAppAbout(people.author, returned);
    expect(toAuthor.map((n) => n.kind)).toEqual(['sheet_returned']);
    expect((await inAppAbout(people.reviewer, returned)).map((n) => n.kind)).toEqual(['sheet_submitted']);
    expect(recipientsOf(await mailAbout(returned, 'returned'))).toEqual([people.author.email]);

    const approved = await newSubmittableSheet(teamId, projectId, people.author);
    await transitionSheetAndNotify(teamId, actorOf(people.author), approved, 'submit');
    await acknowledgeEveryReviewFlag(teamId, approved, people.reviewer);
    await transitionSheetAndNotify(teamId, actorOf(people.reviewer), approved, 'approve');
    expect((await inAppAbout(people.author, approved)).map((n) => n.kind)).toEqual(['sheet_approved']);
    expect(recipientsOf(await mailAbout(approved, 'approved'))).toEqual([people.author.email]);
  });

  it('withdrawing tells nobody', async () => {
    const sheetId = await newSubmittableSheet(teamId, projectId, people.author);
    await transitionSheetAndNotify(teamId, actorOf(people.author), sheetId, 'submit');
    const before = await unreadNotificationCount(teamId, people.reviewer.id);
    await transitionSheetAndNotify(teamId, actorOf(people.author), sheetId, 'withdraw');
    expect(await unreadNotificationCount(teamId, people.reviewer.id)).toBe(before);
  });
});

describe('settings', () => {
  it('start with everything on, and a channel turned off is honoured for that kind only', async () => {
    const defaults = await getNotificationSettings(teamId, people.reviewer2.id);
    expect(Object.values(defaults).every((c) => c.email && c.inApp)).toBe(true);
    await saveNotificationSettings(teamId, people.reviewer2.id, { ...defaults, sheet_submitted: { email: false, inApp: true } });
    const adminDefaults = await getNotificationSettings(teamId, people.admin.id);
    await saveNotificationSettings(teamId, people.admin.id, { ...adminDefaults, sheet_submitted: { email: true, inApp: false } });
    const authorDefaults = await getNotificationSettings(teamId, people.author.id);
    await saveNotificationSettings(teamId, people.author.id, { ...authorDefaults, sheet_returned: { email: false, inApp: false } });

    const sheetId = await newSubmittableSheet(teamId, projectId, people.author);
    await transitionSheetAndNotify(teamId, actorOf(people.author), sheetId, 'submit');
    expect(await inAppAbout(people.reviewer2, sheetId)).toHaveLength(1);
    expect(await inAppAbout(people.admin, sheetId)).toHaveLength(0);
    expect(recipientsOf(await mailAbout(sheetId, 'submitted'))).toEqual([people.reviewer.email, people.admin.email].sort());

    await transitionSheetAndNotify(teamId, actorOf(people.reviewer), sheetId, 'return', { comment: 'Check the grouping.' });
    expect(await inAppAbout(people.author, sheetId)).toHaveLength(0);
    expect(await mailAbout(sheetId, 'returned')).toHaveLength(0);
    // The author kept approvals on.
    expect((await getNotificationSettings(teamId, people.author.id)).sheet_approved).toEqual({ email: true, inApp: true });
  });
});

describe('marking read', () => {
  it('a member marks their own notifications read, never another member’s or another team’s', async () => {
    const sheetId = await newSubmittableSheet(teamId, projectId, people.author);
    await transitionSheetAndNotify(teamId, actorOf(people.author), sheetId, 'submit');
    const [mine] = await inAppAbout(people.reviewer, sheetId);
    const unread = await unreadNotificationCount(teamId, people.reviewer.id);
    expect(unread).toBeGreaterThan(0);
    expect(await markNotificationRead(teamId, people.reviewer2.id, mine.id)).toBe(false);
    expect(await markNotificationRead(otherTeamId, people.reviewer.id, mine.id)).toBe(false);
    expect(await unreadNotificationCount(teamId, people.reviewer.id)).toBe(unread);
    expect(await markNotificationRead(teamId, people.reviewer.id, mine.id)).toBe(true);
    expect(await unreadNotificationCount(teamId, people.reviewer.id)).toBe(unread - 1);
    expect(await markAllNotificationsRead(teamId, people.reviewer.id)).toBe(unread - 1);
    expect(await unreadNotificationCount(teamId, people.reviewer.id)).toBe(0);
    expect(await unreadNotificationCount(teamId, people.reviewer2.id)).toBeGreaterThan(0);
  });
});

describe('when mail is down', () => {
  it('the submission stands, the in-app notification is written, and the failure is counted, not thrown', async () => {
    const holder = globalThis as unknown as { ampwardenMailer?: unknown };
    const savedPort = process.env.SMTP_PORT;
    holder.ampwardenMailer = undefined;
    // Port 9 (discard) on loopback has no listener here: the connection is refused at once.
    process.env.SMTP_PORT = '9';
    try {
      const sheetId = await newSubmittableSheet(teamId, projectId, people.author);
      const outcome = await transitionSheetAndNotify(teamId, actorOf(people.author), sheetId, 'submit');
      expect(outcome.status).toBe('in_review');
      expect(outcome.mail.sent).toBe(0);
      expect(outcome.mail.failed).toBeGreaterThan(0);
      expect((await getSheet(teamId, sheetId))!.status).toBe('in_review');
      expect(await inAppAbout(people.reviewer, sheetId)).toHaveLength(1);
    } finally {
      process.env.SMTP_PORT = savedPort;
      holder.ampwardenMailer = undefined;
    }
  });
});

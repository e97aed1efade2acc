/**
 * Mail of the review notifications (issue 23), sent after the review decision is committed. A mail
 * server that is down or refuses a message is logged and skipped: the decision stands, and the
 * in-app notification (written with it) still tells the member.
 */
import type { MailNotice } from '@/db/queries/notifications';
import { transitionSheet, type TransitionAction } from '@/db/queries/sheets';
import type { Actor } from '@/lib/sheet';
import { appBaseUrl, sendMail } from '@/server/mail/send';
import { notificationMail } from '@/server/mail/templates';

export interface MailOutcome {
  sent: number;
  failed: number;
}

export async function sendNoticeMail(notices: readonly MailNotice[]): Promise<MailOutcome> {
  let sent = 0;
  let failed = 0;
  for (const notice of notices) {
    try {
      await sendMail(notificationMail({ to: notice.to, recipientName: notice.recipientName, title: notice.title, kind: notice.kind, link: `${appBaseUrl()}${notice.link}` }));
      sent += 1;
    } catch (error) {
      failed += 1;
      console.error(`[notifications] mail about sheet ${notice.sheetId} (${notice.kind}) was not sent: ${error instanceof Error ? error.message : String(error)}`);
    }
  }
  return { sent, failed };
}

/** A review action and then its mail: what the transitions route and tests call. */
export async function transitionSheetAndNotify(
  teamId: string,
  actor: Actor,
  sheetId: string,
  action: TransitionAction,
  options: { comment?: string; expectedVersion?: number } = {},
) {
  const { notices, ...updated } = await transitionSheet(teamId, actor, sheetId, action, options);
  const mail = await sendNoticeMail(notices);
  return { ...updated, mail };
}

/** The wording of the mail Ampwarden sends: plain text first, a simple HTML twin beside it. */
import { ROLE_LABELS, type Role } from '@/lib/auth/permissions';
import type { OutgoingMail } from './send';
import type { NotificationKind } from '@/lib/notifications/kinds';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function html(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('');
  return `<div style="font-family:sans-serif;color:#1a2431">${body}<p><a href="${escapeHtml(link.href)}" style="color:#9a5a2e">${escapeHtml(link.label)}</a></p></div>`;
}

export function invitationMail(input: { to: string; teamName: string; inviterName: string; role: Role; link: string; expiresAt: Date }): OutgoingMail {
  const until = input.expiresAt.toISOString().replace('T', ' ').slice(0, 16);
  const lines = [
    `${input.inviterName} has invited you to the team "${input.teamName}" on Ampwarden as ${ROLE_LABELS[input.role].toLowerCase()}.`,
    `Open the link below to choose your password. It works once and until ${until} UTC.`,
    'If you did not expect this invitation, ignore this message; nothing happens until the link is opened.',
  ];
  return {
    to: input.to,
    subject: `Join ${input.teamName} on Ampwarden`,
    text: `${lines[0]}\n\n${lines[1]}\n\n${input.link}\n\n${lines[2]}\n`,
    html: html(lines, { href: input.link, label: 'Choose your password' }),
  };
}

export function passwordResetMail(input: { to: string; link: string; expiresAt: Date }): OutgoingMail {
  const until = input.expiresAt.toISOString().replace('T', ' ').slice(0, 16);
  const lines = [
    'Someone asked to set a new password for your Ampwarden account.',
    `Open the link below to choose it. It works once and until ${until} UTC; your other sessions end when the new password is saved.`,
    'If it was not you, ignore this message: your password stays as it is.',
  ];
  return {
    to: input.to,
    subject: 'A new password for Ampwarden',
    text: `${lines[0]}\n\n${lines[1]}\n\n${input.link}\n\n${lines[2]}\n`,
    html: html(lines, { href: input.link, label: 'Choose a new password' }),
  };
}

const NOTICE_ENDINGS: Record<NotificationKind, string> = {
  sheet_submitted: 'It waits for a reviewer of your team: open it to check the flags and approve or return it.',
  sheet_returned: 'Open it to read the reviewer’s comment in its history, change it and submit it again.',
  sheet_approved: 'It is frozen as approved; editing it makes a new revision.',
};

/** A review notification: what happened to which sheet, and the link to it. */
export function notificationMail(input: { to: string; recipientName: string; title: string; kind: NotificationKind; link: string }): OutgoingMail {
  const lines = [
    `${input.title}.`,
    NOTICE_ENDINGS[input.kind],
    'You can turn these messages off on the Notifications page of Ampwarden (settings).',
  ];
  return {
    to: input.to,
    subject: input.title,
    text: `${lines[0]}\n\n${lines[1]}\n\n${input.link}\n\n${lines[2]}\n`,
    html: html(lines, { href: input.link, label: 'Open the sizing sheet' }),
  };
}

/**
 * The kinds of notification (issue 23) and who receives each. Pure: the database enum, the
 * settings page and the sending code read this one table.
 */
export const NOTIFICATION_KINDS = ['sheet_submitted', 'sheet_returned', 'sheet_approved'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

export const NOTIFICATION_LABELS: Readonly<Record<NotificationKind, { label: string; who: string }>> = {
  sheet_submitted: { label: 'A sheet is submitted for review', who: 'sent to the reviewers of your team' },
  sheet_returned: { label: 'My sheet is returned', who: 'sent to the sheet’s author' },
  sheet_approved: { label: 'My sheet is approved', who: 'sent to the sheet’s author' },
};

/** Which review action sends which kind; withdraw tells nobody. */
export function notificationKindOf(action: string): NotificationKind | null {
  if (action === 'submit') return 'sheet_submitted';
  if (action === 'return') return 'sheet_returned';
  if (action === 'approve') return 'sheet_approved';
  return null;
}

export interface NotificationChoice {
  email: boolean;
  inApp: boolean;
}

export const DEFAULT_CHOICE: NotificationChoice = { email: true, inApp: true };

/** The words of one notification (in the app and the mail subject). */
export function notificationTitle(kind: NotificationKind, sheet: { circuitTag: string; title: string; revision: number }, actorName: string): string {
  const what = `${sheet.circuitTag} “${sheet.title}” (revision ${sheet.revision})`;
  if (kind === 'sheet_submitted') return `${actorName} submitted ${what} for review`;
  if (kind === 'sheet_returned') return `${actorName} returned ${what}`;
  return `${actorName} approved ${what}`;
}

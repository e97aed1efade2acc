'use server';
/** Form posts of the notifications page: mark read (one, all), and the member's choices per kind. */
import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { markAllNotificationsRead, markNotificationRead, saveNotificationSettings } from '@/db/queries/notifications';
import { isUuid } from '@/db/queries/sheets';
import { NOTIFICATION_KINDS, type NotificationChoice, type NotificationKind } from '@/lib/notifications/kinds';
import { authorizeAction } from '@/server/auth/actions';

const idSchema = z.string().refine(isUuid, 'No such notification.');

export async function markReadAction(formData: FormData): Promise<void> {
  const user = await authorizeAction('authenticated');
  const parsed = idSchema.safeParse(formData.get('id'));
  if (!parsed.success) return;
  await markNotificationRead(user.teamId, user.id, parsed.data);
  revalidatePath('/', 'layout');
}

export async function markAllReadAction(): Promise<void> {
  const user = await authorizeAction('authenticated');
  await markAllNotificationsRead(user.teamId, user.id);
  revalidatePath('/', 'layout');
}

/** Checkboxes post "on" when ticked and nothing when not: each kind × channel is a boolean. */
const settingsSchema = z.object(
  Object.fromEntries(
    NOTIFICATION_KINDS.flatMap((kind) => [
      [`${kind}.email`, z.literal('on').optional()],
      [`${kind}.inApp`, z.literal('on').optional()],
    ]),
  ),
);

export async function saveSettingsAction(_state: { saved?: boolean; message?: string }, formData: FormData): Promise<{ saved?: boolean; message?: string }> {
  const user = await authorizeAction('authenticated');
  const raw = Object.fromEntries([...formData.entries()].filter(([key]) => NOTIFICATION_KINDS.some((k) => key.startsWith(`${k}.`))));
  const parsed = settingsSchema.safeParse(raw);
  if (!parsed.success) return { message: 'Those settings could not be read; reload the page and try again.' };
  const settings = Object.fromEntries(
    NOTIFICATION_KINDS.map((kind) => [kind, { email: parsed.data[`${kind}.email`] === 'on', inApp: parsed.data[`${kind}.inApp`] === 'on' }]),
  ) as Record<NotificationKind, NotificationChoice>;
  await saveNotificationSettings(user.teamId, user.id, settings);
  revalidatePath('/notifications');
  return { saved: true };
}

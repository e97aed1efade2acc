import Link from 'next/link';
import { getNotificationSettings, listNotifications } from '@/db/queries/notifications';
import { NOTIFICATION_KINDS, NOTIFICATION_LABELS } from '@/lib/notifications/kinds';
import { requirePageUser } from '@/server/auth/session';
import { NotificationSettingsForm } from '@/components/shell/NotificationSettingsForm';
import { markAllReadAction, markReadAction, saveSettingsAction } from './actions';

export const metadata = { title: 'Notifications' };
export const dynamic = 'force-dynamic';

export default async function NotificationsPage() {
  const user = await requirePageUser('team:read');
  const [items, settings] = await Promise.all([listNotifications(user.teamId, user.id), getNotificationSettings(user.teamId, user.id)]);
  const unread = items.filter((n) => !n.readAt).length;
  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_360px]">
      <section aria-labelledby="notifications-heading">
        <div className="flex items-baseline gap-3">
          <h1 id="notifications-heading" className="text-title">Notifications</h1>
          <span className="num text-ink-600" data-testid="unread-summary">{unread === 0 ? 'none unread' : `${unread} unread`}</span>
          {unread > 0 ? (
            <form action={markAllReadAction} className="ml-auto">
              <button type="submit" className="btn-quiet">Mark all read</button>
            </form>
          ) : null}
        </div>
        {items.length === 0 ? (
          <p className="panel mt-4 p-6 text-ink-600">Nothing yet. You are told here when a sheet is submitted for your review, or when a sheet of yours is returned or approved.</p>
        ) : (
          <ul className="panel mt-4 divide-y divide-ink-50" data-testid="notification-list">
            {items.map((n) => (
              <li key={n.id} className={`flex flex-wrap items-baseline gap-3 px-4 py-3 ${n.readAt ? 'text-ink-500' : ''}`} data-testid="notification-item" data-read={n.readAt ? 'yes' : 'no'}>
                <span aria-hidden="true">{n.readAt ? '○' : '●'}</span>
                <span className="sr-only">{n.readAt ? 'Read:' : 'Unread:'}</span>
                <Link href={n.link} className={`${n.readAt ? '' : 'font-semibold'} text-copper-700 hover:underline`}>{n.title}</Link>
                <span className="num text-caption">{n.createdAt.toISOString().slice(0, 16).replace('T', ' ')} UTC</span>
                {!n.readAt ? (
                  <form action={markReadAction} className="ml-auto">
                    <input type="hidden" name="id" value={n.id} />
                    <button type="submit" className="btn-quiet">Mark read</button>
                  </form>
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </section>
      <aside>
        <NotificationSettingsForm
          action={saveSettingsAction}
          kinds={NOTIFICATION_KINDS.map((kind) => ({ kind, ...NOTIFICATION_LABELS[kind], ...settings[kind] }))}
        />
      </aside>
    </div>
  );
}

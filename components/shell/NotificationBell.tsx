import Link from 'next/link';

/** The bell in the workspace header: how many notifications are unread, as a number and in words. */
export function NotificationBell({ unread }: { unread: number }) {
  const words = unread === 0 ? 'Notifications, none unread' : `Notifications, ${unread} unread`;
  return (
    <Link href="/notifications" aria-label={words} title={words} data-testid="notification-bell" className="relative flex items-center gap-1 rounded px-2 py-1 text-ink-100 hover:bg-ink-800">
      <svg aria-hidden="true" viewBox="0 0 20 20" width="18" height="18" fill="none" stroke="currentColor" strokeWidth="1.6">
        <path d="M10 2.5a5 5 0 0 0-5 5v3.2L3.5 13.5h13L15 10.7V7.5a5 5 0 0 0-5-5Z" strokeLinejoin="round" />
        <path d="M8 15.5a2 2 0 0 0 4 0" strokeLinecap="round" />
      </svg>
      {unread > 0 ? (
        <span data-testid="notification-count" className="num min-w-5 rounded-full bg-copper-500 px-1.5 text-center text-caption font-semibold text-white">
          {unread > 99 ? '99+' : unread}
        </span>
      ) : null}
    </Link>
  );
}

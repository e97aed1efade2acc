import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Wordmark } from '@/components/shell/Wordmark';
import { teamMailAddresses } from '@/db/queries/members';
import { requirePageUser } from '@/server/auth/session';
import { devMailboxEnabled } from '@/server/mail/mailbox';

export const metadata = { title: 'Mailbox (local)' };
export const dynamic = 'force-dynamic';

interface CaughtMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** Plain text with its web addresses made into links (the text itself is never rendered as HTML). */
function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return (
    <>
      {parts.map((part, index) =>
        /^https?:\/\//.test(part) ? (
          <a key={index} href={part} className="break-all text-copper-600 underline">
            {part}
          </a>
        ) : (
          <span key={index}>{part}</span>
        ),
      )}
    </>
  );
}

/**
 * The messages the app sent while the local mail catcher is in use (npm start, npm test). They
 * hold reset and invitation links, so: only in a local development mode (server/mail/mailbox.ts;
 * 404 otherwise, as in production), only for a signed-in admin (anyone else is sent to sign in or
 * gets 403), and only the mail of that admin's own team. An invited person gets their link from
 * the admin who invited them, as they would pass on a link that arrived by real mail.
 */
export default async function MailboxPage() {
  const catcherUrl = process.env.MAIL_CATCHER_URL;
  if (!catcherUrl || !devMailboxEnabled()) notFound();
  const admin = await requirePageUser('members:manage');
  const ours = await teamMailAddresses(admin.teamId);
  let messages: CaughtMessage[] | null = null;
  try {
    const response = await fetch(`${catcherUrl.replace(/\/$/, '')}/messages`, { cache: 'no-store' });
    if (response.ok) messages = ((await response.json()) as CaughtMessage[]).filter((m) => m.to.some((to) => ours.has(to.trim().toLowerCase())));
  } catch {
    messages = null;
  }
  return (
    <div className="min-h-screen bg-paper">
      <header className="bg-ink-900">
        <div className="mx-auto flex h-12 max-w-4xl items-center justify-between px-6">
          <Link href="/" aria-label="Ampwarden home">
            <Wordmark />
          </Link>
          <span className="text-caption text-ink-300">local mail catcher</span>
        </div>
      </header>
      <main className="mx-auto max-w-4xl px-6 py-8">
        <h1 className="text-title">Mailbox</h1>
        <p className="mt-2 text-ink-600">Mail the app sent on this machine to {admin.teamName}: its members, the people it invited and the recipients of its sheets. Nothing here left the computer; newest first.</p>
        {messages === null ? (
          <p role="alert" className="mt-6 rounded-md border border-over/40 bg-over-light px-3 py-2 text-over-dark">
            The mail catcher at {catcherUrl} does not answer. It runs with npm start; restart it if it stopped.
          </p>
        ) : messages.length === 0 ? (
          <p className="mt-6 text-ink-500">No mail yet. Invitations and password links appear here.</p>
        ) : (
          <ol className="mt-6 space-y-4">
            {messages.map((message) => (
              <li key={message.id} className="panel p-4">
                <article aria-label={message.subject}>
                  <header className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
                    <h2 className="text-lead font-semibold">{message.subject || '(no subject)'}</h2>
                    <time dateTime={message.receivedAt} className="num text-caption text-ink-500">
                      {message.receivedAt.replace('T', ' ').slice(0, 19)} UTC
                    </time>
                  </header>
                  <p className="mt-1 text-caption text-ink-600">
                    to {message.to.join(', ')} · from {message.from}
                  </p>
                  <pre className="mt-3 whitespace-pre-wrap font-sans text-body text-ink-800">
                    <Linkified text={message.text} />
                  </pre>
                </article>
              </li>
            ))}
          </ol>
        )}
      </main>
    </div>
  );
}

/**
 * When /dev/mailbox (the local mail catcher's messages, reset and invitation links included) may be
 * shown at all. Only in a local development mode: the mail catcher is in use (MAIL_CATCHER_URL),
 * and either the server runs in development (`next dev`) or the mailbox was explicitly enabled with
 * AMPWARDEN_DEV_MAILBOX=1 (a production build, or any other NODE_ENV, needs that) — which `npm start` and `npm test` do for their own mail catcher, and a
 * production installation never does. Even then only a signed-in admin sees it, and only mail to
 * their own team's members, invitees and sheet recipients (app/dev/mailbox/page.tsx).
 */
export function devMailboxEnabled(
  env: Record<string, string | undefined> = process.env,
  // Written out as `process.env.NODE_ENV` so that the build fixes it ("production" in `next build`),
  // whatever NODE_ENV the server process itself was started with.
  nodeEnv: string | undefined = process.env.NODE_ENV,
): boolean {
  if (!env.MAIL_CATCHER_URL) return false;
  if (env.AMPWARDEN_DEV_MAILBOX === '0') return false;
  if (nodeEnv === 'development') return true;
  return env.AMPWARDEN_DEV_MAILBOX === '1';
}

/**
 * Next.js instrumentation. register() runs once when a server process starts: on the Node.js
 * runtime it records each request's socket address for the per-address limits
 * (server/http/peerAddress.ts).
 */
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { installPeerAddressHeader } = await import('./server/http/peerAddress');
    installPeerAddressHeader();
  }
}

/** A page or route that failed because PostgreSQL is unreachable closes the page gate at once (server/http/databaseGate.ts). */
export async function onRequestError(error: unknown) {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const [{ isDatabaseUnreachable }, { markDatabaseDown }] = await Promise.all([import('./server/http/errors'), import('./server/http/databaseGate')]);
  if (isDatabaseUnreachable(error)) markDatabaseDown();
}

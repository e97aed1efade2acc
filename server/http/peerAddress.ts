/**
 * Records the TCP peer of every request in PEER_ADDRESS_HEADER before Next.js sees the request,
 * replacing whatever a client wrote there, so that server/http/clientAddress.ts can tell the real
 * socket address from the forwarded headers a client chose. Next's route handlers are given no
 * socket, and Next itself only fills in X-Forwarded-For when it is missing.
 *
 * Installed once per process by instrumentation.ts (Node.js runtime): wraps http.Server#emit for
 * the 'request' event, which is how Node hands every request to Next's server.
 */
import http from 'node:http';
import { PEER_ADDRESS_HEADER } from './clientAddress';

const holder = globalThis as unknown as { ampwardenPeerAddressInstalled?: boolean };

export function installPeerAddressHeader(): void {
  if (holder.ampwardenPeerAddressInstalled) return;
  holder.ampwardenPeerAddressInstalled = true;
  const emit = http.Server.prototype.emit;
  http.Server.prototype.emit = function emitWithPeer(this: http.Server, event: string | symbol, ...args: unknown[]) {
    if (event === 'request') {
      const request = args[0] as http.IncomingMessage;
      request.headers[PEER_ADDRESS_HEADER] = request.socket?.remoteAddress ?? '';
    }
    return emit.apply(this, [event, ...args] as Parameters<typeof emit>);
  } as typeof emit;
}

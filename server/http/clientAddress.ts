/**
 * The address a request came from, for the per-address limits (sign-in, reset mail, anonymous
 * PDFs). Forwarded headers are whatever the client wrote unless a proxy we trust wrote them: Next
 * only adds `X-Forwarded-For` when the request has none, so a client that sends its own picks its
 * own address. The rule is therefore:
 *
 * - the socket address (the TCP peer), which the server records in PEER_ADDRESS_HEADER on every
 *   request (server/http/peerAddress.ts, installed by instrumentation.ts) over anything the client sent;
 * - only when that peer is one of the configured proxies (AMPWARDEN_TRUSTED_PROXIES, a comma-separated
 *   list of IP addresses; empty by default, so nothing is trusted), the right-most
 *   `X-Forwarded-For` entry that is not itself a trusted proxy — the one our own proxy saw.
 *
 * Without a recorded peer (code run outside `next start` / `next dev`) every caller shares the one
 * address 'unknown': the limits then hold for everyone together rather than for nobody.
 */
export const PEER_ADDRESS_HEADER = 'x-ampwarden-peer-address';

export const UNKNOWN_ADDRESS = 'unknown';

type HeaderSource = { get(name: string): string | null } | Record<string, string | string[] | undefined>;

function reader(headers: HeaderSource): (name: string) => string | null {
  if (typeof (headers as { get?: unknown }).get === 'function') return (name) => (headers as { get(name: string): string | null }).get(name);
  return (name) => {
    const value = (headers as Record<string, string | string[] | undefined>)[name];
    return Array.isArray(value) ? value.join(',') : (value ?? null);
  };
}

/** `::ffff:192.0.2.1` (an IPv4 peer on a dual-stack socket) is 192.0.2.1; case and brackets do not matter. */
export function normaliseAddress(raw: string): string {
  // 64 characters hold any IPv6 text form; longer is not an address and must not grow the limiter's keys.
  const trimmed = raw.trim().replace(/^\[|\]$/g, '').toLowerCase().slice(0, 64);
  return trimmed.startsWith('::ffff:') && trimmed.includes('.') ? trimmed.slice('::ffff:'.length) : trimmed;
}

/** The configured proxies; read each time so that a test or an operator can change the setting. */
export function trustedProxies(setting = process.env.AMPWARDEN_TRUSTED_PROXIES ?? ''): Set<string> {
  return new Set(
    setting
      .split(',')
      .map((entry) => entry.trim())
      .filter(Boolean)
      .map(normaliseAddress),
  );
}

export function clientAddressFrom(headers: HeaderSource, trusted: Set<string> = trustedProxies()): string {
  const read = reader(headers);
  const peerRaw = read(PEER_ADDRESS_HEADER);
  if (!peerRaw || !peerRaw.trim()) return UNKNOWN_ADDRESS;
  const peer = normaliseAddress(peerRaw);
  if (!trusted.has(peer)) return peer;
  const hops = (read('x-forwarded-for') ?? '')
    .split(',')
    .map((part) => part.trim())
    .filter(Boolean)
    .map(normaliseAddress);
  // From the nearest hop outwards: the first address that is not one of our proxies is the client.
  for (let i = hops.length - 1; i >= 0; i -= 1) {
    if (!trusted.has(hops[i])) return hops[i];
  }
  return hops[0] ?? peer;
}

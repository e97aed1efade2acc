// The address the per-address limits count (issue 19, item 2): the socket address, unless the
// socket is a configured proxy; then the nearest X-Forwarded-For entry that is not one of ours.
// The standard right-to-left reading of X-Forwarded-For (RFC 7239 §5.2 describes the same chain for
// the Forwarded header; common practice for proxies).
import { describe, expect, it } from 'vitest';
import { clientAddressFrom, PEER_ADDRESS_HEADER, trustedProxies, UNKNOWN_ADDRESS } from '@/server/http/clientAddress';

const none = trustedProxies('');

describe('clientAddressFrom', () => {
  it('without trusted proxies (the default) a client-written X-Forwarded-For is ignored', () => {
    const headers = new Headers({ [PEER_ADDRESS_HEADER]: '198.51.100.7', 'x-forwarded-for': '203.0.113.9', 'x-real-ip': '192.0.2.4' });
    expect(clientAddressFrom(headers, none)).toBe('198.51.100.7');
  });

  it('behind a configured proxy the nearest untrusted hop counts, not what the client prepended', () => {
    const trusted = trustedProxies('10.0.0.2, 10.0.0.3');
    const headers = { [PEER_ADDRESS_HEADER]: '10.0.0.2', 'x-forwarded-for': '6.6.6.6, 203.0.113.9, 10.0.0.3' };
    expect(clientAddressFrom(headers, trusted)).toBe('203.0.113.9');
  });

  it('an IPv4 peer on a dual-stack socket (::ffff:a.b.c.d) is the IPv4 address, for the setting too', () => {
    expect(clientAddressFrom({ [PEER_ADDRESS_HEADER]: '::ffff:127.0.0.1', 'x-forwarded-for': '203.0.113.1' }, trustedProxies('127.0.0.1'))).toBe('203.0.113.1');
    expect(clientAddressFrom({ [PEER_ADDRESS_HEADER]: '::ffff:192.0.2.1' }, none)).toBe('192.0.2.1');
  });

  it('without a recorded peer every caller shares one address, so the limit still holds', () => {
    expect(clientAddressFrom({ 'x-forwarded-for': '203.0.113.9' }, none)).toBe(UNKNOWN_ADDRESS);
  });
});

// /dev/mailbox only in a local development mode (issue 19, item 7): never with NODE_ENV=production
// unless explicitly enabled, never without the mail catcher. (Who may see it: tests/e2e/hardening.)
import { describe, expect, it } from 'vitest';
import { devMailboxEnabled } from '@/server/mail/mailbox';

const catcher = { MAIL_CATCHER_URL: 'http://127.0.0.1:2580' };

describe('devMailboxEnabled', () => {
  it('production (and any mode but development): off unless AMPWARDEN_DEV_MAILBOX=1', () => {
    expect(devMailboxEnabled(catcher, 'production')).toBe(false);
    expect(devMailboxEnabled({ ...catcher, AMPWARDEN_DEV_MAILBOX: 'true' }, 'production')).toBe(false);
    expect(devMailboxEnabled(catcher, 'test')).toBe(false);
    expect(devMailboxEnabled({ ...catcher, AMPWARDEN_DEV_MAILBOX: '1' }, 'production')).toBe(true);
  });
  it('development: on with the mail catcher, off without it or when switched off', () => {
    expect(devMailboxEnabled(catcher, 'development')).toBe(true);
    expect(devMailboxEnabled({}, 'development')).toBe(false);
    expect(devMailboxEnabled({ ...catcher, AMPWARDEN_DEV_MAILBOX: '0' }, 'development')).toBe(false);
  });
});

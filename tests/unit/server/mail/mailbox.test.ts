// /dev/mailbox only in a local development mode (issue 19, item 7): never with NODE_ENV=production
// unless explicitly enabled, never without the mail catcher. (Who may see it: tests/e2e/hardening.)
import { describe, expect, it } from 'vitest';
import { devMailboxEnabled } from '@/server/mail/mailbox';

const catcher = { MAIL_CATCHER_URL: 'http://127.0.0.1:2580' };

describe('devMailboxEnabled', () => {
  it('production: off unless AMPWARDEN_DEV_MAILBOX=1', () => {
    expect(devMailboxEnabled({ ...catcher, NODE_ENV: 'production' })).toBe(false);
    expect(devMailboxEnabled({ ...catcher, NODE_ENV: 'production', AMPWARDEN_DEV_MAILBOX: 'true' })).toBe(false);
    expect(devMailboxEnabled({ ...catcher, NODE_ENV: 'production', AMPWARDEN_DEV_MAILBOX: '1' })).toBe(true);
  });
  it('development: on with the mail catcher, off without it or when switched off', () => {
    expect(devMailboxEnabled({ ...catcher, NODE_ENV: 'development' })).toBe(true);
    expect(devMailboxEnabled({ NODE_ENV: 'development' })).toBe(false);
    expect(devMailboxEnabled({ ...catcher, NODE_ENV: 'development', AMPWARDEN_DEV_MAILBOX: '0' })).toBe(false);
  });
});

// Which review action tells whom (issue 23): submit, return and approve each have their kind; withdraw tells nobody.
import { describe, expect, it } from 'vitest';
import { notificationKindOf, notificationTitle } from '@/lib/notifications/kinds';

describe('notification kinds', () => {
  it('maps the review actions to their kinds and withdraw to none', () => {
    expect(notificationKindOf('submit')).toBe('sheet_submitted');
    expect(notificationKindOf('return')).toBe('sheet_returned');
    expect(notificationKindOf('approve')).toBe('sheet_approved');
    expect(notificationKindOf('withdraw')).toBeNull();
  });

  it('says who did what to which sheet and revision', () => {
    expect(notificationTitle('sheet_returned', { circuitTag: 'MSB-CH1', title: 'Chiller feeder', revision: 2 }, 'R. Okafor')).toBe('R. Okafor returned MSB-CH1 “Chiller feeder” (revision 2)');
  });
});

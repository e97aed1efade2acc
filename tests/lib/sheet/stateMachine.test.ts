// The review rules of ../shared/design/product.md: a reviewer may not approve a sheet they
// authored; an unacknowledged review flag or any blocker prevents approval; approved is frozen.
import { describe, expect, it } from 'vitest';
import { availableActions, decide, type Actor, type SheetAction, type SheetStatus } from '@/lib/sheet';
import { can, ROLES, type Role } from '@/lib/auth/permissions';

const actorAs = (role: Role, userId = `${role}-1`): Actor => ({ userId, can: (p) => can(role, p) });
const ready = { hasChosenCandidate: true, blockerCodes: [], unacknowledgedReviewCodes: [] };
const STATES: SheetStatus[] = ['draft', 'in_review', 'approved', 'returned'];
const ACTIONS: SheetAction[] = ['edit', 'submit', 'withdraw', 'approve', 'return', 'acknowledge', 'revise'];

/** The expected table, written out from product.md's roles: author is "author-1" (a designer or admin). */
function expected(action: SheetAction, status: SheetStatus, role: Role, isAuthor: boolean): boolean {
  const writes = role === 'designer' || role === 'admin';
  const reviews = role === 'reviewer' || role === 'admin';
  switch (action) {
    case 'edit':
      return writes && (status === 'draft' || status === 'returned');
    case 'submit':
      return writes && (status === 'draft' || status === 'returned');
    case 'withdraw':
      return writes && isAuthor && status === 'in_review';
    case 'approve':
    case 'return':
    case 'acknowledge':
      return reviews && !isAuthor && status === 'in_review';
    case 'revise':
      return writes && status === 'approved';
  }
}

describe('sheet state machine', () => {
  it('matches the role table for every action, state, role and authorship', () => {
    for (const action of ACTIONS) {
      for (const status of STATES) {
        for (const role of ROLES) {
          for (const isAuthor of [true, false]) {
            const actor = actorAs(role, isAuthor ? 'author-1' : 'someone-else');
            const decision = decide(action, { status, authorId: 'author-1' }, actor, ready);
            expect({ action, status, role, isAuthor, allowed: decision.allowed }).toEqual({ action, status, role, isAuthor, allowed: expected(action, status, role, isAuthor) });
          }
        }
      }
    }
  });

  it('refuses approval with a blocker, with an unacknowledged review flag, or without a chosen candidate', () => {
    const sheet = { status: 'in_review' as const, authorId: 'author-1' };
    const reviewer = actorAs('reviewer');
    expect(decide('approve', sheet, reviewer, { ...ready, blockerCodes: ['OVER_LIMIT'] })).toMatchObject({ allowed: false, code: 'blocked' });
    expect(decide('approve', sheet, reviewer, { ...ready, unacknowledgedReviewCodes: ['AMBIENT_ASSUMED'] })).toMatchObject({ allowed: false, code: 'not_ready' });
    expect(decide('approve', sheet, reviewer, { ...ready, hasChosenCandidate: false })).toMatchObject({ allowed: false, code: 'not_ready' });
    expect(decide('approve', sheet, reviewer, undefined)).toMatchObject({ allowed: false });
    expect(decide('approve', sheet, reviewer, ready)).toEqual({ allowed: true });
  });

  it('says why the author cannot approve', () => {
    expect(decide('approve', { status: 'in_review', authorId: 'admin-1' }, actorAs('admin'), ready)).toMatchObject({ allowed: false, code: 'own_sheet' });
  });

  it('shows the approve button to the author never, and to a reviewer even while flags stand (disabled with the reason)', () => {
    const sheet = { status: 'in_review' as const, authorId: 'author-1' };
    expect(availableActions(sheet, actorAs('admin', 'author-1'), ready)).not.toContain('approve');
    expect(availableActions(sheet, actorAs('designer', 'author-1'), ready)).not.toContain('approve');
    expect(availableActions(sheet, actorAs('reviewer'), { ...ready, blockerCodes: ['RUNAWAY'] })).toContain('approve');
  });

  it('only the newest revision of an approved sheet can be revised', () => {
    expect(decide('revise', { status: 'approved', authorId: 'a', hasNewerRevision: true }, actorAs('designer'))).toMatchObject({ allowed: false, code: 'wrong_state' });
  });
});

// Review independence (issue 19, item 3): nobody approves a revision they edited or submitted, nor
// acknowledges its flags (part of approving it) — not even an admin, who holds every right. The
// rule is the issue's; the roles are product.md's "People and roles".
import { describe, expect, it } from 'vitest';
import { availableActions, decide, type Actor } from '@/lib/sheet';
import { can, type Role } from '@/lib/auth/permissions';

const actorAs = (role: Role, userId: string): Actor => ({ userId, can: (p) => can(role, p) });
const ready = { hasChosenCandidate: true, blockerCodes: [], unacknowledgedReviewCodes: [] };
const inReview = { status: 'in_review' as const, authorId: 'designer-1', editorIds: ['designer-1', 'admin-1'], submitterIds: ['designer-2'] };

describe('nobody approves a revision they edited or submitted', () => {
  it('an admin who rewrote the inputs may neither approve nor acknowledge, even with every flag acknowledged', () => {
    const admin = actorAs('admin', 'admin-1');
    expect(decide('approve', inReview, admin, ready)).toMatchObject({ allowed: false, code: 'own_sheet' });
    expect(decide('acknowledge', inReview, admin)).toMatchObject({ allowed: false, code: 'own_sheet' });
    expect(availableActions(inReview, admin, ready)).not.toContain('approve');
  });

  it('whoever submitted the revision may not approve it', () => {
    const admin = actorAs('admin', 'designer-2');
    expect(decide('approve', inReview, admin, ready)).toMatchObject({ allowed: false, code: 'own_sheet', reason: expect.stringMatching(/submitted/) });
  });

  it('a reviewer who took no part approves; returning approves nothing, so an editor may still return it', () => {
    expect(decide('approve', inReview, actorAs('reviewer', 'reviewer-1'), ready)).toEqual({ allowed: true });
    expect(decide('acknowledge', inReview, actorAs('reviewer', 'reviewer-1'))).toEqual({ allowed: true });
    expect(decide('return', inReview, actorAs('admin', 'admin-1'))).toEqual({ allowed: true });
  });

  it('the reason says why, in words', () => {
    const decision = decide('approve', inReview, actorAs('admin', 'admin-1'), ready);
    expect(decision.allowed).toBe(false);
    if (!decision.allowed) expect(decision.reason).toMatch(/edited this revision/);
  });
});

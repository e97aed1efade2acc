/**
 * The review states of a sizing sheet and who may move it between them
 * (../shared/design/product.md: People and roles; Vocabulary; review rules).
 *
 *   draft ──submit──▶ in_review ──approve──▶ approved ──revise──▶ (a new draft revision)
 *     ▲                 │  │
 *     └────withdraw─────┘  └──return──▶ returned ──submit──▶ in_review
 *
 * Pure: the caller passes what the user may do (`can`) and who wrote, edited and submitted the
 * revision, so the same rules run on the server (authoritative) and in the browser (to show only
 * the buttons that will work).
 *
 * Review independence: nobody approves a revision they edited or submitted, nor acknowledges its
 * flags (which is part of approving it) — not even an admin, who holds every right. The author
 * may not review their own sheet at all. Returning a sheet approves nothing, so an editor or
 * submitter who holds the reviewer right may still return it with a comment.
 */
import { flagTitleList } from './flagWords';

export type SheetStatus = 'draft' | 'in_review' | 'approved' | 'returned';
export type SheetAction = 'edit' | 'submit' | 'withdraw' | 'approve' | 'return' | 'acknowledge' | 'revise';
export type SheetPermission = 'sheet:write' | 'sheet:submit' | 'sheet:review';

export interface Actor {
  userId: string;
  can: (permission: SheetPermission) => boolean;
}

export interface SheetForTransition {
  status: SheetStatus;
  authorId: string;
  /** Everyone who saved inputs of this revision (db: sheet_contributions `edited`). */
  editorIds?: readonly string[];
  /** Everyone who submitted this revision for review (db: sheet_contributions `submitted`). */
  submitterIds?: readonly string[];
  /** Set when a newer revision of this sheet exists: only the newest revision may be revised again. */
  hasNewerRevision?: boolean;
}

/** What approval needs besides the role: computed from the server's result snapshot and the acknowledgements. */
export interface ApprovalReadiness {
  hasChosenCandidate: boolean;
  /** `blocker` flags on the chosen candidate (or the candidate fails). */
  blockerCodes: string[];
  /** `review` flags on the chosen candidate without an acknowledgement. */
  unacknowledgedReviewCodes: string[];
}

export type Decision = { allowed: true } | { allowed: false; reason: string; code: DenialCode };
export type DenialCode = 'forbidden' | 'wrong_state' | 'own_sheet' | 'blocked' | 'not_ready';

const allow: Decision = { allowed: true };
const deny = (code: DenialCode, reason: string): Decision => ({ allowed: false, code, reason });

/** From-states of every action, and the state it leads to (revise leaves the old sheet approved). */
export const TRANSITIONS: Readonly<Record<Exclude<SheetAction, 'edit' | 'acknowledge'>, { from: SheetStatus[]; to: SheetStatus }>> = {
  submit: { from: ['draft', 'returned'], to: 'in_review' },
  withdraw: { from: ['in_review'], to: 'draft' },
  approve: { from: ['in_review'], to: 'approved' },
  return: { from: ['in_review'], to: 'returned' },
  revise: { from: ['approved'], to: 'approved' },
};

export const EDITABLE_STATES: readonly SheetStatus[] = ['draft', 'returned'];

const PERMISSION_OF: Record<SheetAction, SheetPermission> = {
  edit: 'sheet:write',
  submit: 'sheet:submit',
  withdraw: 'sheet:submit',
  approve: 'sheet:review',
  return: 'sheet:review',
  acknowledge: 'sheet:review',
  revise: 'sheet:write',
};

const STATE_WORDS: Record<SheetStatus, string> = {
  draft: 'a draft',
  in_review: 'in review',
  approved: 'approved',
  returned: 'returned',
};

export function decide(action: SheetAction, sheet: SheetForTransition, actor: Actor, readiness?: ApprovalReadiness): Decision {
  if (!actor.can(PERMISSION_OF[action])) {
    return deny('forbidden', `Your role may not ${actionWords(action)}.`);
  }
  const from = action === 'edit' ? EDITABLE_STATES : action === 'acknowledge' ? (['in_review'] as SheetStatus[]) : TRANSITIONS[action].from;
  if (!from.includes(sheet.status)) {
    if (action === 'edit' && sheet.status === 'approved') {
      return deny('wrong_state', 'This sheet is approved and frozen; start a new revision to change it.');
    }
    if (action === 'edit' && sheet.status === 'in_review') {
      return deny('wrong_state', 'This sheet is in review; withdraw it (or wait for the reviewer to return it) to change it.');
    }
    return deny('wrong_state', `The sheet is ${STATE_WORDS[sheet.status]}, so it cannot be ${pastWords(action)}.`);
  }
  const isAuthor = sheet.authorId === actor.userId;
  switch (action) {
    case 'withdraw':
      // Only the author takes their own sheet back; others return it with a comment.
      if (!isAuthor) return deny('forbidden', 'Only the author can withdraw a sheet from review.');
      return allow;
    case 'approve':
    case 'return':
    case 'acknowledge':
      if (isAuthor) return deny('own_sheet', 'A reviewer may not review a sheet they authored.');
      if (action !== 'return') {
        const signOff = action === 'approve' ? 'approve it' : 'acknowledge its flags';
        if (sheet.editorIds?.includes(actor.userId)) {
          return deny('own_sheet', `You edited this revision, so you may not ${signOff}: another reviewer must.`);
        }
        if (sheet.submitterIds?.includes(actor.userId)) {
          return deny('own_sheet', `You submitted this revision for review, so you may not ${signOff}: another reviewer must.`);
        }
      }
      if (action === 'approve') {
        if (!readiness) return deny('not_ready', 'The sheet has no server result to approve.');
        if (!readiness.hasChosenCandidate) return deny('not_ready', 'No candidate is chosen on this sheet.');
        if (readiness.blockerCodes.length > 0) {
          return deny('blocked', `A blocker prevents approval: ${flagTitleList(readiness.blockerCodes)}.`);
        }
        if (readiness.unacknowledgedReviewCodes.length > 0) {
          return deny('not_ready', `Acknowledge every review flag first: ${flagTitleList(readiness.unacknowledgedReviewCodes)}.`);
        }
      }
      return allow;
    case 'revise':
      if (sheet.hasNewerRevision) return deny('wrong_state', 'A newer revision of this sheet exists; revise that one.');
      return allow;
    case 'submit':
      // Nothing is chosen for the designer (issue 22), and a chosen candidate that fails is not sent to a reviewer.
      if (readiness && !readiness.hasChosenCandidate) return deny('not_ready', 'Choose a candidate before submitting the sheet: none is chosen yet.');
      if (readiness && readiness.blockerCodes.length > 0) {
        return deny('blocked', `The chosen candidate has a blocker, so the sheet cannot be submitted: ${flagTitleList(readiness.blockerCodes)}. Change the sheet or choose another candidate.`);
      }
      return allow;
    default:
      return allow;
  }
}

function actionWords(action: SheetAction): string {
  return {
    edit: 'edit sizing sheets',
    submit: 'submit sheets for review',
    withdraw: 'withdraw sheets from review',
    approve: 'approve sheets',
    return: 'return sheets',
    acknowledge: 'acknowledge flags',
    revise: 'start new revisions',
  }[action];
}

function pastWords(action: SheetAction): string {
  return {
    edit: 'edited',
    submit: 'submitted',
    withdraw: 'withdrawn',
    approve: 'approved',
    return: 'returned',
    acknowledge: 'reviewed',
    revise: 'revised',
  }[action];
}

/** The actions a user may take now, for showing buttons (the server decides again). */
export function availableActions(sheet: SheetForTransition, actor: Actor, readiness?: ApprovalReadiness): SheetAction[] {
  const all: SheetAction[] = ['edit', 'submit', 'withdraw', 'acknowledge', 'approve', 'return', 'revise'];
  return all.filter((action) => {
    const decision = decide(action, sheet, actor, readiness);
    // Approve and submit stay visible (disabled, with the reason) when only the result stands in the way.
    return decision.allowed || ((action === 'approve' || action === 'submit') && (decision.code === 'blocked' || decision.code === 'not_ready'));
  });
}

export const STATUS_LABELS: Record<SheetStatus, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  returned: 'Returned',
};

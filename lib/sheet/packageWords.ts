/**
 * The words of the calculation package (issue 22): the revision table's rows and the approval
 * statement a licensed engineer signs under. Pure, so that the PDF and its tests read one text.
 */
import { licenceWords } from '../auth/profile';
import type { CalculationPackage, RevisionRecord } from './records';
import { formatDate } from './sheetTables';
import { STATUS_LABELS, type SheetStatus } from './stateMachine';

export const REVISION_COLUMNS = ['Rev.', 'Status', 'What changed', 'Edited by', 'Submitted by', 'Reviewed by', 'Decision'] as const;

const names = (list: string[]) => (list.length ? list.join(', ') : '—');

export function revisionRow(r: RevisionRecord): string[] {
  return [
    String(r.revision),
    STATUS_LABELS[r.status],
    r.changed === null ? 'First issue' : r.changed.length ? r.changed.join(', ') : 'No input changed',
    names(r.editedBy),
    names(r.submittedBy),
    r.reviewedBy ?? '—',
    r.decision ? `${r.decision === 'approved' ? 'Approved' : 'Returned'} ${formatDate(r.decidedAt)}` : 'not decided',
  ];
}

export interface ApprovalWords {
  heading: string;
  statement: string;
  /** The approver's name, licence and jurisdiction line (null until approved). */
  approverLine: string | null;
}

/** The approval statement of the printed revision: signed words when approved, a plain refusal otherwise. */
export function approvalStatement(
  sheet: { circuitTag: string; title: string; revision: number; status: SheetStatus; approvedAt: Date | string | null },
  pkg: CalculationPackage | undefined,
): ApprovalWords {
  const doc = pkg ? `calculation package ${pkg.documentNumber}, revision ${sheet.revision}` : `sizing sheet ${sheet.circuitTag}, revision ${sheet.revision}`;
  if (sheet.status !== 'approved') {
    return {
      heading: 'Approval',
      statement: `Not approved. This ${doc} is ${STATUS_LABELS[sheet.status].toLowerCase()}: it may not be signed, stamped or used for construction until a reviewer approves this revision.`,
      approverLine: null,
    };
  }
  const approver = pkg?.approver ?? null;
  return {
    heading: 'Approval',
    statement:
      `I have checked this ${doc} for ${sheet.circuitTag} (${sheet.title}): the inputs and their units, the methods and standards named, ` +
      'every assumption flag with its acknowledgement, and the results of the chosen candidate. In my professional judgement the chosen ' +
      'conductor is adequately sized by its heating for the conditions stated here. This approval covers only what this document states.',
    approverLine: approver
      ? `Approved by ${approver.name}, licence or registration ${licenceWords(approver)}, on ${formatDate(sheet.approvedAt)}.`
      : `Approved on ${formatDate(sheet.approvedAt)}; the approver could not be read back.`,
  };
}

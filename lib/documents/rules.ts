/**
 * The rules of managing documents — projects, sizing sheets, schedules (issue 23). Pure, so that
 * the server (authoritative) and the pages (to offer only what will work) read one table.
 *
 * - rename, duplicate, archive, delete need the kind's write right (lib/auth/permissions);
 *   restoring a deleted one needs `document:restore` (admins).
 * - a duplicate is a new draft whose history starts fresh; it names its origin.
 * - approved revisions are never deleted, only archived; a project holding one cannot be deleted.
 * - delete is soft: hidden at once, restorable for DELETE_RETENTION_DAYS, then purged.
 */
import { can, type Permission, type Role } from '../auth/permissions';
import type { SheetStatus } from '../sheet/stateMachine';

export const DOCUMENT_KINDS = ['project', 'sheet', 'schedule'] as const;
export type DocumentKind = (typeof DOCUMENT_KINDS)[number];
export const DOCUMENT_OPS = ['rename', 'duplicate', 'archive', 'unarchive', 'delete', 'restore'] as const;
export type DocumentOp = (typeof DOCUMENT_OPS)[number];

/** How long a deleted document can be restored before it is purged. */
export const DELETE_RETENTION_DAYS = 30;

export const WRITE_PERMISSION: Readonly<Record<DocumentKind, Permission>> = {
  project: 'project:write',
  sheet: 'sheet:write',
  schedule: 'schedule:write',
};

export function mayManage(role: Role, kind: DocumentKind, op: DocumentOp): boolean {
  return can(role, op === 'restore' ? 'document:restore' : WRITE_PERMISSION[kind]);
}

/** Why a sheet in this state refuses the operation, or null when it allows it. */
export function sheetRefusal(op: DocumentOp, status: SheetStatus): string | null {
  if (op === 'rename' && (status === 'approved' || status === 'in_review')) {
    return status === 'approved'
      ? 'An approved sheet is frozen: make a new revision (Edit) or a duplicate to change its title.'
      : 'A sheet in review cannot be renamed: withdraw it first.';
  }
  if (op === 'delete' && status === 'approved') return 'Approved revisions are never deleted; archive it instead.';
  if (op === 'delete' && status === 'in_review') return 'A sheet in review cannot be deleted: withdraw it first.';
  if (op === 'archive' && status === 'in_review') return 'A sheet in review cannot be archived: withdraw it or decide it first.';
  return null;
}

export function projectDeleteRefusal(approvedSheets: number): string | null {
  return approvedSheets > 0
    ? `This project holds ${approvedSheets} approved ${approvedSheets === 1 ? 'revision' : 'revisions'}, which are never deleted; archive the project instead.`
    : null;
}

/** The title of a duplicate sheet: it names its origin. */
export function duplicateSheetTitle(title: string, revision: number, maxLength = 200): string {
  const suffix = ` from revision ${revision}`;
  const head = `Copy of ${title}`;
  return head.length + suffix.length <= maxLength ? `${head}${suffix}` : `${head.slice(0, maxLength - suffix.length - 1)}…${suffix}`;
}

/** The name of a duplicate project or schedule; `taken` lists names in use, so the copy gets a free one. */
export function duplicateName(name: string, taken: readonly string[] = [], maxLength = 200): string {
  const used = new Set(taken);
  for (let n = 1; ; n++) {
    const suffix = n === 1 ? '' : ` (${n})`;
    const base = `Copy of ${name}`;
    const candidate = `${base.slice(0, maxLength - suffix.length)}${suffix}`;
    if (!used.has(candidate)) return candidate;
  }
}

/** Whether a document deleted at `deletedAt` may still be restored at `now`. */
export function restorable(deletedAt: Date, now: Date = new Date()): boolean {
  return now.getTime() - deletedAt.getTime() < DELETE_RETENTION_DAYS * 24 * 3600 * 1000;
}

/**
 * A sizing sheet as the pages and components read it: one sheet with its review data, and one line
 * of a list (project page, review queue). Plain shapes in lib/ so that components use them without
 * importing the database layer; db/queries/sheets.ts fills them (and re-exports them).
 */
import type { ResultSnapshot } from './snapshot';
import type { SheetInputs } from './schema';
import type { SheetStatus } from './stateMachine';

export interface SheetRecord {
  id: string;
  teamId: string;
  projectId: string;
  projectName: string;
  circuitTag: string;
  title: string;
  status: SheetStatus;
  revision: number;
  previousRevisionId: string | null;
  newerRevisionId: string | null;
  inputs: SheetInputs;
  /** The stored inputs' schema version before migrate-on-read. */
  storedSchemaVersion: number;
  result: ResultSnapshot | null;
  solverVersion: string | null;
  version: number;
  authorId: string;
  authorName: string | null;
  /** Who saved inputs of this revision, the author included; nobody among them may approve it. */
  editorIds: string[];
  /** Who submitted this revision for review; nobody among them may approve it. */
  submitterIds: string[];
  reviewerId: string | null;
  reviewerName: string | null;
  approvedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
  /** ISO 4217 code of the team's money, shown with every amount (teams.currency). */
  teamCurrency: string;
  acknowledgements: { flagCode: string; comment: string; reviewerName: string | null; createdAt: Date }[];
}

export interface SheetListItem {
  id: string;
  projectId: string;
  projectName: string;
  circuitTag: string;
  title: string;
  status: SheetStatus;
  revision: number;
  authorId: string;
  authorName: string | null;
  updatedAt: Date;
  newerRevisionId: string | null;
  chosenLabel: string | null;
  chosenPasses: boolean | null;
}

/** One revision of a sheet in the calculation package's revision table (issue 22). */
export interface RevisionRecord {
  revision: number;
  status: SheetStatus;
  /** Parts of the inputs changed since the previous revision, in words; null for the first issue. */
  changed: string[] | null;
  editedBy: string[];
  submittedBy: string[];
  /** Who approved or returned it, and when. */
  reviewedBy: string | null;
  decision: 'approved' | 'returned' | null;
  decidedAt: Date | null;
  createdAt: Date;
}

/** What the calculation package adds to a sheet: its document number, its revisions and the approver's licence. */
export interface CalculationPackage {
  /** Stable across the revisions of one sheet (from its first revision). */
  documentNumber: string;
  /** Oldest first, ending with the sheet printed. */
  revisions: RevisionRecord[];
  /** The approver of the printed revision, with the licence recorded at approval (or their profile's). */
  approver: { name: string; licenceNumber: string; licenceJurisdiction: string } | null;
}

/** "AW-1F3A9C2E": the first eight hex digits of the first revision's id. */
export function documentNumberOf(firstRevisionId: string): string {
  return `AW-${firstRevisionId.replace(/-/g, '').slice(0, 8).toUpperCase()}`;
}

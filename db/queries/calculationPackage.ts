/**
 * What the calculation package (the signable PDF, issue 22) needs beyond the sheet itself: the
 * chain of revisions with who edited, submitted and reviewed each and what changed between them,
 * the document number, and the approver's licence as recorded at approval. Team-scoped.
 */
import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import { getDb } from '../client';
import { auditLog, sheetContributions, sheets, users } from '../schema';
import { readSheetInputs, type SheetStatus } from '../../lib/sheet';
import { changedInputSections, sectionWords } from '../../lib/sheet/revisionWords';
import { documentNumberOf, type CalculationPackage, type RevisionRecord, type SheetRecord } from '../../lib/sheet/records';

/** Enough for any real chain; a longer one (a data fault) is cut rather than followed forever. */
const MAX_REVISIONS = 200;

export async function calculationPackageOf(teamId: string, sheet: Pick<SheetRecord, 'id' | 'previousRevisionId' | 'reviewerId' | 'reviewerName' | 'status'>): Promise<CalculationPackage> {
  const db = getDb();
  const chain: { id: string; revision: number; status: SheetStatus; inputs: unknown; schemaVersion: number; reviewerName: string | null; approvedAt: Date | null; createdAt: Date; previousRevisionId: string | null }[] = [];
  let nextId: string | null = sheet.id;
  while (nextId && chain.length < MAX_REVISIONS) {
    const [row] = await db
      .select({ id: sheets.id, revision: sheets.revision, status: sheets.status, inputs: sheets.inputs, schemaVersion: sheets.schemaVersion, reviewerName: users.name, approvedAt: sheets.approvedAt, createdAt: sheets.createdAt, previousRevisionId: sheets.previousRevisionId })
      .from(sheets)
      .leftJoin(users, eq(users.id, sheets.reviewerId))
      .where(and(eq(sheets.teamId, teamId), eq(sheets.id, nextId)));
    if (!row) break;
    chain.unshift({ ...row, status: row.status as SheetStatus });
    nextId = row.previousRevisionId;
  }
  const ids = chain.map((r) => r.id);
  const contributions = ids.length
    ? await db
        .select({ sheetId: sheetContributions.sheetId, kind: sheetContributions.kind, name: users.name })
        .from(sheetContributions)
        .innerJoin(users, eq(users.id, sheetContributions.userId))
        .where(and(eq(sheetContributions.teamId, teamId), inArray(sheetContributions.sheetId, ids)))
        .orderBy(asc(sheetContributions.firstAt))
    : [];
  const decisions = ids.length
    ? await db
        .select({ entityId: auditLog.entityId, action: auditLog.action, at: auditLog.at, name: users.name, detail: auditLog.detail })
        .from(auditLog)
        .leftJoin(users, eq(users.id, auditLog.actorId))
        .where(and(eq(auditLog.teamId, teamId), eq(auditLog.entity, 'sheet'), inArray(auditLog.entityId, ids), inArray(auditLog.action, ['sheet.approve', 'sheet.return'])))
        .orderBy(desc(auditLog.at))
    : [];
  const namesOf = (sheetId: string, kind: 'edited' | 'submitted') => contributions.filter((c) => c.sheetId === sheetId && c.kind === kind).map((c) => c.name);
  const revisions: RevisionRecord[] = chain.map((row, i) => {
    const latest = decisions.find((d) => d.entityId === row.id);
    const before = i > 0 ? readSheetInputs(chain[i - 1].inputs, chain[i - 1].schemaVersion) : null;
    const after = readSheetInputs(row.inputs, row.schemaVersion);
    return {
      revision: row.revision,
      status: row.status,
      changed: before ? changedInputSections(before as unknown as Record<string, unknown>, after as unknown as Record<string, unknown>).map(sectionWords) : null,
      editedBy: namesOf(row.id, 'edited'),
      submittedBy: namesOf(row.id, 'submitted'),
      reviewedBy: latest?.name ?? row.reviewerName,
      decision: latest ? (latest.action === 'sheet.approve' ? 'approved' : 'returned') : row.status === 'approved' ? 'approved' : null,
      decidedAt: latest?.at ?? row.approvedAt,
      createdAt: row.createdAt,
    };
  });
  let approver: CalculationPackage['approver'] = null;
  if (sheet.status === 'approved') {
    const approval = decisions.find((d) => d.entityId === sheet.id && d.action === 'sheet.approve');
    const recorded = (approval?.detail as { reviewerLicence?: { licenceNumber?: string; licenceJurisdiction?: string } } | null)?.reviewerLicence;
    const [profile] = sheet.reviewerId
      ? await db.select({ name: users.name, licenceNumber: users.licenceNumber, licenceJurisdiction: users.licenceJurisdiction }).from(users).where(and(eq(users.teamId, teamId), eq(users.id, sheet.reviewerId)))
      : [];
    const name = approval?.name ?? sheet.reviewerName ?? profile?.name ?? null;
    if (name) {
      approver = {
        name,
        licenceNumber: recorded?.licenceNumber ?? profile?.licenceNumber ?? '',
        licenceJurisdiction: recorded?.licenceJurisdiction ?? profile?.licenceJurisdiction ?? '',
      };
    }
  }
  return { documentNumber: documentNumberOf(chain[0]?.id ?? sheet.id), revisions, approver };
}

import { and, asc, eq } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { auditLog } from '../schema';

export interface AuditEntry {
  teamId: string | null;
  actorId: string | null;
  action: string;
  entity: string;
  entityId?: string | null;
  detail?: Record<string, unknown>;
}

/** Written inside the same transaction as the change it records, so neither exists without the other. */
export async function recordAudit(tx: Executor, entry: AuditEntry): Promise<void> {
  await tx.insert(auditLog).values({
    teamId: entry.teamId,
    actorId: entry.actorId,
    action: entry.action,
    entity: entry.entity,
    entityId: entry.entityId ?? null,
    detail: entry.detail ?? {},
  });
}

export async function listAuditFor(teamId: string, entity: string, entityId: string) {
  return getDb()
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.teamId, teamId), eq(auditLog.entity, entity), eq(auditLog.entityId, entityId)))
    .orderBy(asc(auditLog.at));
}

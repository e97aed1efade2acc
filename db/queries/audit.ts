import { and, asc, eq } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { auditLog, users } from '../schema';

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

/** The entries about one entity of a team, oldest first, with the name of who acted (null once removed). */
export async function listAuditFor(teamId: string, entity: string, entityId: string) {
  return getDb()
    .select({ id: auditLog.id, action: auditLog.action, actorId: auditLog.actorId, actorName: users.name, detail: auditLog.detail, at: auditLog.at })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(and(eq(auditLog.teamId, teamId), eq(auditLog.entity, entity), eq(auditLog.entityId, entityId)))
    .orderBy(asc(auditLog.at));
}

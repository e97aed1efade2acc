/** A person's professional profile (licence or registration, jurisdiction): read and write their own row, audited. */
import { and, eq } from 'drizzle-orm';
import { getDb } from '../client';
import { users } from '../schema';
import { recordAudit } from './audit';
import type { ProfessionalProfile } from '../../lib/auth/profile';

export async function getProfessionalProfile(teamId: string, userId: string): Promise<(ProfessionalProfile & { name: string; email: string }) | null> {
  const [row] = await getDb()
    .select({ name: users.name, email: users.email, licenceNumber: users.licenceNumber, licenceJurisdiction: users.licenceJurisdiction })
    .from(users)
    .where(and(eq(users.teamId, teamId), eq(users.id, userId)));
  return row ?? null;
}

export async function setProfessionalProfile(teamId: string, userId: string, profile: ProfessionalProfile): Promise<void> {
  await getDb().transaction(async (tx) => {
    await tx
      .update(users)
      .set({ licenceNumber: profile.licenceNumber, licenceJurisdiction: profile.licenceJurisdiction, updatedAt: new Date() })
      .where(and(eq(users.teamId, teamId), eq(users.id, userId)));
    await recordAudit(tx, { teamId, actorId: userId, action: 'user.profile', entity: 'user', entityId: userId, detail: { ...profile } });
  });
}

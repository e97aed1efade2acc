'use server';
/**
 * Admin → team settings for sizing schedules: the smallest cable section a schedule may run in
 * parallel. Empty restores the library's default (common practice). Audited.
 */
import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { recordAudit } from '@/db/queries/audit';
import { setTeamMinParallelSection, teamSizingOptions } from '@/db/queries/teams';
import { getDb } from '@/db/client';
import { INPUT_BOUNDS, zodBound } from '@/lib/inputBounds';
import { authorizeAction } from '@/server/auth/actions';
import type { TeamSizingState } from '@/components/team/TeamSizingSettings';


const bound = INPUT_BOUNDS.minParallelSectionMm2;
const inputSchema = z.union([z.literal(''), z.coerce.number({ message: `${bound.label} must be a number in mm²` }).pipe(zodBound(z.number(), bound))]);

export async function setMinParallelSectionAction(_state: TeamSizingState, formData: FormData): Promise<TeamSizingState> {
  const user = await authorizeAction('members:manage');
  const parsed = inputSchema.safeParse(String(formData.get('minParallelSectionMm2') ?? '').trim());
  if (!parsed.success) return { fieldError: parsed.error.issues[0]?.message ?? `${bound.label}: not a valid section` };
  const sectionMm2 = parsed.data === '' ? null : parsed.data;
  const before = await teamSizingOptions(user.teamId);
  await getDb().transaction(async (tx) => {
    await setTeamMinParallelSection(user.teamId, sectionMm2, tx);
    await recordAudit(tx, {
      teamId: user.teamId,
      actorId: user.id,
      action: 'team.settings',
      entity: 'team',
      entityId: user.teamId,
      detail: { minParallelSectionMm2: { from: before.minParallelSectionMm2 ?? null, to: sectionMm2 } },
    });
  });
  revalidatePath('/admin/members');
  return { message: sectionMm2 === null ? 'Schedules use the default again.' : `Schedules queued from now on run cables in parallel only from ${sectionMm2} mm².` };
}

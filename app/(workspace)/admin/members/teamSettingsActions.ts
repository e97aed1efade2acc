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
import { parseNumber } from '@/lib/units/parse';
import { authorizeAction } from '@/server/auth/actions';
import type { TeamSizingState } from '@/components/team/TeamSizingSettings';

const bound = INPUT_BOUNDS.minParallelSectionMm2;
const boundSchema = zodBound(z.number(), bound);

export async function setMinParallelSectionAction(_state: TeamSizingState, formData: FormData): Promise<TeamSizingState> {
  const user = await authorizeAction('members:manage');
  const text = String(formData.get('minParallelSectionMm2') ?? '').trim();
  let sectionMm2: number | null = null;
  if (text !== '') {
    // The one number rule of the app, with the admin's own decimal separator.
    const read = parseNumber(text, { decimalSeparator: user.decimalSeparator ?? '.', field: bound.label });
    if (!read.ok) return { fieldError: read.message };
    const inBounds = boundSchema.safeParse(read.value);
    if (!inBounds.success) return { fieldError: inBounds.error.issues[0]?.message ?? `${bound.label}: out of bounds` };
    sectionMm2 = inBounds.data;
  }
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

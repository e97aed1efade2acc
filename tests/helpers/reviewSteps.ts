/**
 * Steps the notification and document tests share: a sheet that can be submitted (240 mm² copper
 * XLPE at 400 A in air, within its limit with review flags), and acknowledging every review flag
 * so that a reviewer can approve it. Inputs only; nothing here is a check value.
 */
import { acknowledgeFlag, createSheet, getSheet } from '@/db/queries/sheets';
import { defaultSheetInputs, type Actor, type SheetInputs } from '@/lib/sheet';
import { can, type Role } from '@/lib/auth/permissions';
import { testCable240 } from './sheetCandidates';

export const actorOf = (user: { id: string; role: Role }): Actor => ({ userId: user.id, can: (p) => can(user.role, p) });

export function submittableInputs(): SheetInputs {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.candidates = [testCable240];
  inputs.chosenCandidateId = testCable240.id;
  return inputs;
}

export async function newSubmittableSheet(teamId: string, projectId: string, author: { id: string; role: Role }, title = 'Test feeder') {
  const tag = `T-${Math.random().toString(36).slice(2, 7)}`;
  return (await createSheet(teamId, actorOf(author), { projectId, circuitTag: tag, title, inputs: submittableInputs() })).id;
}

export async function acknowledgeEveryReviewFlag(teamId: string, sheetId: string, reviewer: { id: string; role: Role }) {
  const sheet = await getSheet(teamId, sheetId);
  for (const flag of sheet!.result!.chosenFlags.filter((f) => f.severity === 'review')) {
    await acknowledgeFlag(teamId, actorOf(reviewer), sheetId, flag.code, 'Accepted: checked against the site survey.');
  }
}

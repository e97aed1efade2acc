import { z } from 'zod';
import { transitionSheet } from '@/db/queries/sheets';
import { apiHandler } from '@/server/http/api';
import { commentSchema, expectedVersionSchema, sheetActor, sheetOperation } from '../../_shared/sheetApi';
import { readJsonBody } from '@/server/http/body';

const bodySchema = z.object({
  action: z.enum(['submit', 'withdraw', 'approve', 'return']),
  comment: commentSchema.optional(),
  expectedVersion: expectedVersionSchema.optional(),
});

/**
 * Moves the sheet through review. Who may do what depends on the action and on the sheet (a
 * reviewer may not approve their own), so the state machine decides: 403 for the role or own
 * sheet, 409 for the wrong state, a standing blocker or unacknowledged review flags.
 */
export const POST = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, bodySchema);
  return sheetOperation(async () => {
    const updated = await transitionSheet(user!.teamId, sheetActor(user!), params.sheetId, body.action, body);
    return Response.json(updated);
  });
});

import { z } from 'zod';
import { apiHandler } from '@/server/http/api';
import { transitionSheetAndNotify } from '@/server/notifications/mail';
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
 * sheet, 409 for the wrong state, a standing blocker or unacknowledged review flags. The people
 * concerned are notified (in the app with the decision, by mail after it; a mail failure is logged
 * and does not undo the decision).
 */
export const POST = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, bodySchema);
  return sheetOperation(async () => {
    const { mail: _mail, ...updated } = await transitionSheetAndNotify(user!.teamId, sheetActor(user!), params.sheetId, body.action, body);
    return Response.json(updated);
  });
});

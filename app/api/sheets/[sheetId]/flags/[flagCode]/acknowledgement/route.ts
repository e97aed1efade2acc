import { z } from 'zod';
import { acknowledgeFlag } from '@/db/queries/sheets';
import { apiHandler } from '@/server/http/api';
import { commentSchema, sheetActor, sheetOperation } from '../../../../_shared/sheetApi';
import { readJsonBody } from '@/server/http/body';

const bodySchema = z.object({ comment: commentSchema.min(3, 'Say why the assumption is acceptable (a comment is required)') });

/** A reviewer accepts one `review` flag of the chosen candidate, saying why. */
export const PUT = apiHandler({ permission: 'sheet:review' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, bodySchema);
  return sheetOperation(async () => {
    await acknowledgeFlag(user!.teamId, sheetActor(user!), params.sheetId, params.flagCode, body.comment);
    return Response.json({ acknowledged: params.flagCode });
  });
});

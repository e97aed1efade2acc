import { z } from 'zod';
import { getSheet, saveSheet } from '@/db/queries/sheets';
import { sheetInputsSchema } from '@/lib/sheet';
import { apiHandler, ApiError } from '@/server/http/api';
import { expectedVersionSchema, sheetActor, sheetOperation, sheetTitleSchema } from '../_shared/sheetApi';
import { readJsonBody } from '@/server/http/body';

export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const sheet = await getSheet(user!.teamId, params.sheetId);
  if (!sheet) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  return Response.json({ sheet });
});

const saveBodySchema = z.object({
  expectedVersion: expectedVersionSchema,
  inputs: sheetInputsSchema,
  title: sheetTitleSchema.optional(),
  circuitTag: z.string().trim().min(1, 'Circuit tag is required').max(40).optional(),
});

/** Saves inputs and the chosen candidate; the result snapshot is computed here, not taken from the client. */
export const PUT = apiHandler({ permission: 'sheet:write' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, saveBodySchema);
  return sheetOperation(async () => {
    const saved = await saveSheet(user!.teamId, sheetActor(user!), params.sheetId, body);
    return Response.json(saved);
  });
});

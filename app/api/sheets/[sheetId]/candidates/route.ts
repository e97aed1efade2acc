import { z } from 'zod';
import { getSheet, saveSheet } from '@/db/queries/sheets';
import { sheetCandidateSchema, sheetInputsSchema } from '@/lib/sheet';
import { apiHandler, ApiError } from '@/server/http/api';
import { expectedVersionSchema, sheetActor, sheetOperation } from '../../_shared/sheetApi';
import { readJsonBody } from '@/server/http/body';

const bodySchema = z.object({
  expectedVersion: expectedVersionSchema,
  candidate: sheetCandidateSchema,
  choose: z.boolean().default(false),
});

/** Adds one candidate (full conductor data, as the catalogue mapping gives it) and saves the sheet. */
export const POST = apiHandler({ permission: 'sheet:write' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, bodySchema);
  const sheet = await getSheet(user!.teamId, params.sheetId);
  if (!sheet) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  if (sheet.inputs.candidates.some((c) => c.id === body.candidate.id)) {
    throw new ApiError(409, 'duplicate_candidate', 'This sheet already has a candidate with that id.', 'candidate.id');
  }
  const inputs = sheetInputsSchema.parse({
    ...sheet.inputs,
    candidates: [...sheet.inputs.candidates, body.candidate],
    chosenCandidateId: body.choose ? body.candidate.id : sheet.inputs.chosenCandidateId,
  });
  return sheetOperation(async () => {
    const saved = await saveSheet(user!.teamId, sheetActor(user!), params.sheetId, { expectedVersion: body.expectedVersion, inputs });
    return Response.json(saved, { status: 201 });
  });
});

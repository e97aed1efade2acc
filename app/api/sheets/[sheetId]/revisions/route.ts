import { reviseSheet } from '@/db/queries/sheets';
import { apiHandler } from '@/server/http/api';
import { sheetActor, sheetOperation } from '../../_shared/sheetApi';

/** Approved sheets are frozen: this starts the next revision as a draft. */
export const POST = apiHandler({ permission: 'sheet:write' }, async (_req, { user, params }) => {
  return sheetOperation(async () => {
    const created = await reviseSheet(user!.teamId, sheetActor(user!), params.sheetId);
    return Response.json({ sheet: created }, { status: 201 });
  });
});

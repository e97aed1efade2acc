import { getSheet, sheetHistory } from '@/db/queries/sheets';
import { apiHandler, ApiError } from '@/server/http/api';

export const GET = apiHandler({ permission: 'team:read' }, async (_req, { user, params }) => {
  const sheet = await getSheet(user!.teamId, params.sheetId);
  if (!sheet) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  return Response.json({ history: await sheetHistory(user!.teamId, sheet.id) });
});

import { getScheduleRow } from '@/db/queries/schedules';
import { createSheet } from '@/db/queries/sheets';
import { scheduleRowToSheetInputs, sheetTitleOf } from '@/lib/schedule';
import { apiHandler, ApiError } from '@/server/http/api';
import { INT4_MAX } from '@/server/http/body';
import { sheetActor, sheetOperation } from '../../../../../sheets/_shared/sheetApi';

/** "Open as sizing sheet": a new draft sheet in the schedule's project from one row (201 { sheet }). */
export const POST = apiHandler({ permission: 'sheet:write' }, async (_req, { user, params }) => {
  const rowNumber = Number(params.rowNumber);
  // Row numbers are integer-column values: anything outside 1…INT4_MAX is simply no such row.
  const row = Number.isInteger(rowNumber) && rowNumber >= 1 && rowNumber <= INT4_MAX ? await getScheduleRow(user!.teamId, params.scheduleId, rowNumber) : null;
  if (!row) throw new ApiError(404, 'not_found', 'No such schedule row.');
  if (!row.family) throw new ApiError(409, 'family_missing', 'The family of this row is not stored with the schedule.');
  const inputs = scheduleRowToSheetInputs(row.input, row.sizing, row.family.candidates);
  return sheetOperation(async () => {
    const sheet = await createSheet(user!.teamId, sheetActor(user!), {
      projectId: row.projectId,
      circuitTag: row.input.circuitTag.slice(0, 40),
      title: sheetTitleOf(row.input),
      inputs,
    });
    return Response.json({ sheet }, { status: 201 });
  });
});

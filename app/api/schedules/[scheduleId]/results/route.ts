import { getSchedule, listScheduleResults } from '@/db/queries/schedules';
import { teamCurrencyOf } from '@/db/queries/members';
import { EXPORT_CAUTION, resultsTable, tableToCsv, tableToXlsx, totalsOf } from '@/lib/schedule';
import { toCsv } from '@/lib/files/csv';
import { apiHandler, ApiError } from '@/server/http/api';
import { download, exportFormat } from '../../_shared/scheduleApi';

/** Result lines and totals as JSON, or the export with ?format=csv|xlsx. */
export const GET = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
  const format = exportFormat(req.url);
  const schedule = await getSchedule(user!.teamId, params.scheduleId);
  if (!schedule) throw new ApiError(404, 'not_found', 'No such schedule.');
  const lines = await listScheduleResults(user!.teamId, schedule.id);
  if (format === null) return Response.json({ lines, totals: totalsOf(lines), solverVersion: schedule.solverVersion });
  const table = resultsTable(lines, await teamCurrencyOf(user!.teamId));
  const base = `${schedule.name} results`;
  if (format === 'csv') {
    // The caution travels with the figures, as the last line of the file.
    return download(`${tableToCsv(table)}\r\n\r\n${toCsv([[EXPORT_CAUTION]])}\r\n`, `${base}.csv`, 'csv');
  }
  const notes: Array<[string, string]> = [
    ['caution', EXPORT_CAUTION],
    ['solver', schedule.solverVersion ?? ''],
    ['source file', schedule.fileName ?? ''],
  ];
  return download(await tableToXlsx(table, 'Results', notes), `${base}.xlsx`, 'xlsx');
});

import { loadTeamFamilies } from '@/db/queries/schedules';
import { tableToCsv, tableToXlsx, templateNotes, templateTable } from '@/lib/schedule';
import { apiHandler } from '@/server/http/api';
import { download, exportFormat } from '../_shared/scheduleApi';

/** The schedule template, with the family names of the team's catalogue. ?format=csv|xlsx (default xlsx). */
export const GET = apiHandler({ permission: 'team:read' }, async (req, { user }) => {
  const format = exportFormat(req.url) ?? 'xlsx';
  const labels = (await loadTeamFamilies(user!.teamId)).map((f) => f.label);
  const table = templateTable(labels);
  if (format === 'csv') return download(tableToCsv(table), 'ampwarden-schedule-template.csv', 'csv');
  return download(await tableToXlsx(table, 'Schedule', templateNotes(labels)), 'ampwarden-schedule-template.xlsx', 'xlsx');
});

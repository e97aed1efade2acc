import { apiHandler } from '@/server/http/api';
import { listCatalogue } from '@/db/queries/catalogue';
import { writeCsv, writeXlsx } from '@/lib/catalogue/files';
import { fileBaseName, fileResponse, formatFrom, kindFrom } from '../../_shared/catalogueApi';

export const dynamic = 'force-dynamic';

/**
 * The team's rows of one part as CSV or XLSX, in the import layout (SI units, values as stored),
 * so that an exported file edited in a spreadsheet imports back.
 */
export const GET = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
  const kind = kindFrom(params);
  const format = formatFrom(req);
  const rows = await listCatalogue(user!.teamId, kind);
  const date = new Date().toISOString().slice(0, 10);
  const name = `ampwarden-${fileBaseName(kind)}-${date}.${format}`;
  const records = rows as unknown as Array<Record<string, unknown>>;
  return format === 'csv' ? fileResponse(writeCsv(kind, records), name, 'csv') : fileResponse(await writeXlsx(kind, records), name, 'xlsx');
});

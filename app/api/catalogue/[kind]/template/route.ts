import { apiHandler } from '@/server/http/api';
import { writeCsv, writeXlsx } from '@/lib/catalogue/files';
import { fileBaseName, fileResponse, formatFrom, kindFrom } from '../../_shared/catalogueApi';

export const dynamic = 'force-dynamic';

/** An empty file with the columns an import of this part expects (`?format=csv|xlsx`). */
export const GET = apiHandler({ permission: 'team:read' }, async (req, { params }) => {
  const kind = kindFrom(params);
  const format = formatFrom(req);
  const name = `ampwarden-${fileBaseName(kind)}-template.${format}`;
  return format === 'csv' ? fileResponse(writeCsv(kind, []), name, 'csv') : fileResponse(await writeXlsx(kind, []), name, 'xlsx');
});

/** GET /api/sheets/[sheetId]/candidates/export?format=csv|xlsx — the candidate comparison from the saved snapshot (any team member). */
import { z } from 'zod';
import { getSheet } from '@/db/queries/sheets';
import { apiHandler, ApiError } from '@/server/http/api';
import { candidatesCsv, candidatesXlsx, exportResponse } from '@/server/share/candidateExport';
import { sheetFileStem } from '@/server/pdf/renderSheetPdf';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

const querySchema = z.object({ format: z.enum(['csv', 'xlsx'], { error: 'format must be csv or xlsx' }).default('csv') });

export const GET = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
  const { format } = querySchema.parse({ format: req.nextUrl.searchParams.get('format') ?? undefined });
  const sheet = await getSheet(user!.teamId, params.sheetId);
  if (!sheet) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  const stem = sheetFileStem(sheet).replace(/^sizing-sheet-/, 'candidates-');
  return format === 'csv' ? exportResponse(candidatesCsv(sheet), stem, 'csv') : exportResponse(await candidatesXlsx(sheet), stem, 'xlsx');
});

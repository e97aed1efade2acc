/** GET /api/sheets/[sheetId]/pdf[?download=1] — the PDF sizing sheet of the saved sheet, for any member of its team. */
import { getSheet } from '@/db/queries/sheets';
import { apiHandler, ApiError } from '@/server/http/api';
import { pdfResponse, renderSheetPdf, sheetFileStem } from '@/server/pdf/renderSheetPdf';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
  const sheet = await getSheet(user!.teamId, params.sheetId);
  if (!sheet) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  const pdf = await renderSheetPdf(sheet);
  return pdfResponse(pdf, sheetFileStem(sheet), req.nextUrl.searchParams.get('download') ? 'attachment' : 'inline');
});

/** GET /api/sheets/[sheetId]/pdf[?download=1] — the PDF sizing sheet of the saved sheet, for any member of its team. */
import { getSheet } from '@/db/queries/sheets';
import { apiHandler, ApiError } from '@/server/http/api';
import { sheetPackagePdf } from '@/server/pdf/pdfRenderer';
import { pdfResponse, sheetFileStem } from '@/server/pdf/renderSheetPdf';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
  const sheet = await getSheet(user!.teamId, params.sheetId);
  if (!sheet) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  // Off the request thread, and once per saved state of the sheet (server/pdf/pdfRenderer.ts).
  const pdf = await sheetPackagePdf(sheet);
  return pdfResponse(pdf, sheetFileStem(sheet), req.nextUrl.searchParams.get('download') ? 'attachment' : 'inline');
});

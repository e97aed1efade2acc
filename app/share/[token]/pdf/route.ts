/**
 * GET /share/[token]/pdf — the PDF sizing sheet for the holder of a read-only link, without signing
 * in. A wrong token (never issued, malformed, or whose sheet is gone) answers 404 "not valid"; a
 * revoked or expired link answers 410 and says which.
 */
import { openShare } from '@/db/queries/shares';
import { apiHandler, ApiError } from '@/server/http/api';
import { pdfResponse, renderSheetPdf, sheetFileStem } from '@/server/pdf/renderSheetPdf';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = apiHandler({ permission: 'public' }, async (_req, { params }) => {
  const opened = await openShare(params.token);
  if (opened.state === 'invalid') throw new ApiError(404, 'link_not_valid', 'This link is not valid.');
  if (opened.state === 'revoked') throw new ApiError(410, 'link_revoked', 'This link was revoked by the team that shared it.');
  if (opened.state === 'expired') throw new ApiError(410, 'link_expired', 'This link has expired.');
  return pdfResponse(await renderSheetPdf(opened.sheet), sheetFileStem(opened.sheet));
});

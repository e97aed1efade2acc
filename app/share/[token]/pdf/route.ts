/**
 * GET /share/[token]/pdf — the PDF sizing sheet for the holder of a read-only link, without signing
 * in. A wrong token (never issued, malformed, or whose sheet is gone) answers 404 "not valid"; a
 * revoked or expired link answers 410 and says which. Anonymous, so limited per client address
 * (429 with Retry-After; server/limits/sharePdf.ts); rendered off the request thread and cached
 * per saved state of the sheet (server/pdf/pdfRenderer.ts).
 */
import { openShare } from '@/db/queries/shares';
import { apiHandler, ApiError } from '@/server/http/api';
import { clientAddressFrom } from '@/server/http/clientAddress';
import { SHARE_PDF_LIMIT, sharePdfRetryAfterS } from '@/server/limits/sharePdf';
import { sheetPackagePdf } from '@/server/pdf/pdfRenderer';
import { pdfResponse, sheetFileStem } from '@/server/pdf/renderSheetPdf';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = apiHandler({ permission: 'public' }, async (req, { params }) => {
  const retryAfterS = await sharePdfRetryAfterS(clientAddressFrom(req.headers));
  if (retryAfterS !== null) {
    throw new ApiError(429, 'rate_limited', `More than ${SHARE_PDF_LIMIT.points} PDFs were asked for from your address in ${SHARE_PDF_LIMIT.durationS / 60} minutes; try again in ${retryAfterS} s.`, undefined, { 'retry-after': String(retryAfterS) });
  }
  const opened = await openShare(params.token);
  if (opened.state === 'invalid') throw new ApiError(404, 'link_not_valid', 'This link is not valid.');
  if (opened.state === 'revoked') throw new ApiError(410, 'link_revoked', 'This link was revoked by the team that shared it.');
  if (opened.state === 'expired') throw new ApiError(410, 'link_expired', 'This link has expired.');
  return pdfResponse(await sheetPackagePdf(opened.sheet), sheetFileStem(opened.sheet));
});

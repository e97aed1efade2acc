/**
 * POST /api/sheets/[sheetId]/email — sends a new read-only link to the sheet (and, if asked, the PDF
 * sizing sheet attached) to one address, through server/mail. The link, the recipient and the
 * message are written to the sheet's history in the same transaction that makes the link; if the
 * mail cannot be sent, the link is revoked and the history records the failure. Designers and admins.
 */
import { createMailedShare, markMailFailed } from '@/db/queries/shares';
import { getSheet } from '@/db/queries/sheets';
import { STATUS_LABELS } from '@/lib/sheet/stateMachine';
import { apiHandler, ApiError } from '@/server/http/api';
import { appBaseUrl, sendMail } from '@/server/mail/send';
import { SHARE_MAIL_LIMIT, shareMailRetryAfterS } from '@/server/limits/shareMail';
import { sheetPackagePdf } from '@/server/pdf/pdfRenderer';
import { sheetFileStem } from '@/server/pdf/renderSheetPdf';
import { sheetMail } from '@/server/share/mail';
import { emailSheetBodySchema } from '@/server/share/schemas';
import { readJsonBody } from '@/server/http/body';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const POST = apiHandler({ permission: 'sheet:share' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, emailSheetBodySchema, { optional: true });
  const sheet = await getSheet(user!.teamId, params.sheetId);
  if (!sheet) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  // The PDF is rendered before anything is recorded, so a rendering failure leaves no trace of a send.
  const retryAfterS = await shareMailRetryAfterS(user!.id);
  if (retryAfterS !== null) {
    throw new ApiError(
      429,
      'rate_limited',
      `You have sent ${SHARE_MAIL_LIMIT.points} sheets by e-mail in the last hour, the limit per member; try again in ${Math.ceil(retryAfterS / 60)} min, or share a link instead.`,
      undefined,
      { 'retry-after': String(retryAfterS) },
    );
  }
  const pdf = body.attachPdf ? Buffer.from(await sheetPackagePdf(sheet)) : undefined;
  const base = appBaseUrl();
  const share = await createMailedShare(user!.teamId, user!.id, sheet.id, { to: body.to, message: body.message, pdfAttached: body.attachPdf, expiresInDays: body.expiresInDays });
  if (!share) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  const mail = sheetMail({
    to: body.to,
    senderName: user!.name,
    teamName: user!.teamName,
    sheet: { circuitTag: sheet.circuitTag, title: sheet.title, projectName: sheet.projectName, revision: sheet.revision, statusLabel: STATUS_LABELS[sheet.status] },
    message: body.message,
    link: `${base}/share/${share.token}`,
    expiresAt: share.expiresAt,
    pdf: pdf ? { fileName: `${sheetFileStem(sheet)}.pdf`, content: pdf } : undefined,
  });
  try {
    await sendMail(mail);
  } catch (error) {
    await markMailFailed(user!.teamId, user!.id, sheet.id, share.id, body.to, error instanceof Error ? error.message.slice(0, 300) : 'unknown');
    throw new ApiError(502, 'mail_failed', 'The message could not be sent; the link it carried was revoked. Try again later.');
  }
  return Response.json({ sentTo: body.to, share: { id: share.id, expiresAt: share.expiresAt }, pdfAttached: body.attachPdf }, { status: 201 });
});

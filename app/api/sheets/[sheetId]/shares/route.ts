/**
 * GET  /api/sheets/[sheetId]/shares — the sheet's read-only links (never their tokens: only hashes are kept).
 * POST /api/sheets/[sheetId]/shares — a new link valid for 1–90 days; the token is in this answer only.
 * Designers and admins ('sheet:share'); another team's sheet answers 404.
 */
import { createShare, listShares } from '@/db/queries/shares';
import { createShareBodySchema } from '@/server/share/schemas';
import { apiHandler, ApiError } from '@/server/http/api';
import { readJsonBody } from '@/server/http/body';

export const dynamic = 'force-dynamic';

export const GET = apiHandler({ permission: 'sheet:share' }, async (_req, { user, params }) => {
  const shares = await listShares(user!.teamId, params.sheetId);
  if (!shares) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  return Response.json({ shares }, { headers: { 'cache-control': 'private, no-store' } });
});

export const POST = apiHandler({ permission: 'sheet:share' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, createShareBodySchema, { optional: true });
  const created = await createShare(user!.teamId, user!.id, params.sheetId, { expiresInDays: body.expiresInDays });
  if (!created) throw new ApiError(404, 'not_found', 'No such sizing sheet.');
  return Response.json(
    { share: { id: created.id, expiresAt: created.expiresAt }, path: `/share/${created.token}`, token: created.token },
    { status: 201, headers: { 'cache-control': 'private, no-store' } },
  );
});

/** DELETE /api/sheets/[sheetId]/shares/[shareId] — revokes a read-only link at once (designers and admins). */
import { revokeShare } from '@/db/queries/shares';
import { apiHandler, ApiError } from '@/server/http/api';

export const DELETE = apiHandler({ permission: 'sheet:share' }, async (_req, { user, params }) => {
  const revoked = await revokeShare(user!.teamId, user!.id, params.sheetId, params.shareId);
  if (!revoked) throw new ApiError(404, 'not_found', 'No such link on this sizing sheet.');
  return Response.json({ share: revoked });
});

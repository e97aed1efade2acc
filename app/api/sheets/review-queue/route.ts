import { listReviewQueue } from '@/db/queries/sheets';
import { apiHandler } from '@/server/http/api';

/** Sheets in review that the signed-in reviewer may decide (their own are left out). */
export const GET = apiHandler({ permission: 'sheet:review' }, async (_req, { user }) => {
  return Response.json({ sheets: await listReviewQueue(user!.teamId, user!.id) });
});

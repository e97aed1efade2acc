import { z } from 'zod';
import { MAX_SHEETS_PER_BATCH, requestSheetBatch } from '@/db/queries/sheetBatches';
import { enqueueSheetBatch } from '@/server/jobs/boss';
import { apiHandler } from '@/server/http/api';
import { INT4_MAX, readJsonBody } from '@/server/http/body';
import { scheduleOperation } from '../../_shared/scheduleApi';

const bodySchema = z.object({
  rowNumbers: z
    .array(z.number().int('Row numbers are whole numbers').min(2, 'Row numbers start at 2 (row 1 is the header)').max(INT4_MAX))
    .min(1, 'Choose at least one row')
    .max(MAX_SHEETS_PER_BATCH, `Choose at most ${MAX_SHEETS_PER_BATCH} rows at a time`),
});

/**
 * "Make sizing sheets" for chosen rows (issue 23): stores the batch and its job, answers 202 with
 * the batch id at once; a worker makes one draft sheet per row in the schedule's project.
 */
export const POST = apiHandler({ permission: 'sheet:write' }, async (req, { user, params }) => {
  const body = await readJsonBody(req, bodySchema);
  return scheduleOperation(async () => {
    const batch = await requestSheetBatch(user!.teamId, user!.id, params.scheduleId, body.rowNumbers, enqueueSheetBatch);
    return Response.json({ batch }, { status: 202 });
  });
});

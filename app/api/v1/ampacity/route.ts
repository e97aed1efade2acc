import { ampacity } from '@/lib/electrical';
import { API_CAUTION, API_VERSION, MAX_REQUEST_BYTES, ampacityConditions, ampacityRequestSchema, type AmpacityResponse } from '@/lib/api';
import { readJsonBody } from '@/server/apiTokens/body';
import { calculationJson, tokenApiHandler } from '@/server/apiTokens/handler';

export const dynamic = 'force-dynamic';

/** One candidate + conditions → its ampacity, the profile at that current and the flags. */
export const POST = tokenApiHandler({ scope: 'calc', fieldPrefix: { from: 'candidates.0', to: 'candidate' } }, async (req) => {
  const request = ampacityRequestSchema.parse(await readJsonBody(req, MAX_REQUEST_BYTES));
  const answer: AmpacityResponse = { apiVersion: API_VERSION, caution: API_CAUTION, ampacity: ampacity(request.candidate, ampacityConditions(request)) };
  return calculationJson(answer);
});

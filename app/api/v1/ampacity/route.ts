import { MAX_REQUEST_BYTES } from '@/lib/api';
import { readJsonBody } from '@/server/apiTokens/body';
import { tokenApiHandler } from '@/server/apiTokens/handler';
import { calculateOffThread } from '@/server/calculation/offThread';

export const dynamic = 'force-dynamic';

/** One candidate + conditions → its ampacity, the profile at that current and the flags (server/calculation/answers.ts). */
export const POST = tokenApiHandler({ scope: 'calc' }, async (req) => calculateOffThread({ endpoint: 'ampacity', body: await readJsonBody(req, MAX_REQUEST_BYTES) }));

import { MAX_REQUEST_BYTES } from '@/lib/api';
import { readJsonBody } from '@/server/apiTokens/body';
import { tokenApiHandler } from '@/server/apiTokens/handler';
import { calculateOffThread } from '@/server/calculation/offThread';

export const dynamic = 'force-dynamic';

/** Candidates + conditions → one result per candidate with its flags, and the comparison (server/calculation/answers.ts). */
export const POST = tokenApiHandler({ scope: 'calc' }, async (req) => calculateOffThread({ endpoint: 'evaluate', body: await readJsonBody(req, MAX_REQUEST_BYTES) }));

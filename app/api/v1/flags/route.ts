import { FLAG_CODES, FLAG_REGISTRY } from '@/lib/electrical';
import { API_VERSION } from '@/lib/api';
import { tokenApiHandler } from '@/server/apiTokens/handler';

export const dynamic = 'force-dynamic';

/** Every assumption flag a calculation may raise, with its fixed severity and basis. */
export const GET = tokenApiHandler({ scope: 'read' }, async () =>
  Response.json({
    apiVersion: API_VERSION,
    flags: FLAG_CODES.map((code) => ({ code, ...FLAG_REGISTRY[code] })),
  }),
);

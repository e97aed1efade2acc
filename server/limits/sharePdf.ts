/**
 * Limits on PDFs asked for without signing in (share links), so that a link — or a guess at many
 * links — cannot keep the server rendering: 30 PDFs per client address in 10 minutes. Rendering
 * happens off the request thread and repeats come from the cache (server/pdf/pdfRenderer.ts), so a
 * person reading a shared sheet never comes near this. Kept in PostgreSQL with the other limits,
 * so every app instance counts the same requests.
 */
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { getPool } from '@/db/client';

export const SHARE_PDF_LIMIT = { points: 30, durationS: 10 * 60 } as const;

const holder = globalThis as unknown as { ampwardenSharePdfLimiter?: RateLimiterPostgres };

function limiter(): RateLimiterPostgres {
  holder.ampwardenSharePdfLimiter ??= new RateLimiterPostgres({
    storeClient: getPool(),
    storeType: 'pool',
    tableName: 'sign_in_limits',
    tableCreated: true,
    keyPrefix: 'share-pdf-address',
    points: SHARE_PDF_LIMIT.points,
    duration: SHARE_PDF_LIMIT.durationS,
  });
  return holder.ampwardenSharePdfLimiter;
}

/** Counts one anonymous PDF request; the seconds to wait when this address has asked too often, else null. */
export async function sharePdfRetryAfterS(clientAddress: string): Promise<number | null> {
  try {
    await limiter().consume(clientAddress);
    return null;
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) return Math.max(1, Math.ceil(rejection.msBeforeNext / 1000));
    throw rejection;
  }
}

/**
 * The wrapper of every /api/v1 route handler: bearer-token authentication, scope, per-token rate
 * limit, and errors as JSON. The calculation API is for other programs, so it takes team API
 * tokens only — no session cookie, hence no CSRF surface.
 *
 *   export const POST = tokenApiHandler({ scope: 'calc' }, async (req, { token }) => { ... });
 *
 * - no or malformed Authorization header → 401 `unauthenticated`; unknown, revoked or expired
 *   token → 401 naming which; token without the scope → 403 `forbidden`;
 * - over the token's rate → 429 `rate_limited` with Retry-After;
 * - ZodError → 400 with the field paths; ApiError → its status; the library's input errors → 400
 *   with the field; SizingError (no honest answer) → 422; database down → 503; else 500.
 */
import type { NextRequest } from 'next/server';
import { ElectricalInputError, SizingError } from '@/lib/electrical';
import { toDotPath } from '@/lib/api/finite';
import { LAST_USED_RESOLUTION_MS, findTokenByHash, touchApiToken, type ApiTokenScope, type TokenPrincipal } from '@/db/queries/apiTokens';
import { ApiError, errorResponse } from '@/server/http/errors';
import { hashApiToken, looksLikeApiToken } from './tokens';
import { consumeTokenRequest, type TokenRateState } from './limiter';

export interface TokenApiContext {
  token: TokenPrincipal;
}

const UNAUTHENTICATED_HEADERS = { 'www-authenticate': 'Bearer realm="ampwarden-api"' };

function withHeaders(response: Response, headers: Record<string, string>): Response {
  for (const [name, value] of Object.entries(headers)) response.headers.set(name, value);
  return response;
}

function rateHeaders(rate: TokenRateState): Record<string, string> {
  return { 'x-ratelimit-limit': String(rate.limit), 'x-ratelimit-remaining': String(rate.remaining), 'x-ratelimit-reset': String(rate.resetS) };
}

/** The token of the request, or an ApiError saying why not. */
export async function authenticateToken(req: Request): Promise<TokenPrincipal> {
  const header = req.headers.get('authorization');
  if (!header) throw new ApiError(401, 'unauthenticated', 'Send a team API token: Authorization: Bearer <token>. Admins create tokens under Admin → API tokens.');
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (!match) throw new ApiError(401, 'unauthenticated', 'The Authorization header must read "Bearer <token>".');
  const token = match[1];
  if (!looksLikeApiToken(token)) throw new ApiError(401, 'unauthenticated', 'This is not an Ampwarden API token.');
  const found = await findTokenByHash(hashApiToken(token));
  if (found.state === 'revoked') throw new ApiError(401, 'token_revoked', 'This API token has been revoked; ask an admin of your team for a new one.');
  if (found.state === 'expired') throw new ApiError(401, 'token_expired', 'This API token has expired; ask an admin of your team for a new one.');
  if (found.state !== 'active') throw new ApiError(401, 'unauthenticated', 'Unknown API token.');
  return found.principal;
}

/** Maps the calculation library's own errors; everything else goes to the shared mapping. */
export function calculationErrorResponse(error: unknown, fieldPrefix?: { from: string; to: string }): Response {
  if (error instanceof ElectricalInputError) {
    let fieldPath = toDotPath(error.field);
    if (fieldPrefix && fieldPath.startsWith(fieldPrefix.from)) fieldPath = fieldPrefix.to + fieldPath.slice(fieldPrefix.from.length);
    const message = error.message.startsWith(`${error.field}: `) ? error.message.slice(error.field.length + 2) : error.message;
    return Response.json(
      { error: { code: 'invalid_input', message: `${fieldPath}: ${message}`, fieldPath, issues: [{ path: fieldPath, message }] } },
      { status: 400 },
    );
  }
  if (error instanceof SizingError) {
    return Response.json({ error: { code: error.code.toLowerCase(), message: error.message } }, { status: 422 });
  }
  return errorResponse(error);
}

/**
 * A result holding NaN or ±Infinity is never sent (JSON would turn it into null, read as "no
 * value"). It happens only at the degenerate edge of a method — a limit a hair above the starting
 * temperature, say — so the caller gets 422 naming the value, and the server log keeps the case
 * for the library's authors.
 */
export function nonFiniteResult(resultPath: string): ApiError {
  console.warn(`ampwarden: non-finite number in a calculation result at ${resultPath}`);
  return new ApiError(
    422,
    'no_finite_result',
    `The calculation gave no finite value for ${resultPath}; the inputs lie at the edge of the method (for example a limit equal to the starting temperature). Check them.`,
  );
}

export function tokenApiHandler(
  options: { scope: ApiTokenScope; fieldPrefix?: { from: string; to: string } },
  handler: (req: NextRequest, ctx: TokenApiContext) => Promise<Response>,
): (req: NextRequest) => Promise<Response> {
  return async (req) => {
    let rate: TokenRateState | null = null;
    try {
      let token: TokenPrincipal;
      try {
        token = await authenticateToken(req);
      } catch (error) {
        if (error instanceof ApiError && error.status === 401) return withHeaders(errorResponse(error), UNAUTHENTICATED_HEADERS);
        throw error;
      }
      if (!token.scopes.includes(options.scope)) {
        throw new ApiError(403, 'forbidden', `This API token lacks the ${options.scope} scope; an admin can create one that has it.`);
      }
      rate = await consumeTokenRequest(token.tokenId, token.requestsPerMinute);
      if (!rate.allowed) {
        return withHeaders(
          errorResponse(new ApiError(429, 'rate_limited', `This token may make ${rate.limit} requests a minute; try again in ${rate.resetS} s.`)),
          { ...rateHeaders(rate), 'retry-after': String(rate.resetS) },
        );
      }
      if (!token.lastUsedAt || Date.now() - token.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) await touchApiToken(token.tokenId);
      const response = await handler(req, { token });
      return withHeaders(response, rateHeaders(rate));
    } catch (error) {
      const response = calculationErrorResponse(error, options.fieldPrefix);
      return rate ? withHeaders(response, rateHeaders(rate)) : response;
    }
  };
}

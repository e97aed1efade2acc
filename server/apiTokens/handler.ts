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
 * - ZodError → 400 with the field paths; ApiError → its status; database down → 503; else 500.
 *   The calculations' own errors (the library's input errors → 400, SizingError → 422) are
 *   answered in the calculation thread (server/calculation/answers.ts).
 */
import type { NextRequest } from 'next/server';
import { authoriseTokenRequest, type ApiTokenScope, type TokenPrincipal } from '@/db/queries/apiTokens';
import { ApiError, errorResponse } from '@/server/http/errors';
import { hashApiToken, looksLikeApiToken } from './tokens';
import { rateState, type TokenRateState } from './limiter';

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

/** The token in the Authorization header, or an ApiError saying what is wrong with the header. */
function bearerTokenOf(req: Request): string {
  const header = req.headers.get('authorization');
  if (!header) throw new ApiError(401, 'unauthenticated', 'Send a team API token: Authorization: Bearer <token>. Admins create tokens under Admin → API tokens.');
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (!match) throw new ApiError(401, 'unauthenticated', 'The Authorization header must read "Bearer <token>".');
  if (!looksLikeApiToken(match[1])) throw new ApiError(401, 'unauthenticated', 'This is not an Ampwarden API token.');
  return match[1];
}

/**
 * Authenticates the request's token, checks its scope and counts the request against the token's
 * rate — one database round trip (db/queries/apiTokens.ts authoriseTokenRequest). Throws an
 * ApiError (401, 403) when the request may not go on; a request over the rate comes back with
 * `rate.allowed` false.
 */
export async function authoriseRequest(req: Request, scope: ApiTokenScope): Promise<{ token: TokenPrincipal; rate: TokenRateState }> {
  const found = await authoriseTokenRequest(hashApiToken(bearerTokenOf(req)), scope);
  switch (found.state) {
    case 'revoked':
      throw new ApiError(401, 'token_revoked', 'This API token has been revoked; ask an admin of your team for a new one.');
    case 'expired':
      throw new ApiError(401, 'token_expired', 'This API token has expired; ask an admin of your team for a new one.');
    case 'unknown':
      throw new ApiError(401, 'unauthenticated', 'Unknown API token.');
    case 'missing_scope':
      throw new ApiError(403, 'forbidden', `This API token lacks the ${scope} scope; an admin can create one that has it.`);
    case 'active':
      return { token: found.principal, rate: rateState(found.principal.requestsPerMinute, found.window) };
  }
}

export function tokenApiHandler(
  options: { scope: ApiTokenScope },
  handler: (req: NextRequest, ctx: TokenApiContext) => Promise<Response>,
): (req: NextRequest) => Promise<Response> {
  return async (req) => {
    let rate: TokenRateState | null = null;
    try {
      let token: TokenPrincipal;
      try {
        ({ token, rate } = await authoriseRequest(req, options.scope));
      } catch (error) {
        if (error instanceof ApiError && error.status === 401) return withHeaders(errorResponse(error), UNAUTHENTICATED_HEADERS);
        throw error;
      }
      if (!rate.allowed) {
        return withHeaders(
          errorResponse(new ApiError(429, 'rate_limited', `This token may make ${rate.limit} requests a minute; try again in ${rate.resetS} s.`)),
          { ...rateHeaders(rate), 'retry-after': String(rate.resetS) },
        );
      }
      const response = await handler(req, { token });
      return withHeaders(response, rateHeaders(rate));
    } catch (error) {
      const response = errorResponse(error);
      return rate ? withHeaders(response, rateHeaders(rate)) : response;
    }
  };
}

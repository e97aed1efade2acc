/**
 * The wrapper every route handler goes through: it finds the session user, checks the
 * permission, and turns thrown errors into JSON answers.
 *
 *   export const GET = apiHandler({ permission: 'team:read' }, async (req, { user, params }) => {
 *     const project = await getProject(user!.teamId, params.projectId);
 *     if (!project) throw new ApiError(404, 'not_found', 'No such project.');
 *     return Response.json(project);
 *   });
 *
 * - anonymous on a non-public route → 401 `unauthenticated`; missing permission → 403 `forbidden`
 *   (rows of another team must answer 404 from the handler, never 403);
 * - ZodError → 400 `{ error: { code: 'invalid_input', message, issues: [{ path, message }] } }`
 *   with `path` dot-separated;
 * - ApiError → its status `{ error: { code, message, fieldPath? } }`;
 * - database unreachable → 503 `database_unavailable`; anything else → 500 `internal_error`;
 * - a state-changing request whose Origin is another site → 403 `cross_site` (the session cookie
 *   is SameSite=Lax already; this is the second lock).
 */
import type { NextRequest } from 'next/server';
import { can, type Permission } from '@/lib/auth/permissions';
import { getSessionUser, type SessionUser } from '@/server/auth/session';
import { ApiError, errorResponse } from './errors';

export { ApiError, errorResponse, isDatabaseUnreachable } from './errors';

export interface ApiContext {
  user: SessionUser | null;
  params: Record<string, string>;
}

export interface ApiHandlerOptions {
  permission: Permission | 'authenticated' | 'public';
}

type NextRouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function isCrossSite(req: Request): boolean {
  if (SAFE_METHODS.has(req.method)) return false;
  const origin = req.headers.get('origin');
  if (!origin) return false;
  const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host');
  try {
    return new URL(origin).host !== host;
  } catch {
    return true;
  }
}

function flattenParams(raw: Record<string, string | string[] | undefined> | undefined): Record<string, string> {
  const params: Record<string, string> = {};
  for (const [key, value] of Object.entries(raw ?? {})) {
    if (value !== undefined) params[key] = Array.isArray(value) ? value.join('/') : value;
  }
  return params;
}

export function apiHandler(
  options: ApiHandlerOptions,
  handler: (req: NextRequest, ctx: ApiContext) => Promise<Response>,
): (req: NextRequest, routeContext: NextRouteContext) => Promise<Response> {
  return async (req, routeContext) => {
    try {
      if (isCrossSite(req)) throw new ApiError(403, 'cross_site', 'Requests that change data must come from Ampwarden itself.');
      const user = await getSessionUser();
      if (options.permission !== 'public') {
        if (!user) throw new ApiError(401, 'unauthenticated', 'Sign in first.');
        if (options.permission !== 'authenticated' && !can(user.role, options.permission)) {
          throw new ApiError(403, 'forbidden', `Your role (${user.role}) may not do this.`);
        }
      }
      const params = flattenParams(await routeContext?.params);
      return await handler(req, { user, params });
    } catch (error) {
      return errorResponse(error);
    }
  };
}

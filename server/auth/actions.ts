/**
 * The guard for server actions. Deliberately not a 'use server' module itself (that would expose
 * it as an action): call it first thing inside each action.
 *
 *   'use server';
 *   export async function renameProject(input: unknown) {
 *     const user = await authorizeAction('project:write');
 *     ...
 *   }
 *
 * Anonymous callers get 401 and callers without the permission 403 (Next's unauthorized() /
 * forbidden(), which set the HTTP status of the action response). Rows of another team must be
 * answered with notFound() (404), never 403.
 */
import { forbidden, unauthorized } from 'next/navigation';
import { can, type Permission } from '@/lib/auth/permissions';
import { getSessionUser, type SessionUser } from './session';

export async function authorizeAction(permission: Permission | 'authenticated'): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) unauthorized();
  if (permission !== 'authenticated' && !can(user.role, permission)) forbidden();
  return user;
}

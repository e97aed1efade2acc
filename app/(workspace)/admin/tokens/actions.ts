'use server';
/**
 * Admin → API tokens: create (the token is answered once, to this form, and never again) and
 * revoke. Each action checks the permission first; another team's token is "not found" (404).
 */
import { revalidatePath } from 'next/cache';
import { notFound } from 'next/navigation';
import { revokeApiToken } from '@/db/queries/apiTokens';
import { createTeamApiToken, createTokenInputSchema } from '@/server/apiTokens/manage';
import { authorizeAction } from '@/server/auth/actions';

export interface CreateTokenState {
  message?: string;
  fieldErrors?: Record<string, string>;
  /** Present once, right after creation. */
  created?: { name: string; token: string; prefix: string };
}

export async function createApiTokenAction(_state: CreateTokenState, formData: FormData): Promise<CreateTokenState> {
  const user = await authorizeAction('apitoken:manage');
  const expires = String(formData.get('expiresInDays') ?? '').trim();
  const parsed = createTokenInputSchema.safeParse({
    name: formData.get('name') ?? '',
    scopes: formData.getAll('scopes').map(String),
    requestsPerMinute: String(formData.get('requestsPerMinute') ?? '').trim() || undefined,
    expiresInDays: expires === '' ? null : expires,
  });
  if (!parsed.success) {
    const fieldErrors: Record<string, string> = {};
    for (const issue of parsed.error.issues) fieldErrors[String(issue.path[0] ?? 'form')] ??= issue.message;
    return { message: 'Check the highlighted fields.', fieldErrors };
  }
  const created = await createTeamApiToken(user.teamId, user.id, parsed.data);
  revalidatePath('/admin/tokens');
  return { created: { name: parsed.data.name, token: created.token, prefix: created.prefix } };
}

export interface RevokeTokenState {
  message?: string;
  revokedId?: string;
}

export async function revokeApiTokenAction(_state: RevokeTokenState, formData: FormData): Promise<RevokeTokenState> {
  const user = await authorizeAction('apitoken:manage');
  const tokenId = String(formData.get('tokenId') ?? '');
  if (!(await revokeApiToken(user.teamId, user.id, tokenId))) notFound();
  revalidatePath('/admin/tokens');
  return { message: 'Token revoked: programs using it are refused from now on.', revokedId: tokenId };
}

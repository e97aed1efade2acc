'use server';
/**
 * The document commands (issue 23): rename, duplicate, archive, unarchive, delete (soft) and
 * restore for projects, sizing sheets and schedules. Validated with zod; the rights and the rules
 * (approved revisions never deleted, …) are enforced by db/queries/documents, which works only on
 * the caller's team, so another team's id is simply "not found".
 */
import { revalidatePath } from 'next/cache';
import { forbidden, redirect } from 'next/navigation';
import { z } from 'zod';
import { deleteDocument, DocumentError, duplicateDocument, renameDocument, restoreDocument, setArchived } from '@/db/queries/documents';
import { isUuid } from '@/db/queries/sheets';
import { DOCUMENT_KINDS, mayManage } from '@/lib/documents/rules';
import { authorizeAction } from '@/server/auth/actions';

export interface DocumentActionState {
  ok?: boolean;
  message?: string;
  /** Where the new or restored document is, for a link beside the message. */
  href?: string;
}

const kind = z.enum(DOCUMENT_KINDS);
const id = z.string().refine(isUuid, 'No such document.');
const commandSchema = z.discriminatedUnion('op', [
  z.object({ op: z.literal('rename'), kind, id, name: z.string().trim().min(1, 'Enter a name.').max(200, 'Use at most 200 characters.') }),
  z.object({ op: z.enum(['duplicate', 'archive', 'unarchive', 'delete', 'restore']), kind, id }),
]);

const PATH = { project: '/projects', sheet: '/sheets', schedule: '/schedules' } as const;

export async function documentAction(_state: DocumentActionState, formData: FormData): Promise<DocumentActionState> {
  const user = await authorizeAction('team:read');
  const parsed = commandSchema.safeParse(Object.fromEntries(formData.entries()));
  if (!parsed.success) return { message: parsed.error.issues[0]?.message ?? 'That command could not be read.' };
  const command = parsed.data;
  // The role is answered with HTTP 403 like every action; a document of another team is "not found" in the form state.
  if (!mayManage(user.role, command.kind, command.op)) forbidden();
  const actor = { userId: user.id, role: user.role };
  let result: DocumentActionState;
  try {
    switch (command.op) {
      case 'rename':
        await renameDocument(user.teamId, actor, command.kind, command.id, command.name);
        result = { ok: true, message: `Renamed to “${command.name}”.` };
        break;
      case 'duplicate': {
        const copy = await duplicateDocument(user.teamId, actor, command.kind, command.id);
        result = { ok: true, message: `Duplicated as “${copy.name}”, a new draft.`, href: `${PATH[command.kind]}/${copy.id}` };
        break;
      }
      case 'archive':
      case 'unarchive':
        await setArchived(user.teamId, actor, command.kind, command.id, command.op === 'archive');
        result = { ok: true, message: command.op === 'archive' ? 'Archived: hidden from the lists, kept as it is.' : 'Back in the lists.' };
        break;
      case 'delete':
        await deleteDocument(user.teamId, actor, command.kind, command.id);
        result = { ok: true, message: 'Deleted. An admin can restore it for 30 days.' };
        break;
      case 'restore':
        await restoreDocument(user.teamId, actor, command.kind, command.id);
        result = { ok: true, message: 'Restored.', href: `${PATH[command.kind]}/${command.id}` };
        break;
    }
  } catch (error) {
    if (error instanceof DocumentError) return { message: error.message };
    throw error;
  }
  revalidatePath('/', 'layout');
  // A project deleted from its own page has nowhere to stay.
  if (command.op === 'delete' && command.kind === 'project') redirect('/projects');
  return result;
}

/** The "Recently deleted" page's Restore buttons (plain form posts; the list itself shows the outcome). */
export async function restoreFormAction(formData: FormData): Promise<void> {
  formData.set('op', 'restore');
  await documentAction({}, formData);
}

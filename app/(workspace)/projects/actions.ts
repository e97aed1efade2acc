'use server';
/**
 * Form posts of the projects pages: create a project, create a sizing sheet. Each checks the
 * permission first (authorizeAction), validates with zod and answers field errors to the form.
 */
import { redirect } from 'next/navigation';
import { revalidatePath } from 'next/cache';
import { createProject } from '@/db/queries/projects';
import { createSheet, isUuid, SheetOperationError } from '@/db/queries/sheets';
import { defaultSheetInputs } from '@/lib/sheet';
import { authorizeAction } from '@/server/auth/actions';
import { createProjectBodySchema, createSheetBodySchema, sheetActor } from '@/app/api/sheets/_shared/sheetApi';

export interface FormState {
  message?: string;
  fieldErrors?: Record<string, string>;
}

function fieldErrorsOf(issues: { path: PropertyKey[]; message: string }[]): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const issue of issues) errors[String(issue.path[0] ?? 'form')] ??= issue.message;
  return errors;
}

export async function createProjectAction(_state: FormState, formData: FormData): Promise<FormState> {
  const user = await authorizeAction('project:write');
  const parsed = createProjectBodySchema.safeParse({
    name: formData.get('name') ?? '',
    site: formData.get('site') ?? '',
    description: formData.get('description') ?? '',
  });
  if (!parsed.success) return { message: 'Check the highlighted fields.', fieldErrors: fieldErrorsOf(parsed.error.issues) };
  let projectId: string;
  try {
    projectId = (await createProject(user.teamId, user.id, parsed.data)).id;
  } catch (error) {
    const code = (error as { code?: string; cause?: { code?: string } }).code ?? (error as { cause?: { code?: string } }).cause?.code;
    if (code === '23505') return { fieldErrors: { name: 'Your team already has a project with this name.' } };
    throw error;
  }
  revalidatePath('/projects');
  redirect(`/projects/${projectId}`);
}

export async function createSheetAction(_state: FormState, formData: FormData): Promise<FormState> {
  const user = await authorizeAction('sheet:write');
  const projectId = String(formData.get('projectId') ?? '');
  if (!isUuid(projectId)) return { message: 'No such project.' };
  const parsed = createSheetBodySchema.safeParse({
    circuitTag: formData.get('circuitTag') ?? '',
    title: formData.get('title') ?? '',
    installation: formData.get('installation') ?? 'cable-in-air',
  });
  if (!parsed.success) return { message: 'Check the highlighted fields.', fieldErrors: fieldErrorsOf(parsed.error.issues) };
  let sheetId: string;
  try {
    sheetId = (
      await createSheet(user.teamId, sheetActor(user), {
        projectId,
        circuitTag: parsed.data.circuitTag,
        title: parsed.data.title,
        inputs: defaultSheetInputs(parsed.data.installation),
      })
    ).id;
  } catch (error) {
    if (error instanceof SheetOperationError) return { message: error.message };
    throw error;
  }
  revalidatePath(`/projects/${projectId}`);
  redirect(`/sheets/${sheetId}`);
}

/**
 * Shared by the sheet route handlers, pages and server actions: the session user as a state-machine
 * actor, and SheetOperationError as a JSON answer (a 409 carries what changed).
 */
import { z } from 'zod';
import { SheetOperationError } from '@/db/queries/sheets';
import { can, type Role } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/sheet';
import { INT4_MAX } from '@/server/http/body';

export function sheetActor(user: { id: string; role: Role }): Actor {
  return { userId: user.id, can: (permission) => can(user.role, permission) };
}

/** Runs the operation; a SheetOperationError becomes its JSON answer, anything else goes to apiHandler. */
export async function sheetOperation(operation: () => Promise<Response>): Promise<Response> {
  try {
    return await operation();
  } catch (error) {
    if (error instanceof SheetOperationError) {
      return Response.json({ error: { code: error.code, message: error.message, ...(error.detail ?? {}) } }, { status: error.status });
    }
    throw error;
  }
}

/** A sheet's saved version (an integer column): bounded, so that a huge number is a 400, not a database error. */
export const expectedVersionSchema = z
  .number({ error: 'expectedVersion must be a number' })
  .int('expectedVersion must be a whole number')
  .positive('expectedVersion must be at least 1')
  .max(INT4_MAX, `expectedVersion must be at most ${INT4_MAX}`);

export const commentSchema = z.string().trim().max(2000, 'A comment must be at most 2000 characters');

/** The sheet's title. The form labels it "What the circuit feeds": the messages name that field, and the API's name for it. */
export const sheetTitleSchema = z
  .string()
  .trim()
  .min(1, 'What the circuit feeds (title) is required')
  .max(200, 'What the circuit feeds (title) must be at most 200 characters');

export const createSheetBodySchema = z.object({
  circuitTag: z.string().trim().min(1, 'Circuit tag is required').max(40, 'Circuit tag must be at most 40 characters'),
  title: sheetTitleSchema,
  installation: z.enum(['bar-on-edge', 'bar-flat', 'cable-in-air', 'buried', 'enclosure']).default('cable-in-air'),
});

export const createProjectBodySchema = z.object({
  name: z.string().trim().min(1, 'Name is required').max(200, 'Name must be at most 200 characters'),
  site: z.string().trim().max(200, 'Site must be at most 200 characters').default(''),
  description: z.string().trim().max(2000, 'Description must be at most 2000 characters').default(''),
});

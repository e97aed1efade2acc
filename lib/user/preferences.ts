/**
 * A user's own settings that follow them from browser to browser (stored on their row,
 * `users.preferences`, jsonb). Each key is optional so that a new one needs no data migration, and
 * an update replaces only its own key (db/queries/preferences.ts merges), so settings of other
 * screens stay as they are.
 */
import { z } from 'zod';

/** Ids of columns (AG Grid colIds): short words, so a stored choice is never a large or odd value. */
const columnIdSchema = z.string().regex(/^[A-Za-z][A-Za-z0-9]{0,39}$/, 'A column id is a short word');

/** The comparison grid's column picker: column id → shown (true) or hidden (false); columns not listed keep their default. */
export const candidateGridColumnsSchema = z.record(columnIdSchema, z.boolean()).refine((v) => Object.keys(v).length <= 60, 'At most 60 columns');

export const userPreferencesSchema = z.object({
  candidateGridColumns: candidateGridColumnsSchema.optional(),
});

export type UserPreferences = z.infer<typeof userPreferencesSchema>;
export type CandidateGridColumns = z.infer<typeof candidateGridColumnsSchema>;

/** What is stored, read leniently: a value that no longer fits the schema counts as no choice made. */
export function readUserPreferences(stored: unknown): UserPreferences {
  const parsed = userPreferencesSchema.safeParse(stored ?? {});
  return parsed.success ? parsed.data : {};
}

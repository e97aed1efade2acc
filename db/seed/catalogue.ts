/**
 * Seeds the standard catalogue (lib/catalogue/standardData.ts) into a team. A new team gets its own
 * copy so that its edits never touch another team's rows. Idempotent: keys the team already has
 * are left as they are.
 */
import { eq } from 'drizzle-orm';
import { getDb, type Db, type Executor } from '../client';
import { copyCatalogueRowsToTeam } from '../queries/catalogue';
import { teams } from '../schema';
import { DEMO_TEAM } from './demo';
import { STANDARD_BUILDS, STANDARD_CONDUCTORS, STANDARD_COVERINGS, STANDARD_MATERIALS } from '../../lib/catalogue/standardData';

export const STANDARD_CATALOGUE = {
  materials: STANDARD_MATERIALS,
  conductors: STANDARD_CONDUCTORS,
  coverings: STANDARD_COVERINGS,
  builds: STANDARD_BUILDS,
} as const;

/**
 * Gives a team the standard catalogue. Pass the transaction that creates the team so that a team
 * never exists without its catalogue; without one it runs in a transaction of its own.
 */
export async function copyStandardCatalogueToTeam(teamId: string, tx?: Executor, actorId: string | null = null) {
  if (tx) return copyCatalogueRowsToTeam(tx, teamId, STANDARD_CATALOGUE, actorId);
  return getDb().transaction((own) => copyCatalogueRowsToTeam(own, teamId, STANDARD_CATALOGUE, actorId));
}

/** The seed step: the demo team's catalogue. */
export async function seedCatalogue(db: Db) {
  const [team] = await db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
  if (!team) throw new Error('the demo team is missing: run the demo seed first');
  return copyStandardCatalogueToTeam(team.id, undefined);
}

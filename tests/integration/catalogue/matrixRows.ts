/**
 * Rows of team A that the role × endpoint matrix (tests/integration/security/endpoint-matrix.ts)
 * points the catalogue endpoints at: built fresh for each call so that an admin's write never
 * changes what the next call sees.
 */
import { randomUUID } from 'node:crypto';
import { getDb } from '@/db/client';
import { catalogueCoverings } from '@/db/schema';
import { previewImport } from '@/db/queries/catalogue';
import { CATALOGUE_COLUMNS } from '@/lib/catalogue/columns';

/** A covering of the team that nothing references (so that deleting it succeeds). */
export async function freshCatalogueCovering(teamId: string): Promise<{ id: string }> {
  const [row] = await getDb()
    .insert(catalogueCoverings)
    .values({
      teamId,
      key: `matrix-${randomUUID().slice(0, 8)}`,
      name: 'Matrix covering',
      role: 'sheath',
      thermalResistivityKmPerW: '5.0',
      resistivitySource: 'Matrix test row',
      limitsSource: 'Matrix test row',
      emissivitySource: 'Matrix test row',
    })
    .returning({ id: catalogueCoverings.id });
  return row;
}

/** A previewed (not yet committed) import of one valid covering. */
export async function freshCatalogueImport(teamId: string, actorId: string): Promise<{ id: string }> {
  const header = CATALOGUE_COLUMNS.coverings.map((c) => c.header).join(',');
  const line = `matrix-import-${randomUUID().slice(0, 8)},Matrix import,sheath,5.0,Matrix test,,,Matrix test,,Matrix test`;
  const preview = await previewImport(teamId, actorId, 'coverings', {
    fileName: 'matrix.csv',
    mediaType: 'text/csv',
    bytes: new TextEncoder().encode(`${header}\n${line}\n`),
  });
  return { id: preview.importId };
}

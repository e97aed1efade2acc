import { countCatalogue } from '@/db/queries/catalogue';
import { can } from '@/lib/auth/permissions';
import { requirePageUser } from '@/server/auth/session';
import { CatalogueScreen } from '@/components/catalogue/CatalogueScreen';
import { isCatalogueKind } from '@/lib/catalogue/schemas';

export const metadata = { title: 'Catalogue' };
export const dynamic = 'force-dynamic';

export default async function CataloguePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser('team:read');
  const { part } = await searchParams;
  const counts = await countCatalogue(user.teamId);
  return (
    <section aria-labelledby="catalogue-heading">
      <CatalogueScreen
        initialKind={isCatalogueKind(part) ? part : 'conductors'}
        canEdit={can(user.role, 'catalogue:write')}
        units={user.unitSystem}
        counts={counts}
      />
    </section>
  );
}

// Seeds the invented demo scenario once; running it again changes nothing.
import { closeDb, getDb } from '../db/client';
import { seedDemo } from '../db/seed/demo';
import { seedSheets } from '../db/seed/sheets';
import { seedCatalogue } from '../db/seed/catalogue';

async function main() {
  const report = await seedDemo(getDb());
  const catalogueAdded = await seedCatalogue(getDb());
  const catalogueRows = Object.values(catalogueAdded).reduce((a, b) => a + b, 0);
  if (catalogueRows > 0) console.log(`ampwarden: standard catalogue seeded (${catalogueRows} rows)`);
  const sheetReport = await seedSheets(getDb());
  const changed = report.teamCreated || report.usersCreated > 0 || report.projectsCreated > 0 || sheetReport.sheetsCreated > 0;
  console.log(
    changed
      ? `ampwarden: demo data seeded (team ${report.teamCreated ? 'created' : 'kept'}, ${report.usersCreated} users, ${report.projectsCreated} projects, ${sheetReport.sheetsCreated} sizing sheets)`
      : 'ampwarden: demo data already present',
  );
}

main()
  .catch((error: unknown) => {
    console.error(`ampwarden: seeding failed: ${error instanceof Error ? error.message : String(error)}`);
    process.exitCode = 1;
  })
  .finally(() => closeDb());

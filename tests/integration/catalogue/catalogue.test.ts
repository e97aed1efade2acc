// The catalogue against the real PostgreSQL server: the seeded values equal the published tables
// they cite (../shared/design/references.md), edits are validated and audited, teams are isolated,
// and imports commit every row or none.
import Decimal from 'decimal.js';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { closeDb, getDb } from '@/db/client';
import { auditLog, catalogueConductors, catalogueImports } from '@/db/schema';
import {
  CatalogueConflictError,
  CatalogueNotFoundError,
  catalogueRowHistory,
  commitImport,
  createCatalogueRow,
  countCatalogue,
  deleteCatalogueRow,
  getImportFile,
  ImportProblemsError,
  listBuilds,
  listCatalogue,
  listConductors,
  listCoverings,
  listMaterials,
  previewImport,
  updateCatalogueRow,
} from '@/db/queries/catalogue';
import { copyStandardCatalogueToTeam } from '@/db/seed/catalogue';
import { CATALOGUE_COLUMNS } from '@/lib/catalogue';
import { FileRefusal, validateRecords, writeXlsx } from '@/lib/catalogue/files';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';

afterAll(() => closeDb());

let teamId: string;
let otherTeamId: string;
let adminId: string;

beforeAll(async () => {
  teamId = (await createTestTeam('catalogue')).id;
  otherTeamId = (await createTestTeam('catalogue-other')).id;
  adminId = (await createTestUser(teamId, 'admin')).id;
  await copyStandardCatalogueToTeam(teamId);
});

const encode = (text: string) => new TextEncoder().encode(text);
const csvFile = (fileName: string, text: string) => ({ fileName, mediaType: 'text/csv', bytes: encode(text) });
const same = (a: string | null | undefined, b: string) => a !== null && a !== undefined && new Decimal(a).eq(b);

describe('the seeded catalogue equals the tables it cites', () => {
  it('IEC 60228 Table 2 class 2 copper and aluminium R20 (references.md, from memory), read back from numeric columns', async () => {
    const conductors = await listConductors(teamId);
    const r20 = (key: string) => conductors.find((c) => c.key === key)?.r20OhmPerKm;
    const copper: Record<string, string> = {
      '1.5': '12.1', '2.5': '7.41', '4': '4.61', '6': '3.08', '10': '1.83', '16': '1.15', '25': '0.727', '35': '0.524',
      '50': '0.387', '70': '0.268', '95': '0.193', '120': '0.153', '150': '0.124', '185': '0.0991', '240': '0.0754', '300': '0.0601',
    };
    for (const [section, expected] of Object.entries(copper)) expect(same(r20(`cu-${section}`), expected), `copper ${section} mm²`).toBe(true);
    for (const [section, expected] of Object.entries({ '50': '0.641', '95': '0.320', '150': '0.206', '240': '0.125' })) {
      expect(same(r20(`al-${section}`), expected), `aluminium ${section} mm²`).toBe(true);
    }
  });
  it('IEC 60287-1-1 Table 1 ρ20, α20 and IEC 60949 K, β (references.md)', async () => {
    const materials = await listMaterials(teamId);
    const copper = materials.find((m) => m.key === 'copper')!;
    const aluminium = materials.find((m) => m.key === 'aluminium')!;
    expect([copper.rho20OhmM, copper.alpha20PerK, copper.adiabaticK, copper.betaK].map((v) => new Decimal(v).toString())).toEqual(['1.7241e-8', '0.00393', '226', '234.5']);
    expect([aluminium.rho20OhmM, aluminium.alpha20PerK, aluminium.adiabaticK, aluminium.betaK].map((v) => new Decimal(v).toString())).toEqual(['2.8264e-8', '0.00403', '148', '228']);
  });
  it('IEC 60287-2-1 Table 1 thermal resistivities (references.md, from memory)', async () => {
    const coverings = await listCoverings(teamId);
    const rho = (key: string) => new Decimal(coverings.find((c) => c.key === key)!.thermalResistivityKmPerW).toNumber();
    expect([rho('pvc-insulation'), rho('xlpe-insulation'), rho('epr-insulation'), rho('pe-insulation'), rho('pvc-sheath')]).toEqual([5, 3.5, 3.5, 3.5, 5]);
  });
  it('builds come back with their ordered layers', async () => {
    const build = (await listBuilds(teamId)).find((b) => b.key === 'demo-cu-240-xlpe-pvc')!;
    expect(build).toMatchObject({ conductorKey: 'cu-240', maker: 'Demo build', layer1CoveringKey: 'xlpe-insulation', layer2CoveringKey: 'pvc-sheath', layer3CoveringKey: '' });
    expect(same(build.layer1ThicknessMm, '1.7')).toBe(true);
  });
  it('copying again adds nothing; another team has its own (empty) catalogue', async () => {
    expect(await copyStandardCatalogueToTeam(teamId)).toEqual({ materials: 0, conductors: 0, coverings: 0, builds: 0 });
    expect(await countCatalogue(otherTeamId)).toEqual({ materials: 0, conductors: 0, coverings: 0, builds: 0 });
  });
});

describe('edits', () => {
  it('validates the whole row again, names the field, writes and audits', async () => {
    const row = (await listCoverings(teamId)).find((c) => c.key === 'pe-sheath')!;
    await expect(updateCatalogueRow(teamId, adminId, 'coverings', row.id, { emissivity: '1.5' })).rejects.toThrow(/emissivity/);
    const updated = await updateCatalogueRow(teamId, adminId, 'coverings', row.id, { emissivity: '0.85', emissivitySource: 'Supplier datasheet' });
    expect(updated.emissivity).toBe('0.85');
    const [entry] = await getDb()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.teamId, teamId), eq(auditLog.entityId, row.id), eq(auditLog.action, 'catalogue.row.update')));
    expect(entry.actorId).toBe(adminId);
    expect(entry.detail).toMatchObject({ key: 'pe-sheath', changes: { emissivity: { from: '0.9', to: '0.85' } } });
  });
  it('refuses a reference to a key the team does not have, and a taken key', async () => {
    const conductor = (await listConductors(teamId)).find((c) => c.key === 'cu-bar-12x2')!;
    const issue = async (changes: Record<string, unknown>) => {
      const error = await updateCatalogueRow(teamId, adminId, 'conductors', conductor.id, changes).catch((e: unknown) => e);
      expect(error).toBeInstanceOf(ZodError);
      const [first] = (error as ZodError).issues;
      return `${first.path.join('.')}: ${first.message}`;
    };
    expect(await issue({ materialKey: 'brass' })).toBe('materialKey: no metal with key "brass" in this catalogue');
    expect(await issue({ key: 'cu-240' })).toBe('key: "cu-240" is already used by another row');
    expect(await issue({ colour: 'red' })).toBe('colour: is not a column of this catalogue');
  });
  it("another team's id finds nothing (404), and a used row cannot be deleted", async () => {
    const copper = (await listMaterials(teamId)).find((m) => m.key === 'copper')!;
    await expect(updateCatalogueRow(otherTeamId, adminId, 'materials', copper.id, { name: 'Taken' })).rejects.toBeInstanceOf(CatalogueNotFoundError);
    await expect(deleteCatalogueRow(otherTeamId, adminId, 'materials', copper.id)).rejects.toBeInstanceOf(CatalogueNotFoundError);
    await expect(deleteCatalogueRow(teamId, adminId, 'materials', copper.id)).rejects.toBeInstanceOf(CatalogueConflictError);
    expect((await listMaterials(teamId)).some((m) => m.id === copper.id)).toBe(true);
  });
});

describe('a changed value names its source (issue 23)', () => {
  const refusal = async (promise: Promise<unknown>) => {
    const error = await promise.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ZodError);
    return (error as ZodError).issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  };

  it('refuses a changed value without its source and leaves the row as it was', async () => {
    const row = (await listCoverings(teamId)).find((c) => c.key === 'pvc-insulation')!;
    const issues = await refusal(updateCatalogueRow(teamId, adminId, 'coverings', row.id, { thermalResistivityKmPerW: '6' }));
    expect(issues).toEqual([expect.stringMatching(/^resistivitySource: is required when Thermal resistivity changes/)]);
    // A blank source is no source.
    expect(await refusal(updateCatalogueRow(teamId, adminId, 'coverings', row.id, { thermalResistivityKmPerW: '6', resistivitySource: '  ' }))).toHaveLength(1);
    const after = (await listCoverings(teamId)).find((c) => c.key === 'pvc-insulation')!;
    expect(after.thermalResistivityKmPerW).toBe(row.thermalResistivityKmPerW);
    expect(after.resistivitySource).toBe(row.resistivitySource);
  });

  it('saves the value with its source; the same value written differently, or a name, needs none', async () => {
    const row = (await listCoverings(teamId)).find((c) => c.key === 'pvc-insulation')!;
    const saved = await updateCatalogueRow(teamId, adminId, 'coverings', row.id, { thermalResistivityKmPerW: '6', resistivitySource: 'Supplier datasheet PV-6 (test)' });
    expect([saved.thermalResistivityKmPerW, saved.resistivitySource]).toEqual(['6', 'Supplier datasheet PV-6 (test)']);
    // "6.0" is the stored 6: not a change of value.
    await updateCatalogueRow(teamId, adminId, 'coverings', row.id, { thermalResistivityKmPerW: '6.0' });
    const renamed = await updateCatalogueRow(teamId, adminId, 'coverings', row.id, { name: 'PVC insulation (renamed in a test)' });
    expect(renamed.name).toBe('PVC insulation (renamed in a test)');
  });

  it('applies to each cited value of every part: a bar’s thickness, a metal’s resistivity, a build’s layer', async () => {
    const bar = (await listConductors(teamId)).find((c) => c.key === 'cu-bar-12x2')!;
    expect(await refusal(updateCatalogueRow(teamId, adminId, 'conductors', bar.id, { thicknessMm: '2.5' }))).toEqual([expect.stringMatching(/^dimensionSource: /)]);
    const copper = (await listMaterials(teamId)).find((m) => m.key === 'copper')!;
    expect(await refusal(updateCatalogueRow(teamId, adminId, 'materials', copper.id, { rho20OhmM: '1.8e-8' }))).toEqual([expect.stringMatching(/^electricalSource: /)]);
    const build = (await listBuilds(teamId)).find((b) => b.key === 'demo-cu-240-xlpe-pvc')!;
    expect(await refusal(updateCatalogueRow(teamId, adminId, 'builds', build.id, { layer1ThicknessMm: '1.9' }))).toEqual([expect.stringMatching(/^layer1Source: /)]);
  });
});

describe('adding an item (issue 23)', () => {
  const header = CATALOGUE_COLUMNS.coverings.map((c) => c.header);
  const asRecord = (line: string) => Object.fromEntries(header.map((h, i) => [h, line.split(',')[i] ?? '']));
  const asRow = (line: string) => Object.fromEntries(CATALOGUE_COLUMNS.coverings.map((c, i) => [c.field, line.split(',')[i] ?? '']));

  it('refuses exactly what an import refuses, with the same field and message', async () => {
    const bad = 'mica-added,Mica tape,insulation,abc,Supplier datasheet,200,150,Supplier datasheet,1.5,';
    const imported = validateRecords('coverings', [{ row: 2, values: asRecord(bad) }]).problems.map((p) => `${p.column}: ${p.message}`).sort();
    const error = await createCatalogueRow(teamId, adminId, 'coverings', asRow(bad)).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ZodError);
    const added = (error as ZodError).issues.map((i) => `${CATALOGUE_COLUMNS.coverings.find((c) => c.field === i.path[0])!.header}: ${i.message}`).sort();
    expect(imported.length).toBeGreaterThanOrEqual(3);
    expect(added).toEqual(imported);
    expect((await listCoverings(teamId)).some((c) => c.key === 'mica-added')).toBe(false);
  });

  it('adds a valid row and audits it; a taken key or an unknown reference is refused', async () => {
    const good = 'silicone-added,Silicone rubber (added),insulation,4.5,Supplier datasheet,180,350,Supplier datasheet,0.9,Supplier datasheet';
    const created = await createCatalogueRow(teamId, adminId, 'coverings', asRow(good));
    expect(created).toMatchObject({ key: 'silicone-added', thermalResistivityKmPerW: '4.5', continuousLimitC: '180' });
    const [entry] = await getDb().select().from(auditLog).where(and(eq(auditLog.entityId, created.id), eq(auditLog.action, 'catalogue.row.create')));
    expect(entry.actorId).toBe(adminId);
    const firstIssue = async (promise: Promise<unknown>) => ((await promise.catch((e: unknown) => e)) as ZodError).issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    expect(await firstIssue(createCatalogueRow(teamId, adminId, 'coverings', asRow(good)))).toEqual(['key: "silicone-added" is already used by another row']);
    // Optional columns left out of the body are empty, as an empty cell of a file is.
    const sparse = await createCatalogueRow(teamId, adminId, 'coverings', { key: 'sparse-added', name: 'Sparse', role: 'sheath', thermalResistivityKmPerW: '5', resistivitySource: 'S', limitsSource: 'S', emissivitySource: 'S' });
    expect([sparse.continuousLimitC, sparse.emissivity]).toEqual([null, null]);
    const conductor = { ...(await listConductors(teamId)).find((c) => c.key === 'cu-240')!, key: 'brass-240', materialKey: 'brass' } as Record<string, unknown>;
    delete conductor.id;
    delete conductor.updatedAt;
    expect(await firstIssue(createCatalogueRow(teamId, adminId, 'conductors', conductor))).toEqual(['materialKey: no metal with key "brass" in this catalogue']);
  });
});

describe('an item’s history from the audit log (issue 23)', () => {
  it('lists the addition, each edit with from → to and who, and each import that changed it; nothing for another team', async () => {
    const line = 'history-item,History covering,sheath,5.0,Test source A,,,Test source A,0.9,Test source A';
    const created = await createCatalogueRow(teamId, adminId, 'coverings', Object.fromEntries(CATALOGUE_COLUMNS.coverings.map((c, i) => [c.field, line.split(',')[i]])));
    await updateCatalogueRow(teamId, adminId, 'coverings', created.id, { emissivity: '0.8', emissivitySource: 'Test source B' });
    const header = CATALOGUE_COLUMNS.coverings.map((c) => c.header).join(',');
    const preview = await previewImport(teamId, adminId, 'coverings', csvFile('history.csv', `${header}
${line.replace('5.0', '5.5')}
`));
    await commitImport(teamId, adminId, preview.importId);
    const history = (await catalogueRowHistory(teamId, 'coverings', created.id))!;
    expect(history.map((h) => h.action)).toEqual(['created', 'edited', 'imported']);
    expect(history[0].actorName).toMatch(/^admin /);
    expect(history[1].changes).toEqual({ emissivity: { from: '0.9', to: '0.8' }, emissivitySource: { from: 'Test source A', to: 'Test source B' } });
    expect(history[2]).toMatchObject({ fileName: 'history.csv', changes: { thermalResistivityKmPerW: { from: '5.0', to: '5.5' }, emissivity: { from: '0.8', to: '0.9' } } });
    expect(await catalogueRowHistory(otherTeamId, 'coverings', created.id)).toBeNull();
  });
});

describe('imports', () => {
  const header = CATALOGUE_COLUMNS.conductors.map((c) => c.header).join(',');
  // Bars computed as ρ20/(w·t) with IEC 60287-1-1 ρ20 (the same rule as the standard rows).
  const barRow = (w: number, t: number) =>
    `cu-bar-${w}x${t}-imp,${w} × ${t} mm,copper,rectangular,bar,Rectangular bar,${w * t},${new Decimal(17.241).div(w * t).toSignificantDigits(5).toFixed()},rho20/(w·t),,${w},${t},Nominal size`;

  it('a good file commits every row, and the original file is kept', async () => {
    const before = (await listConductors(teamId)).length;
    const text = [header, barRow(63, 10), barRow(75, 10), barRow(125, 10)].join('\n');
    const preview = await previewImport(teamId, adminId, 'conductors', csvFile('bars.csv', text));
    expect(preview).toMatchObject({ rowCount: 3, newCount: 3, replaceCount: 0, problems: [] });
    const result = await commitImport(teamId, adminId, preview.importId);
    expect(result).toMatchObject({ inserted: 3, updated: 0 });
    const after = await listConductors(teamId);
    expect(after.length).toBe(before + 3);
    expect(after.find((c) => c.key === 'cu-bar-75x10-imp')?.r20OhmPerKm).toBe('0.022988');
    const kept = await getImportFile(teamId, preview.importId);
    expect(new TextDecoder().decode(kept!.content)).toBe(text);
    expect(await getImportFile(otherTeamId, preview.importId)).toBeNull();
    await expect(commitImport(teamId, adminId, preview.importId)).rejects.toBeInstanceOf(CatalogueConflictError);
  });

  it('a file with one bad row commits nothing and reports that row', async () => {
    const before = await listConductors(teamId);
    const bad = barRow(90, 10).replace('copper', 'brass');
    const text = [header, barRow(63, 10).replace('Nominal size', 'Nominal size (re-imported)'), barRow(85, 10), bad, barRow(95, 10)].join('\n');
    const preview = await previewImport(teamId, adminId, 'conductors', csvFile('bad.csv', text));
    expect(preview.problems).toEqual([{ row: 4, column: 'material_key', message: 'no metal with key "brass" in this catalogue' }]);
    expect(preview).toMatchObject({ rowCount: 4, newCount: 2, replaceCount: 1 });
    const failure = await commitImport(teamId, adminId, preview.importId).catch((e: unknown) => e);
    expect(failure).toBeInstanceOf(ImportProblemsError);
    expect((failure as ImportProblemsError).problems).toEqual(preview.problems);
    const after = await listConductors(teamId);
    expect(after.map((c) => `${c.key}|${c.dimensionSource}`).sort()).toEqual(before.map((c) => `${c.key}|${c.dimensionSource}`).sort());
    const [record] = await getDb().select().from(catalogueImports).where(eq(catalogueImports.id, preview.importId));
    expect(record.status).toBe('previewed');
  });

  it('an XLSX file of builds replaces layers of an existing build', async () => {
    const builds = await listBuilds(teamId);
    const original = builds.find((b) => b.key === 'demo-cu-95-xlpe-pvc')!;
    const changed = { ...original, layer2CoveringKey: 'pe-sheath', layer2ThicknessMm: '1.6', layer2Source: 'Supplier datasheet' };
    const bytes = await writeXlsx('builds', [changed as unknown as Record<string, unknown>]);
    const preview = await previewImport(teamId, adminId, 'builds', { fileName: 'builds.xlsx', mediaType: '', bytes });
    expect(preview.problems).toEqual([]);
    expect(await commitImport(teamId, adminId, preview.importId)).toMatchObject({ inserted: 0, updated: 1 });
    const after = (await listBuilds(teamId)).find((b) => b.key === 'demo-cu-95-xlpe-pvc')!;
    expect(after).toMatchObject({ id: original.id, layer2CoveringKey: 'pe-sheath', layer2ThicknessMm: '1.6' });
  });

  it('refused files leave no import record', async () => {
    const count = async () => (await getDb().select().from(catalogueImports).where(eq(catalogueImports.teamId, teamId))).length;
    const before = await count();
    await expect(previewImport(teamId, adminId, 'conductors', csvFile('none.csv', ''))).rejects.toBeInstanceOf(FileRefusal);
    await expect(previewImport(teamId, adminId, 'conductors', csvFile('cols.csv', 'key,name\na,b'))).rejects.toThrow(/missing columns/);
    expect(await count()).toBe(before);
  });

  it('team B cannot commit team A’s import', async () => {
    const preview = await previewImport(teamId, adminId, 'conductors', csvFile('bars.csv', [header, barRow(140, 10)].join('\n')));
    await expect(commitImport(otherTeamId, adminId, preview.importId)).rejects.toBeInstanceOf(CatalogueNotFoundError);
    expect((await listCatalogue(teamId, 'conductors')).some((c) => c.key === 'cu-bar-140x10-imp')).toBe(false);
  });
});

describe('numeric storage', () => {
  it('keeps decimals exactly (no binary floating point on the way)', async () => {
    const [row] = await getDb().select({ r: catalogueConductors.r20OhmPerKm }).from(catalogueConductors).where(and(eq(catalogueConductors.teamId, teamId), eq(catalogueConductors.key, 'cu-185')));
    expect(row.r).toBe('0.0991');
  });
});

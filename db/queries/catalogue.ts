/**
 * The team catalogue in PostgreSQL. Every function takes the team id first and touches only that
 * team's rows; another team's id simply finds nothing. Writes run in one transaction with their
 * audit entry. Rows travel in the shared row form of lib/catalogue (decimal strings in the stored
 * SI units, references by key), validated by the same zod schemas the client uses.
 */
import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import { z } from 'zod';
import {
  buildLayers,
  MAX_BUILD_LAYERS,
  ROW_SCHEMAS,
  type BuildRow,
  type CatalogueKind,
  type CatalogueRowByKind,
  type ConductorRow,
  type CoveringRow,
  type MaterialRow,
  type StoredRow,
} from '@/lib/catalogue/schemas';
import { CATALOGUE_COLUMNS, columnByField } from '@/lib/catalogue/columns';
import { readCatalogueFile, validateRecords, type ImportProblem, type RawRecord } from '@/lib/catalogue/files';
import { missingCitations, sameCatalogueValue } from '@/lib/catalogue/citations';
import { getDb, type Executor } from '../client';
import {
  catalogueCableBuildLayers,
  catalogueCableBuilds,
  catalogueConductors,
  catalogueCoverings,
  catalogueImports,
  catalogueMaterials,
} from '../schema';
import { listAuditFor, recordAudit } from './audit';

export class CatalogueNotFoundError extends Error {}
/** A row still used elsewhere, a key taken twice, an import already committed. */
export class CatalogueConflictError extends Error {}
/** An import whose rows are not all valid: nothing was written. */
export class ImportProblemsError extends Error {
  constructor(readonly problems: ImportProblem[]) {
    super(`${problems.length} problem${problems.length === 1 ? '' : 's'} in the file: nothing was imported`);
  }
}

const TABLES = {
  materials: catalogueMaterials,
  conductors: catalogueConductors,
  coverings: catalogueCoverings,
  builds: catalogueCableBuilds,
} as const;

/** Entity names in the audit log. */
const AUDIT_ENTITY: Record<CatalogueKind, string> = {
  materials: 'catalogue_material',
  conductors: 'catalogue_conductor',
  coverings: 'catalogue_covering',
  builds: 'catalogue_cable_build',
};

function pgCode(error: unknown): string | undefined {
  for (let current: unknown = error, depth = 0; current && depth < 4; depth++) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string') return code;
    current = (current as { cause?: unknown }).cause;
  }
  return undefined;
}

// ───────────────────────── reading ─────────────────────────

const stamp = (row: { id: string; updatedAt: Date }) => ({ id: row.id, updatedAt: row.updatedAt.toISOString() });

export async function listMaterials(teamId: string, tx: Executor = getDb()): Promise<StoredRow<'materials'>[]> {
  const rows = await tx.select().from(catalogueMaterials).where(eq(catalogueMaterials.teamId, teamId)).orderBy(asc(catalogueMaterials.name));
  return rows.map((r) => ({
    ...stamp(r),
    key: r.key,
    name: r.name,
    baseMetal: r.baseMetal,
    rho20OhmM: r.rho20OhmM,
    alpha20PerK: r.alpha20PerK,
    electricalSource: r.electricalSource,
    thermalConductivityWPerMK: r.thermalConductivityWPerMK,
    densityKgPerM3: r.densityKgPerM3,
    specificHeatJPerKgK: r.specificHeatJPerKgK,
    thermalSource: r.thermalSource,
    adiabaticK: r.adiabaticK,
    betaK: r.betaK,
    shortCircuitSource: r.shortCircuitSource,
    pricePerKg: r.pricePerKg,
    priceNote: r.priceNote,
  }));
}

export async function listConductors(teamId: string, tx: Executor = getDb()): Promise<StoredRow<'conductors'>[]> {
  const rows = await tx
    .select({ c: catalogueConductors, materialKey: catalogueMaterials.key })
    .from(catalogueConductors)
    .innerJoin(catalogueMaterials, eq(catalogueMaterials.id, catalogueConductors.materialId))
    .where(eq(catalogueConductors.teamId, teamId))
    .orderBy(asc(catalogueMaterials.key), asc(catalogueConductors.shape), asc(catalogueConductors.sizeSystem), asc(catalogueConductors.sectionMm2));
  return rows.map(({ c, materialKey }) => ({
    ...stamp(c),
    key: c.key,
    designation: c.designation,
    materialKey,
    shape: c.shape,
    sizeSystem: c.sizeSystem,
    construction: c.construction,
    sectionMm2: c.sectionMm2,
    r20OhmPerKm: c.r20OhmPerKm,
    resistanceSource: c.resistanceSource,
    diameterMm: c.diameterMm,
    widthMm: c.widthMm,
    thicknessMm: c.thicknessMm,
    dimensionSource: c.dimensionSource,
    yieldStrengthMpa: c.yieldStrengthMpa,
    yieldStrengthSource: c.yieldStrengthSource,
    shortCircuitLimitC: c.shortCircuitLimitC,
    shortCircuitLimitSource: c.shortCircuitLimitSource,
  }));
}

export async function listCoverings(teamId: string, tx: Executor = getDb()): Promise<StoredRow<'coverings'>[]> {
  const rows = await tx.select().from(catalogueCoverings).where(eq(catalogueCoverings.teamId, teamId)).orderBy(asc(catalogueCoverings.role), asc(catalogueCoverings.name));
  return rows.map((r) => ({
    ...stamp(r),
    key: r.key,
    name: r.name,
    role: r.role,
    thermalResistivityKmPerW: r.thermalResistivityKmPerW,
    resistivitySource: r.resistivitySource,
    continuousLimitC: r.continuousLimitC,
    shortCircuitLimitC: r.shortCircuitLimitC,
    limitsSource: r.limitsSource,
    emissivity: r.emissivity,
    emissivitySource: r.emissivitySource,
  }));
}

export async function listBuilds(teamId: string, tx: Executor = getDb()): Promise<StoredRow<'builds'>[]> {
  const builds = await tx
    .select({ b: catalogueCableBuilds, conductorKey: catalogueConductors.key, sectionMm2: catalogueConductors.sectionMm2 })
    .from(catalogueCableBuilds)
    .innerJoin(catalogueConductors, eq(catalogueConductors.id, catalogueCableBuilds.conductorId))
    .where(eq(catalogueCableBuilds.teamId, teamId))
    .orderBy(asc(catalogueCableBuilds.maker), asc(catalogueConductors.materialId), asc(catalogueConductors.sectionMm2), asc(catalogueCableBuilds.name));
  const layers = await tx
    .select({ buildId: catalogueCableBuildLayers.buildId, position: catalogueCableBuildLayers.position, coveringKey: catalogueCoverings.key, thicknessMm: catalogueCableBuildLayers.thicknessMm, source: catalogueCableBuildLayers.thicknessSource })
    .from(catalogueCableBuildLayers)
    .innerJoin(catalogueCoverings, eq(catalogueCoverings.id, catalogueCableBuildLayers.coveringId))
    .where(eq(catalogueCableBuildLayers.teamId, teamId));
  const byBuild = new Map<string, typeof layers>();
  for (const layer of layers) byBuild.set(layer.buildId, [...(byBuild.get(layer.buildId) ?? []), layer]);
  return builds.map(({ b, conductorKey }) => {
    const row: Record<string, unknown> = { ...stamp(b), key: b.key, name: b.name, maker: b.maker, conductorKey, cores: b.cores, note: b.note };
    for (let n = 1; n <= MAX_BUILD_LAYERS; n++) {
      const layer = byBuild.get(b.id)?.find((l) => l.position === n);
      row[`layer${n}CoveringKey`] = layer?.coveringKey ?? '';
      row[`layer${n}ThicknessMm`] = layer?.thicknessMm ?? null;
      row[`layer${n}Source`] = layer?.source ?? '';
    }
    return row as StoredRow<'builds'>;
  });
}

export async function listCatalogue<K extends CatalogueKind>(teamId: string, kind: K, tx: Executor = getDb()): Promise<StoredRow<K>[]> {
  const readers = { materials: listMaterials, conductors: listConductors, coverings: listCoverings, builds: listBuilds };
  return (await readers[kind](teamId, tx)) as unknown as StoredRow<K>[];
}

export async function getCatalogueRow<K extends CatalogueKind>(teamId: string, kind: K, id: string, tx: Executor = getDb()): Promise<StoredRow<K> | null> {
  if (!z.uuid().safeParse(id).success) return null;
  // The catalogue of a team is a few hundred rows: reading the kind and picking one keeps one code path for the joins.
  const rows = await listCatalogue(teamId, kind, tx);
  return rows.find((r) => r.id === id) ?? null;
}

/** How many rows of each kind the team has (for empty states and the tab counts). */
export async function countCatalogue(teamId: string, tx: Executor = getDb()): Promise<Record<CatalogueKind, number>> {
  const count = async (table: (typeof TABLES)[CatalogueKind]) =>
    (await tx.select({ n: sql<number>`count(*)::int` }).from(table).where(eq(table.teamId, teamId)))[0]?.n ?? 0;
  return {
    materials: await count(catalogueMaterials),
    conductors: await count(catalogueConductors),
    coverings: await count(catalogueCoverings),
    builds: await count(catalogueCableBuilds),
  };
}

// ───────────────────────── references ─────────────────────────

interface KeyMaps {
  materials: Map<string, string>;
  conductors: Map<string, { id: string; shape: 'round' | 'rectangular' }>;
  coverings: Map<string, string>;
}

async function keyMaps(tx: Executor, teamId: string): Promise<KeyMaps> {
  const materials = await tx.select({ id: catalogueMaterials.id, key: catalogueMaterials.key }).from(catalogueMaterials).where(eq(catalogueMaterials.teamId, teamId));
  const conductors = await tx
    .select({ id: catalogueConductors.id, key: catalogueConductors.key, shape: catalogueConductors.shape })
    .from(catalogueConductors)
    .where(eq(catalogueConductors.teamId, teamId));
  const coverings = await tx.select({ id: catalogueCoverings.id, key: catalogueCoverings.key }).from(catalogueCoverings).where(eq(catalogueCoverings.teamId, teamId));
  return {
    materials: new Map(materials.map((m) => [m.key, m.id])),
    conductors: new Map(conductors.map((c) => [c.key, { id: c.id, shape: c.shape }])),
    coverings: new Map(coverings.map((c) => [c.key, c.id])),
  };
}

/** Problems with the keys a row names (field → message); empty when all resolve. */
function referenceIssues(kind: CatalogueKind, row: CatalogueRowByKind[CatalogueKind], maps: KeyMaps): Array<{ field: string; message: string }> {
  const issues: Array<{ field: string; message: string }> = [];
  if (kind === 'conductors') {
    const { materialKey } = row as ConductorRow;
    if (!maps.materials.has(materialKey)) issues.push({ field: 'materialKey', message: `no metal with key "${materialKey}" in this catalogue` });
  }
  if (kind === 'builds') {
    const build = row as BuildRow;
    const conductor = maps.conductors.get(build.conductorKey);
    if (!conductor) issues.push({ field: 'conductorKey', message: `no conductor with key "${build.conductorKey}" in this catalogue` });
    else if (conductor.shape !== 'round') issues.push({ field: 'conductorKey', message: `"${build.conductorKey}" is a bar; a cable build needs a round conductor` });
    for (const layer of buildLayers(build)) {
      if (!maps.coverings.has(layer.coveringKey)) issues.push({ field: `layer${layer.position}CoveringKey`, message: `no covering with key "${layer.coveringKey}" in this catalogue` });
    }
  }
  return issues;
}

function zodErrorOf(issues: Array<{ field: string; message: string }>): z.ZodError {
  return new z.ZodError(issues.map((i) => ({ code: 'custom' as const, path: [i.field], message: i.message, input: undefined })));
}

// ───────────────────────── writing ─────────────────────────

function valuesFor(kind: CatalogueKind, teamId: string, row: CatalogueRowByKind[CatalogueKind], maps: KeyMaps) {
  switch (kind) {
    case 'materials':
      return { teamId, ...(row as MaterialRow) };
    case 'conductors': {
      const { materialKey, ...rest } = row as ConductorRow;
      return { teamId, ...rest, materialId: maps.materials.get(materialKey)! };
    }
    case 'coverings':
      return { teamId, ...(row as CoveringRow) };
    case 'builds': {
      const b = row as BuildRow;
      return { teamId, key: b.key, name: b.name, maker: b.maker, conductorId: maps.conductors.get(b.conductorKey)!.id, cores: b.cores, note: b.note };
    }
  }
}

async function replaceLayers(tx: Executor, teamId: string, buildId: string, row: BuildRow, maps: KeyMaps) {
  await tx.delete(catalogueCableBuildLayers).where(and(eq(catalogueCableBuildLayers.teamId, teamId), eq(catalogueCableBuildLayers.buildId, buildId)));
  const layers = buildLayers(row);
  if (layers.length === 0) return;
  await tx.insert(catalogueCableBuildLayers).values(
    layers.map((l) => ({ teamId, buildId, position: l.position, coveringId: maps.coverings.get(l.coveringKey)!, thicknessMm: l.thicknessMm, thicknessSource: l.source })),
  );
}

/**
 * Inserts rows, or replaces the row of the same key. References must already resolve (call
 * `referenceIssues` first). Returns how many rows were new and how many replaced.
 */
async function upsertRows(tx: Executor, teamId: string, kind: CatalogueKind, rows: CatalogueRowByKind[CatalogueKind][], maps: KeyMaps) {
  const table = TABLES[kind];
  let inserted = 0;
  let updated = 0;
  const written: Array<{ id: string; key: string; isNew: boolean }> = [];
  for (const row of rows) {
    const values = valuesFor(kind, teamId, row, maps);
    const { teamId: _team, key: _key, ...changes } = values as Record<string, unknown>;
    const [result] = await tx
      .insert(table)
      .values(values as never)
      .onConflictDoUpdate({ target: [table.teamId, table.key], set: { ...changes, updatedAt: new Date() } as never })
      .returning({ id: table.id, isNew: sql<boolean>`(xmax = 0)` });
    if (result.isNew) inserted++;
    else updated++;
    written.push({ id: result.id, key: (row as { key: string }).key, isNew: result.isNew });
    if (kind === 'builds') await replaceLayers(tx, teamId, result.id, row as BuildRow, maps);
  }
  return { inserted, updated, written };
}

/** Field → { from, to } for the fields whose value differs (decimals compared by value). */
function diffOf(before: Record<string, unknown>, after: Record<string, unknown>): Record<string, { from: unknown; to: unknown }> {
  const diff: Record<string, { from: unknown; to: unknown }> = {};
  for (const [field, value] of Object.entries(after)) {
    if (!sameCatalogueValue(before[field], value)) diff[field] = { from: before[field] ?? null, to: value };
  }
  return diff;
}

function withoutStamp<K extends CatalogueKind>(row: StoredRow<K>): Record<string, unknown> {
  const { id: _id, updatedAt: _updatedAt, ...rest } = row;
  return rest;
}

/**
 * A cell edit (or several): merges `changes` into the stored row, validates the whole row again
 * (ZodError names the field), resolves references, writes and audits — all or nothing.
 */
export async function updateCatalogueRow<K extends CatalogueKind>(
  teamId: string,
  actorId: string,
  kind: K,
  id: string,
  changes: Record<string, unknown>,
): Promise<StoredRow<K>> {
  const unknownFields = Object.keys(changes).filter((f) => !columnByField(kind, f));
  if (unknownFields.length) throw zodErrorOf(unknownFields.map((field) => ({ field, message: 'is not a column of this catalogue' })));
  return getDb().transaction(async (tx) => {
    const stored = await getCatalogueRow(teamId, kind, id, tx);
    if (!stored) throw new CatalogueNotFoundError('No such catalogue row.');
    const before = withoutStamp(stored);
    const row = ROW_SCHEMAS[kind].parse({ ...before, ...changes }) as CatalogueRowByKind[K];
    // A changed value names its source in the same edit (lib/catalogue/citations.ts).
    const uncited = missingCitations(kind, before, changes);
    if (uncited.length) {
      throw zodErrorOf(
        uncited.map(({ field, sourceField }) => ({
          field: sourceField,
          message: `is required when ${columnByField(kind, field)?.label ?? field} changes: say where the new value comes from (standard and table, datasheet, handbook, or 'from memory')`,
        })),
      );
    }
    const maps = await keyMaps(tx, teamId);
    const issues = referenceIssues(kind, row, maps);
    if (issues.length) throw zodErrorOf(issues);
    const table = TABLES[kind];
    const { teamId: _team, ...values } = valuesFor(kind, teamId, row, maps) as Record<string, unknown>;
    try {
      await tx.update(table).set({ ...values, updatedAt: new Date() } as never).where(and(eq(table.teamId, teamId), eq(table.id, id)));
    } catch (error) {
      if (pgCode(error) === '23505') throw zodErrorOf([{ field: 'key', message: `"${(row as { key: string }).key}" is already used by another row` }]);
      throw error;
    }
    if (kind === 'builds') await replaceLayers(tx, teamId, id, row as BuildRow, maps);
    const diff = diffOf(before, row as Record<string, unknown>);
    await recordAudit(tx, { teamId, actorId, action: 'catalogue.row.update', entity: AUDIT_ENTITY[kind], entityId: id, detail: { key: (row as { key: string }).key, changes: diff } });
    const updated = await getCatalogueRow(teamId, kind, id, tx);
    return updated!;
  });
}

/**
 * A new row from the add-an-item form: validated by the same row schema an import applies
 * (ROW_SCHEMAS, also behind validateRecords), references resolved, a taken key refused; written
 * and audited in one transaction.
 */
export async function createCatalogueRow<K extends CatalogueKind>(teamId: string, actorId: string, kind: K, input: Record<string, unknown>): Promise<StoredRow<K>> {
  const unknownFields = Object.keys(input).filter((f) => !columnByField(kind, f));
  if (unknownFields.length) throw zodErrorOf(unknownFields.map((field) => ({ field, message: 'is not a column of this catalogue' })));
  // Every column present, an omitted one empty: the shape an imported row has (recordToInput), so the same schema answers alike.
  const whole = Object.fromEntries(CATALOGUE_COLUMNS[kind].map((c) => [c.field, input[c.field] ?? null]));
  const row = ROW_SCHEMAS[kind].parse(whole) as CatalogueRowByKind[K];
  return getDb().transaction(async (tx) => {
    const maps = await keyMaps(tx, teamId);
    const issues = referenceIssues(kind, row, maps);
    if (issues.length) throw zodErrorOf(issues);
    const table = TABLES[kind];
    const key = (row as { key: string }).key;
    let id: string;
    try {
      const [created] = await tx.insert(table).values(valuesFor(kind, teamId, row, maps) as never).returning({ id: table.id });
      id = created.id;
    } catch (error) {
      if (pgCode(error) === '23505') throw zodErrorOf([{ field: 'key', message: `"${key}" is already used by another row` }]);
      throw error;
    }
    if (kind === 'builds') await replaceLayers(tx, teamId, id, row as BuildRow, maps);
    await recordAudit(tx, { teamId, actorId, action: 'catalogue.row.create', entity: AUDIT_ENTITY[kind], entityId: id, detail: { key, changes: diffOf({}, row as Record<string, unknown>) } });
    return (await getCatalogueRow(teamId, kind, id, tx))!;
  });
}

export interface CatalogueHistoryEntry {
  at: string;
  action: 'created' | 'edited' | 'imported' | 'deleted' | 'other';
  actorName: string | null;
  /** The file an import came from. */
  fileName?: string;
  changes: Record<string, { from: unknown; to: unknown }>;
}

const HISTORY_ACTIONS: Record<string, CatalogueHistoryEntry['action']> = {
  'catalogue.row.create': 'created',
  'catalogue.row.update': 'edited',
  'catalogue.row.import': 'imported',
  'catalogue.row.delete': 'deleted',
};

/** One row's history from the audit log, oldest first; null when the team has no such row. */
export async function catalogueRowHistory(teamId: string, kind: CatalogueKind, id: string): Promise<CatalogueHistoryEntry[] | null> {
  if (!(await getCatalogueRow(teamId, kind, id))) return null;
  const entries = await listAuditFor(teamId, AUDIT_ENTITY[kind], id);
  return entries.map((e) => {
    const detail = (e.detail ?? {}) as { changes?: CatalogueHistoryEntry['changes']; fileName?: string };
    return {
      at: e.at.toISOString(),
      action: HISTORY_ACTIONS[e.action] ?? 'other',
      actorName: e.actorName,
      ...(detail.fileName ? { fileName: detail.fileName } : {}),
      changes: detail.changes ?? {},
    };
  });
}

/** Removes a row unless something still uses it (a conductor its metal, a build its conductor or covering). */
export async function deleteCatalogueRow(teamId: string, actorId: string, kind: CatalogueKind, id: string): Promise<void> {
  if (!z.uuid().safeParse(id).success) throw new CatalogueNotFoundError('No such catalogue row.');
  const table = TABLES[kind];
  try {
    await getDb().transaction(async (tx) => {
      const [removed] = await tx.delete(table).where(and(eq(table.teamId, teamId), eq(table.id, id))).returning({ key: table.key });
      if (!removed) throw new CatalogueNotFoundError('No such catalogue row.');
      await recordAudit(tx, { teamId, actorId, action: 'catalogue.row.delete', entity: AUDIT_ENTITY[kind], entityId: id, detail: { key: removed.key } });
    });
  } catch (error) {
    if (pgCode(error) === '23503') {
      const usedBy = kind === 'materials' ? 'conductors' : kind === 'conductors' ? 'cable builds' : 'cable builds';
      throw new CatalogueConflictError(`This row is still used by ${usedBy} in the catalogue; change or remove those first.`);
    }
    throw error;
  }
}

// ───────────────────────── imports ─────────────────────────

export interface ImportFile {
  fileName: string;
  mediaType: string;
  bytes: Uint8Array;
}

export interface ImportPreview {
  importId: string;
  kind: CatalogueKind;
  fileName: string;
  rowCount: number;
  newCount: number;
  replaceCount: number;
  problems: ImportProblem[];
  /** The first rows as they would be stored, for the preview table. */
  sample: Array<{ row: number; value: Record<string, unknown> }>;
}

const PREVIEW_SAMPLE_ROWS = 50;

/** Reads and checks a file against the team's catalogue: every problem with its row and column. */
/** Reads an uploaded catalogue file; the routes pass the off-thread reader (server/files/uploadReader.ts). */
export type CatalogueFileReader = (kind: CatalogueKind, fileName: string, bytes: Uint8Array) => Promise<RawRecord[]>;

async function checkImport(tx: Executor, teamId: string, kind: CatalogueKind, file: { fileName: string; bytes: Uint8Array }, read: CatalogueFileReader) {
  const records = await read(kind, file.fileName, file.bytes);
  const { rows, problems } = validateRecords(kind, records);
  const maps = await keyMaps(tx, teamId);
  for (const { row, value } of rows) {
    for (const issue of referenceIssues(kind, value, maps)) {
      problems.push({ row, column: columnByField(kind, issue.field)?.header ?? issue.field, message: issue.message });
    }
  }
  problems.sort((a, b) => a.row - b.row);
  return { records, rows, problems, maps };
}

/**
 * Step 1 of an import: reads the file (refusing what cannot be a catalogue sheet: FileRefusal),
 * validates every row and keeps the original file with an import record. Changes no catalogue row.
 */
export async function previewImport(teamId: string, actorId: string, kind: CatalogueKind, file: ImportFile, read: CatalogueFileReader = readCatalogueFile): Promise<ImportPreview> {
  return getDb().transaction(async (tx) => {
    const { records, rows, problems } = await checkImport(tx, teamId, kind, file, read);
    const table = TABLES[kind];
    const rowsWithProblems = new Set(problems.map((p) => p.row));
    const keys = rows.filter((r) => !rowsWithProblems.has(r.row)).map((r) => (r.value as { key: string }).key);
    const existing = keys.length
      ? await tx.select({ key: table.key }).from(table).where(and(eq(table.teamId, teamId), inArray(table.key, keys)))
      : [];
    const [record] = await tx
      .insert(catalogueImports)
      .values({
        teamId,
        kind,
        fileName: file.fileName,
        mediaType: file.mediaType || 'application/octet-stream',
        sizeBytes: file.bytes.byteLength,
        content: Buffer.from(file.bytes),
        rowCount: records.length,
        problems,
        createdBy: actorId,
      })
      .returning({ id: catalogueImports.id });
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'catalogue.import.preview',
      entity: 'catalogue_import',
      entityId: record.id,
      detail: { kind, fileName: file.fileName, rows: records.length, problems: problems.length },
    });
    return {
      importId: record.id,
      kind,
      fileName: file.fileName,
      rowCount: records.length,
      newCount: keys.length - existing.length,
      replaceCount: existing.length,
      problems,
      sample: rows.slice(0, PREVIEW_SAMPLE_ROWS).map((r) => ({ row: r.row, value: r.value as Record<string, unknown> })),
    };
  });
}

/**
 * Step 2: re-reads the kept file, re-validates against the catalogue as it is now, and writes
 * every row in one transaction — or none (ImportProblemsError) when any row has a problem.
 */
export async function commitImport(teamId: string, actorId: string, importId: string, read: CatalogueFileReader = readCatalogueFile) {
  if (!z.uuid().safeParse(importId).success) throw new CatalogueNotFoundError('No such import.');
  return getDb().transaction(async (tx) => {
    const [record] = await tx
      .select()
      .from(catalogueImports)
      .where(and(eq(catalogueImports.teamId, teamId), eq(catalogueImports.id, importId)))
      .for('update');
    if (!record) throw new CatalogueNotFoundError('No such import.');
    if (record.status === 'committed') throw new CatalogueConflictError('This file has already been imported.');
    const bytes = new Uint8Array(record.content);
    const { rows, problems, maps } = await checkImport(tx, teamId, record.kind, { fileName: record.fileName, bytes }, read);
    if (problems.length) throw new ImportProblemsError(problems);
    const previous = new Map((await listCatalogue(teamId, record.kind, tx)).map((r) => [r.key, withoutStamp(r)]));
    const { inserted, updated, written } = await upsertRows(tx, teamId, record.kind, rows.map((r) => r.value), maps);
    // Each row's own history shows what the file changed in it (the import entry below covers the file).
    for (const [i, w] of written.entries()) {
      const changes = diffOf(w.isNew ? {} : previous.get(w.key) ?? {}, rows[i].value as Record<string, unknown>);
      if (!w.isNew && Object.keys(changes).length === 0) continue;
      await recordAudit(tx, {
        teamId,
        actorId,
        action: 'catalogue.row.import',
        entity: AUDIT_ENTITY[record.kind],
        entityId: w.id,
        detail: { key: w.key, importId: record.id, fileName: record.fileName, changes },
      });
    }
    await tx.update(catalogueImports).set({ status: 'committed', committedAt: new Date() }).where(eq(catalogueImports.id, record.id));
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'catalogue.import.commit',
      entity: 'catalogue_import',
      entityId: record.id,
      detail: { kind: record.kind, fileName: record.fileName, inserted, updated },
    });
    return { importId: record.id, kind: record.kind, inserted, updated };
  });
}

/** The original file of an import, as uploaded. */
export async function getImportFile(teamId: string, importId: string) {
  if (!z.uuid().safeParse(importId).success) return null;
  const [record] = await getDb()
    .select({ fileName: catalogueImports.fileName, mediaType: catalogueImports.mediaType, content: catalogueImports.content })
    .from(catalogueImports)
    .where(and(eq(catalogueImports.teamId, teamId), eq(catalogueImports.id, importId)));
  return record ?? null;
}

export async function listImports(teamId: string, limit = 20) {
  return getDb()
    .select({
      id: catalogueImports.id,
      kind: catalogueImports.kind,
      fileName: catalogueImports.fileName,
      sizeBytes: catalogueImports.sizeBytes,
      status: catalogueImports.status,
      rowCount: catalogueImports.rowCount,
      createdAt: catalogueImports.createdAt,
      committedAt: catalogueImports.committedAt,
    })
    .from(catalogueImports)
    .where(eq(catalogueImports.teamId, teamId))
    .orderBy(sql`${catalogueImports.createdAt} desc`)
    .limit(limit);
}

// ───────────────────────── the standard catalogue ─────────────────────────

export interface StandardCatalogue {
  materials: unknown[];
  conductors: unknown[];
  coverings: unknown[];
  builds: unknown[];
}

/**
 * Copies the standard rows into a team, kind by kind in dependency order, skipping keys the team
 * already has (so it is idempotent and never overwrites a team's edits). Validates the standard
 * rows with the same schemas as any import.
 */
export async function copyCatalogueRowsToTeam(tx: Executor, teamId: string, standard: StandardCatalogue, actorId: string | null = null) {
  const added: Record<CatalogueKind, number> = { materials: 0, conductors: 0, coverings: 0, builds: 0 };
  for (const kind of ['materials', 'coverings', 'conductors', 'builds'] as const) {
    const rows = standard[kind].map((raw) => ROW_SCHEMAS[kind].parse(raw) as CatalogueRowByKind[CatalogueKind]);
    const table = TABLES[kind];
    const present = new Set((await tx.select({ key: table.key }).from(table).where(eq(table.teamId, teamId))).map((r) => r.key));
    const missing = rows.filter((r) => !present.has((r as { key: string }).key));
    if (missing.length === 0) continue;
    const maps = await keyMaps(tx, teamId);
    for (const row of missing) {
      const issues = referenceIssues(kind, row, maps);
      if (issues.length) throw new Error(`standard catalogue ${kind} ${(row as { key: string }).key}: ${issues.map((i) => `${i.field} ${i.message}`).join('; ')}`);
    }
    const { inserted } = await upsertRows(tx, teamId, kind, missing, maps);
    added[kind] = inserted;
  }
  const total = Object.values(added).reduce((a, b) => a + b, 0);
  if (total > 0) {
    await recordAudit(tx, { teamId, actorId, action: 'catalogue.standard.copy', entity: 'catalogue', entityId: teamId, detail: { added } });
  }
  return added;
}

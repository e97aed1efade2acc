/**
 * The team catalogue: conductor materials, conductors (round cores and rectangular bars),
 * coverings (insulation, sheath, coating, paint) and cable builds (a conductor plus ordered
 * layers). Every row belongs to one team; the standard rows are copied into each team
 * (db/seed/catalogue.ts) so that a team's edits never touch another team's data.
 *
 * Physical values are `numeric` (exact decimals; they arrive in the app as strings and are
 * handled with decimal.js), each with a text column saying where it came from.
 * Units are in the column names and match the published tables: R₂₀ in Ω/km, dimensions in mm.
 */
import { sql } from 'drizzle-orm';
import {
  check,
  customType,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { teams, users } from './core';

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow();

/** PostgreSQL bytea, read and written as a Node Buffer (drizzle has no built-in column for it). */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });

/** The metal that sets the electrical model (IEC 60287 constants, skin-effect factors). */
export const baseMetalEnum = pgEnum('catalogue_base_metal', ['copper', 'aluminium']);
export const conductorShapeEnum = pgEnum('catalogue_conductor_shape', ['round', 'rectangular']);
/** How the size is named: metric section, American wire gauge, thousands of circular mils, or a bar's width × thickness. */
export const sizeSystemEnum = pgEnum('catalogue_size_system', ['metric', 'awg', 'kcmil', 'bar']);
export const coveringRoleEnum = pgEnum('catalogue_covering_role', ['insulation', 'sheath', 'coating', 'paint', 'sleeve']);
export const catalogueKindEnum = pgEnum('catalogue_kind', ['materials', 'conductors', 'coverings', 'builds']);
export const importStatusEnum = pgEnum('catalogue_import_status', ['previewed', 'committed']);

export const catalogueMaterials = pgTable(
  'catalogue_materials',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    /** Stable name used by imports and cross-references, e.g. 'copper'. */
    key: text('key').notNull(),
    name: text('name').notNull(),
    baseMetal: baseMetalEnum('base_metal').notNull(),
    rho20OhmM: numeric('rho20_ohm_m').notNull(),
    alpha20PerK: numeric('alpha20_per_k').notNull(),
    electricalSource: text('electrical_source').notNull(),
    thermalConductivityWPerMK: numeric('thermal_conductivity_w_per_mk').notNull(),
    densityKgPerM3: numeric('density_kg_per_m3').notNull(),
    specificHeatJPerKgK: numeric('specific_heat_j_per_kgk').notNull(),
    thermalSource: text('thermal_source').notNull(),
    adiabaticK: numeric('adiabatic_k').notNull(),
    betaK: numeric('beta_k').notNull(),
    shortCircuitSource: text('short_circuit_source').notNull(),
    /** A team setting (money), not a physical value; null when the team has not set one. */
    pricePerKg: numeric('price_per_kg'),
    priceNote: text('price_note').notNull().default(''),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('catalogue_materials_team_key').on(t.teamId, t.key)],
);

export const catalogueConductors = pgTable(
  'catalogue_conductors',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    /** How the size reads, e.g. '240 mm²', '4/0 AWG', '500 kcmil', '100 × 10 mm'. */
    designation: text('designation').notNull(),
    materialId: uuid('material_id')
      .notNull()
      .references(() => catalogueMaterials.id, { onDelete: 'restrict' }),
    shape: conductorShapeEnum('shape').notNull(),
    sizeSystem: sizeSystemEnum('size_system').notNull(),
    /** e.g. 'IEC 60228 class 2', 'Class B concentric', 'bar'. */
    construction: text('construction').notNull().default(''),
    sectionMm2: numeric('section_mm2').notNull(),
    r20OhmPerKm: numeric('r20_ohm_per_km').notNull(),
    resistanceSource: text('resistance_source').notNull(),
    /** Round conductors: the effective (overall) conductor diameter. */
    diameterMm: numeric('diameter_mm'),
    /** Rectangular bars. */
    widthMm: numeric('width_mm'),
    thicknessMm: numeric('thickness_mm'),
    dimensionSource: text('dimension_source').notNull(),
    /** Bars: the 0.2 % proof strength R_p0.2 of the bar as supplied, N/mm² (IEC 60865-1 stress check); null = the library's default per metal (flagged). */
    yieldStrengthMpa: numeric('yield_strength_mpa'),
    yieldStrengthSource: text('yield_strength_source').notNull().default(''),
    /** Bars: the highest temperature the bar and its supports may reach in a short circuit, °C; null = the library's default (flagged). */
    shortCircuitLimitC: numeric('short_circuit_limit_c'),
    shortCircuitLimitSource: text('short_circuit_limit_source').notNull().default(''),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('catalogue_conductors_team_key').on(t.teamId, t.key),
    index('catalogue_conductors_material_idx').on(t.materialId),
    check(
      'catalogue_conductors_geometry',
      sql`(${t.shape} = 'round' and ${t.diameterMm} is not null) or (${t.shape} = 'rectangular' and ${t.widthMm} is not null and ${t.thicknessMm} is not null)`,
    ),
    check('catalogue_conductors_yield_strength', sql`${t.yieldStrengthMpa} is null or (${t.shape} = 'rectangular' and ${t.yieldStrengthMpa} > 0)`),
    check('catalogue_conductors_short_circuit_limit', sql`${t.shortCircuitLimitC} is null or ${t.shape} = 'rectangular'`),
  ],
);

export const catalogueCoverings = pgTable(
  'catalogue_coverings',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    name: text('name').notNull(),
    role: coveringRoleEnum('role').notNull(),
    thermalResistivityKmPerW: numeric('thermal_resistivity_km_per_w').notNull(),
    resistivitySource: text('resistivity_source').notNull(),
    continuousLimitC: numeric('continuous_limit_c'),
    shortCircuitLimitC: numeric('short_circuit_limit_c'),
    limitsSource: text('limits_source').notNull(),
    emissivity: numeric('emissivity'),
    emissivitySource: text('emissivity_source').notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('catalogue_coverings_team_key').on(t.teamId, t.key)],
);

export const catalogueCableBuilds = pgTable(
  'catalogue_cable_builds',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    /** What a designer picks, e.g. '240 mm² copper XLPE/PVC single-core'. */
    name: text('name').notNull(),
    /** Invented demo makers only in the seed ('Demo build'); a team enters its own suppliers. */
    maker: text('maker').notNull(),
    conductorId: uuid('conductor_id')
      .notNull()
      .references(() => catalogueConductors.id, { onDelete: 'restrict' }),
    cores: integer('cores').notNull().default(1),
    note: text('note').notNull().default(''),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('catalogue_cable_builds_team_key').on(t.teamId, t.key), check('catalogue_cable_builds_cores', sql`${t.cores} >= 1`)],
);

/** The coverings of a build, from the conductor outwards (position 1 touches the conductor). */
export const catalogueCableBuildLayers = pgTable(
  'catalogue_cable_build_layers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    buildId: uuid('build_id')
      .notNull()
      .references(() => catalogueCableBuilds.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    coveringId: uuid('covering_id')
      .notNull()
      .references(() => catalogueCoverings.id, { onDelete: 'restrict' }),
    thicknessMm: numeric('thickness_mm').notNull(),
    thicknessSource: text('thickness_source').notNull(),
  },
  (t) => [uniqueIndex('catalogue_cable_build_layers_position').on(t.buildId, t.position), check('catalogue_layer_position', sql`${t.position} >= 1`)],
);

/** An uploaded file: kept as sent (bytea) with what the preview found and whether it was committed. */
export const catalogueImports = pgTable(
  'catalogue_imports',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id').notNull().references(() => teams.id, { onDelete: 'cascade' }),
    kind: catalogueKindEnum('kind').notNull(),
    fileName: text('file_name').notNull(),
    mediaType: text('media_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    content: bytea('content').notNull(),
    status: importStatusEnum('status').notNull().default('previewed'),
    rowCount: integer('row_count').notNull(),
    /** Row-level problems found by the preview: [{ row, column, message }]. */
    problems: jsonb('problems').notNull().default([]),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    committedAt: timestamp('committed_at', { withTimezone: true }),
  },
  (t) => [index('catalogue_imports_team_idx').on(t.teamId)],
);

/**
 * The row of each catalogue kind as people see and send it (grid edits, API bodies, CSV/XLSX
 * imports): numbers as decimal strings in the stored SI units, references by key (a conductor
 * names its metal by `materialKey`, a build its conductor by `conductorKey`).
 * The server validates every write with these schemas again, whatever the client checked.
 */
import Decimal from 'decimal.js';
import { z } from 'zod';
import { INPUT_BOUNDS, type InputBound } from '../inputBounds';
import { decimalField, optionalDecimalField, type DecimalBounds } from './decimal';

/**
 * A bound of lib/inputBounds (SI) in the catalogue's stored unit: `perSi` catalogue units per SI
 * unit (1000 for mm per m or Ω/km per Ω/m), scaled exactly with decimal.js. Used where a catalogue
 * field goes into the sizing library as it is, so the catalogue never holds a value the library
 * refuses; elsewhere the catalogue keeps its own, tighter data-quality ranges.
 */
function libraryBound(bound: InputBound, perSi: number | string = 1): DecimalBounds {
  const scaled = (v: number) => new Decimal(v).times(perSi).toString();
  return { min: scaled(bound.min), minExclusive: bound.minExclusive, max: scaled(bound.max), maxExclusive: bound.maxExclusive };
}

export const CATALOGUE_KINDS = ['materials', 'conductors', 'coverings', 'builds'] as const;
export type CatalogueKind = (typeof CATALOGUE_KINDS)[number];

export function isCatalogueKind(value: unknown): value is CatalogueKind {
  return typeof value === 'string' && (CATALOGUE_KINDS as readonly string[]).includes(value);
}

/** A cable build holds at most this many layers (insulation, screen, bedding, sheath…). */
export const MAX_BUILD_LAYERS = 4;

const keyField = z
  .string({ error: 'is required' })
  .trim()
  .toLowerCase()
  .regex(/^[a-z0-9][a-z0-9._-]{0,63}$/, "must be 1–64 characters: lower-case letters, digits, '-', '_' or '.', starting with a letter or digit");

const nameField = z.string({ error: 'is required' }).trim().min(1, 'is required').max(200, 'must be at most 200 characters');

const sourceField = z
  .string({ error: 'is required' })
  .trim()
  .min(1, "is required: say where the value comes from (standard and table, datasheet, handbook, or 'from memory')")
  .max(500, 'must be at most 500 characters');

const optionalText = (max = 500) =>
  z
    .union([z.string(), z.null(), z.undefined()])
    .transform((v) => (v ?? '').trim())
    .pipe(z.string().max(max, `must be at most ${max} characters`));

function enumField<const T extends readonly [string, ...string[]]>(values: T) {
  return z.preprocess(
    (v) => (typeof v === 'string' ? v.trim().toLowerCase() : v),
    z.enum(values, { error: `must be one of: ${values.join(', ')}` }),
  );
}

export const BASE_METALS = ['copper', 'aluminium'] as const;
export const CONDUCTOR_SHAPES = ['round', 'rectangular'] as const;
export const SIZE_SYSTEMS = ['metric', 'awg', 'kcmil', 'bar'] as const;
export const COVERING_ROLES = ['insulation', 'sheath', 'coating', 'paint', 'sleeve'] as const;

export const materialRowSchema = z.object({
  key: keyField,
  name: nameField,
  baseMetal: enumField(BASE_METALS),
  rho20OhmM: decimalField({ min: 0, minExclusive: true, max: '1e-6' }),
  alpha20PerK: decimalField({ min: 0, minExclusive: true, max: '0.01' }),
  electricalSource: sourceField,
  thermalConductivityWPerMK: decimalField({ min: 0, minExclusive: true, max: 1000 }),
  densityKgPerM3: decimalField({ min: 0, minExclusive: true, max: 25000 }),
  specificHeatJPerKgK: decimalField({ min: 0, minExclusive: true, max: 5000 }),
  thermalSource: sourceField,
  adiabaticK: decimalField({ min: 0, minExclusive: true, max: 1000 }),
  betaK: decimalField({ min: 0, minExclusive: true, max: 1000 }),
  shortCircuitSource: sourceField,
  pricePerKg: optionalDecimalField({ min: 0 }),
  priceNote: optionalText(),
});

export const conductorRowSchema = z
  .object({
    key: keyField,
    designation: nameField,
    materialKey: keyField,
    shape: enumField(CONDUCTOR_SHAPES),
    sizeSystem: enumField(SIZE_SYSTEMS),
    construction: optionalText(200),
    sectionMm2: decimalField({ min: 0, minExclusive: true, max: 10000 }),
    r20OhmPerKm: decimalField(libraryBound(INPUT_BOUNDS.r20OhmPerM, 1000)),
    resistanceSource: sourceField,
    diameterMm: optionalDecimalField(libraryBound(INPUT_BOUNDS.conductorDiameterM, 1000)),
    widthMm: optionalDecimalField(libraryBound(INPUT_BOUNDS.barWidthM, 1000)),
    thicknessMm: optionalDecimalField(libraryBound(INPUT_BOUNDS.barThicknessM, 1000)),
    dimensionSource: sourceField,
    /** Bars: R_p0.2 in N/mm² (the IEC 60865-1 stress check); the library's range, scaled from Pa. */
    yieldStrengthMpa: optionalDecimalField(libraryBound(INPUT_BOUNDS.yieldStrengthPa, '1e-6')),
    yieldStrengthSource: optionalText(),
    /** Bars: the short-circuit temperature of the bar and its supports, °C. */
    shortCircuitLimitC: optionalDecimalField(libraryBound(INPUT_BOUNDS.shortCircuitLimitC)),
    shortCircuitLimitSource: optionalText(),
  })
  .superRefine((row, ctx) => {
    if (row.shape === 'round') {
      if (row.diameterMm === null) ctx.addIssue({ code: 'custom', path: ['diameterMm'], message: 'is required for a round conductor' });
      if (row.sizeSystem === 'bar') ctx.addIssue({ code: 'custom', path: ['sizeSystem'], message: "'bar' is for rectangular conductors" });
    } else {
      if (row.widthMm === null) ctx.addIssue({ code: 'custom', path: ['widthMm'], message: 'is required for a rectangular bar' });
      if (row.thicknessMm === null) ctx.addIssue({ code: 'custom', path: ['thicknessMm'], message: 'is required for a rectangular bar' });
      if (row.sizeSystem !== 'bar') ctx.addIssue({ code: 'custom', path: ['sizeSystem'], message: "must be 'bar' for a rectangular conductor" });
      if (row.widthMm !== null && row.thicknessMm !== null && Number(row.thicknessMm) > Number(row.widthMm)) {
        ctx.addIssue({ code: 'custom', path: ['thicknessMm'], message: 'must not exceed the width (give the longer side as the width)' });
      }
    }
    if (row.yieldStrengthMpa !== null && row.shape !== 'rectangular') {
      ctx.addIssue({ code: 'custom', path: ['yieldStrengthMpa'], message: 'applies to bars only (the IEC 60865-1 stress check); leave it empty for a round conductor' });
    }
    if (row.yieldStrengthMpa !== null && row.yieldStrengthSource === '') {
      ctx.addIssue({ code: 'custom', path: ['yieldStrengthSource'], message: "is required with a proof strength: say where it comes from (standard and temper, maker's certificate, or 'from memory')" });
    }
    if (row.shortCircuitLimitC !== null && row.shape !== 'rectangular') {
      ctx.addIssue({ code: 'custom', path: ['shortCircuitLimitC'], message: "applies to bare bars only; a cable's short-circuit limit belongs to its insulation (the covering)" });
    }
    if (row.shortCircuitLimitC !== null && row.shortCircuitLimitSource === '') {
      ctx.addIssue({ code: 'custom', path: ['shortCircuitLimitSource'], message: "is required with a short-circuit limit: say where it comes from (standard and clause, the support maker's data, or 'from memory')" });
    }
  });

export const coveringRowSchema = z
  .object({
    key: keyField,
    name: nameField,
    role: enumField(COVERING_ROLES),
    thermalResistivityKmPerW: decimalField({ min: 0, minExclusive: true, max: 100 }),
    resistivitySource: sourceField,
    continuousLimitC: optionalDecimalField(libraryBound(INPUT_BOUNDS.continuousLimitC)),
    shortCircuitLimitC: optionalDecimalField(libraryBound(INPUT_BOUNDS.shortCircuitLimitC)),
    limitsSource: sourceField,
    emissivity: optionalDecimalField({ min: 0, minExclusive: true, max: 1 }),
    emissivitySource: sourceField,
  })
  .superRefine((row, ctx) => {
    if (row.continuousLimitC !== null && row.shortCircuitLimitC !== null && Number(row.shortCircuitLimitC) < Number(row.continuousLimitC)) {
      ctx.addIssue({ code: 'custom', path: ['shortCircuitLimitC'], message: 'must not be below the continuous limit' });
    }
  });

/** A build's layers travel flat (layer1CoveringKey, layer1ThicknessMm, layer1Source, …) so that a spreadsheet row holds a whole build. */
export type LayerFieldName = `layer${1 | 2 | 3 | 4}${'CoveringKey' | 'ThicknessMm' | 'Source'}`;

const layerShape = {
  layer1CoveringKey: optionalText(64),
  layer1ThicknessMm: optionalDecimalField({ min: 0, minExclusive: true, max: 50 }),
  layer1Source: optionalText(),
  layer2CoveringKey: optionalText(64),
  layer2ThicknessMm: optionalDecimalField({ min: 0, minExclusive: true, max: 50 }),
  layer2Source: optionalText(),
  layer3CoveringKey: optionalText(64),
  layer3ThicknessMm: optionalDecimalField({ min: 0, minExclusive: true, max: 50 }),
  layer3Source: optionalText(),
  layer4CoveringKey: optionalText(64),
  layer4ThicknessMm: optionalDecimalField({ min: 0, minExclusive: true, max: 50 }),
  layer4Source: optionalText(),
} satisfies Record<LayerFieldName, z.ZodType>;

/** The sizing layer computes cables of these many cores (lib/inputBounds): a build outside them could never be sized. */
const CORES_WORDS = `must be a whole number from ${INPUT_BOUNDS.cores.min} to ${INPUT_BOUNDS.cores.max}`;

export const buildRowSchema = z
  .object({
    key: keyField,
    name: nameField,
    maker: nameField,
    conductorKey: keyField,
    cores: z.preprocess(
      (v) => (typeof v === 'string' && v.trim() !== '' ? Number(v.trim()) : v),
      z
        .number({ error: CORES_WORDS })
        .int(CORES_WORDS)
        .min(INPUT_BOUNDS.cores.min, CORES_WORDS)
        .max(INPUT_BOUNDS.cores.max, CORES_WORDS),
    ),
    note: optionalText(),
    ...layerShape,
  })
  .superRefine((row, ctx) => {
    let ended = false;
    let count = 0;
    for (let n = 1; n <= MAX_BUILD_LAYERS; n++) {
      const covering = row[`layer${n}CoveringKey` as LayerFieldName] as string;
      const thickness = row[`layer${n}ThicknessMm` as LayerFieldName] as string | null;
      const source = row[`layer${n}Source` as LayerFieldName] as string;
      const empty = covering === '' && thickness === null && source === '';
      if (empty) {
        ended = true;
        continue;
      }
      if (ended) {
        ctx.addIssue({ code: 'custom', path: [`layer${n}CoveringKey`], message: `layer ${n} follows an empty layer ${n - 1}: list layers from the conductor outwards without gaps` });
      }
      count++;
      if (covering === '') ctx.addIssue({ code: 'custom', path: [`layer${n}CoveringKey`], message: 'is required when the layer has a thickness or source' });
      else if (!/^[a-z0-9][a-z0-9._-]{0,63}$/.test(covering.toLowerCase())) ctx.addIssue({ code: 'custom', path: [`layer${n}CoveringKey`], message: 'is not a valid covering key' });
      if (thickness === null) ctx.addIssue({ code: 'custom', path: [`layer${n}ThicknessMm`], message: 'is required for each layer' });
      if (source === '') ctx.addIssue({ code: 'custom', path: [`layer${n}Source`], message: 'is required: say where the thickness comes from' });
    }
    if (count === 0) ctx.addIssue({ code: 'custom', path: ['layer1CoveringKey'], message: 'a build needs at least one layer (its insulation)' });
  })
  .transform((row) => {
    const normalised = { ...row };
    for (let n = 1; n <= MAX_BUILD_LAYERS; n++) {
      const field = `layer${n}CoveringKey` as LayerFieldName;
      (normalised as Record<string, unknown>)[field] = (row[field] as string).toLowerCase();
    }
    return normalised;
  });

export type MaterialRow = z.output<typeof materialRowSchema>;
export type ConductorRow = z.output<typeof conductorRowSchema>;
export type CoveringRow = z.output<typeof coveringRowSchema>;
export type BuildRow = z.output<typeof buildRowSchema>;

export interface CatalogueRowByKind {
  materials: MaterialRow;
  conductors: ConductorRow;
  coverings: CoveringRow;
  builds: BuildRow;
}
export type AnyCatalogueRow = CatalogueRowByKind[CatalogueKind];

export const ROW_SCHEMAS = {
  materials: materialRowSchema,
  conductors: conductorRowSchema,
  coverings: coveringRowSchema,
  builds: buildRowSchema,
} as const;

/** The layers of a build row, in order. */
export function buildLayers(row: BuildRow): Array<{ position: number; coveringKey: string; thicknessMm: string; source: string }> {
  const layers = [];
  for (let n = 1; n <= MAX_BUILD_LAYERS; n++) {
    const coveringKey = row[`layer${n}CoveringKey` as LayerFieldName] as string;
    const thicknessMm = row[`layer${n}ThicknessMm` as LayerFieldName] as string | null;
    if (coveringKey && thicknessMm) layers.push({ position: n, coveringKey, thicknessMm, source: row[`layer${n}Source` as LayerFieldName] as string });
  }
  return layers;
}

/** A row as the API answers it: the validated fields plus the database id. */
export type StoredRow<K extends CatalogueKind> = CatalogueRowByKind[K] & { id: string; updatedAt: string };

/** Body of a cell edit: the fields that change (in SI), merged into the stored row and re-validated whole. */
export const rowPatchSchema = z.object({
  changes: z.record(z.string(), z.unknown()).refine((c) => Object.keys(c).length > 0, 'name at least one field to change'),
});

/** Body of the add-an-item form: the whole row (in SI), validated by the kind's row schema on the server, as an import row is. */
export const rowCreateSchema = z.object({
  row: z.record(z.string(), z.unknown()),
});

/**
 * Request bodies of the calculation API (v1), as zod schemas. They describe exactly the inputs of
 * `lib/electrical` (Candidate, Conditions — the type checks at the bottom keep them in step) in SI
 * units, with the same ranges the library enforces, so that nearly every bad value is refused here
 * with its field path before any computation. Objects are strict: an unknown key is an error,
 * because a misspelt optional field (say `ambientc`) would otherwise be dropped silently and the
 * result computed with an assumed default.
 *
 * Pure TypeScript (runs in the browser too): the documentation page and the OpenAPI document are
 * generated from these same schemas.
 */
import { z } from 'zod';
import type { Candidate, Conditions } from '../electrical/sizing/types';
import {
  MAX_CANDIDATES_PER_REQUEST,
  MAX_ID_CHARS,
  MAX_LABEL_CHARS,
  MAX_LAYERS_PER_CABLE,
  MAX_NOTE_CHARS,
  MAX_SOURCE_NOTES,
} from './limits';

// ───────────────────────────── building blocks ─────────────────────────────

/** A finite number (zod 4 refuses NaN and ±Infinity) with a message naming the quantity. */
function num(label: string) {
  return z.number({
    error: (issue) => (issue.input === undefined ? `${label} is required` : `${label} must be a finite number`),
  });
}

function range(label: string, unit: string, min: number, max: number, opts: { minExclusive?: boolean } = {}) {
  const suffix = unit ? ` ${unit}` : '';
  const base = num(label);
  const low = opts.minExclusive
    ? base.gt(min, `${label} must be greater than ${min}${suffix}`)
    : base.min(min, `${label} must be at least ${min}${suffix}`);
  return low.max(max, `${label} must be at most ${max}${suffix}`);
}

function temperatureLimit(label: string) {
  return range(label, '°C', -50, 1000);
}

const money = z
  .union([
    z.string().trim().regex(/^\d+(\.\d+)?$/, 'must be a decimal amount such as 0.12'),
    num('Amount').min(0, 'Amount must not be negative'),
  ])
  .meta({ description: 'A non-negative amount, as a decimal string ("0.12") or a number; any currency, used consistently.' });

const shortText = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .min(1, `${label} must not be empty`)
    .max(max, `${label} must be at most ${max} characters`);

// ───────────────────────────── candidates ─────────────────────────────

const costsSchema = z
  .strictObject({
    conductorPricePerKg: money.optional(),
    pricePerM: money.optional(),
    densityKgPerM3: range('Density', 'kg/m³', 100, 25_000).optional(),
  })
  .meta({ description: 'Prices for the life-cycle cost: metal price per kg, or a price per metre of one conductor.' });

const candidateCommon = {
  id: shortText('Candidate id', MAX_ID_CHARS).optional().meta({ description: 'Your identifier, echoed in the results (default candidate-N).' }),
  label: shortText('Label', MAX_LABEL_CHARS).optional(),
  material: z.enum(['copper', 'aluminium'], { error: "Material must be 'copper' or 'aluminium'" }),
  r20OhmPerM: range('Resistance at 20 °C', 'Ω/m', 0, 1, { minExclusive: true }).meta({
    description: 'DC resistance at 20 °C of ONE conductor (one core or one bar), Ω/m, from the datasheet or IEC 60228.',
  }),
  alpha20PerK: range('Temperature coefficient', '1/K', 0, 0.01).optional(),
  parallel: z
    .number({ error: 'Parallel runs must be a whole number' })
    .int('Parallel runs must be a whole number')
    .min(1, 'Parallel runs must be at least 1')
    .max(100, 'Parallel runs must be at most 100')
    .optional()
    .meta({ description: 'Identical runs per phase sharing the current (default 1).' }),
  catalogue: z
    .strictObject({
      conductorId: shortText('Conductor id', MAX_ID_CHARS).optional(),
      coveringIds: z.array(shortText('Covering id', MAX_ID_CHARS)).max(MAX_LAYERS_PER_CABLE).optional(),
    })
    .optional(),
  sourceNotes: z
    .array(z.string().max(MAX_NOTE_CHARS, `A source note must be at most ${MAX_NOTE_CHARS} characters`))
    .max(MAX_SOURCE_NOTES, `At most ${MAX_SOURCE_NOTES} source notes`)
    .optional()
    .meta({ description: 'Where the data came from. A note containing "from memory" raises the DATA_FROM_MEMORY flag.' }),
  dataFromMemory: z.boolean().optional(),
  costs: costsSchema.optional(),
};

const layerRoles = ['insulation', 'semiconductor', 'screen', 'bedding', 'armour', 'sheath', 'jacket', 'filler', 'other'] as const;

export const cableLayerSchema = z.strictObject({
  name: shortText('Layer name', MAX_LABEL_CHARS),
  role: z.enum(layerRoles).optional(),
  thicknessM: range('Layer thickness', 'm', 0, 0.5, { minExclusive: true }),
  thermalResistivityKmPerW: range('Thermal resistivity', 'K·m/W', 0, 1e4, { minExclusive: true }),
  continuousLimitC: temperatureLimit('Continuous limit').optional(),
  shortCircuitLimitC: temperatureLimit('Short-circuit limit').optional(),
});

export const cableCandidateSchema = z
  .strictObject({
    ...candidateCommon,
    kind: z.literal('cable'),
    sectionMm2: range('Section', 'mm²', 0, 5000, { minExclusive: true }),
    conductorDiameterM: range('Conductor diameter', 'm', 0, 0.2, { minExclusive: true }),
    cores: z.number({ error: 'Cores must be a whole number' }).int('Cores must be a whole number').min(1).max(5).optional(),
    layers: z
      .array(cableLayerSchema)
      .min(1, 'A cable needs at least its insulation layer')
      .max(MAX_LAYERS_PER_CABLE, `At most ${MAX_LAYERS_PER_CABLE} layers`),
    emissivity: range('Emissivity', '', 0, 1).optional(),
    ks: range('ks', '', 0, 1.5, { minExclusive: true }).optional(),
    kp: range('kp', '', 0, 1.5, { minExclusive: true }).optional(),
  })
  .meta({ id: 'CableCandidate', description: 'A cable: one conductor and its coverings listed from the conductor outwards.' });

export const barCoatingSchema = z.strictObject({
  name: shortText('Coating name', MAX_LABEL_CHARS).optional(),
  thicknessM: range('Coating thickness', 'm', 0, 0.05, { minExclusive: true }),
  thermalResistivityKmPerW: range('Coating thermal resistivity', 'K·m/W', 0, 1e4, { minExclusive: true }),
  emissivity: range('Coating emissivity', '', 0, 1).optional(),
  continuousLimitC: temperatureLimit('Coating continuous limit').optional(),
  shortCircuitLimitC: temperatureLimit('Coating short-circuit limit').optional(),
});

export const barCandidateSchema = z
  .strictObject({
    ...candidateCommon,
    kind: z.literal('bar'),
    widthM: range('Bar width', 'm', 0, 1, { minExclusive: true }),
    thicknessM: range('Bar thickness', 'm', 0, 0.2, { minExclusive: true }),
    barsPerPhase: z.number({ error: 'Bars per phase must be a whole number' }).int('Bars per phase must be a whole number').min(1).max(20).optional(),
    barGapM: range('Gap between bars', 'm', 0, 1).optional(),
    coating: barCoatingSchema.optional(),
    emissivity: range('Emissivity', '', 0, 1).optional(),
    acResistanceRatio: range('AC/DC resistance ratio', '', 1, 10).optional(),
    terminalLimitC: temperatureLimit('Terminal limit').optional(),
    shortCircuitLimitC: temperatureLimit('Short-circuit limit').optional(),
  })
  .meta({ id: 'BarCandidate', description: 'A rectangular bus bar (or a pack of bars per phase).' });

export const candidateSchema = z
  .discriminatedUnion('kind', [cableCandidateSchema, barCandidateSchema], { error: "Candidate kind must be 'cable' or 'bar'" })
  .meta({ id: 'Candidate' });

// ───────────────────────────── conditions ─────────────────────────────

const arrangement = {
  formation: z.enum(['trefoil', 'flat'], { error: "Formation must be 'trefoil' or 'flat'" }).optional(),
  spacingM: range('Cable spacing', 'm', 0, 100, { minExclusive: true }).optional(),
};

export const installationSchema = z
  .discriminatedUnion(
    'kind',
    [
      z.strictObject({ kind: z.literal('cable-in-air'), ...arrangement }),
      z.strictObject({ kind: z.literal('bar-on-edge') }),
      z.strictObject({ kind: z.literal('bar-flat') }),
      z.strictObject({
        kind: z.literal('buried'),
        depthM: range('Depth', 'm', 0, 20, { minExclusive: true }),
        soilResistivityKmPerW: range('Soil thermal resistivity', 'K·m/W', 0.1, 20).optional(),
        groundC: range('Ground temperature', '°C', -60, 200).optional(),
        ...arrangement,
      }),
      z.strictObject({
        kind: z.literal('enclosure'),
        deratingFactor: range('Enclosure derating', '', 0, 1, { minExclusive: true }),
        inside: z.enum(['cable-in-air', 'bar-on-edge', 'bar-flat'], { error: "Inside must be 'cable-in-air', 'bar-on-edge' or 'bar-flat'" }),
        ...arrangement,
      }),
    ],
    { error: "Installation kind must be 'cable-in-air', 'bar-on-edge', 'bar-flat', 'buried' or 'enclosure'" },
  )
  .meta({ id: 'Installation' });

export const economicsSchema = z.strictObject({
  lossLoadFactor: range('Loss load factor', '', 0, 1),
  hoursPerYear: range('Hours per year', 'h', 0, 8784).optional(),
  energyPricePerKWh: money,
  demandChargePerKWYear: money.optional(),
  loadGrowthPercent: range('Load growth', '%', -100, 100, { minExclusive: true }).optional(),
  energyPriceGrowthPercent: range('Energy price growth', '%', -100, 100, { minExclusive: true }).optional(),
  discountRatePercent: range('Discount rate', '%', -100, 100, { minExclusive: true }),
  years: z.number({ error: 'Years must be a whole number' }).int('Years must be a whole number').min(0).max(200, 'Years must be at most 200'),
});

const conditionsShape = {
  designCurrentA: range('Design current', 'A', 0, 100_000).meta({ description: 'Design current I_B per phase, A r.m.s.' }),
  frequencyHz: range('Frequency', 'Hz', 0, 1000).meta({ description: '0 for DC.' }),
  phases: z.union([z.literal(1), z.literal(3)], { error: 'Phases must be 1 or 3' }),
  nominalVoltageV: range('Voltage U₀', 'V', 0, 1e6, { minExclusive: true }).meta({ description: 'U₀, line to neutral, V.' }),
  lengthM: range('Route length', 'm', 0, 1e6),
  powerFactor: range('Power factor', '', 0, 1),
  reactanceOhmPerM: range('Reactance', 'Ω/m', 0, 1).optional(),
  maxVoltageDropPercent: range('Allowed voltage drop', '%', 0, 100, { minExclusive: true }).optional(),
  ambientC: range('Ambient', '°C', -60, 200).optional().meta({ description: 'Air around the conductor, °C. Not given: a reference ambient is assumed and flagged.' }),
  installation: installationSchema,
  windSpeedMPerS: range('Air speed', 'm/s', 0, 60).optional(),
  solar: z
    .strictObject({
      irradianceWPerM2: range('Sun irradiance', 'W/m²', 0, 1500),
      absorptivity: range('Solar absorptivity', '', 0, 1).optional(),
    })
    .optional(),
  fault: z
    .strictObject({
      currentA: range('Fault current', 'A', 0, 1e7, { minExclusive: true }),
      durationS: range('Clearing time', 's', 0, 60, { minExclusive: true }),
      initialFrom: z.enum(['limit', 'operating'], { error: "initialFrom must be 'limit' or 'operating'" }).optional(),
    })
    .optional(),
  temperatureLimitC: temperatureLimit('Own temperature limit').optional(),
  raiseMaterialLimit: z.boolean().optional(),
  groupingFactor: range('Grouping factor', '', 0, 1, { minExclusive: true }).optional(),
  surfaceCoefficientWPerM2K: range('Surface coefficient', 'W/(m²·K)', 0, 1e5, { minExclusive: true }).optional(),
  economics: economicsSchema.optional(),
};

/** Cross-field rules the library also enforces, stated here so that the error names the field. */
function conditionRules(value: { installation: { kind: string }; solar?: { irradianceWPerM2: number }; windSpeedMPerS?: number; raiseMaterialLimit?: boolean; temperatureLimitC?: number }, ctx: z.RefinementCtx) {
  if (value.raiseMaterialLimit && value.temperatureLimitC === undefined) {
    ctx.addIssue({ code: 'custom', path: ['temperatureLimitC'], message: 'Own temperature limit is required when raiseMaterialLimit is set' });
  }
  if (value.installation.kind === 'buried') {
    if (value.solar && value.solar.irradianceWPerM2 > 0) ctx.addIssue({ code: 'custom', path: ['solar'], message: 'A buried cable receives no sun' });
    if ((value.windSpeedMPerS ?? 0) > 0) ctx.addIssue({ code: 'custom', path: ['windSpeedMPerS'], message: 'A buried cable is not cooled by wind' });
  }
}

export const conditionsSchema = z.strictObject(conditionsShape).superRefine(conditionRules).meta({ id: 'Conditions' });

/** For the ampacity alone the design current does not matter: it may be left out. */
export const ampacityConditionsSchema = z
  .strictObject({ ...conditionsShape, designCurrentA: conditionsShape.designCurrentA.optional() })
  .superRefine(conditionRules)
  .meta({ id: 'AmpacityConditions' });

// ───────────────────────────── request bodies ─────────────────────────────

export const evaluateRequestSchema = z
  .strictObject({
    conditions: conditionsSchema,
    candidates: z
      .array(candidateSchema, { error: 'candidates must be a list' })
      .min(1, 'Give at least one candidate')
      .max(MAX_CANDIDATES_PER_REQUEST, `At most ${MAX_CANDIDATES_PER_REQUEST} candidates in one request`),
  })
  .superRefine((value, ctx) => {
    const seen = new Map<string, number>();
    value.candidates.forEach((candidate, index) => {
      if (candidate.id === undefined) return;
      if (seen.has(candidate.id)) ctx.addIssue({ code: 'custom', path: ['candidates', index, 'id'], message: `Candidate id '${candidate.id}' is used twice` });
      seen.set(candidate.id, index);
    });
  })
  .meta({ id: 'EvaluateRequest' });

export const ampacityRequestSchema = z
  .strictObject({ conditions: ampacityConditionsSchema, candidate: candidateSchema })
  .meta({ id: 'AmpacityRequest' });

export type EvaluateRequest = z.output<typeof evaluateRequestSchema>;
export type AmpacityRequest = z.output<typeof ampacityRequestSchema>;

/** The library's Conditions from an ampacity request (the design current does not enter). */
export function ampacityConditions(request: AmpacityRequest): Conditions {
  return { ...request.conditions, designCurrentA: request.conditions.designCurrentA ?? 0 };
}

// The schemas must produce exactly what lib/electrical takes: these fail to compile otherwise.
type Assignable<From, To> = [From] extends [To] ? true : false;
const candidateFits: Assignable<z.output<typeof candidateSchema>, Candidate> = true;
const conditionsFit: Assignable<z.output<typeof conditionsSchema>, Conditions> = true;
void candidateFits;
void conditionsFit;

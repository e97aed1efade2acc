/**
 * Request bodies of the calculation API (v1), as zod schemas. They describe exactly the inputs of
 * `lib/electrical` (Candidate, Conditions — the type checks at the bottom keep them in step) in SI
 * units, with the ranges of lib/inputBounds (the one table the library and every other edge read),
 * so that nearly every bad value is refused here with its field path before any computation. Objects are strict: an unknown key is an error,
 * because a misspelt optional field (say `ambientc`) would otherwise be dropped silently and the
 * result computed with an assumed default.
 *
 * Pure TypeScript (runs in the browser too): the documentation page and the OpenAPI document are
 * generated from these same schemas.
 */
import { z } from 'zod';
import type { Candidate, Conditions } from '../electrical/sizing/types';
import { protectiveDeviceSchema, timeCurrentCurveSchema } from '../electrical/protection/device';
import { INPUT_BOUNDS, zodBound, type BoundName } from '../inputBounds';
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

/** A number inside its bound of lib/inputBounds, named as the API documents it. */
function bounded(name: BoundName, label: string = INPUT_BOUNDS[name].label) {
  return zodBound(num(label), INPUT_BOUNDS[name], label);
}

/** A whole number inside its bound, with the message the API has always given for a non-integer. */
function wholeNumber(name: BoundName, label: string = INPUT_BOUNDS[name].label) {
  return zodBound(z.number({ error: `${label} must be a whole number` }), INPUT_BOUNDS[name], label);
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
    densityKgPerM3: bounded('densityKgPerM3').optional(),
  })
  .meta({ description: 'Prices for the life-cycle cost: metal price per kg, or a price per metre of one conductor.' });

const candidateCommon = {
  id: shortText('Candidate id', MAX_ID_CHARS).optional().meta({ description: 'Your identifier, echoed in the results (default candidate-N).' }),
  label: shortText('Label', MAX_LABEL_CHARS).optional(),
  material: z.enum(['copper', 'aluminium'], { error: "Material must be 'copper' or 'aluminium'" }),
  r20OhmPerM: bounded('r20OhmPerM').meta({
    description: 'DC resistance at 20 °C of ONE conductor (one core or one bar), Ω/m, from the datasheet or IEC 60228.',
  }),
  alpha20PerK: bounded('alpha20PerK').optional(),
  parallel: wholeNumber('parallel')
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
  thicknessM: bounded('layerThicknessM'),
  thermalResistivityKmPerW: bounded('thermalResistivityKmPerW'),
  continuousLimitC: bounded('continuousLimitC').optional(),
  shortCircuitLimitC: bounded('shortCircuitLimitC').optional(),
});

export const cableCandidateSchema = z
  .strictObject({
    ...candidateCommon,
    kind: z.literal('cable'),
    sectionMm2: bounded('sectionMm2'),
    conductorDiameterM: bounded('conductorDiameterM'),
    cores: wholeNumber('cores').optional(),
    layers: z
      .array(cableLayerSchema)
      .min(1, 'A cable needs at least its insulation layer')
      .max(MAX_LAYERS_PER_CABLE, `At most ${MAX_LAYERS_PER_CABLE} layers`),
    emissivity: bounded('emissivity').optional(),
    ks: bounded('ks').optional(),
    kp: bounded('kp').optional(),
    screen: z
      .strictObject({
        material: z.enum(['copper', 'aluminium', 'lead'], { error: "Screen material must be 'copper', 'aluminium' or 'lead'" }),
        sectionMm2: bounded('screenSectionMm2').optional(),
        r20OhmPerM: bounded('screenR20OhmPerM').optional(),
        bonding: z.enum(['solid', 'single-point', 'cross-bonded'], { error: "Screen bonding must be 'solid', 'single-point' or 'cross-bonded'" }),
      })
      .refine((screen) => screen.sectionMm2 !== undefined || screen.r20OhmPerM !== undefined, { message: 'Give the screen section (sectionMm2) or its resistance at 20 °C (r20OhmPerM)', path: ['sectionMm2'] })
      .optional()
      .meta({
        id: 'CableScreen',
        description:
          "The metallic screen or sheath of a single-core cable (its place and thickness: the layer with role 'screen'). With it the screen losses λ₁ of IEC 60287-1-1 §2.3 are computed for the bonding and formation; without it they are left out and flagged.",
      }),
  })
  .superRefine((cable, ctx) => {
    if (cable.screen && !cable.layers.some((l) => l.role === 'screen')) {
      ctx.addIssue({ code: 'custom', path: ['screen'], message: "A screen needs its place among the layers: give one layer the role 'screen'" });
    }
  })
  .meta({ id: 'CableCandidate', description: 'A cable: one conductor and its coverings listed from the conductor outwards.' });

export const barCoatingSchema = z.strictObject({
  name: shortText('Coating name', MAX_LABEL_CHARS).optional(),
  thicknessM: bounded('coatingThicknessM'),
  thermalResistivityKmPerW: bounded('thermalResistivityKmPerW', 'Coating thermal resistivity'),
  emissivity: bounded('emissivity', 'Coating emissivity').optional(),
  continuousLimitC: bounded('continuousLimitC', 'Coating continuous limit').optional(),
  shortCircuitLimitC: bounded('shortCircuitLimitC', 'Coating short-circuit limit').optional(),
});

export const barCandidateSchema = z
  .strictObject({
    ...candidateCommon,
    kind: z.literal('bar'),
    widthM: bounded('barWidthM'),
    thicknessM: bounded('barThicknessM'),
    barsPerPhase: wholeNumber('barsPerPhase').optional(),
    barGapM: bounded('barGapM').optional(),
    coating: barCoatingSchema.optional(),
    emissivity: bounded('emissivity').optional(),
    acResistanceRatio: bounded('acResistanceRatio').optional(),
    terminalLimitC: bounded('terminalLimitC').optional(),
    shortCircuitLimitC: bounded('shortCircuitLimitC').optional(),
    yieldStrengthPa: bounded('yieldStrengthPa')
      .optional()
      .meta({ description: '0.2 % proof strength R_p0.2 of the bar as supplied, Pa, for the IEC 60865-1 stress check. Not given: a cautious default per metal is assumed and flagged (BUSBAR_YIELD_STRENGTH_DEFAULTED).' }),
  })
  .meta({ id: 'BarCandidate', description: 'A rectangular bus bar (or a pack of bars per phase).' });

export const candidateSchema = z
  .discriminatedUnion('kind', [cableCandidateSchema, barCandidateSchema], { error: "Candidate kind must be 'cable' or 'bar'" })
  .meta({ id: 'Candidate' });

// ───────────────────────────── conditions ─────────────────────────────

const otherCircuitSchema = z
  .strictObject({
    currentA: bounded('otherCircuitCurrentA').meta({ description: 'Its current per phase, A.' }),
    cable: z
      .strictObject({
        externalDiameterM: bounded('otherCableDiameterM').meta({ description: 'Overall diameter D_e of one of its cables, m.' }),
        lossWPerM: bounded('otherCableLossWPerM').meta({ description: 'Heat ONE of its cables gives off at that current, W/m (from its own rating; flagged as entered).' }),
      })
      .optional()
      .meta({ description: 'Its cable when it is not the candidate’s own. Absent: the same cable as the candidate, solved at its own current.' }),
  })
  .meta({ description: 'A circuit lying beside the one being sized (same trench or route), in one row with it.' });

const arrangement = {
  formation: z
    .enum(['trefoil', 'flat', 'flat-vertical'], { error: "Formation must be 'trefoil', 'flat' or 'flat-vertical'" })
    .optional()
    .meta({ description: "How the circuit's single-core cables lie (default trefoil); 'flat' is a horizontal row, 'flat-vertical' a vertical one." }),
  spacingM: bounded('spacingM').optional().meta({ description: 'Axis-to-axis spacing of the circuit’s cables, m (default touching). Less than the cable diameter is refused as an overlap.' }),
  circuitSpacingM: bounded('circuitSpacingM')
    .optional()
    .meta({ description: 'Centre-to-centre spacing between the circuit’s parallel runs and the other circuits, which lie in one row beside it, m (default touching).' }),
  circuitRow: z.enum(['horizontal', 'vertical'], { error: "circuitRow must be 'horizontal' or 'vertical'" }).optional().meta({ description: 'Direction of that row (default horizontal; vertical rows run downward).' }),
  otherCircuits: z.array(otherCircuitSchema).max(23, 'At most 23 other circuits').optional(),
  transposed: z.boolean().optional().meta({ description: 'Flat formation: phases transposed along the route (screen losses).' }),
};

const buriedSurroundings = {
  duct: z
    .strictObject({
      material: z.enum(['pvc', 'pe', 'earthenware', 'fibre-in-air', 'fibre-in-concrete', 'metallic'], { error: "Duct material must be 'pvc', 'pe', 'earthenware', 'fibre-in-air', 'fibre-in-concrete' or 'metallic'" }),
      innerDiameterM: bounded('ductInnerDiameterM'),
      outerDiameterM: bounded('ductOuterDiameterM'),
    })
    .optional()
    .meta({ description: 'Every cable in its own duct (IEC 60287-2-1 §4.2.7.1–4.2.7.3).' }),
  backfill: z
    .strictObject({
      widthM: bounded('backfillWidthM'),
      heightM: bounded('backfillHeightM'),
      centreDepthM: bounded('backfillCentreDepthM'),
      resistivityKmPerW: bounded('backfillResistivityKmPerW'),
    })
    .optional()
    .meta({ description: 'A rectangular backfill or concrete bank of its own resistivity, centred on the cables (IEC 60287-2-1 §4.2.7.4).' }),
};

/** How the bars are held, IEC 60865-1 Table 3 (lib/electrical/busbar/forces.ts BEAM_FACTORS). */
const SUPPORT_ARRANGEMENTS = [
  'single-span-both-simply-supported',
  'single-span-fixed-and-simply-supported',
  'single-span-both-fixed',
  'continuous-two-spans',
  'continuous-three-or-more-spans',
] as const;

export const busbarSystemSchema = z
  .strictObject({
    phaseSpacingM: bounded('phaseSpacingM').meta({ description: 'Centre of one phase pack to the centre of the next, m. The packs must not touch.' }),
    supportSpacingM: bounded('supportSpacingM').optional().meta({ description: 'Span between supports, m. With `supports` and a fault, the IEC 60865-1 forces are checked.' }),
    spacerSpacingM: bounded('spacerSpacingM').optional().meta({ description: 'Distance between the spacers tying a pack, m (default the support span; not more than it).' }),
    supports: z
      .enum(SUPPORT_ARRANGEMENTS, { error: `supports must be one of ${SUPPORT_ARRANGEMENTS.map((s) => `'${s}'`).join(', ')}` })
      .optional()
      .meta({ description: 'How the bars are held (IEC 60865-1 Table 3: the beam and support kind, giving α and β).' }),
    supportStrengthN: bounded('supportStrengthN').optional().meta({ description: 'Rated bending strength of one support, N. Without it the support forces are reported, not checked (flagged).' }),
    rOverX: bounded('rOverX').optional().meta({ description: 'R/X of the short-circuit impedance: κ = 1.02 + 0.98·e^(−3R/X) (IEC 60909-0 eq. 55). Give this or `kappa`; neither: κ = 2.0 (flagged).' }),
    kappa: bounded('peakFactorKappa').optional().meta({ description: 'The peak factor κ itself, instead of R/X.' }),
    mainSectionModulusM3: bounded('mainSectionModulusM3')
      .optional()
      .meta({ description: 'Section modulus of a stiffened pack about its bending axis, m³ (IEC 60865-1; flagged). Default: the bars alone.' }),
    packNodes: z
      .enum(['per-bar', 'per-pack'], { error: "packNodes must be 'per-bar' or 'per-pack'" })
      .optional()
      .meta({ description: "'per-bar' (default, cautious): each bar of a pack at its own temperature; 'per-pack': the bars bonded to one temperature (flagged)." }),
  })
  .superRefine((system, ctx) => {
    if (system.rOverX !== undefined && system.kappa !== undefined) ctx.addIssue({ code: 'custom', path: ['kappa'], message: 'Give R/X (rOverX) or κ (kappa), not both' });
    if (system.spacerSpacingM !== undefined && system.spacerSpacingM > (system.supportSpacingM ?? Number.POSITIVE_INFINITY)) {
      ctx.addIssue({ code: 'custom', path: ['spacerSpacingM'], message: 'Spacer spacing must not exceed the support span' });
    }
  })
  .meta({
    id: 'BusbarSystem',
    description:
      'The three-phase system the bar candidates form: phase packs side by side, each bar of a pack rated with its own share of the current (filament method) and its own heat balance; with the supports described and a fault, the IEC 60865-1 forces on the bars and supports. Without it the phase spacing is assumed (flagged) and the forces are not checked.',
  });

const barSystem = { system: busbarSystemSchema.optional() };

export const installationSchema = z
  .discriminatedUnion(
    'kind',
    [
      z.strictObject({ kind: z.literal('cable-in-air'), ...arrangement }),
      z.strictObject({ kind: z.literal('bar-on-edge'), ...barSystem }),
      z.strictObject({ kind: z.literal('bar-flat'), ...barSystem }),
      z.strictObject({
        kind: z.literal('buried'),
        depthM: bounded('depthM'),
        soilResistivityKmPerW: bounded('soilResistivityKmPerW').optional(),
        groundC: bounded('groundC').optional(),
        ...arrangement,
        ...buriedSurroundings,
      }),
      z.strictObject({
        kind: z.literal('enclosure'),
        deratingFactor: bounded('enclosureDerating'),
        inside: z.enum(['cable-in-air', 'bar-on-edge', 'bar-flat'], { error: "Inside must be 'cable-in-air', 'bar-on-edge' or 'bar-flat'" }),
        ...arrangement,
        ...barSystem,
      }),
    ],
    { error: "Installation kind must be 'cable-in-air', 'bar-on-edge', 'bar-flat', 'buried' or 'enclosure'" },
  )
  .meta({ id: 'Installation' });

export const economicsSchema = z.strictObject({
  lossLoadFactor: bounded('lossLoadFactor'),
  hoursPerYear: bounded('hoursPerYear').optional(),
  energyPricePerKWh: money,
  demandChargePerKWYear: money.optional(),
  loadGrowthPercent: bounded('loadGrowthPercent').optional(),
  energyPriceGrowthPercent: bounded('energyPriceGrowthPercent').optional(),
  discountRatePercent: bounded('discountRatePercent'),
  years: wholeNumber('years'),
});

// ───────────────────────────── protection (physics.md §11) ─────────────────────────────

/**
 * The library's own device schema (lib/electrical/protection/device.ts) has the last word on a
 * device — a setting above the rating, an instantaneous setting not above the setting, a curve
 * whose currents do not rise or whose times rise (the point named) — so the API refuses exactly
 * what the library refuses. The strict objects here add the API's rule against unknown keys and
 * the ranges of lib/inputBounds.
 */
function libraryDeviceRules(device: unknown, ctx: z.RefinementCtx) {
  // A field already refused here (out of range, unknown key) is not said twice.
  if (ctx.issues.length > 0) return;
  const parsed = protectiveDeviceSchema.safeParse(device);
  if (parsed.success) return;
  for (const issue of parsed.error.issues) {
    // The curve is checked by the same rule on its own (timeCurrentCurve below), with the point named.
    if (issue.path[0] === 'timeCurrentCurve') continue;
    ctx.addIssue({ code: 'custom', path: issue.path as Array<string | number>, message: issue.message });
  }
}

const curvePointSchema = z.strictObject({
  currentA: bounded('curvePointCurrentA').meta({ description: 'Prospective current, A r.m.s.' }),
  timeS: bounded('curvePointTimeS').meta({ description: "The maker's maximum operating (total clearing) time at that current, s." }),
});

const timeCurrentCurve = z
  .array(curvePointSchema)
  .min(2, 'A time–current curve needs at least two points')
  .max(200, 'A time–current curve has at most 200 points')
  .superRefine((points, ctx) => {
    // The library's rule (currents strictly rising, times never rising), naming the point; a
    // point already refused here (out of range) is not said twice.
    if (ctx.issues.length > 0) return;
    const parsed = timeCurrentCurveSchema.safeParse(points);
    if (!parsed.success) for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', path: issue.path as Array<string | number>, message: issue.message });
  })
  .meta({ description: "The maker's time–current curve as points, currents strictly rising and times never rising; interpolated in log–log." });

const conventionalOperatingCurrent = bounded('conventionalOperatingCurrentA')
  .optional()
  .meta({ description: 'I₂ entered; without it the device standard’s rule (1.45·I_n IEC 60898-1, 1.30·I_r IEC 60947-2, the gG factor of IEC 60269-1; from memory).' });

const breakerIec60898 = z.strictObject({
  kind: z.literal('breaker-iec60898-1'),
  curve: z.enum(['B', 'C', 'D'], { error: "curve must be 'B', 'C' or 'D'" }),
  ratedCurrentA: bounded('deviceRatedCurrentA').meta({ description: 'Rated current I_n, A.' }),
  conventionalOperatingCurrentA: conventionalOperatingCurrent,
  timeCurrentCurve: timeCurrentCurve.optional(),
});

const breakerIec60947 = z.strictObject({
  kind: z.literal('breaker-iec60947-2'),
  ratedCurrentA: bounded('deviceRatedCurrentA').meta({ description: 'Rated current of the breaker (frame or trip unit), A.' }),
  settingCurrentA: bounded('deviceRatedCurrentA', 'Setting I_r').meta({ description: 'Overload setting I_r, A: the I_n of IEC 60364-4-43 §433.1 for an adjustable device.' }),
  settingRangeA: z
    .strictObject({ minA: bounded('deviceRatedCurrentA', 'Lowest setting'), maxA: bounded('deviceRatedCurrentA', 'Highest setting') })
    .optional(),
  instantaneousCurrentA: bounded('instantaneousCurrentA').meta({ description: 'Instantaneous setting I_i, A.' }),
  instantaneousTolerance: z.number({ error: 'instantaneousTolerance must be a number' }).min(0, 'instantaneousTolerance must be at least 0').max(0.5, 'instantaneousTolerance must be at most 0.5').optional().meta({ description: 'Tolerance of I_i as a fraction (default 0.2, IEC 60947-2, from memory).' }),
  instantaneousMaxTimeS: bounded('instantaneousMaxTimeS').optional().meta({ description: "The maker's largest break time of the instantaneous release, s (default 0.1 s, flagged)." }),
  conventionalOperatingCurrentA: conventionalOperatingCurrent,
  timeCurrentCurve: timeCurrentCurve.optional(),
});

const fuseGg = z.strictObject({
  kind: z.literal('fuse-gG-iec60269'),
  ratedCurrentA: bounded('deviceRatedCurrentA').meta({ description: 'Rated current I_n, A.' }),
  conventionalOperatingCurrentA: conventionalOperatingCurrent,
  timeCurrentCurve: timeCurrentCurve.optional().meta({ description: "The maker's time–current curve: needed to check disconnection." }),
});

export const protectiveDeviceRequestSchema = z
  .discriminatedUnion('kind', [breakerIec60898, breakerIec60947, fuseGg], { error: "Device kind must be 'breaker-iec60898-1', 'breaker-iec60947-2' or 'fuse-gG-iec60269'" })
  .superRefine(libraryDeviceRules)
  .meta({ id: 'ProtectiveDevice', description: 'The circuit’s protective device as data: a circuit-breaker to IEC 60898-1 (curve B, C or D) or IEC 60947-2 (settings), or a gG fuse to IEC 60269.' });

export const protectionSchema = z
  .strictObject({
    device: protectiveDeviceRequestSchema,
    deviceSeriesA: z
      .array(bounded('deviceRatedCurrentA', 'Rating of the series'))
      .min(1, 'deviceSeriesA needs at least one rating')
      .max(60, 'At most 60 ratings in deviceSeriesA')
      .optional()
      .meta({ description: 'Ratings (or trip-unit settings) to search for the smallest coordinated device; default the standard series of the kind (none for IEC 60947-2).' }),
    systemEarthing: z.enum(['TN', 'TT'], { error: "systemEarthing must be 'TN' or 'TT' (IT systems are not handled)" }).optional().meta({ description: 'Default TN.' }),
    circuit: z.enum(['final', 'distribution'], { error: "circuit must be 'final' or 'distribution'" }).optional().meta({ description: 'A final circuit (Table 41.1 times) or a distribution circuit (5 s TN, 1 s TT); default distribution.' }),
    source: z
      .union([
        z.strictObject({ resistanceOhm: bounded('sourceResistanceOhm'), reactanceOhm: bounded('sourceReactanceOhm').optional() }),
        z.strictObject({ impedanceOhm: bounded('sourceImpedanceOhm') }),
      ])
      .optional()
      .meta({ description: 'Impedance of the source up to the circuit’s origin, Ω: R (+ X), or |Z| only (added arithmetically, an upper bound). With the protective conductor, automatic disconnection is checked.' }),
    earthElectrodesOhm: bounded('earthElectrodesOhm').optional().meta({ description: 'TT only: R_A + R_B of the earth electrodes, Ω.' }),
    protectiveConductor: z
      .strictObject({
        sectionMm2: bounded('protectiveConductorSectionMm2'),
        material: z.enum(['copper', 'aluminium'], { error: "material must be 'copper' or 'aluminium'" }).optional().meta({ description: "Default the line conductor's metal." }),
        insulation: z.enum(['pvc-70', 'pvc-90', 'thermosetting-90'], { error: "insulation must be 'pvc-70', 'pvc-90' or 'thermosetting-90'" }).optional().meta({ description: 'Default thermosetting-90.' }),
        arrangement: z
          .enum(['in-cable-or-bunched', 'separate'], { error: "arrangement must be 'in-cable-or-bunched' or 'separate'" })
          .optional()
          .meta({ description: 'A core of the cable or bunched with it (IEC 60364-5-54 Table A.54.3, default), or a separate conductor (Table A.54.2).' }),
      })
      .optional()
      .meta({ description: 'The protective conductor of the circuit (its length is the route’s).' }),
  })
  .superRefine((p, ctx) => {
    const earthing = p.systemEarthing ?? 'TN';
    if (earthing === 'TN' && p.earthElectrodesOhm !== undefined) ctx.addIssue({ code: 'custom', path: ['earthElectrodesOhm'], message: 'A TN fault loop does not run through earth electrodes: give earthElectrodesOhm for TT only' });
    // The library checks disconnection only with both the source and the protective conductor.
    if (!p.source || !p.protectiveConductor) return;
    if (earthing === 'TT' && p.earthElectrodesOhm === undefined) ctx.addIssue({ code: 'custom', path: ['earthElectrodesOhm'], message: 'A TT fault loop runs through the earth electrodes: give R_A + R_B' });
    if (p.device.kind === 'fuse-gG-iec60269' && !p.device.timeCurrentCurve) {
      ctx.addIssue({ code: 'custom', path: ['device', 'timeCurrentCurve'], message: "A fuse's disconnection is read from its time–current curve: give the maker's curve, or leave out the source" });
    }
  })
  .meta({
    id: 'Protection',
    description:
      'The circuit’s protection: overload coordination I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z (IEC 60364-4-43 §433.1) against the rated ampacity; with the source and the protective conductor, automatic disconnection (IEC 60364-4-41 §411) and the protective conductor’s section (IEC 60364-5-54 §543.1).',
  });

const conditionsShape = {
  designCurrentA: bounded('designCurrentA').meta({ description: 'Design current I_B per phase, A r.m.s.' }),
  frequencyHz: bounded('frequencyHz').meta({ description: '0 for DC.' }),
  phases: z.union([z.literal(1), z.literal(3)], { error: 'Phases must be 1 or 3' }),
  nominalVoltageV: bounded('nominalVoltageV').meta({ description: 'U₀, line to neutral, V (low and medium voltage: no dielectric loss is modelled).' }),
  lengthM: bounded('lengthM'),
  powerFactor: bounded('powerFactor'),
  reactanceOhmPerM: bounded('reactanceOhmPerM').optional(),
  maxVoltageDropPercent: bounded('maxVoltageDropPercent').optional(),
  ambientC: bounded('ambientC').optional().meta({ description: 'Air around the conductor, °C. Not given: a reference ambient is assumed and flagged.' }),
  installation: installationSchema,
  windSpeedMPerS: bounded('windSpeedMPerS').optional(),
  solar: z
    .strictObject({
      irradianceWPerM2: bounded('irradianceWPerM2'),
      absorptivity: bounded('solarAbsorptivity').optional(),
    })
    .optional(),
  fault: z
    .strictObject({
      currentA: bounded('faultCurrentA'),
      durationS: bounded('faultDurationS'),
      initialFrom: z.enum(['limit', 'operating'], { error: "initialFrom must be 'limit' or 'operating'" }).optional(),
    })
    .optional(),
  temperatureLimitC: bounded('temperatureLimitC').optional(),
  raiseMaterialLimit: z.boolean().optional(),
  userLimitJustification: z.string().max(2000, 'userLimitJustification: at most 2,000 characters').optional(),
  groupingFactor: bounded('groupingFactor').optional(),
  surfaceCoefficientWPerM2K: bounded('surfaceCoefficientWPerM2K').optional(),
  economics: economicsSchema.optional(),
  protection: protectionSchema.optional(),
  thirdHarmonicPercent: bounded('thirdHarmonicPercent')
    .optional()
    .meta({ description: 'Third-harmonic content of the phase current, % (IEC 60364-5-52 Annex E): the neutral of four- and five-core cables; flagged for other conductors above 15 %.' }),
};

/** Cross-field rules the library also enforces, stated here so that the error names the field. */
function conditionRules(value: { installation: { kind: string; inside?: string; system?: unknown; duct?: { innerDiameterM: number; outerDiameterM: number } }; solar?: { irradianceWPerM2: number }; windSpeedMPerS?: number; raiseMaterialLimit?: boolean; temperatureLimitC?: number }, ctx: z.RefinementCtx) {
  if (value.installation.kind === 'enclosure' && value.installation.system !== undefined && value.installation.inside === 'cable-in-air') {
    ctx.addIssue({ code: 'custom', path: ['installation', 'system'], message: 'A bus-bar system is for bars: the enclosure holds cables' });
  }
  if (value.raiseMaterialLimit && value.temperatureLimitC === undefined) {
    ctx.addIssue({ code: 'custom', path: ['temperatureLimitC'], message: 'Own temperature limit is required when raiseMaterialLimit is set' });
  }
  if (value.installation.kind === 'buried') {
    if (value.solar && value.solar.irradianceWPerM2 > 0) ctx.addIssue({ code: 'custom', path: ['solar'], message: 'A buried cable receives no sun' });
    if ((value.windSpeedMPerS ?? 0) > 0) ctx.addIssue({ code: 'custom', path: ['windSpeedMPerS'], message: 'A buried cable is not cooled by wind' });
    const duct = value.installation.duct;
    if (duct && !(duct.outerDiameterM > duct.innerDiameterM)) {
      ctx.addIssue({ code: 'custom', path: ['installation', 'duct', 'outerDiameterM'], message: 'Duct outer diameter must be larger than its inner diameter' });
    }
  }
}

export const conditionsSchema = z.strictObject(conditionsShape).superRefine(conditionRules).meta({ id: 'Conditions' });

/** For the ampacity alone the design current does not matter: it may be left out. */
export const ampacityConditionsSchema = z
  .strictObject({ ...conditionsShape, designCurrentA: bounded('currentA', 'Design current').optional().meta({ description: 'Not needed for the ampacity; 0 A is accepted.' }) })
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

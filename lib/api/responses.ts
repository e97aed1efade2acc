/**
 * Answers of the calculation API (v1), as zod schemas: they generate the OpenAPI document and the
 * tests parse every answer with them (zod 4 numbers refuse NaN and ±Infinity, so a parse also
 * proves there is no such value in a result). They mirror lib/electrical's result types; the
 * checks at the bottom keep the two in step.
 */
import { z } from 'zod';
import { FLAG_CODES } from '../electrical/sizing/flags';
import type { AmpacityResult, CandidateEvaluation } from '../electrical/sizing/types';
import { API_VERSION } from './limits';

const finite = z.number();

export const flagSchema = z
  .object({
    code: z.enum(FLAG_CODES),
    severity: z.enum(['note', 'review', 'blocker']),
    title: z.string(),
    message: z.string(),
    data: z.record(z.string(), z.union([finite, z.string(), z.boolean()])).optional(),
  })
  .meta({ id: 'AssumptionFlag', description: 'A statement the result depends on that a licensed reviewer must accept (note, review, blocker).' });

const governingLimitSchema = z.object({
  temperatureC: finite,
  source: z.enum(['insulation', 'coating', 'terminal', 'user', 'layer']),
  layer: z.string().optional(),
});

const profileSchema = z
  .object({
    geometry: z.enum(['slab', 'cylinder']),
    positionsM: z.array(finite),
    temperaturesC: z.array(finite),
    layers: z.array(
      z.object({ name: z.string(), startM: finite, endM: finite, limitC: finite.optional(), generating: z.boolean() }),
    ),
    hotSpot: z.object({ temperatureC: finite, positionM: finite }),
  })
  .meta({ id: 'HeatProfile', description: 'Temperature versus position through the conductor and its coverings.' });

const closedFormSchema = z.object({
  currentA: finite,
  method: z.string(),
  differencePercent: finite,
  externalResistanceKmPerW: finite,
  internalResistanceKmPerW: finite,
});

export const ampacityResultSchema = z
  .object({
    current: finite.meta({ description: 'Ampacity of the circuit per phase, A (all parallel conductors, after derating).' }),
    hotSpot: z.object({ temperature: finite, position: finite }),
    iterations: finite,
    solves: finite,
    conductorCurrentA: finite,
    governingLimit: governingLimitSchema,
    acFactor: finite,
    bracketA: z.tuple([finite, finite]),
    closedForm: closedFormSchema.nullable(),
    profile: profileSchema,
    zeroBecause: z.string().optional(),
    flags: z.array(flagSchema),
  })
  .meta({ id: 'AmpacityResult' });

const shortCircuitSchema = z.object({
  checked: z.boolean(),
  reason: z.string().optional(),
  currentA: finite.optional(),
  durationS: finite.optional(),
  initialC: finite.optional(),
  finalC: finite.nullable().optional(),
  limitC: finite.optional(),
  kFactor: finite.optional(),
  minimumSectionMm2: finite.optional(),
  sectionPerPhaseMm2: finite.optional(),
  withstands: z.boolean().optional(),
});

const decimalText = z.string().meta({ description: 'A decimal amount as text (exact).' });

// The checks of physics.md §11 (lib/electrical/protection), each with its numbers and verdict.
const verdictSchema = z.enum(['pass', 'fail']);
const inequalitySchema = z.object({
  text: z.string().meta({ description: "The inequality in words, e.g. 'I_B ≤ I_n'." }),
  left: finite,
  right: finite,
  holds: z.boolean(),
});
const deviceKindSchema = z.enum(['breaker-iec60898-1', 'breaker-iec60947-2', 'fuse-gG-iec60269']);

const coordinationSchema = z
  .object({
    clause: z.string(),
    designCurrentA: finite,
    deviceCurrentA: finite.meta({ description: 'I_n, or the setting I_r of an adjustable breaker, A.' }),
    ampacityA: finite.meta({ description: 'I_z: the rated ampacity of the circuit as built, A.' }),
    conventionalOperatingCurrentA: finite,
    conventionalOperatingCurrentBasis: z.string(),
    inequalities: z.array(inequalitySchema).meta({ description: 'I_B ≤ I_n, I_n ≤ I_z and I₂ ≤ 1.45·I_z, each with its numbers.' }),
    verdict: verdictSchema,
  })
  .meta({ id: 'OverloadCoordination', description: 'IEC 60364-4-43 §433.1 for the given device.' });

const smallestRatingSchema = z
  .object({
    clause: z.string(),
    kind: deviceKindSchema,
    ratingA: finite.optional().meta({ description: 'The smallest rating (or setting) of the series that coordinates; absent when none does.' }),
    inequalities: z.array(inequalitySchema).optional(),
    series: z.array(finite).readonly(),
    seriesBasis: z.string(),
  })
  .meta({ id: 'SmallestCoordinatedRating' });

const conductorAtFaultSchema = z.object({ temperatureC: finite, resistanceOhm: finite, reactanceOhm: finite });

const disconnectionSchema = z
  .object({
    clause: z.string(),
    loop: z.object({
      impedanceOhm: finite.meta({ description: 'Z_s, Ω.' }),
      resistanceOhm: finite.optional(),
      reactanceOhm: finite.optional(),
      phase: conductorAtFaultSchema,
      protective: conductorAtFaultSchema,
      earthElectrodesOhm: finite,
      basis: z.string(),
    }),
    voltageFactor: finite,
    faultCurrentA: finite.meta({ description: 'I_a = c·U₀/Z_s, A.' }),
    required: z.object({ timeS: finite, basis: z.string() }),
    operating: z.object({ timeS: finite.optional(), method: z.enum(['instantaneous', 'curve', 'curve-end', 'below-curve', 'no-data']), basis: z.string() }),
    maxLoopImpedanceOhm: finite.optional(),
    currentToDisconnectA: finite.optional(),
    verdict: verdictSchema,
    assumptions: z.array(z.string()),
  })
  .meta({ id: 'AutomaticDisconnection', description: 'IEC 60364-4-41 §411: Z_s, the fault current, the required and the operating time.' });

const protectiveConductorResultSchema = z
  .object({
    clause: z.string(),
    adiabatic: z
      .object({ minimumMm2: finite, nextStandardMm2: finite.optional(), kAs05PerMm2: finite, energyA2s: finite, initialC: finite, finalC: finite, basis: z.string() })
      .optional(),
    table: z.object({ minimumMm2: finite, nextStandardMm2: finite.optional(), basis: z.string() }).optional(),
    mechanicalMinimumMm2: finite,
    requiredMinimumMm2: finite,
    governing: z.enum(['adiabatic', 'table', 'mechanical']),
    note: z.string().optional(),
    installed: z.object({ sectionMm2: finite, meetsAdiabatic: z.boolean().optional(), meetsTable: z.boolean().optional(), verdict: verdictSchema }).optional(),
  })
  .meta({ id: 'ProtectiveConductorSection', description: 'IEC 60364-5-54 §543.1: the adiabatic and the table minimum, which governed, and the installed section’s verdict.' });

const harmonicsSchema = z
  .object({
    clause: z.string(),
    designCurrentA: finite,
    thirdHarmonicFraction: finite,
    neutralCurrentA: finite.meta({ description: '3·h₃·I_B, A.' }),
    reductionFactor: finite,
    governing: z.enum(['phase', 'neutral']),
    sizingCurrentA: finite,
    basis: z.string(),
    neutralHeatShare: finite.meta({ description: "The neutral's heat over one phase core's, (3·h₃)², carried in the heat balance (the evaluation's ampacity includes it)." }),
    ratingThreeLoadedCoresA: finite.meta({ description: 'The rating with three loaded cores and no harmonics, A: what the Annex E factors apply to.' }),
    annexEPasses: z.boolean().meta({ description: 'Annex E: the sizing current is at most the three-loaded-core rating.' }),
  })
  .meta({ id: 'HarmonicNeutralSizing' });

const groupSchema = z
  .object({
    placement: z.enum(['air', 'buried', 'ducts', 'backfill']),
    method: z.string(),
    cables: z.array(
      z.object({
        circuit: finite.meta({ description: "The candidate's parallel runs first, then the other circuits." }),
        index: finite,
        position: z.enum(['alone', 'trefoil', 'flat-outer', 'flat-centre', 'pair']),
        role: z.enum(['rated', 'same-cable', 'fixed']),
        xM: finite,
        yM: finite.meta({ description: 'Upward; the ground surface is y = 0 for buried cables.' }),
        externalDiameterM: finite,
        envelopeDiameterM: finite,
        conductorC: finite.nullable(),
        surfaceC: finite.nullable(),
        heatWPerM: finite.nullable(),
        riseFromOthersK: finite.nullable(),
      }),
    ),
    governingCable: finite.nullable().meta({ description: 'Index into cables of the cable that governs.' }),
    circuitAxisSpacingM: finite.nullable(),
    circuitSpacingM: finite.nullable(),
    depthM: finite.nullable(),
    bank: z.object({ centreXM: finite, centreDepthM: finite, widthM: finite, heightM: finite }).optional(),
  })
  .meta({ id: 'CableGroupResult', description: 'The cross-section that was rated: every cable, its temperatures and heat at the design current, and the one that governs.' });

export const evaluationOkSchema = z
  .object({
    ok: z.literal(true),
    index: finite,
    id: z.string(),
    label: z.string(),
    kind: z.enum(['cable', 'bar']),
    passes: z.boolean().meta({ description: 'True when no blocker flag was raised.' }),
    designCurrentA: finite,
    conductorCurrentA: finite,
    ambientC: finite,
    hotSpotC: finite.nullable().meta({ description: 'Hot spot at the design current, °C; null when there is no steady state (RUNAWAY).' }),
    governingTemperatureC: finite.nullable(),
    limit: governingLimitSchema,
    marginK: finite.nullable(),
    marginPercent: finite.nullable(),
    ampacityA: finite,
    utilisation: finite.nullable().meta({ description: 'Design current / ampacity. When the ampacity is zero (no current allowed) and current is asked for: 1.7976931348623157e308 (the largest double), with the OVER_LIMIT flag.' }),
    acFactor: finite,
    conductorC: finite.nullable(),
    resistanceOhmPerM: finite.nullable(),
    lossPerConductorWPerM: finite.nullable(),
    lossWPerM: finite.nullable(),
    loadedConductors: finite,
    conductorsInstalled: finite,
    sectionPerPhaseMm2: finite,
    runsPerPhase: finite.meta({ description: 'Parallel cables per phase, or bars per phase × parallel packs; among passing candidates fewer runs are preferred, then less section.' }),
    voltageDrop: z.object({ volts: finite, percent: finite, limitPercent: finite.optional() }),
    shortCircuit: shortCircuitSchema,
    massKg: finite,
    materialCost: decimalText.nullable(),
    lossCostPresentValue: decimalText.nullable(),
    lifeCycleCost: decimalText.nullable(),
    ampacity: ampacityResultSchema,
    profile: profileSchema.nullable(),
    group: groupSchema.optional(),
    protection: z
      .object({
        coordination: coordinationSchema.nullable(),
        smallestRating: smallestRatingSchema.nullable(),
        disconnection: disconnectionSchema.nullable(),
        protectiveConductor: protectiveConductorResultSchema.nullable(),
      })
      .optional()
      .meta({ id: 'ProtectionResult', description: 'Overload coordination (IEC 60364-4-43 §433.1), automatic disconnection (IEC 60364-4-41 §411) and the protective conductor (IEC 60364-5-54 §543.1), each with its numbers and verdict.' }),
    pack: z
      .object({
        bars: z.array(z.object({ phase: z.string(), positionInPack: finite, shareOfPhase: finite, currentA: finite, lossWPerM: finite, temperatureC: finite, acFactor: finite.nullable() })),
        hottest: z.object({ phase: z.string(), positionInPack: finite, temperatureC: finite }),
        acFactor: finite,
        method: z.string(),
      })
      .optional()
      .meta({ id: 'BusbarPackResult', description: 'A pack of bars at the design current: each bar\'s share of its phase current, loss and temperature (filament method, pack heat balance).' }),
    harmonics: harmonicsSchema.optional().meta({ description: 'The neutral of a four- or five-core cable under third harmonics (IEC 60364-5-52 Annex E): its current, the reduction factor and the sizing current.' }),
    forces: z
      .object({
        method: z.string(),
        kappa: finite,
        peakCurrentA: finite,
        mainForceN: finite,
        totalStressPa: finite,
        yieldStrengthPa: finite,
        stressRatio: finite,
        subConductorStressRatio: finite.nullable(),
        supportForceAN: finite,
        supportForceBN: finite,
        supportForceRatio: finite.nullable(),
        passes: z.boolean(),
        largestSupportSpacingM: finite,
        largestSupportSpacingLimitedBy: z.string(),
      })
      .optional()
      .meta({ id: 'ShortCircuitForces', description: 'IEC 60865-1 forces and stresses of the bus-bar system for the prospective fault.' }),
    flags: z.array(flagSchema),
    solves: finite,
    isSmallestPassing: z.boolean().optional(),
    isLowestLifeCycleCostPassing: z.boolean().optional(),
  })
  .meta({ id: 'CandidateResult' });

export const evaluationErrorSchema = z
  .object({
    ok: z.literal(false),
    index: finite,
    id: z.string(),
    label: z.string(),
    error: z.object({ code: z.string(), message: z.string(), field: z.string().optional() }),
  })
  .meta({ id: 'CandidateNotEvaluated', description: 'A candidate for which no honest answer exists (for example the heat balance has no solution); the others are still evaluated.' });

export const evaluationSchema = z.discriminatedUnion('ok', [evaluationOkSchema, evaluationErrorSchema]);

const answerCommon = {
  apiVersion: z.literal(API_VERSION),
  caution: z.string().meta({ description: 'Always present: the terms on which the numbers may be used.' }),
};

export const evaluateResponseSchema = z
  .object({
    ...answerCommon,
    evaluations: z.array(evaluationSchema),
    smallestPassingIndex: finite.nullable(),
    lowestLifeCycleCostPassingIndex: finite.nullable(),
  })
  .meta({ id: 'EvaluateResponse' });

export const ampacityResponseSchema = z
  .object({ ...answerCommon, ampacity: ampacityResultSchema })
  .meta({ id: 'AmpacityResponse' });

export const flagsResponseSchema = z
  .object({
    apiVersion: z.literal(API_VERSION),
    flags: z.array(z.object({ code: z.enum(FLAG_CODES), severity: z.enum(['note', 'review', 'blocker']), title: z.string(), basis: z.string() })),
  })
  .meta({ id: 'FlagsResponse' });

export const errorResponseSchema = z
  .object({
    error: z.object({
      code: z.string().meta({ description: 'Stable, machine-readable: invalid_input, invalid_json, payload_too_large, unsupported_media_type, unauthenticated, forbidden, rate_limited, database_unavailable, internal_error…' }),
      message: z.string(),
      fieldPath: z.string().optional().meta({ description: 'The input at fault, dot-separated (candidates.0.layers.1.thicknessM).' }),
      issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
    }),
  })
  .meta({ id: 'Error' });

export type EvaluateResponse = z.output<typeof evaluateResponseSchema>;
export type AmpacityResponse = z.output<typeof ampacityResponseSchema>;

/** The caution that travels with every calculated answer (product.md, "Cautions"). */
export const API_CAUTION =
  'Engineering aid only. These results depend on the assumption flags listed with them. The installation must comply with the applicable wiring rules and standards (IEC 60364 and national codes) and local authority requirements, and a qualified, licensed engineer must check and sign the sizing before it is used for construction.';

// Library results must fit the documented answers: these fail to compile otherwise.
type Assignable<From, To> = [From] extends [To] ? true : false;
const evaluationFits: Assignable<CandidateEvaluation, z.input<typeof evaluationSchema>> = true;
const ampacityFits: Assignable<AmpacityResult, z.input<typeof ampacityResultSchema>> = true;
void evaluationFits;
void ampacityFits;

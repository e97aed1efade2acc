/**
 * Candidates as they are stored on a sizing sheet: a full copy of the conductor data the sizing
 * library needs (not just a catalogue id), so that a saved or approved sheet recomputes to the
 * same numbers even after the catalogue changes. The catalogue ids ride along for traceability.
 */
import { z } from 'zod';
import type { BarCandidate, CableCandidate, Candidate } from '../electrical/sizing/types';
import { INPUT_BOUNDS, zodBound, type BoundName } from '../inputBounds';

/*
 * Bounds: where lib/inputBounds gives a range at least as wide as a stored sheet could hold
 * (counts, emissivities, the AC/DC ratio, α20), the table's range is used. The dimensions and
 * resistances stay "greater than 0" here: a candidate is a copy of catalogue data kept with the
 * sheet, and a stored (perhaps approved) sheet must stay readable; a value beyond the table is
 * refused by the library with its field named when the sheet is computed.
 */
const bounded = (name: BoundName) => zodBound(z.number({ error: `${INPUT_BOUNDS[name].label} must be a number` }), INPUT_BOUNDS[name]);

const positive = (what: string) => z.number({ error: `${what} must be a number` }).positive(`${what} must be greater than 0`);
const money = z
  .string()
  .trim()
  .regex(/^\d+(\.\d+)?$/, 'must be a decimal amount such as 9.50');

const candidateCommon = {
  id: z.string().min(1).max(120),
  label: z.string().min(1).max(200),
  material: z.enum(['copper', 'aluminium']),
  r20OhmPerM: positive('Resistance at 20 °C'),
  alpha20PerK: bounded('alpha20PerK').optional(),
  parallel: zodBound(z.number(), INPUT_BOUNDS.parallel, 'Conductors per phase').default(1),
  catalogue: z
    .object({ conductorId: z.string().optional(), coveringIds: z.array(z.string()).optional(), buildId: z.string().optional() })
    .optional(),
  sourceNotes: z.array(z.string().max(1000)).max(60).optional(),
  dataFromMemory: z.boolean().optional(),
  costs: z
    .object({
      conductorPricePerKg: money.optional(),
      pricePerM: money.optional(),
      densityKgPerM3: z.number().positive().optional(),
    })
    .optional(),
};

const cableLayerSchema = z.object({
  name: z.string().min(1).max(120),
  role: z.enum(['insulation', 'semiconductor', 'screen', 'bedding', 'armour', 'sheath', 'jacket', 'filler', 'other']).optional(),
  thicknessM: positive('Layer thickness'),
  thermalResistivityKmPerW: positive('Thermal resistivity'),
  continuousLimitC: z.number().optional(),
  shortCircuitLimitC: z.number().optional(),
});

/**
 * The metallic screen or sheath of a single-core cable (sheet version 5): with it the screen losses
 * λ₁ of IEC 60287-1-1 §2.3 are computed for the circuit's bonding and formation. Its place and
 * thickness are the layer with role 'screen'.
 */
export const cableScreenSchema = z
  .object({
    material: z.enum(['copper', 'aluminium', 'lead'], { error: "Screen material must be 'copper', 'aluminium' or 'lead'" }),
    sectionMm2: bounded('screenSectionMm2').optional(),
    r20OhmPerM: bounded('screenR20OhmPerM').optional(),
    bonding: z.enum(['solid', 'single-point', 'cross-bonded'], { error: "Screen bonding must be 'solid', 'single-point' or 'cross-bonded'" }),
  })
  .refine((s) => s.sectionMm2 !== undefined || s.r20OhmPerM !== undefined, { message: 'Give the screen’s section or its resistance at 20 °C', path: ['sectionMm2'] });

export const cableCandidateSchema = z
  .object({
    ...candidateCommon,
    kind: z.literal('cable'),
    sectionMm2: positive('Section'),
    conductorDiameterM: positive('Conductor diameter'),
    cores: bounded('cores').optional(),
    layers: z.array(cableLayerSchema).min(1, 'A cable needs at least its insulation'),
    emissivity: bounded('emissivity').optional(),
    ks: z.number().positive().optional(),
    kp: z.number().positive().optional(),
    screen: cableScreenSchema.optional(),
  })
  .superRefine((cable, ctx) => {
    if (cable.screen && !cable.layers.some((l) => l.role === 'screen')) {
      ctx.addIssue({ code: 'custom', path: ['screen'], message: 'A screen needs its place among the layers: mark one layer as the screen' });
    }
  });

export const barCandidateSchema = z.object({
  ...candidateCommon,
  kind: z.literal('bar'),
  widthM: positive('Bar width'),
  thicknessM: positive('Bar thickness'),
  barsPerPhase: bounded('barsPerPhase').optional(),
  barGapM: z.number().positive().optional(),
  coating: z
    .object({
      name: z.string().optional(),
      thicknessM: positive('Coating thickness'),
      thermalResistivityKmPerW: positive('Coating thermal resistivity'),
      emissivity: bounded('emissivity').optional(),
      continuousLimitC: z.number().optional(),
      shortCircuitLimitC: z.number().optional(),
    })
    .optional(),
  emissivity: bounded('emissivity').optional(),
  acResistanceRatio: bounded('acResistanceRatio').optional(),
  terminalLimitC: z.number().optional(),
  shortCircuitLimitC: z.number().optional(),
  /** R_p0.2 of the bar material, Pa, from the catalogue (sheet version 6); without it the force check assumes a default per metal (flagged). */
  yieldStrengthPa: bounded('yieldStrengthPa').optional(),
});

export const sheetCandidateSchema = z.discriminatedUnion('kind', [cableCandidateSchema, barCandidateSchema]);
export type SheetCandidate = z.infer<typeof sheetCandidateSchema>;

// The stored shape must stay assignable to the sizing library's Candidate.
type Assignable<T, U extends T> = U;
export type _CableCheck = Assignable<CableCandidate, z.infer<typeof cableCandidateSchema>>;
export type _BarCheck = Assignable<BarCandidate, z.infer<typeof barCandidateSchema>>;

export function toLibraryCandidate(candidate: SheetCandidate): Candidate {
  return candidate;
}

/** The section per phase, mm², for sorting and labels. */
export function sectionPerPhaseMm2(candidate: SheetCandidate): number {
  if (candidate.kind === 'cable') return candidate.sectionMm2 * candidate.parallel;
  return candidate.widthM * candidate.thicknessM * 1e6 * (candidate.barsPerPhase ?? 1) * candidate.parallel;
}

/** "2 × 100 × 10 mm copper bars per phase", "2 × 240 mm² copper XLPE per phase". */
export function describeArrangement(candidate: SheetCandidate): string {
  if (candidate.kind === 'bar') {
    const bars = (candidate.barsPerPhase ?? 1) * candidate.parallel;
    return `${bars} bar${bars > 1 ? 's' : ''} per phase`;
  }
  return `${candidate.parallel} cable${candidate.parallel > 1 ? 's' : ''} per phase`;
}

/**
 * The zod schema of a circuit's cross-section (see ./arrangement.ts for the conventions), shared
 * by the sheet, the schedule rows, the API and the PDF. Field ranges are checked here; the
 * geometric rules (overlaps, spacing required, above ground, inside the backfill) come from
 * `arrangementGeometryIssues`, so the schema and the layout can never disagree.
 */
import { z } from 'zod';
import { ElectricalInputError } from '../errors';
import {
  arrangementGeometryIssues,
  placeCables,
  CIRCUIT_FORMATIONS,
  type Arrangement,
  type ArrangementLayout,
} from './arrangement';
import { DUCT_MATERIALS } from './constants';

const num = (label: string) => z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a finite number`);
const length = (label: string, maxM: number) =>
  num(label).gt(0, `${label} must be greater than 0`).max(maxM, `${label} must be at most ${maxM} m`);

export const arrangementCircuitSchema = z.strictObject({
  label: z.string().trim().max(80, 'Circuit label must be at most 80 characters').optional(),
  cableRef: z.string().trim().min(1).max(120).optional(),
  externalDiameterM: length('Cable diameter', 0.3),
  currentA: num('Circuit current').min(0, 'Circuit current must not be negative').max(20000, 'Circuit current must be at most 20 000 A').optional(),
  formation: z.enum(CIRCUIT_FORMATIONS, { error: 'Choose a formation: single, trefoil, flat-horizontal or flat-vertical' }),
  cableCount: z.union([z.literal(2), z.literal(3)], { error: 'A flat formation has 2 or 3 cables' }).optional(),
  spacing: z.enum(['touching', 'spaced'], { error: "Spacing must be 'touching' or 'spaced'" }),
  // Zero is let through here so that the geometric rule can say "spacing required" in its own words.
  axisSpacingM: num('Cable spacing').min(0, 'Cable spacing must not be negative').max(10, 'Cable spacing must be at most 10 m').optional(),
  trefoilApex: z.enum(['up', 'down']).optional(),
  transposed: z.boolean().optional(),
});

export const ductSpecSchema = z.strictObject({
  material: z.enum(DUCT_MATERIALS, { error: 'Choose a duct material' }),
  innerDiameterM: length('Duct inner diameter', 1),
  outerDiameterM: length('Duct outer diameter', 1.2),
});

export const backfillSpecSchema = z.strictObject({
  widthM: length('Backfill width', 10),
  heightM: length('Backfill height', 10),
  centreDepthM: length('Backfill centre depth', 20),
  centreXM: num('Backfill centre position').optional(),
  resistivityKmPerW: num('Backfill thermal resistivity').min(0.1, 'Backfill thermal resistivity must be at least 0.1 K·m/W').max(20, 'Backfill thermal resistivity must be at most 20 K·m/W'),
});

const depth = length('Depth', 20);

export const placementSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('air') }),
    z.strictObject({ kind: z.literal('buried'), depthM: depth }),
    z.strictObject({ kind: z.literal('ducts'), depthM: depth, duct: ductSpecSchema }),
    z.strictObject({ kind: z.literal('backfill'), depthM: depth, bank: backfillSpecSchema, duct: ductSpecSchema.optional() }),
  ],
  { error: "Placement must be 'air', 'buried', 'ducts' or 'backfill'" },
);

export const circuitSpacingSchema = z.strictObject({
  direction: z.enum(['horizontal', 'vertical'], { error: "Circuit direction must be 'horizontal' or 'vertical'" }),
  axisSpacingM: num('Circuit spacing').min(0, 'Circuit spacing must not be negative').max(50, 'Circuit spacing must be at most 50 m'),
});

export const MAX_CIRCUITS = 24;

export const arrangementSchema = z
  .strictObject({
    circuits: z
      .array(arrangementCircuitSchema)
      .min(1, 'An arrangement has at least one circuit')
      .max(MAX_CIRCUITS, `An arrangement has at most ${MAX_CIRCUITS} circuits`),
    circuitSpacing: circuitSpacingSchema.optional(),
    placement: placementSchema,
  })
  .superRefine((value, ctx) => {
    for (const issue of arrangementGeometryIssues(value)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  })
  .meta({ id: 'CircuitCrossSection' });

export type ArrangementInput = z.input<typeof arrangementSchema>;

// The hand-written type of ./arrangement.ts and the schema's output must stay the same shape.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const shapesAgree: Same<z.output<typeof arrangementSchema>, Arrangement> = true;
void shapesAgree;

/** Dotted field path as the rest of lib/electrical names fields (e.g. `circuits.1.axisSpacingM`). */
function fieldOf(path: ReadonlyArray<PropertyKey>): string {
  return path.length === 0 ? 'arrangement' : path.map(String).join('.');
}

/** Validate an arrangement, throwing an `ElectricalInputError` that names the first bad field. */
export function parseArrangement(input: unknown): Arrangement {
  const parsed = arrangementSchema.safeParse(input);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new ElectricalInputError(fieldOf(first.path), first.message);
  }
  return parsed.data;
}

/** Validate, then lay the arrangement out into cable centres (see ./arrangement.ts for axes). */
export function layoutArrangement(input: unknown): ArrangementLayout {
  return placeCables(parseArrangement(input));
}

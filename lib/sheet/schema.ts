/**
 * The inputs of a sizing sheet, as stored in `sheets.inputs` (JSON) — always SI.
 *
 * Versioned: `schemaVersion` is stored in the JSON and in the row. Older versions are migrated on
 * read (`readSheetInputs`), never rewritten in place, so an approved sheet keeps the JSON it was
 * approved with. Version history:
 *   1 — the first shape: flat circuit fields, `sunIrradianceWPerM2` as a bare number,
 *       `installation` without the enclosure's inner arrangement, no life-cycle cost inputs.
 *   2 — grouped circuit/fault/environment/installation/limits/economics sections, optional
 *       values as null ("not entered", so the library assumes and flags a default).
 *   3 — optional checks beyond the steady state: `overTime` (overload, daily load, fault with heat
 *       into the coverings) and `alongRun` (a bar run between terminals with joints); a version-2
 *       sheet reads with both unchecked.
 *   4 — optional check `enclosureAir` (the air inside an enclosure from the losses in it); a
 *       version-2 or -3 sheet reads with it unchecked.
 *   5 — the cross-section that is rated (issue 17, physics.md §8): the circuit's formation may be
 *       a vertical row, the spacing between the circuit's runs and the other circuits and the
 *       direction of their row, the other circuits beside it (each with its current and either the
 *       same cable or a cable given by its diameter and heat), transposition, and for buried
 *       cables ducts and a backfill; a candidate may carry its metallic screen's data. An older
 *       sheet reads with its own formation and spacing, no other circuits, no ducts and no
 *       backfill — the arrangement it was sized for — and keeps its saved result (marked for
 *       re-evaluation when that result came from an earlier solver, lib/sheet/reEvaluation.ts).
 *   6 — bus-bar systems and the rest of the circuit check (issues 18 and 21, lib/sheet/systemSchema.ts):
 *       `busbarSystem` (gap between a pack's bars, phase spacing, support span and how the bars are
 *       held, rated support strength, κ or the fault's R/X, the pack's heat exchange), `protection`
 *       (the circuit's device, earthing, source impedance, protective conductor) and `harmonics`
 *       (third-harmonic content). An older sheet reads with none of them described — the system
 *       it was sized with (phase spacing assumed, forces and protection not checked) — and keeps
 *       its saved result; a saved pack rated by the method since replaced is marked for
 *       re-evaluation when its figure changes (lib/sheet/reEvaluation.ts). `limits.raiseJustification`
 *       (why a raised limit is safe, issue 22): empty on older sheets.
 *   7 — the option `crossSection` (issue 20): solve the ground around a buried circuit in two
 *       dimensions beside the IEC rating, with the ground surface isothermal or exchanging heat
 *       with the air through a coefficient. An older sheet reads with the option off.
 */
import { z } from 'zod';
import { INPUT_BOUNDS, zodBound, type BoundName } from '../inputBounds';
import { sheetCandidateSchema } from './candidates';
import { busbarSystemSchema, harmonicsSchema, protectionSchema, systemDefaults, systemIssues } from './systemSchema';

export const SHEET_SCHEMA_VERSION = 7 as const;

const num = (label: string) => z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a finite number`);
/** A number inside its bound of lib/inputBounds (the one table every edge and the library read). */
const bounded = (name: BoundName, label: string = INPUT_BOUNDS[name].label) => zodBound(num(label), INPUT_BOUNDS[name], label);
/** The same, or null for "not entered" (the library then assumes a default and flags it). */
const optionalBounded = (name: BoundName, label?: string) => bounded(name, label).nullable();
const moneyText = (label: string) =>
  z
    .string()
    .trim()
    .regex(/^\d+(\.\d+)?$/, `${label} must be an amount such as 0.12`);

export const installationKinds = ['bar-on-edge', 'bar-flat', 'cable-in-air', 'buried', 'enclosure'] as const;
export type InstallationKind = (typeof installationKinds)[number];

export const circuitSchema = z.object({
  designCurrentA: bounded('designCurrentA'),
  /** U₀, line to neutral, V. */
  nominalVoltageV: bounded('nominalVoltageV'),
  phases: z.union([z.literal(1), z.literal(3)], { error: 'Phases must be 1 or 3' }),
  frequencyHz: bounded('frequencyHz'),
  lengthM: bounded('lengthM'),
  powerFactor: bounded('powerFactor'),
  maxVoltageDropPercent: optionalBounded('maxVoltageDropPercent'),
  reactanceOhmPerM: optionalBounded('reactanceOhmPerM'),
});

export const faultSchema = z.object({
  checked: z.boolean(),
  currentA: bounded('faultCurrentA'),
  durationS: bounded('faultDurationS'),
});

export const environmentSchema = z.object({
  /** null: not entered (the library assumes its reference ambient and raises a flag). */
  ambientC: optionalBounded('ambientC'),
  windSpeedMPerS: bounded('windSpeedMPerS'),
  outdoorSun: z.boolean(),
  irradianceWPerM2: bounded('irradianceWPerM2'),
  /** null: not entered (assumed and flagged). */
  solarAbsorptivity: optionalBounded('solarAbsorptivity'),
});

export const formations = ['trefoil', 'flat', 'flat-vertical'] as const;
export const circuitRows = ['horizontal', 'vertical'] as const;
/** Duct materials of IEC 60287-2-1 Table 4 (the constants the library holds, lib/electrical/iec60287/constants.ts). */
export const ductMaterials = ['pvc', 'pe', 'earthenware', 'fibre-in-air', 'fibre-in-concrete', 'metallic'] as const;

/** A circuit lying beside the one being sized (same trench or route), in one row with it. */
export const otherCircuitSchema = z.object({
  /** The designer's name for it ("Lighting feeder L-2"); may be empty. */
  label: z.string().trim().max(80, 'A circuit label must be at most 80 characters'),
  currentA: bounded('otherCircuitCurrentA'),
  /** True: the same cable as the candidate, solved at its own current; false: its cable is given by diameter and heat. */
  sameCable: z.boolean(),
  /** One cable's overall diameter, m; used (and required) when sameCable is false. */
  externalDiameterM: optionalBounded('otherCableDiameterM'),
  /** Heat of ONE of its cables at its current, W/m, from its own rating; used (and required) when sameCable is false. */
  lossWPerM: optionalBounded('otherCableLossWPerM'),
});
export type SheetOtherCircuit = z.infer<typeof otherCircuitSchema>;

export const ductSchema = z.object({
  /** Every cable in its own duct (buried cables only). The sizes are kept while unticked. */
  used: z.boolean(),
  material: z.enum(ductMaterials, { error: 'Choose a duct material' }),
  innerDiameterM: bounded('ductInnerDiameterM'),
  outerDiameterM: bounded('ductOuterDiameterM'),
});

export const backfillSchema = z.object({
  /** A rectangular backfill or concrete bank of its own resistivity around the cables (buried only). */
  used: z.boolean(),
  widthM: bounded('backfillWidthM'),
  heightM: bounded('backfillHeightM'),
  /** Depth of the bank's centre, m; null = at the depth of the cable axis. */
  centreDepthM: optionalBounded('backfillCentreDepthM'),
  resistivityKmPerW: bounded('backfillResistivityKmPerW'),
});

export const installationSchema = z.object({
  kind: z.enum(installationKinds, { error: 'Choose an installation' }),
  /** How the circuit's single-core cables lie: trefoil, a horizontal row ('flat') or a vertical row. */
  formation: z.enum(formations, { error: 'Choose how the cables lie' }),
  /** Axis-to-axis spacing of the circuit's cables, m; null = touching. */
  spacingM: optionalBounded('spacingM'),
  /** Centre-to-centre spacing between the circuit's parallel runs and the other circuits, m; null = touching. */
  circuitSpacingM: optionalBounded('circuitSpacingM'),
  /** Direction of the row of circuits. */
  circuitRow: z.enum(circuitRows, { error: 'Choose the direction of the row of circuits' }),
  otherCircuits: z.array(otherCircuitSchema).max(23, 'At most 23 other circuits beside this one'),
  /** Flat formation: phases transposed along the route (screen losses). */
  transposed: z.boolean(),
  depthM: bounded('depthM'),
  soilResistivityKmPerW: optionalBounded('soilResistivityKmPerW'),
  groundC: optionalBounded('groundC'),
  duct: ductSchema,
  backfill: backfillSchema,
  enclosureDerating: bounded('enclosureDerating'),
  enclosureInside: z.enum(['cable-in-air', 'bar-on-edge', 'bar-flat']),
});

export const limitsSchema = z.object({
  /** A limit of the user's own (a joint, a neighbouring device), °C; null = material limits only. */
  temperatureLimitC: optionalBounded('temperatureLimitC'),
  raiseMaterialLimit: z.boolean(),
  /** Why a raised limit is safe, for the reviewer (a blocker while empty); empty on older sheets. */
  raiseJustification: z.string().max(2000, 'At most 2,000 characters').default(''),
  groupingFactor: bounded('groupingFactor'),
});

export const economicsSchema = z.object({
  included: z.boolean(),
  lossLoadFactor: bounded('lossLoadFactor'),
  hoursPerYear: bounded('hoursPerYear'),
  energyPricePerKWh: moneyText('Energy price'),
  discountRatePercent: bounded('discountRatePercent'),
  years: bounded('years'),
  loadGrowthPercent: bounded('loadGrowthPercent'),
  energyPriceGrowthPercent: bounded('energyPriceGrowthPercent'),
});

/** Allowed numbers of equal intervals in a day's load profile (hourly or finer, dividing the day). */
export const DAILY_PROFILE_LENGTHS = [24, 48, 96, 144, 288, 1440] as const;

export const overTimeSchema = z.object({
  checked: z.boolean(),
  overloadCurrentA: bounded('overloadCurrentA'),
  overloadDurationS: bounded('overloadDurationS'),
  /** Currents per phase over one day in equal intervals from midnight, A; empty = no daily check. */
  dailyProfileA: z
    .array(bounded('dailyLoadCurrentA'))
    .refine((v) => v.length === 0 || (DAILY_PROFILE_LENGTHS as readonly number[]).includes(v.length), `A daily profile has ${DAILY_PROFILE_LENGTHS.join(', ')} values (hourly or finer)`),
  /** Fault heating with heat into the coverings, beside the adiabatic figure (uses the fault inputs). */
  faultWithCoverings: z.boolean(),
});

export const runEndKinds = ['terminal', 'insulated'] as const;
export const alongRunSchema = z.object({
  checked: z.boolean(),
  lengthM: bounded('runLengthM'),
  startEnd: z.enum(runEndKinds),
  startTemperatureC: bounded('terminalTemperatureC', 'Start terminal temperature'),
  endEnd: z.enum(runEndKinds),
  endTemperatureC: bounded('terminalTemperatureC', 'End terminal temperature'),
  joints: z
    .array(
      z.object({
        positionM: num('Joint position').min(0, 'Joint position must not be negative'),
        /** µΩ; null = not entered (a default is assumed and flagged). */
        resistanceMicroOhm: optionalBounded('jointResistanceMicroOhm'),
      }),
    )
    .max(50, 'At most 50 joints on one run'),
});

export const enclosureWalls = ['painted-steel', 'stainless-steel', 'aluminium', 'plastic'] as const;
const enclosureLength = (label: string) => bounded('enclosureSizeM', label);
export const enclosureAirSchema = z.object({
  checked: z.boolean(),
  heightM: enclosureLength('Enclosure height'),
  widthM: enclosureLength('Enclosure width'),
  depthM: enclosureLength('Enclosure depth'),
  backCovered: z.boolean(),
  sidesCovered: z.union([z.literal(0), z.literal(1), z.literal(2)], { error: 'Covered sides must be 0, 1 or 2' }),
  topCovered: z.boolean(),
  wall: z.enum(enclosureWalls),
  outsideAirC: bounded('enclosureOutsideAirC'),
  routeLengthInsideM: bounded('routeLengthInsideM'),
  otherLossesW: bounded('otherLossesW'),
});

/** How the ground surface is treated in the two-dimensional cross-section (lib/thermal/crossSection). */
export const groundSurfaceKinds = ['isothermal', 'convective'] as const;
export const crossSectionSchema = z.object({
  /** Solve the cross-section in two dimensions beside the IEC rating (buried circuits; stored with the snapshot on save). */
  checked: z.boolean(),
  /** 'isothermal': the surface at the ground temperature (the IEC assumption); 'convective': it gives heat to air at the ground temperature. */
  surface: z.enum(groundSurfaceKinds, { error: 'Choose how the ground surface is treated' }),
  /** W/(m²·K), used when the surface is convective; kept while it is isothermal. */
  heatTransferCoefficientWPerM2K: bounded('groundSurfaceCoefficientWPerM2K'),
});

export const sheetInputsSchema = z
  .object({
    schemaVersion: z.literal(SHEET_SCHEMA_VERSION),
    circuit: circuitSchema,
    fault: faultSchema,
    environment: environmentSchema,
    installation: installationSchema,
    limits: limitsSchema,
    economics: economicsSchema,
    overTime: overTimeSchema,
    alongRun: alongRunSchema,
    enclosureAir: enclosureAirSchema,
    busbarSystem: busbarSystemSchema,
    protection: protectionSchema,
    harmonics: harmonicsSchema,
    crossSection: crossSectionSchema,
    candidates: z.array(sheetCandidateSchema).max(24, 'At most 24 candidates on one sheet'),
    chosenCandidateId: z.string().nullable(),
    notes: z.string().max(4000),
  })
  .superRefine((value, ctx) => {
    const ids = new Set<string>();
    value.candidates.forEach((candidate, index) => {
      if (ids.has(candidate.id)) ctx.addIssue({ code: 'custom', path: ['candidates', index, 'id'], message: 'Two candidates share one id' });
      ids.add(candidate.id);
    });
    if (value.chosenCandidateId !== null && !ids.has(value.chosenCandidateId)) {
      ctx.addIssue({ code: 'custom', path: ['chosenCandidateId'], message: 'The chosen candidate is not on this sheet' });
    }
    if (value.limits.raiseMaterialLimit && value.limits.temperatureLimitC === null) {
      ctx.addIssue({ code: 'custom', path: ['limits', 'temperatureLimitC'], message: 'Enter your own limit to replace the material limits' });
    }
    value.alongRun.joints.forEach((joint, index) => {
      if (joint.positionM > value.alongRun.lengthM) {
        ctx.addIssue({ code: 'custom', path: ['alongRun', 'joints', index, 'positionM'], message: 'Joint position must lie on the run' });
      }
    });
    if (value.installation.kind === 'buried' && (value.environment.outdoorSun || value.environment.windSpeedMPerS > 0)) {
      ctx.addIssue({ code: 'custom', path: ['environment', 'outdoorSun'], message: 'A buried cable sees neither sun nor wind' });
    }
    arrangementIssues(value.installation).forEach((issue) => ctx.addIssue({ code: 'custom', path: ['installation', ...issue.path], message: issue.message }));
    systemIssues(value).forEach((issue) => ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message }));
  });

/**
 * What the arrangement needs that a single field cannot say: a cable given for another circuit,
 * a duct wider outside than inside. Where the cables lie (overlaps, inside the backfill, fitting
 * the duct) depends on the candidate's diameter and is refused by the library with the field named.
 */
function arrangementIssues(installation: z.infer<typeof installationSchema>): Array<{ path: Array<string | number>; message: string }> {
  const issues: Array<{ path: Array<string | number>; message: string }> = [];
  installation.otherCircuits.forEach((other, index) => {
    if (other.sameCable) return;
    if (other.externalDiameterM === null) issues.push({ path: ['otherCircuits', index, 'externalDiameterM'], message: 'Enter the diameter of the other circuit’s cable, or take the same cable' });
    if (other.lossWPerM === null) issues.push({ path: ['otherCircuits', index, 'lossWPerM'], message: 'Enter the heat per cable of the other circuit, or take the same cable' });
  });
  const buried = installation.kind === 'buried';
  if (buried && installation.duct.used && !(installation.duct.outerDiameterM > installation.duct.innerDiameterM)) {
    issues.push({ path: ['duct', 'outerDiameterM'], message: 'Duct outer diameter must be larger than its inner diameter' });
  }
  return issues;
}

export type SheetInputs = z.infer<typeof sheetInputsSchema>;

// ───────────────────────────── version 1 ─────────────────────────────

export const sheetInputsV1Schema = z.object({
  schemaVersion: z.literal(1).optional(),
  designCurrentA: z.number(),
  voltageV: z.number(),
  phases: z.union([z.literal(1), z.literal(3)]),
  frequencyHz: z.number(),
  lengthM: z.number(),
  powerFactor: z.number(),
  faultCurrentA: z.number().nullable().optional(),
  faultDurationS: z.number().nullable().optional(),
  ambientC: z.number().nullable().optional(),
  windSpeedMPerS: z.number().optional(),
  sunIrradianceWPerM2: z.number().optional(),
  installation: z.object({
    kind: z.enum(['bar-on-edge', 'bar-flat', 'cable-in-air', 'buried', 'enclosure']),
    depthM: z.number().optional(),
    soilResistivityKmPerW: z.number().optional(),
    deratingFactor: z.number().optional(),
  }),
  candidates: z.array(sheetCandidateSchema).default([]),
  chosenCandidateId: z.string().nullable().optional(),
});
export type SheetInputsV1 = z.infer<typeof sheetInputsV1Schema>;

export class SheetSchemaError extends Error {
  constructor(
    message: string,
    readonly storedVersion: number,
  ) {
    super(message);
  }
}

function migrateV1(v1: SheetInputsV1): SheetInputs {
  const base = defaultSheetInputs(v1.installation.kind);
  const faultEntered = v1.faultCurrentA != null && v1.faultDurationS != null;
  const sun = v1.sunIrradianceWPerM2 ?? 0;
  const insideFor = (): SheetInputs['installation']['enclosureInside'] =>
    v1.candidates.some((c) => c.kind === 'bar') ? 'bar-on-edge' : 'cable-in-air';
  return {
    ...base,
    circuit: {
      ...base.circuit,
      designCurrentA: v1.designCurrentA,
      nominalVoltageV: v1.voltageV,
      phases: v1.phases,
      frequencyHz: v1.frequencyHz,
      lengthM: v1.lengthM,
      powerFactor: v1.powerFactor,
    },
    fault: faultEntered ? { checked: true, currentA: v1.faultCurrentA!, durationS: v1.faultDurationS! } : { ...base.fault, checked: false },
    environment: {
      ...base.environment,
      ambientC: v1.ambientC ?? null,
      windSpeedMPerS: v1.windSpeedMPerS ?? 0,
      outdoorSun: sun > 0,
      irradianceWPerM2: sun > 0 ? sun : base.environment.irradianceWPerM2,
    },
    installation: {
      ...base.installation,
      kind: v1.installation.kind,
      depthM: v1.installation.depthM ?? base.installation.depthM,
      soilResistivityKmPerW: v1.installation.soilResistivityKmPerW ?? null,
      enclosureDerating: v1.installation.deratingFactor ?? base.installation.enclosureDerating,
      // Version 1 had no inner arrangement for enclosures; the candidates' kind tells it.
      enclosureInside: insideFor(),
    },
    // Version 1 had no life-cycle cost inputs: they start excluded, as the sheet was sized without them.
    economics: { ...base.economics, included: false },
    candidates: v1.candidates,
    chosenCandidateId: v1.chosenCandidateId ?? null,
  };
}

/**
 * Reads stored inputs of any known version as the current version. Throws SheetSchemaError with a
 * plain message when the JSON matches no known version (the page shows it instead of crashing).
 */
export function readSheetInputs(raw: unknown, storedVersion?: number): SheetInputs {
  const version =
    (raw && typeof raw === 'object' && typeof (raw as { schemaVersion?: unknown }).schemaVersion === 'number'
      ? (raw as { schemaVersion: number }).schemaVersion
      : undefined) ??
    storedVersion ??
    1;
  if (version === SHEET_SCHEMA_VERSION) {
    const parsed = sheetInputsSchema.safeParse(raw);
    if (!parsed.success) throw new SheetSchemaError(`Stored sheet inputs do not match version ${version}: ${parsed.error.issues[0]?.message}`, version);
    return parsed.data;
  }
  if (version === 2 || version === 3 || version === 4 || version === 5 || version === 6) {
    // Versions 3 and 4 only added optional checks (over time, along the run; the enclosure air):
    // a sheet stored before them reads with them unchecked. Version 5 added the cross-section:
    // an older sheet keeps its formation and spacing, with nothing beside it, no ducts, no backfill.
    // Version 6 added the bus-bar system, the protection and the harmonics: an older sheet reads
    // with none of them described (the system it was sized with; nothing more checked). Version 7
    // added the two-dimensional cross-section, off on an older sheet.
    const defaults = defaultSheetInputs();
    const added = version === 2 ? { overTime: defaults.overTime, alongRun: defaults.alongRun, enclosureAir: defaults.enclosureAir } : version === 3 ? { enclosureAir: defaults.enclosureAir } : {};
    const stored = raw as { installation?: unknown };
    const installation =
      version < 5 && stored.installation && typeof stored.installation === 'object' ? { ...arrangementDefaults(), ...(stored.installation as object) } : stored.installation;
    const parsed = sheetInputsSchema.safeParse({ ...(raw as object), schemaVersion: SHEET_SCHEMA_VERSION, ...added, ...(version < 6 ? systemDefaults() : {}), ...addedInVersion7(), installation });
    if (!parsed.success) throw new SheetSchemaError(`Stored sheet inputs do not match version ${version}: ${parsed.error.issues[0]?.message}`, version);
    return parsed.data;
  }
  if (version === 1) {
    const parsed = sheetInputsV1Schema.safeParse(raw);
    if (!parsed.success) throw new SheetSchemaError(`Stored sheet inputs do not match version 1: ${parsed.error.issues[0]?.message}`, 1);
    return sheetInputsSchema.parse(migrateV1(parsed.data));
  }
  throw new SheetSchemaError(`Sheet inputs of schema version ${version} are newer than this application understands`, version);
}

/** What version 7 added, as an older sheet reads it: the two-dimensional cross-section switched off. */
function addedInVersion7(): Pick<SheetInputs, 'crossSection'> {
  return { crossSection: crossSectionDefaults() };
}

// ───────────────────────────── defaults ─────────────────────────────

/**
 * The two-dimensional cross-section as a new sheet has it: off, the surface isothermal as IEC 60287
 * assumes it; 10 W/(m²·K) is only the starting value shown when the designer makes the surface
 * exchange heat with the air (a still-air figure for bare ground, common practice, from memory).
 */
export function crossSectionDefaults(): SheetInputs['crossSection'] {
  return { checked: false, surface: 'isothermal', heatTransferCoefficientWPerM2K: 10 };
}

/**
 * The arrangement fields of version 5 as a new sheet (and an older one read as version 5) has
 * them: nothing beside the circuit, its runs touching in a horizontal row, no ducts, no backfill.
 * The duct and backfill sizes are only a starting point shown when the designer ticks them: a
 * 110 mm PVC duct of 100 mm bore, and a 0.6 m × 0.4 m bank of a sand-cement backfill of about
 * 1.0 K·m/W (common practice for LV trenches, from memory) — they count only once ticked.
 */
export function arrangementDefaults(): Pick<
  SheetInputs['installation'],
  'circuitSpacingM' | 'circuitRow' | 'otherCircuits' | 'transposed' | 'duct' | 'backfill'
> {
  return {
    circuitSpacingM: null,
    circuitRow: 'horizontal',
    otherCircuits: [],
    transposed: false,
    duct: { used: false, material: 'pvc', innerDiameterM: 0.1, outerDiameterM: 0.11 },
    backfill: { used: false, widthM: 0.6, heightM: 0.4, centreDepthM: null, resistivityKmPerW: 1.0 },
  };
}

/** A new other circuit as the form adds it: the same cable as the candidate, at no current yet. */
export function newOtherCircuit(): SheetOtherCircuit {
  return { label: '', currentA: 0, sameCable: true, externalDiameterM: null, lossWPerM: null };
}

/**
 * Defaults and where they come from (shown as help text beside each field: `DEFAULT_SOURCES`).
 * Optional values start as null so that the library assumes its own reference value and raises
 * the flag that says so — a default never hides as if the user had entered it.
 */
export function defaultSheetInputs(kind: InstallationKind = 'cable-in-air'): SheetInputs {
  return {
    schemaVersion: SHEET_SCHEMA_VERSION,
    circuit: {
      designCurrentA: 400,
      nominalVoltageV: 230,
      phases: 3,
      frequencyHz: 50,
      lengthM: 50,
      powerFactor: 0.9,
      maxVoltageDropPercent: 4,
      reactanceOhmPerM: null,
    },
    fault: { checked: true, currentA: 25000, durationS: 0.4 },
    environment: { ambientC: null, windSpeedMPerS: 0, outdoorSun: false, irradianceWPerM2: 1000, solarAbsorptivity: null },
    // Three single-core cables in trefoil, touching, nothing beside them: the arrangement a designer
    // picks first for a three-phase feeder of single cores (common practice), rated as the group it is.
    installation: {
      kind,
      formation: 'trefoil',
      spacingM: null,
      ...arrangementDefaults(),
      depthM: 0.7,
      soilResistivityKmPerW: null,
      groundC: null,
      enclosureDerating: 0.8,
      enclosureInside: 'cable-in-air',
    },
    limits: { temperatureLimitC: null, raiseMaterialLimit: false, raiseJustification: '', groupingFactor: 1 },
    economics: {
      included: false,
      lossLoadFactor: 0.5,
      hoursPerYear: 8760,
      energyPricePerKWh: '0.15',
      discountRatePercent: 5,
      years: 25,
      loadGrowthPercent: 0,
      energyPriceGrowthPercent: 0,
    },
    overTime: { checked: false, overloadCurrentA: 600, overloadDurationS: 3600, dailyProfileA: [], faultWithCoverings: false },
    alongRun: { checked: false, lengthM: 6, startEnd: 'terminal', startTemperatureC: 70, endEnd: 'terminal', endTemperatureC: 70, joints: [] },
    enclosureAir: {
      checked: false,
      heightM: 2,
      widthM: 0.8,
      depthM: 0.6,
      backCovered: true,
      sidesCovered: 0,
      topCovered: false,
      wall: 'painted-steel',
      outsideAirC: 35,
      routeLengthInsideM: 2,
      otherLossesW: 0,
    },
    ...systemDefaults(),
    crossSection: crossSectionDefaults(),
    candidates: [],
    chosenCandidateId: null,
    notes: '',
  };
}

/** Help text: where each default comes from. Words of our own; sources as in physics.md / references.md. */
export const DEFAULT_SOURCES = {
  nominalVoltageV: '230 V line to neutral: the IEC 60038 low-voltage system 230/400 V (common practice).',
  frequencyHz: '50 Hz: the IEC 60038 system frequency in most of the world; use 60 Hz where it applies.',
  powerFactor: '0.9: a common design value for mixed loads (common practice); use the load’s own value.',
  maxVoltageDropPercent: '4 %: a usual design allowance for a feeder (IEC 60364-5-52 Annex G informative values, from memory); your local code decides.',
  reactanceOhmPerM: 'Left empty: 0.08 mΩ/m, the IEC 60364-5-52 Annex G value for cables (flagged; it is for cables, not bars).',
  fault: '25 kA for 0.4 s: a placeholder to replace with the prospective fault current at this point and the protective device’s clearing time (IEC 60364-4-41 gives 0.4 s for final circuits, from memory).',
  ambientC: 'Left empty: 30 °C in air for cables (IEC 60364-5-52 reference), 40 °C for bars in assemblies (IEC 61439-1 upper ambient); both from memory and flagged.',
  windSpeedMPerS: '0 m/s: still air, the cautious case. Wind cooling is credited only when you enter it, and it is flagged.',
  irradianceWPerM2: '1000 W/m²: full sun at the ground, the value IEC 60287-2-1 uses for cables in sun (from memory).',
  solarAbsorptivity: 'Left empty: 0.8, the highest value of IEC 60287-2-1 Table 4 (from memory, flagged).',
  depthM: '0.7 m: the reference laying depth of IEC 60364-5-52 tables (from memory).',
  soilResistivityKmPerW: 'Left empty: 2.5 K·m/W, the IEC 60364-5-52 reference soil (from memory, flagged). Measure the site when you can.',
  groundC: 'Left empty: 20 °C, the IEC 60364-5-52 reference ground temperature (from memory, flagged).',
  enclosureDerating: 'No default from a standard: enter the enclosure maker’s factor or your own assessment (flagged for review).',
  groupingFactor: '1: nothing else to allow for. The circuit’s own cables and the other circuits listed under the installation are computed; enter a factor (IEC 60364-5-52 Table B.52.17 or similar, flagged) only for circuits in air that no method here covers.',
  formation: 'Trefoil, touching: three single-core cables as a designer lays them first (common practice). The group is rated as it lies (IEC 60287-2-1: the free-air law of its arrangement, or superposition in the ground).',
  spacingM: 'Axis to axis, between the cables of this circuit. Left empty: touching.',
  circuitSpacingM: 'Centre to centre, between this circuit’s parallel runs and the other circuits, which lie in one row beside it. Left empty: touching.',
  otherCircuits: 'Circuits in the same trench or route heat this one. Same cable: solved at its own current; otherwise give one cable’s diameter and the heat it gives off at its current (from its own rating, flagged).',
  duct: '110 mm PVC duct of 100 mm bore as a starting point (common practice, from memory): enter the duct you lay. IEC 60287-2-1 §4.2.7 adds the air space and the wall.',
  backfill: '0.6 m × 0.4 m of sand-cement backfill, 1.0 K·m/W, as a starting point (common practice, from memory). Centre depth left empty: at the depth of the cable axis.',
  temperatureLimitC: 'Left empty: the limits of the candidate’s own insulation, coating or terminals govern.',
  lossLoadFactor: '0.5: a mid value; derive it from the load profile (IEC 60287-3-2 μ).',
  energyPricePerKWh: '0.15 per kWh: a placeholder; use the project’s tariff.',
  discountRatePercent: '5 %: a placeholder discount rate; use the client’s.',
  years: '25 years: a usual economic life for a feeder (common practice).',
  terminalTemperatureC: '70 °C: a placeholder for a device terminal; enter the device maker’s terminal temperature (IEC 61439-1 limits terminal rises to 70 K, from memory).',
  enclosureOutsideAirC: '35 °C: the highest 24-hour mean of the air around an assembly in IEC 61439-1 normal service conditions (from memory); enter the room’s own value.',
  enclosureWall: 'Painted sheet steel, k = 5.5 W/(m²·K); stainless steel 3.7, aluminium 12, plastic 3.5 (common-practice wall coefficients, from memory).',
  enclosureOtherLossesW: 'Left at 0 W: add the declared power losses of every device inside (the maker’s data, as IEC 61439-1 asks for the temperature-rise verification).',
  groundSurfaceCoefficientWPerM2K: '10 W/(m²·K): a still-air figure for bare ground to the air, convection and radiation together (common practice, from memory); wind raises it. The air is taken at the ground temperature.',
  jointResistanceMicroOhm: 'Left empty: 10 µΩ per joint, a pessimistic figure for an unmeasured bolted joint (common practice, flagged). Enter a measured value when you have one.',
} as const;

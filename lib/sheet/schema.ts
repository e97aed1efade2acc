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
 */
import { z } from 'zod';
import { sheetCandidateSchema } from './candidates';

export const SHEET_SCHEMA_VERSION = 4 as const;

const num = (label: string) => z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a finite number`);
const optionalNum = (label: string) => num(label).nullable();
const moneyText = (label: string) =>
  z
    .string()
    .trim()
    .regex(/^\d+(\.\d+)?$/, `${label} must be an amount such as 0.12`);

export const installationKinds = ['bar-on-edge', 'bar-flat', 'cable-in-air', 'buried', 'enclosure'] as const;
export type InstallationKind = (typeof installationKinds)[number];

export const circuitSchema = z.object({
  designCurrentA: num('Design current').gt(0, 'Design current must be greater than 0 A').max(20000, 'Design current must be at most 20 000 A'),
  /** U₀, line to neutral, V. */
  nominalVoltageV: num('Voltage U₀').gt(0, 'Voltage U₀ must be greater than 0 V').max(36000, 'Voltage U₀ must be at most 36 kV'),
  phases: z.union([z.literal(1), z.literal(3)], { error: 'Phases must be 1 or 3' }),
  frequencyHz: num('Frequency').min(0, 'Frequency must be 0 (DC) or more').max(1000, 'Frequency must be at most 1000 Hz'),
  lengthM: num('Route length').min(0, 'Route length must not be negative').max(100000, 'Route length must be at most 100 km'),
  powerFactor: num('Power factor').min(0, 'Power factor must be between 0 and 1').max(1, 'Power factor must be between 0 and 1'),
  maxVoltageDropPercent: optionalNum('Allowed voltage drop').refine((v) => v === null || (v > 0 && v <= 100), 'Allowed voltage drop must be between 0 and 100 %'),
  reactanceOhmPerM: optionalNum('Reactance').refine((v) => v === null || v >= 0, 'Reactance must not be negative'),
});

export const faultSchema = z.object({
  checked: z.boolean(),
  currentA: num('Fault current').gt(0, 'Fault current must be greater than 0 A'),
  durationS: num('Clearing time').gt(0, 'Clearing time must be greater than 0 s').max(60, 'Clearing time must be at most 60 s'),
});

export const environmentSchema = z.object({
  /** null: not entered (the library assumes its reference ambient and raises a flag). */
  ambientC: optionalNum('Ambient').refine((v) => v === null || (v >= -60 && v <= 200), 'Ambient must be between −60 and 200 °C'),
  windSpeedMPerS: num('Air speed').min(0, 'Air speed must not be negative').max(60, 'Air speed must be at most 60 m/s'),
  outdoorSun: z.boolean(),
  irradianceWPerM2: num('Sun irradiance').min(0, 'Sun irradiance must not be negative').max(1500, 'Sun irradiance must be at most 1500 W/m²'),
  /** null: not entered (assumed and flagged). */
  solarAbsorptivity: optionalNum('Solar absorptivity').refine((v) => v === null || (v >= 0 && v <= 1), 'Solar absorptivity must be between 0 and 1'),
});

export const installationSchema = z.object({
  kind: z.enum(installationKinds, { error: 'Choose an installation' }),
  formation: z.enum(['trefoil', 'flat']),
  /** Axis-to-axis spacing of the circuit's cables, m; null = touching. */
  spacingM: optionalNum('Cable spacing').refine((v) => v === null || v > 0, 'Cable spacing must be greater than 0'),
  depthM: num('Depth').gt(0, 'Depth must be greater than 0').max(20, 'Depth must be at most 20 m'),
  soilResistivityKmPerW: optionalNum('Soil thermal resistivity').refine((v) => v === null || (v >= 0.1 && v <= 20), 'Soil thermal resistivity must be between 0.1 and 20 K·m/W'),
  groundC: optionalNum('Ground temperature').refine((v) => v === null || (v >= -60 && v <= 200), 'Ground temperature must be between −60 and 200 °C'),
  enclosureDerating: num('Enclosure derating').gt(0, 'Enclosure derating must be greater than 0').max(1, 'Enclosure derating must be at most 1'),
  enclosureInside: z.enum(['cable-in-air', 'bar-on-edge', 'bar-flat']),
});

export const limitsSchema = z.object({
  /** A limit of the user's own (a joint, a neighbouring device), °C; null = material limits only. */
  temperatureLimitC: optionalNum('Own temperature limit').refine((v) => v === null || (v > -50 && v <= 1000), 'Own temperature limit must be between −50 and 1000 °C'),
  raiseMaterialLimit: z.boolean(),
  groupingFactor: num('Grouping factor').gt(0, 'Grouping factor must be greater than 0').max(1, 'Grouping factor must be at most 1'),
});

export const economicsSchema = z.object({
  included: z.boolean(),
  lossLoadFactor: num('Loss load factor').min(0, 'Loss load factor must be between 0 and 1').max(1, 'Loss load factor must be between 0 and 1'),
  hoursPerYear: num('Hours per year').min(0, 'Hours per year must not be negative').max(8784, 'Hours per year must be at most 8784'),
  energyPricePerKWh: moneyText('Energy price'),
  discountRatePercent: num('Discount rate').gt(-100).lt(100, 'Discount rate must be under 100 %'),
  years: num('Years').int('Years must be a whole number').min(0).max(200, 'Years must be at most 200'),
  loadGrowthPercent: num('Load growth').gt(-100).lt(100, 'Load growth must be under 100 %'),
  energyPriceGrowthPercent: num('Energy price growth').gt(-100).lt(100, 'Energy price growth must be under 100 %'),
});

/** Allowed numbers of equal intervals in a day's load profile (hourly or finer, dividing the day). */
export const DAILY_PROFILE_LENGTHS = [24, 48, 96, 144, 288, 1440] as const;

export const overTimeSchema = z.object({
  checked: z.boolean(),
  overloadCurrentA: num('Overload current').gt(0, 'Overload current must be greater than 0 A').max(100000, 'Overload current must be at most 100 kA'),
  overloadDurationS: num('Overload duration').gt(0, 'Overload duration must be greater than 0').max(7 * 86400, 'Overload duration must be at most a week'),
  /** Currents per phase over one day in equal intervals from midnight, A; empty = no daily check. */
  dailyProfileA: z
    .array(num('Daily load current').min(0, 'Daily load currents must not be negative').max(100000, 'Daily load currents must be at most 100 kA'))
    .refine((v) => v.length === 0 || (DAILY_PROFILE_LENGTHS as readonly number[]).includes(v.length), `A daily profile has ${DAILY_PROFILE_LENGTHS.join(', ')} values (hourly or finer)`),
  /** Fault heating with heat into the coverings, beside the adiabatic figure (uses the fault inputs). */
  faultWithCoverings: z.boolean(),
});

export const runEndKinds = ['terminal', 'insulated'] as const;
export const alongRunSchema = z.object({
  checked: z.boolean(),
  lengthM: num('Run length').gt(0, 'Run length must be greater than 0 m').max(1000, 'Run length must be at most 1000 m'),
  startEnd: z.enum(runEndKinds),
  startTemperatureC: num('Start terminal temperature').min(-60, 'Terminal temperature must be at least −60 °C').max(300, 'Terminal temperature must be at most 300 °C'),
  endEnd: z.enum(runEndKinds),
  endTemperatureC: num('End terminal temperature').min(-60, 'Terminal temperature must be at least −60 °C').max(300, 'Terminal temperature must be at most 300 °C'),
  joints: z
    .array(
      z.object({
        positionM: num('Joint position').min(0, 'Joint position must not be negative'),
        /** µΩ; null = not entered (a default is assumed and flagged). */
        resistanceMicroOhm: optionalNum('Joint resistance').refine((v) => v === null || (v >= 0 && v <= 10000), 'Joint resistance must be between 0 and 10 000 µΩ'),
      }),
    )
    .max(50, 'At most 50 joints on one run'),
});

export const enclosureWalls = ['painted-steel', 'stainless-steel', 'aluminium', 'plastic'] as const;
const enclosureLength = (label: string) => num(label).gt(0, `${label} must be greater than 0 m`).max(10, `${label} must be at most 10 m`);
export const enclosureAirSchema = z.object({
  checked: z.boolean(),
  heightM: enclosureLength('Enclosure height'),
  widthM: enclosureLength('Enclosure width'),
  depthM: enclosureLength('Enclosure depth'),
  backCovered: z.boolean(),
  sidesCovered: z.union([z.literal(0), z.literal(1), z.literal(2)], { error: 'Covered sides must be 0, 1 or 2' }),
  topCovered: z.boolean(),
  wall: z.enum(enclosureWalls),
  outsideAirC: num('Air around the enclosure').min(-60, 'Air around the enclosure must be at least −60 °C').max(100, 'Air around the enclosure must be at most 100 °C'),
  routeLengthInsideM: num('Route length inside').min(0, 'Route length inside must not be negative').max(100, 'Route length inside must be at most 100 m'),
  otherLossesW: num('Other losses inside').min(0, 'Other losses inside must not be negative').max(100000, 'Other losses inside must be at most 100 kW'),
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
  });

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
  if (version === 2 || version === 3) {
    // Versions 3 and 4 only added optional checks (over time, along the run; the enclosure air):
    // a sheet stored before them reads with them unchecked.
    const defaults = defaultSheetInputs();
    const added = version === 2 ? { overTime: defaults.overTime, alongRun: defaults.alongRun, enclosureAir: defaults.enclosureAir } : { enclosureAir: defaults.enclosureAir };
    const parsed = sheetInputsSchema.safeParse({ ...(raw as object), schemaVersion: SHEET_SCHEMA_VERSION, ...added });
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

// ───────────────────────────── defaults ─────────────────────────────

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
    installation: {
      kind,
      formation: 'trefoil',
      spacingM: null,
      depthM: 0.7,
      soilResistivityKmPerW: null,
      groundC: null,
      enclosureDerating: 0.8,
      enclosureInside: 'cable-in-air',
    },
    limits: { temperatureLimitC: null, raiseMaterialLimit: false, groupingFactor: 1 },
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
  groupingFactor: '1: no other circuits nearby. Enter a factor from IEC 60364-5-52 Table B.52.17 (or similar) when grouped (flagged).',
  temperatureLimitC: 'Left empty: the limits of the candidate’s own insulation, coating or terminals govern.',
  lossLoadFactor: '0.5: a mid value; derive it from the load profile (IEC 60287-3-2 μ).',
  energyPricePerKWh: '0.15 per kWh: a placeholder; use the project’s tariff.',
  discountRatePercent: '5 %: a placeholder discount rate; use the client’s.',
  years: '25 years: a usual economic life for a feeder (common practice).',
  terminalTemperatureC: '70 °C: a placeholder for a device terminal; enter the device maker’s terminal temperature (IEC 61439-1 limits terminal rises to 70 K, from memory).',
  enclosureOutsideAirC: '35 °C: the highest 24-hour mean of the air around an assembly in IEC 61439-1 normal service conditions (from memory); enter the room’s own value.',
  enclosureWall: 'Painted sheet steel, k = 5.5 W/(m²·K); stainless steel 3.7, aluminium 12, plastic 3.5 (common-practice wall coefficients, from memory).',
  enclosureOtherLossesW: 'Left at 0 W: add the declared power losses of every device inside (the maker’s data, as IEC 61439-1 asks for the temperature-rise verification).',
  jointResistanceMicroOhm: 'Left empty: 10 µΩ per joint, a pessimistic figure for an unmeasured bolted joint (common practice, flagged). Enter a measured value when you have one.',
} as const;

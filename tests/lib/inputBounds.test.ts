// lib/inputBounds: one table of input ranges, read by the sheet, the calculation API, the schedule
// upload and the catalogue, and by the library's checkBound. The references here are the
// definitions of the quantities (a power factor lies in [0, 1], a leap year has 366 × 24 = 8784 h)
// and the decision recorded in the table (one 100 kA current cap, issue 16); every edge is probed
// just inside and just outside each end of each range, so an edge with a number of its own fails.
import { describe, expect, it } from 'vitest';
import { ampacityConditionsSchema, conditionsSchema, EXAMPLE_EVALUATE_REQUEST } from '@/lib/api';
import { conductorRowSchema, coveringRowSchema } from '@/lib/catalogue';
import { STANDARD_CONDUCTORS, STANDARD_COVERINGS } from '@/lib/catalogue/standardData';
import { ElectricalInputError } from '@/lib/electrical/errors';
import { checkBound, checkOptionalBound, describeBound, INPUT_BOUNDS, MAX_CIRCUIT_CURRENT_A, withinBound, type BoundName, type InputBound } from '@/lib/inputBounds';
import { normaliseHeader, scheduleRowSchema, SCHEDULE_COLUMNS } from '@/lib/schedule';
import { defaultSheetInputs, sheetInputsSchema, type SheetInputs } from '@/lib/sheet';

/** Values on both sides of both ends of a range (relative step 1e-9, at least 1e-9 absolute). */
function probes(bound: InputBound): number[] {
  const step = (v: number) => Math.max(Math.abs(v) * 1e-9, 1e-9);
  return [bound.min - step(bound.min), bound.min, bound.min + step(bound.min), bound.max - step(bound.max), bound.max, bound.max + step(bound.max)];
}

/** A probe written out in full as a person or a spreadsheet writes it: the number parser (lib/units/parse) takes no exponent forms. */
const written = (v: number) => v.toLocaleString('en-US', { useGrouping: false, maximumFractionDigits: 20 });

function setIn<T>(value: T, path: string, v: unknown): T {
  const copy = structuredClone(value) as Record<string, unknown>;
  const keys = path.split('.');
  let at = copy;
  for (const key of keys.slice(0, -1)) at = at[key] as Record<string, unknown>;
  at[keys.at(-1)!] = v;
  return copy as T;
}

function issuesAt(result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[] }> } }, path: string): number {
  return result.success ? 0 : result.error!.issues.filter((i) => i.path.join('.') === path).length;
}

describe('the table', () => {
  it('one current cap of 100 kA for the design current, an overload and a daily load (issue 16 decision)', () => {
    expect(MAX_CIRCUIT_CURRENT_A).toBe(100_000);
    for (const name of ['designCurrentA', 'overloadCurrentA', 'dailyLoadCurrentA'] as const) expect(INPUT_BOUNDS[name].max).toBe(100_000);
  });

  it('ranges fixed by definition', () => {
    // cos φ, a share of sunlight, emissivity, derating factors: [0, 1] or (0, 1].
    for (const name of ['powerFactor', 'solarAbsorptivity', 'emissivity', 'lossLoadFactor'] as const) expect([INPUT_BOUNDS[name].min, INPUT_BOUNDS[name].max]).toEqual([0, 1]);
    for (const name of ['groupingFactor', 'enclosureDerating'] as const) expect(INPUT_BOUNDS[name]).toMatchObject({ min: 0, minExclusive: true, max: 1 });
    expect(INPUT_BOUNDS.hoursPerYear.max).toBe(366 * 24);
    // Frequency 0 is DC, which the sheet and the library accept.
    expect(withinBound(INPUT_BOUNDS.frequencyHz, 0)).toBe(true);
  });

  it('every bound is a proper range with a label and a stated basis', () => {
    for (const [name, b] of Object.entries(INPUT_BOUNDS) as [BoundName, InputBound][]) {
      expect(b.min, name).toBeLessThan(b.max);
      expect(b.label.length, name).toBeGreaterThan(1);
      expect(b.basis.length, name).toBeGreaterThan(10);
    }
  });
});

describe('checkBound (for the library: validate where data enters it)', () => {
  it('returns the value inside the range, at both ends included', () => {
    expect(checkBound('frequencyHz', 0)).toBe(0);
    expect(checkBound('frequencyHz', 1000)).toBe(1000);
    expect(checkBound('years', 25)).toBe(25);
  });

  it('throws ElectricalInputError naming the field, by default the bound name, or the dotted path given', () => {
    const thrown = (f: () => unknown) => {
      try {
        f();
      } catch (error) {
        return error;
      }
      throw new Error('expected a refusal');
    };
    const e1 = thrown(() => checkBound('frequencyHz', 1200)) as ElectricalInputError;
    expect(e1).toBeInstanceOf(ElectricalInputError);
    expect(e1.field).toBe('frequencyHz');
    expect(e1.message).toBe('frequencyHz: must be at least 0 Hz and at most 1000 Hz (got 1200)');
    const e2 = thrown(() => checkBound('designCurrentA', 0, 'conditions.designCurrentA')) as ElectricalInputError;
    expect(e2.field).toBe('conditions.designCurrentA');
    expect(e2.message).toBe('conditions.designCurrentA: must be greater than 0 A and at most 100000 A (got 0)');
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, '50', null, undefined]) {
      const e = thrown(() => checkBound('frequencyHz', bad)) as ElectricalInputError;
      expect(e.message).toBe(`frequencyHz: must be a finite number (got ${String(bad)})`);
    }
    expect((thrown(() => checkBound('years', 2.5)) as ElectricalInputError).message).toBe('years: must be a whole number from 0 to 200 years (got 2.5)');
  });

  it('checkOptionalBound lets an absent value through as undefined, and checks a present one', () => {
    expect(checkOptionalBound('groupingFactor', undefined)).toBeUndefined();
    expect(checkOptionalBound('groupingFactor', null)).toBeUndefined();
    expect(checkOptionalBound('groupingFactor', 0.8)).toBe(0.8);
    expect(() => checkOptionalBound('groupingFactor', 0)).toThrow(ElectricalInputError);
  });

  it('describes ranges in words', () => {
    expect(describeBound(INPUT_BOUNDS.ambientC)).toBe('at least -60 °C and at most 200 °C');
    expect(describeBound(INPUT_BOUNDS.barsPerPhase)).toBe('a whole number from 1 to 20');
  });
});

describe('every edge reads the same ranges', () => {
  // [bound, field of the sheet inputs, field of the API conditions, header of the schedule column]
  const FIELDS: Array<[BoundName, string | null, string | null, string | null]> = [
    ['designCurrentA', 'circuit.designCurrentA', 'designCurrentA', 'design current (A)'],
    ['nominalVoltageV', 'circuit.nominalVoltageV', 'nominalVoltageV', 'voltage U0 (V)'],
    ['frequencyHz', 'circuit.frequencyHz', 'frequencyHz', 'frequency (Hz)'],
    ['lengthM', 'circuit.lengthM', 'lengthM', 'length (m)'],
    ['powerFactor', 'circuit.powerFactor', 'powerFactor', 'power factor'],
    ['maxVoltageDropPercent', 'circuit.maxVoltageDropPercent', 'maxVoltageDropPercent', 'max voltage drop (%)'],
    ['reactanceOhmPerM', 'circuit.reactanceOhmPerM', 'reactanceOhmPerM', null],
    ['faultCurrentA', 'fault.currentA', 'fault.currentA', null],
    ['faultDurationS', 'fault.durationS', 'fault.durationS', 'clearing time (s)'],
    ['ambientC', 'environment.ambientC', 'ambientC', 'ambient (°C)'],
    ['windSpeedMPerS', 'environment.windSpeedMPerS', 'windSpeedMPerS', null],
    ['irradianceWPerM2', 'environment.irradianceWPerM2', null, null],
    ['solarAbsorptivity', 'environment.solarAbsorptivity', null, null],
    ['spacingM', 'installation.spacingM', 'installation.spacingM', null],
    ['depthM', 'installation.depthM', null, null],
    ['soilResistivityKmPerW', 'installation.soilResistivityKmPerW', null, null],
    ['groundC', 'installation.groundC', null, null],
    ['enclosureDerating', 'installation.enclosureDerating', null, null],
    // The cross-section of sheet version 5 (issue 17).
    ['circuitSpacingM', 'installation.circuitSpacingM', 'installation.circuitSpacingM', null],
    ['ductInnerDiameterM', 'installation.duct.innerDiameterM', null, null],
    ['backfillWidthM', 'installation.backfill.widthM', null, null],
    ['backfillResistivityKmPerW', 'installation.backfill.resistivityKmPerW', null, null],
    ['temperatureLimitC', 'limits.temperatureLimitC', 'temperatureLimitC', 'temperature limit (°C)'],
    ['groupingFactor', 'limits.groupingFactor', 'groupingFactor', 'grouping factor'],
    ['surfaceCoefficientWPerM2K', null, 'surfaceCoefficientWPerM2K', null],
    ['lossLoadFactor', 'economics.lossLoadFactor', null, null],
    ['hoursPerYear', 'economics.hoursPerYear', null, null],
    ['discountRatePercent', 'economics.discountRatePercent', null, null],
    ['years', 'economics.years', null, null],
    ['overloadCurrentA', 'overTime.overloadCurrentA', null, null],
    ['overloadDurationS', 'overTime.overloadDurationS', null, null],
    ['runLengthM', 'alongRun.lengthM', null, null],
    ['terminalTemperatureC', 'alongRun.startTemperatureC', null, null],
    ['enclosureSizeM', 'enclosureAir.heightM', null, null],
    ['enclosureOutsideAirC', 'enclosureAir.outsideAirC', null, null],
    ['otherLossesW', 'enclosureAir.otherLossesW', null, null],
  ];

  const sheet: SheetInputs = defaultSheetInputs('cable-in-air');
  const api = structuredClone(EXAMPLE_EVALUATE_REQUEST.conditions);

  it.each(FIELDS.filter((f) => f[1] !== null))('sheet: %s at %s', (name, path) => {
    for (const v of probes(INPUT_BOUNDS[name])) {
      expect(issuesAt(sheetInputsSchema.safeParse(setIn(sheet, path!, v)), path!) === 0, `${path} = ${v}`).toBe(withinBound(INPUT_BOUNDS[name], v));
    }
  });

  it.each(FIELDS.filter((f) => f[2] !== null))('API: %s (sheet %s, API %s)', (name, _sheet, path) => {
    for (const v of probes(INPUT_BOUNDS[name])) {
      const body = path!.startsWith('installation.') ? { ...api, installation: { kind: 'cable-in-air', [path!.split('.')[1]]: v } } : path!.startsWith('fault.') ? setIn({ ...api, fault: { currentA: 1000, durationS: 0.2 } }, path!, v) : setIn(api, path!, v);
      expect(issuesAt(conditionsSchema.safeParse(body), path!) === 0, `${path} = ${v}`).toBe(withinBound(INPUT_BOUNDS[name], v));
    }
  });

  const scheduleFields = FIELDS.filter((f) => f[3] !== null);
  const good: Record<string, unknown> = {
    circuitTag: 'F-1', from: '', to: '', designCurrentA: '120', nominalVoltageV: '230', phases: '3', frequencyHz: '', lengthM: '35', powerFactor: '0.9',
    installation: 'cable in air', depthM: '', ambientC: '', faultCurrentKA: '', clearingTimeS: '', family: 'copper', maxVoltageDropPercent: '', maxParallel: '',
    temperatureLimitC: '', groupingFactor: '',
  };
  it.each(scheduleFields)('schedule: %s', (name, _sheet, _api, header) => {
    const column = SCHEDULE_COLUMNS.find((c) => normaliseHeader(c.header) === normaliseHeader(header))!;
    for (const v of probes(INPUT_BOUNDS[name])) {
      const row = { ...good, [column.field]: written(v), ...(column.field === 'clearingTimeS' ? { faultCurrentKA: '10' } : {}) };
      expect(issuesAt(scheduleRowSchema.safeParse(row), column.field) === 0, `${header} = ${v}`).toBe(withinBound(INPUT_BOUNDS[name], v));
    }
  });

  it('schedule: the fault current in kA is the table’s range in A divided by 1000', () => {
    const bound = INPUT_BOUNDS.faultCurrentA;
    for (const v of probes(bound)) {
      const row = { ...good, faultCurrentKA: written(v / 1000), clearingTimeS: '0.2' };
      expect(issuesAt(scheduleRowSchema.safeParse(row), 'faultCurrentKA') === 0, `${v} A`).toBe(withinBound(bound, v));
    }
  });

  it('API: the ampacity endpoint takes any current from 0 A up to the cap (the design current does not enter it)', () => {
    for (const v of probes(INPUT_BOUNDS.currentA)) {
      const body = { ...api, designCurrentA: v };
      expect(issuesAt(ampacityConditionsSchema.safeParse(body), 'designCurrentA') === 0, `designCurrentA = ${v}`).toBe(withinBound(INPUT_BOUNDS.currentA, v));
    }
    expect(ampacityConditionsSchema.safeParse({ ...api, designCurrentA: undefined }).success).toBe(true);
  });

  it('catalogue: resistance, diameter, width and covering limits never exceed what the library takes (Ω/km and mm are ×1000 of SI)', () => {
    const conductor = STANDARD_CONDUCTORS.find((c) => c.shape === 'round')!;
    const covering = STANDARD_COVERINGS.find((c) => c.continuousLimitC !== null && c.shortCircuitLimitC !== null)!;
    const cases: Array<[InputBound, (v: number) => { success: boolean; error?: { issues: Array<{ path: PropertyKey[] }> } }, string, number]> = [
      [INPUT_BOUNDS.r20OhmPerM, (v) => conductorRowSchema.safeParse({ ...conductor, r20OhmPerKm: String(v) }), 'r20OhmPerKm', 1000],
      [INPUT_BOUNDS.conductorDiameterM, (v) => conductorRowSchema.safeParse({ ...conductor, diameterMm: String(v) }), 'diameterMm', 1000],
      [INPUT_BOUNDS.continuousLimitC, (v) => coveringRowSchema.safeParse({ ...covering, continuousLimitC: String(v), shortCircuitLimitC: null }), 'continuousLimitC', 1],
      [INPUT_BOUNDS.shortCircuitLimitC, (v) => coveringRowSchema.safeParse({ ...covering, continuousLimitC: null, shortCircuitLimitC: String(v) }), 'shortCircuitLimitC', 1],
    ];
    for (const [bound, parse, field, perSi] of cases) {
      for (const v of probes(bound)) expect(issuesAt(parse(v * perSi), field) === 0, `${field} = ${v * perSi}`).toBe(withinBound(bound, v));
    }
  });
});

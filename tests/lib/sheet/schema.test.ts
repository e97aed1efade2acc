import { describe, expect, it } from 'vitest';
import {
  defaultSheetInputs,
  readSheetInputs,
  SHEET_SCHEMA_VERSION,
  SheetSchemaError,
  sheetInputsSchema,
  toConditions,
  type SheetInputs,
} from '@/lib/sheet';
import { demoSheets } from '@/db/seed/sheets';

const cable = demoSheets()[1].inputs.candidates[0];

function valid(): SheetInputs {
  return { ...defaultSheetInputs('cable-in-air'), candidates: [cable], chosenCandidateId: cable.id };
}

function issuePaths(value: unknown): string[] {
  const parsed = sheetInputsSchema.safeParse(value);
  return parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'));
}

describe('sheet input schema', () => {
  it('accepts the defaults of every installation and the demo sheets', () => {
    for (const kind of ['bar-on-edge', 'bar-flat', 'cable-in-air', 'buried', 'enclosure'] as const) {
      expect(sheetInputsSchema.safeParse(defaultSheetInputs(kind)).success).toBe(true);
    }
    for (const demo of demoSheets()) expect(issuePaths(demo.inputs)).toEqual([]);
  });

  it('names the field at fault', () => {
    const v = valid();
    expect(issuePaths({ ...v, circuit: { ...v.circuit, designCurrentA: 0 } })).toEqual(['circuit.designCurrentA']);
    expect(issuePaths({ ...v, circuit: { ...v.circuit, powerFactor: 1.2 } })).toEqual(['circuit.powerFactor']);
    expect(issuePaths({ ...v, circuit: { ...v.circuit, phases: 2 } })).toEqual(['circuit.phases']);
    expect(issuePaths({ ...v, fault: { ...v.fault, durationS: -1 } })).toEqual(['fault.durationS']);
    expect(issuePaths({ ...v, installation: { ...v.installation, enclosureDerating: 1.5 } })).toEqual(['installation.enclosureDerating']);
    expect(issuePaths({ ...v, economics: { ...v.economics, energyPricePerKWh: '12,5' } })).toEqual(['economics.energyPricePerKWh']);
    expect(issuePaths({ ...v, candidates: [{ ...cable, parallel: 1.5 }] })).toEqual(['candidates.0.parallel']);
  });

  it('refuses inconsistent sheets: a chosen candidate not on the sheet, duplicate ids, sun on a buried cable, a raised limit without a value', () => {
    const v = valid();
    expect(issuePaths({ ...v, chosenCandidateId: 'nope' })).toEqual(['chosenCandidateId']);
    expect(issuePaths({ ...v, candidates: [cable, cable] })).toEqual(['candidates.1.id']);
    const buried = { ...v, installation: { ...v.installation, kind: 'buried' }, environment: { ...v.environment, outdoorSun: true } };
    expect(issuePaths(buried)).toEqual(['environment.outdoorSun']);
    expect(issuePaths({ ...v, limits: { ...v.limits, raiseMaterialLimit: true, temperatureLimitC: null } })).toEqual(['limits.temperatureLimitC']);
  });

  it('leaves values that were not entered out of the conditions, so the library assumes and flags them', () => {
    const conditions = toConditions(valid());
    expect(conditions.ambientC).toBeUndefined();
    expect(conditions.reactanceOhmPerM).toBeUndefined();
    expect(conditions.solar).toBeUndefined();
    expect(conditions.economics).toBeUndefined();
    const entered = valid();
    entered.environment = { ...entered.environment, ambientC: 35, outdoorSun: true, irradianceWPerM2: 1000, solarAbsorptivity: 0.5 };
    expect(toConditions(entered)).toMatchObject({ ambientC: 35, solar: { irradianceWPerM2: 1000, absorptivity: 0.5 } });
  });

  it('gives a buried cable the ground temperature, not the air ambient', () => {
    const v = defaultSheetInputs('buried');
    v.environment.ambientC = 40;
    v.installation.groundC = 15;
    const conditions = toConditions(v);
    expect(conditions.ambientC).toBeUndefined();
    expect(conditions.installation).toMatchObject({ kind: 'buried', groundC: 15, depthM: 0.7 });
  });
});

describe('migrate on read', () => {
  const v1 = {
    schemaVersion: 1,
    designCurrentA: 630,
    voltageV: 230,
    phases: 3,
    frequencyHz: 60,
    lengthM: 85,
    powerFactor: 0.92,
    faultCurrentA: null,
    faultDurationS: null,
    ambientC: null,
    windSpeedMPerS: 1.5,
    sunIrradianceWPerM2: 0,
    installation: { kind: 'enclosure', deratingFactor: 0.7 },
    candidates: [cable],
    chosenCandidateId: cable.id,
  };

  it('reads a version-1 sheet as the current version without losing an entered value', () => {
    const read = readSheetInputs(v1, 1);
    expect(read.schemaVersion).toBe(SHEET_SCHEMA_VERSION);
    expect(read.circuit).toMatchObject({ designCurrentA: 630, nominalVoltageV: 230, phases: 3, frequencyHz: 60, lengthM: 85, powerFactor: 0.92 });
    expect(read.fault.checked).toBe(false);
    expect(read.environment).toMatchObject({ ambientC: null, windSpeedMPerS: 1.5, outdoorSun: false });
    expect(read.installation).toMatchObject({ kind: 'enclosure', enclosureDerating: 0.7, enclosureInside: 'cable-in-air' });
    expect(read.economics.included).toBe(false);
    expect(read.candidates).toEqual([cable]);
    expect(read.chosenCandidateId).toBe(cable.id);
    expect(sheetInputsSchema.safeParse(read).success).toBe(true);
  });

  it('takes the version from the row when the JSON has none', () => {
    const { schemaVersion: _omitted, ...bare } = v1;
    expect(readSheetInputs(bare, 1).circuit.designCurrentA).toBe(630);
  });

  it('reads the current version unchanged, and refuses unknown or broken versions with a plain error', () => {
    const current = valid();
    expect(readSheetInputs(JSON.parse(JSON.stringify(current)), 2)).toEqual(current);
    expect(() => readSheetInputs({ ...current, schemaVersion: 99 }, 99)).toThrow(SheetSchemaError);
    expect(() => readSheetInputs({ ...v1, voltageV: 'high' }, 1)).toThrow(/version 1/);
  });
});

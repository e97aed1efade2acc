/** Sheet inputs versions 3 and 4: the optional checks beyond the steady state, and migrate-on-read of versions 2 and 3. */
import { describe, expect, it } from 'vitest';
import { defaultSheetInputs, readSheetInputs, SHEET_SCHEMA_VERSION, sheetInputsSchema } from '@/lib/sheet/schema';

describe('sheet inputs versions 3 and 4', () => {
  it('a version-2 sheet reads as the current version with every optional check unchecked and nothing else changed', () => {
    const current = defaultSheetInputs('bar-on-edge');
    const { overTime: _o, alongRun: _a, enclosureAir: _e, ...rest } = current;
    const v2 = { ...rest, schemaVersion: 2, notes: 'kept' };
    const read = readSheetInputs(JSON.parse(JSON.stringify(v2)), 2);
    expect(SHEET_SCHEMA_VERSION).toBe(7); // version 6 (issues 18, 21) and 7 (issue 20) read older versions as below
    expect(read.schemaVersion).toBe(SHEET_SCHEMA_VERSION);
    expect(read.overTime.checked).toBe(false);
    expect(read.alongRun.checked).toBe(false);
    expect(read.enclosureAir.checked).toBe(false);
    expect(read.notes).toBe('kept');
    expect(read.circuit).toEqual(current.circuit);
  });

  it('a version-3 sheet keeps its checks over time and along the run and gains the enclosure check unchecked', () => {
    const current = defaultSheetInputs('bar-on-edge');
    const { enclosureAir: _e, ...rest } = current;
    const v3 = { ...rest, schemaVersion: 3, overTime: { ...current.overTime, checked: true, overloadCurrentA: 750 } };
    const read = readSheetInputs(JSON.parse(JSON.stringify(v3)), 3);
    expect(read.schemaVersion).toBe(SHEET_SCHEMA_VERSION);
    expect(read.overTime).toEqual({ ...current.overTime, checked: true, overloadCurrentA: 750 });
    expect(read.enclosureAir).toEqual(current.enclosureAir);
    expect(read.enclosureAir.checked).toBe(false);
  });

  it('refuses enclosure inputs out of range, naming the field', () => {
    const v = defaultSheetInputs('bar-on-edge');
    const flat = sheetInputsSchema.safeParse({ ...v, enclosureAir: { ...v.enclosureAir, depthM: 0 } });
    expect(flat.success).toBe(false);
    expect(flat.error!.issues[0].path.join('.')).toBe('enclosureAir.depthM');
    const sides = sheetInputsSchema.safeParse({ ...v, enclosureAir: { ...v.enclosureAir, sidesCovered: 3 } });
    expect(sides.success).toBe(false);
    expect(sides.error!.issues[0].path.join('.')).toBe('enclosureAir.sidesCovered');
  });

  it('refuses a daily profile that is not hourly or finer, and a joint off the run, naming the field', () => {
    const v = defaultSheetInputs('bar-on-edge');
    const badProfile = sheetInputsSchema.safeParse({ ...v, overTime: { ...v.overTime, dailyProfileA: [100, 200, 300] } });
    expect(badProfile.success).toBe(false);
    expect(badProfile.error!.issues[0].path.join('.')).toBe('overTime.dailyProfileA');
    const offRun = sheetInputsSchema.safeParse({ ...v, alongRun: { ...v.alongRun, lengthM: 2, joints: [{ positionM: 3, resistanceMicroOhm: null }] } });
    expect(offRun.success).toBe(false);
    expect(offRun.error!.issues[0].path.join('.')).toBe('alongRun.joints.0.positionM');
    const hourly = sheetInputsSchema.safeParse({ ...v, overTime: { ...v.overTime, dailyProfileA: Array(24).fill(400) } });
    expect(hourly.success).toBe(true);
  });
});

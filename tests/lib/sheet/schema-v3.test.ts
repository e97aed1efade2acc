/** Sheet inputs version 3: the optional checks beyond the steady state, and migrate-on-read of version 2. */
import { describe, expect, it } from 'vitest';
import { defaultSheetInputs, readSheetInputs, SHEET_SCHEMA_VERSION, sheetInputsSchema } from '@/lib/sheet/schema';

describe('sheet inputs version 3', () => {
  it('a version-2 sheet reads as version 3 with both checks unchecked and nothing else changed', () => {
    const current = defaultSheetInputs('bar-on-edge');
    const { overTime: _o, alongRun: _a, ...rest } = current;
    const v2 = { ...rest, schemaVersion: 2, notes: 'kept' };
    const read = readSheetInputs(JSON.parse(JSON.stringify(v2)), 2);
    expect(SHEET_SCHEMA_VERSION).toBe(3);
    expect(read.schemaVersion).toBe(3);
    expect(read.overTime.checked).toBe(false);
    expect(read.alongRun.checked).toBe(false);
    expect(read.notes).toBe('kept');
    expect(read.circuit).toEqual(current.circuit);
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

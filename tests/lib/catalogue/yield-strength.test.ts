// The bar's 0.2 % proof strength R_p0.2 in the catalogue (issue 18, IEC 60865-1 stress check):
// stored in N/mm² with its source, refused outside the range the force check takes (1 … 1000
// N/mm², lib/electrical/busbar/forces.ts), for round conductors, and without a source; carried to
// the candidate in Pa (1 N/mm² = 10⁶ Pa by definition of the units) and used by the force check.
import { describe, expect, it } from 'vitest';
import { barToCandidate, CATALOGUE_COLUMNS, conductorRowSchema, ROW_SCHEMAS } from '@/lib/catalogue';
import { recordToInput, validateRecords } from '@/lib/catalogue/files';
import { STANDARD_CONDUCTORS, STANDARD_MATERIALS } from '@/lib/catalogue/standardData';
import { evaluateCandidate, type Conditions } from '@/lib/electrical';

const issuesOf = (result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[]; message: string }> } }) =>
  (result.error?.issues ?? []).map((i) => `${i.path.join('.')}: ${i.message}`);

const withId = <T extends object>(row: T, id: string) => ({ ...row, id });
const material = (key: string) => withId(ROW_SCHEMAS.materials.parse(STANDARD_MATERIALS.find((m) => m.key === key)), `m-${key}`);
const bar = STANDARD_CONDUCTORS.find((c) => c.key === 'cu-bar-100x10')!;
const round = STANDARD_CONDUCTORS.find((c) => c.key === 'cu-240')!;

describe('the standard bars carry a proof strength with its source', () => {
  it('copper bars 180 N/mm² (Cu-ETP R240 half-hard, EN 13601 minimum, from memory); aluminium bars 70 N/mm² (EN AW-1350A half-hard, from memory)', () => {
    const copper = conductorRowSchema.parse(bar);
    expect(copper.yieldStrengthMpa).toBe('180');
    expect(copper.yieldStrengthSource).toMatch(/EN 13601.*from memory/);
    const aluminium = conductorRowSchema.parse(STANDARD_CONDUCTORS.find((c) => c.key === 'al-bar-100x10'));
    expect(aluminium.yieldStrengthMpa).toBe('70');
    expect(aluminium.yieldStrengthSource).toMatch(/1350A.*from memory/);
  });
  it('round conductors have none', () => {
    expect(conductorRowSchema.parse(round).yieldStrengthMpa).toBeNull();
  });
});

describe('refusals name the field', () => {
  it('outside 1 … 1000 N/mm² (the force check takes 10⁶ … 10⁹ Pa)', () => {
    expect(issuesOf(conductorRowSchema.safeParse({ ...bar, yieldStrengthMpa: '0.5' }))).toEqual(['yieldStrengthMpa: must be at least 1 and at most 1000 (got 0.5)']);
    expect(issuesOf(conductorRowSchema.safeParse({ ...bar, yieldStrengthMpa: '1001' }))).toEqual(['yieldStrengthMpa: must be at least 1 and at most 1000 (got 1001)']);
    expect(conductorRowSchema.safeParse({ ...bar, yieldStrengthMpa: '1' }).success).toBe(true);
    expect(conductorRowSchema.safeParse({ ...bar, yieldStrengthMpa: '1000' }).success).toBe(true);
  });
  it('on a round conductor, and without a source', () => {
    expect(issuesOf(conductorRowSchema.safeParse({ ...round, yieldStrengthMpa: '200', yieldStrengthSource: 'maker' }))[0]).toMatch(/^yieldStrengthMpa: applies to bars only/);
    expect(issuesOf(conductorRowSchema.safeParse({ ...bar, yieldStrengthMpa: '200', yieldStrengthSource: ' ' }))[0]).toMatch(/^yieldStrengthSource: is required with a proof strength/);
  });
  it('an empty cell is "not given"', () => {
    const row = conductorRowSchema.parse({ ...bar, yieldStrengthMpa: '', yieldStrengthSource: '' });
    expect(row.yieldStrengthMpa).toBeNull();
  });
});

describe('files: the column is optional, so older files import unchanged', () => {
  it('the conductor columns list it with its unit, and a file without it validates', () => {
    const headers = CATALOGUE_COLUMNS.conductors.map((c) => c.header);
    expect(headers).toContain('yield_strength_mpa');
    expect(headers).toContain('yield_strength_source');
    const values = Object.fromEntries(CATALOGUE_COLUMNS.conductors.filter((c) => !c.header.startsWith('yield_')).map((c) => [c.header, (bar as Record<string, unknown>)[c.field] ?? '']));
    const { rows, problems } = validateRecords('conductors', [{ row: 2, values }]);
    expect(problems).toEqual([]);
    expect(rows[0].value.yieldStrengthMpa).toBeNull();
    expect(recordToInput('conductors', { ...values, yield_strength_mpa: 250, yield_strength_source: 'certificate' }).yieldStrengthMpa).toBe('250');
  });
});

describe('to the candidate and the IEC 60865-1 check', () => {
  const conditions: Conditions = {
    designCurrentA: 1000,
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 10,
    powerFactor: 0.9,
    ambientC: 35,
    installation: { kind: 'bar-on-edge', system: { phaseSpacingM: 0.15, supportSpacingM: 0.5, supports: 'continuous-three-or-more-spans', rOverX: 0.1 } },
    fault: { currentA: 30000, durationS: 0.5 },
    temperatureLimitC: 90,
  };
  const candidateWith = (mpa: string | null) =>
    barToCandidate({ conductor: withId(conductorRowSchema.parse({ ...bar, yieldStrengthMpa: mpa ?? '', yieldStrengthSource: mpa ? 'maker’s certificate (test)' : '' }), 'c-bar'), material: material('copper') });

  it('N/mm² → Pa (× 10⁶), with the source among the notes', () => {
    const c = candidateWith('250');
    expect(c.yieldStrengthPa).toBe(250e6);
    expect(c.sourceNotes).toContain('100 × 10 mm R_p0.2: maker’s certificate (test)');
    expect(candidateWith(null).yieldStrengthPa).toBeUndefined();
  });

  it('the check uses it: σ_tot ≤ q·R_p0.2, so the stress ratio scales as 1/R_p0.2 (IEC 60865-1), and no default is flagged', () => {
    const at250 = evaluateCandidate(candidateWith('250'), conditions);
    const at180 = evaluateCandidate(candidateWith('180'), conditions);
    const none = evaluateCandidate(candidateWith(null), conditions);
    if (!at250.ok || !at180.ok || !none.ok) throw new Error('not evaluated');
    expect(at250.forces?.yieldStrengthPa).toBe(250e6);
    expect(at250.forces!.stressRatio / at180.forces!.stressRatio).toBeCloseTo(180 / 250, 12);
    expect(at250.flags.map((f) => f.code)).not.toContain('BUSBAR_YIELD_STRENGTH_DEFAULTED');
    // Without one the library's default per metal is used and flagged for review.
    expect(none.flags.map((f) => f.code)).toContain('BUSBAR_YIELD_STRENGTH_DEFAULTED');
  });
});

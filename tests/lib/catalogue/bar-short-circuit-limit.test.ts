// A bare bar's short-circuit temperature in the catalogue (issue 22, "checks that run"): the
// standard bars carry the IEC 60865-1 recommended 200 °C for bare copper and aluminium (from
// memory) with that source; a value is refused on a round conductor or without a source; the
// catalogue bar's check then runs with it whenever a fault is entered, and the final temperature
// is the IEC 60949 adiabatic one worked by hand:
//   θ_f = (θ_i + β)·exp(I²t / (K²S²)) − β, copper K = 226 A·s½/mm², β = 234.5 K (IEC 60949 Table 1, from memory).
import { describe, expect, it } from 'vitest';
import { barToCandidate, conductorRowSchema, ROW_SCHEMAS } from '@/lib/catalogue';
import { STANDARD_CONDUCTORS, STANDARD_MATERIALS } from '@/lib/catalogue/standardData';
import { evaluateCandidate, type Conditions } from '@/lib/electrical';

const issuesOf = (result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[]; message: string }> } }) =>
  (result.error?.issues ?? []).map((i) => `${i.path.join('.')}: ${i.message}`);
const withId = <T extends object>(row: T, id: string) => ({ ...row, id });
const copper = withId(ROW_SCHEMAS.materials.parse(STANDARD_MATERIALS.find((m) => m.key === 'copper')), 'm-copper');
const bar = STANDARD_CONDUCTORS.find((c) => c.key === 'cu-bar-100x10')!;
const round = STANDARD_CONDUCTORS.find((c) => c.key === 'cu-240')!;

describe('the standard bars carry a short-circuit limit with its source', () => {
  it('200 °C for copper and aluminium bars, citing IEC 60865-1 (from memory) and the supports', () => {
    for (const key of ['cu-bar-100x10', 'al-bar-60x10']) {
      const row = conductorRowSchema.parse(STANDARD_CONDUCTORS.find((c) => c.key === key));
      expect(row.shortCircuitLimitC).toBe('200');
      expect(row.shortCircuitLimitSource).toMatch(/IEC 60865-1.*from memory.*supports/);
    }
  });
  it('round conductors have none (their insulation carries it)', () => {
    expect(conductorRowSchema.parse(round).shortCircuitLimitC).toBeNull();
  });
  it('refused on a round conductor, and without a source, naming the field', () => {
    expect(issuesOf(conductorRowSchema.safeParse({ ...round, shortCircuitLimitC: '200', shortCircuitLimitSource: 'x' }))[0]).toMatch(/^shortCircuitLimitC: applies to bare bars only/);
    expect(issuesOf(conductorRowSchema.safeParse({ ...bar, shortCircuitLimitC: '180', shortCircuitLimitSource: '' }))[0]).toMatch(/^shortCircuitLimitSource: is required/);
  });
});

describe('the check runs for a catalogue bar whenever a fault is entered', () => {
  const conditions: Conditions = {
    designCurrentA: 1000,
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 400,
    lengthM: 10,
    powerFactor: 0.9,
    ambientC: 35,
    installation: { kind: 'bar-on-edge' },
    fault: { currentA: 50000, durationS: 1 },
    temperatureLimitC: 90,
  };
  const candidateWith = (limit: string | null) =>
    barToCandidate({
      conductor: withId(conductorRowSchema.parse({ ...bar, shortCircuitLimitC: limit ?? '', shortCircuitLimitSource: limit ? 'support maker’s data (test)' : '' }), 'c-bar'),
      material: copper,
    });

  it('the catalogue value is used, its source is among the notes, and no default is flagged', () => {
    const c = candidateWith('160');
    expect(c.shortCircuitLimitC).toBe(160);
    expect(c.sourceNotes).toContain('100 × 10 mm short-circuit limit: support maker’s data (test)');
    const r = evaluateCandidate(c, conditions);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.shortCircuit.checked).toBe(true);
    expect(r.shortCircuit.limitC).toBe(160);
    expect(r.flags.map((f) => f.code)).not.toContain('BAR_SHORT_CIRCUIT_LIMIT_DEFAULTED');
    expect(r.flags.map((f) => f.code)).not.toContain('SHORT_CIRCUIT_NOT_CHECKED');
  });

  it('θ_f of 100 × 10 mm copper, 50 kA for 1 s from the 90 °C limit, is the IEC 60949 adiabatic figure worked by hand (±0.3 K)', () => {
    const r = evaluateCandidate(candidateWith('200'), conditions);
    if (!r.ok) throw new Error(r.error.message);
    // I²t/(K²S²) = 50000²·1 / (226²·1000²) = 0.048947; θ_f = (90 + 234.5)·e^0.048947 − 234.5 = 106.28 °C.
    expect(r.shortCircuit.initialC).toBe(90);
    expect(Math.abs(r.shortCircuit.finalC! - 106.28)).toBeLessThan(0.3);
    expect(r.shortCircuit.withstands).toBe(true);
  });

  it('with no value anywhere the library’s default runs the check and is flagged for review', () => {
    const r = evaluateCandidate(candidateWith(null), conditions);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.shortCircuit.checked).toBe(true);
    expect(r.shortCircuit.limitC).toBe(200);
    expect(r.flags.map((f) => f.code)).toContain('BAR_SHORT_CIRCUIT_LIMIT_DEFAULTED');
  });
});

// The calculation API's request schema for bus-bar systems (issue 18) and protection (issue 21):
// strict objects that accept `installation.system`, a bar's `yieldStrengthPa`, `protection` and
// `thirdHarmonicPercent`, refuse what the library refuses with the field path named (a
// time–current curve that is not monotone names its point), and show all of it in the OpenAPI
// document. An accepted request reaches the library as given: the earth-fault loop of the example
// is worked by hand below (IEC 60364-4-41 §411.4.4 with c_min = 0.95 of IEC 60909-0 Table 1, from
// memory; R(θ) = R₂₀[1 + α₂₀(θ − 20)] with IEC 60287-1-1 Table 1 copper constants).
import { describe, expect, it } from 'vitest';
import { buildOpenApiDocument, evaluateRequestSchema, evaluationSchema, EXAMPLE_BUSBAR_SYSTEM_REQUEST, EXAMPLE_EVALUATE_REQUEST } from '@/lib/api';
import { compareCandidates } from '@/lib/electrical';
import { INPUT_BOUNDS } from '@/lib/inputBounds';

type Body = Record<string, unknown> & { conditions: Record<string, unknown>; candidates: unknown[] };
const clone = (value: unknown): Body => structuredClone(value) as Body;
const issues = (body: unknown) => {
  const parsed = evaluateRequestSchema.safeParse(body);
  return parsed.success ? [] : parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
};
const paths = (body: unknown) => issues(body).map((i) => i.split(': ')[0]);

const fuse = (curve: Array<{ currentA: number; timeS: number }>) => ({ device: { kind: 'fuse-gG-iec60269', ratedCurrentA: 250, timeCurrentCurve: curve } });
const cableBody = (extra: Record<string, unknown>) => {
  const body = clone(EXAMPLE_EVALUATE_REQUEST);
  Object.assign(body.conditions, extra);
  return body;
};

describe('accepts', () => {
  it('the documented bus-bar example: a system on edge with supports, R_p0.2 of the bars, an IEC 60947-2 breaker with its loop', () => {
    expect(issues(EXAMPLE_BUSBAR_SYSTEM_REQUEST)).toEqual([]);
  });

  it('every device kind, a curve with a plateau (an instantaneous release shows one), TT with its electrodes, and the third-harmonic content', () => {
    const curve = [
      { currentA: 500, timeS: 1000 },
      { currentA: 1500, timeS: 5 },
      { currentA: 3000, timeS: 0.1 },
      { currentA: 6000, timeS: 0.1 },
    ];
    expect(issues(cableBody({ protection: fuse(curve), thirdHarmonicPercent: 20 }))).toEqual([]);
    expect(issues(cableBody({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 250 }, systemEarthing: 'TT', earthElectrodesOhm: 30, source: { impedanceOhm: 0.05 }, protectiveConductor: { sectionMm2: 50 } } }))).toEqual([]);
    expect(issues(cableBody({ protection: { device: { kind: 'breaker-iec60947-2', ratedCurrentA: 400, settingCurrentA: 250, instantaneousCurrentA: 2500, timeCurrentCurve: curve } } }))).toEqual([]);
  });

  it('a system on an enclosure holding bars', () => {
    const body = clone(EXAMPLE_BUSBAR_SYSTEM_REQUEST);
    body.conditions.installation = { kind: 'enclosure', deratingFactor: 0.8, inside: 'bar-on-edge', system: { phaseSpacingM: 0.2 } };
    expect(issues(body)).toEqual([]);
  });
});

describe('refuses, naming the field', () => {
  it('a fuse curve whose time rises names the point and says why (the library’s rule: times never rise as the current rises)', () => {
    const found = issues(cableBody({ protection: fuse([{ currentA: 1000, timeS: 100 }, { currentA: 2000, timeS: 5 }, { currentA: 4000, timeS: 8 }]) }));
    expect(found).toEqual(["conditions.protection.device.timeCurrentCurve.2.timeS: must not exceed the previous point's time (5 s): the operating time falls as the current rises"]);
  });

  it('a curve whose current does not rise names that point’s current', () => {
    expect(paths(cableBody({ protection: fuse([{ currentA: 1000, timeS: 100 }, { currentA: 1000, timeS: 5 }]) }))).toEqual(['conditions.protection.device.timeCurrentCurve.1.currentA']);
  });

  it('device data the library refuses: a setting above the rating, an instantaneous setting not above the setting, a rating of zero, an unknown key', () => {
    expect(paths(cableBody({ protection: { device: { kind: 'breaker-iec60947-2', ratedCurrentA: 400, settingCurrentA: 500, instantaneousCurrentA: 300 } } }))).toEqual([
      'conditions.protection.device.settingCurrentA',
      'conditions.protection.device.instantaneousCurrentA',
    ]);
    expect(issues(cableBody({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 0 } } }))).toEqual(['conditions.protection.device.ratedCurrentA: Device rating must be greater than 0 A']);
    expect(paths(cableBody({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'E', ratedCurrentA: 63 } } }))).toEqual(['conditions.protection.device.curve']);
    expect(issues(cableBody({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 63, ratedCurentA: 63 } } }))[0]).toMatch(/^conditions\.protection\.device: Unrecognized key: "ratedCurentA"/);
  });

  it('a loop the library cannot check: a fuse without its curve, TT without electrodes, TN with them', () => {
    const loop = { source: { resistanceOhm: 0.01, reactanceOhm: 0.02 }, protectiveConductor: { sectionMm2: 70 } };
    expect(paths(cableBody({ protection: { device: { kind: 'fuse-gG-iec60269', ratedCurrentA: 250 }, ...loop } }))).toEqual(['conditions.protection.device.timeCurrentCurve']);
    expect(paths(cableBody({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 100 }, systemEarthing: 'TT', ...loop } }))).toEqual(['conditions.protection.earthElectrodesOhm']);
    expect(paths(cableBody({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'B', ratedCurrentA: 100 }, earthElectrodesOhm: 10 } }))).toEqual(['conditions.protection.earthElectrodesOhm']);
  });

  it('the system: both R/X and κ, spacers wider apart than the supports, a misspelt key, a system around cables', () => {
    const body = clone(EXAMPLE_BUSBAR_SYSTEM_REQUEST);
    const system = (body.conditions.installation as { system: Record<string, unknown> }).system;
    expect(paths({ ...body, conditions: { ...body.conditions, installation: { kind: 'bar-on-edge', system: { ...system, kappa: 1.8 } } } })).toEqual(['conditions.installation.system.kappa']);
    expect(paths({ ...body, conditions: { ...body.conditions, installation: { kind: 'bar-on-edge', system: { ...system, spacerSpacingM: 0.5 } } } })).toEqual(['conditions.installation.system.spacerSpacingM']);
    expect(issues({ ...body, conditions: { ...body.conditions, installation: { kind: 'bar-flat', system: { phaseSpacingM: 0.2, supportSpan: 0.4 } } } })[0]).toMatch(/^conditions\.installation\.system: Unrecognized key: "supportSpan"/);
    const cables = cableBody({ installation: { kind: 'enclosure', deratingFactor: 0.8, inside: 'cable-in-air', system: { phaseSpacingM: 0.2 } } });
    expect(paths(cables)).toEqual(['conditions.installation.system']);
  });

  it('numbers outside the one table of bounds (lib/inputBounds), probed just outside each end', () => {
    const body = clone(EXAMPLE_BUSBAR_SYSTEM_REQUEST);
    const withSystem = (patch: Record<string, unknown>) => ({ ...body, conditions: { ...body.conditions, installation: { kind: 'bar-on-edge', system: { phaseSpacingM: 0.2, ...patch } } } });
    expect(paths(withSystem({ phaseSpacingM: 0 }))).toEqual(['conditions.installation.system.phaseSpacingM']);
    expect(paths(withSystem({ phaseSpacingM: INPUT_BOUNDS.phaseSpacingM.max * (1 + 1e-9) }))).toEqual(['conditions.installation.system.phaseSpacingM']);
    expect(paths(withSystem({ kappa: INPUT_BOUNDS.peakFactorKappa.min - 1e-9 }))).toEqual(['conditions.installation.system.kappa']);
    expect(paths(withSystem({ kappa: INPUT_BOUNDS.peakFactorKappa.max + 1e-9 }))).toEqual(['conditions.installation.system.kappa']);
    expect(paths(withSystem({ supportStrengthN: 0 }))).toEqual(['conditions.installation.system.supportStrengthN']);
    const bar = { ...(body.candidates[0] as object), yieldStrengthPa: INPUT_BOUNDS.yieldStrengthPa.max * (1 + 1e-9) };
    expect(paths({ ...body, candidates: [bar] })).toEqual(['candidates.0.yieldStrengthPa']);
    expect(paths({ ...body, candidates: [{ ...bar, yieldStrengthPa: INPUT_BOUNDS.yieldStrengthPa.min * (1 - 1e-9) }] })).toEqual(['candidates.0.yieldStrengthPa']);
    expect(paths(cableBody({ thirdHarmonicPercent: 100.000001 }))).toEqual(['conditions.thirdHarmonicPercent']);
    expect(paths(cableBody({ protection: { ...fuse([]), device: { kind: 'fuse-gG-iec60269', ratedCurrentA: 250, timeCurrentCurve: [{ currentA: 1000, timeS: 100 }, { currentA: 2000, timeS: 0 }] } } }))).toEqual([
      'conditions.protection.device.timeCurrentCurve.1.timeS',
    ]);
  });
});

describe('what is accepted reaches the library as given', () => {
  const parsed = evaluateRequestSchema.parse(EXAMPLE_BUSBAR_SYSTEM_REQUEST);
  const comparison = compareCandidates(parsed.candidates, parsed.conditions);
  const first = comparison.evaluations[0];
  if (!first.ok) throw new Error(first.error.message);

  it('the forces are checked with the bars’ own R_p0.2 (250 N/mm² given, no default flagged) and the result fits the documented answer', () => {
    expect(first.forces?.yieldStrengthPa).toBe(250e6);
    expect(first.flags.map((f) => f.code)).not.toContain('BUSBAR_YIELD_STRENGTH_DEFAULTED');
    expect(first.pack?.bars).toHaveLength(9);
    expect(evaluationSchema.safeParse(JSON.parse(JSON.stringify(first))).success).toBe(true);
  });

  it('the earth-fault loop worked by hand: Z_s from the source, 3 bars per phase and the 1000 mm² protective conductor at 200 °C', () => {
    // Copper ρ₂₀ = 1.7241e-8 Ω·m, α₂₀ = 3.93e-3 /K (IEC 60287-1-1 Table 1); 15 m route; both
    // conductors at their end-of-fault temperature, the bars' 200 °C short-circuit limit.
    const hot = 1 + 3.93e-3 * (200 - 20);
    const phaseOhm = ((1.7241e-8 / (0.1 * 0.01)) / 3) * 15 * hot;
    const peOhm = (1.7241e-8 / 1000e-6) * 15 * hot;
    const r = 0.0016 + phaseOhm + peOhm;
    const x = 0.0064;
    const zs = Math.hypot(r, x);
    const d = first.protection?.disconnection;
    expect(d?.loop.impedanceOhm).toBeCloseTo(zs, 9);
    // I_a = c·U₀/Z_s with c_min 0.95; above (1 + 0.2)·I_i = 30 kA the breaker trips in the maker's 0.05 s, within 5 s (TN distribution circuit).
    expect(d?.faultCurrentA).toBeCloseTo((0.95 * 230) / zs, 6);
    expect((0.95 * 230) / zs).toBeGreaterThan(1.2 * 25000);
    expect(d?.operating.timeS).toBe(0.05);
    expect(d?.required.timeS).toBe(5);
    expect(d?.verdict).toBe('pass');
  });

  it('coordination with the entered series: I₂ = 1.30·I_r = 3250 A for an IEC 60947-2 breaker (from memory), I_r = 2500 A', () => {
    const c = first.protection?.coordination;
    expect(c?.deviceCurrentA).toBe(2500);
    expect(c?.conventionalOperatingCurrentA).toBeCloseTo(1.3 * 2500, 9);
    expect(c?.inequalities.map((l) => l.text)).toEqual(['I_B ≤ I_r', 'I_r ≤ I_z', 'I₂ ≤ 1.45·I_z']);
    expect(first.protection?.smallestRating?.ratingA).toBe(2500);
  });
});

describe('the OpenAPI document shows them', () => {
  const doc = buildOpenApiDocument() as { components: { schemas: Record<string, { properties?: Record<string, unknown>; oneOf?: unknown[]; anyOf?: unknown[] }> } };
  const schemas = doc.components.schemas;
  it('the bus-bar system under the bar installations and the enclosure, and R_p0.2 of a bar', () => {
    expect(Object.keys(schemas.BusbarSystem.properties ?? {})).toEqual(['phaseSpacingM', 'supportSpacingM', 'spacerSpacingM', 'supports', 'supportStrengthN', 'rOverX', 'kappa', 'mainSectionModulusM3', 'packNodes']);
    const installation = JSON.stringify(schemas.Installation);
    expect(installation.match(/#\/components\/schemas\/BusbarSystem/g)?.length).toBe(3);
    expect(schemas.BarCandidate.properties).toHaveProperty('yieldStrengthPa');
  });
  it('protection with its device kinds, and the third-harmonic content', () => {
    expect(schemas.Conditions.properties).toHaveProperty('protection');
    expect(schemas.Conditions.properties).toHaveProperty('thirdHarmonicPercent');
    expect(Object.keys(schemas.Protection.properties ?? {})).toEqual(['device', 'deviceSeriesA', 'systemEarthing', 'circuit', 'source', 'earthElectrodesOhm', 'protectiveConductor']);
    expect((schemas.ProtectiveDevice.oneOf ?? schemas.ProtectiveDevice.anyOf)?.length).toBe(3);
    expect(schemas).toHaveProperty('AutomaticDisconnection');
    expect(schemas).toHaveProperty('OverloadCoordination');
  });
});

import { describe, expect, it } from 'vitest';
import {
  ampacity,
  BEYOND_STEADY_FLAG_CODES,
  evaluateCandidate,
  FLAG_CODES,
  FLAG_REGISTRY,
  RETIRED_FLAG_CODES,
  type Candidate,
  type BeyondSteadyFlagCode,
  type Conditions,
  type FlagCode,
} from '@/lib/electrical';
import { barConditions, cableConditions, copperBar, xlpeCable } from './fixtures';

/**
 * Assumption flags (physics.md §5): one case built to trip each code. The cases are physical
 * situations (no mocking); their numbers are inputs, not check values.
 */
function codesOf(candidate: Candidate, conditions: Conditions): FlagCode[] {
  const e = evaluateCandidate(candidate, conditions);
  if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
  return e.flags.map((f) => f.code);
}

// The optional checks over time and along the run raise their own codes (tests/lib/electrical/beyond-steady.test.ts);
// retired codes are only read from stored sheets.
type Retired = (typeof RETIRED_FLAG_CODES)[number];
const STEADY_CODES = FLAG_CODES.filter(
  (c) => !(BEYOND_STEADY_FLAG_CODES as readonly FlagCode[]).includes(c) && !(RETIRED_FLAG_CODES as readonly FlagCode[]).includes(c),
) as Exclude<FlagCode, BeyondSteadyFlagCode | Retired>[];

/** A three-phase system of 100 × 10 mm copper bars 200 mm apart on supports 1 m apart, with a 50 kA fault. */
const system = (extra: Record<string, unknown> = {}) => ({ phaseSpacingM: 0.2, supportSpacingM: 1, supports: 'continuous-three-or-more-spans' as const, ...extra });
const barFault = { currentA: 50_000, durationS: 0.5 };

const cases: Record<Exclude<FlagCode, BeyondSteadyFlagCode | Retired>, () => { candidate: Candidate; conditions: Conditions }> = {
  AMBIENT_ASSUMED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ ambientC: undefined }) }),
  GROUPING_DERATING_ENTERED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ groupingFactor: 0.8 }) }),
  ENCLOSURE_DERATING_ENTERED: () => ({
    candidate: xlpeCable(95),
    conditions: cableConditions({ installation: { kind: 'enclosure', deratingFactor: 0.85, inside: 'cable-in-air', spacingM: 0.1 } }),
  }),
  // Two runs of trefoils touching side by side in air: IEC 60287-2-1 Table 2 covers one group.
  MUTUAL_HEATING_NOT_MODELLED: () => ({ candidate: xlpeCable(95, { parallel: 2 }), conditions: cableConditions({ installation: { kind: 'cable-in-air' } }) }),
  // A 20 mm bar laid flat: L = w/2 = 10 mm puts Ra below the 1e4 where the horizontal-plate
  // correlations start (Incropera ch. 9).
  CORRELATION_OUT_OF_RANGE: () => ({
    candidate: copperBar(0.02, 0.005),
    conditions: barConditions({ designCurrentA: 100, installation: { kind: 'bar-flat' } }),
  }),
  SURFACE_COEFFICIENT_ENTERED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ surfaceCoefficientWPerM2K: 9 }) }),
  // Wind cools cables that lie each alone (the fixture's 0.1 m spacing); a group's free-air law is for still air.
  WIND_COOLING_CREDITED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ windSpeedMPerS: 2 }) }),
  EMISSIVITY_ASSUMED: () => ({ candidate: xlpeCable(95, { emissivity: undefined }), conditions: cableConditions() }),
  SOLAR_ABSORPTIVITY_ASSUMED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ solar: { irradianceWPerM2: 1000 } }) }),
  AC_FACTOR_USER_ENTERED: () => ({ candidate: copperBar(0.1, 0.01, { acResistanceRatio: 1.06 }), conditions: barConditions() }),
  // 400 Hz on a 300 mm² conductor: x_s² = 8π·400·1e-7/R' ≈ 12, x_s ≈ 3.5 > 2.8.
  AC_FORMULA_OUT_OF_RANGE: () => ({ candidate: xlpeCable(300), conditions: cableConditions({ frequencyHz: 400, designCurrentA: 100 }) }),
  PROXIMITY_SPACING_ASSUMED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ installation: { kind: 'cable-in-air' } }) }),
  NEAR_RUNAWAY: () => {
    // A bare bar allowed (by the user) to 450 °C behind a fixed 10 W/(m²·K): run at 99 % of
    // that rating, resistance growth has more than doubled the rise.
    const candidate = copperBar(0.05, 0.005, { terminalLimitC: undefined, acResistanceRatio: 1.02 });
    const base = barConditions({ surfaceCoefficientWPerM2K: 10, temperatureLimitC: 450 });
    const rating = ampacity(candidate, base).current;
    return { candidate, conditions: { ...base, designCurrentA: 0.99 * rating } };
  },
  RUNAWAY: () => {
    const candidate = copperBar(0.05, 0.005, { terminalLimitC: undefined, acResistanceRatio: 1.02 });
    const base = barConditions({ surfaceCoefficientWPerM2K: 10, temperatureLimitC: 450 });
    return { candidate, conditions: { ...base, designCurrentA: 3 * ampacity(candidate, base).current } };
  },
  OVER_LIMIT: () => {
    const candidate = xlpeCable(95);
    return { candidate, conditions: cableConditions({ designCurrentA: 1.2 * ampacity(candidate, cableConditions()).current }) };
  },
  MARGIN_UNDER_10: () => {
    const candidate = xlpeCable(95);
    return { candidate, conditions: cableConditions({ designCurrentA: 0.97 * ampacity(candidate, cableConditions()).current }) };
  },
  USER_LIMIT_ABOVE_RATING: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ temperatureLimitC: 105, raiseMaterialLimit: true, userLimitJustification: 'maker rates this XLPE at 105 °C (test report)' }) }),
  USER_LIMIT_NOT_JUSTIFIED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ temperatureLimitC: 105, raiseMaterialLimit: true }) }),
  SHORT_CIRCUIT_NOT_CHECKED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ fault: undefined }) }),
  SHORT_CIRCUIT_EXCEEDED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ fault: { currentA: 50_000, durationS: 1 } }) }),
  SHORT_CIRCUIT_LONG_DURATION: () => ({ candidate: xlpeCable(240), conditions: cableConditions({ fault: { currentA: 2_000, durationS: 8 } }) }),
  MULTICORE_ROUND_CORES: () => ({ candidate: xlpeCable(95, { cores: 4 }), conditions: cableConditions() }),
  DATA_FROM_MEMORY: () => ({ candidate: xlpeCable(95, { sourceNotes: ['R20 from IEC 60228 Table 2, from memory'] }), conditions: cableConditions() }),
  PARALLEL_SHARING_ASSUMED: () => ({ candidate: xlpeCable(95, { parallel: 2 }), conditions: cableConditions() }),
  BAR_EDGES_LUMPED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions() }),
  BURIED_SOIL_ASSUMED: () => ({
    candidate: xlpeCable(95),
    conditions: cableConditions({ installation: { kind: 'buried', depthM: 0.7, groundC: 15, spacingM: 0.1 } }),
  }),
  SOIL_DRYING_RISK: () => {
    const candidate = xlpeCable(95);
    const conditions = cableConditions({ installation: { kind: 'buried', depthM: 0.7, soilResistivityKmPerW: 1.0, groundC: 20, spacingM: 0.1 } });
    return { candidate, conditions: { ...conditions, designCurrentA: 0.95 * ampacity(candidate, conditions).current } };
  },
  VOLTAGE_DROP_EXCEEDED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ maxVoltageDropPercent: 0.5 }) }),
  REACTANCE_ASSUMED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ reactanceOhmPerM: undefined }) }),
  BAR_REACTANCE_ASSUMED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ reactanceOhmPerM: undefined }) }),
  // A 60 mm thick aluminium bar under a fixed 2000 W/(m²·K): h·t/(4k) ≈ 0.13, so the conductor
  // is far from isothermal and the closed form (which assumes it is) disagrees.
  CROSS_CHECK_DIFFERENCE: () => ({
    candidate: { kind: 'bar', material: 'aluminium', widthM: 0.1, thicknessM: 0.06, r20OhmPerM: 2.8264e-8 / 6e-3, terminalLimitC: 90, acResistanceRatio: 1 },
    conditions: barConditions({ surfaceCoefficientWPerM2K: 2000 }),
  }),
  CABLE_GROUP_RATED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ installation: { kind: 'cable-in-air' } }) }),
  OTHER_CIRCUITS_NOT_COVERED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ installation: { kind: 'cable-in-air', otherCircuits: [{ currentA: 150 }] } }) }),
  // A trefoil with a 5 mm clearance is not tabulated (touching is): rated as touching.
  GROUP_ROW_CONSERVATIVE: () => {
    const c = xlpeCable(95);
    const de = c.conductorDiameterM + 2 * (1.7e-3 + 1.8e-3);
    return { candidate: c, conditions: cableConditions({ installation: { kind: 'cable-in-air', spacingM: de + 0.005 } }) };
  },
  WIND_NOT_CREDITED_TO_GROUP: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ windSpeedMPerS: 2, installation: { kind: 'cable-in-air' } }) }),
  OTHER_CIRCUIT_HEAT_ENTERED: () => ({
    candidate: xlpeCable(95),
    conditions: cableConditions({ installation: { kind: 'buried', depthM: 0.8, otherCircuits: [{ currentA: 200, cable: { externalDiameterM: 0.03, lossWPerM: 20 } }], circuitSpacingM: 0.3 } }),
  }),
  SCREEN_LOSSES_INCLUDED: () => {
    const c = xlpeCable(240);
    c.layers = [c.layers[0], { name: 'copper wire screen', role: 'screen', thicknessM: 0.8e-3, thermalResistivityKmPerW: 0.0025 }, c.layers[1]];
    c.screen = { material: 'copper', sectionMm2: 35, bonding: 'solid' };
    return { candidate: c, conditions: cableConditions({ installation: { kind: 'cable-in-air' } }) };
  },
  // PVC insulation at U₀ = 6.35 kV: IEC 60287-1-1 Table 3 counts its dielectric loss from 6 kV (from memory).
  DIELECTRIC_LOSSES_INCLUDED: () => {
    const c = xlpeCable(95);
    c.layers = [{ name: 'PVC insulation', role: 'insulation', thicknessM: 3.4e-3, thermalResistivityKmPerW: 6.0, continuousLimitC: 70, shortCircuitLimitC: 160 }, c.layers[1]];
    return { candidate: c, conditions: cableConditions({ nominalVoltageV: 6350 }) };
  },
  BAR_AC_FACTOR_COMPUTED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions() }),
  PHASE_SPACING_ASSUMED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions() }),
  PACK_RATED_AS_SYSTEM: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ installation: { kind: 'bar-on-edge', system: system() } }) }),
  BAR_SHORT_CIRCUIT_LIMIT_DEFAULTED: () => ({ candidate: copperBar(0.1, 0.01, { shortCircuitLimitC: undefined }), conditions: barConditions({ fault: { currentA: 20_000, durationS: 0.5 } }) }),
  FORCES_NOT_CHECKED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: { currentA: 20_000, durationS: 0.5 } }) }),
  // A 1 mm gap: the channel's Ra′ falls below the Bar-Cohen & Rohsenow range.
  // Four 900 × 2 mm bars per phase: the skin-depth mesh would take ~9,000 filaments.
  FILAMENT_MESH_COARSENED: () => ({ candidate: copperBar(0.9, 0.002, { barsPerPhase: 4, barGapM: 0.01 }), conditions: barConditions({ installation: { kind: 'bar-on-edge', system: system({ phaseSpacingM: 0.3 }) } }) }),
  BUSBAR_CHANNEL_OUT_OF_RANGE: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.001 }), conditions: barConditions({ installation: { kind: 'bar-on-edge', system: system() } }) }),
  // A 60 mm gap: the channel would cool better than a free plate; it is capped there.
  BUSBAR_CHANNEL_LIMITED_TO_PLATE: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.06 }), conditions: barConditions({ installation: { kind: 'bar-on-edge', system: system({ phaseSpacingM: 0.4 }) } }) }),
  BUSBAR_FLAT_GAP_NO_CONVECTION: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ installation: { kind: 'bar-flat', system: system() } }) }),
  BUSBAR_FLAT_SLOT_RADIATION_TO_ROOM: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ installation: { kind: 'bar-flat', system: system() } }) }),
  BUSBAR_EDGE_CONVECTION: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ installation: { kind: 'bar-on-edge', system: system() } }) }),
  // A 20 mm pair laid flat: L = w/2 = 10 mm puts Ra below the 1e4 where the horizontal-plate
  // correlations start (Incropera ch. 9).
  BUSBAR_PLATE_OUT_OF_RANGE: () => ({ candidate: copperBar(0.02, 0.005, { barsPerPhase: 2, barGapM: 0.005 }), conditions: barConditions({ designCurrentA: 100, installation: { kind: 'bar-flat', system: system({ phaseSpacingM: 0.08 }) } }) }),
  BUSBAR_BARS_ISOTHERMAL: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_PACK_ISOTHERMAL: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ installation: { kind: 'bar-on-edge', system: system({ packNodes: 'per-pack' }) } }) }),
  // 40 kA through one 100 × 10 mm pair at 200 °C ambient: no steady state at the design current.
  BUSBAR_NO_STEADY_STATE: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01, terminalLimitC: 400 }), conditions: barConditions({ designCurrentA: 40_000, installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_KAPPA_DEFAULTED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_DYNAMIC_FACTORS_DEFAULTED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_YIELD_STRENGTH_DEFAULTED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_SECTION_MODULUS_NO_STIFFENING: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_SECTION_MODULUS_ENTERED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system({ mainSectionModulusM3: 5e-6 }) } }) }),
  BUSBAR_MAIN_DISTANCE_FROM_ENVELOPE: () => ({ candidate: copperBar(0.1, 0.01, { barsPerPhase: 2, barGapM: 0.01 }), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_STRESS_EXCEEDED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: { currentA: 80_000, durationS: 0.5 }, installation: { kind: 'bar-on-edge', system: system() } }) }),
  BUSBAR_SUB_CONDUCTOR_STRESS_EXCEEDED: () => ({
    candidate: copperBar(0.1, 0.005, { barsPerPhase: 2, barGapM: 0.005 }),
    conditions: barConditions({ fault: { currentA: 80_000, durationS: 0.5 }, installation: { kind: 'bar-on-edge', system: system({ spacerSpacingM: 1 }) } }),
  }),
  BUSBAR_SUPPORT_FORCE_EXCEEDED: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system({ supportStrengthN: 1000 }) } }) }),
  BUSBAR_SUPPORT_STRENGTH_NOT_GIVEN: () => ({ candidate: copperBar(0.1, 0.01), conditions: barConditions({ fault: barFault, installation: { kind: 'bar-on-edge', system: system() } }) }),
  // A 630 A breaker on a 95 mm² cable (I_n > I_z).
  PROTECTION_OVERLOAD_NOT_COORDINATED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 630 } } }) }),
  DISCONNECTION_NOT_CHECKED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 250 } } }) }),
  // 600 m of 95 mm² with a 16 mm² protective conductor: the earth-fault current stays below the C250's 2500 A.
  PROTECTION_DISCONNECTION_TOO_SLOW: () => ({
    candidate: xlpeCable(95),
    conditions: cableConditions({ lengthM: 600, protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 250 }, source: { resistanceOhm: 0.01, reactanceOhm: 0.02 }, protectiveConductor: { sectionMm2: 16 } } }),
  }),
  // A source given only as |Z| is added arithmetically (an assumption said so).
  PROTECTION_ASSUMPTIONS: () => ({
    candidate: xlpeCable(95),
    conditions: cableConditions({ lengthM: 40, protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 250 }, source: { impedanceOhm: 0.02 }, protectiveConductor: { sectionMm2: 50 } } }),
  }),
  PROTECTIVE_CONDUCTOR_TOO_SMALL: () => ({
    candidate: xlpeCable(95),
    conditions: cableConditions({ lengthM: 20, protection: { device: { kind: 'breaker-iec60898-1', curve: 'C', ratedCurrentA: 250 }, source: { resistanceOhm: 0.005, reactanceOhm: 0.01 }, protectiveConductor: { sectionMm2: 1.5 } } }),
  }),
  HARMONICS_NOT_COVERED: () => ({ candidate: xlpeCable(95), conditions: cableConditions({ thirdHarmonicPercent: 30 }) }),
  // A four-core cable with 40 % third harmonics: the neutral carries 3·0.4·I_B = 1.2·I_B (Annex E).
  HARMONICS_NEUTRAL_GOVERNS: () => ({ candidate: xlpeCable(95, { cores: 4 }), conditions: cableConditions({ designCurrentA: 100, thirdHarmonicPercent: 40 }) }),
  // Any content on a four-core cable puts the neutral's (3·h₃)² share of a phase core's heat into the balance.
  HARMONICS_NEUTRAL_HEAT: () => ({ candidate: xlpeCable(95, { cores: 4 }), conditions: cableConditions({ designCurrentA: 100, thirdHarmonicPercent: 20 }) }),
  HARMONICS_OVER_RATING: () => ({ candidate: xlpeCable(16, { cores: 4 }), conditions: cableConditions({ designCurrentA: 90, thirdHarmonicPercent: 50 }) }),
  SHEATH_LOSSES_NOT_INCLUDED: () => {
    const c = xlpeCable(95);
    c.layers = [c.layers[0], { name: 'copper wire screen', role: 'screen', thicknessM: 0.5e-3, thermalResistivityKmPerW: 0.0025 }, c.layers[1]];
    return { candidate: c, conditions: cableConditions() };
  },
};

describe('each assumption flag is raised by a case built for it (physics.md §5)', () => {
  it('every registered code has a case here (so none is untested)', () => {
    expect(Object.keys(cases).sort()).toEqual([...STEADY_CODES].sort());
  });

  for (const code of STEADY_CODES) {
    it(`${code} (${FLAG_REGISTRY[code].severity})`, () => {
      const { candidate, conditions } = cases[code]();
      const e = evaluateCandidate(candidate, conditions);
      if (!e.ok) throw new Error(`${e.error.code}: ${e.error.message}`);
      const flag = e.flags.find((f) => f.code === code);
      expect(flag, `expected ${code} among ${e.flags.map((f) => f.code).join(', ')}`).toBeDefined();
      expect(flag!.severity).toBe(FLAG_REGISTRY[code].severity);
      expect(flag!.message.length).toBeGreaterThan(20);
      if (flag!.severity === 'blocker') expect(e.passes).toBe(false);
    });
  }
});

describe('a comfortable case', () => {
  it('a 240 mm² Cu/XLPE circuit at 300 A, every input stated, raises no review or blocker flag', () => {
    const codes = evaluateCandidate(xlpeCable(240), cableConditions({ designCurrentA: 300 }));
    if (!codes.ok) throw new Error(codes.error.message);
    const serious = codes.flags.filter((f) => f.severity !== 'note');
    expect(serious.map((f) => f.code)).toEqual([]);
    expect(codes.passes).toBe(true);
  });

  it('flags come out blockers first, then review, then notes, once per code', () => {
    const codes = codesOf(xlpeCable(95, { emissivity: undefined, parallel: 2 }), cableConditions({ ambientC: undefined, designCurrentA: 900 }));
    const order = { blocker: 0, review: 1, note: 2 } as const;
    const severities = codes.map((c) => order[FLAG_REGISTRY[c].severity]);
    expect([...severities].sort((a, b) => a - b)).toEqual(severities);
    expect(new Set(codes).size).toBe(codes.length);
  });
});

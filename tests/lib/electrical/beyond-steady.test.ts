/**
 * The optional checks over time and along the run (lib/electrical/sizing/beyondSteady.ts):
 * each of their flag codes is raised by a case built for it (physics.md §5–6), and the fault
 * heating sits at or below the IEC 60949 adiabatic figure the steady evaluation reports (heat
 * leaving the conductor can only lower it). The numbers are inputs, not check values.
 */
import { describe, expect, it } from 'vitest';
import { alongRunCheck, BEYOND_STEADY_FLAG_CODES, CONDUCTOR_VOLUMETRIC_HEAT_CAPACITY, FLAG_REGISTRY, overTimeCheck, type FlagCode } from '@/lib/electrical';
import { barConditions, cableConditions, copperBar, xlpeCable } from './fixtures';

const hourly = (day: number, night: number) => Array.from({ length: 24 }, (_, h) => (h >= 8 && h < 20 ? day : night));

function raised(flags: { code: FlagCode; severity: string }[], code: FlagCode) {
  const f = flags.find((x) => x.code === code);
  expect(f, `expected ${code} among ${flags.map((x) => x.code).join(', ')}`).toBeDefined();
  expect(f!.severity).toBe(FLAG_REGISTRY[code].severity);
}

describe('over time', () => {
  it('a heavy overload reaches the limit before it ends; a light one does not', () => {
    const heavy = overTimeCheck(xlpeCable(95), cableConditions({ designCurrentA: 200 }), { overload: { currentA: 600, durationS: 3600 } });
    expect(heavy.overload!.passes).toBe(false);
    expect(heavy.overload!.timeToLimitS!).toBeLessThan(3600);
    raised(heavy.flags, 'OVERLOAD_LIMIT_REACHED');
    raised(heavy.flags, 'HEAT_CAPACITY_ASSUMED');
    const light = overTimeCheck(xlpeCable(95), cableConditions({ designCurrentA: 200 }), { overload: { currentA: 210, durationS: 3600 } });
    expect(light.overload!.passes).toBe(true);
    // The series starts at the steady state of the design current.
    expect(light.overload!.series[0].hotSpotC).toBeLessThan(light.limitC);
  });

  it('a daily cycle above the rating peaks over the limit at the end of the heavy hours', () => {
    const r = overTimeCheck(xlpeCable(95), cableConditions({ designCurrentA: 200 }), { dailyCurrentsA: hourly(500, 100) });
    expect(r.daily!.periodic).toBe(true);
    expect(r.daily!.passes).toBe(false);
    expect(r.daily!.peakTimeS).toBeGreaterThan(8 * 3600);
    expect(r.daily!.peakTimeS).toBeLessThanOrEqual(20 * 3600);
    raised(r.flags, 'DAILY_PEAK_OVER_LIMIT');
  });

  it('a daily cycle that cannot settle within the days repeated raises DAILY_CYCLE_NOT_PERIODIC; a quick one settles without it', () => {
    // Physical reason: the approach to the periodic state goes as e^(−t/τ), τ = ρc·A / (h·P − I²·R₂₀·α₂₀)
    // for a lumped conductor (lumped-capacitance closed form, e.g. Incropera ch. 5, with the Joule
    // heat's own rise with temperature, from memory). A 100×10 mm copper bar with an entered
    // surface coefficient of 0.012 W/(m²·K) (as if wrapped in thick insulation) has ρc·A/(h·P)
    // ≈ 3.45e6·1e-3/(0.012·0.22) s ≈ 15 days (ρc from IEC 60949, see CONDUCTOR_VOLUMETRIC_HEAT_CAPACITY),
    // and a day current at 90 % of the runaway current √(h·P/(R₂₀·α₂₀)) leaves little net cooling
    // per kelvin, stretching τ further: a month of repeated days is not enough.
    const bar = copperBar(0.1, 0.01);
    const hWPerM2K = 0.012;
    const perimeterM = 2 * (0.1 + 0.01);
    const alpha20PerK = 0.00393; // copper, IEC 60287-1-1 Table 1 (from memory)
    const runawayA = Math.sqrt((hWPerM2K * perimeterM) / (bar.r20OhmPerM * alpha20PerK));
    const tauS = (CONDUCTOR_VOLUMETRIC_HEAT_CAPACITY.copper * 0.1 * 0.01) / (hWPerM2K * perimeterM);
    expect(tauS).toBeGreaterThan(10 * 86400);
    const slow = overTimeCheck(bar, barConditions({ designCurrentA: 50, surfaceCoefficientWPerM2K: hWPerM2K }), { dailyCurrentsA: hourly(0.9 * runawayA, 0) });
    expect(slow.daily!.periodic).toBe(false);
    raised(slow.flags, 'DAILY_CYCLE_NOT_PERIODIC');
    expect(slow.flags.find((f) => f.code === 'DAILY_CYCLE_NOT_PERIODIC')!.message).toContain(`after ${slow.daily!.days} days`);

    // The same bar and day with the air correlations (h ≈ 10 W/(m²·K), common practice for still
    // air): τ ≈ ρc·A/(h·P) ≈ 0.4 h, far from runaway, so the cycle repeats within a few days.
    const quick = overTimeCheck(bar, barConditions({ designCurrentA: 50 }), { dailyCurrentsA: hourly(0.9 * runawayA, 0) });
    expect(quick.daily!.periodic).toBe(true);
    expect(quick.daily!.days).toBeLessThan(slow.daily!.days);
    expect(quick.flags.map((f) => f.code)).not.toContain('DAILY_CYCLE_NOT_PERIODIC');
  });

  it('fault heating with heat into the coverings is below the IEC 60949 adiabatic figure', () => {
    const r = overTimeCheck(xlpeCable(95), cableConditions({ designCurrentA: 200, fault: { currentA: 10000, durationS: 1 } }), { fault: true });
    expect(r.fault!.iecAdiabaticC).not.toBeNull();
    expect(r.fault!.finalC).toBeLessThan(r.fault!.iecAdiabaticC!);
    expect(r.fault!.finalC).toBeGreaterThan(r.fault!.initialC);
    raised(r.flags, 'FAULT_HEAT_INTO_COVERINGS');
  });
});

describe('along the run', () => {
  it('joints without a resistance are assumed and flagged; a hot run is over the limit', () => {
    const bar = copperBar(0.05, 0.005);
    const r = alongRunCheck(bar, barConditions({ designCurrentA: 900 }), {
      lengthM: 3,
      start: { kind: 'terminal', temperatureC: 70 },
      end: { kind: 'insulated' },
      joints: [{ positionM: 1.5, resistanceMicroOhm: null }],
    });
    raised(r.flags, 'JOINT_RESISTANCE_ASSUMED');
    raised(r.flags, 'RUN_HOT_SPOT_OVER_LIMIT');
    expect(r.passes).toBe(false);
    const cool = alongRunCheck(bar, barConditions({ designCurrentA: 200 }), {
      lengthM: 3,
      // Terminals held at the air temperature: the joint is what heats the middle.
      start: { kind: 'terminal', temperatureC: 40 },
      end: { kind: 'terminal', temperatureC: 40 },
      joints: [{ positionM: 1.5, resistanceMicroOhm: 20 }],
    });
    expect(cool.passes).toBe(true);
    expect(cool.flags.map((f) => f.code)).not.toContain('JOINT_RESISTANCE_ASSUMED');
    // The joint is a local maximum of the profile.
    expect(Math.abs(cool.hotSpot.positionM - 1.5)).toBeLessThan(0.05);
  });
});

it('every beyond-steady code is registered', () => {
  for (const code of BEYOND_STEADY_FLAG_CODES) expect(FLAG_REGISTRY[code]).toBeDefined();
});

/**
 * Runs over time (lib/thermal/transientRuns.ts) against closed forms:
 * - lumped capacitance, Incropera et al., Fundamentals of Heat and Mass Transfer, §5.2 (and §5.3
 *   for a body with internal generation): T(t) = T_ss + (T0 − T_ss)·e^(−t/τ), τ = ρcV/(hA);
 * - the step response of a Joule-heated solid cylinder tends to its steady state, whose centre
 *   rise is q'''r₀²/(4k) above a fixed surface (Incropera §3.5.2);
 * - implicit Euler is first order in time (e.g. Patankar 1980, §4.3: the fully implicit scheme),
 *   measured as the step halves.
 * Copper data (ρ = 8960 kg/m³, c = 385 J/(kg·K), ρ₂₀ = 1.7241e-8 Ω·m) are common practice /
 * IEC 60287-1-1 Table 1.
 */
import { describe, expect, it } from 'vitest';
import { dailyCycle, overloadTimeToLimit, solveSteady, type ThermalProblem } from '@/lib/thermal';

const RHO20 = 1.7241e-8;
const DENSITY = 8960;
const HEAT_CAPACITY = 385;
const AMBIENT = 35;
const H = 10;

/**
 * A thin, highly conductive plate (Bi = hL/(2k) ≈ 1e-5 for L = 0.01 m... 1e-4 for 0.2 m) cooled
 * on both faces by a fixed h: lumped, with V/A = L/2 per m² of face.
 */
function lumpedPlate(thicknessM: number, currentA: number): ThermalProblem {
  return {
    geometry: {
      kind: 'slab',
      layers: [{ thickness: thicknessM, conductivity: 1e4, generating: true, cells: 4, density: DENSITY, heatCapacity: HEAT_CAPACITY }],
    },
    source: { kind: 'joule', current: currentA, area: 1e-4, rho20: RHO20, alpha20: 0 },
    inner: { kind: 'surface', ambient: AMBIENT, h: H },
    outer: { kind: 'surface', ambient: AMBIENT, h: H },
  };
}

/** Current giving a steady rise `riseK` to the lumped plate: q'''L = 2h·rise, q''' = J²ρ₂₀. */
function currentForRise(thicknessM: number, riseK: number): number {
  const q = (2 * H * riseK) / thicknessM;
  return Math.sqrt(q / RHO20) * 1e-4;
}

describe('lumped body (Incropera §5.2–5.3)', () => {
  const L = 0.01;
  const tau = (DENSITY * HEAT_CAPACITY * L) / (2 * H); // 1724.8 s
  const overloadA = currentForRise(L, 60);

  it('the hot spot follows T_ss + (T0 − T_ss)·e^(−t/τ) from ambient', () => {
    const r = overloadTimeToLimit({ problem: lumpedPlate(L, 0), overloadCurrentA: overloadA, limitC: AMBIENT + 100, maxTimeS: 5 * tau, timeStepS: tau / 1000 });
    expect(r.outcome).toBe('steady-below-limit');
    expect(r.initialHotSpotC).toBeCloseTo(AMBIENT, 9);
    expect(r.overloadSteadyHotSpotC!).toBeCloseTo(AMBIENT + 60, 3);
    let worst = 0;
    for (const p of r.series) worst = Math.max(worst, Math.abs(p.hotSpotC - (AMBIENT + 60 * (1 - Math.exp(-p.timeS / tau)))));
    // Implicit Euler's error for Δt = τ/1000 is about 60·(1/e)·Δt/(2τ) ≈ 0.011 K.
    expect(worst).toBeLessThan(0.03);
    expect(worst).toBeGreaterThan(0); // a first-order scheme, not the exact exponential
  });

  it('time to the limit: t = τ·ln((T_ss − T0)/(T_ss − T_lim)), first order as Δt halves', () => {
    // Rise 60 K at steady state, limit at 40 K rise: t = τ ln 3.
    const exact = tau * Math.log(3);
    const errors = [20, 40, 80, 160].map((n) => {
      const r = overloadTimeToLimit({ problem: lumpedPlate(L, 0), overloadCurrentA: overloadA, limitC: AMBIENT + 40, maxTimeS: 4 * tau, timeStepS: tau / n });
      expect(r.outcome).toBe('reaches-limit');
      return Math.abs(r.timeToLimitS! - exact);
    });
    const orders = errors.slice(1).map((e, i) => Math.log2(errors[i] / e));
    for (const p of orders) {
      expect(p).toBeGreaterThan(0.9);
      expect(p).toBeLessThan(1.1);
    }
    // Default step (refined near an early crossing) lands within 1 %.
    const auto = overloadTimeToLimit({ problem: lumpedPlate(L, 0), overloadCurrentA: overloadA, limitC: AMBIENT + 40, maxTimeS: 10 * tau });
    expect(Math.abs(auto.timeToLimitS! - exact) / exact).toBeLessThan(0.01);
  });

  it('an overload whose steady state is below the limit never reaches it; one above it does not within a short horizon', () => {
    const below = overloadTimeToLimit({ problem: lumpedPlate(L, 0), overloadCurrentA: overloadA, limitC: AMBIENT + 61, maxTimeS: 10 * tau });
    expect(below.outcome).toBe('steady-below-limit');
    expect(below.timeToLimitS).toBeNull();
    const short = overloadTimeToLimit({ problem: lumpedPlate(L, 0), overloadCurrentA: overloadA, limitC: AMBIENT + 40, maxTimeS: 0.5 * tau });
    expect(short.outcome).toBe('not-within-max-time');
    const already = overloadTimeToLimit({ problem: lumpedPlate(L, overloadA), overloadCurrentA: 2 * overloadA, limitC: AMBIENT + 40, maxTimeS: tau });
    expect(already.outcome).toBe('already-over-limit');
  });

  it('daily two-level load: periodic peak (T_hi + a·T_lo)/(1 + a), a = e^(−12 h/τ), at the end of the high hours', () => {
    // Thick plate: τ = ρcL/(2h) = 34 496 s, comparable with the 12 h halves of the day.
    const thick = 0.2;
    const tauThick = (DENSITY * HEAT_CAPACITY * thick) / (2 * H);
    const high = currentForRise(thick, 60);
    const low = currentForRise(thick, 10);
    const currents = Array.from({ length: 24 }, (_, hour) => (hour >= 8 && hour < 20 ? high : low));
    const r = dailyCycle({ problem: lumpedPlate(thick, 0), currentsA: currents, timeStepS: 30, limitC: 90 });
    const a = Math.exp(-43200 / tauThick);
    const expectedPeak = AMBIENT + (60 + a * 10) / (1 + a);
    const expectedLow = AMBIENT + (10 + a * 60) / (1 + a);
    expect(r.periodic).toBe(true);
    const peaks = r.dailyPeaksC;
    expect(Math.abs(peaks[peaks.length - 1] - peaks[peaks.length - 2])).toBeLessThan(0.01);
    // Implicit-Euler error with Δt = 30 s is about 0.01 K here.
    expect(Math.abs(r.peakC - expectedPeak)).toBeLessThan(0.03);
    expect(Math.abs(r.minimumC - expectedLow)).toBeLessThan(0.03);
    expect(r.peakTimeS).toBe(20 * 3600);
    expect(r.exceedsLimit).toBe(false);
  });

  it('one day allowed cannot tell a periodic state, and says so in words (no NaN)', () => {
    const thick = 0.2;
    const high = currentForRise(thick, 60);
    const currents = Array.from({ length: 24 }, (_, hour) => (hour >= 8 && hour < 20 ? high : 0));
    const r = dailyCycle({ problem: lumpedPlate(thick, 0), currentsA: currents, timeStepS: 60, maxDays: 1 });
    expect(r.periodic).toBe(false);
    const flag = r.flags.find((f) => f.code === 'daily-cycle-not-periodic');
    expect(flag?.message).toMatch(/One day is not enough/);
    expect(flag?.message).not.toMatch(/NaN/);
  });
});

describe('step response converges to the steady state (Incropera §3.5.2)', () => {
  it('Joule-heated solid copper cylinder with a fixed surface temperature', () => {
    const r0 = 0.01;
    const area = Math.PI * r0 * r0;
    const problem: ThermalProblem = {
      geometry: { kind: 'cylinder', layers: [{ thickness: r0, conductivity: 1, generating: true, cells: 40, density: DENSITY, heatCapacity: HEAT_CAPACITY }] },
      source: { kind: 'joule', current: 0, area, rho20: RHO20, alpha20: 0 },
      inner: { kind: 'symmetry' },
      outer: { kind: 'temperature', value: 40 },
    };
    // q''' = 2e5 W/m³ → centre rise q'''r₀²/(4k) = 5 K with k = 1 (a poor conductor, so that
    // the rise is resolved); diffusion time r₀²/(k/ρc) ≈ 345 s.
    const q = 2e5;
    const current = Math.sqrt(q / RHO20) * area;
    const r = overloadTimeToLimit({ problem, overloadCurrentA: current, limitC: 1000, maxTimeS: 20000, timeStepS: 50 });
    const last = r.series[r.series.length - 1];
    const steady = solveSteady({ ...problem, source: { ...problem.source, current } as ThermalProblem['source'] });
    expect(Math.abs(last.hotSpotC - Math.max(...steady.temperatures))).toBeLessThan(1e-6);
    expect(Math.abs(last.hotSpotC - (40 + (q * r0 * r0) / 4))).toBeLessThan(0.01);
  });
});

/**
 * Fault heating (lib/thermal/transientRuns.ts faultHeating) against the adiabatic method of
 * IEC 60949: θ_f = (θ_i + β)·exp(I²t/(K²S²)) − β (lib/electrical shortCircuitFinalTemperature).
 * The adiabatic equation is the heat balance σ_c·dθ/dt = J²ρ₂₀(θ + β)/(20 + β) of a conductor
 * that keeps all its heat, with K² = σ_c(β + 20)/ρ₂₀ (IEC 60949, from memory); the test gives the
 * copper those very constants (ρ₂₀ = 1.7241e-8 Ω·m, β = 234.5 K, K = 226 A·s½/mm²), so the
 * conductor-only transient must reproduce the IEC figure to its time-step error.
 * XLPE: thermal resistivity 3.5 K·m/W (IEC 60287-2-1 Table 1, from memory), volumetric heat
 * capacity 2.4e6 J/(m³·K) (IEC 60949 Table, from memory).
 */
import { describe, expect, it } from 'vitest';
import { shortCircuitFinalTemperature } from '@/lib/electrical';
import { faultHeating, type ThermalProblem } from '@/lib/thermal';

const RHO20 = 1.7241e-8;
const BETA = 234.5;
const K_IEC = 226e6; // A·s½/m²
const SIGMA_C = (K_IEC * K_IEC * RHO20) / (BETA + 20); // J/(m³·K)

function cable(sectionMm2: number): ThermalProblem {
  const area = sectionMm2 * 1e-6;
  const r0 = Math.sqrt(area / Math.PI);
  return {
    geometry: {
      kind: 'cylinder',
      layers: [
        { thickness: r0, conductivity: 390, generating: true, cells: 20, density: 8960, heatCapacity: SIGMA_C / 8960, name: 'conductor' },
        { thickness: 2.6e-3, conductivity: 1 / 3.5, cells: 60, density: 1000, heatCapacity: 2400, name: 'XLPE' },
      ],
    },
    source: { kind: 'joule', current: 0, area, rho20: RHO20, alpha20: 1 / (BETA + 20) },
    inner: { kind: 'symmetry' },
    outer: { kind: 'surface', ambient: 30, h: 10 },
  };
}

describe('fault heating vs IEC 60949', () => {
  const S = 240;
  const I = 30e3;
  const t = 1;
  const iec = shortCircuitFinalTemperature({ material: 'copper', current: I, duration: t, section: S, initial: 90 });

  it('with no heat leaving the conductor the transient equals the adiabatic result', () => {
    const r = faultHeating({ problem: cable(S), faultCurrentA: I, durationS: t, initialC: 90 });
    // ≈ 206 °C; implicit-Euler error with 1000 steps: (I²t/K²S²)²/(2·1000)·(θ_f + β) ≈ 0.02 K.
    expect(iec).toBeGreaterThan(200);
    expect(Math.abs(r.finalAdiabaticC - iec)).toBeLessThan(0.05);
    expect(Math.abs(r.finalAdiabaticConductorMeanC - iec)).toBeLessThan(0.05);
  });

  it('with heat flowing into the insulation the final temperature is lower', () => {
    const r = faultHeating({ problem: cable(S), faultCurrentA: I, durationS: t, initialC: 90 });
    expect(r.finalConductorMeanC).toBeLessThan(iec - 0.5);
    expect(r.finalHotSpotC).toBeLessThan(r.finalAdiabaticC);
    // And it still heats: the insulation takes a few per cent at most in one second.
    expect(r.finalHotSpotC).toBeGreaterThan(90 + 0.9 * (iec - 90));
  });

  it('longer faults lose relatively more to the insulation', () => {
    const short = faultHeating({ problem: cable(S), faultCurrentA: I, durationS: 0.5, initialC: 90, steps: 400 });
    const long = faultHeating({ problem: cable(S), faultCurrentA: I / Math.sqrt(8), durationS: 4, initialC: 90, steps: 400 });
    // Same I²t: adiabatic rises equal; the longer fault gives the insulation more time.
    expect(Math.abs(short.finalAdiabaticC - long.finalAdiabaticC)).toBeLessThan(0.1);
    expect(long.finalAdiabaticC - long.finalHotSpotC).toBeGreaterThan(short.finalAdiabaticC - short.finalHotSpotC);
  });
});

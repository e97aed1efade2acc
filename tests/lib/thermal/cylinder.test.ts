/**
 * Cylinders against closed forms.
 * Sources: Incropera et al., Fundamentals of Heat and Mass Transfer, §3.3.1 (cylindrical wall,
 * R' = ln(r2/r1)/(2πk), in series with 1/(2πr h)) and §3.5.2 (solid cylinder with uniform
 * generation, T(r) = Ts + q'''r0²/(4k)(1 − r²/r0²)); references.md "core with generation inside an
 * insulating layer with surface convection".
 */
import { describe, expect, it } from 'vitest';
import { solveSteady, type ThermalProblem } from '@/lib/thermal';
import { maxNodalError, observedOrders } from './helpers';

describe('cylindrical wall, conduction only (Incropera §3.3.1)', () => {
  it('reproduces the logarithmic profile of a two-layer tube to 1e-9 K', () => {
    const r1 = 0.01;
    const r2 = 0.014;
    const r3 = 0.02;
    const k1 = 0.3;
    const k2 = 0.05;
    const r = solveSteady({
      geometry: {
        kind: 'cylinder',
        innerRadius: r1,
        layers: [
          { thickness: r2 - r1, conductivity: k1, cells: 9 },
          { thickness: r3 - r2, conductivity: k2, cells: 17 },
        ],
      },
      source: { kind: 'uniform', q: 0 },
      inner: { kind: 'temperature', value: 90 },
      outer: { kind: 'temperature', value: 30 },
    });
    const R1 = Math.log(r2 / r1) / (2 * Math.PI * k1);
    const R2 = Math.log(r3 / r2) / (2 * Math.PI * k2);
    const heat = (90 - 30) / (R1 + R2); // W/m
    const exact = (rad: number) =>
      rad <= r2 ? 90 - (heat * Math.log(rad / r1)) / (2 * Math.PI * k1) : 90 - heat * R1 - (heat * Math.log(rad / r2)) / (2 * Math.PI * k2);
    expect(maxNodalError(r, exact)).toBeLessThan(1e-9);
    expect(r.heatBalance.leavingOuter).toBeCloseTo(heat, 9);
    expect(r.heatBalance.unit).toBe('W/m');
  });
});

describe('solid cylinder with uniform generation (Incropera §3.5.2)', () => {
  const r0 = 0.01;
  const k = 2;
  const q = 4e6; // W/m³: q'''r0²/(4k) = 50 K
  const ts = 40;
  const problem = (cells: number): ThermalProblem => ({
    geometry: { kind: 'cylinder', layers: [{ thickness: r0, conductivity: k, generating: true, cells }] },
    source: { kind: 'uniform', q },
    inner: { kind: 'symmetry' },
    outer: { kind: 'temperature', value: ts },
  });
  const exact = (r: number) => ts + ((q * r0 * r0) / (4 * k)) * (1 - (r * r) / (r0 * r0));

  it('error falls at second order (measured order ≥ 1.9), starting from r = 0', () => {
    const errors = [10, 20, 40, 80, 160].map((cells) => maxNodalError(solveSteady(problem(cells)), exact));
    for (const order of observedOrders(errors)) expect(order).toBeGreaterThanOrEqual(1.9);
    expect(errors[2]).toBeLessThan(0.05);
  });

  it('heat per metre equals q\'\'\'πr0² and leaves through the surface', () => {
    const r = solveSteady(problem(40));
    expect(r.heatGeneratedWPerM).toBeCloseTo(q * Math.PI * r0 * r0, 6);
    expect(r.heatBalance.leavingOuter).toBeCloseTo(q * Math.PI * r0 * r0, 6);
    expect(r.heatBalance.leavingInner).toBe(0);
    expect(r.hotSpot.position).toBe(r.positions[0]);
  });
});

/**
 * Core with generation inside one insulating layer, fixed surface coefficient h to T∞
 * (references.md). Heat per metre W = q'''πrc²; Ts = T∞ + W/(2πro h);
 * insulation T(r) = Ts + W ln(ro/r)/(2πki); core T(r) = T(rc) + q'''(rc² − r²)/(4kc).
 */
function coreInInsulation(args: { rc: number; ro: number; kc: number; ki: number; h: number; tInf: number; q: number }) {
  const { rc, ro, kc, ki, h, tInf, q } = args;
  const w = q * Math.PI * rc * rc;
  const tSurface = tInf + w / (2 * Math.PI * ro * h);
  const tInterface = tSurface + (w * Math.log(ro / rc)) / (2 * Math.PI * ki);
  const exact = (r: number) =>
    r <= rc ? tInterface + (q * (rc * rc - r * r)) / (4 * kc) : tSurface + (w * Math.log(ro / r)) / (2 * Math.PI * ki);
  const problem = (cells?: number): ThermalProblem => ({
    geometry: {
      kind: 'cylinder',
      layers: [
        { thickness: rc, conductivity: kc, generating: true, ...(cells ? { cells } : {}) },
        { thickness: ro - rc, conductivity: ki, ...(cells ? { cells } : {}) },
      ],
    },
    source: { kind: 'uniform', q },
    inner: { kind: 'symmetry' },
    outer: { kind: 'surface', ambient: tInf, h },
  });
  return { exact, problem, tSurface, w };
}

describe('core with generation inside an insulating layer with surface conductance (references.md)', () => {
  it('error falls at second order under refinement (measured order ≥ 1.9)', () => {
    // A poorly conducting core (2 W/(m·K)) so that the core's own ΔT, where the discretisation
    // error lives, is several kelvin.
    const c = coreInInsulation({ rc: 0.008, ro: 0.012, kc: 2, ki: 0.2857, h: 10, tInf: 30, q: 1e6 });
    const errors = [10, 20, 40, 80, 160].map((cells) => maxNodalError(solveSteady(c.problem(cells)), c.exact));
    for (const order of observedOrders(errors)) expect(order).toBeGreaterThanOrEqual(1.9);
  });

  it('is within 0.05 K at the default 40 cells per layer for a realistic cable', () => {
    // 240 mm² copper (IEC 60228 max R20 0.0754 Ω/km, from memory; conductor diameter 17.5 mm
    // assumed), XLPE ρ_T = 3.5 K·m/W (IEC 60287-2-1 Table 1, from memory), 2.6 mm insulation,
    // 500 A, h = 10 W/(m²·K) to 30 °C. Copper conductivity ~390 W/(m·K) (common practice).
    const rc = 0.0175 / 2;
    const area = Math.PI * rc * rc;
    const q = (500 / area) ** 2 * 0.0754e-3 * area; // W/m³ at R20, uniform source
    const c = coreInInsulation({ rc, ro: rc + 0.0026, kc: 390, ki: 1 / 3.5, h: 10, tInf: 30, q });
    const r = solveSteady(c.problem());
    expect(r.positions.length).toBe(80);
    expect(maxNodalError(r, c.exact)).toBeLessThan(0.05);
    expect(Math.abs(r.surfaceTemperature - c.tSurface)).toBeLessThan(1e-6);
    expect(r.heatGeneratedWPerM).toBeCloseTo(500 * 500 * 0.0754e-3, 9);
    expect(r.energyResidual).toBeLessThan(1e-9);
  });
});

/**
 * Plane walls against closed forms.
 * Source: Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer,
 * §3.1 (plane wall, composite wall) and §3.5.1 (plane wall with uniform generation).
 */
import { describe, expect, it } from 'vitest';
import { solveSteady, type ThermalProblem } from '@/lib/thermal';
import { maxNodalError, observedOrders } from './helpers';

const L = 0.05; // half-thickness, m (wall is 2L thick)
const k = 1.0; // W/(m·K)

/** Incropera §3.5.1: T(ξ) = q'''L²/(2k)(1 − ξ²/L²) + (T2 − T1)/2·ξ/L + (T1 + T2)/2, ξ ∈ [−L, L]. */
function wallWithGeneration(q: number, t1: number, t2: number) {
  return (x: number): number => {
    const xi = x - L;
    return ((q * L * L) / (2 * k)) * (1 - (xi * xi) / (L * L)) + ((t2 - t1) / 2) * (xi / L) + (t1 + t2) / 2;
  };
}

function wall(cells: number, q: number, t1: number, t2: number): ThermalProblem {
  return {
    geometry: { kind: 'slab', layers: [{ thickness: 2 * L, conductivity: k, generating: true, cells }] },
    source: { kind: 'uniform', q },
    inner: { kind: 'temperature', value: t1 },
    outer: { kind: 'temperature', value: t2 },
  };
}

describe('plane wall, conduction only (Incropera §3.1)', () => {
  it('reproduces the linear profile to 1e-9 K', () => {
    for (const cells of [1, 3, 40, 200]) {
      const r = solveSteady(wall(cells, 0, 20, 80));
      const err = maxNodalError(r, (x) => 20 + ((80 - 20) * x) / (2 * L));
      expect(err).toBeLessThan(1e-9);
      expect(r.energyResidual).toBeLessThan(1e-9);
    }
  });

  it('composite wall: interface temperatures from series resistances, exact (Incropera §3.1.2)', () => {
    // Layers 20 mm at 0.5 W/(m·K) and 30 mm at 0.05 W/(m·K) between 100 °C and 0 °C.
    const r = solveSteady({
      geometry: {
        kind: 'slab',
        layers: [
          { thickness: 0.02, conductivity: 0.5, cells: 7 },
          { thickness: 0.03, conductivity: 0.05, cells: 13 },
        ],
      },
      source: { kind: 'uniform', q: 0 },
      inner: { kind: 'temperature', value: 100 },
      outer: { kind: 'temperature', value: 0 },
    });
    const r1 = 0.02 / 0.5;
    const r2 = 0.03 / 0.05;
    const flux = 100 / (r1 + r2); // W/m²
    const exact = (x: number) => (x <= 0.02 ? 100 - (flux * x) / 0.5 : 100 - flux * r1 - (flux * (x - 0.02)) / 0.05);
    expect(maxNodalError(r, exact)).toBeLessThan(1e-9);
    expect(r.heatBalance.leavingOuter).toBeCloseTo(flux, 9);
    expect(r.heatBalance.leavingInner).toBeCloseTo(-flux, 9);
  });
});

describe('plane wall with uniform generation (Incropera §3.5.1)', () => {
  const q = 1e5; // W/m³: q'''L²/k = 250 K
  const t1 = 20;
  const t2 = 40;
  const exact = wallWithGeneration(q, t1, t2);

  it('has its interior peak above both boundary temperatures, where the closed form puts it', () => {
    const r = solveSteady(wall(60, q, t1, t2));
    // Closed form: the peak is at ξ* = (T2 − T1)k/(2q'''L) from the centre.
    const xiPeak = ((t2 - t1) * k) / (2 * q * L);
    expect(r.hotSpot.temperature).toBeGreaterThan(Math.max(t1, t2) + 100);
    expect(r.hotSpot.position).toBeGreaterThan(0);
    expect(r.hotSpot.position).toBeLessThan(2 * L);
    expect(Math.abs(r.hotSpot.position - (L + xiPeak))).toBeLessThan((2 * L) / 60);
    expect(Math.abs(r.hotSpot.temperature - exact(L + xiPeak))).toBeLessThan(0.05);
    // references.md: "for q'''L²/k of order 100 K and 60 cells across, the nodal error is a few
    // hundredths of a kelvin".
    expect(maxNodalError(r, exact)).toBeLessThan(0.05);
    expect(r.energyResidual).toBeLessThan(1e-9);
    expect(r.heatGeneratedWPerM2).toBeCloseTo(q * 2 * L, 6);
  });

  it('nodal error falls at second order (measured order ≥ 1.9)', () => {
    const errors = [10, 20, 40, 80, 160].map((cells) => maxNodalError(solveSteady(wall(cells, q, t1, t2)), exact));
    for (const order of observedOrders(errors)) expect(order).toBeGreaterThanOrEqual(1.9);
  });

  it('symmetry at the mid-plane gives the same nodes as the full symmetric wall', () => {
    const full = solveSteady(wall(80, q, 30, 30));
    const half = solveSteady({
      geometry: { kind: 'slab', layers: [{ thickness: L, conductivity: k, generating: true, cells: 40 }] },
      source: { kind: 'uniform', q },
      inner: { kind: 'symmetry' },
      outer: { kind: 'temperature', value: 30 },
    });
    half.temperatures.forEach((t, i) => expect(Math.abs(t - full.temperatures[40 + i])).toBeLessThan(1e-9));
  });

  it('convective faces: surface temperature T∞ + q\'\'\'L/h and second-order interior (Incropera §3.5.1 with convection)', () => {
    const h = 25;
    const tInf = 15;
    const problem = (cells: number): ThermalProblem => ({
      geometry: { kind: 'slab', layers: [{ thickness: 2 * L, conductivity: k, generating: true, cells }] },
      source: { kind: 'uniform', q: 2e4 },
      inner: { kind: 'surface', ambient: tInf, h },
      outer: { kind: 'surface', ambient: tInf, h },
    });
    const ts = tInf + (2e4 * L) / h;
    const exactConv = (x: number) => ((2e4 * L * L) / (2 * k)) * (1 - ((x - L) / L) ** 2) + ts;
    const errors = [10, 20, 40, 80].map((cells) => maxNodalError(solveSteady(problem(cells)), exactConv));
    for (const order of observedOrders(errors)) expect(order).toBeGreaterThanOrEqual(1.9);
    const r = solveSteady(problem(40));
    expect(r.surfaceTemperature).toBeCloseTo(ts, 9);
    expect(r.iterations).toBe(1); // linear problem: one exact pass
  });

  it('flux boundary: heat entering one face leaves by the other, linear profile exact', () => {
    const r = solveSteady({
      geometry: { kind: 'slab', layers: [{ thickness: 0.1, conductivity: 2, cells: 25 }] },
      source: { kind: 'uniform', q: 0 },
      inner: { kind: 'flux', value: 500 },
      outer: { kind: 'temperature', value: 10 },
    });
    // Fourier: T(x) = 10 + q''(0.1 − x)/k.
    expect(maxNodalError(r, (x) => 10 + (500 * (0.1 - x)) / 2)).toBeLessThan(1e-9);
    expect(r.hotSpot.position).toBe(0);
    expect(r.hotSpot.temperature).toBeCloseTo(10 + (500 * 0.1) / 2, 9);
    expect(r.heatBalance.leavingOuter).toBeCloseTo(500, 9);
  });
});

/**
 * The library contract of physics.md §7 (names and shapes) and the input errors of issue 3:
 * non-positive thickness or conductivity, NaN, empty layers, emissivity outside [0, 1],
 * temperatures below absolute zero (−273.15 °C), non-positive cells — each a ThermalInputError
 * naming the field.
 */
import { describe, expect, it } from 'vitest';
import { solveSteady, solveTransient, ThermalInputError, type ThermalProblem } from '@/lib/thermal';

const valid = (): ThermalProblem => ({
  geometry: {
    kind: 'cylinder',
    innerRadius: 0,
    layers: [
      { thickness: 0.005, conductivity: 390, generating: true, cells: 10 },
      { thickness: 0.002, conductivity: 0.3, cells: 10 },
    ],
  },
  source: { kind: 'joule', current: 100, area: Math.PI * 0.005 ** 2, rho20: 1.7241e-8, alpha20: 3.93e-3, acFactor: 1 },
  inner: { kind: 'symmetry' },
  outer: { kind: 'surface', ambient: 25, h: 8, emissivity: 0.9, convection: undefined },
  options: {},
});

describe('§7 contract shape', () => {
  it('solveSteady returns positions, temperatures, hotSpot, iterations, converged, energyResidual', () => {
    const p = valid();
    delete (p.outer as { convection?: unknown }).convection;
    const r = solveSteady(p);
    expect(Array.isArray(r.positions)).toBe(true);
    expect(Array.isArray(r.temperatures)).toBe(true);
    expect(r.positions).toHaveLength(20);
    expect(r.temperatures).toHaveLength(20);
    expect(r.positions.every((x, i) => i === 0 || x > r.positions[i - 1])).toBe(true); // radii, ascending
    expect(r.positions[19]).toBeLessThan(0.007);
    expect(typeof r.hotSpot.temperature).toBe('number');
    expect(typeof r.hotSpot.position).toBe('number');
    expect(Number.isInteger(r.iterations)).toBe(true);
    expect(r.converged).toBe(true);
    expect(r.energyResidual).toBeLessThan(1e-6);
    expect(r.runaway).toBeUndefined();
    expect(r.layerBounds).toEqual([
      { from: 0, to: 0.005 },
      { from: 0.005, to: 0.007 },
    ]);
    expect(['lagged', 'tangent']).toContain(r.linearisation);
  });

  it('solveTransient is exported and steps', () => {
    const p = valid();
    delete (p.outer as { convection?: unknown }).convection;
    p.geometry.layers.forEach((l) => Object.assign(l, { density: 2000, heatCapacity: 500 }));
    const r = solveTransient({ ...p, initial: 25, timeStep: 5, steps: 3 });
    expect(r.history.map((h) => h.time)).toEqual([5, 10, 15]);
    expect(r.temperatures).toEqual(r.history[2].temperatures);
  });
});

function fieldOf(mutate: (p: ThermalProblem) => void): string | undefined {
  const p = valid();
  delete (p.outer as { convection?: unknown }).convection;
  mutate(p);
  try {
    solveSteady(p);
  } catch (e) {
    if (e instanceof ThermalInputError) return e.field;
    throw e;
  }
  return undefined;
}

describe('invalid input throws ThermalInputError naming the field', () => {
  it.each<[string, (p: ThermalProblem) => void]>([
    ['geometry.layers[1].thickness', (p) => (p.geometry.layers[1].thickness = 0)],
    ['geometry.layers[0].thickness', (p) => (p.geometry.layers[0].thickness = -0.001)],
    ['geometry.layers[1].conductivity', (p) => (p.geometry.layers[1].conductivity = 0)],
    ['geometry.layers[0].conductivity', (p) => (p.geometry.layers[0].conductivity = NaN)],
    ['geometry.layers', (p) => (p.geometry.layers = [])],
    ['geometry.layers[1].cells', (p) => (p.geometry.layers[1].cells = 0)],
    ['geometry.layers[0].cells', (p) => (p.geometry.layers[0].cells = -4)],
    ['outer.emissivity', (p) => ((p.outer as { emissivity: number }).emissivity = 1.01)],
    ['outer.emissivity', (p) => ((p.outer as { emissivity: number }).emissivity = -0.01)],
    ['outer.ambient', (p) => ((p.outer as { ambient: number }).ambient = -273.16)],
    ['outer.h', (p) => ((p.outer as { h: number }).h = NaN)],
    ['source.current', (p) => ((p.source as { current: number }).current = NaN)],
    ['source.alpha20', (p) => ((p.source as { alpha20: number }).alpha20 = -1e-3)],
    ['source.acFactor', (p) => ((p.source as { acFactor: number }).acFactor = 0.9)],
    ['geometry.innerRadius', (p) => (p.geometry.innerRadius = -0.001)],
    ['geometry.kind', (p) => ((p.geometry as { kind: string }).kind = 'sphere')],
    // The axis of a solid cylinder has no area: only symmetry means anything there.
    ['inner.kind', (p) => (p.inner = { kind: 'temperature', value: 20 })],
    // Fixed h and a correlation at once is ambiguous.
    ['outer.h', (p) => Object.assign(p.outer, { convection: { kind: 'horizontal-cylinder' } })],
    // IEC 60287 coefficient already contains radiation.
    ['outer.emissivity', (p) => (p.outer = { kind: 'surface', ambient: 25, emissivity: 0.5, convection: { kind: 'iec-60287-free-air' } })],
    // A correlation on a slab face needs its length.
    ['outer.convection.diameter', (p) => {
      p.geometry = { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 1, generating: true }] };
      p.outer = { kind: 'surface', ambient: 25, convection: { kind: 'horizontal-cylinder' } };
    }],
    // A source with nowhere to act.
    ['geometry.layers', (p) => p.geometry.layers.forEach((l) => (l.generating = false))],
    // No path for heat to leave: no steady state exists.
    ['outer', (p) => (p.outer = { kind: 'surface', ambient: 25 })],
    ['outer', (p) => (p.outer = { kind: 'flux', value: 0 })],
    ['options.relaxation', (p) => (p.options = { relaxation: 1.5 })],
    ['options.tolerance', (p) => (p.options = { tolerance: 0 })],
    ['options.linearisation', (p) => (p.options = { linearisation: 'newton' as 'tangent' })],
  ])('%s', (field, mutate) => {
    expect(fieldOf(mutate)).toBe(field);
  });

  it('rejects a problem that is not an object', () => {
    expect(() => solveSteady(null as unknown as ThermalProblem)).toThrow(ThermalInputError);
    expect(() => solveSteady({} as ThermalProblem)).toThrow(/geometry/);
  });
});

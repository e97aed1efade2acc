import { describe, expect, it } from 'vitest';
import { prepare, solveSteady, type ThermalProblem } from '@/lib/thermal';

/**
 * Heat released at a radius inside a cylindrical body (a cable screen's loss): with the outer face
 * held at T_o and nothing else heating, all of Q flows outward from r_s, so everything inside r_s
 * sits at T_o + Q·ln(r_o/r_s)/(2πk) and the profile outside is logarithmic (Incropera §3.3.1,
 * conduction in a cylindrical wall: R' = ln(r₂/r₁)/(2πk)). The finite volumes release the heat at
 * the centre of the cell holding r_s, so the match is to the cell's width.
 */
describe('point sources (heat released at a position of the body)', () => {
  const k = 0.2;
  const rCore = 0.01;
  const wall = 0.01;
  const rS = 0.015;
  const outerC = 20;
  const heatWPerM = 12;
  const problem = (cells: number): ThermalProblem => ({
    geometry: {
      kind: 'cylinder',
      layers: [
        { thickness: rCore, conductivity: 400, generating: true, cells: 10 },
        { thickness: wall, conductivity: k, cells },
      ],
    },
    source: { kind: 'uniform', q: 0 },
    inner: { kind: 'symmetry' },
    outer: { kind: 'temperature', value: outerC },
    pointSources: [{ position: rS, heat: heatWPerM }],
  });

  it('a point heat inside the wall lifts everything inside it by Q·ln(r_o/r_s)/(2πk) (Incropera §3.3.1)', () => {
    const exact = outerC + (heatWPerM * Math.log((rCore + wall) / rS)) / (2 * Math.PI * k);
    const r = solveSteady(problem(400));
    expect(r.converged).toBe(true);
    // 400 cells over 10 mm: the heat lands within half a cell (12.5 µm) of r_s, which moves the
    // rise by at most ln(1 + 12.5 µm/r_s)/ln(r_o/r_s) (the same wall law).
    const halfCellM = wall / 400 / 2;
    const bound = Math.log(1 + halfCellM / rS) / Math.log((rCore + wall) / rS);
    expect(Math.abs(r.hotSpot.temperature - exact) / (exact - outerC)).toBeLessThan(1.05 * bound);
    // The energy balance counts the point heat: it all leaves through the outer face.
    expect(r.heatBalance ? Math.abs(r.energyResidual) : 0).toBeLessThan(1e-6);
  });

  it('a prepared problem takes another heat per call (the screen loss follows the current)', () => {
    const p = prepare({ ...problem(100), source: { kind: 'joule', current: 0, area: Math.PI * rCore * rCore, rho20: 1.7241e-8, alpha20: 3.93e-3 } });
    const once = p.at(0, 1, { pointHeats: [heatWPerM] });
    const twice = p.at(0, 1, { pointHeats: [2 * heatWPerM] });
    // Linear conduction: twice the heat, twice the rise.
    expect(twice.hotSpot.temperature - outerC).toBeCloseTo(2 * (once.hotSpot.temperature - outerC), 9);
    expect(() => p.at(0, 1, { pointHeats: [] })).toThrow(/pointHeats/);
    expect(() => solveSteady({ ...problem(20), pointSources: [{ position: 0.05, heat: 1 }] })).toThrow(/pointSources\[0\]\.position/);
  });
});

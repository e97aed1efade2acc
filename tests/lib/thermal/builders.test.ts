/**
 * Problems built from catalogue-like data (physics.md §3).
 * Check values: IEC 60228 Table 2 copper resistances and IEC 60287 thermal resistivities (both
 * from memory, as listed in references.md); IEC 60287-2-1 T4 worked by hand in surfaces.test.ts;
 * copper conductivity and density (common practice).
 */
import { describe, expect, it } from 'vitest';
import {
  busBarProblem,
  cableProblem,
  evaluateConvection,
  radiationCoefficient,
  solveSteady,
  ThermalInputError,
  type BusBarInput,
  type CableInput,
  type SteadyResult,
} from '@/lib/thermal';

/** Volume-weighted mean temperature of the equal cells filling [from, to] (ring volumes ∝ r_e² − r_w²). */
function meanOver(r: SteadyResult, from: number, to: number, cylinder: boolean): number {
  const inside = r.temperatures.filter((_, i) => r.positions[i] > from && r.positions[i] < to);
  const n = inside.length;
  let sum = 0;
  let weight = 0;
  inside.forEach((t, k) => {
    const w = from + ((to - from) * k) / n;
    const e = from + ((to - from) * (k + 1)) / n;
    const v = cylinder ? e * e - w * w : e - w;
    sum += v * t;
    weight += v;
  });
  return sum / weight;
}

const cable240 = (outer: CableInput['outer'], currentA = 500): CableInput => ({
  conductorDiameterM: 0.0175, // assumed effective diameter of a 240 mm² stranded conductor
  currentA,
  r20OhmPerM: 0.0754e-3, // IEC 60228, 240 mm² Cu class 2 max (from memory)
  alpha20PerK: 3.93e-3, // IEC 60287-1-1 Table 1
  acFactor: 1.02,
  conductorConductivity: 390,
  layers: [
    { name: 'XLPE', thicknessM: 0.0026, thermalResistivityKmPerW: 3.5 }, // IEC 60287-2-1 Table 1 (from memory)
    { name: 'PVC sheath', thicknessM: 0.0018, thermalResistivityKmPerW: 5.0 }, // IEC 60287-2-1 Table 1 (from memory)
  ],
  outer,
});

describe('cableProblem', () => {
  it('builds a solid Joule-heated conductor with ρ20 = R20·A from the catalogue resistance', () => {
    const p = cableProblem(cable240({ kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' } }));
    expect(p.geometry.kind).toBe('cylinder');
    expect(p.geometry.innerRadius).toBe(0);
    expect(p.inner).toEqual({ kind: 'symmetry' });
    expect(p.geometry.layers[0]).toMatchObject({ name: 'conductor', thickness: 0.00875, generating: true, conductivity: 390 });
    expect(p.geometry.layers[1].conductivity).toBeCloseTo(1 / 3.5, 15);
    const area = Math.PI * 0.00875 ** 2;
    expect(p.source).toMatchObject({ kind: 'joule', current: 500, alpha20: 3.93e-3, acFactor: 1.02 });
    const source = p.source as { area: number; rho20: number };
    expect(source.area / area).toBeCloseTo(1, 14);
    expect(source.rho20 / source.area).toBeCloseTo(0.0754e-3, 15);
    const r = solveSteady(p);
    expect(r.converged).toBe(true);
    // Heat per metre is I²R(T)·F_ac of the catalogue R20 at the conductor's mean temperature.
    const tMean = meanOver(r, 0, 0.00875, true);
    expect(r.heatGeneratedWPerM! / (500 ** 2 * 0.0754e-3 * (1 + 3.93e-3 * (tMean - 20)) * 1.02)).toBeCloseTo(1, 12);
    expect(r.layerBounds.map((b) => b.name)).toEqual(['conductor', 'XLPE', 'PVC sheath']);
    expect(r.layerBounds[2].to).toBeCloseTo(0.0175 / 2 + 0.0026 + 0.0018, 12);
    expect(r.surface.outer!.correlation).toMatch(/Churchill–Chu horizontal cylinder/);
  });

  it('buried: the surface rises above the ground by W·T4 with T4 of IEC 60287-2-1 (hand value 0.718654 K·m/W)', () => {
    // Layers chosen so that De = 35 mm, the diameter of the hand-worked T4.
    const input = cable240({ kind: 'buried', soilResistivityKmPerW: 1.0, depthM: 0.8, groundC: 20 });
    input.layers = [
      { name: 'XLPE', thicknessM: 0.0026, thermalResistivityKmPerW: 3.5 },
      { name: 'PVC sheath', thicknessM: 0.035 / 2 - 0.00875 - 0.0026, thermalResistivityKmPerW: 5.0 },
    ];
    const r = solveSteady(cableProblem(input));
    expect(r.converged).toBe(true);
    expect(Math.abs((r.surfaceTemperature - 20) / (r.heatGeneratedWPerM! * 0.718654) - 1)).toBeLessThan(1e-5);
    // Soil is a fixed conductance: the exact runaway onset is available.
    expect(r.runawayOnsetCurrentA).toBeGreaterThan(500);
    expect(r.flags.some((f) => f.code === 'buried-constant-soil')).toBe(true);
  });

  it('solar gain αH·De per metre is added at the surface', () => {
    const shaded = cable240({ kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'forced', windMps: 0.5 } });
    const sunny = cable240({ kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'forced', windMps: 0.5 }, solarWPerM2: 1000, absorptivity: 0.6 });
    const r0 = solveSteady(cableProblem(shaded));
    const r = solveSteady(cableProblem(sunny));
    expect(r.hotSpot.temperature).toBeGreaterThan(r0.hotSpot.temperature + 1);
    const s = r.surface.outer!;
    const de = 0.0175 + 2 * (0.0026 + 0.0018);
    // Gross loss by convection and radiation = Joule heat + absorbed solar, per metre.
    const gross = (s.hConv + s.hRad) * (s.temperature - 30) * Math.PI * de;
    expect(gross / (r.heatGeneratedWPerM! + 0.6 * 1000 * de)).toBeCloseTo(1, 5);
    expect(s.correlation).toMatch(/Churchill–Bernstein/);
  });

  it('a sunlit cable carrying no current settles above ambient, with no runaway (regression)', () => {
    // Net flows are ~0 here (absorbed = lost); the energy balance must be scaled by the gross flow.
    for (const currentA of [0, 1]) {
      const r = solveSteady(cableProblem(cable240({ kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' }, solarWPerM2: 900, absorptivity: 0.5 }, currentA)));
      expect(r.converged).toBe(true);
      expect(r.runaway).toBeUndefined();
      expect(r.hotSpot.temperature).toBeGreaterThan(35);
      expect(r.energyResidual).toBeLessThan(1e-6);
    }
  });

  it('IEC free-air surface: emissivity set aside and said so', () => {
    const p = cableProblem(cable240({ kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'iec-60287-free-air' } }));
    expect(p.outer).toMatchObject({ kind: 'surface', emissivity: 0 });
    expect(p.assumptions!.some((f) => f.code === 'iec-coefficient-includes-radiation')).toBe(true);
    expect(solveSteady(p).converged).toBe(true);
  });

  const fieldOf = (f: () => unknown): string | undefined => {
    try {
      f();
    } catch (e) {
      if (e instanceof ThermalInputError) return e.field;
      throw e;
    }
    return undefined;
  };
  const air: CableInput['outer'] = { kind: 'air', ambientC: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' } };
  it.each<[string, (c: CableInput) => void]>([
    ['conductorDiameterM', (c) => (c.conductorDiameterM = 0)],
    ['currentA', (c) => (c.currentA = NaN)],
    ['r20OhmPerM', (c) => (c.r20OhmPerM = -1)],
    ['acFactor', (c) => (c.acFactor = 0.95)],
    ['layers', (c) => (c.layers = [])],
    ['layers[1].thicknessM', (c) => (c.layers[1].thicknessM = -0.001)],
    ['layers[0].thermalResistivityKmPerW', (c) => (c.layers[0].thermalResistivityKmPerW = 0)],
    ['outer.emissivity', (c) => (c.outer = { ...air, emissivity: 1.2 } as CableInput['outer'])],
    ['outer.ambientC', (c) => (c.outer = { ...air, ambientC: -274 } as CableInput['outer'])],
    ['outer.absorptivity', (c) => (c.outer = { ...air, solarWPerM2: 800 } as CableInput['outer'])],
    ['outer.convection.windMps', (c) => (c.outer = { ...air, convection: { kind: 'forced', windMps: 0 } } as CableInput['outer'])],
    ['depthM', (c) => (c.outer = { kind: 'buried', soilResistivityKmPerW: 1, depthM: 0.005, groundC: 20 })],
  ])('rejects bad %s with a named error', (field, mutate) => {
    const c = cable240(air);
    mutate(c);
    expect(fieldOf(() => cableProblem(c))).toBe(field);
  });
});

const bar = (over: Partial<BusBarInput> = {}): BusBarInput => ({
  widthM: 0.1,
  thicknessM: 0.01,
  barsPerPhase: 1,
  currentA: 1600,
  r20OhmPerM: 1.7241e-8 / (0.1 * 0.01), // ρ20 of copper, IEC 60287-1-1 Table 1, over 100 × 10 mm
  alpha20PerK: 3.93e-3,
  acFactor: 1.05,
  conductivity: 390,
  orientation: 'edge',
  ambientC: 35,
  emissivity: 0.9,
  ...over,
});

describe('busBarProblem', () => {
  it('on edge: symmetric slab, heat per metre = (I/n)²R(T)F, losses through 2(w + t) per metre', () => {
    const p = busBarProblem(bar());
    const r = solveSteady(p);
    expect(r.converged).toBe(true);
    expect(r.geometry).toBe('slab');
    expect(Math.abs(r.faceTemperatures.inner - r.faceTemperatures.outer)).toBeLessThan(1e-9);
    const tMean = meanOver(r, 0, 0.01, false);
    const perMetre = r.heatGeneratedWPerM2! * 0.1;
    expect(perMetre / (1600 ** 2 * (1.7241e-8 / 1e-3) * (1 + 3.93e-3 * (tMean - 20)) * 1.05)).toBeCloseTo(1, 9);
    // Surface check with the library's own (separately hand-checked) correlation and σ:
    // both faces, area (w + t) each per metre after lumping the edges.
    const ts = r.surfaceTemperature;
    const h = evaluateConvection({ kind: 'vertical-plate', height: 0.1 }, ts, 35).h + radiationCoefficient({ emissivity: 0.9, surfaceC: ts, surroundingsC: 35 });
    expect((2 * (0.1 + 0.01) * h * (ts - 35)) / perMetre).toBeCloseTo(1, 6);
    expect(r.surface.outer!.correlation).toMatch(/vertical plate/);
  });

  it('laid flat: the lower face (poorer convection, Incropera §9.6.2) runs hotter than the upper', () => {
    const r = solveSteady(busBarProblem(bar({ orientation: 'flat' })));
    expect(r.converged).toBe(true);
    expect(r.surface.inner!.hConv).toBeLessThan(r.surface.outer!.hConv);
    expect(r.faceTemperatures.inner).toBeGreaterThan(r.faceTemperatures.outer);
    expect(r.surface.inner!.correlation).toMatch(/lower face/);
    expect(r.surface.outer!.correlation).toMatch(/upper face/);
  });

  it('coating: three layers, coating emissivity, coating ΔT appears', () => {
    const p = busBarProblem(bar({ coating: { thicknessM: 0.5e-3, conductivity: 0.2, emissivity: 0.95 }, emissivity: 0.1 }));
    expect(p.geometry.layers.map((l) => l.name)).toEqual(['coating', 'bar', 'coating']);
    expect(p.outer).toMatchObject({ emissivity: 0.95, areaFactor: (0.1 + 0.002 + 0.01) / 0.1 });
    const r = solveSteady(p);
    expect(r.hotSpot.temperature - r.surfaceTemperature).toBeGreaterThan(0.1);
  });

  it('several bars per phase: current shared, optimism flagged', () => {
    const p = busBarProblem(bar({ barsPerPhase: 2, currentA: 3200 }));
    expect(p.source).toMatchObject({ current: 1600 });
    expect(p.assumptions!.some((f) => f.code === 'multi-bar-pack' && f.severity === 'warning')).toBe(true);
  });

  it.each<[string, Partial<BusBarInput>]>([
    ['widthM', { widthM: 0 }],
    ['barsPerPhase', { barsPerPhase: 0 }],
    ['orientation', { orientation: 'sideways' as 'edge' }],
    ['emissivity', { emissivity: -0.1 }],
    ['coating.emissivity', { coating: { thicknessM: 1e-3, conductivity: 0.2, emissivity: 2 } }],
    ['ambientC', { ambientC: -300 }],
    ['windMps', { windMps: -1 }],
  ])('rejects bad %s with a named error', (field, over) => {
    let thrown: unknown;
    try {
      busBarProblem(bar(over));
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(ThermalInputError);
    expect((thrown as ThermalInputError).field).toBe(field);
  });
});

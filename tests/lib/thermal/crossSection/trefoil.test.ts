/**
 * Three circuits, each a touching trefoil, in uniform soil, with temperature-dependent losses.
 * Outside reference: IEC 60287-2-1 §4.2.3 superposition (helpers.ts, worked there), and for the
 * conductor IEC 60287-1-1 eq. (1) without dielectric or sheath losses: θ_c − θ_s = W_c·(T1 + T3),
 * T1, T3 = ρ/(2π)·ln(D_out/D_in) of insulation and sheath, W_c = I²R₂₀[1 + α(θ_c − 20)]·F_ac,
 * iterated here to its fixed point.
 */
import { describe, expect, it } from 'vitest';
import { solveCrossSection } from '@/lib/thermal/crossSection';
import {
  CABLE_D,
  CONDUCTOR_D,
  COPPER_ALPHA,
  INSULATION_D,
  PVC_RHO,
  R20_240_OHM_PER_M,
  XLPE_RHO,
  exampleCable,
  layerResistance,
  superpositionRise,
  trefoil,
  uniformGround,
} from './helpers';

const RHO = 1.0;
const CURRENT = 480;
const CENTRES = [-0.3, 0, 0.3].flatMap((x) => trefoil(x, 1.0, CABLE_D));

function iecConductorTemperatures(): number[] {
  const internal = layerResistance(XLPE_RHO, CONDUCTOR_D, INSULATION_D) + layerResistance(PVC_RHO, INSULATION_D, CABLE_D);
  let conductor = CENTRES.map(() => 90);
  for (let pass = 0; pass < 200; pass++) {
    const watts = conductor.map((t) => CURRENT ** 2 * R20_240_OHM_PER_M * (1 + COPPER_ALPHA * (t - 20)) * 1.02);
    const surface = superpositionRise(CENTRES, CABLE_D, watts, RHO);
    conductor = surface.map((rise, k) => 20 + rise + watts[k] * internal);
  }
  return conductor;
}

describe('three trefoil circuits in uniform soil (IEC 60287-2-1 §4.2.3 superposition)', () => {
  const result = solveCrossSection(uniformGround(RHO, CENTRES.map((c) => exampleCable(c.x, c.depth, CURRENT))));
  if (!result.converged) throw new Error(result.message);

  it('every cable surface rise within 2 % of the superposition at the solved losses', () => {
    const watts = result.cables.map((c) => c.losses.totalWPerM);
    const iec = superpositionRise(CENTRES, CABLE_D, watts, RHO);
    result.cables.forEach((cable, k) => expect(Math.abs((cable.surfaceC - 20) / iec[k] - 1)).toBeLessThan(0.02));
  });

  it('every conductor rise within 2 % of IEC 60287-1-1 eq. (1) iterated with the superposition', () => {
    const iec = iecConductorTemperatures();
    result.cables.forEach((cable, k) => expect(Math.abs((cable.conductorC - 20) / (iec[k] - 20) - 1)).toBeLessThan(0.02));
    // The governing cable is one of the middle circuit's (both methods agree on which circuit).
    const hottestIec = iec.indexOf(Math.max(...iec));
    expect(Math.floor(result.governing!.index / 3)).toBe(Math.floor(hottestIec / 3));
  });

  it('the energy balance closes to 1e-6 and the losses follow R(T) = R₂₀[1 + α(T − 20)]·F_ac', () => {
    expect(result.heat.energyResidual).toBeLessThan(1e-6);
    for (const cable of result.cables) {
      const expected = CURRENT ** 2 * R20_240_OHM_PER_M * (1 + COPPER_ALPHA * (cable.conductorC - 20)) * 1.02;
      expect(cable.losses.conductorWPerM).toBeCloseTo(expected, 9);
    }
  });
});

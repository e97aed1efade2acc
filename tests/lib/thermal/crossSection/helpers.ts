/**
 * Shared inputs and hand-worked reference formulae for the cross-section tests. The cable is an
 * EXAMPLE (illustrative dimensions of a single-core 240 mm² copper XLPE cable, not a catalogue
 * entry); every check value comes from a formula written out here or in the test, never from
 * the library.
 */
import type { CrossSectionCable, CrossSectionInput } from '@/lib/thermal/crossSection';

/** IEC 60287-1-1 Table 1: copper α₂₀ = 3.93e-3 /K. */
export const COPPER_ALPHA = 3.93e-3;
/** IEC 60228 Table 2, class 2 copper 240 mm² (references.md, from memory): 0.0754 Ω/km. */
export const R20_240_OHM_PER_M = 0.0754e-3;
/** IEC 60287-2-1 Table 1 (references.md, from memory): XLPE 3.5 K·m/W, PVC 5.0 K·m/W. */
export const XLPE_RHO = 3.5;
export const PVC_RHO = 5.0;

/** Example cable: conductor 18.4 mm, XLPE to 30 mm, PVC sheath to 36 mm (illustrative). */
export const CONDUCTOR_D = 0.0184;
export const INSULATION_D = 0.03;
export const CABLE_D = 0.036;

export function exampleCable(xM: number, depthM: number, currentA: number, extra: Partial<CrossSectionCable> = {}): CrossSectionCable {
  return {
    xM,
    depthM,
    outerDiameterM: CABLE_D,
    conductor: { diameterM: CONDUCTOR_D, r20OhmPerM: R20_240_OHM_PER_M, alpha20PerK: COPPER_ALPHA, acFactor: 1.02, currentA },
    coverings: [
      { name: 'insulation', outerDiameterM: INSULATION_D, thermalResistivityKmPerW: XLPE_RHO },
      { name: 'sheath', outerDiameterM: CABLE_D, thermalResistivityKmPerW: PVC_RHO },
    ],
    maxConductorTemperatureC: 90,
    ...extra,
  };
}

/** IEC 60287-2-1: T1 = ρ/(2π)·ln(1 + 2t/d) — written per layer as ρ/(2π)·ln(D_out/D_in). */
export function layerResistance(rho: number, dInner: number, dOuter: number): number {
  return (rho / (2 * Math.PI)) * Math.log(dOuter / dInner);
}

/** Centres of a touching trefoil (equilateral, side = De) with its centroid at (x, depth), apex up. */
export function trefoil(x: number, depth: number, de: number): Array<{ x: number; depth: number }> {
  const h = (de * Math.sqrt(3)) / 2;
  return [
    { x, depth: depth - (2 * h) / 3 },
    { x: x - de / 2, depth: depth + h / 3 },
    { x: x + de / 2, depth: depth + h / 3 },
  ];
}

/**
 * IEC 60287-2-1 §4.2.3 superposition (Kennelly's images), worked here: the rise of cable p's
 * surface over the ambient ground is
 *   ΔT_p = W_p·ρ/(2π)·ln(u_p + √(u_p² − 1)) + Σ_{k≠p} W_k·ρ/(2π)·ln(d′_pk/d_pk),
 * u_p = 2L_p/De, d_pk the distance between the centres, d′_pk from p to the image of k above
 * the surface.
 */
export function superpositionRise(centres: Array<{ x: number; depth: number }>, de: number, watts: number[], rho: number): number[] {
  return centres.map((p, ip) => {
    let rise = 0;
    centres.forEach((k, ik) => {
      if (ip === ik) {
        const u = (2 * p.depth) / de;
        rise += ((watts[ik] * rho) / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
      } else {
        const d = Math.hypot(p.x - k.x, p.depth - k.depth);
        const dImage = Math.hypot(p.x - k.x, p.depth + k.depth);
        rise += ((watts[ik] * rho) / (2 * Math.PI)) * Math.log(dImage / d);
      }
    });
    return rise;
  });
}

export function uniformGround(rho: number, cables: CrossSectionCable[], extra: Partial<CrossSectionInput> = {}): CrossSectionInput {
  return {
    domain: { widthM: 100, depthM: 50 },
    soil: { thermalResistivityKmPerW: rho },
    cables,
    surface: { kind: 'isothermal', temperatureC: 20 },
    deepGroundTemperatureC: 20,
    ...extra,
  };
}

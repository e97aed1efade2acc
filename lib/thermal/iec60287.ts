/**
 * IEC 60287-2-1 (thermal resistance) formulae used beside the finite-volume model. Cited from
 * memory: the formulae and constants as recalled, not read from the standard at hand, and clause
 * numbers are left out because they moved between editions.
 */
import { iecFreeAirCoefficient } from './convection';
import { ThermalInputError } from './errors';
import { IEC_FREE_AIR_SINGLE_CABLE, requireFinite, requireNonNegative, requirePositive } from './validate';

export { IEC_FREE_AIR_SINGLE_CABLE };

/**
 * IEC 60287-2-1, insulation of a single-core cable: T1 = ρ_T/(2π)·ln(1 + 2t₁/d_c), K·m/W
 * (references.md lists it with IEC 60287-1-1).
 */
export function insulationThermalResistance(args: {
  thermalResistivityKmPerW: number;
  conductorDiameterM: number;
  thicknessM: number;
}): number {
  const rho = requirePositive(args.thermalResistivityKmPerW, 'thermalResistivityKmPerW');
  const d = requirePositive(args.conductorDiameterM, 'conductorDiameterM');
  const t = requirePositive(args.thicknessM, 'thicknessM');
  return (rho / (2 * Math.PI)) * Math.log(1 + (2 * t) / d);
}

/**
 * IEC 60287-2-1, single isolated buried cable: T4 = ρ_soil/(2π)·ln(u + √(u² − 1)), u = 2L/De,
 * K·m/W (L = depth of the cable axis).
 */
export function buriedExternalThermalResistance(args: {
  soilResistivityKmPerW: number;
  depthM: number;
  externalDiameterM: number;
}): number {
  const rho = requirePositive(args.soilResistivityKmPerW, 'soilResistivityKmPerW');
  const depth = requirePositive(args.depthM, 'depthM');
  const de = requirePositive(args.externalDiameterM, 'externalDiameterM');
  const u = (2 * depth) / de;
  if (!(u > 1)) throw new ThermalInputError('depthM', 'the cable axis must lie deeper than its radius (u = 2L/De > 1)');
  return (rho / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
}

export interface IecFreeAirResult {
  /** Δθs, K: surface temperature rise above ambient. */
  surfaceRiseK: number;
  /** h = Z/De^g + E, W/(m²·K^(5/4)). */
  coefficient: number;
  /** T4* = 1/(π De h Δθs^¼), K·m/W. */
  externalThermalResistanceKmPerW: number;
  /** K_A = π De h · internal resistance. */
  KA: number;
  iterations: number;
  /** Heat leaving per metre implied by Δθs: π De h Δθs^(5/4), W/m. */
  heatPerMetreW: number;
}

/**
 * IEC 60287-2-1, cable in free air shielded from solar radiation: the surface rise Δθs follows
 * from the permissible conductor rise Δθ by the iteration
 *   (Δθs)^¼_{n+1} = [(Δθ + Δθd)/(1 + K_A (Δθs)^¼_n)]^¼,   starting at (Δθs)^¼ = 2,
 *   K_A = π De h · T_int,  T_int = [T1/n + T2(1 + λ1) + T3(1 + λ1 + λ2)]/(1 + λ1 + λ2).
 * The map contracts (its slope is below ¼), so it always converges; the standard stops at a
 * change of 0.001, this stops at `tolerance` (default 1e-12) because it serves as a cross-check.
 * Constants Z, E, g default to "single cable" of Table 2 (from memory: 0.21, 3.94, 0.60).
 */
export function iecFreeAirSurfaceRise(args: {
  externalDiameterM: number;
  conductorRiseK: number;
  internalThermalResistanceKmPerW: number;
  dielectricRiseK?: number;
  Z?: number;
  E?: number;
  g?: number;
  tolerance?: number;
}): IecFreeAirResult {
  const de = requirePositive(args.externalDiameterM, 'externalDiameterM');
  const rise = requirePositive(args.conductorRiseK, 'conductorRiseK');
  const tInt = requireNonNegative(args.internalThermalResistanceKmPerW, 'internalThermalResistanceKmPerW');
  const dielectric = args.dielectricRiseK === undefined ? 0 : requireNonNegative(args.dielectricRiseK, 'dielectricRiseK');
  const Z = args.Z === undefined ? IEC_FREE_AIR_SINGLE_CABLE.Z : requirePositive(args.Z, 'Z');
  const E = args.E === undefined ? IEC_FREE_AIR_SINGLE_CABLE.E : requireNonNegative(args.E, 'E');
  const g = args.g === undefined ? IEC_FREE_AIR_SINGLE_CABLE.g : requireFinite(args.g, 'g');
  const tolerance = args.tolerance === undefined ? 1e-12 : requirePositive(args.tolerance, 'tolerance');

  const coefficient = iecFreeAirCoefficient({ externalDiameterM: de, Z, E, g });
  const KA = Math.PI * de * coefficient * tInt;
  let root = 2;
  let iterations = 0;
  for (; iterations < 1000; iterations++) {
    const next = ((rise + dielectric) / (1 + KA * root)) ** 0.25;
    const change = Math.abs(next - root);
    root = next;
    if (change <= tolerance) {
      iterations++;
      break;
    }
  }
  const surfaceRiseK = root ** 4;
  return {
    surfaceRiseK,
    coefficient,
    externalThermalResistanceKmPerW: 1 / (Math.PI * de * coefficient * root),
    KA,
    iterations,
    heatPerMetreW: Math.PI * de * coefficient * surfaceRiseK ** 1.25,
  };
}

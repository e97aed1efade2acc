/**
 * Conductor material constants, each with the source it came from.
 *
 * "From memory" means the value was recalled, not read from the document at hand
 * (see /work/shared/design/references.md); the label is kept so a reviewer can check it.
 */
import { ElectricalInputError } from './errors';

export type ConductorMaterial = 'copper' | 'aluminium';

export interface ConductorMaterialConstants {
  /** Resistivity at 20 °C, Ω·m — IEC 60287-1-1 Table 1. */
  rho20OhmM: number;
  /** Temperature coefficient of resistance at 20 °C, 1/K — IEC 60287-1-1 Table 1. */
  alpha20PerK: number;
  /** IEC 60949 Table 1 constant K, A·s½/mm² (from memory). */
  adiabaticKConstant: number;
  /** IEC 60949 Table 1 reciprocal of the temperature coefficient at 0 °C, β in K (from memory). */
  betaK: number;
  /**
   * Resistivity in normal service used by IEC 60364-5-52 Annex G, Ω·m. Annex G states the
   * values 0.0225 Ω·mm²/m (copper) and 0.036 Ω·mm²/m (aluminium) and calls them 1.25 times the
   * resistivity at 20 °C. They are a little above 1.25 × the IEC 60287 ρ₂₀ (0.02155 and 0.03533)
   * because Annex G rounds up; we use the stated Annex G values (larger, so conservative) and
   * allow an override per call.
   */
  annexGRho1OhmM: number;
  /**
   * Density, kg/m³: copper 8890 (IEC 60028 annealed copper standard, 8.89 g/cm³ at 20 °C),
   * aluminium 2703 (IEC 60889 hard-drawn aluminium wire, 2.703 g/cm³) — both from memory.
   */
  densityKgPerM3: number;
  /**
   * Thermal conductivity of the metal, W/(m·K) — pure copper 401, pure aluminium 237
   * (Incropera et al., Table A.1 at 300 K, from memory). Only the tiny temperature drop inside
   * the conductor depends on it.
   */
  thermalConductivityWPerMK: number;
}

export const CONDUCTOR_MATERIALS: Readonly<Record<ConductorMaterial, Readonly<ConductorMaterialConstants>>> =
  Object.freeze({
    copper: Object.freeze({
      rho20OhmM: 1.7241e-8,
      alpha20PerK: 3.93e-3,
      adiabaticKConstant: 226,
      betaK: 234.5,
      annexGRho1OhmM: 0.0225e-6,
      densityKgPerM3: 8890,
      thermalConductivityWPerMK: 401,
    }),
    aluminium: Object.freeze({
      rho20OhmM: 2.8264e-8,
      alpha20PerK: 4.03e-3,
      adiabaticKConstant: 148,
      betaK: 228,
      annexGRho1OhmM: 0.036e-6,
      densityKgPerM3: 2703,
      thermalConductivityWPerMK: 237,
    }),
  });

export function materialConstants(material: unknown, field = 'material'): Readonly<ConductorMaterialConstants> {
  if (material === 'copper' || material === 'aluminium') return CONDUCTOR_MATERIALS[material];
  throw new ElectricalInputError(field, `must be 'copper' or 'aluminium' (got ${String(material)})`);
}

/** Magnetic constant μ₀ (H/m). The 2019 SI value differs from 4π·1e-7 by ~1e-10, irrelevant here. */
export const MU0 = 4 * Math.PI * 1e-7;

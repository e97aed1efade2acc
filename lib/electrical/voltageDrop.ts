/**
 * Voltage drop, IEC 60364-5-52 Annex G:
 *   u = b(ρ₁·L/S·cosφ + λ·L·sinφ)·I_B,   Δu% = 100·u/U₀
 * b = 1 for three-phase circuits, 2 for single-phase; ρ₁ the resistivity in normal service
 * (Annex G: 0.0225 Ω·mm²/m copper, 0.036 aluminium, "1.25 × ρ₂₀"); λ = 0.08 mΩ/m when not
 * known; U₀ the line-to-neutral voltage. sinφ is taken positive (lagging load), which adds the
 * reactive drop as Annex G does.
 */
import { ElectricalInputError, requireFinite, requireNonNegative, requirePositive, requireRange } from './errors';
import { materialConstants, type ConductorMaterial } from './materials';

export const ANNEX_G_DEFAULT_REACTANCE_OHM_PER_M = 0.08e-3;

export interface VoltageDropResult {
  volts: number;
  percent: number;
}

export function voltageDrop(args: {
  phases: 1 | 3;
  current: number;
  length: number;
  /** Conductor section per phase, mm² (parallel conductors: the sum). */
  section: number;
  material: ConductorMaterial;
  powerFactor: number;
  /** Reactance per unit length λ, Ω/m (default 0.08e-3). */
  reactance?: number;
  /** U₀, line to neutral, V. */
  nominalVoltage: number;
  /** Override for ρ₁ in Ω·m (e.g. 1.25 × a datasheet resistivity); default the Annex G value. */
  resistivity?: number;
}): VoltageDropResult {
  const phases = requireFinite(args?.phases, 'phases');
  if (phases !== 1 && phases !== 3) throw new ElectricalInputError('phases', `must be 1 or 3 (got ${phases})`);
  const current = requireNonNegative(args.current, 'current');
  const length = requireNonNegative(args.length, 'length');
  const section = requirePositive(args.section, 'section');
  const m = materialConstants(args.material);
  const cosPhi = requireRange(args.powerFactor, 'powerFactor', 0, 1);
  const lambda = args.reactance === undefined ? ANNEX_G_DEFAULT_REACTANCE_OHM_PER_M : requireNonNegative(args.reactance, 'reactance');
  const u0 = requirePositive(args.nominalVoltage, 'nominalVoltage');
  const rho1 = args.resistivity === undefined ? m.annexGRho1OhmM : requirePositive(args.resistivity, 'resistivity');
  const b = phases === 3 ? 1 : 2;
  const sinPhi = Math.sqrt(Math.max(0, 1 - cosPhi * cosPhi));
  const sectionM2 = section * 1e-6;
  const volts = b * ((rho1 * length) / sectionM2 * cosPhi + lambda * length * sinPhi) * current;
  return { volts, percent: (100 * volts) / u0 };
}

/**
 * Cables in free air, IEC 60287-2-1 §4.2.1 (ed. 1: §2.2.1), from memory:
 *   T₄* = 1 / (π·D_e·h·(Δθ_s)^¼),  h = Z/D_e^g + E  (D_e in m; Z, E, g from Table 2 by arrangement),
 * with the surface rise Δθ_s found by the clause's iteration
 *   (Δθ_s)^¼ₙ₊₁ = [(Δθ + Δθ_d + Δθ_ds) / (1 + K_A·(Δθ_s)^¼ₙ)]^¼,  (Δθ_s)^¼₀ = 2,
 *   K_A = π·D_e·h·T_int,  T_int = [T₁/n + T₂(1 + λ₁) + T₃(1 + λ₁ + λ₂)] / (1 + λ₁ + λ₂),
 *   Δθ_d = W_d·[(1/(1 + λ₁ + λ₂) − ½)·T₁ − n·T₂·λ₂/(1 + λ₁ + λ₂)],
 *   Δθ_ds = σ·D_e·H·T_int  (= σ·D_e·H·K_A/(π·D_e·h); zero when shielded from the sun).
 * The three terms follow from the heat balance at the surface, W_surface + σ·D_e·H =
 * π·D_e·h·Δθ_s^(5/4), and eq. (1) of IEC 60287-1-1 for the rise through the cable; the derivation
 * is repeated in the tests. For a group, each cable uses the group's Z, E, g and its own D_e.
 */
import { ElectricalInputError, requireFinite, requireNonNegative, requirePositive, requireInteger, requireRange } from '../errors';
import {
  FREE_AIR_CONSTANTS,
  FREE_AIR_ISOLATED_HORIZONTAL_CLEARANCE_RATIO,
  type FreeAirArrangement,
  type FreeAirConstants,
} from './constants';
import { cableCountOf, type Arrangement } from './arrangement';

/** h = Z/D_e^g + E, W/(m²·K^(5/4)), IEC 60287-2-1 §4.2.1 (from memory). */
export function freeAirHeatTransferCoefficient(args: { externalDiameterM: number; Z: number; E: number; g: number }): number {
  const de = requirePositive(args?.externalDiameterM, 'externalDiameterM');
  const Z = requireNonNegative(args.Z, 'Z');
  const E = requireNonNegative(args.E, 'E');
  const g = requireFinite(args.g, 'g');
  return Z / de ** g + E;
}

/** T_int of the iteration (K·m/W per unit of heat leaving the surface), see the file comment. */
export function internalThermalResistance(args: {
  T1: number;
  T2?: number;
  T3: number;
  cores?: number;
  lambda1?: number;
  lambda2?: number;
}): number {
  const T1 = requireNonNegative(args?.T1, 'T1');
  const T2 = requireNonNegative(args.T2 ?? 0, 'T2');
  const T3 = requireNonNegative(args.T3, 'T3');
  const n = requireInteger(args.cores ?? 1, 'cores', 1, 4);
  const l1 = requireNonNegative(args.lambda1 ?? 0, 'lambda1');
  const l2 = requireNonNegative(args.lambda2 ?? 0, 'lambda2');
  return (T1 / n + T2 * (1 + l1) + T3 * (1 + l1 + l2)) / (1 + l1 + l2);
}

export interface FreeAirExternalResult {
  /** T₄*, K·m/W. */
  T4: number;
  /** Converged Δθ_s, K (surface above ambient). */
  surfaceRiseK: number;
  /** h, W/(m²·K^(5/4)). */
  h: number;
  KA: number;
  internalResistanceKmPerW: number;
  dielectricRiseK: number;
  solarRiseK: number;
  iterations: number;
  /** Heat the surface gives off, π·D_e·h·Δθ_s^(5/4) (includes the absorbed sun), W/m. */
  surfaceHeatWPerM: number;
}

/**
 * T₄* of a cable in free air by the iteration of IEC 60287-2-1 §4.2.1 (see the file comment).
 * `conductorRiseK` is Δθ, the permissible rise of the conductor above ambient. The standard stops
 * when (Δθ_s)^¼ changes by less than 0.001; this stops at `tolerance` (default 1e-10), because
 * the result serves as an independent check.
 */
export function freeAirExternalResistance(args: {
  externalDiameterM: number;
  constants: Pick<FreeAirConstants, 'Z' | 'E' | 'g'>;
  conductorRiseK: number;
  T1: number;
  T2?: number;
  T3: number;
  cores?: number;
  lambda1?: number;
  lambda2?: number;
  /** W_d per core, W/m (0 when dielectric losses do not count). */
  dielectricLossWPerM?: number;
  /** Sun: σ (absorption coefficient) and H (intensity, W/m²; the standard suggests 1000 W/m²). */
  sun?: { absorptionCoefficient: number; irradianceWPerM2: number };
  tolerance?: number;
}): FreeAirExternalResult {
  const de = requirePositive(args?.externalDiameterM, 'externalDiameterM');
  const rise = requirePositive(args.conductorRiseK, 'conductorRiseK');
  const h = freeAirHeatTransferCoefficient({ externalDiameterM: de, ...requireConstants(args.constants) });
  const n = args.cores ?? 1;
  const l1 = args.lambda1 ?? 0;
  const l2 = args.lambda2 ?? 0;
  const tInt = internalThermalResistance({ T1: args.T1, T2: args.T2, T3: args.T3, cores: n, lambda1: l1, lambda2: l2 });
  const wd = requireNonNegative(args.dielectricLossWPerM ?? 0, 'dielectricLossWPerM');
  const T1 = args.T1;
  const T2 = args.T2 ?? 0;
  const dielectricRiseK = wd * ((1 / (1 + l1 + l2) - 0.5) * T1 - (n * T2 * l2) / (1 + l1 + l2));
  let solarRiseK = 0;
  if (args.sun) {
    const sigma = requireRange(args.sun.absorptionCoefficient, 'sun.absorptionCoefficient', 0, 1);
    const H = requireRange(args.sun.irradianceWPerM2, 'sun.irradianceWPerM2', 0, 1500);
    solarRiseK = sigma * de * H * tInt;
  }
  const tolerance = args.tolerance === undefined ? 1e-10 : requirePositive(args.tolerance, 'tolerance');
  const driving = rise + dielectricRiseK + solarRiseK;
  if (!(driving > 0)) throw new ElectricalInputError('conductorRiseK', 'leaves no rise for the surface once the dielectric losses are counted');
  const KA = Math.PI * de * h * tInt;

  let root = 2; // the clause's starting value (Δθ_s)^¼ = 2
  let iterations = 0;
  let converged = false;
  while (iterations < 500) {
    const next = (driving / (1 + KA * root)) ** 0.25;
    iterations++;
    const change = Math.abs(next - root);
    root = next;
    if (change <= tolerance) {
      converged = true;
      break;
    }
  }
  // The map contracts with a slope below ¼ at its fixed point; failing here would be a defect.
  if (!converged) throw new ElectricalInputError('constants', 'the free-air iteration did not settle');
  const surfaceRiseK = root ** 4;
  return {
    T4: 1 / (Math.PI * de * h * root),
    surfaceRiseK,
    h,
    KA,
    internalResistanceKmPerW: tInt,
    dielectricRiseK,
    solarRiseK,
    iterations,
    surfaceHeatWPerM: Math.PI * de * h * surfaceRiseK ** 1.25,
  };
}

function requireConstants(c: Pick<FreeAirConstants, 'Z' | 'E' | 'g'> | undefined): { Z: number; E: number; g: number } {
  if (!c) throw new ElectricalInputError('constants', 'give Z, E and g (IEC 60287-2-1 Table 2)');
  return { Z: requireNonNegative(c.Z, 'constants.Z'), E: requireNonNegative(c.E, 'constants.E'), g: requireFinite(c.g, 'constants.g') };
}

// ───────────────────────── Which row of Table 2 an arrangement is ─────────────────────────

export type FreeAirRowChoice =
  | { kind: 'tabulated'; arrangement: FreeAirArrangement; constants: FreeAirConstants; assumptions: string[] }
  | { kind: 'outside-method'; reason: string };

const SLACK = 1e-9;

/**
 * The row of IEC 60287-2-1 Table 2 (from memory) that covers an arrangement in air, or why none
 * does. One circuit: single; trefoil touching; two or three touching in a horizontal or vertical
 * row; two or three vertical with a clearance of D_e. Cables in a horizontal row with a clearance
 * of at least 0.75·D_e are each rated as a single cable (the table's footnote), which also covers
 * several circuits laid side by side in ONE horizontal row. Every other group in air (spaced
 * trefoil, horizontal clearance below 0.75·D_e, several circuits in any other pattern) lies
 * outside these constants — IEC 60287-2-2 has group factors for such cases; they are not here.
 */
export function freeAirRowFor(arrangement: Arrangement): FreeAirRowChoice {
  if (arrangement.placement.kind !== 'air') return { kind: 'outside-method', reason: 'the arrangement is not in air' };
  const circuits = arrangement.circuits;
  const tabulated = (name: FreeAirArrangement, assumptions: string[] = []): FreeAirRowChoice => ({
    kind: 'tabulated',
    arrangement: name,
    constants: FREE_AIR_CONSTANTS[name],
    assumptions: [...assumptions, `Clear of walls and other surfaces by at least ${name === 'single' ? '0.3' : '0.5'}·D_e (the condition of IEC 60287-2-1 Table 2, from memory)`],
  });
  const allInOneHorizontalRow = () =>
    circuits.every((c) => c.formation === 'single' || c.formation === 'flat-horizontal') &&
    (circuits.length === 1 || arrangement.circuitSpacing?.direction === 'horizontal');

  // Isolated cables in one horizontal row, clearance ≥ 0.75·D_e everywhere.
  if (allInOneHorizontalRow()) {
    const clearances: number[] = [];
    let largest = 0;
    for (const c of circuits) {
      largest = Math.max(largest, c.externalDiameterM);
      if (cableCountOf(c) > 1) {
        const s = c.spacing === 'touching' ? c.externalDiameterM : (c.axisSpacingM ?? 0);
        clearances.push((s - c.externalDiameterM) / c.externalDiameterM);
      }
    }
    if (circuits.length > 1 && arrangement.circuitSpacing) {
      // Between neighbouring circuits: the outer cables of two rows face each other.
      for (let i = 0; i + 1 < circuits.length; i++) {
        const a = circuits[i];
        const b = circuits[i + 1];
        const halfA = cableCountOf(a) === 1 ? 0 : rowHalfWidth(a);
        const halfB = cableCountOf(b) === 1 ? 0 : rowHalfWidth(b);
        const gap = arrangement.circuitSpacing.axisSpacingM - halfA - halfB - (a.externalDiameterM + b.externalDiameterM) / 2;
        clearances.push(gap / Math.max(a.externalDiameterM, b.externalDiameterM));
      }
    }
    if (clearances.every((r) => r >= FREE_AIR_ISOLATED_HORIZONTAL_CLEARANCE_RATIO - SLACK)) {
      return tabulated('single', clearances.length > 0 ? ['Cables in a horizontal row with a clearance of at least 0.75·D_e rated as isolated (IEC 60287-2-1 Table 2, footnote, from memory)'] : []);
    }
  }
  if (circuits.length > 1) {
    return {
      kind: 'outside-method',
      reason: 'several circuits in air other than isolated cables in one horizontal row: IEC 60287-2-1 Table 2 covers one group only (group factors of IEC 60287-2-2 are not implemented)',
    };
  }
  const c = circuits[0];
  const n = cableCountOf(c);
  const de = c.externalDiameterM;
  const clearance = c.spacing === 'touching' ? 0 : ((c.axisSpacingM ?? 0) - de) / de;
  if (c.formation === 'trefoil') {
    if (c.spacing === 'touching' || clearance <= SLACK) return tabulated('trefoil-touching');
    return { kind: 'outside-method', reason: 'a spaced trefoil is not tabulated in IEC 60287-2-1 Table 2' };
  }
  if (c.formation === 'flat-horizontal') {
    if (clearance <= SLACK) return tabulated(n === 2 ? 'two-touching-horizontal' : 'three-touching-horizontal');
    return {
      kind: 'outside-method',
      reason: `a horizontal row with a clearance of ${clearance.toFixed(2)}·D_e: touching and ≥ 0.75·D_e are tabulated, in between is not`,
    };
  }
  if (c.formation === 'flat-vertical') {
    if (clearance <= SLACK) return tabulated(n === 2 ? 'two-touching-vertical' : 'three-touching-vertical');
    if (Math.abs(clearance - 1) <= 1e-6) return tabulated(n === 2 ? 'two-spaced-vertical' : 'three-spaced-vertical');
    if (clearance > 1) {
      return tabulated(n === 2 ? 'two-spaced-vertical' : 'three-spaced-vertical', [
        `Vertical clearance ${clearance.toFixed(2)}·D_e rated with the row tabulated for a clearance of D_e (assumed conservative: wider spacing heats less)`,
      ]);
    }
    return { kind: 'outside-method', reason: `a vertical row with a clearance of ${clearance.toFixed(2)}·D_e: only touching and D_e are tabulated` };
  }
  return tabulated('single');
}

/** Distance from a flat row's centre to the axis of its outer cable. */
function rowHalfWidth(c: Arrangement['circuits'][number]): number {
  const s = c.spacing === 'touching' ? c.externalDiameterM : (c.axisSpacingM ?? 0);
  return cableCountOf(c) === 2 ? s / 2 : s;
}

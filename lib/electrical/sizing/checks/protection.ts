/**
 * Check: the rest of a low-voltage circuit check (physics.md §11, lib/electrical/protection), run
 * when the circuit's protective device is given:
 *   - overload coordination, IEC 60364-4-43 §433.1 — I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z, with I_z
 *     the rated ampacity of the circuit as built (every derating and the group model included),
 *     and the smallest device of the standard series that satisfies it;
 *   - automatic disconnection, IEC 60364-4-41 §411 — when the source impedance and the protective
 *     conductor are given: Z_s with both conductors at their fault temperature, I_a, and whether
 *     the device operates within the required time;
 *   - the protective conductor's section, IEC 60364-5-54 §543.1 — the adiabatic minimum for that
 *     fault and time, and the table of §543.1.3.
 */
import { materialConstants } from '../../materials';
import {
  harmonicNeutralSizing,
  type HarmonicSizingResult,
  automaticDisconnection,
  overloadCoordination,
  protectiveConductorSection,
  smallestCoordinatedRating,
  validateProtectiveDevice,
  type AutomaticDisconnectionResult,
  type OverloadCoordinationResult,
  type ProtectiveConductorResult,
  type SmallestRatingResult,
} from '../../protection';
import { sizingContext, type SizingContext } from '../context';
import { FlagSet } from '../flags';
import type { HarmonicCheckResult } from '../types';
import { ampacityCheck } from './ampacity';
import { PROTECTION_TEXT } from '../flagText';
import type { ProtectionConditions } from '../types';

export interface ProtectionResult {
  coordination: OverloadCoordinationResult | null;
  smallestRating: SmallestRatingResult | null;
  disconnection: AutomaticDisconnectionResult | null;
  protectiveConductor: ProtectiveConductorResult | null;
}

/** The protection conditions as given, the device checked where it enters (field named). */
export function prepareProtection(raw: ProtectionConditions | undefined, field: string): ProtectionConditions | undefined {
  if (raw === undefined) return undefined;
  validateProtectiveDevice(raw.device, `${field}.device`);
  return raw;
}

export function protectionCheck(ctx: SizingContext, ampacityA: number, conductorC: number | null): ProtectionResult | null {
  const { cand, cond, flags } = ctx;
  const p = cond.protection;
  if (!p) return null;
  if (!(ampacityA > 0)) {
    flags.add('PROTECTION_OVERLOAD_NOT_COORDINATED', PROTECTION_TEXT.noAmpacity());
    return { coordination: null, smallestRating: null, disconnection: null, protectiveConductor: null };
  }
  const coordination = overloadCoordination({ device: p.device, designCurrentA: cond.designCurrentA, ampacityA });
  let smallestRating: SmallestRatingResult | null = null;
  try {
    smallestRating = smallestCoordinatedRating({ kind: p.device.kind, designCurrentA: cond.designCurrentA, ampacityA, ...(p.deviceSeriesA ? { series: p.deviceSeriesA } : {}) });
  } catch {
    smallestRating = null; // an adjustable breaker without its settings: no series to search
  }
  if (coordination.verdict === 'fail') {
    const failing = coordination.inequalities.find((l) => !l.holds)!;
    flags.add('PROTECTION_OVERLOAD_NOT_COORDINATED', PROTECTION_TEXT.notCoordinated(failing.text, failing.left, failing.right, smallestRating?.ratingA), { left: failing.left, right: failing.right });
  }

  let disconnection: AutomaticDisconnectionResult | null = null;
  let protectiveConductor: ProtectiveConductorResult | null = null;
  const pe = p.protectiveConductor;
  if (p.source && pe) {
    const limitC = cand.contactLimit.temperatureC;
    const faultLimitC = cand.shortCircuitLimitC ?? limitC;
    const peMaterial = pe.material ?? cand.material;
    const peR20 = materialConstants(peMaterial).rho20OhmM / (pe.sectionMm2 * 1e-6);
    disconnection = automaticDisconnection({
      device: p.device,
      systemEarthing: p.systemEarthing ?? 'TN',
      nominalVoltageToEarthV: cond.nominalVoltageV,
      circuit: p.circuit ?? 'distribution',
      source: p.source,
      // All of a phase's parallel conductors in parallel; from their operating temperature to the fault limit.
      phaseConductor: { material: cand.material, r20OhmPerM: cand.r20 / cand.conductorsPerPhase, alpha20PerK: cand.alpha20, lengthM: cond.lengthM, initialC: conductorC ?? limitC, finalC: Math.max(faultLimitC, conductorC ?? limitC) },
      protectiveConductor: { material: peMaterial, r20OhmPerM: peR20, lengthM: cond.lengthM, initialC: conductorC ?? limitC, finalC: Math.max(faultLimitC, conductorC ?? limitC) },
      ...(p.earthElectrodesOhm !== undefined ? { earthElectrodesOhm: p.earthElectrodesOhm } : {}),
    });
    if (disconnection.verdict === 'fail') {
      flags.add('PROTECTION_DISCONNECTION_TOO_SLOW', PROTECTION_TEXT.tooSlow(disconnection.faultCurrentA, disconnection.required.timeS, disconnection.operating.timeS), { faultCurrentA: disconnection.faultCurrentA });
    }
    if (disconnection.assumptions.length > 0) flags.add('PROTECTION_ASSUMPTIONS', PROTECTION_TEXT.assumptions(disconnection.assumptions));
    protectiveConductor = protectiveConductorSection({
      material: peMaterial,
      insulation: pe.insulation ?? 'thermosetting-90',
      arrangement: pe.arrangement ?? 'in-cable-or-bunched',
      ...(disconnection.operating.timeS !== undefined ? { faultCurrentA: disconnection.faultCurrentA, disconnectionTimeS: Math.min(5, disconnection.operating.timeS) } : {}),
      lineSectionMm2: cand.sectionPerPhaseMm2,
      lineMaterial: cand.material,
      installedSectionMm2: pe.sectionMm2,
    });
    if (protectiveConductor.installed?.verdict === 'fail') {
      flags.add('PROTECTIVE_CONDUCTOR_TOO_SMALL', PROTECTION_TEXT.peTooSmall(pe.sectionMm2, protectiveConductor.requiredMinimumMm2, protectiveConductor.governing), { installedMm2: pe.sectionMm2 });
    }
  } else {
    flags.add('DISCONNECTION_NOT_CHECKED', PROTECTION_TEXT.disconnectionNotChecked());
  }
  return { coordination, smallestRating, disconnection, protectiveConductor };
}

/**
 * Check: third harmonics and the neutral of a four- or five-core cable, IEC 60364-5-52 Annex E.
 * The heat balance already carries the neutral's loss (prepareCandidate: its share (3·h₃)² in the
 * multi-core heat path and on the equivalent conductor), so `ampacityA` is the rating with it. The
 * standard's check stands beside it: the sizing current (the phase current, or the neutral's
 * 3·h₃·I_B) over the Annex E factor must not exceed the rating with three loaded cores — the
 * rating the factors were tabulated for, solved here again without harmonics. Other cables with a
 * notable content are flagged: Annex E covers multi-core cables with the neutral inside.
 */
export function harmonicsCheck(ctx: SizingContext, ampacityA: number): HarmonicCheckResult | null {
  const { cand, cond, flags } = ctx;
  const h = cond.thirdHarmonicFraction;
  if (!(h > 0)) return null;
  if (cand.kind !== 'cable' || (cand.cores !== 4 && cand.cores !== 5)) {
    if (h > 0.15) flags.add('HARMONICS_NOT_COVERED', PROTECTION_TEXT.harmonicsNotCovered(100 * h));
    return null;
  }
  const r = harmonicNeutralSizing({ designCurrentA: cond.designCurrentA, thirdHarmonicFraction: h, cores: cand.cores });
  const neutralHeatShare = cand.neutralHeatShare;
  const ratingThreeLoadedCoresA =
    neutralHeatShare > 0 ? ampacityCheck(sizingContext(cand.source, { ...cond, thirdHarmonicFraction: 0 }, cand.index, new FlagSet())).current : ampacityA;
  const annexEPasses = r.sizingCurrentA <= ratingThreeLoadedCoresA;
  if (r.governing === 'neutral') flags.add('HARMONICS_NEUTRAL_GOVERNS', PROTECTION_TEXT.neutralGoverns(r.neutralCurrentA, r.sizingCurrentA), { neutralCurrentA: r.neutralCurrentA });
  if (neutralHeatShare > 0) flags.add('HARMONICS_NEUTRAL_HEAT', PROTECTION_TEXT.neutralHeat(neutralHeatShare, ampacityA, ratingThreeLoadedCoresA), { neutralHeatShare });
  if (!annexEPasses) {
    flags.add('HARMONICS_OVER_RATING', PROTECTION_TEXT.harmonicsOverRating(r.sizingCurrentA, ratingThreeLoadedCoresA, r.basis), { sizingCurrentA: r.sizingCurrentA });
  }
  return { ...r, neutralHeatShare, ratingThreeLoadedCoresA, annexEPasses };
}

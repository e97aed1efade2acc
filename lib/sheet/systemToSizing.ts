/**
 * Sheet inputs (version 6) → the sizing library's bus-bar system, protection and harmonics
 * (lib/electrical/sizing/types: BusbarSystemConditions, ProtectionConditions,
 * Conditions.thirdHarmonicPercent). What the sheet leaves empty stays undefined, so the library
 * assumes its default and raises the flag that says so, or does not run the check (and flags it).
 */
import type { BarCandidate, BusbarSystemConditions, Candidate, ProtectionConditions } from '../electrical/sizing/types';
import type { ProtectiveDevice } from '../electrical/protection';
import type { SheetInputs } from './schema';
import type { SheetDevice } from './systemSchema';

/** Bars are rated in a system when the installation (or the enclosure's inside) is a bar placement. */
export function barPlacement(inputs: SheetInputs): 'bar-on-edge' | 'bar-flat' | null {
  const i = inputs.installation;
  const placement = i.kind === 'enclosure' ? i.enclosureInside : i.kind;
  return placement === 'bar-on-edge' || placement === 'bar-flat' ? placement : null;
}

/**
 * The three-phase system of the bars, or undefined when the phase spacing is not entered (the
 * library then assumes one, flags PHASE_SPACING_ASSUMED, and cannot check the forces).
 */
export function toBusbarSystem(inputs: SheetInputs): BusbarSystemConditions | undefined {
  const b = inputs.busbarSystem;
  if (barPlacement(inputs) === null || b.phaseSpacingM === null) return undefined;
  const system: BusbarSystemConditions = { phaseSpacingM: b.phaseSpacingM };
  if (b.supportSpacingM !== null) system.supportSpacingM = b.supportSpacingM;
  if (b.spacerSpacingM !== null) system.spacerSpacingM = b.spacerSpacingM;
  if (b.supports !== null) system.supports = b.supports;
  if (b.supportStrengthN !== null) system.supportStrengthN = b.supportStrengthN;
  if (b.peakFactorBy === 'r-over-x') system.rOverX = b.rOverX;
  if (b.peakFactorBy === 'kappa') system.kappa = b.kappa;
  if (b.packNodes === 'per-pack') system.packNodes = 'per-pack';
  return system;
}

/**
 * A bar candidate with the sheet's gap between the bars of a pack, when one is entered (it is a
 * property of the system as built, the same for every pack on the sheet); otherwise the
 * candidate's own gap, or the library's default (the bar thickness).
 */
export function withSheetBarGap(candidate: Candidate, inputs: SheetInputs): Candidate {
  if (candidate.kind !== 'bar') return candidate;
  const gap = inputs.busbarSystem.barGapM;
  if (gap === null || (candidate.barsPerPhase ?? 1) < 2) return candidate;
  const withGap: BarCandidate = { ...candidate, barGapM: gap };
  return withGap;
}

/** The sheet's device as the library's data (the schema has checked that each kind has what it needs). */
export function toProtectiveDevice(d: SheetDevice): ProtectiveDevice {
  const i2 = d.conventionalOperatingCurrentA !== null ? { conventionalOperatingCurrentA: d.conventionalOperatingCurrentA } : {};
  const curve = d.timeCurrentCurve.length >= 2 ? { timeCurrentCurve: d.timeCurrentCurve.map((p) => ({ currentA: p.currentA, timeS: p.timeS })) } : {};
  switch (d.kind) {
    case 'breaker-iec60898-1':
      return { kind: 'breaker-iec60898-1', curve: d.curve, ratedCurrentA: d.ratedCurrentA, ...i2, ...curve };
    case 'breaker-iec60947-2':
      return {
        kind: 'breaker-iec60947-2',
        ratedCurrentA: d.ratedCurrentA,
        settingCurrentA: d.settingCurrentA ?? d.ratedCurrentA,
        instantaneousCurrentA: d.instantaneousCurrentA ?? 0,
        ...(d.instantaneousMaxTimeS !== null ? { instantaneousMaxTimeS: d.instantaneousMaxTimeS } : {}),
        ...i2,
        ...curve,
      };
    case 'fuse-gG-iec60269':
      return { kind: 'fuse-gG-iec60269', ratedCurrentA: d.ratedCurrentA, ...i2, ...curve };
  }
}

/**
 * The circuit's protection, or undefined when no device is described (the checks are then not
 * run). Disconnection needs both the source impedance and the protective conductor; without
 * either the library raises DISCONNECTION_NOT_CHECKED.
 */
export function toProtection(inputs: SheetInputs): ProtectionConditions | undefined {
  const p = inputs.protection;
  if (!p.included) return undefined;
  const protection: ProtectionConditions = {
    device: toProtectiveDevice(p.device),
    systemEarthing: p.earthing,
    circuit: p.circuitRole,
  };
  if (p.device.kind === 'breaker-iec60947-2' && p.device.settingStepsA.length > 0) protection.deviceSeriesA = [...p.device.settingStepsA].sort((a, b) => a - b);
  if (p.sourceBy === 'r-and-x') protection.source = { resistanceOhm: p.sourceResistanceOhm, reactanceOhm: p.sourceReactanceOhm };
  if (p.sourceBy === 'magnitude') protection.source = { impedanceOhm: p.sourceImpedanceOhm };
  if (p.earthing === 'TT' && p.earthElectrodesOhm !== null) protection.earthElectrodesOhm = p.earthElectrodesOhm;
  const pe = p.protectiveConductor;
  if (pe.entered) {
    protection.protectiveConductor = {
      sectionMm2: pe.sectionMm2,
      ...(pe.material !== 'same' ? { material: pe.material } : {}),
      insulation: pe.insulation,
      arrangement: pe.arrangement,
    };
  }
  return protection;
}

/** Third-harmonic content, %, when entered and above zero. */
export function toThirdHarmonicPercent(inputs: SheetInputs): number | undefined {
  const h = inputs.harmonics.thirdHarmonicPercent;
  return h !== null && h > 0 ? h : undefined;
}

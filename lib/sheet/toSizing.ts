/**
 * Sheet inputs → the sizing library's `Conditions` and `Candidate[]` (lib/electrical/sizing/types).
 * Values left empty on the sheet are left undefined here, so that the library applies its own
 * reference value and raises the flag that says so.
 */
import type { BuriedSurroundings, CableArrangement, Candidate, Conditions, Installation, OtherCircuit } from '../electrical/sizing/types';
import { toLibraryCandidate } from './candidates';
import type { SheetInputs, SheetOtherCircuit } from './schema';
import { toBusbarSystem, toProtection, toThirdHarmonicPercent, withSheetBarGap } from './systemToSizing';

const orUndefined = <T>(value: T | null): T | undefined => (value === null ? undefined : value);

/**
 * The circuit's cross-section (physics.md §8): its formation and spacing, the other circuits in one
 * row beside it and their spacing, transposition. Unentered spacings stay undefined (touching).
 */
export function toArrangement(inputs: SheetInputs): CableArrangement {
  const i = inputs.installation;
  const arrangement: CableArrangement = { formation: i.formation };
  if (i.spacingM !== null) arrangement.spacingM = i.spacingM;
  if (i.otherCircuits.length > 0) {
    arrangement.otherCircuits = i.otherCircuits.map(toOtherCircuit);
    arrangement.circuitRow = i.circuitRow;
  }
  // The spacing between circuits also places the circuit's own parallel runs.
  if (i.circuitSpacingM !== null && (i.otherCircuits.length > 0 || inputs.candidates.some((c) => c.parallel > 1))) {
    arrangement.circuitSpacingM = i.circuitSpacingM;
    arrangement.circuitRow = i.circuitRow;
  }
  if (i.transposed && i.formation !== 'trefoil') arrangement.transposed = true;
  return arrangement;
}

function toOtherCircuit(other: SheetOtherCircuit): OtherCircuit {
  // The schema requires the diameter and the heat when the cable is not the same.
  if (other.sameCable || other.externalDiameterM === null || other.lossWPerM === null) return { currentA: other.currentA };
  return { currentA: other.currentA, cable: { externalDiameterM: other.externalDiameterM, lossWPerM: other.lossWPerM } };
}

/** Ducts and backfill of a buried circuit, when ticked (IEC 60287-2-1 §4.2.7). */
export function toBuriedSurroundings(inputs: SheetInputs): BuriedSurroundings {
  const i = inputs.installation;
  const surroundings: BuriedSurroundings = {};
  if (i.duct.used) surroundings.duct = { material: i.duct.material, innerDiameterM: i.duct.innerDiameterM, outerDiameterM: i.duct.outerDiameterM };
  if (i.backfill.used) {
    surroundings.backfill = {
      widthM: i.backfill.widthM,
      heightM: i.backfill.heightM,
      centreDepthM: i.backfill.centreDepthM ?? i.depthM,
      resistivityKmPerW: i.backfill.resistivityKmPerW,
    };
  }
  return surroundings;
}

export function toInstallation(inputs: SheetInputs): Installation {
  const i = inputs.installation;
  const arrangement = toArrangement(inputs);
  // The three-phase system of the bars (sheet version 6), when its phase spacing is entered.
  const system = toBusbarSystem(inputs);
  switch (i.kind) {
    case 'bar-on-edge':
    case 'bar-flat':
      return system ? { kind: i.kind, system } : { kind: i.kind };
    case 'cable-in-air':
      return { kind: 'cable-in-air', ...arrangement };
    case 'buried':
      return {
        kind: 'buried',
        depthM: i.depthM,
        ...(i.soilResistivityKmPerW !== null ? { soilResistivityKmPerW: i.soilResistivityKmPerW } : {}),
        ...(i.groundC !== null ? { groundC: i.groundC } : {}),
        ...arrangement,
        ...toBuriedSurroundings(inputs),
      };
    case 'enclosure':
      return { kind: 'enclosure', deratingFactor: i.enclosureDerating, inside: i.enclosureInside, ...arrangement, ...(system ? { system } : {}) };
  }
}

export function toConditions(inputs: SheetInputs, designCurrentA = inputs.circuit.designCurrentA): Conditions {
  const { circuit, fault, environment, limits, economics } = inputs;
  const buried = inputs.installation.kind === 'buried';
  const conditions: Conditions = {
    designCurrentA,
    frequencyHz: circuit.frequencyHz,
    phases: circuit.phases,
    nominalVoltageV: circuit.nominalVoltageV,
    lengthM: circuit.lengthM,
    powerFactor: circuit.powerFactor,
    installation: toInstallation(inputs),
  };
  const reactance = orUndefined(circuit.reactanceOhmPerM);
  if (reactance !== undefined) conditions.reactanceOhmPerM = reactance;
  const maxDrop = orUndefined(circuit.maxVoltageDropPercent);
  if (maxDrop !== undefined) conditions.maxVoltageDropPercent = maxDrop;
  // Buried cables see the ground temperature (installation.groundC), not the air.
  if (!buried && environment.ambientC !== null) conditions.ambientC = environment.ambientC;
  if (!buried && environment.windSpeedMPerS > 0) conditions.windSpeedMPerS = environment.windSpeedMPerS;
  if (!buried && environment.outdoorSun && environment.irradianceWPerM2 > 0) {
    conditions.solar = {
      irradianceWPerM2: environment.irradianceWPerM2,
      ...(environment.solarAbsorptivity !== null ? { absorptivity: environment.solarAbsorptivity } : {}),
    };
  }
  if (fault.checked) conditions.fault = { currentA: fault.currentA, durationS: fault.durationS };
  if (limits.temperatureLimitC !== null) {
    conditions.temperatureLimitC = limits.temperatureLimitC;
    if (limits.raiseMaterialLimit) {
      conditions.raiseMaterialLimit = true;
      if (limits.raiseJustification.trim()) conditions.userLimitJustification = limits.raiseJustification;
    }
  }
  if (limits.groupingFactor < 1) conditions.groupingFactor = limits.groupingFactor;
  if (economics.included) {
    conditions.economics = {
      lossLoadFactor: economics.lossLoadFactor,
      hoursPerYear: economics.hoursPerYear,
      energyPricePerKWh: economics.energyPricePerKWh,
      discountRatePercent: economics.discountRatePercent,
      years: economics.years,
      loadGrowthPercent: economics.loadGrowthPercent,
      energyPriceGrowthPercent: economics.energyPriceGrowthPercent,
    };
  }
  const protection = toProtection(inputs);
  if (protection) conditions.protection = protection;
  const thirdHarmonicPercent = toThirdHarmonicPercent(inputs);
  if (thirdHarmonicPercent !== undefined) conditions.thirdHarmonicPercent = thirdHarmonicPercent;
  return conditions;
}

export function toCandidates(inputs: SheetInputs): Candidate[] {
  return inputs.candidates.map((c) => withSheetBarGap(toLibraryCandidate(c), inputs));
}

/** Which installations suit which candidate kind (a bar is not buried; a cable does not lie "on edge"). */
export function installationSuits(kind: SheetInputs['installation']['kind'], candidateKind: 'cable' | 'bar', inside?: string): boolean {
  const placement = kind === 'enclosure' ? inside : kind;
  if (candidateKind === 'bar') return placement === 'bar-on-edge' || placement === 'bar-flat';
  return placement === 'cable-in-air' || placement === 'buried';
}

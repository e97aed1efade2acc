/**
 * Sheet inputs → the sizing library's `Conditions` and `Candidate[]` (lib/electrical/sizing/types).
 * Values left empty on the sheet are left undefined here, so that the library applies its own
 * reference value and raises the flag that says so.
 */
import type { Candidate, Conditions, Installation } from '../electrical/sizing/types';
import { toLibraryCandidate } from './candidates';
import type { SheetInputs } from './schema';

const orUndefined = <T>(value: T | null): T | undefined => (value === null ? undefined : value);

export function toInstallation(inputs: SheetInputs): Installation {
  const i = inputs.installation;
  const arrangement = { formation: i.formation, ...(i.spacingM !== null ? { spacingM: i.spacingM } : {}) };
  switch (i.kind) {
    case 'bar-on-edge':
    case 'bar-flat':
      return { kind: i.kind };
    case 'cable-in-air':
      return { kind: 'cable-in-air', ...arrangement };
    case 'buried':
      return {
        kind: 'buried',
        depthM: i.depthM,
        ...(i.soilResistivityKmPerW !== null ? { soilResistivityKmPerW: i.soilResistivityKmPerW } : {}),
        ...(i.groundC !== null ? { groundC: i.groundC } : {}),
        ...arrangement,
      };
    case 'enclosure':
      return { kind: 'enclosure', deratingFactor: i.enclosureDerating, inside: i.enclosureInside, ...arrangement };
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
    if (limits.raiseMaterialLimit) conditions.raiseMaterialLimit = true;
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
  return conditions;
}

export function toCandidates(inputs: SheetInputs): Candidate[] {
  return inputs.candidates.map(toLibraryCandidate);
}

/** Which installations suit which candidate kind (a bar is not buried; a cable does not lie "on edge"). */
export function installationSuits(kind: SheetInputs['installation']['kind'], candidateKind: 'cable' | 'bar', inside?: string): boolean {
  const placement = kind === 'enclosure' ? inside : kind;
  if (candidateKind === 'bar') return placement === 'bar-on-edge' || placement === 'bar-flat';
  return placement === 'cable-in-air' || placement === 'buried';
}

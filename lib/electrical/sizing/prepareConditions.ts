/**
 * Validation and normalisation of the conditions of a comparison, done once per comparison, and
 * the assumption flags that follow from them alone (no solve needed). Every refusal names the field.
 */
import {
  ElectricalInputError,
  requireInteger,
  requireNonNegative,
  requirePositive,
  requireRange,
  requireTemperature,
} from '../errors';
import { toMoney } from '../economics';
import { checkBound, checkOptionalBound } from '../../inputBounds';
import { DEFAULT_TEXT, ENTERED_TEXT, SHORT_CIRCUIT_TEXT } from './flagText';
import { FlagSet } from './flags';
import type { PreparedConditions } from './prepared';
import { prepareBusbarSystemConditions } from './busbarSystem';
import { prepareProtection } from './checks/protection';
import type { BusbarSystemConditions, BuriedSurroundings, CableArrangement, Conditions, EconomicsInputs, OtherCircuit } from './types';

/** Reference ambients when none is entered (flagged AMBIENT_ASSUMED). */
export const DEFAULT_AIR_AMBIENT_CABLE_C = 30; // IEC 60364-5-52 reference ambient for air (from memory)
export const DEFAULT_AIR_AMBIENT_BAR_C = 40; // IEC 61439-1 upper ambient for indoor assemblies (from memory)
export const DEFAULT_GROUND_C = 20; // IEC 60364-5-52 reference ground temperature (from memory)
export const DEFAULT_SOIL_RESISTIVITY_KM_PER_W = 2.5; // IEC 60364-5-52 tables for buried cables (from memory)
/** Solar absorption when none is given: IEC 60287-2-1 Table 4's highest listed value (0.8, from memory). */
export const DEFAULT_SOLAR_ABSORPTIVITY = 0.8;
/** Adiabatic short-circuit method range (IEC 60364-4-43, from memory). */
export const ADIABATIC_MAX_DURATION_S = 5;

function optional<T>(value: T | undefined | null, check: (v: T) => number): number | undefined {
  return value === undefined || value === null ? undefined : check(value);
}

// ───────────────────────────── Conditions ─────────────────────────────

export function prepareConditions(c: Conditions): PreparedConditions {
  if (c === null || typeof c !== 'object') throw new ElectricalInputError('conditions', 'must be an object');
  const f = (name: string) => `conditions.${name}`;
  const designCurrentA = checkBound('currentA', c.designCurrentA, f('designCurrentA'));
  const frequencyHz = checkBound('frequencyHz', c.frequencyHz, f('frequencyHz'));
  if (c.phases !== 1 && c.phases !== 3) throw new ElectricalInputError(f('phases'), `must be 1 or 3 (got ${String(c.phases)})`);
  const nominalVoltageV = checkBound('nominalVoltageV', c.nominalVoltageV, f('nominalVoltageV'));
  const lengthM = checkBound('lengthM', c.lengthM, f('lengthM'));
  const powerFactor = checkBound('powerFactor', c.powerFactor, f('powerFactor'));
  const reactanceOhmPerM = checkOptionalBound('reactanceOhmPerM', c.reactanceOhmPerM, f('reactanceOhmPerM'));
  const maxVoltageDropPercent = checkOptionalBound('maxVoltageDropPercent', c.maxVoltageDropPercent, f('maxVoltageDropPercent'));
  const windSpeedMPerS = c.windSpeedMPerS === undefined ? 0 : checkBound('windSpeedMPerS', c.windSpeedMPerS, f('windSpeedMPerS'));
  const groupingFactor =
    c.groupingFactor === undefined ? 1 : checkBound('groupingFactor', c.groupingFactor, f('groupingFactor'));
  const userLimitC = checkOptionalBound('temperatureLimitC', c.temperatureLimitC, f('temperatureLimitC'));
  const surfaceCoefficientWPerM2K = optional(c.surfaceCoefficientWPerM2K, (v) =>
    requireRange(v, f('surfaceCoefficientWPerM2K'), 0, 1e5, { minExclusive: true }),
  );

  const inst = c.installation as Conditions['installation'] | undefined;
  if (!inst || typeof inst !== 'object') throw new ElectricalInputError(f('installation'), 'is required');
  let placement: PreparedConditions['placement'];
  let enclosureFactor = 1;
  let buried: PreparedConditions['buried'];
  switch (inst.kind) {
    case 'cable-in-air':
    case 'bar-on-edge':
    case 'bar-flat':
      placement = inst.kind;
      break;
    case 'buried': {
      placement = 'buried';
      const depthM = checkBound('depthM', inst.depthM, f('installation.depthM'));
      const soilAssumed = inst.soilResistivityKmPerW === undefined;
      const soilResistivityKmPerW = soilAssumed
        ? DEFAULT_SOIL_RESISTIVITY_KM_PER_W
        : checkBound('soilResistivityKmPerW', inst.soilResistivityKmPerW, f('installation.soilResistivityKmPerW'));
      buried = { depthM, soilResistivityKmPerW, soilAssumed, groundAssumed: inst.groundC === undefined };
      break;
    }
    case 'enclosure':
      if (inst.inside !== 'cable-in-air' && inst.inside !== 'bar-on-edge' && inst.inside !== 'bar-flat') {
        throw new ElectricalInputError(f('installation.inside'), `must be 'cable-in-air', 'bar-on-edge' or 'bar-flat'`);
      }
      placement = inst.inside;
      enclosureFactor = checkBound('enclosureDerating', inst.deratingFactor, f('installation.deratingFactor'));
      break;
    default:
      throw new ElectricalInputError(
        f('installation.kind'),
        `must be 'cable-in-air', 'bar-on-edge', 'bar-flat', 'buried' or 'enclosure' (got ${String((inst as { kind?: unknown }).kind)})`,
      );
  }
  const arrangement = inst as CableArrangement & BuriedSurroundings;
  const formation = arrangement.formation === undefined ? 'trefoil' : arrangement.formation;
  if (formation !== 'trefoil' && formation !== 'flat' && formation !== 'flat-vertical') {
    throw new ElectricalInputError(f('installation.formation'), `must be 'trefoil', 'flat' or 'flat-vertical'`);
  }
  const spacingM = checkOptionalBound('spacingM', arrangement.spacingM, f('installation.spacingM'));
  const circuitSpacingM = optional(arrangement.circuitSpacingM, (v) => requireRange(v, f('installation.circuitSpacingM'), 0, 50, { minExclusive: true }));
  const circuitRow = arrangement.circuitRow ?? 'horizontal';
  if (circuitRow !== 'horizontal' && circuitRow !== 'vertical') throw new ElectricalInputError(f('installation.circuitRow'), `must be 'horizontal' or 'vertical'`);
  const others = arrangement.otherCircuits ?? [];
  if (!Array.isArray(others) || others.length > 23) throw new ElectricalInputError(f('installation.otherCircuits'), 'must be a list of at most 23 circuits');
  const otherCircuits: OtherCircuit[] = others.map((o, i) => {
    const of = (n: string) => f(`installation.otherCircuits[${i}].${n}`);
    if (o === null || typeof o !== 'object') throw new ElectricalInputError(f(`installation.otherCircuits[${i}]`), 'must be an object');
    const currentA = checkBound('currentA', o.currentA, of('currentA'));
    if (o.cable === undefined) return { currentA };
    return {
      currentA,
      cable: {
        externalDiameterM: requireRange(o.cable.externalDiameterM, of('cable.externalDiameterM'), 0, 0.3, { minExclusive: true }),
        lossWPerM: requireRange(o.cable.lossWPerM, of('cable.lossWPerM'), 0, 1000),
      },
    };
  });
  const protection = prepareProtection(c.protection, f('protection'));
  const busbarSystem = prepareBusbarSystemConditions((inst as { system?: BusbarSystemConditions }).system, f('installation.system'));
  if (busbarSystem && placement !== 'bar-on-edge' && placement !== 'bar-flat') throw new ElectricalInputError(f('installation.system'), 'a bus-bar system is for bars');
  if (placement !== 'buried' && (arrangement.duct !== undefined || arrangement.backfill !== undefined)) {
    throw new ElectricalInputError(f(arrangement.duct !== undefined ? 'installation.duct' : 'installation.backfill'), 'ducts and backfill are for buried cables');
  }
  // Ambient: ground temperature for buried cables, air otherwise.
  let ambientC: number;
  let ambientAssumed = false;
  if (placement === 'buried') {
    const g = (inst as { groundC?: number }).groundC;
    if (g === undefined) {
      ambientC = DEFAULT_GROUND_C;
      ambientAssumed = true;
    } else ambientC = checkBound('groundC', g, f('installation.groundC'));
  } else if (c.ambientC === undefined) {
    ambientC = placement === 'cable-in-air' ? DEFAULT_AIR_AMBIENT_CABLE_C : DEFAULT_AIR_AMBIENT_BAR_C;
    ambientAssumed = true;
  } else {
    ambientC = checkBound('ambientC', c.ambientC, f('ambientC'));
  }

  let solar: PreparedConditions['solar'];
  if (c.solar !== undefined) {
    const irradianceWPerM2 = checkBound('irradianceWPerM2', c.solar.irradianceWPerM2, f('solar.irradianceWPerM2'));
    const absorptivityAssumed = c.solar.absorptivity === undefined;
    const absorptivity = absorptivityAssumed ? DEFAULT_SOLAR_ABSORPTIVITY : checkBound('solarAbsorptivity', c.solar.absorptivity, f('solar.absorptivity'));
    if (irradianceWPerM2 > 0) solar = { irradianceWPerM2, absorptivity, absorptivityAssumed };
  }
  if (solar && placement === 'buried') throw new ElectricalInputError(f('solar'), 'a buried cable receives no sun');
  if (windSpeedMPerS > 0 && placement === 'buried') throw new ElectricalInputError(f('windSpeedMPerS'), 'a buried cable is not cooled by wind');

  let fault: PreparedConditions['fault'];
  if (c.fault !== undefined) {
    const initialFrom = c.fault.initialFrom ?? 'limit';
    if (initialFrom !== 'limit' && initialFrom !== 'operating') {
      throw new ElectricalInputError(f('fault.initialFrom'), `must be 'limit' or 'operating'`);
    }
    fault = {
      currentA: checkBound('faultCurrentA', c.fault.currentA, f('fault.currentA')),
      durationS: checkBound('faultDurationS', c.fault.durationS, f('fault.durationS')),
      initialFrom,
    };
  }
  if (c.userLimitJustification !== undefined && typeof c.userLimitJustification !== 'string') {
    throw new ElectricalInputError(f('userLimitJustification'), 'must be text');
  }
  const justification = c.userLimitJustification?.trim() || undefined;
  if (c.raiseMaterialLimit && userLimitC === undefined) {
    throw new ElectricalInputError(f('temperatureLimitC'), 'is required when raiseMaterialLimit is set');
  }

  let economics: EconomicsInputs | undefined;
  if (c.economics !== undefined) {
    const e = c.economics;
    checkBound('lossLoadFactor', e.lossLoadFactor, f('economics.lossLoadFactor'));
    if (e.hoursPerYear !== undefined) checkBound('hoursPerYear', e.hoursPerYear, f('economics.hoursPerYear'));
    toMoney(e.energyPricePerKWh, f('economics.energyPricePerKWh'));
    if (e.demandChargePerKWYear !== undefined) toMoney(e.demandChargePerKWYear, f('economics.demandChargePerKWYear'));
    if (e.loadGrowthPercent !== undefined) checkBound('loadGrowthPercent', e.loadGrowthPercent, f('economics.loadGrowthPercent'));
    if (e.energyPriceGrowthPercent !== undefined) {
      checkBound('energyPriceGrowthPercent', e.energyPriceGrowthPercent, f('economics.energyPriceGrowthPercent'));
    }
    checkBound('discountRatePercent', e.discountRatePercent, f('economics.discountRatePercent'));
    checkBound('years', e.years, f('economics.years'));
    economics = e;
  }

  const prepared: PreparedConditions = {
    source: c,
    designCurrentA,
    frequencyHz,
    phases: c.phases,
    nominalVoltageV,
    lengthM,
    powerFactor,
    reactanceOhmPerM,
    maxVoltageDropPercent,
    ambientC,
    ambientAssumed,
    placement,
    enclosureFactor,
    groupingFactor,
    formation,
    spacingM,
    circuitSpacingM,
    circuitRow,
    otherCircuits,
    transposed: arrangement.transposed === true,
    // Ducts and backfill are checked with the whole cross-section, where the cable's size is known.
    duct: arrangement.duct,
    backfill: arrangement.backfill,
    ...(busbarSystem ? { busbarSystem } : {}),
    ...(protection ? { protection } : {}),
    thirdHarmonicFraction: (checkOptionalBound('thirdHarmonicPercent', c.thirdHarmonicPercent, f('thirdHarmonicPercent')) ?? 0) / 100,
    buried,
    windSpeedMPerS,
    solar,
    fault,
    userLimitC,
    raiseMaterialLimit: c.raiseMaterialLimit === true,
    ...(justification ? { userLimitJustification: justification } : {}),
    surfaceCoefficientWPerM2K,
    economics,
  };
  return prepared;
}

/** The flags the conditions alone raise, added to one candidate's flag set. */
export function conditionFlags(c: PreparedConditions, flags: FlagSet, model: { windCredited: boolean } = { windCredited: true }): void {
  if (c.ambientAssumed) {
    if (c.placement === 'buried') {
      flags.add('AMBIENT_ASSUMED', DEFAULT_TEXT.groundAmbient(c.ambientC), { ambientC: c.ambientC });
    } else {
      const basis = c.placement === 'cable-in-air' ? 'the IEC 60364-5-52 reference air temperature' : 'the IEC 61439-1 upper ambient for indoor assemblies';
      flags.add('AMBIENT_ASSUMED', DEFAULT_TEXT.airAmbient(c.ambientC, basis), { ambientC: c.ambientC });
    }
  }
  if (c.groupingFactor < 1) {
    flags.add('GROUPING_DERATING_ENTERED', ENTERED_TEXT.grouping(c.groupingFactor), { factor: c.groupingFactor });
  }
  if (c.enclosureFactor < 1) {
    flags.add('ENCLOSURE_DERATING_ENTERED', ENTERED_TEXT.enclosure(c.enclosureFactor), { factor: c.enclosureFactor });
  }
  if (c.surfaceCoefficientWPerM2K !== undefined) {
    flags.add('SURFACE_COEFFICIENT_ENTERED', ENTERED_TEXT.surfaceCoefficient(c.surfaceCoefficientWPerM2K), { h: c.surfaceCoefficientWPerM2K });
  }
  if (c.windSpeedMPerS > 0 && model.windCredited) {
    flags.add('WIND_COOLING_CREDITED', ENTERED_TEXT.wind(c.windSpeedMPerS), { windSpeedMPerS: c.windSpeedMPerS });
  }
  if (c.solar?.absorptivityAssumed) {
    flags.add('SOLAR_ABSORPTIVITY_ASSUMED', DEFAULT_TEXT.solarAbsorptivity(DEFAULT_SOLAR_ABSORPTIVITY));
  }
  if (c.buried && (c.buried.soilAssumed || c.buried.groundAssumed)) {
    const parts: string[] = [];
    if (c.buried.soilAssumed) parts.push(`a soil thermal resistivity of ${DEFAULT_SOIL_RESISTIVITY_KM_PER_W} K·m/W`);
    if (c.buried.groundAssumed) parts.push(`a ground temperature of ${DEFAULT_GROUND_C} °C`);
    flags.add('BURIED_SOIL_ASSUMED', DEFAULT_TEXT.soil(parts));
  }
  if (c.fault === undefined) {
    flags.add('SHORT_CIRCUIT_NOT_CHECKED', SHORT_CIRCUIT_TEXT.notChecked());
  } else if (c.fault.durationS > ADIABATIC_MAX_DURATION_S) {
    flags.add('SHORT_CIRCUIT_LONG_DURATION', SHORT_CIRCUIT_TEXT.longDuration(c.fault.durationS, ADIABATIC_MAX_DURATION_S));
  }
}


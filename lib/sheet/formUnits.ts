/**
 * The sheet form shows values in the user's unit system and stores SI. Each numeric field names
 * the quantity it is; the conversions themselves live in lib/units.
 */
import {
  celsiusToFahrenheit,
  convertFromSi,
  convertToSi,
  fahrenheitToCelsius,
  feetToMetres,
  formatNumber,
  metresToFeet,
  unitLabel,
  type Quantity,
  type UnitSystem,
} from '../units';

/** Quantities of the sheet form: lib/units' plus those that have no imperial form of their own. */
export type FormQuantity = Quantity | 'speedMPerS' | 'none';

export interface FieldUnit {
  quantity: FormQuantity;
  /** The unit shown when the quantity is the same in both systems (A, V, Hz, %, W/m²...). */
  fixedUnit?: string;
}

export const SHEET_FIELD_UNITS = {
  'circuit.designCurrentA': { quantity: 'none', fixedUnit: 'A' },
  'circuit.nominalVoltageV': { quantity: 'none', fixedUnit: 'V' },
  'circuit.frequencyHz': { quantity: 'none', fixedUnit: 'Hz' },
  'circuit.lengthM': { quantity: 'lengthM' },
  'circuit.powerFactor': { quantity: 'none' },
  'circuit.maxVoltageDropPercent': { quantity: 'none', fixedUnit: '%' },
  'circuit.reactanceOhmPerM': { quantity: 'resistanceOhmPerKm' },
  // Fault currents in kA on every surface (the schedule's column, the sheet, the printed tables):
  // switchgear and fault studies quote them in kA (common practice). Stored in A (API field currentA).
  'fault.currentA': { quantity: 'none', fixedUnit: 'kA' },
  'fault.durationS': { quantity: 'none', fixedUnit: 's' },
  'environment.ambientC': { quantity: 'temperature' },
  'environment.windSpeedMPerS': { quantity: 'speedMPerS' },
  'environment.irradianceWPerM2': { quantity: 'none', fixedUnit: 'W/m²' },
  'environment.solarAbsorptivity': { quantity: 'none' },
  'installation.spacingM': { quantity: 'lengthMm' },
  'installation.circuitSpacingM': { quantity: 'lengthMm' },
  // One entry for the same field of every other circuit in the list.
  'installation.otherCircuits.currentA': { quantity: 'none', fixedUnit: 'A' },
  'installation.otherCircuits.externalDiameterM': { quantity: 'lengthMm' },
  'installation.otherCircuits.lossWPerM': { quantity: 'powerWPerM' },
  'installation.duct.innerDiameterM': { quantity: 'lengthMm' },
  'installation.duct.outerDiameterM': { quantity: 'lengthMm' },
  'installation.backfill.widthM': { quantity: 'lengthM' },
  'installation.backfill.heightM': { quantity: 'lengthM' },
  'installation.backfill.centreDepthM': { quantity: 'lengthM' },
  'installation.backfill.resistivityKmPerW': { quantity: 'thermalResistivityKmPerW' },
  'installation.depthM': { quantity: 'lengthM' },
  'installation.soilResistivityKmPerW': { quantity: 'thermalResistivityKmPerW' },
  'installation.groundC': { quantity: 'temperature' },
  'installation.enclosureDerating': { quantity: 'none' },
  'limits.temperatureLimitC': { quantity: 'temperature' },
  'limits.groupingFactor': { quantity: 'none' },
  'economics.lossLoadFactor': { quantity: 'none' },
  'economics.hoursPerYear': { quantity: 'none', fixedUnit: 'h' },
  'economics.discountRatePercent': { quantity: 'none', fixedUnit: '%' },
  'economics.years': { quantity: 'none', fixedUnit: 'years' },
  'economics.loadGrowthPercent': { quantity: 'none', fixedUnit: '% / year' },
  'economics.energyPriceGrowthPercent': { quantity: 'none', fixedUnit: '% / year' },
  // Optional checks (lib/sheet/schema.ts overTime, alongRun, enclosureAir).
  'overTime.overloadCurrentA': { quantity: 'none', fixedUnit: 'A' },
  'overTime.overloadDurationS': { quantity: 'none', fixedUnit: 'min' },
  'alongRun.lengthM': { quantity: 'lengthM' },
  'alongRun.terminalTemperatureC': { quantity: 'temperature' },
  'alongRun.jointPositionM': { quantity: 'lengthM' },
  'alongRun.jointResistanceMicroOhm': { quantity: 'none', fixedUnit: 'µΩ' },
  'enclosureAir.heightM': { quantity: 'lengthM' },
  'enclosureAir.widthM': { quantity: 'lengthM' },
  'enclosureAir.depthM': { quantity: 'lengthM' },
  'enclosureAir.outsideAirC': { quantity: 'temperature' },
  'enclosureAir.routeLengthInsideM': { quantity: 'lengthM' },
  'enclosureAir.otherLossesW': { quantity: 'none', fixedUnit: 'W' },
  // The bus-bar system, the protection and the harmonics (sheet version 6, lib/sheet/systemSchema.ts).
  'busbarSystem.barGapM': { quantity: 'lengthMm' },
  'busbarSystem.phaseSpacingM': { quantity: 'lengthMm' },
  'busbarSystem.supportSpacingM': { quantity: 'lengthMm' },
  'busbarSystem.spacerSpacingM': { quantity: 'lengthMm' },
  'busbarSystem.supportStrengthN': { quantity: 'none', fixedUnit: 'N' },
  'busbarSystem.rOverX': { quantity: 'none' },
  'busbarSystem.kappa': { quantity: 'none' },
  'protection.device.ratedCurrentA': { quantity: 'none', fixedUnit: 'A' },
  'protection.device.settingCurrentA': { quantity: 'none', fixedUnit: 'A' },
  'protection.device.instantaneousCurrentA': { quantity: 'none', fixedUnit: 'A' },
  'protection.device.instantaneousMaxTimeS': { quantity: 'none', fixedUnit: 's' },
  'protection.device.conventionalOperatingCurrentA': { quantity: 'none', fixedUnit: 'A' },
  // One entry for the same field of every point of the curve.
  'protection.device.timeCurrentCurve.currentA': { quantity: 'none', fixedUnit: 'A' },
  'protection.device.timeCurrentCurve.timeS': { quantity: 'none', fixedUnit: 's' },
  'protection.earthElectrodesOhm': { quantity: 'none', fixedUnit: 'Ω' },
  'protection.sourceResistanceOhm': { quantity: 'none', fixedUnit: 'mΩ' },
  'protection.sourceReactanceOhm': { quantity: 'none', fixedUnit: 'mΩ' },
  'protection.sourceImpedanceOhm': { quantity: 'none', fixedUnit: 'mΩ' },
  'protection.protectiveConductor.sectionMm2': { quantity: 'areaMm2' },
  'harmonics.thirdHarmonicPercent': { quantity: 'none', fixedUnit: '%' },
  'crossSection.heatTransferCoefficientWPerM2K': { quantity: 'none', fixedUnit: 'W/(m²·K)' },
} as const satisfies Record<string, FieldUnit>;

export type SheetNumericField = keyof typeof SHEET_FIELD_UNITS;

/**
 * Stored SI → what the form shows. Stored values carry a scale of their own where the form shows
 * a handier unit: spacing is stored in m and shown in mm (or in), reactance is stored in Ω/m and
 * shown in mΩ/m = Ω/km (or Ω/kft).
 */
const STORED_TO_QUANTITY_SCALE: Partial<Record<SheetNumericField, number>> = {
  'installation.spacingM': 1000,
  'installation.circuitSpacingM': 1000,
  'installation.otherCircuits.externalDiameterM': 1000,
  'installation.duct.innerDiameterM': 1000,
  'installation.duct.outerDiameterM': 1000,
  'circuit.reactanceOhmPerM': 1000,
  // Stored in A, shown in kA.
  'fault.currentA': 1 / 1000,
  // Stored in seconds, shown in minutes.
  'overTime.overloadDurationS': 1 / 60,
  // The bus-bar system's lengths are stored in m and shown in mm (or in); the source impedance in Ω, shown in mΩ.
  'busbarSystem.barGapM': 1000,
  'busbarSystem.phaseSpacingM': 1000,
  'busbarSystem.supportSpacingM': 1000,
  'busbarSystem.spacerSpacingM': 1000,
  'protection.sourceResistanceOhm': 1000,
  'protection.sourceReactanceOhm': 1000,
  'protection.sourceImpedanceOhm': 1000,
};

/**
 * `value × scale`, dividing by the whole number 1/scale where the scale is a fraction (1/1000 for
 * kA, 1/60 for minutes): 25 kA is then exactly 25 000 A, not 25 / 0.001 = 24 999.999…
 */
function scaled(value: number, scale: number): number {
  if (scale >= 1) return value * scale;
  return value / Math.round(1 / scale);
}

export function toDisplay(field: SheetNumericField, storedValue: number, system: UnitSystem): number {
  const spec: FieldUnit = SHEET_FIELD_UNITS[field];
  const value = scaled(storedValue, STORED_TO_QUANTITY_SCALE[field] ?? 1);
  if (spec.quantity === 'none') return value;
  if (spec.quantity === 'speedMPerS') return system === 'si' ? value : metresToFeet(value);
  return convertFromSi(value, spec.quantity, system);
}

export function fromDisplay(field: SheetNumericField, shownValue: number, system: UnitSystem): number {
  const spec: FieldUnit = SHEET_FIELD_UNITS[field];
  let value: number;
  if (spec.quantity === 'none') value = shownValue;
  else if (spec.quantity === 'speedMPerS') value = system === 'si' ? shownValue : feetToMetres(shownValue);
  else value = convertToSi(shownValue, spec.quantity, system);
  return scaled(value, 1 / (STORED_TO_QUANTITY_SCALE[field] ?? 1));
}

export function displayUnit(field: SheetNumericField, system: UnitSystem): string {
  const spec: FieldUnit = SHEET_FIELD_UNITS[field];
  if (spec.quantity === 'none') return spec.fixedUnit ?? '';
  if (spec.quantity === 'speedMPerS') return system === 'si' ? 'm/s' : 'ft/s';
  return unitLabel(spec.quantity, system);
}

/**
 * A stored value as the text a field shows: rounded for reading, without float noise
 * (0.30000000000000004). An SI value shows what was typed (six significant figures); a value
 * converted to US customary units shows four (6 m reads 19.69 ft, not 19.685 ft) — the stored SI
 * value keeps its precision until the field is edited.
 */
export function displayText(field: SheetNumericField, storedValue: number | null, system: UnitSystem): string {
  if (storedValue === null || !Number.isFinite(storedValue)) return '';
  const spec: FieldUnit = SHEET_FIELD_UNITS[field];
  const converted = system === 'imperial' && spec.quantity !== 'none';
  return formatNumber(toDisplay(field, storedValue, system), converted ? 4 : 6);
}

/** Temperatures on the result strip and plots, in the user's system. */
export function temperatureIn(system: UnitSystem, temperatureC: number): number {
  return system === 'si' ? temperatureC : celsiusToFahrenheit(temperatureC);
}
export function temperatureFrom(system: UnitSystem, shown: number): number {
  return system === 'si' ? shown : fahrenheitToCelsius(shown);
}

/**
 * A message of the stored quantity (the bounds speak the stored unit: "at most 500000 A") in the
 * unit the field shows, for the field whose display unit differs by a scale alone (the fault
 * current, stored in A and shown in kA): "at most 500 kA".
 */
export function messageInDisplayUnit(field: SheetNumericField, message: string | undefined): string | undefined {
  if (message === undefined || field !== 'fault.currentA') return message;
  return message.replace(/(\d+(?:\.\d+)?) A\b/g, (_all, value: string) => `${formatNumber(Number(value) / 1000, 6)} kA`);
}

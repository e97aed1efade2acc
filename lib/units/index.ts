/**
 * `lib/units` — SI ↔ US customary conversions for display and entry.
 *
 * Everything is stored and computed in SI; these functions only convert at the edges (screens,
 * imports, exports). Exact defining factors are used where one exists:
 * - 1 in = 25.4 mm and 1 ft = 0.3048 m exactly (international yard and pound agreement, 1959);
 * - 1 lb = 0.453 592 37 kg exactly (same agreement);
 * - 1 circular mil = the area of a circle 0.001 in across = π/4 × (0.0254 mm)² (definition);
 *   1 kcmil = 1000 circular mils;
 * - AWG diameter d = 0.127 mm × 92^((36 − n)/39) (ASTM B258 definition; 0000 → n = −3);
 * - 1 BTU_IT = 1055.055 852 62 J exactly, 1 °F difference = 5/9 K exactly.
 *
 * Pure TypeScript, no dependencies: runs in the browser and on the server.
 */
export type UnitSystem = 'si' | 'imperial';

export const MM_PER_INCH = 25.4;
export const M_PER_FOOT = 0.3048;
export const KG_PER_POUND = 0.45359237;
export const J_PER_BTU = 1055.05585262;
/** Area of one circular mil, mm²: π/4 × (0.0254 mm)². */
export const MM2_PER_CIRCULAR_MIL = (Math.PI / 4) * 0.0254 * 0.0254;
export const MM2_PER_KCMIL = MM2_PER_CIRCULAR_MIL * 1000;

// ── temperature ──
export const celsiusToFahrenheit = (temperatureC: number) => (temperatureC * 9) / 5 + 32;
export const fahrenheitToCelsius = (temperatureF: number) => ((temperatureF - 32) * 5) / 9;
/** A temperature difference (rise above ambient): 1 K = 1.8 °F of difference, no offset. */
export const kelvinRiseToFahrenheitRise = (riseK: number) => riseK * 1.8;
export const fahrenheitRiseToKelvinRise = (riseF: number) => riseF / 1.8;

// ── length ──
export const mmToInches = (lengthMm: number) => lengthMm / MM_PER_INCH;
export const inchesToMm = (lengthIn: number) => lengthIn * MM_PER_INCH;
export const metresToFeet = (lengthM: number) => lengthM / M_PER_FOOT;
export const feetToMetres = (lengthFt: number) => lengthFt * M_PER_FOOT;

// ── conductor area ──
export const mm2ToKcmil = (areaMm2: number) => areaMm2 / MM2_PER_KCMIL;
export const kcmilToMm2 = (areaKcmil: number) => areaKcmil * MM2_PER_KCMIL;
export const mm2ToSquareInches = (areaMm2: number) => areaMm2 / (MM_PER_INCH * MM_PER_INCH);
export const squareInchesToMm2 = (areaIn2: number) => areaIn2 * MM_PER_INCH * MM_PER_INCH;

/** Gauge number n of an AWG label: '14' → 14, '1/0' → 0, '2/0' → −1, '3/0' → −2, '4/0' → −3. */
export function awgNumber(gauge: string | number): number {
  if (typeof gauge === 'number') return gauge;
  const trimmed = gauge.trim().toUpperCase().replace(/^AWG\s*/, '');
  const aught = /^([1-4])\/0$/.exec(trimmed);
  if (aught) return 1 - Number(aught[1]);
  if (/^0{1,4}$/.test(trimmed)) return 1 - trimmed.length;
  const n = Number(trimmed);
  if (!Number.isInteger(n) || n < -3 || n > 40) throw new RangeError(`not an AWG size: ${gauge}`);
  return n;
}

/** The label of gauge number n: 14 → '14', 0 → '1/0', −3 → '4/0'. */
export function awgLabel(n: number): string {
  return n > 0 ? String(n) : `${1 - n}/0`;
}

/** Diameter of a solid wire of the gauge, mm (ASTM B258 definition). */
export function awgDiameterMm(gauge: string | number): number {
  return 0.127 * Math.pow(92, (36 - awgNumber(gauge)) / 39);
}

/** Nominal area of the gauge, mm² (area of the solid wire of that diameter). */
export function awgToMm2(gauge: string | number): number {
  const d = awgDiameterMm(gauge);
  return (Math.PI / 4) * d * d;
}

/** The gauge number (possibly fractional) whose nominal area is `areaMm2`. */
export function mm2ToAwgNumber(areaMm2: number): number {
  const diameterMm = Math.sqrt((4 * areaMm2) / Math.PI);
  return 36 - (39 * Math.log(diameterMm / 0.127)) / Math.log(92);
}

// ── per-length quantities ──
/** Ω/km → Ω per 1000 ft: one thousand feet is 0.3048 km. */
export const ohmPerKmToOhmPerKft = (resistanceOhmPerKm: number) => resistanceOhmPerKm * M_PER_FOOT;
export const ohmPerKftToOhmPerKm = (resistanceOhmPerKft: number) => resistanceOhmPerKft / M_PER_FOOT;
export const wattPerMetreToWattPerFoot = (powerWPerM: number) => powerWPerM * M_PER_FOOT;
export const wattPerFootToWattPerMetre = (powerWPerFt: number) => powerWPerFt / M_PER_FOOT;
export const kgPerMetreToLbPerFoot = (massKgPerM: number) => (massKgPerM * M_PER_FOOT) / KG_PER_POUND;
export const lbPerFootToKgPerMetre = (massLbPerFt: number) => (massLbPerFt * KG_PER_POUND) / M_PER_FOOT;

// ── thermal ──
/**
 * Thermal resistivity K·m/W → °C·cm/W, the unit North American cable practice quotes
 * (soil "rho" 90 °C·cm/W). A difference of 1 °C equals 1 K, so the factor is just 100.
 */
export const kelvinMetrePerWattToCelsiusCmPerWatt = (resistivityKmPerW: number) => resistivityKmPerW * 100;
export const celsiusCmPerWattToKelvinMetrePerWatt = (resistivityCcmPerW: number) => resistivityCcmPerW / 100;
/** W/(m·K) → BTU/(h·ft·°F). */
export const wattPerMetreKelvinToBtuPerHourFootF = (conductivityWPerMK: number) =>
  (conductivityWPerMK * 3600 * M_PER_FOOT) / (J_PER_BTU * 1.8);
export const btuPerHourFootFToWattPerMetreKelvin = (conductivityBtu: number) =>
  (conductivityBtu * J_PER_BTU * 1.8) / (3600 * M_PER_FOOT);
/** kg/m³ → lb/ft³. */
export const kgPerM3ToLbPerFt3 = (densityKgPerM3: number) => (densityKgPerM3 / KG_PER_POUND) * M_PER_FOOT ** 3;
export const lbPerFt3ToKgPerM3 = (densityLbPerFt3: number) => (densityLbPerFt3 * KG_PER_POUND) / M_PER_FOOT ** 3;
/** J/(kg·K) → BTU/(lb·°F). */
export const joulePerKgKelvinToBtuPerLbF = (specificHeatJPerKgK: number) =>
  (specificHeatJPerKgK * KG_PER_POUND) / (J_PER_BTU * 1.8);
export const btuPerLbFToJoulePerKgKelvin = (specificHeatBtu: number) => (specificHeatBtu * J_PER_BTU * 1.8) / KG_PER_POUND;
/** A price per kg → per lb (a pound is less than a kilogram, so the price per lb is smaller). */
export const pricePerKgToPricePerLb = (pricePerKg: number) => pricePerKg * KG_PER_POUND;
export const pricePerLbToPricePerKg = (pricePerLb: number) => pricePerLb / KG_PER_POUND;

// ── formatting ──
/** Quantities the screens show. The SI unit is the stored one. */
export type Quantity =
  | 'temperature'
  | 'temperatureRise'
  | 'lengthMm'
  | 'lengthM'
  | 'areaMm2'
  | 'resistanceOhmPerKm'
  | 'powerWPerM'
  | 'massKgPerM'
  | 'thermalResistivityKmPerW'
  | 'thermalConductivityWPerMK'
  | 'densityKgPerM3'
  | 'specificHeatJPerKgK'
  | 'pricePerKg';

interface QuantitySpec {
  si: string;
  imperial: string;
  toImperial: (siValue: number) => number;
  fromImperial: (imperialValue: number) => number;
  /** Significant digits shown (a display choice; stored values keep their full precision). */
  digits: number;
}

export const QUANTITIES: Readonly<Record<Quantity, QuantitySpec>> = {
  temperature: { si: '°C', imperial: '°F', toImperial: celsiusToFahrenheit, fromImperial: fahrenheitToCelsius, digits: 4 },
  temperatureRise: { si: 'K', imperial: '°F rise', toImperial: kelvinRiseToFahrenheitRise, fromImperial: fahrenheitRiseToKelvinRise, digits: 3 },
  lengthMm: { si: 'mm', imperial: 'in', toImperial: mmToInches, fromImperial: inchesToMm, digits: 4 },
  lengthM: { si: 'm', imperial: 'ft', toImperial: metresToFeet, fromImperial: feetToMetres, digits: 4 },
  areaMm2: { si: 'mm²', imperial: 'kcmil', toImperial: mm2ToKcmil, fromImperial: kcmilToMm2, digits: 4 },
  resistanceOhmPerKm: { si: 'Ω/km', imperial: 'Ω/kft', toImperial: ohmPerKmToOhmPerKft, fromImperial: ohmPerKftToOhmPerKm, digits: 4 },
  powerWPerM: { si: 'W/m', imperial: 'W/ft', toImperial: wattPerMetreToWattPerFoot, fromImperial: wattPerFootToWattPerMetre, digits: 3 },
  massKgPerM: { si: 'kg/m', imperial: 'lb/ft', toImperial: kgPerMetreToLbPerFoot, fromImperial: lbPerFootToKgPerMetre, digits: 3 },
  thermalResistivityKmPerW: {
    si: 'K·m/W',
    imperial: '°C·cm/W',
    toImperial: kelvinMetrePerWattToCelsiusCmPerWatt,
    fromImperial: celsiusCmPerWattToKelvinMetrePerWatt,
    digits: 3,
  },
  thermalConductivityWPerMK: {
    si: 'W/(m·K)',
    imperial: 'BTU/(h·ft·°F)',
    toImperial: wattPerMetreKelvinToBtuPerHourFootF,
    fromImperial: btuPerHourFootFToWattPerMetreKelvin,
    digits: 3,
  },
  densityKgPerM3: { si: 'kg/m³', imperial: 'lb/ft³', toImperial: kgPerM3ToLbPerFt3, fromImperial: lbPerFt3ToKgPerM3, digits: 4 },
  specificHeatJPerKgK: {
    si: 'J/(kg·K)',
    imperial: 'BTU/(lb·°F)',
    toImperial: joulePerKgKelvinToBtuPerLbF,
    fromImperial: btuPerLbFToJoulePerKgKelvin,
    digits: 3,
  },
  pricePerKg: { si: '/kg', imperial: '/lb', toImperial: pricePerKgToPricePerLb, fromImperial: pricePerLbToPricePerKg, digits: 4 },
};

export function unitLabel(quantity: Quantity, system: UnitSystem): string {
  return QUANTITIES[quantity][system];
}

/** An SI value (number or decimal string) in the chosen system, as a number. */
export function convertFromSi(value: number | string, quantity: Quantity, system: UnitSystem): number {
  const n = typeof value === 'string' ? Number(value) : value;
  return system === 'si' ? n : QUANTITIES[quantity].toImperial(n);
}

/** A value entered in the chosen system, back to SI. */
export function convertToSi(value: number | string, quantity: Quantity, system: UnitSystem): number {
  const n = typeof value === 'string' ? Number(value) : value;
  return system === 'si' ? n : QUANTITIES[quantity].fromImperial(n);
}

/** The number alone, rounded for display (no unit). Empty input gives ''. */
export function formatNumber(value: number, digits: number): string {
  if (!Number.isFinite(value)) return '';
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, digits - 1 - magnitude);
  // toFixed keeps trailing zeros of the precision; strip them so 25.40 shows 25.4.
  return value.toFixed(Math.min(decimals, 12)).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
}

/**
 * An SI value shown in the user's system with its unit, e.g.
 * formatQuantity(90, 'temperature', 'imperial') → '194 °F'.
 */
export function formatQuantity(
  value: number | string | null | undefined,
  quantity: Quantity,
  system: UnitSystem,
  options: { digits?: number; withUnit?: boolean } = {},
): string {
  if (value === null || value === undefined || value === '') return '';
  const converted = convertFromSi(value, quantity, system);
  if (!Number.isFinite(converted)) return '';
  const text = formatNumber(converted, options.digits ?? QUANTITIES[quantity].digits);
  if (options.withUnit === false) return text;
  return `${text} ${unitLabel(quantity, system)}`;
}

/** Prefixes for a power, largest first: the first whose size the value reaches is used. */
const POWER_PREFIXES: ReadonlyArray<{ prefix: string; factor: number }> = [
  { prefix: 'M', factor: 1e6 },
  { prefix: 'k', factor: 1e3 },
  { prefix: '', factor: 1 },
  // mW is the smallest: a loss below a milliwatt reads "0.646 mW", which a designer reads as "nothing".
  { prefix: 'm', factor: 1e-3 },
];

/**
 * A power in watts with the unit picked by its size (MW, kW, W, mW), so that a small loss reads
 * "0.646 mW" rather than "0.000000646 kW"; `per` adds a denominator ("/m" → "12.1 kW/m").
 * The figure keeps `digits` significant digits, as formatNumber does.
 */
export function formatPower(watts: number, options: { digits?: number; per?: string } = {}): string {
  if (!Number.isFinite(watts)) return '';
  const digits = options.digits ?? 3;
  const unit = (prefix: string) => `${prefix}W${options.per ?? ''}`;
  if (watts === 0) return `0 ${unit('')}`;
  const size = Math.abs(watts);
  // Rounding first, so that 999.96 W becomes "1 kW", not "1000 W".
  const rounded = Number(size.toPrecision(digits));
  const chosen = POWER_PREFIXES.find((p) => rounded >= p.factor) ?? POWER_PREFIXES[POWER_PREFIXES.length - 1];
  return `${formatNumber(watts / chosen.factor, digits)} ${unit(chosen.prefix)}`;
}

/** A loss per length in the user's system: SI picks its prefix by size (mW/m, W/m, kW/m); imperial stays W/ft. */
export function lossPerLengthWords(lossWPerM: number, system: UnitSystem): string {
  if (system === 'si') return formatPower(lossWPerM, { digits: QUANTITIES.powerWPerM.digits, per: '/m' });
  return formatQuantity(lossWPerM, 'powerWPerM', system);
}

// ── words with quantities (help texts, candidate names) ──

/** SI units as they appear in words, with the quantity each is; longest first so "mm²" wins over "mm" and "m". */
const WORD_UNITS: ReadonlyArray<{ unit: string; quantity: Quantity }> = [
  { unit: 'K·m/W', quantity: 'thermalResistivityKmPerW' },
  { unit: 'mΩ/m', quantity: 'resistanceOhmPerKm' },
  { unit: 'Ω/km', quantity: 'resistanceOhmPerKm' },
  { unit: 'mm²', quantity: 'areaMm2' },
  { unit: 'W/m', quantity: 'powerWPerM' },
  { unit: 'm/s', quantity: 'lengthM' },
  { unit: '°C', quantity: 'temperature' },
  { unit: 'mm', quantity: 'lengthMm' },
  { unit: 'm', quantity: 'lengthM' },
  { unit: 'K', quantity: 'temperatureRise' },
];
const escapeRegExp = (s: string) => s.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
// A number, a space, a unit, and then no letter, digit or superscript (so "W/m²", "IEC 60364-5-52", "mΩ" stay whole).
const WORD_QUANTITY = new RegExp(`(?<![\\w.,-])(\\d+(?:\\.\\d+)?) (${WORD_UNITS.map((u) => escapeRegExp(u.unit)).join('|')})(?![\\p{L}\\d²³/·])`, 'gu');

/**
 * Text written with SI quantities, for a reader in the chosen system: in imperial each quantity
 * reads in US customary units, rounded to three significant figures, with the SI figure after it
 * in brackets (the standards the texts quote are written in SI): "0.7 m" → "2.3 ft (0.7 m)",
 * "30 °C" → "86 °F (30 °C)", a rise "70 K" → "126 °F rise (70 K)". SI text is returned as it is.
 */
export function quantitiesInWords(text: string, system: UnitSystem): string {
  if (system === 'si') return text;
  return text.replace(WORD_QUANTITY, (whole, value: string, unit: string) => {
    const spec = WORD_UNITS.find((u) => u.unit === unit);
    if (!spec) return whole;
    if (Number(value) === 0 && spec.quantity !== 'temperature') return `0 ${unit === 'm/s' ? 'ft/s' : unitLabel(spec.quantity, 'imperial')}`;
    // mΩ/m is Ω/km: the same number.
    const converted = QUANTITIES[spec.quantity].toImperial(Number(value));
    const imperialUnit = unit === 'm/s' ? 'ft/s' : unitLabel(spec.quantity, 'imperial');
    return `${formatNumber(converted, 3)} ${imperialUnit} (${whole})`;
  });
}

/**
 * What a printed or shared document says about its units: it is in SI whatever the author's
 * screen shows (the records it prints are SI; converting them there would be a second path to get wrong).
 */
export const DOCUMENT_UNITS_LINE =
  'Units: SI throughout — temperatures in °C, temperature differences (margins, rises) in K, lengths in m and mm, sections in mm², currents in A, fault currents in kA, losses in W/m. Figures are not converted to the reader’s unit setting.';

/**
 * A catalogue name for a reader in the chosen system: kept as written (it is the name the
 * catalogue and the drawings use), with its size in US customary units after it in imperial —
 * "60 × 10 mm Copper bar (2.36 × 0.394 in)", "95 mm² copper XLPE/PVC single-core (187 kcmil)".
 */
export function nameInSystem(name: string, system: UnitSystem): string {
  if (system === 'si') return name;
  const bar = /(\d+(?:\.\d+)?) × (\d+(?:\.\d+)?) mm(?![²\p{L}])/u.exec(name);
  if (bar) return `${name} (${formatNumber(mmToInches(Number(bar[1])), 3)} × ${formatNumber(mmToInches(Number(bar[2])), 3)} in)`;
  const section = /(\d+(?:\.\d+)?) mm²/.exec(name);
  if (section) return `${name} (${formatNumber(mm2ToKcmil(Number(section[1])), 3)} kcmil)`;
  return name;
}

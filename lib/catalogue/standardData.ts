/**
 * The standard catalogue every team starts from: rows in the import layout (decimal strings in
 * the stored units), each value with its source. "From memory" means the value was recalled,
 * not read from the document at hand (../shared/design/references.md); the label stays so that
 * a reviewer checks it and the sizing flags it (DATA_FROM_MEMORY).
 *
 * Computed values (bar and North American resistances, approximate diameters) are derived here
 * with decimal.js from the stated formula, so the formula and the stored number cannot drift apart.
 *
 * Pure data in lib/ (no database): the seed (db/seed/catalogue.ts) copies it into every team, and
 * the verification cases (lib/verification) check it, without lib importing db.
 */
import Decimal from 'decimal.js';
import { awgToMm2, kcmilToMm2 } from '../units';
import { DEFAULT_YIELD_STRENGTH_PA } from '../electrical/busbar/forces';
import { BARE_BAR_SHORT_CIRCUIT_LIMIT_C, BARE_BAR_SHORT_CIRCUIT_LIMIT_SOURCE } from '../electrical/sizing/checks/shortCircuit';
import type { BuildRow, ConductorRow, CoveringRow, MaterialRow } from './schemas';

type Input<T> = { [K in keyof T]: T[K] extends string ? string : T[K] extends string | null ? string | null : T[K] };

// ───────────────────────── Metals ─────────────────────────

const IEC_60287_TABLE_1 = 'IEC 60287-1-1 Table 1';
const DEMO_PRICE_NOTE = 'Invented demo price, not a market quote: a team setting — enter your own.';

export const STANDARD_MATERIALS: Input<MaterialRow>[] = [
  {
    key: 'copper',
    name: 'Copper',
    baseMetal: 'copper',
    rho20OhmM: '0.000000017241',
    alpha20PerK: '0.00393',
    electricalSource: IEC_60287_TABLE_1,
    thermalConductivityWPerMK: '401',
    densityKgPerM3: '8890',
    specificHeatJPerKgK: '385',
    thermalSource:
      'Conductivity and specific heat: pure copper at 300 K, Incropera et al., Fundamentals of Heat and Mass Transfer, Table A.1 (from memory); density: IEC 60028 annealed copper standard, 8.89 g/cm³ at 20 °C (from memory)',
    adiabaticK: '226',
    betaK: '234.5',
    shortCircuitSource: 'IEC 60949 Table 1 (from memory)',
    pricePerKg: '9.50',
    priceNote: DEMO_PRICE_NOTE,
  },
  {
    key: 'aluminium',
    name: 'Aluminium',
    baseMetal: 'aluminium',
    rho20OhmM: '0.000000028264',
    alpha20PerK: '0.00403',
    electricalSource: IEC_60287_TABLE_1,
    thermalConductivityWPerMK: '237',
    densityKgPerM3: '2703',
    specificHeatJPerKgK: '903',
    thermalSource:
      'Conductivity and specific heat: pure aluminium at 300 K, Incropera et al., Table A.1 (from memory); density: IEC 60889 hard-drawn aluminium wire, 2.703 g/cm³ (from memory)',
    adiabaticK: '148',
    betaK: '228',
    shortCircuitSource: 'IEC 60949 Table 1 (from memory)',
    pricePerKg: '2.60',
    priceNote: DEMO_PRICE_NOTE,
  },
];

const RHO20_OHM_MM2_PER_M = { copper: new Decimal('0.017241'), aluminium: new Decimal('0.028264') } as const;

// ───────────────────────── Round cores, IEC 60228 class 2 ─────────────────────────

/**
 * IEC 60228 Table 2, class 2, maximum DC resistance at 20 °C, Ω/km. The values also listed in
 * references.md are tagged so; the rest are recalled from the same table.
 */
const IN_REFERENCES = 'IEC 60228 Table 2, class 2, maximum at 20 °C (from memory)';
const NOT_IN_REFERENCES = 'IEC 60228 Table 2, class 2, maximum at 20 °C (from memory)';

export const IEC_60228_COPPER: ReadonlyArray<readonly [sectionMm2: string, r20OhmPerKm: string, source: string]> = [
  ['1.5', '12.1', IN_REFERENCES],
  ['2.5', '7.41', IN_REFERENCES],
  ['4', '4.61', IN_REFERENCES],
  ['6', '3.08', IN_REFERENCES],
  ['10', '1.83', IN_REFERENCES],
  ['16', '1.15', IN_REFERENCES],
  ['25', '0.727', IN_REFERENCES],
  ['35', '0.524', IN_REFERENCES],
  ['50', '0.387', IN_REFERENCES],
  ['70', '0.268', IN_REFERENCES],
  ['95', '0.193', IN_REFERENCES],
  ['120', '0.153', IN_REFERENCES],
  ['150', '0.124', IN_REFERENCES],
  ['185', '0.0991', IN_REFERENCES],
  ['240', '0.0754', IN_REFERENCES],
  ['300', '0.0601', IN_REFERENCES],
  ['400', '0.0470', NOT_IN_REFERENCES],
  ['500', '0.0366', NOT_IN_REFERENCES],
  ['630', '0.0283', NOT_IN_REFERENCES],
];

export const IEC_60228_ALUMINIUM: ReadonlyArray<readonly [sectionMm2: string, r20OhmPerKm: string, source: string]> = [
  ['16', '1.91', NOT_IN_REFERENCES],
  ['25', '1.20', NOT_IN_REFERENCES],
  ['35', '0.868', NOT_IN_REFERENCES],
  ['50', '0.641', IN_REFERENCES],
  ['70', '0.443', NOT_IN_REFERENCES],
  ['95', '0.320', IN_REFERENCES],
  ['120', '0.253', NOT_IN_REFERENCES],
  ['150', '0.206', IN_REFERENCES],
  ['185', '0.164', NOT_IN_REFERENCES],
  ['240', '0.125', IN_REFERENCES],
  ['300', '0.100', NOT_IN_REFERENCES],
  ['400', '0.0778', NOT_IN_REFERENCES],
  ['500', '0.0605', NOT_IN_REFERENCES],
  ['630', '0.0469', NOT_IN_REFERENCES],
];

/**
 * Effective diameter of a class 2 conductor, approximate: d = √(4A/(π·f)) with the fill factor
 * f = 7/9 for the small 7-wire non-compacted conductors (≤ 6 mm²; geometry of 7 equal round wires
 * in a circle three wires across) and f = 0.90 for compacted conductors (≥ 10 mm², common
 * practice). Rounded to 0.1 mm. A supplier's datasheet diameter should replace it.
 */
export function approximateClass2DiameterMm(sectionMm2: string): string {
  const area = new Decimal(sectionMm2);
  const fill = area.lte(6) ? new Decimal(7).div(9) : new Decimal('0.90');
  return area.times(4).div(fill.times(Math.PI)).sqrt().toDecimalPlaces(1).toFixed(1);
}
const CLASS_2_DIAMETER_SOURCE =
  'Approximate: d = √(4A/(π·f)), fill factor f = 7/9 for 7-wire non-compacted (≤ 6 mm²) and 0.90 for compacted conductors (common practice); replace with the datasheet value';

function metricConductors(material: 'copper' | 'aluminium', table: typeof IEC_60228_COPPER): Input<ConductorRow>[] {
  const prefix = material === 'copper' ? 'cu' : 'al';
  return table.map(([sectionMm2, r20OhmPerKm, resistanceSource]) => ({
    key: `${prefix}-${sectionMm2}`,
    designation: `${sectionMm2} mm²`,
    materialKey: material,
    shape: 'round',
    sizeSystem: 'metric',
    construction: 'IEC 60228 class 2 (stranded)',
    sectionMm2,
    r20OhmPerKm,
    resistanceSource,
    diameterMm: approximateClass2DiameterMm(sectionMm2),
    widthMm: null,
    thicknessMm: null,
    dimensionSource: CLASS_2_DIAMETER_SOURCE,
    yieldStrengthMpa: null,
    yieldStrengthSource: '',
    shortCircuitLimitC: null,
    shortCircuitLimitSource: '',
  }));
}

// ───────────────────────── North American sizes ─────────────────────────

/**
 * Lay of the strands makes each wire longer than the conductor: the DC resistance of a
 * concentric-lay stranded conductor is taken 2 % above that of a solid rod of the same area
 * (common practice; ASTM B8 uses a similar increment). With it, copper 4/0 AWG at 75 °C comes
 * to 0.0608 Ω/kft, as NEC Chapter 9 Table 8 lists (from memory) — see the unit tests.
 */
export const STRANDING_FACTOR = new Decimal('1.02');

/** Overall diameter of class B concentric stranded conductors, inches — NEC Chapter 9 Table 8 (from memory). */
export const NEC_TABLE_8_STRANDED_DIAMETER_IN: ReadonlyArray<readonly [size: string, diameterIn: string]> = [
  ['14', '0.073'],
  ['12', '0.092'],
  ['10', '0.116'],
  ['8', '0.146'],
  ['6', '0.184'],
  ['4', '0.232'],
  ['3', '0.260'],
  ['2', '0.292'],
  ['1', '0.332'],
  ['1/0', '0.372'],
  ['2/0', '0.418'],
  ['3/0', '0.470'],
  ['4/0', '0.528'],
  ['250', '0.575'],
  ['300', '0.630'],
  ['350', '0.681'],
  ['400', '0.728'],
  ['500', '0.813'],
  ['600', '0.893'],
  ['700', '0.964'],
  ['750', '0.998'],
  ['800', '1.030'],
  ['900', '1.094'],
  ['1000', '1.152'],
];

export function northAmericanSectionMm2(size: string): Decimal {
  const isKcmil = !size.includes('/') && Number(size) >= 250;
  return new Decimal(isKcmil ? kcmilToMm2(Number(size)) : awgToMm2(size));
}

/** R₂₀ = ρ₂₀ · k_stranding / A, Ω/km, to 4 significant figures. */
export function strandedR20OhmPerKm(material: 'copper' | 'aluminium', sectionMm2: Decimal): string {
  return RHO20_OHM_MM2_PER_M[material].times(STRANDING_FACTOR).times(1000).div(sectionMm2).toSignificantDigits(4).toFixed();
}

function northAmericanConductors(material: 'copper' | 'aluminium', smallestAwg: number): Input<ConductorRow>[] {
  const prefix = material === 'copper' ? 'cu' : 'al';
  const rows: Input<ConductorRow>[] = [];
  for (const [size, diameterIn] of NEC_TABLE_8_STRANDED_DIAMETER_IN) {
    const isKcmil = !size.includes('/') && Number(size) >= 250;
    if (!isKcmil && !size.includes('/') && Number(size) > smallestAwg) continue;
    const section = northAmericanSectionMm2(size);
    rows.push({
      key: isKcmil ? `${prefix}-${size}kcmil` : `${prefix}-awg-${size.replace('/', '-')}`,
      designation: isKcmil ? `${size} kcmil` : `${size} AWG`,
      materialKey: material,
      shape: 'round',
      sizeSystem: isKcmil ? 'kcmil' : 'awg',
      construction: 'Class B concentric stranded',
      sectionMm2: section.toSignificantDigits(4).toFixed(),
      r20OhmPerKm: strandedR20OhmPerKm(material, section),
      resistanceSource: `Computed: R₂₀ = ρ₂₀·1.02/A with ρ₂₀ from ${IEC_60287_TABLE_1} and a 2 % stranding increment (common practice); A from ${isKcmil ? '1 kcmil = 0.5067 mm²' : 'the AWG definition d = 0.127 mm·92^((36−n)/39)'}`,
      diameterMm: new Decimal(diameterIn).times('25.4').toFixed(),
      widthMm: null,
      thicknessMm: null,
      dimensionSource: `NEC Chapter 9 Table 8, stranded overall diameter ${diameterIn} in (from memory)`,
      yieldStrengthMpa: null,
      yieldStrengthSource: '',
      shortCircuitLimitC: null,
      shortCircuitLimitSource: '',
    });
  }
  return rows;
}

// ───────────────────────── Rectangular bars ─────────────────────────

/** Common bar sizes, width × thickness in mm (common practice). */
export const BAR_SIZES_MM: ReadonlyArray<readonly [widthMm: number, thicknessMm: number]> = [
  [12, 2], [15, 3], [20, 2], [20, 3], [20, 5], [25, 3], [25, 5], [30, 3], [30, 5], [30, 10],
  [40, 3], [40, 5], [40, 10], [50, 5], [50, 10], [60, 5], [60, 10], [80, 5], [80, 10],
  [100, 5], [100, 10], [120, 10], [160, 10], [200, 10],
];

/** R₂₀ = ρ₂₀/(w·t), Ω/km, 5 significant figures; corners taken square. */
export function barR20OhmPerKm(material: 'copper' | 'aluminium', widthMm: number, thicknessMm: number): string {
  return RHO20_OHM_MM2_PER_M[material].times(1000).div(widthMm * thicknessMm).toSignificantDigits(5).toFixed();
}

function bars(material: 'copper' | 'aluminium'): Input<ConductorRow>[] {
  const prefix = material === 'copper' ? 'cu' : 'al';
  return BAR_SIZES_MM.map(([widthMm, thicknessMm]) => ({
    key: `${prefix}-bar-${widthMm}x${thicknessMm}`,
    designation: `${widthMm} × ${thicknessMm} mm`,
    materialKey: material,
    shape: 'rectangular',
    sizeSystem: 'bar',
    construction: 'Rectangular bar',
    sectionMm2: String(widthMm * thicknessMm),
    r20OhmPerKm: barR20OhmPerKm(material, widthMm, thicknessMm),
    resistanceSource: `Computed: R₂₀ = ρ₂₀/(w·t), ρ₂₀ from ${IEC_60287_TABLE_1}; corner radius ignored (the true section is slightly smaller, so the true R₂₀ is slightly higher)`,
    diameterMm: null,
    widthMm: String(widthMm),
    thicknessMm: String(thicknessMm),
    dimensionSource: 'Nominal bar size (common sizes, common practice)',
    // The cautious proof strength per metal that the IEC 60865-1 check assumes when none is given
    // (lib/electrical/busbar/forces.ts, from memory): the half-hard temper a switchboard bar is
    // commonly supplied in. Replace it with the temper on the maker's certificate.
    yieldStrengthMpa: new Decimal(DEFAULT_YIELD_STRENGTH_PA[material].valuePa).div(1e6).toFixed(),
    yieldStrengthSource: `${DEFAULT_YIELD_STRENGTH_PA[material].source}; the temper as supplied governs`,
    shortCircuitLimitC: String(BARE_BAR_SHORT_CIRCUIT_LIMIT_C),
    shortCircuitLimitSource: BARE_BAR_SHORT_CIRCUIT_LIMIT_SOURCE,
  }));
}

export const STANDARD_CONDUCTORS: Input<ConductorRow>[] = [
  ...metricConductors('copper', IEC_60228_COPPER),
  ...metricConductors('aluminium', IEC_60228_ALUMINIUM),
  ...northAmericanConductors('copper', 14),
  ...northAmericanConductors('aluminium', 12),
  ...bars('copper'),
  ...bars('aluminium'),
];

// ───────────────────────── Coverings ─────────────────────────

const IEC_60287_2_1 = (what: string) => `IEC 60287-2-1 Table 1, ${what} (from memory)`;
const HANDBOOK_EMISSIVITY = (what: string) => `Handbook value for ${what} (from memory)`;
const NOT_OUTER = 'Not set: normally not an outer surface — the outer layer gives the emissivity';

export const STANDARD_COVERINGS: Input<CoveringRow>[] = [
  {
    key: 'pvc-insulation',
    name: 'PVC insulation',
    role: 'insulation',
    thermalResistivityKmPerW: '5.0',
    resistivitySource: IEC_60287_2_1('PVC insulation up to 3 kV'),
    continuousLimitC: '70',
    shortCircuitLimitC: '160',
    limitsSource: 'Common practice: 70 °C continuous; 160 °C short circuit (140 °C above 300 mm²)',
    emissivity: '0.9',
    emissivitySource: HANDBOOK_EMISSIVITY('PVC surfaces'),
  },
  {
    key: 'xlpe-insulation',
    name: 'XLPE insulation',
    role: 'insulation',
    thermalResistivityKmPerW: '3.5',
    resistivitySource: IEC_60287_2_1('XLPE insulation'),
    continuousLimitC: '90',
    shortCircuitLimitC: '250',
    limitsSource: 'Common practice: 90 °C continuous, 250 °C short circuit',
    emissivity: null,
    emissivitySource: NOT_OUTER,
  },
  {
    key: 'epr-insulation',
    name: 'EPR insulation',
    role: 'insulation',
    thermalResistivityKmPerW: '3.5',
    resistivitySource: IEC_60287_2_1('EPR insulation up to 3 kV'),
    continuousLimitC: '90',
    shortCircuitLimitC: '250',
    limitsSource: 'Common practice: 90 °C continuous, 250 °C short circuit',
    emissivity: null,
    emissivitySource: NOT_OUTER,
  },
  {
    key: 'pe-insulation',
    name: 'PE insulation',
    role: 'insulation',
    thermalResistivityKmPerW: '3.5',
    resistivitySource: IEC_60287_2_1('polyethylene insulation'),
    continuousLimitC: '70',
    shortCircuitLimitC: '150',
    limitsSource: 'Common practice for thermoplastic polyethylene: 70 °C continuous, 150 °C short circuit (from memory)',
    emissivity: null,
    emissivitySource: NOT_OUTER,
  },
  {
    key: 'pvc-sheath',
    name: 'PVC sheath',
    role: 'sheath',
    thermalResistivityKmPerW: '5.0',
    resistivitySource: IEC_60287_2_1('PVC sheath'),
    continuousLimitC: null,
    shortCircuitLimitC: null,
    limitsSource: "Not set: the insulation's limits govern",
    emissivity: '0.9',
    emissivitySource: HANDBOOK_EMISSIVITY('PVC surfaces'),
  },
  {
    key: 'pe-sheath',
    name: 'PE sheath',
    role: 'sheath',
    thermalResistivityKmPerW: '3.5',
    resistivitySource: IEC_60287_2_1('polyethylene sheath'),
    continuousLimitC: null,
    shortCircuitLimitC: null,
    limitsSource: "Not set: the insulation's limits govern",
    emissivity: '0.9',
    emissivitySource: HANDBOOK_EMISSIVITY('polyethylene surfaces'),
  },
  {
    key: 'epoxy-powder-coating',
    name: 'Epoxy powder coating',
    role: 'coating',
    thermalResistivityKmPerW: '5.0',
    resistivitySource: 'Epoxy resin, thermal conductivity about 0.2 W/(m·K): handbook value (from memory)',
    continuousLimitC: '130',
    shortCircuitLimitC: null,
    limitsSource: "Common practice for class B (130 °C) epoxy bar coatings; check the coating maker's datasheet",
    emissivity: '0.9',
    emissivitySource: HANDBOOK_EMISSIVITY('epoxy coatings'),
  },
  {
    key: 'matt-black-paint',
    name: 'Matt black paint',
    role: 'paint',
    thermalResistivityKmPerW: '5.0',
    resistivitySource: 'Paint resin film, thermal conductivity about 0.2 W/(m·K): handbook value (from memory)',
    continuousLimitC: null,
    shortCircuitLimitC: null,
    limitsSource: "Not set: check the paint maker's datasheet",
    emissivity: '0.95',
    emissivitySource: HANDBOOK_EMISSIVITY('flat black paint'),
  },
  {
    key: 'polyolefin-sleeve',
    name: 'Heat-shrink polyolefin sleeve',
    role: 'sleeve',
    thermalResistivityKmPerW: '4.0',
    resistivitySource: 'Polyolefin, thermal conductivity about 0.25 W/(m·K): handbook value (from memory)',
    continuousLimitC: '125',
    shortCircuitLimitC: null,
    limitsSource: "Common practice: general-purpose polyolefin sleeving rated 125 °C; check the maker's datasheet",
    emissivity: '0.9',
    emissivitySource: HANDBOOK_EMISSIVITY('polymer surfaces'),
  },
];

// ───────────────────────── Demo cable builds ─────────────────────────

/** IEC 60502-1 nominal insulation thickness, 0.6/1 kV, mm (from memory). */
const XLPE_THICKNESS_MM: Record<string, string> = {
  '16': '0.7', '25': '0.9', '35': '0.9', '50': '1.0', '70': '1.1', '95': '1.1', '120': '1.2',
  '150': '1.4', '185': '1.6', '240': '1.7', '300': '1.8', '400': '2.0', '500': '2.2', '630': '2.4',
};
const PVC_THICKNESS_MM: Record<string, string> = {
  '16': '1.0', '25': '1.2', '35': '1.2', '50': '1.4', '70': '1.4', '95': '1.6', '120': '1.6',
  '150': '1.8', '185': '2.0', '240': '2.2', '300': '2.4', '400': '2.6', '500': '2.8', '630': '2.8',
};

/** IEC 60502-1 sheath: t = 0.035·D + 1.0 mm, at least 1.4 mm for single-core (from memory), D ≈ conductor + insulation. */
export function sheathThicknessMm(conductorDiameterMm: string, insulationMm: string): string {
  const underSheath = new Decimal(conductorDiameterMm).plus(new Decimal(insulationMm).times(2));
  return Decimal.max(underSheath.times('0.035').plus(1), '1.4').toDecimalPlaces(1).toFixed(1);
}

const DEMO_BUILD_NOTE = 'Demo item: an invented build with IEC 60502-1 nominal thicknesses; replace it with your supplier’s datasheet.';

function demoBuild(material: 'copper' | 'aluminium', sectionMm2: string, insulation: 'xlpe' | 'pvc'): Input<BuildRow> {
  const prefix = material === 'copper' ? 'cu' : 'al';
  const insulationMm = (insulation === 'xlpe' ? XLPE_THICKNESS_MM : PVC_THICKNESS_MM)[sectionMm2];
  const diameter = approximateClass2DiameterMm(sectionMm2);
  return {
    key: `demo-${prefix}-${sectionMm2}-${insulation}-pvc`,
    name: `${sectionMm2} mm² ${material} ${insulation.toUpperCase()}/PVC single-core`,
    maker: 'Demo build',
    conductorKey: `${prefix}-${sectionMm2}`,
    cores: 1,
    note: DEMO_BUILD_NOTE,
    layer1CoveringKey: `${insulation}-insulation`,
    layer1ThicknessMm: insulationMm,
    layer1Source: `IEC 60502-1 nominal ${insulation.toUpperCase()} insulation thickness, 0.6/1 kV (from memory)`,
    layer2CoveringKey: 'pvc-sheath',
    layer2ThicknessMm: sheathThicknessMm(diameter, insulationMm),
    layer2Source: 'IEC 60502-1 sheath formula 0.035·D + 1.0 mm, at least 1.4 mm (from memory); D taken as conductor plus insulation',
    layer3CoveringKey: '',
    layer3ThicknessMm: null,
    layer3Source: '',
    layer4CoveringKey: '',
    layer4ThicknessMm: null,
    layer4Source: '',
  };
}

export const STANDARD_BUILDS: Input<BuildRow>[] = [
  ...['16', '25', '35', '50', '70', '95', '120', '150', '185', '240', '300', '400', '500', '630'].map((s) => demoBuild('copper', s, 'xlpe')),
  ...['16', '35', '70', '95', '120', '185', '240'].map((s) => demoBuild('copper', s, 'pvc')),
  ...['50', '95', '150', '185', '240', '300', '400'].map((s) => demoBuild('aluminium', s, 'xlpe')),
];


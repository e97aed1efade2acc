/**
 * One description per catalogue column, shared by the grid, the import templates, the import
 * header check and the exports, so that a file exported from the grid imports back unchanged.
 * File headers are snake_case with the stored SI unit in the name; files are always in SI.
 */
import type { Quantity } from '@/lib/units';
import {
  BASE_METALS,
  CONDUCTOR_SHAPES,
  COVERING_ROLES,
  MAX_BUILD_LAYERS,
  SIZE_SYSTEMS,
  type CatalogueKind,
} from './schemas';

export type ColumnType = 'text' | 'decimal' | 'integer' | 'enum' | 'reference';

export interface ColumnSpec {
  /** Property of the row object. */
  field: string;
  /** Header in CSV/XLSX files. */
  header: string;
  /** Grid header, without unit. */
  label: string;
  type: ColumnType;
  required: boolean;
  /** Converted for display when the user works in imperial units. */
  quantity?: Quantity;
  /** Shown next to the label when the column has a unit that is not converted. */
  fixedUnit?: string;
  options?: readonly string[];
  /** For reference columns: the kind whose key the value names. */
  references?: CatalogueKind;
  /** One line for the template's notes sheet. */
  hint: string;
  /** Hidden in the grid until the user adds it with the column chooser. */
  hiddenByDefault?: boolean;
}

const key = (hint: string): ColumnSpec => ({ field: 'key', header: 'key', label: 'Key', type: 'text', required: true, hint });
const source = (field: string, header: string, label: string, what: string): ColumnSpec => ({
  field,
  header,
  label,
  type: 'text',
  required: true,
  hint: `Where ${what} comes from: standard and table, datasheet, handbook, or "from memory".`,
});

const MATERIAL_COLUMNS: ColumnSpec[] = [
  key('Stable short name used by conductors, e.g. copper.'),
  { field: 'name', header: 'name', label: 'Name', type: 'text', required: true, hint: 'Name shown to designers.' },
  { field: 'baseMetal', header: 'base_metal', label: 'Base metal', type: 'enum', options: BASE_METALS, required: true, hint: 'copper or aluminium: selects the electrical model.' },
  { field: 'rho20OhmM', header: 'rho20_ohm_m', label: 'Resistivity ρ₂₀', fixedUnit: 'Ω·m', type: 'decimal', required: true, hint: 'Electrical resistivity at 20 °C, Ω·m (e.g. 1.7241e-8).' },
  { field: 'alpha20PerK', header: 'alpha20_per_k', label: 'Temp. coefficient α₂₀', fixedUnit: '1/K', type: 'decimal', required: true, hint: 'Temperature coefficient of resistance at 20 °C, 1/K.' },
  source('electricalSource', 'electrical_source', 'Source of ρ₂₀, α₂₀', 'ρ₂₀ and α₂₀'),
  { field: 'thermalConductivityWPerMK', header: 'thermal_conductivity_w_per_mk', label: 'Thermal conductivity', quantity: 'thermalConductivityWPerMK', type: 'decimal', required: true, hint: 'W/(m·K).' },
  { field: 'densityKgPerM3', header: 'density_kg_per_m3', label: 'Density', quantity: 'densityKgPerM3', type: 'decimal', required: true, hint: 'kg/m³.' },
  { field: 'specificHeatJPerKgK', header: 'specific_heat_j_per_kgk', label: 'Specific heat', quantity: 'specificHeatJPerKgK', type: 'decimal', required: true, hint: 'J/(kg·K).' },
  source('thermalSource', 'thermal_source', 'Source of thermal values', 'conductivity, density and specific heat'),
  { field: 'adiabaticK', header: 'adiabatic_k', label: 'Short-circuit K', fixedUnit: 'A·s½/mm²', type: 'decimal', required: true, hint: 'IEC 60949 constant K, A·s½/mm².' },
  { field: 'betaK', header: 'beta_k', label: 'Short-circuit β', fixedUnit: 'K', type: 'decimal', required: true, hint: 'IEC 60949 β, K.' },
  source('shortCircuitSource', 'short_circuit_source', 'Source of K, β', 'K and β'),
  { field: 'pricePerKg', header: 'price_per_kg', label: 'Metal price', quantity: 'pricePerKg', type: 'decimal', required: false, hint: 'Team setting: metal price per kg in the team currency (empty for none).' },
  { field: 'priceNote', header: 'price_note', label: 'Price note', type: 'text', required: false, hint: 'Where the price comes from and when.' },
];

const CONDUCTOR_COLUMNS: ColumnSpec[] = [
  key('Stable short name used by cable builds, e.g. cu-240.'),
  { field: 'designation', header: 'designation', label: 'Size', type: 'text', required: true, hint: 'How the size reads, e.g. 240 mm², 4/0 AWG, 100 × 10 mm.' },
  { field: 'materialKey', header: 'material_key', label: 'Metal', type: 'reference', references: 'materials', required: true, hint: 'Key of a conductor metal in this catalogue.' },
  { field: 'shape', header: 'shape', label: 'Shape', type: 'enum', options: CONDUCTOR_SHAPES, required: true, hint: 'round (cable core) or rectangular (bar).' },
  { field: 'sizeSystem', header: 'size_system', label: 'Size system', type: 'enum', options: SIZE_SYSTEMS, required: true, hint: 'metric, awg, kcmil (round) or bar (rectangular).' },
  { field: 'construction', header: 'construction', label: 'Construction', type: 'text', required: false, hint: 'e.g. IEC 60228 class 2, class B concentric, bar.' },
  { field: 'sectionMm2', header: 'section_mm2', label: 'Section', quantity: 'areaMm2', type: 'decimal', required: true, hint: 'Nominal cross-section, mm².' },
  { field: 'r20OhmPerKm', header: 'r20_ohm_per_km', label: 'DC resistance at 20 °C', quantity: 'resistanceOhmPerKm', type: 'decimal', required: true, hint: 'DC resistance at 20 °C, Ω/km.' },
  source('resistanceSource', 'resistance_source', 'Source of resistance', 'the resistance'),
  { field: 'diameterMm', header: 'diameter_mm', label: 'Diameter', quantity: 'lengthMm', type: 'decimal', required: false, hint: 'Round conductors: effective conductor diameter, mm.' },
  { field: 'widthMm', header: 'width_mm', label: 'Width', quantity: 'lengthMm', type: 'decimal', required: false, hint: 'Bars: width (the longer side), mm.' },
  { field: 'thicknessMm', header: 'thickness_mm', label: 'Thickness', quantity: 'lengthMm', type: 'decimal', required: false, hint: 'Bars: thickness, mm.' },
  source('dimensionSource', 'dimension_source', 'Source of dimensions', 'the dimensions'),
  {
    field: 'yieldStrengthMpa',
    header: 'yield_strength_mpa',
    label: 'Proof strength R_p0.2',
    fixedUnit: 'N/mm²',
    type: 'decimal',
    required: false,
    hint: 'Bars: 0.2 % proof strength R_p0.2 of the bar as supplied (its temper), N/mm², for the IEC 60865-1 short-circuit stress check. Empty: a cautious default per metal is assumed and flagged.',
  },
  {
    field: 'yieldStrengthSource',
    header: 'yield_strength_source',
    label: 'Source of R_p0.2',
    type: 'text',
    required: false,
    hint: 'Where the proof strength comes from (standard and temper, the maker’s certificate, or "from memory"); required when a proof strength is given.',
    hiddenByDefault: true,
  },
  {
    field: 'shortCircuitLimitC',
    header: 'short_circuit_limit_c',
    label: 'Short-circuit limit (bare bar)',
    quantity: 'temperature',
    type: 'decimal',
    required: false,
    hint: 'Bars: the highest temperature the bare bar and its supports may reach during a short circuit, °C. A coating’s own limit, when lower, governs. Empty: the library’s default is assumed and flagged.',
  },
  {
    field: 'shortCircuitLimitSource',
    header: 'short_circuit_limit_source',
    label: 'Source of the short-circuit limit',
    type: 'text',
    required: false,
    hint: 'Where the bar’s short-circuit limit comes from (standard and clause, the support maker’s data, or "from memory"); required when a limit is given.',
    hiddenByDefault: true,
  },
];

const COVERING_COLUMNS: ColumnSpec[] = [
  key('Stable short name used by cable builds, e.g. xlpe.'),
  { field: 'name', header: 'name', label: 'Name', type: 'text', required: true, hint: 'Name shown to designers.' },
  { field: 'role', header: 'role', label: 'Used as', type: 'enum', options: COVERING_ROLES, required: true, hint: 'insulation, sheath, coating, paint or sleeve.' },
  { field: 'thermalResistivityKmPerW', header: 'thermal_resistivity_km_per_w', label: 'Thermal resistivity', quantity: 'thermalResistivityKmPerW', type: 'decimal', required: true, hint: 'K·m/W.' },
  source('resistivitySource', 'resistivity_source', 'Source of resistivity', 'the thermal resistivity'),
  { field: 'continuousLimitC', header: 'continuous_limit_c', label: 'Continuous limit', quantity: 'temperature', type: 'decimal', required: false, hint: 'Highest continuous temperature, °C (empty when another layer governs).' },
  { field: 'shortCircuitLimitC', header: 'short_circuit_limit_c', label: 'Short-circuit limit', quantity: 'temperature', type: 'decimal', required: false, hint: 'Highest short-circuit temperature, °C.' },
  source('limitsSource', 'limits_source', 'Source of limits', 'the temperature limits'),
  { field: 'emissivity', header: 'emissivity', label: 'Emissivity', type: 'decimal', required: false, hint: 'Surface emissivity, 0–1 (empty when not an outer surface).' },
  source('emissivitySource', 'emissivity_source', 'Source of emissivity', 'the emissivity'),
];

const layerColumns = (): ColumnSpec[] => {
  const columns: ColumnSpec[] = [];
  for (let n = 1; n <= MAX_BUILD_LAYERS; n++) {
    const where = n === 1 ? 'touching the conductor' : `layer ${n} from the conductor`;
    columns.push(
      { field: `layer${n}CoveringKey`, header: `layer_${n}_covering_key`, label: `Layer ${n}`, type: 'reference', references: 'coverings', required: n === 1, hint: `Covering key of the layer ${where}.`, hiddenByDefault: n > 2 },
      { field: `layer${n}ThicknessMm`, header: `layer_${n}_thickness_mm`, label: `Layer ${n} thickness`, quantity: 'lengthMm', type: 'decimal', required: n === 1, hint: `Thickness of layer ${n}, mm.`, hiddenByDefault: n > 2 },
      { field: `layer${n}Source`, header: `layer_${n}_source`, label: `Layer ${n} source`, type: 'text', required: n === 1, hint: `Where the thickness of layer ${n} comes from.`, hiddenByDefault: true },
    );
  }
  return columns;
};

const BUILD_COLUMNS: ColumnSpec[] = [
  key('Stable short name, e.g. demo-cu-240-xlpe-pvc.'),
  { field: 'name', header: 'name', label: 'Name', type: 'text', required: true, hint: 'What a designer picks, e.g. 240 mm² copper XLPE/PVC single-core.' },
  { field: 'maker', header: 'maker', label: 'Maker', type: 'text', required: true, hint: 'Supplier or "Demo build".' },
  { field: 'conductorKey', header: 'conductor_key', label: 'Conductor', type: 'reference', references: 'conductors', required: true, hint: 'Key of a round conductor in this catalogue.' },
  { field: 'cores', header: 'cores', label: 'Cores', type: 'integer', required: true, hint: 'Number of cores, 1–5.' },
  { field: 'note', header: 'note', label: 'Note', type: 'text', required: false, hint: 'Anything a designer should know.' },
  ...layerColumns(),
];

export const CATALOGUE_COLUMNS: Readonly<Record<CatalogueKind, readonly ColumnSpec[]>> = {
  materials: MATERIAL_COLUMNS,
  conductors: CONDUCTOR_COLUMNS,
  coverings: COVERING_COLUMNS,
  builds: BUILD_COLUMNS,
};

/** Our names for the tabs and files. */
export const KIND_LABELS: Readonly<Record<CatalogueKind, { tab: string; singular: string; file: string; blurb: string }>> = {
  materials: {
    tab: 'Metals',
    singular: 'metal',
    file: 'metals',
    blurb: 'Conductor metals: resistivity and its temperature coefficient, thermal properties, short-circuit constants and the metal price your team uses.',
  },
  conductors: {
    tab: 'Cores and bars',
    singular: 'conductor',
    file: 'conductors',
    blurb: 'Round cable cores (metric sections, AWG and kcmil) and rectangular bars, with their DC resistance at 20 °C and dimensions.',
  },
  coverings: {
    tab: 'Insulation and finishes',
    singular: 'covering',
    file: 'coverings',
    blurb: 'Insulation, sheaths, coatings, paints and sleeves: thermal resistivity, temperature limits and surface emissivity.',
  },
  builds: {
    tab: 'Cable builds',
    singular: 'cable build',
    file: 'cable-builds',
    blurb: 'A conductor with its layers from the inside out, picked as one item on a sizing sheet.',
  },
};

export function columnByField(kind: CatalogueKind, field: string): ColumnSpec | undefined {
  return CATALOGUE_COLUMNS[kind].find((c) => c.field === field);
}

export function columnByHeader(kind: CatalogueKind, header: string): ColumnSpec | undefined {
  const wanted = header.trim().toLowerCase();
  return CATALOGUE_COLUMNS[kind].find((c) => c.header === wanted);
}

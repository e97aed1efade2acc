/**
 * Tabulated constants of IEC 60287-1-1 and IEC 60287-2-1 used by this folder.
 *
 * Every value here was RECALLED, not read from the standard at hand ("from memory"); each table
 * names the table it stands for. Clause numbers are those of IEC 60287-2-1 ed. 2 (2015) and
 * IEC 60287-1-1 ed. 2 (2006, with its amendments) as recalled — edition 1 of part 2-1 numbered
 * the same clauses 2.2.x (e.g. free air 2.2.1, groups 2.2.3, ducts 2.2.7). A reviewer should
 * compare each table with the printed standard before these numbers are relied on for release.
 */

// ───────────────────────── Free air: Z, E, g (IEC 60287-2-1 Table 2) ─────────────────────────

/**
 * The arrangements IEC 60287-2-1 §4.2.1 tabulates for cables in free air (Table 2, "values for
 * constants Z, E and g for black surfaces of cables in free air"), from memory. The table's
 * cables are clear of any wall by at least 0.3·D_e (single cable) or 0.5·D_e (groups). "Spaced"
 * means a clearance of D_e between neighbouring surfaces (axis spacing 2·D_e).
 * The two rows for cables fixed ON a vertical wall are deliberately left out: recalled with too
 * little confidence to be used.
 */
export const FREE_AIR_ARRANGEMENTS = [
  'single',
  'two-touching-horizontal',
  'three-touching-horizontal',
  'trefoil-touching',
  'two-touching-vertical',
  'two-spaced-vertical',
  'three-touching-vertical',
  'three-spaced-vertical',
] as const;
export type FreeAirArrangement = (typeof FREE_AIR_ARRANGEMENTS)[number];

export interface FreeAirConstants {
  /** Z, dimensionless as used in h = Z/D_e^g + E (D_e in m). */
  Z: number;
  E: number;
  g: number;
  /** Row of IEC 60287-2-1 Table 2 as recalled, and its wording. */
  row: number;
  description: string;
}

export const FREE_AIR_CONSTANTS: Readonly<Record<FreeAirArrangement, Readonly<FreeAirConstants>>> = Object.freeze({
  single: { Z: 0.21, E: 3.94, g: 0.6, row: 1, description: 'single cable (clear of walls by ≥ 0.3·D_e)' },
  'two-touching-horizontal': { Z: 0.29, E: 2.35, g: 0.5, row: 2, description: 'two cables touching, horizontal' },
  'trefoil-touching': { Z: 0.96, E: 1.25, g: 0.2, row: 3, description: 'three cables in trefoil (touching)' },
  'three-touching-horizontal': { Z: 0.62, E: 1.95, g: 0.25, row: 4, description: 'three cables touching, horizontal' },
  'two-touching-vertical': { Z: 1.42, E: 0.86, g: 0.25, row: 5, description: 'two cables touching, vertical' },
  'two-spaced-vertical': { Z: 0.75, E: 2.8, g: 0.3, row: 6, description: 'two cables spaced D_e, vertical' },
  'three-touching-vertical': { Z: 1.61, E: 0.42, g: 0.2, row: 7, description: 'three cables touching, vertical' },
  'three-spaced-vertical': { Z: 1.31, E: 2.0, g: 0.2, row: 8, description: 'three cables spaced D_e, vertical' },
});

/**
 * Footnote to Table 2 (from memory): cables spaced HORIZONTALLY with a clearance of at least
 * 0.75·D_e between neighbouring surfaces are each rated as a single isolated cable.
 */
export const FREE_AIR_ISOLATED_HORIZONTAL_CLEARANCE_RATIO = 0.75;

/**
 * Absorption coefficient of solar radiation σ for cable surfaces, IEC 60287-2-1 Table 4 (from
 * memory): bitumen/jute 0.8, polychloroprene 0.8, PVC 0.6, PE 0.4, lead 0.6.
 */
export const SOLAR_ABSORPTION_COEFFICIENT = Object.freeze({
  'bitumen-jute': 0.8,
  polychloroprene: 0.8,
  pvc: 0.6,
  pe: 0.4,
  lead: 0.6,
});

// ───────────────────────── Thermal resistivities (IEC 60287-2-1 Table 1) ─────────────────────────

export const INSULATION_MATERIALS = ['xlpe', 'epr', 'pvc', 'pe'] as const;
export type InsulationMaterial = (typeof INSULATION_MATERIALS)[number];

/**
 * Thermal resistivity of insulation, K·m/W, IEC 60287-2-1 Table 1 (from memory; the same values
 * as references.md): XLPE 3.5, EPR 3.5 (≤ 3 kV; also 3.5 above, from memory), PE 3.5,
 * PVC 5.0 up to and including 3 kV and 6.0 above 3 kV.
 */
export function insulationThermalResistivity(material: InsulationMaterial, voltageU0V: number): number {
  switch (material) {
    case 'xlpe':
    case 'epr':
    case 'pe':
      return 3.5;
    case 'pvc':
      // Table 1 splits PVC at 3 kV rated voltage; U₀ ≤ 1.8 kV belongs to the 3 kV class (U ≤ 3 kV).
      return voltageU0V <= 1800 ? 5.0 : 6.0;
  }
}

/** Duct materials with the constants this folder knows. */
export const DUCT_MATERIALS = ['pvc', 'pe', 'earthenware', 'fibre-in-air', 'fibre-in-concrete', 'metallic'] as const;
export type DuctMaterial = (typeof DUCT_MATERIALS)[number];

/**
 * Thermal resistivity of duct walls, K·m/W, IEC 60287-2-1 Table 1 (from memory): PVC 6.0,
 * PE 3.5, earthenware 1.2, fibre 4.8; a metallic conduit's wall resistance is negligible (0).
 * Concrete (as a surround or duct bank) 1.0.
 */
export const DUCT_WALL_RESISTIVITY: Readonly<Record<DuctMaterial, number>> = Object.freeze({
  pvc: 6.0,
  pe: 3.5,
  earthenware: 1.2,
  'fibre-in-air': 4.8,
  'fibre-in-concrete': 4.8,
  metallic: 0,
});

export const CONCRETE_RESISTIVITY_KM_PER_W = 1.0;

/**
 * Constants U, V, Y for the air space between a cable and its duct, IEC 60287-2-1 Table 4
 * (ed. 1 numbering; from memory):
 *   metallic conduit 5.2 / 1.4 / 0.011; fibre duct in air 5.2 / 0.83 / 0.006;
 *   fibre duct in concrete 5.2 / 0.91 / 0.010; earthenware 1.87 / 0.28 / 0.0036;
 *   plastic (PE, PVC) 1.87 / 0.312 / 0.0037.
 * Asbestos-cement and the pipe-type rows are left out (not used by this project).
 */
export const DUCT_AIR_SPACE_CONSTANTS: Readonly<Record<DuctMaterial, Readonly<{ U: number; V: number; Y: number }>>> = Object.freeze({
  metallic: { U: 5.2, V: 1.4, Y: 0.011 },
  'fibre-in-air': { U: 5.2, V: 0.83, Y: 0.006 },
  'fibre-in-concrete': { U: 5.2, V: 0.91, Y: 0.01 },
  earthenware: { U: 1.87, V: 0.28, Y: 0.0036 },
  pvc: { U: 1.87, V: 0.312, Y: 0.0037 },
  pe: { U: 1.87, V: 0.312, Y: 0.0037 },
});

/** The T₄′ expression is stated for cable diameters 25 mm ≤ D_e ≤ 100 mm (from memory). */
export const DUCT_AIR_SPACE_DIAMETER_RANGE_M = Object.freeze({ min: 0.025, max: 0.1 });

/** The duct-bank equivalent radius is stated for side ratios below 3 (from memory). */
export const DUCT_BANK_MAX_SIDE_RATIO = 3;

// ───────────────────────── Screens and sheaths (IEC 60287-1-1 Table 1) ─────────────────────────

export const SCREEN_MATERIALS = ['copper', 'aluminium', 'lead'] as const;
export type ScreenMaterial = (typeof SCREEN_MATERIALS)[number];

/**
 * Electrical resistivity at 20 °C (Ω·m) and temperature coefficient (1/K) of screen and sheath
 * metals, IEC 60287-1-1 Table 1: copper 1.7241e-8 / 3.93e-3 and aluminium 2.84e-8 / 4.03e-3
 * (the aluminium SHEATH value, slightly above the conductor's 2.8264e-8), lead 21.4e-8 / 4.0e-3
 * (from memory).
 */
export const SCREEN_MATERIAL_CONSTANTS: Readonly<Record<ScreenMaterial, Readonly<{ rho20OhmM: number; alpha20PerK: number }>>> =
  Object.freeze({
    copper: { rho20OhmM: 1.7241e-8, alpha20PerK: 3.93e-3 },
    aluminium: { rho20OhmM: 2.84e-8, alpha20PerK: 4.03e-3 },
    lead: { rho20OhmM: 21.4e-8, alpha20PerK: 4.0e-3 },
  });

// ───────────────────────── Dielectric losses (IEC 60287-1-1 Table 3) ─────────────────────────

export interface DielectricRow {
  /** Relative permittivity ε. */
  permittivity: number;
  tanDelta: number;
  /** U₀ (V, line to earth) at and above which W_d must be calculated. */
  thresholdU0V: number;
  description: string;
}

/**
 * Values of ε and tan δ and the U₀ at which dielectric losses start to count, IEC 60287-1-1
 * Table 3 (from memory):
 *   XLPE unfilled, up to and including 18/30 (36) kV: ε 2.5, tan δ 0.004, 127 kV;
 *   XLPE unfilled above 18/30 kV: 2.5, 0.001, 127 kV;
 *   PE (HD and LD): 2.3, 0.001, 127 kV;
 *   EPR up to and including 18/30 kV: 3.0, 0.020, 63.5 kV; above 18/30 kV: 3.0, 0.005, 63.5 kV;
 *   PVC: 8.0, 0.1, 6 kV.
 */
export function dielectricRow(material: InsulationMaterial, voltageU0V: number): DielectricRow {
  const upTo18of30 = voltageU0V <= 18000;
  switch (material) {
    case 'xlpe':
      return upTo18of30
        ? { permittivity: 2.5, tanDelta: 0.004, thresholdU0V: 127000, description: 'XLPE (unfilled), up to and including 18/30 kV' }
        : { permittivity: 2.5, tanDelta: 0.001, thresholdU0V: 127000, description: 'XLPE (unfilled), above 18/30 kV' };
    case 'pe':
      return { permittivity: 2.3, tanDelta: 0.001, thresholdU0V: 127000, description: 'PE (HD and LD)' };
    case 'epr':
      return upTo18of30
        ? { permittivity: 3.0, tanDelta: 0.02, thresholdU0V: 63500, description: 'EPR, up to and including 18/30 kV' }
        : { permittivity: 3.0, tanDelta: 0.005, thresholdU0V: 63500, description: 'EPR, above 18/30 kV' };
    case 'pvc':
      return { permittivity: 8.0, tanDelta: 0.1, thresholdU0V: 6000, description: 'PVC' };
  }
}

/**
 * Assumption flags raised by the bus-bar system computations. Codes are STABLE (a sheet stores
 * them and a reviewer acknowledges them): add new ones, never rename or reuse. Severities use the
 * sizing layer's words (lib/electrical/sizing/flags.ts): note, review, blocker.
 */
export type BusbarFlagSeverity = 'note' | 'review' | 'blocker';

export interface BusbarFlag {
  code: BusbarFlagCode;
  severity: BusbarFlagSeverity;
  message: string;
}

export const BUSBAR_FLAG_CODES = [
  // Heat transfer of a pack
  'BUSBAR_CHANNEL_OUT_OF_RANGE',
  'BUSBAR_CHANNEL_LIMITED_TO_PLATE',
  'BUSBAR_FLAT_GAP_NO_CONVECTION',
  'BUSBAR_FLAT_SLOT_RADIATION_TO_ROOM',
  'BUSBAR_EDGE_CONVECTION',
  'BUSBAR_PLATE_OUT_OF_RANGE',
  'BUSBAR_BARS_ISOTHERMAL',
  'BUSBAR_PACK_ISOTHERMAL',
  'BUSBAR_NO_STEADY_STATE',
  // Short-circuit forces (IEC 60865-1)
  'BUSBAR_KAPPA_DEFAULTED',
  'BUSBAR_DYNAMIC_FACTORS_DEFAULTED',
  'BUSBAR_YIELD_STRENGTH_DEFAULTED',
  'BUSBAR_SECTION_MODULUS_NO_STIFFENING',
  'BUSBAR_SECTION_MODULUS_ENTERED',
  'BUSBAR_MAIN_DISTANCE_FROM_ENVELOPE',
  'BUSBAR_STRESS_EXCEEDED',
  'BUSBAR_SUB_CONDUCTOR_STRESS_EXCEEDED',
  'BUSBAR_SUPPORT_FORCE_EXCEEDED',
  'BUSBAR_SUPPORT_STRENGTH_NOT_GIVEN',
] as const;

export type BusbarFlagCode = (typeof BUSBAR_FLAG_CODES)[number];

/** Severity, title and basis of each code, as the sizing layer's registry holds them (lib/electrical/sizing/flags.ts). */
export const BUSBAR_FLAG_DEFINITIONS: Readonly<Record<BusbarFlagCode, Readonly<{ severity: BusbarFlagSeverity; title: string; basis: string }>>> = Object.freeze({
  BUSBAR_CHANNEL_OUT_OF_RANGE: { severity: 'review', title: 'Gap between bars outside the channel correlation', basis: 'Bar-Cohen & Rohsenow (1984) vertical parallel-plate channels, stated range' },
  BUSBAR_CHANNEL_LIMITED_TO_PLATE: { severity: 'note', title: 'Gap convection capped at the open-plate value', basis: 'Bar-Cohen & Rohsenow (1984) channels against Churchill & Chu (1975) plates (a channel never cools better than a free plate)' },
  BUSBAR_FLAT_GAP_NO_CONVECTION: { severity: 'review', title: 'No convection credited inside flat bars\u2019 gaps', basis: 'Bar-Cohen & Rohsenow (1984) covers vertical channels only (horizontal gaps: cautious)' },
  BUSBAR_FLAT_SLOT_RADIATION_TO_ROOM: { severity: 'note', title: 'Radiation leaving a flat pack\u2019s gaps counted as reaching the room', basis: 'view factors of the gap openings (slightly optimistic)' },
  BUSBAR_EDGE_CONVECTION: { severity: 'note', title: 'Narrow edges of the bars', basis: 'Churchill & Chu (1975) plate correlation (edges convect as the plate)' },
  BUSBAR_PLATE_OUT_OF_RANGE: { severity: 'review', title: 'Plate correlation outside its stated range', basis: 'Churchill & Chu (1975), stated range' },
  BUSBAR_BARS_ISOTHERMAL: { severity: 'note', title: 'Each bar at one temperature', basis: 'conduction across a copper or aluminium bar keeps it within a fraction of a kelvin' },
  BUSBAR_PACK_ISOTHERMAL: { severity: 'review', title: 'A pack\u2019s bars taken at one temperature', basis: 'the optimistic bound: perfectly conducting spacers' },
  BUSBAR_NO_STEADY_STATE: { severity: 'blocker', title: 'No steady state for the bus-bar pack', basis: 'thermal runaway: no steady heat balance exists (Patankar (1980), Numerical Heat Transfer and Fluid Flow)' },
  BUSBAR_KAPPA_DEFAULTED: { severity: 'review', title: 'Peak factor κ assumed', basis: 'IEC 60909-0 κ from R/X (κ = 2.0 without it, cautious)' },
  BUSBAR_DYNAMIC_FACTORS_DEFAULTED: { severity: 'review', title: 'Dynamic factors of IEC 60865-1 assumed', basis: 'IEC 60865-1 V_σ·V_r, V_F·V_r without reclosing (from memory)' },
  BUSBAR_YIELD_STRENGTH_DEFAULTED: { severity: 'review', title: 'Yield strength of the bar material assumed', basis: 'R_p0.2 default per material (from memory)' },
  BUSBAR_SECTION_MODULUS_NO_STIFFENING: { severity: 'note', title: 'No stiffening elements credited', basis: 'IEC 60865-1: main-conductor section modulus of the bars alone (cautious)' },
  BUSBAR_SECTION_MODULUS_ENTERED: { severity: 'review', title: 'Section modulus entered', basis: 'IEC 60865-1 (stiffened packs)' },
  BUSBAR_MAIN_DISTANCE_FROM_ENVELOPE: { severity: 'note', title: 'Effective distance of the main conductors from the pack outline', basis: 'IEC 60865-1 a_m with Dwight\u2019s factor of the enclosing rectangle' },
  BUSBAR_STRESS_EXCEEDED: { severity: 'blocker', title: 'Bending stress of the bars above the allowed', basis: 'IEC 60865-1: σ_tot ≤ q·R_p0.2' },
  BUSBAR_SUB_CONDUCTOR_STRESS_EXCEEDED: { severity: 'blocker', title: 'Stress between the bars of a pack above the allowed', basis: 'IEC 60865-1: σ_s ≤ R_p0.2' },
  BUSBAR_SUPPORT_FORCE_EXCEEDED: { severity: 'blocker', title: 'Force on the supports above their rating', basis: 'IEC 60865-1: F_d against the rated strength' },
  BUSBAR_SUPPORT_STRENGTH_NOT_GIVEN: { severity: 'review', title: 'Support strength not given', basis: 'IEC 60865-1 (support forces reported, not checked)' },
});

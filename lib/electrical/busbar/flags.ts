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

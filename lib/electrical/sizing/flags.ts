/**
 * Assumption flags: statements a result depends on that a licensed reviewer must accept.
 *
 * Codes are STABLE (stored with sheets and acknowledged by reviewers): add new ones, never
 * rename or reuse. Each code has one fixed severity:
 *   note    — shown, no acknowledgement needed;
 *   review  — a reviewer must acknowledge it before the sheet can be approved;
 *   blocker — the candidate fails; a sheet built on it cannot be approved.
 * Every uncertainty listed in physics.md §5 maps to at least one code here.
 */
import { BUSBAR_FLAG_CODES, BUSBAR_FLAG_DEFINITIONS } from '../busbar/flags';

export type FlagSeverity = 'note' | 'review' | 'blocker';

/** Codes the steady evaluation (evaluateCandidate) raises. */
const STEADY_FLAG_CODES = [
  'AMBIENT_ASSUMED',
  'GROUPING_DERATING_ENTERED',
  'ENCLOSURE_DERATING_ENTERED',
  'MUTUAL_HEATING_NOT_MODELLED',
  'CORRELATION_OUT_OF_RANGE',
  'SURFACE_COEFFICIENT_ENTERED',
  'WIND_COOLING_CREDITED',
  'EMISSIVITY_ASSUMED',
  'SOLAR_ABSORPTIVITY_ASSUMED',
  'AC_FACTOR_LOWER_BOUND',
  'AC_FACTOR_USER_ENTERED',
  'AC_FORMULA_OUT_OF_RANGE',
  'PROXIMITY_SPACING_ASSUMED',
  'NEAR_RUNAWAY',
  'RUNAWAY',
  'OVER_LIMIT',
  'MARGIN_UNDER_10',
  'USER_LIMIT_ABOVE_RATING',
  'USER_LIMIT_NOT_JUSTIFIED',
  'SHORT_CIRCUIT_NOT_CHECKED',
  'SHORT_CIRCUIT_EXCEEDED',
  'SHORT_CIRCUIT_LONG_DURATION',
  'MULTICORE_APPROXIMATION',
  'MULTICORE_ROUND_CORES',
  'DATA_FROM_MEMORY',
  'MULTI_BAR_INNER_FACES',
  'PARALLEL_SHARING_ASSUMED',
  'BAR_EDGES_LUMPED',
  'BURIED_SOIL_ASSUMED',
  'SOIL_DRYING_RISK',
  'VOLTAGE_DROP_EXCEEDED',
  'REACTANCE_ASSUMED',
  'BAR_REACTANCE_ASSUMED',
  'CROSS_CHECK_DIFFERENCE',
  'SHEATH_LOSSES_NOT_INCLUDED',
  'CABLE_GROUP_RATED',
  'OTHER_CIRCUITS_NOT_COVERED',
  'GROUP_ROW_CONSERVATIVE',
  'WIND_NOT_CREDITED_TO_GROUP',
  'OTHER_CIRCUIT_HEAT_ENTERED',
  'SCREEN_LOSSES_INCLUDED',
  'DIELECTRIC_LOSSES_INCLUDED',
  'BAR_AC_FACTOR_COMPUTED',
  'PHASE_SPACING_ASSUMED',
  'PACK_RATED_AS_SYSTEM',
  'BAR_SHORT_CIRCUIT_LIMIT_DEFAULTED',
  'FORCES_NOT_CHECKED',
  'FILAMENT_MESH_COARSENED',
  'PROTECTION_OVERLOAD_NOT_COORDINATED',
  'PROTECTION_DISCONNECTION_TOO_SLOW',
  'PROTECTION_ASSUMPTIONS',
  'PROTECTIVE_CONDUCTOR_TOO_SMALL',
  'DISCONNECTION_NOT_CHECKED',
  'HARMONICS_NOT_COVERED',
  'HARMONICS_NEUTRAL_GOVERNS',
  'HARMONICS_NEUTRAL_HEAT',
  'HARMONICS_OVER_RATING',
  ...BUSBAR_FLAG_CODES,
] as const;

/** Codes raised only by the optional checks beyond the steady state (sizing/beyondSteady.ts, sizing/enclosureAir.ts) and the sheet's cross-section field (lib/sheet/crossSectionField.ts), never by evaluateCandidate. */
export const BEYOND_STEADY_FLAG_CODES = [
  'OVERLOAD_LIMIT_REACHED',
  'DAILY_PEAK_OVER_LIMIT',
  'DAILY_CYCLE_NOT_PERIODIC',
  'HEAT_CAPACITY_ASSUMED',
  'FAULT_HEAT_INTO_COVERINGS',
  'RUN_HOT_SPOT_OVER_LIMIT',
  'JOINT_RESISTANCE_ASSUMED',
  'ENCLOSURE_AIR_ESTIMATED',
  'ENCLOSURE_AIR_ABOVE_AMBIENT',
  'ENCLOSURE_HOT_SPOT_OVER_LIMIT',
  'ENCLOSURE_AIR_RATED',
  'CROSS_SECTION_FIELD_HOTTER',
] as const;

export const FLAG_CODES = [...STEADY_FLAG_CODES, ...BEYOND_STEADY_FLAG_CODES] as const;

/**
 * Codes no evaluation raises any more — the method they qualified was replaced (bars' AC factor
 * and packs are computed since solver 0.2.0) — kept so that stored sheets read and show them.
 */
export const RETIRED_FLAG_CODES = ['AC_FACTOR_LOWER_BOUND', 'MULTI_BAR_INNER_FACES', 'MULTICORE_APPROXIMATION'] as const;

export type FlagCode = (typeof FLAG_CODES)[number];
export type BeyondSteadyFlagCode = (typeof BEYOND_STEADY_FLAG_CODES)[number];

export interface FlagDefinition {
  severity: FlagSeverity;
  /** Short plain title for lists. */
  title: string;
  /** Where the concern comes from (the published document, or "from memory"); shown to people, so never a file of this repository. */
  basis: string;
}

// The bus-bar system's codes (lib/electrical/busbar/flags.ts) keep their severities there.
const BUSBAR_FLAG_REGISTRY = BUSBAR_FLAG_DEFINITIONS;

export const FLAG_REGISTRY: Readonly<Record<FlagCode, Readonly<FlagDefinition>>> = Object.freeze({
  AMBIENT_ASSUMED: { severity: 'review', title: 'Ambient temperature assumed', basis: 'IEC 60364-5-52 reference ambients 30 °C air, 20 °C ground (from memory)' },
  GROUPING_DERATING_ENTERED: { severity: 'review', title: 'Grouping derating factor entered', basis: 'IEC 60364-5-52 Annex B grouping factors, entered by the user (from memory)' },
  ENCLOSURE_DERATING_ENTERED: { severity: 'review', title: 'Enclosure derating factor entered', basis: 'a user-entered factor: no published method is applied to enclosures here' },
  MUTUAL_HEATING_NOT_MODELLED: { severity: 'review', title: 'Heating by nearby cables outside the methods here', basis: 'IEC 60287-2-1 §4.2.1 covers one group in air; other arrangements need a grouping factor' },
  CORRELATION_OUT_OF_RANGE: { severity: 'review', title: 'Convection correlation used outside its stated range', basis: 'Churchill & Chu (1975), Churchill & Bernstein (1977): the correlation\'s stated range' },
  SURFACE_COEFFICIENT_ENTERED: { severity: 'review', title: 'Surface heat-transfer coefficient entered by the user', basis: 'a surface coefficient entered by the user replaces the Churchill & Chu (1975) correlations' },
  WIND_COOLING_CREDITED: { severity: 'review', title: 'Cooling by wind or fan credited', basis: 'forced convection: Churchill & Bernstein (1977); flat-plate correlations (Incropera et al., ch. 7)' },
  EMISSIVITY_ASSUMED: { severity: 'note', title: 'Surface emissivity assumed', basis: 'radiation exchange with the surroundings (Incropera et al., Fundamentals of Heat and Mass Transfer, ch. 12)' },
  SOLAR_ABSORPTIVITY_ASSUMED: { severity: 'note', title: 'Solar absorptivity assumed', basis: 'absorbed solar radiation (Incropera et al., Fundamentals of Heat and Mass Transfer, ch. 12)' },
  AC_FACTOR_LOWER_BOUND: { severity: 'review', title: 'AC resistance factor is a lower bound', basis: 'approximation ignoring edge crowding of the current in bars (a lower bound)' },
  AC_FACTOR_USER_ENTERED: { severity: 'note', title: 'AC/DC resistance ratio entered from the bar maker', basis: 'the bar maker\'s data (AC/DC resistance ratio)' },
  AC_FORMULA_OUT_OF_RANGE: { severity: 'review', title: 'Skin or proximity formula outside its main range', basis: 'IEC 60287-1-1 §2.1 (x ≤ 2.8)' },
  PROXIMITY_SPACING_ASSUMED: { severity: 'note', title: 'Cable spacing assumed for the proximity effect', basis: 'IEC 60287-1-1 §2.1.4' },
  NEAR_RUNAWAY: { severity: 'review', title: 'Close to thermal runaway', basis: 'thermal runaway of a conductor whose resistance rises with temperature (Patankar (1980), Numerical Heat Transfer and Fluid Flow); rated limit of IEC 60287-1-1' },
  RUNAWAY: { severity: 'blocker', title: 'No steady state: thermal runaway', basis: 'thermal runaway: no steady heat balance exists (Patankar (1980), Numerical Heat Transfer and Fluid Flow)' },
  OVER_LIMIT: { severity: 'blocker', title: 'Hot spot above the temperature limit', basis: 'IEC 60287-1-1 rated conductor temperature, or the limit entered' },
  MARGIN_UNDER_10: { severity: 'review', title: 'Margin under 10 %', basis: 'common practice: a margin under 10 % needs a reviewer\'s look' },
  USER_LIMIT_ABOVE_RATING: { severity: 'review', title: 'User limit above the material rating', basis: 'IEC 60287-1-1 rated conductor temperatures (from memory)' },
  USER_LIMIT_NOT_JUSTIFIED: { severity: 'blocker', title: 'Raised limit without a written justification', basis: 'IEC 60287-1-1 rated conductor temperatures (a rating above the material’s needs the maker’s evidence)' },
  SHORT_CIRCUIT_NOT_CHECKED: { severity: 'review', title: 'Short circuit not checked', basis: 'IEC 60949 adiabatic method (needs the fault current and duration)' },
  SHORT_CIRCUIT_EXCEEDED: { severity: 'blocker', title: 'Short-circuit temperature above the limit', basis: 'IEC 60949 adiabatic method' },
  SHORT_CIRCUIT_LONG_DURATION: { severity: 'note', title: 'Fault longer than the adiabatic range', basis: 'IEC 60949 / IEC 60364-4-43 (adiabatic up to 5 s, from memory)' },
  MULTICORE_APPROXIMATION: { severity: 'review', title: 'Multi-core cable approximated', basis: 'IEC 60287-2-1 §4.1.2 (multi-core T₁), approximated' },
  MULTICORE_ROUND_CORES: {
    severity: 'review',
    title: 'Multi-core heat path computed for round cores laid up touching',
    basis: 'IEC 60287-2-1 §4.1.2 (T₁ of multi-core cables: isothermal conductors and sheath), solved in two dimensions',
  },
  DATA_FROM_MEMORY: { severity: 'review', title: 'Data entered from memory', basis: 'values recalled rather than read from the published document (from memory)' },
  MULTI_BAR_INNER_FACES: { severity: 'review', title: 'Inner faces of a multi-bar pack', basis: 'inner faces of a pack lose less heat (Incropera et al., ch. 9)' },
  PARALLEL_SHARING_ASSUMED: { severity: 'review', title: 'Equal current sharing between parallel conductors assumed', basis: 'common practice' },
  BAR_EDGES_LUMPED: { severity: 'note', title: 'Bar edges lumped onto the faces', basis: 'edge loss lumped onto the wide faces by area (Incropera et al., ch. 9)' },
  BURIED_SOIL_ASSUMED: { severity: 'review', title: 'Soil thermal resistivity or ground temperature assumed', basis: 'IEC 60287-2-1 §2.2 (external thermal resistance T₄)' },
  SOIL_DRYING_RISK: { severity: 'review', title: 'Soil around the cable may dry out', basis: 'IEC 60287-1-1 (partial drying of the soil, from memory)' },
  VOLTAGE_DROP_EXCEEDED: { severity: 'blocker', title: 'Voltage drop above the allowed value', basis: 'IEC 60364-5-52 Annex G' },
  REACTANCE_ASSUMED: { severity: 'note', title: 'Default reactance used for the voltage drop', basis: 'IEC 60364-5-52 Annex G (λ = 0.08 mΩ/m)' },
  BAR_REACTANCE_ASSUMED: { severity: 'review', title: 'Cable reactance default used for a bus bar', basis: 'IEC 60364-5-52 Annex G (λ is for cables)' },
  CROSS_CHECK_DIFFERENCE: { severity: 'review', title: 'Solver and closed-form ampacity differ', basis: 'IEC 60287-1-1 eq. (1) closed-form cross-check' },
  SHEATH_LOSSES_NOT_INCLUDED: { severity: 'review', title: 'Losses in metallic screens or armour not included', basis: 'IEC 60287-1-1 §2.3 (λ₁, λ₂ taken as zero)' },
  CABLE_GROUP_RATED: { severity: 'note', title: 'Cables rated as the group they lie in', basis: 'IEC 60287-2-1 §4.2.1 (free air, Table 2) and §4.2.2–4.2.7 (buried: images, closed forms, ducts, backfill); constants from memory' },
  OTHER_CIRCUITS_NOT_COVERED: { severity: 'blocker', title: 'Nearby circuits in air not rated', basis: 'IEC 60287-2-1 Table 2 covers one group; IEC 60364-5-52 Annex B grouping factors (from memory)' },
  GROUP_ROW_CONSERVATIVE: { severity: 'review', title: 'Cable spacing not tabulated: rated as touching', basis: 'IEC 60287-2-1 Table 2 (touching and the tabulated clearances only)' },
  WIND_NOT_CREDITED_TO_GROUP: { severity: 'note', title: 'Wind not credited to a group of cables', basis: 'IEC 60287-2-1 §4.2.1 free-air law is for still air' },
  BAR_AC_FACTOR_COMPUTED: { severity: 'note', title: 'Bar AC resistance computed from the current distribution', basis: 'filament (partial-inductance) method; Hoer & Love (1965) / Grover (1946) mutual inductances' },
  PHASE_SPACING_ASSUMED: { severity: 'review', title: 'Phase spacing of the bars assumed', basis: 'filament (partial-inductance) method and IEC 60865-1 (current sharing and forces depend on it)' },
  PACK_RATED_AS_SYSTEM: { severity: 'note', title: 'Bars rated as a pack', basis: 'current sharing by the filament (partial-inductance) method; channels by Bar-Cohen & Rohsenow (1984); radiation by view factors (Incropera et al., Fundamentals of Heat and Mass Transfer, ch. 13)' },
  BAR_SHORT_CIRCUIT_LIMIT_DEFAULTED: { severity: 'review', title: 'Short-circuit temperature of the bar assumed', basis: 'common practice for bare bars (from memory)' },
  PROTECTION_OVERLOAD_NOT_COORDINATED: { severity: 'blocker', title: 'Overload protection does not coordinate', basis: 'IEC 60364-4-43 §433.1' },
  PROTECTION_DISCONNECTION_TOO_SLOW: { severity: 'blocker', title: 'Earth fault not disconnected in time', basis: 'IEC 60364-4-41 §411 (Table 41.1)' },
  PROTECTION_ASSUMPTIONS: { severity: 'review', title: 'Assumptions of the disconnection check', basis: 'IEC 60364-4-41 §411; IEC 60909-0 c_min' },
  PROTECTIVE_CONDUCTOR_TOO_SMALL: { severity: 'blocker', title: 'Protective conductor too small', basis: 'IEC 60364-5-54 §543.1' },
  HARMONICS_NOT_COVERED: { severity: 'review', title: 'Third harmonics outside the method', basis: 'IEC 60364-5-52 Annex E (four- and five-core cables)' },
  HARMONICS_NEUTRAL_GOVERNS: { severity: 'note', title: 'The neutral governs under third harmonics', basis: 'IEC 60364-5-52 Annex E' },
  HARMONICS_NEUTRAL_HEAT: { severity: 'note', title: "The neutral's heat under third harmonics is in the rating", basis: 'IEC 60364-5-52 Annex E currents; IEC 60287-1-1 losses' },
  HARMONICS_OVER_RATING: { severity: 'blocker', title: 'Rating exceeded with third harmonics', basis: 'IEC 60364-5-52 Annex E reduction factors (from memory)' },
  DISCONNECTION_NOT_CHECKED: { severity: 'review', title: 'Automatic disconnection not checked', basis: 'IEC 60364-4-41 §411 (needs the source impedance and the protective conductor)' },
  FILAMENT_MESH_COARSENED: { severity: 'review', title: 'Filament mesh of the bars coarsened', basis: 'filament method: the mesh limited to keep the solve within seconds' },
  FORCES_NOT_CHECKED: { severity: 'review', title: 'Short-circuit forces not checked', basis: 'IEC 60865-1 (needs the support span and arrangement)' },
  ...BUSBAR_FLAG_REGISTRY,
  SCREEN_LOSSES_INCLUDED: { severity: 'note', title: 'Screen losses included', basis: 'IEC 60287-1-1 §2.3 (λ₁ by bonding and formation, from memory)' },
  DIELECTRIC_LOSSES_INCLUDED: { severity: 'note', title: 'Dielectric losses included', basis: 'IEC 60287-1-1 §2.2 and Table 3 (from memory)' },
  OTHER_CIRCUIT_HEAT_ENTERED: { severity: 'review', title: 'Heat of another circuit entered by the user', basis: 'IEC 60287-2-1 §4.2.3 (superposition of the entered heat)' },

  OVERLOAD_LIMIT_REACHED: { severity: 'blocker', title: 'Overload reaches the limit too soon', basis: 'implicit-Euler heat balance from the steady state at the design current (Patankar (1980), Numerical Heat Transfer and Fluid Flow)' },
  DAILY_PEAK_OVER_LIMIT: { severity: 'blocker', title: 'Daily load cycle peaks above the limit', basis: 'implicit-Euler heat balance, daily profile repeated to a periodic state (Patankar (1980), Numerical Heat Transfer and Fluid Flow)' },
  DAILY_CYCLE_NOT_PERIODIC: { severity: 'review', title: 'Daily cycle had not settled', basis: 'implicit-Euler heat balance: successive daily peaks within 0.01 K (Patankar (1980), Numerical Heat Transfer and Fluid Flow)' },
  HEAT_CAPACITY_ASSUMED: { severity: 'review', title: 'Heat capacities assumed for the run over time', basis: 'IEC 60949 σ of the metal; polymer coverings from memory; soil stores no heat' },
  FAULT_HEAT_INTO_COVERINGS: { severity: 'note', title: 'Fault with heat flowing out of the conductor, beside the adiabatic figure', basis: 'implicit-Euler heat balance (Patankar (1980), Numerical Heat Transfer and Fluid Flow); IEC 60949 adiabatic method governs the verdict' },
  RUN_HOT_SPOT_OVER_LIMIT: { severity: 'blocker', title: 'Hot spot along the run above the limit', basis: 'conduction along the bar with sideways loss, joints as point heat I²R (Patankar (1980), Numerical Heat Transfer and Fluid Flow)' },
  JOINT_RESISTANCE_ASSUMED: { severity: 'review', title: 'Joint resistance assumed', basis: 'Common practice: a pessimistic figure for an unmeasured bolted joint' },
  ENCLOSURE_AIR_ESTIMATED: { severity: 'review', title: 'Enclosure air temperature estimated', basis: 'wall heat transfer with IEC TR 60890 surface factors (common practice, from memory); verify by IEC 61439-1' },
  ENCLOSURE_AIR_ABOVE_AMBIENT: { severity: 'review', title: 'Air inside the enclosure warmer than the sheet ambient', basis: 'enclosure air from the losses inside it, IEC TR 60890 surface factors (common practice, from memory)' },
  ENCLOSURE_HOT_SPOT_OVER_LIMIT: { severity: 'blocker', title: 'Hot spot above the limit in the enclosure air', basis: 'enclosure air and conductor solved together; wall heat transfer with IEC TR 60890 surface factors (common practice, from memory)' },
  ENCLOSURE_AIR_RATED: { severity: 'note', title: 'Rated in the air inside the enclosure', basis: 'enclosure air and conductor solved together; wall heat transfer with IEC TR 60890 surface factors (common practice, from memory)' },
  CROSS_SECTION_FIELD_HOTTER: { severity: 'review', title: 'The two-dimensional field runs hotter than the IEC rating', basis: 'finite-volume cross-section (Patankar (1980), Numerical Heat Transfer and Fluid Flow) beside the IEC 60287-2-1 §4.2.3 superposition' },
});

export interface AssumptionFlag {
  code: FlagCode;
  severity: FlagSeverity;
  title: string;
  /** A plain sentence a reviewer can accept or reject. */
  message: string;
  /** Numbers behind the sentence, for the UI and the record. */
  data?: Record<string, number | string | boolean>;
}

export function makeFlag(code: FlagCode, message: string, data?: AssumptionFlag['data']): AssumptionFlag {
  const def = FLAG_REGISTRY[code];
  return data === undefined
    ? { code, severity: def.severity, title: def.title, message }
    : { code, severity: def.severity, title: def.title, message, data };
}

/** Collects flags once per code (the first sentence wins) in a stable order. */
export class FlagSet {
  private readonly byCode = new Map<FlagCode, AssumptionFlag>();

  add(code: FlagCode, message: string, data?: AssumptionFlag['data']): void {
    if (!this.byCode.has(code)) this.byCode.set(code, makeFlag(code, message, data));
  }

  has(code: FlagCode): boolean {
    return this.byCode.has(code);
  }

  list(): AssumptionFlag[] {
    const order: Record<FlagSeverity, number> = { blocker: 0, review: 1, note: 2 };
    return [...this.byCode.values()].sort(
      (a, b) => order[a.severity] - order[b.severity] || FLAG_CODES.indexOf(a.code) - FLAG_CODES.indexOf(b.code),
    );
  }
}

/** Formats a number for a flag sentence without pretending to more digits than it has. */
export function fmt(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return String(value);
  return Number(value.toPrecision(digits)).toString();
}

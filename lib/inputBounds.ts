/**
 * The allowed range of every number a person or a program gives the sizing — one table, read by
 * every edge that checks input (the sheet's zod schema and its form, the calculation API's schemas
 * and OpenAPI document, the schedule's row schema, the catalogue's schema where a field feeds the
 * library) and by the library's own checks (`checkBound`, which throws ElectricalInputError naming
 * the field). A value outside is refused at the edge with its field named, never computed.
 *
 * SI units, as the library takes them (°C for temperatures, mm² for sections; the sheet's joint
 * resistance in µΩ as stored). An edge that shows other units converts the bound, not the table.
 *
 * A range here is a range of validity, not a design rule: the flags still say when a value inside
 * it rests on an assumption (physics.md §5). Where a bound comes from the trade rather than from a
 * method, `basis` says "common practice"; a recalled figure says "from memory".
 */
import type { z } from 'zod';
import { ElectricalInputError } from './electrical/errors';

export interface InputBound {
  /** The quantity's plain name, as messages and forms say it. */
  label: string;
  /** SI unit as printed after a number ('' for a pure number). */
  unit: string;
  min: number;
  minExclusive?: boolean;
  max: number;
  maxExclusive?: boolean;
  /** Whole numbers only. */
  integer?: boolean;
  /** Why the range is what it is. */
  basis: string;
}

/**
 * The one cap on a circuit's current, A per phase r.m.s.: the design current, an overload and every
 * value of a daily load. 100 kA, not the 20 kA the sheet and the schedule had: the calculation API
 * already accepted 100 kA (a narrower cap would break its v1 contract), and the sheet's overload and
 * daily-load currents were already capped at 100 kA — a design current must fit under the same
 * cap as an overload of it. 100 kA is above any conductor system of LV and MV distribution (the
 * largest LV switchboards carry about 6.3 kA, common practice) with room for parallel packs; the
 * heat balance itself holds at any current, and runaway is detected, not assumed away.
 */
export const MAX_CIRCUIT_CURRENT_A = 100_000;

/** Common temperature limit of a covering, a terminal or the user: −50 °C … 1000 °C (as the library checked before). */
const TEMPERATURE_LIMIT = { unit: '°C', min: -50, max: 1000, basis: 'No insulation, coating or terminal is rated outside −50…1000 °C (common practice).' } as const;
const AIR_TEMPERATURE_BASIS =
  'Keeps the film temperature of a conductor at its limit inside the air-property table of lib/thermal/air.ts (200–1000 K, Incropera Table A.4, from memory).';

export const INPUT_BOUNDS = {
  // ───────────── circuit ─────────────
  designCurrentA: {
    label: 'Design current',
    unit: 'A',
    min: 0,
    minExclusive: true,
    max: MAX_CIRCUIT_CURRENT_A,
    basis: 'I_B per phase, r.m.s.; the one current cap MAX_CIRCUIT_CURRENT_A (see there).',
  },
  currentA: {
    label: 'Current',
    unit: 'A',
    min: 0,
    max: MAX_CIRCUIT_CURRENT_A,
    basis: 'Any circuit current the library is asked to solve at, 0 A included (the ampacity alone needs no design current); the one current cap.',
  },
  nominalVoltageV: {
    label: 'Voltage U₀',
    unit: 'V',
    min: 0,
    minExclusive: true,
    max: 36_000,
    basis:
      'U₀ line to neutral up to 36 kV covers low- and medium-voltage distribution (the scope of this product). The heat balance has no dielectric loss, which IEC 60287-1-1 adds for high-voltage cables (from memory), so higher voltages are refused rather than computed without it.',
  },
  frequencyHz: { label: 'Frequency', unit: 'Hz', min: 0, max: 1000, basis: '0 is DC; 50/60 Hz mains and 400 Hz systems lie inside; the AC-resistance methods are flagged outside their main range.' },
  lengthM: { label: 'Route length', unit: 'm', min: 0, max: 100_000, basis: 'Up to 100 km: longer than any LV/MV feeder; the length enters only the voltage drop, losses and mass.' },
  powerFactor: { label: 'Power factor', unit: '', min: 0, max: 1, basis: 'cos φ lies in [0, 1] by definition.' },
  maxVoltageDropPercent: { label: 'Allowed voltage drop', unit: '%', min: 0, minExclusive: true, max: 100, basis: 'A share of U₀.' },
  reactanceOhmPerM: { label: 'Reactance', unit: 'Ω/m', min: 0, max: 1, basis: 'λ of IEC 60364-5-52 Annex G is 0.08 mΩ/m for cables; 1 Ω/m is four orders above any conductor.' },

  // ───────────── fault ─────────────
  faultCurrentA: {
    label: 'Fault current',
    unit: 'A',
    min: 0,
    minExclusive: true,
    max: 500_000,
    basis: 'Prospective fault currents of LV/MV systems stay well under 500 kA (common practice); a larger figure is almost surely a unit slip (A for kA).',
  },
  thirdHarmonicPercent: { label: 'Third-harmonic content', unit: '%', min: 0, max: 100, basis: 'A share of the phase current (IEC 60364-5-52 Annex E).' },
  faultDurationS: { label: 'Clearing time', unit: 's', min: 0, minExclusive: true, max: 60, basis: 'Up to 60 s; the adiabatic method (IEC 60949) is flagged beyond 5 s.' },

  // ───────────── surroundings ─────────────
  ambientC: { label: 'Ambient', unit: '°C', min: -60, max: 200, basis: AIR_TEMPERATURE_BASIS },
  windSpeedMPerS: { label: 'Air speed', unit: 'm/s', min: 0, max: 60, basis: 'Up to a hurricane (about 60 m/s); cooling by wind is flagged.' },
  irradianceWPerM2: { label: 'Sun irradiance', unit: 'W/m²', min: 0, max: 1500, basis: 'Above the solar constant (1361 W/m², from memory) no sunlight reaches a conductor.' },
  solarAbsorptivity: { label: 'Solar absorptivity', unit: '', min: 0, max: 1, basis: 'A share of the incident sunlight.' },

  // ───────────── installation ─────────────
  spacingM: { label: 'Cable spacing', unit: 'm', min: 0, minExclusive: true, max: 100, basis: 'Axis to axis; beyond a few metres the cables no longer see each other.' },
  depthM: { label: 'Depth', unit: 'm', min: 0, minExclusive: true, max: 20, basis: 'Depth of the cable axis; 20 m is below any direct burial or duct bank.' },
  soilResistivityKmPerW: {
    label: 'Soil thermal resistivity',
    unit: 'K·m/W',
    min: 0.1,
    max: 20,
    basis: 'Moist soils lie near 0.5–1, dry sand up to about 3–4 K·m/W (IEC 60287-3-1, from memory); 0.1…20 leaves room for backfills and very dry ground.',
  },
  groundC: { label: 'Ground temperature', unit: '°C', min: -60, max: 200, basis: 'The ambient range; undisturbed ground lies near 5–25 °C (common practice).' },
  enclosureDerating: { label: 'Enclosure derating', unit: '', min: 0, minExclusive: true, max: 1, basis: 'A factor on the ampacity; 0 would allow no current.' },

  // ───────────── the cross-section: other circuits, ducts, backfill (physics.md §8) ─────────────
  // The ranges are those lib/electrical/sizing/prepareConditions.ts and the arrangement schema
  // (lib/electrical/iec60287/arrangementSchema.ts) accept, so that an edge refuses what the
  // library would refuse, with the same field named.
  circuitSpacingM: {
    label: 'Circuit spacing',
    unit: 'm',
    min: 0,
    minExclusive: true,
    max: 50,
    basis: 'Centre to centre between neighbouring circuits of one row; the library takes (0, 50] m (prepareConditions.ts).',
  },
  otherCircuitCurrentA: {
    label: 'Other circuit current',
    unit: 'A',
    min: 0,
    max: 20_000,
    basis: 'Current per phase of a circuit beside the one being sized; the library and the arrangement schema take 0…20 000 A.',
  },
  otherCableDiameterM: {
    label: 'Other circuit cable diameter',
    unit: 'm',
    min: 0,
    minExclusive: true,
    max: 0.3,
    basis: 'Overall diameter D_e of one cable of another circuit; the arrangement schema takes up to 0.3 m.',
  },
  otherCableLossWPerM: {
    label: 'Heat per cable of the other circuit',
    unit: 'W/m',
    min: 0,
    max: 1000,
    basis: 'Joule (and screen) heat of ONE cable of another circuit at its current, from that circuit’s own rating; the library takes 0…1000 W/m.',
  },
  ductInnerDiameterM: { label: 'Duct inner diameter', unit: 'm', min: 0, minExclusive: true, max: 1, basis: 'The arrangement schema takes up to 1 m.' },
  ductOuterDiameterM: { label: 'Duct outer diameter', unit: 'm', min: 0, minExclusive: true, max: 1.2, basis: 'The arrangement schema takes up to 1.2 m.' },
  backfillWidthM: { label: 'Backfill width', unit: 'm', min: 0, minExclusive: true, max: 10, basis: 'A backfill or duct bank; the arrangement schema takes up to 10 m.' },
  backfillHeightM: { label: 'Backfill height', unit: 'm', min: 0, minExclusive: true, max: 10, basis: 'A backfill or duct bank; the arrangement schema takes up to 10 m.' },
  backfillCentreDepthM: { label: 'Backfill centre depth', unit: 'm', min: 0, minExclusive: true, max: 20, basis: 'Depth of the bank’s centre; the depth range.' },
  backfillResistivityKmPerW: {
    label: 'Backfill thermal resistivity',
    unit: 'K·m/W',
    min: 0.1,
    max: 20,
    basis: 'Sand-cement and concrete lie near 0.7–1.2 K·m/W (IEC 60287-3-1, from memory); the soil range.',
  },
  screenSectionMm2: { label: 'Screen section', unit: 'mm²', min: 0, minExclusive: true, max: 5000, basis: 'Metallic cross-section of one cable’s screen or sheath; the library takes up to 5000 mm².' },
  screenR20OhmPerM: { label: 'Screen resistance at 20 °C', unit: 'Ω/m', min: 0, minExclusive: true, max: 1, basis: 'Of one cable’s screen, from the maker; the library takes up to 1 Ω/m.' },

  // ───────────── the bus-bar system (physics.md §10; IEC 60865-1 for the forces) ─────────────
  // The ranges are those lib/electrical/sizing/busbarSystem.ts (prepareBusbarSystemConditions) and
  // lib/electrical/busbar/forces.ts accept, so that an edge refuses what the library would refuse.
  phaseSpacingM: {
    label: 'Phase spacing',
    unit: 'm',
    min: 0,
    minExclusive: true,
    max: 10,
    basis: 'Centre of one phase’s pack to the centre of the next; the library takes (0, 10] m (busbarSystem.ts). Packs that would overlap are refused by the library with the field named.',
  },
  supportSpacingM: { label: 'Support spacing', unit: 'm', min: 0, minExclusive: true, max: 20, basis: 'Span between the supports of the run; the library takes (0, 20] m (busbarSystem.ts).' },
  spacerSpacingM: { label: 'Spacer spacing', unit: 'm', min: 0, minExclusive: true, max: 20, basis: 'Distance between the spacers tying a pack’s bars; the library takes (0, 20] m (busbarSystem.ts).' },
  supportStrengthN: {
    label: 'Rated support strength',
    unit: 'N',
    min: 0,
    minExclusive: true,
    max: 1e7,
    basis: 'Rated bending (cantilever) strength of one support; the library takes (0, 10 MN] (busbarSystem.ts), far above any LV/MV post insulator.',
  },
  rOverX: { label: 'R/X of the fault', unit: '', min: 0, max: 10, basis: 'R/X of the short-circuit impedance for κ = 1.02 + 0.98·e^(−3R/X), IEC 60909-0 eq. (55); the library takes 0…10.' },
  peakFactorKappa: { label: 'Peak factor κ', unit: '', min: 1.02, max: 2, basis: 'κ of IEC 60909-0 lies between 1.02 (R/X large) and 2.0 (R/X → 0), eq. (55).' },
  mainSectionModulusM3: {
    label: 'Section modulus of the pack',
    unit: 'm³',
    min: 0,
    minExclusive: true,
    max: 1,
    basis: 'Of a stiffened pack about its bending axis (IEC 60865-1); the library takes (0, 1] m³ (busbarSystem.ts prepareBusbarSystemConditions).',
  },
  yieldStrengthPa: {
    label: 'Yield strength R_p0.2',
    unit: 'Pa',
    min: 1e6,
    max: 1e9,
    basis: '0.2 % proof strength of the bar material for the IEC 60865-1 stress check; the force check takes 1 MPa…1 GPa (busbar/forces.ts); copper and aluminium bars lie near 50–350 N/mm² (common practice).',
  },

  // ───────────── protection (physics.md §11: IEC 60364-4-41, -4-43, -5-54) ─────────────
  deviceRatedCurrentA: {
    label: 'Device rating',
    unit: 'A',
    min: 0,
    minExclusive: true,
    max: 10_000,
    basis: 'Rated current I_n of a circuit-breaker or fuse (or the setting I_r); the largest LV circuit-breakers are rated 6300 A (common practice). The device schema refuses 0 or less (lib/electrical/protection/device.ts).',
  },
  conventionalOperatingCurrentA: {
    label: 'Conventional operating current I₂',
    unit: 'A',
    min: 0,
    minExclusive: true,
    max: 25_000,
    basis: 'I₂ of IEC 60364-4-43 §433.1, at most about 2.1·I_n for gG fuses (from memory) of the largest device rating.',
  },
  instantaneousCurrentA: {
    label: 'Instantaneous setting I_i',
    unit: 'A',
    min: 0,
    minExclusive: true,
    max: 500_000,
    basis: 'Instantaneous release setting of an IEC 60947-2 breaker; under the fault-current cap.',
  },
  instantaneousMaxTimeS: { label: 'Instantaneous break time', unit: 's', min: 0, minExclusive: true, max: 5, basis: 'The maker’s largest break time of the instantaneous release; 5 s is the longest disconnection time of IEC 60364-4-41 (from memory).' },
  curvePointCurrentA: { label: 'Curve point current', unit: 'A', min: 0, minExclusive: true, max: 500_000, basis: 'A point of the maker’s time–current curve; under the fault-current cap.' },
  curvePointTimeS: { label: 'Curve point time', unit: 's', min: 0, minExclusive: true, max: 100_000, basis: 'Operating time of a curve point; the conventional times of IEC 60269-1 reach 4 h (from memory), a day is the end of any published curve.' },
  sourceResistanceOhm: { label: 'Source resistance', unit: 'Ω', min: 0, max: 10, basis: 'Resistance of the supply up to the circuit’s origin; LV sources lie in milliohms to about an ohm (common practice).' },
  sourceReactanceOhm: { label: 'Source reactance', unit: 'Ω', min: 0, max: 10, basis: 'Reactance of the supply up to the circuit’s origin; as the resistance.' },
  sourceImpedanceOhm: { label: 'Source impedance', unit: 'Ω', min: 0, max: 10, basis: 'Magnitude of the supply impedance, when only |Z| is known (added arithmetically, an upper bound).' },
  earthElectrodesOhm: { label: 'Earth electrodes R_A + R_B', unit: 'Ω', min: 0, minExclusive: true, max: 10_000, basis: 'TT systems: electrode resistances of a few ohms to a few hundred ohms (common practice).' },
  protectiveConductorSectionMm2: { label: 'Protective conductor section', unit: 'mm²', min: 0, minExclusive: true, max: 5000, basis: 'The section range of one conductor (the library refuses 0 or less).' },

  // ───────────── limits ─────────────
  temperatureLimitC: { label: 'Own temperature limit', ...TEMPERATURE_LIMIT },
  groupingFactor: { label: 'Grouping factor', unit: '', min: 0, minExclusive: true, max: 1, basis: 'A derating factor (IEC 60364-5-52 Table B.52.17 style); 0 would allow no current.' },
  surfaceCoefficientWPerM2K: { label: 'Surface coefficient', unit: 'W/(m²·K)', min: 0, minExclusive: true, max: 1e5, basis: 'Combined convection and radiation; forced water cooling stays under 1e5 W/(m²·K) (Incropera Table 1.1, from memory).' },

  // ───────────── life-cycle cost ─────────────
  lossLoadFactor: { label: 'Loss load factor', unit: '', min: 0, max: 1, basis: 'μ of IEC 60287-3-2: a share of the peak losses.' },
  hoursPerYear: { label: 'Hours per year', unit: 'h', min: 0, max: 8784, basis: '8784 h in a leap year.' },
  discountRatePercent: { label: 'Discount rate', unit: '%', min: -100, minExclusive: true, max: 100, basis: 'Above −100 % so that (1 + i) stays positive.' },
  loadGrowthPercent: { label: 'Load growth', unit: '% a year', min: -100, minExclusive: true, max: 100, basis: 'Above −100 % so that the load stays positive.' },
  energyPriceGrowthPercent: { label: 'Energy price growth', unit: '% a year', min: -100, minExclusive: true, max: 100, basis: 'Above −100 % so that the price stays positive.' },
  years: { label: 'Years', unit: 'years', min: 0, max: 200, integer: true, basis: 'Whole years of economic life.' },

  // ───────────── candidate (one conductor) ─────────────
  r20OhmPerM: { label: 'Resistance at 20 °C', unit: 'Ω/m', min: 1e-6, max: 1, basis: 'Of one conductor; 1 Ω/m is above the IEC 60228 value of 0.5 mm² (36 Ω/km, from memory) by far, and 1 µΩ/m is a copper section of 17,000 mm², beyond any one bar or cable.' },
  alpha20PerK: { label: 'Temperature coefficient', unit: '1/K', min: 0, max: 0.01, basis: 'Copper 3.93e-3, aluminium 4.03e-3 /K (IEC 60287-1-1 Table 1).' },
  parallel: { label: 'Parallel runs', unit: '', min: 1, max: 100, integer: true, basis: 'Identical runs per phase sharing the current.' },
  densityKgPerM3: { label: 'Density', unit: 'kg/m³', min: 100, max: 25_000, basis: 'Every metal lies inside (osmium 22 590 kg/m³, from memory).' },
  sectionMm2: { label: 'Section', unit: 'mm²', min: 0, minExclusive: true, max: 5000, basis: 'Of one cable core; the largest cables have about 3000 mm² (common practice).' },
  conductorDiameterM: { label: 'Conductor diameter', unit: 'm', min: 2e-4, max: 0.2, basis: 'Of one round conductor (0.2 mm is finer than 30 AWG).' },
  cores: { label: 'Cores', unit: '', min: 1, max: 5, integer: true, basis: 'Single-core to five-core cables.' },
  layerThicknessM: { label: 'Layer thickness', unit: 'm', min: 1e-5, max: 0.5, basis: 'One covering of a cable (10 µm is thinner than any tape or foil).' },
  thermalResistivityKmPerW: { label: 'Thermal resistivity', unit: 'K·m/W', min: 0, minExclusive: true, max: 1e4, basis: 'Of a covering; insulations lie near 3.5–6 K·m/W (IEC 60287-2-1 Table 1, from memory).' },
  emissivity: { label: 'Emissivity', unit: '', min: 0, max: 1, basis: 'A share of black-body radiation.' },
  ks: { label: 'ks', unit: '', min: 0, minExclusive: true, max: 1.5, basis: 'IEC 60287-1-1 Table 2 skin-effect factor (1 for round stranded).' },
  kp: { label: 'kp', unit: '', min: 0, minExclusive: true, max: 1.5, basis: 'IEC 60287-1-1 Table 2 proximity-effect factor.' },
  barWidthM: { label: 'Bar width', unit: 'm', min: 1e-3, max: 1, basis: 'Of one bar.' },
  barThicknessM: { label: 'Bar thickness', unit: 'm', min: 5e-4, max: 0.2, basis: 'Of one bar (0.5 mm is a thin laminate).' },
  minParallelSectionMm2: { label: 'Smallest section run in parallel', unit: 'mm²', min: 1.5, max: 1000, basis: 'Team setting for schedules: below it a circuit gets one larger cable rather than parallel runs (parallel small cables share current unevenly).' },
  barsPerPhase: { label: 'Bars per phase', unit: '', min: 1, max: 20, integer: true, basis: 'Bars in one pack.' },
  barGapM: { label: 'Gap between bars', unit: 'm', min: 0, max: 1, basis: 'Clear gap inside a pack.' },
  packGapM: { label: 'Gap between the bars of a pack', unit: 'm', min: 1e-3, max: 1, basis: 'A pack of two or more bars per phase needs a gap between them (spacers of 1 mm and more; without one the bars are one thicker bar).' },
  coatingThicknessM: { label: 'Coating thickness', unit: 'm', min: 0, minExclusive: true, max: 0.05, basis: 'Paint, sleeve or coating on a bar.' },
  acResistanceRatio: { label: 'AC/DC resistance ratio', unit: '', min: 1, max: 10, basis: 'R_ac/R_dc ≥ 1 (skin and proximity effects only add resistance).' },
  continuousLimitC: { label: 'Continuous limit', ...TEMPERATURE_LIMIT },
  shortCircuitLimitC: { label: 'Short-circuit limit', ...TEMPERATURE_LIMIT },
  terminalLimitC: { label: 'Terminal limit', ...TEMPERATURE_LIMIT },

  // ───────────── optional checks of a sheet (over time, along the run, enclosure air) ─────────────
  overloadCurrentA: { label: 'Overload current', unit: 'A', min: 0, minExclusive: true, max: MAX_CIRCUIT_CURRENT_A, basis: 'Under the one current cap MAX_CIRCUIT_CURRENT_A.' },
  overloadDurationS: { label: 'Overload duration', unit: 's', min: 0, minExclusive: true, max: 7 * 86_400, basis: 'Up to a week.' },
  dailyLoadCurrentA: { label: 'Daily load current', unit: 'A', min: 0, max: MAX_CIRCUIT_CURRENT_A, basis: 'Under the one current cap MAX_CIRCUIT_CURRENT_A; 0 A hours are allowed.' },
  runLengthM: { label: 'Run length', unit: 'm', min: 0, minExclusive: true, max: 1000, basis: 'A bar run between two terminals.' },
  terminalTemperatureC: { label: 'Terminal temperature', unit: '°C', min: -60, max: 300, basis: 'A device terminal at the end of a bar run.' },
  jointResistanceMicroOhm: { label: 'Joint resistance', unit: 'µΩ', min: 0, max: 10_000, basis: 'A bolted joint has a few µΩ (common practice); 10 mΩ is a failed joint.' },
  enclosureSizeM: { label: 'Enclosure size', unit: 'm', min: 0, minExclusive: true, max: 10, basis: 'Height, width or depth of one enclosure.' },
  enclosureOutsideAirC: { label: 'Air around the enclosure', unit: '°C', min: -60, max: 100, basis: 'Room air around an assembly.' },
  routeLengthInsideM: { label: 'Route length inside', unit: 'm', min: 0, max: 100, basis: 'The part of the route inside one enclosure.' },
  otherLossesW: { label: 'Other losses inside', unit: 'W', min: 0, max: 100_000, basis: 'Declared losses of the devices inside one enclosure.' },
  // The cross-section solved in two dimensions (issue 20): the ground surface exchanging heat with the air.
  groundSurfaceCoefficientWPerM2K: {
    label: 'Ground surface coefficient',
    unit: 'W/(m²·K)',
    min: 0,
    minExclusive: true,
    max: 100,
    basis: 'Convection and radiation from bare ground to the air: a few W/(m²·K) in still air to a few tens in strong wind (common practice, from memory); 100 is far above any ground surface.',
  },
} as const satisfies Record<string, InputBound>;

export type BoundName = keyof typeof INPUT_BOUNDS;

/** True when `value` is a finite number inside the bound. */
export function withinBound(bound: InputBound, value: number): boolean {
  if (!Number.isFinite(value)) return false;
  if (bound.integer && !Number.isInteger(value)) return false;
  const aboveMin = bound.minExclusive ? value > bound.min : value >= bound.min;
  const belowMax = bound.maxExclusive ? value < bound.max : value <= bound.max;
  return aboveMin && belowMax;
}

const withUnit = (value: number, unit: string) => `${value}${unit ? ` ${unit}` : ''}`;

/** The lower end in words: "at least −60 °C", "greater than 0 A". */
export function lowerWords(bound: InputBound): string {
  return `${bound.minExclusive ? 'greater than' : 'at least'} ${withUnit(bound.min, bound.unit)}`;
}

/** The upper end in words: "at most 1000 Hz", "under 100 %". */
export function upperWords(bound: InputBound): string {
  return `${bound.maxExclusive ? 'under' : 'at most'} ${withUnit(bound.max, bound.unit)}`;
}

/** The whole range in words: "greater than 0 A and at most 100000 A", "a whole number from 1 to 20". */
export function describeBound(bound: InputBound): string {
  if (bound.integer && !bound.minExclusive && !bound.maxExclusive) return `a whole number from ${bound.min} to ${withUnit(bound.max, bound.unit)}`;
  return `${lowerWords(bound)} and ${upperWords(bound)}`;
}

/**
 * The library's check at the edge where data enters it: returns the value when it is a finite
 * number inside the bound, else throws ElectricalInputError naming the field (default: the bound's
 * name; pass the dotted path, e.g. 'conditions.frequencyHz').
 */
export function checkBound(name: BoundName, value: unknown, field: string = name): number {
  const bound: InputBound = INPUT_BOUNDS[name];
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new ElectricalInputError(field, `must be a finite number (got ${String(value)})`);
  if (!withinBound(bound, value)) throw new ElectricalInputError(field, `must be ${describeBound(bound)} (got ${value})`);
  return value;
}

/** The same check for an optional input: undefined and null pass as undefined. */
export function checkOptionalBound(name: BoundName, value: unknown, field: string = name): number | undefined {
  return value === undefined || value === null ? undefined : checkBound(name, value, field);
}

/**
 * The bound on a zod number schema of an edge: `.gt`/`.min`, `.lt`/`.max` and `.int` with messages
 * naming the quantity ("Frequency must be at most 1000 Hz"). Built from zod's own checks, not a
 * refinement, so the JSON Schema of the API (OpenAPI document, field table) shows the same
 * minimum and maximum. `base` is the edge's own number schema (its message for a non-number).
 */
export function zodBound(base: z.ZodNumber, bound: InputBound, label: string = bound.label): z.ZodNumber {
  let schema = bound.integer ? base.int(`${label} must be a whole number`) : base;
  schema = bound.minExclusive ? schema.gt(bound.min, `${label} must be ${lowerWords(bound)}`) : schema.min(bound.min, `${label} must be ${lowerWords(bound)}`);
  schema = bound.maxExclusive ? schema.lt(bound.max, `${label} must be ${upperWords(bound)}`) : schema.max(bound.max, `${label} must be ${upperWords(bound)}`);
  return schema;
}

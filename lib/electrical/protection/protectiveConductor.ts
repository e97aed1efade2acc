/**
 * Cross-section of the protective conductor, IEC 60364-5-54 §543.1.
 *
 * §543.1.2 (adiabatic, disconnection times up to 5 s): S = √(I²t)/k, I the fault current
 * through the device, t its operating time (both from the §411 check), k from the conductor
 * and its insulation: k = K·√ln((β + θ_f)/(β + θ_i)) (IEC 60949 K and β, via `adiabaticK`)
 * with the initial and final temperatures of Tables A.54.2 (insulated protective conductor not
 * part of a cable, initial 30 °C) and A.54.3 (a core of a cable or bunched with cables,
 * initial = the cable's operating temperature) — from memory:
 *
 *   insulation        A.54.2 θ_i  A.54.3 θ_i  θ_f
 *   PVC 70 °C            30          70        160 (140 above 300 mm²)
 *   PVC 90 °C            30          90        160 (140 above 300 mm²)
 *   thermosetting 90 °C  30          90        250   (XLPE, EPR)
 *
 * §543.1.3 table (Table 54.3, same material as the line conductor, from memory):
 * S_pe = S for S ≤ 16 mm², 16 for 16 < S ≤ 35, S/2 above 35.
 *
 * Which governs. §543.1.1 lets the section be calculated (§543.1.2) or selected from the
 * table, but first asks the conductor to withstand the thermal stress of the prospective
 * fault during the disconnection time. So when the fault current and time are known the
 * calculation governs: a section the table admits but the calculation does not is refused (the
 * table's presumption is contradicted by the numbers), and a section below the table but above
 * the calculation is accepted (the calculated route). Without fault data only the table can
 * be applied, and it governs. A protective conductor that is not part of a cable nor bunched
 * with the line conductors is never below 2.5 mm² Cu / 16 mm² Al with mechanical protection,
 * 4 mm² Cu / 16 mm² Al without (§543.1.3, from memory); when that floor is the larger figure
 * it governs.
 */
import { ElectricalInputError, requireNonNegative, requirePositive, requireRange, requireTemperature } from '../errors';
import type { ConductorMaterial } from '../materials';
import { materialConstants } from '../materials';
import { adiabaticK } from '../shortCircuit';

export type ProtectiveConductorInsulation = 'pvc-70' | 'pvc-90' | 'thermosetting-90';
/** `in-cable-or-bunched`: Table A.54.3 (a core of a multi-core cable, or bunched with cables, e.g. in the same conduit); `separate`: Table A.54.2. */
export type ProtectiveConductorArrangement = 'in-cable-or-bunched' | 'separate';

/** §543.1.2 applies to disconnection times up to 5 s. */
export const ADIABATIC_PE_MAX_TIME_S = 5;

/** IEC 60228 nominal cross-sections, mm² (from memory). */
export const IEC_60228_SECTIONS_MM2: readonly number[] = Object.freeze([
  0.5, 0.75, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300, 400, 500, 630, 800, 1000, 1200, 1400, 1600, 1800, 2000, 2500,
]);

const OPERATING_C: Readonly<Record<ProtectiveConductorInsulation, number>> = { 'pvc-70': 70, 'pvc-90': 90, 'thermosetting-90': 90 };

/** Tables A.54.2 / A.54.3 temperatures (from memory). */
export function protectiveConductorTemperatures(args: {
  insulation: ProtectiveConductorInsulation;
  arrangement: ProtectiveConductorArrangement;
  sectionMm2: number;
}): { initialC: number; finalC: number; basis: string } {
  const { insulation, arrangement } = args;
  if (typeof insulation !== 'string' || !Object.hasOwn(OPERATING_C, insulation)) throw new ElectricalInputError('insulation', `must be 'pvc-70', 'pvc-90' or 'thermosetting-90' (got ${String(insulation)})`);
  if (arrangement !== 'in-cable-or-bunched' && arrangement !== 'separate') {
    throw new ElectricalInputError('arrangement', `must be 'in-cable-or-bunched' or 'separate' (got ${String(arrangement)})`);
  }
  const s = requirePositive(args.sectionMm2, 'sectionMm2');
  const initialC = arrangement === 'separate' ? 30 : OPERATING_C[insulation];
  const finalC = insulation === 'thermosetting-90' ? 250 : s > 300 ? 140 : 160;
  const table = arrangement === 'separate' ? 'Table A.54.2' : 'Table A.54.3';
  return { initialC, finalC, basis: `IEC 60364-5-54 ${table}, ${insulation}: ${initialC} → ${finalC} °C (from memory)` };
}

function nextStandardSection(s: number): number | undefined {
  // A section worked out as exactly a standard value keeps it (floating-point slack 1e-9).
  return IEC_60228_SECTIONS_MM2.find((v) => v >= s * (1 - 1e-9));
}

export interface AdiabaticPeResult {
  /** √(I²t)/k, mm². */
  minimumMm2: number;
  nextStandardMm2: number | undefined;
  kAs05PerMm2: number;
  energyA2s: number;
  initialC: number;
  finalC: number;
  basis: string;
}

export interface ProtectiveConductorResult {
  clause: 'IEC 60364-5-54 §543.1';
  /** §543.1.2; undefined when no fault data were given. */
  adiabatic: AdiabaticPeResult | undefined;
  /** Table 54.3; undefined when the protective conductor is not of the line conductor's material (the k₁/k₂ scaling is not done here). */
  table: { minimumMm2: number; nextStandardMm2: number | undefined; basis: string } | undefined;
  /** §543.1.3 floor for a separate conductor, mm²; 0 for a core of a cable or one bunched with the line conductors. */
  mechanicalMinimumMm2: number;
  /** Least section accepted, mm² (see the module note for the rule). */
  requiredMinimumMm2: number;
  governing: 'adiabatic' | 'table' | 'mechanical';
  /** A sentence for the reader when the two methods disagree. */
  note: string | undefined;
  /** With an installed section: each method alone and the verdict against `requiredMinimumMm2`. */
  installed?: { sectionMm2: number; meetsAdiabatic: boolean | undefined; meetsTable: boolean | undefined; verdict: 'pass' | 'fail' };
}

/**
 * Minimum protective-conductor section by both methods of §543.1 and which one governs.
 * Fault data: `faultCurrentA` with `disconnectionTimeS` (from the §411 check), or the device's
 * let-through `energyA2s` from its maker (for a breaker tripping instantaneously, I²·t at the
 * minimum fault current under-states the energy at higher currents), or neither (table only).
 */
export function protectiveConductorSection(args: {
  material: ConductorMaterial;
  insulation: ProtectiveConductorInsulation;
  arrangement: ProtectiveConductorArrangement;
  /** Earth-fault current I, A (from the §411 check). */
  faultCurrentA?: number;
  /** Operating time of the device at I, s (≤ 5 s). */
  disconnectionTimeS?: number;
  energyA2s?: number;
  lineSectionMm2: number;
  lineMaterial: ConductorMaterial;
  installedSectionMm2?: number;
  /** A separate conductor with protection against mechanical damage (§543.1.3). */
  mechanicallyProtected?: boolean;
  initialC?: number;
  finalC?: number;
}): ProtectiveConductorResult {
  materialConstants(args?.material, 'material');
  materialConstants(args.lineMaterial, 'lineMaterial');
  // The temperatures are checked even when only the table is used, so bad data never pass silently.
  protectiveConductorTemperatures({ insulation: args.insulation, arrangement: args.arrangement, sectionMm2: 1 });
  const line = requirePositive(args.lineSectionMm2, 'lineSectionMm2');
  const installed = args.installedSectionMm2 === undefined ? undefined : requirePositive(args.installedSectionMm2, 'installedSectionMm2');
  const energy = faultEnergy(args);

  let adiabatic: AdiabaticPeResult | undefined;
  if (energy !== undefined) {
    const adiabaticAt = (sectionForTable: number) => {
      const temps = protectiveConductorTemperatures({ insulation: args.insulation, arrangement: args.arrangement, sectionMm2: sectionForTable });
      const initialC = args.initialC === undefined ? temps.initialC : requireTemperature(args.initialC, 'initialC');
      const finalC = args.finalC === undefined ? temps.finalC : requireTemperature(args.finalC, 'finalC');
      const k = adiabaticK({ material: args.material, initial: initialC, final: finalC });
      const entered = args.initialC !== undefined || args.finalC !== undefined;
      return { k, initialC, finalC, basis: entered ? `entered temperatures ${initialC} → ${finalC} °C` : temps.basis };
    };
    // The PVC final temperature depends on the section (140 °C above 300 mm²): settle it.
    let a = adiabaticAt(installed ?? 1);
    let minimum = Math.sqrt(energy) / a.k;
    if (installed === undefined && minimum > 300) {
      a = adiabaticAt(minimum);
      minimum = Math.sqrt(energy) / a.k;
    }
    adiabatic = {
      minimumMm2: minimum,
      nextStandardMm2: nextStandardSection(minimum),
      kAs05PerMm2: a.k,
      energyA2s: energy,
      initialC: a.initialC,
      finalC: a.finalC,
      basis: `§543.1.2 S = √(I²t)/k; ${a.basis}`,
    };
  }

  let table: ProtectiveConductorResult['table'];
  if (args.material === args.lineMaterial) {
    const tmin = line <= 16 ? line : line <= 35 ? 16 : line / 2;
    const rule = line <= 16 ? 'S ≤ 16 mm²: S_pe = S' : line <= 35 ? '16 < S ≤ 35 mm²: S_pe = 16 mm²' : 'S > 35 mm²: S_pe = S/2';
    table = { minimumMm2: tmin, nextStandardMm2: nextStandardSection(tmin), basis: `IEC 60364-5-54 Table 54.3, ${rule} (from memory)` };
  }
  if (!adiabatic && !table) {
    throw new ElectricalInputError('faultCurrentA', 'a protective conductor of another material than the line conductor needs the fault current and time (§543.1.2)');
  }
  const separate = args.arrangement === 'separate';
  const mechanicalMinimumMm2 = !separate ? 0 : args.material === 'aluminium' ? 16 : args.mechanicallyProtected ? 2.5 : 4;

  const methodGoverning: 'adiabatic' | 'table' = adiabatic ? 'adiabatic' : 'table';
  const methodMinimum = adiabatic ? adiabatic.minimumMm2 : (table as { minimumMm2: number }).minimumMm2;
  const requiredMinimumMm2 = Math.max(methodMinimum, mechanicalMinimumMm2);
  const governing = mechanicalMinimumMm2 > methodMinimum ? 'mechanical' : methodGoverning;

  let note: string | undefined;
  if (adiabatic && table) {
    const a = fmt(adiabatic.minimumMm2);
    const t = fmt(table.minimumMm2);
    if (table.minimumMm2 < adiabatic.minimumMm2) {
      note = `Table 54.3 alone would admit ${t} mm², but this fault needs ${a} mm² adiabatically; §543.1.1 asks the conductor to withstand the fault, so the calculation governs.`;
    } else if (table.minimumMm2 > adiabatic.minimumMm2) {
      note = `Table 54.3 asks ${t} mm²; the calculation (§543.1.2) shows ${a} mm² withstands this fault, which §543.1.1 accepts.`;
    }
  }

  const result: ProtectiveConductorResult = { clause: 'IEC 60364-5-54 §543.1', adiabatic, table, mechanicalMinimumMm2, requiredMinimumMm2, governing, note };
  if (installed !== undefined) {
    const slack = 1 + 1e-9;
    result.installed = {
      sectionMm2: installed,
      meetsAdiabatic: adiabatic ? adiabatic.minimumMm2 <= installed * slack : undefined,
      meetsTable: table ? table.minimumMm2 <= installed * slack : undefined,
      verdict: requiredMinimumMm2 <= installed * slack ? 'pass' : 'fail',
    };
  }
  return result;
}

/** I²t from the fault data, or undefined when none were given (table only). */
function faultEnergy(args: { faultCurrentA?: number; disconnectionTimeS?: number; energyA2s?: number }): number | undefined {
  if (args.energyA2s !== undefined) return requireNonNegative(args.energyA2s, 'energyA2s');
  if (args.faultCurrentA === undefined && args.disconnectionTimeS === undefined) return undefined;
  const I = requireNonNegative(args.faultCurrentA, 'faultCurrentA');
  const t = requireRange(args.disconnectionTimeS, 'disconnectionTimeS', 0, ADIABATIC_PE_MAX_TIME_S, { minExclusive: true });
  return I * I * t;
}

function fmt(v: number): string {
  return Number(v.toPrecision(3)).toString();
}

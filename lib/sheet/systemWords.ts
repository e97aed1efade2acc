/**
 * The bus-bar system and the protection checks in words, for people (issues 18 and 21): each bar
 * of a pack as a table row (its temperature, share of the phase current, R_ac/R_dc, the one that
 * governs), the IEC 60865-1 forces as lines with their verdict, the protection verdicts
 * (coordination, disconnection, protective conductor, harmonics and neutral) and the smallest
 * device that coordinates — from the library's evaluation (lib/electrical/sizing/types.ts) and,
 * for the device's name, the sheet inputs. The sheet's panels, the share page, the PDF, the
 * candidate grid and the schedule take their words from here.
 *
 * SI numbers out unrounded in the rows; sentences round. Pure TypeScript (browser and server).
 */
import type { AssumptionFlag } from '../electrical/sizing/flags';
import type { CandidateEvaluationOk, ForcesResult, PackResult } from '../electrical/sizing/types';
import { formatNumber } from '../units';
import type { SheetInputs } from './schema';
import type { SheetDevice } from './systemSchema';

const n = (v: number, digits = 4) => formatNumber(v, digits);

// ───────────────────────────── flags beside each result ─────────────────────────────

/** Flags that qualify the pack's current sharing and heat balance (shown beside the pack table). */
export const PACK_FLAG_CODES: readonly string[] = [
  'PACK_RATED_AS_SYSTEM',
  'BAR_AC_FACTOR_COMPUTED',
  'PHASE_SPACING_ASSUMED',
  'FILAMENT_MESH_COARSENED',
  'BUSBAR_CHANNEL_OUT_OF_RANGE',
  'BUSBAR_CHANNEL_LIMITED_TO_PLATE',
  'BUSBAR_FLAT_GAP_NO_CONVECTION',
  'BUSBAR_FLAT_SLOT_RADIATION_TO_ROOM',
  'BUSBAR_EDGE_CONVECTION',
  'BUSBAR_PLATE_OUT_OF_RANGE',
  'BUSBAR_BARS_ISOTHERMAL',
  'BUSBAR_PACK_ISOTHERMAL',
  'BUSBAR_NO_STEADY_STATE',
];

/** Flags of the IEC 60865-1 check (shown beside the forces). */
export const FORCES_FLAG_CODES: readonly string[] = [
  'FORCES_NOT_CHECKED',
  'PHASE_SPACING_ASSUMED',
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
];

/** Flags of the protection checks and the harmonics (shown beside the protection verdicts). */
export const PROTECTION_FLAG_CODES: readonly string[] = [
  'PROTECTION_OVERLOAD_NOT_COORDINATED',
  'PROTECTION_DISCONNECTION_TOO_SLOW',
  'PROTECTION_ASSUMPTIONS',
  'PROTECTIVE_CONDUCTOR_TOO_SMALL',
  'DISCONNECTION_NOT_CHECKED',
  'HARMONICS_NOT_COVERED',
  'HARMONICS_NEUTRAL_GOVERNS',
  'HARMONICS_NEUTRAL_HEAT',
  'HARMONICS_OVER_RATING',
];

/** The evaluation's flags of one result part, worst first (blockers, then review, then notes). */
export function flagsOf(e: CandidateEvaluationOk, codes: readonly string[]): AssumptionFlag[] {
  const rank = { blocker: 0, review: 1, note: 2 } as const;
  return e.flags.filter((f) => codes.includes(f.code)).sort((a, b) => rank[a.severity] - rank[b.severity]);
}

// ───────────────────────────── the pack ─────────────────────────────

export interface PackBarRow {
  phase: string;
  /** 0-based in the pack, from the left (bars on edge) or from the bottom (bars flat). */
  positionInPack: number;
  /** "bar 1 of 3 (outer)", "bar 2 of 3 (inner)". */
  bar: string;
  temperatureC: number;
  /** Its share of its phase's current, 0…1. */
  shareOfPhase: number;
  currentA: number;
  lossWPerM: number;
  /** R_ac/R_dc of the bar; null where the library gives none (DC). */
  acFactor: number | null;
  /** The hottest bar: it governs the pack's rating. */
  governs: boolean;
}

/** "bar 1 of 3 (outer)": counted from the left on edge, from the bottom flat (lib/electrical/busbar/geometry.ts). */
export function packBarWords(positionInPack: number, barsInPack: number): string {
  if (barsInPack <= 1) return 'the bar';
  const outer = positionInPack === 0 || positionInPack === barsInPack - 1;
  return `bar ${positionInPack + 1} of ${barsInPack} (${outer ? 'outer' : 'inner'})`;
}

/** Every bar of the system at the design current, in phase order, the governing (hottest) bar marked. */
export function packBarRows(pack: PackResult): PackBarRow[] {
  const perPhase = new Map<string, number>();
  for (const b of pack.bars) perPhase.set(b.phase, (perPhase.get(b.phase) ?? 0) + 1);
  return pack.bars.map((b) => ({
    phase: b.phase,
    positionInPack: b.positionInPack,
    bar: packBarWords(b.positionInPack, perPhase.get(b.phase) ?? 1),
    temperatureC: b.temperatureC,
    shareOfPhase: b.shareOfPhase,
    currentA: b.currentA,
    lossWPerM: b.lossWPerM,
    acFactor: b.acFactor,
    governs: b.phase === pack.hottest.phase && b.positionInPack === pack.hottest.positionInPack,
  }));
}

/** "L2, bar 1 of 3 (outer), 84.2 °C" — the bar that governs. */
export function hottestBarText(pack: PackResult, temperatureText: (c: number) => string = (c) => `${n(c)} °C`): string {
  const inPack = pack.bars.filter((b) => b.phase === pack.hottest.phase).length;
  return `${pack.hottest.phase}, ${packBarWords(pack.hottest.positionInPack, inPack)}, ${temperatureText(pack.hottest.temperatureC)}`;
}

// ───────────────────────────── the forces ─────────────────────────────

export type Verdict = 'passes' | 'fails' | 'not checked';

export interface ResultLine {
  label: string;
  value: string;
  verdict?: 'passes' | 'fails';
}

/** The larger of the support forces at the end and the inner supports, N. */
export function largestSupportForceN(f: ForcesResult): number {
  return Math.max(f.supportForceAN, f.supportForceBN);
}

/** The forces as lines with units: the peak current, the stresses against the allowed, the supports against their rating, the largest span. */
export function forcesLines(f: ForcesResult, supportSpacingM: number | null = null): ResultLine[] {
  const lines: ResultLine[] = [
    { label: 'Peak short-circuit current i_p = κ·√2·I″k', value: `${n(f.peakCurrentA / 1000)} kA (κ = ${n(f.kappa)})` },
    { label: 'Force on the middle phase over one span', value: `${n(f.mainForceN)} N` },
    {
      label: 'Bending stress σ_tot against q·R_p0.2',
      value: `stress ratio ${n(f.stressRatio, 3)} (σ_tot ${n(f.totalStressPa / 1e6)} N/mm², R_p0.2 ${n(f.yieldStrengthPa / 1e6)} N/mm²)`,
      verdict: f.stressRatio <= 1 ? 'passes' : 'fails',
    },
  ];
  if (f.subConductorStressRatio !== null) {
    lines.push({ label: 'Stress between the bars of a pack σ_s against R_p0.2', value: `stress ratio ${n(f.subConductorStressRatio, 3)}`, verdict: f.subConductorStressRatio <= 1 ? 'passes' : 'fails' });
  }
  const largest = largestSupportForceN(f);
  lines.push(
    f.supportForceRatio === null
      ? { label: 'Force on a support F_d', value: `${n(largest)} N (end supports ${n(f.supportForceAN)} N, inner ${n(f.supportForceBN)} N); no rated strength entered: not checked` }
      : {
          label: 'Force on a support F_d against its rating',
          value: `${n(largest)} N of ${n(largest / f.supportForceRatio)} N rated (ratio ${n(f.supportForceRatio, 3)})`,
          verdict: f.supportForceRatio <= 1 ? 'passes' : 'fails',
        },
    {
      label: 'Largest support spacing that passes',
      value: `${n(f.largestSupportSpacingM * 1000)} mm, limited by the ${f.largestSupportSpacingLimitedBy}${supportSpacingM !== null ? ` (entered: ${n(supportSpacingM * 1000)} mm)` : ''}`,
    },
  );
  return lines;
}

/** Passes, fails or not checked, for a bar candidate's evaluation; null for a cable. */
export function forcesVerdict(e: CandidateEvaluationOk): Verdict | null {
  if (e.kind !== 'bar') return null;
  if (!e.forces) return 'not checked';
  return e.forces.passes ? 'passes' : 'fails';
}

/** Why the forces were not checked, in words, from the sheet inputs (the library's own flag says it too). */
export function forcesNotCheckedReason(inputs: SheetInputs): string {
  const b = inputs.busbarSystem;
  const missing: string[] = [];
  if (!inputs.fault.checked) missing.push('the fault current (Fault section)');
  if (b.phaseSpacingM === null) missing.push('the phase spacing');
  if (b.supportSpacingM === null) missing.push('the support spacing');
  if (b.supports === null) missing.push('how the bars are held');
  return missing.length > 0 ? `Not checked: enter ${missing.join(', ')}.` : 'Not checked.';
}

// ───────────────────────────── protection ─────────────────────────────

/** "C 100 A circuit-breaker (IEC 60898-1)", "gG 250 A fuse (IEC 60269)", "IEC 60947-2 circuit-breaker 2500 A, I_r 2000 A". */
export function deviceWords(d: SheetDevice): string {
  switch (d.kind) {
    case 'breaker-iec60898-1':
      return `${d.curve} ${n(d.ratedCurrentA)} A circuit-breaker (IEC 60898-1)`;
    case 'breaker-iec60947-2':
      return `${n(d.ratedCurrentA)} A circuit-breaker (IEC 60947-2), I_r ${d.settingCurrentA === null ? '—' : `${n(d.settingCurrentA)} A`}, I_i ${d.instantaneousCurrentA === null ? '—' : `${n(d.instantaneousCurrentA)} A`}`;
    case 'fuse-gG-iec60269':
      return `gG ${n(d.ratedCurrentA)} A fuse (IEC 60269)`;
  }
}

/** The device type in a few words, for a grid or a schedule column. */
export function deviceTypeWords(d: SheetDevice): string {
  return d.kind === 'breaker-iec60898-1' ? `breaker ${d.curve}` : d.kind === 'breaker-iec60947-2' ? 'breaker IEC 60947-2' : 'gG fuse';
}

export interface ProtectionVerdicts {
  coordination: Verdict;
  disconnection: Verdict;
  protectiveConductor: Verdict;
  /** Harmonics and the neutral: 'not checked' when no content is given or the cable is not four- or five-core. */
  harmonics: Verdict;
}

/** Each protection verdict of an evaluation (null when no device and no harmonics were given). */
export function protectionVerdicts(e: CandidateEvaluationOk): ProtectionVerdicts | null {
  const p = e.protection;
  const h = e.harmonics;
  if (!p && !h) return null;
  const verdict = (v: 'pass' | 'fail' | undefined | null): Verdict => (v === 'pass' ? 'passes' : v === 'fail' ? 'fails' : 'not checked');
  return {
    coordination: verdict(p?.coordination?.verdict),
    disconnection: verdict(p?.disconnection?.verdict),
    protectiveConductor: verdict(p?.protectiveConductor?.installed?.verdict),
    harmonics: h ? (h.annexEPasses && e.designCurrentA <= e.ampacityA ? 'passes' : 'fails') : 'not checked',
  };
}

/** The protection checks as lines with units and verdicts, in the order of the wiring rules. */
export function protectionLines(e: CandidateEvaluationOk): ResultLine[] {
  const lines: ResultLine[] = [];
  const p = e.protection;
  if (p) {
    const c = p.coordination;
    if (c) {
      for (const l of c.inequalities) lines.push({ label: `${l.text} (IEC 60364-4-43 §433.1)`, value: `${n(l.left)} A ≤ ${n(l.right)} A`, verdict: l.holds ? 'passes' : 'fails' });
      lines.push({ label: 'I₂ taken as', value: `${n(c.conventionalOperatingCurrentA)} A: ${c.conventionalOperatingCurrentBasis}` });
    } else {
      lines.push({ label: 'Overload coordination', value: 'not checked: the candidate may carry no current (no ampacity to coordinate with)', verdict: 'fails' });
    }
    const s = p.smallestRating;
    if (s) {
      lines.push({
        label: 'Smallest device that coordinates',
        value: s.ratingA === undefined ? `none of the series (${s.seriesBasis}) satisfies §433.1 with I_z = ${n(e.ampacityA)} A` : `${n(s.ratingA)} A (${s.seriesBasis})`,
      });
    }
    const d = p.disconnection;
    if (d) {
      lines.push(
        { label: 'Earth-fault loop impedance Z_s', value: `${n(d.loop.impedanceOhm * 1000)} mΩ (${d.loop.basis})` },
        { label: 'Earth-fault current I_a = c·U₀/Z_s', value: `${n(d.faultCurrentA / 1000)} kA (c = ${n(d.voltageFactor, 3)})` },
        {
          label: `Disconnection within ${n(d.required.timeS, 3)} s (${d.clause})`,
          value: `${d.operating.timeS === undefined ? 'not shown by the device data' : `${n(d.operating.timeS, 3)} s`}; ${d.operating.basis}. Required: ${d.required.basis}`,
          verdict: d.verdict === 'pass' ? 'passes' : 'fails',
        },
      );
      if (d.maxLoopImpedanceOhm !== undefined) lines.push({ label: 'Largest Z_s that disconnects in time', value: `${n(d.maxLoopImpedanceOhm * 1000)} mΩ` });
    } else {
      lines.push({ label: 'Automatic disconnection (IEC 60364-4-41 §411)', value: 'not checked: enter the source impedance and the protective conductor' });
    }
    const pe = p.protectiveConductor;
    if (pe) {
      lines.push({
        label: 'Protective conductor (IEC 60364-5-54 §543.1)',
        value: `${pe.installed ? `${n(pe.installed.sectionMm2)} mm² installed, ` : ''}at least ${n(pe.requiredMinimumMm2, 3)} mm² needed; ${pe.governing === 'adiabatic' ? `the adiabatic formula governs (${pe.adiabatic?.basis ?? ''})` : pe.governing === 'table' ? `Table 54.3 governs (${pe.table?.basis ?? ''})` : 'the mechanical minimum of §543.1.3 governs'}${pe.note ? `. ${pe.note}` : ''}`,
        ...(pe.installed ? { verdict: pe.installed.verdict === 'pass' ? ('passes' as const) : ('fails' as const) } : {}),
      });
    }
  }
  const h = e.harmonics;
  if (h) {
    lines.push(
      { label: 'Neutral current I_N = 3·h₃·I_B (IEC 60364-5-52 Annex E)', value: `${n(h.neutralCurrentA)} A at ${n(h.thirdHarmonicFraction * 100, 3)} % third harmonic` },
      {
        label: `Annex E: sizing current on the ${h.governing} (factor ${n(h.reductionFactor, 3)}) against I_z with three loaded cores`,
        value: `${n(h.sizingCurrentA)} A ≤ ${n(h.ratingThreeLoadedCoresA)} A; ${h.basis}`,
        verdict: h.annexEPasses ? 'passes' : 'fails',
      },
      ...(h.neutralHeatShare > 0
        ? [
            {
              label: "Heat balance with the neutral's loss ((3·h₃)² of a phase core's)",
              value: `I_B ${n(e.designCurrentA)} A ≤ I_z ${n(e.ampacityA)} A (with three loaded cores alone ${n(h.ratingThreeLoadedCoresA)} A)`,
              verdict: e.designCurrentA <= e.ampacityA ? ('passes' as const) : ('fails' as const),
            },
          ]
        : []),
    );
  }
  return lines;
}

/**
 * The parts of the sheet inputs that sheet version 6 added (issues 18 and 21), as zod schemas read
 * by lib/sheet/schema.ts:
 *   - `busbarSystem`: the three-phase system a bar candidate forms — the gap between the bars of a
 *     pack, the phase spacing, the support span, how the bars are held, the rated strength of a
 *     support, the peak factor κ (or the fault's R/X) and how the pack's bars exchange heat. The
 *     bars per phase are the candidate's own (a candidate is a catalogue bar × how many per phase);
 *     the arrangement (on edge or flat) is the installation's kind.
 *   - `protection`: the circuit's protective device (IEC 60898-1 breaker B/C/D, IEC 60947-2
 *     breaker, gG fuse) with its rating, setting, I₂ and trip data, the earthing and role of the
 *     circuit, the source impedance and the protective conductor.
 *   - `harmonics`: the third-harmonic content of the phase current (IEC 60364-5-52 Annex E).
 * Numbers are SI; null is "not entered" (the library then assumes and flags, or does not check).
 * Every range is a row of lib/inputBounds; an error names its field.
 */
import { z } from 'zod';
import { INPUT_BOUNDS, zodBound, type BoundName } from '../inputBounds';

const num = (label: string) => z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a finite number`);
const bounded = (name: BoundName, label: string = INPUT_BOUNDS[name].label) => zodBound(num(label), INPUT_BOUNDS[name], label);
const optionalBounded = (name: BoundName, label?: string) => bounded(name, label).nullable();

/** How the bars are held, IEC 60865-1 Table 3 (the library's names, lib/electrical/sizing/types.ts). */
export const supportArrangements = [
  'single-span-both-simply-supported',
  'single-span-fixed-and-simply-supported',
  'single-span-both-fixed',
  'continuous-two-spans',
  'continuous-three-or-more-spans',
] as const;
export type SheetSupportArrangement = (typeof supportArrangements)[number];

/** Our words for them. */
export const SUPPORT_WORDS: Readonly<Record<SheetSupportArrangement, string>> = {
  'single-span-both-simply-supported': 'One span, both ends simply supported',
  'single-span-fixed-and-simply-supported': 'One span, one end fixed, one simply supported',
  'single-span-both-fixed': 'One span, both ends fixed',
  'continuous-two-spans': 'Continuous over two spans',
  'continuous-three-or-more-spans': 'Continuous over three or more spans',
};

export const peakFactorWays = ['assumed', 'r-over-x', 'kappa'] as const;

export const busbarSystemSchema = z.object({
  /** Clear gap between the wide faces of a pack's bars, m; null = each candidate's own, or the bar thickness (the library's default). */
  barGapM: optionalBounded('barGapM', 'Gap between bars').refine((v) => v === null || v > 0, 'Gap between bars must be greater than 0 m'),
  /** Centre of one phase's pack to the next, m; null = assumed (the bar width clear between packs, flagged), and the forces are not checked. */
  phaseSpacingM: optionalBounded('phaseSpacingM'),
  /** Span between supports, m; null = not described (forces not checked). */
  supportSpacingM: optionalBounded('supportSpacingM'),
  /** Between the spacers of a pack, m; null = the support spacing. */
  spacerSpacingM: optionalBounded('spacerSpacingM'),
  /** How the bars are held; null = not described (forces not checked, flagged). */
  supports: z.enum(supportArrangements, { error: 'Choose how the bars are held' }).nullable(),
  /** Rated bending strength of one support, N; null = the forces are reported, not checked against it (flagged). */
  supportStrengthN: optionalBounded('supportStrengthN'),
  /** κ from the fault's R/X, κ entered, or assumed 2.0 (the upper limit, flagged). The values are kept while not used. */
  peakFactorBy: z.enum(peakFactorWays, { error: 'Choose how the peak factor is found' }),
  rOverX: bounded('rOverX'),
  kappa: bounded('peakFactorKappa'),
  /** Each bar at its own temperature (cautious) or the pack's bars bonded to one (optimistic, flagged). */
  packNodes: z.enum(['per-bar', 'per-pack'], { error: 'Choose how the bars of a pack share heat' }),
});
export type SheetBusbarSystem = z.infer<typeof busbarSystemSchema>;

export const deviceKinds = ['breaker-iec60898-1', 'breaker-iec60947-2', 'fuse-gG-iec60269'] as const;
export type SheetDeviceKind = (typeof deviceKinds)[number];

export const DEVICE_KIND_WORDS: Readonly<Record<SheetDeviceKind, string>> = {
  'breaker-iec60898-1': 'Circuit-breaker, IEC 60898-1',
  'breaker-iec60947-2': 'Circuit-breaker, IEC 60947-2 (adjustable)',
  'fuse-gG-iec60269': 'gG fuse, IEC 60269',
};

const curvePointSchema = z.object({
  currentA: bounded('curvePointCurrentA'),
  timeS: bounded('curvePointTimeS'),
});

export const deviceSchema = z.object({
  kind: z.enum(deviceKinds, { error: 'Choose the kind of device' }),
  /** IEC 60898-1 breakers only (kept while another kind is chosen). */
  curve: z.enum(['B', 'C', 'D'], { error: 'Choose the curve B, C or D' }),
  /** I_n, A (for an IEC 60947-2 breaker the frame or trip-unit rating). */
  ratedCurrentA: bounded('deviceRatedCurrentA'),
  /** IEC 60947-2: the overload setting I_r, A (required for that kind). */
  settingCurrentA: optionalBounded('deviceRatedCurrentA', 'Setting I_r'),
  /** IEC 60947-2: the settings of its trip unit, A, for the smallest coordinated setting (empty: not searched). */
  settingStepsA: z.array(bounded('deviceRatedCurrentA', 'A trip-unit setting')).max(40, 'At most 40 trip-unit settings'),
  /** IEC 60947-2: instantaneous setting I_i, A (required for that kind). */
  instantaneousCurrentA: optionalBounded('instantaneousCurrentA'),
  /** IEC 60947-2: the maker's largest instantaneous break time, s; null = 0.1 s assumed (flagged). */
  instantaneousMaxTimeS: optionalBounded('instantaneousMaxTimeS'),
  /** I₂ entered; null = by the device standard's rule (from memory, said so in the result). */
  conventionalOperatingCurrentA: optionalBounded('conventionalOperatingCurrentA'),
  /** The maker's time–current curve (needed for a fuse's disconnection); empty = none. */
  timeCurrentCurve: z.array(curvePointSchema).max(40, 'At most 40 points on a time–current curve'),
});
export type SheetDevice = z.infer<typeof deviceSchema>;

export const protectionSchema = z.object({
  /** The circuit's device is described: coordination (and, with the source and the protective conductor, disconnection) are checked. */
  included: z.boolean(),
  device: deviceSchema,
  /** A final circuit (Table 41.1 times) or a distribution circuit (5 s TN, 1 s TT). */
  circuitRole: z.enum(['final', 'distribution'], { error: 'Choose a final or a distribution circuit' }),
  earthing: z.enum(['TN', 'TT'], { error: 'Choose TN or TT' }),
  /** TT only: R_A + R_B, Ω. */
  earthElectrodesOhm: optionalBounded('earthElectrodesOhm'),
  /** The supply up to the circuit's origin: not entered (disconnection not checked), R + jX, or |Z| only. */
  sourceBy: z.enum(['not-entered', 'r-and-x', 'magnitude'], { error: 'Choose how the source impedance is given' }),
  sourceResistanceOhm: bounded('sourceResistanceOhm'),
  sourceReactanceOhm: bounded('sourceReactanceOhm'),
  sourceImpedanceOhm: bounded('sourceImpedanceOhm'),
  protectiveConductor: z.object({
    /** Entered: disconnection (with the source) and its section are checked. */
    entered: z.boolean(),
    sectionMm2: bounded('protectiveConductorSectionMm2'),
    /** 'same' = the candidate's own metal. */
    material: z.enum(['same', 'copper', 'aluminium'], { error: 'Choose the protective conductor’s metal' }),
    insulation: z.enum(['pvc-70', 'pvc-90', 'thermosetting-90'], { error: 'Choose the protective conductor’s insulation' }),
    arrangement: z.enum(['in-cable-or-bunched', 'separate'], { error: 'Choose how the protective conductor runs' }),
  }),
});
export type SheetProtection = z.infer<typeof protectionSchema>;

export const harmonicsSchema = z.object({
  /** Third-harmonic content of the phase current, %; null = not entered (none assumed). */
  thirdHarmonicPercent: optionalBounded('thirdHarmonicPercent'),
});

type Issue = { path: Array<string | number>; message: string };

/** What single fields cannot say: the data each choice needs, each refusal on the field to fill. */
export function systemIssues(value: { busbarSystem: SheetBusbarSystem; protection: SheetProtection; installation: { kind: string; enclosureInside: string } }): Issue[] {
  const issues: Issue[] = [];
  const b = value.busbarSystem;
  // The system's fields are shown (and used) only for bars; a cable sheet keeps them unread.
  const placement = value.installation.kind === 'enclosure' ? value.installation.enclosureInside : value.installation.kind;
  const bars = placement === 'bar-on-edge' || placement === 'bar-flat';
  if (bars && (b.supports !== null || b.supportSpacingM !== null || b.supportStrengthN !== null)) {
    // The forces need the whole system: the library takes the supports only with the phase spacing.
    if (b.phaseSpacingM === null) issues.push({ path: ['busbarSystem', 'phaseSpacingM'], message: 'Enter the phase spacing: the forces on the bars and supports need it' });
    if (b.supports !== null && b.supportSpacingM === null) issues.push({ path: ['busbarSystem', 'supportSpacingM'], message: 'Enter the support spacing: the forces need the span' });
    if (b.supportSpacingM !== null && b.supports === null) issues.push({ path: ['busbarSystem', 'supports'], message: 'Choose how the bars are held: the forces need it' });
  }
  if (bars && b.spacerSpacingM !== null && b.supportSpacingM !== null && b.spacerSpacingM > b.supportSpacingM) {
    issues.push({ path: ['busbarSystem', 'spacerSpacingM'], message: 'Spacer spacing must not exceed the support spacing' });
  }
  const p = value.protection;
  if (!p.included) return issues;
  const d = p.device;
  const at = (...path: Array<string | number>) => ['protection', ...path];
  if (d.kind === 'breaker-iec60947-2') {
    if (d.settingCurrentA === null) issues.push({ path: at('device', 'settingCurrentA'), message: 'Enter the setting I_r of the breaker' });
    else if (d.settingCurrentA > d.ratedCurrentA) issues.push({ path: at('device', 'settingCurrentA'), message: `Setting I_r must not exceed the rated current ${d.ratedCurrentA} A` });
    if (d.instantaneousCurrentA === null) issues.push({ path: at('device', 'instantaneousCurrentA'), message: 'Enter the instantaneous setting I_i of the breaker' });
    else if (d.settingCurrentA !== null && d.instantaneousCurrentA <= d.settingCurrentA) issues.push({ path: at('device', 'instantaneousCurrentA'), message: `Instantaneous setting I_i must be above the setting I_r = ${d.settingCurrentA} A` });
  }
  d.timeCurrentCurve.forEach((point, i) => {
    if (i === 0) return;
    const before = d.timeCurrentCurve[i - 1];
    if (!(point.currentA > before.currentA)) issues.push({ path: at('device', 'timeCurrentCurve', i, 'currentA'), message: `Curve point current must be greater than the previous point’s (${before.currentA} A): currents rise along the curve` });
    else if (point.timeS > before.timeS) issues.push({ path: at('device', 'timeCurrentCurve', i, 'timeS'), message: `Curve point time must not exceed the previous point’s (${before.timeS} s): the operating time falls as the current rises` });
  });
  if (d.timeCurrentCurve.length === 1) issues.push({ path: at('device', 'timeCurrentCurve'), message: 'A time–current curve needs at least two points' });
  const disconnection = p.sourceBy !== 'not-entered' && p.protectiveConductor.entered;
  if (disconnection && d.kind === 'fuse-gG-iec60269' && d.timeCurrentCurve.length === 0) {
    issues.push({ path: at('device', 'timeCurrentCurve'), message: 'A fuse’s disconnection is read from its time–current curve: enter the maker’s curve, or leave the source impedance out' });
  }
  if (disconnection && p.earthing === 'TT' && p.earthElectrodesOhm === null) {
    issues.push({ path: at('earthElectrodesOhm'), message: 'A TT fault loop runs through the earth electrodes: enter R_A + R_B' });
  }
  return issues;
}

/** The version-6 parts as a new sheet (and an older one read as version 6) has them: nothing described, nothing checked. */
export function systemDefaults(): { busbarSystem: SheetBusbarSystem; protection: SheetProtection; harmonics: z.infer<typeof harmonicsSchema> } {
  return {
    busbarSystem: {
      barGapM: null,
      phaseSpacingM: null,
      supportSpacingM: null,
      spacerSpacingM: null,
      supports: null,
      supportStrengthN: null,
      // The starting values shown when the designer picks the way: R/X 0.1 and κ 1.8 (an LV
      // switchboard near a transformer, common practice) — they count only once chosen.
      peakFactorBy: 'assumed',
      rOverX: 0.1,
      kappa: 1.8,
      packNodes: 'per-bar',
    },
    protection: {
      included: false,
      device: {
        kind: 'breaker-iec60898-1',
        curve: 'C',
        ratedCurrentA: 100,
        settingCurrentA: null,
        settingStepsA: [],
        instantaneousCurrentA: null,
        instantaneousMaxTimeS: null,
        conventionalOperatingCurrentA: null,
        timeCurrentCurve: [],
      },
      circuitRole: 'distribution',
      earthing: 'TN',
      earthElectrodesOhm: null,
      sourceBy: 'not-entered',
      sourceResistanceOhm: 0.01,
      sourceReactanceOhm: 0.02,
      sourceImpedanceOhm: 0.025,
      protectiveConductor: { entered: false, sectionMm2: 50, material: 'same', insulation: 'thermosetting-90', arrangement: 'in-cable-or-bunched' },
    },
    harmonics: { thirdHarmonicPercent: null },
  };
}

/** Help text beside the fields: what an empty field means and where the figures come from. */
export const SYSTEM_HELP = {
  phaseSpacingM:
    'Centre of one phase’s pack to the next. Left empty: the packs are taken one bar width apart (flagged) — the current sharing depends on it, and the forces cannot be checked without it.',
  barGapM: 'Clear gap between the wide faces of a pack’s bars, for every pack on this sheet. Left empty: each bar’s thickness (a common spacer, common practice).',
  supports:
    'The forces of IEC 60865-1 need the fault current, the phase spacing, the support spacing and how the bars are held; the rated strength of a support (the maker’s figure) lets the support forces be checked too.',
  peakFactor: 'i_p = κ·√2·I″k. κ from R/X by IEC 60909-0 eq. (55), κ = 1.02 + 0.98·e^(−3R/X); without either κ = 2.0, the upper limit (cautious, flagged).',
  device:
    'The device that protects this circuit. I₂ left empty: 1.45·I_n for IEC 60898-1 breakers, 1.30·I_r for IEC 60947-2 breakers, the IEC 60269-1 factor for gG fuses (all from memory, said so in the result).',
  curve: 'The maker’s time–current curve as points, currents rising, times falling (log–log between points). A fuse needs it for the disconnection check; a breaker uses it below its instantaneous trip.',
  source:
    'Impedance of the supply up to the origin of this circuit (transformer and upstream cables). With the protective conductor, the earth-fault loop and the disconnection time are checked (IEC 60364-4-41 §411).',
  protectiveConductor: 'Its section is checked by the adiabatic formula of IEC 60364-5-54 §543.1.2 with the fault current and disconnection time, and by Table 54.3; the result says which governs.',
  thirdHarmonicPercent: 'Third-harmonic content of the phase current. For four- and five-core cables IEC 60364-5-52 Annex E sets the neutral current and a reduction factor (from memory). Left empty: none.',
} as const;

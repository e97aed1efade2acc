/**
 * The columns of a schedule file: one list drives the template, the header check, the row
 * validation messages and the preview, so that a cell's problem is named by the header the
 * designer sees in the spreadsheet. Values are SI, with the unit in the header.
 */
import { INPUT_BOUNDS } from '../inputBounds';

export type ScheduleColumnType = 'text' | 'number' | 'integer' | 'enum';

export interface ScheduleColumn {
  /** Field of the parsed row (lib/schedule/row.ts). */
  field: ScheduleField;
  /** Header as written in the file (matched case-insensitively, spaces collapsed). */
  header: string;
  type: ScheduleColumnType;
  required: boolean;
  /** What the column means and what happens when it is left empty. */
  hint: string;
  options?: readonly string[];
  /** Example value used in the downloadable template. */
  example: string | number;
}

export const INSTALLATION_WORDS = ['cable in air', 'buried', 'bar on edge', 'bar flat'] as const;
export type InstallationWord = (typeof INSTALLATION_WORDS)[number];

/** How a cable circuit's single cores lie (physics.md §8); the sheet's formations in words. */
export const FORMATION_WORDS = ['trefoil', 'flat', 'flat vertical'] as const;

/**
 * The circuit's protective device in a word (physics.md §11): a circuit-breaker to IEC 60898-1 with
 * its instantaneous curve, or a gG fuse to IEC 60269. An adjustable IEC 60947-2 breaker needs its
 * settings and instantaneous setting, which a schedule row does not hold: size such a circuit on
 * its sheet.
 */
export const DEVICE_WORDS = ['breaker B', 'breaker C', 'breaker D', 'gG fuse'] as const;
export type DeviceWord = (typeof DEVICE_WORDS)[number];

/** How the bars are held, IEC 60865-1 Table 3, in words (the library's beam and support kinds). */
export const SUPPORT_WORDS = ['simply supported', 'fixed and simply supported', 'both ends fixed', 'continuous two spans', 'continuous three or more spans'] as const;
export type SupportWord = (typeof SUPPORT_WORDS)[number];

export type ScheduleField =
  | 'circuitTag'
  | 'from'
  | 'to'
  | 'designCurrentA'
  | 'nominalVoltageV'
  | 'phases'
  | 'frequencyHz'
  | 'lengthM'
  | 'powerFactor'
  | 'installation'
  | 'depthM'
  | 'ambientC'
  | 'faultCurrentKA'
  | 'clearingTimeS'
  | 'family'
  | 'maxVoltageDropPercent'
  | 'maxParallel'
  | 'groupingFactor'
  | 'temperatureLimitC'
  | 'formation'
  | 'spacingMm'
  | 'otherCircuits'
  | 'otherCircuitCurrentA'
  | 'circuitSpacingMm'
  | 'deviceType'
  | 'deviceRatingA'
  | 'phaseSpacingMm'
  | 'supportSpanMm'
  | 'supports'
  | 'supportStrengthN';

export const SCHEDULE_COLUMNS: readonly ScheduleColumn[] = [
  { field: 'circuitTag', header: 'circuit tag', type: 'text', required: true, example: 'F-101', hint: 'Your name for the circuit, unique within the file (at most 64 characters).' },
  { field: 'from', header: 'from', type: 'text', required: false, example: 'MSB-1', hint: 'Where the circuit starts (board, transformer…). Optional.' },
  { field: 'to', header: 'to', type: 'text', required: false, example: 'Chiller CH-2', hint: 'Where the circuit ends (load, sub-board…). Optional.' },
  { field: 'designCurrentA', header: 'design current (A)', type: 'number', required: true, example: 250, hint: `Design current I_B per phase, r.m.s., greater than 0 and at most ${INPUT_BOUNDS.designCurrentA.max} A.` },
  { field: 'nominalVoltageV', header: 'voltage U0 (V)', type: 'number', required: true, example: 230, hint: 'Line-to-neutral voltage U₀ (230 for a 230/400 V system); the voltage drop is a percentage of it.' },
  { field: 'phases', header: 'phases', type: 'integer', required: true, example: 3, options: ['1', '3'], hint: '1 or 3.' },
  { field: 'frequencyHz', header: 'frequency (Hz)', type: 'number', required: false, example: 50, hint: '0 for DC. Empty means 50 Hz, and the result notes that it was assumed.' },
  { field: 'lengthM', header: 'length (m)', type: 'number', required: true, example: 60, hint: 'Route length, metres.' },
  { field: 'powerFactor', header: 'power factor', type: 'number', required: true, example: 0.9, hint: 'cos φ of the load, 0 to 1.' },
  { field: 'installation', header: 'installation', type: 'enum', required: true, example: 'cable in air', options: INSTALLATION_WORDS, hint: 'How the conductor lies. Cables: cable in air or buried; bars: bar on edge or bar flat.' },
  { field: 'depthM', header: 'burial depth (m)', type: 'number', required: false, example: '', hint: 'Depth of the cable axis; required when the installation is buried.' },
  { field: 'ambientC', header: 'ambient (°C)', type: 'number', required: false, example: 35, hint: 'Air temperature, or the ground temperature at depth for buried cables. Empty: the reference value is assumed and flagged for review.' },
  { field: 'faultCurrentKA', header: 'fault current (kA)', type: 'number', required: false, example: 10, hint: 'Prospective fault current at the circuit. Give it with the clearing time, or leave both empty (the short circuit is then not checked, and flagged).' },
  { field: 'clearingTimeS', header: 'clearing time (s)', type: 'number', required: false, example: 0.2, hint: 'Time the protective device takes to clear the fault, seconds (at most 60).' },
  { field: 'family', header: 'conductor family', type: 'text', required: true, example: 'copper XLPE single-core', hint: 'The family the size is chosen from, as listed beside the upload (from your team catalogue), e.g. "copper XLPE single-core" or "aluminium bars".' },
  { field: 'maxVoltageDropPercent', header: 'max voltage drop (%)', type: 'number', required: false, example: 4, hint: 'Allowed voltage drop, % of U₀. Empty: the drop is reported but does not fail a size.' },
  { field: 'maxParallel', header: 'max parallel runs', type: 'integer', required: false, example: 1, hint: 'Cables in parallel per phase (or bars per phase for bar families) the sizing may use, 1 to 8. Empty means 1.' },
  { field: 'temperatureLimitC', header: 'temperature limit (°C)', type: 'number', required: false, example: '', hint: 'A limit of your own (joints, terminals, neighbouring equipment) that caps the material limits. Required for bar families, whose bare bars have no insulation limit.' },
  { field: 'groupingFactor', header: 'grouping factor', type: 'number', required: false, example: '', hint: 'Derating for nearby circuits in air that no method here covers, 0 < f ≤ 1 (e.g. from IEC 60364-5-52 tables). Empty means 1; an entered factor is flagged for review. The circuit’s own cables and the other circuits of the next columns are computed, not derated.' },
  // The cross-section (cables only): how the circuit lies and what lies beside it (physics.md §8).
  { field: 'formation', header: 'formation', type: 'enum', required: false, example: 'trefoil', options: FORMATION_WORDS, hint: 'Cables only: how the single-core cables of the circuit lie — trefoil, flat (a horizontal row) or flat vertical. Empty means trefoil. The group is rated as it lies.' },
  { field: 'spacingMm', header: 'axis spacing (mm)', type: 'number', required: false, example: '', hint: 'Cables only: axis-to-axis spacing of the circuit’s cables. Empty means touching.' },
  { field: 'otherCircuits', header: 'other circuits', type: 'integer', required: false, example: '', hint: `Cables only: how many other circuits lie beside this one in the same trench or route, in one row (0 to 23). Each is taken to have the same cable as the size being tried, at the current of the next column. Empty means none.` },
  { field: 'otherCircuitCurrentA', header: 'other circuit current (A)', type: 'number', required: false, example: '', hint: `Current per phase of each of the other circuits, at most ${INPUT_BOUNDS.otherCircuitCurrentA.max} A; required when there are other circuits.` },
  { field: 'circuitSpacingMm', header: 'circuit spacing (mm)', type: 'number', required: false, example: '', hint: 'Centre to centre between the circuit’s parallel runs and the other circuits, side by side. Empty means touching.' },
  // The protective device (physics.md §11): overload coordination against each size's rating.
  {
    field: 'deviceType',
    header: 'device type',
    type: 'enum',
    required: false,
    example: 'gG fuse',
    options: DEVICE_WORDS,
    hint: 'The circuit’s protective device: a circuit-breaker to IEC 60898-1 (curve B, C or D) or a gG fuse to IEC 60269. With its rating, each size is checked for overload coordination (IEC 60364-4-43 §433.1: I_B ≤ I_n ≤ I_z and I₂ ≤ 1.45·I_z) and the smallest coordinated rating is shown; disconnection is not checked from a schedule (flagged: size the circuit on its sheet with the source impedance and protective conductor). Empty: no device, protection not checked.',
  },
  { field: 'deviceRatingA', header: 'device rating (A)', type: 'number', required: false, example: 250, hint: `Rated current I_n of that device, greater than 0 and at most ${INPUT_BOUNDS.deviceRatedCurrentA.max} A; required with the device type.` },
  // The bus-bar system (physics.md §10): bar families only.
  { field: 'phaseSpacingMm', header: 'phase spacing (mm)', type: 'number', required: false, example: '', hint: 'Bars only: centre of one phase pack to the centre of the next. Empty: assumed (a clear gap of one bar width between packs, flagged) and the short-circuit forces are not checked.' },
  { field: 'supportSpanMm', header: 'support span (mm)', type: 'number', required: false, example: '', hint: 'Bars only: distance between the supports. With the supports, the phase spacing and a fault, the IEC 60865-1 forces on the bars and supports are checked.' },
  { field: 'supports', header: 'supports', type: 'enum', required: false, example: '', options: SUPPORT_WORDS, hint: 'Bars only: how the bars are held over the supports (IEC 60865-1 Table 3); required with the support span.' },
  { field: 'supportStrengthN', header: 'support strength (N)', type: 'number', required: false, example: '', hint: 'Bars only: rated bending strength of one support. Empty: the support forces are reported, not checked (flagged).' },
];

/** Headers compare case-insensitively with runs of white space collapsed (U₀ and U0 alike). */
export function normaliseHeader(header: unknown): string {
  return String(header ?? '')
    .replace(/₀/g, '0')
    .replace(/\s+/g, ' ')
    .trim()
    .toLowerCase();
}

const byHeader = new Map(SCHEDULE_COLUMNS.map((c) => [normaliseHeader(c.header), c]));
const byField = new Map(SCHEDULE_COLUMNS.map((c) => [c.field, c]));

export function columnByHeader(header: string): ScheduleColumn | undefined {
  return byHeader.get(normaliseHeader(header));
}

export function columnByField(field: string): ScheduleColumn | undefined {
  return byField.get(field as ScheduleField);
}

/** Header for messages: the file's spelling of the column when known. */
export function headerOf(field: string): string {
  return columnByField(field)?.header ?? field;
}

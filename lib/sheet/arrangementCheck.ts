/**
 * A cross-section the library refuses (cables overlapping, a cable not fitting its duct, cables
 * outside the backfill or above the ground, a spacing of zero where one is needed) is a mistake
 * in the sheet, not a result: the sheet shows it on the field and the server refuses to save it
 * (nothing is half-saved). Whether it fits depends on each candidate's diameter, so the refusal
 * comes from the library's evaluation (ElectricalInputError naming `conditions.installation.…`),
 * mapped here to the sheet's own field path. Pure TypeScript (browser and server).
 */
import type { CandidateEvaluation } from '../electrical/sizing/types';

export interface ArrangementRefusal {
  /** The sheet field to blame, as the form names it ('installation.circuitSpacingM', 'installation.otherCircuits.0.currentA'). */
  field: string;
  /** The field as the library named it. */
  libraryField: string;
  /** The library's reason, without the field prefix. */
  message: string;
  /** The candidate whose cables do not fit (null when the conditions themselves were refused). */
  candidateLabel: string | null;
}

/** Fields that say a candidate does not suit the installation kind: shown in the grid, not refused. */
const KIND_FIELDS = new Set(['conditions.installation.kind', 'conditions.installation.inside']);

/** The library's protection fields (lib/electrical/sizing/types ProtectionConditions) → the sheet's (lib/sheet/systemSchema.ts). */
function protectionFieldOf(rest: string): string {
  const dotted = rest.replace(/\[(\d+)\]/g, '.$1');
  const renamed: Record<string, string> = {
    'source.resistanceOhm': 'sourceResistanceOhm',
    'source.reactanceOhm': 'sourceReactanceOhm',
    'source.impedanceOhm': 'sourceImpedanceOhm',
    source: 'sourceBy',
    systemEarthing: 'earthing',
    circuit: 'circuitRole',
    deviceSeriesA: 'device.settingStepsA',
  };
  return `protection.${renamed[dotted] ?? dotted}`;
}

/**
 * The library's `conditions.installation.otherCircuits[2].cable.lossWPerM` → the sheet's
 * `installation.otherCircuits.2.lossWPerM`; the bus-bar system's `conditions.installation.system.…`
 * → `busbarSystem.…`, the protection's `conditions.protection.…` → `protection.…` (sheet version 6).
 */
export function sheetFieldOf(libraryField: string): string | null {
  const system = /^conditions\.installation\.system\.(.+)$/.exec(libraryField);
  if (system) return `busbarSystem.${system[1]}`;
  const protection = /^conditions\.protection\.(.+)$/.exec(libraryField);
  if (protection) return protectionFieldOf(protection[1]);
  if (libraryField === 'conditions.thirdHarmonicPercent') return 'harmonics.thirdHarmonicPercent';
  if (!libraryField.startsWith('conditions.installation')) return null;
  return libraryField
    .replace(/^conditions\./, '')
    .replace(/\[(\d+)\]/g, '.$1')
    .replace(/(otherCircuits\.\d+)\.cable\./, '$1.')
    .replace(/^installation\.inside$/, 'installation.enclosureInside')
    .replace(/^installation\.deratingFactor$/, 'installation.enclosureDerating');
}

/** The reason without the leading "field: " the library's messages carry. */
export function plainMessage(message: string, libraryField: string): string {
  return message.startsWith(`${libraryField}: `) ? message.slice(libraryField.length + 2) : message;
}

/** The first refusal of the arrangement among a computation's results, or null when it fits every candidate. */
export function arrangementRefusalOf(
  evaluations: readonly CandidateEvaluation[],
  conditionsError: { message: string; field?: string } | null = null,
): ArrangementRefusal | null {
  if (conditionsError?.field) {
    const field = sheetFieldOf(conditionsError.field);
    if (field && !KIND_FIELDS.has(conditionsError.field)) {
      return { field, libraryField: conditionsError.field, message: plainMessage(conditionsError.message, conditionsError.field), candidateLabel: null };
    }
  }
  for (const e of evaluations) {
    if (e.ok || !e.error.field || KIND_FIELDS.has(e.error.field)) continue;
    const field = sheetFieldOf(e.error.field);
    if (field) return { field, libraryField: e.error.field, message: plainMessage(e.error.message, e.error.field), candidateLabel: e.label };
  }
  return null;
}

/** What was refused, in a few words: the cables' arrangement, the bus-bar system, or the protection data (sheet version 6). */
export function refusalSubject(r: ArrangementRefusal): string {
  if (r.field.startsWith('busbarSystem.')) return 'the bus-bar system does not fit as entered';
  if (r.field.startsWith('protection.') || r.field.startsWith('harmonics.')) return 'the protection data are refused';
  return 'the cables do not lie as entered';
}

/** "Circuit 1 and circuit 2 overlap: … (with 240 mm² Cu XLPE)". */
export function refusalSentence(r: ArrangementRefusal): string {
  return `${r.message}${r.candidateLabel ? ` (with ${r.candidateLabel})` : ''}`;
}

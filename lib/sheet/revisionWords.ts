/**
 * The parts of a sheet's inputs in plain words, for the history ("saved version 4 (circuit,
 * candidates)") and the calculation package's revision table (what changed between revisions).
 * The keys are those of SheetInputs (lib/sheet/schema.ts); a key this version does not know is
 * spelled out rather than shown as it is stored.
 */
const SECTION_WORDS: Readonly<Record<string, string>> = Object.freeze({
  schemaVersion: 'input format',
  circuit: 'circuit',
  fault: 'fault',
  environment: 'environment',
  installation: 'installation',
  limits: 'temperature limits',
  economics: 'economics',
  overTime: 'check over time',
  alongRun: 'check along the run',
  enclosureAir: 'enclosure air check',
  busbarSystem: 'bus-bar system',
  protection: 'protection',
  harmonics: 'harmonics',
  crossSection: 'cross-section in two dimensions',
  candidates: 'candidates',
  chosenCandidateId: 'chosen candidate',
  notes: "designer's notes",
});

export function sectionWords(key: string): string {
  return SECTION_WORDS[key] ?? key.replace(/([a-z])([A-Z])/g, '$1 $2').replace(/_+/g, ' ').toLowerCase();
}

/** Which parts of the inputs differ between two revisions (top-level keys compared as JSON). */
export function changedInputSections(before: Record<string, unknown>, after: Record<string, unknown>): string[] {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].filter((k) => k !== 'schemaVersion');
  return keys.filter((key) => JSON.stringify(before[key]) !== JSON.stringify(after[key]));
}

/**
 * Flag codes in plain words (issue 22, "plain words instead of internal codes"). Codes stay in the
 * API, the stored snapshot and the audit data — they are stable keys — but every surface a person
 * reads (the sheet, review messages, the history, the PDF, the share page) shows the flag's title
 * from here instead. Pure: the same words in the browser and on the server.
 */
import { FLAG_REGISTRY } from '../electrical/sizing/flags';

/**
 * Readiness codes that are not assumption flags (lib/sheet/snapshot approvalReadiness) and the
 * field solver's own codes (lib/thermal/crossSection), which the flag registry does not hold.
 */
const OTHER_TITLES: Readonly<Record<string, string>> = Object.freeze({
  CONDITIONS_INVALID: 'The circuit could not be computed from the saved inputs',
  CHOSEN_CANDIDATE_MISSING: 'The chosen candidate is no longer on the sheet',
  EVALUATION_FAILED: 'The chosen candidate could not be evaluated',
  OPTIONAL_CHECK_NOT_COMPUTED: 'An optional check switched on could not be computed',
  CANDIDATE_FAILS: 'The chosen candidate does not pass',
  CROSS_SECTION_SHALLOW_CIRCLE: 'Cable shallow for its size in the two-dimensional field',
  CROSS_SECTION_DUCT_CONSTANTS_FROM_MEMORY: 'Duct-air constants from memory',
  CROSS_SECTION_SIDE_BOUNDARY: 'Side walls of the field may be too close',
});

/**
 * The title of a flag or readiness code. A code unknown to this version (a sheet written by a
 * later one) is still never shown raw: its words are spelled out in sentence case.
 */
export function flagTitle(code: string): string {
  const known = (FLAG_REGISTRY as Readonly<Record<string, { title: string } | undefined>>)[code]?.title ?? OTHER_TITLES[code];
  if (known) return known;
  const words = code.toLowerCase().replace(/_+/g, ' ').trim();
  return words ? words.charAt(0).toUpperCase() + words.slice(1) : 'An assumption flag';
}

/** Several codes as one list for a sentence: "Ambient temperature assumed; Margin under 10 %". */
export function flagTitleList(codes: readonly string[]): string {
  return codes.map(flagTitle).join('; ');
}

/** The severity in the words a reviewer reads beside a flag. */
export const SEVERITY_WORDS: Readonly<Record<'note' | 'review' | 'blocker', string>> = Object.freeze({
  note: 'note',
  review: 'for review',
  blocker: 'blocker',
});

/** A flag on one line: "Joint resistance assumed (for review): the joints …". */
export function flagLine(flag: { code: string; severity: 'note' | 'review' | 'blocker'; message: string; title?: string }): string {
  return `${flag.title ?? flagTitle(flag.code)} (${SEVERITY_WORDS[flag.severity]}): ${flag.message}`;
}

/** Internal codes as they must never reach a person: upper-case words joined by underscores. */
export const INTERNAL_CODE_PATTERN = /\b[A-Z][A-Z0-9]+_[A-Z0-9_]{2,}\b/g;

/** Names of this repository's design files, which a person reading a result has no access to. */
export const REPOSITORY_FILE_PATTERN = /physics\.md|references\.md|product\.md|stack\.md/g;

/**
 * A source as stored by an earlier version (catalogue rows copied from the standard data, saved
 * method lines) may still name a design file of this repository; a person reads the published
 * document or "from memory" instead, so those mentions are taken out of the text shown.
 */
export function plainSource(text: string): string {
  return text
    .replace(/\(from memory[,;] (?:as listed in|not in) references\.md\)/g, '(from memory)')
    .replace(/\s*\(?physics\.md §[0-9–-]+(?: and §[0-9]+)?\)?[:;,]?/g, '')
    .replace(/[;,]?\s*\(?references\.md\)?[:;,]?/g, '')
    .replace(/\(\s*\)/g, '')
    .replace(/\(\s+/g, '(')
    .replace(/ {2,}/g, ' ')
    .replace(/\s+([.,;)])/g, '$1')
    .trim();
}

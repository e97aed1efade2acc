// Issue 22, "plain words instead of internal codes": a flag's code becomes its title for every
// person-facing surface; review messages name titles, never codes; a stored source that names a
// design file of this repository reads as the published document or "from memory".
import { describe, expect, it } from 'vitest';
import { FLAG_CODES, FLAG_REGISTRY, RETIRED_FLAG_CODES } from '@/lib/electrical/sizing/flags';
import { flagLine, flagTitle, flagTitleList, INTERNAL_CODE_PATTERN, plainSource, REPOSITORY_FILE_PATTERN } from '@/lib/sheet/flagWords';
import { decide } from '@/lib/sheet/stateMachine';
import { METHOD_LINES } from '@/lib/sheet/sheetTables';
import { IEC_60228_COPPER } from '@/lib/catalogue/standardData';
import { verificationCases } from '@/lib/verification';

const hasCode = (text: string) => new RegExp(INTERNAL_CODE_PATTERN.source).test(text);
const hasFile = (text: string) => new RegExp(REPOSITORY_FILE_PATTERN.source).test(text);

describe('flag titles instead of codes', () => {
  it('every flag code, current and retired, has a title from the registry that is not a code', () => {
    for (const code of [...FLAG_CODES, ...RETIRED_FLAG_CODES]) {
      expect(flagTitle(code)).toBe(FLAG_REGISTRY[code].title);
      expect(hasCode(flagTitle(code)), code).toBe(false);
    }
  });

  it('readiness codes and the field solver codes read as sentences', () => {
    for (const code of ['CONDITIONS_INVALID', 'CHOSEN_CANDIDATE_MISSING', 'EVALUATION_FAILED', 'OPTIONAL_CHECK_NOT_COMPUTED', 'CANDIDATE_FAILS', 'CROSS_SECTION_SIDE_BOUNDARY', 'CROSS_SECTION_SHALLOW_CIRCLE', 'CROSS_SECTION_DUCT_CONSTANTS_FROM_MEMORY']) {
      expect(hasCode(flagTitle(code)), code).toBe(false);
      expect(flagTitle(code).length).toBeGreaterThan(8);
    }
  });

  it('a code this version does not know is spelled out, not shown raw', () => {
    expect(flagTitle('SOME_FUTURE_FLAG')).toBe('Some future flag');
    expect(flagTitleList(['OVER_LIMIT', 'AMBIENT_ASSUMED'])).toBe('Hot spot above the temperature limit; Ambient temperature assumed');
    expect(flagLine({ code: 'JOINT_RESISTANCE_ASSUMED', severity: 'review', message: 'the joint at 3 m has no resistance entered' })).toBe(
      'Joint resistance assumed (for review): the joint at 3 m has no resistance entered',
    );
  });

  it('the approval refusals name the flags by title', () => {
    const sheet = { status: 'in_review' as const, authorId: 'a' };
    const reviewer = { userId: 'r', can: () => true };
    const blocked = decide('approve', sheet, reviewer, { hasChosenCandidate: true, blockerCodes: ['OVER_LIMIT'], unacknowledgedReviewCodes: [] });
    const notReady = decide('approve', sheet, reviewer, { hasChosenCandidate: true, blockerCodes: [], unacknowledgedReviewCodes: ['AC_FACTOR_LOWER_BOUND', 'DATA_FROM_MEMORY'] });
    expect(blocked.allowed ? '' : blocked.reason).toBe('A blocker prevents approval: Hot spot above the temperature limit.');
    expect(notReady.allowed ? '' : notReady.reason).toBe('Acknowledge every review flag first: AC resistance factor is a lower bound; Data entered from memory.');
  });
});

describe('sources named by the published document', () => {
  it('no flag basis, method line, catalogue source or verification citation names a repository file', () => {
    for (const [code, def] of Object.entries(FLAG_REGISTRY)) expect(hasFile(def.basis), `${code}: ${def.basis}`).toBe(false);
    for (const line of METHOD_LINES) expect(hasFile(line), line).toBe(false);
    for (const [, , source] of IEC_60228_COPPER) expect(hasFile(source), source).toBe(false);
    for (const c of verificationCases) expect(hasFile(JSON.stringify(c)), c.id).toBe(false);
  });

  it('a source stored by an earlier version reads without the file names', () => {
    expect(plainSource('IEC 60228 Table 2, class 2, maximum at 20 °C (from memory, as listed in references.md)')).toBe('IEC 60228 Table 2, class 2, maximum at 20 °C (from memory)');
    expect(plainSource('IEC 60228 Table 2, class 2, maximum at 20 °C (from memory; not in references.md)')).toBe('IEC 60228 Table 2, class 2, maximum at 20 °C (from memory)');
    expect(plainSource('Wall heat transfer with the IEC TR 60890 surface factors (physics.md §6).')).toBe('Wall heat transfer with the IEC TR 60890 surface factors.');
    expect(hasFile(plainSource('physics.md §5; references.md'))).toBe(false);
  });
});

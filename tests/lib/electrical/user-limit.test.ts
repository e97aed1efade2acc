// Issue 22: a user limit that replaces the insulation rating needs a written justification, shown
// to the reviewer; without it the result is blocked. The rule is the product's (physics.md §5:
// a rating above the material's needs the maker's evidence); XLPE's 90 °C continuous rating is
// IEC 60502-1 / IEC 60287-1-1 common practice.
import { describe, expect, it } from 'vitest';
import { evaluateCandidate } from '@/lib/electrical';
import { cableConditions, xlpeCable } from './fixtures';

const codes = (e: ReturnType<typeof evaluateCandidate>) => (e.ok ? e.flags.map((f) => f.code) : []);

describe('a limit raised above the material rating', () => {
  it('without a justification: a blocker naming what is missing, and the candidate does not pass', () => {
    const e = evaluateCandidate(xlpeCable(95), cableConditions({ temperatureLimitC: 105, raiseMaterialLimit: true }));
    expect(codes(e)).toEqual(expect.arrayContaining(['USER_LIMIT_ABOVE_RATING', 'USER_LIMIT_NOT_JUSTIFIED']));
    expect(e.ok && e.passes).toBe(false);
    expect(e.ok && e.flags.find((f) => f.code === 'USER_LIMIT_NOT_JUSTIFIED')!.message).toMatch(/105 °C replaces a 90 °C material rating without a written justification/);
  });

  it('with one: the review flag quotes it for the reviewer, no blocker; blank text counts as none', () => {
    const why = 'Maker’s type test report TR-17 rates this insulation at 105 °C continuous';
    const e = evaluateCandidate(xlpeCable(95), cableConditions({ temperatureLimitC: 105, raiseMaterialLimit: true, userLimitJustification: `  ${why} ` }));
    expect(codes(e)).toContain('USER_LIMIT_ABOVE_RATING');
    expect(codes(e)).not.toContain('USER_LIMIT_NOT_JUSTIFIED');
    expect(e.ok && e.flags.find((f) => f.code === 'USER_LIMIT_ABOVE_RATING')!.message).toContain(`“${why}”`);
    const blank = evaluateCandidate(xlpeCable(95), cableConditions({ temperatureLimitC: 105, raiseMaterialLimit: true, userLimitJustification: '   ' }));
    expect(codes(blank)).toContain('USER_LIMIT_NOT_JUSTIFIED');
  });

  it('a limit below the rating needs no justification (it only makes the sizing stricter)', () => {
    const e = evaluateCandidate(xlpeCable(95), cableConditions({ temperatureLimitC: 80, raiseMaterialLimit: true }));
    expect(codes(e)).not.toContain('USER_LIMIT_NOT_JUSTIFIED');
    expect(codes(e)).not.toContain('USER_LIMIT_ABOVE_RATING');
  });
});

import { describe, expect, it } from 'vitest';
import { candidateGridColumnsSchema, readUserPreferences } from '@/lib/user/preferences';

describe('user preferences (users.preferences)', () => {
  it('a column choice maps short column ids to shown or hidden', () => {
    expect(candidateGridColumnsSchema.parse({ mass: false, lifeCycleCost: true })).toEqual({ mass: false, lifeCycleCost: true });
  });

  it('refuses column ids that are not short words, values that are not booleans, and more than 60 columns', () => {
    expect(candidateGridColumnsSchema.safeParse({ 'mass; drop table': false }).success).toBe(false);
    expect(candidateGridColumnsSchema.safeParse({ mass: 'no' }).success).toBe(false);
    expect(candidateGridColumnsSchema.safeParse(Object.fromEntries(Array.from({ length: 61 }, (_, i) => [`c${i}`, true]))).success).toBe(false);
  });

  it('reads a stored value leniently: what no longer fits counts as no choice', () => {
    expect(readUserPreferences(null)).toEqual({});
    expect(readUserPreferences({ candidateGridColumns: { mass: 3 } })).toEqual({});
    expect(readUserPreferences({ candidateGridColumns: { mass: false } })).toEqual({ candidateGridColumns: { mass: false } });
  });
});

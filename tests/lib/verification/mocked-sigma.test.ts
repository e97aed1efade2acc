/**
 * The same broken-formula check as registry.test.ts, but through the module system instead of
 * the case's library parameter: the thermal library's Stefan–Boltzmann constant is replaced by
 * the rounded 5.67e-8 for everything in this file, solver included. The radiation cases compare
 * against σ = 5.670374419e-8 (CODATA 2018), so they must fail; cases without radiation must not.
 */
import { describe, expect, it, vi } from 'vitest';

vi.mock('@/lib/thermal/constants', async (importOriginal) => {
  const original = await importOriginal<typeof import('@/lib/thermal/constants')>();
  return { ...original, STEFAN_BOLTZMANN: 5.67e-8 };
});

const { getCase, runCase } = await import('@/lib/verification');

describe('with σ rounded to 5.67e-8 inside lib/thermal', () => {
  it('the radiation cases fail, the heat balance with radiation included', () => {
    for (const id of ['radiation-coefficient', 'radiative-flux', 'radiating-plate-solver']) {
      expect(runCase(getCase(id)!).pass, id).toBe(false);
    }
  });

  it('cases that involve no radiation still pass', () => {
    for (const id of ['plane-wall-generation', 'churchill-chu-horizontal-cylinder', 'joule-core-temperature']) {
      expect(runCase(getCase(id)!).pass, id).toBe(true);
    }
  });
});

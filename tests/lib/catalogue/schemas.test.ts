// Row schemas: what a grid edit or an import row may hold, with the field named in each error.
import { describe, expect, it } from 'vitest';
import { buildRowSchema, conductorRowSchema, coveringRowSchema, materialRowSchema } from '@/lib/catalogue';
import { STANDARD_BUILDS, STANDARD_CONDUCTORS, STANDARD_COVERINGS, STANDARD_MATERIALS } from '@/lib/catalogue/standardData';

const issuesOf = (result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[]; message: string }> } }) =>
  (result.error?.issues ?? []).map((i) => `${i.path.join('.')}: ${i.message}`);

describe('decimals', () => {
  it('keeps exact decimal strings, accepts exponents and numbers', () => {
    const row = materialRowSchema.parse({ ...STANDARD_MATERIALS[0], rho20OhmM: '1.7241e-8', densityKgPerM3: 8890 });
    expect(row.rho20OhmM).toBe('0.000000017241');
    expect(row.densityKgPerM3).toBe('8890');
  });
  it('names the field and what is wrong', () => {
    const result = materialRowSchema.safeParse({ ...STANDARD_MATERIALS[0], alpha20PerK: 'abc', densityKgPerM3: '-1', electricalSource: ' ' });
    expect(issuesOf(result)).toEqual([
      'alpha20PerK: must be a number (got "abc")',
      'electricalSource: is required: say where the value comes from (standard and table, datasheet, handbook, or \'from memory\')',
      'densityKgPerM3: must be greater than 0 and at most 25000 (got -1)',
    ]);
  });
  it('an optional decimal may be empty', () => {
    expect(materialRowSchema.parse({ ...STANDARD_MATERIALS[0], pricePerKg: '' }).pricePerKg).toBeNull();
  });
});

describe('cross-field rules', () => {
  const round = STANDARD_CONDUCTORS.find((c) => c.key === 'cu-240')!;
  const bar = STANDARD_CONDUCTORS.find((c) => c.key === 'cu-bar-100x10')!;
  it('a round conductor needs a diameter; a bar needs width ≥ thickness and size system "bar"', () => {
    expect(issuesOf(conductorRowSchema.safeParse({ ...round, diameterMm: '' }))).toEqual(['diameterMm: is required for a round conductor']);
    expect(issuesOf(conductorRowSchema.safeParse({ ...bar, widthMm: '5', sizeSystem: 'metric' }))).toEqual([
      "sizeSystem: must be 'bar' for a rectangular conductor",
      'thicknessMm: must not exceed the width (give the longer side as the width)',
    ]);
  });
  it('a covering short-circuit limit is not below its continuous limit; emissivity is within (0, 1]', () => {
    const pvc = STANDARD_COVERINGS[0];
    expect(issuesOf(coveringRowSchema.safeParse({ ...pvc, shortCircuitLimitC: '60', emissivity: '1.2' }))).toEqual([
      'emissivity: must be greater than 0 and at most 1 (got 1.2)',
    ]);
    expect(issuesOf(coveringRowSchema.safeParse({ ...pvc, shortCircuitLimitC: '60' }))).toEqual(['shortCircuitLimitC: must not be below the continuous limit']);
  });
  it('build layers run from the conductor outwards without gaps, each with thickness and source', () => {
    const build = STANDARD_BUILDS[0];
    expect(issuesOf(buildRowSchema.safeParse({ ...build, layer2CoveringKey: '', layer2ThicknessMm: null, layer2Source: '', layer3CoveringKey: 'pvc-sheath', layer3ThicknessMm: '1.4', layer3Source: 'x' }))).toEqual([
      'layer3CoveringKey: layer 3 follows an empty layer 2: list layers from the conductor outwards without gaps',
    ]);
    expect(issuesOf(buildRowSchema.safeParse({ ...build, layer1ThicknessMm: '' }))).toEqual(['layer1ThicknessMm: is required for each layer']);
    expect(issuesOf(buildRowSchema.safeParse({ ...build, cores: '2.5' }))).toEqual(['cores: must be a whole number from 1 to 5']);
  });
});

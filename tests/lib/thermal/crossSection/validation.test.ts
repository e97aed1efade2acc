/**
 * Bad input is refused with the field named (ThermalInputError, lib/thermal/errors.ts); never a
 * NaN deep inside a solve.
 */
import { describe, expect, it } from 'vitest';
import { ThermalInputError } from '@/lib/thermal/errors';
import { crossSectionAmpacity, solveCrossSection, type CrossSectionInput } from '@/lib/thermal/crossSection';
import { CABLE_D, exampleCable, uniformGround } from './helpers';

function refusedField(input: unknown): string {
  try {
    solveCrossSection(input);
  } catch (error) {
    if (error instanceof ThermalInputError) return error.field;
    throw error;
  }
  throw new Error('the input was accepted');
}

const base = (): CrossSectionInput => uniformGround(1, [exampleCable(0, 1, 300), exampleCable(CABLE_D, 1, 300)]);

describe('bad input is refused with the field named', () => {
  it('overlapping cables (touching is allowed)', () => {
    const input = base();
    input.cables[1].xM = 0.9 * CABLE_D;
    expect(refusedField(input)).toBe('cables[1]');
    expect(solveCrossSection(base()).converged).toBe(true);
  });

  it('a cable above the ground surface, below the domain or outside its sides', () => {
    const above = base();
    above.cables[0].depthM = CABLE_D / 2;
    expect(refusedField(above)).toBe('cables[0].depthM');
    const below = base();
    below.cables[0].depthM = 49.99;
    expect(refusedField(below)).toBe('cables[0].depthM');
    const outside = base();
    outside.cables[1].xM = 50;
    expect(refusedField(outside)).toBe('cables[1].xM');
  });

  it('a duct that pokes above the ground counts its own diameter', () => {
    const input = base();
    input.cables = [exampleCable(0, 0.05, 300, { duct: { innerDiameterM: 0.1, outerDiameterM: 0.11, wallThermalResistivityKmPerW: 3.5, air: 'plastic' } })];
    expect(refusedField(input)).toBe('cables[0].depthM');
  });

  it('a region with zero or negative resistivity, or outside the domain', () => {
    for (const rho of [0, -1]) {
      const input = base();
      input.regions = [{ depthTopM: 0, depthBottomM: 0.5, thermalResistivityKmPerW: rho }];
      expect(refusedField(input)).toBe('regions[0].thermalResistivityKmPerW');
    }
    const outside = base();
    outside.regions = [{ depthTopM: 0.2, depthBottomM: 60, thermalResistivityKmPerW: 1 }];
    expect(refusedField(outside)).toBe('regions[0].depthBottomM');
    expect(refusedField({ ...base(), soil: { thermalResistivityKmPerW: 0 } })).toBe('soil.thermalResistivityKmPerW');
  });

  it('NaN or a missing number anywhere', () => {
    const nanCurrent = base();
    nanCurrent.cables[0].conductor.currentA = Number.NaN;
    expect(refusedField(nanCurrent)).toBe('cables[0].conductor.currentA');
    const nanCovering = base();
    nanCovering.cables[1].coverings[0].thermalResistivityKmPerW = Number.NaN;
    expect(refusedField(nanCovering)).toBe('cables[1].coverings[0].thermalResistivityKmPerW');
    expect(refusedField({ ...base(), domain: { widthM: Number.NaN, depthM: 50 } })).toBe('domain.widthM');
    expect(refusedField({ ...base(), deepGroundTemperatureC: undefined })).toBe('deepGroundTemperatureC');
  });

  it('a cable whose stated outer diameter is not its last covering’s, a covering smaller than what it covers', () => {
    const mismatch = base();
    mismatch.cables[0].outerDiameterM = 0.04;
    expect(refusedField(mismatch)).toBe('cables[0].outerDiameterM');
    const shrinking = base();
    shrinking.cables[0].coverings[1].outerDiameterM = 0.025;
    expect(refusedField(shrinking)).toBe('cables[0].coverings[1].outerDiameterM');
  });

  it('a heat source inside a cable, a negative source, a surface coefficient of zero', () => {
    const inside = base();
    inside.heatSources = [{ kind: 'line', xM: 0.001, depthM: 1, wattsPerM: 5 }];
    expect(refusedField(inside)).toBe('heatSources[0].xM');
    const negative = base();
    negative.heatSources = [{ kind: 'line', xM: 2, depthM: 1, wattsPerM: -5 }];
    expect(refusedField(negative)).toBe('heatSources[0].wattsPerM');
    const overlapping = base();
    overlapping.heatSources = [{ kind: 'rectangle', xMinM: -0.1, xMaxM: 0.1, depthTopM: 0.9, depthBottomM: 1.1, wattsPerM: 5 }];
    expect(refusedField(overlapping)).toBe('heatSources[0]');
    expect(refusedField({ ...base(), surface: { kind: 'convective', airTemperatureC: 20, heatTransferCoefficientWPerM2K: 0 } })).toBe('surface.heatTransferCoefficientWPerM2K');
  });

  it('an ampacity search over a cable without a temperature limit', () => {
    const input = base();
    delete input.cables[1].maxConductorTemperatureC;
    expect(() => crossSectionAmpacity(input)).toThrow(ThermalInputError);
    try {
      crossSectionAmpacity(input);
    } catch (error) {
      expect((error as ThermalInputError).field).toBe('cables[1].maxConductorTemperatureC');
    }
  });
});

/**
 * The product functions the verification cases call, gathered in one object so that a test can
 * hand a case a library with one function swapped for a broken formula (dependency injection)
 * and see exactly that case fail. The page and vitest pass `productLibrary`: the real thing.
 */
import {
  airProperties,
  buriedExternalThermalResistance,
  churchillChuHorizontalCylinder,
  churchillChuVerticalPlate,
  evaluateConvection,
  iecFreeAirSurfaceRise,
  insulationThermalResistance,
  radiationCoefficient,
  radiativeFlux,
  solveSteady,
  solveTridiagonal,
  STEFAN_BOLTZMANN,
} from '../thermal';
import {
  adiabaticK,
  ampacity,
  CONDUCTOR_MATERIALS,
  minimumSection,
  resistanceAt,
  shortCircuitFinalTemperature,
  skinEffectFactor,
  voltageDrop,
} from '../electrical';
// Plain data (decimal strings and their sources), importable without the database: the rows the
// seed step copies into every team's catalogue.
import { STANDARD_CONDUCTORS, STANDARD_MATERIALS } from '../catalogue/standardData';

export const productLibrary = {
  // lib/thermal
  solveSteady,
  solveTridiagonal,
  churchillChuHorizontalCylinder,
  churchillChuVerticalPlate,
  evaluateConvection,
  airProperties,
  radiationCoefficient,
  radiativeFlux,
  stefanBoltzmann: STEFAN_BOLTZMANN,
  iecFreeAirSurfaceRise,
  insulationThermalResistance,
  buriedExternalThermalResistance,
  // lib/electrical
  resistanceAt,
  skinEffectFactor,
  conductorMaterials: CONDUCTOR_MATERIALS,
  adiabaticK,
  shortCircuitFinalTemperature,
  minimumSection,
  voltageDrop,
  ampacity,
  // the seeded standard catalogue
  catalogueConductors: STANDARD_CONDUCTORS as ReadonlyArray<{ key: string; materialKey: string; shape: string; sizeSystem: string; sectionMm2: string; r20OhmPerKm: string; resistanceSource: string }>,
  catalogueMaterials: STANDARD_MATERIALS as ReadonlyArray<{ key: string; rho20OhmM: string; alpha20PerK: string; electricalSource: string }>,
};

export type ProductLibrary = typeof productLibrary;

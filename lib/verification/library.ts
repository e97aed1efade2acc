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
};

export type ProductLibrary = typeof productLibrary;

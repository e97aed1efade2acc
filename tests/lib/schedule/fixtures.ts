/**
 * Inputs of the schedule unit tests (not check values). Cable data as in
 * tests/lib/electrical: IEC 60228 class 2 copper R20 (from memory, references.md), conductor
 * diameter ≈ 1.2·√S mm and 1.7 mm XLPE / 1.8 mm PVC (typical 0.6/1 kV, common practice), XLPE
 * ρ_T 3.5 and PVC 5.0 K·m/W (IEC 60287-2-1 Table 1, from memory), XLPE 90/250 °C (common practice).
 */
import type { CableCandidate } from '@/lib/electrical';
import type { ScheduleRow } from '@/lib/schedule';

export const IEC60228_CU_OHM_PER_KM: Record<number, number> = { 16: 1.15, 25: 0.727, 35: 0.524, 50: 0.387, 70: 0.268, 95: 0.193 };

export function copperXlpe(sectionMm2: number): CableCandidate {
  return {
    kind: 'cable',
    id: `cu-xlpe-${sectionMm2}`,
    label: `${sectionMm2} mm² copper XLPE/PVC single-core`,
    material: 'copper',
    sectionMm2,
    r20OhmPerM: IEC60228_CU_OHM_PER_KM[sectionMm2] * 1e-3,
    conductorDiameterM: 1.2e-3 * Math.sqrt(sectionMm2),
    cores: 1,
    parallel: 1,
    layers: [
      { name: 'XLPE insulation', role: 'insulation', thicknessM: 1.7e-3, thermalResistivityKmPerW: 3.5, continuousLimitC: 90, shortCircuitLimitC: 250 },
      { name: 'PVC sheath', role: 'sheath', thicknessM: 1.8e-3, thermalResistivityKmPerW: 5.0 },
    ],
    emissivity: 0.9,
  };
}

export const SMALL_FAMILY = [16, 25, 35, 50, 70, 95].map(copperXlpe);

export function row(overrides: Partial<ScheduleRow> = {}): ScheduleRow {
  return {
    rowNumber: 2,
    circuitTag: 'T-1',
    from: 'MSB',
    to: 'Load',
    designCurrentA: 100,
    nominalVoltageV: 230,
    phases: 3,
    frequencyHz: 50,
    lengthM: 40,
    powerFactor: 0.9,
    installation: 'cable-in-air',
    depthM: null,
    ambientC: 30,
    faultCurrentKA: null,
    clearingTimeS: null,
    family: 'copper xlpe single-core',
    maxVoltageDropPercent: null,
    maxParallel: 1,
    groupingFactor: null,
    temperatureLimitC: null,
    ...overrides,
  };
}

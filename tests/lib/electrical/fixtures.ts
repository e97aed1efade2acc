/**
 * Shared test inputs. These are INPUTS, not check values. Where a number comes from a standard
 * it says which (and "from memory" when recalled); geometry of a typical cable is common practice.
 */
import type { BarCandidate, CableCandidate, Conditions } from '@/lib/electrical';

/** IEC 60228 Table 2, class 2 plain copper, max Ω/km at 20 °C (from memory — references.md). */
export const IEC60228_CU_OHM_PER_KM: Record<number, number> = {
  16: 1.15, 25: 0.727, 35: 0.524, 50: 0.387, 70: 0.268, 95: 0.193, 120: 0.153,
  150: 0.124, 185: 0.0991, 240: 0.0754, 300: 0.0601,
};

/**
 * Single-core copper XLPE cable with a PVC sheath. Conductor diameter ≈ 1.2·√S mm (round
 * stranded compacted, common practice), insulation 1.7 mm / sheath 1.8 mm (typical 0.6/1 kV,
 * common practice); XLPE ρ_T = 3.5, PVC 5.0 K·m/W (IEC 60287-2-1 Table 1, from memory);
 * XLPE 90 °C continuous / 250 °C short circuit (common practice, references.md).
 */
export function xlpeCable(sectionMm2: number, extra: Partial<CableCandidate> = {}): CableCandidate {
  const r20 = IEC60228_CU_OHM_PER_KM[sectionMm2];
  if (r20 === undefined) throw new Error(`no IEC 60228 value for ${sectionMm2} mm² in the fixture`);
  return {
    kind: 'cable',
    id: `cu-xlpe-${sectionMm2}`,
    label: `Cu/XLPE/PVC 1×${sectionMm2} mm²`,
    material: 'copper',
    sectionMm2,
    r20OhmPerM: r20 * 1e-3,
    conductorDiameterM: 1.2e-3 * Math.sqrt(sectionMm2),
    layers: [
      { name: 'XLPE insulation', role: 'insulation', thicknessM: 1.7e-3, thermalResistivityKmPerW: 3.5, continuousLimitC: 90, shortCircuitLimitC: 250 },
      { name: 'PVC sheath', role: 'sheath', thicknessM: 1.8e-3, thermalResistivityKmPerW: 5.0 },
    ],
    emissivity: 0.9,
    ...extra,
  };
}

/** A bare copper bar; R20 from the IEC 60287-1-1 resistivity over the nominal area. */
export function copperBar(widthM: number, thicknessM: number, extra: Partial<BarCandidate> = {}): BarCandidate {
  return {
    kind: 'bar',
    id: `cu-bar-${widthM * 1000}x${thicknessM * 1000}`,
    material: 'copper',
    widthM,
    thicknessM,
    r20OhmPerM: 1.7241e-8 / (widthM * thicknessM),
    emissivity: 0.4,
    terminalLimitC: 105,
    shortCircuitLimitC: 200,
    ...extra,
  };
}

/** Cable circuit in free air, every input stated (so no "assumed" flags). */
export function cableConditions(extra: Partial<Conditions> = {}): Conditions {
  return {
    designCurrentA: 250,
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 60,
    powerFactor: 0.9,
    reactanceOhmPerM: 0.08e-3,
    ambientC: 30,
    installation: { kind: 'cable-in-air', formation: 'flat', spacingM: 0.1 },
    fault: { currentA: 10_000, durationS: 0.2 },
    ...extra,
  };
}

export function barConditions(extra: Partial<Conditions> = {}): Conditions {
  return {
    designCurrentA: 1000,
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 20,
    powerFactor: 0.9,
    reactanceOhmPerM: 0.15e-3,
    ambientC: 40,
    installation: { kind: 'bar-on-edge' },
    fault: { currentA: 30_000, durationS: 0.5 },
    ...extra,
  };
}

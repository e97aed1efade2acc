/**
 * Example request bodies for the documentation page, the OpenAPI document and the tests. They are
 * INPUTS (a plausible invented circuit), not check values. Sources of the numbers:
 * - R20 of 95 and 120 mm² class 2 copper: IEC 60228 Table 2 maxima, 0.193 and 0.153 Ω/km (from memory);
 * - conductor diameter ≈ 1.2·√S mm, 1.7 mm XLPE and 1.8 mm PVC for 0.6/1 kV (common practice);
 * - ρ_T of XLPE 3.5 and PVC 5.0 K·m/W: IEC 60287-2-1 Table 1 (from memory);
 * - XLPE 90 °C continuous, 250 °C short circuit (common practice);
 * - copper bar R20 from ρ20 = 1.7241e-8 Ω·m (IEC 60287-1-1 Table 1) over the nominal area;
 * - R20 of 185 and 240 mm²: IEC 60228 Table 2 maxima, 0.0991 and 0.0754 Ω/km (from memory);
 * - soil 1.2 K·m/W and 20 °C ground: plausible site values (inputs, not references);
 * - the bus-bar system: 200 mm between phase centres and supports every 400 mm are plausible for
 *   an LV switchboard riser, R/X 0.15 near a distribution transformer, a 50 kA fault (inputs, not
 *   references); R_p0.2 250 N/mm² for a hard-drawn copper bar (common practice, from memory);
 * - the breaker: an invented IEC 60947-2 air circuit-breaker of 3200 A set to 2500 A, I_i = 10·I_r,
 *   and a source of 1.6 + j6.4 mΩ (about a 1600 kVA transformer at 400 V, common practice).
 */
import type { AmpacityRequest, EvaluateRequest } from './schemas';

function xlpeCable(sectionMm2: number, r20OhmPerKm: number) {
  return {
    kind: 'cable' as const,
    id: `cu-xlpe-${sectionMm2}`,
    label: `Cu/XLPE/PVC 1×${sectionMm2} mm²`,
    material: 'copper' as const,
    sectionMm2,
    r20OhmPerM: r20OhmPerKm / 1000,
    conductorDiameterM: Number((1.2e-3 * Math.sqrt(sectionMm2)).toFixed(5)),
    layers: [
      { name: 'XLPE insulation', role: 'insulation' as const, thicknessM: 0.0017, thermalResistivityKmPerW: 3.5, continuousLimitC: 90, shortCircuitLimitC: 250 },
      { name: 'PVC sheath', role: 'sheath' as const, thicknessM: 0.0018, thermalResistivityKmPerW: 5 },
    ],
    emissivity: 0.9,
    sourceNotes: ['R20: IEC 60228 Table 2 maximum (from memory)'],
  };
}

export const EXAMPLE_EVALUATE_REQUEST: EvaluateRequest = {
  conditions: {
    designCurrentA: 250,
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 60,
    powerFactor: 0.9,
    reactanceOhmPerM: 0.00008,
    maxVoltageDropPercent: 4,
    ambientC: 35,
    installation: { kind: 'cable-in-air', formation: 'flat', spacingM: 0.1 },
    fault: { currentA: 10000, durationS: 0.2 },
  },
  candidates: [xlpeCable(95, 0.193), xlpeCable(120, 0.153)],
};

/**
 * A buried circuit beside another one (physics.md §8): three single cores flat, 70 mm apart,
 * 0.8 m deep, with a second circuit of the same cable at 200 A, 350 mm centre to centre.
 */
export const EXAMPLE_BURIED_GROUP_REQUEST: EvaluateRequest = {
  conditions: {
    designCurrentA: 300,
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 120,
    powerFactor: 0.9,
    maxVoltageDropPercent: 4,
    installation: {
      kind: 'buried',
      depthM: 0.8,
      soilResistivityKmPerW: 1.2,
      groundC: 20,
      formation: 'flat',
      spacingM: 0.07,
      otherCircuits: [{ currentA: 200 }],
      circuitSpacingM: 0.35,
      circuitRow: 'horizontal',
    },
    fault: { currentA: 10000, durationS: 0.2 },
  },
  candidates: [xlpeCable(185, 0.0991), xlpeCable(240, 0.0754)],
};

export const EXAMPLE_AMPACITY_REQUEST: AmpacityRequest = {
  conditions: {
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 20,
    powerFactor: 0.9,
    ambientC: 40,
    installation: { kind: 'bar-on-edge' },
  },
  candidate: {
    kind: 'bar',
    id: 'cu-bar-100x10',
    label: 'Copper bar 100 × 10 mm',
    material: 'copper',
    widthM: 0.1,
    thicknessM: 0.01,
    r20OhmPerM: 1.7241e-8 / (0.1 * 0.01),
    emissivity: 0.4,
    terminalLimitC: 105,
    shortCircuitLimitC: 200,
  },
};

function copperBarPack(barsPerPhase: number) {
  return {
    kind: 'bar' as const,
    id: `cu-${barsPerPhase}x100x10`,
    label: `${barsPerPhase} × 100 × 10 mm copper per phase`,
    material: 'copper' as const,
    widthM: 0.1,
    thicknessM: 0.01,
    barsPerPhase,
    barGapM: 0.01,
    r20OhmPerM: 1.7241e-8 / (0.1 * 0.01),
    emissivity: 0.4,
    terminalLimitC: 105,
    shortCircuitLimitC: 200,
    yieldStrengthPa: 250e6,
  };
}

/**
 * A bus-bar system as built (physics.md §10) and its protection (§11): packs of three and four
 * 100 × 10 mm copper bars per phase on edge, their supports for the IEC 60865-1 forces, and the
 * air circuit-breaker with the earth-fault loop for coordination and disconnection.
 */
export const EXAMPLE_BUSBAR_SYSTEM_REQUEST: EvaluateRequest = {
  conditions: {
    designCurrentA: 2500,
    frequencyHz: 50,
    phases: 3,
    nominalVoltageV: 230,
    lengthM: 15,
    powerFactor: 0.9,
    ambientC: 35,
    installation: {
      kind: 'bar-on-edge',
      system: { phaseSpacingM: 0.2, supportSpacingM: 0.4, spacerSpacingM: 0.2, supports: 'continuous-three-or-more-spans', supportStrengthN: 25000, rOverX: 0.15 },
    },
    fault: { currentA: 50000, durationS: 0.5 },
    protection: {
      device: { kind: 'breaker-iec60947-2', ratedCurrentA: 3200, settingCurrentA: 2500, instantaneousCurrentA: 25000, instantaneousMaxTimeS: 0.05 },
      deviceSeriesA: [2000, 2250, 2500, 2800, 3200],
      systemEarthing: 'TN',
      circuit: 'distribution',
      source: { resistanceOhm: 0.0016, reactanceOhm: 0.0064 },
      protectiveConductor: { sectionMm2: 1000, arrangement: 'separate' },
    },
  },
  candidates: [copperBarPack(3), copperBarPack(4)],
};

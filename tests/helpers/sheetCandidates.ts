/**
 * Sheet candidates used as test INPUTS (never as check values), with where their numbers come from.
 */
import type { SheetCandidate } from '@/lib/sheet';

/** IEC 60028 resistivity of annealed copper at 20 °C, 1/58 Ω·mm²/m (from memory). */
const COPPER_RHO20_OHM_M = 1 / 58e6;

/**
 * A bare copper bar pack: R20 of one bar from the IEC 60028 resistivity over w·t; joints held to
 * 105 °C and a 200 °C short-circuit limit (common practice); gap between bars = one thickness.
 */
export function testCopperBar(widthMm: number, thicknessMm: number, options: { barsPerPhase?: number; emissivity?: number } = {}): SheetCandidate {
  const barsPerPhase = options.barsPerPhase ?? 1;
  const size = `${barsPerPhase > 1 ? `${barsPerPhase} × ` : ''}${widthMm} × ${thicknessMm}`;
  return {
    id: `cu-bar-${barsPerPhase > 1 ? `${barsPerPhase}x` : ''}${widthMm}x${thicknessMm}`,
    label: `${size} mm copper bar (test)`,
    kind: 'bar',
    material: 'copper',
    r20OhmPerM: COPPER_RHO20_OHM_M / ((widthMm / 1000) * (thicknessMm / 1000)),
    parallel: 1,
    widthM: widthMm / 1000,
    thicknessM: thicknessMm / 1000,
    barsPerPhase,
    barGapM: thicknessMm / 1000,
    terminalLimitC: 105,
    shortCircuitLimitC: 200,
    ...(options.emissivity !== undefined ? { emissivity: options.emissivity } : {}),
    sourceNotes: ['Resistance from the IEC 60028 copper resistivity 1/58 Ω·mm²/m (test data).'],
  };
}

/**
 * Copper XLPE/PVC single core 240 mm²: R20 the IEC 60228 class 2 maximum 0.0754 Ω/km
 * (references.md), XLPE 1.7 mm ρ_T 3.5 and PVC 1.9 mm ρ_T 5.0 K·m/W (IEC 60287-2-1 Table 1),
 * XLPE 90 °C / 250 °C (common practice), all from memory.
 */
export const testCable240: SheetCandidate = {
  id: 'cu-xlpe-240',
  label: '240 mm² Cu XLPE single-core (test)',
  kind: 'cable',
  material: 'copper',
  r20OhmPerM: 0.0754e-3,
  sectionMm2: 240,
  conductorDiameterM: 0.018,
  parallel: 1,
  layers: [
    { name: 'XLPE insulation', role: 'insulation', thicknessM: 1.7e-3, thermalResistivityKmPerW: 3.5, continuousLimitC: 90, shortCircuitLimitC: 250 },
    { name: 'PVC sheath', role: 'sheath', thicknessM: 1.9e-3, thermalResistivityKmPerW: 5.0 },
  ],
};

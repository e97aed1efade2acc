/**
 * The independent closed form beside a cable's solver result (physics.md §8): IEC 60287-1-1
 * eq. (1) with the standard's own T₁…T₄ — the free-air iteration of IEC 60287-2-1 §4.2.1 with the
 * Z, E, g of the arrangement, or the buried formulas and superposition of §4.2.2–4.2.7 — never the
 * solver's surface coefficient (lib/electrical/iec60287). Bars keep the closed form of model.ts.
 */
import { cableThermalResistances, rateArrangementInAir, rateBuriedArrangement, rateInFreeAir, ratingEquation, type GroupCircuitData, type SingleCoreCable } from '../iec60287/rating';
import { FREE_AIR_CONSTANTS, type InsulationMaterial } from '../iec60287/constants';
import type { CableGroup } from './cableGroup';
import type { PreparedCable, PreparedConditions } from './prepared';
import type { GoverningLimit } from './types';

export const CLOSED_FORM_METHOD_CABLE_AIR =
  'IEC 60287-1-1 eq. (1) with T₁, T₃ from the coverings and T₄* from the IEC 60287-2-1 §4.2.1 free-air iteration with the Z, E, g of the arrangement (independent of the solver)';
export const CLOSED_FORM_METHOD_CABLE_BURIED =
  'IEC 60287-1-1 eq. (1) with T₁, T₃ from the coverings and T₄ by IEC 60287-2-1 §4.2.2–4.2.7 (closed forms for touching circuits, superposition with images for the rest; independent of the solver)';

export const CLOSED_FORM_METHOD_CABLE_FIXED_H =
  'IEC 60287-1-1 eq. (1) with T₁, T₃ from the coverings and T₄ = 1/(π·D_e·h) from the entered surface coefficient';

export interface CableClosedForm {
  /** Model current at the limit (divide by the model's current scale for one conductor), A. */
  conductorCurrentA: number;
  method: string;
  externalResistanceKmPerW: number;
  internalResistanceKmPerW: number;
}

const INSULATION_WORDS: [RegExp, InsulationMaterial][] = [
  [/xlpe|cross-?linked/i, 'xlpe'],
  [/epr|ethylene.?propylene/i, 'epr'],
  [/pvc|polyvinyl/i, 'pvc'],
  [/\bpe\b|polyethylene/i, 'pe'],
];

function insulationMaterialOf(name: string): InsulationMaterial {
  for (const [pattern, material] of INSULATION_WORDS) if (pattern.test(name)) return material;
  // Unknown: PVC has the lowest voltage at which dielectric losses count (cautious).
  return 'pvc';
}

/**
 * The candidate as IEC 60287 sees it: layers inside the screen form the insulation (one T₁),
 * layers outside it the jacket (one T₃), each as the equivalent single layer with the same
 * thermal resistance; metallic layers count for nothing, as the standard takes them. A multi-core
 * cable enters as the same equivalent conductor the solver uses (flagged there).
 */
export function asSingleCoreCable(cand: PreparedCable): SingleCoreCable {
  const n = cand.loadedCores;
  const dc = cand.conductorDiameterM * Math.sqrt(n);
  const screenAt = cand.screenLayerIndex ?? cand.layers.findIndex((l) => l.role === 'screen');
  const inner = screenAt >= 0 ? cand.layers.slice(0, screenAt) : cand.layers;
  const outer = screenAt >= 0 ? cand.layers.slice(screenAt + 1) : [];
  let r = dc / 2;
  const group = (layers: typeof cand.layers) => {
    let t = 0;
    let resistance = 0;
    for (const l of layers) {
      const metallic = l.role === 'screen' || l.role === 'armour';
      if (!metallic) resistance += Math.log((r + l.thicknessM) / r) / (2 * Math.PI * l.conductivityWPerMK);
      t += l.thicknessM;
      r += l.thicknessM;
    }
    return { t, resistance };
  };
  const ins = group(inner);
  if (screenAt >= 0) r += cand.layers[screenAt].thicknessM;
  const startJacket = r;
  const jac = group(outer);
  const de = cand.outerDiameterM;
  const rhoIns = (ins.resistance * 2 * Math.PI) / Math.log(1 + (2 * ins.t) / dc);
  const rhoJac = jac.t > 0 ? (jac.resistance * 2 * Math.PI) / Math.log(de / (2 * startJacket)) : 5;
  const cable: SingleCoreCable = {
    conductor: { material: cand.material, r20OhmPerM: cand.r20 / n, diameterM: dc, ...(cand.ks !== undefined ? { ks: cand.ks } : {}), ...(cand.kp !== undefined ? { kp: cand.kp } : {}) },
    insulation: { material: insulationMaterialOf(inner[0]?.name ?? ''), thicknessM: ins.t, thermalResistivityKmPerW: rhoIns },
    jacket: { thicknessM: jac.t, thermalResistivityKmPerW: rhoJac },
    externalDiameterM: de,
  };
  if (cand.screen && screenAt >= 0) {
    const screenLayer = cand.layers[screenAt];
    const inside = dc / 2 + ins.t;
    cable.screen = {
      material: cand.screen.material,
      ...(cand.screen.sectionMm2 !== undefined ? { sectionMm2: cand.screen.sectionMm2 } : {}),
      ...(cand.screen.r20OhmPerM !== undefined ? { r20OhmPerM: cand.screen.r20OhmPerM } : {}),
      meanDiameterM: 2 * inside + screenLayer.thicknessM,
      thicknessM: screenLayer.thicknessM,
      bonding: cand.screen.bonding,
    };
  }
  return cable;
}

interface ClosedFormAtConductor {
  conductorCurrentA: number;
  lambda1: number;
  externalResistanceKmPerW: number;
  internalResistanceKmPerW: number;
  method: string;
}

/**
 * The closed-form rating of the candidate's circuit in its arrangement, or null where the
 * standard's method does not reach (the solver's result then stands alone, flagged by the caller
 * when the group is outside a method). When a covering's own limit governs, the conductor
 * temperature at which that covering reaches its limit is found first (bisection on eq. (1)'s
 * conductor temperature), so the comparison is at the same governing limit as the solver's.
 * `acResistanceAt(θ)` is R_ac of one (model) conductor at θ, IEC 60287-1-1 §2.1.
 */
export function cableClosedForm(
  cand: PreparedCable,
  cond: PreparedConditions,
  group: CableGroup,
  governing: GoverningLimit,
  acResistanceAt: (temperatureC: number) => number,
): CableClosedForm | null {
  const at = (conductorC: number) => closedFormAtConductor(cand, cond, group, conductorC, acResistanceAt);
  try {
    if (governing.source !== 'layer') {
      const r = at(governing.temperatureC);
      return r && { ...r };
    }
    const layerIndex = cand.layers.findIndex((l) => l.name === governing.layer && !l.contact);
    if (layerIndex < 0) return null;
    const cable = asSingleCoreCable(cand);
    // Conductor surface → the governing covering's inner face, with the screen's heat beyond it.
    let r = cable.conductor.diameterM / 2;
    const screenAt = cand.screenLayerIndex ?? -1;
    const faceRise = (conductorC: number, rated: ClosedFormAtConductor) => {
      let rise = 0;
      r = cable.conductor.diameterM / 2;
      const w = rated.conductorCurrentA ** 2 * acResistanceAt(conductorC);
      cand.layers.forEach((l, i) => {
        if (i >= layerIndex) return;
        const metallic = l.role === 'screen' || l.role === 'armour';
        const heat = screenAt >= 0 && i > screenAt ? w * (1 + rated.lambda1) : w;
        if (!metallic) rise += (heat * Math.log((r + l.thicknessM) / r)) / (2 * Math.PI * l.conductivityWPerMK);
        r += l.thicknessM;
      });
      return rise;
    };
    let lo = governing.temperatureC;
    let hi = governing.temperatureC + 400;
    let best: ClosedFormAtConductor | null = null;
    for (let k = 0; k < 80 && hi - lo > 1e-7; k++) {
      const mid = 0.5 * (lo + hi);
      const rated = at(mid);
      if (!rated) return null;
      if (mid - faceRise(mid, rated) > governing.temperatureC) hi = mid;
      else {
        lo = mid;
        best = rated;
      }
    }
    return best;
  } catch {
    return null;
  }
}

function closedFormAtConductor(cand: PreparedCable, cond: PreparedConditions, group: CableGroup, conductorC: number, acResistanceAt: (t: number) => number): ClosedFormAtConductor | null {
  const cable = asSingleCoreCable(cand);
  const data: GroupCircuitData = { cable, voltageU0V: cond.nominalVoltageV, conductorMaxC: conductorC };
  if (cond.surfaceCoefficientWPerM2K !== undefined && cond.placement !== 'buried') {
    // The user's own combined coefficient is an input, not the solver's: T₄ = 1/(π·D_e·h).
    const { T1, T2, T3 } = cableThermalResistances(cable, cond.nominalVoltageV);
    const T4 = 1 / (Math.PI * cable.externalDiameterM * cond.surfaceCoefficientWPerM2K);
    const sun = cond.solar ? cond.solar.absorptivity * cable.externalDiameterM * cond.solar.irradianceWPerM2 : 0;
    const eq = ratingEquation({ conductorRiseK: conductorC - cond.ambientC, acResistanceOhmPerM: acResistanceAt(conductorC), T1, T2, T3, T4, absorbedSolarWPerM: sun });
    return { conductorCurrentA: eq.currentA, lambda1: 0, externalResistanceKmPerW: T4, internalResistanceKmPerW: T1 + T3, method: CLOSED_FORM_METHOD_CABLE_FIXED_H };
  }
  // The rated circuit's runs carry the unknown current; the others their own (the schema's rule).
  // A multi-core cable enters as its equivalent conductor carrying n·I (asSingleCoreCable), so the
  // other circuits of the same cable carry n times their circuit current too.
  const n = cand.loadedCores;
  const arrangement = {
    ...group.arrangement,
    circuits: group.arrangement.circuits.map((c, i) => (i < cand.parallel ? { ...c, currentA: undefined } : c.currentA !== undefined ? { ...c, currentA: c.currentA * n } : c)),
  };
  const circuitsData = arrangement.circuits.map((_, i) => {
    const other = i >= cand.parallel ? cond.otherCircuits[i - cand.parallel] : undefined;
    if (other?.cable) return { ...data, cable: { ...cable, externalDiameterM: other.cable.externalDiameterM }, fixedHeatWPerM: other.cable.lossWPerM };
    return data;
  });
  if (group.model.kind === 'air') {
    const sun = cond.solar ? { absorptionCoefficient: cond.solar.absorptivity, irradianceWPerM2: cond.solar.irradianceWPerM2 } : undefined;
    const base = { ambientC: cond.ambientC, frequencyHz: cond.frequencyHz, ...(sun ? { sun } : {}) };
    if (group.isolated || group.model.uncoveredNeighbours > 0 || group.model.conservativeRow) {
      // One circuit by the row the solver used (an isolated cable: the single-cable row).
      const constants = group.model.constants ?? FREE_AIR_CONSTANTS.single;
      const c = arrangement.circuits[0];
      const r = rateInFreeAir({
        cable,
        circuit: { cableCount: c.formation === 'single' ? 1 : c.formation === 'trefoil' ? 3 : c.cableCount ?? 3, axisSpacingM: group.layout.circuitAxisSpacingM[0], formation: c.formation, transposed: c.transposed ?? false },
        constants,
        conductorMaxC: conductorC,
        voltageU0V: cond.nominalVoltageV,
        ...base,
      });
      const g = r.positions.find((p) => p.position === r.governing) ?? r.positions[0];
      return { conductorCurrentA: r.currentA, lambda1: g.lambda1, externalResistanceKmPerW: g.freeAir.T4, internalResistanceKmPerW: r.electrical.thermal.T1 + r.electrical.thermal.T3, method: CLOSED_FORM_METHOD_CABLE_AIR };
    }
    const r = rateArrangementInAir({ arrangement, circuits: circuitsData, ...base });
    const g = r.positions.find((p) => p.position === r.governing) ?? r.positions[0];
    return { conductorCurrentA: r.currentA, lambda1: g.lambda1, externalResistanceKmPerW: g.freeAir.T4, internalResistanceKmPerW: r.electrical.thermal.T1 + r.electrical.thermal.T3, method: CLOSED_FORM_METHOD_CABLE_AIR };
  }
  const r = rateBuriedArrangement({ arrangement, circuits: circuitsData, soilResistivityKmPerW: cond.buried!.soilResistivityKmPerW, groundC: cond.ambientC, frequencyHz: cond.frequencyHz });
  const g = r.cables.find((c) => c.circuit === r.governing.circuit && c.index === r.governing.index) ?? r.cables[0];
  const thermal = r.circuits[g.circuit].thermal;
  return { conductorCurrentA: r.currentA, lambda1: g.lambda1, externalResistanceKmPerW: g.effectiveT4, internalResistanceKmPerW: thermal.T1 + thermal.T3, method: CLOSED_FORM_METHOD_CABLE_BURIED };
}

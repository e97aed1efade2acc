/**
 * Bus bars as built (physics.md §10, lib/electrical/busbar): the three-phase system of packs the
 * candidate forms, its current distribution by the filament method, the pack's heat balance bar
 * by bar, and the short-circuit forces of IEC 60865-1.
 *
 * - One bar per phase: the finite-volume slab through the thickness stays the thermal model; its
 *   R_ac/R_dc comes from the filament method — of the middle phase of the system when the phase
 *   spacing is given, else of an isolated bar (flagged) — instead of the plane-conductor bound.
 * - A pack (two or more bars per phase): each bar has its own loss (the current shares computed)
 *   and its own heat balance (outer faces as plates, gaps as channels, radiation by view factors);
 *   the hottest bar governs. The slab model would rate every bar as if both faces were free.
 * Filament solves are the costly part (tens of ms): their results are kept per geometry, so an
 * edit of the design current does not repeat them.
 */
import {
  defaultMesh,
  isolatedBarAcFactor,
  skinDepth,
  type FilamentMeshOptions,
  prepareBusbarSystem,
  prepareCurrentDistribution,
  preparePackHeat,
  rateBusbarSystem,
  shortCircuitForces,
  solveCurrentDistribution,
  solvePackHeat,
  type BusbarFlag,
  type CurrentDistributionResult,
  type PackHeatResult,
  type PreparedBusbarSystem,
  type ShortCircuitForceResult,
  type SupportArrangement,
} from '../busbar';
import { ElectricalInputError, requireRange } from '../errors';
import type { PreparedBar, PreparedConditions } from './prepared';
import type { BusbarSystemConditions } from './types';

/** Clear distance between phase packs when none is entered: the bar width (flagged). */
export const DEFAULT_PHASE_CLEARANCE_BAR_WIDTHS = 1;
/** Above this the pack's steady state is not believed (the solver's limit for cables, physics.md §1), °C. */
const PACK_TEMPERATURE_CEILING_C = 2000;
/** Support span when none is entered, m (only the forces use it; they are not checked then). */
const DEFAULT_SUPPORT_SPACING_M = 1;

export interface BusbarSystemModel {
  system: PreparedBusbarSystem;
  phaseSpacingAssumed: boolean;
  conductor: { rho20OhmM: number; alpha20PerK: number };
  frequencyHz: number;
  emissivity: number;
  ambientC: number;
  /** The candidate's pack is modelled bar by bar (two or more bars per phase). */
  pack: boolean;
  /** The filament mesh per bar (the default from the skin depth, coarsened to the budget). */
  mesh: Required<FilamentMeshOptions>;
  /** Set when the mesh had to be coarsened below the default to stay within the budget. */
  meshCoarsened: boolean;
  thermalNodes: 'per-bar' | 'per-pack';
}

export interface PackState {
  heat: PackHeatResult;
  distribution: CurrentDistributionResult;
}

const cache = new Map<string, unknown>();
function cached<T>(key: string, make: () => T): T {
  if (cache.has(key)) return cache.get(key) as T;
  const value = make();
  if (cache.size > 200) cache.clear();
  cache.set(key, value);
  return value;
}

export function busbarSystemOf(cand: PreparedBar, cond: PreparedConditions): BusbarSystemModel {
  const given = cond.busbarSystem;
  const arrangement = cond.placement === 'bar-flat' ? 'flat' : 'edge';
  const stack = cand.barsPerPhase * cand.thicknessM + (cand.barsPerPhase - 1) * cand.barGapM;
  const packAcross = arrangement === 'edge' ? stack : cand.widthM;
  const phaseSpacingM = given?.phaseSpacingM ?? packAcross + DEFAULT_PHASE_CLEARANCE_BAR_WIDTHS * cand.widthM;
  let system: PreparedBusbarSystem;
  try {
    system = prepareBusbarSystem({
      barsPerPhase: cand.barsPerPhase,
      barWidthM: cand.widthM,
      barThicknessM: cand.thicknessM,
      ...(cand.barsPerPhase > 1 ? { gapM: cand.barGapM } : {}),
      phaseSpacingM,
      arrangement,
      supportSpacingM: given?.supportSpacingM ?? DEFAULT_SUPPORT_SPACING_M,
      ...(given?.spacerSpacingM !== undefined ? { spacerSpacingM: given.spacerSpacingM } : {}),
    });
  } catch (e) {
    if (e instanceof ElectricalInputError) throw new ElectricalInputError(`conditions.installation.system.${e.field}`, e.message.replace(/^[^:]*: /, ''));
    throw e;
  }
  const rho = cand.r20 * cand.widthM * cand.thicknessM;
  const { mesh, coarsened } = meshWithinBudget(system, rho * (1 + cand.alpha20 * (cand.contactLimit.temperatureC - 20)), cond.frequencyHz);
  return {
    system,
    mesh,
    meshCoarsened: coarsened,
    phaseSpacingAssumed: given === undefined,
    conductor: { rho20OhmM: cand.r20 * cand.widthM * cand.thicknessM, alpha20PerK: cand.alpha20 },
    frequencyHz: cond.frequencyHz,
    emissivity: cand.emissivity,
    ambientC: cond.ambientC,
    pack: cand.barsPerPhase > 1,
    thermalNodes: given?.packNodes ?? 'per-bar',
  };
}

/**
 * Filaments a solve may take (the phases' bars, before the mirror halves them): the dense complex
 * system costs n³, so a very wide, thin or many-bar system would take minutes. Within the budget
 * the skin-depth mesh of the bus-bar module stands; beyond it the cells along the width, then
 * across the thickness, are reduced (flagged: a coarser mesh sees less of the edge crowding).
 */
export const FILAMENT_BUDGET = 1600;

function meshWithinBudget(system: PreparedBusbarSystem, resistivityOhmM: number, frequencyHz: number): { mesh: Required<FilamentMeshOptions>; coarsened: boolean } {
  const mesh = defaultMesh(system.barWidthM, system.barThicknessM, frequencyHz > 0 ? skinDepth(resistivityOhmM, frequencyHz) : Number.POSITIVE_INFINITY);
  const bars = system.bars.length;
  if (bars * mesh.cellsAcrossThickness * mesh.cellsAlongWidth <= FILAMENT_BUDGET) return { mesh, coarsened: false };
  // Even, so that the quarter kept by the mirrors holds whole cells.
  const along = Math.max(4, 2 * Math.floor(FILAMENT_BUDGET / (2 * bars * mesh.cellsAcrossThickness)));
  const across = bars * mesh.cellsAcrossThickness * along > FILAMENT_BUDGET ? Math.max(2, Math.floor(FILAMENT_BUDGET / (bars * along))) : mesh.cellsAcrossThickness;
  return { mesh: { ...mesh, cellsAlongWidth: along, cellsAcrossThickness: across }, coarsened: true };
}

function keyOf(m: BusbarSystemModel, extra: string): string {
  const s = m.system;
  return [s.arrangement, s.barsPerPhase, s.barWidthM, s.barThicknessM, s.gapM, s.phaseSpacingM, m.conductor.rho20OhmM, m.conductor.alpha20PerK, m.frequencyHz, extra].join('|');
}

/**
 * R_ac/R_dc of a single bar per phase at a temperature, by the filament method: the worst phase of
 * the three-phase system (the middle one, proximity from both sides), or an isolated bar when the
 * phase spacing is not known. Linear in temperature between the two ends solved (the ratio moves
 * by a fraction of a per cent over 100 K).
 */
export function singleBarAcFactor(m: BusbarSystemModel, lowC: number, highC: number): (temperatureC: number) => number {
  if (m.frequencyHz === 0) return () => 1;
  const at = (t: number) =>
    cached(keyOf(m, `single:${m.phaseSpacingAssumed ? 'isolated' : 'system'}:${t.toFixed(3)}`), () => {
      if (m.phaseSpacingAssumed) {
        const rho = m.conductor.rho20OhmM * (1 + m.conductor.alpha20PerK * (t - 20));
        return isolatedBarAcFactor({ widthM: m.system.barWidthM, thicknessM: m.system.barThicknessM, resistivityOhmM: rho, frequencyHz: m.frequencyHz, mesh: m.mesh }).acFactor;
      }
      const prepared = prepareCurrentDistribution({ system: m.system, conductor: m.conductor, frequencyHz: m.frequencyHz, barTemperaturesC: t, mesh: m.mesh });
      const d = solveCurrentDistribution(prepared, { barTemperaturesC: t, phaseCurrentA: 1 });
      return Math.max(...d.groups.map((g) => g.acFactor ?? 1));
    });
  const a = at(lowC);
  const b = at(highC);
  // Outside the two ends the ratio is held at the nearer end, not extrapolated: a search that
  // tries a current far above the rating reaches hundreds of °C, where a straight line through
  // the falling ratio would pass below 1 (an AC resistance below the DC one). Holding the end
  // value there keeps the ratio physical and, above the limit, errs high (cautious).
  return (t) => {
    if (highC === lowC) return a;
    const clamped = Math.min(Math.max(t, Math.min(lowC, highC)), Math.max(lowC, highC));
    return a + ((b - a) * (clamped - lowC)) / (highC - lowC);
  };
}

/** Ampacity of the pack system per phase (one run), its bar temperatures and current shares. */
export function packAmpacity(m: BusbarSystemModel, limitC: number): { currentA: number; state: PackState; flags: BusbarFlag[] } {
  const r = cached(keyOf(m, `ampacity:${limitC}:${m.ambientC}:${m.emissivity}:${m.thermalNodes}`), () =>
    rateBusbarSystem({
      system: m.system,
      conductor: m.conductor,
      conditions: { ambientC: m.ambientC, emissivity: m.emissivity, limitC, thermalNodes: m.thermalNodes },
      excitation: m.frequencyHz === 0 ? { kind: 'dc' } : { kind: 'three-phase', frequencyHz: m.frequencyHz },
      mesh: m.mesh,
    }),
  );
  return { currentA: r.ampacityA, state: { heat: r.heat, distribution: r.distribution }, flags: r.flags };
}

/**
 * The pack at a phase current (one run): the current distribution at the bars' temperatures and
 * the heat balance at its losses, repeated until the temperatures move by less than 0.01 K.
 * Null when there is no steady state.
 */
export function packStateAt(m: BusbarSystemModel, phaseCurrentA: number, startC: number): PackState | null {
  const n = m.system.bars.length;
  // The filament system is factorised at some temperatures; far from them (over 40 K) it is made afresh.
  const prepareAt = (t: readonly number[]) => prepareCurrentDistribution({ system: m.system, conductor: m.conductor, frequencyHz: m.frequencyHz, barTemperaturesC: t, mesh: m.mesh });
  let prepared = cached(keyOf(m, `prepared:${startC}`), () => prepareAt(new Array<number>(n).fill(startC)));
  const heat = cached(keyOf(m, `heat:${m.ambientC}:${m.emissivity}:${m.thermalNodes}`), () => preparePackHeat(m.system, { ambientC: m.ambientC, emissivity: m.emissivity, thermalNodes: m.thermalNodes }));
  let temperatures = new Array<number>(n).fill(startC);
  for (let pass = 0; pass < 12; pass++) {
    if (temperatures.some((t, k) => Math.abs(t - prepared.referenceTemperaturesC[k]) > 40)) prepared = prepareAt(temperatures);
    const unit = solveCurrentDistribution(prepared, { barTemperaturesC: temperatures, phaseCurrentA: 1 });
    const i2 = phaseCurrentA * phaseCurrentA;
    const referenceLoss = unit.bars.map((b) => b.lossWPerM);
    const result = solvePackHeat(heat, (t) => {
      const out = new Float64Array(n);
      for (let k = 0; k < n; k++) out[k] = (i2 * referenceLoss[k] * (1 + m.conductor.alpha20PerK * (t[k] - 20))) / (1 + m.conductor.alpha20PerK * (temperatures[k] - 20));
      return out;
    }, { initialC: Float64Array.from(temperatures) });
    if (!result.converged) return null;
    const found = result.bars.map((b) => b.temperatureC);
    // Heat only ever adds: a bar below the air, or hotter than any material survives, is a
    // heat balance without a steady state (the losses outgrow the cooling), never a temperature.
    if (found.some((t) => !Number.isFinite(t) || t < m.ambientC - 1e-6 || t > PACK_TEMPERATURE_CEILING_C)) return null;
    const moved = Math.max(...found.map((t, k) => Math.abs(t - temperatures[k])));
    temperatures = found;
    if (moved < 0.01) {
      if (temperatures.some((t, k) => Math.abs(t - prepared.referenceTemperaturesC[k]) > 40)) prepared = prepareAt(temperatures);
      const scaled = solveCurrentDistribution(prepared, { barTemperaturesC: temperatures, phaseCurrentA });
      return { heat: result, distribution: scaled };
    }
  }
  return null;
}

/** IEC 60865-1 forces of the system for the prospective fault, when the supports are described. */
export function systemForces(m: BusbarSystemModel, cand: PreparedBar, cond: PreparedConditions): ShortCircuitForceResult | null {
  const given = cond.busbarSystem;
  if (!cond.fault || !given?.supports || given.supportSpacingM === undefined) return null;
  return shortCircuitForces({
    system: m.system,
    initialCurrentA: cond.fault.currentA / cand.parallel,
    ...(given.rOverX !== undefined ? { rOverX: given.rOverX } : {}),
    ...(given.kappa !== undefined ? { kappa: given.kappa } : {}),
    material: cand.material,
    ...(cand.yieldStrengthPa !== undefined ? { yieldStrengthPa: cand.yieldStrengthPa } : {}),
    supports: given.supports as SupportArrangement,
    ...(given.supportStrengthN !== undefined ? { supportStrengthN: given.supportStrengthN } : {}),
    ...(given.mainSectionModulusM3 !== undefined ? { mainSectionModulusM3: given.mainSectionModulusM3 } : {}),
  });
}

/** Checks the bus-bar system conditions where they enter the library (every refusal names its field). */
export function prepareBusbarSystemConditions(raw: BusbarSystemConditions | undefined, field: string): BusbarSystemConditions | undefined {
  if (raw === undefined) return undefined;
  if (raw === null || typeof raw !== 'object') throw new ElectricalInputError(field, 'must be an object');
  const f = (n: string) => `${field}.${n}`;
  const out: BusbarSystemConditions = { phaseSpacingM: requireRange(raw.phaseSpacingM, f('phaseSpacingM'), 0, 10, { minExclusive: true }) };
  if (raw.supportSpacingM !== undefined) out.supportSpacingM = requireRange(raw.supportSpacingM, f('supportSpacingM'), 0, 20, { minExclusive: true });
  if (raw.spacerSpacingM !== undefined) out.spacerSpacingM = requireRange(raw.spacerSpacingM, f('spacerSpacingM'), 0, 20, { minExclusive: true });
  if (raw.supports !== undefined) {
    const kinds = ['single-span-both-simply-supported', 'single-span-fixed-and-simply-supported', 'single-span-both-fixed', 'continuous-two-spans', 'continuous-three-or-more-spans'];
    if (!kinds.includes(raw.supports)) throw new ElectricalInputError(f('supports'), `must be one of ${kinds.join(', ')}`);
    out.supports = raw.supports;
  }
  if (raw.supportStrengthN !== undefined) out.supportStrengthN = requireRange(raw.supportStrengthN, f('supportStrengthN'), 0, 1e7, { minExclusive: true });
  if (raw.rOverX !== undefined) out.rOverX = requireRange(raw.rOverX, f('rOverX'), 0, 10);
  if (raw.kappa !== undefined) out.kappa = requireRange(raw.kappa, f('kappa'), 1.02, 2);
  if (raw.mainSectionModulusM3 !== undefined) out.mainSectionModulusM3 = requireRange(raw.mainSectionModulusM3, f('mainSectionModulusM3'), 0, 1, { minExclusive: true });
  if (raw.packNodes !== undefined) {
    if (raw.packNodes !== 'per-bar' && raw.packNodes !== 'per-pack') throw new ElectricalInputError(f('packNodes'), "must be 'per-bar' or 'per-pack'");
    out.packNodes = raw.packNodes;
  }
  return out;
}

/**
 * One candidate ready to be solved: its prepared inputs, its thermal model, its AC-factor
 * function and its flags. Built once per candidate per comparison; every check (ampacity, design
 * point, hot spot at another current) solves through `solveAt` without re-validating anything.
 */
import { solveSteady, type Boundary, type ThermalProblem } from '../../thermal';
import { ElectricalInputError, SizingError } from '../errors';
import { acFactorFunction, type AcFactorFunction } from './acFactor';
import { FlagSet, fmt } from './flags';
import { GROUP_TEXT, MODEL_TEXT } from './flagText';
import { cableGroupOf, type CableGroup } from './cableGroup';
import { solveBuriedGroup, type GroupSteadyResult } from './groupSolve';
import { asSingleCoreCable } from './closedForm';
import { busbarSystemOf, type BusbarSystemModel } from './busbarSystem';
import { buildThermalModel, type CableLosses, type Mesh, type ThermalModel } from './model';
import { screenLossFactorAt, type CircuitGeometry } from '../iec60287/rating';
import { dielectricLoss } from '../iec60287/screens';
import type { CablePosition } from '../iec60287/arrangement';
import { prepareCandidate } from './prepareCandidate';
import { conditionFlags } from './prepareConditions';
import type { PreparedCable, PreparedCandidate, PreparedConditions } from './prepared';
import type { Candidate } from './types';

export interface SizingContext {
  cand: PreparedCandidate;
  cond: PreparedConditions;
  /** The cross-section of a cable circuit (its runs, the circuits beside it); bars have none. */
  group?: CableGroup;
  /** The three-phase system a bar belongs to; a pack is rated on it instead of the slab. */
  busbar?: BusbarSystemModel;
  model: ThermalModel;
  acFn: AcFactorFunction;
  flags: FlagSet;
  /** Heat-balance solves so far (reported with the result). */
  solves: number;
}

/** Prepares one candidate under conditions prepared once for the whole comparison. */
export function sizingContext(candidate: Candidate, cond: PreparedConditions, index: number, flags = new FlagSet()): SizingContext {
  const cand = prepareCandidate(candidate, index, cond, flags);
  const group = cand.kind === 'cable' ? cableGroupOf(cand, cond) : undefined;
  const losses = cand.kind === 'cable' && group ? cableLossesOf(cand, cond, group, flags) : undefined;
  const groupLawInAir = group !== undefined && group.model.kind === 'air' && group.model.constants !== null && cond.surfaceCoefficientWPerM2K === undefined;
  conditionFlags(cond, flags, { windCredited: !groupLawInAir });
  if (group) groupFlags(group, cond, flags);
  const busbar = cand.kind === 'bar' ? busbarSystemOf(cand, cond) : undefined;
  if (busbar?.phaseSpacingAssumed && cand.kind === 'bar' && cond.frequencyHz > 0) {
    if (busbar.pack) flags.add('PHASE_SPACING_ASSUMED', MODEL_TEXT.phaseSpacingAssumed(busbar.system.phaseSpacingM), { phaseSpacingM: busbar.system.phaseSpacingM });
    else if (cand.acResistanceRatio === undefined) flags.add('PHASE_SPACING_ASSUMED', MODEL_TEXT.isolatedBarAssumed());
  }
  if (busbar?.meshCoarsened && cond.frequencyHz > 0 && (busbar.pack || (cand.kind === 'bar' && cand.acResistanceRatio === undefined))) {
    flags.add('FILAMENT_MESH_COARSENED', MODEL_TEXT.filamentMeshCoarsened(busbar.mesh.cellsAcrossThickness, busbar.mesh.cellsAlongWidth));
  }
  const acFn = acFactorFunction(cand, cond, busbar);
  if (losses) losses.acResistanceAt = (t) => ((cand.r20 / (cand.kind === 'cable' ? cand.loadedCores : 1)) * (1 + cand.alpha20 * (t - 20))) * acFn(t).factor;
  return { cand, cond, ...(group ? { group } : {}), ...(busbar ? { busbar } : {}), model: buildThermalModel(cand, cond, group, losses), acFn, flags, solves: 0 };
}

/**
 * The screen and dielectric losses of a cable (IEC 60287-1-1 §2.2–2.3, lib/electrical/iec60287):
 * where in the 1-D model they are released and how large, or undefined when neither counts.
 */
export function cableLossesOf(cand: PreparedCable, cond: PreparedConditions, group: CableGroup, flags: FlagSet): CableLosses | undefined {
  const cable = asSingleCoreCable(cand);
  const n = cand.loadedCores;
  const dEq = cand.conductorDiameterM * Math.sqrt(n);
  const losses: CableLosses = { acResistanceAt: () => 0 };
  if (cand.screen && cand.screenLayerIndex !== undefined && cond.frequencyHz > 0) {
    const run = group.arrangement.circuits[0];
    const circuit: CircuitGeometry = {
      cableCount: run.formation === 'single' ? 1 : run.formation === 'trefoil' ? 3 : run.cableCount ?? 3,
      axisSpacingM: group.layout.circuitAxisSpacingM[0],
      formation: run.formation,
      transposed: run.transposed ?? false,
    };
    const positions = circuit.cableCount === 1 ? ['alone'] : run.formation === 'trefoil' ? ['trefoil'] : circuit.cableCount === 2 ? ['pair'] : ['flat-outer', 'flat-centre'];
    const lambdaAt = (position: string, conductorAcOhmPerM: number, screenC: number) =>
      screenLossFactorAt({ cable, position: position as CablePosition, circuit, conductorAcResistanceOhmPerM: conductorAcOhmPerM, screenTemperatureC: screenC, frequencyHz: cond.frequencyHz }).lambda1;
    const lambda1 = (position: string, r: number, screenC: number) =>
      position === 'worst' ? Math.max(...positions.map((p) => lambdaAt(p, r, screenC))) : lambdaAt(position, r, screenC);
    let radius = dEq / 2;
    for (let i = 0; i < cand.screenLayerIndex; i++) radius += cand.layers[i].thicknessM;
    radius += cand.layers[cand.screenLayerIndex].thicknessM / 2;
    losses.screen = { radiusM: radius, lambda1, worstPosition: 'worst' };
    const basis = screenLossFactorAt({ cable, position: positions[0] as CablePosition, circuit, conductorAcResistanceOhmPerM: losses.acResistanceAt(90) || cand.r20, screenTemperatureC: 70, frequencyHz: cond.frequencyHz }).basis;
    flags.add('SCREEN_LOSSES_INCLUDED', MODEL_TEXT.screenLossesIncluded(basis));
  }
  const insulationOuter = dEq + 2 * cable.insulation.thicknessM;
  const dielectric = cond.frequencyHz > 0 ? dielectricLoss({ insulation: cable.insulation.material, voltageU0V: cond.nominalVoltageV, frequencyHz: cond.frequencyHz, conductorDiameterM: dEq, insulationDiameterM: insulationOuter }) : null;
  if (dielectric?.counts && dielectric.lossWPerM > 0) {
    // Spread over the insulation by volume: six points at the radii that halve each sixth of its area.
    const r0 = dEq / 2;
    const r1 = insulationOuter / 2;
    const radiiM = Array.from({ length: 6 }, (_, i) => Math.sqrt(r0 * r0 + ((i + 0.5) / 6) * (r1 * r1 - r0 * r0)));
    losses.dielectric = { lossWPerM: dielectric.lossWPerM * n, radiiM };
    flags.add('DIELECTRIC_LOSSES_INCLUDED', MODEL_TEXT.dielectricLossesIncluded(dielectric.lossWPerM * n, dielectric.reason), { lossWPerM: dielectric.lossWPerM * n });
  }
  return losses.screen || losses.dielectric ? losses : undefined;
}

/** What the reviewer must know of how the group was rated. */
function groupFlags(group: CableGroup, cond: PreparedConditions, flags: FlagSet): void {
  const model = group.model;
  if (group.isolated) return;
  if (model.kind === 'air') {
    if (cond.surfaceCoefficientWPerM2K !== undefined) return; // the user's coefficient replaces every law
    if (model.constants !== null) flags.add('CABLE_GROUP_RATED', GROUP_TEXT.air(model.rowText, model.notes), { row: model.row });
    if (model.conservativeRow) flags.add('GROUP_ROW_CONSERVATIVE', MODEL_TEXT.groupRowConservative(model.conservativeRow));
    if (cond.windSpeedMPerS > 0 && model.constants !== null) flags.add('WIND_NOT_CREDITED_TO_GROUP', MODEL_TEXT.windNotCreditedToGroup(cond.windSpeedMPerS));
    if (model.uncoveredNeighbours > 0) {
      flags.add('MUTUAL_HEATING_NOT_MODELLED', MODEL_TEXT.mutualHeating(model.uncoveredNeighbours), { circuits: model.uncoveredNeighbours });
      // The user's grouping factor stands for the other circuits; without it the number is unsafe.
      if (cond.groupingFactor === 1) flags.add('OTHER_CIRCUITS_NOT_COVERED', MODEL_TEXT.otherCircuitsNotCovered(model.uncoveredNeighbours), { circuits: model.uncoveredNeighbours });
    }
    return;
  }
  flags.add('CABLE_GROUP_RATED', GROUP_TEXT.buried(group.cables.length, model.notes), { cables: group.cables.length });
  const entered = cond.otherCircuits.filter((o) => o.cable !== undefined).length;
  if (entered > 0) flags.add('OTHER_CIRCUIT_HEAT_ENTERED', MODEL_TEXT.otherCircuitHeatEntered(entered), { circuits: entered });
}

/** The user-entered factors scale the current a conductor may carry (both flagged). */
function deratingOf(ctx: SizingContext): number {
  return ctx.cond.groupingFactor * ctx.cond.enclosureFactor;
}

/** Circuit current per phase → current in the thermal model's conductor (after derating). */
export function toModelCurrent(ctx: SizingContext, circuitA: number): number {
  return (circuitA / ctx.cand.conductorsPerPhase / deratingOf(ctx)) * ctx.model.currentScale;
}

/** Model current → circuit current per phase. */
export function fromModelCurrent(ctx: SizingContext, modelA: number): number {
  return (modelA / ctx.model.currentScale) * ctx.cand.conductorsPerPhase * deratingOf(ctx);
}

/** Model current → the real current in one conductor (core or bar). */
export function modelToConductorCurrent(ctx: SizingContext, modelA: number): number {
  return modelA / ctx.model.currentScale / deratingOf(ctx);
}

/**
 * Without current and without sun there is no heat flow at all: the exact steady state is the
 * surroundings' temperature everywhere, whatever the surface law. A linear surface gives it in
 * one exact pass, where a convection correlation (h → 0 as ΔT → 0) leaves the solver nothing to
 * iterate on.
 */
function zeroFlowProblem(problem: ThermalProblem): ThermalProblem {
  const still = (b: Boundary): Boundary =>
    b.kind === 'surface' && !(b.absorbedFlux && b.absorbedFlux > 0)
      ? { kind: 'surface', ambient: b.ambient, h: 1, emissivity: 0, ...(b.areaFactor !== undefined ? { areaFactor: b.areaFactor } : {}) }
      : b;
  return { ...problem, inner: still(problem.inner), outer: still(problem.outer) };
}

/** One heat-balance solve of the candidate's model (of every solved cable of a buried group). */
export function solveAt(ctx: SizingContext, modelCurrentA: number, acFactor: number, mesh: Mesh): GroupSteadyResult {
  ctx.solves++;
  try {
    const group = ctx.group;
    const result: GroupSteadyResult =
      group && group.model.kind === 'buried' && !group.isolated
        ? solveBuriedGroup(ctx, group, group.model, modelCurrentA, acFactor, mesh)
        : modelCurrentA === 0 && ctx.model.fixedHeatWPerM === 0
          ? solveSteady(zeroFlowProblem(ctx.model.problem(0, acFactor, mesh)))
          : ctx.model.solver(mesh).at(modelCurrentA, acFactor);
    // A group's runaway (mutual heating feeding itself) comes without an onset current; only a
    // single cable's "no steady state even at 0 A" is the solver failing.
    if (!result.converged && result.runaway && !result.group && !(result.runaway.current !== undefined && result.runaway.current > 0)) {
      // "No steady state even at 0 A" is impossible physically (with no current the conductor
      // settles at the surroundings' temperature, or above it in the sun): this is the solver
      // failing to settle, not a runaway. Say so rather than report a runaway.
      throw new SizingError(
        'SOLVER_NOT_CONVERGED',
        `the heat-balance solver could not settle at ${fmt(modelCurrentA)} A (it reports no steady state even at 0 A, which cannot be true); no temperature is reported`,
      );
    }
    return result;
  } catch (e) {
    if (e instanceof Error && e.name === 'ThermalInputError') {
      const field = (e as Error & { field?: string }).field;
      throw new ElectricalInputError(`thermal.${field ?? 'problem'}`, e.message);
    }
    throw e;
  }
}

/** AC resistance of the MODEL conductor per metre at a temperature (for the closed form). */
export function modelResistance(ctx: SizingContext, temperatureC: number): number {
  const { model, cand } = ctx;
  return ((model.rho20 * (1 + cand.alpha20 * (temperatureC - 20))) / model.areaM2) * ctx.acFn(temperatureC).factor;
}

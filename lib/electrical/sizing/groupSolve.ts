/**
 * The heat balance of a buried group (cableGroup.ts): every solved cable's 1-D model with its own
 * external resistance and the ground raised by the others' heat, each cable's heat taken at its
 * own solved temperature, repeated until the heats settle (Picard on the losses; the coupling is
 * weak — a watt more in a neighbour moves a cable by ρ/(2π)·ln(d′/d) ≈ 0.1–0.5 K — so it settles
 * in a handful of rounds). The result of the hottest cable of the circuit being sized governs.
 */
import type { SteadyResult } from '../../thermal';
import { SizingError } from '../errors';
import { ductAirT4, externalRise, type BuriedGroupModel, type CableGroup } from './cableGroup';
import type { SizingContext } from './context';
import { heatPerMetre, readLimits, type Mesh } from './model';

/** Relative change of every cable's heat below which the group is settled. */
const HEAT_SETTLED = 1e-10;
const MAX_ROUNDS = 60;

export interface GroupCableState {
  /** Index into the group's cables. */
  cable: number;
  /** Null for a neighbour given only by its heat (not solved). */
  conductorC: number | null;
  surfaceC: number | null;
  heatWPerM: number;
  /** Rise of its surroundings above the ground from the other cables, K (null when not solved). */
  riseFromOthersK: number | null;
}

export interface GroupSolution {
  /** Index of the governing cable (the hottest against its limit, of the circuit being sized). */
  governingCable: number;
  cables: GroupCableState[];
  rounds: number;
}

export type GroupSteadyResult = SteadyResult & { group?: GroupSolution };

/** Neighbour units carry the candidate's cable at their own current: its model current. */
function neighbourModelCurrent(ctx: SizingContext, conductorA: number): number {
  return conductorA * ctx.model.currentScale;
}

export function solveBuriedGroup(ctx: SizingContext, group: CableGroup, model: BuriedGroupModel, modelCurrentA: number, acFactor: number, mesh: Mesh): GroupSteadyResult {
  const de = group.cables[0].externalDiameterM;
  const ground = ctx.model.referenceC;
  const units = model.units;
  // First guess of each unit's heat: none (the rounds converge from below: more heat, more rise).
  const heat = units.map(() => 0);
  const meanAirC = units.map(() => ground);
  const neighbourFactor = units.map(() => acFactor);
  const results: (SteadyResult | null)[] = units.map(() => null);
  const heatOfCable = (k: number) => {
    const u = model.unitOfCable[k];
    return u < 0 ? model.fixedHeatWPerM[k] : heat[u];
  };
  let rounds = 0;
  for (; rounds < MAX_ROUNDS; rounds++) {
    let largestChange = 0;
    let largestHeat = 0;
    for (let i = 0; i < units.length; i++) {
      const unit = units[i];
      const rise = externalRise(unit, heatOfCable);
      const ductAir = ductAirT4(model, unit.members.length > 0 ? group.cables[unit.cable].externalDiameterM : de, meanAirC[i]);
      const t4 = unit.ownT4 + ductAir;
      const current = unit.rated ? modelCurrentA : neighbourModelCurrent(ctx, unit.fixedConductorA ?? 0);
      const factor = unit.rated ? acFactor : neighbourFactor[i];
      ctx.solves++;
      const r = ctx.model.solveWithOuter(mesh, current, factor, { hWPerM2K: 1 / (t4 * Math.PI * group.cables[unit.cable].externalDiameterM), ambientC: ground + rise });
      if (!r.converged) return { ...r, group: { governingCable: unit.cable, cables: [], rounds } };
      results[i] = r;
      const w = heatPerMetre(ctx.model, r);
      largestChange = Math.max(largestChange, Math.abs(w - heat[i]));
      largestHeat = Math.max(largestHeat, w);
      heat[i] = w;
      // The duct air sits between the cable surface and the duct: its mean temperature is the
      // cable surface less half the drop across T₄′ (IEC 60287-2-1 §4.2.7.1 evaluates T₄′ at θ_m).
      meanAirC[i] = r.surfaceTemperature - 0.5 * w * ductAir;
      if (!unit.rated) {
        const limits = readLimits(ctx.model, r, ctx.cand.contactLimit);
        neighbourFactor[i] = ctx.acFn(limits.conductorC).factor;
      }
    }
    if (largestChange <= HEAT_SETTLED * Math.max(largestHeat, 1e-12)) break;
  }
  if (rounds >= MAX_ROUNDS) throw new SizingError('SOLVER_NOT_CONVERGED', 'the heats of the buried group did not settle');
  // The governing cable: the rated unit with the largest excess over its limit.
  let governing = -1;
  let worst = Number.NEGATIVE_INFINITY;
  const states: GroupCableState[] = [];
  units.forEach((unit, i) => {
    const r = results[i]!;
    const limits = readLimits(ctx.model, r, ctx.cand.contactLimit);
    const rise = externalRise(unit, heatOfCable);
    for (const k of unit.members) states.push({ cable: k, conductorC: limits.conductorC, surfaceC: r.surfaceTemperature, heatWPerM: heat[i], riseFromOthersK: rise });
    if (unit.rated && limits.excessK > worst) {
      worst = limits.excessK;
      governing = i;
    }
  });
  for (let k = 0; k < group.cables.length; k++) {
    if (model.unitOfCable[k] < 0) states.push({ cable: k, conductorC: null, surfaceC: null, heatWPerM: model.fixedHeatWPerM[k], riseFromOthersK: null });
  }
  states.sort((a, b) => a.cable - b.cable);
  const r = results[governing]!;
  return { ...r, group: { governingCable: units[governing].cable, cables: states, rounds: rounds + 1 } };
}

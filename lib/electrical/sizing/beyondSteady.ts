/**
 * Optional checks beyond the steady state (physics.md §6), on the same thermal model of a
 * candidate as the steady evaluation:
 *   - over time: overload time-to-limit from the design current, a daily load profile repeated to
 *     its periodic state, and the fault with heat flowing into the coverings next to the IEC 60949
 *     adiabatic figure;
 *   - along the run (bars): conduction along the bar between terminals with bolted joints.
 * The heat balance is lib/thermal's (transientRuns.ts, barRun.ts); this module builds the inputs
 * from a candidate and its conditions and turns the answers into flags a reviewer can read.
 */
import {
  DEFAULT_JOINT_RESISTANCE_MICRO_OHM,
  dailyCycle,
  faultHeating,
  overloadTimeToLimit,
  solveBarRun,
  type BarRunEnd,
  type HotSpotPoint,
  type ThermalProblem,
} from '../../thermal';
import { ElectricalInputError } from '../errors';
import { sizingContext, toModelCurrent } from './context';
import { evaluateCandidate } from './evaluate';
import { FlagSet, fmt, type AssumptionFlag } from './flags';
import { prepareConditions } from './prepareConditions';
import type { Candidate, Conditions, CandidateEvaluationOk } from './types';

/**
 * Volumetric heat capacity of the conductor metal, J/(m³·K): IEC 60949 Table I σ_c, copper
 * 3.45e6, aluminium 2.5e6 (from memory) — the values behind the adiabatic K.
 */
export const CONDUCTOR_VOLUMETRIC_HEAT_CAPACITY = { copper: 3.45e6, aluminium: 2.5e6 } as const;
/** Polymer coverings, J/(m³·K): a mid value of the IEC 60853-2 table for PVC/PE/XLPE (≈1.7–2.4e6, from memory). */
export const COVERING_VOLUMETRIC_HEAT_CAPACITY = 2.0e6;

export interface OverTimeInputs {
  /** Overload current per phase, A, and how long it must be carried, s. */
  overload?: { currentA: number; durationS: number };
  /** Currents per phase over one day in equal intervals from midnight (24 = hourly), A. */
  dailyCurrentsA?: number[];
  /** Fault heating with heat flowing into the coverings (uses conditions.fault). */
  fault?: boolean;
}

export interface OverTimeResult {
  limitC: number;
  overload?: {
    currentA: number;
    durationS: number;
    outcome: 'reaches-limit' | 'not-within-max-time' | 'steady-below-limit' | 'already-over-limit';
    timeToLimitS: number | null;
    passes: boolean;
    series: HotSpotPoint[];
  };
  daily?: {
    peakC: number;
    peakTimeS: number;
    days: number;
    periodic: boolean;
    passes: boolean;
    series: HotSpotPoint[];
  };
  fault?: {
    /** Where the fault's heat flows out of the conductor: a cable's coverings, or a bare bar's surroundings. */
    heatFlowsInto: 'coverings' | 'surroundings';
    initialC: number;
    finalC: number;
    adiabaticModelC: number;
    iecAdiabaticC: number | null;
    limitC: number | null;
    passes: boolean | null;
    series: { timeS: number; hotSpotC: number; adiabaticC: number }[];
  };
  flags: AssumptionFlag[];
}

function evaluated(candidate: Candidate, conditions: Conditions): CandidateEvaluationOk {
  const e = evaluateCandidate(candidate, conditions);
  if (!e.ok) throw new ElectricalInputError(e.error.field ?? 'candidate', e.error.message);
  return e;
}

/** The candidate's thermal model with heat capacities, and the model current of a circuit current. */
function transientModel(candidate: Candidate, conditions: Conditions, evaluation: CandidateEvaluationOk, flags: FlagSet) {
  const ctx = sizingContext(candidate, prepareConditions(conditions), 0);
  const { cand, cond, model } = ctx;
  if (ctx.busbar?.pack) {
    // The runs over time use the one-bar slab; a pack's bars share heat and current unequally.
    throw new ElectricalInputError('candidate.barsPerPhase', 'the checks over time are for one bar per phase; a pack of bars is rated in the steady state only');
  }
  const acFactor = ctx.acFn(evaluation.limit.temperatureC).factor;
  const base = model.problem(0, acFactor, 'coarse');
  const metal = CONDUCTOR_VOLUMETRIC_HEAT_CAPACITY[cand.material];
  const density = cand.constants.densityKgPerM3;
  const problem: ThermalProblem = {
    ...base,
    geometry: {
      ...base.geometry,
      layers: base.geometry.layers.map((l) =>
        l.generating ? { ...l, density, heatCapacity: metal / density } : { ...l, density: 1000, heatCapacity: COVERING_VOLUMETRIC_HEAT_CAPACITY / 1000 },
      ),
    },
  };
  if (base.geometry.layers.some((l) => !l.generating)) {
    flags.add('HEAT_CAPACITY_ASSUMED', `Coverings taken at ${fmt(COVERING_VOLUMETRIC_HEAT_CAPACITY / 1e6)} MJ/(m³·K) (a mid value for polymers, from memory); the metal at its IEC 60949 value.`);
  }
  if (cond.placement === 'buried') {
    flags.add('HEAT_CAPACITY_ASSUMED', 'The soil is taken as a steady thermal resistance: it stores no heat, so the cable heats faster than in real ground (cautious).');
  }
  const toModel = (circuitA: number) => toModelCurrent(ctx, circuitA);
  return { problem, toModel };
}

function withCurrent(problem: ThermalProblem, currentA: number): ThermalProblem {
  return { ...problem, source: { ...problem.source, current: currentA } as ThermalProblem['source'] };
}

/** Runs the checks over time that have inputs. */
export function overTimeCheck(candidate: Candidate, conditions: Conditions, inputs: OverTimeInputs): OverTimeResult {
  const evaluation = evaluated(candidate, conditions);
  const flags = new FlagSet();
  const limitC = evaluation.limit.temperatureC;
  const { problem, toModel } = transientModel(candidate, conditions, evaluation, flags);
  const rescale = (s: HotSpotPoint[], modelToCircuit: number): HotSpotPoint[] => s.map((p) => ({ ...p, currentA: p.currentA * modelToCircuit }));
  const modelToCircuit = conditions.designCurrentA > 0 ? conditions.designCurrentA / toModel(conditions.designCurrentA) : 1;
  const result: OverTimeResult = { limitC, flags: [] };

  if (inputs.overload) {
    const { currentA, durationS } = inputs.overload;
    const r = overloadTimeToLimit({
      problem: withCurrent(problem, toModel(conditions.designCurrentA)),
      overloadCurrentA: toModel(currentA),
      limitC,
      maxTimeS: 2 * durationS,
    });
    const passes = r.outcome === 'steady-below-limit' || (r.outcome !== 'already-over-limit' && (r.timeToLimitS === null || r.timeToLimitS >= durationS));
    result.overload = { currentA, durationS, outcome: r.outcome, timeToLimitS: r.timeToLimitS, passes, series: rescale(r.series, modelToCircuit) };
    if (!passes) {
      flags.add(
        'OVERLOAD_LIMIT_REACHED',
        r.outcome === 'already-over-limit'
          ? `Already at the ${fmt(limitC)} °C limit before the overload starts.`
          : `At ${fmt(currentA)} A the hot spot reaches ${fmt(limitC)} °C after ${fmt(r.timeToLimitS! / 60)} min, before the ${fmt(durationS / 60)} min the overload must last.`,
      );
    }
  }

  if (inputs.dailyCurrentsA && inputs.dailyCurrentsA.length > 0) {
    const r = dailyCycle({ problem, currentsA: inputs.dailyCurrentsA.map(toModel), limitC });
    result.daily = { peakC: r.peakC, peakTimeS: r.peakTimeS, days: r.days, periodic: r.periodic, passes: r.peakC <= limitC, series: rescale(r.series, modelToCircuit) };
    if (!r.periodic) flags.add('DAILY_CYCLE_NOT_PERIODIC', `The daily peak had not settled after ${r.days} days; the last day's peak is shown.`);
    if (r.peakC > limitC) {
      flags.add('DAILY_PEAK_OVER_LIMIT', `The repeated daily load peaks at ${fmt(r.peakC)} °C at ${clock(r.peakTimeS)}, above the ${fmt(limitC)} °C limit.`);
    }
  }

  if (inputs.fault && conditions.fault) {
    const sc = evaluation.shortCircuit;
    const initialC = sc.initialC ?? limitC;
    const r = faultHeating({ problem: withCurrent(problem, toModel(conditions.designCurrentA)), faultCurrentA: toModel(conditions.fault.currentA), durationS: conditions.fault.durationS, initialC, steps: 400 });
    const scLimit = sc.limitC ?? null;
    const heatFlowsInto = problem.geometry.layers.some((l) => !l.generating) ? 'coverings' : 'surroundings';
    result.fault = {
      heatFlowsInto,
      initialC,
      finalC: r.finalHotSpotC,
      adiabaticModelC: r.finalAdiabaticC,
      iecAdiabaticC: sc.finalC ?? null,
      limitC: scLimit,
      passes: scLimit === null ? null : r.finalHotSpotC <= scLimit,
      series: r.series,
    };
    const aboveIec = sc.finalC != null && r.finalHotSpotC > sc.finalC;
    flags.add(
      'FAULT_HEAT_INTO_COVERINGS',
      `With heat flowing into the ${heatFlowsInto} the fault ends at ${fmt(r.finalHotSpotC)} °C, against ${sc.finalC == null ? 'no' : fmt(sc.finalC)} °C by the IEC 60949 adiabatic method; the withstand verdict stays with the adiabatic figure.` +
        (aboveIec
          ? ` The model ends higher: it heats the conductor with the candidate's own AC resistance (its R₂₀ with the skin and proximity effect), which the adiabatic K of IEC 60949 leaves out — with no heat flowing out at all the model reaches ${fmt(r.finalAdiabaticC)} °C. Weigh the higher figure.`
          : ''),
    );
  }
  result.flags = flags.list();
  return result;
}

function clock(timeS: number): string {
  const minutes = Math.round(timeS / 60);
  return `${String(Math.floor(minutes / 60) % 24).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}

// ───────────────────────────── Along the run ─────────────────────────────

export interface AlongRunInputs {
  lengthM: number;
  start: BarRunEnd;
  end: BarRunEnd;
  joints: { positionM: number; resistanceMicroOhm: number | null }[];
}

export interface AlongRunResult {
  limitC: number;
  hotSpot: { temperatureC: number; positionM: number };
  passes: boolean;
  positionsM: number[];
  temperaturesC: number[];
  joints: { positionM: number; resistanceMicroOhm: number; temperatureC: number; heatW: number; assumed: boolean }[];
  heatIntoStartW: number;
  heatIntoEndW: number;
  flags: AssumptionFlag[];
}

/** A bar candidate's run between its terminals, at the design current. */
export function alongRunCheck(candidate: Candidate, conditions: Conditions, inputs: AlongRunInputs): AlongRunResult {
  if (candidate.kind !== 'bar') throw new ElectricalInputError('candidate.kind', 'the run along the length is for bars');
  const evaluation = evaluated(candidate, conditions);
  const ctx = sizingContext(candidate, prepareConditions(conditions), 0);
  const { cand, cond } = ctx;
  const flags = new FlagSet();
  const limitC = evaluation.limit.temperatureC;
  if (cand.kind !== 'bar' || (cond.placement !== 'bar-on-edge' && cond.placement !== 'bar-flat')) {
    throw new ElectricalInputError('conditions.installation', 'the run along the length needs a bar on edge or laid flat');
  }
  if (cand.barsPerPhase > 1) {
    throw new ElectricalInputError('candidate.barsPerPhase', 'the run along the length is for one bar per phase; a pack of bars is rated in the steady state only');
  }
  const acFactor = ctx.acFn(limitC).factor;
  const r = solveBarRun({
    lengthM: inputs.lengthM,
    widthM: cand.widthM,
    thicknessM: cand.thicknessM,
    barsPerPhase: cand.barsPerPhase,
    // One pack per parallel run; derating as in the steady model.
    currentA: conditions.designCurrentA / cand.parallel / (cond.groupingFactor * cond.enclosureFactor),
    r20OhmPerM: cand.r20,
    alpha20PerK: cand.alpha20,
    acFactor,
    conductivityWPerMK: cand.constants.thermalConductivityWPerMK,
    orientation: cond.placement === 'bar-flat' ? 'flat' : 'edge',
    ambientC: cond.ambientC,
    emissivity: cand.emissivity,
    ...(cond.windSpeedMPerS > 0 ? { windMps: cond.windSpeedMPerS } : {}),
    ...(cond.surfaceCoefficientWPerM2K !== undefined ? { fixedHWPerM2K: cond.surfaceCoefficientWPerM2K } : {}),
    start: inputs.start,
    end: inputs.end,
    joints: inputs.joints.map((j) => (j.resistanceMicroOhm === null ? { positionM: j.positionM } : { positionM: j.positionM, resistanceMicroOhm: j.resistanceMicroOhm })),
  });
  const assumed = r.joints.filter((j) => j.assumed).length;
  if (assumed > 0) {
    flags.add('JOINT_RESISTANCE_ASSUMED', `${assumed} joint${assumed > 1 ? 's' : ''} without an entered resistance: ${DEFAULT_JOINT_RESISTANCE_MICRO_OHM} µΩ assumed each (pessimistic, common practice, not a measurement).`);
  }
  const passes = r.converged && r.hotSpot.temperatureC <= limitC;
  if (!passes) {
    flags.add(
      'RUN_HOT_SPOT_OVER_LIMIT',
      r.converged
        ? `Along the run the hot spot reaches ${fmt(r.hotSpot.temperatureC)} °C at ${fmt(r.hotSpot.positionM)} m, above the ${fmt(limitC)} °C limit.`
        : 'No steady state along the run at the design current.',
    );
  }
  return {
    limitC,
    hotSpot: r.hotSpot,
    passes,
    positionsM: r.positionsM,
    temperaturesC: r.temperaturesC,
    joints: r.joints.map((j) => ({ positionM: j.positionM, resistanceMicroOhm: j.resistanceMicroOhm, temperatureC: j.temperatureC, heatW: j.heatW, assumed: j.assumed })),
    heatIntoStartW: r.heatIntoStartW,
    heatIntoEndW: r.heatIntoEndW,
    flags: flags.list(),
  };
}

/**
 * Heat balance over time (physics.md §6): overload time-to-limit, fault heating with heat flowing
 * into the coverings, and a daily load profile repeated to a periodic steady state.
 *
 * Every run marches implicit-Euler steps on the same finite-volume assembly and outer iteration
 * as `solveSteady`/`solveTransient` (assembly.ts, iterate.ts): a_P gains ρcΔV/Δt and b gains
 * ρcΔV/Δt·T_old; the Joule source is re-evaluated at each step's own temperatures and current
 * (the iteration converges every step), so R(T) follows the temperature. Implicit Euler is first
 * order in time: the defaults below choose steps small against the time being resolved, and
 * every result says which step it used. The steady states a run starts from come from one
 * prepared problem per run (prepare.ts), not from a new solve of a rebuilt problem each time.
 *
 * Mesh and time scale: the steady mesh a caller passes may be coarse in the coverings (the sizing
 * layer uses 4 cells per covering, exact in steady state). Over the long times of an overload or a
 * daily cycle the heat crosses a covering in minutes (penetration depth √(αt) of XLPE over 30 min
 * ≈ 15 mm, against layers of 1–3 mm), so that mesh holds. A fault of about a second heats only a
 * skin √(αt) ≈ 0.4 mm deep, and four cells per covering miss a fifth to a quarter of the heat
 * flowing into it; faultHeating therefore refines the coverings itself (see refineCoverings).
 */
import { createContext, type SolverContext } from './assembly';
import { cellCount } from './mesh';
import { ThermalInputError } from './errors';
import { iterate } from './iterate';
import type { NormalizedProblem } from './normalized';
import { preparedFrom, type PreparedProblem } from './prepare';
import type { ThermalFlag, ThermalProblem } from './types';
import {
  requireHeatCapacities,
  requirePositive,
  requirePositiveInteger,
  requireRecord,
  requireSteadyHeatPath,
  requireTemperature,
  validateProblem,
} from './validate';

/** One point of a hot-spot-versus-time series. */
export interface HotSpotPoint {
  /** s from the start of the run (or of the day, for a daily cycle) */
  timeS: number;
  /** °C, hottest cell */
  hotSpotC: number;
  /** A, the current flowing during the step that ended here */
  currentA: number;
}

/** A marcher: implicit-Euler steps of fixed length on one problem, at any current. */
interface Marcher {
  ctx: SolverContext;
  cellCount: number;
  /** One step from `previous` (°C per cell) at `currentA`; null when the step does not converge. */
  step(previous: Float64Array, currentA: number): Float64Array<ArrayBufferLike> | null;
}

/** A run's problem, validated once: marchers at any step, steady states at any current. */
interface RunModel {
  normalized: NormalizedProblem;
  /** Steady state per cell at `currentA`, or null when there is none. */
  steadyCells(currentA: number): { temperatures: Float64Array; hotSpotC: number } | null;
  marcher(timeStepS: number): Marcher;
}

function requireJoule(problem: ThermalProblem): void {
  if (problem?.source?.kind !== 'joule') throw new ThermalInputError('problem.source.kind', "must be 'joule' (the current changes over time)");
}

function runModel(problem: ThermalProblem): RunModel {
  requireJoule(problem);
  const normalized = validateProblem(problem, false);
  requireHeatCapacities(normalized);
  return runModelOf(normalized);
}

function runModelOf(normalized: NormalizedProblem): RunModel {
  const acFactor = normalized.source.kind === 'joule' ? normalized.source.acFactor : 1;
  let steady: PreparedProblem | undefined;
  return {
    normalized,
    steadyCells(currentA) {
      if (!steady) {
        requireSteadyHeatPath(normalized);
        steady = preparedFrom(normalized);
      }
      const r = steady.at(currentA, acFactor);
      if (!r.converged) return null;
      return { temperatures: Float64Array.from(r.temperatures), hotSpotC: hottest(r.temperatures) };
    },
    marcher(timeStepS) {
      // Own storage: a run interleaves steps with steady solves.
      const ctx = createContext(normalized, timeStepS);
      const n = ctx.mesh.cellCount;
      return {
        ctx,
        cellCount: n,
        step(previous, currentA) {
          const outcome = iterate(ctx, {
            start: previous,
            previous,
            currentA,
            surfaceStart: { inner: previous[0], outer: previous[n - 1] },
          });
          return outcome.status === 'converged' ? Float64Array.from(outcome.temperatures) : null;
        },
      };
    },
  };
}

function hottest(t: ArrayLike<number>): number {
  let h = -Infinity;
  for (let i = 0; i < t.length; i++) if (t[i] > h) h = t[i];
  return h;
}

// ─────────────────────────────────── Overload ───────────────────────────────────

export interface OverloadInput {
  /** The conductor at its starting current (Joule source); layers carry density and heat capacity. */
  problem: ThermalProblem;
  /** Current from t = 0, A. */
  overloadCurrentA: number;
  /** Hot-spot limit, °C. */
  limitC: number;
  /** Longest time looked at, s. */
  maxTimeS: number;
  /** Implicit-Euler step, s (default maxTimeS/400, refined when the limit comes early). */
  timeStepS?: number;
}

export type OverloadOutcome =
  /** The hot spot reaches the limit at `timeToLimitS`. */
  | 'reaches-limit'
  /** The steady state at the overload would exceed the limit, but not within maxTimeS. */
  | 'not-within-max-time'
  /** The overload has a steady state below the limit: it can be carried indefinitely. */
  | 'steady-below-limit'
  /** Already at or over the limit at the starting current. */
  | 'already-over-limit';

export interface OverloadResult {
  outcome: OverloadOutcome;
  /** s, linear interpolation between the two steps around the crossing; null unless reached. */
  timeToLimitS: number | null;
  limitC: number;
  startingCurrentA: number;
  overloadCurrentA: number;
  /** Steady hot spot at the starting current, °C. */
  initialHotSpotC: number;
  /** Steady hot spot at the overload current, °C; null when there is none (runaway). */
  overloadSteadyHotSpotC: number | null;
  timeStepS: number;
  /** Hot spot against time from t = 0 (first point: the starting state). */
  series: HotSpotPoint[];
  flags: ThermalFlag[];
}

/** Steps over the horizon by default, and at least this many before the crossing. */
const OVERLOAD_STEPS = 400;
const STEPS_BEFORE_CROSSING = 200;

function marchToLimit(
  model: RunModel,
  start: Float64Array,
  currentA: number,
  limitC: number,
  maxTimeS: number,
  timeStepS: number,
): { series: HotSpotPoint[]; crossingS: number | null; stepsToCrossing: number; failedAtS?: number } {
  const m = model.marcher(timeStepS);
  const series: HotSpotPoint[] = [{ timeS: 0, hotSpotC: hottest(start), currentA: 0 }];
  let t: Float64Array<ArrayBufferLike> = start;
  const steps = Math.ceil(maxTimeS / timeStepS - 1e-9);
  for (let k = 1; k <= steps; k++) {
    const next = m.step(t, currentA);
    if (!next) return { series, crossingS: null, stepsToCrossing: k, failedAtS: (k - 1) * timeStepS };
    const before = series[series.length - 1].hotSpotC;
    const now = hottest(next);
    series.push({ timeS: k * timeStepS, hotSpotC: now, currentA });
    if (now >= limitC) {
      const fraction = now === before ? 1 : (limitC - before) / (now - before);
      return { series, crossingS: (k - 1 + fraction) * timeStepS, stepsToCrossing: k };
    }
    t = next;
  }
  return { series, crossingS: null, stepsToCrossing: steps };
}

/**
 * How long an overload can flow, starting from the steady state at the problem's current.
 * Throws ThermalInputError (field named) for invalid input or a starting current without a
 * steady state.
 */
export function overloadTimeToLimit(input: OverloadInput): OverloadResult {
  const raw = requireRecord(input, 'overload');
  const problem = raw.problem as ThermalProblem;
  requireJoule(problem);
  const startingCurrentA = (problem.source as { current: number }).current;
  const overloadCurrentA = requirePositive(raw.overloadCurrentA, 'overloadCurrentA');
  const limitC = requireTemperature(raw.limitC, 'limitC');
  const maxTimeS = requirePositive(raw.maxTimeS, 'maxTimeS');
  const given = raw.timeStepS === undefined ? undefined : requirePositive(raw.timeStepS, 'timeStepS');

  const model = runModel(problem);
  const initial = model.steadyCells(startingCurrentA);
  if (!initial) throw new ThermalInputError('problem.source.current', 'has no steady state to start the overload from');
  const overloadSteady = model.steadyCells(overloadCurrentA);
  const flags: ThermalFlag[] = [...(problem.assumptions ?? [])];
  const base = {
    limitC,
    startingCurrentA,
    overloadCurrentA,
    initialHotSpotC: initial.hotSpotC,
    overloadSteadyHotSpotC: overloadSteady ? overloadSteady.hotSpotC : null,
  };
  if (initial.hotSpotC >= limitC) {
    return {
      ...base,
      outcome: 'already-over-limit',
      timeToLimitS: 0,
      timeStepS: given ?? maxTimeS / OVERLOAD_STEPS,
      series: [{ timeS: 0, hotSpotC: initial.hotSpotC, currentA: startingCurrentA }],
      flags,
    };
  }

  let timeStepS = given ?? maxTimeS / OVERLOAD_STEPS;
  let run = marchToLimit(model, initial.temperatures, overloadCurrentA, limitC, maxTimeS, timeStepS);
  if (given === undefined && run.crossingS !== null && run.stepsToCrossing < STEPS_BEFORE_CROSSING) {
    // The limit came early: resolve the rise with enough steps (first-order error ∝ Δt).
    timeStepS = (run.stepsToCrossing * timeStepS) / STEPS_BEFORE_CROSSING;
    run = marchToLimit(model, initial.temperatures, overloadCurrentA, limitC, maxTimeS, timeStepS);
  }
  run.series[0].currentA = startingCurrentA;
  if (run.failedAtS !== undefined) {
    flags.push({
      code: 'transient-step-not-converged',
      severity: 'warning',
      message: `A time step after ${run.failedAtS.toFixed(0)} s did not converge; the series stops there.`,
    });
  }
  let outcome: OverloadOutcome;
  if (run.crossingS !== null) outcome = 'reaches-limit';
  else if (overloadSteady && overloadSteady.hotSpotC < limitC) outcome = 'steady-below-limit';
  else outcome = 'not-within-max-time';
  return { ...base, outcome, timeToLimitS: run.crossingS, timeStepS, series: run.series, flags };
}

// ─────────────────────────────────── Fault ───────────────────────────────────

export interface FaultHeatingInput {
  /** The conductor and its coverings at the pre-fault current (Joule source). */
  problem: ThermalProblem;
  faultCurrentA: number;
  durationS: number;
  /** Start from the steady state at the pre-fault current (default) or uniformly at this °C. */
  initialC?: number;
  /** Implicit-Euler steps over the fault (default 1000). */
  steps?: number;
}

export interface FaultHeatingResult {
  /** Hottest cell at the start, °C. */
  initialHotSpotC: number;
  /** Hot spot at the end of the fault with heat flowing into the coverings, °C. */
  finalHotSpotC: number;
  /**
   * Hot spot at the end of the fault when no heat leaves the generating layers (their faces made
   * adiabatic): the same model's counterpart of the IEC 60949 adiabatic method, °C.
   */
  finalAdiabaticC: number;
  /** Conductor-average temperatures at the end, °C (the quantity the adiabatic method describes). */
  finalConductorMeanC: number;
  finalAdiabaticConductorMeanC: number;
  timeStepS: number;
  series: { timeS: number; hotSpotC: number; adiabaticC: number }[];
  /**
   * Cells per layer of the run with heat into the coverings: the generating layers as given, the
   * coverings refined for the fault's time scale (see refineCoverings).
   */
  cellsPerLayer: number[];
  /**
   * How much the final hot spot moved at the last doubling of the covering cells, K (0: no
   * coverings; +Infinity: the first size was already the cap, nothing to compare with).
   */
  meshChangeK: number;
  flags: ThermalFlag[];
}

const FAULT_STEPS = 1000;

/**
 * Covering refinement for a fault (issue 16). The heat a fault drives into a covering flows
 * through a skin of the thermal penetration depth δ = √(αt), α = k/(ρc), t the fault duration;
 * the covering cells must be small against δ for the first half-cell to carry that flow. So:
 *   1. every covering's cells are doubled until a cell is at most δ/CELLS_PER_PENETRATION_DEPTH
 *      thick (a first size, no run needed);
 *   2. the fault is run, the covering cells doubled and the fault run again, until the final hot
 *      spot moves by at most FAULT_MESH_TOLERANCE of the credit for the heat flowing into the
 *      coverings (adiabatic minus non-adiabatic final hot spot) — or by 1e-6 of the rise, when
 *      that credit is nil — and the finer run is reported;
 *   3. at MAX_COVERING_CELLS per layer the refinement stops and, if the result was still moving,
 *      says so in a flag.
 * Measured on XLPE/PVC copper cables of 70–240 mm² at 1 s (tests/lib/thermal/fault-mesh.test.ts):
 * the credit is second order in the cell size (each doubling cuts the change about fourfold), so
 * the reported run is within about a third of the tolerance of the mesh-converged credit.
 */
const CELLS_PER_PENETRATION_DEPTH = 4;
const FAULT_MESH_TOLERANCE = 0.005;
const MAX_COVERING_CELLS = 1024;

/** The contiguous generating layers alone, both faces adiabatic (symmetry = zero flux). */
function adiabaticConductor(problem: NormalizedProblem): { problem: NormalizedProblem; first: number; cells: number } {
  const layers = problem.geometry.layers;
  const first = layers.findIndex((l) => l.generating);
  if (first < 0) throw new ThermalInputError('problem.geometry.layers', 'has no generating layer');
  let last = first;
  while (last + 1 < layers.length && layers[last + 1].generating) last++;
  let innerRadius = problem.geometry.innerRadius;
  for (let i = 0; i < first; i++) innerRadius += layers[i].thickness;
  const kept = layers.slice(first, last + 1);
  return {
    problem: {
      ...problem,
      geometry: { ...problem.geometry, innerRadius: problem.geometry.kind === 'cylinder' ? innerRadius : 0, layers: kept },
      inner: { kind: 'symmetry' },
      outer: { kind: 'symmetry' },
    },
    first: layers.slice(0, first).reduce((s, l) => s + l.cells, 0),
    cells: kept.reduce((s, l) => s + l.cells, 0),
  };
}

function volumeMean(ctx: SolverContext, t: ArrayLike<number>): number {
  let sum = 0;
  let volume = 0;
  for (let i = 0; i < t.length; i++) {
    if (!ctx.mesh.generating[i]) continue;
    sum += t[i] * ctx.mesh.volumes[i];
    volume += ctx.mesh.volumes[i];
  }
  return sum / volume;
}

/** The problem with layer i at `cells[i]` cells (validated once: only the mesh changes). */
function withCells(problem: NormalizedProblem, cells: number[]): NormalizedProblem {
  return { ...problem, geometry: { ...problem.geometry, layers: problem.geometry.layers.map((l, i) => ({ ...l, cells: cells[i] })) } };
}

/** Step 1 of refineCoverings: covering cells no thicker than δ/CELLS_PER_PENETRATION_DEPTH. */
function cellsForPenetrationDepth(problem: NormalizedProblem, durationS: number): number[] {
  return problem.geometry.layers.map((l) => {
    if (l.generating) return l.cells;
    const depthM = Math.sqrt((l.conductivity / (l.density! * l.heatCapacity!)) * durationS);
    let cells = l.cells;
    while (l.thickness / cells > depthM / CELLS_PER_PENETRATION_DEPTH && 2 * cells <= MAX_COVERING_CELLS) cells *= 2;
    return cells;
  });
}

interface FaultRun {
  cells: number[];
  start: Float64Array;
  final: Float64Array<ArrayBufferLike>;
  ctx: SolverContext;
  /** Hot spot after each recorded step. */
  hotSpots: number[];
}

/** The fault marched on one problem from `initialC` or from its steady state at the pre-fault current. */
function march(
  problem: NormalizedProblem,
  cells: number[],
  args: { faultCurrentA: number; steps: number; timeStepS: number; initialC?: number; every: number },
): FaultRun {
  const model = runModelOf(withCells(problem, cells));
  const m = model.marcher(args.timeStepS);
  let start: Float64Array;
  if (args.initialC !== undefined) {
    start = new Float64Array(m.cellCount).fill(args.initialC);
  } else {
    const s = model.steadyCells((problem.source as { current: number }).current);
    if (!s) throw new ThermalInputError('problem.source.current', 'has no steady state to start the fault from');
    start = s.temperatures;
  }
  let t: Float64Array<ArrayBufferLike> = start;
  const hotSpots: number[] = [];
  for (let k = 1; k <= args.steps; k++) {
    const next = m.step(t, args.faultCurrentA);
    if (!next) throw new ThermalInputError('faultCurrentA', `heats the conductor beyond the model's temperature limit within ${(k * args.timeStepS).toPrecision(3)} s`);
    t = next;
    if (k % args.every === 0 || k === args.steps) hotSpots.push(hottest(t));
  }
  return { cells, start, final: t, ctx: m.ctx, hotSpots };
}

/**
 * The fault run with heat into the coverings on a mesh refined for the fault's time scale
 * (CELLS_PER_PENETRATION_DEPTH, FAULT_MESH_TOLERANCE above); `adiabaticC` is the final hot spot
 * of the adiabatic run, for the credit.
 */
function refineCoverings(
  normalized: NormalizedProblem,
  args: { faultCurrentA: number; steps: number; timeStepS: number; initialC?: number; every: number; durationS: number },
  adiabaticC: number,
): { run: FaultRun; changeK: number; settled: boolean } {
  const given = normalized.geometry.layers.map((l) => l.cells);
  if (!normalized.geometry.layers.some((l) => !l.generating)) return { run: march(normalized, given, args), changeK: 0, settled: true };
  const first = cellsForPenetrationDepth(normalized, args.durationS);
  let run = march(normalized, first, args);
  // No comparison yet: the change is unknown (only if the first size is already at the cap).
  let changeK = Infinity;
  for (;;) {
    const finer = run.cells.map((c, i) => (normalized.geometry.layers[i].generating ? c : Math.min(2 * c, MAX_COVERING_CELLS)));
    if (finer.every((c, i) => c === run.cells[i])) return { run, changeK, settled: false };
    const next = march(normalized, finer, args);
    const after = hottest(next.final);
    changeK = Math.abs(after - hottest(run.final));
    const credit = Math.abs(adiabaticC - after);
    const rise = Math.abs(after - hottest(next.start));
    if (changeK <= Math.max(FAULT_MESH_TOLERANCE * credit, 1e-6 * rise)) return { run: next, changeK, settled: true };
    run = next;
  }
}

/**
 * Temperature after a fault, with and without heat flowing into the coverings. The non-adiabatic
 * factor ε of the run — here the ratio of final hot-spot RISES, (finalAdiabaticC −
 * initialHotSpotC)/(finalHotSpotC − initialHotSpotC) — is what the covering refinement settles.
 */
export function faultHeating(input: FaultHeatingInput): FaultHeatingResult {
  const raw = requireRecord(input, 'fault');
  const problem = raw.problem as ThermalProblem;
  requireJoule(problem);
  const faultCurrentA = requirePositive(raw.faultCurrentA, 'faultCurrentA');
  const durationS = requirePositive(raw.durationS, 'durationS');
  const steps = raw.steps === undefined ? FAULT_STEPS : requirePositiveInteger(raw.steps, 'steps');
  const initialC = raw.initialC === undefined ? undefined : requireTemperature(raw.initialC, 'initialC');
  const timeStepS = durationS / steps;
  const every = Math.max(1, Math.floor(steps / 200));
  const normalized = validateProblem(problem, false);
  requireHeatCapacities(normalized);

  // The conductor alone, both faces adiabatic, from the given mesh's start (the coverings'
  // mesh does not change the conductor's steady state: conduction through them is exact).
  let start: Float64Array;
  if (initialC !== undefined) {
    start = new Float64Array(cellCount(normalized.geometry)).fill(initialC);
  } else {
    const s = runModelOf(normalized).steadyCells((problem.source as { current: number }).current);
    if (!s) throw new ThermalInputError('problem.source.current', 'has no steady state to start the fault from');
    start = s.temperatures;
  }
  const adiabatic = adiabaticConductor(normalized);
  const alone = runModelOf(adiabatic.problem).marcher(timeStepS);
  let conductorOnly: Float64Array<ArrayBufferLike> = start.slice(adiabatic.first, adiabatic.first + adiabatic.cells);
  const adiabaticSeries: number[] = [];
  for (let k = 1; k <= steps; k++) {
    const next = alone.step(conductorOnly, faultCurrentA);
    if (!next) throw new ThermalInputError('faultCurrentA', `heats the conductor beyond the model's temperature limit within ${(k * timeStepS).toPrecision(3)} s`);
    conductorOnly = next;
    if (k % every === 0 || k === steps) adiabaticSeries.push(hottest(conductorOnly));
  }
  const finalAdiabaticC = hottest(conductorOnly);

  const { run, changeK, settled } = refineCoverings(normalized, { faultCurrentA, steps, timeStepS, initialC, every, durationS }, finalAdiabaticC);
  const series: FaultHeatingResult['series'] = [{ timeS: 0, hotSpotC: hottest(start), adiabaticC: hottest(start.slice(adiabatic.first, adiabatic.first + adiabatic.cells)) }];
  let recorded = 0;
  for (let k = 1; k <= steps; k++) {
    if (k % every === 0 || k === steps) {
      series.push({ timeS: k * timeStepS, hotSpotC: run.hotSpots[recorded], adiabaticC: adiabaticSeries[recorded] });
      recorded++;
    }
  }
  const flags: ThermalFlag[] = [...(problem.assumptions ?? [])];
  if (!settled) {
    flags.push({
      code: 'fault-mesh-not-settled',
      severity: 'warning',
      message: `The heat flowing into the coverings still changed with the mesh at ${MAX_COVERING_CELLS} cells per covering; the fault's final temperature may be uncertain by more than ${FAULT_MESH_TOLERANCE * 100} % of that credit.`,
    });
  }
  return {
    initialHotSpotC: hottest(start),
    finalHotSpotC: hottest(run.final),
    finalAdiabaticC,
    finalConductorMeanC: volumeMean(run.ctx, run.final),
    finalAdiabaticConductorMeanC: volumeMean(alone.ctx, conductorOnly),
    timeStepS,
    series,
    cellsPerLayer: run.cells,
    meshChangeK: changeK,
    flags,
  };
}

// ─────────────────────────────────── Daily cycle ───────────────────────────────────

export interface DailyCycleInput {
  /** The conductor (Joule source; its current is not used). */
  problem: ThermalProblem;
  /**
   * Currents over one day in equal intervals from midnight (24 = hourly, 96 = quarter-hourly…),
   * each held through its interval, A.
   */
  currentsA: number[];
  /** Implicit-Euler step, s (default: the interval split into steps of at most 120 s). */
  timeStepS?: number;
  /** Days repeated at most (default 30). */
  maxDays?: number;
  /** Successive daily peaks closer than this count as periodic, K (default 0.01). */
  toleranceK?: number;
  /** Optional limit, °C, for the report. */
  limitC?: number;
}

export interface DailyCycleResult {
  /** True when successive daily peaks differed by less than the tolerance. */
  periodic: boolean;
  days: number;
  /** Peak hot spot of each simulated day, °C. */
  dailyPeaksC: number[];
  /** Peak of the last day, °C, and when it occurs, s after midnight. */
  peakC: number;
  peakTimeS: number;
  /** Lowest hot spot of the last day, °C. */
  minimumC: number;
  limitC?: number;
  exceedsLimit?: boolean;
  timeStepS: number;
  /** The last day, from midnight (first point: the state at midnight). */
  series: HotSpotPoint[];
  /** Root-mean-square current of the profile, A (the steady start). */
  rmsCurrentA: number;
  flags: ThermalFlag[];
}

const DAY_S = 86400;
const MAX_DAILY_STEP_S = 120;

export function dailyCycle(input: DailyCycleInput): DailyCycleResult {
  const raw = requireRecord(input, 'cycle');
  const problem = raw.problem as ThermalProblem;
  requireJoule(problem);
  if (!Array.isArray(raw.currentsA) || raw.currentsA.length < 24) {
    throw new ThermalInputError('currentsA', 'must list at least 24 currents (hourly) over the day');
  }
  const currents = raw.currentsA.map((c, i) => {
    if (typeof c !== 'number' || !Number.isFinite(c) || c < 0) throw new ThermalInputError(`currentsA[${i}]`, 'must be a finite current ≥ 0 A');
    return c;
  });
  const intervalS = DAY_S / currents.length;
  let timeStepS: number;
  if (raw.timeStepS === undefined) {
    timeStepS = intervalS / Math.ceil(intervalS / MAX_DAILY_STEP_S - 1e-9);
  } else {
    timeStepS = requirePositive(raw.timeStepS, 'timeStepS');
    const ratio = intervalS / timeStepS;
    if (Math.abs(ratio - Math.round(ratio)) > 1e-9) throw new ThermalInputError('timeStepS', `must divide the profile interval (${intervalS} s)`);
  }
  const stepsPerInterval = Math.round(intervalS / timeStepS);
  const maxDays = raw.maxDays === undefined ? 30 : requirePositiveInteger(raw.maxDays, 'maxDays');
  const toleranceK = raw.toleranceK === undefined ? 0.01 : requirePositive(raw.toleranceK, 'toleranceK');
  const limitC = raw.limitC === undefined ? undefined : requireTemperature(raw.limitC, 'limitC');

  // Start from the steady state at the profile's r.m.s. current (same mean Joule heat at 20 °C):
  // close to the periodic state, so few days are needed.
  const rmsCurrentA = Math.sqrt(currents.reduce((s, c) => s + c * c, 0) / currents.length);
  const flags: ThermalFlag[] = [...(problem.assumptions ?? [])];
  const model = runModel(problem);
  const m = model.marcher(timeStepS);
  let state: Float64Array<ArrayBufferLike> | undefined = model.steadyCells(rmsCurrentA)?.temperatures ?? model.steadyCells(0)?.temperatures;
  if (!state) throw new ThermalInputError('problem', 'has no steady state even without current');

  const dailyPeaksC: number[] = [];
  let series: HotSpotPoint[] = [];
  let periodic = false;
  for (let day = 1; day <= maxDays; day++) {
    series = [{ timeS: 0, hotSpotC: hottest(state), currentA: currents[currents.length - 1] }];
    let peak = -Infinity;
    for (let interval = 0; interval < currents.length; interval++) {
      for (let s = 1; s <= stepsPerInterval; s++) {
        const next = m.step(state, currents[interval]);
        if (!next) {
          throw new ThermalInputError(`currentsA[${interval}]`, `drives the conductor beyond the model's temperature limit on day ${day}`);
        }
        state = next;
        const h = hottest(state);
        peak = Math.max(peak, h);
        series.push({ timeS: (interval * stepsPerInterval + s) * timeStepS, hotSpotC: h, currentA: currents[interval] });
      }
    }
    dailyPeaksC.push(peak);
    if (day > 1 && Math.abs(peak - dailyPeaksC[day - 2]) < toleranceK) {
      periodic = true;
      break;
    }
  }
  if (!periodic) {
    flags.push({
      code: 'daily-cycle-not-periodic',
      severity: 'warning',
      message:
        dailyPeaksC.length < 2
          ? `One day is not enough to tell whether the daily peak has settled (maxDays = ${maxDays}).`
          : `The daily peak still changed by ${Math.abs(dailyPeaksC[dailyPeaksC.length - 1] - dailyPeaksC[dailyPeaksC.length - 2]).toFixed(3)} K after ${maxDays} days.`,
    });
  }
  let peakIndex = 0;
  let minimumC = Infinity;
  for (let i = 0; i < series.length; i++) {
    if (series[i].hotSpotC > series[peakIndex].hotSpotC) peakIndex = i;
    minimumC = Math.min(minimumC, series[i].hotSpotC);
  }
  const peakC = series[peakIndex].hotSpotC;
  return {
    periodic,
    days: dailyPeaksC.length,
    dailyPeaksC,
    peakC,
    peakTimeS: series[peakIndex].timeS,
    minimumC,
    ...(limitC !== undefined ? { limitC, exceedsLimit: peakC > limitC } : {}),
    timeStepS,
    series,
    rmsCurrentA,
    flags,
  };
}

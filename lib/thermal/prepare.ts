/**
 * A prepared problem (physics.md §12): validated, meshed and assembled once (diffusion, where the
 * source acts, the boundary geometry), then solved at as many currents, AC factors and ambients as
 * wanted. A call neither re-validates the problem nor re-meshes it; the exact runaway onset's
 * eigenvalue (runaway.ts) is found once, at the first call that needs it.
 *
 * `prepare(problem).at(I, F)` gives the SteadyResult that solveSteady gives for the problem with
 * source.current = I and source.acFactor = F — the same code path, so the same numbers.
 */
import { contextStoreSize, createContext, withProblem, type SolverContext } from './assembly';
import { ThermalInputError } from './errors';
import { iterate } from './iterate';
import type { NormalizedBoundary, NormalizedProblem } from './normalized';
import { slabArrays, type ArraySource } from './pool';
import { steadyStart, undrivenTemperature } from './reference';
import { convergedResult, peakPosition, unboundedResult } from './results';
import {
  boundedBelowLimit,
  eigenvalueOnsetCurrent,
  eigenvalueRunaway,
  hasLinearSurroundings,
  limitRunaway,
  slowestMode,
  type SlowestMode,
} from './runaway';
import type { SteadyResult, ThermalProblem } from './types';
import { isRecord, requireFinite, requireNonNegative, requireTemperature, validateProblem } from './validate';

/** What one call may change besides the current and the AC factor. */
export interface PreparedSolveOptions {
  /**
   * °C: the outer boundary's air (surface) or ground/fixed temperature (temperature boundary) for
   * this call — e.g. the ambient of one cable raised by its neighbours' heating. The radiative
   * surroundings of a surface follow it unless the problem gave them explicitly. A flux or
   * symmetry boundary has no ambient: asking for one is an input error.
   */
  outerAmbientC?: number;
  /** °C: the same for the inner boundary (a bus bar has air on both faces). */
  innerAmbientC?: number;
  /**
   * The heats of the problem's point sources for this call, in their order (W per metre of
   * cylinder or per m² of slab): a cable's screen loss follows its conductor's loss.
   */
  pointHeats?: readonly number[];
}

export interface PreparedProblem {
  /** Cells of the mesh: every result has this many positions. */
  readonly cellCount: number;
  /** The steady state of the problem as given: what solveSteady(problem) returns. */
  solve(): SteadyResult;
  /**
   * The steady state at `currentA` (A, ≥ 0) and `acFactor` (≥ 1) of the Joule source, with the
   * boundary ambients of `options` if given: what solveSteady returns for the problem with those
   * values put in.
   */
  at(currentA: number, acFactor: number, options?: PreparedSolveOptions): SteadyResult;
  /**
   * The exact current at and above which no steady state exists at `acFactor` (default: the
   * problem's), A — the eigenvalue criterion, for a Joule source with α > 0 behind
   * temperature-independent surroundings; undefined where it does not apply.
   */
  runawayOnsetCurrentA(acFactor?: number): number | undefined;
}

/** Validate and mesh `problem` once, to solve it at many currents. */
export function prepare(problem: ThermalProblem): PreparedProblem {
  const raw = isRecord(problem) ? problem : undefined;
  return preparedFrom(validateProblem(problem, true), {
    outer: surroundingsGiven(raw?.outer),
    inner: surroundingsGiven(raw?.inner),
  });
}

function surroundingsGiven(boundary: unknown): boolean {
  return isRecord(boundary) && boundary.surroundings !== undefined;
}

/**
 * A prepared problem from a problem already validated; its arrays from `arrays` (solveSteady
 * passes a borrowed scratch and drops the prepared problem when done).
 */
export function preparedFrom(
  normalized: NormalizedProblem,
  surroundingsExplicit: { inner: boolean; outer: boolean } = { inner: false, outer: false },
  arrays: ArraySource = slabArrays(contextStoreSize(normalized)),
): PreparedProblem {
  return new Prepared(createContext(normalized, undefined, arrays), surroundingsExplicit);
}

class Prepared implements PreparedProblem {
  /** null until analysed; undefined when the eigenvalue criterion does not apply. */
  private mode: SlowestMode | undefined | null = null;

  constructor(
    private readonly ctx: SolverContext,
    private readonly surroundingsExplicit: { inner: boolean; outer: boolean },
  ) {}

  get cellCount(): number {
    return this.ctx.mesh.cellCount;
  }

  solve(): SteadyResult {
    return steadyState(this.ctx, this.slowestMode());
  }

  at(currentA: number, acFactor: number, options?: PreparedSolveOptions): SteadyResult {
    const base = this.ctx.problem;
    if (base.source.kind !== 'joule') throw new ThermalInputError('source.kind', "must be 'joule' to solve at another current");
    const current = requireNonNegative(currentA, 'currentA');
    const factor = requireFinite(acFactor, 'acFactor');
    if (factor < 1) throw new ThermalInputError('acFactor', `must be at least 1 (got ${factor})`);
    const problem: NormalizedProblem = { ...base, source: { ...base.source, current, acFactor: factor } };
    if (options?.outerAmbientC !== undefined) {
      problem.outer = withAmbient(base.outer, requireTemperature(options.outerAmbientC, 'outerAmbientC'), 'outerAmbientC', this.surroundingsExplicit.outer);
    }
    if (options?.innerAmbientC !== undefined) {
      problem.inner = withAmbient(base.inner, requireTemperature(options.innerAmbientC, 'innerAmbientC'), 'innerAmbientC', this.surroundingsExplicit.inner);
    }
    if (options?.pointHeats !== undefined) {
      const points = base.pointSources ?? [];
      if (options.pointHeats.length !== points.length) throw new ThermalInputError('pointHeats', `give one heat per point source (${points.length})`);
      problem.pointSources = points.map((p, i) => ({ position: p.position, heat: requireNonNegative(options.pointHeats![i], `pointHeats[${i}]`) }));
    }
    return steadyState(withProblem(this.ctx, problem), this.slowestMode());
  }

  runawayOnsetCurrentA(acFactor?: number): number | undefined {
    const source = this.ctx.problem.source;
    const mode = this.slowestMode();
    if (!mode || source.kind !== 'joule') return undefined;
    const factor = acFactor === undefined ? source.acFactor : requireFinite(acFactor, 'acFactor');
    if (factor < 1) throw new ThermalInputError('acFactor', `must be at least 1 (got ${factor})`);
    return eigenvalueOnsetCurrent(mode, { ...source, acFactor: factor });
  }

  /** The slowest mode depends on the mesh and the surroundings only: found once. */
  private slowestMode(): SlowestMode | undefined {
    if (this.mode === null) this.mode = slowestMode(this.ctx);
    return this.mode;
  }
}

/** The boundary with another ambient (surface) or fixed temperature. */
function withAmbient(b: NormalizedBoundary, ambientC: number, field: string, surroundingsExplicit: boolean): NormalizedBoundary {
  if (b.kind === 'temperature') return { kind: 'temperature', value: ambientC };
  if (b.kind === 'surface') return { ...b, ambient: ambientC, surroundings: surroundingsExplicit ? b.surroundings : ambientC };
  throw new ThermalInputError(field, `the ${field.startsWith('outer') ? 'outer' : 'inner'} boundary is a ${b.kind} boundary: it has no ambient to change`);
}

/**
 * The steady state of one problem on its context (physics.md §1 "Iteration and honesty"):
 * existence settled first where the exact criterion applies, then the outer iteration, then —
 * for temperature-dependent surroundings that gave no state below the limit — the bisection for
 * the largest current that has one (runaway.ts).
 */
function steadyState(ctx: SolverContext, mode: SlowestMode | undefined): SteadyResult {
  const problem = ctx.problem;
  const flags = [...problem.assumptions];
  const source = problem.source;

  const eigen = eigenvalueRunaway(source, mode);
  if (eigen) {
    return unboundedResult(ctx, {
      iterations: 0,
      tridiagonalSolves: 0,
      hotSpotPosition: eigen.peakPosition,
      linearisation: problem.options.linearisation,
      linearisationCounts: { tangent: 0, lagged: 0 },
      flags: [...flags, eigen.flag],
      runaway: eigen.report,
      runawayOnsetCurrentA: eigen.report.current,
    });
  }
  const onsetA = mode && source.kind === 'joule' ? eigenvalueOnsetCurrent(mode, source) : undefined;

  const start = steadyStart(problem);
  // With nothing driving heat, the steady state is the one reference temperature everywhere;
  // linearising the surfaces there (instead of 10 K above) lets one pass confirm it, where a
  // Newton iteration towards ΔT = 0 — a root at which h itself vanishes for some correlations —
  // would only creep.
  const undriven = undrivenTemperature(problem);
  const outcome = iterate(ctx, undriven === undefined ? { start } : { start, surfaceStart: { inner: undriven, outer: undriven } });

  const limitC = problem.options.temperatureLimit;
  // Runaway means growth past the limit (diverged) or a steady state above it — never merely an
  // iteration that ran out of passes, which is reported as not converged below. With fixed
  // surroundings the eigenvalue test above has already settled existence (runaway.ts).
  const temperatureDependent = source.kind === 'joule' && !mode && !hasLinearSurroundings(problem);
  const unbounded =
    outcome.status === 'diverged' || (outcome.status === 'converged' && !boundedBelowLimit(true, outcome.temperatures, limitC));
  if (temperatureDependent && unbounded) {
    const found = limitRunaway({
      failingCurrentA: source.current,
      limitC,
      startPosition: ctx.mesh.nodes[0],
      trial: (currentA) => {
        const trial = iterate(ctx, { start, currentA });
        const bounded = boundedBelowLimit(trial.status === 'converged', trial.temperatures, limitC);
        return { bounded, peakPosition: bounded ? peakPosition(ctx, trial.temperatures) : NaN, solves: trial.tridiagonalSolves };
      },
    });
    return unboundedResult(ctx, {
      iterations: outcome.iterations,
      tridiagonalSolves: outcome.tridiagonalSolves + found.solves,
      hotSpotPosition: found.peakPosition,
      linearisation: outcome.linearisation,
      linearisationCounts: outcome.linearisationCounts,
      flags: [...flags, found.flag],
      runaway: found.report,
    });
  }
  if (outcome.status === 'converged') return convergedResult(ctx, outcome, flags, onsetA);

  return unboundedResult(ctx, {
    iterations: outcome.iterations,
    tridiagonalSolves: outcome.tridiagonalSolves,
    hotSpotPosition: peakPosition(ctx, outcome.temperatures),
    linearisation: outcome.linearisation,
    linearisationCounts: outcome.linearisationCounts,
    flags: [
      ...flags,
      {
        code: 'not-converged',
        severity: 'warning',
        message: `The outer iteration did not converge in ${outcome.iterations} passes (energy residual ${outcome.energy.residual.toExponential(2)}); no temperatures are reported.`,
      },
    ],
    lastIterate: outcome.temperatures,
    runawayOnsetCurrentA: onsetA,
  });
}

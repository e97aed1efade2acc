/**
 * The §7 entry points: a steady solve (a prepared problem solved once) and the transient solve.
 */
import { contextStoreSize, createContext, type SolverContext } from './assembly';
import { ThermalInputError } from './errors';
import { iterate, type IterationOutcome } from './iterate';
import type { NormalizedProblem } from './normalized';
import { borrowScratch } from './pool';
import { preparedFrom } from './prepare';
import { convergedResult, peakPosition, plain, unboundedResult } from './results';
import type { SteadyResult, ThermalProblem, TransientProblem, TransientResult } from './types';
import {
  requireHeatCapacities,
  requirePositive,
  requirePositiveInteger,
  requireRecord,
  requireTemperature,
  validateProblem,
} from './validate';

/**
 * The steady state (physics.md §1, §7): prepare(problem).solve(), on a borrowed scratch instead
 * of arrays of its own (see pool.ts).
 */
export function solveSteady(problem: ThermalProblem): SteadyResult {
  const normalized = validateProblem(problem, true);
  const scratch = borrowScratch(contextStoreSize(normalized));
  try {
    return preparedFrom(normalized, undefined, scratch).solve();
  } finally {
    scratch.release();
  }
}

// ---------------------------------------------------------------------------------------------
// Transient (implicit Euler)
// ---------------------------------------------------------------------------------------------

/**
 * Implicit-Euler steps (physics.md §1: a_P gains ρcΔV/Δt, b gains ρcΔV/Δt·T_P_old). Each step
 * is solved to convergence with the same outer iteration as the steady problem. Every layer needs
 * density and heatCapacity. Transient results carry no runaway report: temperatures stay finite
 * at finite time; a step that leaves the temperature limit stops the run unconverged.
 */
export function solveTransient(problem: TransientProblem): TransientResult {
  const normalized = validateProblem(problem, false);
  const raw = requireRecord(problem, 'problem');
  const timeStep = requirePositive(raw.timeStep, 'timeStep');
  const steps = raw.steps === undefined ? 1 : requirePositiveInteger(raw.steps, 'steps');
  requireHeatCapacities(normalized);
  const scratch = borrowScratch(contextStoreSize(normalized));
  try {
    return transient(raw, normalized, createContext(normalized, timeStep, scratch), timeStep, steps);
  } finally {
    scratch.release();
  }
}

function transient(
  raw: Record<string, unknown>,
  normalized: NormalizedProblem,
  ctx: SolverContext,
  timeStep: number,
  steps: number,
): TransientResult {
  const n = ctx.mesh.cellCount;

  let previous: Float64Array;
  if (Array.isArray(raw.initial)) {
    if (raw.initial.length !== n) throw new ThermalInputError('initial', `must have one value per cell (${n}), got ${raw.initial.length}`);
    previous = Float64Array.from(raw.initial.map((t, i) => requireTemperature(t, `initial[${i}]`)));
  } else {
    previous = new Float64Array(n).fill(requireTemperature(raw.initial, 'initial'));
  }

  const history: TransientResult['history'] = [];
  let iterations = 0;
  let solves = 0;
  const counts = { tangent: 0, lagged: 0 };
  let outcome: IterationOutcome | undefined;
  let maxResidual = 0;
  for (let step = 1; step <= steps; step++) {
    outcome = iterate(ctx, {
      start: previous,
      previous,
      // Linearise each surface first about where the body starts the step.
      surfaceStart: { inner: previous[0], outer: previous[n - 1] },
    });
    iterations += outcome.iterations;
    solves += outcome.tridiagonalSolves;
    counts.tangent += outcome.linearisationCounts.tangent;
    counts.lagged += outcome.linearisationCounts.lagged;
    if (outcome.status !== 'converged') {
      const failed = unboundedResult(ctx, {
        iterations,
        tridiagonalSolves: solves,
        hotSpotPosition: peakPosition(ctx, outcome.temperatures),
        linearisation: outcome.linearisation,
        linearisationCounts: counts,
        flags: [
          ...normalized.assumptions,
          { code: 'not-converged', severity: 'warning', message: `Time step ${step} did not converge (${outcome.status}).` },
        ],
        lastIterate: outcome.temperatures,
      });
      return { ...failed, time: (step - 1) * timeStep, history };
    }
    maxResidual = Math.max(maxResidual, outcome.energy.residual);
    history.push({ time: step * timeStep, temperatures: plain(outcome.temperatures) });
    previous = Float64Array.from(outcome.temperatures);
  }
  const final = convergedResult(ctx, outcome!, [...normalized.assumptions]);
  return {
    ...final,
    iterations,
    tridiagonalSolves: solves,
    linearisationCounts: counts,
    energyResidual: maxResidual,
    time: steps * timeStep,
    history,
  };
}

/**
 * The outer (Picard/Newton) iteration of every solve (physics.md §1).
 *
 * Each pass: linearise the surfaces about the current surface temperatures and the source about
 * the current cell temperatures, assemble the equations from their terms (assembly.ts), solve
 * them with one Thomas sweep, update. Stop when the largest change (cells and surface faces) is
 * below the tolerance and the energy balance closes. The unknowns are rises above the context's
 * reference temperature (reference.ts).
 */
import { assemble, type SolverContext } from './assembly';
import { boundaryTerms, linearisedSurfaceRise, type BoundarySide } from './boundary';
import { energyBalance, type EnergyBalance } from './energy';
import { DivergenceWatch, hasLinearSurroundings } from './runaway';
import { jouleCoefficients, jouleLine } from './source';
import type { Contribution, JouleLine } from './terms';
import { thomas } from './tridiagonal';
import type { Linearisation } from './types';

/**
 * Smallest acceptable pivot/diagonal ratio for a tangent pass. Positive pivots ⇔ the symmetric
 * tangent matrix K − S_p·D is positive definite; the margin keeps us away from the singular
 * point where round-off would dominate.
 *
 * Why this and not the per-cell test a_P > Σa_nb: with S_p > 0 an interior generating cell has
 * a_P = a_W + a_E − S_pΔV < Σa_nb, so the per-cell test fails in every interior conductor cell
 * and would forbid the tangent form outright. What the per-cell test is for — a non-singular
 * M-matrix whose solution keeps the physical ordering (no spurious undershoot, a unique field) —
 * holds for a symmetric Z-matrix exactly when it is positive definite, i.e. when it is
 * diagonally dominant after scaling by some positive vector (Berman & Plemmons, M-matrix
 * characterisations). Thomas's pivots reveal that at no extra cost.
 */
const TANGENT_PIVOT_MARGIN = 1e-9;

/** Relative change treated as round-off when rises are huge (a few thousand ulps). */
const ROUND_OFF_RELATIVE = 1e-12;

/** First linearisation point of a surface in a steady solve: a modest rise above the air. */
const STEADY_SURFACE_START_RISE_K = 10;

export type IterationStatus = 'converged' | 'diverged' | 'stalled';

export interface IterationOutcome {
  status: IterationStatus;
  /**
   * °C. A view into the context's work storage (one array fewer to allocate per solve): the next
   * iterate on the same context overwrites it, so copy what must outlive that.
   */
  temperatures: Float64Array;
  /** °C (NaN for a side that is not a surface) */
  surfaceC: { inner: number; outer: number };
  iterations: number;
  tridiagonalSolves: number;
  linearisation: Linearisation;
  linearisationCounts: { tangent: number; lagged: number };
  energy: EnergyBalance;
}

export interface IterateArgs {
  /** Starting cell temperatures, °C: one for all cells, or one per cell. */
  start: number | ArrayLike<number>;
  /** Transient: the temperatures at the start of the step, °C. */
  previous?: Float64Array;
  /** Joule current to use instead of the problem's (bisection on current). */
  currentA?: number;
  /** Starting surface temperatures for the linearisation, °C. */
  surfaceStart?: { inner: number; outer: number };
}

export function iterate(ctx: SolverContext, args: IterateArgs): IterationOutcome {
  const { problem, mesh, reference } = ctx;
  const { options, source } = problem;
  const n = mesh.cellCount;
  const joule = source.kind === 'joule' ? jouleCoefficients(source, args.currentA ?? source.current) : undefined;
  const rises = ctx.work.rises;
  const start = args.start;
  if (typeof start === 'number') rises.fill(start - reference);
  else for (let i = 0; i < n; i++) rises[i] = start[i] - reference;
  let previousRises: Float64Array | undefined;
  if (args.previous) {
    previousRises = ctx.work.previousRises;
    for (let i = 0; i < n; i++) previousRises[i] = args.previous[i] - reference;
  }
  let surfaceInner = surfaceStartRise(ctx.inner, args.surfaceStart?.inner, reference);
  let surfaceOuter = surfaceStartRise(ctx.outer, args.surfaceStart?.outer, reference);
  const linearSurroundings = hasLinearSurroundings(problem);
  const counts = { tangent: 0, lagged: 0 };
  let solves = 0;
  let lastMode: Linearisation = 'lagged';
  let previousDelta = Infinity;
  const watch = new DivergenceWatch(options.temperatureLimit - reference);
  const line = joule ? jouleLine(joule, reference) : undefined;
  // One exit below the loop builds the outcome (no per-call closures: under the dev loader each
  // named closure costs a defineProperty, and a solve is only a few passes long).
  let status: IterationStatus = 'stalled';
  let passes = options.maxIterations;
  let energy: EnergyBalance | undefined;

  for (let iteration = 1; iteration <= options.maxIterations; iteration++) {
    const innerTerms = boundaryTerms(ctx.inner, surfaceInner, reference);
    const outerTerms = boundaryTerms(ctx.outer, surfaceOuter, reference);

    let mode: Linearisation = joule ? options.linearisation : 'lagged';
    const pivotRatio = assembleAndSolve(ctx, mode, line, rises, previousRises, innerTerms, outerTerms);
    solves++;
    if (mode === 'tangent' && !(pivotRatio > TANGENT_PIVOT_MARGIN)) {
      // The tangent matrix is not positive definite at this linearisation: its solution would
      // not be an ordered, physical temperature field. Fall back to the lagged form.
      mode = 'lagged';
      assembleAndSolve(ctx, mode, line, rises, previousRises, innerTerms, outerTerms);
      solves++;
    }
    counts[mode]++;
    lastMode = mode;

    const omega = joule && mode === 'lagged' ? options.relaxation : 1;
    const solution = ctx.work.solution;
    let delta = 0;
    let hottest = -Infinity;
    let largest = 0;
    for (let i = 0; i < n; i++) {
      const next = rises[i] + omega * (solution[i] - rises[i]);
      const change = Math.abs(next - rises[i]);
      if (change > delta || change !== change) delta = change;
      rises[i] = next;
      if (next > hottest) hottest = next;
      largest = Math.max(largest, Math.abs(next));
    }
    if (innerTerms.exchange) {
      const ts = linearisedSurfaceRise(ctx.inner, innerTerms, rises[0]);
      delta = Math.max(delta, Math.abs(ts - surfaceInner));
      surfaceInner = ts;
    }
    if (outerTerms.exchange) {
      const ts = linearisedSurfaceRise(ctx.outer, outerTerms, rises[n - 1]);
      delta = Math.max(delta, Math.abs(ts - surfaceOuter));
      surfaceOuter = ts;
    }

    if (!Number.isFinite(delta) || !Number.isFinite(hottest)) {
      status = 'diverged';
      passes = iteration;
      break;
    }
    // One pass is the exact answer when nothing is left to re-evaluate: fixed surroundings and a
    // source represented exactly (uniform, or Joule in tangent form with a positive-definite
    // matrix). Such an answer is reported even if very hot: it is the model's steady state.
    const exact = linearSurroundings && (!joule || mode === 'tangent');
    if (watch.diverging(hottest, exact, joule !== undefined)) {
      status = 'diverged';
      passes = iteration;
      break;
    }
    // Error estimate for a linearly converging iteration: |e| ≈ Δ·r/(1 − r), r = Δ_k/Δ_{k−1};
    // near runaway the lagged form converges slowly and a small Δ alone would overstate accuracy.
    const ratio = delta / previousDelta;
    const errorEstimate = ratio < 1 ? (delta * ratio) / (1 - ratio) : Infinity;
    previousDelta = delta;
    // 1e-6 K, or round-off where rises are so large (absurd, but valid input) that 1e-6 K is
    // below the resolution of a double.
    const tolerance = Math.max(options.tolerance, ROUND_OFF_RELATIVE * largest);
    const settled = exact || (delta < tolerance && (errorEstimate < tolerance || delta < 1e-3 * tolerance));
    if (settled) {
      energy = energyBalance(ctx, joule, rises, surfaceInner, surfaceOuter, previousRises);
      if (energy.residual <= options.energyTolerance) {
        status = 'converged';
        passes = iteration;
        break;
      }
      // A linear system solved exactly cannot improve by repeating the pass.
      if (exact) {
        passes = iteration;
        break;
      }
      energy = undefined;
    }
  }
  return {
    status,
    temperatures: celsius(rises, reference, ctx.work.temperatures),
    surfaceC: { inner: reference + surfaceInner, outer: reference + surfaceOuter },
    iterations: passes,
    tridiagonalSolves: solves,
    linearisation: lastMode,
    linearisationCounts: counts,
    energy: energy ?? energyBalance(ctx, joule, rises, surfaceInner, surfaceOuter, previousRises),
  };
}

/**
 * Assemble one pass (assembly.ts) and solve it. Returns the smallest pivot ratio of the sweep
 * (positive for a positive-definite matrix).
 */
function assembleAndSolve(
  ctx: SolverContext,
  mode: Linearisation,
  joule: JouleLine | undefined,
  rises: Float64Array,
  previousRises: Float64Array | undefined,
  inner: Contribution,
  outer: Contribution,
): number {
  assemble(ctx, { mode, joule, rises, previousRises, inner, outer });
  const { lower, diagonal, upper, rhs, solution, scratch } = ctx.work;
  return thomas(ctx.mesh.cellCount, lower, diagonal, upper, rhs, solution, scratch);
}

/** First linearisation point of a surface, as a rise above the reference (NaN: not a surface). */
function surfaceStartRise(side: BoundarySide, givenC: number | undefined, reference: number): number {
  return side.spec.kind === 'surface' ? (givenC ?? side.spec.ambient + STEADY_SURFACE_START_RISE_K) - reference : NaN;
}

function celsius(rises: Float64Array, reference: number, out: Float64Array): Float64Array {
  for (let i = 0; i < rises.length; i++) out[i] = reference + rises[i];
  return out;
}

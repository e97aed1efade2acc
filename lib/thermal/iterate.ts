/**
 * Assembly and the outer (Picard/Newton) iteration (physics.md §1).
 *
 * Each pass: linearise the surfaces about the current surface temperatures and the source about
 * the current cell temperatures, assemble a_P T_P = a_W T_W + a_E T_E + b, solve it with one
 * Thomas sweep, update. Stop when the largest change (cells and surface faces) is below the
 * tolerance and the energy balance closes.
 *
 * The unknowns are rises θ = T − T_ref above a reference temperature (the ambient the heat is
 * finally given to), so that a rise of 1e-9 K keeps its digits instead of drowning in the 1e-14
 * relative round-off of a temperature near 300; the equations are unchanged by the shift.
 */
import { boundarySide, boundaryTerms, linearisedSurfaceRise, type BoundarySide, type BoundaryTerms } from './boundary';
import { interiorConductances } from './coefficients';
import { energyBalance, type EnergyBalance } from './energy';
import { buildMesh, cellCount, meshStoreSize, type Mesh } from './mesh';
import { freshArrays, type ArraySource } from './pool';
import { jouleCoefficients, type JouleCoefficients } from './source';
import { isLinearSurface } from './surface';
import { thomas } from './tridiagonal';
import type { Linearisation } from './types';
import type { NormalizedBoundary, NormalizedProblem } from './validate';

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

/** Consecutive rising passes above the temperature limit that count as divergence. */
const DIVERGENCE_STREAK = 3;

/** First linearisation point of a surface in a steady solve: a modest rise above the air. */
const STEADY_SURFACE_START_RISE_K = 10;

export interface SolverContext {
  problem: NormalizedProblem;
  /** °C; unknowns are rises above it. */
  reference: number;
  mesh: Mesh;
  /** Conductance between cells j and j+1. */
  conductances: Float64Array;
  /** Σ of the two face conductances per cell: the part of a_P that no pass changes. */
  conductionDiagonal: Float64Array;
  /** ΔV of generating cells, 0 elsewhere: where S_u and S_p act. */
  sourceVolumes: Float64Array;
  inner: BoundarySide;
  outer: BoundarySide;
  /** ρcΔV/Δt per cell (transient only). */
  capacityRate?: Float64Array;
  work: {
    lower: Float64Array;
    diagonal: Float64Array;
    upper: Float64Array;
    rhs: Float64Array;
    solution: Float64Array;
    scratch: Float64Array;
    /** Current iterate, θ = T − reference. */
    rises: Float64Array;
    /** Transient: θ at the start of the step. */
    previousRises: Float64Array;
    /** °C of the last outcome (see IterationOutcome.temperatures). */
    temperatures: Float64Array;
  };
}

/** The temperature the heat is finally given to: the outer ambient or fixed temperature, if any. */
export function referenceTemperature(problem: NormalizedProblem): number {
  for (const b of [problem.outer, problem.inner]) {
    if (b.kind === 'surface') return b.ambient;
    if (b.kind === 'temperature') return b.value;
  }
  return 20;
}

/**
 * Mesh, conductances and work arrays for one solve, all taken from `arrays` (a solve's scratch,
 * see pool.ts, which must have room for contextStoreSize(problem) doubles).
 */
export function contextStoreSize(problem: NormalizedProblem): number {
  const n = cellCount(problem.geometry);
  return meshStoreSize(n) + 12 * n;
}

export function createContext(problem: NormalizedProblem, timeStep?: number, arrays: ArraySource = freshArrays): SolverContext {
  const mesh = buildMesh(problem.geometry, arrays);
  const n = mesh.cellCount;
  let capacityRate: Float64Array | undefined;
  if (timeStep !== undefined) {
    capacityRate = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const layer = problem.geometry.layers[mesh.layerOfCell[i]];
      capacityRate[i] = (layer.density! * layer.heatCapacity! * mesh.volumes[i]) / timeStep;
    }
  }
  const work = {
    lower: arrays.take(n),
    diagonal: arrays.take(n),
    upper: arrays.take(n),
    rhs: arrays.take(n),
    solution: arrays.take(n),
    scratch: arrays.take(n),
    rises: arrays.take(n),
    previousRises: arrays.take(n),
    temperatures: arrays.take(n),
  };
  const conductances = interiorConductances(mesh, arrays.take(Math.max(n - 1, 0)));
  const conductionDiagonal = arrays.take(n);
  const sourceVolumes = arrays.take(n);
  // Conduction and the place of the source are fixed for the solve: set them (and the
  // off-diagonals, which the Thomas sweep only reads) once, not on every pass.
  for (let i = 0; i < n; i++) {
    const gw = i > 0 ? conductances[i - 1] : 0;
    const ge = i < n - 1 ? conductances[i] : 0;
    work.lower[i] = -gw;
    work.upper[i] = -ge;
    conductionDiagonal[i] = gw + ge;
    sourceVolumes[i] = mesh.generating[i] ? mesh.volumes[i] : 0;
  }
  return {
    problem,
    reference: referenceTemperature(problem),
    mesh,
    conductances,
    conductionDiagonal,
    sourceVolumes,
    inner: boundarySide(mesh, problem.inner, 'inner'),
    outer: boundarySide(mesh, problem.outer, 'outer'),
    capacityRate,
    work,
  };
}

function isNonlinearBoundary(b: NormalizedBoundary): boolean {
  return b.kind === 'surface' && !isLinearSurface(b);
}

/** True when no boundary conductance depends on temperature. */
export function hasLinearSurroundings(problem: NormalizedProblem): boolean {
  return !isNonlinearBoundary(problem.inner) && !isNonlinearBoundary(problem.outer);
}

/**
 * Fill the tridiagonal system for one pass (unknowns θ) and solve it. Returns the smallest pivot
 * ratio (positive for a positive-definite matrix). Row i: −G_w θ_{i−1} + a_P θ_i − G_e θ_{i+1} = b;
 * the off-diagonals −G and the conduction part of a_P were set with the context.
 */
function assembleAndSolve(
  ctx: SolverContext,
  mode: Linearisation,
  joule: JouleCoefficients | undefined,
  rises: Float64Array,
  previousRises: Float64Array | undefined,
  inner: BoundaryTerms,
  outer: BoundaryTerms,
): number {
  const { mesh, conductionDiagonal, sourceVolumes, capacityRate, reference } = ctx;
  const { lower, diagonal, upper, rhs, solution, scratch } = ctx.work;
  const n = mesh.cellCount;
  const source = ctx.problem.source;
  // Joule: q(T) = q20 + slope·(T − 20) = qRef + slope·θ, qRef being q at the reference.
  // Uniform: S_u = q, S_p = 0. Joule tangent: S_u = qRef, S_p = slope (exact). Lagged: per cell.
  const slope = joule ? joule.slope : 0;
  const qRef = source.kind === 'uniform' ? source.q : joule!.q20 + slope * (reference - 20);
  const spTangent = joule && mode === 'tangent' ? slope : 0;
  const lagged = joule !== undefined && mode === 'lagged';
  for (let i = 0; i < n; i++) {
    let ap = conductionDiagonal[i];
    let b = 0;
    const v = sourceVolumes[i];
    if (v !== 0) {
      if (lagged) {
        b += (qRef + slope * rises[i]) * v;
      } else {
        b += qRef * v;
        ap -= spTangent * v;
      }
    }
    if (capacityRate) {
      ap += capacityRate[i];
      b += capacityRate[i] * previousRises![i];
    }
    diagonal[i] = ap;
    rhs[i] = b;
  }
  diagonal[0] += inner.a;
  rhs[0] += inner.b;
  diagonal[n - 1] += outer.a;
  rhs[n - 1] += outer.b;
  return thomas(n, lower, diagonal, upper, rhs, solution, scratch);
}

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
  let previousHottest = -Infinity;
  let aboveLimitStreak = 0;
  const limitRise = options.temperatureLimit - reference;
  // One exit below the loop builds the outcome (no per-call closures: under the dev loader each
  // named closure costs a defineProperty, and a solve is only a few passes long).
  let status: IterationStatus = 'stalled';
  let passes = options.maxIterations;
  let energy: EnergyBalance | undefined;

  for (let iteration = 1; iteration <= options.maxIterations; iteration++) {
    const innerTerms = boundaryTerms(ctx.inner, surfaceInner, reference);
    const outerTerms = boundaryTerms(ctx.outer, surfaceOuter, reference);

    let mode: Linearisation = joule ? options.linearisation : 'lagged';
    const pivotRatio = assembleAndSolve(ctx, mode, joule, rises, previousRises, innerTerms, outerTerms);
    solves++;
    if (mode === 'tangent' && !(pivotRatio > TANGENT_PIVOT_MARGIN)) {
      // The tangent matrix is not positive definite at this linearisation: its solution would
      // not be an ordered, physical temperature field. Fall back to the lagged form.
      mode = 'lagged';
      assembleAndSolve(ctx, mode, joule, rises, previousRises, innerTerms, outerTerms);
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
    // Only a temperature-dependent source can run away; a uniform one always has a bounded state.
    // Growth past the limit for several passes in a row is taken as unbounded (see
    // DEFAULT_TEMPERATURE_LIMIT_C). One pass above it is not enough: a first linearisation about
    // a cool surface can overshoot, and the next Newton pass pulls it back.
    if (!exact && joule && hottest > limitRise && hottest > previousHottest) aboveLimitStreak++;
    else aboveLimitStreak = 0;
    previousHottest = hottest;
    if (aboveLimitStreak >= DIVERGENCE_STREAK) {
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

/** First linearisation point of a surface, as a rise above the reference (NaN: not a surface). */
function surfaceStartRise(side: BoundarySide, givenC: number | undefined, reference: number): number {
  return side.spec.kind === 'surface' ? (givenC ?? side.spec.ambient + STEADY_SURFACE_START_RISE_K) - reference : NaN;
}

function celsius(rises: Float64Array, reference: number, out: Float64Array): Float64Array {
  for (let i = 0; i < rises.length; i++) out[i] = reference + rises[i];
  return out;
}

/** Assemble K (conduction + linear boundary conductances) for the runaway analysis. */
export function conductanceMatrix(ctx: SolverContext): { diagonal: Float64Array; offDiagonal: Float64Array } {
  const n = ctx.mesh.cellCount;
  const diagonal = new Float64Array(n);
  const g = ctx.conductances;
  for (let i = 0; i < n; i++) diagonal[i] = (i > 0 ? g[i - 1] : 0) + (i < n - 1 ? g[i] : 0);
  // Linear boundaries do not depend on the linearisation point; any value will do.
  diagonal[0] += boundaryTerms(ctx.inner, 0, ctx.reference).a;
  diagonal[n - 1] += boundaryTerms(ctx.outer, 0, ctx.reference).a;
  return { diagonal, offDiagonal: g };
}

/**
 * Thermal runaway: every rule of lib/thermal about a steady state that does not exist, in one
 * place — the exact criterion for temperature-independent surroundings, the bisection for
 * temperature-dependent ones, and when an iteration counts as diverging.
 *
 * 1. Temperature-independent surroundings (eigenvalue criterion). Principle (linear stability of
 * the discrete heat balance): with boundary conductances fixed, the tangent form of the discrete
 * equations is exact and reads (K − S_p·D)·T = b, where K is the symmetric conductance matrix
 * (conduction + boundaries, positive definite), D the diagonal of generating-cell volumes and
 * S_p = J²ρ₂₀α₂₀F_ac. A steady state with finite, physically ordered temperatures exists exactly
 * while K − S_p·D stays positive definite, i.e. while S_p < λ_min, the smallest eigenvalue of the
 * pencil K v = λ D v. At S_p = λ_min the system is singular (the temperature of the slowest mode
 * grows without bound); above it the only "solution" has temperatures below ambient —
 * unphysical. So the onset current is
 *     I_c = A·√(λ_min / (ρ₂₀ α₂₀ F_ac)).
 * For a conductor of negligible internal ΔT behind a resistance R_th this is
 * λ_min = 1/(R_th·A) and I_c = 1/√(R₂₀ α R_th), the closed form in references.md.
 * λ_min is found by bisection on λ with Sylvester's law of inertia: the number of negative LDLᵀ
 * pivots of K − λD equals the number of eigenvalues below λ. Each test is one O(N) sweep, and
 * bisection cannot miss or mis-order an eigenvalue the way a power iteration can. λ_min depends
 * on the mesh and the surroundings only — not on the current, the AC factor or the ambient — so a
 * prepared problem finds it once.
 *
 * 2. Temperature-dependent surroundings (temperature-limit criterion): no closed existence
 * criterion (and with radiation, whose loss grows as T⁴, a steady state exists mathematically at
 * any current, however absurd its temperature). The question answered is: is there a steady
 * state with the hot spot below options.temperatureLimit? Bisect on current for the largest
 * current for which there is (bisectOnset).
 *
 * 3. Divergence of an iteration (DivergenceWatch): growth past the limit for several passes in a
 * row.
 */
import type { SolverContext } from './assembly';
import { boundaryTerms, isLinearBoundary } from './boundary';
import type { NormalizedProblem, NormalizedSource } from './normalized';
import { isLinearSidewaysLoss, sidewaysLossPerVolume } from './sideways';
import { negativePivotCount, thomas } from './tridiagonal';
import type { RunawayReport, ThermalFlag } from './types';

/** Relative width of the current bracket at which the bisection for onset stops. */
const ONSET_BISECTION_TOLERANCE = 1e-4;

/** Consecutive rising passes above the temperature limit that count as divergence. */
const DIVERGENCE_STREAK = 3;


/**
 * Smallest λ with det(K − λD) = 0. `kDiagonal` is K's diagonal, `offDiagonal` the magnitudes of
 * its (negative) off-diagonal entries, `weights` D's diagonal (≥ 0, not all zero).
 */
export function smallestGeneralizedEigenvalue(
  kDiagonal: Float64Array,
  offDiagonal: Float64Array,
  weights: Float64Array,
): number {
  const n = kDiagonal.length;
  const shifted = new Float64Array(n);
  const countBelow = (lambda: number): number => {
    for (let i = 0; i < n; i++) shifted[i] = kDiagonal[i] - lambda * weights[i];
    return negativePivotCount(n, shifted, offDiagonal);
  };
  // Upper bound: the Rayleigh quotient of the all-ones vector, (1ᵀK1)/(1ᵀD1) ≥ λ_min.
  let sumK = 0;
  let sumD = 0;
  for (let i = 0; i < n; i++) {
    sumK += kDiagonal[i] - (i > 0 ? offDiagonal[i - 1] : 0) - (i < n - 1 ? offDiagonal[i] : 0);
    sumD += weights[i];
  }
  let hi = Math.max(sumK / sumD, Number.MIN_VALUE) * (1 + 1e-9);
  for (let guard = 0; countBelow(hi) === 0 && guard < 200; guard++) hi *= 2;
  let lo = 0;
  for (let iteration = 0; iteration < 200 && hi - lo > 1e-14 * hi; iteration++) {
    const mid = 0.5 * (lo + hi);
    if (countBelow(mid) > 0) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Index of the largest entry of the slowest mode, approximated by one shifted inverse-iteration
 * step (K − 0.999λ_min D)v = D·1: the response to a uniform source just below onset, which the
 * slow mode dominates. Used to say where a runaway would start.
 */
export function slowestModePeak(
  kDiagonal: Float64Array,
  offDiagonal: Float64Array,
  weights: Float64Array,
  lambdaMin: number,
): number {
  const n = kDiagonal.length;
  const diag = new Float64Array(n);
  const lower = new Float64Array(n);
  const upper = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    diag[i] = kDiagonal[i] - 0.999 * lambdaMin * weights[i];
    if (i > 0) lower[i] = -offDiagonal[i - 1];
    if (i < n - 1) upper[i] = -offDiagonal[i];
  }
  const v = new Float64Array(n);
  thomas(n, lower, diag, upper, weights, v, new Float64Array(n));
  let peak = 0;
  for (let i = 1; i < n; i++) if (v[i] > v[peak]) peak = i;
  return peak;
}

/** Onset current from λ_min, A. */
export function onsetCurrent(args: { lambdaMin: number; area: number; rho20: number; alpha20: number; acFactor: number }): number {
  return args.area * Math.sqrt(args.lambdaMin / (args.rho20 * args.alpha20 * args.acFactor));
}


// ───────────────────────────── 1. Eigenvalue criterion ─────────────────────────────

/** The slowest mode of K v = λ D v of a mesh: independent of current, AC factor and ambient. */
export interface SlowestMode {
  lambdaMin: number;
  /** m: where the runaway would start (largest entry of the mode). */
  peakPosition: number;
}

/** True when nothing that carries heat away depends on temperature. */
export function hasLinearSurroundings(problem: NormalizedProblem): boolean {
  const { inner, outer, sideways } = problem;
  return isLinearBoundary(inner) && isLinearBoundary(outer) && (!sideways || isLinearSidewaysLoss(sideways));
}

/** K (conduction + linear boundary conductances + a linear sideways loss) for the analysis. */
export function conductanceMatrix(ctx: SolverContext): { diagonal: Float64Array; offDiagonal: Float64Array } {
  const n = ctx.mesh.cellCount;
  const diagonal = Float64Array.from(ctx.conductionDiagonal);
  // Linear boundaries do not depend on the linearisation point; any value will do.
  diagonal[0] += boundaryTerms(ctx.inner, 0, ctx.reference).aP;
  diagonal[n - 1] += boundaryTerms(ctx.outer, 0, ctx.reference).aP;
  if (ctx.sideways) for (let i = 0; i < n; i++) diagonal[i] += sidewaysLossPerVolume(ctx.sideways, 0) * ctx.mesh.volumes[i];
  return { diagonal, offDiagonal: ctx.conductances };
}

/**
 * The slowest mode, when the eigenvalue criterion applies: a Joule source that grows with
 * temperature (α > 0) behind temperature-independent surroundings. Undefined otherwise.
 */
export function slowestMode(ctx: SolverContext): SlowestMode | undefined {
  const source = ctx.problem.source;
  if (source.kind !== 'joule' || source.alpha20 === 0 || !hasLinearSurroundings(ctx.problem)) return undefined;
  const { diagonal, offDiagonal } = conductanceMatrix(ctx);
  const mesh = ctx.mesh;
  const weights = new Float64Array(mesh.cellCount);
  for (let i = 0; i < mesh.cellCount; i++) weights[i] = mesh.generating[i] ? mesh.volumes[i] : 0;
  const lambdaMin = smallestGeneralizedEigenvalue(diagonal, offDiagonal, weights);
  return { lambdaMin, peakPosition: mesh.nodes[slowestModePeak(diagonal, offDiagonal, weights, lambdaMin)] };
}

/** The exact onset current of a source behind the mesh whose slowest mode this is, A. */
export function eigenvalueOnsetCurrent(mode: SlowestMode, source: Extract<NormalizedSource, { kind: 'joule' }>): number {
  return onsetCurrent({ lambdaMin: mode.lambdaMin, area: source.area, rho20: source.rho20, alpha20: source.alpha20, acFactor: source.acFactor });
}

/** A steady state that does not exist: what the result says about it. */
export interface RunawayFinding {
  report: RunawayReport;
  flag: ThermalFlag;
  /** m */
  peakPosition: number;
  /** Tridiagonal solves spent finding it. */
  solves: number;
}

/** At or above the exact onset there is no steady state: settled before any iteration. */
export function eigenvalueRunaway(source: NormalizedSource, mode: SlowestMode | undefined): RunawayFinding | undefined {
  if (!mode || source.kind !== 'joule') return undefined;
  const onset = eigenvalueOnsetCurrent(mode, source);
  if (source.current < onset) return undefined;
  return {
    report: { current: onset, criterion: 'eigenvalue' },
    flag: {
      code: 'thermal-runaway',
      severity: 'warning',
      message: `No steady state: at ${source.current} A Joule heating grows with temperature faster than the surroundings remove it (onset ${onset.toPrecision(6)} A).`,
    },
    peakPosition: mode.peakPosition,
    solves: 0,
  };
}

// ───────────────────────────── 2. Temperature-limit criterion ─────────────────────────────

/** One steady iteration at a trial current, as the bisection needs it. */
export interface TrialSolve {
  /** Converged with the hottest node within the temperature limit. */
  bounded: boolean;
  /** m, hottest node of the trial (read only when bounded). */
  peakPosition: number;
  solves: number;
}

/** A converged state whose hottest node is within the limit. */
export function boundedBelowLimit(converged: boolean, temperatures: Float64Array, limitC: number): boolean {
  if (!converged) return false;
  let hottest = -Infinity;
  for (let i = 0; i < temperatures.length; i++) hottest = Math.max(hottest, temperatures[i]);
  return hottest <= limitC;
}

/**
 * Temperature-dependent surroundings, and the iteration at `failingCurrentA` found no steady
 * state below the limit (diverged, or converged above it): bisect on current between 0 A (always
 * bounded) and it. The hot spot rises with current, so the answer is monotone and the bisection
 * well posed. Never called for fixed surroundings: there the eigenvalue test has settled
 * existence exactly, and a lagged iteration that climbed past the limit below the onset is not a
 * runaway (such a state is reported, flagged, even above the limit).
 */
export function limitRunaway(args: {
  failingCurrentA: number;
  limitC: number;
  /** Initial peak position (before any bounded trial). */
  startPosition: number;
  trial: (currentA: number) => TrialSolve;
}): RunawayFinding {
  let lo = 0;
  let hi = args.failingCurrentA;
  let solves = 0;
  let peak = args.startPosition;
  while (hi - lo > ONSET_BISECTION_TOLERANCE * hi) {
    const mid = 0.5 * (lo + hi);
    const t = args.trial(mid);
    solves += t.solves;
    if (t.bounded) {
      lo = mid;
      peak = t.peakPosition;
    } else {
      hi = mid;
    }
  }
  return {
    report: { current: lo, criterion: 'temperature-limit' },
    flag: {
      code: 'thermal-runaway',
      severity: 'warning',
      message: `No steady state below ${args.limitC} °C at ${args.failingCurrentA} A; the largest current with one is ${lo.toPrecision(5)} A (bisection on current).`,
    },
    peakPosition: peak,
    solves,
  };
}

// ───────────────────────────── 3. Divergence of an iteration ─────────────────────────────

/**
 * Watches the hottest rise pass by pass. Only a temperature-dependent source can run away (a
 * uniform one always has a bounded state), and an exact pass is the model's answer however hot.
 * Growth past the limit for DIVERGENCE_STREAK passes in a row is taken as unbounded (see
 * DEFAULT_TEMPERATURE_LIMIT_C); one pass above it is not enough: a first linearisation about a
 * cool surface can overshoot, and the next Newton pass pulls it back.
 */
export class DivergenceWatch {
  private streak = 0;
  private previousHottest = -Infinity;

  constructor(private readonly limitRise: number) {}

  /** True when the iteration is to be stopped as diverging. */
  diverging(hottestRise: number, exactPass: boolean, temperatureDependentSource: boolean): boolean {
    if (!exactPass && temperatureDependentSource && hottestRise > this.limitRise && hottestRise > this.previousHottest) this.streak++;
    else this.streak = 0;
    this.previousHottest = hottestRise;
    return this.streak >= DIVERGENCE_STREAK;
  }
}

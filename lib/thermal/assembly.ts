/**
 * The one finite-volume assembly of lib/thermal (physics.md §1, §12): the equations
 * a_P θ_P = a_W θ_W + a_E θ_E + b of a 1-D mesh, summed from the named terms of terms.ts —
 * diffusion per face, the source (S_u, S_p) per cell, heat capacity per cell, a boundary term at
 * each end — and, for a bar run, the sideways loss and the joints' point heat per cell. The
 * steady solve, the transient solve, the runs over time and the bar run all assemble here.
 *
 * A SolverContext holds what does not change between passes (mesh, face conductances, where the
 * source acts, heat-capacity rates) and the work arrays of the tridiagonal system; `assemble`
 * fills the system for one pass.
 */
import { boundarySide, withSpec, type BoundarySide } from './boundary';
import { buildMesh, cellCount, cellHolding, interiorConductances, meshStoreSize, type Mesh } from './mesh';
import type { NormalizedProblem, SidewaysLoss } from './normalized';
import { freshArrays, type ArraySource } from './pool';
import { referenceTemperature } from './reference';
import { sidewaysAmbient, sidewaysLossPerVolume } from './sideways';
import {
  capacityContribution,
  capacityRate,
  jouleLagged,
  jouleTangent,
  pointHeat,
  sidewaysLoss,
  sourceContribution,
  uniformSource,
  type Contribution,
  type JouleLine,
  type SourceTerm,
} from './terms';
import type { Linearisation } from './types';

/** The tridiagonal system of one pass and the iterate's storage. */
export interface WorkArrays {
  /** Row i: lower[i]·θ_{i−1} + diagonal[i]·θ_i + upper[i]·θ_{i+1} = rhs[i]. */
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
}

export interface SolverContext {
  problem: NormalizedProblem;
  /** °C; unknowns are rises above it. */
  reference: number;
  mesh: Mesh;
  /** Diffusion conductance of the face between cells j and j+1. */
  conductances: Float64Array;
  /** Σ of the two face conductances per cell: the part of a_P that no pass changes. */
  conductionDiagonal: Float64Array;
  /** ΔV of generating cells, 0 elsewhere: where the volumetric source acts. */
  sourceVolumes: Float64Array;
  inner: BoundarySide;
  outer: BoundarySide;
  /** ρcΔV/Δt per cell (transient only). */
  capacityRate?: Float64Array;
  /** Point heat per cell, W (bar run joints only). */
  pointHeat?: Float64Array;
  /** Sideways loss law (bar run only). */
  sideways?: SidewaysLoss;
  work: WorkArrays;
}

/** What changes from pass to pass: the linearisations. */
export interface Pass {
  /** Joule linearisation of this pass (a uniform source has only one form). */
  mode: Linearisation;
  /** The Joule line about the reference; undefined for a uniform source. */
  joule: JouleLine | undefined;
  /** The iterate the lagged source and the sideways loss are evaluated at. */
  rises: Float64Array;
  /** Transient: θ at the start of the step. */
  previousRises: Float64Array | undefined;
  /** Boundary terms of the pass (boundary.ts boundaryTerms). */
  inner: Contribution;
  outer: Contribution;
}

/** Doubles a context takes from its ArraySource (see pool.ts). */
export function contextStoreSize(problem: NormalizedProblem): number {
  const n = cellCount(problem.geometry);
  return meshStoreSize(n) + 12 * n;
}

function workArrays(n: number, arrays: ArraySource): WorkArrays {
  return {
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
}

/** Diffusion is fixed for a mesh: set the off-diagonals (−G) and the conduction part of a_P once. */
function setDiffusion(n: number, conductances: Float64Array, work: WorkArrays, conductionDiagonal: Float64Array): void {
  for (let i = 0; i < n; i++) {
    const gw = i > 0 ? conductances[i - 1] : 0;
    const ge = i < n - 1 ? conductances[i] : 0;
    work.lower[i] = -gw;
    work.upper[i] = -ge;
    conductionDiagonal[i] = gw + ge;
  }
}

function capacityRates(problem: NormalizedProblem, mesh: Mesh, timeStepS: number): Float64Array {
  const rates = new Float64Array(mesh.cellCount);
  for (let i = 0; i < mesh.cellCount; i++) {
    const layer = problem.geometry.layers[mesh.layerOfCell[i]];
    rates[i] = capacityRate(layer.density!, layer.heatCapacity!, mesh.volumes[i], timeStepS);
  }
  return rates;
}

/**
 * Mesh, conductances and work arrays for a solve, all taken from `arrays` (a solve's scratch, see
 * pool.ts, which must have room for contextStoreSize(problem) doubles). With a time step the
 * context is transient (every layer then needs density and heat capacity: validate.ts
 * requireHeatCapacities).
 */
export function createContext(problem: NormalizedProblem, timeStepS?: number, arrays: ArraySource = freshArrays): SolverContext {
  const mesh = buildMesh(problem.geometry, arrays);
  const n = mesh.cellCount;
  const work = workArrays(n, arrays);
  const conductances = interiorConductances(mesh, arrays.take(Math.max(n - 1, 0)));
  const conductionDiagonal = arrays.take(n);
  const sourceVolumes = arrays.take(n);
  setDiffusion(n, conductances, work, conductionDiagonal);
  for (let i = 0; i < n; i++) sourceVolumes[i] = mesh.generating[i] ? mesh.volumes[i] : 0;
  const ctx: SolverContext = {
    problem,
    reference: referenceTemperature(problem),
    mesh,
    conductances,
    conductionDiagonal,
    sourceVolumes,
    inner: boundarySide(mesh, problem.inner, 'inner'),
    outer: boundarySide(mesh, problem.outer, 'outer'),
    work,
  };
  if (timeStepS !== undefined) ctx.capacityRate = capacityRates(problem, mesh, timeStepS);
  if (problem.sideways) ctx.sideways = problem.sideways;
  if (problem.pointSources && problem.pointSources.length > 0) ctx.pointHeat = pointHeatPerCell(mesh, problem.pointSources);
  return ctx;
}

/** Each point source's heat into the cell holding it. */
function pointHeatPerCell(mesh: Mesh, points: NonNullable<NormalizedProblem['pointSources']>): Float64Array {
  const heat = new Float64Array(mesh.cellCount);
  for (const p of points) heat[cellHolding(mesh, p.position)] += p.heat;
  return heat;
}

/**
 * The same mesh at another source and boundary law (a prepared problem at another current, AC
 * factor or ambient): nothing is rebuilt, the reference follows the new boundaries.
 */
export function withProblem(ctx: SolverContext, problem: NormalizedProblem): SolverContext {
  return {
    ...ctx,
    problem,
    reference: referenceTemperature(problem),
    inner: problem.inner === ctx.problem.inner ? ctx.inner : withSpec(ctx.inner, problem.inner),
    outer: problem.outer === ctx.problem.outer ? ctx.outer : withSpec(ctx.outer, problem.outer),
    ...(problem.pointSources !== ctx.problem.pointSources && problem.pointSources ? { pointHeat: pointHeatPerCell(ctx.mesh, problem.pointSources) } : {}),
  };
}

/**
 * Fill the tridiagonal system of one pass in ctx.work (diagonal and rhs; the off-diagonals −G
 * were set with the context): the diffusion part of a_P and the source of every cell, then the
 * sideways loss, the point heat and the heat capacity where the problem has them, then the
 * boundary terms of the two end cells. Each term is one sweep adding its contribution.
 */
export function assemble(ctx: SolverContext, pass: Pass): void {
  addDiffusionAndSource(ctx, pass);
  if (ctx.sideways) addSidewaysLoss(ctx, ctx.sideways, pass.rises);
  if (ctx.pointHeat) addPointHeat(ctx, ctx.pointHeat);
  if (ctx.capacityRate) addCapacity(ctx, ctx.capacityRate, pass.previousRises!);
  const { diagonal, rhs } = ctx.work;
  const n = ctx.mesh.cellCount;
  diagonal[0] += pass.inner.aP;
  rhs[0] += pass.inner.b;
  diagonal[n - 1] += pass.outer.aP;
  rhs[n - 1] += pass.outer.b;
}

/**
 * a_P = Σ G of the cell's faces + the source's −S_pΔV; b = S_uΔV. A uniform source and the tangent
 * Joule source are one term for every generating cell, so their contribution per unit volume is
 * taken once per pass; a lagged source is evaluated per cell at θ*.
 */
function addDiffusionAndSource(ctx: SolverContext, pass: Pass): void {
  const { conductionDiagonal, sourceVolumes } = ctx;
  const { diagonal, rhs } = ctx.work;
  const { joule, rises } = pass;
  const n = ctx.mesh.cellCount;
  const source = ctx.problem.source;
  const common: SourceTerm | undefined =
    source.kind === 'uniform' ? uniformSource(source.q) : pass.mode === 'tangent' ? jouleTangent(joule!) : undefined;
  if (common) {
    const perVolume = sourceContribution(common, 1);
    for (let i = 0; i < n; i++) {
      const v = sourceVolumes[i];
      diagonal[i] = conductionDiagonal[i] + perVolume.aP * v;
      rhs[i] = perVolume.b * v;
    }
    return;
  }
  for (let i = 0; i < n; i++) {
    const v = sourceVolumes[i];
    const c = v !== 0 ? sourceContribution(jouleLagged(joule!, rises[i]), v) : NO_CONTRIBUTION;
    diagonal[i] = conductionDiagonal[i] + c.aP;
    rhs[i] = c.b;
  }
}

const NO_CONTRIBUTION: Contribution = { aP: 0, b: 0 };

/** The bar run's sideways loss, S_p = −hP/A_c with h at the cell's iterate (terms.ts sidewaysLoss). */
function addSidewaysLoss(ctx: SolverContext, loss: SidewaysLoss, rises: Float64Array): void {
  const { diagonal, rhs } = ctx.work;
  const volumes = ctx.mesh.volumes;
  const ambientRise = sidewaysAmbient(loss) - ctx.reference;
  for (let i = 0; i < volumes.length; i++) {
    const c = sourceContribution(sidewaysLoss(sidewaysLossPerVolume(loss, rises[i] - ambientRise), ambientRise), volumes[i]);
    diagonal[i] += c.aP;
    rhs[i] += c.b;
  }
}

/** The joints' point heat (terms.ts pointHeat). */
function addPointHeat(ctx: SolverContext, heat: Float64Array): void {
  const rhs = ctx.work.rhs;
  for (let i = 0; i < heat.length; i++) if (heat[i] !== 0) rhs[i] += pointHeat(heat[i]).b;
}

/** Implicit Euler: ρcΔV/Δt on a_P, ρcΔV/Δt·θ_old on b (terms.ts capacityContribution). */
function addCapacity(ctx: SolverContext, rates: Float64Array, previousRises: Float64Array): void {
  const { diagonal, rhs } = ctx.work;
  for (let i = 0; i < rates.length; i++) {
    const c = capacityContribution(rates[i], previousRises[i]);
    diagonal[i] += c.aP;
    rhs[i] += c.b;
  }
}

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
  if (problem.pointSources && problem.pointSources.length > 0) {
    const heat = new Float64Array(n);
    for (const p of problem.pointSources) heat[cellHolding(mesh, p.position)] += p.heat;
    ctx.pointHeat = heat;
  }
  return ctx;
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
  };
}

/**
 * Fill the tridiagonal system of one pass in ctx.work (diagonal and rhs; the off-diagonals −G
 * were set with the context): per cell the diffusion part of a_P, then the source, the sideways
 * loss, the point heat and the heat capacity; then the boundary terms of the two end cells.
 */
export function assemble(ctx: SolverContext, pass: Pass): void {
  const { mesh, conductionDiagonal, sourceVolumes, capacityRate: rates, pointHeat: heat, sideways } = ctx;
  const { diagonal, rhs } = ctx.work;
  const { joule, rises, previousRises } = pass;
  const n = mesh.cellCount;
  const source = ctx.problem.source;
  // A uniform source and the tangent Joule source are one term for every generating cell: their
  // contribution per unit volume is taken once per pass. A lagged source is evaluated per cell at θ*.
  const common: SourceTerm | undefined =
    source.kind === 'uniform' ? uniformSource(source.q) : pass.mode === 'tangent' ? jouleTangent(joule!) : undefined;
  const perVolume = common ? sourceContribution(common, 1) : undefined;
  const ambientRise = sideways ? sidewaysAmbient(sideways) - ctx.reference : 0;
  for (let i = 0; i < n; i++) {
    let ap = conductionDiagonal[i];
    let b = 0;
    const v = sourceVolumes[i];
    if (v !== 0) {
      if (perVolume) {
        ap += perVolume.aP * v;
        b += perVolume.b * v;
      } else {
        const c = sourceContribution(jouleLagged(joule!, rises[i]), v);
        ap += c.aP;
        b += c.b;
      }
    }
    if (sideways) {
      const c = sourceContribution(sidewaysLoss(sidewaysLossPerVolume(sideways, rises[i] - ambientRise), ambientRise), mesh.volumes[i]);
      ap += c.aP;
      b += c.b;
    }
    if (heat) b += pointHeat(heat[i]).b;
    if (rates) {
      const c = capacityContribution(rates[i], previousRises![i]);
      ap += c.aP;
      b += c.b;
    }
    diagonal[i] = ap;
    rhs[i] = b;
  }
  diagonal[0] += pass.inner.aP;
  rhs[0] += pass.inner.b;
  diagonal[n - 1] += pass.outer.aP;
  rhs[n - 1] += pass.outer.b;
}

/**
 * Steady cross-section solve (physics.md §9): prepared system (assemble.ts) → cable terms →
 * preconditioned conjugate gradients → outer iteration → energy balance.
 *
 * Unknowns are the rises θ above T_ref of the cells and of the circle nodes (circles.ts). Cable
 * c puts s_c·W_c on its circle nodes and sees their weighted mean θ_s = s_cᵀθ; its 1-D radial
 * model gives W_c = W_c(T_ref) + β_c·θ_s exactly (cableModel.ts: Joule heat is linear in T). So
 *     (K − Σ_c β_c s_c s_cᵀ)·θ = b + Σ_c s_c·W_c(T_ref),
 * symmetric, with off-diagonals still ≤ 0 (β ≥ 0, s ≥ 0): a Z-matrix. The rank-one terms are
 * applied matrix-free. Without ducts nothing changes between outer passes (the second only
 * confirms the first); with ducts T4′(θm) is re-evaluated from each pass until no rise changes
 * by more than `toleranceK`.
 *
 * Runaway (no steady state) — three certificates, each exact for the discrete model:
 *   1. b·A ≥ 1 for a cable: its own coverings cannot carry its heat away at any surface
 *      temperature;
 *   2. a diagonal entry ≤ 0, or a CG curvature pᵀAp ≤ 0: the matrix is not positive definite;
 *   3. a solution with a negative rise. Every term of the right-hand side is ≥ 0 (T_ref is the
 *      lowest boundary temperature, sources are ≥ 0). Were the matrix positive definite, it
 *      would be an M-matrix with an inverse ≥ 0, so θ ≥ 0. If its smallest eigenvalue λ₁ < 0,
 *      with eigenvector v₁ > 0 (Perron–Frobenius for an irreducible Z-matrix), v₁ᵀθ = v₁ᵀb/λ₁ < 0
 *      and some rise is negative: temperatures below every boundary — no physical steady state.
 * A steady state exists exactly while the matrix is positive definite; a failed result carries
 * no temperatures (physics.md §1: never a made-up value).
 */
import { amgPreconditioner } from './amg';
import { assemble, type CrossSectionSystem } from './assemble';
import { cableChain, cableHeatLine, cableState, jouleLine, runsAwayInside, type CableChain, type JouleLine } from './cableModel';
import { conjugateGradient, type Preconditioner } from './pcg';
import { ic0Preconditioner, jacobiPreconditioner } from './preconditioners';
import { multiply } from './sparse';
import { cableSourceTerm } from './terms';
import type {
  CableTemperatures,
  CrossSectionConverged,
  CrossSectionFailed,
  CrossSectionFlag,
  CrossSectionInput,
  CrossSectionIterations,
  CrossSectionMeshReport,
  CrossSectionResult,
  CrossSectionRunaway,
  PreconditionerKind,
} from './types';
import { validateCrossSection } from './validate';

/** Heat flows below this (W/m) are round-off, not physics: the energy residual's floor. */
const ENERGY_SCALE_FLOOR_W = 1e-12;
/** A rise below −this × the largest rise counts as negative (certificate 3). */
const NEGATIVE_RISE_SHARE = 1e-7;

export interface PreparedCrossSection {
  system: CrossSectionSystem;
  preconditioner: Preconditioner;
  preconditionerKind: PreconditionerKind;
  /** The last solution, the next solve's starting point. */
  warmStart?: Float64Array;
}

function buildPreconditioner(system: CrossSectionSystem, kind: PreconditionerKind): Preconditioner {
  if (kind === 'jacobi') return jacobiPreconditioner(system.matrix);
  if (kind === 'ic0') return ic0Preconditioner(system.matrix);
  return amgPreconditioner(system.matrix);
}

/** Validate, mesh, assemble K and build its preconditioner: everything that does not depend on the currents. */
export function prepareCrossSection(input: CrossSectionInput | unknown, preconditioner?: PreconditionerKind): PreparedCrossSection {
  const problem = validateCrossSection(input);
  const system = assemble(problem);
  const kind = preconditioner ?? problem.options.preconditioner;
  return { system, preconditioner: buildPreconditioner(system, kind), preconditionerKind: kind };
}

export interface CableTerm {
  /** β_c = dW_c/dT_s, W/(K·m) */
  beta: number;
  /** W_c(T_ref), W/m */
  heatAtReference: number;
}

export interface TangentSystem {
  rhs: Float64Array;
  chains: CableChain[];
  joules: JouleLine[];
  terms: CableTerm[];
  /** Index of a cable that runs away on its own (certificate 1), else −1. */
  runawayCable: number;
}

/** The linear system of one outer pass, for duct air at `meanAirC` (one per cable). */
export function tangentSystem(system: CrossSectionSystem, currentsA: number[], meanAirC: number[]): TangentSystem {
  const { problem, referenceC } = system;
  const rhs = new Float64Array(system.n);
  for (let i = 0; i < system.n; i++) rhs[i] = system.boundaryRhs[i] + system.fixedSources[i];
  const chains: CableChain[] = [];
  const joules: JouleLine[] = [];
  const terms: CableTerm[] = [];
  let runawayCable = -1;
  problem.cables.forEach((cable, c) => {
    const chain = cableChain(cable, meanAirC[c], `cables[${c}]`);
    const joule = jouleLine(cable, currentsA[c]);
    chains.push(chain);
    joules.push(joule);
    if (runsAwayInside(chain, joule)) {
      if (runawayCable < 0) runawayCable = c;
      terms.push({ beta: 0, heatAtReference: 0 });
      return;
    }
    const line = cableHeatLine(chain, joule, referenceC);
    const term = cableSourceTerm(line.heatAtReference, line.slope);
    terms.push({ beta: term.sp, heatAtReference: term.su });
    const { nodes, share } = system.couplings[c];
    for (let f = 0; f < nodes.length; f++) rhs[nodes[f]] += share[f] * term.su;
  });
  return { rhs, chains, joules, terms, runawayCable };
}

/** θ_s = s_cᵀθ: the circle's mean rise. */
function circleMean(system: CrossSectionSystem, c: number, rises: Float64Array): number {
  const { nodes, share } = system.couplings[c];
  let s = 0;
  for (let f = 0; f < nodes.length; f++) s += share[f] * rises[nodes[f]];
  return s;
}

/** y = (K − Σ β_c s_c s_cᵀ)·x */
export function applyTangent(system: CrossSectionSystem, terms: CableTerm[], x: Float64Array, y: Float64Array): void {
  multiply(system.matrix, x, y);
  terms.forEach((term, c) => {
    if (term.beta === 0) return;
    const { nodes, share } = system.couplings[c];
    const g = term.beta * circleMean(system, c, x);
    for (let f = 0; f < nodes.length; f++) y[nodes[f]] -= g * share[f];
  });
}

/** The tangent matrix as entries (row, column, value), duplicates to be summed: for checks with a general-purpose solver. */
export function tangentEntries(system: CrossSectionSystem, terms: CableTerm[]): { rows: number[]; cols: number[]; values: number[] } {
  const { rowPtr, col, val } = system.matrix;
  const rows: number[] = [];
  const cols: number[] = [];
  const values: number[] = [];
  for (let i = 0; i < system.n; i++) {
    for (let p = rowPtr[i]; p < rowPtr[i + 1]; p++) {
      rows.push(i);
      cols.push(col[p]);
      values.push(val[p]);
    }
  }
  terms.forEach((term, c) => {
    if (term.beta === 0) return;
    const { nodes, share } = system.couplings[c];
    for (let f = 0; f < nodes.length; f++) {
      for (let g = 0; g < nodes.length; g++) {
        rows.push(nodes[f]);
        cols.push(nodes[g]);
        values.push(-term.beta * share[f] * share[g]);
      }
    }
  });
  return { rows, cols, values };
}

/** Circle rise θ_s and heat W of cable c at the solved rises. */
export function circleOf(system: CrossSectionSystem, term: CableTerm, c: number, rises: Float64Array): { riseK: number; emittedW: number } {
  const riseK = circleMean(system, c, rises);
  return { riseK, emittedW: term.heatAtReference + term.beta * riseK };
}

function meshReport(system: CrossSectionSystem): CrossSectionMeshReport {
  let smallest = Infinity;
  let largest = 0;
  for (const faces of [system.xFaces, system.yFaces]) {
    for (let i = 0; i + 1 < faces.length; i++) {
      const d = faces[i + 1] - faces[i];
      if (d < smallest) smallest = d;
      if (d > largest) largest = d;
    }
  }
  return { nx: system.nx, ny: system.ny, cells: system.nx * system.ny, unknowns: system.n, smallestCellM: smallest, largestCellM: largest };
}

function failure(
  prepared: PreparedCrossSection,
  status: 'runaway' | 'not-converged',
  message: string,
  iterations: CrossSectionIterations,
  runaway?: CrossSectionRunaway,
): CrossSectionFailed {
  prepared.warmStart = undefined;
  return {
    converged: false,
    status,
    ...(runaway ? { runaway } : {}),
    message,
    governing: { conductorC: Number.POSITIVE_INFINITY },
    iterations,
    mesh: meshReport(prepared.system),
    preconditioner: prepared.preconditionerKind,
  };
}

/** Heat leaving through a boundary row, W/m. */
function boundaryOutflow(system: CrossSectionSystem, row: CrossSectionSystem['top'], rises: Float64Array): number {
  const boundaryRise = row.temperatureC - system.referenceC;
  let q = 0;
  for (let i = 0; i < row.node.length; i++) q += row.conductance[i] * (rises[row.node[i]] - boundaryRise);
  return q;
}

export interface SolveOverrides {
  /** A current per cable, A (replaces the input's). */
  currentsA?: number[];
}

export function solvePrepared(prepared: PreparedCrossSection, overrides: SolveOverrides = {}): CrossSectionResult {
  const { system } = prepared;
  const { problem, referenceC, n } = system;
  const options = problem.options;
  const m = problem.cables.length;
  const currents = overrides.currentsA ?? problem.cables.map((c) => c.current);
  const iterations: CrossSectionIterations = { outer: 0, cg: 0, cgPerOuter: [] };
  const rises = prepared.warmStart ? Float64Array.from(prepared.warmStart) : new Float64Array(n);
  const previous = new Float64Array(n);
  const meanAir = problem.cables.map(() => referenceC);
  let lastSystem: TangentSystem | undefined;
  let converged = false;
  const runawayField = (message: string) =>
    failure(prepared, 'runaway', 'no steady state: the heat generated grows with temperature faster than the ground can remove it', iterations, { kind: 'field', message });

  for (let outer = 1; outer <= options.maxOuterIterations; outer++) {
    iterations.outer = outer;
    const tangent = tangentSystem(system, currents, meanAir);
    lastSystem = tangent;
    if (tangent.runawayCable >= 0) {
      const c = tangent.runawayCable;
      return failure(prepared, 'runaway', `cables[${c}]: no steady state — its coverings cannot carry the heat away at any surface temperature`, iterations, {
        kind: 'cable',
        cable: c,
        message: 'the heat generated grows with temperature faster than the cable’s own coverings can pass it',
      });
    }
    if (!diagonalStaysPositive(system, tangent.terms)) return runawayField('the tangent matrix is not positive definite (a diagonal entry next to a cable is not positive)');
    previous.set(rises);
    const outcome = conjugateGradient((x, y) => applyTangent(system, tangent.terms, x, y), tangent.rhs, rises, prepared.preconditioner, {
      relativeTolerance: options.cgRelativeTolerance,
      maxIterations: options.maxCgIterations,
    });
    iterations.cg += outcome.iterations;
    iterations.cgPerOuter.push(outcome.iterations);
    if (outcome.breakdown) return runawayField('the tangent matrix is not positive definite (conjugate-gradient curvature ≤ 0)');
    if (!outcome.converged) {
      return failure(prepared, 'not-converged', `the linear solve stopped at a relative residual of ${outcome.relativeResidual.toExponential(2)} after ${outcome.iterations} iterations`, iterations);
    }
    let largest = 0;
    let smallest = Infinity;
    for (let i = 0; i < n; i++) {
      if (rises[i] > largest) largest = rises[i];
      if (rises[i] < smallest) smallest = rises[i];
    }
    if (smallest < -NEGATIVE_RISE_SHARE * Math.max(largest, 1e-300)) {
      return runawayField('the only solution of the tangent system lies below the boundary temperatures (its matrix is not positive definite)');
    }
    let change = 0;
    for (let i = 0; i < n; i++) change = Math.max(change, Math.abs(rises[i] - previous[i]));
    problem.cables.forEach((cable, c) => {
      const circle = circleOf(system, tangent.terms[c], c, rises);
      meanAir[c] = cableState(cable, tangent.chains[c], tangent.joules[c], referenceC + circle.riseK).meanAirC;
    });
    if (outer > 1 && change < options.toleranceK) {
      converged = true;
      break;
    }
  }
  if (!converged || !lastSystem) {
    return failure(prepared, 'not-converged', `the outer iteration did not settle within ${options.maxOuterIterations} passes`, iterations);
  }
  const tangent = lastSystem;

  // Results at the final temperatures; the chain uses the duct air of the last solved pass.
  const circles = problem.cables.map((_, c) => circleOf(system, tangent.terms[c], c, rises));
  const cables: CableTemperatures[] = problem.cables.map((cable, c) => {
    const circleC = referenceC + circles[c].riseK;
    const state = cableState(cable, tangent.chains[c], tangent.joules[c], circleC);
    const entry: CableTemperatures = {
      ...(cable.name !== undefined ? { name: cable.name } : {}),
      index: c,
      currentA: currents[c],
      conductorC: state.conductorC,
      coveringOuterC: state.coveringOuterC,
      surfaceC: state.surfaceC,
      losses: state.losses,
    };
    if (cable.duct) {
      entry.ductOuterC = circleC;
      entry.ductAirResistanceKmPerW = tangent.chains[c].ductAir;
    }
    if (cable.limit !== undefined) {
      entry.limitC = cable.limit;
      entry.marginK = cable.limit - state.conductorC;
    }
    return entry;
  });

  const heat = energyBalance(system, rises, cables);
  if (!(heat.energyResidual <= options.energyTolerance)) {
    return failure(prepared, 'not-converged', `the energy balance closes only to ${heat.energyResidual.toExponential(2)} (demanded ${options.energyTolerance})`, iterations);
  }

  const limited = cables.filter((c) => c.marginK !== undefined);
  const pool = limited.length > 0 ? limited : cables;
  const governingCable =
    pool.length > 0 ? pool.reduce((best, c) => ((limited.length > 0 ? c.marginK! < best.marginK! : c.conductorC > best.conductorC) ? c : best)) : undefined;

  const { nx, ny } = system;
  const temperaturesC = new Float64Array(nx * ny);
  for (let cell = 0; cell < nx * ny; cell++) temperaturesC[cell] = referenceC + rises[cell];
  let sideRise = 0;
  for (const i of [0, nx - 1]) {
    const background = columnBackground(system, i);
    for (let j = 0; j < ny; j++) sideRise = Math.max(sideRise, Math.abs(rises[j * nx + i] - background[j]));
  }
  let circleRise = 0;
  for (let c = 0; c < m; c++) circleRise = Math.max(circleRise, circles[c].riseK);

  prepared.warmStart = Float64Array.from(rises);
  return {
    converged: true,
    status: 'converged',
    cables,
    ...(governingCable
      ? {
          governing: {
            index: governingCable.index,
            ...(governingCable.name !== undefined ? { name: governingCable.name } : {}),
            conductorC: governingCable.conductorC,
            ...(governingCable.marginK !== undefined ? { marginK: governingCable.marginK } : {}),
          },
        }
      : {}),
    heat,
    iterations,
    mesh: meshReport(system),
    field: {
      nx,
      ny,
      xFacesM: system.xFaces,
      depthFacesM: system.yFaces,
      xCentresM: system.xc,
      depthCentresM: system.yc,
      temperaturesC,
      cableOfCell: system.owner,
    },
    preconditioner: prepared.preconditionerKind,
    sideRiseRatio: circleRise > 0 ? sideRise / circleRise : 0,
    flags: resultFlags(system, circleRise > 0 ? sideRise / circleRise : 0),
  };
}

/**
 * Rises of one column of cells with no heat at all: 1-D conduction between the surface and the
 * deep ground through the column's own cells (series resistances per metre of width). At a side
 * wall the heating by the cables is what exceeds this.
 */
function columnBackground(system: CrossSectionSystem, i: number): Float64Array {
  const { nx, ny, yFaces, conductivity, top, bottom, referenceC } = system;
  const width = system.xFaces[i + 1] - system.xFaces[i];
  const toNode = new Float64Array(ny);
  let r = width / top.conductance[i];
  for (let j = 0; j < ny; j++) {
    if (j > 0) r += (yFaces[j] - yFaces[j - 1]) / (2 * conductivity[(j - 1) * nx + i]) + (yFaces[j + 1] - yFaces[j]) / (2 * conductivity[j * nx + i]);
    toNode[j] = r;
  }
  const total = r + width / bottom.conductance[i];
  const topRise = top.temperatureC - referenceC;
  const bottomRise = bottom.temperatureC - referenceC;
  return toNode.map((rj) => topRise + ((bottomRise - topRise) * rj) / total);
}

/** Below this u = 2L/D the even-flux circle and the isothermal cylinder differ by more than 0.8 %. */
const SHALLOW_U = 4;
/** Side-wall rise share above which the adiabatic sides may be too close. */
const SIDE_RISE_SHARE = 0.01;

function resultFlags(system: CrossSectionSystem, sideRiseRatio: number): CrossSectionFlag[] {
  const flags: CrossSectionFlag[] = [];
  system.problem.cables.forEach((cable, c) => {
    const u = cable.depth / cable.radius;
    if (u < SHALLOW_U) {
      const isothermal = Math.log(u + Math.sqrt(u * u - 1));
      const difference = (Math.log(2 * u) / isothermal - 1) * 100;
      flags.push({
        code: 'CROSS_SECTION_SHALLOW_CIRCLE',
        severity: 'review',
        message: `cables[${c}] is shallow for its size (2L/D = ${u.toFixed(2)}): the even-flux circle of the 2-D field gives ${difference.toFixed(1)} % more external resistance than an isothermal cylinder would`,
      });
    }
    if (cable.duct?.preset) {
      flags.push({
        code: 'CROSS_SECTION_DUCT_CONSTANTS_FROM_MEMORY',
        severity: 'note',
        message: `cables[${c}]: the duct-air constants U, V, Y of '${cable.duct.preset}' are the IEC 60287-2-1 values as recalled, not read from the standard`,
      });
    }
  });
  if (sideRiseRatio > SIDE_RISE_SHARE) {
    flags.push({
      code: 'CROSS_SECTION_SIDE_BOUNDARY',
      severity: 'review',
      message: `the side walls warm by ${(sideRiseRatio * 100).toFixed(1)} % of the hottest cable surface's rise: the domain may be too narrow`,
    });
  }
  return flags;
}

/** Certificate 2 on the diagonal: K_ii − Σ β_c s_ci² > 0 at every circle node. */
function diagonalStaysPositive(system: CrossSectionSystem, terms: CableTerm[]): boolean {
  const { val, diag } = system.matrix;
  return terms.every((term, c) => {
    const { nodes, share } = system.couplings[c];
    for (let f = 0; f < nodes.length; f++) if (!(val[diag[nodes[f]]] - term.beta * share[f] * share[f] > 0)) return false;
    return true;
  });
}

/**
 * Heat generated (every cable's losses at its solved temperature plus the fixed sources) against
 * heat leaving through the surface and the bottom, relative to the largest term.
 */
function energyBalance(system: CrossSectionSystem, rises: Float64Array, cables: CableTemperatures[]): CrossSectionConverged['heat'] {
  let generated = system.fixedSourceTotalW;
  for (const cable of cables) generated += cable.losses.totalWPerM;
  const toSurface = boundaryOutflow(system, system.top, rises);
  const toBottom = boundaryOutflow(system, system.bottom, rises);
  const scale = Math.max(Math.abs(generated), Math.abs(toSurface), Math.abs(toBottom), ENERGY_SCALE_FLOOR_W);
  const energyResidual = Math.abs(generated - toSurface - toBottom) / scale;
  return { generatedWPerM: generated, toSurfaceWPerM: toSurface, toBottomWPerM: toBottom, energyResidual: Number.isFinite(energyResidual) ? energyResidual : Infinity };
}

export function solveCrossSection(input: CrossSectionInput | unknown): CrossSectionResult {
  return solvePrepared(prepareCrossSection(input));
}

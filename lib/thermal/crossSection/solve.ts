/**
 * Steady cross-section solve (physics.md §9): prepared system (assemble.ts) → cable terms →
 * preconditioned conjugate gradients → outer iteration → energy balance.
 *
 * The system in rises θ above T_ref is (K − diag(β))·θ = b: K the conduction and boundary
 * conductances (built once), β the cables' S_p (cableModel.ts) on their nodes, b the boundary
 * terms, fixed sources and the cables' heat at T_ref. Joule heat is linear in temperature, so the
 * S_p form is exact and without ducts the second outer pass only confirms the first; with ducts
 * the duct-air resistance T4′(θm) is re-evaluated from each pass until nothing changes by more
 * than `toleranceK`.
 *
 * Runaway (no steady state). K is a symmetric M-matrix (off-diagonals ≤ 0, positive definite),
 * and so is K − diag(β) as long as it stays positive definite. A steady state exists exactly
 * then. Three certificates that it does not, each exact:
 *   1. b·A ≥ 1 for a cable: its own coverings cannot carry its heat at any surface temperature;
 *   2. a diagonal entry K_cc − β_c ≤ 0, or a CG curvature pᵀ(K − diag β)p ≤ 0: a direction with
 *      non-positive energy, so the matrix is not positive definite;
 *   3. a solution with a negative rise. Every term of b is ≥ 0 (T_ref is the lowest boundary
 *      temperature, sources are ≥ 0). If the matrix were positive definite, its inverse would be
 *      ≥ 0 (an M-matrix) and θ ≥ 0. If instead its smallest eigenvalue λ₁ < 0, with eigenvector
 *      v₁ > 0 (Perron–Frobenius for an irreducible Z-matrix), then v₁ᵀθ = v₁ᵀb/λ₁ < 0 and some
 *      rise must be negative: temperatures below every boundary, i.e. no physical steady state.
 * The result then carries no temperatures (physics.md §1: never a made-up value).
 */
import { amgPreconditioner } from './amg';
import { assemble, type CrossSectionSystem } from './assemble';
import { cableChain, cableHeatLine, cableState, jouleLine, runsAwayInside, type CableChain, type JouleLine } from './cableModel';
import { conjugateGradient, type Preconditioner } from './pcg';
import { ic0Preconditioner, jacobiPreconditioner } from './preconditioners';
import { multiplyShifted } from './sparse';
import { cableSourceTerm } from './terms';
import type {
  CableTemperatures,
  CrossSectionFailed,
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

export interface TangentSystem {
  /** β per unknown (non-zero on cable nodes): the matrix is K − diag(shift). */
  shift: Float64Array;
  rhs: Float64Array;
  chains: CableChain[];
  joules: JouleLine[];
}

/** The linear system of one outer pass, for duct air at `meanAirC` (one per cable). */
export function tangentSystem(system: CrossSectionSystem, currentsA: number[], meanAirC: number[]): TangentSystem {
  const { problem, soilUnknowns, referenceC } = system;
  const shift = new Float64Array(system.n);
  const rhs = new Float64Array(system.n);
  for (let i = 0; i < system.n; i++) rhs[i] = system.boundaryRhs[i] + system.fixedSources[i];
  const chains: CableChain[] = [];
  const joules: JouleLine[] = [];
  problem.cables.forEach((cable, c) => {
    const chain = cableChain(cable, meanAirC[c], `cables[${c}]`);
    const joule = jouleLine(cable, currentsA[c]);
    chains.push(chain);
    joules.push(joule);
    if (runsAwayInside(chain, joule)) return;
    const line = cableHeatLine(chain, joule, referenceC);
    const term = cableSourceTerm(line.heatAtReference, line.slope);
    rhs[soilUnknowns + c] += term.su;
    shift[soilUnknowns + c] = term.sp;
  });
  return { shift, rhs, chains, joules };
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
  const { problem, soilUnknowns, referenceC, n } = system;
  const options = problem.options;
  const m = problem.cables.length;
  const currents = overrides.currentsA ?? problem.cables.map((c) => c.current);
  const iterations: CrossSectionIterations = { outer: 0, cg: 0, cgPerOuter: [] };
  const rises = prepared.warmStart ? Float64Array.from(prepared.warmStart) : new Float64Array(n);
  const previous = new Float64Array(n);
  const meanAir = problem.cables.map(() => referenceC);
  let lastSystem: TangentSystem | undefined;
  let converged = false;

  for (let outer = 1; outer <= options.maxOuterIterations; outer++) {
    iterations.outer = outer;
    const tangent = tangentSystem(system, currents, meanAir);
    lastSystem = tangent;
    for (let c = 0; c < m; c++) {
      if (runsAwayInside(tangent.chains[c], tangent.joules[c])) {
        return failure(prepared, 'runaway', `cables[${c}]: no steady state — its coverings cannot carry the heat away at any surface temperature`, iterations, {
          kind: 'cable',
          cable: c,
          message: 'the heat generated grows with temperature faster than the cable’s own coverings can pass it',
        });
      }
      const node = soilUnknowns + c;
      if (!(system.matrix.val[system.matrix.diag[node]] - tangent.shift[node] > 0)) {
        return failure(prepared, 'runaway', `cables[${c}]: no steady state — its heat grows with temperature faster than its surroundings remove it`, iterations, {
          kind: 'field',
          message: 'the tangent matrix is not positive definite (a cable node’s diagonal is not positive)',
        });
      }
    }
    previous.set(rises);
    const outcome = conjugateGradient((x, y) => multiplyShifted(system.matrix, tangent.shift, x, y), tangent.rhs, rises, prepared.preconditioner, {
      relativeTolerance: options.cgRelativeTolerance,
      maxIterations: options.maxCgIterations,
    });
    iterations.cg += outcome.iterations;
    iterations.cgPerOuter.push(outcome.iterations);
    if (outcome.breakdown) {
      return failure(prepared, 'runaway', 'no steady state: the heat generated grows with temperature faster than the ground can remove it', iterations, {
        kind: 'field',
        message: 'the tangent matrix is not positive definite (conjugate-gradient curvature ≤ 0)',
      });
    }
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
      return failure(prepared, 'runaway', 'no steady state: the heat generated grows with temperature faster than the ground can remove it', iterations, {
        kind: 'field',
        message: 'the only solution of the tangent system lies below the boundary temperatures (its matrix is not positive definite)',
      });
    }
    let change = 0;
    for (let i = 0; i < n; i++) change = Math.max(change, Math.abs(rises[i] - previous[i]));
    problem.cables.forEach((cable, c) => {
      meanAir[c] = cableState(cable, tangent.chains[c], tangent.joules[c], referenceC + rises[soilUnknowns + c]).meanAirC;
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
  const cables: CableTemperatures[] = problem.cables.map((cable, c) => {
    const circleC = referenceC + rises[soilUnknowns + c];
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

  let generated = system.fixedSourceTotalW;
  for (const cable of cables) generated += cable.losses.totalWPerM;
  const toSurface = boundaryOutflow(system, system.top, rises);
  const toBottom = boundaryOutflow(system, system.bottom, rises);
  const scale = Math.max(Math.abs(generated), Math.abs(toSurface), Math.abs(toBottom), ENERGY_SCALE_FLOOR_W);
  const energyResidual = Math.abs(generated - toSurface - toBottom) / scale;
  if (!(energyResidual <= options.energyTolerance)) {
    return failure(prepared, 'not-converged', `the energy balance closes only to ${energyResidual.toExponential(2)} (demanded ${options.energyTolerance})`, iterations);
  }

  const limited = cables.filter((c) => c.marginK !== undefined);
  const pool = limited.length > 0 ? limited : cables;
  const governingCable = pool.reduce((best, c) =>
    (limited.length > 0 ? c.marginK! < best.marginK! : c.conductorC > best.conductorC) ? c : best,
  );

  const { nx, ny } = system;
  const temperaturesC = new Float64Array(nx * ny);
  for (let cell = 0; cell < nx * ny; cell++) temperaturesC[cell] = referenceC + rises[system.unknownOfCell[cell]];
  let sideRise = 0;
  for (let j = 0; j < ny; j++) {
    for (const i of [0, nx - 1]) {
      const cell = j * nx + i;
      if (system.owner[cell] < 0) sideRise = Math.max(sideRise, rises[system.unknownOfCell[cell]]);
    }
  }
  let circleRise = 0;
  for (let c = 0; c < m; c++) circleRise = Math.max(circleRise, rises[soilUnknowns + c]);

  prepared.warmStart = Float64Array.from(rises);
  return {
    converged: true,
    status: 'converged',
    cables,
    governing: {
      index: governingCable.index,
      ...(governingCable.name !== undefined ? { name: governingCable.name } : {}),
      conductorC: governingCable.conductorC,
      ...(governingCable.marginK !== undefined ? { marginK: governingCable.marginK } : {}),
    },
    heat: { generatedWPerM: generated, toSurfaceWPerM: toSurface, toBottomWPerM: toBottom, energyResidual },
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
  };
}

export function solveCrossSection(input: CrossSectionInput | unknown): CrossSectionResult {
  return solvePrepared(prepareCrossSection(input));
}

/**
 * Current distribution among parallel conductors by the filament (partial-inductance) method.
 *
 * Every conductor is cut into rectangular filaments, each carrying a uniform current density.
 * Per metre of run, each filament i obeys R'_i·I_i + jω·Σ_j L'_ij·I_j = V_g, where g is the
 * conductor group it belongs to (the bars of one phase are joined at both ends, so all their
 * filaments see the same voltage drop V_g per metre), and each group's total current is imposed:
 * Σ_{i∈g} I_i = I_g. L'_ij are the partial inductances of long rectangular conductors
 * (rectangleInductance.ts). With Z = R + jωL and B the filament-to-group incidence,
 *   I = Z⁻¹·B·v,  (Bᵀ·Z⁻¹·B)·v = I_groups,
 * i.e. one factorisation of Z and one solve per group. Phasors are RMS; losses per metre are
 * Σ R'_i·|I_i|², and equal Re Σ_g V_g·conj(I_g) (Tellegen), which the result reports as a check.
 *
 * Mirror symmetry: when the whole arrangement (geometry, resistivities) is symmetric about y = 0
 * and/or x = 0 AND the group currents are too — which holds about y = 0 for any bus-bar system
 * laid out by geometry.ts — the current density is even about that axis. Only the filaments on
 * one side are then given; each stands for itself and its mirror images (multiplicity 2 or 4),
 * and its row of L' sums the images' inductances. This is exact, not an approximation.
 */
import { MU0 } from '../materials';
import { factorComplexSymmetric, solveComplexGeneral, solveComplexSymmetric, type ComplexSymmetricFactor } from './complexDense';
import type { BusbarRectangle } from './geometry';
import {
  logMeanDistanceExactOf,
  logMeanDistanceMultipoleOf,
  MULTIPOLE_DISTANCE_RATIO,
  rectangleMoments,
} from './rectangleInductance';

export interface Complex {
  re: number;
  im: number;
}

export interface Filament extends BusbarRectangle {
  /** Resistivity at the working temperature, Ω·m. */
  resistivityOhmM: number;
  /** Conductor group (all filaments of a group share the voltage drop). */
  group: number;
  /** Free tag (e.g. the bar it belongs to) for the caller's aggregation. */
  tag: number;
}

export interface FilamentProblem {
  /** The filaments (only those on the kept side of each mirror axis). */
  filaments: readonly Filament[];
  /** Imposed RMS current phasor of each group, A. Index = Filament.group. */
  groupCurrents: readonly Complex[];
  /** 0 for DC. */
  frequencyHz: number;
  /** Even mirror symmetry: `y` about the line y = 0 (filaments given with y ≥ 0), `x` about x = 0 (x ≥ 0). */
  mirror?: { x?: boolean; y?: boolean };
}

export interface FilamentSolution {
  /** RMS current phasor of each given filament (its images carry the same), A. */
  currentRe: Float64Array;
  currentIm: Float64Array;
  /** Loss per metre of each given filament INCLUDING its images, W/m. */
  filamentLossWPerM: Float64Array;
  /** Copies of each given filament in the full arrangement (1, 2 or 4). */
  multiplicity: number;
  /** Voltage drop per metre of each group, V/m (shifted by an arbitrary common amount jωc·ΣI_g). */
  groupVoltage: Complex[];
  /** Σ R'|I|² over the full arrangement, W/m. */
  totalLossWPerM: number;
  /** |Σ R'|I|² − Re Σ V_g·conj(I_g)| / Σ R'|I|²: the solve's energy check. */
  powerBalanceResidual: number;
}

function checkProblem(problem: FilamentProblem, mirror: { x: boolean; y: boolean }): void {
  const groups = problem.groupCurrents.length;
  if (groups === 0) throw new Error('filament problem: no groups');
  if (!(problem.frequencyHz >= 0) || !Number.isFinite(problem.frequencyHz)) throw new Error('filament problem: frequency must be ≥ 0');
  const seen = new Array<boolean>(groups).fill(false);
  const tolerance = 1e-12;
  for (const f of problem.filaments) {
    if (!(f.sizeXM > 0 && f.sizeYM > 0 && f.resistivityOhmM > 0)) throw new Error('filament problem: filament sizes and resistivity must be > 0');
    if (!(Number.isInteger(f.group) && f.group >= 0 && f.group < groups)) throw new Error(`filament problem: group ${f.group} has no current`);
    if (mirror.y && f.cyM - f.sizeYM / 2 < -tolerance) throw new Error('filament problem: with mirror.y every filament must lie in y ≥ 0');
    if (mirror.x && f.cxM - f.sizeXM / 2 < -tolerance) throw new Error('filament problem: with mirror.x every filament must lie in x ≥ 0');
    seen[f.group] = true;
  }
  const empty = seen.indexOf(false);
  if (empty >= 0) throw new Error(`filament problem: group ${empty} has no filament`);
}

/** Half the diagonal of the box holding every filament and its images, m: sets D_ref. */
function referenceDistance(filaments: readonly Filament[], mirror: { x: boolean; y: boolean }): number {
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const f of filaments) {
    minX = Math.min(minX, f.cxM - f.sizeXM / 2, mirror.x ? -(f.cxM + f.sizeXM / 2) : Infinity);
    maxX = Math.max(maxX, f.cxM + f.sizeXM / 2);
    minY = Math.min(minY, f.cyM - f.sizeYM / 2, mirror.y ? -(f.cyM + f.sizeYM / 2) : Infinity);
    maxY = Math.max(maxY, f.cyM + f.sizeYM / 2);
  }
  // Any D_ref larger than every distance keeps L' positive; twice the diagonal is comfortably so.
  return 2 * Math.hypot(maxX - minX, maxY - minY);
}

/**
 * Fills the lower triangle of `out` (n × n, row-major) with scale·L″_ij, L″_ij = Σ over the images
 * of j of (ln D_ref − ⟨ln r⟩). Plain arrays of numbers rather than objects: this is the O(n²) part.
 */
function assembleInductance(filaments: readonly Filament[], mirror: { x: boolean; y: boolean }, scale: number, out: Float64Array): void {
  const n = filaments.length;
  const cx = Float64Array.from(filaments, (f) => f.cxM);
  const cy = Float64Array.from(filaments, (f) => f.cyM);
  const sx = Float64Array.from(filaments, (f) => f.sizeXM);
  const sy = Float64Array.from(filaments, (f) => f.sizeYM);
  const m2 = new Float64Array(n);
  const m4 = new Float64Array(n);
  const m6 = new Float64Array(n);
  for (let i = 0; i < n; i++) [m2[i], m4[i], m6[i]] = rectangleMoments(sx[i], sy[i]);
  const lnRef = Math.log(referenceDistance(filaments, mirror));
  // Image signs (x, y): the filament itself, then its mirror images.
  const signs: Array<[number, number]> = [[1, 1]];
  if (mirror.y) signs.push([1, -1]);
  if (mirror.x) signs.push([-1, 1]);
  if (mirror.x && mirror.y) signs.push([-1, -1]);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const side = MULTIPOLE_DISTANCE_RATIO * Math.max(sx[i], sy[i], sx[j], sy[j]);
      const near2 = side * side;
      let sum = 0;
      for (const [gx, gy] of signs) {
        const jx = gx * cx[j];
        const jy = gy * cy[j];
        const dx = cx[i] - jx;
        const dy = cy[i] - jy;
        const lnG =
          dx * dx + dy * dy > near2
            ? logMeanDistanceMultipoleOf(dx, dy, m2[i], m4[i], m6[i], m2[j], m4[j], m6[j])
            : logMeanDistanceExactOf(cx[i], cy[i], sx[i], sy[i], jx, jy, sx[j], sy[j]);
        sum += lnRef - lnG;
      }
      out[i * n + j] = scale * sum;
    }
  }
}

export interface PreparedFilamentSystem {
  readonly filaments: readonly Filament[];
  readonly groupCount: number;
  readonly frequencyHz: number;
  readonly multiplicity: number;
  /** Resistance per metre of each filament the factorisation was made with, Ω/m. */
  readonly baseResistance: Float64Array;
  /** L·D·Lᵀ of Z = R + jωL (null at DC). */
  readonly factor: ComplexSymmetricFactor | null;
}

/** Validates and factors Z = R + jωL once; `solvePreparedFilaments` then solves for any currents. */
export function prepareFilamentSystem(problem: Omit<FilamentProblem, 'groupCurrents'> & { groupCount: number }): PreparedFilamentSystem {
  const mirror = { x: problem.mirror?.x === true, y: problem.mirror?.y === true };
  checkProblem({ ...problem, groupCurrents: new Array(problem.groupCount).fill({ re: 0, im: 0 }) }, mirror);
  const filaments = problem.filaments;
  const n = filaments.length;
  const omega = 2 * Math.PI * problem.frequencyHz;
  const baseResistance = Float64Array.from(filaments, (f) => f.resistivityOhmM / (f.sizeXM * f.sizeYM));
  let factor: ComplexSymmetricFactor | null = null;
  if (omega > 0) {
    const zRe = new Float64Array(n * n);
    const zIm = new Float64Array(n * n);
    assembleInductance(filaments, mirror, (omega * MU0) / (2 * Math.PI), zIm);
    for (let i = 0; i < n; i++) zRe[i * n + i] = baseResistance[i];
    factor = factorComplexSymmetric(n, zRe, zIm);
  }
  return {
    filaments,
    groupCount: problem.groupCount,
    frequencyHz: problem.frequencyHz,
    multiplicity: (mirror.x ? 2 : 1) * (mirror.y ? 2 : 1),
    baseResistance,
    factor,
  };
}

/** Largest |Δρ/ρ| for which the factorisation is reused; beyond it the caller should prepare again. */
export const REUSE_RESISTIVITY_CHANGE = 0.3;

/**
 * Solves (R′ + jωL)·x = b with the factorisation of (R + jωL), R′ = R + ΔR diagonal, by the
 * fixed point x ← (R + jωL)⁻¹·(b − ΔR·x). It contracts at a rate at most max|ΔR_i/R_i|:
 * R^−½(R + jωL)R^−½ = I + jS with S real symmetric is normal with eigenvalues 1 + jλ, so
 * ‖R^½(R + jωL)⁻¹R^½‖ ≤ 1 (this module's own short argument).
 */
function solveShifted(
  factor: ComplexSymmetricFactor,
  deltaR: Float64Array | null,
  bRe: Float64Array,
  bIm: Float64Array,
): { re: Float64Array; im: Float64Array; iterations: number } {
  const n = bRe.length;
  const xRe = bRe.slice();
  const xIm = bIm.slice();
  solveComplexSymmetric(factor, xRe, xIm);
  if (deltaR === null) return { re: xRe, im: xIm, iterations: 0 };
  const rhsRe = new Float64Array(n);
  const rhsIm = new Float64Array(n);
  for (let iteration = 1; iteration <= 200; iteration++) {
    for (let i = 0; i < n; i++) {
      rhsRe[i] = bRe[i] - deltaR[i] * xRe[i];
      rhsIm[i] = bIm[i] - deltaR[i] * xIm[i];
    }
    solveComplexSymmetric(factor, rhsRe, rhsIm);
    let change = 0;
    let size = 0;
    for (let i = 0; i < n; i++) {
      change = Math.max(change, Math.abs(rhsRe[i] - xRe[i]), Math.abs(rhsIm[i] - xIm[i]));
      size = Math.max(size, Math.abs(rhsRe[i]), Math.abs(rhsIm[i]));
    }
    xRe.set(rhsRe);
    xIm.set(rhsIm);
    if (change <= 1e-12 * size) return { re: xRe, im: xIm, iterations: iteration };
  }
  throw new Error('filament solve: the resistivity update did not converge');
}

/**
 * Filament currents for the imposed group currents; `resistivityOhmM` (per filament) replaces the
 * resistivities the system was prepared with (each within REUSE_RESISTIVITY_CHANGE of it).
 */
export function solvePreparedFilaments(
  prepared: PreparedFilamentSystem,
  groupCurrents: readonly Complex[],
  resistivityOhmM?: ArrayLike<number>,
): FilamentSolution & { refinementIterations: number } {
  const { filaments, multiplicity, factor } = prepared;
  const n = filaments.length;
  const groups = prepared.groupCount;
  if (groupCurrents.length !== groups) throw new Error(`filament solve: ${groups} group currents expected`);
  let resistance = prepared.baseResistance;
  let deltaR: Float64Array | null = null;
  if (resistivityOhmM !== undefined) {
    if (resistivityOhmM.length !== n) throw new Error('filament solve: one resistivity per filament expected');
    resistance = Float64Array.from(filaments, (f, i) => resistivityOhmM[i] / (f.sizeXM * f.sizeYM));
    deltaR = Float64Array.from(resistance, (r, i) => r - prepared.baseResistance[i]);
    const largest = Math.max(...deltaR.map((d, i) => Math.abs(d) / prepared.baseResistance[i]));
    if (!(largest <= REUSE_RESISTIVITY_CHANGE)) throw new Error('filament solve: resistivities moved too far from the prepared ones; prepare again');
  }

  // Columns X_g = Z⁻¹·b_g, b_g = 1 on the filaments of group g; stored as groups × n.
  const xRe = new Float64Array(groups * n);
  const xIm = new Float64Array(groups * n);
  let refinementIterations = 0;
  if (factor === null) {
    // DC: Z = R, each filament takes V/R′.
    filaments.forEach((f, i) => {
      xRe[f.group * n + i] = 1 / resistance[i];
    });
  } else {
    for (let g = 0; g < groups; g++) {
      const bRe = new Float64Array(n);
      filaments.forEach((f, i) => {
        if (f.group === g) bRe[i] = 1;
      });
      const x = solveShifted(factor, deltaR, bRe, new Float64Array(n));
      refinementIterations = Math.max(refinementIterations, x.iterations);
      xRe.set(x.re, g * n);
      xIm.set(x.im, g * n);
    }
  }

  // Schur system S·v = I_groups, S_hg = multiplicity · Σ_{i∈h} X_g,i.
  const sRe = new Float64Array(groups * groups);
  const sIm = new Float64Array(groups * groups);
  for (let g = 0; g < groups; g++) {
    for (let i = 0; i < n; i++) {
      const h = filaments[i].group;
      sRe[h * groups + g] += multiplicity * xRe[g * n + i];
      sIm[h * groups + g] += multiplicity * xIm[g * n + i];
    }
  }
  const v = solveComplexGeneral(
    groups,
    sRe,
    sIm,
    groupCurrents.map((c) => c.re),
    groupCurrents.map((c) => c.im),
  );

  const currentRe = new Float64Array(n);
  const currentIm = new Float64Array(n);
  for (let g = 0; g < groups; g++) {
    const vr = v.re[g];
    const vi = v.im[g];
    for (let i = 0; i < n; i++) {
      const ar = xRe[g * n + i];
      const ai = xIm[g * n + i];
      currentRe[i] += vr * ar - vi * ai;
      currentIm[i] += vr * ai + vi * ar;
    }
  }
  const filamentLossWPerM = new Float64Array(n);
  let totalLossWPerM = 0;
  for (let i = 0; i < n; i++) {
    const loss = multiplicity * resistance[i] * (currentRe[i] ** 2 + currentIm[i] ** 2);
    filamentLossWPerM[i] = loss;
    totalLossWPerM += loss;
  }
  let supplied = 0;
  for (let g = 0; g < groups; g++) {
    const c = groupCurrents[g];
    supplied += v.re[g] * c.re + v.im[g] * c.im; // Re(V·conj(I))
  }
  const groupVoltage = Array.from({ length: groups }, (_, g) => ({ re: v.re[g], im: v.im[g] }));
  const powerBalanceResidual = totalLossWPerM > 0 ? Math.abs(totalLossWPerM - supplied) / totalLossWPerM : 0;
  return { currentRe, currentIm, filamentLossWPerM, multiplicity, groupVoltage, totalLossWPerM, powerBalanceResidual, refinementIterations };
}


/** Solves the filament currents for the imposed group currents (prepare and solve in one). */
export function solveFilaments(problem: FilamentProblem): FilamentSolution {
  const prepared = prepareFilamentSystem({ ...problem, groupCount: problem.groupCurrents.length });
  return solvePreparedFilaments(prepared, problem.groupCurrents);
}

// ---------------------------------------------------------------------------------------------
// Meshing a rectangle into graded filaments
// ---------------------------------------------------------------------------------------------

/**
 * Break points of [0, 1] in n cells, finer towards the ends where the current crowds:
 * x(s) = (1 − β)s + β(1 − cos πs)/2 (both ends), or x(s) = (1 − β)s + β·sin(πs/2) (towards 1 only,
 * for half a conductor cut on its mirror axis). β = 0 is uniform.
 */
export function gradedBreaks(cells: number, towards: 'both' | 'high', beta: number): number[] {
  const out: number[] = [];
  for (let i = 0; i <= cells; i++) {
    const s = i / cells;
    const clustered = towards === 'both' ? (1 - Math.cos(Math.PI * s)) / 2 : Math.sin((Math.PI * s) / 2);
    out.push((1 - beta) * s + beta * clustered);
  }
  return out;
}

export interface RectangleMesh {
  /** Cells across x and across y. */
  cellsX: number;
  cellsY: number;
  /** How each direction is graded: 'both' ends, towards the 'high' end only (mirror cut at the low end), or 'uniform'. */
  gradingX: 'both' | 'high' | 'uniform';
  gradingY: 'both' | 'high' | 'uniform';
  /** Strength of the grading, 0 … 1. */
  beta: number;
}

/** Cuts a rectangle into cellsX × cellsY graded rectangles. */
export function meshRectangle(rect: BusbarRectangle, mesh: RectangleMesh): BusbarRectangle[] {
  // A fractional count would leave the last break short of the edge: a cell of negative size.
  if (!(Number.isInteger(mesh.cellsX) && mesh.cellsX >= 1 && Number.isInteger(mesh.cellsY) && mesh.cellsY >= 1)) {
    throw new Error(`meshRectangle: cell counts must be whole numbers ≥ 1 (got ${mesh.cellsX} × ${mesh.cellsY})`);
  }
  const breaks = (cells: number, grading: RectangleMesh['gradingX']) =>
    grading === 'uniform' ? gradedBreaks(cells, 'both', 0) : gradedBreaks(cells, grading, mesh.beta);
  const bx = breaks(mesh.cellsX, mesh.gradingX);
  const by = breaks(mesh.cellsY, mesh.gradingY);
  const x0 = rect.cxM - rect.sizeXM / 2;
  const y0 = rect.cyM - rect.sizeYM / 2;
  const out: BusbarRectangle[] = [];
  for (let i = 0; i < mesh.cellsX; i++) {
    const xa = x0 + bx[i] * rect.sizeXM;
    const xb = x0 + bx[i + 1] * rect.sizeXM;
    for (let j = 0; j < mesh.cellsY; j++) {
      const ya = y0 + by[j] * rect.sizeYM;
      const yb = y0 + by[j + 1] * rect.sizeYM;
      out.push({ cxM: (xa + xb) / 2, cyM: (ya + yb) / 2, sizeXM: xb - xa, sizeYM: yb - ya });
    }
  }
  return out;
}

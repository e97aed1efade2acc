/**
 * Heat paths inside two- to five-core cables with round conductors: the internal thermal
 * resistance between each conductor and the inner surface of the sheath (IEC 60287's T₁ for
 * multi-core cables) and the concentric coverings outside it (T₂, T₃ of IEC 60287-2-1
 * §4.1.3–4.1.4: ρ_T/(2π)·ln(1 + 2t/D)).
 *
 * Owned by the protection branch (issue 21, item 5); independent of any lib/electrical/iec60287
 * folder of another branch.
 *
 * The method. IEC 60287-2-1 treats the insulation, fillers and belt of a multi-core cable as
 * one medium between isothermal conductors and an isothermal sheath, and gives its geometric
 * factor G (T₁ = ρ_T/(2π)·G) from a figure or, in its 2015 edition, a fitted expression; we
 * recall neither well enough to use, so this module solves the same two-dimensional conduction
 * problem itself, exactly to a stated tolerance:
 * - ∇²θ = 0 in the medium (resistivity ρ), θ = 0 on the sheath circle |z| = R, every
 *   conductor surface isothermal (copper and aluminium conduct ~1000× better than the
 *   insulation) at an unknown θ_i, and the heat W_i each conductor gives off prescribed.
 * - θ is written as the line sources W_i at the conductor centres with their images in the
 *   sheath (the Green's function of the disc, ρ/(2π)·ln(|R² − z·c̄|/(R·|z − c|)); any
 *   electrostatics text, e.g. Smythe, "Static and Dynamic Electricity", images in a cylinder)
 *   plus, for each conductor, multipoles Re[A_k (r/(z − c))^k] made zero on the sheath by the
 *   circle theorem (Milne-Thomson: f(z) − conj(f(R²/z̄))). The multipole coefficients and the
 *   θ_i follow from collocation on each conductor's circle; the order is raised until the
 *   resistances settle to 1e-7 (relative).
 * - Checks (tests): one eccentric conductor reproduces the exact shape factor of eccentric
 *   cylinders, arccosh((R² + r² − e²)/(2Rr)) (Incropera, Table 4.1, from memory); the
 *   concentric case is the single-core T₁ = ρ_T/(2π)·ln(1 + 2t₁/d_c) of IEC 60287-2-1; thin
 *   conductors tend to the line-source closed form for three cores,
 *   ρ/(2π)·ln[(R⁶ − s⁶)/(3s²R³r_c)] (derived by images, worked in the test).
 *
 * Without the multipoles (line sources alone) the result is far off for LV cables, whose
 * conductors are large beside the insulation: 55 % high for a 3 × 95 mm² build with 1.1 mm of
 * insulation — that is why they are here. An independent finite-difference solution of the
 * same problem (scipy, Richardson-extrapolated) agrees within 0.05 % for three and four cores.
 */
import { ElectricalInputError, SizingError, requireNonNegative, requirePositive, requireRange } from './errors';

// ───────────────────────────── Small complex arithmetic ─────────────────────────────

interface C {
  re: number;
  im: number;
}
const c = (re: number, im = 0): C => ({ re, im });
const sub = (a: C, b: C): C => c(a.re - b.re, a.im - b.im);
const mul = (a: C, b: C): C => c(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);
const div = (a: C, b: C): C => {
  const d = b.re * b.re + b.im * b.im;
  return c((a.re * b.re + a.im * b.im) / d, (a.im * b.re - a.re * b.im) / d);
};
const conj = (a: C): C => c(a.re, -a.im);
const abs = (a: C): number => Math.hypot(a.re, a.im);

// ───────────────────────────── Dense linear solve ─────────────────────────────

/** LU factorisation with partial pivoting of a square row-major matrix (in place); returns the pivots. */
function luFactor(a: Float64Array, n: number): Int32Array {
  const piv = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (best === 0 || !Number.isFinite(best)) throw new SizingError('MULTICORE_SINGULAR', 'the multi-core conduction system is singular');
    piv[k] = p;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j];
        a[k * n + j] = a[p * n + j];
        a[p * n + j] = t;
      }
    }
    const akk = a[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = (a[i * n + k] /= akk);
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) a[i * n + j] -= f * a[k * n + j];
    }
  }
  return piv;
}

function luSolve(lu: Float64Array, piv: Int32Array, n: number, rhs: Float64Array): Float64Array {
  const x = Float64Array.from(rhs);
  for (let k = 0; k < n; k++) {
    const p = piv[k];
    if (p !== k) {
      const t = x[k];
      x[k] = x[p];
      x[p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    let s = x[i];
    for (let j = 0; j < i; j++) s -= lu[i * n + j] * x[j];
    x[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i];
    for (let j = i + 1; j < n; j++) s -= lu[i * n + j] * x[j];
    x[i] = s / lu[i * n + i];
  }
  return x;
}

// ───────────────────────────── The conduction problem ─────────────────────────────

/** An isothermal round conductor (or screened core) inside the sheath. */
export interface IsothermalCircle {
  /** Centre, m, from the cable axis. */
  xM: number;
  yM: number;
  radiusM: number;
}

/** Source (line + image) term in units R = 1, ρ/(2π) = 1: ln(|1 − z·c̄|/|z − c|). */
function greenUnit(z: C, centre: C): number {
  return Math.log(abs(sub(c(1), mul(z, conj(centre)))) / abs(sub(z, centre)));
}

interface Solved {
  /** m_ij in units of ρ/(2π): rise of circle i per unit heat of circle j. */
  matrix: number[][];
  order: number;
  /** Largest departure of θ from θ_i between collocation points, in the same units, per unit heat. */
  residual: number;
}

/** Collocation solve at multipole order K (R = 1). */
function solveAtOrder(circles: readonly { centre: C; r: number }[], K: number): Solved {
  const N = circles.length;
  const per = 2 * K + 1;
  const n = N * per;
  const a = new Float64Array(n * n);
  const points: C[][] = circles.map(({ centre, r }) =>
    Array.from({ length: per }, (_, p) => {
      const phi = (2 * Math.PI * p) / per;
      return c(centre.re + r * Math.cos(phi), centre.im + r * Math.sin(phi));
    }),
  );
  // Row (i, p): Σ_j Σ_k [a_jk(u_r − v_r) + b_jk(−u_i − v_i)] − θ_i = −Σ_j W_j g(z, c_j),
  // u = (r_j/(z − c_j))^k, v = (r_j/(1/z − c̄_j))^k.
  const fillRow = (row: Float64Array, z: C, i: number) => {
    row.fill(0);
    row[i * per] = -1;
    const zInv = div(c(1), z);
    circles.forEach(({ centre, r }, j) => {
      const base = div(c(r), sub(z, centre));
      const baseImage = div(c(r), sub(zInv, conj(centre)));
      let u = c(1);
      let v = c(1);
      for (let k = 1; k <= K; k++) {
        u = mul(u, base);
        v = mul(v, baseImage);
        row[j * per + 2 * k - 1] = u.re - v.re;
        row[j * per + 2 * k] = -u.im - v.im;
      }
    });
  };
  const row = new Float64Array(n);
  for (let i = 0; i < N; i++) {
    for (let p = 0; p < per; p++) {
      fillRow(row, points[i][p], i);
      a.set(row, (i * per + p) * n);
    }
  }
  const pivots = luFactor(a, n);
  const matrix: number[][] = Array.from({ length: N }, () => new Array<number>(N).fill(0));
  let residual = 0;
  for (let j = 0; j < N; j++) {
    const rhs = new Float64Array(n);
    for (let i = 0; i < N; i++) for (let p = 0; p < per; p++) rhs[i * per + p] = -greenUnit(points[i][p], circles[j].centre);
    const x = luSolve(a, pivots, n, rhs);
    for (let i = 0; i < N; i++) matrix[i][j] = x[i * per];
    // Boundary mismatch between collocation points: θ(z) − θ_i at the mid-angles.
    for (let i = 0; i < N; i++) {
      const { centre, r } = circles[i];
      for (let p = 0; p < per; p++) {
        const phi = (2 * Math.PI * (p + 0.5)) / per;
        const z = c(centre.re + r * Math.cos(phi), centre.im + r * Math.sin(phi));
        fillRow(row, z, i);
        let theta = greenUnit(z, circles[j].centre);
        for (let q = 0; q < n; q++) if (row[q] !== 0 && q % per !== 0) theta += row[q] * x[q];
        residual = Math.max(residual, Math.abs(theta - x[i * per]));
      }
    }
  }
  return { matrix, order: K, residual };
}

const ORDERS = [4, 8, 12, 16, 24, 32, 48, 64] as const;
const SETTLED_RELATIVE = 1e-7;

function maxRelativeChange(a: number[][], b: number[][]): number {
  let scale = 0;
  for (const r of b) for (const v of r) scale = Math.max(scale, Math.abs(v));
  let d = 0;
  for (let i = 0; i < a.length; i++) for (let j = 0; j < a.length; j++) d = Math.max(d, Math.abs(a[i][j] - b[i][j]));
  return d / scale;
}

export interface ConductionMatrixResult {
  /** M_ij, K·m/W: temperature rise of circle i above the sheath per W/m given off by circle j (symmetric). */
  matrixKmPerW: number[][];
  /** Multipole order at which the matrix settled. */
  order: number;
  /** Largest change of M in the last order step, relative. */
  settledRelative: number;
  /** Largest departure from isothermal on the circles per W/m, K·m/W (accuracy of the collocation). */
  boundaryResidualKmPerW: number;
}

/**
 * Thermal resistance matrix of isothermal circles inside an isothermal circle of radius
 * `radiusM`, in a medium of resistivity `thermalResistivityKmPerW`. Circles must not overlap
 * each other nor the sheath.
 */
export function isothermalCirclesInSheath(args: {
  circles: readonly IsothermalCircle[];
  radiusM: number;
  thermalResistivityKmPerW: number;
}): ConductionMatrixResult {
  const R = requirePositive(args?.radiusM, 'radiusM');
  const rho = requireRange(args.thermalResistivityKmPerW, 'thermalResistivityKmPerW', 0, 1e4, { minExclusive: true });
  if (!Array.isArray(args.circles) || args.circles.length === 0 || args.circles.length > 7) {
    throw new ElectricalInputError('circles', 'must list one to seven conductors');
  }
  const circles = args.circles.map((k, i) => {
    const x = Number.isFinite(k?.xM) ? k.xM : NaN;
    const y = Number.isFinite(k?.yM) ? k.yM : NaN;
    if (Number.isNaN(x)) throw new ElectricalInputError(`circles[${i}].xM`, 'must be a finite number');
    if (Number.isNaN(y)) throw new ElectricalInputError(`circles[${i}].yM`, 'must be a finite number');
    const r = requirePositive(k.radiusM, `circles[${i}].radiusM`);
    if (Math.hypot(x, y) + r >= R) throw new ElectricalInputError(`circles[${i}]`, `must lie inside the sheath (radius ${R} m)`);
    return { centre: c(x / R, y / R), r: r / R };
  });
  for (let i = 0; i < circles.length; i++) {
    for (let j = 0; j < i; j++) {
      if (abs(sub(circles[i].centre, circles[j].centre)) <= circles[i].r + circles[j].r) {
        throw new ElectricalInputError(`circles[${i}]`, `overlaps or touches circles[${j}]`);
      }
    }
  }
  let previous = solveAtOrder(circles, ORDERS[0]);
  for (let s = 1; s < ORDERS.length; s++) {
    const next = solveAtOrder(circles, ORDERS[s]);
    const change = maxRelativeChange(previous.matrix, next.matrix);
    previous = next;
    if (change < SETTLED_RELATIVE) {
      return wrap(next, change);
    }
    if (s === ORDERS.length - 1) {
      throw new SizingError(
        'MULTICORE_NOT_SETTLED',
        `the multi-core conduction solution did not settle (relative change ${change.toExponential(2)} at order ${next.order}); conductors too close together or to the sheath`,
      );
    }
  }
  throw new SizingError('MULTICORE_NOT_SETTLED', 'unreachable');

  function wrap(s: Solved, change: number): ConductionMatrixResult {
    const scale = rho / (2 * Math.PI);
    return {
      matrixKmPerW: s.matrix.map((r) => r.map((v) => v * scale)),
      order: s.order,
      settledRelative: change,
      boundaryResidualKmPerW: s.residual * scale,
    };
  }
}

// ───────────────────────────── A cable of n equal round cores ─────────────────────────────

/** T₂/T₃ of a concentric covering, IEC 60287-2-1 §4.1.3–4.1.4: ρ_T/(2π)·ln(1 + 2t/D), K·m/W. */
export function concentricCoveringThermalResistance(args: { innerDiameterM: number; thicknessM: number; thermalResistivityKmPerW: number }): number {
  const D = requirePositive(args?.innerDiameterM, 'innerDiameterM');
  const t = requirePositive(args.thicknessM, 'thicknessM');
  const rho = requirePositive(args.thermalResistivityKmPerW, 'thermalResistivityKmPerW');
  return (rho / (2 * Math.PI)) * Math.log(1 + (2 * t) / D);
}

export interface MulticoreCableInput {
  /** Cores in the cable (2–5), laid up touching on one circle. */
  cores: number;
  conductorDiameterM: number;
  /** Insulation thickness of each core, m. */
  insulationThicknessM: number;
  insulationResistivityKmPerW: number;
  /** Fillers (and belt): without it, the insulation's. */
  fillerResistivityKmPerW?: number;
  /** From the circle circumscribing the laid-up cores to the inner surface of the sheath (belt, inner covering), m; ≥ 0. */
  innerCoveringThicknessM: number;
  /** Heat given off by each core, W/m (its I²R_ac at its temperature; 0 for an unloaded core or the protective conductor). */
  coreLossesWPerM: readonly number[];
  /** Concentric coverings from the inside out (sheath, armour bedding, jacket): each carries the cable's whole loss. */
  outerLayers?: readonly { name?: string; thicknessM: number; thermalResistivityKmPerW: number }[];
}

export interface MulticoreCableResult {
  method: string;
  coreCentresM: { xM: number; yM: number }[];
  /** Radius of the inner surface of the (first) sheath, m. */
  radiusUnderSheathM: number;
  /** Outer diameter over every layer, m. */
  outerDiameterM: number;
  /** Resistivity used for the medium between the cores (or screens) and the sheath. */
  mediumResistivityKmPerW: number;
  mediumResistivityBasis: string;
  /** M_ij, K·m/W, conductor i over the sheath's inner surface per W/m of core j. */
  matrixKmPerW: number[][];
  /** Rise of each conductor over the sheath's inner surface for the given losses, K. */
  coreRiseK: number[];
  /** IEC 60287 T₁ of each loaded core, ΔT_i/W_i (K·m/W); undefined for a core giving off nothing. */
  perCoreT1KmPerW: (number | undefined)[];
  hottestCore: number;
  totalLossWPerM: number;
  /** ΔT of the hottest core over the sheath per W/m of the cable's total loss, K·m/W (depends on the loss shares, not their size). */
  internalResistanceForTotalKmPerW: number;
  /** T₂/T₃ of each outer layer, K·m/W, carrying the total loss. */
  outerLayerResistancesKmPerW: { name: string; kmPerW: number }[];
  /** Hottest conductor over the cable surface for the given losses, K. */
  hottestRiseOverSurfaceK: number;
  /**
   * For a one-conductor radial model carrying the total loss: the conductor diameter that,
   * with the medium's resistivity out to the sheath, reproduces the hottest core (the
   * construction of IEC 60853-2 for multi-core cables, from memory). To keep another
   * equivalent conductor (e.g. d_c·√n) use `effectiveInternalLayer`.
   */
  equivalentConductorDiameterM: number;
  order: number;
  settledRelative: number;
  boundaryResidualKmPerW: number;
}

/**
 * Internal and covering thermal resistances of a cable of n equal round, unscreened cores,
 * touching on one circle, from each core's loss. The sheath's inner surface is taken
 * isothermal, as IEC 60287 does for T₁ of multi-core cables. Cores with their own metallic
 * screens (medium-voltage builds) are not handled: touching screens make touching isothermal
 * circles, which this method refuses.
 */
export function multicoreCableThermal(args: MulticoreCableInput): MulticoreCableResult {
  const n = args?.cores;
  if (n !== 2 && n !== 3 && n !== 4 && n !== 5) throw new ElectricalInputError('cores', `must be 2, 3, 4 or 5 (got ${String(n)})`);
  const dc = requireRange(args.conductorDiameterM, 'conductorDiameterM', 0, 0.2, { minExclusive: true });
  const ti = requireRange(args.insulationThicknessM, 'insulationThicknessM', 0, 0.1, { minExclusive: true });
  const rhoI = requireRange(args.insulationResistivityKmPerW, 'insulationResistivityKmPerW', 0, 1e4, { minExclusive: true });
  const rhoF = args.fillerResistivityKmPerW === undefined ? rhoI : requireRange(args.fillerResistivityKmPerW, 'fillerResistivityKmPerW', 0, 1e4, { minExclusive: true });
  const belt = requireNonNegative(args.innerCoveringThicknessM, 'innerCoveringThicknessM');
  if (!Array.isArray(args.coreLossesWPerM) || args.coreLossesWPerM.length !== n) {
    throw new ElectricalInputError('coreLossesWPerM', `must give one loss per core (${n})`);
  }
  const losses = args.coreLossesWPerM.map((w, i) => requireNonNegative(w, `coreLossesWPerM[${i}]`));
  const total = losses.reduce((s, w) => s + w, 0);
  if (!(total > 0)) throw new ElectricalInputError('coreLossesWPerM', 'at least one core must give off heat');

  const rc = dc / 2;
  const rCore = rc + ti;
  const s = n === 2 ? rCore : rCore / Math.sin(Math.PI / n);
  const R = s + rCore + belt;
  const centres = Array.from({ length: n }, (_, j) => {
    const phi = Math.PI / 2 + (2 * Math.PI * j) / n;
    return { xM: s * Math.cos(phi), yM: s * Math.sin(phi) };
  });

  // One medium from the conductor surfaces to the sheath. A filler of another resistivity is
  // not resolved; the larger of the two over the whole medium bounds every rise from above
  // (raising the resistivity anywhere cannot cool a conductor: Rayleigh's monotony law).
  const mediumRho = Math.max(rhoI, rhoF);
  const mediumBasis =
    rhoF === rhoI
      ? 'insulation, fillers and belt as one medium (as IEC 60287-2-1 takes them)'
      : `insulation and fillers of different resistivity: the larger, ${mediumRho} K·m/W, taken for both (an upper bound)`;
  const solved = isothermalCirclesInSheath({
    circles: centres.map((p) => ({ ...p, radiusM: rc })),
    radiusM: R,
    thermalResistivityKmPerW: mediumRho,
  });
  const matrix = solved.matrixKmPerW.map((r) => [...r]);
  const coreRiseK = matrix.map((r) => r.reduce((sum, m, j) => sum + m * losses[j], 0));
  let hottestCore = 0;
  for (let i = 1; i < n; i++) if (coreRiseK[i] > coreRiseK[hottestCore]) hottestCore = i;
  const internal = coreRiseK[hottestCore] / total;

  let diameter = 2 * R;
  const outerLayerResistancesKmPerW = (args.outerLayers ?? []).map((l, k) => {
    const kmPerW = concentricCoveringThermalResistance({
      innerDiameterM: diameter,
      thicknessM: requirePositive(l?.thicknessM, `outerLayers[${k}].thicknessM`),
      thermalResistivityKmPerW: requirePositive(l.thermalResistivityKmPerW, `outerLayers[${k}].thermalResistivityKmPerW`),
    });
    diameter += 2 * l.thicknessM;
    return { name: l.name ?? `layer ${k + 1}`, kmPerW };
  });
  const outerSum = outerLayerResistancesKmPerW.reduce((sum, l) => sum + l.kmPerW, 0);

  const equivalentConductorDiameterM = 2 * R * Math.exp((-2 * Math.PI * internal) / mediumRho);

  return {
    method: 'two-dimensional conduction between isothermal conductors and an isothermal sheath: line sources with their images and circle-theorem multipoles, collocation (see module note)',
    coreCentresM: centres,
    radiusUnderSheathM: R,
    outerDiameterM: diameter,
    mediumResistivityKmPerW: mediumRho,
    mediumResistivityBasis: mediumBasis,
    matrixKmPerW: matrix,
    coreRiseK,
    perCoreT1KmPerW: losses.map((w, i) => (w > 0 ? coreRiseK[i] / w : undefined)),
    hottestCore,
    totalLossWPerM: total,
    internalResistanceForTotalKmPerW: internal,
    outerLayerResistancesKmPerW,
    hottestRiseOverSurfaceK: coreRiseK[hottestCore] + total * outerSum,
    equivalentConductorDiameterM,
    order: solved.order,
    settledRelative: solved.settledRelative,
    boundaryResidualKmPerW: solved.boundaryResidualKmPerW,
  };
}

/**
 * The one layer, from an equivalent conductor of `conductorDiameterM` out to the sheath's inner
 * surface, whose ρ/(2π)·ln(2R/d) equals the internal resistance for the total loss: a one-
 * conductor radial model with this layer and the real outer layers gives the hottest core's
 * temperature (the loss shares fixed).
 */
export function effectiveInternalLayer(args: {
  internalResistanceForTotalKmPerW: number;
  radiusUnderSheathM: number;
  conductorDiameterM: number;
}): { thicknessM: number; thermalResistivityKmPerW: number } {
  const internal = requirePositive(args?.internalResistanceForTotalKmPerW, 'internalResistanceForTotalKmPerW');
  const R = requirePositive(args.radiusUnderSheathM, 'radiusUnderSheathM');
  const d = requireRange(args.conductorDiameterM, 'conductorDiameterM', 0, 2 * R, { minExclusive: true, maxExclusive: true });
  return { thicknessM: R - d / 2, thermalResistivityKmPerW: (2 * Math.PI * internal) / Math.log((2 * R) / d) };
}

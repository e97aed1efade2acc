/**
 * Helpers for field cases: nodal error against a closed form and the observed order of a
 * grid-convergence study (the slope of log error against log cell size, Roache's "observed
 * order of accuracy").
 */
import type { ConvergenceStudy, ProfileComparison } from './types';

export function maxNodalError(positions: number[], temperatures: number[], exact: (position: number) => number): number {
  if (positions.length === 0 || positions.length !== temperatures.length) return Number.POSITIVE_INFINITY;
  let worst = 0;
  for (let i = 0; i < positions.length; i++) {
    const e = Math.abs(temperatures[i] - exact(positions[i]));
    if (!(e <= worst)) worst = e; // a NaN makes the error NaN, never a silent pass
  }
  return worst;
}

/** Least-squares slope of log(error) against log(1/cells) over the last `fitPoints` entries. */
export function observedOrder(cells: number[], errors: number[], fitPoints = cells.length): number {
  const from = Math.max(0, cells.length - fitPoints);
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = from; i < cells.length; i++) {
    xs.push(Math.log(1 / cells[i]));
    ys.push(Math.log(errors[i]));
  }
  const n = xs.length;
  if (n < 2) return Number.NaN;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const my = ys.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (xs[i] - mx) * (ys[i] - my);
    sxx += (xs[i] - mx) ** 2;
  }
  return sxy / sxx;
}

export interface FieldSolve {
  positions: number[];
  temperatures: number[];
}

export function convergenceStudy(
  cellCounts: number[],
  solveWith: (cells: number) => FieldSolve,
  exact: (position: number) => number,
  fitPoints = 3,
): ConvergenceStudy {
  const maxErrors = cellCounts.map((n) => {
    const s = solveWith(n);
    return maxNodalError(s.positions, s.temperatures, exact);
  });
  return { cells: [...cellCounts], maxErrors, measuredOrder: observedOrder(cellCounts, maxErrors, fitPoints), fitPoints };
}

export function profileComparison(
  solve: FieldSolve,
  exact: (position: number) => number,
  span: { from: number; to: number },
  positionLabel: string,
  cells: number,
): ProfileComparison {
  const samples = 121;
  const curvePositions = Array.from({ length: samples }, (_, i) => span.from + ((span.to - span.from) * i) / (samples - 1));
  return {
    positionLabel,
    positions: [...solve.positions],
    solver: [...solve.temperatures],
    closedFormAtNodes: solve.positions.map(exact),
    curve: { positions: curvePositions, temperatures: curvePositions.map(exact) },
    cells,
  };
}

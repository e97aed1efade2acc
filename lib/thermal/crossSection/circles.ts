/**
 * How a cable's circle sits on the grid (issue 20): the cells whose centre lies inside the circle
 * form the cable — they are not soil unknowns but one node, the circle's temperature T_s (the
 * isothermal outer surface that the exact buried-cylinder resistance ρ/(2π)·arccosh(2L/De) and
 * IEC 60287's T4 assume). A face between such a cell and a soil cell is a cut face; its heat path
 * runs from the soil node along the grid line to the point where that line meets the circle, not
 * to the staircase face — the symmetric treatment of a boundary on a Cartesian grid by Gibou,
 * Fedkiw, Cheng & Kang (J. Comput. Phys. 176, 2002), whose solution converges in second order.
 * The circle's heat is spread over the cut faces in proportion to their conductances, which is
 * what an isothermal surface does.
 */
import { firstCentreAtOrAbove } from './grid';
import type { NormalizedCable } from './validate';

/** −1 for a soil cell, else the cable whose circle holds the cell's centre (row-major, row = depth). */
export function cellOwners(cables: NormalizedCable[], xc: Float64Array, yc: Float64Array): Int32Array {
  const nx = xc.length;
  const owner = new Int32Array(nx * yc.length).fill(-1);
  cables.forEach((cable, c) => {
    const r2 = cable.radius * cable.radius;
    const i0 = firstCentreAtOrAbove(xc, cable.x - cable.radius);
    const j0 = firstCentreAtOrAbove(yc, cable.depth - cable.radius);
    for (let j = j0; j < yc.length && yc[j] <= cable.depth + cable.radius; j++) {
      const dy = yc[j] - cable.depth;
      for (let i = i0; i < nx && xc[i] <= cable.x + cable.radius; i++) {
        const dx = xc[i] - cable.x;
        if (dx * dx + dy * dy < r2) owner[j * nx + i] = c;
      }
    }
  });
  return owner;
}

/**
 * Where the grid line at transverse coordinate `across` (the other axis) meets the circle, as
 * the lower and upper roots along the line's own axis; `centreAlong`/`centreAcross` are the
 * circle's centre on those axes.
 */
export function chord(centreAlong: number, centreAcross: number, radius: number, across: number): { lower: number; upper: number } {
  const d = across - centreAcross;
  const half = Math.sqrt(Math.max(0, radius * radius - d * d));
  return { lower: centreAlong - half, upper: centreAlong + half };
}

export function circleAxes(cable: NormalizedCable, axis: 'x' | 'y'): { along: number; across: number } {
  return axis === 'x' ? { along: cable.x, across: cable.depth } : { along: cable.depth, across: cable.x };
}

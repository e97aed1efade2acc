/**
 * How a cable's circle sits on the grid (issue 20).
 *
 * Model. The 2-D field keeps the soil (or backfill) inside each circle — the circle is the
 * cable's outer surface, or its duct's — exactly as IEC 60287's superposition does, which treats
 * every cable as a line source in homogeneous ground (Kennelly's hypothesis). The cable's own
 * materials act through its 1-D radial model only (cableModel.ts). The cable's heat W leaves its
 * circle evenly, and the cable's surface temperature is the mean over the circle. In uniform
 * soil this is the superposition itself: outside, an even ring source has the field of a line
 * source at its centre, and the mean of a harmonic field over a circle is its value at the
 * centre (mean-value theorem), so for one cable below an isothermal surface the surface rise is
 * W·ρ/(2π)·ln(2u), u = 2L/De — against the isothermal cylinder's exact arccosh(u) a difference
 * of 1/(4u²·ln 2u) relative (0.02 % at u = 20).
 *
 * On the grid. The cells whose centre lies inside the circle are the cable's cells; a face
 * between one of them and a cell outside (or the domain boundary) is a cut face. Where a cut
 * face's grid line (the segment between the two cell centres) meets the circle, the solver puts
 * a node X on the circle: the segment becomes a chain centre → X → centre, each piece the soil
 * path's series resistance (the distances to the circle, not to the staircase face, as in the
 * symmetric Cartesian-grid boundary treatment of Gibou, Fedkiw, Cheng & Kang, J. Comput. Phys.
 * 176, 2002). The nodes are the circle's crossings with the grid's centre lines; sorted by angle
 * they get trapezoid weights s_k (half the angle to each neighbour, / 2π; Σ s_k = 1), second
 * order for the smooth field on the circle. The cable puts s_k·W on node k and reads its surface
 * temperature as T_s = Σ s_k·T_k — the same weights both ways, which keeps the system
 * symmetric — and the soil receives exactly W: the energy balance is exact.
 *
 * Why not cells that stop being soil. Measured on the first version of this solver, treating
 * each circle as an isothermal body forces touching cables together (two isothermal cylinders
 * in contact exchange unbounded heat: the gap closes as y²/R and ∫dy/gap diverges; the three
 * cables of a touching trefoil came out within 0.05 K of each other and 1.3–4 % below the IEC
 * superposition), and removing the cells with an even outward flux leaves the pocket between
 * three touching cables with heat coming in and no way out (no steady state).
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
 * Where the grid line at transverse coordinate `across` meets the circle, as the lower and upper
 * roots along the line's own axis; `centreAlong`/`centreAcross` are the circle's centre.
 */
export function chord(centreAlong: number, centreAcross: number, radius: number, across: number): { lower: number; upper: number } {
  const d = across - centreAcross;
  const half = Math.sqrt(Math.max(0, radius * radius - d * d));
  return { lower: centreAlong - half, upper: centreAlong + half };
}

export function circleAxes(cable: NormalizedCable, axis: 'x' | 'y'): { along: number; across: number } {
  return axis === 'x' ? { along: cable.x, across: cable.depth } : { along: cable.depth, across: cable.x };
}

/**
 * Trapezoid weights of points on a circle given by their angles (radians, any order): half the
 * angle to each neighbour, over 2π. They add up to one.
 */
export function trapezoidShares(angles: number[]): Float64Array {
  const n = angles.length;
  const order = angles.map((_, k) => k).sort((p, q) => angles[p] - angles[q]);
  const shares = new Float64Array(n);
  for (let r = 0; r < n; r++) {
    const here = angles[order[r]];
    const before = r > 0 ? angles[order[r - 1]] : angles[order[n - 1]] - 2 * Math.PI;
    const after = r < n - 1 ? angles[order[r + 1]] : angles[order[0]] + 2 * Math.PI;
    shares[order[r]] = (after - before) / 2 / (2 * Math.PI);
  }
  return shares;
}

/**
 * The temperature field of a solved cross-section as a picture a person can read: a window around
 * the cables sampled on a regular grid (for the sheet's heat map, the stored snapshot and the
 * PDF), isotherms traced on it, and the colour ramp. Pure TypeScript (browser and server), so the
 * screen and the print show the same picture.
 */
import type { CrossSectionField } from '../thermal/crossSection';

/**
 * viridis (van der Walt and Smith, matplotlib, 2015; CC0), sampled at nine stops from the
 * published colour map: a perceptually uniform ramp that also reads in grey. Plotly knows the same
 * map as 'Viridis'; the PDF colours its rectangles from these stops.
 */
export const VIRIDIS_STOPS = ['#440154', '#472d7b', '#3b528b', '#2c728e', '#21918c', '#28ae80', '#5ec962', '#addc30', '#fde725'] as const;

/** The ramp colour of t in [0, 1], interpolated linearly between the stops in sRGB. */
export function viridisColour(t: number): string {
  const clamped = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  const x = clamped * (VIRIDIS_STOPS.length - 1);
  const i = Math.min(VIRIDIS_STOPS.length - 2, Math.floor(x));
  const f = x - i;
  const a = hexToRgb(VIRIDIS_STOPS[i]);
  const b = hexToRgb(VIRIDIS_STOPS[i + 1]);
  const mix = (p: number, q: number) => Math.round(p + (q - p) * f);
  return `#${[mix(a[0], b[0]), mix(a[1], b[1]), mix(a[2], b[2])].map((v) => v.toString(16).padStart(2, '0')).join('')}`;
}

function hexToRgb(hex: string): [number, number, number] {
  return [parseInt(hex.slice(1, 3), 16), parseInt(hex.slice(3, 5), 16), parseInt(hex.slice(5, 7), 16)];
}

export interface PictureWindow {
  /** Across, in the arrangement's coordinates (as the drawing of the rated cross-section), m. */
  xMinM: number;
  xMaxM: number;
  /** Below the surface, m. */
  depthTopM: number;
  depthBottomM: number;
}

export interface FieldPicture extends PictureWindow {
  columns: number;
  rows: number;
  /** °C at the centre of each pixel, row by row from the top (index = row·columns + column), to 0.01 K. */
  temperaturesC: number[];
  minC: number;
  maxC: number;
}

/**
 * The window a reader wants: the cables (and the backfill) with room around them — at least
 * 0.3 m, and three quarters of the deepest cable's depth — from the surface down.
 */
export function pictureWindowOf(cables: ReadonlyArray<{ xM: number; yM: number; envelopeDiameterM: number }>, bank?: { centreXM: number; centreDepthM: number; widthM: number; heightM: number }): PictureWindow {
  const xs: number[] = [];
  let deepest = 0;
  let deepestCentre = 0;
  for (const c of cables) {
    xs.push(c.xM - c.envelopeDiameterM / 2, c.xM + c.envelopeDiameterM / 2);
    deepest = Math.max(deepest, -c.yM + c.envelopeDiameterM / 2);
    deepestCentre = Math.max(deepestCentre, -c.yM);
  }
  if (bank) {
    xs.push(bank.centreXM - bank.widthM / 2, bank.centreXM + bank.widthM / 2);
    deepest = Math.max(deepest, bank.centreDepthM + bank.heightM / 2);
  }
  const pad = Math.max(0.3, 0.75 * deepestCentre);
  return { xMinM: Math.min(...xs) - pad, xMaxM: Math.max(...xs) + pad, depthTopM: 0, depthBottomM: deepest + pad };
}

/** Index i with centres[i] ≤ v < centres[i + 1], clamped to the first and last interval. */
function bracket(centres: Float64Array, v: number): number {
  let lo = 0;
  let hi = centres.length - 1;
  if (v <= centres[0]) return 0;
  if (v >= centres[hi]) return Math.max(0, hi - 1);
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (centres[mid] <= v) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** The field's temperature at a point (solver coordinates), bilinear between the four nearest cell centres. */
export function fieldTemperatureAt(field: CrossSectionField, xM: number, depthM: number): number {
  const { nx, xCentresM, depthCentresM, temperaturesC } = field;
  const i = bracket(xCentresM, xM);
  const j = bracket(depthCentresM, depthM);
  const i1 = Math.min(i + 1, nx - 1);
  const j1 = Math.min(j + 1, field.ny - 1);
  const tx = i1 === i ? 0 : Math.min(1, Math.max(0, (xM - xCentresM[i]) / (xCentresM[i1] - xCentresM[i])));
  const ty = j1 === j ? 0 : Math.min(1, Math.max(0, (depthM - depthCentresM[j]) / (depthCentresM[j1] - depthCentresM[j])));
  const at = (a: number, b: number) => temperaturesC[b * nx + a];
  return (1 - ty) * ((1 - tx) * at(i, j) + tx * at(i1, j)) + ty * ((1 - tx) * at(i, j1) + tx * at(i1, j1));
}

/**
 * The field sampled at the centres of a columns × rows grid over the window (arrangement
 * coordinates; the solver's x is the arrangement's less `centreXM`).
 */
export function samplePicture(field: CrossSectionField, window: PictureWindow, columns: number, centreXM: number): FieldPicture {
  const width = window.xMaxM - window.xMinM;
  const height = window.depthBottomM - window.depthTopM;
  const rows = Math.max(12, Math.min(columns, Math.round((columns * height) / width)));
  const temperaturesC: number[] = [];
  let minC = Infinity;
  let maxC = -Infinity;
  for (let r = 0; r < rows; r++) {
    const depth = window.depthTopM + ((r + 0.5) / rows) * height;
    for (let c = 0; c < columns; c++) {
      const x = window.xMinM + ((c + 0.5) / columns) * width;
      const t = Math.round(fieldTemperatureAt(field, x - centreXM, depth) * 100) / 100;
      temperaturesC.push(t);
      if (t < minC) minC = t;
      if (t > maxC) maxC = t;
    }
  }
  return { ...window, columns, rows, temperaturesC, minC, maxC };
}

/** Isotherm temperatures at a plain step (1, 2, 2.5 or 5 × 10ⁿ K), about `count` of them strictly inside (min, max). */
export function isothermLevels(minC: number, maxC: number, count = 6): number[] {
  const span = maxC - minC;
  if (!(span > 0) || !Number.isFinite(span)) return [];
  const raw = span / (count + 1);
  const decade = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((s) => s * decade).find((s) => s >= raw) ?? 10 * decade;
  const levels: number[] = [];
  for (let v = Math.ceil(minC / step) * step; v < maxC; v += step) if (v > minC) levels.push(Number(v.toPrecision(12)));
  return levels;
}

export interface Isotherm {
  levelC: number;
  /** Segments [x1, depth1, x2, depth2] in the picture's coordinates, m. */
  segments: Array<[number, number, number, number]>;
}

/**
 * Isotherms by marching squares over the pixel centres (each square's edges cut where the level
 * lies between its corners, linearly; a saddle is split by the square's mean).
 */
export function isotherms(picture: FieldPicture, levels: readonly number[]): Isotherm[] {
  const { columns, rows, temperaturesC: v } = picture;
  const dx = (picture.xMaxM - picture.xMinM) / columns;
  const dy = (picture.depthBottomM - picture.depthTopM) / rows;
  const X = (c: number) => picture.xMinM + (c + 0.5) * dx;
  const Y = (r: number) => picture.depthTopM + (r + 0.5) * dy;
  return levels.map((level) => {
    const segments: Isotherm['segments'] = [];
    for (let r = 0; r + 1 < rows; r++) {
      for (let c = 0; c + 1 < columns; c++) {
        const a = v[r * columns + c]; // top left
        const b = v[r * columns + c + 1]; // top right
        const d = v[(r + 1) * columns + c]; // bottom left
        const e = v[(r + 1) * columns + c + 1]; // bottom right
        const cut = (p: number, q: number) => (level - p) / (q - p);
        const points: Array<[number, number]> = [];
        if ((a < level) !== (b < level)) points.push([X(c) + cut(a, b) * dx, Y(r)]);
        if ((b < level) !== (e < level)) points.push([X(c + 1), Y(r) + cut(b, e) * dy]);
        if ((d < level) !== (e < level)) points.push([X(c) + cut(d, e) * dx, Y(r + 1)]);
        if ((a < level) !== (d < level)) points.push([X(c), Y(r) + cut(a, d) * dy]);
        if (points.length === 2) segments.push([points[0][0], points[0][1], points[1][0], points[1][1]]);
        else if (points.length === 4) {
          // Saddle: the mean decides which corners the level separates.
          const centreAbove = (a + b + d + e) / 4 >= level;
          const aAbove = a >= level;
          const [top, right, bottom, left] = points;
          if (centreAbove === aAbove) {
            segments.push([top[0], top[1], right[0], right[1]], [bottom[0], bottom[1], left[0], left[1]]);
          } else {
            segments.push([top[0], top[1], left[0], left[1]], [bottom[0], bottom[1], right[0], right[1]]);
          }
        }
      }
    }
    return { levelC: level, segments };
  });
}

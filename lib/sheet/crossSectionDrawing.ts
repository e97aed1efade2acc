/**
 * The cross-section a reviewer sees: what was rated, drawn to scale with its dimensions. This
 * module turns a laid-out arrangement into drawing primitives (circles, rectangles, lines, text)
 * in a box of the caller's size; the sheet (SVG) and the PDF (react-pdf) only render them, so both
 * show the same drawing.
 */

/** What the drawing needs of a laid-out arrangement (structurally the IEC 60287 layout). */
export interface DrawingInput {
  cables: Array<{ circuit: number; xM: number; yM: number; externalDiameterM: number; envelopeDiameterM: number }>;
  /** 'air' draws no ground; otherwise the ground surface is y = 0 and cables lie below it. */
  placement: { kind: 'air' | 'buried' | 'ducts' | 'backfill'; depthM?: number };
  /** A backfill or duct bank rectangle (centre x, centre depth, size), m. */
  bank?: { centreXM: number; centreDepthM: number; widthM: number; heightM: number };
  /** The circuits of the circuit being rated (drawn darker), by index. */
  ratedCircuits: number[];
  /** Which cable governs (the hottest), by index into `cables`. */
  governingCable?: number;
  /** Axis spacing inside the first circuit and between circuits, for the dimension lines, m. */
  circuitAxisSpacingM?: number | null;
  circuitSpacingM?: number | null;
}

export type Primitive =
  /** `cable`: index into the input's cables, so that a renderer can give each cable its title (temperatures). */
  | { kind: 'circle'; cx: number; cy: number; r: number; role: 'rated' | 'other' | 'duct' | 'governing' | 'governing-ring'; cable?: number }
  | { kind: 'rect'; x: number; y: number; width: number; height: number; role: 'bank' | 'soil' }
  | { kind: 'line'; x1: number; y1: number; x2: number; y2: number; role: 'ground' | 'dimension' | 'extension' }
  | { kind: 'text'; x: number; y: number; text: string; anchor: 'start' | 'middle' | 'end'; role: 'dimension' | 'label' };

export interface Drawing {
  width: number;
  height: number;
  /** Drawing units per metre (the scale). */
  scale: number;
  primitives: Primitive[];
  /** The scale in words, e.g. "1 : 10". */
  scaleText: string;
}

function mm(valueM: number): string {
  const v = valueM * 1000;
  return `${v >= 100 ? v.toFixed(0) : v.toPrecision(3)} mm`;
}

/** A plain drawing scale 1 : n with n from the usual series, so a printed drawing can be measured. */
function niceScaleDenominator(raw: number): number {
  const series = [1, 2, 2.5, 5, 10];
  const decade = 10 ** Math.floor(Math.log10(raw));
  for (const s of series) if (s * decade >= raw) return s * decade;
  return 10 * decade;
}

/**
 * Lays out the drawing in a `width` × `height` box (units of the renderer: px or pt). The scale
 * fits the cables, the ground above the buried ones and any bank, with margins for dimensions.
 */
export function crossSectionDrawing(input: DrawingInput, width: number, height: number, unitsPerMetreAtPrint = 1000 / 0.3528): Drawing {
  const margin = 0.12; // share of the box kept for dimension lines and labels
  const xs: number[] = [];
  const ys: number[] = [];
  for (const c of input.cables) {
    const r = c.envelopeDiameterM / 2;
    xs.push(c.xM - r, c.xM + r);
    ys.push(c.yM - r, c.yM + r);
  }
  const buried = input.placement.kind !== 'air';
  if (buried) ys.push(0);
  if (input.bank) {
    const b = input.bank;
    xs.push(b.centreXM - b.widthM / 2, b.centreXM + b.widthM / 2);
    ys.push(-b.centreDepthM - b.heightM / 2, -b.centreDepthM + b.heightM / 2);
  }
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  const spanX = Math.max(maxX - minX, 1e-3);
  const spanY = Math.max(maxY - minY, 1e-3);
  const fit = Math.min((width * (1 - 2 * margin)) / spanX, (height * (1 - 2 * margin)) / spanY);
  // Round to a plain 1 : n scale at print size (pt per metre), then back to the box's units.
  const denominator = niceScaleDenominator(unitsPerMetreAtPrint / fit);
  const scale = unitsPerMetreAtPrint / denominator;
  const ox = width / 2 - ((minX + maxX) / 2) * scale;
  const oy = height / 2 + ((minY + maxY) / 2) * scale; // y up in metres, down in the drawing
  const X = (xM: number) => ox + xM * scale;
  const Y = (yM: number) => oy - yM * scale;
  const p: Primitive[] = [];

  if (buried) {
    p.push({ kind: 'rect', x: 0, y: Y(0), width, height: height - Y(0), role: 'soil' });
    p.push({ kind: 'line', x1: 0, y1: Y(0), x2: width, y2: Y(0), role: 'ground' });
    p.push({ kind: 'text', x: 4, y: Y(0) - 4, text: 'ground surface', anchor: 'start', role: 'label' });
  }
  if (input.bank) {
    const b = input.bank;
    p.push({ kind: 'rect', x: X(b.centreXM - b.widthM / 2), y: Y(-b.centreDepthM + b.heightM / 2), width: b.widthM * scale, height: b.heightM * scale, role: 'bank' });
  }
  input.cables.forEach((c, i) => {
    if (c.envelopeDiameterM > c.externalDiameterM) p.push({ kind: 'circle', cx: X(c.xM), cy: Y(c.yM), r: (c.envelopeDiameterM / 2) * scale, role: 'duct' });
    const role = i === input.governingCable ? 'governing' : input.ratedCircuits.includes(c.circuit) ? 'rated' : 'other';
    p.push({ kind: 'circle', cx: X(c.xM), cy: Y(c.yM), r: (c.externalDiameterM / 2) * scale, role, cable: i });
  });
  // The governing cable is ringed as well as coloured, so that it shows without colour (product.md).
  const governing = input.governingCable !== undefined ? input.cables[input.governingCable] : undefined;
  if (governing) {
    p.push({ kind: 'circle', cx: X(governing.xM), cy: Y(governing.yM), r: (governing.envelopeDiameterM / 2) * scale + 3, role: 'governing-ring', cable: input.governingCable });
  }

  // Dimensions: depth of the first circuit's centre, its axis spacing, the spacing between circuits.
  const first = input.cables.filter((c) => c.circuit === 0);
  const cx0 = first.reduce((s, c) => s + c.xM, 0) / Math.max(1, first.length);
  const cy0 = first.reduce((s, c) => s + c.yM, 0) / Math.max(1, first.length);
  if (buried && input.placement.depthM !== undefined) {
    const x = X(Math.min(...input.cables.map((c) => c.xM - c.envelopeDiameterM / 2))) - 14;
    p.push({ kind: 'line', x1: x, y1: Y(0), x2: x, y2: Y(cy0), role: 'dimension' });
    p.push({ kind: 'line', x1: x - 4, y1: Y(cy0), x2: X(cx0), y2: Y(cy0), role: 'extension' });
    p.push({ kind: 'text', x: x - 3, y: (Y(0) + Y(cy0)) / 2, text: mm(input.placement.depthM), anchor: 'end', role: 'dimension' });
  }
  if (input.circuitAxisSpacingM && first.length > 1) {
    const a = first[0];
    const b = first[1];
    // Above the whole circuit (a trefoil's apex would otherwise sit on the line).
    const yTop = Y(Math.max(...first.map((c) => c.yM + c.envelopeDiameterM / 2))) - 10;
    p.push({ kind: 'line', x1: X(a.xM), y1: yTop, x2: X(b.xM), y2: yTop, role: 'dimension' });
    p.push({ kind: 'text', x: (X(a.xM) + X(b.xM)) / 2, y: yTop - 3, text: `s = ${mm(input.circuitAxisSpacingM)}`, anchor: 'middle', role: 'dimension' });
  }
  const second = input.cables.filter((c) => c.circuit === 1);
  if (input.circuitSpacingM && second.length > 0) {
    const cx1 = second.reduce((s, c) => s + c.xM, 0) / second.length;
    const cy1 = second.reduce((s, c) => s + c.yM, 0) / second.length;
    const yBottom = Y(Math.min(...input.cables.map((c) => c.yM - c.envelopeDiameterM / 2))) + 14;
    const horizontal = Math.abs(cx1 - cx0) >= Math.abs(cy1 - cy0);
    if (horizontal) {
      p.push({ kind: 'line', x1: X(cx0), y1: yBottom, x2: X(cx1), y2: yBottom, role: 'dimension' });
      p.push({ kind: 'text', x: (X(cx0) + X(cx1)) / 2, y: yBottom + 10, text: `circuits ${mm(input.circuitSpacingM)} apart`, anchor: 'middle', role: 'dimension' });
    } else {
      const xRight = X(Math.max(...input.cables.map((c) => c.xM + c.envelopeDiameterM / 2))) + 14;
      p.push({ kind: 'line', x1: xRight, y1: Y(cy0), x2: xRight, y2: Y(cy1), role: 'dimension' });
      p.push({ kind: 'text', x: xRight + 3, y: (Y(cy0) + Y(cy1)) / 2, text: mm(input.circuitSpacingM), anchor: 'start', role: 'dimension' });
    }
  }
  return { width, height, scale, primitives: p, scaleText: `1 : ${denominator}` };
}

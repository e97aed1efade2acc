/**
 * The bus-bar system a reviewer sees, drawn to scale: the cross-section (the three phase packs,
 * every bar, the gaps, the phase spacing) and, when the supports are described, an elevation of
 * the run (supports at their spacing, the spacers of a pack). The bars are laid out by the same
 * function the computation uses (lib/electrical/busbar prepareBusbarSystem), so the drawing is the
 * system that was rated — with the library's assumed phase spacing when none is entered, said so.
 * This module only makes primitives (rectangles, lines, text) in a box of the caller's size; the
 * sheet (SVG) and the PDF (react-pdf) render them.
 */
import { prepareBusbarSystem, type PreparedBusbarSystem } from '../electrical/busbar';
import { DEFAULT_PHASE_CLEARANCE_BAR_WIDTHS } from '../electrical/sizing/busbarSystem';
import type { PackResult } from '../electrical/sizing/types';
import { formatNumber } from '../units';
import type { SheetCandidate } from './candidates';
import type { SheetInputs } from './schema';
import { barPlacement } from './systemToSizing';

export interface BusbarDrawingInput {
  arrangement: 'edge' | 'flat';
  barsPerPhase: number;
  barWidthM: number;
  barThicknessM: number;
  /** Clear gap between the wide faces of a pack's bars, m (0 with one bar). */
  gapM: number;
  phaseSpacingM: number;
  /** True when the sheet gives no phase spacing and the library's default is drawn. */
  phaseSpacingAssumed: boolean;
  /** Span between supports, m; null: no elevation is drawn. */
  supportSpacingM: number | null;
  /** Between a pack's spacers, m; null: at the supports. */
  spacerSpacingM: number | null;
  /** The bar that governs (the hottest), when the result is known. */
  governing?: { phase: string; positionInPack: number };
}

export type BusbarPrimitive =
  /** `bar`: index into the laid-out bars (L1's first, then L2's, then L3's), for a renderer's title. */
  | { kind: 'rect'; x: number; y: number; width: number; height: number; role: 'bar' | 'governing' | 'governing-ring' | 'run' | 'support'; bar?: number }
  | { kind: 'line'; x1: number; y1: number; x2: number; y2: number; role: 'dimension' | 'extension' | 'spacer' | 'centre' }
  | { kind: 'text'; x: number; y: number; text: string; anchor: 'start' | 'middle' | 'end'; role: 'dimension' | 'label' };

export interface BusbarView {
  width: number;
  height: number;
  /** Drawing units per metre. */
  scale: number;
  /** "1 : 5". */
  scaleText: string;
  primitives: BusbarPrimitive[];
}

export interface BusbarDrawing {
  crossSection: BusbarView;
  /** Null when the support spacing is not known. */
  elevation: BusbarView | null;
  /** Every bar in the cross-section's order: its phase and place in the pack. */
  bars: Array<{ phase: string; positionInPack: number }>;
}

/** Points per metre on the printed page (1 pt = 0.3528 mm). */
const PT_PER_M = 1000 / 0.3528;

/** A plain drawing scale 1 : n with n from the usual series, so a printed drawing can be measured. */
function niceScaleDenominator(raw: number): number {
  const series = [1, 2, 2.5, 5, 10];
  const decade = 10 ** Math.floor(Math.log10(raw));
  for (const s of series) if (s * decade >= raw) return s * decade;
  return 10 * decade;
}

function mm(valueM: number): string {
  return `${formatNumber(valueM * 1000, 4)} mm`;
}

/**
 * What to draw for one bar candidate on a sheet, or null when it is not a bar on a bar placement.
 * The phase spacing, when not entered, is the library's default (the pack across plus one bar
 * width clear, lib/electrical/sizing/busbarSystem.ts).
 */
export function busbarDrawingInputOf(inputs: SheetInputs, candidate: SheetCandidate, pack?: PackResult): BusbarDrawingInput | null {
  const placement = barPlacement(inputs);
  if (candidate.kind !== 'bar' || placement === null) return null;
  const arrangement = placement === 'bar-flat' ? 'flat' : 'edge';
  const barsPerPhase = candidate.barsPerPhase ?? 1;
  const gapM = barsPerPhase > 1 ? (inputs.busbarSystem.barGapM ?? candidate.barGapM ?? candidate.thicknessM) : 0;
  const stack = barsPerPhase * candidate.thicknessM + (barsPerPhase - 1) * gapM;
  const across = arrangement === 'edge' ? stack : candidate.widthM;
  const entered = inputs.busbarSystem.phaseSpacingM;
  return {
    arrangement,
    barsPerPhase,
    barWidthM: candidate.widthM,
    barThicknessM: candidate.thicknessM,
    gapM,
    phaseSpacingM: entered ?? across + DEFAULT_PHASE_CLEARANCE_BAR_WIDTHS * candidate.widthM,
    phaseSpacingAssumed: entered === null,
    supportSpacingM: inputs.busbarSystem.supportSpacingM,
    spacerSpacingM: inputs.busbarSystem.spacerSpacingM,
    ...(pack ? { governing: { phase: pack.hottest.phase, positionInPack: pack.hottest.positionInPack } } : {}),
  };
}

/** The bars laid out as the computation lays them; null when the geometry is refused (the refusal shows on its field). */
function layOut(input: BusbarDrawingInput): PreparedBusbarSystem | null {
  try {
    return prepareBusbarSystem({
      barsPerPhase: input.barsPerPhase,
      barWidthM: input.barWidthM,
      barThicknessM: input.barThicknessM,
      ...(input.barsPerPhase > 1 ? { gapM: input.gapM } : {}),
      phaseSpacingM: input.phaseSpacingM,
      arrangement: input.arrangement,
      // Only the cross-section is laid out here; the span does not move the bars.
      supportSpacingM: input.supportSpacingM ?? 1,
    });
  } catch {
    return null;
  }
}

function crossSectionView(system: PreparedBusbarSystem, input: BusbarDrawingInput, width: number, height: number): BusbarView {
  const margin = { x: 0.08 * width, top: 0.2 * height, bottom: 0.2 * height };
  const minX = -system.phaseSpacingM - system.packSizeXM / 2;
  const maxX = system.phaseSpacingM + system.packSizeXM / 2;
  const spanX = maxX - minX;
  const spanY = system.packSizeYM;
  const fit = Math.min((width - 2 * margin.x) / spanX, (height - margin.top - margin.bottom) / spanY);
  const denominator = niceScaleDenominator(PT_PER_M / fit);
  const scale = PT_PER_M / denominator;
  const ox = width / 2;
  const oy = margin.top + (height - margin.top - margin.bottom) / 2;
  const X = (xM: number) => ox + xM * scale;
  const Y = (yM: number) => oy - yM * scale;
  const p: BusbarPrimitive[] = [];

  system.bars.forEach((b, i) => {
    const governs = input.governing !== undefined && b.group === input.governing.phase && b.positionInPack === input.governing.positionInPack;
    p.push({ kind: 'rect', x: X(b.cxM - b.sizeXM / 2), y: Y(b.cyM + b.sizeYM / 2), width: b.sizeXM * scale, height: b.sizeYM * scale, role: governs ? 'governing' : 'bar', bar: i });
  });
  // The governing bar is outlined as well as coloured, so it shows without colour (product.md).
  const g = input.governing ? system.bars.findIndex((b) => b.group === input.governing!.phase && b.positionInPack === input.governing!.positionInPack) : -1;
  if (g >= 0) {
    const b = system.bars[g];
    p.push({ kind: 'rect', x: X(b.cxM - b.sizeXM / 2) - 2.5, y: Y(b.cyM + b.sizeYM / 2) - 2.5, width: b.sizeXM * scale + 5, height: b.sizeYM * scale + 5, role: 'governing-ring', bar: g });
  }

  // Phase names under the packs; the phase spacing above them, between L1 and L2.
  const top = Y(system.packSizeYM / 2);
  const bottom = Y(-system.packSizeYM / 2);
  for (const group of system.groups) p.push({ kind: 'text', x: X(group.centreXM), y: bottom + 12, text: group.name, anchor: 'middle', role: 'label' });
  const l1 = system.groups[0].centreXM;
  const l2 = system.groups[1].centreXM;
  const dimY = top - 12;
  p.push({ kind: 'line', x1: X(l1), y1: top - 3, x2: X(l1), y2: dimY - 3, role: 'extension' });
  p.push({ kind: 'line', x1: X(l2), y1: top - 3, x2: X(l2), y2: dimY - 3, role: 'extension' });
  p.push({ kind: 'line', x1: X(l1), y1: dimY, x2: X(l2), y2: dimY, role: 'dimension' });
  p.push({ kind: 'text', x: (X(l1) + X(l2)) / 2, y: dimY - 3, text: `a = ${mm(system.phaseSpacingM)}${input.phaseSpacingAssumed ? ' (assumed)' : ''}`, anchor: 'middle', role: 'dimension' });

  // The bar's width beside the last pack (its height on edge, its breadth flat).
  const last = system.groups[system.groups.length - 1];
  if (input.arrangement === 'edge') {
    const x = X(last.centreXM + system.packSizeXM / 2) + 8;
    p.push({ kind: 'line', x1: x, y1: top, x2: x, y2: bottom, role: 'dimension' });
    p.push({ kind: 'text', x: x + 3, y: (top + bottom) / 2, text: mm(system.barWidthM), anchor: 'start', role: 'dimension' });
  } else {
    const y = bottom + 22;
    p.push({ kind: 'line', x1: X(last.centreXM - system.barWidthM / 2), y1: y, x2: X(last.centreXM + system.barWidthM / 2), y2: y, role: 'dimension' });
    p.push({ kind: 'text', x: X(last.centreXM), y: y + 10, text: mm(system.barWidthM), anchor: 'middle', role: 'dimension' });
  }
  // The gap of a pack, named beside L1.
  if (system.barsPerPhase > 1) {
    p.push({
      kind: 'text',
      x: X(system.groups[0].centreXM - system.packSizeXM / 2),
      y: bottom + 24,
      text: `${system.barsPerPhase} × ${formatNumber(system.barWidthM * 1000, 4)} × ${formatNumber(system.barThicknessM * 1000, 4)} mm, gap ${mm(system.gapM)}`,
      anchor: 'start',
      role: 'dimension',
    });
  }
  return { width, height, scale, scaleText: `1 : ${denominator}`, primitives: p };
}

/** Three spans of the run (or the one span) with the supports and, when closer, the pack's spacers. */
function elevationView(input: BusbarDrawingInput, width: number, height: number, packDepthM: number): BusbarView | null {
  const span = input.supportSpacingM;
  if (span === null) return null;
  const spans = 3;
  const length = spans * span;
  const marginX = 0.08 * width;
  const fit = (width - 2 * marginX) / length;
  const denominator = niceScaleDenominator(PT_PER_M / fit);
  const scale = PT_PER_M / denominator;
  const x0 = (width - length * scale) / 2;
  const runY = height * 0.35;
  // The run's depth on paper: to scale, but never thinner than a line a reader can see.
  const runH = Math.max(packDepthM * scale, 2);
  const p: BusbarPrimitive[] = [{ kind: 'rect', x: x0, y: runY, width: length * scale, height: runH, role: 'run' }];
  for (let k = 0; k <= spans; k++) {
    const x = x0 + k * span * scale;
    p.push({ kind: 'rect', x: x - 3, y: runY + runH, width: 6, height: 10, role: 'support' });
  }
  const spacer = input.spacerSpacingM;
  if (input.barsPerPhase > 1 && spacer !== null && spacer < span) {
    for (let s = spacer; s < length - 1e-9; s += spacer) {
      if (Math.abs(s / span - Math.round(s / span)) < 1e-6) continue;
      const x = x0 + s * scale;
      p.push({ kind: 'line', x1: x, y1: runY - 3, x2: x, y2: runY + runH + 3, role: 'spacer' });
    }
  }
  const dimY = runY + runH + 22;
  p.push({ kind: 'line', x1: x0, y1: dimY, x2: x0 + span * scale, y2: dimY, role: 'dimension' });
  p.push({ kind: 'text', x: x0 + (span * scale) / 2, y: dimY + 10, text: `l = ${mm(span)}`, anchor: 'middle', role: 'dimension' });
  p.push({ kind: 'text', x: x0, y: runY - 8, text: `supports every ${mm(span)}${input.barsPerPhase > 1 && spacer !== null && spacer < span ? `, spacers every ${mm(spacer)}` : ''} (three spans shown)`, anchor: 'start', role: 'label' });
  return { width, height, scale, scaleText: `1 : ${denominator}`, primitives: p };
}

/**
 * The drawing in boxes of the caller's size (units of the renderer, px or pt), or null when the
 * geometry is refused (packs overlapping; the refusal is shown on its field).
 */
export function busbarDrawing(input: BusbarDrawingInput, width: number, crossSectionHeight: number, elevationHeight = crossSectionHeight / 2): BusbarDrawing | null {
  const system = layOut(input);
  if (!system) return null;
  return {
    crossSection: crossSectionView(system, input, width, crossSectionHeight),
    elevation: elevationView(input, width, elevationHeight, system.packSizeYM),
    bars: system.bars.map((b) => ({ phase: b.group, positionInPack: b.positionInPack })),
  };
}

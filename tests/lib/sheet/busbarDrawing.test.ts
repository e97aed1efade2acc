// The bus-bar system drawn to scale (lib/sheet/busbarDrawing.ts). Checks are hand geometry: bars
// on edge stand w tall and t wide, side by side at a pitch of t + g, packs a apart centre to
// centre (L1 at −a, L2 at 0, L3 at +a, lib/electrical/busbar/geometry.ts); bars flat swap the two;
// the drawing scale is a plain 1 : n (n from 1, 2, 2.5, 5, 10 × a power of ten) at print size,
// 1 pt = 0.3528 mm; without an entered phase spacing the library's default is drawn (the pack
// across plus one bar width clear, lib/electrical/sizing/busbarSystem.ts) and labelled assumed.
import { describe, expect, it } from 'vitest';
import { busbarDrawing, busbarDrawingInputOf, type BusbarDrawingInput, type BusbarPrimitive } from '@/lib/sheet/busbarDrawing';
import { defaultSheetInputs } from '@/lib/sheet/schema';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';

const PT_PER_M = 1000 / 0.3528;
type Rect = Extract<BusbarPrimitive, { kind: 'rect' }>;
const barsOf = (p: BusbarPrimitive[]) => p.filter((x): x is Rect => x.kind === 'rect' && (x.role === 'bar' || x.role === 'governing'));
const textsOf = (p: BusbarPrimitive[]) => p.filter((x) => x.kind === 'text').map((x) => (x as { text: string }).text);

const threeBarsOnEdge: BusbarDrawingInput = {
  arrangement: 'edge',
  barsPerPhase: 3,
  barWidthM: 0.1,
  barThicknessM: 0.01,
  gapM: 0.01,
  phaseSpacingM: 0.2,
  phaseSpacingAssumed: false,
  supportSpacingM: 0.6,
  spacerSpacingM: 0.3,
  governing: { phase: 'L2', positionInPack: 0 },
};

describe('the cross-section to scale', () => {
  it('three 100 × 10 mm bars per phase on edge, 10 mm gaps, phases 200 mm apart: sizes, pitch, spacing and gap at the drawing scale', () => {
    const d = busbarDrawing(threeBarsOnEdge, 440, 200)!;
    const { scale, primitives } = d.crossSection;
    const bars = barsOf(primitives);
    expect(bars).toHaveLength(9);
    for (const b of bars) {
      expect(b.width).toBeCloseTo(0.01 * scale, 9);
      expect(b.height).toBeCloseTo(0.1 * scale, 9);
    }
    const cx = (b: Rect) => b.x + b.width / 2;
    // Pitch inside a pack t + g = 20 mm; the clear gap between neighbouring bars 10 mm.
    expect(cx(bars[1]) - cx(bars[0])).toBeCloseTo(0.02 * scale, 9);
    expect(bars[1].x - (bars[0].x + bars[0].width)).toBeCloseTo(0.01 * scale, 9);
    // Pack centres (the middle bar of each pack) 200 mm apart.
    expect(cx(bars[4]) - cx(bars[1])).toBeCloseTo(0.2 * scale, 9);
    expect(cx(bars[7]) - cx(bars[4])).toBeCloseTo(0.2 * scale, 9);
    // All bars on one centre line (on edge they stand side by side).
    expect(new Set(bars.map((b) => (b.y + b.height / 2).toFixed(6))).size).toBe(1);
    // The scale: 1 : n from the series, and the system (2a + the pack across = 450 mm) fits the box's width.
    const n = Number(d.crossSection.scaleText.split(' : ')[1]);
    expect(scale).toBeCloseTo(PT_PER_M / n, 9);
    expect(n / 10 ** Math.floor(Math.log10(n))).toSatisfy((m: number) => [1, 2, 2.5, 5, 10].some((s) => Math.abs(s - m) < 1e-9));
    expect((2 * 0.2 + 0.05) * scale).toBeLessThanOrEqual(440);
    expect(textsOf(primitives)).toEqual(expect.arrayContaining(['L1', 'L2', 'L3', 'a = 200 mm', '100 mm', '3 × 100 × 10 mm, gap 10 mm']));
  });

  it('the governing bar is filled and outlined: L2’s first bar', () => {
    const { primitives } = busbarDrawing(threeBarsOnEdge, 440, 200)!.crossSection;
    const governing = primitives.filter((p) => p.kind === 'rect' && p.role === 'governing') as Rect[];
    expect(governing).toHaveLength(1);
    expect(governing[0].bar).toBe(3); // L1's three bars, then L2's first
    const ring = primitives.find((p) => p.kind === 'rect' && p.role === 'governing-ring') as Rect;
    expect(ring.x).toBeLessThan(governing[0].x);
    expect(ring.x + ring.width).toBeGreaterThan(governing[0].x + governing[0].width);
  });

  it('bars laid flat stack upward: w wide, t high, the pitch along the vertical', () => {
    const d = busbarDrawing({ ...threeBarsOnEdge, arrangement: 'flat', phaseSpacingM: 0.25 }, 440, 200)!;
    const { scale, primitives } = d.crossSection;
    const bars = barsOf(primitives);
    for (const b of bars) {
      expect(b.width).toBeCloseTo(0.1 * scale, 9);
      expect(b.height).toBeCloseTo(0.01 * scale, 9);
    }
    const cy = (b: Rect) => b.y + b.height / 2;
    expect(cy(bars[0]) - cy(bars[1])).toBeCloseTo(0.02 * scale, 9); // y grows downward on paper
  });

  it('packs that overlap draw nothing (3 × 10 mm + 2 × 10 mm gaps = 50 mm across > 40 mm apart)', () => {
    expect(busbarDrawing({ ...threeBarsOnEdge, phaseSpacingM: 0.04 }, 440, 200)).toBeNull();
    expect(busbarDrawing({ ...threeBarsOnEdge, phaseSpacingM: 0.0501 }, 440, 200)).not.toBeNull();
  });
});

describe('the run with its supports', () => {
  it('three spans of 600 mm: four supports 600 mm apart at the elevation’s scale, a spacer midway in each span', () => {
    const e = busbarDrawing(threeBarsOnEdge, 440, 200, 90)!.elevation!;
    const supports = e.primitives.filter((p) => p.kind === 'rect' && p.role === 'support') as Rect[];
    expect(supports).toHaveLength(4);
    for (let k = 1; k < 4; k++) expect(supports[k].x - supports[k - 1].x).toBeCloseTo(0.6 * e.scale, 9);
    const spacers = e.primitives.filter((p) => p.kind === 'line' && p.role === 'spacer');
    expect(spacers).toHaveLength(3);
    expect(textsOf(e.primitives)).toContain('l = 600 mm');
    expect(e.scale).toBeCloseTo(PT_PER_M / Number(e.scaleText.split(' : ')[1]), 9);
  });

  it('no elevation without the support spacing', () => {
    expect(busbarDrawing({ ...threeBarsOnEdge, supportSpacingM: null }, 440, 200)!.elevation).toBeNull();
  });
});

describe('from the sheet', () => {
  it('the sheet’s gap, else the candidate’s; the library’s assumed phase spacing when none is entered, labelled', () => {
    const inputs = defaultSheetInputs('bar-on-edge');
    const pack = testCopperBar(100, 10, { barsPerPhase: 3 });
    const assumed = busbarDrawingInputOf(inputs, pack)!;
    // The pack across (3·10 + 2·10 = 50 mm) plus one bar width (100 mm) clear: 150 mm.
    expect(assumed.phaseSpacingM).toBeCloseTo(0.15, 12);
    expect(assumed.phaseSpacingAssumed).toBe(true);
    expect(textsOf(busbarDrawing(assumed, 440, 200)!.crossSection.primitives)).toContain('a = 150 mm (assumed)');
    inputs.busbarSystem.barGapM = 0.02;
    inputs.busbarSystem.phaseSpacingM = 0.3;
    expect(busbarDrawingInputOf(inputs, pack)).toMatchObject({ gapM: 0.02, phaseSpacingM: 0.3, phaseSpacingAssumed: false, arrangement: 'edge' });
    expect(busbarDrawingInputOf(inputs, testCable240)).toBeNull();
    inputs.installation.kind = 'cable-in-air';
    expect(busbarDrawingInputOf(inputs, pack)).toBeNull();
  });
});

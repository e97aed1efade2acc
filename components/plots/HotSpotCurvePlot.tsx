'use client';
import type { HotSpotCurve } from '@/lib/sheet/compute';
import type { UnitSystem } from '@/lib/units';
import { convertFromSi, unitLabel } from '@/lib/units';
import { Plot, PLOT_CONFIG, PLOT_LAYOUT_BASE } from './Plot';
import { candidateColour, candidateMarker } from './ramp';

/** Hot spot against current for each candidate, with the design current and each ampacity marked. */
export function HotSpotCurvePlot({
  curves,
  designCurrentA,
  limits,
  units,
}: {
  curves: HotSpotCurve[];
  designCurrentA: number;
  limits: Record<string, number>;
  units: UnitSystem;
}) {
  const toT = (c: number) => convertFromSi(c, 'temperature', units);
  const tUnit = unitLabel('temperature', units);
  const data = curves.flatMap((curve, i) => {
    const colour = candidateColour(i, curves.length);
    const symbol = candidateMarker(i);
    const points = curve.points.filter((p) => p.hotSpotC !== null);
    const limit = limits[curve.candidateId];
    return [
      {
        x: points.map((p) => p.currentA),
        y: points.map((p) => toT(p.hotSpotC as number)),
        type: 'scatter' as const,
        mode: 'lines+markers' as const,
        name: curve.label,
        line: { color: colour, width: 2, shape: 'spline' as const },
        // A shape on every few points as well as the colour, so the lines can be told apart by shape.
        marker: { color: colour, size: 7, symbol, maxdisplayed: 12 },
        hovertemplate: `${curve.label}<br>%{x:.0f} A → %{y:.1f} ${tUnit}<extra></extra>`,
      },
      {
        x: [curve.ampacityA],
        y: [limit !== undefined ? toT(limit) : null],
        type: 'scatter' as const,
        mode: 'markers' as const,
        name: `${curve.label}: ampacity`,
        showlegend: false,
        marker: { color: colour, size: 9, symbol: 'circle-open', line: { width: 2, color: colour } },
        hovertemplate: `ampacity ${curve.ampacityA.toFixed(0)} A<extra></extra>`,
      },
    ];
  });
  // A named figure rather than role="img": an image may not hold controls, and Plotly's mode-bar buttons inside are focusable.
  return (
    <figure data-testid="curve-plot" aria-label="Hot spot versus current for each candidate">
      <Plot
        data={data}
        layout={{
          ...PLOT_LAYOUT_BASE,
          title: { text: 'Hot spot versus current (○ = ampacity)', font: { size: 12 } },
          height: 300,
          legend: { orientation: 'h', y: -0.32, yanchor: 'top', font: { size: 10 } },
          margin: { ...PLOT_LAYOUT_BASE.margin, b: 86 },
          shapes: [
            { type: 'line', xref: 'x', yref: 'paper', x0: designCurrentA, x1: designCurrentA, y0: 0, y1: 1, line: { color: '#b8703d', width: 1.5, dash: 'dot' } },
          ],
          annotations: [
            { x: designCurrentA, y: 1, xref: 'x', yref: 'paper', yanchor: 'bottom', text: `design ${designCurrentA.toFixed(0)} A`, showarrow: false, font: { size: 10, color: '#9a5a2e' } },
          ],
          xaxis: { ...PLOT_LAYOUT_BASE.xaxis, title: { text: 'current per phase (A)' }, rangemode: 'tozero' },
          yaxis: { ...PLOT_LAYOUT_BASE.yaxis, title: { text: `hot spot (${tUnit})` } },
        }}
        config={PLOT_CONFIG}
        useResizeHandler
        style={{ width: '100%', height: 300 }}
      />
    </figure>
  );
}

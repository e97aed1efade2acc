'use client';
import type { HeatProfile } from '@/lib/electrical/sizing/types';
import type { UnitSystem } from '@/lib/units';
import { convertFromSi, unitLabel } from '@/lib/units';
import { Plot, PLOT_CONFIG, PLOT_LAYOUT_BASE } from './Plot';

const LAYER_FILLS = ['rgba(184,112,61,0.16)', 'rgba(47,61,79,0.07)', 'rgba(23,119,111,0.08)', 'rgba(160,107,8,0.08)', 'rgba(107,126,148,0.10)'];

/**
 * The heat-balance profile through the conductor and its coverings: temperature against position
 * (radius for a cable, depth through the thickness for a bar), layers as bands, the governing
 * limit as a line. Points coloured on the viridis ramp.
 */
export function ProfilePlot({ profile, limitC, limitLabel, units, title }: { profile: HeatProfile; limitC: number; limitLabel: string; units: UnitSystem; title: string }) {
  const toT = (c: number) => convertFromSi(c, 'temperature', units);
  const toX = (m: number) => convertFromSi(m * 1000, 'lengthMm', units);
  const tUnit = unitLabel('temperature', units);
  const xUnit = unitLabel('lengthMm', units);
  const xs = profile.positionsM.map(toX);
  const ts = profile.temperaturesC.map(toT);
  const xMax = Math.max(...profile.layers.map((l) => toX(l.endM)), ...xs);
  const shapes = profile.layers.map((layer, i) => ({
    type: 'rect' as const,
    xref: 'x' as const,
    yref: 'paper' as const,
    x0: toX(layer.startM),
    x1: toX(layer.endM),
    y0: 0,
    y1: 1,
    fillcolor: layer.generating ? LAYER_FILLS[0] : LAYER_FILLS[1 + (i % (LAYER_FILLS.length - 1))],
    line: { width: 0 },
    layer: 'below' as const,
  }));
  const annotations = profile.layers.map((layer, i) => ({
    x: (toX(layer.startM) + toX(layer.endM)) / 2,
    y: 1,
    xref: 'x' as const,
    yref: 'paper' as const,
    yanchor: 'bottom' as const,
    // Thin neighbouring layers would print over each other: every other label sits one line higher.
    yshift: i % 2 === 1 ? 11 : 0,
    text: layer.name.length > 18 ? `${layer.name.slice(0, 16)}…` : layer.name,
    showarrow: false,
    font: { size: 10, color: '#3d4e62' },
  }));
  shapes.push({
    type: 'line' as never,
    xref: 'x',
    yref: 'y' as never,
    x0: 0,
    x1: xMax,
    y0: toT(limitC),
    y1: toT(limitC),
    line: { color: '#a8402b', width: 1.5, dash: 'dash' } as never,
  } as never);
  annotations.push({ x: xMax, y: toT(limitC) as never, xref: 'x', yref: 'y' as never, yanchor: 'bottom', text: `limit ${toT(limitC).toFixed(0)} ${tUnit} (${limitLabel})`, showarrow: false, font: { size: 10, color: '#a8402b' }, xanchor: 'right' } as never);
  const yMin = Math.min(...ts);
  const yMax = Math.max(...ts, toT(limitC));
  const pad = Math.max(1, (yMax - yMin) * 0.08);
  // A named figure rather than role="img": an image may not hold controls, and Plotly's mode-bar buttons inside are focusable.
  return (
    <figure data-testid="profile-plot" aria-label={`Heat-balance profile: ${title}`}>
      <Plot
        data={[
          {
            x: xs,
            y: ts,
            type: 'scatter',
            mode: 'lines+markers',
            name: 'temperature',
            line: { color: '#3d4e62', width: 1.5 },
            marker: { size: 5, color: ts, colorscale: 'Viridis', cmin: yMin, cmax: Math.max(yMax, yMin + 1), showscale: false },
            hovertemplate: `%{x:.2f} ${xUnit}<br>%{y:.1f} ${tUnit}<extra></extra>`,
          },
          {
            x: [toX(profile.hotSpot.positionM)],
            y: [toT(profile.hotSpot.temperatureC)],
            type: 'scatter',
            mode: 'text+markers',
            name: 'hot spot',
            text: [`hot spot ${toT(profile.hotSpot.temperatureC).toFixed(1)} ${tUnit}`],
            textposition: 'top right',
            marker: { size: 9, symbol: 'diamond', color: '#b8703d' },
            hoverinfo: 'skip',
          },
        ]}
        layout={{
          ...PLOT_LAYOUT_BASE,
          margin: { ...PLOT_LAYOUT_BASE.margin, t: 44 },
          title: { text: title, font: { size: 12 }, y: 0.98 },
          height: 300,
          showlegend: false,
          shapes,
          annotations,
          xaxis: { ...PLOT_LAYOUT_BASE.xaxis, title: { text: `${profile.geometry === 'cylinder' ? 'radius' : 'depth through the bar'} (${xUnit})` }, range: [0, xMax] },
          yaxis: { ...PLOT_LAYOUT_BASE.yaxis, title: { text: `temperature (${tUnit})` }, range: [yMin - pad, yMax + pad * 2] },
        }}
        config={PLOT_CONFIG}
        useResizeHandler
        style={{ width: '100%', height: 300 }}
      />
    </figure>
  );
}

/**
 * A line chart for the calculation package (react-pdf Svg): the plots of lib/sheet/packagePlots
 * (hot spot against current, over time, along the run, across the pack) with axes, ticks and
 * units, the governing limit as a dashed line and vertical marks (design current, joints).
 */
import { G, Line, Polyline, Svg, Text } from '@react-pdf/renderer';
import type { PackagePlot } from '@/lib/sheet/packagePlots';
import { formatNumber } from '@/lib/units';
import { pdfSafeText } from './fonts';
import { ChartAxes, niceTicks } from './ProfileChart';

const INK = '#233040';
const MUTED = '#4f6278';
const LIMIT = '#a8402b';
const LINES = ['#2f3d4f', '#9a5a2e', '#17776f', '#6b4a06'];

export function LineChart({ plot, widthPt = 523, heightPt = 190 }: { plot: PackagePlot; widthPt?: number; heightPt?: number }) {
  const margin = { left: 42, right: 12, top: 14, bottom: 30 };
  const plotW = widthPt - margin.left - margin.right;
  const plotH = heightPt - margin.top - margin.bottom;
  const xs = plot.lines.flatMap((l) => l.points.map((p) => p[0])).concat((plot.marks ?? []).map((m) => m.x));
  const ys = plot.lines.flatMap((l) => l.points.map((p) => p[1])).concat(plot.limitC === null ? [] : [plot.limitC]);
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs) > xMin ? Math.max(...xs) : xMin + 1;
  const yLow = Math.min(...ys);
  const yHigh = Math.max(...ys);
  const pad = Math.max(2, (yHigh - yLow) * 0.08);
  const yTicks = niceTicks(yLow - pad, yHigh + pad, 5);
  const yMin = Math.min(yTicks[0], yLow - pad);
  const yMax = Math.max(yTicks[yTicks.length - 1], yHigh + pad);
  const xTicks = niceTicks(xMin, xMax, 6);
  const x = (v: number) => margin.left + ((v - xMin) / (xMax - xMin)) * plotW;
  const y = (v: number) => margin.top + plotH - ((v - yMin) / (yMax - yMin)) * plotH;
  return (
    <Svg width={widthPt} height={heightPt} viewBox={`0 0 ${widthPt} ${heightPt}`}>
      <ChartAxes margin={margin} plotW={plotW} plotH={plotH} xTicks={xTicks} yTicks={yTicks} x={x} y={y} />
      {plot.limitC !== null ? (
        <G>
          <Line x1={margin.left} x2={margin.left + plotW} y1={y(plot.limitC)} y2={y(plot.limitC)} stroke={LIMIT} strokeWidth={1.1} strokeDasharray="4,3" />
          <Text x={margin.left + plotW - 2} y={y(plot.limitC) - 3} textAnchor="end" style={{ fontSize: 7 }} fill={LIMIT}>
            {pdfSafeText(`limit ${formatNumber(plot.limitC, 4)} °C`)}
          </Text>
        </G>
      ) : null}
      {(plot.marks ?? []).map((m, i) => (
        <G key={`m${i}`}>
          <Line x1={x(m.x)} x2={x(m.x)} y1={margin.top} y2={margin.top + plotH} stroke={MUTED} strokeWidth={0.6} strokeDasharray="2,2" />
          <Text x={x(m.x) + 2} y={margin.top + 7 + (i % 3) * 8} style={{ fontSize: 6.5 }} fill={MUTED}>
            {pdfSafeText(m.label)}
          </Text>
        </G>
      ))}
      {plot.lines.map((line, i) => (
        <Polyline
          key={line.label}
          points={line.points.map(([px, py]) => `${x(px).toFixed(2)},${y(py).toFixed(2)}`).join(' ')}
          fill="none"
          stroke={LINES[i % LINES.length]}
          strokeWidth={1.3}
          {...(line.dashed ? { strokeDasharray: '3,2' } : {})}
        />
      ))}
      <Text x={margin.left + plotW / 2} y={heightPt - 4} textAnchor="middle" style={{ fontSize: 7.5 }} fill={MUTED}>
        {pdfSafeText(plot.xLabel)}
      </Text>
      <Text x={4} y={margin.top - 5} style={{ fontSize: 7.5 }} fill={MUTED}>
        {pdfSafeText(plot.yLabel)}
      </Text>
    </Svg>
  );
}

/** The legend under a chart with more than one line, as text (so that it is read back too). */
export function legendWords(plot: PackagePlot): string | null {
  if (plot.lines.length < 2) return null;
  return plot.lines.map((l, i) => `${['dark', 'copper', 'teal', 'ochre'][i % 4]}${l.dashed ? ' dashed' : ''}: ${l.label}`).join(' · ');
}

/**
 * The heat-balance profile as a vector chart for the PDF (react-pdf Svg): temperature against
 * position through the conductor and its coverings, the layers as bands with their names, the
 * governing limit as a dashed line, the hot spot marked, axes with ticks and units.
 */
import { Circle, G, Line, Polyline, Rect, Svg, Text } from '@react-pdf/renderer';
import type { HeatProfile } from '@/lib/electrical/sizing/types';
import { formatNumber } from '@/lib/units';
import { pdfSafeText } from './fonts';

const INK = '#233040';
const MUTED = '#4f6278';
const GRID = '#dde3ea';
const LIMIT = '#a8402b';
const LINE = '#2f3d4f';
const BAND_FILLS = ['#f4e6da', '#eef1f5', '#e3f1ef', '#f5eedd', '#e9edf2'];

/** 1, 2 or 5 × a power of ten, giving about `count` steps over the range. */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!(max > min)) return [min];
  const raw = (max - min) / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const first = Math.ceil(min / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = first; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

/** Grid lines, ticks with their figures, and the two axes of a chart in the calculation package (one drawing for every chart). */
export function ChartAxes({
  margin,
  plotW,
  plotH,
  xTicks,
  yTicks,
  x,
  y,
}: {
  margin: { left: number; top: number };
  plotW: number;
  plotH: number;
  xTicks: number[];
  yTicks: number[];
  x: (v: number) => number;
  y: (v: number) => number;
}) {
  return (
    <G>
      {yTicks.map((t) => (
        <G key={`y${t}`}>
          <Line x1={margin.left} x2={margin.left + plotW} y1={y(t)} y2={y(t)} stroke={GRID} strokeWidth={0.5} />
          <Line x1={margin.left - 3} x2={margin.left} y1={y(t)} y2={y(t)} stroke={INK} strokeWidth={0.7} />
          <Text x={margin.left - 5} y={y(t) + 2.2} textAnchor="end" style={{ fontSize: 7 }} fill={INK}>
            {formatNumber(t, 4)}
          </Text>
        </G>
      ))}
      {xTicks.map((t) => (
        <G key={`x${t}`}>
          <Line x1={x(t)} x2={x(t)} y1={margin.top + plotH} y2={margin.top + plotH + 3} stroke={INK} strokeWidth={0.7} />
          <Text x={x(t)} y={margin.top + plotH + 11} textAnchor="middle" style={{ fontSize: 7 }} fill={INK}>
            {formatNumber(t, 4)}
          </Text>
        </G>
      ))}
      <Line x1={margin.left} x2={margin.left} y1={margin.top} y2={margin.top + plotH} stroke={INK} strokeWidth={0.8} />
      <Line x1={margin.left} x2={margin.left + plotW} y1={margin.top + plotH} y2={margin.top + plotH} stroke={INK} strokeWidth={0.8} />
    </G>
  );
}

/**
 * `soil`: a buried cable's surroundings, drawn beyond its surface as a band not to scale (the
 * external resistance T₄ is a logarithm of the depth, not a layer of the radius) with the fall
 * from the cable surface to the undisturbed ground temperature.
 */
export function ProfileChart({
  profile,
  limitC,
  limitLabel,
  widthPt = 523,
  heightPt = 210,
  soil,
}: {
  profile: HeatProfile;
  limitC: number;
  limitLabel: string;
  widthPt?: number;
  heightPt?: number;
  soil?: { groundC: number; externalResistanceKmPerW: number | null };
}) {
  const margin = { left: 42, right: 12, top: 22, bottom: 30 };
  const plotW = widthPt - margin.left - margin.right;
  const plotH = heightPt - margin.top - margin.bottom;
  const xsMm = profile.positionsM.map((m) => m * 1000);
  const cableMaxMm = Math.max(...profile.layers.map((l) => l.endM * 1000), ...xsMm);
  // The soil band takes a third more of the width beyond the surface.
  const xMaxMm = soil ? cableMaxMm * 1.45 : cableMaxMm;
  const temps = profile.temperaturesC;
  const tLow = Math.min(...temps, limitC, ...(soil ? [soil.groundC] : []));
  const tHigh = Math.max(...temps, limitC);
  const pad = Math.max(2, (tHigh - tLow) * 0.08);
  const yTicks = niceTicks(tLow - pad, tHigh + pad, 5);
  const yMin = Math.min(yTicks[0], tLow - pad);
  const yMax = Math.max(yTicks[yTicks.length - 1], tHigh + pad);
  const xTicks = niceTicks(0, cableMaxMm, 6);
  const x = (mm: number) => margin.left + (mm / xMaxMm) * plotW;
  const y = (c: number) => margin.top + plotH - ((c - yMin) / (yMax - yMin)) * plotH;
  const points = xsMm.map((mm, i) => `${x(mm).toFixed(2)},${y(temps[i]).toFixed(2)}`).join(' ');
  const axisWord = profile.geometry === 'cylinder' ? 'radius from the conductor axis (mm)' : 'depth through the bar (mm)';
  const surfaceC = temps[temps.length - 1];
  return (
    <Svg width={widthPt} height={heightPt} viewBox={`0 0 ${widthPt} ${heightPt}`}>
      {profile.layers.map((layer, i) => {
        const x0 = x(layer.startM * 1000);
        const x1 = x(layer.endM * 1000);
        const name = layer.name.length > 22 ? `${layer.name.slice(0, 20)}…` : layer.name;
        return (
          <G key={`${layer.name}-${i}`}>
            <Rect x={x0} y={margin.top} width={Math.max(0.5, x1 - x0)} height={plotH} fill={layer.generating ? BAND_FILLS[0] : BAND_FILLS[1 + (i % (BAND_FILLS.length - 1))]} />
            {x1 - x0 > 18 ? (
              <Text x={(x0 + x1) / 2} y={margin.top - 4 - (i % 2) * 8} textAnchor="middle" style={{ fontSize: 6.5 }} fill={MUTED}>
                {pdfSafeText(name)}
              </Text>
            ) : null}
          </G>
        );
      })}
      {soil ? (
        <G>
          <Rect x={x(cableMaxMm)} y={margin.top} width={x(xMaxMm) - x(cableMaxMm)} height={plotH} fill="#efe6d6" />
          <Text x={(x(cableMaxMm) + x(xMaxMm)) / 2} y={margin.top - 4} textAnchor="middle" style={{ fontSize: 6.5 }} fill={MUTED}>
            soil (not to scale)
          </Text>
          <Line x1={x(cableMaxMm)} x2={x(xMaxMm)} y1={y(surfaceC)} y2={y(soil.groundC)} stroke={LINE} strokeWidth={1.1} strokeDasharray="3,2" />
          <Text x={x(xMaxMm) - 2} y={y(soil.groundC) - 3} textAnchor="end" style={{ fontSize: 6.5 }} fill={INK}>
            {pdfSafeText(`ground ${formatNumber(soil.groundC, 4)} °C${soil.externalResistanceKmPerW === null ? '' : `, T₄ = ${formatNumber(soil.externalResistanceKmPerW, 3)} K·m/W`}`)}
          </Text>
        </G>
      ) : null}
      <ChartAxes margin={margin} plotW={plotW} plotH={plotH} xTicks={xTicks} yTicks={yTicks} x={x} y={y} />
      <Line x1={margin.left} x2={margin.left + plotW} y1={y(limitC)} y2={y(limitC)} stroke={LIMIT} strokeWidth={1.1} strokeDasharray="4,3" />
      <Text x={margin.left + plotW - 2} y={y(limitC) - 3} textAnchor="end" style={{ fontSize: 7 }} fill={LIMIT}>
        {pdfSafeText(`limit ${formatNumber(limitC, 4)} °C (${limitLabel})`)}
      </Text>
      <Polyline points={points} fill="none" stroke={LINE} strokeWidth={1.3} />
      <Circle cx={x(profile.hotSpot.positionM * 1000)} cy={y(profile.hotSpot.temperatureC)} r={2.6} fill={LIMIT} />
      <Text x={Math.min(x(profile.hotSpot.positionM * 1000) + 5, margin.left + plotW - 90)} y={y(profile.hotSpot.temperatureC) + 10} style={{ fontSize: 7 }} fill={INK}>
        {`hot spot ${formatNumber(profile.hotSpot.temperatureC, 4)} °C`}
      </Text>
      <Text x={margin.left + plotW / 2} y={heightPt - 4} textAnchor="middle" style={{ fontSize: 7.5 }} fill={MUTED}>
        {axisWord}
      </Text>
      <Text x={4} y={margin.top - 8} style={{ fontSize: 7.5 }} fill={MUTED}>
        temperature (°C)
      </Text>
    </Svg>
  );
}

'use client';
/**
 * The bus-bar system that was rated, drawn to scale (geometry: lib/sheet/busbarDrawing): the three
 * phase packs with every bar and the phase spacing, and an elevation of the run with its supports
 * when the support spacing is known. Each bar carries its temperature as a title (shown on hover);
 * the same figures are in the pack table beside the drawing for keyboard and screen-reader users.
 * The governing bar is outlined as well as coloured, so it shows without colour.
 */
import { busbarDrawing, type BusbarDrawingInput, type BusbarPrimitive } from '@/lib/sheet/busbarDrawing';

const FILL: Record<string, string> = { bar: '#b8703d', governing: '#a8402b', run: '#d9b08f', support: '#3d4e62' };

function shape(p: BusbarPrimitive, key: number, titles: readonly string[] | undefined) {
  switch (p.kind) {
    case 'rect': {
      if (p.role === 'governing-ring') return <rect key={key} x={p.x} y={p.y} width={p.width} height={p.height} fill="none" stroke="#a8402b" strokeWidth={1.25} strokeDasharray="3 1.5" aria-hidden="true" />;
      const title = p.bar !== undefined ? titles?.[p.bar] : undefined;
      return (
        <rect key={key} x={p.x} y={p.y} width={p.width} height={p.height} fill={FILL[p.role]} stroke="#1a2431" strokeWidth={p.role === 'run' ? 0.5 : 0.6} data-testid={p.role === 'bar' || p.role === 'governing' ? `busbar-bar-${p.bar}` : undefined} data-role={p.role}>
          {title ? <title>{title}</title> : null}
        </rect>
      );
    }
    case 'line':
      return <line key={key} x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2} stroke={p.role === 'spacer' ? '#1a2431' : '#5c6f85'} strokeWidth={p.role === 'spacer' ? 1 : 0.75} markerStart={p.role === 'dimension' ? 'url(#bus-dim-tick)' : undefined} markerEnd={p.role === 'dimension' ? 'url(#bus-dim-tick)' : undefined} />;
    case 'text':
      return (
        <text key={key} x={p.x} y={p.y} textAnchor={p.anchor} fontSize={10} fill={p.role === 'label' ? '#4f6278' : '#233040'} className="font-mono">
          {p.text}
        </text>
      );
  }
}

export function BusbarSystemView({ input, title, titles, width = 440, height = 200 }: { input: BusbarDrawingInput; title: string; titles?: readonly string[]; width?: number; height?: number }) {
  const drawing = busbarDrawing(input, width, height, 90);
  if (!drawing) {
    return (
      <figure className="panel p-2" data-testid="busbar-drawing">
        <p className="text-caption text-over-dark">The packs do not fit the phase spacing entered: nothing to draw (see the phase spacing field).</p>
      </figure>
    );
  }
  const defs = (
    <defs>
      <marker id="bus-dim-tick" viewBox="0 0 6 6" refX="3" refY="3" markerWidth="6" markerHeight="6" orient="auto">
        <line x1="3" y1="0" x2="3" y2="6" stroke="#5c6f85" strokeWidth="1" />
      </marker>
    </defs>
  );
  return (
    <figure className="panel p-2" data-testid="busbar-drawing">
      <svg viewBox={`0 0 ${width} ${height}`} width="100%" role="img" aria-label={`${title}, cross-section at ${drawing.crossSection.scaleText}`}>
        {defs}
        {drawing.crossSection.primitives.map((p, i) => shape(p, i, titles))}
      </svg>
      {drawing.elevation ? (
        <svg viewBox={`0 0 ${width} ${drawing.elevation.height}`} width="100%" role="img" aria-label={`Elevation of the run with its supports, at ${drawing.elevation.scaleText}`} data-testid="busbar-elevation">
          {defs}
          {drawing.elevation.primitives.map((p, i) => shape(p, i, undefined))}
        </svg>
      ) : null}
      <figcaption className="mt-1 text-caption text-ink-600">
        {title}. Copper-coloured: the bars{input.governing ? '; red and outlined: the bar that governs' : ''}. Cross-section drawn at {drawing.crossSection.scaleText}
        {drawing.elevation ? `, the run at ${drawing.elevation.scaleText}` : ''} (when printed); point at a bar for its temperature.
        {input.phaseSpacingAssumed ? ' The phase spacing is not entered: the spacing the method assumed is drawn.' : ''}
      </figcaption>
    </figure>
  );
}

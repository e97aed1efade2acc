'use client';
/**
 * The cross-section that was rated, to scale with its dimensions (geometry: lib/sheet/crossSectionDrawing).
 * Each cable carries its temperatures as a title (shown on hover); the same figures are in the
 * table beside the drawing for keyboard and screen-reader users. The governing cable is ringed as
 * well as coloured, so it shows without colour.
 */
import { crossSectionDrawing, type DrawingInput, type Primitive } from '@/lib/sheet/crossSectionDrawing';

const FILL: Record<string, string> = {
  rated: '#3d4e62',
  other: '#97a6b7',
  governing: '#a8402b',
  duct: 'none',
  'governing-ring': 'none',
  soil: '#f1ebdf',
  bank: '#e4dac7',
};

function shape(p: Primitive, key: number, titles: readonly string[] | undefined) {
  switch (p.kind) {
    case 'circle': {
      const title = p.cable !== undefined && p.role !== 'duct' && p.role !== 'governing-ring' ? titles?.[p.cable] : undefined;
      if (p.role === 'governing-ring') {
        return <circle key={key} cx={p.cx} cy={p.cy} r={p.r} fill="none" stroke="#a8402b" strokeWidth={1.25} aria-hidden="true" />;
      }
      return (
        <circle
          key={key}
          cx={p.cx}
          cy={p.cy}
          r={p.r}
          fill={FILL[p.role]}
          stroke={p.role === 'duct' ? '#4f6278' : '#1a2431'}
          strokeWidth={p.role === 'duct' ? 1 : 0.75}
          strokeDasharray={p.role === 'duct' ? '3 2' : undefined}
          data-testid={title ? `cross-section-cable-${p.cable}` : undefined}
          data-role={p.role}
        >
          {title ? <title>{title}</title> : null}
        </circle>
      );
    }
    case 'rect':
      return <rect key={key} x={p.x} y={p.y} width={p.width} height={p.height} fill={FILL[p.role]} stroke={p.role === 'bank' ? '#7f90a3' : 'none'} />;
    case 'line':
      return <line key={key} x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2} stroke={p.role === 'ground' ? '#233040' : '#5c6f85'} strokeWidth={p.role === 'ground' ? 1.5 : 0.75} markerStart={p.role === 'dimension' ? 'url(#dim-tick)' : undefined} markerEnd={p.role === 'dimension' ? 'url(#dim-tick)' : undefined} />;
    case 'text':
      return (
        <text key={key} x={p.x} y={p.y} textAnchor={p.anchor} fontSize={10} fill={p.role === 'label' ? '#4f6278' : '#233040'} className="font-mono">
          {p.text}
        </text>
      );
  }
}

export function CrossSectionView({
  input,
  title,
  titles,
  caption,
  width = 420,
  height = 260,
}: {
  input: DrawingInput;
  title: string;
  /** Hover text of each cable, by its index in `input.cables` (its temperatures). */
  titles?: readonly string[];
  /** A line under the drawing (the governing cable in words). */
  caption?: string;
  width?: number;
  height?: number;
}) {
  const drawing = crossSectionDrawing(input, width, height);
  return (
    <figure className="panel p-2" data-testid="cross-section">
      <svg viewBox={`0 0 ${width} ${height}`} width="100%" role="img" aria-label={title}>
        <defs>
          <marker id="dim-tick" viewBox="0 0 6 6" refX="3" refY="3" markerWidth="6" markerHeight="6" orient="auto">
            <line x1="3" y1="0" x2="3" y2="6" stroke="#5c6f85" strokeWidth="1" />
          </marker>
        </defs>
        {drawing.primitives.map((p, i) => shape(p, i, titles))}
      </svg>
      <figcaption className="mt-1 text-caption text-ink-600">
        {title}. Dark: the circuit rated{input.governingCable !== undefined ? '; red and ringed: the cable that governs' : ''}; grey: other circuits{input.cables.some((c) => c.envelopeDiameterM > c.externalDiameterM) ? '; dashed: ducts' : ''}. Drawn at {drawing.scaleText} (when printed); point at a cable for its temperatures.
        {caption ? (
          <>
            {' '}
            <span className="font-medium text-ink-800" data-testid="cross-section-governing">{caption}</span>
          </>
        ) : null}
      </figcaption>
    </figure>
  );
}

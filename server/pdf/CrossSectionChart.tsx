/**
 * The rated cross-section for the PDF (react-pdf Svg): the same primitives the sheet draws
 * (lib/sheet/crossSectionDrawing), so the printed drawing is the one the designer saw, at a plain
 * 1 : n scale of the printed page (points), with its dimensions. The governing cable is ringed as
 * well as filled, so it shows in black-and-white print.
 */
import { Circle, Line, Rect, Svg, Text } from '@react-pdf/renderer';
import { crossSectionDrawing, type DrawingInput, type Primitive } from '@/lib/sheet/crossSectionDrawing';
import { pdfSafeText } from './fonts';

const FILL: Record<string, string> = {
  rated: '#3d4e62',
  other: '#97a6b7',
  governing: '#a8402b',
  soil: '#f1ebdf',
  bank: '#e4dac7',
};

function shape(p: Primitive, key: number) {
  switch (p.kind) {
    case 'circle':
      if (p.role === 'duct') return <Circle key={key} cx={p.cx} cy={p.cy} r={p.r} fill="none" stroke="#4f6278" strokeWidth={0.8} strokeDasharray="3,2" />;
      if (p.role === 'governing-ring') return <Circle key={key} cx={p.cx} cy={p.cy} r={p.r} fill="none" stroke="#a8402b" strokeWidth={1} />;
      return <Circle key={key} cx={p.cx} cy={p.cy} r={p.r} fill={FILL[p.role]} stroke="#1a2431" strokeWidth={0.6} />;
    case 'rect':
      return <Rect key={key} x={p.x} y={p.y} width={p.width} height={p.height} fill={FILL[p.role]} stroke={p.role === 'bank' ? '#7f90a3' : undefined} strokeWidth={p.role === 'bank' ? 0.6 : 0} />;
    case 'line':
      return <Line key={key} x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2} stroke={p.role === 'ground' ? '#233040' : '#5c6f85'} strokeWidth={p.role === 'ground' ? 1.2 : 0.6} />;
    case 'text':
      return (
        <Text key={key} x={p.x} y={p.y} textAnchor={p.anchor} style={{ fontSize: 7 }} fill={p.role === 'label' ? '#4f6278' : '#233040'}>
          {pdfSafeText(p.text)}
        </Text>
      );
  }
}

export function CrossSectionChart({ input, widthPt = 300, heightPt = 180 }: { input: DrawingInput; widthPt?: number; heightPt?: number }) {
  const drawing = crossSectionDrawing(input, widthPt, heightPt);
  return (
    <Svg width={widthPt} height={heightPt} viewBox={`0 0 ${widthPt} ${heightPt}`}>
      {drawing.primitives.map(shape)}
      <Text x={widthPt - 4} y={heightPt - 4} textAnchor="end" style={{ fontSize: 6.5 }} fill="#4f6278">
        {`scale ${drawing.scaleText}`}
      </Text>
    </Svg>
  );
}

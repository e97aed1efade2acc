/**
 * The chosen candidate's cross-section solved in two dimensions, as the saved snapshot holds it
 * (lib/sheet/crossSectionField.ts): the field as a picture drawn with react-pdf primitives — the
 * stored coarse grid as coloured bands (viridis, the sheet's ramp, in 24 steps), isotherms traced
 * on it, the ground surface, the backfill and the cables (the governing one ringed in red), a
 * colour scale — and the numbers: every cable's temperature by the field and by the IEC rating,
 * the governing cable, the ampacity by the field against the rating's, the mesh, the solver's
 * flags and the caution.
 */
import { flagLine } from '@/lib/sheet/flagWords';
import { Circle, Line, Rect, Svg, Text as SvgText, Text, View } from '@react-pdf/renderer';
import { FIELD_CAUTION, fieldCableRows, fieldReportSentences, type FieldCheckOutcome, type FieldReport } from '@/lib/sheet/crossSectionField';
import { isothermLevels, isotherms, viridisColour } from '@/lib/sheet/fieldPicture';
import { formatNumber } from '@/lib/units';
import { pdfSafeText as safe } from './fonts';

const MUTED = '#4f6278';
const RULE = '#c3ccd7';
const h2 = { marginTop: 12, marginBottom: 3, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: RULE, paddingBottom: 2 } as const;
const COLOUR_STEPS = 24;

function FieldPictureSvg({ report, widthPt = 260 }: { report: FieldReport; widthPt?: number }) {
  const p = report.picture!;
  const scaleW = 30; // room for the colour scale
  const plotW = widthPt - scaleW;
  const aspect = (p.depthBottomM - p.depthTopM) / (p.xMaxM - p.xMinM);
  const plotH = Math.min(220, plotW * aspect);
  const sx = plotW / (p.xMaxM - p.xMinM);
  const sy = plotH / (p.depthBottomM - p.depthTopM);
  const X = (x: number) => (x - p.xMinM) * sx;
  const Y = (depth: number) => (depth - p.depthTopM) * sy;
  const span = p.maxC - p.minC || 1;
  const step = (t: number) => Math.min(COLOUR_STEPS - 1, Math.floor(((t - p.minC) / span) * COLOUR_STEPS));
  const colourOf = (s: number) => viridisColour((s + 0.5) / COLOUR_STEPS);
  const cellW = plotW / p.columns;
  const cellH = plotH / p.rows;
  // Each row as runs of one colour step: a banded picture, and far fewer rectangles than pixels.
  const bands: Array<{ x: number; y: number; w: number; colour: string }> = [];
  for (let r = 0; r < p.rows; r++) {
    let start = 0;
    for (let c = 1; c <= p.columns; c++) {
      const here = step(p.temperaturesC[r * p.columns + start]);
      if (c < p.columns && step(p.temperaturesC[r * p.columns + c]) === here) continue;
      bands.push({ x: start * cellW, y: r * cellH, w: (c - start) * cellW, colour: colourOf(here) });
      start = c;
    }
  }
  const levels = isothermLevels(p.minC, p.maxC, 6);
  const lines = isotherms(p, levels);
  const governing = report.governing?.cable;
  const bank = report.group.bank;
  return (
    <Svg width={widthPt} height={plotH + 14} viewBox={`0 0 ${widthPt} ${plotH + 14}`}>
      {bands.map((b, i) => (
        <Rect key={`b${i}`} x={b.x} y={b.y} width={b.w + 0.3} height={cellH + 0.3} fill={b.colour} />
      ))}
      {lines.flatMap((iso) => iso.segments.map((s, i) => <Line key={`i${iso.levelC}-${i}`} x1={X(s[0])} y1={Y(s[1])} x2={X(s[2])} y2={Y(s[3])} stroke="#ffffff" strokeWidth={0.5} />))}
      <Line x1={0} y1={Y(0)} x2={plotW} y2={Y(0)} stroke="#233040" strokeWidth={1.2} />
      {bank ? <Rect x={X(bank.centreXM - bank.widthM / 2)} y={Y(bank.centreDepthM - bank.heightM / 2)} width={bank.widthM * sx} height={bank.heightM * sy} fill="none" stroke="#f1ebdf" strokeWidth={0.6} strokeDasharray="2,2" /> : null}
      {report.group.cables.map((c, k) => (
        <Circle key={`c${k}`} cx={X(c.xM)} cy={Y(-c.yM)} r={Math.max(0.8, (c.externalDiameterM / 2) * sx)} fill={c.role === 'rated' ? '#3d4e62' : '#97a6b7'} stroke={k === governing ? '#a8402b' : '#1a2431'} strokeWidth={k === governing ? 1.2 : 0.4} />
      ))}
      {governing !== undefined ? (
        <Circle cx={X(report.group.cables[governing].xM)} cy={Y(-report.group.cables[governing].yM)} r={(report.group.cables[governing].envelopeDiameterM / 2) * sx + 2.5} fill="none" stroke="#a8402b" strokeWidth={0.9} />
      ) : null}
      {/* Colour scale: the coolest step at the bottom. */}
      {Array.from({ length: COLOUR_STEPS }, (_, s) => (
        <Rect key={`s${s}`} x={plotW + 6} y={plotH - ((s + 1) * plotH) / COLOUR_STEPS} width={8} height={plotH / COLOUR_STEPS + 0.3} fill={colourOf(s)} />
      ))}
      <SvgText x={plotW + 16} y={7} style={{ fontSize: 5.5 }} fill={MUTED}>
        {`${formatNumber(p.maxC, 3)}`}
      </SvgText>
      <SvgText x={plotW + 16} y={plotH} style={{ fontSize: 5.5 }} fill={MUTED}>
        {`${formatNumber(p.minC, 3)}`}
      </SvgText>
      <SvgText x={plotW + 6} y={plotH + 10} style={{ fontSize: 5.5 }} fill={MUTED}>
        °C
      </SvgText>
      <SvgText x={0} y={plotH + 10} style={{ fontSize: 6 }} fill={MUTED}>
        {safe(`${formatNumber((p.xMaxM - p.xMinM) * 1000, 4)} mm across, ${formatNumber((p.depthBottomM - p.depthTopM) * 1000, 4)} mm down from the surface; isotherms every ${levels.length > 1 ? formatNumber(levels[1] - levels[0], 3) : '—'} K`)}
      </SvgText>
    </Svg>
  );
}

export function CrossSectionFieldSection({ outcome, otherLabels = [] }: { outcome: FieldCheckOutcome | null | undefined; otherLabels?: readonly string[] }) {
  if (!outcome) return null;
  if (!outcome.ok) {
    return (
      <View>
        <Text style={h2} minPresenceAhead={60}>Cross-section in two dimensions (chosen candidate)</Text>
        <Text>{safe(`Not computed: ${outcome.message}`)}</Text>
      </View>
    );
  }
  const report = outcome.report;
  const words = fieldReportSentences(report);
  const rows = fieldCableRows(report, otherLabels);
  const columns = [
    { title: `Cable at ${formatNumber(report.designCurrentA, 4)} A`, width: '36%' },
    { title: 'Role', width: '18%' },
    { title: 'Field (°C)', width: '11%' },
    { title: 'IEC (°C)', width: '11%' },
    { title: 'Field − IEC (K)', width: '12%' },
    { title: 'Surface, field (°C)', width: '12%' },
  ];
  return (
    <View>
      <Text style={h2} minPresenceAhead={120}>{safe(`Cross-section in two dimensions: ${report.candidateLabel}`)}</Text>
      <View style={{ flexDirection: 'row', gap: 8 }} wrap={false}>
        {report.picture ? <FieldPictureSvg report={report} /> : null}
        <View style={{ flex: 1 }}>
          {words.results.map((line) => (
            <Text key={line} style={{ marginTop: 1, fontWeight: 600 }}>
              {safe(line)}
            </Text>
          ))}
          {report.reviewFlags.map((f) => (
            <Text key={f.code} style={{ marginTop: 2, color: '#6b4a06' }}>
              {safe(`Flag: ${flagLine(f)}`)}
            </Text>
          ))}
          <Text style={{ marginTop: 2, color: MUTED }}>{safe(words.method)}</Text>
        </View>
      </View>
      <View style={{ marginTop: 4 }}>
        <View style={{ flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 1.6, color: MUTED, fontWeight: 600, fontSize: 7.4 }} wrap={false} fixed>
          {columns.map((c) => (
            <Text key={c.title} style={{ width: c.width, paddingRight: 3 }}>
              {safe(c.title)}
            </Text>
          ))}
        </View>
        {rows.map((r, i) => (
          <View key={i} style={[{ flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 1.6 }, r.governs ? { fontWeight: 600, backgroundColor: '#f7efe8' } : {}]} wrap={false}>
            {[`${r.governs ? '[governs] ' : ''}${r.cable}`, r.role, r.field, r.iec, r.difference, r.surface].map((cell, j) => (
              <Text key={j} style={{ width: columns[j].width, paddingRight: 3 }}>
                {safe(cell)}
              </Text>
            ))}
          </View>
        ))}
      </View>
      {report.notes.map((n) => (
        <Text key={n} style={{ marginTop: 1, color: MUTED }}>
          {safe(`· ${n}`)}
        </Text>
      ))}
      {report.flags.length === 0 ? (
        <Text style={{ marginTop: 2, color: MUTED }}>No flags from the field solver.</Text>
      ) : (
        report.flags.map((f, i) => (
          <Text key={i} style={{ marginTop: 1 }}>
            {safe(`Field solver: ${flagLine(f)}`)}
          </Text>
        ))
      )}
      <View style={{ marginTop: 4, padding: 5, borderWidth: 1, borderColor: '#a06b08', backgroundColor: '#f6e8c8' }} wrap={false}>
        <Text>{safe(`Caution. ${FIELD_CAUTION}`)}</Text>
      </View>
    </View>
  );
}

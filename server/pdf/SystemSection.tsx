/**
 * The PDF's sections for the bus-bar system and the protection of the chosen candidate, from the
 * saved snapshot: the system drawn to scale (the same primitives the sheet draws,
 * lib/sheet/busbarDrawing), every bar of the pack with its temperature, share of the phase current
 * and R_ac/R_dc (the governing bar marked in words), the IEC 60865-1 forces with their verdicts,
 * and the protection verdicts — each with the flags of that check beside it, in the words of
 * lib/sheet/systemWords (which the sheet and the share page use too).
 */
import { flagLine } from '@/lib/sheet/flagWords';
import { Line, Rect, Svg, Text, View } from '@react-pdf/renderer';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { busbarDrawing, busbarDrawingInputOf, type BusbarPrimitive, type BusbarView } from '@/lib/sheet/busbarDrawing';
import type { SheetInputs } from '@/lib/sheet/schema';
import {
  deviceWords,
  flagsOf,
  FORCES_FLAG_CODES,
  forcesLines,
  forcesNotCheckedReason,
  hottestBarText,
  PACK_FLAG_CODES,
  packBarRows,
  PROTECTION_FLAG_CODES,
  protectionLines,
  protectionVerdicts,
  type ResultLine,
} from '@/lib/sheet/systemWords';
import { formatNumber } from '@/lib/units';
import { pdfSafeText as safe } from './fonts';

const RULE = '#c3ccd7';
const MUTED = '#4f6278';
const OVER = '#7d2d1d';
const WITHIN = '#0f544e';
const h2 = { marginTop: 12, marginBottom: 3, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: RULE, paddingBottom: 2 } as const;
const row = { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 1.6 } as const;

const FILL: Record<string, string> = { bar: '#b8703d', governing: '#a8402b', run: '#d9b08f', support: '#3d4e62' };

function shape(p: BusbarPrimitive, key: number) {
  switch (p.kind) {
    case 'rect':
      if (p.role === 'governing-ring') return <Rect key={key} x={p.x} y={p.y} width={p.width} height={p.height} fill="none" stroke="#a8402b" strokeWidth={1} strokeDasharray="3,1.5" />;
      return <Rect key={key} x={p.x} y={p.y} width={p.width} height={p.height} fill={FILL[p.role]} stroke="#1a2431" strokeWidth={0.5} />;
    case 'line':
      return <Line key={key} x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2} stroke={p.role === 'spacer' ? '#1a2431' : '#5c6f85'} strokeWidth={p.role === 'spacer' ? 0.9 : 0.6} />;
    case 'text':
      return (
        <Text key={key} x={p.x} y={p.y} textAnchor={p.anchor} style={{ fontSize: 7 }} fill={p.role === 'label' ? MUTED : '#233040'}>
          {safe(p.text)}
        </Text>
      );
  }
}

function ViewChart({ view }: { view: BusbarView }) {
  return (
    <Svg width={view.width} height={view.height} viewBox={`0 0 ${view.width} ${view.height}`}>
      {view.primitives.map(shape)}
      <Text x={view.width - 4} y={view.height - 4} textAnchor="end" style={{ fontSize: 6.5 }} fill={MUTED}>
        {`scale ${view.scaleText}`}
      </Text>
    </Svg>
  );
}

function Lines({ lines }: { lines: ResultLine[] }) {
  return (
    <View>
      {lines.map((l, i) => (
        <View key={i} style={row} wrap={false}>
          <Text style={{ width: '38%', paddingRight: 3, color: MUTED }}>{safe(l.label)}</Text>
          <Text style={{ width: '50%', paddingRight: 3 }}>{safe(l.value)}</Text>
          <Text style={{ width: '12%', fontWeight: 600, color: l.verdict === 'fails' ? OVER : WITHIN }}>{l.verdict === 'passes' ? 'passes' : l.verdict === 'fails' ? 'FAILS' : ''}</Text>
        </View>
      ))}
    </View>
  );
}

function Flags({ e, codes }: { e: CandidateEvaluationOk; codes: readonly string[] }) {
  const flags = flagsOf(e, codes);
  if (flags.length === 0) return null;
  return (
    <View style={{ marginTop: 2 }}>
      {flags.map((f) => (
        <Text key={f.code} style={{ marginTop: 1, color: f.severity === 'blocker' ? OVER : MUTED }}>
          {safe(`Flag: ${flagLine(f)}`)}
        </Text>
      ))}
    </View>
  );
}

const n = (v: number, d = 4) => formatNumber(v, d);

/** The bus-bar system of the chosen bar candidate: drawing, pack table, forces. */
export function BusbarSystemSection({ inputs, chosen }: { inputs: SheetInputs; chosen: CandidateEvaluationOk | null }) {
  if (!chosen || chosen.kind !== 'bar') return null;
  const candidate = inputs.candidates.find((c) => c.id === chosen.id);
  const drawingInput = candidate ? busbarDrawingInputOf(inputs, candidate, chosen.pack) : null;
  const drawing = drawingInput ? busbarDrawing(drawingInput, 520, 150, 70) : null;
  const pack = chosen.pack;
  const f = chosen.forces;
  return (
    <View>
      <Text style={h2} minPresenceAhead={120}>{safe(`Bus-bar system rated: ${chosen.label}`)}</Text>
      {drawing ? (
        <View wrap={false}>
          <ViewChart view={drawing.crossSection} />
          {drawing.elevation ? <ViewChart view={drawing.elevation} /> : null}
          <Text style={{ color: MUTED }}>
            {safe(`Copper-coloured: the bars${drawingInput?.governing ? '; red and outlined: the bar that governs' : ''}.${drawingInput?.phaseSpacingAssumed ? ' The phase spacing is not entered: the spacing the method assumed is drawn.' : ''}`)}
          </Text>
        </View>
      ) : null}
      {pack ? (
        <View style={{ marginTop: 4 }}>
          <Text style={{ fontWeight: 600 }}>{safe(`Governs: ${hottestBarText(pack)}; the worst phase's R_ac/R_dc ${n(pack.acFactor)}.`)}</Text>
          <View style={[row, { color: MUTED, fontWeight: 600, fontSize: 7.4 }]} wrap={false} fixed>
            {['Bar', 'Temperature (°C)', 'Share of phase (%)', 'Current (A)', 'R_ac/R_dc', 'Loss (W/m)'].map((h, i) => (
              <Text key={h} style={{ width: i === 0 ? '30%' : '14%', textAlign: i === 0 ? 'left' : 'right', paddingRight: 3 }}>
                {safe(h)}
              </Text>
            ))}
          </View>
          {packBarRows(pack).map((r) => (
            <View key={`${r.phase}-${r.positionInPack}`} style={[row, r.governs ? { fontWeight: 600, backgroundColor: '#f7efe8' } : {}]} wrap={false}>
              <Text style={{ width: '30%', paddingRight: 3 }}>{safe(`${r.governs ? '[governs] ' : ''}${r.phase}, ${r.bar}`)}</Text>
              {[n(r.temperatureC), n(r.shareOfPhase * 100, 3), n(r.currentA), r.acFactor === null ? '—' : n(r.acFactor), n(r.lossWPerM, 3)].map((v, i) => (
                <Text key={i} style={{ width: '14%', textAlign: 'right', paddingRight: 3 }}>
                  {safe(v)}
                </Text>
              ))}
            </View>
          ))}
          <Text style={{ marginTop: 2, color: MUTED }}>{safe(pack.method.replace(/\.?$/, '.'))}</Text>
          <Flags e={chosen} codes={PACK_FLAG_CODES} />
        </View>
      ) : (
        <Text style={{ marginTop: 2 }}>{safe(`One bar per phase: rated as one bar, its R_ac/R_dc ${n(chosen.acFactor)} by the filament method.`)}</Text>
      )}
      <Text style={[h2, { fontSize: 10 }]} minPresenceAhead={80}>Forces under short circuit (IEC 60865-1)</Text>
      {f ? (
        <View>
          <Text style={{ fontWeight: 600, color: f.passes ? WITHIN : OVER }}>{f.passes ? 'The bars and supports withstand the fault.' : 'FAILS under the fault.'}</Text>
          <Lines lines={forcesLines(f, inputs.busbarSystem.supportSpacingM)} />
          <Text style={{ marginTop: 2, color: MUTED }}>{safe(f.method)}</Text>
        </View>
      ) : (
        <Text>{safe(forcesNotCheckedReason(inputs))}</Text>
      )}
      <Flags e={chosen} codes={FORCES_FLAG_CODES} />
    </View>
  );
}

/** The protection verdicts of the chosen candidate (when a device or harmonics are given). */
export function ProtectionSection({ inputs, chosen }: { inputs: SheetInputs; chosen: CandidateEvaluationOk | null }) {
  if (!chosen) return null;
  const verdicts = protectionVerdicts(chosen);
  if (!verdicts) return null;
  return (
    <View>
      <Text style={h2} minPresenceAhead={100}>{safe(`Protection${inputs.protection.included ? `: ${deviceWords(inputs.protection.device)}` : ''}`)}</Text>
      <Text style={{ fontWeight: 600 }}>
        {safe(`Overload coordination: ${verdicts.coordination}. Disconnection in time: ${verdicts.disconnection}. Protective conductor: ${verdicts.protectiveConductor}. Harmonics and neutral: ${verdicts.harmonics}.`)}
      </Text>
      <Lines lines={protectionLines(chosen)} />
      <Flags e={chosen} codes={PROTECTION_FLAG_CODES} />
    </View>
  );
}

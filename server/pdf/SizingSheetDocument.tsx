/**
 * The sizing sheet as a PDF document (@react-pdf/renderer, IBM Plex from fonts/): title block,
 * inputs with units, the candidates table, the chosen candidate's results, the heat-balance profile
 * as a vector chart, every assumption flag of the chosen candidate with its acknowledgement, the
 * method and standards, and the cautions. A sheet that is not approved carries "NOT APPROVED" in a
 * fixed band and a faint diagonal mark on every page; the caution is in the footer of every page.
 * Numbers come from the saved result snapshot only.
 */
import { flagTitle } from '@/lib/sheet/flagWords';
import { Document, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import { CAUTION_TEXT } from '@/lib/caution';
import { candidateRecords, chosenResultRows, formatDate, inputRows, METHOD_LINES } from '@/lib/sheet/sheetTables';
import type { AssumptionFlag } from '@/lib/electrical/sizing/flags';
import { chosenEvaluation, savedOptionalChecks, type ResultSnapshot } from '@/lib/sheet/snapshot';
import { STATUS_LABELS, type SheetStatus } from '@/lib/sheet/stateMachine';
import type { SheetInputs } from '@/lib/sheet/schema';
import { inputWarnings } from '@/lib/sheet/inputWarnings';
import type { CalculationPackage } from '@/lib/sheet/records';
import { DOCUMENT_UNITS_LINE, formatNumber } from '@/lib/units';
import { PDF_FONT_FAMILY, pdfSafeText as safe } from './fonts';
import { ProfileChart } from './ProfileChart';
import { LineChart, legendWords } from './LineChart';
import { CalculationPackageSection, RevisionTable } from './CalculationPackageSection';
import type { PackagePlot } from '@/lib/sheet/packagePlots';
import { OptionalChecksSection } from './OptionalChecksSection';
import { CrossSectionChart } from './CrossSectionChart';
import { BusbarSystemSection, ProtectionSection } from './SystemSection';
import { CrossSectionFieldSection } from './CrossSectionFieldSection';
import { arrangementSentences, drawingInputOf, governingCableOf, governingText, groupCableRows, groupMethodWords } from '@/lib/sheet/groupWords';
import { RE_EVALUATION_HEADING, reEvaluationFiguresLine, reEvaluationOf, reEvaluationSentence } from '@/lib/sheet/reEvaluation';

/** What the document needs of a sheet (db/queries/sheets SheetRecord fits). */
export interface PdfSheet {
  id: string;
  projectName: string;
  circuitTag: string;
  title: string;
  status: SheetStatus;
  revision: number;
  version: number;
  inputs: SheetInputs;
  result: ResultSnapshot | null;
  solverVersion: string | null;
  authorName: string | null;
  reviewerName: string | null;
  approvedAt: Date | string | null;
  updatedAt: Date | string;
  acknowledgements: { flagCode: string; comment: string; reviewerName: string | null; createdAt: Date | string }[];
  /** Document number, revision table and the approver's licence (server/pdf/pdfRenderer sheetPackagePdf); absent in a bare rendering. */
  calculationPackage?: CalculationPackage;
  /** ISO 4217 code of the team's money, named with every amount. */
  teamCurrency: string;
}

/** The marking of a sheet that is not approved: the same words on every page. */
export const NOT_APPROVED_MARK = 'NOT APPROVED';
export function notApprovedLine(status: SheetStatus): string {
  return `${NOT_APPROVED_MARK} — draft for review (status: ${STATUS_LABELS[status]}). Not for construction.`;
}

const INK = '#233040';
const MUTED = '#4f6278';
const RULE = '#c3ccd7';
const COPPER = '#9a5a2e';
const OVER = { text: '#7d2d1d', fill: '#a8402b', light: '#f6dcd5' };
const TIGHT = { text: '#6b4a06', fill: '#a06b08', light: '#f6e8c8' };
const WITHIN = { text: '#0f544e', fill: '#17776f', light: '#d7efec' };
const SEVERITY = {
  blocker: { word: 'BLOCKER', tone: OVER },
  review: { word: 'REVIEW', tone: TIGHT },
  note: { word: 'NOTE', tone: { text: MUTED, fill: '#6b7e94', light: '#eef1f5' } },
} as const;

const styles = StyleSheet.create({
  page: { paddingTop: 58, paddingBottom: 62, paddingHorizontal: 36, fontFamily: PDF_FONT_FAMILY, fontSize: 8.5, color: INK },
  header: { position: 'absolute', top: 16, left: 36, right: 36 },
  headerLine: { flexDirection: 'row', justifyContent: 'space-between', fontSize: 7.5, color: MUTED, borderBottomWidth: 0.5, borderBottomColor: RULE, paddingBottom: 2 },
  draftBand: { marginTop: 3, paddingVertical: 2, paddingHorizontal: 6, backgroundColor: OVER.light, color: OVER.text, fontSize: 8, fontWeight: 600, borderWidth: 0.7, borderColor: OVER.fill },
  watermark: { position: 'absolute', top: 360, left: 40, width: 600, fontSize: 50, fontWeight: 600, color: OVER.fill, opacity: 0.07, transform: 'rotate(-38deg)' },
  footer: { position: 'absolute', bottom: 16, left: 36, right: 36, fontSize: 6.8, color: MUTED, borderTopWidth: 0.5, borderTopColor: RULE, paddingTop: 3 },
  footerRow: { flexDirection: 'row', justifyContent: 'space-between', marginTop: 1 },
  brand: { fontSize: 8, color: COPPER, fontWeight: 600, letterSpacing: 0.5 },
  title: { fontSize: 16, fontWeight: 600, marginTop: 1 },
  subtitle: { fontSize: 10, color: MUTED },
  block: { marginTop: 8, flexDirection: 'row', flexWrap: 'wrap', borderWidth: 0.7, borderColor: RULE },
  blockCell: { width: '20%', padding: 4, borderRightWidth: 0.5, borderBottomWidth: 0.5, borderColor: RULE },
  blockLabel: { fontSize: 6.8, color: MUTED, letterSpacing: 0.4 },
  blockValue: { fontSize: 9, fontWeight: 600 },
  h2: { marginTop: 12, marginBottom: 3, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: RULE, paddingBottom: 2 },
  caution: { marginTop: 6, padding: 6, borderWidth: 1, borderColor: TIGHT.fill, backgroundColor: TIGHT.light, fontSize: 8 },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 1.6 },
  head: { color: MUTED, fontWeight: 600, fontSize: 7.4 },
  summary: { marginTop: 4, padding: 6, flexDirection: 'row', justifyContent: 'space-between', borderWidth: 1 },
  figureLabel: { fontSize: 6.8, color: MUTED },
  figureValue: { fontSize: 12, fontWeight: 600 },
  flag: { marginTop: 4, flexDirection: 'row', gap: 6 },
  badge: { alignSelf: 'flex-start', width: 50, fontSize: 7, fontWeight: 600, paddingVertical: 1, textAlign: 'center', borderWidth: 0.7 },
  muted: { color: MUTED },
});

function toneOf(snapshotChosen: ReturnType<typeof chosenEvaluation>) {
  if (!snapshotChosen) return OVER;
  const e = snapshotChosen;
  if (!e.passes || e.hotSpotC === null || e.marginK === null || e.marginK < 0) return OVER;
  if (e.marginPercent !== null && e.marginPercent < 10) return TIGHT;
  return WITHIN;
}

function TitleBlock({ sheet, generatedAt }: { sheet: PdfSheet; generatedAt: Date }) {
  const cells: [string, string][] = [
    ['Document number', sheet.calculationPackage?.documentNumber ?? 'not numbered (no package data)'],
    ['Project', sheet.projectName],
    ['Circuit', `${sheet.circuitTag} — ${sheet.title}`],
    ['Revision', `${sheet.revision} (saved version ${sheet.version})`],
    ['Status', STATUS_LABELS[sheet.status]],
    ['Author', sheet.authorName ?? '—'],
    ['Reviewer', sheet.reviewerName ?? 'not reviewed yet'],
    [sheet.status === 'approved' ? 'Approved on' : 'Last saved', formatDate(sheet.status === 'approved' ? sheet.approvedAt : sheet.updatedAt)],
    ['Printed', formatDate(generatedAt)],
    ['Units', 'SI throughout'],
  ];
  return (
    <View style={styles.block}>
      {cells.map(([label, value]) => (
        <View key={label} style={styles.blockCell}>
          <Text style={styles.blockLabel}>{label}</Text>
          <Text style={styles.blockValue}>{safe(value)}</Text>
        </View>
      ))}
    </View>
  );
}

function Table({ columns, rows, bold }: { columns: { title: string; width: string; align?: 'right' }[]; rows: string[][]; bold?: (index: number) => boolean }) {
  return (
    <View>
      {/* fixed: the header row repeats on every page the table runs onto. */}
      <View style={[styles.row, styles.head]} wrap={false} fixed>
        {columns.map((c) => (
          <Text key={c.title} style={{ width: c.width, paddingRight: 3, textAlign: c.align ?? 'left' }}>
            {safe(c.title)}
          </Text>
        ))}
      </View>
      {rows.map((cells, i) => (
        <View key={i} style={[styles.row, bold?.(i) ? { fontWeight: 600, backgroundColor: '#f7efe8' } : {}]} wrap={false}>
          {cells.map((cell, j) => (
            <Text key={j} style={{ width: columns[j].width, paddingRight: 3, textAlign: columns[j].align ?? 'left' }}>
              {safe(cell)}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

function FlagItem({ flag, ack }: { flag: AssumptionFlag; ack?: PdfSheet['acknowledgements'][number] }) {
  const look = SEVERITY[flag.severity];
  const ackText =
    flag.severity === 'review'
      ? ack
        ? `Acknowledged by ${ack.reviewerName ?? 'a reviewer'} on ${formatDate(ack.createdAt)}: "${ack.comment}"`
        : 'Not acknowledged yet: a reviewer must accept or reject this assumption before approval.'
      : flag.severity === 'blocker'
        ? 'A blocker cannot be acknowledged away: the sheet must be changed before it can be approved.'
        : 'A note: shown for the record, no acknowledgement needed.';
  return (
    <View style={styles.flag} wrap={false}>
      <Text style={[styles.badge, { color: look.tone.text, backgroundColor: look.tone.light, borderColor: look.tone.fill }]}>{look.word}</Text>
      <View style={{ flex: 1 }}>
        <Text>
          <Text style={{ fontWeight: 600 }}>{safe(`${flag.title ?? flagTitle(flag.code)}. `)}</Text>
          {safe(flag.message)}
        </Text>
        <Text style={{ color: ack ? WITHIN.text : flag.severity === 'review' ? TIGHT.text : MUTED, marginTop: 1 }}>{safe(ackText)}</Text>
      </View>
    </View>
  );
}

function PlotBlock({ plot }: { plot: PackagePlot }) {
  const legend = legendWords(plot);
  return (
    <View wrap={false} style={{ marginTop: 6 }}>
      <Text style={{ fontWeight: 600, fontSize: 9 }}>{safe(`Plot: ${plot.title}`)}</Text>
      <LineChart plot={plot} />
      {legend ? <Text style={styles.muted}>{safe(legend)}</Text> : null}
    </View>
  );
}

/**
 * The plots a reviewer looks at: the heat-balance profile (for a buried cable with the soil to the
 * ground), hot spot against current, and where the sheet has them over time, along the run and
 * across a bus-bar pack. A bar's temperature through its thickness is flat by physics (copper
 * conducts within a fraction of a kelvin), so a bar shows the run or the pack instead when it has
 * them, and says why its profile is flat when it has not.
 */
function ReviewPlots({ sheet }: { sheet: PdfSheet }) {
  const snapshot = sheet.result;
  const chosen = chosenEvaluation(snapshot);
  if (!chosen) return null;
  const optionalPlots = savedOptionalChecks(snapshot, sheet.inputs).flatMap((r) => r.plots ?? []);
  const plots = [...(snapshot?.plots ?? []), ...optionalPlots];
  const barHasMore = chosen.kind === 'bar' && plots.some((p) => p.id === 'along-run' || p.id === 'across-pack');
  const buried = sheet.inputs.installation.kind === 'buried';
  return (
    <View>
      <Text style={styles.h2} minPresenceAhead={120}>{safe(`Plots for review: ${chosen.label}`)}</Text>
      {chosen.profile && !barHasMore ? (
        <View wrap={false}>
          <Text style={{ fontWeight: 600, fontSize: 9 }}>
            {safe(`Plot: heat-balance profile at ${formatNumber(chosen.designCurrentA, 4)} A${chosen.kind === 'cable' ? ', through the conductor and its layers' : ', through the thickness of the bar'}${buried ? ', with the soil to the ground' : ''}`)}
          </Text>
          <ProfileChart
            profile={chosen.profile}
            limitC={chosen.limit.temperatureC}
            limitLabel={chosen.limit.layer ?? chosen.limit.source}
            {...(buried ? { soil: { groundC: chosen.ambientC, externalResistanceKmPerW: chosen.ampacity.closedForm?.externalResistanceKmPerW ?? null } } : {})}
          />
          {chosen.kind === 'bar' ? <Text style={styles.muted}>The temperature through a bar’s thickness is flat: the metal conducts the heat across within a fraction of a kelvin.</Text> : null}
        </View>
      ) : null}
      {plots.map((plot) => (
        <PlotBlock key={`${plot.id}-${plot.title}`} plot={plot} />
      ))}
      {snapshot?.plots === undefined ? <Text style={[styles.muted, { marginTop: 3 }]}>The hot spot against current was not saved with this result (an earlier version saved it); save the sheet again to include it.</Text> : null}
    </View>
  );
}

export function SizingSheetDocument({ sheet, generatedAt = new Date() }: { sheet: PdfSheet; generatedAt?: Date }) {
  const approved = sheet.status === 'approved';
  const snapshot = sheet.result;
  const chosen = chosenEvaluation(snapshot);
  const records = candidateRecords(sheet.inputs.candidates, snapshot, 'No saved result', sheet.inputs.installation.otherCircuits.map((o) => o.label));
  const flags = snapshot?.chosenFlags ?? [];
  const ackByCode = new Map(sheet.acknowledgements.map((a) => [a.flagCode, a]));
  const tone = toneOf(chosen);
  const inputs = inputRows(sheet.inputs, sheet.teamCurrency);
  const n = (v: number | null, d = 4) => (v === null ? '—' : formatNumber(v, d));
  const otherLabels = sheet.inputs.installation.otherCircuits.map((o) => o.label);
  const reEvaluation = reEvaluationOf(sheet.inputs, snapshot);
  const arrangement = arrangementSentences(sheet.inputs);
  const group = chosen?.group ?? null;
  const governing = group ? governingCableOf(group, otherLabels) : null;
  return (
    <Document
      title={`Sizing sheet ${sheet.circuitTag} rev ${sheet.revision}`}
      author="Ampwarden"
      subject={`${sheet.projectName} — ${sheet.title}`}
      creator="Ampwarden"
      producer="Ampwarden"
    >
      <Page size="A4" style={styles.page}>
        {!approved ? <Text style={styles.watermark} fixed>{NOT_APPROVED_MARK}</Text> : null}
        <View style={styles.footer} fixed>
          <Text>{safe(`Caution: ${CAUTION_TEXT.join(' ')}`)}</Text>
          <View style={styles.footerRow}>
            <Text>{safe(`${sheet.calculationPackage ? `${sheet.calculationPackage.documentNumber} · ` : ''}${sheet.circuitTag} rev ${sheet.revision} · ${approved ? 'Approved' : NOT_APPROVED_MARK}`)}</Text>
            <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
          </View>
        </View>
        <View style={styles.header} fixed>
          <View style={styles.headerLine}>
            <Text>{safe(`Calculation package${sheet.calculationPackage ? ` ${sheet.calculationPackage.documentNumber}` : ''} · ${sheet.circuitTag} · revision ${sheet.revision}`)}</Text>
            <Text>{safe(`${sheet.projectName} · ${STATUS_LABELS[sheet.status]}`)}</Text>
          </View>
          {!approved ? <Text style={styles.draftBand}>{safe(notApprovedLine(sheet.status))}</Text> : null}
        </View>

        <Text style={styles.brand}>AMPWARDEN · SIZING SHEET · CALCULATION PACKAGE</Text>
        <Text style={styles.title}>{safe(`${sheet.circuitTag} — ${sheet.title}`)}</Text>
        <Text style={styles.subtitle}>{safe(sheet.projectName)}</Text>
        <Text style={{ fontSize: 7.5, color: MUTED, marginBottom: 4 }}>{safe(DOCUMENT_UNITS_LINE)}</Text>
        <TitleBlock sheet={sheet} generatedAt={generatedAt} />
        <View style={styles.caution}>
          <Text>{safe(`Caution. ${CAUTION_TEXT.join(' ')}`)}</Text>
        </View>
        {reEvaluation ? (
          <View style={[styles.caution, { borderWidth: 1.5 }]} wrap={false}>
            <Text style={{ fontWeight: 600, fontSize: 9.5, color: TIGHT.text }}>{safe(RE_EVALUATION_HEADING)}</Text>
            <Text style={{ marginTop: 2 }}>{safe(reEvaluationSentence(reEvaluation))}</Text>
            <Text style={{ marginTop: 2, fontWeight: 600 }}>{safe(reEvaluationFiguresLine(reEvaluation))}</Text>
          </View>
        ) : null}

        <RevisionTable sheet={sheet} />

        <Text style={styles.h2} minPresenceAhead={80}>Result of the chosen candidate</Text>
        {chosen ? (
          <View>
            <View style={[styles.summary, { borderColor: tone.fill, backgroundColor: tone.light }]} wrap={false}>
              {[
                ['Chosen', `${chosen.label}`],
                ['Section per phase', `${formatNumber(chosen.sectionPerPhaseMm2, 4)} mm²`],
                ['Hot spot', chosen.hotSpotC === null ? 'runaway' : `${formatNumber(chosen.hotSpotC, 4)} °C`],
                ['Limit', `${formatNumber(chosen.limit.temperatureC, 4)} °C`],
                ['Ampacity', `${formatNumber(chosen.ampacityA, 4)} A`],
              ].map(([label, value]) => (
                <View key={label} style={{ maxWidth: label === 'Chosen' ? 170 : 100 }}>
                  <Text style={styles.figureLabel}>{label}</Text>
                  <Text style={[styles.figureValue, { color: label === 'Chosen' ? INK : tone.text, fontSize: label === 'Chosen' ? 9.5 : 12 }]}>{safe(value)}</Text>
                </View>
              ))}
            </View>
            <View style={{ marginTop: 4 }}>
              <Table
                columns={[
                  { title: 'Quantity', width: '34%' },
                  { title: 'Value', width: '66%' },
                ]}
                rows={chosenResultRows(chosen, sheet.inputs.circuit.lengthM, otherLabels, sheet.teamCurrency).map((r) => [r.label, r.value])}
              />
            </View>
          </View>
        ) : (
          <Text style={{ color: OVER.text }}>
            {safe(
              snapshot?.error
                ? `The circuit could not be computed: ${snapshot.error.message}`
                : snapshot?.chosenCandidateId
                  ? 'The chosen candidate could not be evaluated (see the candidates table).'
                  : 'No candidate has been chosen on this sheet yet.',
            )}
          </Text>
        )}

        {arrangement.length > 0 ? (
          <View>
            <Text style={styles.h2} minPresenceAhead={80}>Cross-section rated</Text>
            {arrangement.map((line) => (
              <Text key={line} style={{ marginTop: 1 }}>
                {safe(line)}
              </Text>
            ))}
            {group && chosen ? (
              <View style={{ marginTop: 4 }}>
                <View style={{ flexDirection: 'row', gap: 8 }} wrap={false}>
                  <CrossSectionChart input={drawingInputOf(group)} widthPt={250} heightPt={170} />
                  <View style={{ flex: 1 }}>
                    <Text style={{ fontWeight: 600 }}>{safe(governing ? `${chosen.label}: ${governingText(governing)}` : `${chosen.label}: no cable governs (no steady state at the design current)`)}</Text>
                    <Text style={[styles.muted, { marginTop: 2 }]}>{safe(`Rated ${groupMethodWords(group)}. ${group.method}.`)}</Text>
                    <Text style={[styles.muted, { marginTop: 2 }]}>Dark: the circuit rated; red and ringed: the cable that governs; grey: other circuits; dashed: ducts.</Text>
                  </View>
                </View>
                <View style={{ marginTop: 4 }}>
                  <Table
                    columns={[
                      { title: `Cable at ${formatNumber(chosen.designCurrentA, 4)} A`, width: '40%' },
                      { title: 'Role', width: '21%' },
                      { title: 'Conductor (°C)', width: '13%', align: 'right' },
                      { title: 'Surface (°C)', width: '13%', align: 'right' },
                      { title: 'Heat (W/m)', width: '13%', align: 'right' },
                    ]}
                    rows={groupCableRows(group, otherLabels).map((r) => [`${r.governs ? '[governs] ' : ''}${r.cable}`, r.role, n(r.conductorC), n(r.surfaceC), n(r.heatWPerM, 3)])}
                    bold={(i) => i === group.governingCable}
                  />
                </View>
              </View>
            ) : chosen && chosen.kind === 'cable' ? (
              <Text style={[styles.muted, { marginTop: 2 }]}>The saved result of the chosen candidate has no cross-section: it was computed by an earlier method that rated each cable alone.</Text>
            ) : null}
          </View>
        ) : null}

        <BusbarSystemSection inputs={sheet.inputs} chosen={chosen} />
        <ProtectionSection inputs={sheet.inputs} chosen={chosen} />
        <CrossSectionFieldSection outcome={snapshot?.crossSection} otherLabels={otherLabels} />

        <Text style={styles.h2} minPresenceAhead={60}>{safe(`Assumption flags of the chosen candidate (${flags.length})`)}</Text>
        {flags.length === 0 ? <Text style={styles.muted}>No assumption flags were raised for the chosen candidate.</Text> : flags.map((f) => <FlagItem key={f.code} flag={f} ack={ackByCode.get(f.code)} />)}

        <ReviewPlots sheet={sheet} />

        <Text style={styles.h2} minPresenceAhead={60}>{safe(`Candidates compared (${records.length})`)}</Text>
        {records.length === 0 ? (
          <Text style={styles.muted}>No candidates on this sheet.</Text>
        ) : (
          <Table
            columns={[
              { title: 'Candidate', width: '18%' },
              { title: 'Section/phase (mm²)', width: '8%', align: 'right' },
              { title: 'Hot spot (°C)', width: '7%', align: 'right' },
              { title: 'Limit (°C)', width: '6%', align: 'right' },
              { title: 'Margin (%)', width: '6%', align: 'right' },
              { title: 'Ampacity (A)', width: '7%', align: 'right' },
              { title: 'Loss (W/m)', width: '6%', align: 'right' },
              { title: 'Voltage drop (%)', width: '7%', align: 'right' },
              { title: 'Short circuit', width: '7%' },
              { title: 'Governing cable', width: '14%' },
              { title: 'Result', width: '14%' },
            ]}
            rows={records.map((r) => [
              `${r.chosen ? '[chosen] ' : ''}${r.label}`,
              n(r.sectionPerPhaseMm2),
              n(r.hotSpotC),
              n(r.limitC),
              n(r.marginPercent, 3),
              n(r.ampacityA),
              n(r.lossWPerM, 3),
              n(r.voltageDropPercent, 3),
              r.shortCircuit || '—',
              r.governingCable === null ? '—' : `${r.governingCable}${r.governingCableC === null ? '' : `, ${n(r.governingCableC)} °C`}`,
              r.evaluated ? `${r.state}${r.marks.length ? ` · ${r.marks.join(', ')}` : ''}` : `${r.state}${r.error ? `: ${r.error}` : ''}`,
            ])}
            bold={(i) => records[i].chosen}
          />
        )}

        <Text style={styles.h2} minPresenceAhead={80}>Inputs (SI units)</Text>
        <Table
          columns={[
            { title: 'Group', width: '18%' },
            { title: 'Input', width: '40%' },
            { title: 'Value', width: '30%', align: 'right' },
            { title: 'Unit', width: '12%' },
          ]}
          rows={inputs.map((r) => [r.section, r.label, r.value, r.unit])}
        />
        {sheet.inputs.notes.trim() ? <Text style={{ marginTop: 4 }}>{safe(`Designer's notes: ${sheet.inputs.notes.trim()}`)}</Text> : null}
        {inputWarnings(sheet.inputs).map((w) => (
          <Text key={w.field} style={{ marginTop: 3, color: TIGHT.text }}>{safe(`Input warning — ${w.message}`)}</Text>
        ))}

        <OptionalChecksSection inputs={sheet.inputs} snapshot={snapshot} />

        <Text style={styles.h2} minPresenceAhead={60}>Method and standards</Text>
        {METHOD_LINES.map((line) => (
          <Text key={line} style={{ marginTop: 2 }}>
            {safe(`· ${line}`)}
          </Text>
        ))}
        <Text style={[styles.muted, { marginTop: 3 }]}>
          {safe(`Computed by ${sheet.solverVersion ?? snapshot?.solverVersion ?? 'unknown solver'}${snapshot ? ` on ${formatDate(snapshot.computedAt)}` : ''}, on the server from the saved inputs.`)}
        </Text>

        <Text style={styles.h2} minPresenceAhead={40}>Cautions</Text>
        {CAUTION_TEXT.map((line) => (
          <Text key={line} style={{ marginTop: 2 }}>
            {safe(line)}
          </Text>
        ))}
        <Text style={{ marginTop: 2 }}>Every result above rests on the assumption flags listed with it; a flag is never hidden or dropped from this document.</Text>

        <CalculationPackageSection sheet={sheet} />

      </Page>
    </Document>
  );
}

/**
 * The verification report as a PDF document (@react-pdf/renderer), for a reviewer's file. Server
 * only: it reads the font files from fonts/ (IBM Plex, SIL Open Font License).
 */
import path from 'node:path';
import { Document, Font, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import { CAUTION_TEXT } from '@/lib/caution';
import {
  describeTolerance,
  formatNumber,
  METHOD_AREA_LABELS,
  METHOD_AREAS,
  sourceBasis,
  summarise,
  type CaseResult,
  type QuantityResult,
} from '@/lib/verification';
import { pdfSafeText } from './pdfText';

const FONT_DIR = path.join(process.cwd(), 'fonts');
let fontsRegistered = false;

/** Registers the fonts once per server process (Font.register keeps a global store). */
export function registerReportFonts(): void {
  if (fontsRegistered) return;
  const file = (name: string) => path.join(FONT_DIR, name);
  Font.register({
    family: 'Plex Sans',
    fonts: [
      { src: file('ibm-plex-sans-latin-400-normal.woff'), fontWeight: 400 },
      { src: file('ibm-plex-sans-latin-400-italic.woff'), fontWeight: 400, fontStyle: 'italic' },
      { src: file('ibm-plex-sans-latin-600-normal.woff'), fontWeight: 600 },
    ],
  });
  // Greek symbols of the formulae (θ, ρ, σ, Δ…) come from the Greek subset, as a fallback.
  Font.register({
    family: 'Plex Sans Greek',
    fonts: [
      { src: file('ibm-plex-sans-greek-400-normal.woff'), fontWeight: 400 },
      { src: file('ibm-plex-sans-greek-400-normal.woff'), fontWeight: 400, fontStyle: 'italic' },
      { src: file('ibm-plex-sans-greek-600-normal.woff'), fontWeight: 600 },
    ],
  });
  // Not IBM Plex Mono: fontkit cannot read the empty space glyph of its woff files ("Offset is
  // outside the bounds of the DataView"), so numbers are set in Plex Sans here.
  // Words of a citation stay whole; react-pdf would otherwise hyphenate them by its own rules.
  Font.registerHyphenationCallback((word) => [word]);
  fontsRegistered = true;
}

/** Every font file the document embeds (for the glyph-coverage test). */
export const REPORT_FONT_FILES = ['ibm-plex-sans-latin-400-normal.woff', 'ibm-plex-sans-greek-400-normal.woff'] as const;

const INK = '#233040';
const MUTED = '#4f6278';
const RULE = '#c3ccd7';
const PASS = { text: '#0f544e', fill: '#17776f', light: '#d7efec' };
const FAIL = { text: '#7d2d1d', fill: '#a8402b', light: '#f6dcd5' };

const styles = StyleSheet.create({
  page: { paddingTop: 36, paddingBottom: 44, paddingHorizontal: 36, fontFamily: ['Plex Sans', 'Plex Sans Greek'], fontSize: 8.5, color: INK },
  title: { fontSize: 16, fontWeight: 600 },
  subtitle: { fontSize: 9, color: MUTED, marginTop: 2 },
  summary: { marginTop: 10, flexDirection: 'row', alignItems: 'center', gap: 6, padding: 6, borderRadius: 3 },
  summaryText: { fontSize: 11, fontWeight: 600 },
  caution: { marginTop: 8, padding: 6, borderWidth: 1, borderColor: '#a06b08', backgroundColor: '#f6e8c8', fontSize: 8 },
  area: { marginTop: 14, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: RULE, paddingBottom: 2 },
  case: { marginTop: 8 },
  caseTitle: { fontSize: 9.5, fontWeight: 600 },
  meta: { color: MUTED, marginTop: 1 },
  notes: { color: MUTED, marginTop: 2, fontStyle: 'italic' },
  table: { marginTop: 3, borderTopWidth: 0.5, borderTopColor: RULE },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 2 },
  head: { color: MUTED, fontWeight: 600 },
  cQuantity: { width: '30%', paddingRight: 4 },
  cNumber: { width: '14%', paddingRight: 4, fontSize: 8 },
  cTolerance: { width: '13%', paddingRight: 4, fontSize: 8 },
  cResult: { width: '15%', flexDirection: 'row', alignItems: 'center', gap: 3 },
  mark: { width: 6, height: 6, borderRadius: 3 },
  footer: { position: 'absolute', bottom: 18, left: 36, right: 36, flexDirection: 'row', justifyContent: 'space-between', color: MUTED, fontSize: 7.5 },
});

function ResultMark({ pass }: { pass: boolean }) {
  const tone = pass ? PASS : FAIL;
  return (
    <View style={styles.cResult}>
      <View style={[styles.mark, { backgroundColor: tone.fill }]} />
      <Text style={{ color: tone.text, fontWeight: 600 }}>{pass ? 'pass' : 'FAIL'}</Text>
    </View>
  );
}

function QuantityRow({ q }: { q: QuantityResult }) {
  const unit = q.unit ? ` ${q.unit}` : '';
  return (
    <View style={styles.row} wrap={false}>
      <Text style={styles.cQuantity}>{pdfSafeText(q.label)}</Text>
      <Text style={styles.cNumber}>{pdfSafeText(`${formatNumber(q.reference)}${unit}`)}</Text>
      <Text style={styles.cNumber}>{pdfSafeText(`${formatNumber(q.value)}${unit}`)}</Text>
      <Text style={styles.cNumber}>{pdfSafeText(formatNumber(q.deviation, 3))}</Text>
      <Text style={styles.cTolerance}>{pdfSafeText(describeTolerance(q.tolerance, q.unit))}</Text>
      <ResultMark pass={q.pass} />
    </View>
  );
}

function CaseBlock({ result }: { result: CaseResult }) {
  const basis = sourceBasis(result.source);
  const inputs = result.inputs.map((i) => `${i.name} = ${typeof i.value === 'number' ? formatNumber(i.value) : i.value}${i.unit ? ` ${i.unit}` : ''}`).join('; ');
  return (
    <View style={styles.case}>
      <View wrap={false}>
        <Text style={styles.caseTitle}>{pdfSafeText(result.title)}</Text>
        <Text style={styles.meta}>{pdfSafeText(`Case ${result.id} · Source (${basis}): ${result.source.citation}`)}</Text>
        <Text style={styles.meta}>{pdfSafeText(`Inputs: ${inputs}`)}</Text>
      </View>
      {result.notes ? <Text style={styles.notes}>{pdfSafeText(result.notes)}</Text> : null}
      {result.error ? <Text style={{ color: FAIL.text, marginTop: 2 }}>{pdfSafeText(`Could not compute: ${result.error}`)}</Text> : null}
      <View style={styles.table}>
        <View style={[styles.row, styles.head]} wrap={false}>
          <Text style={styles.cQuantity}>Quantity</Text>
          <Text style={styles.cNumber}>Reference</Text>
          <Text style={styles.cNumber}>Ampwarden</Text>
          <Text style={styles.cNumber}>Deviation</Text>
          <Text style={styles.cTolerance}>Tolerance</Text>
          <Text style={styles.cResult}>Result</Text>
        </View>
        {result.quantities.map((q) => (
          <QuantityRow key={q.key} q={q} />
        ))}
      </View>
      {result.convergence ? (
        <Text style={[styles.meta, { marginTop: 2 }]}>
          {pdfSafeText(
            `Grid convergence: cells ${result.convergence.cells.join(', ')}; largest nodal error ${result.convergence.maxErrors.map((e) => formatNumber(e, 3)).join(', ')} K; ` +
              `measured order ${result.convergence.measuredOrder.toFixed(3)} (least squares over the finest ${result.convergence.fitPoints} meshes).`,
          )}
        </Text>
      ) : null}
    </View>
  );
}

export function VerificationReportDocument({ results, generatedAt }: { results: CaseResult[]; generatedAt: string }) {
  const summary = summarise(results);
  const allPass = summary.failed === 0;
  const tone = allPass ? PASS : FAIL;
  return (
    <Document title="Ampwarden verification report" author="Ampwarden" subject="Reference checks of the heat-balance solver and the electrical methods">
      <Page size="A4" orientation="landscape" style={styles.page}>
        <Text style={styles.title}>Ampwarden · Verification report</Text>
        <Text style={styles.subtitle}>
          {`Generated ${generatedAt}, computed on the server with the same registry of cases the verification page runs in the browser and the test suite runs in CI.`}
        </Text>
        <View style={[styles.summary, { backgroundColor: tone.light }]}>
          <View style={[styles.mark, { backgroundColor: tone.fill, width: 9, height: 9, borderRadius: 5 }]} />
          <Text style={[styles.summaryText, { color: tone.text }]}>
            {`${allPass ? 'All checks pass' : 'Some checks FAIL'}: ${summary.passed} of ${summary.cases} cases pass (${summary.quantities} compared quantities).`}
          </Text>
        </View>
        <View style={styles.caution}>
          <Text>{pdfSafeText(`Caution. ${CAUTION_TEXT.join(' ')}`)}</Text>
          <Text style={{ marginTop: 2 }}>
            {pdfSafeText('"From memory" marks a reference value that was recalled rather than read from the document at hand: a reviewer should confirm it against the standard.')}
          </Text>
        </View>
        {METHOD_AREAS.map((area) => {
          const inArea = results.filter((r) => r.area === area);
          if (inArea.length === 0) return null;
          return (
            <View key={area}>
              <Text style={styles.area} minPresenceAhead={60}>
                {pdfSafeText(METHOD_AREA_LABELS[area])}
              </Text>
              {inArea.map((r) => (
                <CaseBlock key={r.id} result={r} />
              ))}
            </View>
          );
        })}
        <View style={styles.footer} fixed>
          <Text>Ampwarden verification report · an engineering aid, to be checked by a licensed engineer</Text>
          <Text render={({ pageNumber, totalPages }) => `page ${pageNumber} of ${totalPages}`} />
        </View>
      </Page>
    </Document>
  );
}

/**
 * The parts that make the PDF a calculation package a licensed engineer can sign (issue 22): the
 * revision table (what changed, who edited, submitted and reviewed each revision), the approval
 * statement with the approver's licence or registration and jurisdiction, and the signature and
 * stamp area. Words from lib/sheet/packageWords.ts.
 */
import { Text, View } from '@react-pdf/renderer';
import { approvalStatement, REVISION_COLUMNS, revisionRow } from '@/lib/sheet/packageWords';
import { pdfSafeText as safe } from './fonts';
import type { PdfSheet } from './SizingSheetDocument';

const MUTED = '#4f6278';
const RULE = '#c3ccd7';
const h2 = { marginTop: 12, marginBottom: 3, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: RULE, paddingBottom: 2 } as const;
const row = { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 1.6 } as const;
const WIDTHS = ['6%', '10%', '26%', '16%', '14%', '13%', '15%'];

export function RevisionTable({ sheet }: { sheet: PdfSheet }) {
  const revisions = sheet.calculationPackage?.revisions ?? [];
  return (
    <View>
      <Text style={h2} minPresenceAhead={60}>Revisions</Text>
      {revisions.length === 0 ? (
        <Text style={{ color: MUTED }}>{safe(`Revision ${sheet.revision}; the revision history was not read for this rendering.`)}</Text>
      ) : (
        <View>
          <View style={[row, { color: MUTED, fontWeight: 600, fontSize: 7.4 }]} wrap={false} fixed>
            {REVISION_COLUMNS.map((title, j) => (
              <Text key={title} style={{ width: WIDTHS[j], paddingRight: 3 }}>
                {title}
              </Text>
            ))}
          </View>
          {revisions.map((r) => (
            <View key={r.revision} style={[row, r.revision === sheet.revision ? { fontWeight: 600, backgroundColor: '#f7efe8' } : {}]} wrap={false}>
              {revisionRow(r).map((cell, j) => (
                <Text key={j} style={{ width: WIDTHS[j], paddingRight: 3 }}>
                  {safe(cell)}
                </Text>
              ))}
            </View>
          ))}
        </View>
      )}
    </View>
  );
}

function Box({ label, height, width }: { label: string; height: number; width: string }) {
  return (
    <View style={{ width, height, borderWidth: 0.8, borderColor: '#233040', padding: 4 }}>
      <Text style={{ fontSize: 7, color: MUTED }}>{label}</Text>
    </View>
  );
}

export function CalculationPackageSection({ sheet }: { sheet: PdfSheet }) {
  const words = approvalStatement(sheet, sheet.calculationPackage);
  const approver = sheet.calculationPackage?.approver ?? null;
  return (
    <View wrap={false}>
      <Text style={h2}>{words.heading}</Text>
      <Text>{safe(words.statement)}</Text>
      {words.approverLine ? <Text style={{ marginTop: 3, fontWeight: 600 }}>{safe(words.approverLine)}</Text> : null}
      <View style={{ marginTop: 6, flexDirection: 'row', gap: 8 }}>
        <View style={{ width: '58%', gap: 6 }}>
          <View style={{ flexDirection: 'row', gap: 6 }}>
            <Box label={`Reviewer's name: ${approver?.name ?? ''}`} height={30} width="100%" />
          </View>
          <View style={{ flexDirection: 'row', gap: 6 }}>
            <Box label={safe(`Licence or registration number: ${approver?.licenceNumber ?? ''}`)} height={30} width="50%" />
            <Box label={safe(`Jurisdiction: ${approver?.licenceJurisdiction ?? ''}`)} height={30} width="50%" />
          </View>
          <View style={{ flexDirection: 'row', gap: 6 }}>
            <Box label="Signature" height={46} width="65%" />
            <Box label="Date" height={46} width="35%" />
          </View>
        </View>
        <Box label="Professional stamp or seal" height={124} width="42%" />
      </View>
      {sheet.status !== 'approved' ? <Text style={{ marginTop: 3, color: '#7d2d1d', fontWeight: 600 }}>Do not sign: this revision is not approved.</Text> : null}
    </View>
  );
}

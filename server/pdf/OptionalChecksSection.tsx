/**
 * The PDF's short sections for the optional checks of the chosen candidate (over time, along the
 * run, inside the enclosure — physics.md §6) as the saved snapshot holds them (the wording of
 * lib/sheet/optionalChecksReport.ts, which the share link prints too), each with its own flags.
 */
import { flagLine } from '@/lib/sheet/flagWords';
import { Text, View } from '@react-pdf/renderer';
import type { SheetInputs } from '@/lib/sheet/schema';
import { savedOptionalChecks, type ResultSnapshot } from '@/lib/sheet/snapshot';
import { pdfSafeText as safe } from './fonts';

const h2 = { marginTop: 12, marginBottom: 3, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: '#c3ccd7', paddingBottom: 2 } as const;

export function OptionalChecksSection({ inputs, snapshot }: { inputs: SheetInputs; snapshot: ResultSnapshot | null }) {
  const reports = savedOptionalChecks(snapshot, inputs);
  if (reports.length === 0) return null;
  return (
    <View>
      {reports.map((report) => (
        <View key={report.heading}>
          <Text style={h2} minPresenceAhead={60}>
            {report.heading}
          </Text>
          {report.lines.map((line, i) => (
            <Text key={i}>{safe(line)}</Text>
          ))}
          {report.notComputed !== undefined ? (
            <Text>{safe(`Not computed: ${report.notComputed}`)}</Text>
          ) : (
            <View>
              <Text style={{ marginTop: 2, color: '#5b6b7d' }}>{safe(report.method)}</Text>
              {report.flags.map((f) => (
                <Text key={f.code} style={{ marginTop: 1 }}>
                  {safe(`Flag: ${flagLine(f)}`)}
                </Text>
              ))}
            </View>
          )}
        </View>
      ))}
    </View>
  );
}

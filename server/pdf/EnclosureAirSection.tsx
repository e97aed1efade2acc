/**
 * The PDF's short section for the optional check "Inside the enclosure" of the chosen candidate
 * (physics.md §6), computed from the saved inputs with the same library as the screen, with its
 * flags and the method named.
 */
import { Text, View } from '@react-pdf/renderer';
import { computeEnclosureAir } from '@/lib/sheet/enclosureAir';
import type { SheetInputs } from '@/lib/sheet/schema';
import { formatNumber } from '@/lib/units';
import { pdfSafeText as safe } from './fonts';

const h2 = { marginTop: 12, marginBottom: 3, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: '#c3ccd7', paddingBottom: 2 } as const;
const c = (v: number) => `${formatNumber(v, 4)} °C`;
const SIDES = ['none', 'one', 'both'] as const;

export function EnclosureAirSection({ inputs }: { inputs: SheetInputs }) {
  if (!inputs.enclosureAir.checked || inputs.chosenCandidateId === null) return null;
  const outcome = computeEnclosureAir(inputs, inputs.chosenCandidateId);
  if (!outcome) return null;
  const e = inputs.enclosureAir;
  return (
    <View>
      <Text style={h2} minPresenceAhead={60}>Inside the enclosure (chosen candidate)</Text>
      <Text>
        {safe(
          `Closed enclosure ${formatNumber(e.heightM, 4)} × ${formatNumber(e.widthM, 4)} × ${formatNumber(e.depthM, 4)} m (H × W × D), ${e.wall.replace('-', ' ')} walls, back ${e.backCovered ? 'against a wall' : 'free'}, sides covered: ${SIDES[e.sidesCovered]}, roof ${e.topCovered ? 'covered' : 'free'}; air around it ${c(e.outsideAirC)}; ${formatNumber(e.routeLengthInsideM, 4)} m of the route inside.`,
        )}
      </Text>
      {outcome.ok ? (
        <View>
          <Text>
            {safe(
              `Losses inside ${formatNumber(outcome.result.totalLossesW, 4)} W (circuit ${formatNumber(outcome.result.conductorLossesW, 4)} W, other equipment ${formatNumber(outcome.result.otherLossesW, 4)} W) over A_e = ${formatNumber(outcome.result.effectiveAreaM2, 4)} m²: mean air inside ${c(outcome.result.insideAirC)} (sheet ambient ${c(outcome.result.sheetAmbientC)}). Hot spot in that air ${outcome.result.hotSpotC === null ? 'none (no steady state)' : c(outcome.result.hotSpotC)} against ${c(outcome.result.limitC)} — ${outcome.result.passes ? 'passes' : 'FAILS'}.`,
            )}
          </Text>
          <Text style={{ marginTop: 2, color: '#5b6b7d' }}>{safe(`Method: ${outcome.result.method}; air and conductor solved together.`)}</Text>
          {outcome.result.flags.map((f) => (
            <Text key={f.code} style={{ marginTop: 1 }}>
              {safe(`Flag ${f.code} (${f.severity}): ${f.message}`)}
            </Text>
          ))}
        </View>
      ) : (
        <Text>{safe(`Not computed: ${outcome.message}`)}</Text>
      )}
    </View>
  );
}

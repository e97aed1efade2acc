/**
 * The PDF's short sections for the optional checks "Over time" and "Along the run" of the chosen
 * candidate (physics.md §6), computed from the saved inputs with the same library as the screen,
 * each with its own flags.
 */
import { Text, View } from '@react-pdf/renderer';
import { computeBeyondSteady } from '@/lib/sheet/beyondSteady';
import type { SheetInputs } from '@/lib/sheet/schema';
import { formatNumber } from '@/lib/units';
import type { AssumptionFlag } from '@/lib/electrical/sizing/flags';
import { pdfSafeText as safe } from './fonts';

const h2 = { marginTop: 12, marginBottom: 3, fontSize: 11, fontWeight: 600, borderBottomWidth: 1, borderBottomColor: '#c3ccd7', paddingBottom: 2 } as const;

function Flags({ flags }: { flags: AssumptionFlag[] }) {
  return (
    <View>
      {flags.map((f) => (
        <Text key={f.code} style={{ marginTop: 1 }}>
          {safe(`Flag ${f.code} (${f.severity}): ${f.message}`)}
        </Text>
      ))}
    </View>
  );
}

const c = (v: number) => `${formatNumber(v, 4)} °C`;

export function BeyondSteadySection({ inputs }: { inputs: SheetInputs }) {
  if ((!inputs.overTime.checked && !inputs.alongRun.checked) || inputs.chosenCandidateId === null) return null;
  const results = computeBeyondSteady(inputs, inputs.chosenCandidateId);
  if (!results) return null;
  const t = results.overTime;
  const a = results.alongRun;
  return (
    <View>
      {t ? (
        <View>
          <Text style={h2} minPresenceAhead={60}>Over time (chosen candidate)</Text>
          {t.ok ? (
            <View>
              {t.result.overload ? (
                <Text>
                  {safe(
                    `Overload ${formatNumber(t.result.overload.currentA, 4)} A for ${formatNumber(t.result.overload.durationS / 60, 3)} min from the steady state at the design current: ${
                      t.result.overload.timeToLimitS !== null
                        ? `the hot spot reaches the ${c(t.result.limitC)} limit after ${formatNumber(t.result.overload.timeToLimitS / 60, 3)} min`
                        : t.result.overload.outcome === 'steady-below-limit'
                          ? `it never reaches the ${c(t.result.limitC)} limit`
                          : `the limit is not reached within ${formatNumber((2 * t.result.overload.durationS) / 60, 3)} min`
                    } — ${t.result.overload.passes ? 'passes' : 'FAILS'}.`,
                  )}
                </Text>
              ) : null}
              {t.result.daily ? (
                <Text>
                  {safe(
                    `Daily load (${inputs.overTime.dailyProfileA.length} intervals) repeated ${t.result.daily.days} days${t.result.daily.periodic ? ' to a periodic state' : ' (not settled)'}: peak ${c(t.result.daily.peakC)} at ${formatNumber(t.result.daily.peakTimeS / 3600, 3)} h — ${t.result.daily.passes ? 'passes' : 'FAILS'}.`,
                  )}
                </Text>
              ) : null}
              {t.result.fault ? (
                <Text>
                  {safe(
                    `Fault with heat into the coverings: ${c(t.result.fault.finalC)} at the end, against ${t.result.fault.iecAdiabaticC === null ? '—' : c(t.result.fault.iecAdiabaticC)} by the IEC 60949 adiabatic method (which governs the verdict).`,
                  )}
                </Text>
              ) : null}
              <Text style={{ marginTop: 2, color: '#5b6b7d' }}>Implicit-Euler heat balance on the same finite-volume model as the steady result (physics.md §6).</Text>
              <Flags flags={t.result.flags} />
            </View>
          ) : (
            <Text>{safe(`Not computed: ${t.message}`)}</Text>
          )}
        </View>
      ) : null}
      {a ? (
        <View>
          <Text style={h2} minPresenceAhead={60}>Along the run (chosen candidate)</Text>
          {a.ok ? (
            <View>
              <Text>
                {safe(
                  `Run of ${formatNumber(inputs.alongRun.lengthM, 4)} m: hot spot ${c(a.result.hotSpot.temperatureC)} at ${formatNumber(a.result.hotSpot.positionM, 3)} m against ${c(a.result.limitC)} — ${a.result.passes ? 'passes' : 'FAILS'}. Heat into the start terminal ${formatNumber(a.result.heatIntoStartW, 3)} W, into the end ${formatNumber(a.result.heatIntoEndW, 3)} W.`,
                )}
              </Text>
              {a.result.joints.map((j, i) => (
                <Text key={i}>{safe(`Joint ${i + 1} at ${formatNumber(j.positionM, 3)} m: ${formatNumber(j.resistanceMicroOhm, 3)} µΩ${j.assumed ? ' (assumed)' : ''}, ${formatNumber(j.heatW, 3)} W, ${c(j.temperatureC)}.`)}</Text>
              ))}
              <Text style={{ marginTop: 2, color: '#5b6b7d' }}>Conduction along the bar, sideways loss from the surface correlations at the local temperature, joints as point heat I²R (physics.md §6).</Text>
              <Flags flags={a.result.flags} />
            </View>
          ) : (
            <Text>{safe(`Not computed: ${a.message}`)}</Text>
          )}
        </View>
      ) : null}
    </View>
  );
}

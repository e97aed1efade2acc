'use client';
/**
 * "Over time" and "Along the run": the sheet's optional checks beyond the steady state
 * (physics.md §6) for the candidate in focus — their inputs (part of the sheet inputs), a button
 * that runs them (they take a second or two, so they do not run on every keystroke), the
 * results with their own flags, and the plots.
 */
import { useState } from 'react';
import type { UseFormReturnType } from '@mantine/form';
import { Plot, PLOT_CONFIG, PLOT_LAYOUT_BASE } from '@/components/plots/Plot';
import { useDecimalSeparator } from '@/components/providers/NumberFormatProvider';
import { computeBeyondSteady, readDailyProfileText, type BeyondSteadyResults } from '@/lib/sheet/beyondSteady';
import type { SheetInputs } from '@/lib/sheet/schema';
import { convertFromSi, formatNumber, unitLabel, type UnitSystem } from '@/lib/units';
import { CheckFlagList } from './checkParts';
import { NumberField } from './NumberField';

const LIMIT_COLOUR = '#a8402b';

export function BeyondSteadyPanel({ form, editable, candidateId, units }: { form: UseFormReturnType<SheetInputs>; editable: boolean; candidateId: string | null; units: UnitSystem }) {
  const values = form.values;
  const separator = useDecimalSeparator();
  const [results, setResults] = useState<BeyondSteadyResults | null>(null);
  const [running, setRunning] = useState(false);
  const [profileError, setProfileError] = useState<string | null>(null);
  const t = values.overTime;
  const a = values.alongRun;
  const tUnit = unitLabel('temperature', units);
  const toT = (c: number) => convertFromSi(c, 'temperature', units);
  const lUnit = unitLabel('lengthM', units);
  const focusedIsBar = values.candidates.find((c) => c.id === candidateId)?.kind === 'bar';
  const toL = (m: number) => convertFromSi(m, 'lengthM', units);
  const fmtT = (c: number) => `${formatNumber(toT(c), 4)} ${tUnit}`;
  const errorOf = (path: string) => form.errors[path] as string | undefined;

  const run = () => {
    if (!candidateId) return;
    setRunning(true);
    // Let the button show "Computing…" before the synchronous work starts.
    setTimeout(() => {
      try {
        setResults(computeBeyondSteady(form.getValues(), candidateId));
      } finally {
        setRunning(false);
      }
    }, 20);
  };

  const readProfile = (text: string) => {
    const read = readDailyProfileText(text, separator);
    if ('error' in read) {
      setProfileError(read.error);
      return;
    }
    setProfileError(null);
    form.setFieldValue('overTime.dailyProfileA', read.currentsA);
  };

  const overTime = results?.overTime;
  const alongRun = results?.alongRun;
  return (
    <section aria-labelledby="beyond-heading" className="panel p-3" data-testid="beyond-steady">
      <h2 id="beyond-heading" className="text-body font-semibold">
        Over time and along the run <span className="text-caption font-normal text-ink-500">(optional checks)</span>
      </h2>
      <div className="mt-2 grid gap-4 xl:grid-cols-2">
        <fieldset className="space-y-2">
          <legend className="font-semibold">Over time</legend>
          <label className="flex items-center gap-2">
            <input type="checkbox" data-testid="over-time-checked" checked={t.checked} disabled={!editable} onChange={(e) => form.setFieldValue('overTime.checked', e.target.checked)} />
            Check an overload, a daily load and the fault over time
          </label>
          {t.checked ? (
            <>
              <div className="grid grid-cols-2 gap-2">
                <NumberField field="overTime.overloadCurrentA" label="Overload current" units={units} testId="overload-current" value={t.overloadCurrentA} disabled={!editable} onChange={(v) => form.setFieldValue('overTime.overloadCurrentA', v as number)} />
                <NumberField field="overTime.overloadDurationS" label="It must last" units={units} testId="overload-minutes" value={t.overloadDurationS} disabled={!editable} onChange={(v) => form.setFieldValue('overTime.overloadDurationS', v as number)} />
              </div>
              {errorOf('overTime.overloadCurrentA') ? <p className="field-error">{errorOf('overTime.overloadCurrentA')}</p> : null}
              {errorOf('overTime.overloadDurationS') ? <p className="field-error">{errorOf('overTime.overloadDurationS')}</p> : null}
              <label className="block">
                <span className="field-label">Daily load, A per interval from midnight (24 hourly values or finer; paste or upload CSV)</span>
                <textarea
                  // Uncontrolled while typing; remounted whenever the profile changes (an upload, a
                  // parsed paste) so the box always shows the profile that is computed and saved.
                  key={t.dailyProfileA.join(',')}
                  className="field-input num h-20"
                  data-testid="daily-profile"
                  disabled={!editable}
                  defaultValue={t.dailyProfileA.join('\n')}
                  onBlur={(e) => (e.target.value.trim() === '' ? form.setFieldValue('overTime.dailyProfileA', []) : readProfile(e.target.value))}
                />
              </label>
              <input
                type="file"
                accept=".csv,text/csv,text/plain"
                aria-label="Upload a daily load CSV"
                disabled={!editable}
                onChange={async (e) => {
                  const file = e.target.files?.[0];
                  if (file) readProfile(await file.text());
                }}
              />
              {profileError ? <p className="field-error">{profileError}</p> : null}
              {errorOf('overTime.dailyProfileA') ? <p className="field-error">{errorOf('overTime.dailyProfileA')}</p> : null}
              <p className="text-caption text-ink-500">{t.dailyProfileA.length > 0 ? `${t.dailyProfileA.length} values entered.` : 'No daily load: that part is not checked.'}</p>
              <label className="flex items-center gap-2">
                <input type="checkbox" checked={t.faultWithCoverings} disabled={!editable} onChange={(e) => form.setFieldValue('overTime.faultWithCoverings', e.target.checked)} />
                Fault with heat flowing out of the conductor into {focusedIsBar ? 'the surroundings' : 'its coverings'} (beside the adiabatic figure)
              </label>
            </>
          ) : null}
        </fieldset>

        <fieldset className="space-y-2">
          <legend className="font-semibold">Along the run (bars)</legend>
          <label className="flex items-center gap-2">
            <input type="checkbox" data-testid="along-run-checked" checked={a.checked} disabled={!editable} onChange={(e) => form.setFieldValue('alongRun.checked', e.target.checked)} />
            Check the run between its terminals, with bolted joints
          </label>
          {a.checked ? (
            <>
              <NumberField field="alongRun.lengthM" label="Run length" units={units} testId="run-length" value={a.lengthM} disabled={!editable} onChange={(v) => form.setFieldValue('alongRun.lengthM', v as number)} />
              {(['start', 'end'] as const).map((side) => (
                <div key={side} className="grid grid-cols-2 gap-2">
                  <label className="block">
                    <span className="field-label">{side === 'start' ? 'Start' : 'End'} of the run</span>
                    <select
                      className="field-input"
                      disabled={!editable}
                      value={side === 'start' ? a.startEnd : a.endEnd}
                      onChange={(e) => form.setFieldValue(side === 'start' ? 'alongRun.startEnd' : 'alongRun.endEnd', e.target.value as 'terminal' | 'insulated')}
                    >
                      <option value="terminal">device terminal at a set temperature</option>
                      <option value="insulated">no heat through the end</option>
                    </select>
                  </label>
                  {(side === 'start' ? a.startEnd : a.endEnd) === 'terminal' ? (
                    <NumberField
                      field="alongRun.terminalTemperatureC"
                      label="Terminal temperature"
                      units={units}
                      testId={`${side}-terminal`}
                      value={side === 'start' ? a.startTemperatureC : a.endTemperatureC}
                      disabled={!editable}
                      onChange={(v) => form.setFieldValue(side === 'start' ? 'alongRun.startTemperatureC' : 'alongRun.endTemperatureC', v as number)}
                    />
                  ) : null}
                </div>
              ))}
              <div>
                <span className="field-label">Bolted joints (resistance empty = 10 µΩ assumed and flagged)</span>
                {a.joints.map((j, i) => (
                  <div key={i} className="mt-1 grid grid-cols-[1fr_1fr_auto] items-end gap-2">
                    <NumberField field="alongRun.jointPositionM" label={`Joint ${i + 1} at`} units={units} testId={`joint-${i}-position`} value={j.positionM} disabled={!editable} onChange={(v) => form.setFieldValue(`alongRun.joints.${i}.positionM`, v as number)} />
                    <NumberField
                      field="alongRun.jointResistanceMicroOhm"
                      label="Resistance"
                      units={units}
                      nullable
                      placeholder="10 assumed"
                      testId={`joint-${i}-resistance`}
                      value={j.resistanceMicroOhm}
                      disabled={!editable}
                      onChange={(v) => form.setFieldValue(`alongRun.joints.${i}.resistanceMicroOhm`, v)}
                    />
                    {editable ? (
                      <button type="button" className="btn-quiet" onClick={() => form.removeListItem('alongRun.joints', i)}>
                        Remove
                      </button>
                    ) : null}
                    {errorOf(`alongRun.joints.${i}.positionM`) ? <p className="field-error col-span-3">{errorOf(`alongRun.joints.${i}.positionM`)}</p> : null}
                  </div>
                ))}
                {editable ? (
                  <button type="button" className="btn-quiet mt-1" onClick={() => form.insertListItem('alongRun.joints', { positionM: a.lengthM / 2, resistanceMicroOhm: null })}>
                    Add a joint
                  </button>
                ) : null}
              </div>
            </>
          ) : null}
        </fieldset>
      </div>

      {t.checked || a.checked ? (
        <button type="button" className="btn-primary mt-3" data-testid="run-beyond" disabled={!candidateId || running} onClick={run}>
          {running ? 'Computing…' : 'Compute these checks for the candidate in focus'}
        </button>
      ) : null}
      {results && results.candidateId !== candidateId ? <p className="mt-1 text-caption text-ink-500">Shown for another candidate; compute again for this one.</p> : null}

      <div className="mt-3 grid gap-3 xl:grid-cols-2">
        {overTime ? (
          overTime.ok ? (
            <div data-testid="over-time-result">
              <dl className="text-body">
                {overTime.result.overload ? (
                  <div className="flex justify-between border-b border-ink-50 py-1">
                    <dt>
                      Overload {formatNumber(overTime.result.overload.currentA, 4)} A for {formatNumber(overTime.result.overload.durationS / 60, 3)} min
                    </dt>
                    <dd className="num">
                      {overTime.result.overload.timeToLimitS !== null
                        ? `limit after ${formatNumber(overTime.result.overload.timeToLimitS / 60, 3)} min`
                        : overTime.result.overload.outcome === 'steady-below-limit'
                          ? 'never reaches the limit'
                          : 'not within twice the duration'}{' '}
                      {overTime.result.overload.passes ? <span className="text-within-dark">✔ passes</span> : <span className="font-semibold text-over-dark">✖ fails</span>}
                    </dd>
                  </div>
                ) : null}
                {overTime.result.daily ? (
                  <div className="flex justify-between border-b border-ink-50 py-1">
                    <dt>Daily load, peak after {overTime.result.daily.days} days</dt>
                    <dd className="num">
                      {fmtT(overTime.result.daily.peakC)} at {formatNumber(overTime.result.daily.peakTimeS / 3600, 3)} h{' '}
                      {overTime.result.daily.passes ? <span className="text-within-dark">✔ passes</span> : <span className="font-semibold text-over-dark">✖ fails</span>}
                    </dd>
                  </div>
                ) : null}
                {overTime.result.fault ? (
                  <div className="flex justify-between border-b border-ink-50 py-1">
                    <dt>Fault with heat flowing out of the conductor</dt>
                    <dd className="num">
                      {fmtT(overTime.result.fault.finalC)} (adiabatic IEC 60949: {overTime.result.fault.iecAdiabaticC === null ? '—' : fmtT(overTime.result.fault.iecAdiabaticC)})
                    </dd>
                  </div>
                ) : null}
              </dl>
              <CheckFlagList flags={overTime.result.flags} testId="beyond-flags" />
              <Plot
                data={[
                  ...(overTime.result.overload
                    ? [{ x: overTime.result.overload.series.map((p) => p.timeS / 60), y: overTime.result.overload.series.map((p) => toT(p.hotSpotC)), type: 'scatter' as const, mode: 'lines' as const, name: 'overload', line: { color: '#b8703d' } }]
                    : []),
                  ...(overTime.result.daily
                    ? [{ x: overTime.result.daily.series.map((p) => p.timeS / 60), y: overTime.result.daily.series.map((p) => toT(p.hotSpotC)), type: 'scatter' as const, mode: 'lines' as const, name: 'daily load (last day)', line: { color: '#17776f' } }]
                    : []),
                ]}
                layout={{
                  ...PLOT_LAYOUT_BASE,
                  title: { text: 'Hot spot over time' },
                  height: 280,
                  xaxis: { ...PLOT_LAYOUT_BASE.xaxis, title: { text: 'time (min)' } },
                  yaxis: { ...PLOT_LAYOUT_BASE.yaxis, title: { text: `hot spot (${tUnit})` } },
                  shapes: [{ type: 'line', xref: 'paper', x0: 0, x1: 1, y0: toT(overTime.result.limitC), y1: toT(overTime.result.limitC), line: { color: LIMIT_COLOUR, dash: 'dash', width: 1.5 } }],
                  annotations: [{ xref: 'paper', x: 1, xanchor: 'right', y: toT(overTime.result.limitC), yanchor: 'bottom', text: `limit ${formatNumber(toT(overTime.result.limitC), 3)} ${tUnit}`, showarrow: false, font: { color: LIMIT_COLOUR, size: 10 } }],
                }}
                config={PLOT_CONFIG}
                style={{ width: '100%' }}
              />
            </div>
          ) : (
            <p className="field-error">Over time: {overTime.message}</p>
          )
        ) : null}
        {alongRun ? (
          alongRun.ok ? (
            <div data-testid="along-run-result">
              <dl className="text-body">
                <div className="flex justify-between border-b border-ink-50 py-1">
                  <dt>Hot spot along the run</dt>
                  <dd className="num">
                    {fmtT(alongRun.result.hotSpot.temperatureC)} at {formatNumber(toL(alongRun.result.hotSpot.positionM), 3)} {lUnit} of {fmtT(alongRun.result.limitC)}{' '}
                    {alongRun.result.passes ? <span className="text-within-dark">✔ passes</span> : <span className="font-semibold text-over-dark">✖ fails</span>}
                  </dd>
                </div>
              </dl>
              <CheckFlagList flags={alongRun.result.flags} testId="beyond-flags" />
              <Plot
                data={[
                  { x: alongRun.result.positionsM.map(toL), y: alongRun.result.temperaturesC.map(toT), type: 'scatter', mode: 'lines', name: 'bar', line: { color: '#b8703d' } },
                  {
                    x: alongRun.result.joints.map((j) => toL(j.positionM)),
                    y: alongRun.result.joints.map((j) => toT(j.temperatureC)),
                    type: 'scatter',
                    mode: 'markers',
                    name: 'joints',
                    marker: { symbol: 'diamond', size: 9, color: '#2f3d4f' },
                  },
                ]}
                layout={{
                  ...PLOT_LAYOUT_BASE,
                  title: { text: 'Temperature along the run' },
                  height: 280,
                  xaxis: { ...PLOT_LAYOUT_BASE.xaxis, title: { text: `position (${lUnit})` } },
                  yaxis: { ...PLOT_LAYOUT_BASE.yaxis, title: { text: `temperature (${tUnit})` } },
                  shapes: [{ type: 'line', xref: 'paper', x0: 0, x1: 1, y0: toT(alongRun.result.limitC), y1: toT(alongRun.result.limitC), line: { color: LIMIT_COLOUR, dash: 'dash', width: 1.5 } }],
                }}
                config={PLOT_CONFIG}
                style={{ width: '100%' }}
              />
            </div>
          ) : (
            <p className="field-error">Along the run: {alongRun.message}</p>
          )
        ) : null}
      </div>
    </section>
  );
}

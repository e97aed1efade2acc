'use client';
/**
 * "Inside the enclosure": the sheet's optional check of the air inside a closed enclosure, heated
 * by the circuit's own loss over the length it runs inside and by the other equipment, and the
 * candidate in focus in that air (physics.md §6). Inputs are part of the sheet inputs; results are
 * computed on request because the air and the conductor are solved together (a few steady solves).
 */
import { useState } from 'react';
import type { UseFormReturnType } from '@mantine/form';
import { Plot, PLOT_CONFIG, PLOT_LAYOUT_BASE } from '@/components/plots/Plot';
import type { EnclosureAirCheckResult } from '@/lib/electrical/sizing/enclosureAir';
import type { CheckOutcome } from '@/lib/sheet/beyondSteady';
import { computeEnclosureAir } from '@/lib/sheet/enclosureAir';
import { DEFAULT_SOURCES, enclosureWalls, type SheetInputs } from '@/lib/sheet/schema';
import { convertFromSi, formatNumber, unitLabel, type UnitSystem } from '@/lib/units';
import { CheckFlagList } from './checkParts';
import { NumberField } from './NumberField';

const WALL_LABELS: Record<(typeof enclosureWalls)[number], string> = {
  'painted-steel': 'painted sheet steel (k 5.5)',
  'stainless-steel': 'stainless steel (k 3.7)',
  aluminium: 'aluminium (k 12)',
  plastic: 'plastic (k 3.5)',
};

type Field = 'heightM' | 'widthM' | 'depthM' | 'outsideAirC' | 'routeLengthInsideM' | 'otherLossesW';

function TemperatureLadder({ result, units }: { result: EnclosureAirCheckResult; units: UnitSystem }) {
  const t = (c: number) => convertFromSi(c, 'temperature', units);
  const tUnit = unitLabel('temperature', units);
  const rows: [string, number | null, string][] = [
    ['air outside', result.outsideAirC, '#8796a8'],
    ['sheet ambient', result.sheetAmbientC, '#5b6b7d'],
    ['air inside (mean)', result.insideAirC, '#17776f'],
    ['hot spot inside', result.hotSpotC, result.passes ? '#b8703d' : '#a8402b'],
  ];
  const shown = rows.filter((r): r is [string, number, string] => r[1] !== null);
  return (
    <Plot
      data={[
        {
          type: 'bar',
          orientation: 'h',
          y: shown.map((r) => r[0]),
          x: shown.map((r) => t(r[1])),
          marker: { color: shown.map((r) => r[2]) },
          text: shown.map((r) => `${formatNumber(t(r[1]), 4)} ${tUnit}`),
          textposition: 'auto',
          hoverinfo: 'text',
        },
      ]}
      layout={{
        ...PLOT_LAYOUT_BASE,
        title: { text: 'Temperatures in and around the enclosure' },
        height: 220,
        margin: { ...PLOT_LAYOUT_BASE.margin, l: 120 },
        xaxis: { ...PLOT_LAYOUT_BASE.xaxis, title: { text: `temperature (${tUnit})` } },
        yaxis: { ...PLOT_LAYOUT_BASE.yaxis, autorange: 'reversed' },
        shapes: [{ type: 'line', yref: 'paper', y0: 0, y1: 1, x0: t(result.limitC), x1: t(result.limitC), line: { color: '#a8402b', dash: 'dash', width: 1.5 } }],
        annotations: [{ yref: 'paper', y: 1, yanchor: 'bottom', x: t(result.limitC), text: `limit ${formatNumber(t(result.limitC), 3)} ${tUnit}`, showarrow: false, font: { color: '#a8402b', size: 10 } }],
        showlegend: false,
      }}
      config={PLOT_CONFIG}
      style={{ width: '100%' }}
    />
  );
}

export function EnclosureAirPanel({ form, editable, candidateId, units }: { form: UseFormReturnType<SheetInputs>; editable: boolean; candidateId: string | null; units: UnitSystem }) {
  const e = form.values.enclosureAir;
  const buried = form.values.installation.kind === 'buried';
  const [outcome, setOutcome] = useState<{ candidateId: string; outcome: CheckOutcome<EnclosureAirCheckResult> | null } | null>(null);
  const [running, setRunning] = useState(false);
  const errorOf = (field: string) => form.errors[`enclosureAir.${field}`] as string | undefined;
  const num = (key: Field, label: string, testId: string, help?: string) => (
    <NumberField
      field={`enclosureAir.${key}`}
      label={label}
      units={units}
      value={e[key]}
      disabled={!editable}
      error={errorOf(key)}
      help={help}
      testId={testId}
      onChange={(v) => form.setFieldValue(`enclosureAir.${key}`, v as number)}
    />
  );
  const tUnit = unitLabel('temperature', units);
  const fmtT = (c: number) => `${formatNumber(convertFromSi(c, 'temperature', units), 4)} ${tUnit}`;

  const run = () => {
    if (!candidateId) return;
    setRunning(true);
    // Let the button show "Computing…" before the synchronous work starts.
    setTimeout(() => {
      try {
        setOutcome({ candidateId, outcome: computeEnclosureAir(form.getValues(), candidateId) });
      } finally {
        setRunning(false);
      }
    }, 20);
  };

  const result = outcome?.outcome;
  return (
    <section aria-labelledby="enclosure-heading" className="panel p-3" data-testid="enclosure-air">
      <h2 id="enclosure-heading" className="text-body font-semibold">
        Inside the enclosure <span className="text-caption font-normal text-ink-500">(optional check)</span>
      </h2>
      <label className="mt-2 flex items-center gap-2">
        <input
          type="checkbox"
          data-testid="enclosure-checked"
          checked={e.checked}
          disabled={!editable || buried}
          onChange={(ev) => form.setFieldValue('enclosureAir.checked', ev.target.checked)}
        />
        Estimate the air inside a closed enclosure from the losses in it, and check the candidate in that air
      </label>
      {buried ? <p className="text-caption text-ink-500">Not for a buried circuit.</p> : null}
      {e.checked && !buried ? (
        <fieldset className="mt-2 space-y-2">
          <legend className="sr-only">Enclosure inputs</legend>
          <div className="grid grid-cols-2 gap-2 md:grid-cols-3">
            {num('heightM', 'Height', 'enclosure-height')}
            {num('widthM', 'Width', 'enclosure-width')}
            {num('depthM', 'Depth', 'enclosure-depth')}
            {num('outsideAirC', 'Air around it', 'enclosure-outside-air', DEFAULT_SOURCES.enclosureOutsideAirC)}
            {num('routeLengthInsideM', 'Route length inside', 'enclosure-route-inside')}
            {num('otherLossesW', 'Other losses inside', 'enclosure-other-losses', DEFAULT_SOURCES.enclosureOtherLossesW)}
          </div>
          <div className="grid grid-cols-2 gap-2 md:grid-cols-4">
            <label className="block">
              <span className="field-label">Wall</span>
              <select className="field-input" data-testid="enclosure-wall" value={e.wall} disabled={!editable} onChange={(ev) => form.setFieldValue('enclosureAir.wall', ev.target.value as SheetInputs['enclosureAir']['wall'])}>
                {enclosureWalls.map((w) => (
                  <option key={w} value={w}>
                    {WALL_LABELS[w]}
                  </option>
                ))}
              </select>
            </label>
            <label className="block">
              <span className="field-label">Sides against a wall or neighbour</span>
              <select
                className="field-input"
                data-testid="enclosure-sides"
                value={e.sidesCovered}
                disabled={!editable}
                onChange={(ev) => form.setFieldValue('enclosureAir.sidesCovered', Number(ev.target.value) as 0 | 1 | 2)}
              >
                <option value={0}>none (stands alone)</option>
                <option value={1}>one (end of a row)</option>
                <option value={2}>both (middle of a row)</option>
              </select>
            </label>
            <label className="flex items-center gap-2 self-end">
              <input type="checkbox" checked={e.backCovered} disabled={!editable} onChange={(ev) => form.setFieldValue('enclosureAir.backCovered', ev.target.checked)} />
              Back against a wall
            </label>
            <label className="flex items-center gap-2 self-end">
              <input type="checkbox" checked={e.topCovered} disabled={!editable} onChange={(ev) => form.setFieldValue('enclosureAir.topCovered', ev.target.checked)} />
              Roof covered
            </label>
          </div>
          <p className="text-caption text-ink-500">{DEFAULT_SOURCES.enclosureWall} Sealed enclosures only: no ventilation openings, fans or sun.</p>
          <button type="button" className="btn-primary" data-testid="run-enclosure" disabled={!candidateId || running} onClick={run}>
            {running ? 'Computing…' : 'Compute the enclosure air for the candidate in focus'}
          </button>
        </fieldset>
      ) : null}

      {result && outcome && outcome.candidateId !== candidateId ? <p className="mt-1 text-caption text-ink-500">Shown for another candidate; compute again for this one.</p> : null}
      {result && e.checked ? (
        result.ok ? (
          <div className="mt-3 grid gap-3 xl:grid-cols-2" data-testid="enclosure-result">
            <div>
              <dl className="text-body">
                <div className="flex justify-between border-b border-ink-50 py-1">
                  <dt>Losses inside</dt>
                  <dd className="num">
                    {formatNumber(result.result.totalLossesW, 4)} W (circuit {formatNumber(result.result.conductorLossesW, 4)} W + other {formatNumber(result.result.otherLossesW, 4)} W)
                  </dd>
                </div>
                <div className="flex justify-between border-b border-ink-50 py-1">
                  <dt>Effective cooling surface</dt>
                  <dd className="num">{formatNumber(result.result.effectiveAreaM2, 4)} m²</dd>
                </div>
                <div className="flex justify-between border-b border-ink-50 py-1">
                  <dt>Mean air inside</dt>
                  <dd className="num" data-testid="enclosure-inside-air">
                    {fmtT(result.result.insideAirC)} (rise {formatNumber(convertFromSi(result.result.airRiseK, 'temperatureRise', units), 3)} {unitLabel('temperatureRise', units)})
                  </dd>
                </div>
                <div className="flex justify-between border-b border-ink-50 py-1">
                  <dt>Hot spot in that air</dt>
                  <dd className="num">
                    {result.result.hotSpotC === null ? 'no steady state' : fmtT(result.result.hotSpotC)} of {fmtT(result.result.limitC)}{' '}
                    {result.result.passes ? <span className="text-within-dark">✔ passes</span> : <span className="font-semibold text-over-dark">✖ fails</span>}
                  </dd>
                </div>
              </dl>
              <CheckFlagList flags={result.result.flags} testId="enclosure-flags" />
              <p className="mt-1 text-caption text-ink-500">Method: {result.result.method}.</p>
            </div>
            <TemperatureLadder result={result.result} units={units} />
          </div>
        ) : (
          <p className="field-error mt-2">Inside the enclosure: {result.message}</p>
        )
      ) : null}
    </section>
  );
}

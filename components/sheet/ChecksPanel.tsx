'use client';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { formatNumber, formatPower, formatQuantity, KG_PER_POUND, lossPerLengthWords, type UnitSystem } from '@/lib/units';

function Row({ label, children, state, testId }: { label: string; children: React.ReactNode; state?: 'pass' | 'fail' | 'none'; testId?: string }) {
  const mark = state === 'pass' ? <span className="text-within-dark">✔ passes</span> : state === 'fail' ? <span className="font-semibold text-over-dark">✖ fails</span> : null;
  return (
    <div className="flex items-baseline justify-between gap-2 border-b border-ink-50 py-1 last:border-0">
      <dt className="text-ink-600">{label}</dt>
      <dd className="num text-right text-ink-900" data-testid={testId}>
        {children} {mark}
      </dd>
    </div>
  );
}

/** Losses, voltage drop and the short-circuit check of the candidate in focus. */
export function ChecksPanel({ evaluation, units, lengthM }: { evaluation: CandidateEvaluationOk; units: UnitSystem; lengthM: number }) {
  const sc = evaluation.shortCircuit;
  const vd = evaluation.voltageDrop;
  return (
    <section aria-labelledby="checks-heading" className="panel p-3">
      <h2 id="checks-heading" className="text-body font-semibold">Losses, voltage drop, short circuit</h2>
      <dl className="mt-1 text-body">
        <Row label="Loss of the circuit" testId="loss-of-circuit">
          {evaluation.lossWPerM === null ? '—' : `${lossPerLengthWords(evaluation.lossWPerM, units)} · ${formatPower(evaluation.lossWPerM * lengthM)} over the route`}
        </Row>
        <Row label="Conductor temperature (mean)">{evaluation.conductorC === null ? '—' : formatQuantity(evaluation.conductorC, 'temperature', units)}</Row>
        <Row label="AC/DC resistance ratio">{formatNumber(evaluation.acFactor, 4)}</Row>
        <Row label="Voltage drop (IEC 60364-5-52 Annex G)" state={vd.limitPercent === undefined ? 'none' : vd.percent <= vd.limitPercent ? 'pass' : 'fail'}>
          {formatNumber(vd.volts, 3)} V · {formatNumber(vd.percent, 3)} %{vd.limitPercent !== undefined ? ` of ${formatNumber(vd.limitPercent, 3)} % allowed` : ''}
        </Row>
        {sc.checked ? (
          <Row label="Short circuit (IEC 60949 adiabatic)" state={sc.withstands ? 'pass' : 'fail'}>
            {formatNumber((sc.currentA ?? 0) / 1000, 4)} kA for {formatNumber(sc.durationS ?? 0, 3)} s → {sc.finalC === null || sc.finalC === undefined ? 'beyond the method' : formatQuantity(sc.finalC, 'temperature', units)} of {formatQuantity(sc.limitC ?? 0, 'temperature', units)} · needs ≥ {formatQuantity(sc.minimumSectionMm2 ?? 0, 'areaMm2', units)}
          </Row>
        ) : (
          <Row label="Short circuit">not checked{sc.reason ? `: ${sc.reason}` : ''}</Row>
        )}
        <Row label="Conductor mass (route)">{units === 'si' ? `${formatNumber(evaluation.massKg, 4)} kg` : `${formatNumber(evaluation.massKg / KG_PER_POUND, 4)} lb`}</Row>
        <Row label="Material cost · life-cycle cost">
          {evaluation.materialCost ?? '—'} · {evaluation.lifeCycleCost ?? '—'}
        </Row>
      </dl>
    </section>
  );
}

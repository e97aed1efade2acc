'use client';
/**
 * Runs every verification case here in the browser, one after the other so the page can show its
 * progress, with the same registry and the same library functions the product uses (and that
 * vitest runs in CI). Shows the table of results, the plots of the field cases and the downloads.
 */
import { Fragment, useCallback, useEffect, useRef, useState } from 'react';
import {
  describeTolerance,
  formatNumber,
  METHOD_AREA_LABELS,
  METHOD_AREAS,
  reportCsv,
  runCase,
  sourceBasis,
  summarise,
  verificationCases,
  type CaseResult,
  type QuantityResult,
  type VerificationCase,
} from '@/lib/verification';
import { FieldCasePlots } from './FieldCasePlots';

type Phase = 'running' | 'done';

const PASS_LOOK = { word: 'Pass', icon: '✔', text: 'text-within-dark', box: 'border-within bg-within-light' };
const FAIL_LOOK = { word: 'Fail', icon: '✖', text: 'text-over-dark', box: 'border-over bg-over-light' };

function ResultBadge({ pass }: { pass: boolean | undefined }) {
  if (pass === undefined) {
    return (
      <span className="inline-flex items-center gap-1 rounded border border-ink-200 bg-ink-50 px-1.5 py-0.5 text-caption text-ink-500">
        <span aria-hidden="true">…</span> Waiting
      </span>
    );
  }
  const look = pass ? PASS_LOOK : FAIL_LOOK;
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-caption font-semibold ${look.box} ${look.text}`}>
      <span aria-hidden="true">{look.icon}</span> {look.word}
    </span>
  );
}

function withUnit(value: string, unit: string): string {
  return unit ? `${value} ${unit}` : value;
}

function CaseRows({ verificationCase, result }: { verificationCase: VerificationCase; result: CaseResult | undefined }) {
  const rows: Array<{ key: string; label: string; unit: string; reference: number; q?: QuantityResult }> = verificationCase.quantities.map((q, i) => ({
    key: q.key,
    label: q.label,
    unit: q.unit,
    reference: q.reference,
    q: result?.quantities[i],
  }));
  const span = rows.length;
  return (
    <>
      {rows.map((row, i) => (
        <tr
          key={row.key}
          id={i === 0 ? `case-${verificationCase.id}` : undefined}
          data-case-id={i === 0 ? verificationCase.id : undefined}
          data-case-result={i === 0 ? (result ? (result.pass ? 'pass' : 'fail') : 'waiting') : undefined}
          className={`align-top target:bg-copper-300/20 ${i === span - 1 ? 'border-b border-ink-100' : ''}`}
        >
          {i === 0 ? (
            <>
              <th scope="rowgroup" rowSpan={span} className="w-64 py-2 pr-3 text-left font-normal">
                <span className="block font-semibold text-ink-900">{verificationCase.title}</span>
                <span className="num block text-caption text-ink-400">{verificationCase.id}</span>
                <details className="mt-1 text-caption text-ink-600">
                  <summary className="cursor-pointer text-copper-600">Inputs and working</summary>
                  <ul className="mt-1 space-y-0.5">
                    {verificationCase.inputs.map((input) => (
                      <li key={input.name}>
                        {input.name}: <span className="num">{withUnit(typeof input.value === 'number' ? formatNumber(input.value) : input.value, input.unit ?? '')}</span>
                      </li>
                    ))}
                  </ul>
                  {verificationCase.notes ? <p className="mt-1 whitespace-pre-line">{verificationCase.notes}</p> : null}
                  {result?.details?.map((d) => (
                    <p key={d} className="mt-1 text-ink-500">{d}</p>
                  ))}
                </details>
                {result?.error ? <p className="mt-1 text-caption text-over-dark">Could not compute: {result.error}</p> : null}
              </th>
              <td rowSpan={span} className="w-72 py-2 pr-3 text-caption text-ink-700">
                {verificationCase.source.citation}
                <span
                  className={`mt-0.5 block font-medium ${verificationCase.source.fromMemory || verificationCase.source.kind === 'from memory' ? 'text-tight-dark' : 'text-ink-500'}`}
                >
                  {sourceBasis(verificationCase.source)}
                </span>
              </td>
            </>
          ) : null}
          <td className="py-2 pr-3 text-caption text-ink-700">{row.label}</td>
          <td className="num py-2 pr-3 text-right">{withUnit(formatNumber(row.reference), row.unit)}</td>
          <td className="num py-2 pr-3 text-right">{row.q ? withUnit(formatNumber(row.q.value), row.unit) : '—'}</td>
          <td className="num py-2 pr-3 text-right text-ink-600">
            {row.q ? formatNumber(row.q.deviation, 3) : '—'}
            {row.q?.relativeDeviation !== null && row.q?.relativeDeviation !== undefined ? (
              <span className="block text-caption text-ink-400">{formatNumber(row.q.relativeDeviation, 2)} rel.</span>
            ) : null}
          </td>
          <td className="num py-2 pr-3 text-right text-ink-600">{describeTolerance(verificationCase.quantities[i].tolerance, row.unit)}</td>
          <td className="py-2">
            <ResultBadge pass={row.q ? row.q.pass : undefined} />
          </td>
        </tr>
      ))}
    </>
  );
}

export function VerificationRunner() {
  const total = verificationCases.length;
  const [results, setResults] = useState<(CaseResult | undefined)[]>(() => new Array(total).fill(undefined));
  const [phase, setPhase] = useState<Phase>('running');
  const [completedAt, setCompletedAt] = useState<string | null>(null);
  const runId = useRef(0);

  const run = useCallback(async () => {
    const id = ++runId.current;
    setPhase('running');
    setCompletedAt(null);
    setResults(new Array(total).fill(undefined));
    for (let i = 0; i < total; i++) {
      // Yield to the browser between cases so the progress is painted and the page stays responsive.
      await new Promise((resolve) => setTimeout(resolve, 0));
      if (runId.current !== id) return;
      const result = runCase(verificationCases[i]);
      setResults((previous) => {
        const next = [...previous];
        next[i] = result;
        return next;
      });
    }
    if (runId.current !== id) return;
    setCompletedAt(new Date().toISOString().replace('T', ' ').replace(/\.\d+Z$/, ' UTC'));
    setPhase('done');
  }, [total]);

  useEffect(() => {
    void run();
    return () => {
      runId.current++; // stops a run in progress when the page goes away
    };
  }, [run]);

  // The run adds rows after the first paint: bring a linked case (#case-…) into view once it exists.
  useEffect(() => {
    if (phase !== 'done' || !window.location.hash.startsWith('#case-')) return;
    document.getElementById(window.location.hash.slice(1))?.scrollIntoView({ block: 'center' });
  }, [phase]);

  const finished = results.filter((r): r is CaseResult => r !== undefined);
  const summary = summarise(finished);
  const allPass = phase === 'done' && summary.failed === 0;

  function downloadCsv() {
    const csv = reportCsv(finished, { generatedAt: completedAt ?? '', where: 'in the browser (the /verification page)' });
    const url = URL.createObjectURL(new Blob([csv], { type: 'text/csv;charset=utf-8' }));
    const link = document.createElement('a');
    link.href = url;
    link.download = `ampwarden-verification-${(completedAt ?? '').slice(0, 10) || 'report'}.csv`;
    document.body.appendChild(link);
    link.click();
    link.remove();
    URL.revokeObjectURL(url);
  }

  const fieldResults = finished.filter((r) => r.profile && r.convergence);

  return (
    <div className="mt-4 space-y-5">
      <div className="panel flex flex-wrap items-center gap-4 p-4">
        <div
          role="status"
          aria-live="polite"
          data-testid="verification-summary"
          data-state={phase}
          data-total={total}
          data-done={finished.length}
          data-passed={summary.passed}
          data-failed={summary.failed}
          className="min-w-72 flex-1"
        >
          {phase === 'running' ? (
            <p className="text-lead text-ink-800">
              Running the checks in this browser: {finished.length} of {total} done
              {summary.failed > 0 ? <span className="text-over-dark">, {summary.failed} failed so far</span> : null}.
            </p>
          ) : (
            <p className={`inline-flex items-center gap-2 rounded-md border px-3 py-1.5 text-lead font-semibold ${allPass ? `${PASS_LOOK.box} ${PASS_LOOK.text}` : `${FAIL_LOOK.box} ${FAIL_LOOK.text}`}`}>
              <span aria-hidden="true">{allPass ? PASS_LOOK.icon : FAIL_LOOK.icon}</span>
              {allPass ? `All ${total} checks pass` : `${summary.failed} of ${total} checks fail`}
              <span className="font-normal">
                ({summary.passed} of {total} pass, {summary.quantities} compared values)
              </span>
            </p>
          )}
          <label className="mt-2 block text-caption text-ink-500">
            <span className="sr-only">Progress</span>
            <progress className="h-2 w-full max-w-md accent-copper-500" max={total} value={finished.length} />
          </label>
          {completedAt ? <p className="mt-1 text-caption text-ink-500">Run finished {completedAt}, in this browser.</p> : null}
        </div>
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-primary" onClick={downloadCsv} disabled={phase !== 'done'} data-testid="download-csv">
            Download CSV
          </button>
          <a className="btn-quiet" href="/api/verification/report?format=pdf" download data-testid="download-pdf">
            Download PDF
          </a>
          <button type="button" className="btn-quiet" onClick={() => void run()} disabled={phase === 'running'}>
            Run again
          </button>
        </div>
      </div>

      <div className="panel overflow-x-auto p-3">
        <table className="w-full min-w-[1100px] text-body" data-testid="verification-table">
          <caption className="sr-only">Verification cases: reference value, Ampwarden&apos;s value, deviation, tolerance and result</caption>
          <thead>
            <tr className="border-b border-ink-200 text-left text-caption tracking-wide text-ink-500">
              <th scope="col" className="py-2 pr-3 font-medium">Case</th>
              <th scope="col" className="py-2 pr-3 font-medium">Source</th>
              <th scope="col" className="py-2 pr-3 font-medium">Quantity</th>
              <th scope="col" className="py-2 pr-3 text-right font-medium">Reference</th>
              <th scope="col" className="py-2 pr-3 text-right font-medium">Ampwarden</th>
              <th scope="col" className="py-2 pr-3 text-right font-medium">Deviation</th>
              <th scope="col" className="py-2 pr-3 text-right font-medium">Tolerance</th>
              <th scope="col" className="py-2 font-medium">Result</th>
            </tr>
          </thead>
          {METHOD_AREAS.map((area) => {
            const indices = verificationCases.map((c, i) => (c.area === area ? i : -1)).filter((i) => i >= 0);
            if (indices.length === 0) return null;
            return (
              <tbody key={area} id={`method-${area}`}>
                <tr>
                  <th colSpan={8} scope="colgroup" className="bg-paper-200 px-2 py-1.5 text-left text-body font-semibold text-ink-800">
                    {METHOD_AREA_LABELS[area]}
                  </th>
                </tr>
                {indices.map((i) => (
                  <Fragment key={verificationCases[i].id}>
                    <CaseRows verificationCase={verificationCases[i]} result={results[i]} />
                  </Fragment>
                ))}
              </tbody>
            );
          })}
        </table>
      </div>

      <section aria-labelledby="field-heading" className="space-y-3">
        <h2 id="field-heading" className="text-lead font-semibold text-ink-900">
          Field cases: profiles and grid convergence
        </h2>
        <p className="text-body text-ink-600">
          Each field case is solved on meshes of 10 to 160 cells; the error against the closed form should fall four-fold with every halving of the cell
          size (second order). The measured order is the least-squares slope over the three finest meshes.
        </p>
        {fieldResults.length === 0 ? <p className="text-caption text-ink-500">The plots appear when their cases have run.</p> : null}
        {fieldResults.map((r) => (
          <FieldCasePlots key={r.id} result={r} />
        ))}
      </section>
    </div>
  );
}

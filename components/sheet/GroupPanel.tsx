'use client';
/**
 * The cross-section the candidate in focus was rated as: the drawing to scale with its dimensions,
 * the governing cable in words, how the group was rated, and every cable's temperatures and heat at
 * the design current (words and numbers from lib/sheet/groupWords, the same as the PDF).
 */
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { cableTitle, drawingInputOf, governingCableOf, governingText, groupCableRows, groupMethodWords } from '@/lib/sheet/groupWords';
import { convertFromSi, formatNumber, formatQuantity, unitLabel, type UnitSystem } from '@/lib/units';
import { CrossSectionView } from './CrossSectionView';

export function GroupPanel({ evaluation, units, otherLabels = [] }: { evaluation: CandidateEvaluationOk; units: UnitSystem; otherLabels?: readonly string[] }) {
  const group = evaluation.group;
  if (!group) {
    return (
      <section className="panel p-3" aria-label="Cross-section" data-testid="group-panel">
        <p className="text-caption text-ink-600">This result has no cross-section: it was saved by an earlier method that rated each cable alone.</p>
      </section>
    );
  }
  const t = (c: number) => formatQuantity(c, 'temperature', units, { digits: 4 });
  const governing = governingCableOf(group, otherLabels);
  const rows = groupCableRows(group, otherLabels);
  const titles = group.cables.map((_, i) => cableTitle(group, i, otherLabels, t));
  const len = (m: number) => formatNumber(convertFromSi(m * 1000, 'lengthMm', units), 4);
  const deg = (c: number) => formatNumber(convertFromSi(c, 'temperature', units), 4);
  const tUnit = unitLabel('temperature', units);
  return (
    <section className="panel p-3" aria-labelledby="group-heading" data-testid="group-panel">
      <h2 id="group-heading" className="text-body font-semibold">
        Cross-section rated: {evaluation.label}
      </h2>
      <p className="text-caption text-ink-700" data-testid="group-governing">
        {governing ? governingText(governing, t) : 'No cable governs: there is no steady state at the design current.'}
        {' · '}
        <span className="text-ink-600" data-testid="group-method">{groupMethodWords(group)}</span>
      </p>
      <div className="mt-2 grid gap-3 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <CrossSectionView
          input={drawingInputOf(group)}
          title={`Cross-section of ${evaluation.label}`}
          titles={titles}
          caption={governing ? governingText(governing, t) : undefined}
        />
        <div className="min-w-0">
          <table className="w-full text-caption" data-testid="group-cables">
            <caption className="mb-1 text-left text-ink-600">Every cable at {formatNumber(evaluation.designCurrentA, 4)} A</caption>
            <thead>
              <tr className="text-left text-ink-500">
                <th scope="col" className="pr-2 font-medium">Cable</th>
                <th scope="col" className="pr-2 text-right font-medium">Across, up ({unitLabel('lengthMm', units)})</th>
                <th scope="col" className="pr-2 text-right font-medium">Conductor ({tUnit})</th>
                <th scope="col" className="pr-2 text-right font-medium">Surface ({tUnit})</th>
                <th scope="col" className="text-right font-medium">Heat ({unitLabel('powerWPerM', units)})</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r, i) => (
                <tr key={i} className={`border-t border-ink-100 ${r.governs ? 'font-semibold text-over-dark' : ''}`}>
                  <th scope="row" className="py-0.5 pr-2 text-left font-normal">
                    {r.governs ? <span aria-hidden="true">● </span> : null}
                    {r.cable}
                    {r.governs ? ' (governs)' : ''}
                    <span className="block text-ink-500">{r.role}</span>
                  </th>
                  <td className="num whitespace-nowrap pr-2 text-right">
                    {len(r.xM)}, {len(r.yM)}
                  </td>
                  <td className="num whitespace-nowrap pr-2 text-right">{r.conductorC === null ? '—' : deg(r.conductorC)}</td>
                  <td className="num whitespace-nowrap pr-2 text-right">{r.surfaceC === null ? '—' : deg(r.surfaceC)}</td>
                  <td className="num whitespace-nowrap text-right">{r.heatWPerM === null ? '—' : formatNumber(convertFromSi(r.heatWPerM, 'powerWPerM', units), 3)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-1 text-[0.6875rem] leading-4 text-ink-500">{group.method}.</p>
        </div>
      </div>
    </section>
  );
}

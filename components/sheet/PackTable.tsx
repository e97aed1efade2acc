'use client';
/**
 * Every bar of the bus-bar system at the design current (lib/sheet/systemWords packBarRows): its
 * temperature, its share of its phase's current, its R_ac/R_dc, the bar that governs marked (in
 * words and weight as well as colour), with the pack's flags beside the table.
 */
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { flagsOf, hottestBarText, PACK_FLAG_CODES, packBarRows } from '@/lib/sheet/systemWords';
import { convertFromSi, formatNumber, formatQuantity, unitLabel, type UnitSystem } from '@/lib/units';
import { CheckFlagList } from './checkParts';

export function PackTable({ evaluation, units }: { evaluation: CandidateEvaluationOk; units: UnitSystem }) {
  const pack = evaluation.pack;
  if (!pack) return null;
  const rows = packBarRows(pack);
  const t = (c: number) => formatQuantity(c, 'temperature', units, { digits: 4 });
  return (
    <div className="min-w-0" data-testid="pack-table">
      <p className="text-caption text-ink-700" data-testid="pack-governing">
        Governs: <span className="font-semibold">{hottestBarText(pack, t)}</span> · the worst phase’s R_ac/R_dc {formatNumber(pack.acFactor, 4)}
      </p>
      <table className="mt-1 w-full text-caption">
        <caption className="mb-1 text-left text-ink-600">Every bar at {formatNumber(evaluation.designCurrentA, 4)} A (bars counted from the left on edge, from the bottom flat)</caption>
        <thead>
          <tr className="text-left text-ink-500">
            <th scope="col" className="pr-2 font-medium">Bar</th>
            <th scope="col" className="pr-2 text-right font-medium">Temperature ({unitLabel('temperature', units)})</th>
            <th scope="col" className="pr-2 text-right font-medium">Share of phase (%)</th>
            <th scope="col" className="pr-2 text-right font-medium">Current (A)</th>
            <th scope="col" className="pr-2 text-right font-medium">R_ac/R_dc</th>
            <th scope="col" className="text-right font-medium">Loss ({unitLabel('powerWPerM', units)})</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={`${r.phase}-${r.positionInPack}`} className={`border-t border-ink-100 ${r.governs ? 'font-semibold text-over-dark' : ''}`} data-testid={`pack-bar-${r.phase}-${r.positionInPack}`}>
              <th scope="row" className="py-0.5 pr-2 text-left font-normal">
                {r.governs ? <span aria-hidden="true">● </span> : null}
                {r.phase}, {r.bar}
                {r.governs ? ' (governs)' : ''}
              </th>
              <td className="num whitespace-nowrap pr-2 text-right">{formatNumber(convertFromSi(r.temperatureC, 'temperature', units), 4)}</td>
              <td className="num whitespace-nowrap pr-2 text-right">{formatNumber(r.shareOfPhase * 100, 3)}</td>
              <td className="num whitespace-nowrap pr-2 text-right">{formatNumber(r.currentA, 4)}</td>
              <td className="num whitespace-nowrap pr-2 text-right">{r.acFactor === null ? '—' : formatNumber(r.acFactor, 4)}</td>
              <td className="num whitespace-nowrap text-right">{formatNumber(convertFromSi(r.lossWPerM, 'powerWPerM', units), 3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-[0.6875rem] leading-4 text-ink-500">{pack.method.replace(/\.?$/, '.')}</p>
      <CheckFlagList flags={flagsOf(evaluation, PACK_FLAG_CODES)} testId="pack-flags" />
    </div>
  );
}

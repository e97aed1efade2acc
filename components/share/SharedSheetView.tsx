'use client';
import { DOCUMENT_UNITS_LINE } from '@/lib/units';
import { inputWarnings } from '@/lib/sheet/inputWarnings';
/**
 * The sizing sheet for a link holder: read-only, from the saved snapshot. The result strip with
 * the flags directly under it, the checks, the heat-balance profile and the hot-spot curves, the
 * candidate grid (a row click shows that candidate above) and the inputs with units. Nothing here
 * links to any other page of the team; nothing can be changed.
 */
import { useMemo, useState } from 'react';
import { ProfilePlot } from '@/components/plots/ProfilePlot';
import { HotSpotCurvePlot } from '@/components/plots/HotSpotCurvePlot';
import { CandidateGrid, candidateRows } from '@/components/sheet/CandidateGrid';
import { ChecksPanel } from '@/components/sheet/ChecksPanel';
import { CheckFlagList } from '@/components/sheet/checkParts';
import { FlagsPanel } from '@/components/sheet/FlagsPanel';
import { ResultStrip } from '@/components/sheet/ResultStrip';
import { useLiveComputation } from '@/components/sheet/useLiveComputation';
import { GroupPanel } from '@/components/sheet/GroupPanel';
import { BusbarResults } from '@/components/sheet/BusbarResults';
import { ProtectionPanel } from '@/components/sheet/ProtectionPanel';
import { FieldReportView } from '@/components/sheet/FieldReportView';
import { ReEvaluationNotice } from '@/components/sheet/ReEvaluationNotice';
import { arrangementSentences } from '@/lib/sheet/groupWords';
import { reEvaluationOf } from '@/lib/sheet/reEvaluation';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import type { OptionalCheckReport } from '@/lib/sheet/optionalChecksReport';
import type { SheetInputs } from '@/lib/sheet/schema';
import type { ResultSnapshot } from '@/lib/sheet/snapshot';
import { formatDate, inputRows } from '@/lib/sheet/sheetTables';

export interface SharedSheet {
  inputs: SheetInputs;
  result: ResultSnapshot | null;
  acknowledgements: { flagCode: string; comment: string; reviewerName: string | null }[];
  /** The optional checks switched on, for the chosen candidate, in words (lib/sheet/optionalChecksReport.ts). */
  optionalChecks: OptionalCheckReport[];
  /** ISO 4217 code of the team's money, named with every amount. */
  teamCurrency: string;
}

function OptionalChecks({ reports }: { reports: OptionalCheckReport[] }) {
  return (
    <section aria-labelledby="optional-heading" className="panel p-3" data-testid="shared-optional-checks">
      <h2 id="optional-heading" className="text-body font-semibold">
        Optional checks of the chosen candidate
      </h2>
      {reports.map((report) => (
        <div key={report.heading} className="mt-2">
          <h3 className="font-semibold">{report.heading.replace(' (chosen candidate)', '')}</h3>
          {report.lines.map((line, i) => (
            <p key={i} className="text-body">
              {line}
            </p>
          ))}
          {report.notComputed !== undefined ? (
            <p className="field-error">Not computed: {report.notComputed}</p>
          ) : (
            <>
              <p className="text-caption text-ink-500">{report.method}</p>
              <CheckFlagList flags={report.flags} testId="shared-optional-flags" />
            </>
          )}
        </div>
      ))}
    </section>
  );
}

const noop = () => {};

export function SharedSheetView({ sheet }: { sheet: SharedSheet }) {
  const snapshot = sheet.result;
  const evaluations = snapshot?.evaluations ?? null;
  const [focusedId, setFocusedId] = useState<string | null>(snapshot?.chosenCandidateId ?? sheet.inputs.candidates[0]?.id ?? null);
  const focused = evaluations?.find((e) => e.id === focusedId) ?? null;
  const focusedOk = focused && focused.ok ? focused : null;
  const isChosen = focusedId !== null && focusedId === snapshot?.chosenCandidateId;
  // The curves are not stored: they are drawn in this browser from the saved inputs, by the same library.
  const live = useLiveComputation(sheet.inputs, { enabled: sheet.inputs.candidates.length > 0, withCurves: true });
  const otherLabels = sheet.inputs.installation.otherCircuits.map((o) => o.label);
  const rows = candidateRows(sheet.inputs.candidates, evaluations, snapshot?.chosenCandidateId ?? null, 'si', otherLabels, 'No saved result');
  const reEvaluation = useMemo(() => reEvaluationOf(sheet.inputs, snapshot), [sheet.inputs, snapshot]);
  const arrangement = arrangementSentences(sheet.inputs);
  const limits = Object.fromEntries((evaluations ?? []).filter((e): e is CandidateEvaluationOk => e.ok).map((e) => [e.id, e.limit.temperatureC]));
  const flags = isChosen ? (snapshot?.chosenFlags ?? []) : (focusedOk?.flags ?? []);
  const inputs = inputRows(sheet.inputs, sheet.teamCurrency);

  return (
    <div className="grid gap-4 lg:grid-cols-[300px_minmax(0,1fr)]">
      <aside className="panel self-start p-3" aria-labelledby="inputs-heading">
        {arrangement.length > 0 ? (
          <div className="mb-2" data-testid="shared-arrangement">
            <h2 className="text-body font-semibold">Arrangement</h2>
            {arrangement.map((line) => (
              <p key={line} className="text-caption text-ink-800">
                {line}
              </p>
            ))}
          </div>
        ) : null}
        <h2 id="inputs-heading" className="text-body font-semibold">Inputs (SI units)</h2>
        <p className="text-caption text-ink-500" data-testid="shared-units-line">{DOCUMENT_UNITS_LINE}</p>
        <table className="mt-1 w-full text-caption" data-testid="shared-inputs">
          <tbody>
            {inputs.map((row, i) => (
              <tr key={`${row.section}-${row.label}`} className={i > 0 && inputs[i - 1].section !== row.section ? 'border-t border-ink-100' : ''}>
                <th scope="row" className="py-0.5 pr-2 text-left font-normal text-ink-600">
                  {row.label}
                </th>
                <td className="num py-0.5 text-right text-ink-900">
                  {row.value} {row.unit}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {sheet.inputs.notes.trim() ? <p className="mt-2 whitespace-pre-line text-caption text-ink-700">Designer’s notes: {sheet.inputs.notes}</p> : null}
        {inputWarnings(sheet.inputs).map((w) => (
          <p key={w.field} className="mt-2 text-caption text-tight-dark" data-testid="shared-input-warning">
            ▲ Input warning — {w.message}
          </p>
        ))}
      </aside>

      <div className="min-w-0 space-y-3">
        {reEvaluation ? <ReEvaluationNotice reEvaluation={reEvaluation} units="si" /> : null}
        <div className="sticky top-0 z-10 -mx-1 bg-paper px-1 pb-1 pt-0.5">
          <ResultStrip evaluation={focused} units="si" source={`saved result of ${formatDate(snapshot?.computedAt)}`} chosen={isChosen} otherLabels={otherLabels} />
        </div>
        <FlagsPanel
          flags={flags}
          heading={isChosen ? 'Assumption flags of the chosen candidate' : `Assumption flags of ${focusedOk?.label ?? 'this candidate'} (not the chosen one)`}
          acknowledgements={sheet.acknowledgements}
          canAcknowledge={false}
          onAcknowledge={noop}
          pendingCode={null}
        />
        {focusedOk ? <ChecksPanel evaluation={focusedOk} units="si" lengthM={sheet.inputs.circuit.lengthM} /> : null}
        {focusedOk && focusedOk.kind === 'cable' ? <GroupPanel evaluation={focusedOk} units="si" otherLabels={otherLabels} /> : null}
        {focusedOk && focusedOk.kind === 'bar' ? <BusbarResults evaluation={focusedOk} inputs={sheet.inputs} units="si" /> : null}
        {focusedOk ? <ProtectionPanel evaluation={focusedOk} inputs={sheet.inputs} /> : null}
        {isChosen && snapshot?.crossSection ? (
          <section aria-labelledby="shared-field-heading" className="panel p-3" data-testid="shared-cross-section-field">
            <h2 id="shared-field-heading" className="text-body font-semibold">
              Cross-section in two dimensions <span className="text-caption font-normal text-ink-500">(beside the IEC rating, as saved)</span>
            </h2>
            {snapshot.crossSection.ok ? <FieldReportView report={snapshot.crossSection.report} units="si" otherLabels={otherLabels} /> : <p className="field-error">Not computed: {snapshot.crossSection.message}</p>}
          </section>
        ) : null}
        {sheet.optionalChecks.length > 0 ? <OptionalChecks reports={sheet.optionalChecks} /> : null}
        {sheet.inputs.candidates.length > 0 ? (
          <div className="grid gap-3 xl:grid-cols-2">
            <section className="panel p-2" aria-label="Heat-balance profile">
              {focusedOk?.profile ? (
                <ProfilePlot profile={focusedOk.profile} limitC={focusedOk.limit.temperatureC} limitLabel={focusedOk.limit.layer ?? focusedOk.limit.source} units="si" title={`Heat-balance profile: ${focusedOk.label}`} />
              ) : (
                <p className="p-4 text-caption text-ink-500">No heat-balance profile for this candidate (no steady state, or no result).</p>
              )}
            </section>
            <section className="panel p-2" aria-label="Hot spot versus current">
              {live.curves.length > 0 ? (
                <HotSpotCurvePlot curves={live.curves} designCurrentA={sheet.inputs.circuit.designCurrentA} limits={limits} units="si" />
              ) : (
                <p className="p-4 text-caption text-ink-500">{live.computing || !live.computation ? 'Drawing the hot-spot curves in your browser…' : 'No curves: the candidates have no result.'}</p>
              )}
            </section>
          </div>
        ) : null}
        <section aria-labelledby="compare-heading" className="panel p-3">
          <h2 id="compare-heading" className="mb-2 text-body font-semibold">
            Candidates compared <span className="font-normal text-ink-500">— click a row to see it above</span>
          </h2>
          {rows.length === 0 ? <p className="text-caption text-ink-500">No candidates on this sheet.</p> :  <CandidateGrid rows={rows} units="si" currency={sheet.teamCurrency} focusedId={focusedId} onFocus={setFocusedId} onChoose={noop} onRemove={noop} editable={false} />}
        </section>
      </div>
    </div>
  );
}

'use client';
/**
 * "Solve the cross-section": beside the IEC rating of a buried circuit, the option to solve the
 * ground around the cables in two dimensions (lib/sheet/crossSectionField.ts). The option and the
 * ground surface are sheet inputs (saved: the server then stores the chosen candidate's field with
 * the snapshot); the solve for the candidate in focus runs in a Web Worker with its progress shown,
 * and can be cancelled. A sheet that cannot be edited shows the field stored with it.
 */
import type { UseFormReturnType } from '@mantine/form';
import type { FieldCheckOutcome } from '@/lib/sheet/crossSectionField';
import { DEFAULT_SOURCES, type SheetInputs } from '@/lib/sheet/schema';
import type { UnitSystem } from '@/lib/units';
import { FieldReportView } from './FieldReportView';
import { NumberField } from './NumberField';
import { fieldInputsKey, useFieldSolve } from './useFieldSolve';

export function CrossSectionFieldPanel({
  form,
  editable,
  candidateId,
  candidateLabel,
  units,
  otherLabels = [],
  stored,
}: {
  form: UseFormReturnType<SheetInputs>;
  editable: boolean;
  /** The cable candidate in focus (null when it has no result). */
  candidateId: string | null;
  candidateLabel: string | null;
  units: UnitSystem;
  otherLabels?: readonly string[];
  /** The field stored with the snapshot (the chosen candidate), shown when nothing was solved here. */
  stored: { outcome: FieldCheckOutcome; candidateLabel: string | null } | null;
}) {
  const values = form.values;
  const option = values.crossSection;
  const buried = values.installation.kind === 'buried';
  const { state, run, cancel } = useFieldSolve();
  const running = state.status === 'running';
  const solve = () => {
    if (candidateId) run(form.getValues(), candidateId);
  };
  const currentKey = fieldInputsKey(values);
  const stale = (state.status === 'done' || state.status === 'error') && (state.inputsKey !== currentKey || state.candidateId !== candidateId);
  const share = state.status === 'running' && state.progress ? state.progress.share : 0;

  return (
    <section aria-labelledby="field-heading" className="panel p-3" data-testid="cross-section-field">
      <h2 id="field-heading" className="text-body font-semibold">
        Cross-section in two dimensions <span className="text-caption font-normal text-ink-500">(beside the IEC rating)</span>
      </h2>
      <label className="mt-2 flex items-start gap-2">
        <input
          type="checkbox"
          className="mt-1"
          data-testid="field-checked"
          checked={option.checked}
          // Unticking stays possible when the installation is no longer buried.
          disabled={!editable || (!buried && !option.checked)}
          onChange={(e) => {
            form.setFieldValue('crossSection.checked', e.target.checked);
            if (e.target.checked && candidateId && buried) run({ ...form.getValues(), crossSection: { ...option, checked: true } }, candidateId);
          }}
        />
        <span>
          Solve the cross-section: the ground around the cables as a two-dimensional field, each cable’s temperature beside the IEC result. When saved, the server stores the chosen candidate’s field with the result.
        </span>
      </label>
      {!buried ? <p className="text-caption text-ink-500">For buried cables only{option.checked ? ': untick it, or make the installation buried' : ''}.</p> : null}
      {option.checked && buried ? (
        <fieldset className="mt-2 space-y-2">
          <legend className="sr-only">Ground surface of the cross-section</legend>
          <div className="grid grid-cols-1 gap-2 md:grid-cols-2">
            <label className="block">
              <span className="field-label">Ground surface</span>
              <select
                className="field-input"
                data-testid="field-surface"
                value={option.surface}
                disabled={!editable}
                onChange={(e) => form.setFieldValue('crossSection.surface', e.target.value as SheetInputs['crossSection']['surface'])}
              >
                <option value="isothermal">held at the ground temperature (as IEC 60287)</option>
                <option value="convective">gives heat to the air through a coefficient</option>
              </select>
            </label>
            {option.surface === 'convective' ? (
              <NumberField
                field="crossSection.heatTransferCoefficientWPerM2K"
                label="Surface to air"
                units={units}
                value={option.heatTransferCoefficientWPerM2K}
                disabled={!editable}
                error={form.errors['crossSection.heatTransferCoefficientWPerM2K'] as string | undefined}
                help={DEFAULT_SOURCES.groundSurfaceCoefficientWPerM2K}
                testId="field-h"
                onChange={(v) => form.setFieldValue('crossSection.heatTransferCoefficientWPerM2K', v as number)}
              />
            ) : null}
          </div>
        </fieldset>
      ) : null}
      {buried && option.checked ? (
        <div className="mt-2 flex flex-wrap items-center gap-2">
          <button type="button" className="btn-primary" data-testid="run-field" disabled={!candidateId || running} onClick={solve}>
            {running ? 'Solving…' : `Solve the cross-section${candidateLabel ? ` for ${candidateLabel}` : ''}`}
          </button>
          {running ? (
            <button type="button" className="btn-quiet" data-testid="cancel-field" onClick={cancel}>
              Cancel
            </button>
          ) : null}
          {!candidateId ? <span className="text-caption text-ink-500">The candidate in focus needs a result first.</span> : null}
        </div>
      ) : null}
      {running ? (
        <div className="mt-2" data-testid="field-progress">
          <div role="progressbar" aria-label="Solving the cross-section" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(share * 100)} className="h-2 w-full overflow-hidden rounded bg-ink-100">
            <div className="h-full bg-copper-600 transition-[width]" style={{ width: `${Math.round(share * 100)}%` }} />
          </div>
          <p className="mt-1 text-caption text-ink-600" aria-live="polite" data-testid="field-progress-text">
            {state.status === 'running' && state.progress ? state.progress.message : 'Starting the background solve'}… you can keep typing.
          </p>
        </div>
      ) : null}
      {state.status === 'cancelled' ? <p className="mt-2 text-caption text-ink-600" data-testid="field-cancelled">The solve was cancelled.</p> : null}
      {stale ? <p className="mt-2 text-caption text-tight-dark" data-testid="field-stale">The inputs or the candidate in focus changed since this solve: solve again for a current figure.</p> : null}
      {state.status === 'error' ? <p className="field-error mt-2" data-testid="field-error">The cross-section could not be solved: {state.message}</p> : null}
      {state.status === 'done' ? (
        <div className="mt-3">
          <FieldReportView report={state.report} units={units} otherLabels={otherLabels} />
        </div>
      ) : stored && state.status === 'idle' ? (
        <div className="mt-3" data-testid="field-stored">
          <p className="mb-1 text-caption text-ink-600">As stored with the saved result{stored.candidateLabel ? ` for ${stored.candidateLabel}` : ''}.</p>
          {stored.outcome.ok ? <FieldReportView report={stored.outcome.report} units={units} otherLabels={otherLabels} /> : <p className="field-error">Not computed: {stored.outcome.message}</p>}
        </div>
      ) : null}
    </section>
  );
}

'use client';
/**
 * The bus-bar system on the sheet (sheet inputs version 6, lib/sheet/systemSchema.ts): the gap
 * between a pack's bars, the phase spacing, the supports (span, how the bars are held, rated
 * strength), the peak factor κ or the fault's R/X, and how the bars of a pack share heat. The bars
 * per phase are each candidate's own (chosen when the candidate is added); the arrangement is the
 * installation's kind. Every number goes through NumberField (the user's units, stored SI); errors
 * name their field — the form's own, or the library's refusal (packs overlapping…).
 */
import type { UseFormReturnType } from '@mantine/form';
import type { SheetInputs } from '@/lib/sheet/schema';
import type { SheetNumericField } from '@/lib/sheet/formUnits';
import { SUPPORT_WORDS, supportArrangements, SYSTEM_HELP, type SheetSupportArrangement } from '@/lib/sheet/systemSchema';
import type { UnitSystem } from '@/lib/units';
import { NumberField } from './NumberField';

type Form = UseFormReturnType<SheetInputs>;

const help = 'text-[0.6875rem] leading-4 text-ink-500';

export function BusbarSystemInputs({
  form,
  units,
  disabled,
  externalErrors = {},
}: {
  form: Form;
  units: UnitSystem;
  disabled: boolean;
  /** Errors from outside the form's schema, by field path (the library refusing the system). */
  externalErrors?: Record<string, string>;
}) {
  const values = form.values;
  const b = values.busbarSystem;
  const placement = values.installation.kind === 'enclosure' ? values.installation.enclosureInside : values.installation.kind;
  const errorAt = (path: string) => (form.errors[path] as string | undefined) ?? externalErrors[path];
  const num = (field: SheetNumericField & `busbarSystem.${string}`, label: string, value: number | null, extra: { help?: string; nullable?: boolean; placeholder?: string; testId?: string } = {}) => (
    <NumberField key={field} field={field} label={label} units={units} value={value} onChange={(v) => form.setFieldValue(field, v as never)} error={errorAt(field)} disabled={disabled} {...extra} />
  );
  const bars = values.candidates.filter((c) => c.kind === 'bar');
  const packs = bars.some((c) => c.kind === 'bar' && (c.barsPerPhase ?? 1) > 1);

  return (
    <fieldset className="space-y-2 rounded border border-ink-100 p-2" data-testid="busbar-system-inputs">
      <legend className="px-1 text-caption font-semibold text-ink-700">Bus-bar system</legend>
      <p className={help}>
        Bars {placement === 'bar-flat' ? 'laid flat' : 'on edge'}, three phases side by side (set under “How it is installed”). Bars per phase are each candidate’s own:{' '}
        {bars.length === 0 ? 'add bar candidates below the results.' : bars.map((c) => `${c.label} — ${c.kind === 'bar' ? (c.barsPerPhase ?? 1) : 1} per phase`).join('; ')}.
      </p>
      <div className="grid grid-cols-2 gap-2">
        {num('busbarSystem.phaseSpacingM', 'Phase spacing', b.phaseSpacingM, { nullable: true, placeholder: 'assumed', testId: 'input-phase-spacing' })}
        {num('busbarSystem.barGapM', 'Gap between bars', b.barGapM, { nullable: true, placeholder: packs ? 'bar thickness' : 'one bar per phase', testId: 'input-bar-gap' })}
      </div>
      <p className={help}>
        {SYSTEM_HELP.phaseSpacingM} {SYSTEM_HELP.barGapM}
      </p>
      <div className="grid grid-cols-2 gap-2">
        {num('busbarSystem.supportSpacingM', 'Support spacing', b.supportSpacingM, { nullable: true, placeholder: 'not described', testId: 'input-support-spacing' })}
        {num('busbarSystem.spacerSpacingM', 'Spacer spacing', b.spacerSpacingM, { nullable: true, placeholder: 'at the supports' })}
      </div>
      <div>
        <label htmlFor="busbar-supports" className="field-label">How the bars are held</label>
        <select
          id="busbar-supports"
          data-testid="input-supports"
          className="field-input py-1"
          value={b.supports ?? ''}
          disabled={disabled}
          aria-invalid={errorAt('busbarSystem.supports') ? true : undefined}
          onChange={(e) => form.setFieldValue('busbarSystem.supports', (e.target.value === '' ? null : e.target.value) as SheetSupportArrangement | null)}
        >
          <option value="">Not described (forces not checked)</option>
          {supportArrangements.map((s) => (
            <option key={s} value={s}>
              {SUPPORT_WORDS[s]}
            </option>
          ))}
        </select>
        <p className="field-error" aria-live="polite">{errorAt('busbarSystem.supports') ?? ''}</p>
      </div>
      {num('busbarSystem.supportStrengthN', 'Rated strength of a support', b.supportStrengthN, { nullable: true, placeholder: 'not entered', testId: 'input-support-strength' })}
      <p className={help}>{SYSTEM_HELP.supports}</p>
      <div className="grid grid-cols-2 gap-2">
        <div>
          <label htmlFor="busbar-peak-by" className="field-label">Peak factor κ</label>
          <select
            id="busbar-peak-by"
            data-testid="input-peak-by"
            className="field-input py-1"
            value={b.peakFactorBy}
            disabled={disabled}
            onChange={(e) => form.setFieldValue('busbarSystem.peakFactorBy', e.target.value as SheetInputs['busbarSystem']['peakFactorBy'])}
          >
            <option value="assumed">Assumed 2.0 (flagged)</option>
            <option value="r-over-x">From the fault’s R/X</option>
            <option value="kappa">Entered</option>
          </select>
        </div>
        {b.peakFactorBy === 'r-over-x' ? num('busbarSystem.rOverX', 'R/X', b.rOverX, { testId: 'input-r-over-x' }) : null}
        {b.peakFactorBy === 'kappa' ? num('busbarSystem.kappa', 'κ', b.kappa, { testId: 'input-kappa' }) : null}
      </div>
      <p className={help}>{SYSTEM_HELP.peakFactor}</p>
      {packs ? (
        <div>
          <label htmlFor="busbar-pack-nodes" className="field-label">Bars of a pack</label>
          <select
            id="busbar-pack-nodes"
            className="field-input py-1"
            value={b.packNodes}
            disabled={disabled}
            onChange={(e) => form.setFieldValue('busbarSystem.packNodes', e.target.value as SheetInputs['busbarSystem']['packNodes'])}
          >
            <option value="per-bar">Each at its own temperature (cautious)</option>
            <option value="per-pack">Bonded to one temperature by the spacers (optimistic, flagged)</option>
          </select>
        </div>
      ) : null}
    </fieldset>
  );
}

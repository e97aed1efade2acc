'use client';
import type { UseFormReturnType } from '@mantine/form';
import type { ReactNode } from 'react';
import { DEFAULT_SOURCES, type SheetInputs } from '@/lib/sheet/schema';
import { displayText, messageInDisplayUnit, type SheetNumericField } from '@/lib/sheet/formUnits';
import { quantitiesInWords, type UnitSystem } from '@/lib/units';
import { NumberField } from './NumberField';
import { inputWarnings } from '@/lib/sheet/inputWarnings';
import { ArrangementInputs } from './ArrangementInputs';
import { BusbarSystemInputs } from './BusbarSystemInputs';
import { ProtectionInputs } from './ProtectionInputs';

type Form = UseFormReturnType<SheetInputs>;

function Section({ title, children, open = true }: { title: string; children: ReactNode; open?: boolean }) {
  return (
    <details open={open} className="group border-b border-ink-100 py-2 last:border-0">
      <summary className="cursor-pointer select-none text-body font-semibold text-ink-800 marker:text-ink-400">{title}</summary>
      <div className="mt-2 space-y-2">{children}</div>
    </details>
  );
}

function getIn(values: SheetInputs, path: string): unknown {
  return path.split('.').reduce<unknown>((v, key) => (v as Record<string, unknown> | undefined)?.[key], values);
}

export function InputsForm({
  form,
  units,
  disabled,
  externalErrors = {},
  arrangementProblem = null,
}: {
  form: Form;
  units: UnitSystem;
  disabled: boolean;
  /** Errors the library raised for fields of the form (an arrangement that does not fit), by field path. */
  externalErrors?: Record<string, string>;
  /** The same in one sentence, shown at the top of the installation. */
  arrangementProblem?: string | null;
}) {
  const values = form.values;
  const warnings = new Map(inputWarnings(values, units).map((w) => [w.field, w.message]));
  const num = (field: SheetNumericField, label: string, extra: { help?: string; nullable?: boolean; placeholder?: string; testId?: string } = {}) => (
    <NumberField
      key={field}
      field={field}
      label={label}
      units={units}
      value={getIn(values, field) as number | null}
      onChange={(v) => form.setFieldValue(field, v as never)}
      error={messageInDisplayUnit(field, (form.errors[field] as string | undefined) ?? externalErrors[field])}
      disabled={disabled}
      warning={warnings.get(field)}
      {...extra}
    />
  );
  const checkbox = (path: string, label: string, testId?: string) => (
    <label className="flex items-center gap-2 text-body">
      <input
        type="checkbox"
        data-testid={testId}
        className="h-4 w-4 accent-copper-500"
        checked={Boolean(getIn(values, path))}
        disabled={disabled}
        onChange={(e) => form.setFieldValue(path, e.target.checked as never)}
      />
      {label}
    </label>
  );
  const kind = values.installation.kind;
  const placement = kind === 'enclosure' ? values.installation.enclosureInside : kind;
  const cables = placement === 'cable-in-air' || placement === 'buried';
  const buried = kind === 'buried';

  return (
    <form aria-label="Circuit inputs" onSubmit={(e) => e.preventDefault()} noValidate>
      <fieldset disabled={disabled} className="contents">
        <Section title="Circuit">
          {num('circuit.designCurrentA', 'Design current', { testId: 'input-design-current' })}
          <div className="grid grid-cols-2 gap-2">
            {num('circuit.nominalVoltageV', 'Voltage U₀', { help: DEFAULT_SOURCES.nominalVoltageV })}
            <div>
              <label htmlFor="phases" className="field-label">Phases</label>
              <select id="phases" className="field-input py-1" value={values.circuit.phases} onChange={(e) => form.setFieldValue('circuit.phases', Number(e.target.value) as 1 | 3)}>
                <option value={3}>3</option>
                <option value={1}>1</option>
              </select>
            </div>
          </div>
          <div className="grid grid-cols-2 gap-2">
            {num('circuit.frequencyHz', 'Frequency', { testId: 'input-frequency' })}
            {num('circuit.powerFactor', 'Power factor', { testId: 'input-power-factor' })}
          </div>
          <p className="text-[0.6875rem] leading-4 text-ink-500">{DEFAULT_SOURCES.frequencyHz} {DEFAULT_SOURCES.powerFactor}</p>
          {num('circuit.lengthM', 'Route length', { testId: 'input-length' })}
          <div className="grid grid-cols-2 gap-2">
            {num('circuit.maxVoltageDropPercent', 'Allowed drop', { nullable: true, placeholder: 'no limit' })}
            {num('circuit.reactanceOhmPerM', 'Reactance', { nullable: true, placeholder: `${displayText('circuit.reactanceOhmPerM', 0.08e-3, units)} (Annex G)` })}
          </div>
          <p className="text-[0.6875rem] leading-4 text-ink-500">{DEFAULT_SOURCES.maxVoltageDropPercent} {quantitiesInWords(DEFAULT_SOURCES.reactanceOhmPerM, units)}</p>
        </Section>

        <Section title="Fault">
          {checkbox('fault.checked', 'Check the short-circuit withstand')}
          {values.fault.checked ? (
            <>
              <div className="grid grid-cols-2 gap-2">
                {num('fault.currentA', 'Fault current', { testId: 'input-fault-current' })}
                {num('fault.durationS', 'Clearing time')}
              </div>
              <p className="text-[0.6875rem] leading-4 text-ink-500">{DEFAULT_SOURCES.fault}</p>
            </>
          ) : (
            <p className="text-caption text-tight-dark">Not checked: the sheet carries a review flag saying so.</p>
          )}
        </Section>

        <ProtectionInputs form={form} units={units} disabled={disabled} externalErrors={externalErrors} />

        <Section title="Installation">
          <div>
            <label htmlFor="installation-kind" className="field-label">How it is installed</label>
            <select
              id="installation-kind"
              className="field-input py-1"
              value={kind}
              onChange={(e) => {
                const next = e.target.value as SheetInputs['installation']['kind'];
                form.setFieldValue('installation.kind', next);
                // Nothing buried sees sun or wind; clear them rather than leave a contradiction.
                if (next === 'buried') {
                  form.setFieldValue('environment.outdoorSun', false);
                  form.setFieldValue('environment.windSpeedMPerS', 0);
                }
              }}
            >
              <option value="bar-on-edge">Bus bar on edge, in air</option>
              <option value="bar-flat">Bus bar laid flat, in air</option>
              <option value="cable-in-air">Cable in air</option>
              <option value="buried">Cable buried in the ground</option>
              <option value="enclosure">In an enclosure (derating by hand)</option>
            </select>
          </div>
          {kind === 'enclosure' ? (
            <>
              <div>
                <label htmlFor="enclosure-inside" className="field-label">Inside the enclosure</label>
                <select id="enclosure-inside" className="field-input py-1" value={values.installation.enclosureInside} onChange={(e) => form.setFieldValue('installation.enclosureInside', e.target.value as SheetInputs['installation']['enclosureInside'])}>
                  <option value="bar-on-edge">Bars on edge</option>
                  <option value="bar-flat">Bars flat</option>
                  <option value="cable-in-air">Cables</option>
                </select>
              </div>
              {num('installation.enclosureDerating', 'Enclosure derating factor', { help: DEFAULT_SOURCES.enclosureDerating })}
            </>
          ) : null}
          {cables && arrangementProblem ? (
            <p role="alert" className="rounded border border-over bg-over-light px-2 py-1 text-caption text-over-dark" data-testid="arrangement-problem">
              ✖ {arrangementProblem}
            </p>
          ) : null}
          {buried ? (
            <>
              {num('installation.depthM', 'Depth to the cable axis', { help: DEFAULT_SOURCES.depthM, testId: 'input-depth' })}
              {num('installation.soilResistivityKmPerW', 'Soil thermal resistivity', { nullable: true, help: DEFAULT_SOURCES.soilResistivityKmPerW })}
              {num('installation.groundC', 'Ground temperature', { nullable: true, help: DEFAULT_SOURCES.groundC })}
            </>
          ) : null}
          {cables ? <ArrangementInputs form={form} units={units} disabled={disabled} externalErrors={externalErrors} /> : null}
          {!cables ? <BusbarSystemInputs form={form} units={units} disabled={disabled} externalErrors={externalErrors} /> : null}
          {num('limits.groupingFactor', 'Grouping factor', { help: DEFAULT_SOURCES.groupingFactor })}
        </Section>

        {!buried ? (
          <Section title="Surroundings">
            {num('environment.ambientC', 'Ambient air', { nullable: true, help: DEFAULT_SOURCES.ambientC, testId: 'input-ambient' })}
            {num('environment.windSpeedMPerS', 'Air speed across it', { help: DEFAULT_SOURCES.windSpeedMPerS })}
            {checkbox('environment.outdoorSun', 'Outdoors, in the sun')}
            {values.environment.outdoorSun ? (
              <>
                {num('environment.irradianceWPerM2', 'Sun irradiance', { help: DEFAULT_SOURCES.irradianceWPerM2 })}
                {num('environment.solarAbsorptivity', 'Solar absorptivity', { nullable: true, help: DEFAULT_SOURCES.solarAbsorptivity })}
              </>
            ) : null}
            {form.errors['environment.outdoorSun'] ? <p className="field-error">{String(form.errors['environment.outdoorSun'])}</p> : null}
          </Section>
        ) : null}

        <Section title="Temperature limit" open={false}>
          {num('limits.temperatureLimitC', 'Your own limit', { nullable: true, help: DEFAULT_SOURCES.temperatureLimitC, testId: 'input-own-limit' })}
          {values.limits.temperatureLimitC !== null ? checkbox('limits.raiseMaterialLimit', 'Replace the material limits even where higher (flagged)', 'raise-limit') : null}
          {values.limits.temperatureLimitC !== null && values.limits.raiseMaterialLimit ? (
            <div>
              <label htmlFor="raise-justification" className="field-label">Why the raised limit is safe (for the reviewer)</label>
              <textarea
                id="raise-justification"
                data-testid="raise-justification"
                rows={3}
                className="field-input"
                aria-describedby="raise-justification-help"
                value={values.limits.raiseJustification}
                onChange={(e) => form.setFieldValue('limits.raiseJustification', e.target.value)}
              />
              <p id="raise-justification-help" className="mt-0.5 text-[0.6875rem] leading-4 text-ink-500">
                The maker’s evidence or test report. While this is empty, a limit above a material rating blocks the result; the reviewer accepts the reason before approving.
              </p>
            </div>
          ) : null}
          {form.errors['limits.temperatureLimitC'] ? null : null}
        </Section>

        <Section title="Life-cycle cost" open={values.economics.included}>
          {checkbox('economics.included', 'Include the cost of losses')}
          {values.economics.included ? (
            <>
              <div>
                <label htmlFor="energy-price" className="field-label">Energy price (per kWh)</label>
                <input
                  id="energy-price"
                  className="field-input num py-1"
                  inputMode="decimal"
                  value={values.economics.energyPricePerKWh}
                  aria-invalid={form.errors['economics.energyPricePerKWh'] ? true : undefined}
                  onChange={(e) => form.setFieldValue('economics.energyPricePerKWh', e.target.value.trim())}
                />
                <p className="field-error">{(form.errors['economics.energyPricePerKWh'] as string) ?? ''}</p>
                <p className="-mt-0.5 text-[0.6875rem] leading-4 text-ink-500">{DEFAULT_SOURCES.energyPricePerKWh}</p>
              </div>
              <div className="grid grid-cols-2 gap-2">
                {num('economics.lossLoadFactor', 'Loss load factor')}
                {num('economics.hoursPerYear', 'Hours per year')}
                {num('economics.discountRatePercent', 'Discount rate')}
                {num('economics.years', 'Economic life')}
                {num('economics.loadGrowthPercent', 'Load growth')}
                {num('economics.energyPriceGrowthPercent', 'Price growth')}
              </div>
              <p className="text-[0.6875rem] leading-4 text-ink-500">{DEFAULT_SOURCES.lossLoadFactor} {DEFAULT_SOURCES.discountRatePercent} {DEFAULT_SOURCES.years} Method: IEC 60287-3-2 (present value of losses).</p>
            </>
          ) : null}
        </Section>

        <Section title="Notes" open={false}>
          <label htmlFor="sheet-notes" className="sr-only">Notes</label>
          <textarea id="sheet-notes" rows={3} className="field-input" value={values.notes} onChange={(e) => form.setFieldValue('notes', e.target.value)} />
        </Section>
      </fieldset>
    </form>
  );
}

'use client';
/**
 * The "Protection" block of the sheet (sheet inputs version 6, lib/sheet/systemSchema.ts): the
 * circuit's protective device (IEC 60898-1 breaker B/C/D, IEC 60947-2 adjustable breaker, gG fuse)
 * with its rating, setting, I₂ and trip data, whether it is a final or a distribution circuit and
 * the earthing, the source impedance, the protective conductor, and the third-harmonic content.
 * Keyboard-usable native controls; numbers through NumberField (the user's units, stored SI);
 * every error is shown on its field.
 */
import { useEffect, useState } from 'react';
import type { UseFormReturnType } from '@mantine/form';
import type { SheetInputs } from '@/lib/sheet/schema';
import type { SheetNumericField } from '@/lib/sheet/formUnits';
import { DEVICE_KIND_WORDS, deviceKinds, SYSTEM_HELP, type SheetDeviceKind } from '@/lib/sheet/systemSchema';
import type { UnitSystem } from '@/lib/units';
import { NumberField } from './NumberField';
import { useDecimalSeparator } from '@/components/providers/NumberFormatProvider';
import { parseNumber, writeNumber, type DecimalSeparator } from '@/lib/units/parse';
import { useUnreadFields } from './unreadFields';

/** Under a decimal comma the items are separated by ';' or spaces; under a point also by ','. */
const itemSplitter = (separator: DecimalSeparator) => (separator === ',' ? /[;\s]+/ : /[,;\s]+/);
const listText = (values: number[], separator: DecimalSeparator) => values.map((v) => writeNumber(String(v), separator)).join(separator === ',' ? '; ' : ', ');

type Form = UseFormReturnType<SheetInputs>;

const help = 'text-[0.6875rem] leading-4 text-ink-500';

/** A list of numbers typed as "1000, 1250, 1600" (the trip unit's settings). */
function NumberListField({ id, label, values, onChange, disabled, error }: { id: string; label: string; values: number[]; onChange: (v: number[]) => void; disabled: boolean; error?: string }) {
  const separator = useDecimalSeparator();
  const { report } = useUnreadFields();
  const [text, setText] = useState(listText(values, separator));
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => () => report(id, null), [report, id]);
  useEffect(() => {
    const parsed = text.split(itemSplitter(separator)).filter(Boolean).map((p) => {
      const r = parseNumber(p, { decimalSeparator: separator, field: label });
      return r.ok ? r.value : Number.NaN;
    });
    if (parsed.join(',') !== values.join(',')) setText(listText(values, separator));
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when the stored list changes
  }, [values.join(',')]);
  const shown = problem ?? error;
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
        <span className="normal-case tracking-normal text-ink-400"> (A)</span>
      </label>
      <input
        id={id}
        className="field-input num py-1"
        inputMode="decimal"
        value={text}
        placeholder={separator === ',' ? 'e.g. 1000; 1250; 1600; 2000' : 'e.g. 1000, 1250, 1600, 2000'}
        disabled={disabled}
        aria-invalid={shown ? true : undefined}
        aria-describedby={`${id}-error`}
        onChange={(e) => {
          setText(e.target.value);
          const parts = e.target.value.split(itemSplitter(separator)).filter(Boolean);
          const numbers: number[] = [];
          for (const part of parts) {
            const r = parseNumber(part, { decimalSeparator: separator, field: label });
            if (!r.ok) {
              const message = `${r.message} (separate the settings with ${separator === ',' ? '";" or spaces' : 'commas'})`;
              setProblem(message);
              report(id, message);
              return;
            }
            numbers.push(r.value);
          }
          setProblem(null);
          report(id, null);
          onChange(numbers);
        }}
      />
      <p id={`${id}-error`} className="field-error" aria-live="polite">{shown ?? ''}</p>
    </div>
  );
}

export function ProtectionInputs({
  form,
  units,
  disabled,
  externalErrors = {},
}: {
  form: Form;
  units: UnitSystem;
  disabled: boolean;
  externalErrors?: Record<string, string>;
}) {
  const values = form.values;
  const p = values.protection;
  const d = p.device;
  const errorAt = (path: string) => (form.errors[path] as string | undefined) ?? externalErrors[path];
  const num = (path: string, unitField: SheetNumericField, label: string, value: number | null, extra: { help?: string; nullable?: boolean; placeholder?: string; testId?: string } = {}) => (
    <NumberField key={path} field={unitField} label={label} units={units} value={value} onChange={(v) => form.setFieldValue(path, v as never)} error={errorAt(path)} disabled={disabled} {...extra} />
  );
  const select = <T extends string>(id: string, path: string, label: string, value: T, options: ReadonlyArray<[T, string]>, testId?: string) => (
    <div>
      <label htmlFor={id} className="field-label">{label}</label>
      <select id={id} data-testid={testId} className="field-input py-1" value={value} disabled={disabled} aria-invalid={errorAt(path) ? true : undefined} onChange={(e) => form.setFieldValue(path, e.target.value as never)}>
        {options.map(([v, words]) => (
          <option key={v} value={v}>
            {words}
          </option>
        ))}
      </select>
      <p className="field-error" aria-live="polite">{errorAt(path) ?? ''}</p>
    </div>
  );
  const checkbox = (path: string, label: string, checked: boolean, testId: string) => (
    <label className="flex items-center gap-2 text-body">
      <input type="checkbox" data-testid={testId} className="h-4 w-4 accent-copper-500" checked={checked} disabled={disabled} onChange={(e) => form.setFieldValue(path, e.target.checked as never)} />
      {label}
    </label>
  );
  const curve = d.timeCurrentCurve;
  const setCurve = (next: SheetInputs['protection']['device']['timeCurrentCurve']) => form.setFieldValue('protection.device.timeCurrentCurve', next);

  return (
    <details open={p.included || values.harmonics.thirdHarmonicPercent !== null} className="group border-b border-ink-100 py-2 last:border-0" data-testid="protection-inputs">
      <summary className="cursor-pointer select-none text-body font-semibold text-ink-800 marker:text-ink-400">Protection</summary>
      <div className="mt-2 space-y-2">
        {checkbox('protection.included', 'Check the protective device of this circuit', p.included, 'input-protection-included')}
        {!p.included ? <p className="text-caption text-ink-600">Not described: overload coordination, disconnection and the protective conductor are not checked.</p> : null}
        {p.included ? (
          <>
            {select<SheetDeviceKind>('device-kind', 'protection.device.kind', 'Device', d.kind, deviceKinds.map((k) => [k, DEVICE_KIND_WORDS[k]]), 'input-device-kind')}
            <div className="grid grid-cols-2 gap-2">
              {d.kind === 'breaker-iec60898-1' ? select('device-curve', 'protection.device.curve', 'Curve', d.curve, [['B', 'B (3–5 I_n)'], ['C', 'C (5–10 I_n)'], ['D', 'D (10–20 I_n)']], 'input-device-curve') : null}
              {num('protection.device.ratedCurrentA', 'protection.device.ratedCurrentA', d.kind === 'breaker-iec60947-2' ? 'Rated current' : 'Rating I_n', d.ratedCurrentA, { testId: 'input-device-rating' })}
              {d.kind === 'breaker-iec60947-2' ? (
                <>
                  {num('protection.device.settingCurrentA', 'protection.device.settingCurrentA', 'Setting I_r', d.settingCurrentA, { nullable: true, placeholder: 'required', testId: 'input-device-setting' })}
                  {num('protection.device.instantaneousCurrentA', 'protection.device.instantaneousCurrentA', 'Instantaneous I_i', d.instantaneousCurrentA, { nullable: true, placeholder: 'required', testId: 'input-device-instantaneous' })}
                  {num('protection.device.instantaneousMaxTimeS', 'protection.device.instantaneousMaxTimeS', 'Its break time', d.instantaneousMaxTimeS, { nullable: true, placeholder: '0.1 assumed' })}
                </>
              ) : null}
              {num('protection.device.conventionalOperatingCurrentA', 'protection.device.conventionalOperatingCurrentA', 'I₂ (optional)', d.conventionalOperatingCurrentA, { nullable: true, placeholder: 'by the standard' })}
            </div>
            {d.kind === 'breaker-iec60947-2' ? (
              <NumberListField id="device-settings" label="Trip-unit settings for the smallest one" values={d.settingStepsA} onChange={(v) => form.setFieldValue('protection.device.settingStepsA', v)} disabled={disabled} error={errorAt('protection.device.settingStepsA')} />
            ) : null}
            <p className={help}>{SYSTEM_HELP.device}</p>

            <fieldset className="rounded border border-ink-100 p-2" data-testid="device-curve-points">
              <legend className="px-1 text-caption font-semibold text-ink-700">Time–current curve ({curve.length} points)</legend>
              <ol className="space-y-1">
                {curve.map((point, index) => (
                  <li key={index} className="flex items-end gap-2">
                    <div className="grid flex-1 grid-cols-2 gap-2">
                      {num(`protection.device.timeCurrentCurve.${index}.currentA`, 'protection.device.timeCurrentCurve.currentA', `Point ${index + 1} current`, point.currentA)}
                      {num(`protection.device.timeCurrentCurve.${index}.timeS`, 'protection.device.timeCurrentCurve.timeS', `Point ${index + 1} time`, point.timeS)}
                    </div>
                    <button type="button" className="btn-quiet mb-5 py-1 text-caption" aria-label={`Remove point ${index + 1}`} disabled={disabled} onClick={() => setCurve(curve.filter((_, k) => k !== index))}>
                      Remove
                    </button>
                  </li>
                ))}
              </ol>
              <button
                type="button"
                className="btn-quiet mt-1 py-1 text-caption"
                disabled={disabled || curve.length >= 40}
                onClick={() => {
                  const last = curve[curve.length - 1];
                  // A new point beyond the last one, so that the curve stays monotone as typed.
                  setCurve([...curve, last ? { currentA: last.currentA * 2, timeS: Math.max(last.timeS / 10, 0.01) } : { currentA: 2 * d.ratedCurrentA, timeS: 100 }]);
                }}
              >
                Add a point
              </button>
              <p className="field-error">{errorAt('protection.device.timeCurrentCurve') ?? ''}</p>
              <p className={help}>{SYSTEM_HELP.curve}</p>
            </fieldset>

            <div className="grid grid-cols-2 gap-2">
              {select('protection-circuit-role', 'protection.circuitRole', 'Circuit', p.circuitRole, [['distribution', 'Distribution'], ['final', 'Final circuit']], 'input-circuit-role')}
              {select('protection-earthing', 'protection.earthing', 'Earthing', p.earthing, [['TN', 'TN'], ['TT', 'TT']])}
            </div>
            {p.earthing === 'TT' ? num('protection.earthElectrodesOhm', 'protection.earthElectrodesOhm', 'Earth electrodes R_A + R_B', p.earthElectrodesOhm, { nullable: true, placeholder: 'required' }) : null}

            {select('protection-source-by', 'protection.sourceBy', 'Source impedance', p.sourceBy, [['not-entered', 'Not entered (disconnection not checked)'], ['r-and-x', 'Resistance and reactance'], ['magnitude', 'Magnitude |Z| only']], 'input-source-by')}
            {p.sourceBy === 'r-and-x' ? (
              <div className="grid grid-cols-2 gap-2">
                {num('protection.sourceResistanceOhm', 'protection.sourceResistanceOhm', 'Source R', p.sourceResistanceOhm, { testId: 'input-source-r' })}
                {num('protection.sourceReactanceOhm', 'protection.sourceReactanceOhm', 'Source X', p.sourceReactanceOhm, { testId: 'input-source-x' })}
              </div>
            ) : null}
            {p.sourceBy === 'magnitude' ? num('protection.sourceImpedanceOhm', 'protection.sourceImpedanceOhm', 'Source |Z|', p.sourceImpedanceOhm) : null}
            <p className={help}>{SYSTEM_HELP.source}</p>

            {checkbox('protection.protectiveConductor.entered', 'Describe the protective conductor', p.protectiveConductor.entered, 'input-pe-entered')}
            {p.protectiveConductor.entered ? (
              <>
                <div className="grid grid-cols-2 gap-2">
                  {num('protection.protectiveConductor.sectionMm2', 'protection.protectiveConductor.sectionMm2', 'Its section', p.protectiveConductor.sectionMm2, { testId: 'input-pe-section' })}
                  {select('pe-material', 'protection.protectiveConductor.material', 'Its metal', p.protectiveConductor.material, [['same', 'As the candidate'], ['copper', 'Copper'], ['aluminium', 'Aluminium']])}
                  {select('pe-insulation', 'protection.protectiveConductor.insulation', 'Its insulation', p.protectiveConductor.insulation, [['thermosetting-90', 'XLPE/EPR 90 °C'], ['pvc-70', 'PVC 70 °C'], ['pvc-90', 'PVC 90 °C']])}
                  {select('pe-arrangement', 'protection.protectiveConductor.arrangement', 'It runs', p.protectiveConductor.arrangement, [['in-cable-or-bunched', 'In the cable or bunched with it'], ['separate', 'Separately']])}
                </div>
                <p className={help}>{SYSTEM_HELP.protectiveConductor}</p>
              </>
            ) : null}
          </>
        ) : null}
        {num('harmonics.thirdHarmonicPercent', 'harmonics.thirdHarmonicPercent', 'Third-harmonic content', values.harmonics.thirdHarmonicPercent, { nullable: true, placeholder: 'none', testId: 'input-third-harmonic', help: SYSTEM_HELP.thirdHarmonicPercent })}
      </div>
    </details>
  );
}

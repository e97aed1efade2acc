'use client';
/**
 * The cross-section of a cable circuit on the sheet (sheet inputs version 5): how the circuit's
 * cables lie and how far apart, the other circuits beside it (a list to add to and remove from),
 * the row they lie in, and for buried cables ducts and a backfill. Every number goes through
 * NumberField (the user's units, stored SI); errors name their field — the form's own, or the
 * library's refusal of an arrangement that does not fit (overlaps, ducts too small…).
 */
import type { UseFormReturnType } from '@mantine/form';
import { DEFAULT_SOURCES, ductMaterials, newOtherCircuit, type SheetInputs } from '@/lib/sheet/schema';
import type { SheetNumericField } from '@/lib/sheet/formUnits';
import { quantitiesInWords, type UnitSystem } from '@/lib/units';
import { NumberField } from './NumberField';

type Form = UseFormReturnType<SheetInputs>;

const DUCT_LABELS: Record<(typeof ductMaterials)[number], string> = {
  pvc: 'PVC',
  pe: 'Polyethylene',
  earthenware: 'Earthenware',
  'fibre-in-air': 'Fibre, in air',
  'fibre-in-concrete': 'Fibre, in concrete',
  metallic: 'Metallic',
};

const help = 'text-[0.6875rem] leading-4 text-ink-500';

export function ArrangementInputs({
  form,
  units,
  disabled,
  externalErrors = {},
}: {
  form: Form;
  units: UnitSystem;
  disabled: boolean;
  /** Errors from outside the form's schema, by field path (the library refusing the arrangement). */
  externalErrors?: Record<string, string>;
}) {
  const values = form.values;
  const i = values.installation;
  const buried = i.kind === 'buried';
  const threePhase = values.circuit.phases === 3;
  const parallelRuns = values.candidates.some((c) => c.kind === 'cable' && c.parallel > 1);
  const errorAt = (path: string) => (form.errors[path] as string | undefined) ?? externalErrors[path];

  const num = (
    path: string,
    unitField: SheetNumericField,
    label: string,
    value: number | null,
    extra: { help?: string; nullable?: boolean; placeholder?: string; testId?: string } = {},
  ) => (
    <NumberField
      key={path}
      field={unitField}
      label={label}
      units={units}
      value={value}
      onChange={(v) => form.setFieldValue(path, v as never)}
      error={errorAt(path)}
      disabled={disabled}
      {...extra}
    />
  );

  const setOthers = (next: SheetInputs['installation']['otherCircuits']) => form.setFieldValue('installation.otherCircuits', next);

  return (
    <div className="space-y-2" data-testid="arrangement-inputs">
      <div className="grid grid-cols-2 gap-2">
        <div>
          <label htmlFor="formation" className="field-label">Cables of the circuit</label>
          <select
            id="formation"
            data-testid="input-formation"
            className="field-input py-1"
            value={i.formation}
            onChange={(e) => form.setFieldValue('installation.formation', e.target.value as SheetInputs['installation']['formation'])}
          >
            <option value="trefoil">{threePhase ? 'Trefoil' : 'Side by side (a pair)'}</option>
            <option value="flat">Flat, horizontal row</option>
            <option value="flat-vertical">Flat, vertical row</option>
          </select>
          <p className="field-error">{errorAt('installation.formation') ?? ''}</p>
        </div>
        {num('installation.spacingM', 'installation.spacingM', 'Axis spacing', i.spacingM, { nullable: true, placeholder: 'touching', testId: 'input-spacing' })}
      </div>
      <p className={help}>{DEFAULT_SOURCES.formation} {DEFAULT_SOURCES.spacingM}</p>
      {i.formation !== 'trefoil' ? (
        <label className="flex items-center gap-2 text-body">
          <input
            type="checkbox"
            className="h-4 w-4 accent-copper-500"
            checked={i.transposed}
            disabled={disabled}
            onChange={(e) => form.setFieldValue('installation.transposed', e.target.checked)}
          />
          Phases transposed along the route
        </label>
      ) : null}

      <fieldset className="rounded border border-ink-100 p-2" data-testid="other-circuits">
        <legend className="px-1 text-caption font-semibold text-ink-700">Other circuits beside this one ({i.otherCircuits.length})</legend>
        {i.otherCircuits.length === 0 ? <p className="text-caption text-ink-600">None: this circuit lies alone{parallelRuns ? ' (its parallel runs lie beside each other)' : ''}.</p> : null}
        <ol className="space-y-2">
          {i.otherCircuits.map((other, index) => {
            const base = `installation.otherCircuits.${index}`;
            const name = other.label.trim() || `Other circuit ${index + 1}`;
            return (
              <li key={index} className="rounded bg-ink-50 p-2" data-testid={`other-circuit-${index}`}>
                <div className="flex items-end gap-2">
                  <div className="min-w-0 flex-1">
                    <label htmlFor={`other-label-${index}`} className="field-label">Name (optional)</label>
                    <input
                      id={`other-label-${index}`}
                      className="field-input py-1"
                      value={other.label}
                      maxLength={80}
                      placeholder={`Other circuit ${index + 1}`}
                      disabled={disabled}
                      onChange={(e) => form.setFieldValue(`${base}.label`, e.target.value as never)}
                    />
                  </div>
                  <button
                    type="button"
                    className="btn-quiet mb-0.5 py-1 text-caption"
                    aria-label={`Remove ${name}`}
                    data-testid={`remove-other-circuit-${index}`}
                    disabled={disabled}
                    onClick={() => setOthers(i.otherCircuits.filter((_, k) => k !== index))}
                  >
                    Remove
                  </button>
                </div>
                {num(`${base}.currentA`, 'installation.otherCircuits.currentA', 'Its current per phase', other.currentA, { testId: `other-current-${index}` })}
                <div>
                  <label htmlFor={`other-cable-${index}`} className="field-label">Its cable</label>
                  <select
                    id={`other-cable-${index}`}
                    data-testid={`other-cable-${index}`}
                    className="field-input py-1"
                    value={other.sameCable ? 'same' : 'given'}
                    disabled={disabled}
                    onChange={(e) => form.setFieldValue(`${base}.sameCable`, (e.target.value === 'same') as never)}
                  >
                    <option value="same">The same cable as the candidate</option>
                    <option value="given">Another cable: its diameter and heat</option>
                  </select>
                </div>
                {!other.sameCable ? (
                  <div className="grid grid-cols-2 gap-2">
                    {num(`${base}.externalDiameterM`, 'installation.otherCircuits.externalDiameterM', 'Cable diameter', other.externalDiameterM, { nullable: true, placeholder: 'required' })}
                    {num(`${base}.lossWPerM`, 'installation.otherCircuits.lossWPerM', 'Heat per cable', other.lossWPerM, { nullable: true, placeholder: 'required' })}
                  </div>
                ) : null}
              </li>
            );
          })}
        </ol>
        <button
          type="button"
          className="btn-quiet mt-2 py-1 text-caption"
          data-testid="add-other-circuit"
          disabled={disabled || i.otherCircuits.length >= 23}
          onClick={() => setOthers([...i.otherCircuits, newOtherCircuit()])}
        >
          Add a circuit beside it
        </button>
        {form.errors['installation.otherCircuits'] ? <p className="field-error">{String(form.errors['installation.otherCircuits'])}</p> : null}
        <p className={`${help} mt-1`}>{DEFAULT_SOURCES.otherCircuits}</p>
        {i.otherCircuits.length > 0 || parallelRuns ? (
          <div className="mt-2 grid grid-cols-2 gap-2">
            <div>
              <label htmlFor="circuit-row" className="field-label">Row of circuits</label>
              <select
                id="circuit-row"
                data-testid="input-circuit-row"
                className="field-input py-1"
                value={i.circuitRow}
                disabled={disabled}
                onChange={(e) => form.setFieldValue('installation.circuitRow', e.target.value as SheetInputs['installation']['circuitRow'])}
              >
                <option value="horizontal">Side by side</option>
                <option value="vertical">One below the other</option>
              </select>
            </div>
            {num('installation.circuitSpacingM', 'installation.circuitSpacingM', 'Circuit spacing', i.circuitSpacingM, { nullable: true, placeholder: 'touching', testId: 'input-circuit-spacing' })}
            <p className={`${help} col-span-2`}>{DEFAULT_SOURCES.circuitSpacingM}</p>
          </div>
        ) : null}
      </fieldset>

      {buried ? (
        <>
          <fieldset className="rounded border border-ink-100 p-2" data-testid="duct-inputs">
            <legend className="px-1 text-caption font-semibold text-ink-700">Ducts</legend>
            <label className="flex items-center gap-2 text-body">
              <input
                type="checkbox"
                data-testid="input-duct-used"
                className="h-4 w-4 accent-copper-500"
                checked={i.duct.used}
                disabled={disabled}
                onChange={(e) => form.setFieldValue('installation.duct.used', e.target.checked)}
              />
              Each cable in its own duct
            </label>
            {i.duct.used ? (
              <>
                <div>
                  <label htmlFor="duct-material" className="field-label">Duct material</label>
                  <select
                    id="duct-material"
                    className="field-input py-1"
                    value={i.duct.material}
                    disabled={disabled}
                    onChange={(e) => form.setFieldValue('installation.duct.material', e.target.value as SheetInputs['installation']['duct']['material'])}
                  >
                    {ductMaterials.map((m) => (
                      <option key={m} value={m}>
                        {DUCT_LABELS[m]}
                      </option>
                    ))}
                  </select>
                </div>
                <div className="grid grid-cols-2 gap-2">
                  {num('installation.duct.innerDiameterM', 'installation.duct.innerDiameterM', 'Inner diameter', i.duct.innerDiameterM)}
                  {num('installation.duct.outerDiameterM', 'installation.duct.outerDiameterM', 'Outer diameter', i.duct.outerDiameterM)}
                </div>
                <p className={help}>{quantitiesInWords(DEFAULT_SOURCES.duct, units)}</p>
              </>
            ) : null}
          </fieldset>
          <fieldset className="rounded border border-ink-100 p-2" data-testid="backfill-inputs">
            <legend className="px-1 text-caption font-semibold text-ink-700">Backfill or concrete bank</legend>
            <label className="flex items-center gap-2 text-body">
              <input
                type="checkbox"
                data-testid="input-backfill-used"
                className="h-4 w-4 accent-copper-500"
                checked={i.backfill.used}
                disabled={disabled}
                onChange={(e) => form.setFieldValue('installation.backfill.used', e.target.checked)}
              />
              In a backfill of its own resistivity
            </label>
            {i.backfill.used ? (
              <>
                <div className="grid grid-cols-2 gap-2">
                  {num('installation.backfill.widthM', 'installation.backfill.widthM', 'Width', i.backfill.widthM)}
                  {num('installation.backfill.heightM', 'installation.backfill.heightM', 'Height', i.backfill.heightM)}
                  {num('installation.backfill.centreDepthM', 'installation.backfill.centreDepthM', 'Centre depth', i.backfill.centreDepthM, { nullable: true, placeholder: 'at the cable depth' })}
                  {num('installation.backfill.resistivityKmPerW', 'installation.backfill.resistivityKmPerW', 'Thermal resistivity', i.backfill.resistivityKmPerW)}
                </div>
                <p className="field-error">{externalErrors['installation.backfill'] ?? ''}</p>
                <p className={help}>{quantitiesInWords(DEFAULT_SOURCES.backfill, units)}</p>
              </>
            ) : null}
          </fieldset>
        </>
      ) : null}
    </div>
  );
}

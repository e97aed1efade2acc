'use client';
/**
 * Small parts shared by the sheet's optional-check panels and the share view: a number field in
 * the user's units, and the list of a check's flags.
 */
import { useEffect, useId, useState } from 'react';
import type { AssumptionFlag } from '@/lib/electrical/sizing/flags';
import { convertFromSi, convertToSi, formatNumber, unitLabel, type Quantity, type UnitSystem } from '@/lib/units';

/**
 * A number field shown in the user's units (a lib/units quantity), or in a fixed unit that is
 * `siPerShown` SI units each (60 for minutes of a value stored in seconds). The text is kept while
 * typing, so "1." or a value mid-edit is not rewritten under the cursor.
 */
export function UnitNumberField({
  label,
  siValue,
  quantity,
  fixedUnit,
  siPerShown = 1,
  units,
  disabled,
  error,
  testId,
  help,
  onChange,
}: {
  label: string;
  siValue: number;
  quantity: Quantity | null;
  fixedUnit?: string;
  siPerShown?: number;
  units: UnitSystem;
  disabled: boolean;
  error?: string;
  testId: string;
  help?: string;
  onChange: (siValue: number) => void;
}) {
  const id = useId();
  const toShown = (v: number) => (quantity ? convertFromSi(v, quantity, units) : v / siPerShown);
  const fromShown = (v: number) => (quantity ? convertToSi(v, quantity, units) : v * siPerShown);
  const shownText = (v: number) => (Number.isFinite(v) ? formatNumber(toShown(v), 6) : '');
  const [text, setText] = useState(shownText(siValue));
  const [focused, setFocused] = useState(false);
  useEffect(() => {
    if (!focused) setText(shownText(siValue));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [siValue, units, focused]);
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label} ({quantity ? unitLabel(quantity, units) : fixedUnit})
      </label>
      <input
        id={id}
        type="number"
        step="any"
        className="field-input num"
        data-testid={testId}
        value={text}
        disabled={disabled}
        aria-invalid={error ? true : undefined}
        aria-describedby={error || help ? `${id}-note` : undefined}
        onFocus={() => setFocused(true)}
        onBlur={() => setFocused(false)}
        onChange={(e) => {
          setText(e.target.value);
          const n = e.target.value === '' ? NaN : Number(e.target.value);
          onChange(Number.isFinite(n) ? fromShown(n) : n);
        }}
      />
      {error ? (
        <p id={`${id}-note`} className="field-error">
          {error}
        </p>
      ) : help ? (
        <p id={`${id}-note`} className="text-caption text-ink-500">
          {help}
        </p>
      ) : null}
    </div>
  );
}

/** A check's flags, worst first as the library orders them; says so when there are none. */
export function CheckFlagList({ flags, testId }: { flags: AssumptionFlag[]; testId: string }) {
  if (flags.length === 0) return <p className="text-caption text-ink-500">No flags from this check.</p>;
  return (
    <ul className="mt-1 space-y-1 text-caption" data-testid={testId}>
      {flags.map((f) => (
        <li key={f.code} className={f.severity === 'blocker' ? 'text-over-dark' : f.severity === 'review' ? 'text-tight-dark' : 'text-ink-600'}>
          <span className="font-mono">{f.code}</span> ({f.severity}): {f.message}
        </li>
      ))}
    </ul>
  );
}

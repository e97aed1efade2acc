'use client';
import { useEffect, useId, useRef, useState } from 'react';
import { displayText, displayUnit, fromDisplay, type SheetNumericField } from '@/lib/sheet/formUnits';
import type { UnitSystem } from '@/lib/units';

/**
 * A number in the user's unit system, stored in SI. Keeps the typed text while focused (so "1." or
 * "−" can be typed), converts on every change, and shows the form's error under the field.
 */
export function NumberField({
  field,
  label,
  value,
  onChange,
  units,
  error,
  help,
  nullable = false,
  placeholder,
  disabled = false,
  testId,
}: {
  field: SheetNumericField;
  label: string;
  value: number | null;
  onChange: (value: number | null) => void;
  units: UnitSystem;
  error?: string;
  help?: string;
  nullable?: boolean;
  placeholder?: string;
  disabled?: boolean;
  testId?: string;
}) {
  const id = useId();
  const [text, setText] = useState(() => displayText(field, value, units));
  const [localError, setLocalError] = useState<string | null>(null);
  const focused = useRef(false);

  useEffect(() => {
    if (!focused.current) setText(displayText(field, value, units));
  }, [field, value, units]);

  const unit = displayUnit(field, units);
  const shownError = localError ?? error;
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
        {/* The space is text, so the label reads "Height (ft)" to assistive technology too. */}
        {unit ? <span className="normal-case tracking-normal text-ink-400"> ({unit})</span> : null}
      </label>
      <input
        id={id}
        data-testid={testId}
        inputMode="decimal"
        className="field-input num py-1"
        value={text}
        placeholder={placeholder ?? (nullable ? 'not entered' : undefined)}
        disabled={disabled}
        aria-invalid={shownError ? true : undefined}
        aria-describedby={`${id}-help ${id}-error`}
        onFocus={() => (focused.current = true)}
        onBlur={() => {
          focused.current = false;
          if (!localError) setText(displayText(field, value, units));
        }}
        onChange={(event) => {
          const raw = event.target.value;
          setText(raw);
          const normalised = raw.trim().replace(/\u2212/g, '-').replace(/\s/g, '');
          if (normalised === '') {
            if (nullable) {
              setLocalError(null);
              onChange(null);
            } else setLocalError(`${label} is required`);
            return;
          }
          const shown = Number(normalised.replace(',', '.'));
          if (!Number.isFinite(shown)) {
            setLocalError(`${label} must be a number`);
            return;
          }
          setLocalError(null);
          onChange(fromDisplay(field, shown, units));
        }}
      />
      <p id={`${id}-error`} className="field-error" aria-live="polite">{shownError ?? ''}</p>
      {help ? <p id={`${id}-help`} className="-mt-0.5 text-[0.6875rem] leading-4 text-ink-500">{help}</p> : null}
    </div>
  );
}

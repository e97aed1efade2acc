'use client';
import { useEffect, useId, useRef, useState } from 'react';
import { displayText, displayUnit, fromDisplay, type SheetNumericField } from '@/lib/sheet/formUnits';
import { quantitiesInWords, type UnitSystem } from '@/lib/units';
import { parseNumber, writeNumber } from '@/lib/units/parse';
import { useDecimalSeparator } from '@/components/providers/NumberFormatProvider';
import { useUnreadFields } from './unreadFields';

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
  warning,
}: {
  /** An accepted value that needs a word (lib/sheet/inputWarnings), shown under the field. */
  warning?: string;
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
  const separator = useDecimalSeparator();
  const { report } = useUnreadFields();
  // Several fields of one list share a `field` key (every other circuit's current): the test id or label tells them apart.
  const unreadKey = `${field}:${testId ?? label}`;
  const onInvalid = (_field: SheetNumericField, message: string | null) => report(unreadKey, message);
  // A field that leaves the screen (a check switched off, a row removed) no longer holds unread text.
  useEffect(() => () => report(unreadKey, null), [report, unreadKey]);
  const shownText = (v: number | null) => writeNumber(displayText(field, v, units), separator);
  const [text, setText] = useState(() => shownText(value));
  const [localError, setLocalError] = useState<string | null>(null);
  const focused = useRef(false);

  useEffect(() => {
    if (!focused.current) setText(writeNumber(displayText(field, value, units), separator));
  }, [field, value, units, separator]);

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
          if (!localError) setText(shownText(value));
        }}
        onChange={(event) => {
          const raw = event.target.value;
          setText(raw);
          // One parser for the whole app (lib/units/parse): the user's separator, nothing ambiguous.
          const parsed = parseNumber(raw, { decimalSeparator: separator, field: label });
          if (!parsed.ok) {
            if (parsed.empty && nullable) {
              setLocalError(null);
              onChange(null);
            } else setLocalError(parsed.empty ? `${label} is required` : parsed.message);
            // The form must not keep computing with the last good value: the sheet shows the
            // result as not current while a field holds text it cannot read (ResultStrip).
            onInvalid(field, parsed.empty && nullable ? null : parsed.empty ? `${label} is required` : parsed.message);
            return;
          }
          setLocalError(null);
          onInvalid(field, null);
          onChange(fromDisplay(field, parsed.value, units));
        }}
      />
      <p id={`${id}-error`} className="field-error" aria-live="polite">{shownError ?? ''}</p>
      {warning && !shownError ? (
        <p className="mt-0.5 text-caption text-tight-dark" data-testid={testId ? `${testId}-warning` : undefined} role="note">
          <span aria-hidden="true">▲ </span>
          {warning}
        </p>
      ) : null}
      {help ? <p id={`${id}-help`} className="-mt-0.5 text-[0.6875rem] leading-4 text-ink-500">{quantitiesInWords(help, units)}</p> : null}
    </div>
  );
}

'use client';
import { useId, useState, useTransition } from 'react';
import { COMMON_CURRENCIES } from '@/lib/units/money';

/** The team's currency, named with every amount on the sheets, the share pages, the PDF and the exports. */
export function TeamCurrency({ currency, onChange }: { currency: string; onChange: (currency: string) => Promise<{ currency: string } | { error: string }> }) {
  const id = useId();
  const [value, setValue] = useState(currency);
  const [message, setMessage] = useState<{ tone: 'saved' | 'refused'; text: string } | null>(null);
  const [pending, startTransition] = useTransition();
  return (
    <form
      className="panel mt-4 flex flex-wrap items-end gap-3 p-3"
      aria-label="Team currency"
      onSubmit={(e) => {
        e.preventDefault();
        startTransition(async () => {
          const answer = await onChange(value);
          setMessage('error' in answer ? { tone: 'refused', text: answer.error } : { tone: 'saved', text: `Amounts now read in ${answer.currency}.` });
          if (!('error' in answer)) setValue(answer.currency);
        });
      }}
    >
      <div>
        <label htmlFor={id} className="field-label">Team currency (ISO 4217)</label>
        <input id={id} data-testid="team-currency" list={`${id}-list`} className="field-input w-28 py-1 font-mono" value={value} maxLength={3} onChange={(e) => setValue(e.target.value)} />
        <datalist id={`${id}-list`}>
          {COMMON_CURRENCIES.map((c) => (
            <option key={c} value={c} />
          ))}
        </datalist>
      </div>
      <button type="submit" className="btn-quiet" disabled={pending} data-testid="team-currency-save">
        Save currency
      </button>
      <p className="basis-full text-caption text-ink-600">
        Named with every amount: catalogue prices, material and life-cycle costs on the sheets, share pages, the PDF and the exports. Changing it relabels the amounts; it converts nothing.
      </p>
      {message ? (
        <p role="status" className={message.tone === 'saved' ? 'text-caption text-within-dark' : 'field-error'}>
          {message.text}
        </p>
      ) : null}
    </form>
  );
}

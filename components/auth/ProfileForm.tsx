'use client';

import { useState, useTransition } from 'react';
import type { ProfessionalProfile } from '@/lib/auth/profile';

/**
 * The person's licence or registration number and its jurisdiction, printed with their approval
 * in the calculation package. The save is the server action the page passes in (layers rule).
 */
export function ProfileForm({
  initial,
  onSave,
}: {
  initial: ProfessionalProfile;
  onSave: (profile: ProfessionalProfile) => Promise<{ ok: true; profile: ProfessionalProfile } | { ok: false; message: string }>;
}) {
  const [values, setValues] = useState(initial);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, startTransition] = useTransition();
  return (
    <form
      className="panel max-w-xl space-y-3 p-4"
      data-testid="profile-form"
      onSubmit={(event) => {
        event.preventDefault();
        startTransition(async () => {
          const answer = await onSave(values);
          setMessage(answer.ok ? { ok: true, text: 'Saved. Calculation packages you approve from now on print these.' } : { ok: false, text: answer.message });
        });
      }}
    >
      <div>
        <label htmlFor="licence-number" className="field-label">Licence or registration number</label>
        <input id="licence-number" className="field-input mt-1 w-full" maxLength={120} value={values.licenceNumber} onChange={(e) => setValues((v) => ({ ...v, licenceNumber: e.target.value }))} />
      </div>
      <div>
        <label htmlFor="licence-jurisdiction" className="field-label">Jurisdiction that issued it</label>
        <input id="licence-jurisdiction" className="field-input mt-1 w-full" maxLength={120} value={values.licenceJurisdiction} onChange={(e) => setValues((v) => ({ ...v, licenceJurisdiction: e.target.value }))} />
        <p className="mt-1 text-caption text-ink-500">The state, province or country, and the body if it helps a reader check it.</p>
      </div>
      <button type="submit" className="btn-primary" disabled={pending} data-testid="profile-save">
        {pending ? 'Saving…' : 'Save'}
      </button>
      {message ? (
        <p role="status" className={`text-caption ${message.ok ? 'text-within-dark' : 'text-over-dark'}`} data-testid="profile-message">
          {message.text}
        </p>
      ) : null}
    </form>
  );
}

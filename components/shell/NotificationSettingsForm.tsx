'use client';

import { useActionState } from 'react';

interface KindRow {
  kind: string;
  label: string;
  who: string;
  email: boolean;
  inApp: boolean;
}

/** The member's choices: for each kind of notification, by e-mail and in the app, each on or off. */
export function NotificationSettingsForm({
  action,
  kinds,
}: {
  action: (state: { saved?: boolean; message?: string }, formData: FormData) => Promise<{ saved?: boolean; message?: string }>;
  kinds: KindRow[];
}) {
  const [state, formAction, pending] = useActionState(action, {});
  return (
    <form action={formAction} className="panel space-y-3 p-4" aria-labelledby="notification-settings-heading">
      <h2 id="notification-settings-heading" className="font-semibold">What you are told</h2>
      {kinds.map((k) => (
        <fieldset key={k.kind} className="space-y-1">
          <legend className="font-medium">{k.label}</legend>
          <p className="text-caption text-ink-500">{k.who}</p>
          <div className="flex gap-4">
            <label className="flex items-center gap-1">
              <input type="checkbox" className="accent-copper-500" name={`${k.kind}.email`} defaultChecked={k.email} data-testid={`setting-${k.kind}-email`} /> by e-mail
            </label>
            <label className="flex items-center gap-1">
              <input type="checkbox" className="accent-copper-500" name={`${k.kind}.inApp`} defaultChecked={k.inApp} data-testid={`setting-${k.kind}-inApp`} /> in the app
            </label>
          </div>
        </fieldset>
      ))}
      <button type="submit" className="btn-primary" disabled={pending}>{pending ? 'Saving…' : 'Save these settings'}</button>
      {state.saved ? <p role="status" className="text-within-dark">✓ Saved.</p> : null}
      {state.message ? <p role="alert" className="field-error">{state.message}</p> : null}
    </form>
  );
}

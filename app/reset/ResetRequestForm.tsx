'use client';

import { useState, type FormEvent } from 'react';
import { FormMessage } from '@/components/auth/AuthFrame';

export function ResetRequestForm() {
  const [state, setState] = useState<{ kind: 'idle' | 'pending' } | { kind: 'sent' | 'error'; message: string }>({ kind: 'idle' });

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const email = String(new FormData(event.currentTarget).get('email') ?? '');
    setState({ kind: 'pending' });
    try {
      const response = await fetch('/api/auth/reset-request', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email }) });
      const body = (await response.json().catch(() => null)) as { message?: string; error?: { message?: string } } | null;
      if (response.ok) setState({ kind: 'sent', message: body?.message ?? 'If that address has an account, a link is on its way.' });
      else setState({ kind: 'error', message: body?.error?.message ?? 'Sending did not work just now. Try again in a moment.' });
    } catch {
      setState({ kind: 'error', message: 'Sending did not work just now. Try again in a moment.' });
    }
  }

  if (state.kind === 'sent') return <FormMessage tone="success">{state.message}</FormMessage>;
  return (
    <form onSubmit={onSubmit} className="panel space-y-4 p-5">
      {state.kind === 'error' ? <FormMessage tone="error">{state.message}</FormMessage> : null}
      <div>
        <label htmlFor="email" className="field-label">
          E-mail
        </label>
        <input id="email" name="email" type="email" autoComplete="email" required className="field-input" />
      </div>
      <button type="submit" className="btn-primary w-full justify-center" disabled={state.kind === 'pending'}>
        {state.kind === 'pending' ? 'Sending…' : 'Send me a link'}
      </button>
    </form>
  );
}

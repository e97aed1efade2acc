'use client';

import { useState, type FormEvent } from 'react';
import { signIn } from 'next-auth/react';
import { FormMessage } from '@/components/auth/AuthFrame';
import { signInErrorMessage } from '@/components/auth/signInMessages';

export function SignInForm({ next, initialEmail, initialError }: { next: string; initialEmail: string; initialError?: string }) {
  const [error, setError] = useState<string | null>(signInErrorMessage(initialError));
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setError(null);
    try {
      const result = await signIn('credentials', { redirect: false, email: String(form.get('email') ?? ''), password: String(form.get('password') ?? '') });
      if (!result || result.error || !result.ok) {
        setError(signInErrorMessage(result?.error ?? 'unknown'));
        setPending(false);
        return;
      }
      // A full load, so that the workspace renders with the new session cookie from the server.
      window.location.assign(next);
    } catch {
      setError(signInErrorMessage('unknown'));
      setPending(false);
    }
  }

  return (
    <form onSubmit={onSubmit} className="panel space-y-4 p-5" noValidate={false}>
      {error ? <FormMessage tone="error">{error}</FormMessage> : null}
      <div>
        <label htmlFor="email" className="field-label">
          E-mail
        </label>
        <input id="email" name="email" type="email" autoComplete="username" required defaultValue={initialEmail} className="field-input" />
      </div>
      <div>
        <label htmlFor="password" className="field-label">
          Password
        </label>
        <input id="password" name="password" type="password" autoComplete="current-password" required className="field-input" />
      </div>
      <button type="submit" className="btn-primary w-full justify-center" disabled={pending}>
        {pending ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}

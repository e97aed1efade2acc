'use client';

import Link from 'next/link';
import { useState, type FormEvent } from 'react';
import { signIn } from 'next-auth/react';
import { FormMessage } from './AuthFrame';

interface Props {
  /** POST endpoint taking `{ token, password, name? }`. */
  endpoint: '/api/auth/invitation' | '/api/auth/reset';
  token: string;
  email: string;
  askName: boolean;
  submitLabel: string;
}

type FieldErrors = Partial<Record<'name' | 'password' | 'confirm', string>>;

/** Choose a password once, from an invitation or a reset link; signs the member in afterwards. */
export function SetPasswordForm({ endpoint, token, email, askName, submitLabel }: Props) {
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const [done, setDone] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const name = String(form.get('name') ?? '');
    const password = String(form.get('password') ?? '');
    const confirm = String(form.get('confirm') ?? '');
    const errors: FieldErrors = {};
    if (askName && !name.trim()) errors.name = 'Enter your name.';
    if (password.length < 12) errors.password = 'Use at least 12 characters.';
    if (password !== confirm) errors.confirm = 'The two passwords differ.';
    setFieldErrors(errors);
    setError(null);
    if (Object.keys(errors).length > 0) return;

    setPending(true);
    try {
      const response = await fetch(endpoint, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(askName ? { token, name, password } : { token, password }),
      });
      if (!response.ok) {
        const body = (await response.json().catch(() => null)) as { error?: { message?: string; issues?: { path: string; message: string }[] } } | null;
        const issues = body?.error?.issues ?? [];
        const byField: FieldErrors = {};
        for (const issue of issues) if (issue.path === 'name' || issue.path === 'password') byField[issue.path] = issue.message;
        setFieldErrors(byField);
        setError(Object.keys(byField).length ? null : (body?.error?.message ?? 'Saving did not work just now. Try again in a moment.'));
        setPending(false);
        return;
      }
      setDone(true);
      const signedIn = await signIn('credentials', { redirect: false, email, password });
      if (signedIn?.ok && !signedIn.error) window.location.assign('/projects');
      else setPending(false);
    } catch {
      setError('Saving did not work just now. Try again in a moment.');
      setPending(false);
    }
  }

  if (done && !pending) {
    return (
      <FormMessage tone="success">
        Your password is saved. <Link href={`/sign-in?email=${encodeURIComponent(email)}`} className="font-medium underline">Sign in</Link>.
      </FormMessage>
    );
  }

  return (
    <form onSubmit={onSubmit} className="panel space-y-4 p-5" noValidate>
      {error ? <FormMessage tone="error">{error}</FormMessage> : null}
      {done ? <FormMessage tone="success">Your password is saved. Signing you in…</FormMessage> : null}
      <div>
        <span className="field-label">E-mail</span>
        <p className="mt-1 text-body text-ink-800">{email}</p>
      </div>
      {askName ? (
        <div>
          <label htmlFor="name" className="field-label">
            Your name
          </label>
          <input id="name" name="name" autoComplete="name" required aria-invalid={Boolean(fieldErrors.name)} aria-describedby="name-error" className="field-input" />
          {fieldErrors.name ? <p id="name-error" className="field-error">{fieldErrors.name}</p> : null}
        </div>
      ) : null}
      <input type="hidden" name="username" autoComplete="username" value={email} />
      <div>
        <label htmlFor="password" className="field-label">
          New password
        </label>
        <input id="password" name="password" type="password" autoComplete="new-password" required minLength={12} aria-invalid={Boolean(fieldErrors.password)} aria-describedby="password-help password-error" className="field-input" />
        <p id="password-help" className="mt-1 text-caption text-ink-500">At least 12 characters; a few unrelated words work well.</p>
        {fieldErrors.password ? <p id="password-error" className="field-error">{fieldErrors.password}</p> : null}
      </div>
      <div>
        <label htmlFor="confirm" className="field-label">
          The same password again
        </label>
        <input id="confirm" name="confirm" type="password" autoComplete="new-password" required aria-invalid={Boolean(fieldErrors.confirm)} aria-describedby="confirm-error" className="field-input" />
        {fieldErrors.confirm ? <p id="confirm-error" className="field-error">{fieldErrors.confirm}</p> : null}
      </div>
      <button type="submit" className="btn-primary w-full justify-center" disabled={pending}>
        {pending ? 'Saving…' : submitLabel}
      </button>
    </form>
  );
}

'use client';

import { useActionState, useEffect, useRef, useState } from 'react';
import { FormMessage } from '@/components/auth/AuthFrame';
import { createApiTokenAction, revokeApiTokenAction, type CreateTokenState, type RevokeTokenState } from './actions';

interface TokenRow {
  id: string;
  name: string;
  prefix: string;
  scopes: ('read' | 'calc')[];
  requestsPerMinute: number;
  createdByName: string | null;
  createdAt: string;
  expiresAt: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

const SCOPE_CHOICES = [
  { value: 'calc', label: 'calc', help: 'run calculations (evaluate, ampacity)' },
  { value: 'read', label: 'read', help: 'read reference data (the list of assumption flags)' },
] as const;

function when(iso: string | null, empty: string): string {
  if (!iso) return empty;
  return new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
}

function stateOf(token: TokenRow): { label: string; className: string } {
  if (token.revokedAt) return { label: 'Revoked', className: 'text-ink-500' };
  if (token.expiresAt && new Date(token.expiresAt).getTime() <= Date.now()) return { label: 'Expired', className: 'text-ink-500' };
  return { label: 'Active', className: 'text-within-dark' };
}

function NewTokenNotice({ created }: { created: NonNullable<CreateTokenState['created']> }) {
  const [copied, setCopied] = useState(false);
  return (
    <div role="status" className="mt-4 rounded-md border border-within/40 bg-within-light p-4 text-within-dark">
      <p className="font-semibold">Token “{created.name}” created. Copy it now: it is shown only this once.</p>
      <label htmlFor="new-token" className="field-label mt-3 block">
        Token
      </label>
      <div className="mt-1 flex gap-2">
        <input id="new-token" readOnly value={created.token} className="field-input num w-full" onFocus={(event) => event.currentTarget.select()} />
        <button
          type="button"
          className="btn-quiet"
          onClick={() => {
            void navigator.clipboard?.writeText(created.token).then(() => setCopied(true));
          }}
        >
          {copied ? 'Copied' : 'Copy'}
        </button>
      </div>
      <p className="mt-2 text-body">Ampwarden keeps only a fingerprint of it; if it is lost, revoke it and create another.</p>
    </div>
  );
}

function RevokeButton({ token }: { token: TokenRow }) {
  const [state, action, pending] = useActionState<RevokeTokenState, FormData>(revokeApiTokenAction, {});
  return (
    <form
      action={action}
      onSubmit={(event) => {
        if (!window.confirm(`Revoke “${token.name}”? Programs using it are refused at once.`)) event.preventDefault();
      }}
    >
      <input type="hidden" name="tokenId" value={token.id} />
      <button type="submit" className="btn-danger" disabled={pending} aria-label={`Revoke token ${token.name}`}>
        {pending ? 'Revoking…' : 'Revoke'}
      </button>
      {state.message ? <span className="sr-only" role="status">{state.message}</span> : null}
    </form>
  );
}

export function TokensAdmin({ tokens, defaultRate, maxRate }: { tokens: TokenRow[]; defaultRate: number; maxRate: number }) {
  const [state, action, pending] = useActionState<CreateTokenState, FormData>(createApiTokenAction, {});
  const formRef = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state.created) formRef.current?.reset();
  }, [state.created]);
  const errors = state.fieldErrors ?? {};

  return (
    <div className="mt-6 space-y-8">
      <section aria-labelledby="new-token-heading" className="panel p-4">
        <h2 id="new-token-heading" className="text-lead font-semibold">
          New token
        </h2>
        <form ref={formRef} action={action} className="mt-3 grid gap-4 sm:grid-cols-2" noValidate>
          <div>
            <label htmlFor="token-name" className="field-label">
              Name (which program uses it)
            </label>
            <input
              id="token-name"
              name="name"
              required
              maxLength={100}
              className="field-input w-full"
              aria-invalid={errors.name ? true : undefined}
              aria-describedby={errors.name ? 'token-name-error' : undefined}
            />
            {errors.name ? (
              <p id="token-name-error" className="field-error">
                {errors.name}
              </p>
            ) : null}
          </div>
          <fieldset aria-describedby={errors.scopes ? 'token-scopes-error' : undefined}>
            <legend className="field-label">Scopes</legend>
            {SCOPE_CHOICES.map((scope) => (
              <label key={scope.value} className="mt-1 flex items-start gap-2 text-body">
                <input type="checkbox" name="scopes" value={scope.value} defaultChecked={scope.value === 'calc'} className="mt-1" />
                <span>
                  <span className="num">{scope.label}</span> — {scope.help}
                </span>
              </label>
            ))}
            {errors.scopes ? (
              <p id="token-scopes-error" className="field-error">
                {errors.scopes}
              </p>
            ) : null}
          </fieldset>
          <div>
            <label htmlFor="token-rate" className="field-label">
              Requests per minute
            </label>
            <input
              id="token-rate"
              name="requestsPerMinute"
              type="number"
              inputMode="numeric"
              min={1}
              max={maxRate}
              defaultValue={defaultRate}
              className="field-input num w-full"
              aria-invalid={errors.requestsPerMinute ? true : undefined}
              aria-describedby={errors.requestsPerMinute ? 'token-rate-error' : undefined}
            />
            {errors.requestsPerMinute ? (
              <p id="token-rate-error" className="field-error">
                {errors.requestsPerMinute}
              </p>
            ) : null}
          </div>
          <div>
            <label htmlFor="token-expiry" className="field-label">
              Expires after (days; empty for never)
            </label>
            <input
              id="token-expiry"
              name="expiresInDays"
              type="number"
              inputMode="numeric"
              min={1}
              max={3650}
              className="field-input num w-full"
              aria-invalid={errors.expiresInDays ? true : undefined}
              aria-describedby={errors.expiresInDays ? 'token-expiry-error' : undefined}
            />
            {errors.expiresInDays ? (
              <p id="token-expiry-error" className="field-error">
                {errors.expiresInDays}
              </p>
            ) : null}
          </div>
          <div className="sm:col-span-2">
            <button type="submit" className="btn-primary" disabled={pending}>
              {pending ? 'Creating…' : 'Create token'}
            </button>
          </div>
        </form>
        {state.message && !state.created ? (
          <div className="mt-3">
            <FormMessage tone="error">{state.message}</FormMessage>
          </div>
        ) : null}
        {state.created ? <NewTokenNotice created={state.created} /> : null}
      </section>

      <section aria-labelledby="token-list-heading">
        <h2 id="token-list-heading" className="text-lead font-semibold">
          Tokens
        </h2>
        {tokens.length === 0 ? (
          <p className="mt-2 text-ink-600">No tokens yet. Create one above for each program that should call the API.</p>
        ) : (
          <div className="mt-2 overflow-x-auto">
            <table className="w-full text-left text-body">
              <caption className="sr-only">API tokens of the team, newest first</caption>
              <thead className="border-b border-ink-200 text-ink-700">
                <tr>
                  <th scope="col" className="py-2 pr-3">Name</th>
                  <th scope="col" className="py-2 pr-3">Starts with</th>
                  <th scope="col" className="py-2 pr-3">Scopes</th>
                  <th scope="col" className="py-2 pr-3">Per minute</th>
                  <th scope="col" className="py-2 pr-3">Created</th>
                  <th scope="col" className="py-2 pr-3">Last used</th>
                  <th scope="col" className="py-2 pr-3">State</th>
                  <th scope="col" className="py-2">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {tokens.map((token) => {
                  const state = stateOf(token);
                  return (
                    <tr key={token.id} className="border-b border-ink-100 align-middle">
                      <td className="py-2 pr-3 font-medium">{token.name}</td>
                      <td className="num py-2 pr-3">{token.prefix}…</td>
                      <td className="num py-2 pr-3">{token.scopes.join(', ')}</td>
                      <td className="num py-2 pr-3">{token.requestsPerMinute}</td>
                      <td className="py-2 pr-3">
                        {when(token.createdAt, '')}
                        {token.createdByName ? <span className="text-ink-600"> by {token.createdByName}</span> : null}
                      </td>
                      <td className="py-2 pr-3">{when(token.lastUsedAt, 'never')}</td>
                      <td className={`py-2 pr-3 ${state.className}`}>
                        {state.label}
                        {token.revokedAt ? <span className="text-ink-600"> {when(token.revokedAt, '')}</span> : null}
                      </td>
                      <td className="py-2">{state.label === 'Active' ? <RevokeButton token={token} /> : null}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}

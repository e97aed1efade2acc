'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition, type FormEvent } from 'react';
import { FormMessage } from '@/components/auth/AuthFrame';

type Role = 'admin' | 'designer' | 'reviewer' | 'viewer';
const ROLE_CHOICES: { value: Role; label: string; rights: string }[] = [
  { value: 'viewer', label: 'Viewer', rights: 'reads projects and sheets' },
  { value: 'designer', label: 'Designer', rights: 'sizes circuits, submits and shares sheets' },
  { value: 'reviewer', label: 'Reviewer', rights: 'approves or returns sheets of others' },
  { value: 'admin', label: 'Admin', rights: 'all of the above, members and catalogue' },
];

interface Member {
  id: string;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  hasPassword: boolean;
  createdAt: string;
}
interface Invitation {
  id: string;
  email: string;
  role: Role;
  createdAt: string;
  expiresAt: string;
}

async function send(url: string, method: string, body?: unknown): Promise<string | null> {
  const response = await fetch(url, { method, headers: body ? { 'content-type': 'application/json' } : undefined, body: body ? JSON.stringify(body) : undefined });
  if (response.ok) return null;
  const answer = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
  return answer?.error?.message ?? `The server answered ${response.status}.`;
}

export function MembersAdmin({ currentUserId, members, invitations }: { currentUserId: string; members: Member[]; invitations: Invitation[] }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: 'error' | 'success'; text: string } | null>(null);
  const [inviteError, setInviteError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [, startTransition] = useTransition();

  async function run(action: () => Promise<string | null>, success: string) {
    setBusy(true);
    setMessage(null);
    const error = await action().catch(() => 'The server could not be reached.');
    setBusy(false);
    setMessage(error ? { tone: 'error', text: error } : { tone: 'success', text: success });
    if (!error) startTransition(() => router.refresh());
    return error;
  }

  async function onInvite(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const form = new FormData(formElement);
    const email = String(form.get('email') ?? '').trim();
    const role = String(form.get('role') ?? 'viewer');
    setInviteError(null);
    const error = await run(() => send('/api/members/invitations', 'POST', { email, role }), `Invitation sent to ${email}.`);
    if (error) setInviteError(error);
    else formElement.reset();
  }

  return (
    <div className="mt-6 space-y-8">
      <div aria-live="polite">{message ? <FormMessage tone={message.tone}>{message.text}</FormMessage> : null}</div>

      <form onSubmit={onInvite} className="panel grid gap-4 p-5 sm:grid-cols-[3fr_2fr_auto] sm:items-end" aria-labelledby="invite-heading">
        <h2 id="invite-heading" className="text-lead font-semibold sm:col-span-3">
          Invite someone
        </h2>
        <div>
          <label htmlFor="invite-email" className="field-label">
            E-mail
          </label>
          <input id="invite-email" name="email" type="email" required className="field-input" aria-invalid={Boolean(inviteError)} aria-describedby="invite-error" />
        </div>
        <div>
          <label htmlFor="invite-role" className="field-label">
            Role
          </label>
          <select id="invite-role" name="role" defaultValue="designer" className="field-input">
            {ROLE_CHOICES.map((choice) => (
              <option key={choice.value} value={choice.value}>
                {choice.label} — {choice.rights}
              </option>
            ))}
          </select>
        </div>
        <button type="submit" className="btn-primary justify-center" disabled={busy}>
          Send invitation
        </button>
        {inviteError ? (
          <p id="invite-error" className="field-error sm:col-span-3">
            {inviteError}
          </p>
        ) : null}
      </form>

      <div className="panel overflow-x-auto">
        <table className="w-full text-left text-body">
          <caption className="sr-only">Members</caption>
          <thead className="border-b border-ink-100 text-caption uppercase tracking-wide text-ink-500">
            <tr>
              <th scope="col" className="px-4 py-2 font-medium">Name</th>
              <th scope="col" className="px-4 py-2 font-medium">E-mail</th>
              <th scope="col" className="px-4 py-2 font-medium">Role</th>
              <th scope="col" className="px-4 py-2 font-medium">Access</th>
              <th scope="col" className="px-4 py-2 font-medium"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {members.length === 0 ? (
              <tr>
                <td colSpan={5} className="px-4 py-6 text-ink-500">No members yet.</td>
              </tr>
            ) : null}
            {members.map((member) => (
              <tr key={member.id} className={`border-b border-ink-50 last:border-0 ${member.active ? '' : 'text-ink-400'}`}>
                <td className="px-4 py-2">
                  {member.name}
                  {member.id === currentUserId ? <span className="ml-2 text-caption text-ink-500">(you)</span> : null}
                </td>
                <td className="px-4 py-2">{member.email}</td>
                <td className="px-4 py-2">
                  <label className="sr-only" htmlFor={`role-${member.id}`}>
                    Role of {member.name}
                  </label>
                  <select
                    id={`role-${member.id}`}
                    value={member.role}
                    disabled={busy}
                    className="rounded-md border border-ink-200 bg-white px-2 py-1"
                    onChange={(event) => {
                      const role = event.target.value as Role;
                      void run(() => send(`/api/members/${member.id}`, 'PATCH', { role }), `${member.name} is now ${role}.`);
                    }}
                  >
                    {ROLE_CHOICES.map((choice) => (
                      <option key={choice.value} value={choice.value}>
                        {choice.label}
                      </option>
                    ))}
                  </select>
                </td>
                <td className="px-4 py-2">{member.active ? 'Active' : 'Closed'}</td>
                <td className="px-4 py-2 text-right">
                  {member.active ? (
                    <button
                      type="button"
                      className="btn-quiet"
                      disabled={busy}
                      onClick={() => {
                        if (window.confirm(`Close ${member.name}'s access? Their open sessions end at once.`)) {
                          void run(() => send(`/api/members/${member.id}`, 'PATCH', { active: false }), `${member.name} can no longer sign in.`);
                        }
                      }}
                    >
                      Close access
                    </button>
                  ) : (
                    <button type="button" className="btn-quiet" disabled={busy} onClick={() => void run(() => send(`/api/members/${member.id}`, 'PATCH', { active: true }), `${member.name} can sign in again.`)}>
                      Restore access
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <section aria-labelledby="open-invitations" className="panel p-5">
        <h2 id="open-invitations" className="text-lead font-semibold">
          Open invitations
        </h2>
        {invitations.length === 0 ? (
          <p className="mt-2 text-ink-500">None waiting.</p>
        ) : (
          <ul className="mt-3 divide-y divide-ink-50">
            {invitations.map((invitation) => (
              <li key={invitation.id} className="flex flex-wrap items-center gap-3 py-2">
                <span className="font-medium">{invitation.email}</span>
                <span className="text-ink-500">as {invitation.role}</span>
                <span className="num text-caption text-ink-500">link valid until {invitation.expiresAt.replace('T', ' ').slice(0, 16)} UTC</span>
                <button
                  type="button"
                  className="btn-quiet ml-auto"
                  disabled={busy}
                  onClick={() => void run(() => send(`/api/members/invitations/${invitation.id}`, 'DELETE'), `The invitation to ${invitation.email} is withdrawn.`)}
                >
                  Withdraw
                </button>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

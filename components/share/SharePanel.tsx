'use client';
/**
 * "Documents and sharing" on the sizing sheet: the PDF sizing sheet and the candidate exports for
 * every member (all from the saved sheet), and for designers and admins the read-only links (make
 * one with an expiry, see when each was last opened, revoke) and sending a link by e-mail, with the
 * PDF attached if wanted. Sends and links appear in the sheet's history.
 */
import { useId, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

interface ShareItem {
  id: string;
  createdAt: string;
  createdByName: string | null;
  expiresAt: string;
  revokedAt: string | null;
  lastOpenedAt: string | null;
  state: 'active' | 'expired' | 'revoked';
}

class ShareApiError extends Error {
  constructor(
    message: string,
    readonly issues: { path: string; message: string }[] = [],
  ) {
    super(message);
  }
}

async function call<T>(url: string, init?: RequestInit): Promise<T> {
  const response = await fetch(url, { ...init, headers: { 'content-type': 'application/json', ...(init?.headers ?? {}) } });
  const body = (await response.json().catch(() => ({}))) as { error?: { message?: string; issues?: { path: string; message: string }[] } };
  if (!response.ok) throw new ShareApiError(body.error?.message ?? `The server answered ${response.status}.`, body.error?.issues);
  return body as T;
}

const EXPIRY_CHOICES = [1, 7, 14, 30, 90] as const;
const when = (iso: string | null) => (iso ? iso.slice(0, 16).replace('T', ' ') : '—');
const STATE_WORDS: Record<ShareItem['state'], { word: string; className: string }> = {
  active: { word: '● works', className: 'text-within-dark' },
  expired: { word: '◌ expired', className: 'text-ink-500' },
  revoked: { word: '✖ revoked', className: 'text-over-dark' },
};

function ExpirySelect({ id, value, onChange }: { id: string; value: number; onChange: (days: number) => void }) {
  return (
    <select id={id} className="field-input py-1" value={value} onChange={(e) => onChange(Number(e.target.value))}>
      {EXPIRY_CHOICES.map((days) => (
        <option key={days} value={days}>
          {days === 1 ? '1 day' : `${days} days`}
        </option>
      ))}
    </select>
  );
}

export function SharePanel({ sheetId, canShare, dirty }: { sheetId: string; canShare: boolean; dirty: boolean }) {
  const queryClient = useQueryClient();
  const ids = useId();
  const [linkDays, setLinkDays] = useState(14);
  const [newLink, setNewLink] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);
  const [mail, setMail] = useState({ to: '', message: '', attachPdf: true, expiresInDays: 14 });
  const [notice, setNotice] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [fieldError, setFieldError] = useState<string | null>(null);

  const shares = useQuery({
    queryKey: ['sheet', sheetId, 'shares'],
    queryFn: async () => (await call<{ shares: ShareItem[] }>(`/api/sheets/${sheetId}/shares`)).shares,
    enabled: canShare,
  });
  const refresh = () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: ['sheet', sheetId, 'shares'] }),
      queryClient.invalidateQueries({ queryKey: ['sheet', sheetId, 'history'] }),
    ]);

  const create = useMutation({
    mutationFn: () => call<{ path: string }>(`/api/sheets/${sheetId}/shares`, { method: 'POST', body: JSON.stringify({ expiresInDays: linkDays }) }),
    onSuccess: async (answer) => {
      setNewLink(`${window.location.origin}${answer.path}`);
      setCopied(false);
      setNotice(null);
      await refresh();
    },
    onError: (error) => setNotice({ tone: 'error', text: error.message }),
  });
  const revoke = useMutation({
    mutationFn: (shareId: string) => call(`/api/sheets/${sheetId}/shares/${shareId}`, { method: 'DELETE' }),
    onSuccess: async () => {
      setNotice({ tone: 'ok', text: 'Link revoked: it no longer opens the sheet.' });
      await refresh();
    },
    onError: (error) => setNotice({ tone: 'error', text: error.message }),
  });
  const send = useMutation({
    mutationFn: () => call<{ sentTo: string; pdfAttached: boolean }>(`/api/sheets/${sheetId}/email`, { method: 'POST', body: JSON.stringify(mail) }),
    onSuccess: async (answer) => {
      setNotice({ tone: 'ok', text: `Sent to ${answer.sentTo}${answer.pdfAttached ? ' with the PDF attached' : ''}; recorded in the history.` });
      setFieldError(null);
      setMail((m) => ({ ...m, to: '', message: '' }));
      await refresh();
    },
    onError: (error) => {
      const toIssue = error instanceof ShareApiError ? error.issues.find((i) => i.path === 'to') : undefined;
      setFieldError(toIssue?.message ?? null);
      setNotice({ tone: 'error', text: toIssue ? 'The message was not sent: check the address.' : error.message });
    },
  });

  return (
    <section aria-labelledby={`${ids}-heading`} className="panel p-3" data-testid="share-panel">
      <h2 id={`${ids}-heading`} className="text-body font-semibold">Documents and sharing</h2>
      <p className="text-caption text-ink-500">
        Everything here is made from the saved sheet{dirty ? ' — you have unsaved changes, which are not included' : ''}. The caution and every assumption flag go with it.
      </p>
      <div className="mt-2 flex flex-wrap gap-2">
        <a className="btn-quiet py-1" href={`/api/sheets/${sheetId}/pdf`} target="_blank" rel="noopener" data-testid="pdf-link">
          PDF sizing sheet
        </a>
        <a className="btn-quiet py-1" href={`/api/sheets/${sheetId}/candidates/export?format=csv`} data-testid="export-csv">
          Candidates as CSV
        </a>
        <a className="btn-quiet py-1" href={`/api/sheets/${sheetId}/candidates/export?format=xlsx`} data-testid="export-xlsx">
          Candidates as XLSX
        </a>
      </div>

      {notice ? (
        <p role={notice.tone === 'error' ? 'alert' : 'status'} className={`mt-2 rounded-md px-3 py-1 text-caption ${notice.tone === 'error' ? 'border border-over bg-over-light text-over-dark' : 'border border-within bg-within-light text-within-dark'}`} data-testid="share-notice">
          {notice.text}
        </p>
      ) : null}

      {canShare ? (
        <div className="mt-3 grid gap-4 xl:grid-cols-2">
          <div>
            <h3 className="text-caption font-semibold uppercase tracking-wide text-ink-600">Read-only links</h3>
            <p className="text-caption text-ink-500">Anyone holding a link sees this sheet only, without signing in, until it expires or you revoke it.</p>
            <div className="mt-1 flex items-end gap-2">
              <div>
                <label htmlFor={`${ids}-link-days`} className="field-label">Works for</label>
                <ExpirySelect id={`${ids}-link-days`} value={linkDays} onChange={setLinkDays} />
              </div>
              <button type="button" className="btn-primary py-1" onClick={() => create.mutate()} disabled={create.isPending} data-testid="make-link">
                {create.isPending ? 'Making…' : 'Make a link'}
              </button>
            </div>
            {newLink ? (
              <div className="mt-2 rounded-md border border-copper-300 bg-paper p-2">
                <label htmlFor={`${ids}-new-link`} className="field-label">New link — copy it now; it is shown only once</label>
                <div className="flex gap-2">
                  <input id={`${ids}-new-link`} className="field-input mt-0 py-1 font-mono text-caption" readOnly value={newLink} onFocus={(e) => e.currentTarget.select()} data-testid="new-link" />
                  <button
                    type="button"
                    className="btn-quiet shrink-0 py-1"
                    onClick={async () => {
                      try {
                        await navigator.clipboard.writeText(newLink);
                        setCopied(true);
                      } catch {
                        setCopied(false);
                      }
                    }}
                  >
                    {copied ? 'Copied' : 'Copy'}
                  </button>
                </div>
              </div>
            ) : null}
            {shares.isLoading ? <p className="mt-2 text-caption text-ink-500" role="status">Loading the links…</p> : null}
            {shares.isError ? <p className="mt-2 field-error">The links could not be loaded: {shares.error.message}</p> : null}
            {shares.data && shares.data.length === 0 ? <p className="mt-2 text-caption text-ink-500">No links yet.</p> : null}
            {shares.data && shares.data.length > 0 ? (
              <table className="mt-2 w-full text-caption" data-testid="share-list">
                <thead>
                  <tr className="text-left text-ink-500">
                    <th className="font-medium">Made</th>
                    <th className="font-medium">By</th>
                    <th className="font-medium">Until</th>
                    <th className="font-medium">Last opened</th>
                    <th className="font-medium">State</th>
                    <th><span className="sr-only">Action</span></th>
                  </tr>
                </thead>
                <tbody>
                  {shares.data.map((share) => (
                    <tr key={share.id} className="border-t border-ink-100" data-state={share.state}>
                      <td className="num">{when(share.createdAt)}</td>
                      <td>{share.createdByName ?? '—'}</td>
                      <td className="num">{when(share.expiresAt)}</td>
                      <td className="num">{when(share.lastOpenedAt)}</td>
                      <td className={STATE_WORDS[share.state].className}>{STATE_WORDS[share.state].word}</td>
                      <td className="text-right">
                        {share.state === 'active' ? (
                          <button type="button" className="text-over-dark underline-offset-2 hover:underline" onClick={() => revoke.mutate(share.id)} disabled={revoke.isPending} aria-label={`Revoke the link made ${when(share.createdAt)}`}>
                            Revoke
                          </button>
                        ) : null}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
          </div>

          <form
            onSubmit={(e) => {
              e.preventDefault();
              if (mail.to.trim()) send.mutate();
            }}
            aria-labelledby={`${ids}-mail-heading`}
          >
            <h3 id={`${ids}-mail-heading`} className="text-caption font-semibold uppercase tracking-wide text-ink-600">Send by e-mail</h3>
            <p className="text-caption text-ink-500">Sends a new read-only link to one address; the address and your message go into the history.</p>
            <label htmlFor={`${ids}-to`} className="field-label mt-1">To</label>
            <input
              id={`${ids}-to`}
              type="email"
              required
              className="field-input py-1"
              value={mail.to}
              onChange={(e) => setMail((m) => ({ ...m, to: e.target.value }))}
              aria-invalid={fieldError ? true : undefined}
              aria-describedby={fieldError ? `${ids}-to-error` : undefined}
              data-testid="mail-to"
            />
            {fieldError ? <p id={`${ids}-to-error`} className="field-error">{fieldError}</p> : null}
            <label htmlFor={`${ids}-message`} className="field-label mt-2">Message (optional)</label>
            <textarea id={`${ids}-message`} className="field-input py-1" rows={3} maxLength={2000} value={mail.message} onChange={(e) => setMail((m) => ({ ...m, message: e.target.value }))} data-testid="mail-message" />
            <div className="mt-2 flex flex-wrap items-end gap-3">
              <label className="flex items-center gap-2 text-body">
                <input type="checkbox" checked={mail.attachPdf} onChange={(e) => setMail((m) => ({ ...m, attachPdf: e.target.checked }))} data-testid="mail-attach" />
                Attach the PDF sizing sheet
              </label>
              <div>
                <label htmlFor={`${ids}-mail-days`} className="field-label">Link works for</label>
                <ExpirySelect id={`${ids}-mail-days`} value={mail.expiresInDays} onChange={(days) => setMail((m) => ({ ...m, expiresInDays: days }))} />
              </div>
              <button type="submit" className="btn-primary py-1" disabled={send.isPending || mail.to.trim() === ''} data-testid="mail-send">
                {send.isPending ? 'Sending…' : 'Send'}
              </button>
            </div>
          </form>
        </div>
      ) : null}
    </section>
  );
}

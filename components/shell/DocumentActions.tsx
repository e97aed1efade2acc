'use client';
/**
 * Rename, duplicate, archive and delete for one project, sizing sheet or schedule (issue 23). The
 * command goes to the server action the page passes in (components never import server code);
 * buttons the rules refuse are shown disabled with the reason, so nobody guesses why.
 */
import Link from 'next/link';
import { useActionState, useState } from 'react';

export interface DocumentActionState {
  ok?: boolean;
  message?: string;
  href?: string;
}

type Op = 'rename' | 'duplicate' | 'archive' | 'unarchive' | 'delete';

export function DocumentActions({
  kind,
  id,
  name,
  archived = false,
  refusals = {},
  action,
  label,
}: {
  kind: 'project' | 'sheet' | 'schedule';
  id: string;
  name: string;
  archived?: boolean;
  /** Why an operation is refused here (e.g. "Approved revisions are never deleted"); absent = allowed. */
  refusals?: Partial<Record<Op, string | null>>;
  action: (state: DocumentActionState, formData: FormData) => Promise<DocumentActionState>;
  /** What the menu is for, for screen readers ("Manage sheet C-12"). */
  label: string;
}) {
  const [state, formAction, pending] = useActionState(action, {});
  const [renaming, setRenaming] = useState(false);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const hidden = (op: Op) => (
    <>
      <input type="hidden" name="kind" value={kind} />
      <input type="hidden" name="id" value={id} />
      <input type="hidden" name="op" value={op} />
    </>
  );
  const button = (op: Op, text: string, extra: { onClick?: () => void; type?: 'submit' | 'button' } = {}) => {
    const refusal = refusals[op];
    return (
      <button
        type={extra.type ?? 'submit'}
        className="btn-quiet"
        disabled={pending || Boolean(refusal)}
        title={refusal ?? undefined}
        aria-describedby={refusal ? `${id}-${op}-why` : undefined}
        onClick={extra.onClick}
        data-testid={`doc-${op}`}
      >
        {text}
      </button>
    );
  };
  return (
    <details className="relative" data-testid={`manage-${kind}`} data-document-id={id}>
      <summary className="btn-quiet cursor-pointer list-none" aria-label={label}>Manage ▾</summary>
      <div className="mt-1 w-72 space-y-2 rounded-md border border-ink-100 bg-white p-3 text-ink-900 shadow-lg">
        {renaming ? (
          <form action={formAction} className="space-y-2" onSubmit={() => setRenaming(false)}>
            {hidden('rename')}
            <label className="field-label" htmlFor={`${id}-rename`}>New name</label>
            <input id={`${id}-rename`} name="name" defaultValue={name} required maxLength={200} className="field-input" data-testid="doc-rename-input" />
            <div className="flex gap-2">
              <button type="submit" className="btn-primary" data-testid="doc-rename-save">Save name</button>
              <button type="button" className="btn-quiet" onClick={() => setRenaming(false)}>Cancel</button>
            </div>
          </form>
        ) : (
          <div className="flex flex-wrap gap-1">
            {button('rename', 'Rename', { type: 'button', onClick: () => setRenaming(true) })}
            <form action={formAction}>{hidden('duplicate')}{button('duplicate', 'Duplicate')}</form>
            <form action={formAction}>{archived ? <>{hidden('unarchive')}{button('unarchive', 'Unarchive')}</> : <>{hidden('archive')}{button('archive', 'Archive')}</>}</form>
            {confirmingDelete ? (
              <form action={formAction} className="flex gap-1" onSubmit={() => setConfirmingDelete(false)}>
                {hidden('delete')}
                <button type="submit" className="btn-quiet text-over-dark" data-testid="doc-delete-confirm">Yes, delete</button>
                <button type="button" className="btn-quiet" onClick={() => setConfirmingDelete(false)}>Keep</button>
              </form>
            ) : (
              button('delete', 'Delete', { type: 'button', onClick: () => setConfirmingDelete(true) })
            )}
          </div>
        )}
        {(['rename', 'duplicate', 'archive', 'unarchive', 'delete'] as const)
          .filter((op) => refusals[op] && (op !== 'archive' || !archived) && (op !== 'unarchive' || archived))
          .map((op) => (
            <p key={op} id={`${id}-${op}-why`} className="text-caption text-ink-600" data-testid={`doc-${op}-why`}>
              <span aria-hidden="true">◐ </span>
              {refusals[op]}
            </p>
          ))}
        {confirmingDelete ? <p className="text-caption text-ink-600">Deleted items are hidden at once; an admin can restore them for 30 days.</p> : null}
        {state.message ? (
          <p role={state.ok ? 'status' : 'alert'} className={state.ok ? 'text-body text-within-dark' : 'field-error'} data-testid="doc-message">
            {state.message} {state.href ? <Link href={state.href} className="text-copper-700 underline">Open it</Link> : null}
          </p>
        ) : null}
      </div>
    </details>
  );
}

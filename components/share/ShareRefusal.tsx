import { Wordmark } from '@/components/shell/Wordmark';

/**
 * What a visitor sees when a share link does not open a sheet. A wrong token says only that the
 * link is not valid — the same words whether it never existed or belongs to any team — while a
 * revoked or expired link says so plainly, so its holder knows to ask for a new one.
 */
export function ShareRefusal({ state, at }: { state: 'invalid' | 'revoked' | 'expired'; at?: Date }) {
  const when = at ? ` on ${at.toISOString().slice(0, 16).replace('T', ' ')} UTC` : '';
  const words = {
    invalid: { title: 'This link is not valid', text: 'No sizing sheet opens with this link. Check that the whole link was copied, or ask the person who sent it for a new one.' },
    revoked: { title: 'This link was revoked', text: `The team that shared this sizing sheet revoked the link${when}; it no longer opens the sheet. Ask the person who sent it for a new link if you still need it.` },
    expired: { title: 'This link has expired', text: `The link stopped working${when}, when its time ran out. Ask the person who sent it for a new link if you still need the sheet.` },
  }[state];
  return (
    <div className="min-h-screen bg-paper">
      <header className="bg-ink-900 px-4 py-2">
        <Wordmark />
      </header>
      <main className="mx-auto max-w-xl px-6 py-16" data-testid="share-refusal" data-state={state}>
        <h1 className="text-title">{words.title}</h1>
        <p className="mt-2 text-ink-700">{words.text}</p>
      </main>
    </div>
  );
}

import Link from 'next/link';
import type { ReactNode } from 'react';
import { Wordmark } from '@/components/shell/Wordmark';

/**
 * The frame of the pages a visitor sees before the workspace (sign in, invitation, new password):
 * an ink band with the mark and one line about the product, the form on paper beside it.
 */
export function AuthFrame({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <div className="grid min-h-screen md:grid-cols-[minmax(18rem,2fr)_3fr]">
      <aside className="flex flex-col justify-between bg-ink-900 px-8 py-8 text-ink-200">
        <Link href="/" aria-label="Ampwarden home" className="w-fit">
          <Wordmark />
        </Link>
        <div className="my-10 max-w-sm">
          <p className="text-lead text-paper">Heat-balance sizing of bus bars and cables, reviewed and signed by your team.</p>
          <svg viewBox="0 0 240 60" className="mt-6 w-full max-w-xs" aria-hidden="true">
            {/* A temperature profile across a bar: the shape of what the workspace computes. */}
            <path d="M0 52 C50 52, 70 12, 120 10 S190 52, 240 52" fill="none" strokeWidth="2" className="stroke-copper-400" />
            <line x1="0" y1="8" x2="240" y2="8" strokeDasharray="4 4" strokeWidth="1" className="stroke-ink-500" />
          </svg>
        </div>
        <p className="text-caption text-ink-300">An engineering aid: every result is checked by a licensed engineer before use.</p>
      </aside>
      <main className="flex items-start justify-center px-6 py-16 md:items-center">
        <div className="w-full max-w-sm">
          <h1 className="text-title">{title}</h1>
          {intro ? <div className="mt-2 text-ink-600">{intro}</div> : null}
          <div className="mt-6">{children}</div>
        </div>
      </main>
    </div>
  );
}

export function FormMessage({ tone, children }: { tone: 'error' | 'info' | 'success'; children: ReactNode }) {
  const styles = {
    error: 'border-over/40 bg-over-light text-over-dark',
    info: 'border-ink-200 bg-ink-50 text-ink-800',
    success: 'border-within/40 bg-within-light text-within-dark',
  }[tone];
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md border px-3 py-2 text-body ${styles}`}>
      {children}
    </div>
  );
}

/** The Ampwarden mark: a bar cross-section with a rising heat line, in copper on ink. */
export function Wordmark({ tone = 'light' }: { tone?: 'light' | 'dark' }) {
  const text = tone === 'light' ? 'text-paper' : 'text-ink-900';
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight ${text}`}>
      <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
        <rect x="2" y="8" width="18" height="8" rx="1.5" className="fill-copper-500" />
        <path d="M4 6 C8 1, 14 1, 18 6" fill="none" strokeWidth="1.8" className="stroke-copper-300" />
      </svg>
      Ampwarden
    </span>
  );
}

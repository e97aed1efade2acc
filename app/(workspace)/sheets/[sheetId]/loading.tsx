export default function Loading() {
  return (
    <div role="status" className="space-y-3">
      <div className="h-8 w-96 animate-pulse rounded bg-ink-100" />
      <div className="grid gap-4 lg:grid-cols-[300px_1fr]">
        <div className="h-[70vh] animate-pulse rounded-lg bg-ink-50" />
        <div className="space-y-3">
          <div className="h-24 animate-pulse rounded-lg bg-ink-50" />
          <div className="h-40 animate-pulse rounded-lg bg-ink-50" />
        </div>
      </div>
      <span className="sr-only">Loading the sizing sheet…</span>
    </div>
  );
}

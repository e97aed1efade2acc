'use client';
export default function ProjectsError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div role="alert" className="panel p-6">
      <h1 className="text-title">The projects could not be loaded</h1>
      <p className="mt-2 text-ink-600">{error.digest ? `The error was logged (${error.digest}).` : error.message}</p>
      <button type="button" className="btn-quiet mt-4" onClick={reset}>Try again</button>
    </div>
  );
}

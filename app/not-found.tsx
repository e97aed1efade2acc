import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-20 text-center">
      <h1 className="text-title">Nothing here</h1>
      <p className="mt-2 text-ink-600">The page does not exist, or it belongs to another team.</p>
      <Link href="/" className="btn-quiet mt-6">
        Back to Ampwarden
      </Link>
    </main>
  );
}

import Link from 'next/link';

export const metadata = { title: 'Not allowed' };

/** Shown with status 403 when a signed-in member's role does not allow a page (requirePageUser). */
export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-6 py-20">
      <p className="num text-caption text-copper-600">403</p>
      <h1 className="mt-1 text-title">Your role does not open this page</h1>
      <p className="mt-3 text-ink-700">
        Ask an admin of your team if you need it. Your other work is where you left it.
      </p>
      <Link href="/projects" className="btn-quiet mt-6">
        Back to projects
      </Link>
    </main>
  );
}

import Link from 'next/link';

export const metadata = { title: 'Sign in first' };

/** Status 401 from unauthorized(): the session ended or never began. */
export default function Unauthorized() {
  return (
    <main className="mx-auto max-w-xl px-6 py-20">
      <p className="num text-caption text-copper-600">401</p>
      <h1 className="mt-1 text-title">Your session has ended</h1>
      <p className="mt-3 text-ink-700">Sign in again to carry on.</p>
      <Link href="/sign-in" className="btn-primary mt-6">
        Sign in
      </Link>
    </main>
  );
}

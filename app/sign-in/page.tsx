import Link from 'next/link';
import { redirect } from 'next/navigation';
import { AuthFrame } from '@/components/auth/AuthFrame';
import { getSessionUser } from '@/server/auth/session';
import { isSafeLocalPath } from '@/server/http/localPath';
import { SignInForm } from './SignInForm';

export const metadata = { title: 'Sign in' };

/** Only paths of this app, never another site, are followed after signing in. */
function safeNext(next: string | string[] | undefined): string {
  const value = Array.isArray(next) ? next[0] : next;
  return isSafeLocalPath(value) && !value.startsWith('/sign-in') ? value : '/projects';
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const next = safeNext(params.next);
  if (await getSessionUser()) redirect(next);
  const email = typeof params.email === 'string' ? params.email : '';
  const error = typeof params.error === 'string' ? params.error : undefined;
  return (
    <AuthFrame title="Sign in" intro="Use the e-mail address your team invited.">
      <SignInForm next={next} initialEmail={email} initialError={error} />
      <p className="mt-6 text-body text-ink-600">
        Forgotten your password?{' '}
        <Link href="/reset" className="font-medium text-copper-600 underline-offset-2 hover:underline">
          Get a link to choose a new one
        </Link>
        .
      </p>
      <p className="mt-2 text-body text-ink-600">No account? An admin of your team can invite you.</p>
    </AuthFrame>
  );
}

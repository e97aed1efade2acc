import { notFound } from 'next/navigation';
import { AuthFrame } from '@/components/auth/AuthFrame';
import { LinkRefusal } from '@/components/auth/LinkRefusal';
import { SetPasswordForm } from '@/components/auth/SetPasswordForm';
import { inspectResetToken } from '@/server/auth/members';

export const metadata = { title: 'Choose a new password' };
export const dynamic = 'force-dynamic';

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const reset = await inspectResetToken(token);
  // A token nobody issued is a page that does not exist (404, ./not-found.tsx).
  if (reset.state === 'unknown') notFound();
  return (
    <AuthFrame title="Choose a new password" intro={reset.state === 'valid' ? 'Saving it ends your sessions on other browsers.' : undefined}>
      {reset.state === 'valid' ? (
        <SetPasswordForm endpoint="/api/auth/reset" token={token} email={reset.email} askName={false} submitLabel="Save new password" />
      ) : (
        <LinkRefusal state={reset.state} kind="reset" />
      )}
    </AuthFrame>
  );
}

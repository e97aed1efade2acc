import { notFound } from 'next/navigation';
import { AuthFrame } from '@/components/auth/AuthFrame';
import { LinkRefusal } from '@/components/auth/LinkRefusal';
import { SetPasswordForm } from '@/components/auth/SetPasswordForm';
import { inspectInvitation } from '@/server/auth/members';
import { ROLE_LABELS } from '@/lib/auth/permissions';

export const metadata = { title: 'Join your team' };
export const dynamic = 'force-dynamic';

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await inspectInvitation(token);
  // A token nobody issued is a page that does not exist (404, ./not-found.tsx); a known one says why it stopped working.
  if (invitation.state === 'unknown') notFound();
  if (invitation.state !== 'valid') {
    return (
      <AuthFrame title="Join your team">
        <LinkRefusal state={invitation.state} kind="invitation" />
      </AuthFrame>
    );
  }
  return (
    <AuthFrame
      title={`Join ${invitation.teamName}`}
      intro={
        <>
          You are invited as <strong className="font-semibold text-ink-900">{ROLE_LABELS[invitation.role].toLowerCase()}</strong>. Choose a password to finish; this link then stops working.
        </>
      }
    >
      <SetPasswordForm endpoint="/api/auth/invitation" token={token} email={invitation.email} askName submitLabel="Save password and join" />
    </AuthFrame>
  );
}

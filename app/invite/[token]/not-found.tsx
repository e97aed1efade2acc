import { AuthFrame } from '@/components/auth/AuthFrame';
import { LinkRefusal } from '@/components/auth/LinkRefusal';

/** An invitation link nobody issued: HTTP 404, with what to do about it. */
export default function InvitationNotFound() {
  return (
    <AuthFrame title="Join your team">
      <LinkRefusal state="unknown" kind="invitation" />
    </AuthFrame>
  );
}

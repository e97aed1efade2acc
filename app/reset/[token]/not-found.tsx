import { AuthFrame } from '@/components/auth/AuthFrame';
import { LinkRefusal } from '@/components/auth/LinkRefusal';

/** A password link nobody issued: HTTP 404, with what to do about it. */
export default function ResetNotFound() {
  return (
    <AuthFrame title="Choose a new password">
      <LinkRefusal state="unknown" kind="reset" />
    </AuthFrame>
  );
}

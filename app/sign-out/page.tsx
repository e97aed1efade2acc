import { AuthFrame } from '@/components/auth/AuthFrame';
import { SignOutButton } from '@/components/auth/SignOutButton';

export const metadata = { title: 'Sign out' };

export default function SignOutPage() {
  return (
    <AuthFrame title="Sign out" intro="Leave the workspace on this browser. Unsaved changes on open sheets are lost.">
      <SignOutButton className="btn-primary w-full justify-center" />
    </AuthFrame>
  );
}

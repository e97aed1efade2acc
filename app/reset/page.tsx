import Link from 'next/link';
import { AuthFrame } from '@/components/auth/AuthFrame';
import { ResetRequestForm } from './ResetRequestForm';

export const metadata = { title: 'New password' };

export default function ResetRequestPage() {
  return (
    <AuthFrame title="Forgotten your password?" intro="Enter the e-mail address you sign in with. We send a link that lets you choose a new password; it works once, for one hour.">
      <ResetRequestForm />
      <p className="mt-6 text-body text-ink-600">
        Remembered it?{' '}
        <Link href="/sign-in" className="font-medium text-copper-600 underline-offset-2 hover:underline">
          Back to sign in
        </Link>
        .
      </p>
    </AuthFrame>
  );
}

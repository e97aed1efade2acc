'use client';

import { signOut } from 'next-auth/react';
import { useState } from 'react';

export function SignOutButton({ className }: { className?: string }) {
  const [pending, setPending] = useState(false);
  return (
    <button
      type="button"
      className={className}
      disabled={pending}
      onClick={() => {
        setPending(true);
        void signOut({ callbackUrl: '/sign-in' });
      }}
    >
      {pending ? 'Signing out…' : 'Sign out'}
    </button>
  );
}

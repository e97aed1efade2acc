import Link from 'next/link';
import type { LinkState } from '@/lib/auth/linkTokens';
import { FormMessage } from './AuthFrame';

/** What a visitor sees for a link that no longer works; says how to get a working one. */
export function LinkRefusal({ state, kind }: { state: Exclude<LinkState, 'valid'> | 'replaced' | 'revoked'; kind: 'invitation' | 'reset' }) {
  const what = kind === 'invitation' ? 'invitation' : 'password link';
  const remedy =
    state === 'replaced' ? (
      <>Open the link in the most recent invitation e-mail instead; only that one works.</>
    ) : kind === 'invitation' ? (
      <>Ask an admin of your team to invite you again.</>
    ) : (
      <>
        <Link href="/reset" className="font-medium underline">Ask for a new link</Link>.
      </>
    );
  const text = {
    used: `This ${what} has already been used.`,
    // The team sent a newer invitation to the same address: saying "used" sent people looking for an account they never made.
    replaced: `This ${what} was replaced by a newer one sent to the same address.`,
    revoked: `This ${what} was withdrawn by an admin of the team.`,
    expired: `This ${what} has expired.`,
    unknown: `This ${what} is not valid; check that the whole link was copied.`,
  }[state];
  return (
    <FormMessage tone="error">
      {text} {remedy}
    </FormMessage>
  );
}

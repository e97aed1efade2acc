import { CautionNotice } from '@/components/shell/CautionNotice';
import { VerificationRunner } from '@/components/verification/VerificationRunner';
import { requirePageUser } from '@/server/auth/session';

export const metadata = { title: 'Verification' };
export const dynamic = 'force-dynamic';

export default async function VerificationPage() {
  // Any signed-in member may read it: the checks hold no team data.
  await requirePageUser();
  return (
    <section aria-labelledby="verification-heading">
      <h1 id="verification-heading" className="text-title">Verification</h1>
      <p className="mt-2 max-w-4xl text-ink-600">
        Every reference check of the heat-balance solver and the electrical methods, run now in your browser with the same code that sizes your
        circuits. Each check names its published source (a standard&apos;s clause, a textbook section, or a value marked <em>from memory</em> that a
        reviewer should confirm), the reference value, Ampwarden&apos;s value and the tolerance allowed. The same checks run in the test suite before
        every release, so this page and the tests cannot disagree.
      </p>
      <div className="mt-3 max-w-4xl">
        <CautionNotice compact />
      </div>
      <VerificationRunner />
    </section>
  );
}

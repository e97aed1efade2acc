export const metadata = { title: 'Verification' };

export default function VerificationPage() {
  return (
    <section aria-labelledby="verification-heading">
      <h1 id="verification-heading" className="text-title">Verification</h1>
      <p className="mt-2 text-ink-600">Every reference check of the solver and the electrical methods, with its source.</p>
    </section>
  );
}

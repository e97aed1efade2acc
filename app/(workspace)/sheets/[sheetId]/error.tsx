'use client';
import Link from 'next/link';
import { CautionNotice } from '@/components/shell/CautionNotice';

export default function SheetError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div role="alert" className="panel space-y-3 p-6">
      <h1 className="text-title">The sizing sheet could not be opened</h1>
      <p className="text-ink-600">
        {error.digest ? `The server logged the error (${error.digest}).` : error.message} If the sheet was saved by a newer version of Ampwarden, its inputs may not be readable here.
      </p>
      <div className="flex gap-2">
        <button type="button" className="btn-quiet" onClick={reset}>Try again</button>
        <Link href="/projects" className="btn-quiet">All projects</Link>
      </div>
      <CautionNotice compact />
    </div>
  );
}

/**
 * /share/[token] — one sizing sheet, read-only, for the holder of a link; no sign-in. The page
 * shows the saved sheet (inputs, candidates, the chosen candidate's result, plots, flags with their
 * acknowledgements, review status and the caution) and offers the PDF through the same token. It
 * has no navigation: nothing else of the team is reachable from here. Search engines are told to
 * keep out (noindex), and no referrer leaves with the token.
 */
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { CautionNotice } from '@/components/shell/CautionNotice';
import { Wordmark } from '@/components/shell/Wordmark';
import { StatusBadge } from '@/components/sheet/StatusBadge';
import { ShareRefusal } from '@/components/share/ShareRefusal';
import { SharedSheetView, type SharedSheet } from '@/components/share/SharedSheetView';
import { formatDate } from '@/lib/sheet/sheetTables';
import { openShare } from '@/db/queries/shares';
import type { SheetRecord } from '@/db/queries/sheets';
import { savedOptionalChecks } from '@/lib/sheet/snapshot';

export const dynamic = 'force-dynamic';

export const metadata: Metadata = {
  title: 'Shared sizing sheet',
  robots: { index: false, follow: false, nocache: true, googleBot: { index: false, follow: false } },
  referrer: 'no-referrer',
};

function reviewWords(sheet: SheetRecord): string {
  switch (sheet.status) {
    case 'approved':
      return `Approved${sheet.approvedAt ? ` on ${formatDate(sheet.approvedAt)}` : ''} by ${sheet.reviewerName ?? 'a reviewer'}.`;
    case 'in_review':
      return 'Submitted for review; not approved yet. Do not use it for construction.';
    case 'returned':
      return `Returned to the author by ${sheet.reviewerName ?? 'the reviewer'} for changes; not approved. Do not use it for construction.`;
    default:
      return 'A draft: not yet submitted for review, not approved. Do not use it for construction.';
  }
}

export default async function SharedSheetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const opened = await openShare(token);
  if (opened.state === 'invalid') notFound();
  if (opened.state === 'revoked') return <ShareRefusal state="revoked" at={opened.revokedAt} />;
  if (opened.state === 'expired') return <ShareRefusal state="expired" at={opened.expiresAt} />;
  const sheet = opened.sheet;
  // Only what the view shows crosses to the browser: no ids of the team's users, projects or sheets.
  const shared: SharedSheet = {
    inputs: sheet.inputs,
    result: sheet.result,
    acknowledgements: sheet.acknowledgements.map((a) => ({ flagCode: a.flagCode, comment: a.comment, reviewerName: a.reviewerName })),
    // As saved with the result (older snapshots: computed here from the saved inputs, not in the reader's browser).
    optionalChecks: savedOptionalChecks(sheet.result, sheet.inputs),
    teamCurrency: sheet.teamCurrency,
  };
  const approved = sheet.status === 'approved';
  return (
    <div className="min-h-screen bg-paper">
      <header className="flex flex-wrap items-center justify-between gap-2 bg-ink-900 px-4 py-2 text-paper">
        <Wordmark />
        <p className="text-caption text-ink-200">Shared read-only · this link works until {formatDate(opened.expiresAt)}</p>
      </header>
      <main className="mx-auto max-w-sheet space-y-3 px-4 py-5" data-testid="shared-sheet">
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div className="min-w-0">
            <p className="text-caption text-ink-500">{sheet.projectName}</p>
            <h1 className="flex flex-wrap items-center gap-x-3 text-title">
              <span className="num">{sheet.circuitTag}</span>
              <span className="font-normal text-ink-700">{sheet.title}</span>
              <StatusBadge status={sheet.status} />
            </h1>
            <p className="text-caption text-ink-500">
              Revision {sheet.revision} · by {sheet.authorName ?? 'unknown'}
              {sheet.reviewerName ? ` · reviewed by ${sheet.reviewerName}` : ''} · saved {formatDate(sheet.updatedAt)}
              {sheet.solverVersion ? ` · ${sheet.solverVersion}` : ''}
            </p>
          </div>
          <a className="btn-primary" href={`/share/${token}/pdf`} data-testid="shared-pdf-link">
            PDF sizing sheet
          </a>
        </div>
        <p
          className={`rounded-md border px-3 py-1.5 text-body ${approved ? 'border-within bg-within-light text-within-dark' : 'border-over bg-over-light text-over-dark'}`}
          data-testid="shared-review-status"
        >
          <span aria-hidden="true">{approved ? '✔ ' : '✖ '}</span>
          <strong className="font-semibold">{approved ? 'Review status: ' : 'Not approved. '}</strong>
          {reviewWords(sheet)}
        </p>
        <CautionNotice compact />
        <SharedSheetView sheet={shared} />
        <CautionNotice />
      </main>
    </div>
  );
}

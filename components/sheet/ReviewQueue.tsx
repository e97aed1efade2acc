import Link from 'next/link';
import type { SheetListItem } from '@/lib/sheet/records';

/** Sheets waiting for this reviewer (their own are left out: nobody reviews their own sheet). */
export function ReviewQueue({ sheets, className = '' }: { sheets: SheetListItem[]; className?: string }) {
  return (
    <section aria-labelledby="review-queue-heading" className={`panel border-copper-300 p-4 ${className}`}>
      <h2 id="review-queue-heading" className="font-semibold">Waiting for your review <span className="num text-ink-500">({sheets.length})</span></h2>
      {sheets.length === 0 ? (
        <p className="mt-1 text-caption text-ink-600">Nothing to review. Sheets that designers submit appear here; your own never do.</p>
      ) : (
        <ul className="mt-2 divide-y divide-ink-50">
          {sheets.map((sheet) => (
            <li key={sheet.id} className="flex flex-wrap items-baseline gap-x-3 py-1.5">
              <Link href={`/sheets/${sheet.id}`} className="num font-medium text-copper-700 hover:underline">{sheet.circuitTag}</Link>
              <span>{sheet.title}</span>
              <span className="text-caption text-ink-500">{sheet.projectName} · by {sheet.authorName} · rev. {sheet.revision}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

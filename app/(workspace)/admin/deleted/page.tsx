import { listRecentlyDeleted } from '@/db/queries/documents';
import { DELETE_RETENTION_DAYS } from '@/lib/documents/rules';
import { requirePageUser } from '@/server/auth/session';
import { restoreFormAction } from '../../documents/actions';

export const metadata = { title: 'Recently deleted' };
export const dynamic = 'force-dynamic';

const KIND_WORDS = { project: 'Project', sheet: 'Sizing sheet', schedule: 'Schedule' } as const;

/** The admins' list of what was deleted in the last 30 days, each with Restore (issue 23). */
export default async function RecentlyDeletedPage() {
  const user = await requirePageUser('document:restore');
  const items = await listRecentlyDeleted(user.teamId);
  return (
    <section aria-labelledby="deleted-heading" className="max-w-5xl">
      <h1 id="deleted-heading" className="text-title">Recently deleted</h1>
      <p className="mt-2 text-ink-600">
        Deleted projects, sizing sheets and schedules stay here for {DELETE_RETENTION_DAYS} days and are then removed for good. Approved revisions are never deleted, only archived.
      </p>
      {items.length === 0 ? (
        <p className="panel mt-4 p-6 text-ink-600">Nothing has been deleted in the last {DELETE_RETENTION_DAYS} days.</p>
      ) : (
        <div className="panel mt-4 overflow-x-auto">
          <table className="w-full text-left text-body" data-testid="deleted-list">
            <thead className="border-b border-ink-100 text-caption uppercase tracking-wide text-ink-500">
              <tr>
                <th className="px-3 py-2">What</th>
                <th className="px-3 py-2">Name</th>
                <th className="px-3 py-2">Project</th>
                <th className="px-3 py-2">Deleted</th>
                <th className="px-3 py-2">By</th>
                <th className="px-3 py-2">Removed for good on</th>
                <th className="px-3 py-2"><span className="sr-only">Restore</span></th>
              </tr>
            </thead>
            <tbody>
              {items.map((item) => (
                <tr key={`${item.kind}-${item.id}`} className="border-b border-ink-50 last:border-0" data-testid="deleted-item">
                  <td className="px-3 py-2">{KIND_WORDS[item.kind]}</td>
                  <td className="px-3 py-2">{item.name}</td>
                  <td className="px-3 py-2">{item.projectName ?? '—'}</td>
                  <td className="num px-3 py-2 text-caption">{item.deletedAt.toISOString().slice(0, 16).replace('T', ' ')}</td>
                  <td className="px-3 py-2">{item.deletedByName ?? '—'}</td>
                  <td className="num px-3 py-2 text-caption">{new Date(item.deletedAt.getTime() + DELETE_RETENTION_DAYS * 86_400_000).toISOString().slice(0, 10)}</td>
                  <td className="px-3 py-2">
                    <form action={restoreFormAction}>
                      <input type="hidden" name="kind" value={item.kind} />
                      <input type="hidden" name="id" value={item.id} />
                      <button type="submit" className="btn-quiet" aria-label={`Restore ${item.name}`}>Restore</button>
                    </form>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}

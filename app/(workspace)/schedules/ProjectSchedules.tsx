import Link from 'next/link';
import { listSchedulesForProject } from '@/db/queries/schedules';
import { scheduleStateWords, type ScheduleStateTone } from '@/lib/schedule';
import { DocumentActions, type DocumentActionState } from '@/components/shell/DocumentActions';

const TONE_CLASS: Record<ScheduleStateTone, string> = {
  waiting: 'text-ink-600',
  ready: 'text-within-dark',
  problem: 'text-over-dark',
  running: 'text-ink-800',
  done: 'text-within-dark',
};

/** The schedules of a project, for the project page. */
export async function ProjectSchedules({
  teamId,
  projectId,
  mayCreate,
  manageAction,
}: {
  teamId: string;
  projectId: string;
  mayCreate: boolean;
  /** Rename, duplicate, archive, delete (issue 23), for those who may write schedules. */
  manageAction?: (state: DocumentActionState, formData: FormData) => Promise<DocumentActionState>;
}) {
  const schedules = await listSchedulesForProject(teamId, projectId);
  return (
    <section aria-labelledby="project-schedules-heading" className="mt-6">
      <h2 id="project-schedules-heading" className="font-semibold">Schedules</h2>
      {schedules.length === 0 ? (
        <p className="panel mt-2 p-4 text-ink-600">
          No schedules yet. A schedule sizes a whole list of circuits from one file{mayCreate ? ': create one with the form beside this list.' : '; a designer of your team creates them.'}
        </p>
      ) : (
        <ul className="panel mt-2 divide-y divide-ink-50">
          {schedules.map((s) => (
            <li key={s.id} className="flex flex-wrap items-baseline gap-3 px-3 py-2">
              <Link href={`/schedules/${s.id}`} className="font-medium text-copper-700 hover:underline">{s.name}</Link>
              <span className="text-caption text-ink-500">{s.fileName ?? 'no file yet'}</span>
              {(() => {
                const state = scheduleStateWords({ ...s, uploadRefusal: s.uploadRefusal ?? null });
                return (
                  <span className={`num text-caption ${TONE_CLASS[state.tone]}`} data-testid="schedule-state">
                    {state.tone === 'problem' ? '✕ ' : state.tone === 'ready' || state.tone === 'done' ? '✓ ' : ''}
                    {state.words}
                  </span>
                );
              })()}
              {manageAction ? <span className="ml-auto"><DocumentActions kind="schedule" id={s.id} name={s.name} action={manageAction} label={`Manage schedule ${s.name}`} /></span> : null}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

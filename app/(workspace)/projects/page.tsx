import Link from 'next/link';
import { listProjects } from '@/db/queries/projects';
import { listReviewQueue } from '@/db/queries/sheets';
import { can } from '@/lib/auth/permissions';
import { requirePageUser } from '@/server/auth/session';
import { ReviewQueue } from '@/components/sheet/ReviewQueue';
import { CreateProjectForm } from './CreateProjectForm';
import { listArchivedProjects } from '@/db/queries/documents';
import { DocumentActions } from '@/components/shell/DocumentActions';
import { documentAction } from '../documents/actions';

export const metadata = { title: 'Projects' };
export const dynamic = 'force-dynamic';

export default async function ProjectsPage() {
  const user = await requirePageUser('team:read');
  const [projects, archived, queue] = await Promise.all([
    listProjects(user.teamId),
    listArchivedProjects(user.teamId),
    can(user.role, 'sheet:review') ? listReviewQueue(user.teamId, user.id) : Promise.resolve(null),
  ]);
  const mayCreate = can(user.role, 'project:write');
  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_320px]">
      <section aria-labelledby="projects-heading">
        <h1 id="projects-heading" className="text-title">Projects</h1>
        <p className="mt-1 text-ink-600">Each project is a site or building; its sizing sheets size one circuit each.</p>
        {queue ? <ReviewQueue sheets={queue} className="mt-4" /> : null}
        {projects.length === 0 ? (
          <div className="panel mt-4 p-6">
            <h2 className="font-semibold">No projects yet</h2>
            <p className="mt-1 text-ink-600">
              Start with the job: a project holds the sizing sheets of one site. {mayCreate ? 'Create one with the form beside this list, then add a sheet for each circuit (a feeder, a bus-bar run).' : 'A designer of your team creates projects; you will see them here.'}
            </p>
          </div>
        ) : (
          <ul className="mt-4 grid gap-3 md:grid-cols-2">
            {projects.map((project) => (
              <li key={project.id}>
                <Link href={`/projects/${project.id}`} className="panel block p-4 hover:border-copper-400">
                  <span className="font-semibold text-ink-900">{project.name}</span>
                  {project.site ? <span className="block text-caption text-ink-500">{project.site}</span> : null}
                  <span className="mt-2 block text-caption text-ink-600">
                    <span className="num">{project.sheetCount}</span> sizing sheet{project.sheetCount === 1 ? '' : 's'} · updated {project.updatedAt.toISOString().slice(0, 10)}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        )}
        {archived.length > 0 ? (
          <section aria-labelledby="archived-projects-heading" className="mt-6" data-testid="archived-projects">
            <h2 id="archived-projects-heading" className="font-semibold">Archived projects</h2>
            <ul className="panel mt-2 divide-y divide-ink-50">
              {archived.map((p) => (
                <li key={p.id} className="flex flex-wrap items-center gap-3 px-3 py-2">
                  <Link href={`/projects/${p.id}`} className="font-medium text-copper-700 hover:underline">{p.name}</Link>
                  {mayCreate ? <span className="ml-auto"><DocumentActions kind="project" id={p.id} name={p.name} archived action={documentAction} label={`Manage archived project ${p.name}`} /></span> : null}
                </li>
              ))}
            </ul>
          </section>
        ) : null}
      </section>
      {mayCreate || can(user.role, 'document:restore') ? (
        <aside className="space-y-4">
          {mayCreate ? <CreateProjectForm /> : null}
          {can(user.role, 'document:restore') ? (
            <p className="panel p-4 text-body">
              <Link href="/admin/deleted" className="text-copper-700 underline">Recently deleted</Link>: projects, sheets and schedules deleted in the last 30 days, to restore.
            </p>
          ) : null}
        </aside>
      ) : null}
    </div>
  );
}

import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getProject } from '@/db/queries/projects';
import { isUuid, listReviewQueue, listSheetsForProject } from '@/db/queries/sheets';
import { can } from '@/lib/auth/permissions';
import { requirePageUser } from '@/server/auth/session';
import { StatusBadge } from '@/components/sheet/StatusBadge';
import { ReviewQueue } from '@/components/sheet/ReviewQueue';
import { CreateSheetForm } from './CreateSheetForm';
import { DocumentActions } from '@/components/shell/DocumentActions';
import { listArchivedInProject } from '@/db/queries/documents';
import { sheetRefusal, projectDeleteRefusal } from '@/lib/documents/rules';
import { documentAction } from '../../documents/actions';
import { ProjectSchedules } from '../../schedules/ProjectSchedules';
import { NewScheduleForm } from '../../schedules/NewScheduleForm';

export const dynamic = 'force-dynamic';

export async function generateMetadata({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await requirePageUser('team:read');
  const project = isUuid(projectId) ? await getProject(user.teamId, projectId) : null;
  return { title: project?.name ?? 'Project' };
}

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await requirePageUser('team:read');
  const project = isUuid(projectId) ? await getProject(user.teamId, projectId) : null;
  if (!project) notFound();
  const [sheets, queue, archived] = await Promise.all([
    listSheetsForProject(user.teamId, project.id),
    can(user.role, 'sheet:review') ? listReviewQueue(user.teamId, user.id) : Promise.resolve(null),
    listArchivedInProject(user.teamId, project.id),
  ]);
  const mayManageSheets = can(user.role, 'sheet:write');
  const approvedCount = sheets.filter((s) => s.status === 'approved').length + archived.sheets.filter((s) => s.status === 'approved').length;
  const projectQueue = queue?.filter((s) => s.projectId === project.id) ?? null;
  const mayCreate = can(user.role, 'sheet:write');
  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_320px]">
      <section aria-labelledby="project-heading">
        <nav aria-label="Breadcrumb" className="text-caption text-ink-500">
          <Link href="/projects" className="hover:underline">Projects</Link> /
        </nav>
        <div className="flex items-start gap-3">
          <h1 id="project-heading" className="text-title">{project.name}</h1>
          {can(user.role, 'project:write') ? (
            <div className="ml-auto">
              <DocumentActions kind="project" id={project.id} name={project.name} archived={project.archivedAt !== null} refusals={{ delete: projectDeleteRefusal(approvedCount) }} action={documentAction} label={`Manage project ${project.name}`} />
            </div>
          ) : null}
        </div>
        {project.archivedAt ? <p role="note" className="mt-1 text-tight-dark">◐ This project is archived: it is kept as it is and hidden from the projects list.</p> : null}
        {project.site ? <p className="text-ink-600">{project.site}</p> : null}
        {project.description ? <p className="mt-1 max-w-3xl text-ink-600">{project.description}</p> : null}
        {projectQueue && projectQueue.length > 0 ? <ReviewQueue sheets={projectQueue} className="mt-4" /> : null}
        <h2 className="mt-6 font-semibold">Sizing sheets</h2>
        {sheets.length === 0 ? (
          <div className="panel mt-2 p-6">
            <p className="font-semibold">No sizing sheets in this project yet</p>
            <p className="mt-1 text-ink-600">
              One sheet sizes one circuit. {mayCreate ? 'Create a sheet with the form beside this list: give the circuit a tag and say what it feeds; on the sheet you enter the design current and installation, add candidate conductors from the catalogue and compare them.' : 'A designer of your team creates them.'}
            </p>
          </div>
        ) : (
          <div className="panel mt-2 overflow-x-auto">
            <table className="w-full text-left text-body">
              <thead className="border-b border-ink-100 text-caption uppercase tracking-wide text-ink-500">
                <tr>
                  <th className="px-3 py-2">Circuit</th>
                  <th className="px-3 py-2">Feeds</th>
                  <th className="px-3 py-2">State</th>
                  <th className="px-3 py-2">Rev.</th>
                  <th className="px-3 py-2">Chosen candidate</th>
                  <th className="px-3 py-2">Author</th>
                  <th className="px-3 py-2">Updated</th>
                  {mayManageSheets ? <th className="px-3 py-2"><span className="sr-only">Manage</span></th> : null}
                </tr>
              </thead>
              <tbody>
                {sheets.map((sheet) => (
                  <tr key={sheet.id} className={`border-b border-ink-50 last:border-0 ${sheet.newerRevisionId ? 'text-ink-400' : ''}`}>
                    <td className="whitespace-nowrap px-3 py-2 num">
                      <Link href={`/sheets/${sheet.id}`} className="font-medium text-copper-700 hover:underline">{sheet.circuitTag}</Link>
                    </td>
                    <td className="px-3 py-2">{sheet.title}</td>
                    <td className="px-3 py-2"><StatusBadge status={sheet.status} />{sheet.newerRevisionId ? <span className="ml-2 text-caption">superseded</span> : null}</td>
                    <td className="whitespace-nowrap px-3 py-2 num">{sheet.revision}</td>
                    <td className="px-3 py-2">{sheet.chosenLabel ?? <span className="text-ink-400">none yet</span>}</td>
                    <td className="px-3 py-2">{sheet.authorName}</td>
                    <td className="px-3 py-2 num text-caption">{sheet.updatedAt.toISOString().slice(0, 16).replace('T', ' ')}</td>
                    {mayManageSheets ? (
                      <td className="px-3 py-2">
                        <DocumentActions
                          kind="sheet"
                          id={sheet.id}
                          name={sheet.title}
                          refusals={{ rename: sheetRefusal('rename', sheet.status), archive: sheetRefusal('archive', sheet.status), delete: sheetRefusal('delete', sheet.status) }}
                          action={documentAction}
                          label={`Manage sheet ${sheet.circuitTag} revision ${sheet.revision}`}
                        />
                      </td>
                    ) : null}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        <ProjectSchedules teamId={user.teamId} projectId={project.id} mayCreate={can(user.role, 'schedule:write')} manageAction={can(user.role, 'schedule:write') ? documentAction : undefined} />
        {archived.sheets.length + archived.schedules.length > 0 ? (
          <section aria-labelledby="archived-heading" className="mt-6" data-testid="archived-in-project">
            <h2 id="archived-heading" className="font-semibold">Archived</h2>
            <p className="text-caption text-ink-600">Kept as they are and left out of the lists above.</p>
            <ul className="panel mt-2 divide-y divide-ink-50">
              {archived.sheets.map((s) => (
                <li key={s.id} className="flex flex-wrap items-center gap-3 px-3 py-2">
                  <Link href={`/sheets/${s.id}`} className="num font-medium text-copper-700 hover:underline">{s.circuitTag}</Link>
                  <span>{s.title}</span>
                  <StatusBadge status={s.status} />
                  <span className="num text-caption">rev. {s.revision}</span>
                  {mayManageSheets ? <span className="ml-auto"><DocumentActions kind="sheet" id={s.id} name={s.title} archived refusals={{ rename: sheetRefusal('rename', s.status), delete: sheetRefusal('delete', s.status) }} action={documentAction} label={`Manage archived sheet ${s.circuitTag}`} /></span> : null}
                </li>
              ))}
              {archived.schedules.map((s) => (
                <li key={s.id} className="flex flex-wrap items-center gap-3 px-3 py-2">
                  <Link href={`/schedules/${s.id}`} className="font-medium text-copper-700 hover:underline">{s.name}</Link>
                  <span className="text-caption">schedule</span>
                  {can(user.role, 'schedule:write') ? <span className="ml-auto"><DocumentActions kind="schedule" id={s.id} name={s.name} archived action={documentAction} label={`Manage archived schedule ${s.name}`} /></span> : null}
                </li>
              ))}
            </ul>
          </section>
        ) : null}
      </section>
      {mayCreate || can(user.role, 'schedule:write') ? (
        <aside className="space-y-4">
          {mayCreate ? <CreateSheetForm projectId={project.id} /> : null}
          {can(user.role, 'schedule:write') ? <NewScheduleForm projectId={project.id} /> : null}
        </aside>
      ) : null}
    </div>
  );
}

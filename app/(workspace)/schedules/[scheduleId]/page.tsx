import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getSchedule } from '@/db/queries/schedules';
import { CautionNotice } from '@/components/shell/CautionNotice';
import { can } from '@/lib/auth/permissions';
import { requirePageUser } from '@/server/auth/session';
import { ScheduleView } from './ScheduleView';

export const dynamic = 'force-dynamic';

export async function generateMetadata({ params }: { params: Promise<{ scheduleId: string }> }) {
  const { scheduleId } = await params;
  const user = await requirePageUser('team:read');
  const schedule = await getSchedule(user.teamId, scheduleId);
  return { title: schedule ? `${schedule.name} — schedule` : 'Schedule' };
}

export default async function SchedulePage({ params }: { params: Promise<{ scheduleId: string }> }) {
  const { scheduleId } = await params;
  const user = await requirePageUser('team:read');
  const schedule = await getSchedule(user.teamId, scheduleId);
  if (!schedule) notFound();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-caption text-ink-500">
        <Link href="/projects" className="hover:underline">Projects</Link> /{' '}
        <Link href={`/projects/${schedule.projectId}`} className="hover:underline">{schedule.projectName}</Link> /
      </nav>
      <h1 className="text-title">{schedule.name}</h1>
      <CautionNotice compact />
      <ScheduleView scheduleId={schedule.id} mayWrite={can(user.role, 'schedule:write')} mayOpenSheet={can(user.role, 'sheet:write')} />
    </div>
  );
}

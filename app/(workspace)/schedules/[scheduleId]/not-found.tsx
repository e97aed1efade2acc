import Link from 'next/link';

export default function ScheduleNotFound() {
  return (
    <div className="panel p-6">
      <h1 className="text-title">No such schedule</h1>
      <p className="mt-1 text-ink-600">It may have been removed, or it belongs to another team.</p>
      <Link href="/projects" className="btn-quiet mt-3 inline-block">Back to projects</Link>
    </div>
  );
}

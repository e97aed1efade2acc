import Link from 'next/link';
export default function SheetNotFound() {
  return (
    <div className="panel p-6">
      <h1 className="text-title">No such sizing sheet</h1>
      <p className="mt-2 text-ink-600">It does not exist, or it belongs to another team.</p>
      <Link href="/projects" className="btn-quiet mt-4">All projects</Link>
    </div>
  );
}

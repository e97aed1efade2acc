export default function Loading() {
  return <p className="text-ink-500" role="status">Loading the project…</p>;
}

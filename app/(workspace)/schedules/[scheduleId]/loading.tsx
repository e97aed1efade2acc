export default function ScheduleLoading() {
  return <p className="text-ink-500" role="status">Loading the schedule…</p>;
}

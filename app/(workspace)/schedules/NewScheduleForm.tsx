'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { createScheduleRequest } from './api';

/** "New schedule" on a project page: a name, then the schedule page takes the file. */
export function NewScheduleForm({ projectId }: { projectId: string }) {
  const router = useRouter();
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  async function submit(event: React.FormEvent) {
    event.preventDefault();
    if (name.trim() === '') {
      setError('Give the schedule a name.');
      return;
    }
    setPending(true);
    setError(null);
    try {
      const schedule = await createScheduleRequest(projectId, name.trim());
      router.push(`/schedules/${schedule.id}`);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
      setPending(false);
    }
  }
  return (
    <form onSubmit={submit} className="panel space-y-3 p-4" aria-labelledby="new-schedule-heading" noValidate>
      <h2 id="new-schedule-heading" className="font-semibold">New schedule</h2>
      <p className="text-caption text-ink-600">Size a whole list of circuits at once from a CSV or XLSX file.</p>
      <div>
        <label htmlFor="schedule-name" className="field-label">Name</label>
        <input id="schedule-name" value={name} onChange={(e) => setName(e.target.value)} maxLength={200} className="field-input" placeholder="e.g. LV feeders, issue B" aria-invalid={error ? true : undefined} aria-describedby={error ? 'schedule-name-error' : undefined} />
        {error ? <p id="schedule-name-error" role="alert" className="field-error">{error}</p> : null}
      </div>
      <button type="submit" className="btn-primary" disabled={pending}>{pending ? 'Creating…' : 'Create schedule'}</button>
    </form>
  );
}

'use client';
import { useActionState } from 'react';
import { createSheetAction, type FormState } from '../actions';

const INSTALLATIONS = [
  { value: 'cable-in-air', label: 'Cable in air (tray, ladder, cleats)' },
  { value: 'buried', label: 'Cable buried in the ground' },
  { value: 'bar-on-edge', label: 'Bus bar on edge' },
  { value: 'bar-flat', label: 'Bus bar laid flat' },
  { value: 'enclosure', label: 'In an enclosure (derating by hand)' },
];

export function CreateSheetForm({ projectId }: { projectId: string }) {
  const [state, action, pending] = useActionState<FormState, FormData>(createSheetAction, {});
  const err = state.fieldErrors ?? {};
  return (
    <form action={action} className="panel space-y-3 p-4" aria-labelledby="new-sheet-heading" noValidate>
      <h2 id="new-sheet-heading" className="font-semibold">New sizing sheet</h2>
      <input type="hidden" name="projectId" value={projectId} />
      <div>
        <label htmlFor="sheet-tag" className="field-label">Circuit tag</label>
        <input id="sheet-tag" name="circuitTag" required maxLength={40} className="field-input num" placeholder="e.g. MSB-CH1" aria-invalid={err.circuitTag ? true : undefined} aria-describedby={err.circuitTag ? 'sheet-tag-error' : undefined} />
        {err.circuitTag ? <p id="sheet-tag-error" className="field-error">{err.circuitTag}</p> : null}
      </div>
      <div>
        <label htmlFor="sheet-title" className="field-label">What the circuit feeds</label>
        <input id="sheet-title" name="title" required maxLength={200} className="field-input" placeholder="e.g. Chiller plant feeder" aria-invalid={err.title ? true : undefined} aria-describedby={err.title ? 'sheet-title-error' : undefined} />
        {err.title ? <p id="sheet-title-error" className="field-error">{err.title}</p> : null}
      </div>
      <div>
        <label htmlFor="sheet-installation" className="field-label">Installation</label>
        <select id="sheet-installation" name="installation" className="field-input" defaultValue="cable-in-air">
          {INSTALLATIONS.map((i) => (
            <option key={i.value} value={i.value}>{i.label}</option>
          ))}
        </select>
        <p className="mt-1 text-caption text-ink-500">Sets the starting defaults; you can change it on the sheet.</p>
      </div>
      {state.message ? <p role="alert" className="field-error">{state.message}</p> : null}
      <button type="submit" className="btn-primary" disabled={pending}>{pending ? 'Creating…' : 'Create sheet'}</button>
    </form>
  );
}

'use client';
import { useActionState } from 'react';
import { createProjectAction, type FormState } from './actions';

export function CreateProjectForm() {
  const [state, action, pending] = useActionState<FormState, FormData>(createProjectAction, {});
  const err = state.fieldErrors ?? {};
  return (
    <form action={action} className="panel space-y-3 p-4" aria-labelledby="new-project-heading" noValidate>
      <h2 id="new-project-heading" className="font-semibold">New project</h2>
      <div>
        <label htmlFor="project-name" className="field-label">Name</label>
        <input id="project-name" name="name" required maxLength={200} className="field-input" aria-invalid={err.name ? true : undefined} aria-describedby={err.name ? 'project-name-error' : undefined} placeholder="e.g. Kestrel Yard cold store extension" />
        {err.name ? <p id="project-name-error" className="field-error">{err.name}</p> : null}
      </div>
      <div>
        <label htmlFor="project-site" className="field-label">Site</label>
        <input id="project-site" name="site" maxLength={200} className="field-input" placeholder="Building, switchroom or yard" />
      </div>
      <div>
        <label htmlFor="project-description" className="field-label">Description</label>
        <textarea id="project-description" name="description" rows={2} maxLength={2000} className="field-input" />
      </div>
      {state.message ? <p role="alert" className="field-error">{state.message}</p> : null}
      <button type="submit" className="btn-primary" disabled={pending}>{pending ? 'Creating…' : 'Create project'}</button>
    </form>
  );
}

'use client';
import { useActionState } from 'react';

export interface TeamSizingState {
  message?: string;
  fieldError?: string;
}

/**
 * The team's sizing settings for schedules (admins). The action comes from the page (components
 * never import server code).
 */
export function TeamSizingSettings({
  minParallelSectionMm2,
  defaultMinParallelSectionMm2,
  action,
}: {
  minParallelSectionMm2: number | null;
  defaultMinParallelSectionMm2: number;
  action: (state: TeamSizingState, formData: FormData) => Promise<TeamSizingState>;
}) {
  const [state, formAction, pending] = useActionState<TeamSizingState, FormData>(action, {});
  return (
    <section aria-labelledby="team-sizing-heading" className="panel mt-8 p-4" data-testid="team-sizing-settings">
      <h2 id="team-sizing-heading" className="text-lead font-semibold">
        Sizing schedules
      </h2>
      <p className="mt-1 text-body text-ink-600">
        A schedule offers parallel runs of a cable only from this section up; below it a circuit gets one larger cable instead, because parallel small cables share the current
        unevenly. Empty: {defaultMinParallelSectionMm2} mm², the default (common practice). The value is frozen with each schedule when it is queued.
      </p>
      <form action={formAction} className="mt-3 flex flex-wrap items-end gap-3" noValidate>
        <div>
          <label htmlFor="min-parallel-section" className="block text-body font-medium text-ink-800">
            Smallest section run in parallel <span className="font-normal text-ink-600">(mm²)</span>
          </label>
          <input
            id="min-parallel-section"
            name="minParallelSectionMm2"
            inputMode="decimal"
            defaultValue={minParallelSectionMm2 ?? ''}
            placeholder={String(defaultMinParallelSectionMm2)}
            className="field-input w-32"
            aria-invalid={state.fieldError ? true : undefined}
            aria-describedby={state.fieldError ? 'min-parallel-section-error' : undefined}
            data-testid="min-parallel-section"
          />
        </div>
        <button type="submit" className="btn-primary" disabled={pending}>
          {pending ? 'Saving…' : 'Save'}
        </button>
      </form>
      {state.fieldError ? (
        <p id="min-parallel-section-error" className="field-error" role="alert">
          {state.fieldError}
        </p>
      ) : null}
      {state.message ? (
        <p className="mt-2 text-body text-within-dark" role="status">
          {state.message}
        </p>
      ) : null}
    </section>
  );
}

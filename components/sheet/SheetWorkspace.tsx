'use client';
/**
 * The sizing sheet's working page: inputs on the left, the result on the right — a strip that
 * stays in view, the flags directly under it, the checks, the plots and the candidate grid — and
 * the review panel and history. Inputs re-compute in the browser at once; saving sends the inputs
 * and the server computes and stores its own snapshot.
 */
import { memo, useCallback, useDeferredValue, useEffect, useMemo, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useForm, schemaResolver } from '@mantine/form';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { CautionNotice } from '@/components/shell/CautionNotice';
import { SharePanel } from '@/components/share/SharePanel';
import { ProfilePlot } from '@/components/plots/ProfilePlot';
import { HotSpotCurvePlot } from '@/components/plots/HotSpotCurvePlot';
import type { CandidateEvaluation, CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { sheetInputsSchema, type SheetInputs } from '@/lib/sheet/schema';
import { approvalReadiness } from '@/lib/sheet/snapshot';
import { decide, type Actor } from '@/lib/sheet/stateMachine';
import { installationSuits } from '@/lib/sheet/toSizing';
import type { SheetCandidate } from '@/lib/sheet/candidates';
import { can, type Role } from '@/lib/auth/permissions';
import type { UnitSystem } from '@/lib/units';
import type { SheetRecord } from '@/lib/sheet/records';
import { sheetApi, SheetApiError } from './api';
import { CandidateGrid, candidateRows } from './CandidateGrid';
import { CandidatePicker } from './CandidatePicker';
import { ChecksPanel } from './ChecksPanel';
import { BeyondSteadyPanel } from './BeyondSteadyPanel';
import { EnclosureAirPanel } from './EnclosureAirPanel';
import { ConflictNotice, type Conflict } from './ConflictNotice';
import { FlagsPanel } from './FlagsPanel';
import { HistoryList, type HistoryItem } from './HistoryList';
import { InputsForm } from './InputsForm';
import { ResultStrip } from './ResultStrip';
import { StatusBadge } from './StatusBadge';
import { useLiveComputation } from './useLiveComputation';
import { useUnsavedGuard } from './useUnsavedGuard';
import { GroupPanel } from './GroupPanel';
import { BusbarResults } from './BusbarResults';
import { ProtectionPanel } from './ProtectionPanel';
import { CrossSectionFieldPanel } from './CrossSectionFieldPanel';
import { ReEvaluationNotice } from './ReEvaluationNotice';
import { arrangementRefusalOf, plainMessage, refusalSentence, refusalSubject } from '@/lib/sheet/arrangementCheck';
import { reEvaluationOf } from '@/lib/sheet/reEvaluation';
import type { CandidateGridColumns } from '@/lib/user/preferences';
import { inputWarnings } from '@/lib/sheet/inputWarnings';
import { messageInDisplayUnit, type SheetNumericField } from '@/lib/sheet/formUnits';
import { UnreadFieldsContext, useUnreadFieldsState } from './unreadFields';

// The plots and the grid are the slow part of a render (Plotly, AG Grid): they take the new result
// in a deferred render, so that the result strip shows a keystroke's result at once.
const DeferredProfilePlot = memo(ProfilePlot);
const DeferredHotSpotCurvePlot = memo(HotSpotCurvePlot);
const DeferredCandidateGrid = memo(CandidateGrid);

/** A value as it arrives through JSON: dates become ISO strings, the rest keeps its shape. */
type ThroughJson<T> = T extends Date ? string : T extends object ? { [K in keyof T]: ThroughJson<T[K]> } : T;

/** The sheet as the page and the API send it: the stored record through JSON, without what the browser does not use. */
export type ClientSheet = ThroughJson<Omit<SheetRecord, 'teamId' | 'reviewerId' | 'createdAt'>>;

export interface WorkspaceUser {
  id: string;
  role: Role;
  unitSystem: UnitSystem;
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** Quiet time after the last edit before a draft saves itself. */
const AUTOSAVE_MS = 2000;

export function SheetWorkspace({
  initialSheet,
  initialHistory,
  user,
  gridColumns = {},
  onGridColumnsChange,
}: {
  initialSheet: ClientSheet;
  initialHistory: HistoryItem[];
  user: WorkspaceUser;
  /** The user's own choice of comparison-grid columns (users.preferences). */
  gridColumns?: CandidateGridColumns;
  /** Stores that choice for the user (a server action handed down by the page). */
  onGridColumnsChange?: (columns: CandidateGridColumns) => Promise<{ ok: true } | { ok: false; message: string }>;
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const sheetId = initialSheet.id;
  const units = user.unitSystem;
  const actor: Actor = useMemo(() => ({ userId: user.id, can: (p) => can(user.role, p) }), [user.id, user.role]);

  const sheetQuery = useQuery({
    queryKey: ['sheet', sheetId],
    queryFn: async () => (await sheetApi.get(sheetId)).sheet as ClientSheet,
    initialData: initialSheet,
  });
  const historyQuery = useQuery({
    queryKey: ['sheet', sheetId, 'history'],
    queryFn: async () => (await sheetApi.history(sheetId)).history as HistoryItem[],
    initialData: initialHistory,
  });
  const sheet = sheetQuery.data;

  const [savedInputs, setSavedInputs] = useState<SheetInputs>(initialSheet.inputs);
  const [baseVersion, setBaseVersion] = useState(initialSheet.version);
  const form = useForm<SheetInputs>({
    mode: 'controlled',
    initialValues: initialSheet.inputs,
    validate: schemaResolver(sheetInputsSchema, { sync: true }),
    validateInputOnChange: true,
  });
  const values = form.values;
  const dirty = !same(values, savedInputs);

  // A newer server copy (another tab, a transition) replaces an untouched form.
  useEffect(() => {
    if (!dirty && sheet.version !== baseVersion) {
      form.setValues(sheet.inputs);
      form.resetDirty(sheet.inputs);
      setSavedInputs(sheet.inputs);
      setBaseVersion(sheet.version);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when the server copy changes
  }, [sheet.version]);

  const editable = decide('edit', sheet, actor).allowed;
  const live = useLiveComputation(values, { enabled: true, withCurves: true });
  // Text a field could not read (lib/units/parse) leaves the form at its last readable value: the
  // result on the strip is then not the result of what is on the screen.
  const unreadFields = useUnreadFieldsState();
  const unreadMessages = Object.values(unreadFields.problems);
  const firstFormErrorEntry = Object.entries(form.errors).find(([, e]) => typeof e === 'string' && e !== '');
  const firstFormError = firstFormErrorEntry ? (messageInDisplayUnit(firstFormErrorEntry[0] as SheetNumericField, String(firstFormErrorEntry[1])) ?? undefined) : undefined;
  const snapshot = sheet.result;
  const liveEvaluations = live.computation?.ok ? live.computation.comparison.evaluations : null;
  // A frozen or submitted sheet shows the server's stored result; a sheet being edited shows the live one.
  const evaluations: CandidateEvaluation[] | null = editable ? liveEvaluations : (snapshot?.evaluations ?? null);
  // Why the result shown is not the result of the inputs on the screen (null when it is): the strip
  // then never shows a passing state (issue 22).
  const notCurrent = !editable
    ? null
    : unreadMessages.length > 0
      ? unreadMessages[0]
      : live.invalid
        ? (firstFormError ?? 'the inputs are incomplete or out of range')
        : null;
  const sourceWords = editable
    ? live.invalid || unreadMessages.length > 0
      ? 'inputs incomplete: showing the last valid result'
      : dirty
        ? 'computed live in your browser, not saved'
        : 'computed live, same as saved'
    : `stored by the server ${snapshot ? snapshot.computedAt.slice(0, 16).replace('T', ' ') : ''}`;

  const [focusedId, setFocusedId] = useState<string | null>(values.chosenCandidateId ?? values.candidates[0]?.id ?? null);
  useEffect(() => {
    if (focusedId && values.candidates.some((c) => c.id === focusedId)) return;
    setFocusedId(values.chosenCandidateId ?? values.candidates[0]?.id ?? null);
  }, [values.candidates, values.chosenCandidateId, focusedId]);
  const focused = evaluations?.find((e) => e.id === focusedId) ?? null;
  const focusedOk = focused && focused.ok ? focused : null;
  const otherLabels = useMemo(() => values.installation.otherCircuits.map((o) => o.label), [values.installation.otherCircuits]);

  // A cross-section the library refuses (overlapping cables, a duct too small…) is shown on its
  // field and cannot be saved; the server refuses it too.
  const refusal = editable && live.computation && !live.invalid ? (live.computation.ok ? arrangementRefusalOf(live.computation.comparison.evaluations) : arrangementRefusalOf([], live.computation.error)) : null;
  const externalErrors = refusal ? { [refusal.field]: refusal.message } : {};

  // A result saved by an earlier method is kept, and marked, with the chosen candidate computed now beside it.
  const reEvaluation = useMemo(
    () => reEvaluationOf(sheet.inputs, sheet.result),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the saved copy changes with its version and snapshot
    [sheet.version, sheet.result?.computedAt, sheet.result?.solverVersion],
  );

  const [conflict, setConflict] = useState<Conflict | null>(null);
  const [notice, setNotice] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [pickerOpen, setPickerOpen] = useState(false);
  const [returnComment, setReturnComment] = useState('');

  const refresh = useCallback(async () => {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: ['sheet', sheetId] }),
      queryClient.invalidateQueries({ queryKey: ['sheet', sheetId, 'history'] }),
    ]);
  }, [queryClient, sheetId]);

  // What failed to save (not a conflict): autosave waits for the next edit instead of retrying the same inputs.
  const [failedInputs, setFailedInputs] = useState<SheetInputs | null>(null);
  const save = useMutation({
    // The inputs sent travel with the call, so that edits made while it is in flight stay unsaved.
    mutationFn: ({ inputs, expectedVersion }: { inputs: SheetInputs; expectedVersion: number; auto: boolean }) =>
      sheetApi.save(sheetId, { expectedVersion, inputs: sheetInputsSchema.parse(inputs) }),
    onSuccess: async (answer, sent) => {
      setSavedInputs(sent.inputs);
      setBaseVersion(answer.version);
      setConflict(null);
      setFailedInputs(null);
      setNotice(sent.auto ? null : { tone: 'ok', text: `Saved as version ${answer.version}; the server computed and stored its own result.` });
      await refresh();
    },
    onError: (error, sent) => {
      if (error instanceof SheetApiError && error.code === 'version_conflict') {
        setConflict({
          message: error.message,
          currentVersion: Number(error.body.currentVersion),
          changedSections: (error.body.changedSections as string[]) ?? [],
          current: error.body.current as Conflict['current'],
        });
        return;
      }
      setFailedInputs(sent.inputs);
      setNotice({ tone: 'error', text: `Not saved: ${error.message}` });
    },
  });
  const saveNow = useCallback(
    (auto: boolean, expectedVersion = baseVersion) => save.mutate({ inputs: values, expectedVersion, auto }),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- mutate is stable; the timer restarts only when the inputs change
    [save.mutate, values, baseVersion],
  );

  const transition = useMutation({
    mutationFn: (body: { action: 'submit' | 'withdraw' | 'approve' | 'return'; comment?: string }) => sheetApi.transition(sheetId, { ...body, expectedVersion: sheet.version }),
    onSuccess: async (_answer, body) => {
      const words = { submit: 'Submitted for review.', withdraw: 'Withdrawn: the sheet is a draft again.', approve: 'Approved. The sheet is now frozen.', return: 'Returned to the author with your comment.' };
      setNotice({ tone: 'ok', text: words[body.action] });
      setReturnComment('');
      await refresh();
      router.refresh();
    },
    onError: (error) => setNotice({ tone: 'error', text: error.message }),
  });

  const acknowledge = useMutation({
    mutationFn: ({ code, comment }: { code: string; comment: string }) => sheetApi.acknowledge(sheetId, code, comment),
    onSuccess: refresh,
    onError: (error) => setNotice({ tone: 'error', text: error.message }),
  });

  const revise = useMutation({
    mutationFn: () => sheetApi.revise(sheetId),
    onSuccess: (answer) => router.push(`/sheets/${answer.sheet.id}`),
    onError: (error) => setNotice({ tone: 'error', text: error.message }),
  });

  // Autosave (issue 23): a draft the user may edit saves itself AUTOSAVE_MS after the last edit,
  // with the same optimistic version check as the Save button — a 409 shows the conflict and
  // overwrites nothing. Inputs that cannot be saved (incomplete, refused, or just refused by the
  // server) wait for the user.
  // Only once the live result is of these very inputs, so that a refusal still being computed is not saved.
  const liveCurrent = live.inputsKey === JSON.stringify(values);
  const retryingFailed = failedInputs !== null && same(values, failedInputs);
  // A field holding text the number rule refused is not saved (the form still holds the last good value).
  const autosaveReady = editable && dirty && conflict === null && !save.isPending && !live.invalid && unreadMessages.length === 0 && liveCurrent && refusal === null && !retryingFailed;
  useEffect(() => {
    if (!autosaveReady) return;
    const timer = window.setTimeout(() => saveNow(true), AUTOSAVE_MS);
    return () => window.clearTimeout(timer);
  }, [autosaveReady, saveNow]);
  const mayManualSave = (dirty || reEvaluation !== null) && !save.isPending && !live.invalid && unreadMessages.length === 0 && refusal === null;
  useUnsavedGuard({
    dirty: editable && (dirty || save.isPending),
    // Ctrl/Cmd+S on an editable sheet is ours (never the browser's "save page"), even when there is nothing to save.
    onSaveShortcut: editable ? () => { if (mayManualSave && conflict === null) saveNow(false); } : null,
  });
  const saveState: { words: 'Saved' | 'Saving…' | 'Not saved'; why: string } = save.isPending
    ? { words: 'Saving…', why: '' }
    : conflict
      ? { words: 'Not saved', why: 'someone saved a newer version; see below' }
      : editable && unreadMessages.length > 0
        ? { words: 'Not saved', why: 'complete the inputs marked to save' }
        : dirty
        ? {
            words: 'Not saved',
            why: refusal
              ? `while ${refusalSubject(refusal)}`
              : live.invalid
                ? 'complete the inputs marked to save'
                : retryingFailed
                  ? 'the server refused the last save; see the message'
                  : 'saves by itself in a moment (Ctrl+S saves now)',
          }
        : { words: 'Saved', why: reEvaluation ? 'with an earlier method: save to re-evaluate' : '' };

  const readiness = approvalReadiness(snapshot, sheet.acknowledgements.map((a) => a.flagCode));
  const submitDecision = decide('submit', sheet, actor, readiness);
  const approveDecision = decide('approve', sheet, actor, readiness);
  const mayReturn = decide('return', sheet, actor).allowed;
  const mayAcknowledge = decide('acknowledge', sheet, actor).allowed;
  const mayWithdraw = decide('withdraw', sheet, actor).allowed;
  const mayRevise = decide('revise', { ...sheet, hasNewerRevision: sheet.newerRevisionId !== null }, actor).allowed;
  const inReviewView = sheet.status === 'in_review' || sheet.status === 'approved';

  const chosenFlags = inReviewView ? (snapshot?.chosenFlags ?? []) : focusedOk?.flags ?? [];
  const flagsHeading = inReviewView ? `Assumption flags of the chosen candidate (as submitted)` : `Assumption flags${focusedOk ? ` of ${focusedOk.label}` : ''}`;

  const addCandidate = (candidate: SheetCandidate) => {
    const next = [...values.candidates, candidate];
    form.setFieldValue('candidates', next);
    // Nothing is chosen for the designer (issue 22): the first candidate added waits for their choice.
    setFocusedId(candidate.id);
  };
  const removeCandidate = useCallback(
    (id: string) => {
      form.setFieldValue('candidates', (form.getValues().candidates as SheetCandidate[]).filter((c) => c.id !== id));
      if (form.getValues().chosenCandidateId === id) form.setFieldValue('chosenCandidateId', null);
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the form object is stable
    [],
  );
  const chooseCandidate = useCallback(
    (id: string) => {
      form.setFieldValue('chosenCandidateId', id);
      setFocusedId(id);
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the form object is stable
    [],
  );

  const lastReturnComment = [...(historyQuery.data ?? [])].reverse().find((h) => h.action === 'sheet.return')?.detail.comment as string | undefined;
  const rows = useDeferredValue(
    useMemo(() => candidateRows(values.candidates, evaluations, values.chosenCandidateId, units, otherLabels), [values.candidates, evaluations, values.chosenCandidateId, units, otherLabels]),
  );
  const deferredCurves = useDeferredValue(live.curves);
  const deferredProfile = useDeferredValue(focusedOk?.profile ?? null);
  const deferredDesignCurrentA = useDeferredValue(values.circuit.designCurrentA);
  const limits = useDeferredValue(
    useMemo(() => Object.fromEntries((evaluations ?? []).filter((e): e is CandidateEvaluationOk => e.ok).map((e) => [e.id, e.limit.temperatureC])), [evaluations]),
  );
  const placement = values.installation.kind === 'enclosure' ? values.installation.enclosureInside : values.installation.kind;
  const preferredKind = placement === 'bar-on-edge' || placement === 'bar-flat' ? 'bar' : 'cable';
  const mismatched = values.candidates.filter((c) => !installationSuits(values.installation.kind, c.kind, values.installation.enclosureInside));

  return (
    <UnreadFieldsContext.Provider value={unreadFields}>
    <div className="space-y-3" data-testid="sheet-workspace">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <nav aria-label="Breadcrumb" className="text-caption text-ink-500">
            <Link href="/projects" className="hover:underline">Projects</Link> / <Link href={`/projects/${sheet.projectId}`} className="hover:underline">{sheet.projectName}</Link> /
          </nav>
          <div className="flex flex-wrap items-center gap-x-3">
            <h1 className="flex flex-wrap items-center gap-x-3 text-title">
              <span className="num">{sheet.circuitTag}</span>
              <span className="font-normal text-ink-700">{sheet.title}</span>
              <StatusBadge status={sheet.status} />
            </h1>
            {editable ? (
              <p className="text-caption" aria-live="polite" data-save-state={saveState.words}>
                <span className={saveState.words === 'Saved' ? 'font-medium text-within-dark' : saveState.words === 'Saving…' ? 'font-medium text-ink-600' : 'font-medium text-tight-dark'}>
                  <span aria-hidden="true">{saveState.words === 'Saved' ? '✔ ' : saveState.words === 'Saving…' ? '⟳ ' : '● '}</span>
                  <span data-testid="save-state">{saveState.words}</span>
                </span>
                {saveState.why ? <span className="text-ink-500" data-testid="save-state-why">{` — ${saveState.why}`}</span> : null}
              </p>
            ) : null}
          </div>
          <p className="text-caption text-ink-500">
            Revision {sheet.revision} · version <span data-testid="sheet-version">{sheet.version}</span> · by {sheet.authorName ?? 'unknown'}
            {sheet.reviewerName ? ` · reviewed by ${sheet.reviewerName}` : ''}
            {sheet.solverVersion ? ` · ${sheet.solverVersion}` : ''}
            {sheet.previousRevisionId ? (
              <>
                {' · '}
                <Link className="underline" href={`/sheets/${sheet.previousRevisionId}`}>previous revision</Link>
              </>
            ) : null}
            {sheet.newerRevisionId ? (
              <>
                {' · '}
                <Link className="font-medium text-copper-700 underline" href={`/sheets/${sheet.newerRevisionId}`}>a newer revision exists</Link>
              </>
            ) : null}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          {editable ? (
            <>
              <button
                type="button"
                className="btn-primary"
                data-testid="save-button"
                // A result saved by an earlier method may be saved again as it stands, to store the current one.
                disabled={!mayManualSave}
                title={refusal ? `Not saved while ${refusalSubject(refusal)}: ${refusalSentence(refusal)}` : unreadMessages.length > 0 ? `Not saved while ${unreadMessages[0]}` : undefined}
                onClick={() => saveNow(false)}
              >
                Save
              </button>
            </>
          ) : null}
          {submitDecision.allowed || (editable && actor.can('sheet:submit')) ? (
            <button
              type="button"
              className="btn-quiet"
              data-testid="submit-button"
              disabled={!submitDecision.allowed || dirty || transition.isPending}
              title={dirty ? 'Save your changes first' : submitDecision.allowed ? undefined : submitDecision.reason}
              onClick={() => transition.mutate({ action: 'submit' })}
            >
              Submit for review
            </button>
          ) : null}
          {editable && actor.can('sheet:submit') && !submitDecision.allowed ? (
            <span className="max-w-md text-caption text-tight-dark" data-testid="submit-blocked-reason">
              {submitDecision.reason}
            </span>
          ) : null}
          {mayWithdraw ? (
            <button type="button" className="btn-quiet" onClick={() => transition.mutate({ action: 'withdraw' })} disabled={transition.isPending}>
              Withdraw from review
            </button>
          ) : null}
          {mayRevise ? (
            <button type="button" className="btn-quiet" data-testid="revise-button" onClick={() => revise.mutate()} disabled={revise.isPending}>
              Start a new revision
            </button>
          ) : null}
        </div>
      </header>

      <CautionNotice compact />
      {reEvaluation ? <ReEvaluationNotice reEvaluation={reEvaluation} units={units} /> : null}
      {sheet.status === 'approved' ? (
        <p className="rounded-md border border-within bg-within-light px-3 py-1.5 text-body text-within-dark">
          ✔ Approved{sheet.approvedAt ? ` on ${sheet.approvedAt.slice(0, 10)}` : ''} by {sheet.reviewerName ?? 'a reviewer'}. The sheet is frozen; {mayRevise ? 'start a new revision to change it.' : 'a designer can start a new revision.'}
        </p>
      ) : null}
      {sheet.status === 'returned' ? (
        <p className="rounded-md border border-tight bg-tight-light px-3 py-1.5 text-body text-tight-dark" data-testid="returned-notice">
          ↩ Returned by {sheet.reviewerName ?? 'the reviewer'}
          {lastReturnComment ? <>: “{lastReturnComment}”</> : null} — change the sheet, save and submit again.
        </p>
      ) : null}
      {notice ? (
        <p role={notice.tone === 'error' ? 'alert' : 'status'} className={`rounded-md px-3 py-1.5 text-body ${notice.tone === 'error' ? 'border border-over bg-over-light text-over-dark' : 'border border-within bg-within-light text-within-dark'}`} data-testid="sheet-notice">
          {notice.text}
        </p>
      ) : null}
      {conflict ? (
        <ConflictNotice
          conflict={conflict}
          mine={values}
          busy={save.isPending}
          onTakeTheirs={() => {
            form.setValues(conflict.current.inputs);
            setSavedInputs(conflict.current.inputs);
            setBaseVersion(conflict.currentVersion);
            setConflict(null);
            void refresh();
          }}
          onKeepMine={() => saveNow(false, conflict.currentVersion)}
        />
      ) : null}

      <div className="grid gap-4 lg:grid-cols-[288px_minmax(0,1fr)] xl:grid-cols-[312px_minmax(0,1fr)]">
        <aside className="panel self-start px-3 py-1 lg:sticky lg:top-2 lg:max-h-[calc(100vh-1rem)] lg:overflow-y-auto" aria-label="Inputs">
          {!editable ? (
            <p className="mt-2 rounded bg-ink-50 px-2 py-1 text-caption text-ink-600">
              {sheet.status === 'in_review' ? 'In review: inputs are read-only.' : sheet.status === 'approved' ? 'Approved: inputs are frozen.' : 'Your role reads this sheet; designers edit it.'}
            </p>
          ) : null}
          <InputsForm form={form} units={units} disabled={!editable} externalErrors={externalErrors} arrangementProblem={refusal ? `The cables do not lie as entered: ${refusalSentence(refusal)}` : null} />
        </aside>

        <div className="min-w-0 space-y-3">
          <div className="sticky top-0 z-10 -mx-1 bg-paper px-1 pb-1 pt-0.5">
            <ResultStrip evaluation={focused ?? null} notCurrent={notCurrent} warnings={editable ? inputWarnings(values, units).map((w) => w.message) : []} units={units} source={live.computing && editable ? 'computing…' : sourceWords} chosen={focusedId !== null && focusedId === values.chosenCandidateId} otherLabels={otherLabels} />
          </div>
          <FlagsPanel
            flags={chosenFlags}
            heading={flagsHeading}
            acknowledgements={sheet.acknowledgements}
            canAcknowledge={mayAcknowledge}
            pendingCode={acknowledge.isPending ? (acknowledge.variables?.code ?? null) : null}
            onAcknowledge={(code, comment) => acknowledge.mutate({ code, comment })}
          />

          {(mayReturn || approveDecision.allowed || (approveDecision.code !== 'forbidden' && approveDecision.code !== 'own_sheet' && approveDecision.code !== 'wrong_state')) && sheet.status === 'in_review' ? (
            <section aria-labelledby="decision-heading" className="panel border-copper-300 p-3" data-testid="review-decision">
              <h2 id="decision-heading" className="text-body font-semibold">Your review</h2>
              {!approveDecision.allowed ? <p className="text-caption text-tight-dark" data-testid="approve-blocked-reason">{approveDecision.reason}</p> : <p className="text-caption text-within-dark">Every review flag is acknowledged and no blocker stands.</p>}
              <div className="mt-2 flex flex-wrap items-end gap-2">
                <button type="button" className="btn-primary" data-testid="approve-button" disabled={!approveDecision.allowed || transition.isPending} onClick={() => transition.mutate({ action: 'approve' })}>
                  Approve
                </button>
                <div className="min-w-64 flex-1">
                  <label htmlFor="return-comment" className="field-label">Comment for the author (needed to return)</label>
                  <input id="return-comment" className="field-input py-1" value={returnComment} onChange={(e) => setReturnComment(e.target.value)} />
                </div>
                <button type="button" className="btn-quiet" data-testid="return-button" disabled={!mayReturn || returnComment.trim().length === 0 || transition.isPending} onClick={() => transition.mutate({ action: 'return', comment: returnComment })}>
                  Return to the author
                </button>
              </div>
            </section>
          ) : null}

          {focusedOk ? <ChecksPanel evaluation={focusedOk} units={units} lengthM={values.circuit.lengthM} /> : null}

          {focusedOk && focusedOk.kind === 'cable' ? <GroupPanel evaluation={focusedOk} units={units} otherLabels={otherLabels} /> : null}

          {focusedOk && focusedOk.kind === 'bar' ? <BusbarResults evaluation={focusedOk} inputs={values} units={units} /> : null}

          {focusedOk ? <ProtectionPanel evaluation={focusedOk} inputs={values} /> : null}
          {/* Shown while ticked whatever the installation, so that an option left on can be unticked. */}
          {(values.installation.kind === 'buried' && values.candidates.some((c) => c.kind === 'cable')) || values.crossSection.checked ? (
            <CrossSectionFieldPanel
              form={form}
              editable={editable}
              candidateId={focusedOk && focusedOk.kind === 'cable' ? focusedOk.id : null}
              candidateLabel={focusedOk && focusedOk.kind === 'cable' ? focusedOk.label : null}
              units={units}
              otherLabels={otherLabels}
              stored={snapshot?.crossSection ? { outcome: snapshot.crossSection, candidateLabel: snapshot.evaluations.find((e) => e.id === snapshot.chosenCandidateId)?.label ?? null } : null}
            />
          ) : null}

          {values.candidates.length > 0 ? <BeyondSteadyPanel form={form} editable={editable} candidateId={focusedOk ? focusedOk.id : null} units={units} /> : null}

          {values.candidates.length > 0 ? <EnclosureAirPanel form={form} editable={editable} candidateId={focusedOk ? focusedOk.id : null} units={units} /> : null}

          {values.candidates.length === 0 ? (
            <section className="panel p-4" data-testid="no-candidates">
              <h2 className="font-semibold">No candidates on this sheet yet</h2>
              <p className="mt-1 max-w-3xl text-ink-600">
                A candidate is one conductor option: a cable build or a bar from the team’s catalogue, with how many run per phase. Add two or three — say the section you expect, one size down and one size up — and the sheet computes each one’s hot spot against its limit, its ampacity, losses, voltage drop and short-circuit withstand as you type, marks the smallest and the cheapest that pass, and lets you choose one.
              </p>
              {editable ? (
                <button type="button" className="btn-primary mt-3" data-testid="add-candidates" onClick={() => setPickerOpen(true)}>
                  Add candidates from the catalogue
                </button>
              ) : null}
            </section>
          ) : (
            <div className="grid gap-3 xl:grid-cols-2">
              <section className="panel p-2" aria-label="Heat-balance profile">
                {focusedOk && deferredProfile ? (
                  <DeferredProfilePlot
                    profile={deferredProfile}
                    limitC={focusedOk.limit.temperatureC}
                    limitLabel={focusedOk.limit.layer ?? focusedOk.limit.source}
                    units={units}
                    title={`Heat-balance profile: ${focusedOk.label}`}
                  />
                ) : (
                  <p className="p-4 text-caption text-ink-500">{focused && focused.ok && focused.hotSpotC === null ? 'No steady state at the design current (thermal runaway): no profile to draw.' : 'The profile appears when the candidate has a result.'}</p>
                )}
              </section>
              <section className="panel p-2" aria-label="Hot spot versus current">
                {deferredCurves.length > 0 ? (
                  <DeferredHotSpotCurvePlot curves={deferredCurves} designCurrentA={deferredDesignCurrentA} limits={limits} units={units} />
                ) : (
                  <p className="p-4 text-caption text-ink-500">{live.computing ? 'Computing the curves…' : 'The curves appear when the candidates have results.'}</p>
                )}
              </section>
            </div>
          )}

          {values.candidates.length > 0 ? (
            <section aria-labelledby="compare-heading" className="panel p-3">
              <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
                <h2 id="compare-heading" className="text-body font-semibold">
                  Compare candidates <span className="font-normal text-ink-500">— click a row to see it above{editable ? '; choose the one the sheet is for' : ''}</span>
                </h2>
                {editable ? (
                  <button type="button" className="btn-quiet py-1" data-testid="add-candidates" onClick={() => setPickerOpen((v) => !v)}>
                    {pickerOpen ? 'Close the catalogue' : 'Add candidates'}
                  </button>
                ) : null}
              </div>
              {mismatched.length > 0 ? (
                <p className="mb-2 text-caption text-tight-dark">
                  ▲ {mismatched.map((c) => c.label).join(', ')} {mismatched.length === 1 ? 'does' : 'do'} not suit the installation chosen ({values.installation.kind}); {mismatched.length === 1 ? 'it' : 'they'} will not evaluate until the installation matches.
                </p>
              ) : null}
              {values.chosenCandidateId === null && values.candidates.length > 0 ? (
                <p role="status" className="mb-2 rounded-md border border-tight bg-tight-light px-3 py-1.5 text-body text-tight-dark" data-testid="choose-prompt">
                  No candidate is chosen yet. Choose the one this sheet specifies with “Choose” in the first column; the sheet cannot be submitted for review until you do.
                </p>
              ) : null}
              <DeferredCandidateGrid
                rows={rows}
                units={units}
                focusedId={focusedId}
                onFocus={setFocusedId}
                onChoose={chooseCandidate}
                onRemove={removeCandidate}
                editable={editable}
                columnChoice={gridColumns}
                onColumnChoiceChange={onGridColumnsChange}
              />
            </section>
          ) : null}

          {pickerOpen && editable ? (
            <CandidatePicker preferredKind={preferredKind} existingIds={values.candidates.map((c) => c.id)} units={units} onAdd={addCandidate} onClose={() => setPickerOpen(false)} />
          ) : null}

          {live.computation && !live.computation.ok && editable ? (
            <p role="alert" className="field-error">The circuit could not be computed: {live.computation.error.field ? plainMessage(live.computation.error.message, live.computation.error.field) : live.computation.error.message}</p>
          ) : null}

          <SharePanel sheetId={sheetId} canShare={can(user.role, 'sheet:share')} dirty={dirty} />
          <HistoryList items={historyQuery.data ?? []} loading={historyQuery.isFetching} />
          {live.elapsedMs !== null && editable ? (
            <p className="text-right text-caption text-ink-400" data-engine={live.engine ?? undefined}>
              Computed in your browser {live.engine === 'worker' ? 'in a background worker ' : ''}in <span className="num">{live.elapsedMs.toFixed(0)}</span> ms (all candidates and their curves).
            </p>
          ) : null}
        </div>
      </div>
    </div>
    </UnreadFieldsContext.Provider>
  );
}

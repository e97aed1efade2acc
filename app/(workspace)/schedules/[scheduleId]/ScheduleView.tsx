'use client';
/**
 * The schedule page: upload and preview (row problems named by row and column; nothing is queued
 * while problems remain unless the designer leaves those rows out), progress while the workers
 * size it, then the result grid with filters, totals, exports and "open as sizing sheet".
 */
import { useMemo, useRef, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ColDef, ICellRendererParams, RowClickedEvent, SelectionChangedEvent } from 'ag-grid-community';
import { DataGrid } from '@/components/grid/DataGrid';
import type { ResultLine } from '@/lib/schedule';
import { formatMoney, withCurrency } from '@/lib/units/money';
import { useNumberFormat } from '@/components/providers/NumberFormatProvider';
import { fetchProgress, fetchResults, fetchSchedule, fetchSheetBatch, openRowAsSheet, queueScheduleRows, requestSheetsForRows, uploadScheduleFile, type ScheduleDetail } from '../api';

/** Without a stored row for this long, the page says that no worker seems to be running. */
const STALL_SECONDS = 120;

const fmt = (value: number | null | undefined, digits = 1) => (value === null || value === undefined || !Number.isFinite(value) ? '—' : value.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits }));

function duration(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds)) return 'estimating…';
  if (seconds < 60) return `${Math.max(1, Math.round(seconds))} s`;
  const minutes = Math.floor(seconds / 60);
  return minutes < 60 ? `${minutes} min ${Math.round(seconds % 60)} s` : `${Math.floor(minutes / 60)} h ${minutes % 60} min`;
}

export function ScheduleView({ scheduleId, mayWrite, mayOpenSheet }: { scheduleId: string; mayWrite: boolean; mayOpenSheet: boolean }) {
  const detail = useQuery({ queryKey: ['schedule', scheduleId], queryFn: () => fetchSchedule(scheduleId) });
  if (detail.isPending) return <p role="status" className="text-ink-500">Loading the schedule…</p>;
  if (detail.isError) return <p role="alert" className="field-error">Could not load the schedule: {detail.error.message}</p>;
  const { schedule } = detail.data;
  if (schedule.status === 'draft') return <UploadStep detail={detail.data} mayWrite={mayWrite} />;
  return <RunStep detail={detail.data} mayOpenSheet={mayOpenSheet} />;
}

// ───────────────────────── upload and preview ─────────────────────────

function UploadStep({ detail, mayWrite }: { detail: ScheduleDetail; mayWrite: boolean }) {
  const { schedule, families, previewRows } = detail;
  const queryClient = useQueryClient();
  const fileInput = useRef<HTMLInputElement>(null);
  const [refusal, setRefusal] = useState<string | null>(null);
  const upload = useMutation({
    mutationFn: (file: File) => uploadScheduleFile(schedule.id, file),
    onMutate: () => setRefusal(null),
    onError: (error) => {
      setRefusal(error.message);
      // The server cleared the file before it (a refused upload never leaves the old preview to be sized by mistake).
      void queryClient.invalidateQueries({ queryKey: ['schedule', schedule.id] });
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['schedule', schedule.id] }),
  });
  const queue = useMutation({
    mutationFn: (dropBadRows: boolean) => queueScheduleRows(schedule.id, dropBadRows),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['schedule', schedule.id] }),
  });
  const badRows = [...new Set(schedule.problems.map((p) => p.row))];
  // While an upload has just failed, the old preview and its button are gone at once, before the refetch confirms it.
  const hasFile = schedule.fileName !== null && !upload.isError;
  const lastRefusal = upload.isError ? { fileName: upload.variables?.name ?? 'the file', message: upload.error.message } : schedule.uploadRefusal;

  return (
    <div className="grid gap-4 lg:grid-cols-[1fr_320px]">
      <section aria-labelledby="preview-heading" className="space-y-3">
        <h2 id="preview-heading" className="font-semibold">{hasFile ? `Preview of ${schedule.fileName}` : 'Upload a schedule'}</h2>
        {!hasFile && lastRefusal ? (
          <div className="panel p-4" role="region" aria-label="Refused upload">
            <p className="font-semibold text-over-dark">✕ {lastRefusal.fileName} was refused; nothing of it was read.</p>
            <p className="mt-1 text-ink-700">{lastRefusal.message}</p>
            <p className="mt-1 text-ink-600">Any file uploaded before it has been cleared, so that it is not sized by mistake. Upload a corrected file.</p>
          </div>
        ) : !hasFile ? (
          <div className="panel p-4 text-ink-600">
            <p>No file yet. Fill in the template (one circuit per row) and upload it here. Every row is checked before anything is sized.</p>
          </div>
        ) : (
          <>
            <p className="num">
              {schedule.fileRowCount} rows read · <span className="text-within-dark">{schedule.cleanRowCount} clean</span>
              {badRows.length > 0 ? <span className="text-over-dark"> · {badRows.length} with problems</span> : null}
            </p>
            {schedule.problems.length > 0 ? (
              <div className="panel overflow-x-auto" role="region" aria-label="Problems in the file">
                <table className="w-full text-left text-body">
                  <caption className="px-3 pt-2 text-left font-semibold text-over-dark">✕ Problems — correct the file and upload it again, or leave these rows out</caption>
                  <thead className="border-b border-ink-100 text-caption tracking-wide text-ink-500">
                    <tr><th className="px-3 py-2">Row</th><th className="px-3 py-2">Column</th><th className="px-3 py-2">Problem</th></tr>
                  </thead>
                  <tbody>
                    {schedule.problems.slice(0, 300).map((p, i) => (
                      <tr key={i} className="border-b border-ink-50 last:border-0">
                        <td className="num px-3 py-1">{p.row}</td>
                        <td className="px-3 py-1">{p.column || '(whole row)'}</td>
                        <td className="px-3 py-1">{p.message}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
                {schedule.problems.length > 300 ? <p className="px-3 py-2 text-caption">…and {schedule.problems.length - 300} more.</p> : null}
              </div>
            ) : null}
            {previewRows.length > 0 ? (
              <div className="panel max-h-80 overflow-auto" role="region" aria-label="Clean rows">
                <table className="w-full text-left text-body">
                  <thead className="sticky top-0 border-b border-ink-100 bg-paper text-caption tracking-wide text-ink-500">
                    <tr><th className="px-3 py-2">Row</th><th className="px-3 py-2">Circuit</th><th className="px-3 py-2">From → to</th><th className="px-3 py-2 text-right">I_B (A)</th><th className="px-3 py-2 text-right">Length (m)</th><th className="px-3 py-2">Installation</th><th className="px-3 py-2">Family</th></tr>
                  </thead>
                  <tbody>
                    {previewRows.map((r) => (
                      <tr key={r.rowNumber} className="border-b border-ink-50 last:border-0">
                        <td className="num px-3 py-1">{r.rowNumber}</td>
                        <td className="num px-3 py-1">{r.circuitTag}</td>
                        <td className="px-3 py-1">{[r.from, r.to].filter(Boolean).join(' → ')}</td>
                        <td className="num px-3 py-1 text-right">{fmt(r.designCurrentA, 0)}</td>
                        <td className="num px-3 py-1 text-right">{fmt(r.lengthM, 0)}</td>
                        <td className="px-3 py-1">{r.installation.replace(/-/g, ' ')}</td>
                        <td className="px-3 py-1">{families.find((f) => f.key === r.family)?.label ?? r.family}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            ) : null}
            {mayWrite ? (
              <div className="flex flex-wrap items-center gap-3">
                {badRows.length === 0 ? (
                  <button type="button" className="btn-primary" disabled={queue.isPending || schedule.cleanRowCount === 0} onClick={() => queue.mutate(false)}>
                    {queue.isPending ? 'Queueing…' : `Size all ${schedule.cleanRowCount} circuits`}
                  </button>
                ) : (
                  <button type="button" className="btn-quiet" disabled={queue.isPending || schedule.cleanRowCount === 0} onClick={() => queue.mutate(true)}>
                    {queue.isPending ? 'Queueing…' : `Leave out the ${badRows.length} ${badRows.length === 1 ? 'row' : 'rows'} with problems and size the other ${schedule.cleanRowCount}`}
                  </button>
                )}
                {queue.isError ? <p role="alert" className="field-error">{queue.error.message}</p> : null}
              </div>
            ) : null}
          </>
        )}
      </section>

      <aside className="space-y-3">
        {mayWrite ? (
          <form
            className="panel space-y-3 p-4"
            aria-labelledby="upload-heading"
            onSubmit={(e) => {
              e.preventDefault();
              const file = fileInput.current?.files?.[0];
              if (!file) setRefusal('Choose a CSV or XLSX file first.');
              else upload.mutate(file);
            }}
          >
            <h2 id="upload-heading" className="font-semibold">{hasFile ? 'Upload a corrected file' : 'Upload the file'}</h2>
            <div>
              <label htmlFor="schedule-file" className="field-label">Schedule file (CSV or XLSX, at most 4 MB and 5,000 circuits)</label>
              <input id="schedule-file" ref={fileInput} type="file" accept=".csv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" className="field-input" aria-describedby={refusal ? 'schedule-file-error' : undefined} aria-invalid={refusal ? true : undefined} />
              {refusal ? <p id="schedule-file-error" role="alert" className="field-error">{refusal}</p> : null}
            </div>
            <button type="submit" className="btn-primary" disabled={upload.isPending}>{upload.isPending ? 'Reading…' : 'Read and check the file'}</button>
            <p className="text-caption text-ink-600">
              Template: <a className="text-copper-700 underline" href="/api/schedules/template?format=xlsx">XLSX</a> · <a className="text-copper-700 underline" href="/api/schedules/template?format=csv">CSV</a>
            </p>
          </form>
        ) : (
          <p className="panel p-4 text-ink-600">A designer of your team uploads the file.</p>
        )}
        <div className="panel p-4">
          <h2 className="font-semibold">Conductor families</h2>
          <p className="text-caption text-ink-600">Write one of these in the “conductor family” column; each is every size of it in your team catalogue.</p>
          {families.length === 0 ? (
            <p className="mt-2 text-over-dark">Your catalogue has no conductors yet: nothing can be sized.</p>
          ) : (
            <ul className="mt-2 space-y-1">
              {families.map((f) => (
                <li key={f.key} className="flex justify-between gap-2"><span>{f.label}</span><span className="num text-caption text-ink-500">{f.sizes} sizes</span></li>
              ))}
            </ul>
          )}
        </div>
      </aside>
    </div>
  );
}

// ───────────────────────── progress ─────────────────────────

function RunStep({ detail, mayOpenSheet }: { detail: ScheduleDetail; mayOpenSheet: boolean }) {
  const { schedule } = detail;
  const progress = useQuery({
    queryKey: ['schedule-progress', schedule.id],
    queryFn: () => fetchProgress(schedule.id),
    initialData: detail.progress,
    refetchInterval: (query) => (query.state.data?.status === 'done' ? false : 1000),
  });
  const p = progress.data;
  const percent = p.total > 0 ? (100 * p.done) / p.total : 0;
  const done = p.status === 'done';
  return (
    <div className="space-y-4">
      <section aria-labelledby="progress-heading" className="panel space-y-2 p-4">
        <h2 id="progress-heading" className="font-semibold">{done ? 'Every circuit sized' : 'Sizing in the background'}</h2>
        <div role="progressbar" aria-label="Circuits sized" aria-valuemin={0} aria-valuemax={p.total} aria-valuenow={p.done} className="h-3 w-full overflow-hidden rounded bg-ink-100">
          <div className={`h-full ${done ? 'bg-within' : 'bg-copper-500'} transition-[width]`} style={{ width: `${percent}%` }} />
        </div>
        <p className="num text-body">
          {p.done} of {p.total} circuits ({fmt(percent, 0)} %)
          {p.ratePerSecond !== null ? ` · ${fmt(p.ratePerSecond, 1)} circuits/s` : ''}
          {!done ? ` · time left ${duration(p.secondsLeft)}` : ''}
          {p.failing > 0 ? <span className="text-over-dark"> · ✕ {p.failing} with no passing size</span> : null}
        </p>
        {!done ? <p className="text-caption text-ink-600">You can leave this page: the workers carry on, and the results appear here when every circuit is sized.</p> : null}
        {!done && p.secondsSinceActivity !== null && p.secondsSinceActivity > STALL_SECONDS ? (
          <p role="alert" className="text-body text-tight-dark">
            ◐ No circuit has been sized for {duration(p.secondsSinceActivity)}. Sizing needs a worker process: `npm start` runs one; see the README to run more.
          </p>
        ) : null}
        {progress.isError ? <p role="alert" className="field-error">Could not refresh the progress: {progress.error.message}</p> : null}
        {schedule.droppedRows.length > 0 ? <p className="text-caption text-ink-600">Rows left out because of problems in the file: {schedule.droppedRows.join(', ')}.</p> : null}
      </section>
      {done ? <Results scheduleId={schedule.id} mayOpenSheet={mayOpenSheet} fileName={schedule.fileName} /> : null}
    </div>
  );
}

// ───────────────────────── results ─────────────────────────

type Filter = 'all' | 'failing' | 'flagged';

function verdict(line: ResultLine): { word: string; icon: string; className: string } {
  if (line.status === 'none_passes') return { word: 'no size passes', icon: '✕', className: 'text-over-dark' };
  if (line.status === 'pending') return { word: 'not sized yet', icon: '…', className: 'text-ink-500' };
  if (line.marginPercent !== null && line.marginPercent < 10) return { word: 'tight (margin under 10 %)', icon: '◐', className: 'text-tight-dark' };
  return { word: 'within limit', icon: '✓', className: 'text-within-dark' };
}

function VerdictCell(props: ICellRendererParams<ResultLine>) {
  if (!props.data) return null;
  const v = verdict(props.data);
  return <span className={v.className}><span aria-hidden="true">{v.icon}</span> {v.word}</span>;
}

function FlagsCell(props: ICellRendererParams<ResultLine>) {
  const line = props.data;
  if (!line) return null;
  if (line.status !== 'sized') return <span className="text-ink-500">see remark</span>;
  if (line.reviewFlags === 0 && line.noteFlags === 0) return <span className="text-ink-500">none</span>;
  return <span>{line.reviewFlags > 0 ? <span className="text-tight-dark">⚑ {line.reviewFlags} to review</span> : null}{line.reviewFlags > 0 && line.noteFlags > 0 ? ', ' : ''}{line.noteFlags > 0 ? `${line.noteFlags} note${line.noteFlags > 1 ? 's' : ''}` : ''}</span>;
}

function Results({ scheduleId, mayOpenSheet, fileName }: { scheduleId: string; mayOpenSheet: boolean; fileName: string | null }) {
  const router = useRouter();
  const results = useQuery({ queryKey: ['schedule-results', scheduleId], queryFn: () => fetchResults(scheduleId) });
  const [filter, setFilter] = useState<Filter>('all');
  const [selected, setSelected] = useState<ResultLine | null>(null);
  // Rows ticked for "Make sizing sheets" (issue 23), in the order of the file.
  const [chosen, setChosen] = useState<number[]>([]);
  const openSheet = useMutation({
    mutationFn: (rowNumber: number) => openRowAsSheet(scheduleId, rowNumber),
    onSuccess: (sheet) => router.push(`/sheets/${sheet.id}`),
  });

  const { currency } = useNumberFormat();
  const columns = useMemo<ColDef<ResultLine>[]>(
    () => [
      { field: 'rowNumber', headerName: 'Row', width: 80, pinned: 'left', cellClass: 'num' },
      { field: 'circuitTag', headerName: 'Circuit', pinned: 'left', width: 120 },
      { headerName: 'Result', colId: 'verdict', cellRenderer: VerdictCell, width: 190, valueGetter: (p) => (p.data ? verdict(p.data).word : '') },
      { headerName: 'Flags', colId: 'flags', cellRenderer: FlagsCell, width: 160, valueGetter: (p) => (p.data ? p.data.reviewFlags : 0), tooltipValueGetter: (p) => p.data?.flagText ?? '' },
      { field: 'size', headerName: 'Smallest passing size', width: 260 },
      { field: 'family', headerName: 'Family', width: 190 },
      { field: 'designCurrentA', headerName: 'I_B (A)', type: 'numericColumn', cellClass: 'num', width: 100 },
      { field: 'lengthM', headerName: 'Length (m)', type: 'numericColumn', cellClass: 'num', width: 110 },
      { field: 'hotSpotC', headerName: 'Hot spot (°C)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 1), width: 120 },
      { field: 'limitC', headerName: 'Limit (°C)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 0), width: 100 },
      { field: 'marginK', headerName: 'Margin (K)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 1), width: 110 },
      { field: 'ampacityA', headerName: 'Ampacity (A)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 1), width: 120 },
      { field: 'voltageDropPercent', headerName: 'Voltage drop (% U₀)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 2), width: 150 },
      { field: 'shortCircuit', headerName: 'Short circuit', width: 130 },
      { field: 'governingCable', headerName: 'Governing cable', width: 240, tooltipField: 'groupMethod', valueFormatter: (p) => p.value ?? '—' },
      { field: 'hottestBar', headerName: 'Governing bar', width: 220, valueFormatter: (p) => p.value ?? '—' },
      { field: 'forces', headerName: 'Short-circuit forces', width: 150, valueFormatter: (p) => (p.value === 'passes' ? '✔ passes' : p.value === 'fails' ? '✖ fails' : (p.value ?? '—')) },
      { field: 'stressRatio', headerName: 'Stress ratio', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 2), width: 110 },
      { field: 'supportForceN', headerName: 'Support force (N)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 0), width: 140 },
      { colId: 'device', headerName: 'Device', width: 150, valueGetter: (p) => (p.data?.deviceType ? `${p.data.deviceType} ${p.data.deviceRatingA} A` : '—') },
      { field: 'coordination', headerName: 'Coordination', width: 130, valueFormatter: (p) => (p.value === 'passes' ? '✔ passes' : p.value === 'fails' ? '✖ fails' : (p.value ?? '—')) },
      { field: 'smallestDeviceA', headerName: 'Smallest coordinated (A)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 0), width: 170 },
      { field: 'lossW', headerName: 'Losses (W)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 0), width: 110 },
      { field: 'massKg', headerName: 'Conductor mass (kg)', type: 'numericColumn', cellClass: 'num', valueFormatter: (p) => fmt(p.value, 1), width: 150 },
      { field: 'materialCost', headerName: withCurrency('Material cost', currency), type: 'numericColumn', cellClass: 'num', width: 140, valueFormatter: (p) => formatMoney(p.value, currency) },
      { field: 'remark', headerName: 'Remark', width: 320, tooltipField: 'remark' },
    ],
    [currency],
  );

  if (results.isPending) return <p role="status" className="text-ink-500">Loading the results…</p>;
  if (results.isError) return <p role="alert" className="field-error">Could not load the results: {results.error.message}</p>;
  const { lines, totals } = results.data;
  const shown = filter === 'failing' ? lines.filter((l) => l.status === 'none_passes') : filter === 'flagged' ? lines.filter((l) => l.status === 'sized' && l.reviewFlags > 0) : lines;

  return (
    <div className="grid gap-4 xl:grid-cols-[1fr_340px]">
      <section aria-labelledby="results-heading" className="space-y-2">
        <div className="flex flex-wrap items-center gap-2">
          <h2 id="results-heading" className="mr-2 font-semibold">Results</h2>
          <div role="group" aria-label="Show" className="flex gap-1">
            {(
              [
                ['all', `All ${lines.length}`],
                ['failing', `No size passes (${totals.failing})`],
                ['flagged', `Flags to review (${totals.flagged})`],
              ] as const
            ).map(([value, label]) => (
              <button key={value} type="button" aria-pressed={filter === value} className={filter === value ? 'btn-primary' : 'btn-quiet'} onClick={() => setFilter(value)}>
                {label}
              </button>
            ))}
          </div>
          <span className="ml-auto text-caption">
            Export: <a className="text-copper-700 underline" href={`/api/schedules/${scheduleId}/results?format=xlsx`}>XLSX</a> · <a className="text-copper-700 underline" href={`/api/schedules/${scheduleId}/results?format=csv`}>CSV</a>
            {fileName ? <> · <a className="text-copper-700 underline" href={`/api/schedules/${scheduleId}/file`}>original file</a></> : null}
          </span>
        </div>
        <DataGrid<ResultLine>
          label="Schedule results"
          rowData={shown}
          columnDefs={columns}
          getRowId={(p) => String(p.data.rowNumber)}
          rowSelection={mayOpenSheet ? { mode: 'multiRow', checkboxes: true, headerCheckbox: true, selectAll: 'filtered', enableClickSelection: false } : { mode: 'singleRow', checkboxes: false, enableClickSelection: true }}
          onSelectionChanged={(e: SelectionChangedEvent<ResultLine>) => setChosen(e.api.getSelectedRows().map((r) => r.rowNumber).sort((a, b) => a - b))}
          onRowClicked={(e: RowClickedEvent<ResultLine>) => setSelected(e.data ?? null)}
          heightPx={560}
          noMatchText={filter === 'all' ? 'No circuits.' : 'No circuit matches this filter.'}
        />
      </section>

      <aside className="space-y-3">
        {mayOpenSheet ? <MakeSheets scheduleId={scheduleId} chosen={chosen} /> : null}
        <div className="panel p-4" aria-labelledby="totals-heading">
          <h2 id="totals-heading" className="font-semibold">Totals of the sized circuits</h2>
          <dl className="mt-2 grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-body">
            <dt>Circuits sized</dt><dd className="num text-right">{totals.sized} of {totals.circuits}</dd>
            <dt>Conductor mass</dt><dd className="num text-right">{fmt(totals.massKg, 0)} kg</dd>
            <dt>Losses at design current</dt><dd className="num text-right">{fmt(totals.lossW / 1000, 2)} kW</dd>
            <dt>Material cost</dt><dd className="num text-right">{formatMoney(totals.materialCost, currency)}</dd>
          </dl>
          {totals.circuitsWithoutCost > 0 ? <p className="mt-1 text-caption text-ink-600">{totals.circuitsWithoutCost} sized circuits have no price in the catalogue and are not in the cost.</p> : null}
          {totals.failing > 0 ? <p className="mt-1 text-caption text-over-dark">✕ {totals.failing} circuits have no passing size and are not in these totals.</p> : null}
        </div>
        <div className="panel p-4" aria-live="polite" aria-labelledby="row-heading">
          <h2 id="row-heading" className="font-semibold">{selected ? `Row ${selected.rowNumber}: ${selected.circuitTag}` : 'Flags of a circuit'}</h2>
          {!selected ? (
            <p className="text-caption text-ink-600">Click a row to see its flags and remark here.</p>
          ) : (
            <>
              <p className={`mt-1 ${verdict(selected).className}`}><span aria-hidden="true">{verdict(selected).icon}</span> {verdict(selected).word}{selected.size ? ` — ${selected.size}` : ''}</p>
              {selected.remark ? <p className="mt-1 text-body">{selected.remark}</p> : null}
              <ul className="mt-2 space-y-1 text-body">
                {selected.flagText === '' ? <li className="text-ink-500">No flags.</li> : selected.flagText.split(/(?=\[(?:blocker|review|note)\] )/).map((flag, i) => <li key={i}>{flag}</li>)}
              </ul>
              {mayOpenSheet ? (
                <button type="button" className="btn-quiet mt-3" disabled={openSheet.isPending} onClick={() => openSheet.mutate(selected.rowNumber)}>
                  {openSheet.isPending ? 'Opening…' : 'Open as sizing sheet'}
                </button>
              ) : null}
              {openSheet.isError ? <p role="alert" className="field-error">{openSheet.error.message}</p> : null}
            </>
          )}
        </div>
      </aside>
    </div>
  );
}

// ───────────────────────── sheets for chosen rows ─────────────────────────

/** "Make sizing sheets" for the ticked rows: queued at once, made by the workers, progress and the list of made sheets. */
function MakeSheets({ scheduleId, chosen }: { scheduleId: string; chosen: number[] }) {
  const [batchId, setBatchId] = useState<string | null>(null);
  const request = useMutation({
    mutationFn: () => requestSheetsForRows(scheduleId, chosen),
    onSuccess: (batch) => setBatchId(batch.id),
  });
  const progress = useQuery({
    queryKey: ['sheet-batch', scheduleId, batchId],
    queryFn: () => fetchSheetBatch(scheduleId, batchId!),
    enabled: batchId !== null,
    refetchInterval: (query) => (query.state.data?.status === 'done' ? false : 1000),
  });
  const p = progress.data;
  const running = batchId !== null && p?.status !== 'done';
  return (
    <section className="panel space-y-2 p-4" aria-labelledby="make-sheets-heading" data-testid="make-sheets">
      <h2 id="make-sheets-heading" className="font-semibold">Sizing sheets from rows</h2>
      <p className="text-caption text-ink-600">Tick rows in the grid; each becomes a draft sizing sheet in this project, with the row’s inputs and its family’s sizes as candidates.</p>
      <button type="button" className="btn-primary" disabled={chosen.length === 0 || request.isPending || running} onClick={() => request.mutate()} data-testid="make-sheets-button">
        {request.isPending ? 'Queueing…' : chosen.length === 0 ? 'Tick rows to make sheets' : `Make sizing sheets for the ${chosen.length} chosen ${chosen.length === 1 ? 'row' : 'rows'}`}
      </button>
      {request.isError ? <p role="alert" className="field-error">{request.error.message}</p> : null}
      {batchId && !p ? <p role="status" className="text-ink-500">Queued…</p> : null}
      {p ? (
        <div className="space-y-2" aria-live="polite">
          <div role="progressbar" aria-label="Sheets made" aria-valuemin={0} aria-valuemax={p.total} aria-valuenow={p.done} className="h-3 w-full overflow-hidden rounded bg-ink-100">
            <div className={`h-full ${p.status === 'done' ? 'bg-within' : 'bg-copper-500'} transition-[width]`} style={{ width: `${p.total > 0 ? (100 * p.done) / p.total : 0}%` }} />
          </div>
          <p className="num text-body" data-testid="make-sheets-progress">
            {p.status === 'done' ? '✓ Done: ' : 'Making sheets in the background: '}
            {p.done} of {p.total}
            {p.failed > 0 ? <span className="text-over-dark"> · ✕ {p.failed} not made</span> : null}
          </p>
          {p.created.length > 0 ? (
            <ul className="max-h-64 space-y-1 overflow-auto text-body" data-testid="made-sheets">
              {p.created.map((s) => (
                <li key={s.sheetId}>
                  <span className="num text-caption text-ink-500">Row {s.rowNumber}</span>{' '}
                  <Link href={`/sheets/${s.sheetId}`} className="text-copper-700 underline">{s.title || s.circuitTag}</Link>
                </li>
              ))}
            </ul>
          ) : null}
          {p.failures.length > 0 ? (
            <ul className="space-y-1 text-body text-over-dark">
              {p.failures.map((f) => <li key={f.rowNumber}>✕ Row {f.rowNumber}: {f.message}</li>)}
            </ul>
          ) : null}
          {!running ? <button type="button" className="btn-quiet" onClick={() => { setBatchId(null); request.reset(); }}>Make more</button> : null}
        </div>
      ) : null}
      {progress.isError ? <p role="alert" className="field-error">Could not refresh the progress: {progress.error.message}</p> : null}
    </section>
  );
}

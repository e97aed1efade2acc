'use client';
import { useMemo } from 'react';
import { AgGridReact } from 'ag-grid-react';
import { AllCommunityModule, ModuleRegistry, themeQuartz, type ColDef, type ICellRendererParams } from 'ag-grid-community';
import type { CandidateEvaluation } from '@/lib/electrical/sizing/types';
import type { SheetCandidate } from '@/lib/sheet/candidates';
import { describeArrangement, sectionPerPhaseMm2 } from '@/lib/sheet/candidates';
import { convertFromSi, formatNumber, unitLabel, type UnitSystem } from '@/lib/units';
import { failureWords, RESULT_STATES, thermalState } from './resultState';

ModuleRegistry.registerModules([AllCommunityModule]);

const gridTheme = themeQuartz.withParams({
  fontFamily: 'var(--font-plex-sans), system-ui, sans-serif',
  fontSize: 12,
  headerFontSize: 11,
  rowHeight: 30,
  headerHeight: 32,
  spacing: 5,
  accentColor: '#b8703d',
  borderColor: '#e1e6ec',
  headerBackgroundColor: '#f2f4f7',
  foregroundColor: '#1a2431',
  backgroundColor: '#ffffff',
});

export interface CandidateRow {
  id: string;
  label: string;
  section: number;
  arrangement: string;
  hotSpot: number | null;
  marginPercent: number | null;
  ampacity: number | null;
  utilisation: number | null;
  lossWPerM: number | null;
  voltageDropPercent: number | null;
  shortCircuit: string;
  massKg: number | null;
  cost: string | null;
  lifeCycleCost: string | null;
  flags: string;
  state: string;
  stateKey: 'within' | 'tight' | 'over' | 'error';
  passes: boolean;
  marks: string[];
  chosen: boolean;
  error: string | null;
}

export function candidateRows(candidates: SheetCandidate[], evaluations: CandidateEvaluation[] | null, chosenId: string | null, units: UnitSystem): CandidateRow[] {
  return candidates.map((candidate) => {
    const e = evaluations?.find((x) => x.id === candidate.id);
    const base = {
      id: candidate.id,
      label: candidate.label,
      section: convertFromSi(sectionPerPhaseMm2(candidate), 'areaMm2', units),
      arrangement: describeArrangement(candidate),
      chosen: candidate.id === chosenId,
    };
    if (!e || !e.ok) {
      return { ...base, hotSpot: null, marginPercent: null, ampacity: null, utilisation: null, lossWPerM: null, voltageDropPercent: null, shortCircuit: '—', massKg: null, cost: null, lifeCycleCost: null, flags: '', state: e ? 'Not evaluated' : 'Computing…', stateKey: 'error' as const, passes: false, marks: [], error: e && !e.ok ? e.error.message : null };
    }
    const counts = { blocker: 0, review: 0, note: 0 };
    for (const f of e.flags) counts[f.severity] += 1;
    const { state, word } = thermalState(e);
    const marks: string[] = [];
    if (e.isSmallestPassing) marks.push('Smallest passing');
    if (e.isLowestLifeCycleCostPassing) marks.push('Lowest cost passing');
    return {
      ...base,
      hotSpot: e.hotSpotC === null ? null : convertFromSi(e.hotSpotC, 'temperature', units),
      marginPercent: e.marginPercent,
      ampacity: e.ampacityA,
      utilisation: e.utilisation === null ? null : e.utilisation * 100,
      lossWPerM: e.lossWPerM === null ? null : convertFromSi(e.lossWPerM, 'powerWPerM', units),
      voltageDropPercent: e.voltageDrop.percent,
      shortCircuit: !e.shortCircuit.checked ? 'not checked' : e.shortCircuit.withstands ? '✔ passes' : '✖ fails',
      massKg: e.massKg,
      cost: e.materialCost,
      lifeCycleCost: e.lifeCycleCost,
      flags: `${counts.blocker ? `${counts.blocker} ✖ ` : ''}${counts.review ? `${counts.review} ▲ ` : ''}${counts.note ? `${counts.note} i` : ''}`.trim(),
      state: e.passes ? word : failureWords(e),
      stateKey: e.passes ? state : 'over',
      passes: e.passes,
      marks,
      error: null,
    };
  });
}

const num = (digits: number) => (p: { value: number | null }) => (p.value === null || p.value === undefined ? '—' : formatNumber(p.value, digits));

function StateCell(p: ICellRendererParams<CandidateRow>) {
  const row = p.data!;
  if (row.stateKey === 'error') return <span className="text-over-dark" title={row.error ?? undefined}>✖ {row.state}</span>;
  const look = RESULT_STATES[row.stateKey];
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 leading-5 ${look.box} ${look.text}`}>
      <span aria-hidden="true">{look.icon}</span>
      {row.state}
    </span>
  );
}

export function CandidateGrid({
  rows,
  units,
  focusedId,
  onFocus,
  onChoose,
  onRemove,
  editable,
}: {
  rows: CandidateRow[];
  units: UnitSystem;
  focusedId: string | null;
  onFocus: (id: string) => void;
  onChoose: (id: string) => void;
  onRemove: (id: string) => void;
  editable: boolean;
}) {
  const columns = useMemo<ColDef<CandidateRow>[]>(() => {
    const t = unitLabel('temperature', units);
    return [
      {
        headerName: 'Choice',
        width: 96,
        pinned: 'left',
        sortable: false,
        cellRenderer: (p: ICellRendererParams<CandidateRow>) =>
          p.data!.chosen ? (
            <span className="font-semibold text-copper-700" data-testid={`chosen-${p.data!.id}`}>● Chosen</span>
          ) : editable ? (
            <button type="button" className="text-copper-700 underline-offset-2 hover:underline" data-testid={`choose-${p.data!.id}`} onClick={(e) => { e.stopPropagation(); onChoose(p.data!.id); }}>
              Choose
            </button>
          ) : (
            <span className="text-ink-400">—</span>
          ),
      },
      { headerName: 'Candidate', field: 'label', minWidth: 190, flex: 1, pinned: 'left', tooltipField: 'label' },
      { headerName: 'State', field: 'state', width: 190, cellRenderer: StateCell },
      { headerName: `Section/phase (${unitLabel('areaMm2', units)})`, field: 'section', width: 120, type: 'numericColumn', valueFormatter: num(4) },
      { headerName: 'Arrangement', field: 'arrangement', width: 140 },
      { headerName: `Hot spot (${t})`, field: 'hotSpot', width: 104, type: 'numericColumn', valueFormatter: num(4) },
      { headerName: 'Margin (%)', field: 'marginPercent', width: 92, type: 'numericColumn', valueFormatter: num(3) },
      { headerName: 'Ampacity (A)', field: 'ampacity', width: 106, type: 'numericColumn', valueFormatter: num(4) },
      { headerName: 'Utilisation (%)', field: 'utilisation', width: 112, type: 'numericColumn', valueFormatter: num(3) },
      { headerName: `Loss (${unitLabel('powerWPerM', units)})`, field: 'lossWPerM', width: 96, type: 'numericColumn', valueFormatter: num(3) },
      { headerName: 'Voltage drop (%)', field: 'voltageDropPercent', width: 118, type: 'numericColumn', valueFormatter: num(3) },
      { headerName: 'Short circuit', field: 'shortCircuit', width: 108 },
      { headerName: 'Mass (kg)', field: 'massKg', width: 96, type: 'numericColumn', valueFormatter: num(4) },
      { headerName: 'Cost', field: 'cost', width: 96, type: 'numericColumn', valueFormatter: (p) => p.value ?? '—' },
      { headerName: 'Life-cycle cost', field: 'lifeCycleCost', width: 118, type: 'numericColumn', valueFormatter: (p) => p.value ?? '—' },
      { headerName: 'Flags', field: 'flags', width: 96, headerTooltip: '✖ blocker, ▲ review, i note' },
      { headerName: 'Marked', field: 'marks', width: 170, valueFormatter: (p) => (p.value as string[]).join(' · '), cellClass: 'font-medium text-within-dark' },
      ...(editable
        ? [
            {
              headerName: '',
              width: 84,
              sortable: false,
              cellRenderer: (p: ICellRendererParams<CandidateRow>) => (
                <button type="button" className="text-caption text-ink-500 hover:text-over" aria-label={`Remove ${p.data!.label}`} onClick={(e) => { e.stopPropagation(); onRemove(p.data!.id); }}>
                  Remove
                </button>
              ),
            } satisfies ColDef<CandidateRow>,
          ]
        : []),
    ];
  }, [units, editable, onChoose, onRemove]);

  return (
    <div className="w-full [&_.ag-center-cols-container]:!min-h-0 [&_.ag-center-cols-viewport]:!min-h-0" data-testid="candidate-grid">
      <AgGridReact<CandidateRow>
        theme={gridTheme}
        rowData={rows}
        columnDefs={columns}
        getRowId={(p) => p.data.id}
        defaultColDef={{ sortable: true, resizable: true, suppressMovable: true }}
        rowSelection={{ mode: 'singleRow', checkboxes: false, enableClickSelection: true }}
        onRowClicked={(e) => e.data && onFocus(e.data.id)}
        getRowClass={(p) => (p.data?.id === focusedId ? 'ag-row-focused-candidate' : undefined)}
        rowClassRules={{ 'font-semibold': (p) => p.data?.id === focusedId }}
        suppressCellFocus={false}
        animateRows={false}
        domLayout="autoHeight"
      />
    </div>
  );
}

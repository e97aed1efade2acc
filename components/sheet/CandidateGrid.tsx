'use client';
import { useMemo } from 'react';
import { AgGridReact } from 'ag-grid-react';
import { AllCommunityModule, ModuleRegistry, themeQuartz, type ColDef, type ICellRendererParams } from 'ag-grid-community';
import type { CandidateEvaluation } from '@/lib/electrical/sizing/types';
import type { SheetCandidate } from '@/lib/sheet/candidates';
import { candidateRecords } from '@/lib/sheet/sheetTables';
import { convertFromSi, formatNumber, nameInSystem, unitLabel, type UnitSystem } from '@/lib/units';
import { formatMoney, withCurrency } from '@/lib/units/money';
import { useNumberFormat } from '@/components/providers/NumberFormatProvider';
import { RESULT_STATES } from './resultState';

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

/** A row of the grid: the candidate's record (lib/sheet candidateRecords → candidateRow) in the user's units. */
export interface CandidateGridRow {
  id: string;
  label: string;
  section: number;
  arrangement: string;
  hotSpot: number | null;
  marginPercent: number | null;
  ampacity: number | null;
  /** Per cent; null when not evaluated or when no current is allowed (utilisationText then says so). */
  utilisation: number | null;
  utilisationText: string;
  lossWPerM: number | null;
  voltageDropPercent: number | null;
  shortCircuit: string;
  massKg: number | null;
  cost: string | null;
  lifeCycleCost: string | null;
  flags: string;
  /** "centre cable of this circuit, 88.7 °C" in the user's units; '' for bars or results without a group. */
  governing: string;
  groupMethod: string;
  /** Bus-bar packs: the bar that governs with its temperature; '' otherwise. */
  governingBar: string;
  /** IEC 60865-1: "✔ passes", "✖ fails", "not checked"; '' for cables. */
  forces: string;
  stressRatio: number | null;
  /** The larger support force, N. */
  supportForceN: number | null;
  /** "100 A ✔ coordinated", "125 A ✖ not coordinated"; '' without a device. */
  device: string;
  /** Smallest coordinated rating, A. */
  smallestDeviceA: number | null;
  state: string;
  stateKey: 'within' | 'tight' | 'over' | 'error';
  passes: boolean;
  marks: string[];
  chosen: boolean;
  error: string | null;
}

const SHORT_CIRCUIT_CELL: Record<string, string> = { passes: '✔ passes', fails: '✖ fails', 'not checked': 'not checked', '': '—' };
const VERDICT_CELL: Record<string, string> = { passes: '✔ passes', fails: '✖ fails', 'not checked': 'not checked' };

export function candidateRows(
  candidates: SheetCandidate[],
  evaluations: CandidateEvaluation[] | null,
  chosenId: string | null,
  units: UnitSystem,
  otherLabels: readonly string[] = [],
  missing = 'Computing…',
): CandidateGridRow[] {
  const records = candidateRecords(candidates, { evaluations: evaluations ?? [], chosenCandidateId: chosenId }, missing, otherLabels);
  return records.map((r) => {
    const counts = r.flagCounts;
    return {
      id: r.id,
      // Names are the catalogue's, as written; in imperial the size follows in US customary units.
      label: nameInSystem(r.label, units),
      section: convertFromSi(r.sectionPerPhaseMm2, 'areaMm2', units),
      arrangement: r.arrangement,
      hotSpot: r.hotSpotC === null ? null : convertFromSi(r.hotSpotC, 'temperature', units),
      marginPercent: r.marginPercent,
      ampacity: r.ampacityA,
      utilisation: r.utilisationPercent,
      utilisationText: r.utilisationText,
      lossWPerM: r.lossWPerM === null ? null : convertFromSi(r.lossWPerM, 'powerWPerM', units),
      voltageDropPercent: r.voltageDropPercent,
      shortCircuit: SHORT_CIRCUIT_CELL[r.shortCircuit] ?? r.shortCircuit,
      massKg: r.massKg,
      cost: r.materialCost,
      lifeCycleCost: r.lifeCycleCost,
      governing: r.governingCable === null ? '' : `${r.governingCable}${r.governingCableC === null ? '' : `, ${formatNumber(convertFromSi(r.governingCableC, 'temperature', units), 4)} ${unitLabel('temperature', units)}`}`,
      groupMethod: r.groupMethod ?? '',
      governingBar: r.hottestBar ?? '',
      forces: r.forces === null ? '' : (VERDICT_CELL[r.forces] ?? r.forces),
      stressRatio: r.stressRatio,
      supportForceN: r.supportForceN,
      device: r.deviceCurrentA === null ? '' : `${formatNumber(r.deviceCurrentA, 4)} A ${r.coordination === 'passes' ? '✔ coordinated' : r.coordination === 'fails' ? '✖ not coordinated' : '(not checked)'}`,
      smallestDeviceA: r.smallestDeviceA,
      flags: `${counts.blocker ? `${counts.blocker} ✖ ` : ''}${counts.review ? `${counts.review} ▲ ` : ''}${counts.note ? `${counts.note} i` : ''}`.trim(),
      state: r.state,
      stateKey: r.stateKey,
      passes: r.passes === true,
      marks: r.marks,
      chosen: r.chosen,
      error: r.error,
    };
  });
}

const num = (digits: number) => (p: { value: number | null }) => (p.value === null || p.value === undefined ? '—' : formatNumber(p.value, digits));

function StateCell(p: ICellRendererParams<CandidateGridRow>) {
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
  currency: currencyProp,
}: {
  /** The team's currency where the page has no workspace around it (the share page); else the workspace's. */
  currency?: string;
  rows: CandidateGridRow[];
  units: UnitSystem;
  focusedId: string | null;
  onFocus: (id: string) => void;
  onChoose: (id: string) => void;
  onRemove: (id: string) => void;
  editable: boolean;
}) {
  // The bus-bar and protection columns show when some candidate has those results.
  const hasBars = rows.some((r) => r.forces !== '');
  const hasDevice = rows.some((r) => r.device !== '');
  const workspace = useNumberFormat();
  const currency = currencyProp ?? workspace.currency;
  const columns = useMemo<ColDef<CandidateGridRow>[]>(() => {
    const t = unitLabel('temperature', units);
    return [
      {
        headerName: 'Choice',
        width: 96,
        pinned: 'left',
        sortable: false,
        cellRenderer: (p: ICellRendererParams<CandidateGridRow>) =>
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
      {
        headerName: 'Governing cable',
        field: 'governing',
        width: 230,
        tooltipValueGetter: (p) => (p.data?.groupMethod ? `Rated as a group: ${p.data.groupMethod}` : undefined),
        valueFormatter: (p) => (p.value ? String(p.value) : '—'),
      },
      { headerName: 'Group rated by', field: 'groupMethod', width: 230, valueFormatter: (p) => (p.value ? String(p.value) : '—') },
      { headerName: 'Governing bar', field: 'governingBar', width: 210, hide: !hasBars, valueFormatter: (p) => (p.value ? String(p.value) : '—') },
      { headerName: 'Forces (IEC 60865-1)', field: 'forces', width: 150, hide: !hasBars, valueFormatter: (p) => (p.value ? String(p.value) : '—') },
      { headerName: 'Stress ratio', field: 'stressRatio', width: 100, type: 'numericColumn', hide: !hasBars, valueFormatter: num(3) },
      { headerName: 'Support force (N)', field: 'supportForceN', width: 124, type: 'numericColumn', hide: !hasBars, valueFormatter: num(4) },
      { headerName: 'Device and coordination', field: 'device', width: 190, hide: !hasDevice, valueFormatter: (p) => (p.value ? String(p.value) : '—') },
      { headerName: 'Smallest coordinated (A)', field: 'smallestDeviceA', width: 150, type: 'numericColumn', hide: !hasDevice, valueFormatter: num(4) },
      {
        headerName: 'Utilisation (%)',
        field: 'utilisation',
        width: 132,
        type: 'numericColumn',
        // A candidate that may carry no current has no utilisation figure: say so, as the PDF does.
        valueFormatter: (p) => (p.data?.utilisation === null && p.data.utilisationText ? p.data.utilisationText : num(3)(p)),
      },
      { headerName: `Loss (${unitLabel('powerWPerM', units)})`, field: 'lossWPerM', width: 96, type: 'numericColumn', valueFormatter: num(3) },
      { headerName: 'Voltage drop (%)', field: 'voltageDropPercent', width: 118, type: 'numericColumn', valueFormatter: num(3) },
      { headerName: 'Short circuit', field: 'shortCircuit', width: 108 },
      { headerName: 'Mass (kg)', field: 'massKg', width: 96, type: 'numericColumn', valueFormatter: num(4) },
      // Every amount names the team's currency (teams.currency), rounded to cents.
      { headerName: withCurrency('Cost', currency), colId: 'cost', field: 'cost', width: 120, type: 'numericColumn', valueFormatter: (p) => formatMoney(p.value, currency) },
      { headerName: withCurrency('Life-cycle cost', currency), colId: 'lifeCycleCost', field: 'lifeCycleCost', width: 140, type: 'numericColumn', valueFormatter: (p) => formatMoney(p.value, currency) },
      { headerName: 'Flags', field: 'flags', width: 96, headerTooltip: '✖ blocker, ▲ review, i note' },
      { headerName: 'Marked', field: 'marks', width: 170, valueFormatter: (p) => (p.value as string[]).join(' · '), cellClass: 'font-medium text-within-dark' },
      ...(editable
        ? [
            {
              headerName: '',
              width: 84,
              sortable: false,
              cellRenderer: (p: ICellRendererParams<CandidateGridRow>) => (
                <button type="button" className="text-caption text-ink-500 hover:text-over" aria-label={`Remove ${p.data!.label}`} onClick={(e) => { e.stopPropagation(); onRemove(p.data!.id); }}>
                  Remove
                </button>
              ),
            } satisfies ColDef<CandidateGridRow>,
          ]
        : []),
    ];
  }, [units, editable, onChoose, onRemove, hasBars, hasDevice, currency]);

  return (
    <div className="w-full [&_.ag-center-cols-container]:!min-h-0 [&_.ag-center-cols-viewport]:!min-h-0" data-testid="candidate-grid">
      <AgGridReact<CandidateGridRow>
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
        // A handful of rows: every column is rendered, so the governing cable and the flags are in the page (and its text) even when scrolled off.
        suppressColumnVirtualisation
        domLayout="autoHeight"
      />
    </div>
  );
}

'use client';
import { useCallback, useMemo, useState } from 'react';
import { AgGridReact } from 'ag-grid-react';
import { AllCommunityModule, ModuleRegistry, themeQuartz, type ColDef, type ColGroupDef, type ICellRendererParams } from 'ag-grid-community';
import type { CandidateEvaluation } from '@/lib/electrical/sizing/types';
import type { SheetCandidate } from '@/lib/sheet/candidates';
import { candidateRecords } from '@/lib/sheet/sheetTables';
import { convertFromSi, formatNumber, KG_PER_POUND, nameInSystem, unitLabel, type UnitSystem } from '@/lib/units';
import type { CandidateGridColumns } from '@/lib/user/preferences';
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
  /** The sheet's limit, per cent; null when none is set. */
  voltageDropLimitPercent: number | null;
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
  /** Automatic disconnection (IEC 60364-4-41 §411) in words with its icon; '' without a device. */
  disconnection: string;
  state: string;
  stateKey: 'within' | 'tight' | 'over' | 'error';
  passes: boolean;
  marks: string[];
  chosen: boolean;
  error: string | null;
}

const SHORT_CIRCUIT_CELL: Record<string, string> = { passes: '✔ passes', fails: '✖ fails', 'not checked': 'not checked', '': '—' };
const VERDICT_CELL: Record<string, string> = { passes: '✔ passes', fails: '✖ fails', 'not checked': 'not checked' };

/** The flags in words with their icons ("✖ 1 blocker · ▲ 2 review"), never icons alone. */
function flagWords(counts: { blocker: number; review: number; note: number }, evaluated: boolean): string {
  const parts = [
    counts.blocker ? `✖ ${counts.blocker} blocker${counts.blocker === 1 ? '' : 's'}` : '',
    counts.review ? `▲ ${counts.review} review` : '',
    counts.note ? `i ${counts.note} note${counts.note === 1 ? '' : 's'}` : '',
  ].filter(Boolean);
  if (parts.length > 0) return parts.join(' · ');
  return evaluated ? '✔ none' : '—';
}

/** The voltage drop with its verdict against the sheet's limit: "2.13 ✔ within 5 %", "6.4 ✖ over 5 %". */
export function voltageDropWords(percent: number | null, limitPercent: number | null): string {
  if (percent === null) return '—';
  const figure = formatNumber(percent, 3);
  if (limitPercent === null) return `${figure} (no limit set)`;
  return percent <= limitPercent ? `${figure} ✔ within ${formatNumber(limitPercent, 3)} %` : `${figure} ✖ over ${formatNumber(limitPercent, 3)} %`;
}

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
      voltageDropLimitPercent: r.voltageDropLimitPercent,
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
      disconnection: r.disconnection === null ? '' : (VERDICT_CELL[r.disconnection] ?? r.disconnection),
      flags: flagWords(counts, r.evaluated),
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

/** Candidate and marks words with their icons (the marks are words; the icon only helps the eye). */
const MARK_ICONS: Record<string, string> = { 'Smallest passing': '◆', 'Lowest cost passing': '◇' };

function MarksCell(p: ICellRendererParams<CandidateGridRow>) {
  const marks = p.data!.marks;
  if (marks.length === 0) return <span className="text-ink-400">—</span>;
  return (
    <span className="flex flex-col leading-5" data-testid={`marks-${p.data!.id}`}>
      {marks.map((m) => (
        <span key={m} className="font-medium text-within-dark">
          <span aria-hidden="true">{MARK_ICONS[m] ?? '•'} </span>
          {m}
        </span>
      ))}
    </span>
  );
}

/** A verdict cell: its words are the value ("✔ passes"); the colour follows the icon, never alone. */
function VerdictCell(p: ICellRendererParams<CandidateGridRow>) {
  const text = typeof p.valueFormatted === 'string' && p.valueFormatted !== '' ? p.valueFormatted : String(p.value ?? '—');
  const tone = text.includes('✖') ? 'text-over-dark' : text.includes('▲') ? 'text-tight-dark' : text.includes('✔') ? 'text-within-dark' : 'text-ink-600';
  return <span className={tone}>{text || '—'}</span>;
}

/** The column groups of the comparison, left to right after the pinned candidate. */
export const CANDIDATE_GRID_GROUPS = ['Thermal', 'Electrical', 'Cost', 'Review'] as const;
type GroupName = (typeof CANDIDATE_GRID_GROUPS)[number];

/** A column the picker can show or hide: its colId, the group it sits in and whether the grid offers it for these rows. */
interface PickableColumn {
  def: ColDef<CandidateGridRow> & { colId: string; headerName: string };
  group: GroupName;
  /** False: no candidate has this result (bus-bar or device columns on a cable sheet); not offered. */
  applies: boolean;
}

export function CandidateGrid({
  rows,
  units,
  focusedId,
  onFocus,
  onChoose,
  onRemove,
  editable,
  columnChoice = {},
  onColumnChoiceChange,
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
  /** colId → shown; columns not in it are shown. The user's own, remembered on their account. */
  columnChoice?: CandidateGridColumns;
  onColumnChoiceChange?: (choice: CandidateGridColumns) => Promise<{ ok: true } | { ok: false; message: string }>;
}) {
  // The bus-bar and protection columns show when some candidate has those results.
  const hasBars = rows.some((r) => r.forces !== '');
  const hasDevice = rows.some((r) => r.device !== '');
  const hasGroup = rows.some((r) => r.governing !== '' || r.groupMethod !== '');
  const [choice, setChoice] = useState<CandidateGridColumns>(columnChoice);
  const [pickerOpen, setPickerOpen] = useState(false);
  const [choiceProblem, setChoiceProblem] = useState<string | null>(null);

  const workspace = useNumberFormat();
  const currency = currencyProp ?? workspace.currency;
  const pickable = useMemo<PickableColumn[]>(() => {
    const t = unitLabel('temperature', units);
    const text = (p: { value: unknown }) => (p.value ? String(p.value) : '—');
    return [
      { group: 'Thermal', applies: true, def: { colId: 'state', headerName: 'State', field: 'state', width: 180, cellRenderer: StateCell, wrapText: true, autoHeight: true } },
      { group: 'Thermal', applies: true, def: { colId: 'hotSpot', headerName: `Hot spot (${t})`, field: 'hotSpot', width: 96, type: 'numericColumn', valueFormatter: num(4) } },
      { group: 'Thermal', applies: true, def: { colId: 'margin', headerName: 'Margin (%)', field: 'marginPercent', width: 88, type: 'numericColumn', valueFormatter: num(3) } },
      { group: 'Thermal', applies: true, def: { colId: 'ampacity', headerName: 'Ampacity (A)', field: 'ampacity', width: 96, type: 'numericColumn', valueFormatter: num(4) } },
      {
        group: 'Thermal',
        applies: true,
        def: {
          colId: 'utilisation',
          headerName: 'Utilisation (%)',
          field: 'utilisation',
          width: 104,
          type: 'numericColumn',
          // A candidate that may carry no current has no utilisation figure: say so, as the PDF does.
          valueFormatter: (p) => (p.data?.utilisation === null && p.data.utilisationText ? p.data.utilisationText : num(3)(p)),
        },
      },
      {
        group: 'Thermal',
        applies: hasGroup,
        def: {
          colId: 'governing',
          headerName: 'Governing cable',
          field: 'governing',
          width: 200,
          wrapText: true,
          autoHeight: true,
          tooltipValueGetter: (p) => (p.data?.groupMethod ? `Rated as a group: ${p.data.groupMethod}` : undefined),
          valueFormatter: text,
        },
      },
      { group: 'Thermal', applies: hasGroup, def: { colId: 'groupMethod', headerName: 'Group rated by', field: 'groupMethod', width: 200, wrapText: true, autoHeight: true, valueFormatter: text } },
      { group: 'Thermal', applies: hasBars, def: { colId: 'governingBar', headerName: 'Governing bar', field: 'governingBar', width: 180, wrapText: true, autoHeight: true, valueFormatter: text } },
      { group: 'Thermal', applies: true, def: { colId: 'loss', headerName: `Loss (${unitLabel('powerWPerM', units)})`, field: 'lossWPerM', width: 88, type: 'numericColumn', valueFormatter: num(3) } },
      { group: 'Electrical', applies: true, def: { colId: 'section', headerName: `Section/phase (${unitLabel('areaMm2', units)})`, field: 'section', width: 104, type: 'numericColumn', valueFormatter: num(4) } },
      { group: 'Electrical', applies: true, def: { colId: 'arrangement', headerName: 'Arrangement', field: 'arrangement', width: 130, wrapText: true, autoHeight: true } },
      {
        group: 'Electrical',
        applies: true,
        def: {
          colId: 'voltageDrop',
          headerName: 'Voltage drop (%)',
          field: 'voltageDropPercent',
          width: 150,
          valueFormatter: (p) => voltageDropWords(p.data?.voltageDropPercent ?? null, p.data?.voltageDropLimitPercent ?? null),
          cellRenderer: VerdictCell,
        },
      },
      { group: 'Electrical', applies: true, def: { colId: 'shortCircuit', headerName: 'Short circuit', field: 'shortCircuit', width: 104, cellRenderer: VerdictCell } },
      { group: 'Electrical', applies: hasBars, def: { colId: 'forces', headerName: 'Forces (IEC 60865-1)', field: 'forces', width: 120, valueFormatter: text, cellRenderer: VerdictCell } },
      { group: 'Electrical', applies: hasBars, def: { colId: 'stressRatio', headerName: 'Stress ratio', field: 'stressRatio', width: 90, type: 'numericColumn', valueFormatter: num(3) } },
      { group: 'Electrical', applies: hasBars, def: { colId: 'supportForce', headerName: 'Support force (N)', field: 'supportForceN', width: 104, type: 'numericColumn', valueFormatter: num(4) } },
      { group: 'Electrical', applies: hasDevice, def: { colId: 'device', headerName: 'Device and coordination', field: 'device', width: 180, wrapText: true, autoHeight: true, valueFormatter: text, cellRenderer: VerdictCell } },
      { group: 'Electrical', applies: hasDevice, def: { colId: 'smallestDevice', headerName: 'Smallest coordinated (A)', field: 'smallestDeviceA', width: 120, type: 'numericColumn', valueFormatter: num(4) } },
      { group: 'Electrical', applies: hasDevice, def: { colId: 'disconnection', headerName: 'Disconnection (IEC 60364-4-41)', field: 'disconnection', width: 130, valueFormatter: text, cellRenderer: VerdictCell } },
      { group: 'Cost', applies: true, def: { colId: 'mass', headerName: units === 'si' ? 'Mass (kg)' : 'Mass (lb)', field: 'massKg', width: 88, type: 'numericColumn', valueFormatter: (p) => (p.value === null || p.value === undefined ? '—' : formatNumber(units === 'si' ? p.value : p.value / KG_PER_POUND, 4)) } },
      { group: 'Cost', applies: true, def: { colId: 'cost', headerName: withCurrency('Material cost', currency), field: 'cost', width: 120, type: 'numericColumn', valueFormatter: (p) => formatMoney(p.value, currency) } },
      { group: 'Cost', applies: true, def: { colId: 'lifeCycleCost', headerName: withCurrency('Life-cycle cost', currency), field: 'lifeCycleCost', width: 140, type: 'numericColumn', valueFormatter: (p) => formatMoney(p.value, currency) } },
      { group: 'Review', applies: true, def: { colId: 'flags', headerName: 'Assumption flags', field: 'flags', width: 150, wrapText: true, autoHeight: true, cellRenderer: VerdictCell, headerTooltip: '✖ blocker, ▲ review, i note' } },
    ];
  }, [units, hasBars, hasDevice, hasGroup, currency]);

  const shown = useCallback((colId: string) => choice[colId] !== false, [choice]);

  const columns = useMemo<(ColDef<CandidateGridRow> | ColGroupDef<CandidateGridRow>)[]>(() => {
    // Pinned on the left, so that the candidate and its conclusion stay in view at 1024 px however far the rest scrolls.
    const pinnedGroup: ColGroupDef<CandidateGridRow> = {
      headerName: 'Candidate',
      groupId: 'candidate',
      children: [
        {
          colId: 'choice',
          headerName: 'Choice',
          width: 80,
          pinned: 'left',
          lockPinned: true,
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
        // Names wrap rather than being cut ("95 mm² copper XLPE/PVC single-core" is long), with the whole name as a tooltip too.
        { colId: 'label', headerName: 'Name', field: 'label', width: 170, pinned: 'left', lockPinned: true, tooltipField: 'label', wrapText: true, autoHeight: true, cellStyle: { lineHeight: '20px', paddingTop: '5px', paddingBottom: '5px' } },
        { colId: 'marks', headerName: 'Marked', field: 'marks', width: 150, pinned: 'left', lockPinned: true, sortable: false, cellRenderer: MarksCell, autoHeight: true, cellStyle: { paddingTop: '5px', paddingBottom: '5px' }, valueFormatter: (p) => (p.value as string[]).join(' · ') },
      ],
    };
    const groups: ColGroupDef<CandidateGridRow>[] = CANDIDATE_GRID_GROUPS.map((group) => ({
      headerName: group,
      groupId: group.toLowerCase(),
      children: pickable.filter((c) => c.group === group).map((c) => ({ ...c.def, hide: !c.applies || !shown(c.def.colId) })),
    }));
    const remove: ColDef<CandidateGridRow>[] = editable
      ? [
          {
            colId: 'remove',
            headerName: '',
            width: 80,
            sortable: false,
            cellRenderer: (p: ICellRendererParams<CandidateGridRow>) => (
              <button type="button" className="text-caption text-ink-500 hover:text-over" aria-label={`Remove ${p.data!.label}`} onClick={(e) => { e.stopPropagation(); onRemove(p.data!.id); }}>
                Remove
              </button>
            ),
          },
        ]
      : [];
    return [pinnedGroup, ...groups, ...remove];
  }, [pickable, shown, editable, onChoose, onRemove]);

  const toggle = (colId: string, visible: boolean) => {
    const next = { ...choice, [colId]: visible };
    setChoice(next);
    setChoiceProblem(null);
    if (onColumnChoiceChange) {
      void onColumnChoiceChange(next)
        .then((answer) => setChoiceProblem(answer.ok ? null : `Your column choice was not remembered: ${answer.message}`))
        .catch(() => setChoiceProblem('Your column choice was not remembered (no answer from the server); it applies on this page only.'));
    }
  };
  const offered = pickable.filter((c) => c.applies);
  const hiddenCount = offered.filter((c) => !shown(c.def.colId)).length;

  return (
    <div className="w-full space-y-1">
      <div className="flex flex-wrap items-center gap-2 text-caption">
        <button type="button" className="btn-quiet py-0.5" aria-expanded={pickerOpen} aria-controls={pickerOpen ? "grid-column-picker" : undefined} data-testid="column-picker-toggle" onClick={() => setPickerOpen((v) => !v)}>
          Columns{hiddenCount > 0 ? ` (${hiddenCount} hidden)` : ''}
        </button>
        <span className="text-ink-500">The name and its marks stay on the left; scroll sideways for the rest.</span>
      </div>
      {pickerOpen ? (
        <fieldset id="grid-column-picker" className="rounded border border-ink-200 bg-paper p-2" data-testid="column-picker">
          <legend className="px-1 text-caption font-medium">Columns to show{onColumnChoiceChange ? ' (remembered for you)' : ' (on this page only)'}</legend>
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            {CANDIDATE_GRID_GROUPS.map((group) => {
              const inGroup = offered.filter((c) => c.group === group);
              if (inGroup.length === 0) return null;
              return (
                <div key={group} className="min-w-36">
                  <p className="text-caption font-semibold text-ink-700">{group}</p>
                  {inGroup.map((c) => (
                    <label key={c.def.colId} className="flex items-center gap-1.5 text-caption">
                      <input type="checkbox" data-testid={`column-${c.def.colId}`} checked={shown(c.def.colId)} onChange={(e) => toggle(c.def.colId, e.target.checked)} />
                      {c.def.headerName}
                    </label>
                  ))}
                </div>
              );
            })}
          </div>
        </fieldset>
      ) : null}
      {choiceProblem ? <p role="alert" className="field-error">{choiceProblem}</p> : null}
      {/* Where the browser's scrollbars overlay the page (no width of their own), AG Grid floats its
          horizontal scrollbar over the last row; here it takes its own line below the rows instead. */}
      <div className="w-full [&_.ag-body-horizontal-scroll.ag-scrollbar-invisible]:!relative" data-testid="candidate-grid">
        <AgGridReact<CandidateGridRow>
          theme={gridTheme}
          rowData={rows}
          columnDefs={columns}
          getRowId={(p) => p.data.id}
          defaultColDef={{ sortable: true, resizable: true, suppressMovable: true, wrapHeaderText: true, autoHeaderHeight: true }}
          rowSelection={{ mode: 'singleRow', checkboxes: false, enableClickSelection: true }}
          onRowClicked={(e) => e.data && onFocus(e.data.id)}
          getRowClass={(p) => (p.data?.id === focusedId ? 'ag-row-focused-candidate' : undefined)}
          rowClassRules={{ 'font-semibold': (p) => p.data?.id === focusedId }}
          suppressCellFocus={false}
          animateRows={false}
          tooltipShowDelay={300}
          // A handful of rows: every column is rendered, so the governing cable and the flags are in the page (and its text) even when scrolled off.
          suppressColumnVirtualisation
          domLayout="autoHeight"
        />
      </div>
    </div>
  );
}

'use client';
/**
 * Ampwarden's AG Grid: our theme (ink, paper, copper accent; IBM Plex), the community modules
 * registered once for the whole app, and the defaults every data grid here shares (sortable,
 * filterable, resizable columns; floating filters; plain-word overlays).
 */
import { forwardRef, useMemo } from 'react';
import { AgGridReact, type AgGridReactProps } from 'ag-grid-react';
import { AllCommunityModule, ModuleRegistry, themeQuartz, type ColDef } from 'ag-grid-community';

let registered = false;
/** AG Grid keeps one module registry per page; registering twice is harmless but we do it once. */
export function registerGridModules(): void {
  if (registered) return;
  ModuleRegistry.registerModules([AllCommunityModule]);
  registered = true;
}
registerGridModules();

/** Colours from tailwind.config.ts (ink, paper, copper). */
export const ampwardenGridTheme = themeQuartz.withParams({
  fontFamily: 'var(--font-plex-sans), system-ui, sans-serif',
  fontSize: 12,
  headerFontSize: 11,
  headerFontWeight: 600,
  rowHeight: 30,
  headerHeight: 34,
  spacing: 5,
  accentColor: '#b8703d',
  borderColor: '#e1e6ec',
  headerBackgroundColor: '#f2f4f7',
  headerTextColor: '#233040',
  foregroundColor: '#1a2431',
  backgroundColor: '#ffffff',
  oddRowBackgroundColor: '#fdfcf9',
  selectedRowBackgroundColor: '#f1ebdf',
  rangeSelectionBorderColor: '#b8703d',
});

const DEFAULT_COLUMN: ColDef = {
  sortable: true,
  filter: true,
  floatingFilter: true,
  resizable: true,
  minWidth: 90,
};

export type DataGridProps<T> = AgGridReactProps<T> & {
  /** Accessible name of the grid. */
  label: string;
  /** Height of the grid; the page scrolls around it. */
  heightPx?: number;
  /** Shown when there are rows but none passes the search or the filters. */
  noMatchText?: string;
};

function DataGridInner<T>({ label, heightPx = 560, noMatchText = 'No rows match the search or the filters.', defaultColDef, ...props }: DataGridProps<T>, ref: React.ForwardedRef<AgGridReact<T>>) {
  const columnDefaults = useMemo(() => ({ ...DEFAULT_COLUMN, ...defaultColDef }) as ColDef<T>, [defaultColDef]);
  return (
    <div role="region" aria-label={label} style={{ height: heightPx }} className="w-full">
      <AgGridReact<T>
        ref={ref}
        theme={ampwardenGridTheme}
        defaultColDef={columnDefaults}
        overlayNoRowsTemplate={`<span class="text-ink-600">${noMatchText}</span>`}
        tooltipShowDelay={400}
        enableCellTextSelection
        ensureDomOrder
        {...props}
      />
    </div>
  );
}

/** A themed AG Grid; pass any AG Grid props. */
export const DataGrid = forwardRef(DataGridInner) as <T>(props: DataGridProps<T> & { ref?: React.Ref<AgGridReact<T>> }) => React.ReactElement;

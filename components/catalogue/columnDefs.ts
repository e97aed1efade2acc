/**
 * Grid columns for a catalogue part, from the shared column descriptions (lib/catalogue/columns):
 * converted for display in the user's unit system, typed editors for admins, number filters on
 * numbers and text filters on text.
 */
import { plainSource } from '@/lib/sheet/flagWords';
import Decimal from 'decimal.js';
import type { ColDef, ValueFormatterParams, ValueGetterParams } from 'ag-grid-community';
import { CATALOGUE_COLUMNS, type ColumnSpec } from '@/lib/catalogue/columns';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import { convertFromSi, convertToSi, formatNumber, unitLabel, type UnitSystem } from '@/lib/units';
import { parseNumber, writeNumber, type DecimalSeparator } from '@/lib/units/parse';

export type GridRow = Record<string, unknown> & { id: string };

/** The header with its unit; a price names the team's currency ("Metal price (EUR/kg)"). */
export function headerOf(column: ColumnSpec, units: UnitSystem, currency = ''): string {
  const plain = column.quantity ? unitLabel(column.quantity, units) : column.fixedUnit;
  const unit = column.quantity === 'pricePerKg' && currency ? `${currency}${plain}` : plain;
  return unit ? `${column.label} (${unit})` : column.label;
}

/** The number a decimal cell shows and filters on, in the user's units. */
export function displayNumber(value: unknown, column: ColumnSpec, units: UnitSystem): number | null {
  if (value === null || value === undefined || value === '') return null;
  const n = Number(value);
  if (!Number.isFinite(n)) return null;
  if (!column.quantity || units === 'si') return n;
  // Six figures: enough to edit and filter on, without binary tails from the conversion factor.
  return Number(convertFromSi(n, column.quantity, units).toPrecision(6));
}

/** Text of a decimal cell: the stored decimal exactly in SI; four significant figures when converted. */
export function formatDecimalCell(value: unknown, column: ColumnSpec, units: UnitSystem, separator: DecimalSeparator = '.'): string {
  if (value === null || value === undefined || value === '') return '';
  if (!column.quantity || units === 'si') {
    // As stored (keeps the figures the source gives), except long runs of zeros, shown with an
    // exponent (the grid's editor takes exponents: a resistivity of 1.72e-8 Ω·m is meant so).
    const text = String(value);
    const decimal = new Decimal(text);
    return writeNumber(!decimal.isZero() && decimal.abs().lt('0.0001') ? decimal.toString() : text, separator);
  }
  const shown = displayNumber(value, column, units);
  return shown === null ? '' : writeNumber(formatNumber(shown, 4), separator);
}

/**
 * A value the user typed in their units → what the API stores (SI decimal string). SI input
 * passes through as typed (exact); converted input is rounded to 6 significant figures, more than
 * any catalogue value carries, so that 0.3048-type factors do not leave 1e-17 tails.
 */
export function toStoredValue(typed: unknown, column: ColumnSpec, units: UnitSystem, separator: DecimalSeparator = '.'): { value: unknown } | { refusal: string } {
  if (column.type !== 'decimal') return { value: typeof typed === 'string' ? typed : typed ?? '' };
  if (typed === null || typed === undefined || (typeof typed === 'string' && typed.trim() === '')) return { value: null };
  // The one parser (lib/units/parse): the user's separator, nothing ambiguous, no hex or exponents.
  const text = String(typed).trim().replace(/\u2212/g, '-');
  const parsed = parseNumber(text, { decimalSeparator: separator, field: column.label, exponent: true });
  if (!parsed.ok) return { refusal: parsed.message };
  // SI input keeps its typed digits (exact decimal), only the separator becomes a point.
  if (!column.quantity || units === 'si') return { value: separator === ',' ? text.replace(',', '.') : text };
  return { value: new Decimal(convertToSi(parsed.value, column.quantity, units)).toSignificantDigits(6).toFixed() };
}

export function columnDefsFor(
  kind: CatalogueKind,
  units: UnitSystem,
  editable: boolean,
  referenceOptions: Partial<Record<CatalogueKind, string[]>>,
  separator: DecimalSeparator = '.',
  currency = '',
): ColDef<GridRow>[] {
  return CATALOGUE_COLUMNS[kind].map((column): ColDef<GridRow> => {
    const base: ColDef<GridRow> = {
      colId: column.field,
      headerName: headerOf(column, units, currency),
      headerTooltip: column.hint,
      hide: column.hiddenByDefault ?? false,
      editable: editable,
      pinned: column.field === 'key' ? 'left' : undefined,
    };
    if (column.type === 'decimal') {
      return {
        ...base,
        type: 'rightAligned',
        // Keep AG Grid's right alignment class alongside our tabular-figures class.
        cellClass: 'num ag-right-aligned-cell',
        width: 140,
        filter: 'agNumberColumnFilter',
        valueGetter: (p: ValueGetterParams<GridRow>) => displayNumber(p.data?.[column.field], column, units),
        valueFormatter: (p: ValueFormatterParams<GridRow>) => formatDecimalCell(p.data?.[column.field], column, units, separator),
        cellEditor: 'agTextCellEditor',
        // The editor starts from what the cell shows, so that SI decimals stay exact.
        valueParser: (p) => p.newValue,
      };
    }
    if (column.type === 'integer') {
      return { ...base, field: column.field, width: 90, type: 'rightAligned', cellClass: 'num ag-right-aligned-cell', filter: 'agNumberColumnFilter', cellEditor: 'agNumberCellEditor' };
    }
    if (column.type === 'enum' || column.type === 'reference') {
      const values = column.type === 'enum' ? [...(column.options ?? [])] : [...(column.required ? [] : ['']), ...(referenceOptions[column.references!] ?? [])];
      return { ...base, field: column.field, width: 150, filter: 'agTextColumnFilter', cellEditor: 'agSelectCellEditor', cellEditorParams: { values } };
    }
    const isSource = /source|note/i.test(column.field);
    return {
      ...base,
      field: column.field,
      width: isSource ? 260 : column.field === 'key' ? 170 : 200,
      filter: 'agTextColumnFilter',
      tooltipField: isSource ? column.field : undefined,
      // Rows copied by an earlier version may name a design file of this repository (issue 22).
      ...(isSource ? { valueFormatter: (p: ValueFormatterParams<GridRow>) => plainSource(String(p.value ?? '')), tooltipValueGetter: (p: { value?: unknown }) => plainSource(String(p.value ?? '')) } : {}),
      cellEditor: isSource ? 'agLargeTextCellEditor' : 'agTextCellEditor',
      cellEditorPopup: isSource,
      cellClass: isSource ? 'text-ink-600' : undefined,
    };
  });
}

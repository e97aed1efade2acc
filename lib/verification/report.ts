/**
 * The verification report as rows (one per compared quantity) and as CSV, shared by the page's
 * download button and the PDF route, so the two files say the same thing.
 */
import { tableCsv, toCsv } from '../files/csv';
import { describeTolerance } from './run';
import { METHOD_AREA_LABELS, type CaseResult } from './types';

export interface ReportSummary {
  cases: number;
  passed: number;
  failed: number;
  quantities: number;
}

export function summarise(results: readonly CaseResult[]): ReportSummary {
  const passed = results.filter((r) => r.pass).length;
  return { cases: results.length, passed, failed: results.length - passed, quantities: results.reduce((n, r) => n + r.quantities.length, 0) };
}

/** Numbers as a reviewer reads them: 7 significant digits, exponent form when very small or large. */
export function formatNumber(value: number, digits = 7): string {
  if (Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return value > 0 ? '∞' : '−∞';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude < 1e-3 || magnitude >= 1e7) {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
    return `${String(Number(mantissa))}e${exponent.replace('+', '')}`;
  }
  return String(Number(value.toPrecision(digits)));
}

/** The kind of source in words, keeping the "from memory" label (references.md). */
export function sourceBasis(source: CaseResult['source']): string {
  if (source.kind === 'from memory' || !source.fromMemory) return source.kind;
  return `${source.kind}, from memory`;
}

export interface ReportRow {
  caseId: string;
  case: string;
  area: string;
  source: string;
  basis: string;
  quantity: string;
  unit: string;
  reference: string;
  ampwarden: string;
  deviation: string;
  relativeDeviation: string;
  tolerance: string;
  result: 'pass' | 'fail';
  note: string;
}

export function reportRows(results: readonly CaseResult[]): ReportRow[] {
  const rows: ReportRow[] = [];
  for (const r of results) {
    for (const q of r.quantities) {
      rows.push({
        caseId: r.id,
        case: r.title,
        area: METHOD_AREA_LABELS[r.area],
        source: r.source.citation,
        basis: sourceBasis(r.source),
        quantity: q.label,
        unit: q.unit,
        reference: formatNumber(q.reference, 10),
        ampwarden: formatNumber(q.value, 10),
        deviation: formatNumber(q.deviation, 3),
        relativeDeviation: q.relativeDeviation === null ? '' : formatNumber(q.relativeDeviation, 3),
        tolerance: describeTolerance(q.tolerance, q.unit),
        result: q.pass ? 'pass' : 'fail',
        note: r.error ?? '',
      });
    }
  }
  return rows;
}

export interface ReportMeta {
  generatedAt: string;
  where: string;
}

/** CSV with a header line per column; the first lines say when and where the checks ran. */
export function reportCsv(results: readonly CaseResult[], meta: ReportMeta): string {
  const summary = summarise(results);
  const rows = reportRows(results);
  // The shared CSV writer (lib/files/csv.ts) makes formula-leading cells inert, as every export does.
  const table = tableCsv(
    ['case id', 'case', 'method', 'source', 'basis', 'quantity', 'unit', 'reference', 'Ampwarden', 'deviation', 'relative deviation', 'tolerance', 'result', 'note'],
    rows.map((row) => [row.caseId, row.case, row.area, row.source, row.basis, row.quantity, row.unit, row.reference, row.ampwarden, row.deviation, row.relativeDeviation, row.tolerance, row.result, row.note]),
  );
  const heading = toCsv(
    [
      ['Ampwarden verification report'],
      ['generated', meta.generatedAt],
      ['run', meta.where],
      ['cases passed', `${summary.passed} of ${summary.cases}`],
      ['caution', 'An engineering aid: results depend on the listed assumptions and must be checked and signed by a qualified, licensed engineer.'],
    ],
  );
  return `${heading}\r\n\r\n${table}\r\n`;
}

/**
 * The sheet's optional checks beyond the steady state ("Over time", "Along the run"), computed
 * for one candidate with lib/electrical (physics.md §6). Same function in the browser and for
 * the PDF.
 */
import Papa from 'papaparse';
import { decimalSeparatorOfDelimiter, parseNumber, type DecimalSeparator } from '../units/parse';
import { alongRunCheck, overTimeCheck, type AlongRunResult, type OverTimeResult } from '../electrical/sizing/beyondSteady';
import type { SheetInputs } from './schema';
import { toCandidates, toConditions } from './toSizing';

export type CheckOutcome<T> = { ok: true; result: T } | { ok: false; message: string; field?: string };

export interface BeyondSteadyResults {
  candidateId: string;
  overTime?: CheckOutcome<OverTimeResult>;
  alongRun?: CheckOutcome<AlongRunResult>;
}

/** A check that could not run, with the library's message and the field it names. */
export function checkFailure(error: unknown): { ok: false; message: string; field?: string } {
  const message = error instanceof Error ? error.message : String(error);
  const field = error && typeof error === 'object' && 'field' in error ? String((error as { field: unknown }).field) : undefined;
  return field ? { ok: false, message, field } : { ok: false, message };
}

/** Runs the checked sections for the candidate `candidateId`; null when the candidate is not on the sheet. */
export function computeBeyondSteady(inputs: SheetInputs, candidateId: string): BeyondSteadyResults | null {
  const index = inputs.candidates.findIndex((c) => c.id === candidateId);
  if (index < 0) return null;
  const candidate = toCandidates(inputs)[index];
  const conditions = toConditions(inputs);
  const out: BeyondSteadyResults = { candidateId };
  if (inputs.overTime.checked) {
    try {
      const t = inputs.overTime;
      out.overTime = {
        ok: true,
        result: overTimeCheck(candidate, conditions, {
          overload: { currentA: t.overloadCurrentA, durationS: t.overloadDurationS },
          ...(t.dailyProfileA.length > 0 ? { dailyCurrentsA: t.dailyProfileA } : {}),
          fault: t.faultWithCoverings && inputs.fault.checked,
        }),
      };
    } catch (error) {
      out.overTime = checkFailure(error);
    }
  }
  if (inputs.alongRun.checked) {
    if (candidate.kind !== 'bar') {
      out.alongRun = { ok: false, message: 'The run along the length is for bars; this candidate is a cable.' };
    } else {
      try {
        const a = inputs.alongRun;
        const end = (kind: 'terminal' | 'insulated', temperatureC: number) => (kind === 'terminal' ? { kind, temperatureC } : { kind });
        out.alongRun = {
          ok: true,
          result: alongRunCheck(candidate, conditions, {
            lengthM: a.lengthM,
            start: end(a.startEnd, a.startTemperatureC),
            end: end(a.endEnd, a.endTemperatureC),
            joints: a.joints,
          }),
        };
      } catch (error) {
        out.alongRun = checkFailure(error);
      }
    }
  }
  return out;
}

/**
 * Parses an uploaded or pasted daily profile: one current per row, the last cell of the row
 * ("hour, current" or just "current"); a non-numeric first row is a header and is skipped.
 * A first column of numbers that do not count the intervals is refused: a one-column file written
 * with decimal commas ("120,5") splits at the comma, and its last cell would read 5 A for 120.5 A.
 */
export function profileFromRows(rows: unknown[][], decimalSeparator: DecimalSeparator = '.'): { currentsA: number[] } | { error: string } {
  const values: number[] = [];
  const leading: { row: number; first: string; last: string }[] = [];
  let seenRow = false;
  for (let r = 0; r < rows.length; r++) {
    const cells = rows[r].map((c) => String(c ?? '').trim()).filter((c) => c !== '');
    if (cells.length === 0) continue;
    const firstRow = !seenRow;
    seenRow = true;
    // The current is the last cell of a row ("hour, current" or just "current").
    // The one parser (lib/units/parse) with the file's decimal separator.
    const parsed = parseNumber(cells[cells.length - 1], { decimalSeparator, field: `Row ${r + 1}` });
    if (!parsed.ok) {
      if (firstRow) continue; // header
      return { error: / is not a number$/.test(parsed.message) ? `Row ${r + 1}: "${cells[cells.length - 1]}" is not a current in A` : `${parsed.message} (a current in A)` };
    }
    const value = parsed.value;
    if (value < 0) return { error: `Row ${r + 1}: a current must not be negative` };
    values.push(value);
    if (cells.length > 1) leading.push({ row: r + 1, first: cells[0], last: cells[cells.length - 1] });
  }
  const firsts = leading.map((l) => {
    const p = parseNumber(l.first, { decimalSeparator, field: 'first column' });
    return p.ok ? p.value : Number.NaN;
  });
  // Labels that are not plain numbers (clock times, dates) are fine; numbers must count evenly (0, 1, 2… or minutes).
  if (leading.length > 1 && firsts.every(Number.isFinite)) {
    const step = firsts[1] - firsts[0];
    const counts = step > 0 && firsts.every((f, i) => Math.abs(f - (firsts[0] + i * step)) <= 1e-9 * Math.max(1, Math.abs(f)));
    if (!counts) {
      const l = leading[0];
      return { error: `Row ${l.row}: two numbers, "${l.first}" and "${l.last}", and the first column does not count the intervals — if that is one current with a decimal comma, separate the columns with ";" or use a decimal point` };
    }
  }
  return { currentsA: values };
}

/**
 * Reads a pasted or uploaded daily-profile file (CSV, delimiter detected) with profileFromRows.
 * Blank lines are kept while parsing so that "Row N" in a message is line N of the file.
 */
export function readDailyProfileText(text: string, userSeparator: DecimalSeparator = '.'): { currentsA: number[] } | { error: string } {
  const parsed = Papa.parse<unknown[]>(text, { skipEmptyLines: false });
  return profileFromRows(parsed.data, decimalSeparatorOfDelimiter(parsed.meta.delimiter, userSeparator));
}

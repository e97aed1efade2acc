/**
 * The daily-load CSV of the "Over time" check, read as the sheet panel reads it
 * (lib/sheet/beyondSteady.ts readDailyProfileText: papaparse keeping blank lines, then profileFromRows).
 * What profileFromRows documents: one current per row, the last cell of a row ("hour, current"
 * or just "current"); a non-numeric first row is a header and is skipped; a non-numeric or
 * negative current anywhere else is an error naming the row; a first column of numbers that do not
 * count the intervals is refused (a one-column file with decimal commas splits at the comma). The number of values is the sheet
 * schema's business (overTimeSchema.dailyProfileA: 24, 48, … equal intervals), so the row-count
 * cases check the two together, as the panel does (it sets the field and the form validates it).
 *
 * The check values are the CSV texts themselves: what is written in the file must come back.
 */
import { describe, expect, it } from 'vitest';
import { readDailyProfileText } from '@/lib/sheet/beyondSteady';
import { DAILY_PROFILE_LENGTHS, overTimeSchema } from '@/lib/sheet/schema';

const readCsv = readDailyProfileText;

/** An invented office-like day, A per hour from midnight (input only). */
const hourlyA = Array.from({ length: 24 }, (_, hour) => (hour >= 8 && hour < 18 ? 420 + 5 * hour : 150 + hour));

const overTimeWith = (dailyProfileA: number[]) => ({ checked: true, overloadCurrentA: 600, overloadDurationS: 3600, dailyProfileA, faultWithCoverings: false });

describe('daily profile CSV (profileFromRows after papaparse)', () => {
  it('reads an hourly "hour,current" file with a header row: 24 currents, in file order, accepted by the sheet schema', () => {
    const csv = ['hour,current_A', ...hourlyA.map((a, hour) => `${hour},${a}`)].join('\n');
    const read = readCsv(csv);
    expect(read).toEqual({ currentsA: hourlyA });
    const currentsA = 'currentsA' in read ? read.currentsA : [];
    expect(overTimeSchema.safeParse(overTimeWith(currentsA)).success).toBe(true);
  });

  it('reads a one-column file without a header, CRLF line ends and blank lines', () => {
    const csv = `${hourlyA.slice(0, 12).join('\r\n')}\r\n\r\n${hourlyA.slice(12).join('\r\n')}\r\n`;
    expect(readCsv(csv)).toEqual({ currentsA: hourlyA });
  });

  it('reads a semicolon file with decimal commas (the usual spreadsheet export where a comma is the decimal mark, common practice)', () => {
    const csv = ['hour;current_A', '0;12,5', ...Array.from({ length: 23 }, (_, i) => `${i + 1};${100 + i},25`)].join('\n');
    const read = readCsv(csv);
    expect('currentsA' in read).toBe(true);
    if (!('currentsA' in read)) return;
    expect(read.currentsA).toHaveLength(24);
    expect(read.currentsA[0]).toBe(12.5);
    expect(read.currentsA[23]).toBe(122.25);
  });

  it('a one-column file with decimal commas is refused, not read as its decimals ("120,5" splits into "120" and "5" at the comma)', () => {
    const csv = hourlyA.map((a) => `${a},5`).join('\n');
    const read = readCsv(csv);
    expect('error' in read).toBe(true);
    if (!('error' in read)) return;
    expect(read.error).toMatch(/^Row 1: /);
    expect(read.error).toContain(`two numbers, "${hourlyA[0]}" and "5"`);
    // A counting first column in any step (hours 1–24, minutes 0, 60, …) is "hour, current" and is read.
    expect(readCsv(hourlyA.map((a, i) => `${i + 1},${a}`).join('\n'))).toEqual({ currentsA: hourlyA });
    expect(readCsv(hourlyA.map((a, i) => `${60 * i},${a}`).join('\n'))).toEqual({ currentsA: hourlyA });
    // A clock-time first column is not a number and is read as a label.
    expect(readCsv(hourlyA.map((a, i) => `${String(i).padStart(2, '0')}:00,${a}`).join('\n'))).toEqual({ currentsA: hourlyA });
  });

  it('a non-numeric current is an error naming its row (the header counts as row 1) and the cell', () => {
    const rows = ['hour,current_A', ...hourlyA.map((a, hour) => `${hour},${hour === 6 ? 'n/a' : a}`)];
    const read = readCsv(rows.join('\n'));
    // Hour 6 is the 7th data row, the 8th line of the file.
    expect(read).toEqual({ error: 'Row 8: "n/a" is not a current in A' });
  });

  it('only the first row may be a header: a text row further down is an error, not skipped', () => {
    const read = readCsv(['100', '110', 'current_A', ...hourlyA.slice(3)].join('\n'));
    expect('error' in read && read.error).toMatch(/^Row 3: "current_A"/);
  });

  it('a negative current is an error naming its row', () => {
    const read = readCsv(hourlyA.map((a, hour) => `${hour},${hour === 10 ? -a : a}`).join('\n'));
    expect(read).toEqual({ error: 'Row 11: a current must not be negative' });
  });

  it('a file with the wrong number of rows is read, and the sheet schema refuses it on the daily profile field naming the allowed counts', () => {
    for (const count of [23, 25]) {
      const values = Array.from({ length: count }, (_, i) => hourlyA[i % 24]);
      const read = readCsv(values.join('\n'));
      expect(read).toEqual({ currentsA: values });
      const checked = overTimeSchema.safeParse(overTimeWith(values));
      expect(checked.success).toBe(false);
      const issue = checked.error!.issues[0];
      expect(issue.path).toEqual(['dailyProfileA']);
      for (const allowed of DAILY_PROFILE_LENGTHS) expect(issue.message).toContain(String(allowed));
    }
    // Quarter-hourly (96) is one of the allowed finer profiles.
    const quarterHourly = Array.from({ length: 96 }, (_, i) => hourlyA[Math.floor(i / 4)]);
    expect(overTimeSchema.safeParse(overTimeWith(quarterHourly)).success).toBe(true);
  });

  it('names the line of the file in "Row N", blank lines included, and takes a header after leading blank lines', () => {
    const csv = ['', 'current_A', '100', '', '', '120', 'n/a'].join('\n');
    expect(readCsv(csv)).toEqual({ error: 'Row 7: "n/a" is not a current in A' });
  });
});

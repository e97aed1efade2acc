// The one CSV writer of every export (issue 19, item 4). Checks against OWASP "CSV Injection":
// cells beginning with = + - @, tab (0x09) or carriage return (0x0D) are prefixed with a single
// quote and the field quoted, embedded quotes doubled (RFC 4180 §2.7). Read back with papaparse,
// a general-purpose CSV parser, so that the checks do not trust our own reading.
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { csvField, tableCsv, toCsv } from '@/lib/files/csv';
import { writeCsv } from '@/lib/catalogue/files';
import { tableToCsv } from '@/lib/schedule';
import { resultsTable, type ResultLine } from '@/lib/schedule/results';
import { reportCsv, runCase, verificationCases } from '@/lib/verification';
import { STANDARD_MATERIALS } from '@/lib/catalogue/standardData';

const parse = (csv: string) => Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;

// Payloads in the form OWASP's page shows them, one per leading character it names.
const FORMULAS = ['=1+2', "=cmd|' /C calc'!A0", '+1+2', '-2+3', '@SUM(1,2)', '\t=1+2', '\r=1+2', '=HYPERLINK("http://attacker.example","x")'];

describe('csvField (OWASP CSV injection)', () => {
  it.each(FORMULAS)('%j is prefixed with a single quote and quoted', (payload) => {
    const field = csvField(payload);
    expect(field.startsWith(`"'`)).toBe(true);
    expect(parse(`${field}\r\n`)[0][0]).toBe(`'${payload}`);
  });

  it('plain numbers stay numbers: -12.5, +3e-4, and the number -5 are not prefixed', () => {
    expect(csvField('-12.5')).toBe('-12.5');
    expect(csvField('+3e-4')).toBe('+3e-4');
    expect(csvField(-5)).toBe('-5');
    // A formula that starts like a number is still a formula.
    expect(csvField('-1+1')).toBe(`"'-1+1"`);
  });

  it('RFC 4180: commas, quotes and line breaks are quoted, quotes doubled; null is empty', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField(null)).toBe('');
    expect(toCsv([['a', 1], ['b', null]])).toBe('a,1\r\nb,');
    expect(tableCsv(['h'], [['=x']])).toBe(`h\r\n"'=x"`);
  });
});

describe('every CSV export goes through it', () => {
  it('catalogue export: a material name beginning with = is inert', () => {
    const material = { ...STANDARD_MATERIALS[0], key: 'evil', name: '=HYPERLINK("http://attacker.example","Copper")' };
    const rows = parse(writeCsv('materials', [material]));
    const nameColumn = rows[0].indexOf('name');
    expect(nameColumn).toBeGreaterThanOrEqual(0);
    expect(rows[1][nameColumn]).toBe(`'${material.name}`);
  });

  it('schedule results export: a circuit tag beginning with @ or + is inert, a negative margin stays a number', () => {
    const line: ResultLine = {
      rowNumber: 2, circuitTag: '@SUM(1,2)', from: '+cmd', to: 'MSB', designCurrentA: 100, lengthM: 10, family: 'fam', status: 'sized', size: '70', runsPerPhase: 1,
      sectionPerPhaseMm2: 70, hotSpotC: 95.5, limitC: 90, marginK: -5.5, marginPercent: -6.1, ampacityA: 90, utilisation: 1.1, voltageDropPercent: 1.2,
      shortCircuit: 'not checked', shortCircuitFinalC: null, lossW: 10, massKg: 5, materialCost: '12.00', blockerFlags: 1, reviewFlags: 0, noteFlags: 0, flagText: '-', remark: '', governingCable: null, groupMethod: null,
    };
    const table = resultsTable([line]);
    const rows = parse(tableToCsv(table));
    expect(rows[1][table.headers.findIndex((h) => /tag/i.test(h))]).toBe(`'@SUM(1,2)`);
    expect(rows[1]).toContain(`'+cmd`);
    expect(rows[1]).toContain('-5.5');
  });

  it('verification report: every cell that begins like a formula is inert, and negative numbers stay numbers', () => {
    const csv = reportCsv(verificationCases.slice(0, 3).map((c) => runCase(c)), { generatedAt: '=1+1', where: '@here' });
    const head = parse(csv.split('\r\n\r\n')[0]);
    expect(head.find((r) => r[0] === 'generated')?.[1]).toBe(`'=1+1`);
    expect(head.find((r) => r[0] === 'run')?.[1]).toBe(`'@here`);
  });
});

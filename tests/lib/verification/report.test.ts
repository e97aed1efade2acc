/**
 * The report files a reviewer downloads: the CSV (built from the same rows as the page) and the
 * PDF (@react-pdf/renderer with the IBM Plex fonts of fonts/). The PDF is rendered here and read
 * back with unpdf; every character it prints must exist in the fonts it embeds (no empty boxes).
 */
import fs from 'node:fs';
import path from 'node:path';
import { createElement } from 'react';
import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import * as fontkit from 'fontkit';
import { renderToBuffer } from '@react-pdf/renderer';
import { extractText, getDocumentProxy } from 'unpdf';
import { reportCsv, reportRows, runCase, summarise, verificationCases, type CaseResult } from '@/lib/verification';
import { REPORT_FONT_FILES, registerReportFonts, VerificationReportDocument } from '@/server/pdf/VerificationReportDocument';
import { pdfSafeText } from '@/server/pdf/pdfText';

const results: CaseResult[] = verificationCases.map((c) => runCase(c));

describe('CSV report', () => {
  it('has one row per compared quantity with reference, Ampwarden value, tolerance and result', () => {
    const csv = reportCsv(results, { generatedAt: '2026-01-01 00:00:00 UTC', where: 'in a test' });
    const [head, table] = csv.split('\r\n\r\n');
    expect(head).toMatch(/cases passed,\d+ of \d+/);
    expect(head).toMatch(/licensed engineer/);
    const parsed = Papa.parse<string[]>(table.trim(), { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const [columns, ...rows] = parsed.data;
    expect(columns).toEqual(['case id', 'case', 'method', 'source', 'basis', 'quantity', 'unit', 'reference', 'Ampwarden', 'deviation', 'relative deviation', 'tolerance', 'result', 'note']);
    expect(rows.length).toBe(summarise(results).quantities);
    expect(new Set(rows.map((r) => r[0])).size).toBe(verificationCases.length);
    // "From memory" labels travel with the values (references.md).
    expect(rows.filter((r) => r[0].startsWith('k-factor-')).every((r) => r[4] === 'from memory' && /from memory/.test(r[3]))).toBe(true);
    // The skin-effect row carries the hand-worked reference and the library's value.
    const skin = rows.find((r) => r[0] === 'skin-effect-cu-240-90c-50hz' && /hand-worked/.test(r[5]))!;
    expect(Number(skin[7])).toBeCloseTo(0.008835005, 9);
    expect(Math.abs(Number(skin[8]) - 0.008835005)).toBeLessThan(1e-8);
  });

  it('marks a failing case as failing', () => {
    const failing: CaseResult = { ...results[0], pass: false, quantities: results[0].quantities.map((q) => ({ ...q, pass: false })) };
    expect(reportRows([failing]).every((r) => r.result === 'fail')).toBe(true);
  });
});

describe('PDF report', () => {
  it('renders cases with their source and result, in the embedded Plex fonts', async () => {
    // A few cases of different kinds keep this quick; the whole report is read back by the
    // browser test (tests/e2e/verification.test.ts) from the route that serves it.
    const sample = ['composite-cylinder', 'k-factor-cu-xlpe', 'skin-effect-cu-240-90c-50hz', 'catalogue-iec60228-aluminium'].map(
      (id) => results.find((r) => r.id === id)!,
    );
    const failing: CaseResult = { ...sample[1], id: 'failing-copy', pass: false, quantities: sample[1].quantities.map((q) => ({ ...q, value: 1, pass: false })) };
    registerReportFonts();
    const pdf = await renderToBuffer(createElement(VerificationReportDocument, { results: [...sample, failing], generatedAt: '2026-01-01 00:00:00 UTC' }) as never);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const doc = await getDocumentProxy(new Uint8Array(pdf));
    const { text } = await extractText(doc, { mergePages: true });
    expect(text).toContain(`4 of 5 cases pass`);
    expect(text).toContain('FAIL');
    expect(text).toContain('licensed engineer');
    for (const r of sample) expect(text, r.title).toContain(pdfSafeText(r.title).slice(0, 40));
    expect(text).toContain('from memory');
    expect(text).toContain('measured order');
    // The fonts are the IBM Plex files of fonts/, embedded (subset) in the PDF.
    expect(pdf.toString('latin1')).toMatch(/IBMPlexSans/);
  }, 60_000);

  it('prints no character that its fonts lack (symbols are written out instead)', () => {
    const load = (name: string) => fontkit.create(fs.readFileSync(path.join(process.cwd(), 'fonts', name)));
    const fonts = REPORT_FONT_FILES.map(load);
    const strings: string[] = [];
    for (const r of results) {
      strings.push(r.title, r.source.citation, r.notes ?? '', r.id);
      for (const i of r.inputs) strings.push(i.name, String(i.value), i.unit ?? '');
      for (const q of r.quantities) strings.push(q.label, q.unit);
    }
    const missing = new Set<string>();
    for (const s of strings) {
      for (const ch of pdfSafeText(s)) {
        if (ch.trim() === '') continue;
        if (!fonts.some((font) => font.hasGlyphForCodePoint(ch.codePointAt(0)!))) missing.add(ch);
      }
    }
    expect([...missing]).toEqual([]);
  });
});

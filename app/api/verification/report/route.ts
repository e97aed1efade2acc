/**
 * GET /api/verification/report[?format=pdf|csv] — the verification report for a reviewer's file,
 * computed here on the server with the same registry the /verification page runs.
 *
 * Access: any signed-in member of any team ('authenticated'). The report holds no team data, so
 * publishing it would leak nothing; it stays behind sign-in because the page that links to it is
 * for members and because rendering it is real work (the whole registry, then a PDF), which an
 * anonymous caller should not be able to make the server do.
 *
 * The cases are deterministic for a given build, so the server computes the report once per
 * process and says when: the code cannot change while the process runs.
 */
import { createElement, type ReactElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { z } from 'zod';
import { apiHandler } from '@/server/http/api';
import { downloadResponse } from '@/server/http/download';
import { reportCsv, runCase, verificationCases, type CaseResult } from '@/lib/verification';
import { registerReportFonts, VerificationReportDocument } from '@/server/pdf/VerificationReportDocument';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

const querySchema = z.object({ format: z.enum(['pdf', 'csv']).default('pdf') });

interface ComputedReport {
  results: CaseResult[];
  generatedAt: string;
  day: string;
}

let computed: ComputedReport | undefined;
let pdf: Promise<Buffer> | undefined;

function report(): ComputedReport {
  if (!computed) {
    const now = new Date();
    computed = {
      results: verificationCases.map((c) => runCase(c)),
      generatedAt: now.toISOString().replace('T', ' ').replace(/\.\d+Z$/, ' UTC'),
      day: now.toISOString().slice(0, 10),
    };
  }
  return computed;
}

function pdfOf(r: ComputedReport): Promise<Buffer> {
  if (!pdf) {
    registerReportFonts();
    const document = createElement(VerificationReportDocument, { results: r.results, generatedAt: r.generatedAt }) as unknown as ReactElement<DocumentProps>;
    pdf = renderToBuffer(document).catch((error: unknown) => {
      pdf = undefined; // a failed render is not kept: the next request tries again
      throw error;
    });
  }
  return pdf;
}

export const GET = apiHandler({ permission: 'authenticated' }, async (req) => {
  const { format } = querySchema.parse({ format: req.nextUrl.searchParams.get('format') ?? undefined });
  const r = report();
  const stem = `ampwarden-verification-${r.day}`;
  if (format === 'csv') {
    return downloadResponse(reportCsv(r.results, { generatedAt: r.generatedAt, where: 'on the server' }), { fileName: `${stem}.csv`, kind: 'csv' });
  }
  return downloadResponse(new Uint8Array(await pdfOf(r)), { fileName: `${stem}.pdf`, kind: 'pdf' });
});

/**
 * PDF sizing sheets for the routes (sheet PDF, share-link PDF, e-mail attachment): rendered in a
 * worker thread, so that rendering (about half a second of CPU each, more on a loaded machine)
 * never holds up other requests, and kept per saved state of the sheet, so that the same sheet
 * asked for again — a share link opened by several people, a PDF viewer's repeated requests — is
 * rendered once.
 *
 * The cache key is the sheet id with its saved version: every change that shows in the PDF (inputs
 * and result snapshot, review state, reviewer, acknowledgements) bumps the version. The PDF keeps
 * the "generated" time of its first rendering. Bounded to 64 PDFs and 96 MB, least recently used
 * out first.
 */
import { Worker } from 'node:worker_threads';
import { calculationPackageOf } from '@/db/queries/calculationPackage';
import { ApiError } from '@/server/http/errors';
import { ThreadCrashError, ThreadPool, ThreadTaskError, ThreadTimeLimitError } from '@/server/threads/pool';
import type { PdfSheet } from './SizingSheetDocument';

export interface PdfTask {
  sheet: PdfSheet;
  generatedAtIso: string;
}

export const PDF_RENDER_TIME_LIMIT_MS = 60_000;
const PDF_RENDER_MEMORY_MB = 512;
const CACHE_MAX_ENTRIES = 64;
const CACHE_MAX_BYTES = 96 * 1024 * 1024;

interface CacheEntry {
  pdf: Promise<Uint8Array>;
  bytes: number;
}

const holder = globalThis as unknown as { ampwardenPdfPool?: ThreadPool<PdfTask, Uint8Array>; ampwardenPdfCache?: Map<string, CacheEntry> };

function pool(): ThreadPool<PdfTask, Uint8Array> {
  holder.ampwardenPdfPool ??= new ThreadPool<PdfTask, Uint8Array>({
    name: 'PDF',
    threads: 1,
    timeLimitMs: PDF_RENDER_TIME_LIMIT_MS,
    maxQueued: 16,
    create: () => new Worker(new URL('./pdfRenderer.worker.ts', import.meta.url), { resourceLimits: { maxOldGenerationSizeMb: PDF_RENDER_MEMORY_MB } }),
  });
  return holder.ampwardenPdfPool;
}

function cache(): Map<string, CacheEntry> {
  holder.ampwardenPdfCache ??= new Map();
  return holder.ampwardenPdfCache;
}

function evict(entries: Map<string, CacheEntry>): void {
  let total = [...entries.values()].reduce((sum, entry) => sum + entry.bytes, 0);
  for (const [key, entry] of entries) {
    if (entries.size <= CACHE_MAX_ENTRIES && total <= CACHE_MAX_BYTES) break;
    entries.delete(key);
    total -= entry.bytes;
  }
}

async function renderOffThread(sheet: PdfSheet): Promise<Uint8Array> {
  try {
    // Only what the document reads crosses to the thread (structured clone; dates stay dates).
    return await pool().run({ sheet, generatedAtIso: new Date().toISOString() });
  } catch (error) {
    if (error instanceof ThreadTimeLimitError) throw new ApiError(503, 'pdf_timeout', `The PDF took longer than ${PDF_RENDER_TIME_LIMIT_MS / 1000} s to render; try again in a moment.`);
    if (error instanceof ThreadCrashError || error instanceof ThreadTaskError) {
      console.error('ampwarden: PDF rendering failed', error);
      throw new ApiError(500, 'pdf_failed', 'The PDF could not be rendered; the error has been logged.');
    }
    throw error;
  }
}

/** The PDF of this saved state of the sheet: from the cache, or rendered once in the worker thread. */
export function sheetPdf(sheet: PdfSheet & { version: number }): Promise<Uint8Array> {
  const key = `${sheet.id}:${sheet.version}`;
  const entries = cache();
  const hit = entries.get(key);
  if (hit) {
    // Most recently used goes last.
    entries.delete(key);
    entries.set(key, hit);
    return hit.pdf;
  }
  const entry: CacheEntry = { pdf: renderOffThread(sheet), bytes: 0 };
  entries.set(key, entry);
  entry.pdf.then(
    (pdf) => {
      entry.bytes = pdf.byteLength;
      evict(entries);
    },
    // A failed rendering is not kept: the next request tries again.
    () => {
      if (entries.get(key) === entry) entries.delete(key);
    },
  );
  evict(entries);
  return entry.pdf;
}

/**
 * The calculation package of a saved sheet (issue 22): the sheet with its document number,
 * revision table and approver's licence, rendered as above. Every route that hands out a sheet's
 * PDF uses this.
 */
export async function sheetPackagePdf(sheet: PdfSheet & { teamId: string; previousRevisionId: string | null; reviewerId: string | null }): Promise<Uint8Array> {
  return sheetPdf({ ...sheet, calculationPackage: await calculationPackageOf(sheet.teamId, sheet) });
}

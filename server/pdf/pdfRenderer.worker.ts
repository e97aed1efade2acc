/**
 * Worker thread of server/pdf/pdfRenderer.ts: renders one PDF sizing sheet with the same code a
 * request would have run (server/pdf/renderSheetPdf.ts), off the request thread.
 */
import { serveTasks } from '@/server/threads/serve';
import type { PdfTask } from './pdfRenderer';
import { renderSheetPdf } from './renderSheetPdf';

serveTasks(
  async (task: PdfTask) => {
    const rendered = await renderSheetPdf(task.sheet, new Date(task.generatedAtIso));
    // A copy of its own, so that its memory can be handed over instead of copied again.
    return new Uint8Array(rendered);
  },
  (bytes) => [bytes.buffer as ArrayBuffer],
);

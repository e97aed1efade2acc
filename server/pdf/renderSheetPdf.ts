/** Renders the PDF sizing sheet of a saved sheet to bytes (server only). */
import { createElement, type ReactElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { downloadResponse } from '@/server/http/download';
import { registerPdfFonts } from './fonts';
import { SizingSheetDocument, type PdfSheet } from './SizingSheetDocument';

export async function renderSheetPdf(sheet: PdfSheet, generatedAt = new Date()): Promise<Buffer> {
  registerPdfFonts();
  const document = createElement(SizingSheetDocument, { sheet, generatedAt }) as unknown as ReactElement<DocumentProps>;
  return renderToBuffer(document);
}

/** "sizing-sheet-KY-MSB-CH1-rev2.pdf": only characters every file system and mail client keeps. */
export function sheetFileStem(sheet: { circuitTag: string; revision: number }): string {
  const tag = sheet.circuitTag.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'sheet';
  return `sizing-sheet-${tag}-rev${sheet.revision}`;
}

export function pdfResponse(body: Uint8Array, stem: string, disposition: 'inline' | 'attachment' = 'inline'): Response {
  return downloadResponse(body, { fileName: `${stem}.pdf`, kind: 'pdf', disposition, headers: { 'x-robots-tag': 'noindex, nofollow' } });
}

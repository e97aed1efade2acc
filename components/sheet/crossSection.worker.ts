/// <reference lib="webworker" />
// Solves the sheet's cross-section in two dimensions off the main thread (lib/sheet/crossSectionField),
// reporting progress as it goes; the page cancels a solve by terminating this worker.
import { solveSheetCrossSection, type FieldProgress, type FieldReport } from '@/lib/sheet/crossSectionField';
import type { SheetInputs } from '@/lib/sheet/schema';

export interface FieldRequest {
  id: number;
  inputs: SheetInputs;
  candidateId: string;
}

export type FieldMessage =
  | { id: number; kind: 'progress'; progress: FieldProgress }
  | { id: number; kind: 'result'; report: FieldReport }
  | { id: number; kind: 'error'; message: string; field?: string };

const post = (message: FieldMessage) => (self as unknown as Worker).postMessage(message);

self.onmessage = (event: MessageEvent<FieldRequest>) => {
  const { id, inputs, candidateId } = event.data;
  try {
    const report = solveSheetCrossSection(inputs, candidateId, { pictureColumns: 96, onProgress: (progress) => post({ id, kind: 'progress', progress }) });
    post({ id, kind: 'result', report });
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const field = error && typeof error === 'object' && 'field' in error ? String((error as { field: unknown }).field) : undefined;
    post(field ? { id, kind: 'error', message, field } : { id, kind: 'error', message });
  }
};

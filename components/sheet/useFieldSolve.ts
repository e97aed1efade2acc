'use client';
/**
 * "Solve the cross-section" in a Web Worker (crossSection.worker.ts): one solve at a time, its
 * progress as the worker reports it, cancelled by terminating the worker (a new one starts with the
 * next solve). The page never waits: typing goes on while the field is solved.
 *
 * The page marks the request and its answer (`ampwarden:field-start`, `ampwarden:field-result`) so
 * that a browser test can measure a solve as the designer sees it; the worker's own time is in the
 * report (`elapsedMs`).
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import type { FieldProgress, FieldReport } from '@/lib/sheet/crossSectionField';
import type { SheetInputs } from '@/lib/sheet/schema';
import type { FieldMessage } from './crossSection.worker';

export type FieldSolveState =
  | { status: 'idle' }
  | { status: 'running'; candidateId: string; inputsKey: string; progress: FieldProgress | null }
  | { status: 'done'; candidateId: string; inputsKey: string; report: FieldReport }
  | { status: 'error'; candidateId: string; inputsKey: string; message: string; field?: string }
  | { status: 'cancelled'; candidateId: string };

/** What a field result depends on: the inputs without the designer's notes. */
export function fieldInputsKey(inputs: SheetInputs): string {
  return JSON.stringify({ ...inputs, notes: '' });
}

function mark(name: string) {
  try {
    performance.mark(name);
  } catch {
    // marks are a measuring aid only
  }
}

export function useFieldSolve(): { state: FieldSolveState; run: (inputs: SheetInputs, candidateId: string) => void; cancel: () => void } {
  const [state, setState] = useState<FieldSolveState>({ status: 'idle' });
  const workerRef = useRef<Worker | null>(null);
  const idRef = useRef(0);
  const requestRef = useRef<{ id: number; candidateId: string; inputsKey: string } | null>(null);

  const stop = useCallback(() => {
    workerRef.current?.terminate();
    workerRef.current = null;
  }, []);

  useEffect(() => stop, [stop]);

  const run = useCallback(
    (inputs: SheetInputs, candidateId: string) => {
      // A solve still running is superseded: its worker goes, with its work.
      if (requestRef.current) stop();
      const id = ++idRef.current;
      const inputsKey = fieldInputsKey(inputs);
      requestRef.current = { id, candidateId, inputsKey };
      let worker: Worker;
      try {
        worker = workerRef.current ?? new Worker(new URL('./crossSection.worker.ts', import.meta.url), { type: 'module' });
      } catch (error) {
        requestRef.current = null;
        setState({ status: 'error', candidateId, inputsKey, message: `This browser could not start a background worker for the solve (${error instanceof Error ? error.message : String(error)}).` });
        return;
      }
      if (!workerRef.current) {
        workerRef.current = worker;
        worker.addEventListener('message', (event: MessageEvent<FieldMessage>) => {
          const request = requestRef.current;
          const message = event.data;
          if (!request || message.id !== request.id) return;
          if (message.kind === 'progress') {
            setState({ status: 'running', candidateId: request.candidateId, inputsKey: request.inputsKey, progress: message.progress });
            return;
          }
          requestRef.current = null;
          mark('ampwarden:field-result');
          if (message.kind === 'result') setState({ status: 'done', candidateId: request.candidateId, inputsKey: request.inputsKey, report: message.report });
          else setState({ status: 'error', candidateId: request.candidateId, inputsKey: request.inputsKey, message: message.message, ...(message.field ? { field: message.field } : {}) });
        });
        worker.addEventListener('error', (event) => {
          const request = requestRef.current;
          requestRef.current = null;
          stop();
          if (request) setState({ status: 'error', candidateId: request.candidateId, inputsKey: request.inputsKey, message: `The background solve stopped: ${event.message || 'the worker failed'}.` });
        });
      }
      setState({ status: 'running', candidateId, inputsKey, progress: null });
      mark('ampwarden:field-start');
      worker.postMessage({ id, inputs, candidateId });
    },
    [stop],
  );

  const cancel = useCallback(() => {
    const request = requestRef.current;
    if (!request) return;
    requestRef.current = null;
    stop();
    setState({ status: 'cancelled', candidateId: request.candidateId });
  }, [stop]);

  return { state, run, cancel };
}

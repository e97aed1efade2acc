'use client';
/**
 * Re-computes the sheet in the browser on every edit, with the same lib/sheet → lib/electrical →
 * lib/thermal code the server runs on save. The work runs in a Web Worker (where one cannot start,
 * on the main thread). There is no debounce: an edit is sent at once when the worker is idle;
 * while it is busy only the NEWEST edit waits (edits in between are superseded, never computed),
 * and a result that belongs to superseded inputs is dropped instead of shown.
 *
 * Each result is marked with `performance.mark('ampwarden:result')` (and the edit that caused it
 * with 'ampwarden:edit') so that a browser test can measure edit-to-result time.
 */
import { useEffect, useRef, useState } from 'react';
import { computeSheetWithCurves, type HotSpotCurve, type SheetComputation } from '@/lib/sheet/compute';
import { sheetInputsSchema, type SheetInputs } from '@/lib/sheet/schema';

export interface LiveResult {
  computation: SheetComputation | null;
  curves: HotSpotCurve[];
  /** The inputs the result belongs to (a newer edit may be on its way). */
  inputsKey: string | null;
  computing: boolean;
  elapsedMs: number | null;
  /** The inputs are not valid yet: the result shown is from the last valid inputs. */
  invalid: boolean;
  /** Where the last result was computed: a background worker, or the page itself when no worker could start. */
  engine: 'worker' | 'page' | null;
}

interface Payload {
  computation: SheetComputation;
  curves: HotSpotCurve[];
  elapsedMs: number;
}

interface Request {
  id: number;
  key: string;
  inputs: SheetInputs;
  withCurves: boolean;
}

function computeHere(inputs: SheetInputs, withCurves: boolean): Payload {
  const started = performance.now();
  const { computation, curves } = computeSheetWithCurves(inputs, withCurves);
  return { computation, curves, elapsedMs: performance.now() - started };
}

function mark(name: string, key: string) {
  try {
    performance.mark(name, { detail: { key } });
  } catch {
    // marks are a measuring aid only
  }
}

export function useLiveComputation(inputs: SheetInputs, options: { enabled: boolean; withCurves: boolean }): LiveResult {
  const [result, setResult] = useState<LiveResult>({ computation: null, curves: [], inputsKey: null, computing: false, elapsedMs: null, invalid: false, engine: null });
  const workerRef = useRef<Worker | null>(null);
  const latestIdRef = useRef(0);
  const inFlightRef = useRef<Request | null>(null);
  const pendingRef = useRef<Request | null>(null);
  const key = JSON.stringify(inputs);

  // Shows a result unless a newer edit superseded it; then sends the newest waiting edit.
  const finishRef = useRef<(request: Request, payload: Payload, engine: 'worker' | 'page') => void>(() => {});
  const sendRef = useRef<(request: Request) => void>(() => {});

  finishRef.current = (request, payload, engine) => {
    inFlightRef.current = null;
    if (request.id === latestIdRef.current) {
      mark('ampwarden:result', request.key);
      setResult({ computation: payload.computation, curves: payload.curves, elapsedMs: payload.elapsedMs, inputsKey: request.key, computing: false, invalid: false, engine });
    }
    const next = pendingRef.current;
    pendingRef.current = null;
    if (next) sendRef.current(next);
  };

  sendRef.current = (request) => {
    inFlightRef.current = request;
    const worker = workerRef.current;
    if (worker) {
      worker.postMessage({ id: request.id, inputs: request.inputs, withCurves: request.withCurves });
      return;
    }
    // No worker: compute on the page after the browser has painted the keystroke.
    setTimeout(() => finishRef.current(request, computeHere(request.inputs, request.withCurves), 'page'), 0);
  };

  useEffect(() => {
    let worker: Worker | null = null;
    try {
      worker = new Worker(new URL('./compute.worker.ts', import.meta.url), { type: 'module' });
    } catch {
      worker = null;
    }
    if (worker) {
      worker.addEventListener('message', (event: MessageEvent) => {
        const request = inFlightRef.current;
        if (request && event.data?.id === request.id) finishRef.current(request, event.data as Payload, 'worker');
      });
      worker.addEventListener('error', () => {
        // The worker failed: compute the request in hand on the page, and every later one too.
        workerRef.current?.terminate();
        workerRef.current = null;
        const request = inFlightRef.current;
        if (request) finishRef.current(request, computeHere(request.inputs, request.withCurves), 'page');
      });
    }
    workerRef.current = worker;
    return () => {
      worker?.terminate();
      workerRef.current = null;
      // A request the terminated worker held will never answer: let the next edit go straight out.
      inFlightRef.current = null;
    };
  }, []);

  useEffect(() => {
    if (!options.enabled) return;
    const parsed = sheetInputsSchema.safeParse(inputs);
    if (!parsed.success) {
      setResult((r) => ({ ...r, invalid: true, computing: false }));
      return;
    }
    mark('ampwarden:edit', key);
    setResult((r) => ({ ...r, invalid: false, computing: true }));
    const request: Request = { id: ++latestIdRef.current, key, inputs: parsed.data, withCurves: options.withCurves };
    if (inFlightRef.current) pendingRef.current = request; // supersedes any edit still waiting
    else sendRef.current(request);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- `key` stands for the inputs
  }, [key, options.enabled, options.withCurves]);

  return result;
}

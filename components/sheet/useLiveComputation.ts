'use client';
/**
 * Re-computes the sheet in the browser whenever its inputs change (debounced), with the same
 * lib/sheet → lib/electrical → lib/thermal code the server runs on save. The work runs in a Web
 * Worker; where one cannot start, it runs on the main thread instead.
 */
import { useEffect, useRef, useState } from 'react';
import { computeSheet, hotSpotCurve, type HotSpotCurve, type SheetComputation } from '@/lib/sheet/compute';
import { sheetInputsSchema, type SheetInputs } from '@/lib/sheet/schema';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';

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

const DEBOUNCE_MS = 200;

function computeHere(inputs: SheetInputs, withCurves: boolean) {
  const started = performance.now();
  const computation = computeSheet(inputs);
  const curves = withCurves && computation.ok
    ? computation.comparison.evaluations.filter((e): e is CandidateEvaluationOk => e.ok).map((e) => hotSpotCurve(inputs, e))
    : [];
  return { computation, curves, elapsedMs: performance.now() - started };
}

export function useLiveComputation(inputs: SheetInputs, options: { enabled: boolean; withCurves: boolean }): LiveResult {
  const [result, setResult] = useState<LiveResult>({ computation: null, curves: [], inputsKey: null, computing: false, elapsedMs: null, invalid: false, engine: null });
  const workerRef = useRef<Worker | null>(null);
  const requestRef = useRef(0);
  const key = JSON.stringify(inputs);

  useEffect(() => {
    try {
      workerRef.current = new Worker(new URL('./compute.worker.ts', import.meta.url), { type: 'module' });
    } catch {
      workerRef.current = null;
    }
    return () => {
      workerRef.current?.terminate();
      workerRef.current = null;
    };
  }, []);

  useEffect(() => {
    if (!options.enabled) return;
    const parsed = sheetInputsSchema.safeParse(inputs);
    if (!parsed.success) {
      setResult((r) => ({ ...r, invalid: true, computing: false }));
      return;
    }
    setResult((r) => ({ ...r, invalid: false, computing: true }));
    const timer = setTimeout(() => {
      const id = ++requestRef.current;
      const worker = workerRef.current;
      const finish = (payload: { computation: SheetComputation; curves: HotSpotCurve[]; elapsedMs: number }, engine: 'worker' | 'page') => {
        if (id !== requestRef.current) return; // a newer edit superseded this one
        setResult({ computation: payload.computation, curves: payload.curves, elapsedMs: payload.elapsedMs, inputsKey: key, computing: false, invalid: false, engine });
      };
      if (worker) {
        const onMessage = (event: MessageEvent) => {
          if (event.data?.id !== id) return;
          worker.removeEventListener('message', onMessage);
          finish(event.data, 'worker');
        };
        const onError = () => {
          worker.removeEventListener('error', onError);
          workerRef.current = null;
          finish(computeHere(parsed.data, options.withCurves), 'page');
        };
        worker.addEventListener('message', onMessage);
        worker.addEventListener('error', onError);
        worker.postMessage({ id, inputs: parsed.data, withCurves: options.withCurves });
      } else {
        finish(computeHere(parsed.data, options.withCurves), 'page');
      }
    }, DEBOUNCE_MS);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- `key` stands for the inputs
  }, [key, options.enabled, options.withCurves]);

  return result;
}

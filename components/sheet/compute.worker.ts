/// <reference lib="webworker" />
// Runs the sizing library off the main thread so that typing never waits for the solver.
import { computeSheetWithCurves } from '@/lib/sheet/compute';
import type { SheetInputs } from '@/lib/sheet/schema';

export interface ComputeRequest {
  id: number;
  inputs: SheetInputs;
  withCurves: boolean;
}

self.onmessage = (event: MessageEvent<ComputeRequest>) => {
  const { id, inputs, withCurves } = event.data;
  const started = performance.now();
  const { computation, curves } = computeSheetWithCurves(inputs, withCurves);
  (self as unknown as Worker).postMessage({ id, computation, curves, elapsedMs: performance.now() - started });
};

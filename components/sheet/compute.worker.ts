/// <reference lib="webworker" />
// Runs the sizing library off the main thread so that typing never waits for the solver.
import { computeSheet, hotSpotCurve, type HotSpotCurve } from '@/lib/sheet/compute';
import type { SheetInputs } from '@/lib/sheet/schema';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';

export interface ComputeRequest {
  id: number;
  inputs: SheetInputs;
  withCurves: boolean;
}

self.onmessage = (event: MessageEvent<ComputeRequest>) => {
  const { id, inputs, withCurves } = event.data;
  const started = performance.now();
  const computation = computeSheet(inputs);
  let curves: HotSpotCurve[] = [];
  if (withCurves && computation.ok) {
    curves = computation.comparison.evaluations
      .filter((e): e is CandidateEvaluationOk => e.ok)
      .map((e) => hotSpotCurve(inputs, e));
  }
  (self as unknown as Worker).postMessage({ id, computation, curves, elapsedMs: performance.now() - started });
};

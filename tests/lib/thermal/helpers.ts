/** Shared helpers for the thermal tests (not a test file itself). */
import { expect } from 'vitest';
import type { SteadyResult } from '@/lib/thermal';

/** Largest |T_numerical − T_exact| over the nodes, K. */
export function maxNodalError(result: SteadyResult, exact: (position: number) => number): number {
  expect(result.converged).toBe(true);
  expect(result.temperatures.length).toBe(result.positions.length);
  let worst = 0;
  result.positions.forEach((x, i) => {
    worst = Math.max(worst, Math.abs(result.temperatures[i] - exact(x)));
  });
  return worst;
}

/** Observed orders log2(e_N / e_2N) for errors on grids that double each time. */
export function observedOrders(errors: number[]): number[] {
  return errors.slice(1).map((e, i) => Math.log2(errors[i] / e));
}

/** Path of the first NaN found anywhere inside a value, or undefined. */
export function findNaN(value: unknown, path = 'result'): string | undefined {
  if (typeof value === 'number') return Number.isNaN(value) ? path : undefined;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = findNaN(value[i], `${path}[${i}]`);
      if (found) return found;
    }
    return undefined;
  }
  if (typeof value === 'object' && value !== null) {
    for (const [key, v] of Object.entries(value)) {
      const found = findNaN(v, `${path}.${key}`);
      if (found) return found;
    }
  }
  return undefined;
}

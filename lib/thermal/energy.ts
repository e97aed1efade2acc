/**
 * Energy balance of a solution (physics.md §1): heat generated = heat leaving through the
 * boundaries (+ heat stored, transient). Generation is re-evaluated at the final temperatures and
 * surface losses from the non-linear surface law, so a closed balance confirms the iteration
 * converged to a solution of the actual equations, not just to a fixed point of its linearisation.
 */
import { heatLeaving } from './boundary';
import type { SolverContext } from './iterate';
import { sourceDensity, type JouleCoefficients } from './source';

export interface EnergyBalance {
  generated: number;
  leavingInner: number;
  leavingOuter: number;
  stored: number;
  /** |generated − leaving − stored| / largest term (0 when every term is 0). */
  residual: number;
}

export function energyBalance(
  ctx: SolverContext,
  joule: JouleCoefficients | undefined,
  temperatures: Float64Array,
  surfaceInner: number,
  surfaceOuter: number,
  previous?: Float64Array,
): EnergyBalance {
  const { mesh, problem, capacityRate } = ctx;
  const n = mesh.cellCount;
  let generated = 0;
  let stored = 0;
  for (let i = 0; i < n; i++) {
    if (mesh.generating[i]) generated += sourceDensity(problem.source, joule, temperatures[i]) * mesh.volumes[i];
    if (capacityRate) stored += capacityRate[i] * (temperatures[i] - previous![i]);
  }
  const leavingInner = heatLeaving(ctx.inner, temperatures[0], surfaceInner);
  const leavingOuter = heatLeaving(ctx.outer, temperatures[n - 1], surfaceOuter);
  const scale = Math.max(Math.abs(generated), Math.abs(leavingInner), Math.abs(leavingOuter), Math.abs(stored));
  const imbalance = Math.abs(generated - leavingInner - leavingOuter - stored);
  const residual = scale > 0 ? imbalance / scale : 0;
  return { generated, leavingInner, leavingOuter, stored, residual: Number.isFinite(residual) ? residual : Infinity };
}

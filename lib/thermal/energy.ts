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

/** All temperatures as rises above ctx.reference (°C = reference + rise). */
export function energyBalance(
  ctx: SolverContext,
  joule: JouleCoefficients | undefined,
  rises: Float64Array,
  surfaceInnerRise: number,
  surfaceOuterRise: number,
  previousRises?: Float64Array,
): EnergyBalance {
  const { mesh, problem, capacityRate, reference } = ctx;
  const n = mesh.cellCount;
  let generated = 0;
  let stored = 0;
  for (let i = 0; i < n; i++) {
    if (mesh.generating[i]) generated += sourceDensity(problem.source, joule, reference + rises[i]) * mesh.volumes[i];
    if (capacityRate) stored += capacityRate[i] * (rises[i] - previousRises![i]);
  }
  const leavingInner = heatLeaving(ctx.inner, rises[0], surfaceInnerRise, reference);
  const leavingOuter = heatLeaving(ctx.outer, rises[n - 1], surfaceOuterRise, reference);
  const scale = Math.max(Math.abs(generated), Math.abs(leavingInner), Math.abs(leavingOuter), Math.abs(stored));
  const imbalance = Math.abs(generated - leavingInner - leavingOuter - stored);
  const residual = scale > 0 ? imbalance / scale : 0;
  return { generated, leavingInner, leavingOuter, stored, residual: Number.isFinite(residual) ? residual : Infinity };
}

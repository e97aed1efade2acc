/**
 * Energy balance of a solution (physics.md §1): heat generated = heat leaving through the
 * boundaries (+ heat lost sideways along a bar run, + heat stored over a time step). Generation is
 * re-evaluated at the final temperatures and the surface and sideways losses from their
 * non-linear laws, so a closed balance confirms the iteration converged to a solution of the
 * actual equations, not just to a fixed point of its linearisation.
 */
import type { SolverContext } from './assembly';
import { heatLeaving } from './boundary';
import { sidewaysAmbient, sidewaysLossPerVolume } from './sideways';
import { generatedHeat, type JouleCoefficients } from './source';

/**
 * Heat flows below 1e-12 W (per metre of cable or per m² of slab) have no physical meaning here;
 * the balance is judged relative to the largest flow, but never to less than this, so that a body
 * at rest (all flows ~0, or subnormal) does not fail the check on round-off.
 */
const ENERGY_SCALE_FLOOR_W = 1e-12;

export interface EnergyBalance {
  /** Volumetric source and point heat. */
  generated: number;
  leavingInner: number;
  leavingOuter: number;
  /** Bar run: heat given to the air along the run (0 otherwise). */
  leavingSideways: number;
  stored: number;
  /** |generated − leaving − stored| / max(largest term, 1e-12 W). */
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
  const { mesh, problem, capacityRate, reference, sourceVolumes, pointHeat, sideways } = ctx;
  const n = mesh.cellCount;
  let generated = generatedHeat(problem.source, joule, reference, rises, sourceVolumes);
  if (pointHeat) for (let i = 0; i < n; i++) generated += pointHeat[i];
  let stored = 0;
  if (capacityRate) {
    for (let i = 0; i < n; i++) stored += capacityRate[i] * (rises[i] - previousRises![i]);
  }
  let leavingSideways = 0;
  if (sideways) {
    const ambientRise = sidewaysAmbient(sideways) - reference;
    for (let i = 0; i < n; i++) {
      const rise = rises[i] - ambientRise;
      leavingSideways += sidewaysLossPerVolume(sideways, rise) * rise * mesh.volumes[i];
    }
  }
  const leavingInner = heatLeaving(ctx.inner, rises[0], surfaceInnerRise, reference);
  const leavingOuter = heatLeaving(ctx.outer, rises[n - 1], surfaceOuterRise, reference);
  // Absorbed (solar) heat enters through a surface and is netted into its "leaving" figure; it
  // still belongs in the scale, or a sunlit body without current (net flows ≈ 0) could never pass.
  let absorbed = 0;
  for (const side of [ctx.inner, ctx.outer]) {
    if (side.spec.kind === 'surface') absorbed += side.exchangeArea * side.spec.absorbedFlux;
  }
  const scale = Math.max(
    Math.abs(generated),
    Math.abs(leavingInner),
    Math.abs(leavingOuter),
    Math.abs(leavingSideways),
    Math.abs(stored),
    absorbed,
    ENERGY_SCALE_FLOOR_W,
  );
  const imbalance = Math.abs(generated - leavingInner - leavingOuter - leavingSideways - stored);
  const residual = imbalance / scale;
  return { generated, leavingInner, leavingOuter, leavingSideways, stored, residual: Number.isFinite(residual) ? residual : Infinity };
}

/**
 * The honest packaging of a solve's outcome into a SteadyResult (physics.md §7 and README "What a
 * result means"): temperatures only when a state was established, +Infinity wherever a number is
 * required otherwise.
 */
import type { SolverContext } from './assembly';
import { faceTemperature } from './boundary';
import type { IterationOutcome } from './iterate';
import type { NormalizedBoundary } from './normalized';
import { surfaceFlux } from './surface';
import type { RunawayReport, SteadyResult, SurfaceDiagnostics, ThermalFlag } from './types';

/**
 * Diagnostics of one surface at its final temperature (one evaluation); its validity flags are
 * appended to `flags`.
 */
function describeSurface(
  side: 'inner' | 'outer',
  spec: NormalizedBoundary,
  surfaceC: number,
  flags: ThermalFlag[],
): SurfaceDiagnostics | undefined {
  if (spec.kind !== 'surface') return undefined;
  const e = surfaceFlux(spec, surfaceC);
  const c = e.convection;
  const diagnostics: SurfaceDiagnostics = {
    temperature: surfaceC,
    hConv: e.hConv,
    hRad: e.hRad,
    heatFlux: e.netFlux,
    correlation: c ? c.correlation : spec.fixedH > 0 ? 'fixed h' : 'no convection',
    ...(c?.rayleigh !== undefined ? { rayleigh: c.rayleigh } : {}),
    ...(c?.reynolds !== undefined ? { reynolds: c.reynolds } : {}),
    ...(c?.nusselt !== undefined ? { nusselt: c.nusselt } : {}),
    ...(c?.filmTemperatureK !== undefined ? { filmTemperatureK: c.filmTemperatureK } : {}),
    inRange: c ? c.inRange : true,
  };
  if (c && !c.inRange) {
    const group =
      c.rayleigh !== undefined ? `Ra = ${c.rayleigh.toPrecision(3)}` : c.reynolds !== undefined ? `Re = ${c.reynolds.toPrecision(3)}` : '';
    flags.push({
      code: 'correlation-out-of-range',
      severity: 'warning',
      message: `${side} surface: ${c.correlation} used outside its stated range (${c.validRange ?? 'n/a'}; ${group}).`,
    });
  }
  if (c && c.airPropertiesInTable === false) {
    flags.push({
      code: 'air-properties-out-of-table',
      severity: 'warning',
      message: `${side} surface: film temperature ${c.filmTemperatureK?.toFixed(1)} K is outside the air table (200–1000 K); properties were held at the nearest end.`,
    });
  }
  return diagnostics;
}

/** Plain number[] (JSON-friendly) from a typed array; sized once rather than grown by push. */
export function plain(values: Float64Array): number[] {
  const out = new Array<number>(values.length);
  for (let i = 0; i < values.length; i++) out[i] = values[i];
  return out;
}

function layerBoundsCopy(ctx: SolverContext): SteadyResult['layerBounds'] {
  return ctx.mesh.layerBounds.map((b) => (b.name !== undefined ? { name: b.name, from: b.from, to: b.to } : { from: b.from, to: b.to }));
}

/** Sets the per-geometry heat figure (W/m for a cylinder, W/m² for a slab). */
function setHeatGenerated(result: SteadyResult, cylinder: boolean, value: number): void {
  if (cylinder) result.heatGeneratedWPerM = value;
  else result.heatGeneratedWPerM2 = value;
}

export function convergedResult(ctx: SolverContext, outcome: IterationOutcome, flags: ThermalFlag[], runawayOnsetCurrentA?: number): SteadyResult {
  const { mesh, problem } = ctx;
  const n = mesh.cellCount;
  const t = outcome.temperatures;
  const faceInner = faceTemperature(ctx.inner, t[0], outcome.surfaceC.inner);
  const faceOuter = faceTemperature(ctx.outer, t[n - 1], outcome.surfaceC.outer);

  let hot = 0;
  for (let i = 1; i < n; i++) if (t[i] > t[hot]) hot = i;
  let hotSpot = { temperature: t[hot], position: mesh.nodes[hot] };
  // A face can be the hottest point (heat entering there); a symmetry face carries no new value.
  if (problem.inner.kind !== 'symmetry' && faceInner > hotSpot.temperature) hotSpot = { temperature: faceInner, position: ctx.inner.position };
  if (problem.outer.kind !== 'symmetry' && faceOuter > hotSpot.temperature) hotSpot = { temperature: faceOuter, position: ctx.outer.position };

  const allFlags = flags.slice();
  const innerSurface = describeSurface('inner', problem.inner, outcome.surfaceC.inner, allFlags);
  const outerSurface = describeSurface('outer', problem.outer, outcome.surfaceC.outer, allFlags);
  if (hotSpot.temperature > problem.options.temperatureLimit) {
    allFlags.push({
      code: 'above-temperature-limit',
      severity: 'warning',
      message: `Hot spot ${hotSpot.temperature.toFixed(1)} °C exceeds ${problem.options.temperatureLimit} °C: a solution of the model, far outside any material's validity.`,
    });
  }
  const e = outcome.energy;
  const cylinder = mesh.kind === 'cylinder';
  const surface: SteadyResult['surface'] = {};
  if (innerSurface) surface.inner = innerSurface;
  if (outerSurface) surface.outer = outerSurface;
  // One literal with every field (no spreads): cheaper to build, and the same shape every time.
  const result: SteadyResult = {
    positions: plain(mesh.nodes),
    temperatures: plain(t),
    hotSpot,
    iterations: outcome.iterations,
    converged: true,
    energyResidual: e.residual,
    geometry: mesh.kind,
    surfaceTemperature: faceOuter,
    faceTemperatures: { inner: faceInner, outer: faceOuter },
    heatBalance: {
      unit: cylinder ? 'W/m' : 'W/m²',
      generated: e.generated,
      leavingInner: e.leavingInner,
      leavingOuter: e.leavingOuter,
      stored: e.stored,
    },
    linearisation: outcome.linearisation,
    linearisationCounts: outcome.linearisationCounts,
    tridiagonalSolves: outcome.tridiagonalSolves,
    surface,
    layerBounds: layerBoundsCopy(ctx),
    flags: allFlags,
  };
  setHeatGenerated(result, cylinder, e.generated);
  if (runawayOnsetCurrentA !== undefined) result.runawayOnsetCurrentA = runawayOnsetCurrentA;
  return result;
}

/**
 * No established steady state: no temperatures at all, +Infinity wherever a number is required
 * (so that any "is it below the limit" test fails safe), the runaway report if there is one.
 */
export function unboundedResult(
  ctx: SolverContext,
  args: {
    iterations: number;
    tridiagonalSolves: number;
    hotSpotPosition: number;
    linearisation: SteadyResult['linearisation'];
    linearisationCounts: SteadyResult['linearisationCounts'];
    flags: ThermalFlag[];
    runaway?: RunawayReport;
    lastIterate?: Float64Array;
    runawayOnsetCurrentA?: number;
  },
): SteadyResult {
  const cylinder = ctx.mesh.kind === 'cylinder';
  const known = (b: NormalizedBoundary): number => (b.kind === 'temperature' ? b.value : Infinity);
  const result: SteadyResult = {
    positions: plain(ctx.mesh.nodes),
    temperatures: [],
    hotSpot: { temperature: Infinity, position: args.hotSpotPosition },
    iterations: args.iterations,
    converged: false,
    energyResidual: Infinity,
    geometry: ctx.mesh.kind,
    surfaceTemperature: known(ctx.problem.outer),
    faceTemperatures: { inner: known(ctx.problem.inner), outer: known(ctx.problem.outer) },
    heatBalance: { unit: cylinder ? 'W/m' : 'W/m²', generated: Infinity, leavingInner: Infinity, leavingOuter: Infinity, stored: 0 },
    linearisation: args.linearisation,
    linearisationCounts: args.linearisationCounts,
    tridiagonalSolves: args.tridiagonalSolves,
    surface: {},
    layerBounds: layerBoundsCopy(ctx),
    flags: args.flags,
  };
  setHeatGenerated(result, cylinder, Infinity);
  if (args.runaway) result.runaway = args.runaway;
  if (args.lastIterate) result.lastIterate = plain(args.lastIterate);
  if (args.runawayOnsetCurrentA !== undefined) result.runawayOnsetCurrentA = args.runawayOnsetCurrentA;
  return result;
}

export function peakPosition(ctx: SolverContext, t: Float64Array): number {
  let peak = 0;
  for (let i = 1; i < t.length; i++) if (t[i] > t[peak]) peak = i;
  return ctx.mesh.nodes[peak];
}

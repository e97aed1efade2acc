/**
 * Entry points: steady and transient solves, and the honest packaging of their results.
 */
import { faceTemperature } from './boundary';
import { surfaceFlux } from './surface';
import { ThermalInputError } from './errors';
import {
  conductanceMatrix,
  contextStoreSize,
  createContext,
  hasLinearSurroundings,
  iterate,
  type IterationOutcome,
  type SolverContext,
} from './iterate';
import { borrowScratch } from './pool';
import { onsetCurrent, slowestModePeak, smallestGeneralizedEigenvalue } from './runaway';
import type {
  RunawayReport,
  SteadyResult,
  SurfaceDiagnostics,
  ThermalFlag,
  ThermalProblem,
  TransientProblem,
  TransientResult,
} from './types';
import {
  requirePositive,
  requirePositiveInteger,
  requireRecord,
  requireTemperature,
  validateProblem,
  type NormalizedBoundary,
  type NormalizedProblem,
} from './validate';

/** Relative width of the current bracket at which the bisection for onset stops. */
const ONSET_BISECTION_TOLERANCE = 1e-4;

// ---------------------------------------------------------------------------------------------
// Result packaging
// ---------------------------------------------------------------------------------------------

function referenceTemperature(b: NormalizedBoundary): number | undefined {
  if (b.kind === 'temperature') return b.value;
  if (b.kind === 'surface') return b.ambient;
  return undefined;
}

/**
 * The temperature of a body with no heat input (no source, no absorbed or imposed flux) whose
 * boundaries all refer to one temperature; undefined when anything drives heat.
 */
function undrivenTemperature(problem: NormalizedProblem): number | undefined {
  const s = problem.source;
  if ((s.kind === 'uniform' && s.q !== 0) || (s.kind === 'joule' && s.current !== 0)) return undefined;
  const refs: number[] = [];
  for (const b of [problem.inner, problem.outer]) {
    if (b.kind === 'flux' && b.value !== 0) return undefined;
    if (b.kind === 'temperature') refs.push(b.value);
    if (b.kind === 'surface') {
      if (b.absorbedFlux !== 0) return undefined;
      refs.push(b.ambient);
      if (b.emissivity > 0) refs.push(b.surroundings);
    }
  }
  return refs.length > 0 && refs.every((t) => t === refs[0]) ? refs[0] : undefined;
}

/** Starting temperature for a steady solve: the mean of the boundaries' reference temperatures. */
function steadyStart(problem: NormalizedProblem): number {
  const a = referenceTemperature(problem.inner);
  const b = referenceTemperature(problem.outer);
  if (a !== undefined && b !== undefined) return 0.5 * (a + b);
  return a ?? b ?? 20;
}

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
function plain(values: Float64Array): number[] {
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

function convergedResult(ctx: SolverContext, outcome: IterationOutcome, flags: ThermalFlag[], runawayOnsetCurrentA?: number): SteadyResult {
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
function unboundedResult(
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

function peakPosition(ctx: SolverContext, t: Float64Array): number {
  let peak = 0;
  for (let i = 1; i < t.length; i++) if (t[i] > t[peak]) peak = i;
  return ctx.mesh.nodes[peak];
}

// ---------------------------------------------------------------------------------------------
// Steady
// ---------------------------------------------------------------------------------------------

/**
 * Exact onset for temperature-independent surroundings (runaway.ts). Returns undefined when the
 * source cannot run away (uniform, α = 0) or the surroundings are temperature-dependent.
 */
function eigenvalueOnset(ctx: SolverContext): { currentA: number; peakPosition: number } | undefined {
  const { problem, mesh } = ctx;
  const source = problem.source;
  if (source.kind !== 'joule' || source.alpha20 === 0 || !hasLinearSurroundings(problem)) return undefined;
  const { diagonal, offDiagonal } = conductanceMatrix(ctx);
  const weights = new Float64Array(mesh.cellCount);
  for (let i = 0; i < mesh.cellCount; i++) weights[i] = mesh.generating[i] ? mesh.volumes[i] : 0;
  const lambdaMin = smallestGeneralizedEigenvalue(diagonal, offDiagonal, weights);
  const peak = slowestModePeak(diagonal, offDiagonal, weights, lambdaMin);
  return {
    currentA: onsetCurrent({ lambdaMin, area: source.area, rho20: source.rho20, alpha20: source.alpha20, acFactor: source.acFactor }),
    peakPosition: mesh.nodes[peak],
  };
}

/** A converged state whose hottest node is within the temperature limit. */
function boundedBelowLimit(ctx: SolverContext, outcome: IterationOutcome): boolean {
  if (outcome.status !== 'converged') return false;
  const t = outcome.temperatures;
  let hottest = -Infinity;
  for (let i = 0; i < t.length; i++) hottest = Math.max(hottest, t[i]);
  return hottest <= ctx.problem.options.temperatureLimit;
}

/**
 * Temperature-dependent surroundings have no closed existence criterion (and with radiation,
 * whose loss grows as T⁴, a steady state exists mathematically at any current, however absurd its
 * temperature). The question answered is therefore: is there a steady state with the hot spot
 * below the temperature limit? Bisect on current for the largest current for which there is,
 * between 0 A (always) and the requested current (known not to). The hot spot rises with
 * current, so the answer is monotone and the bisection well posed.
 */
function bisectOnset(ctx: SolverContext, failingCurrentA: number, start: number): { currentA: number; peakPosition: number; solves: number } {
  let lo = 0;
  let hi = failingCurrentA;
  let solves = 0;
  let peak = ctx.mesh.nodes[0];
  while (hi - lo > ONSET_BISECTION_TOLERANCE * hi) {
    const mid = 0.5 * (lo + hi);
    const outcome = iterate(ctx, { start, currentA: mid });
    solves += outcome.tridiagonalSolves;
    if (boundedBelowLimit(ctx, outcome)) {
      lo = mid;
      peak = peakPosition(ctx, outcome.temperatures);
    } else {
      hi = mid;
    }
  }
  return { currentA: lo, peakPosition: peak, solves };
}

export function solveSteady(problem: ThermalProblem): SteadyResult {
  const normalized = validateProblem(problem, true);
  const scratch = borrowScratch(contextStoreSize(normalized));
  try {
    return steady(normalized, createContext(normalized, undefined, scratch));
  } finally {
    scratch.release();
  }
}

function steady(normalized: NormalizedProblem, ctx: SolverContext): SteadyResult {
  const flags = [...normalized.assumptions];

  const onset = eigenvalueOnset(ctx);
  const source = normalized.source;
  if (onset && source.kind === 'joule' && source.current >= onset.currentA) {
    return unboundedResult(ctx, {
      iterations: 0,
      tridiagonalSolves: 0,
      hotSpotPosition: onset.peakPosition,
      linearisation: normalized.options.linearisation,
      linearisationCounts: { tangent: 0, lagged: 0 },
      flags: [
        ...flags,
        {
          code: 'thermal-runaway',
          severity: 'warning',
          message: `No steady state: at ${source.current} A Joule heating grows with temperature faster than the surroundings remove it (onset ${onset.currentA.toPrecision(6)} A).`,
        },
      ],
      runaway: { current: onset.currentA, criterion: 'eigenvalue' },
      runawayOnsetCurrentA: onset.currentA,
    });
  }

  const start = steadyStart(normalized);
  // With nothing driving heat, the steady state is the one reference temperature everywhere;
  // linearising the surfaces there (instead of 10 K above) lets one pass confirm it, where a
  // Newton iteration towards ΔT = 0 — a root at which h itself vanishes for some correlations —
  // would only creep.
  const undriven = undrivenTemperature(normalized);
  const outcome = iterate(ctx, undriven === undefined ? { start } : { start, surfaceStart: { inner: undriven, outer: undriven } });

  // With fixed surroundings the eigenvalue test above has already settled existence, exactly;
  // such a result is reported even above the limit (flagged), and a lagged iteration that
  // climbed past the limit below the onset is not a runaway. With temperature-dependent
  // surroundings the limit defines the question (see bisectOnset).
  const temperatureDependent = source.kind === 'joule' && !onset && !hasLinearSurroundings(normalized);
  // Runaway means growth past the limit (diverged) or a steady state above it — never merely an
  // iteration that ran out of passes, which is reported as not converged below.
  const unbounded = outcome.status === 'diverged' || (outcome.status === 'converged' && !boundedBelowLimit(ctx, outcome));
  if (temperatureDependent && unbounded) {
    const found = bisectOnset(ctx, source.current, start);
    return unboundedResult(ctx, {
      iterations: outcome.iterations,
      tridiagonalSolves: outcome.tridiagonalSolves + found.solves,
      hotSpotPosition: found.peakPosition,
      linearisation: outcome.linearisation,
      linearisationCounts: outcome.linearisationCounts,
      flags: [
        ...flags,
        {
          code: 'thermal-runaway',
          severity: 'warning',
          message: `No steady state below ${normalized.options.temperatureLimit} °C at ${source.current} A; the largest current with one is ${found.currentA.toPrecision(5)} A (bisection on current).`,
        },
      ],
      runaway: { current: found.currentA, criterion: 'temperature-limit' },
    });
  }
  if (outcome.status === 'converged') return convergedResult(ctx, outcome, flags, onset?.currentA);

  return unboundedResult(ctx, {
    iterations: outcome.iterations,
    tridiagonalSolves: outcome.tridiagonalSolves,
    hotSpotPosition: peakPosition(ctx, outcome.temperatures),
    linearisation: outcome.linearisation,
    linearisationCounts: outcome.linearisationCounts,
    flags: [
      ...flags,
      {
        code: 'not-converged',
        severity: 'warning',
        message: `The outer iteration did not converge in ${outcome.iterations} passes (energy residual ${outcome.energy.residual.toExponential(2)}); no temperatures are reported.`,
      },
    ],
    lastIterate: outcome.temperatures,
    runawayOnsetCurrentA: onset?.currentA,
  });
}

// ---------------------------------------------------------------------------------------------
// Transient (implicit Euler)
// ---------------------------------------------------------------------------------------------

/**
 * Implicit-Euler steps (physics.md §1: a_P gains ρcΔV/Δt, b gains ρcΔV/Δt·T_P_old). Each step
 * is solved to convergence with the same outer iteration as the steady problem. Every layer needs
 * density and heatCapacity. Transient results carry no runaway report: temperatures stay finite
 * at finite time; a step that leaves the temperature limit stops the run unconverged.
 */
export function solveTransient(problem: TransientProblem): TransientResult {
  const normalized = validateProblem(problem, false);
  const raw = requireRecord(problem, 'problem');
  const timeStep = requirePositive(raw.timeStep, 'timeStep');
  const steps = raw.steps === undefined ? 1 : requirePositiveInteger(raw.steps, 'steps');
  normalized.geometry.layers.forEach((layer, i) => {
    if (layer.density === undefined) throw new ThermalInputError(`geometry.layers[${i}].density`, 'is required for a transient solve');
    if (layer.heatCapacity === undefined) {
      throw new ThermalInputError(`geometry.layers[${i}].heatCapacity`, 'is required for a transient solve');
    }
  });
  const scratch = borrowScratch(contextStoreSize(normalized));
  try {
    return transient(raw, normalized, createContext(normalized, timeStep, scratch), timeStep, steps);
  } finally {
    scratch.release();
  }
}

function transient(
  raw: Record<string, unknown>,
  normalized: NormalizedProblem,
  ctx: SolverContext,
  timeStep: number,
  steps: number,
): TransientResult {
  const n = ctx.mesh.cellCount;

  let previous: Float64Array;
  if (Array.isArray(raw.initial)) {
    if (raw.initial.length !== n) throw new ThermalInputError('initial', `must have one value per cell (${n}), got ${raw.initial.length}`);
    previous = Float64Array.from(raw.initial.map((t, i) => requireTemperature(t, `initial[${i}]`)));
  } else {
    previous = new Float64Array(n).fill(requireTemperature(raw.initial, 'initial'));
  }

  const history: TransientResult['history'] = [];
  let iterations = 0;
  let solves = 0;
  const counts = { tangent: 0, lagged: 0 };
  let outcome: IterationOutcome | undefined;
  let maxResidual = 0;
  for (let step = 1; step <= steps; step++) {
    outcome = iterate(ctx, {
      start: previous,
      previous,
      // Linearise each surface first about where the body starts the step.
      surfaceStart: { inner: previous[0], outer: previous[n - 1] },
    });
    iterations += outcome.iterations;
    solves += outcome.tridiagonalSolves;
    counts.tangent += outcome.linearisationCounts.tangent;
    counts.lagged += outcome.linearisationCounts.lagged;
    if (outcome.status !== 'converged') {
      const failed = unboundedResult(ctx, {
        iterations,
        tridiagonalSolves: solves,
        hotSpotPosition: peakPosition(ctx, outcome.temperatures),
        linearisation: outcome.linearisation,
        linearisationCounts: counts,
        flags: [
          ...normalized.assumptions,
          { code: 'not-converged', severity: 'warning', message: `Time step ${step} did not converge (${outcome.status}).` },
        ],
        lastIterate: outcome.temperatures,
      });
      return { ...failed, time: (step - 1) * timeStep, history };
    }
    maxResidual = Math.max(maxResidual, outcome.energy.residual);
    history.push({ time: step * timeStep, temperatures: plain(outcome.temperatures) });
    previous = Float64Array.from(outcome.temperatures);
  }
  const final = convergedResult(ctx, outcome!, [...normalized.assumptions]);
  return {
    ...final,
    iterations,
    tridiagonalSolves: solves,
    linearisationCounts: counts,
    energyResidual: maxResidual,
    time: steps * timeStep,
    history,
  };
}

/**
 * A bus-bar run along its length (physics.md §6): one-dimensional conduction along the bar,
 *   d/dx(k A_c dT/dx) + q'''(T)·A_c − h(T)·P·(T − T∞) + Σ Q_j δ(x − x_j) = 0,
 * solved by the one finite-volume assembly and outer iteration of every solve (assembly.ts,
 * iterate.ts) on a slab mesh along the run, per m² of the bar's section: the sideways loss is the
 * source term S_p = −hP/A_c ≤ 0, S_u = hP·T∞/A_c (terms.ts sidewaysLoss; Incropera §3.6, the fin
 * equation with generation), Joule heating q''' = J²ρ₂₀[1 + α(T − 20)]F_ac is the problem's
 * source (tangent form, exact), bolted joints are point heat I²R_joint in the cell holding them
 * (terms.ts pointHeat), and the ends are boundaries of the slab: a set temperature (a device
 * terminal) or insulated (symmetry).
 *
 * The cross-section is taken at one temperature (fin approximation: Bi = ht/(2k) is ~1e-4 for a
 * copper bar in air). h at each cell comes from the same surface correlations as the steady
 * cross-section model (busBarProblem: vertical plate on edge, horizontal plates laid flat, forced
 * flat plate with wind; radiation to surroundings at the air temperature), evaluated at the
 * cell's own temperature (sideways.ts), and iterated like any other solve: to options.tolerance
 * (1e-6 K) and a closed energy balance.
 */
import { createContext } from './assembly';
import { busBarProblem } from './builders';
import { ThermalInputError } from './errors';
import { iterate } from './iterate';
import { cellHolding } from './mesh';
import type { NormalizedBoundary, NormalizedProblem, NormalizedSurface } from './normalized';
import { requireSecantSurfaces, sidewaysLossPerVolume } from './sideways';
import type { ThermalFlag, ThermalProblem } from './types';
import {
  requireNonNegative,
  requirePositive,
  requirePositiveInteger,
  requireRecord,
  requireTemperature,
  validateProblem,
} from './validate';

/** First iterate: the whole run this far above the air. */
const START_RISE_K = 10;

export type BarRunEnd = { kind: 'terminal'; temperatureC: number } | { kind: 'insulated' };

export interface BarRunJoint {
  /** Distance from the start of the run, m. */
  positionM: number;
  /** Resistance of the whole joint (all bars of the phase), µΩ; default DEFAULT_JOINT_RESISTANCE_MICRO_OHM (flagged). */
  resistanceMicroOhm?: number;
  label?: string;
}

export interface BarRunInput {
  lengthM: number;
  widthM: number;
  thicknessM: number;
  /** Bars per phase sharing the current equally (default 1). */
  barsPerPhase?: number;
  /** Phase current, A. */
  currentA: number;
  /** DC resistance of ONE bar at 20 °C, Ω/m. */
  r20OhmPerM: number;
  alpha20PerK: number;
  /** R_ac/R_dc (default 1). */
  acFactor?: number;
  /** Bar thermal conductivity, W/(m·K). */
  conductivityWPerMK: number;
  orientation: 'edge' | 'flat';
  ambientC: number;
  /** Surface emissivity, 0..1 (ignored with a fixed coefficient). */
  emissivity: number;
  windMps?: number;
  /** A fixed combined surface coefficient replacing the correlations, W/(m²·K). */
  fixedHWPerM2K?: number;
  /** Ends at x = 0 and x = L. */
  start: BarRunEnd;
  end: BarRunEnd;
  joints?: BarRunJoint[];
  /** Cells along the run (default 200). */
  cells?: number;
  /** Outer passes allowed (default 200). */
  maxIterations?: number;
}

export interface BarRunResult {
  converged: boolean;
  /** Cell centres, m from the start. */
  positionsM: number[];
  /** °C at the cell centres (empty when not converged). */
  temperaturesC: number[];
  /** Hottest point (a cell centre or a terminal), °C and m. */
  hotSpot: { temperatureC: number; positionM: number };
  joints: { positionM: number; resistanceMicroOhm: number; heatW: number; temperatureC: number; label?: string; assumed: boolean }[];
  /** Heat flowing from the bar into each terminal, W per phase (0 at an insulated end). */
  heatIntoStartW: number;
  heatIntoEndW: number;
  /** Joule heat of the bars and joints, and heat lost sideways, W per phase. */
  generatedW: number;
  lostSidewaysW: number;
  /** |generated − sideways − terminals| / the largest of those flows (energy.ts). */
  energyResidual: number;
  iterations: number;
  /** Surface coefficient (convection + radiation) at the hot spot, W/(m²·K). */
  hotSpotSurfaceCoefficientWPerM2K: number;
  flags: ThermalFlag[];
}

/**
 * Default joint resistance, µΩ. Common practice, from memory: a sound bolted joint of a medium
 * bar has a few µΩ; 10 µΩ is a deliberately pessimistic figure for an unmeasured joint. Flagged.
 */
export const DEFAULT_JOINT_RESISTANCE_MICRO_OHM = 10;

function requireEnd(value: unknown, field: string): BarRunEnd {
  const r = requireRecord(value, field);
  if (r.kind === 'insulated') return { kind: 'insulated' };
  if (r.kind === 'terminal') return { kind: 'terminal', temperatureC: requireTemperature(r.temperatureC, `${field}.temperatureC`) };
  throw new ThermalInputError(`${field}.kind`, "must be 'terminal' or 'insulated'");
}

export function solveBarRun(input: BarRunInput): BarRunResult {
  const raw = requireRecord(input, 'barRun');
  const lengthM = requirePositive(raw.lengthM, 'lengthM');
  const widthM = requirePositive(raw.widthM, 'widthM');
  const thicknessM = requirePositive(raw.thicknessM, 'thicknessM');
  const bars = raw.barsPerPhase === undefined ? 1 : requirePositiveInteger(raw.barsPerPhase, 'barsPerPhase');
  const currentA = requireNonNegative(raw.currentA, 'currentA');
  const r20 = requirePositive(raw.r20OhmPerM, 'r20OhmPerM');
  const alpha = requireNonNegative(raw.alpha20PerK, 'alpha20PerK');
  const acFactor = raw.acFactor === undefined ? 1 : requirePositive(raw.acFactor, 'acFactor');
  if (acFactor < 1) throw new ThermalInputError('acFactor', 'must be ≥ 1');
  const k = requirePositive(raw.conductivityWPerMK, 'conductivityWPerMK');
  const ambientC = requireTemperature(raw.ambientC, 'ambientC');
  const cells = raw.cells === undefined ? 200 : requirePositiveInteger(raw.cells, 'cells');
  const maxIterations = raw.maxIterations === undefined ? 200 : requirePositiveInteger(raw.maxIterations, 'maxIterations');
  const start = requireEnd(raw.start, 'start');
  const end = requireEnd(raw.end, 'end');
  const fixedH = raw.fixedHWPerM2K === undefined ? undefined : requirePositive(raw.fixedHWPerM2K, 'fixedHWPerM2K');

  // The cross-section model's surfaces (same correlations, same edge lumping), per face.
  const section: ThermalProblem = busBarProblem({
    widthM,
    thicknessM,
    barsPerPhase: bars,
    currentA: 0,
    r20OhmPerM: r20,
    alpha20PerK: alpha,
    conductivity: k,
    orientation: raw.orientation as 'edge' | 'flat',
    ambientC,
    emissivity: raw.emissivity as number,
    ...(raw.windMps !== undefined ? { windMps: raw.windMps as number } : {}),
  });
  const areaFactor = section.outer.kind === 'surface' ? section.outer.areaFactor ?? 1 : 1;
  if (fixedH !== undefined) {
    section.inner = { kind: 'surface', ambient: ambientC, h: fixedH, emissivity: 0, areaFactor };
    section.outer = { kind: 'surface', ambient: ambientC, h: fixedH, emissivity: 0, areaFactor };
  }
  const normalized = validateProblem(section, true);
  const faces = [normalized.inner, normalized.outer] as NormalizedSurface[];
  /** Face area per metre of one bar for each face, m²/m (both together: the perimeter 2(w + t)). */
  const faceAreaPerM = widthM * areaFactor;
  const perimeterM = 2 * faceAreaPerM;

  const flags: ThermalFlag[] = (section.assumptions ?? []).filter((f) => f.code !== 'bar-results-per-square-metre');
  flags.push({
    code: 'bar-run-uniform-section',
    severity: 'info',
    message: 'Each cross-section of the run is taken at one temperature (fin approximation); conduction across the bar is not resolved.',
  });

  const joints = (Array.isArray(raw.joints) ? raw.joints : []).map((j, i) => {
    const r = requireRecord(j, `joints[${i}]`);
    const positionM = requireNonNegative(r.positionM, `joints[${i}].positionM`);
    if (positionM > lengthM) throw new ThermalInputError(`joints[${i}].positionM`, `must lie on the run (0…${lengthM} m)`);
    const assumed = r.resistanceMicroOhm === undefined;
    const resistanceMicroOhm = assumed ? DEFAULT_JOINT_RESISTANCE_MICRO_OHM : requireNonNegative(r.resistanceMicroOhm, `joints[${i}].resistanceMicroOhm`);
    return { positionM, resistanceMicroOhm, assumed, ...(typeof r.label === 'string' ? { label: r.label } : {}) };
  });
  if (joints.some((j) => j.assumed)) {
    flags.push({
      code: 'joint-resistance-assumed',
      severity: 'warning',
      message: `Joint resistance not entered: ${DEFAULT_JOINT_RESISTANCE_MICRO_OHM} µΩ assumed per joint (a pessimistic figure from common practice, not a measurement).`,
    });
  }
  if (joints.length > 0) {
    flags.push({
      code: 'joint-resistance-constant',
      severity: 'info',
      message: 'Joint resistance held at the entered value at every temperature.',
    });
  }

  const areaM2 = widthM * thicknessM;
  const barCurrent = currentA / bars;
  // The pack shares each joint: each bar carries I/n through n·R_j, i.e. I²R_j/n (W per bar).
  const jointHeatW = (j: { resistanceMicroOhm: number }) => (currentA * currentA * j.resistanceMicroOhm * 1e-6) / bars;
  const endBoundary = (e: BarRunEnd): NormalizedBoundary => (e.kind === 'terminal' ? { kind: 'temperature', value: e.temperatureC } : { kind: 'symmetry' });

  // The run as a slab along x, per m² of section: J = I/A_c, ρ₂₀ = R₂₀·A_c (physics.md §1).
  requireSecantSurfaces(faces);
  const along = validateProblem(
    {
      geometry: { kind: 'slab', layers: [{ thickness: lengthM, conductivity: k, generating: true, cells }] },
      source: { kind: 'joule', current: barCurrent, area: areaM2, rho20: r20 * areaM2, alpha20: alpha, acFactor },
      inner: { kind: 'symmetry' },
      outer: { kind: 'symmetry' },
      options: { maxIterations },
    },
    false,
  );
  const problem: NormalizedProblem = {
    ...along,
    inner: endBoundary(start),
    outer: endBoundary(end),
    sideways: { surfaces: faces, areaPerVolume: faceAreaPerM / areaM2 },
    pointSources: joints.map((j) => ({ position: j.positionM, heat: jointHeatW(j) / areaM2 })),
  };
  const ctx = createContext(problem);
  const nodes = Array.from(ctx.mesh.nodes);
  const outcome = iterate(ctx, { start: ambientC + START_RISE_K });

  const perPhase = bars;
  if (outcome.status !== 'converged') {
    flags.push({
      code: 'bar-run-no-steady-state',
      severity: 'warning',
      message: `No steady state along the run at ${currentA} A (Joule heating outruns the sideways loss, or the iteration did not settle in ${maxIterations} passes); no temperatures are reported.`,
    });
    return {
      converged: false,
      positionsM: nodes,
      temperaturesC: [],
      hotSpot: { temperatureC: Infinity, positionM: lengthM / 2 },
      joints: joints.map((j) => ({ ...j, heatW: (currentA * currentA * j.resistanceMicroOhm) / 1e6, temperatureC: Infinity })),
      heatIntoStartW: Infinity,
      heatIntoEndW: Infinity,
      generatedW: Infinity,
      lostSidewaysW: Infinity,
      energyResidual: Infinity,
      iterations: outcome.iterations,
      hotSpotSurfaceCoefficientWPerM2K: Infinity,
      flags,
    };
  }

  const temperaturesC = Array.from(outcome.temperatures);
  let hot = 0;
  for (let i = 1; i < cells; i++) if (temperaturesC[i] > temperaturesC[hot]) hot = i;
  let hotSpot = { temperatureC: temperaturesC[hot], positionM: nodes[hot] };
  if (start.kind === 'terminal' && start.temperatureC > hotSpot.temperatureC) hotSpot = { temperatureC: start.temperatureC, positionM: 0 };
  if (end.kind === 'terminal' && end.temperatureC > hotSpot.temperatureC) hotSpot = { temperatureC: end.temperatureC, positionM: lengthM };

  // The balance is per m² of section: times the section and the bars, W per phase.
  const e = outcome.energy;
  const perPhaseW = (perSection: number) => perSection * areaM2 * perPhase;
  const hotRise = Math.max(temperaturesC[hot] - ambientC, 1e-9);
  return {
    converged: true,
    positionsM: nodes,
    temperaturesC,
    hotSpot,
    joints: joints.map((j) => ({
      ...j,
      heatW: (currentA * currentA * j.resistanceMicroOhm) / 1e6,
      temperatureC: temperaturesC[cellHolding(ctx.mesh, j.positionM)],
    })),
    heatIntoStartW: perPhaseW(e.leavingInner),
    heatIntoEndW: perPhaseW(e.leavingOuter),
    generatedW: perPhaseW(e.generated),
    lostSidewaysW: perPhaseW(e.leavingSideways),
    energyResidual: e.residual,
    iterations: outcome.iterations,
    hotSpotSurfaceCoefficientWPerM2K: (sidewaysLossPerVolume(problem.sideways!, hotRise) * areaM2) / perimeterM,
    flags,
  };
}

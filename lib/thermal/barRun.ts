/**
 * A bus-bar run along its length (physics.md §6): one-dimensional conduction along the bar,
 *   d/dx(k A_c dT/dx) + q'''(T)·A_c − h(T)·P·(T − T∞) + Σ Q_j δ(x − x_j) = 0,
 * written in the finite-volume form of §1 with the sideways loss as a source
 * S_p = −hP/A_c ≤ 0, S_u = hP·T∞/A_c (Incropera §3.6, the fin equation with generation),
 * Joule heating q''' = J²ρ₂₀[1 + α(T − 20)]F_ac in its exact tangent form, bolted joints as point
 * heat I²R_joint in the cell holding them, and the ends either at a set temperature (a device
 * terminal) or insulated.
 *
 * The cross-section is taken at one temperature (fin approximation: Bi = ht/(2k) is ~1e-4 for a
 * copper bar in air). h at each cell comes from the same surface correlations as the steady
 * cross-section model (busBarProblem: vertical plate on edge, horizontal plates laid flat, forced
 * flat plate with wind; radiation to surroundings at the air temperature), evaluated at the
 * cell's own temperature, and the whole field is iterated until no cell moves by 1e-6 K.
 */
import { busBarProblem } from './builders';
import { ThermalInputError } from './errors';
import { surfaceFlux } from './surface';
import { thomas } from './tridiagonal';
import type { ThermalFlag, ThermalProblem } from './types';
import {
  requireNonNegative,
  requirePositive,
  requirePositiveInteger,
  requireRecord,
  requireTemperature,
  validateProblem,
  type NormalizedSurface,
} from './validate';

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
  /** |generated − sideways − terminals| / generated. */
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

  const dx = lengthM / cells;
  const areaM2 = widthM * thicknessM;
  const barCurrent = currentA / bars;
  // Joule per metre of one bar: q' = I²R₂₀F[1 + α(T − 20)] = q20 + slope·(T − 20).
  const q20PerM = barCurrent * barCurrent * r20 * acFactor;
  const slopePerM = q20PerM * alpha;
  const g = (k * areaM2) / dx;
  const jointHeat = new Float64Array(cells);
  const jointCell = joints.map((j) => Math.min(cells - 1, Math.floor(j.positionM / dx)));
  joints.forEach((j, i) => {
    // The pack shares the joint: each bar carries I/n through n·R_j, i.e. I²R_j/n.
    jointHeat[jointCell[i]] += (currentA * currentA * j.resistanceMicroOhm * 1e-6) / bars;
  });

  const nodes = new Float64Array(cells);
  for (let i = 0; i < cells; i++) nodes[i] = (i + 0.5) * dx;
  const lower = new Float64Array(cells);
  const diagonal = new Float64Array(cells);
  const upper = new Float64Array(cells);
  const rhs = new Float64Array(cells);
  const x = new Float64Array(cells);
  const scratch = new Float64Array(cells);
  const hPerM = new Float64Array(cells);
  // Rises above the air keep their digits (as in iterate.ts).
  const rises = new Float64Array(cells).fill(10);
  const endRise = (e: BarRunEnd): number => (e.kind === 'terminal' ? e.temperatureC - ambientC : 0);
  const endConductance = (e: BarRunEnd): number => (e.kind === 'terminal' ? 2 * g : 0);
  const gStart = endConductance(start);
  const gEnd = endConductance(end);

  /** Sideways loss coefficient h·P of one bar at rise θ, W/(m·K) (secant: loss = hP·θ). */
  const lossCoefficient = (rise: number): number => {
    let sum = 0;
    for (const f of faces) {
      const e = surfaceFlux(f, ambientC + rise, rise);
      sum += (e.hConv + e.hRad) * faceAreaPerM;
    }
    return sum;
  };

  let iterations = 0;
  let converged = false;
  for (iterations = 1; iterations <= maxIterations; iterations++) {
    for (let i = 0; i < cells; i++) hPerM[i] = lossCoefficient(Math.max(rises[i], 1e-9));
    const qRef = q20PerM + slopePerM * (ambientC - 20);
    for (let i = 0; i < cells; i++) {
      const gw = i > 0 ? g : gStart;
      const ge = i < cells - 1 ? g : gEnd;
      // S_p·ΔV = (−hP + dq'/dT)·dx (tangent Joule is exact: q' is linear in T).
      diagonal[i] = gw + ge + (hPerM[i] - slopePerM) * dx;
      rhs[i] = qRef * dx + jointHeat[i] + (i === 0 ? gStart * endRise(start) : 0) + (i === cells - 1 ? gEnd * endRise(end) : 0);
      lower[i] = i > 0 ? -g : 0;
      upper[i] = i < cells - 1 ? -g : 0;
    }
    const pivot = thomas(cells, lower, diagonal, upper, rhs, x, scratch);
    if (!(pivot > 0)) break; // Joule growth outruns the sideways loss: no steady state.
    let delta = 0;
    for (let i = 0; i < cells; i++) {
      delta = Math.max(delta, Math.abs(x[i] - rises[i]));
      rises[i] = x[i];
    }
    if (!Number.isFinite(delta)) break;
    if (delta < 1e-6) {
      converged = true;
      break;
    }
  }

  const perPhase = bars;
  if (!converged) {
    flags.push({
      code: 'bar-run-no-steady-state',
      severity: 'warning',
      message: `No steady state along the run at ${currentA} A (Joule heating outruns the sideways loss, or the iteration did not settle in ${maxIterations} passes); no temperatures are reported.`,
    });
    return {
      converged: false,
      positionsM: Array.from(nodes),
      temperaturesC: [],
      hotSpot: { temperatureC: Infinity, positionM: lengthM / 2 },
      joints: joints.map((j) => ({ ...j, heatW: (currentA * currentA * j.resistanceMicroOhm) / 1e6, temperatureC: Infinity })),
      heatIntoStartW: Infinity,
      heatIntoEndW: Infinity,
      generatedW: Infinity,
      lostSidewaysW: Infinity,
      energyResidual: Infinity,
      iterations: Math.min(iterations, maxIterations),
      hotSpotSurfaceCoefficientWPerM2K: Infinity,
      flags,
    };
  }

  const temperaturesC = Array.from(rises, (r) => ambientC + r);
  let hot = 0;
  for (let i = 1; i < cells; i++) if (rises[i] > rises[hot]) hot = i;
  let hotSpot = { temperatureC: temperaturesC[hot], positionM: nodes[hot] };
  if (start.kind === 'terminal' && start.temperatureC > hotSpot.temperatureC) hotSpot = { temperatureC: start.temperatureC, positionM: 0 };
  if (end.kind === 'terminal' && end.temperatureC > hotSpot.temperatureC) hotSpot = { temperatureC: end.temperatureC, positionM: lengthM };

  let generated = 0;
  let lost = 0;
  for (let i = 0; i < cells; i++) {
    generated += (q20PerM + slopePerM * (temperaturesC[i] - 20)) * dx + jointHeat[i];
    lost += lossCoefficient(rises[i]) * rises[i] * dx;
  }
  const intoStart = gStart * (rises[0] - endRise(start));
  const intoEnd = gEnd * (rises[cells - 1] - endRise(end));
  const residual = Math.abs(generated - lost - intoStart - intoEnd) / Math.max(Math.abs(generated), 1e-12);
  const hotRise = Math.max(rises[hot], 1e-9);

  return {
    converged: true,
    positionsM: Array.from(nodes),
    temperaturesC,
    hotSpot,
    joints: joints.map((j, i) => ({
      ...j,
      heatW: (currentA * currentA * j.resistanceMicroOhm) / 1e6,
      temperatureC: temperaturesC[jointCell[i]],
    })),
    heatIntoStartW: intoStart * perPhase,
    heatIntoEndW: intoEnd * perPhase,
    generatedW: generated * perPhase,
    lostSidewaysW: lost * perPhase,
    energyResidual: residual,
    iterations,
    hotSpotSurfaceCoefficientWPerM2K: lossCoefficient(hotRise) / perimeterM,
    flags,
  };
}

/**
 * The heat balance of a buried group (cableGroup.ts): every solved cable's 1-D model with its own
 * external resistance and the ground raised by the others' heat, each cable's heat taken at its
 * own solved temperature.
 *
 * Behind a linear surface (h fixed) with the Joule source linear in temperature, a cable's heat W
 * is exactly affine in the rise of its ambient: W_i = c_i + d_i·ΔT_i. Two solves per cable (its
 * ambient at the ground temperature and 10 K above it) give c_i and d_i; the rises are
 * ΔT_i = Σ_j G_ij·W_j + f_i (G the image coefficients, f the fixed neighbours' heat), so the heats
 * solve one small linear system (I − diag(d)·G)·W = c + d∘f, and a last solve per cable at its
 * rise gives its temperatures. That system is an M-matrix while a steady state exists; when
 * elimination meets a pivot ≤ 0 the mutual heating feeds itself without bound: the group runs away
 * (reported as such, never as a temperature). The duct air's T₄′ (at its mean temperature) and the
 * neighbours' AC factors (at their temperatures) are settled by repeating the whole step.
 */
import type { SteadyResult } from '../../thermal';
import { SizingError } from '../errors';
import { ductAirT4, type BuriedGroupModel, type CableGroup } from './cableGroup';
import type { SizingContext } from './context';
import { heatPerMetre, readLimits, type CableSolve, type Mesh } from './model';

/** Ambient step for the affine response of a cable's heat, K. */
const RESPONSE_STEP_K = 10;
/** Outer passes for the duct air and the neighbours' AC factors. */
const MAX_PASSES = 30;
const SETTLED = 1e-9;

export interface GroupCableState {
  /** Index into the group's cables. */
  cable: number;
  /** Null for a neighbour given only by its heat (not solved). */
  conductorC: number | null;
  surfaceC: number | null;
  heatWPerM: number;
  /** Rise of its surroundings above the ground from the other cables, K (null when not solved). */
  riseFromOthersK: number | null;
}

export interface GroupSolution {
  /** Index of the governing cable (the hottest against its limit, of the circuit being sized). */
  governingCable: number;
  cables: GroupCableState[];
  passes: number;
}

export type GroupSteadyResult = SteadyResult & { group?: GroupSolution };

/** The prepared 1-D problem of one unit behind its own external resistance, cached per mesh and h. */
function unitProblem(ctx: SizingContext, model: BuriedGroupModel, mesh: Mesh, unit: number, hWPerM2K: number): CableSolve {
  const key = `${mesh}:${unit}:${hWPerM2K}`;
  const cache = (model as BuriedGroupModel & { prepared?: Map<string, CableSolve> }).prepared ?? new Map<string, CableSolve>();
  (model as BuriedGroupModel & { prepared?: Map<string, CableSolve> }).prepared = cache;
  let p = cache.get(key);
  if (!p) {
    if (cache.size > 64) cache.clear(); // duct air settling makes new h values; keep the cache small
    p = ctx.model.withOuterSurface(mesh, hWPerM2K);
    cache.set(key, p);
  }
  return p;
}

/** Solves A·x = b by elimination without pivoting; null when a pivot is ≤ 0 (not an M-matrix: runaway). */
function solveMMatrix(a: number[][], b: number[]): number[] | null {
  const n = b.length;
  const m = a.map((row) => [...row]);
  const x = [...b];
  for (let k = 0; k < n; k++) {
    const pivot = m[k][k];
    if (!(pivot > 1e-12)) return null;
    for (let i = k + 1; i < n; i++) {
      const f = m[i][k] / pivot;
      if (f === 0) continue;
      for (let j = k; j < n; j++) m[i][j] -= f * m[k][j];
      x[i] -= f * x[k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i];
    for (let j = i + 1; j < n; j++) s -= m[i][j] * x[j];
    x[i] = s / m[i][i];
  }
  return x;
}

/** No steady state of the group: mutual heating feeds itself (the onset current is not known here). */
function runawayResult(like: SteadyResult | null): GroupSteadyResult {
  return {
    group: { governingCable: -1, cables: [], passes: 0 },
    ...(like ?? ({} as SteadyResult)),
    converged: false,
    temperatures: [],
    positions: like?.positions ?? [],
    hotSpot: { temperature: Number.POSITIVE_INFINITY, position: 0 },
    energyResidual: Number.POSITIVE_INFINITY,
    runaway: { criterion: 'eigenvalue' },
  };
}

/**
 * The next duct-air temperature: a secant step on θ_m = g(θ_m) from the last two passes (the map
 * contracts but overshoots, slope about −0.2), plain substitution on the first pass.
 */
function nextMeanAir(history: { x: number; g: number }, x: number, g: number): number {
  let next = g;
  if (Number.isFinite(history.x) && Math.abs(x - history.x) > 1e-12) {
    const slope = Math.min(0.9, Math.max(-5, (g - history.g) / (x - history.x)));
    next = x + (g - x) / (1 - slope);
  }
  history.x = x;
  history.g = g;
  return next;
}

export function solveBuriedGroup(ctx: SizingContext, group: CableGroup, model: BuriedGroupModel, modelCurrentA: number, acFactor: number, mesh: Mesh): GroupSteadyResult {
  const ground = ctx.model.referenceC;
  const units = model.units;
  const n = units.length;
  const meanAirC = units.map(() => ground + 20);
  const airHistory = units.map(() => ({ x: Number.NaN, g: Number.NaN }));
  const baseRise = units.map(() => 0);
  // A closed-form circuit's screen loss: its worst member's (cautious); a cable alone: its own.
  const positionOf = (i: number) => (units[i].members.length > 1 ? 'worst' : group.cables[units[i].cable].position);
  const factors = units.map((u) => (u.rated ? acFactor : acFactor));
  const currentOf = (i: number) => (units[i].rated ? modelCurrentA : (units[i].fixedConductorA ?? 0) * ctx.model.currentScale);
  let results: SteadyResult[] = [];
  let heats: number[] = [];
  let rises: number[] = [];
  let passes = 0;
  for (; passes < MAX_PASSES; passes++) {
    const prepared: CableSolve[] = [];
    const c: number[] = [];
    const d: number[] = [];
    const t4: number[] = [];
    for (let i = 0; i < n; i++) {
      const unit = units[i];
      const de = group.cables[unit.cable].externalDiameterM;
      t4[i] = unit.ownT4 + ductAirT4(model, de, meanAirC[i]);
      const p = unitProblem(ctx, model, mesh, i, 1 / (t4[i] * Math.PI * de));
      prepared.push(p);
      ctx.solves += 2;
      const r0 = p.at(currentOf(i), factors[i], { outerAmbientC: ground + baseRise[i], position: positionOf(i) });
      if (!r0.converged) return r0.runaway ? runawayResult(r0) : r0;
      const r1 = p.at(currentOf(i), factors[i], { outerAmbientC: ground + baseRise[i] + RESPONSE_STEP_K, position: positionOf(i) });
      if (!r1.converged) return r1.runaway ? runawayResult(r1) : r1;
      // W = c + d·ΔT about the last pass's rise (exactly affine without a screen; the screen's λ₁
      // moves a little with temperature, which the passes settle).
      d[i] = Math.max(0, (heatPerMetre(ctx.model, r1) - heatPerMetre(ctx.model, r0)) / RESPONSE_STEP_K);
      c[i] = heatPerMetre(ctx.model, r0) - d[i] * baseRise[i];
    }
    // Each unit's rise from the others, at the member position that gets the most (cautious).
    const rowOf = units.map((u) => {
      let best = 0;
      let bestRise = -1;
      u.mutualByMember.forEach((row, m) => {
        let rise = 0;
        row.forEach((coef, k) => {
          const owner = model.unitOfCable[k];
          rise += coef * (owner < 0 ? model.fixedHeatWPerM[k] : c[owner]);
        });
        if (rise > bestRise) {
          bestRise = rise;
          best = m;
        }
      });
      return u.mutualByMember[best];
    });
    const G = units.map((_, i) => units.map(() => 0));
    const fixedRise = units.map(() => 0);
    rowOf.forEach((row, i) => {
      row.forEach((coef, k) => {
        if (coef === 0) return;
        const owner = model.unitOfCable[k];
        if (owner < 0) fixedRise[i] += coef * model.fixedHeatWPerM[k];
        else G[i][owner] += coef;
      });
    });
    const A = units.map((_, i) => units.map((__, j) => (i === j ? 1 : 0) - d[i] * G[i][j]));
    const b = units.map((_, i) => c[i] + d[i] * fixedRise[i]);
    const w = solveMMatrix(A, b);
    if (!w || w.some((x, i) => !(x >= c[i] - 1e-9 * Math.max(1, c[i])))) return runawayResult(null);
    rises = units.map((_, i) => G[i].reduce((s, g, j) => s + g * w[j], 0) + fixedRise[i]);
    results = [];
    heats = [];
    let settled = true;
    for (let i = 0; i < n; i++) {
      ctx.solves++;
      const r = prepared[i].at(currentOf(i), factors[i], { outerAmbientC: ground + rises[i], position: positionOf(i) });
      if (!r.converged) return r.runaway ? runawayResult(r) : r;
      results.push(r);
      heats.push(heatPerMetre(ctx.model, r));
      if (Math.abs(heats[i] - w[i]) > SETTLED * Math.max(1, heats[i])) settled = false;
      baseRise[i] = rises[i];
      // The duct air sits between the cable surface and the duct wall: its mean temperature is the
      // surface less half the drop across T₄′ (IEC 60287-2-1 §4.2.7.1 evaluates T₄′ at θ_m).
      if (model.duct) {
        const ductAir = t4[i] - units[i].ownT4;
        const implied = r.surfaceTemperature - 0.5 * heats[i] * ductAir;
        if (Math.abs(implied - meanAirC[i]) > 1e-6) settled = false;
        meanAirC[i] = nextMeanAir(airHistory[i], meanAirC[i], implied);
      }
      if (!units[i].rated) {
        const next = ctx.acFn(readLimits(ctx.model, r, ctx.cand.contactLimit).conductorC).factor;
        if (Math.abs(next - factors[i]) > SETTLED * next) settled = false;
        factors[i] = next;
      }
    }
    if (settled) break;
  }
  if (passes >= MAX_PASSES) throw new SizingError('SOLVER_NOT_CONVERGED', 'the duct air and the heats of the buried group did not settle');

  let governing = -1;
  let worst = Number.NEGATIVE_INFINITY;
  const states: GroupCableState[] = [];
  units.forEach((unit, i) => {
    const limits = readLimits(ctx.model, results[i], ctx.cand.contactLimit);
    for (const k of unit.members) states.push({ cable: k, conductorC: limits.conductorC, surfaceC: results[i].surfaceTemperature, heatWPerM: heats[i], riseFromOthersK: rises[i] });
    if (unit.rated && limits.excessK > worst) {
      worst = limits.excessK;
      governing = i;
    }
  });
  for (let k = 0; k < group.cables.length; k++) {
    if (model.unitOfCable[k] < 0) states.push({ cable: k, conductorC: null, surfaceC: null, heatWPerM: model.fixedHeatWPerM[k], riseFromOthersK: null });
  }
  states.sort((a, b) => a.cable - b.cable);
  // The governing cable's own onset (its neighbours' heat held fixed) overstates the group's: leave
  // it out, so that the near-runaway check takes the cautious estimate from the whole rise.
  const { runawayOnsetCurrentA: _ownOnset, ...governingResult } = results[governing];
  return { ...governingResult, group: { governingCable: units[governing].cable, cables: states, passes: passes + 1 } };
}

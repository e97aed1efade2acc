/**
 * Ampacity of a bus-bar system: the phase current at which the hottest bar reaches its limit,
 * with the current distribution (filament method) and the pack heat balance coupled.
 *
 * The current distribution is linear in the phase current, so at fixed bar temperatures each
 * bar's loss is c_k·I². The bars' temperatures change their resistivities (and so, slightly, the
 * distribution); the loop is therefore: distribution at the bar temperatures → ampacity by a
 * bracketing search on the heat balance, each bar's loss following its own ρ(θ) at the frozen
 * distribution → distribution again at the temperatures found, until they move less than 0.01 K.
 * At that point the frozen-distribution scaling is exact.
 */
import { ElectricalInputError, requireTemperature } from '../errors';
import {
  isolatedBarAcFactor,
  prepareCurrentDistribution,
  solveCurrentDistribution,
  type BusbarConductorData,
  type CurrentDistributionResult,
  type FilamentMeshOptions,
} from './currentDistribution';
import type { BusbarFlag } from './flags';
import type { BusbarBar, PreparedBusbarSystem } from './geometry';
import { packHeatOut, preparePackHeat, solvePackHeat, type PackHeatConditions, type PackHeatResult, type PreparedPackHeat } from './packHeat';

export interface BusbarRatingConditions extends PackHeatConditions {
  /** Temperature limit of the hottest bar, °C. */
  limitC: number;
}

export type RatingExcitation = { kind: 'three-phase'; frequencyHz: number } | { kind: 'dc' };

export interface BusbarRatingInput {
  system: PreparedBusbarSystem;
  conductor: BusbarConductorData;
  conditions: BusbarRatingConditions;
  excitation: RatingExcitation;
  mesh?: FilamentMeshOptions;
}

export interface BusbarRatingResult {
  /** Phase current at which the hottest bar reaches the limit, A (RMS). */
  ampacityA: number;
  /** Current distribution at the ampacity and the bar temperatures found. */
  distribution: CurrentDistributionResult;
  heat: PackHeatResult;
  /** Passes of the coupling loop (one current distribution each). */
  couplingPasses: number;
  /** Factorisations of the filament system (the other passes reuse one). */
  factorisations: number;
  flags: BusbarFlag[];
}

const COUPLING_TOLERANCE_K = 0.01;
const MAX_COUPLING_PASSES = 8;

/**
 * Current at which the hottest bar reaches `limitC`, with each bar's loss I²·c_k·r_k(θ_k)/r_k(θ_ref,k).
 * Regula falsi (Illinois) on the monotone current → hottest-temperature map, to 1e-6 relative.
 */
function ampacityAtFrozenDistribution(
  heat: PreparedPackHeat,
  unitLoss: Float64Array,
  referenceC: Float64Array,
  alpha20: number,
  limitC: number,
  guessA?: number,
): { currentA: number; result: PackHeatResult } {
  const n = unitLoss.length;
  let warm: Float64Array | undefined;
  const solveAt = (currentA: number) => {
    const i2 = currentA * currentA;
    const result = solvePackHeat(
      heat,
      (t) => {
        const out = new Float64Array(n);
        for (let k = 0; k < n; k++) out[k] = (i2 * unitLoss[k] * (1 + alpha20 * (t[k] - 20))) / (1 + alpha20 * (referenceC[k] - 20));
        return out;
      },
      { initialC: warm },
    );
    if (result.converged) warm = Float64Array.from(result.bars, (b) => b.temperatureC);
    return result;
  };
  // First guess: every bar at the limit gives off Σ Q_k(limit); the losses there are I²·Σ c_k.
  const atLimit = packHeatOut(heat, new Float64Array(n).fill(limitC)).total.reduce((s, q) => s + q, 0);
  const lossAtLimit = unitLoss.reduce((s, c, k) => s + (c * (1 + alpha20 * (limitC - 20))) / (1 + alpha20 * (referenceC[k] - 20)), 0);
  let lo = 0;
  let fLo = heat.ambientC - limitC;
  if (guessA !== undefined) {
    // A previous pass's answer: bracket tightly below it.
    const below = solveAt(0.995 * guessA);
    if (below.converged && below.hottestC < limitC) {
      lo = 0.995 * guessA;
      fLo = below.hottestC - limitC;
    }
  }
  let hi = guessA !== undefined ? 1.005 * guessA : Math.sqrt(atLimit / lossAtLimit);
  if (hi <= lo) hi = 1.5 * lo;
  let hiResult = solveAt(hi);
  let fHi = hiResult.converged ? hiResult.hottestC - limitC : Number.POSITIVE_INFINITY;
  for (let expand = 0; fHi < 0 && expand < 40; expand++) {
    lo = hi;
    fLo = fHi;
    hi *= 1.5;
    hiResult = solveAt(hi);
    fHi = hiResult.converged ? hiResult.hottestC - limitC : Number.POSITIVE_INFINITY;
  }
  if (!(fHi >= 0)) throw new Error('ampacity: could not bracket the limit');
  let best = hiResult;
  let bestCurrent = hi;
  let side = 0;
  for (let iter = 0; iter < 200 && hi - lo > 1e-6 * hi; iter++) {
    // Bisection while the upper end has no finite temperature, regula falsi (Illinois) otherwise.
    const mid = Number.isFinite(fHi) ? (lo * fHi - hi * fLo) / (fHi - fLo) : 0.5 * (lo + hi);
    const r = solveAt(mid);
    const fMid = r.converged ? r.hottestC - limitC : Number.POSITIVE_INFINITY;
    if (Math.abs(fMid) < 1e-9) {
      best = r;
      bestCurrent = mid;
      break;
    }
    if (fMid > 0) {
      hi = mid;
      fHi = fMid;
      if (side === 1) fLo /= 2;
      side = 1;
    } else {
      lo = mid;
      fLo = fMid;
      if (side === -1 && Number.isFinite(fHi)) fHi /= 2;
      side = -1;
    }
    best = r;
    bestCurrent = mid;
  }
  return { currentA: bestCurrent, result: best };
}

function scaleDistribution(unit: CurrentDistributionResult, currentA: number): CurrentDistributionResult {
  const i2 = currentA * currentA;
  return {
    ...unit,
    bars: unit.bars.map((b) => ({ ...b, currentA: b.currentA * currentA, lossWPerM: b.lossWPerM * i2 })),
    groups: unit.groups.map((g) => ({ ...g, currentA: g.currentA * currentA, lossWPerM: g.lossWPerM * i2 })),
    totalLossWPerM: unit.totalLossWPerM * i2,
  };
}

/** Ampacity of the system, its bar temperatures and current distribution. */
export function rateBusbarSystem(input: BusbarRatingInput): BusbarRatingResult {
  const limitC = requireTemperature(input.conditions?.limitC, 'conditions.limitC');
  const heat = preparePackHeat(input.system, input.conditions);
  if (!(limitC > heat.ambientC)) throw new ElectricalInputError('conditions.limitC', `must be above the ambient ${heat.ambientC} °C`);
  const n = input.system.bars.length;
  const frequencyHz = input.excitation.kind === 'dc' ? 0 : input.excitation.frequencyHz;
  let reference = new Float64Array(n).fill(limitC);
  // One factorisation at the limit temperature serves every pass (each bar's resistivity moves by
  // a few per cent at most); a pass far from it prepares afresh.
  let prepared = prepareCurrentDistribution({ system: input.system, conductor: input.conductor, frequencyHz, barTemperaturesC: limitC, mesh: input.mesh });
  let factorisations = 1;
  let guessA: number | undefined;
  for (let pass = 0; pass < MAX_COUPLING_PASSES; pass++) {
    const far = reference.some((t, k) => Math.abs(t - prepared.referenceTemperaturesC[k]) > 40);
    if (far) {
      prepared = prepareCurrentDistribution({ system: input.system, conductor: input.conductor, frequencyHz, barTemperaturesC: Array.from(reference), mesh: input.mesh });
      factorisations++;
    }
    const unit = solveCurrentDistribution(prepared, { barTemperaturesC: Array.from(reference), phaseCurrentA: 1 });
    const unitLoss = Float64Array.from(unit.bars, (b) => b.lossWPerM);
    const { currentA, result } = ampacityAtFrozenDistribution(heat, unitLoss, reference, input.conductor.alpha20PerK, limitC, guessA);
    guessA = currentA;
    const found = Float64Array.from(result.bars, (b) => b.temperatureC);
    const moved = Math.max(...found.map((t, k) => Math.abs(t - reference[k])));
    if (moved < COUPLING_TOLERANCE_K || pass === MAX_COUPLING_PASSES - 1) {
      // The distribution was solved at `reference`, within 0.01 K of `found`: report it scaled.
      return {
        ampacityA: currentA,
        distribution: scaleDistribution(unit, currentA),
        heat: result,
        couplingPasses: pass + 1,
        factorisations,
        flags: result.flags,
      };
    }
    reference = found;
  }
  throw new Error('unreachable');
}

/**
 * One bar alone in the same air (its return far away; no neighbouring bars or phases): its
 * ampacity with R_dc (DC) or with its own isolated-bar R_ac/R_dc (AC, filament method). The
 * reference for "n times one bar".
 */
export function rateIsolatedBar(args: {
  widthM: number;
  thicknessM: number;
  arrangement: 'edge' | 'flat';
  conductor: BusbarConductorData;
  conditions: BusbarRatingConditions;
  excitation: RatingExcitation;
  mesh?: FilamentMeshOptions;
}): { ampacityA: number; acFactor: number; temperatureC: number; heat: PackHeatResult } {
  const limitC = requireTemperature(args.conditions?.limitC, 'conditions.limitC');
  const edge = args.arrangement === 'edge';
  const bar: BusbarBar = {
    index: 0,
    group: 'L1',
    groupIndex: 0,
    positionInPack: 0,
    cxM: 0,
    cyM: 0,
    sizeXM: edge ? args.thicknessM : args.widthM,
    sizeYM: edge ? args.widthM : args.thicknessM,
    widthM: args.widthM,
    thicknessM: args.thicknessM,
  };
  const heat = preparePackHeat({ arrangement: args.arrangement, bars: [bar] }, args.conditions);
  const rdcAt = (t: number) => (args.conductor.rho20OhmM * (1 + args.conductor.alpha20PerK * (t - 20))) / (args.widthM * args.thicknessM);
  let referenceC = limitC;
  let acFactor = 1;
  for (let pass = 0; pass < MAX_COUPLING_PASSES; pass++) {
    acFactor =
      args.excitation.kind === 'dc'
        ? 1
        : isolatedBarAcFactor({
            widthM: args.widthM,
            thicknessM: args.thicknessM,
            resistivityOhmM: rdcAt(referenceC) * args.widthM * args.thicknessM,
            frequencyHz: args.excitation.frequencyHz,
            mesh: args.mesh,
          }).acFactor;
    const unitLoss = new Float64Array([acFactor * rdcAt(referenceC)]);
    const { currentA, result } = ampacityAtFrozenDistribution(heat, unitLoss, new Float64Array([referenceC]), args.conductor.alpha20PerK, limitC);
    if (Math.abs(result.hottestC - referenceC) < COUPLING_TOLERANCE_K || pass === MAX_COUPLING_PASSES - 1) {
      return { ampacityA: currentA, acFactor, temperatureC: result.hottestC, heat: result };
    }
    referenceC = result.hottestC;
  }
  throw new Error('unreachable');
}

export interface PackRatingBreakdown {
  barsPerPhase: number;
  /** One bar alone, DC resistance. */
  singleBarDcA: number;
  /** One bar alone with its own R_ac/R_dc. */
  singleBarAcA: number;
  singleBarAcFactor: number;
  /** n × one bar alone (DC): what a pack was rated as. */
  naivePackA: number;
  /** The system with its pack heat transfer, current shared as at DC (equal). */
  systemDcA: number;
  /** The system with pack heat transfer and the AC current distribution: the ampacity. */
  systemAcA: number;
  /** systemDcA / naivePackA: the inner faces (and the neighbouring phases) seeing each other instead of the room. */
  heatTransferFactor: number;
  /** systemAcA / systemDcA: unequal sharing, skin and proximity effect at AC. */
  currentSharingFactor: number;
  ac: BusbarRatingResult;
  dc: BusbarRatingResult;
}

/** The system's AC ampacity against n × one bar, with the two causes of the difference separated. */
export function packRatingBreakdown(input: Omit<BusbarRatingInput, 'excitation'> & { frequencyHz: number }): PackRatingBreakdown {
  const { system } = input;
  const single = (excitation: RatingExcitation) =>
    rateIsolatedBar({
      widthM: system.barWidthM,
      thicknessM: system.barThicknessM,
      arrangement: system.arrangement,
      conductor: input.conductor,
      conditions: input.conditions,
      excitation,
      mesh: input.mesh,
    });
  const singleDc = single({ kind: 'dc' });
  const singleAc = single({ kind: 'three-phase', frequencyHz: input.frequencyHz });
  const dc = rateBusbarSystem({ ...input, excitation: { kind: 'dc' } });
  const ac = rateBusbarSystem({ ...input, excitation: { kind: 'three-phase', frequencyHz: input.frequencyHz } });
  const naivePackA = system.barsPerPhase * singleDc.ampacityA;
  return {
    barsPerPhase: system.barsPerPhase,
    singleBarDcA: singleDc.ampacityA,
    singleBarAcA: singleAc.ampacityA,
    singleBarAcFactor: singleAc.acFactor,
    naivePackA,
    systemDcA: dc.ampacityA,
    systemAcA: ac.ampacityA,
    heatTransferFactor: dc.ampacityA / naivePackA,
    currentSharingFactor: ac.ampacityA / dc.ampacityA,
    ac,
    dc,
  };
}

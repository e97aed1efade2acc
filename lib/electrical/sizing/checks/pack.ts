/**
 * Checks of a bus-bar pack (two or more bars per phase), on the system model of busbarSystem.ts
 * instead of the single-bar slab: the ampacity at which the hottest bar of the system reaches the
 * limit, and the pack at the design current — each bar's current share, loss and temperature.
 */
import type { BusbarFlag, PackHeatResult, PreparedBusbarSystem } from '../../busbar';
import { SizingError } from '../../errors';
import { packAmpacity, packStateAt, type BusbarSystemModel, type PackState } from '../busbarSystem';
import type { SizingContext } from '../context';
import { MODEL_TEXT, RESULT_TEXT } from '../flagText';
import { fmt, type FlagSet } from '../flags';
import type { PreparedBar } from '../prepared';
import type { AmpacityResult, HeatProfile, PackResult } from '../types';
import { NEAR_RUNAWAY_RATIO } from './designPoint';
import type { ThermalAtDesign } from './designPoint';


/** Phase current of one run of the pack, for a circuit current (parallel runs, derating). */
function perRun(ctx: SizingContext, circuitA: number): number {
  return circuitA / ctx.cand.parallel / (ctx.cond.groupingFactor * ctx.cond.enclosureFactor);
}
function fromRun(ctx: SizingContext, runA: number): number {
  return runA * ctx.cand.parallel * ctx.cond.groupingFactor * ctx.cond.enclosureFactor;
}

/** Temperatures across the governing phase's pack, as a profile for the plot. */
function packProfile(system: PreparedBusbarSystem, heat: PackHeatResult): HeatProfile {
  const hottest = system.bars[heat.hottestBar];
  const pack = system.groups[hottest.groupIndex].barIndices.map((i) => system.bars[i]);
  const along = (b: (typeof pack)[number]) => (system.arrangement === 'edge' ? b.cxM : b.cyM);
  const origin = along(pack[0]) - pack[0].thicknessM / 2;
  return {
    geometry: 'slab',
    positionsM: pack.map((b) => along(b) - origin),
    temperaturesC: pack.map((b) => heat.bars[b.index].temperatureC),
    layers: pack.map((b) => ({ name: `${b.group} bar ${b.positionInPack + 1}`, startM: along(b) - origin - b.thicknessM / 2, endM: along(b) - origin + b.thicknessM / 2, generating: true })),
    hotSpot: { temperatureC: heat.hottestC, positionM: along(hottest) - origin },
  };
}

function packResultOf(m: BusbarSystemModel, state: PackState, runA: number, ctx: SizingContext): PackResult {
  const system = m.system;
  const derating = ctx.cond.groupingFactor * ctx.cond.enclosureFactor;
  const bars = system.bars.map((b) => {
    const d = state.distribution.bars[b.index];
    return {
      phase: b.group,
      positionInPack: b.positionInPack,
      shareOfPhase: d.shareOfPhase,
      // The model runs at the current raised by the user's derating factors; report the real one.
      currentA: d.currentA * derating,
      lossWPerM: d.lossWPerM * derating * derating,
      temperatureC: state.heat.bars[b.index].temperatureC,
      acFactor: d.acFactor,
    };
  });
  const hot = system.bars[state.heat.hottestBar];
  void runA;
  return {
    bars,
    hottest: { phase: hot.group, positionInPack: hot.positionInPack, temperatureC: state.heat.hottestC },
    // (null or not finite where the current is all but zero: the ratio is a property of the geometry, 1 then)
    acFactor: Math.max(1, ...state.distribution.groups.map((g) => (g.acFactor !== null && Number.isFinite(g.acFactor) ? g.acFactor : 1))),
    method: MODEL_TEXT.packRated(system.barsPerPhase, `the ${ordinal(hot.positionInPack + 1)} bar of phase ${hot.group}`),
  };
}

function ordinal(n: number): string {
  return n === 1 ? '1st' : n === 2 ? '2nd' : n === 3 ? '3rd' : `${n}th`;
}

/** The bus-bar module's flags into the candidate's (their codes are in the sizing registry). */
function addBusbarFlags(flags: FlagSet, raised: readonly BusbarFlag[]): void {
  for (const f of raised) flags.add(f.code, f.message);
}

const MIN_RISE_K = 1e-6;

export function packAmpacityCheck(ctx: SizingContext, m: BusbarSystemModel): AmpacityResult {
  const cand = ctx.cand as PreparedBar;
  const limit = cand.contactLimit;
  // A rise of less than a microkelvin allows no current worth the name (and leaves the pack's heat
  // balance without a temperature difference to solve on).
  if (!(limit.temperatureC - m.ambientC > MIN_RISE_K)) {
    const state = packStateAt(m, 0, m.ambientC);
    if (!state) throw new SizingError('SOLVER_NOT_CONVERGED', 'the pack could not be solved without current');
    return zeroAmpacity(ctx, m, state, limit);
  }
  const r = packAmpacity(m, limit.temperatureC);
  ctx.solves += 1;
  addBusbarFlags(ctx.flags, r.flags);
  const current = fromRun(ctx, r.currentA);
  const pack = packResultOf(m, r.state, r.currentA, ctx);
  ctx.flags.add('PACK_RATED_AS_SYSTEM', pack.method, { barsPerPhase: cand.barsPerPhase });
  const profile = packProfile(m.system, r.state.heat);
  // The search closes to 1e-6 relative from either side: report the lower end of a 0.1 A bracket.
  const lower = Math.max(0, current - 0.05);
  return {
    current: lower,
    hotSpot: { temperature: r.state.heat.hottestC, position: profile.hotSpot.positionM },
    iterations: 1,
    solves: ctx.solves,
    conductorCurrentA: pack.bars.reduce((mx, b) => Math.max(mx, b.currentA), 0),
    governingLimit: limit,
    acFactor: pack.acFactor,
    bracketA: [lower, lower + 0.1],
    closedForm: null,
    profile,
    flags: [],
  };
}

function zeroAmpacity(ctx: SizingContext, m: BusbarSystemModel, state: PackState, limit: PreparedBar['contactLimit']): AmpacityResult {
  const profile = packProfile(m.system, state.heat);
  return {
    current: 0,
    hotSpot: { temperature: state.heat.hottestC, position: profile.hotSpot.positionM },
    iterations: 1,
    solves: ctx.solves,
    conductorCurrentA: 0,
    governingLimit: limit,
    acFactor: 1,
    bracketA: [0, 0],
    closedForm: null,
    profile,
    zeroBecause: `at zero current the bars are already at ${fmt(state.heat.hottestC, 4)} °C, not below the ${fmt(limit.temperatureC, 4)} °C limit`,
    flags: [],
  };
}

/** The pack at a circuit current: null past runaway. */
export function packAt(ctx: SizingContext, m: BusbarSystemModel, circuitA: number): { state: PackState; pack: PackResult; profile: HeatProfile } | null {
  ctx.solves += 1;
  const runA = perRun(ctx, circuitA);
  const state = packStateAt(m, runA, ctx.cand.contactLimit.temperatureC);
  if (!state) return null;
  return { state, pack: packResultOf(m, state, runA, ctx), profile: packProfile(m.system, state.heat) };
}

/** The thermal result of a pack at the design current, with the flags of the result. */
export function packThermalAtDesign(ctx: SizingContext, m: BusbarSystemModel, amp: AmpacityResult): { thermal: ThermalAtDesign; pack: PackResult | null; profile: HeatProfile | null } {
  const { cond, flags } = ctx;
  const cand = ctx.cand as PreparedBar;
  const limit = amp.governingLimit;
  const at = packAt(ctx, m, cond.designCurrentA);
  if (!at) {
    flags.add('RUNAWAY', RESULT_TEXT.runaway(cond.designCurrentA, undefined));
    flags.add('BUSBAR_NO_STEADY_STATE', `At ${fmt(cond.designCurrentA, 4)} A the pack's heat balance has no steady state.`);
    return { thermal: { limit, hotSpotC: null, governingTemperatureC: null, marginK: null, marginPercent: null, conductorC: null, resistanceOhmPerM: null, lossPerConductorWPerM: null }, pack: null, profile: null };
  }
  const hot = at.state.heat.hottestC;
  const marginK = limit.temperatureC - hot;
  const allowedK = limit.temperatureC - m.ambientC;
  const marginPercent = allowedK > 0 ? (100 * marginK) / allowedK : marginK >= 0 ? 0 : -100;
  if (marginK < 0) flags.add('OVER_LIMIT', RESULT_TEXT.overLimit(cond.designCurrentA, limit.layer ?? limit.source, limit.temperatureC, hot), { temperatureC: hot, limitC: limit.temperatureC });
  else if (marginPercent < 10) flags.add('MARGIN_UNDER_10', RESULT_TEXT.marginUnder10(marginK, marginPercent, allowedK), { marginK, marginPercent });
  // The constant-R_th estimate (I/I_r)² = α·Δθ/(1 + α(θ − 20)) (references.md closed form), cautious.
  const r2 = (cand.alpha20 * (hot - m.ambientC)) / (1 + cand.alpha20 * (hot - 20));
  const ratio = r2 > 0 ? Math.sqrt(r2) : 0;
  if (ratio >= NEAR_RUNAWAY_RATIO) flags.add('NEAR_RUNAWAY', RESULT_TEXT.nearRunaway(ratio), { ratio });
  const bars = at.pack.bars.filter((b) => b.phase !== 'N' && b.phase !== 'PE');
  const meanLoss = bars.reduce((s, b) => s + b.lossWPerM, 0) / bars.length;
  const meanBarA = cond.designCurrentA / cand.conductorsPerPhase;
  return {
    thermal: {
      limit,
      hotSpotC: hot,
      governingTemperatureC: hot,
      marginK,
      marginPercent,
      conductorC: hot,
      resistanceOhmPerM: meanBarA > 0 ? meanLoss / (meanBarA * meanBarA) : null,
      lossPerConductorWPerM: meanLoss,
    },
    pack: at.pack,
    profile: at.profile,
  };
}

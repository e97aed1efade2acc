/**
 * Validation and normalisation of one candidate under prepared conditions, and the assumption
 * flags that follow from the inputs alone (no solve needed). Every refusal names the field.
 * The result is a discriminated union (PreparedCable | PreparedBar): nothing after this casts.
 */
import { ElectricalInputError, requireInteger, requireNonNegative, requireRange } from '../errors';
import { materialConstants, type ConductorMaterialConstants } from '../materials';
import { toMoney } from '../economics';
import { effectiveInternalLayer, multicoreCableThermal } from '../multicore';
import { checkBound } from '../../inputBounds';
import { DEFAULT_TEXT, ENTERED_TEXT, MODEL_TEXT } from './flagText';
import { FlagSet, fmt } from './flags';
import type { PreparedBar, PreparedCable, PreparedCandidate, PreparedConditions, PreparedLayer } from './prepared';
import type { BarCandidate, CableCandidate, CableScreen, Candidate, GoverningLimit, LimitSource } from './types';

/** Jacket emissivity when none is given (PVC/PE, common practice ~0.9). */
export const DEFAULT_CABLE_EMISSIVITY = 0.9;
/** Bare bright metal: low emissivity is the cautious guess (less radiation, hotter bar). */
export const DEFAULT_BARE_BAR_EMISSIVITY = 0.1;
/** Painted or coated bar surface without a stated emissivity (common practice ~0.9). */
export const DEFAULT_COATED_BAR_EMISSIVITY = 0.9;

interface Rating {
  c: number;
  source: LimitSource;
  layer?: string;
}

/**
 * The user's own limit applied to a list of material ratings — the one place the rule lives:
 * the user's limit caps every rating; when it is RAISED it replaces the coverings' ratings (not a
 * terminal's), flagged against the lowest rating it exceeds. Returns the ratings still in force
 * (the user's own limit among them).
 */
function underUserLimit(ratings: Rating[], conditions: PreparedConditions, flags: FlagSet | undefined): Rating[] {
  const user = conditions.userLimitC;
  if (user === undefined) return ratings;
  if (!conditions.raiseMaterialLimit) return [...ratings, { c: user, source: 'user' }];
  const replaced = ratings.filter((r) => r.source !== 'terminal');
  const exceeded = replaced.filter((r) => r.c < user);
  if (exceeded.length > 0 && flags) {
    const worst = exceeded.reduce((a, b) => (a.c < b.c ? a : b));
    const why = conditions.userLimitJustification;
    flags.add('USER_LIMIT_ABOVE_RATING', ENTERED_TEXT.userLimitAboveRating(user, worst.c, worst.layer ?? worst.source, why), { userLimitC: user, ratingC: worst.c });
    if (!why) flags.add('USER_LIMIT_NOT_JUSTIFIED', ENTERED_TEXT.userLimitNotJustified(user, worst.c), { userLimitC: user, ratingC: worst.c });
  }
  return [...ratings.filter((r) => r.source === 'terminal'), { c: user, source: 'user' }];
}

function lowestRating(ratings: Rating[], field: string): GoverningLimit {
  if (ratings.length === 0) throw new ElectricalInputError(field, 'no temperature limit is known: give the covering or terminal limit, or a user limit');
  const min = ratings.reduce((a, b) => (b.c < a.c ? b : a));
  return min.layer === undefined ? { temperatureC: min.c, source: min.source } : { temperatureC: min.c, source: min.source, layer: min.layer };
}

function limitOf(value: unknown, field: string): number | undefined {
  return value === undefined || value === null ? undefined : requireRange(value, field, -50, 1000);
}

interface CommonPrep {
  index: number;
  id: string;
  label: string;
  constants: Readonly<ConductorMaterialConstants>;
  alpha20: number;
  r20: number;
  parallel: number;
  f: (name: string) => string;
  conditions: PreparedConditions;
  flags?: FlagSet;
}

export function prepareCandidate(candidate: Candidate, index: number, conditions: PreparedConditions, flags?: FlagSet): PreparedCandidate {
  const base = `candidates[${index}]`;
  const f = (name: string) => `${base}.${name}`;
  if (candidate === null || typeof candidate !== 'object') throw new ElectricalInputError(base, 'must be an object');
  const constants = materialConstants(candidate.material, f('material'));
  const alpha20 = candidate.alpha20PerK === undefined ? constants.alpha20PerK : requireRange(candidate.alpha20PerK, f('alpha20PerK'), 0, 0.01);
  const r20 = checkBound('r20OhmPerM', candidate.r20OhmPerM, f('r20OhmPerM'));
  const parallel = candidate.parallel === undefined ? 1 : checkBound('parallel', candidate.parallel, f('parallel'));
  const id = candidate.id ?? `candidate-${index + 1}`;
  if (candidate.costs !== undefined) {
    if (candidate.costs.conductorPricePerKg !== undefined) toMoney(candidate.costs.conductorPricePerKg, f('costs.conductorPricePerKg'));
    if (candidate.costs.pricePerM !== undefined) toMoney(candidate.costs.pricePerM, f('costs.pricePerM'));
    if (candidate.costs.densityKgPerM3 !== undefined) requireRange(candidate.costs.densityKgPerM3, f('costs.densityKgPerM3'), 100, 25_000);
  }
  const memory = candidate.dataFromMemory === true || (candidate.sourceNotes ?? []).some((n) => /from memory/i.test(String(n)));
  if (memory && flags) flags.add('DATA_FROM_MEMORY', ENTERED_TEXT.dataFromMemory(candidate.label ?? id));

  const common: CommonPrep = { index, id, label: candidate.label ?? id, constants, alpha20, r20, parallel, f, conditions, flags };
  if (candidate.kind === 'cable') return prepareCable(candidate, common);
  if (candidate.kind === 'bar') return prepareBar(candidate, common);
  throw new ElectricalInputError(f('kind'), `must be 'cable' or 'bar' (got ${String((candidate as { kind?: unknown }).kind)})`);
}

function prepareCable(cand: CableCandidate, p: CommonPrep): PreparedCable {
  const { f, conditions, flags } = p;
  if (conditions.placement === 'bar-on-edge' || conditions.placement === 'bar-flat') {
    throw new ElectricalInputError('conditions.installation.kind', `a cable cannot be installed as '${conditions.placement}'`);
  }
  const sectionMm2 = checkBound('sectionMm2', cand.sectionMm2, f('sectionMm2'));
  const dc = checkBound('conductorDiameterM', cand.conductorDiameterM, f('conductorDiameterM'));
  const cores = cand.cores === undefined ? 1 : checkBound('cores', cand.cores, f('cores'));
  if (!Array.isArray(cand.layers) || cand.layers.length === 0) {
    throw new ElectricalInputError(f('layers'), 'a cable needs at least its insulation layer');
  }
  const emissivityAssumed = cand.emissivity === undefined;
  const emissivity = emissivityAssumed ? DEFAULT_CABLE_EMISSIVITY : checkBound('emissivity', cand.emissivity, f('emissivity'));
  const ks = cand.ks === undefined ? undefined : checkBound('ks', cand.ks, f('ks'));
  const kp = cand.kp === undefined ? undefined : checkBound('kp', cand.kp, f('kp'));

  const layers: PreparedLayer[] = [];
  const shortCircuitLimits: (number | undefined)[] = [];
  let hasMetallicLayer = false;
  cand.layers.forEach((l, k) => {
    const lf = (n: string) => f(`layers[${k}].${n}`);
    if (l === null || typeof l !== 'object') throw new ElectricalInputError(f(`layers[${k}]`), 'must be an object');
    const thicknessM = checkBound('layerThicknessM', l.thicknessM, lf('thicknessM'));
    const rhoT = checkBound('thermalResistivityKmPerW', l.thermalResistivityKmPerW, lf('thermalResistivityKmPerW'));
    const limit = limitOf(l.continuousLimitC, lf('continuousLimitC'));
    shortCircuitLimits.push(limitOf(l.shortCircuitLimitC, lf('shortCircuitLimitC')));
    if (l.role === 'screen' || l.role === 'armour') hasMetallicLayer = true;
    layers.push({
      name: typeof l.name === 'string' && l.name.trim() ? l.name : `layer ${k + 1}`,
      role: l.role ?? (k === 0 ? 'insulation' : 'other'),
      thicknessM,
      conductivityWPerMK: 1 / rhoT,
      limitC: limit,
      contact: k === 0,
    });
  });
  // A conductor-screen layer without a limit passes "contact" to the next layer with one; the
  // fault limit is the first layer's, else that contact layer's.
  const contactIndex = layers.findIndex((l) => l.limitC !== undefined);
  const contactRatings: Rating[] = [];
  if (contactIndex >= 0) {
    contactRatings.push({ c: layers[contactIndex].limitC as number, source: 'insulation', layer: layers[contactIndex].name });
    for (let k = 0; k <= contactIndex; k++) layers[k].contact = true;
  }
  const shortCircuitLimitC = shortCircuitLimits[0] ?? (contactIndex >= 0 ? shortCircuitLimits[contactIndex] : undefined);
  const contactLimit = lowestRating(underUserLimit(contactRatings, conditions, flags), f('layers[0].continuousLimitC'));
  // Outer layers keep their own limits, under the same user rule.
  for (const l of layers) {
    if (l.contact || l.limitC === undefined) {
      l.limitC = undefined;
      continue;
    }
    const inForce = underUserLimit([{ c: l.limitC, source: 'layer', layer: l.name }], conditions, flags);
    // A raised user limit replaces the covering's rating: the layer keeps no limit of its own.
    l.limitC = conditions.raiseMaterialLimit ? undefined : Math.min(...inForce.map((r) => r.c));
  }

  const screenLayerIndex = layers.findIndex((l) => l.role === 'screen');
  let screen: CableScreen | undefined;
  if (cand.screen !== undefined) {
    const sf = (n: string) => f(`screen.${n}`);
    if (cand.screen === null || typeof cand.screen !== 'object') throw new ElectricalInputError(f('screen'), 'must be an object');
    if (cores > 1) throw new ElectricalInputError(f('screen'), 'screen losses are computed for single-core cables');
    if (screenLayerIndex < 0) throw new ElectricalInputError(f('screen'), "give the screen's place among the layers (a layer with role 'screen')");
    if (!['copper', 'aluminium', 'lead'].includes(cand.screen.material)) throw new ElectricalInputError(sf('material'), "must be 'copper', 'aluminium' or 'lead'");
    if (!['solid', 'single-point', 'cross-bonded'].includes(cand.screen.bonding)) throw new ElectricalInputError(sf('bonding'), "must be 'solid', 'single-point' or 'cross-bonded'");
    if (cand.screen.r20OhmPerM === undefined) requireRange(cand.screen.sectionMm2, sf('sectionMm2'), 0, 5000, { minExclusive: true });
    else requireRange(cand.screen.r20OhmPerM, sf('r20OhmPerM'), 0, 1, { minExclusive: true });
    screen = cand.screen;
  }
  const loadedCores = cores === 1 ? 1 : Math.min(cores, conditions.phases === 3 ? 3 : 2);
  // Third harmonics add up in the neutral of a four- or five-core cable (IEC 60364-5-52 Annex E):
  // I_N = 3·h₃·I_B, so the neutral, the fourth core, gives off (3·h₃)² times a phase core's heat.
  const neutralShare = neutralHeatShare(cores, conditions.phases, conditions.thirdHarmonicFraction);
  const equivalentDiameter = dc * Math.sqrt(loadedCores);
  const multicore = cores > 1 ? multicoreHeatPath(cores, loadedCores, dc, layers, neutralShare) : undefined;
  if (multicore) layers.splice(0, layers.length, ...multicore.layers);
  const outerDiameterM = multicore ? multicore.thermal.outerDiameterM : equivalentDiameter + 2 * layers.reduce((s, l) => s + l.thicknessM, 0);
  if (conditions.buried && conditions.buried.depthM <= outerDiameterM / 2) {
    throw new ElectricalInputError('conditions.installation.depthM', `the cable axis must be deeper than its radius (${fmt(outerDiameterM / 2)} m)`);
  }

  if (flags) {
    if (emissivityAssumed && conditions.surfaceCoefficientWPerM2K === undefined && conditions.placement !== 'buried') {
      flags.add('EMISSIVITY_ASSUMED', DEFAULT_TEXT.cableEmissivity(DEFAULT_CABLE_EMISSIVITY));
    }
    if (multicore) {
      const t = multicore.thermal;
      flags.add('MULTICORE_ROUND_CORES', MODEL_TEXT.multicoreGeometry(cores, loadedCores, t.perCoreT1KmPerW[t.hottestCore] ?? 0, t.outerDiameterM, t.mediumResistivityBasis), {
        cores,
        loadedCores,
        t1KmPerW: t.perCoreT1KmPerW[t.hottestCore] ?? 0,
        outerDiameterM: t.outerDiameterM,
      });
    }
    if (hasMetallicLayer && conditions.frequencyHz > 0 && screen === undefined) flags.add('SHEATH_LOSSES_NOT_INCLUDED', MODEL_TEXT.sheathLosses());
    if (p.parallel > 1) flags.add('PARALLEL_SHARING_ASSUMED', MODEL_TEXT.cableParallelSharing(p.parallel), { parallel: p.parallel });
  }

  return {
    kind: 'cable',
    index: p.index,
    id: p.id,
    label: p.label,
    source: cand,
    material: cand.material,
    constants: p.constants,
    alpha20: p.alpha20,
    r20: p.r20,
    conductorsPerPhase: p.parallel,
    parallel: p.parallel,
    sectionPerConductorMm2: sectionMm2,
    sectionPerPhaseMm2: sectionMm2 * p.parallel,
    contactLimit,
    layers,
    emissivity,
    shortCircuitLimitC,
    costs: cand.costs,
    cores,
    loadedCores,
    neutralHeatShare: neutralShare,
    conductorDiameterM: dc,
    outerDiameterM,
    ...(ks !== undefined ? { ks } : {}),
    ...(kp !== undefined ? { kp } : {}),
    hasMetallicLayer,
    ...(screen ? { screen } : {}),
    ...(screenLayerIndex >= 0 ? { screenLayerIndex } : {}),
  };
}

/**
 * The two-dimensional solve takes about 10 ms; its inputs are the cable's construction only, which
 * stays the same while a designer edits currents and surroundings, so recent results are kept.
 */
const MULTICORE_CACHE_SIZE = 64;
const multicoreCache = new Map<string, ReturnType<typeof multicoreCableThermal>>();
function cachedMulticoreThermal(args: Parameters<typeof multicoreCableThermal>[0]): ReturnType<typeof multicoreCableThermal> {
  const key = JSON.stringify(args);
  const hit = multicoreCache.get(key);
  if (hit) {
    multicoreCache.delete(key);
    multicoreCache.set(key, hit);
    return hit;
  }
  const result = multicoreCableThermal(args);
  multicoreCache.set(key, result);
  if (multicoreCache.size > MULTICORE_CACHE_SIZE) multicoreCache.delete(multicoreCache.keys().next().value as string);
  return result;
}

/**
 * The heat path inside a multi-core cable (issue 21, item 5): the cores laid up touching on one
 * circle, the insulation and fillers between them and the sheath solved in two dimensions
 * (lib/electrical/multicore: isothermal conductors and sheath, as IEC 60287-2-1 takes them), each
 * loaded core giving off the same loss. The one-conductor radial model keeps its equivalent
 * conductor d_c·√n (so that J and the heat per metre are the loaded cores'), and the first layer
 * becomes the one medium from it to the sheath's bore with the resistance that puts the
 * equivalent conductor at the hottest core's temperature; the layers outside (sheath, armour,
 * jacket) stay as they are, on the computed diameter under the sheath.
 *
 * Layers: the first is each core's insulation; the layers right after it with role 'filler' or
 * 'bedding' are the inner covering between the laid-up cores and the sheath; the rest are
 * concentric coverings over the whole cable.
 */
/**
 * The neutral's heat relative to one phase core's under third harmonics (0 without): (3·h₃)² for
 * the fourth core of a four- or five-core cable in a three-phase circuit, where Annex E puts the
 * neutral; other cables carry no neutral inside (flagged by the harmonics check).
 */
export function neutralHeatShare(cores: number, phases: number, thirdHarmonicFraction: number): number {
  if ((cores !== 4 && cores !== 5) || phases !== 3 || !(thirdHarmonicFraction > 0)) return 0;
  return (3 * thirdHarmonicFraction) ** 2;
}

function multicoreHeatPath(cores: number, loadedCores: number, dc: number, layers: PreparedLayer[], neutralShare = 0) {
  const insulation = layers[0];
  let k = 1;
  while (k < layers.length && (layers[k].role === 'filler' || layers[k].role === 'bedding')) k++;
  const inner = layers.slice(1, k);
  const outer = layers.slice(k);
  const innerThicknessM = inner.reduce((s, l) => s + l.thicknessM, 0);
  const insulationRho = 1 / insulation.conductivityWPerMK;
  // The fillers between the cores are of the inner covering's material when one is listed.
  const fillerRho = inner.length > 0 ? Math.max(...inner.map((l) => 1 / l.conductivityWPerMK)) : insulationRho;
  const thermal = cachedMulticoreThermal({
    cores,
    conductorDiameterM: dc,
    insulationThicknessM: insulation.thicknessM,
    insulationResistivityKmPerW: insulationRho,
    fillerResistivityKmPerW: fillerRho,
    innerCoveringThicknessM: innerThicknessM,
    coreLossesWPerM: Array.from({ length: cores }, (_, i) => (i < loadedCores ? 1 : i === loadedCores ? neutralShare : 0)),
    outerLayers: outer.map((l) => ({ name: l.name, thicknessM: l.thicknessM, thermalResistivityKmPerW: 1 / l.conductivityWPerMK })),
  });
  const effective = effectiveInternalLayer({
    internalResistanceForTotalKmPerW: thermal.internalResistanceForTotalKmPerW,
    radiusUnderSheathM: thermal.radiusUnderSheathM,
    conductorDiameterM: dc * Math.sqrt(loadedCores),
  });
  // A limit of the inner covering's own applies at the conductor's temperature here (it touches
  // the cores' insulation, which is at most that hot): cautious.
  const innerLimits = inner.map((l) => l.limitC).filter((c): c is number => c !== undefined);
  const merged: PreparedLayer = {
    name: `${insulation.name} and fillers, ${cores} cores laid up (two-dimensional heat path)`,
    role: 'insulation',
    thicknessM: effective.thicknessM,
    conductivityWPerMK: 1 / effective.thermalResistivityKmPerW,
    ...(innerLimits.length > 0 ? { limitC: Math.min(...innerLimits) } : {}),
    contact: true,
  };
  if (merged.limitC !== undefined) merged.contact = false;
  return { thermal, layers: [merged, ...outer] };
}

function prepareBar(cand: BarCandidate, p: CommonPrep): PreparedBar {
  const { f, conditions, flags } = p;
  if (conditions.placement === 'buried' || conditions.placement === 'cable-in-air') {
    throw new ElectricalInputError('conditions.installation.kind', `a bus bar cannot be installed as '${conditions.placement}'`);
  }
  const widthM = checkBound('barWidthM', cand.widthM, f('widthM'));
  const thicknessM = checkBound('barThicknessM', cand.thicknessM, f('thicknessM'));
  const barsPerPhase = cand.barsPerPhase === undefined ? 1 : checkBound('barsPerPhase', cand.barsPerPhase, f('barsPerPhase'));
  // A pack's bars need a gap between them (they would be one thicker bar otherwise).
  const barGapM = cand.barGapM === undefined ? thicknessM : barsPerPhase > 1 ? checkBound('packGapM', cand.barGapM, f('barGapM')) : checkBound('barGapM', cand.barGapM, f('barGapM'));
  const yieldStrengthPa = cand.yieldStrengthPa === undefined ? undefined : requireRange(cand.yieldStrengthPa, f('yieldStrengthPa'), 1e6, 2e9);
  const acResistanceRatio = cand.acResistanceRatio === undefined ? undefined : checkBound('acResistanceRatio', cand.acResistanceRatio, f('acResistanceRatio'));
  const terminal = limitOf(cand.terminalLimitC, f('terminalLimitC'));
  const ratings: Rating[] = [];
  const layers: PreparedLayer[] = [];
  let emissivity: number;
  let emissivityAssumed: boolean;
  let shortCircuitLimitC = limitOf(cand.shortCircuitLimitC, f('shortCircuitLimitC'));
  if (cand.coating !== undefined) {
    const c = cand.coating;
    const cf = (n: string) => f(`coating.${n}`);
    const name = c.name && c.name.trim() ? c.name : 'coating';
    const coatingLimit = limitOf(c.continuousLimitC, cf('continuousLimitC'));
    const coatingSc = limitOf(c.shortCircuitLimitC, cf('shortCircuitLimitC'));
    if (coatingSc !== undefined) shortCircuitLimitC = shortCircuitLimitC === undefined ? coatingSc : Math.min(shortCircuitLimitC, coatingSc);
    layers.push({
      name,
      role: 'coating',
      thicknessM: checkBound('coatingThicknessM', c.thicknessM, cf('thicknessM')),
      conductivityWPerMK: 1 / checkBound('thermalResistivityKmPerW', c.thermalResistivityKmPerW, cf('thermalResistivityKmPerW')),
      contact: true,
    });
    if (coatingLimit !== undefined) ratings.push({ c: coatingLimit, source: 'coating', layer: name });
    emissivityAssumed = c.emissivity === undefined;
    emissivity = emissivityAssumed ? DEFAULT_COATED_BAR_EMISSIVITY : checkBound('emissivity', c.emissivity, cf('emissivity'));
  } else {
    emissivityAssumed = cand.emissivity === undefined;
    emissivity = emissivityAssumed ? DEFAULT_BARE_BAR_EMISSIVITY : checkBound('emissivity', cand.emissivity, f('emissivity'));
  }
  if (terminal !== undefined) ratings.push({ c: terminal, source: 'terminal' });
  const contactLimit = lowestRating(underUserLimit(ratings, conditions, flags), f('terminalLimitC'));

  if (flags) {
    if (emissivityAssumed && conditions.surfaceCoefficientWPerM2K === undefined) {
      flags.add('EMISSIVITY_ASSUMED', cand.coating ? DEFAULT_TEXT.coatingEmissivity(DEFAULT_COATED_BAR_EMISSIVITY) : DEFAULT_TEXT.bareBarEmissivity(DEFAULT_BARE_BAR_EMISSIVITY));
    }
    flags.add('BAR_EDGES_LUMPED', MODEL_TEXT.barEdges((widthM + thicknessM) / widthM));
    if (p.parallel > 1) flags.add('PARALLEL_SHARING_ASSUMED', MODEL_TEXT.barParallelSharing(p.parallel), { parallel: p.parallel });
    if (acResistanceRatio !== undefined && conditions.frequencyHz > 0) {
      flags.add('AC_FACTOR_USER_ENTERED', ENTERED_TEXT.barAcRatio(acResistanceRatio), { ratio: acResistanceRatio });
    }
    if (conditions.reactanceOhmPerM === undefined) flags.add('BAR_REACTANCE_ASSUMED', DEFAULT_TEXT.barReactance());
  }
  const sectionMm2 = widthM * thicknessM * 1e6;
  const conductorsPerPhase = p.parallel * barsPerPhase;
  return {
    kind: 'bar',
    index: p.index,
    id: p.id,
    label: p.label,
    source: cand,
    material: cand.material,
    constants: p.constants,
    alpha20: p.alpha20,
    r20: p.r20,
    conductorsPerPhase,
    parallel: p.parallel,
    sectionPerConductorMm2: sectionMm2,
    sectionPerPhaseMm2: sectionMm2 * conductorsPerPhase,
    contactLimit,
    layers,
    emissivity,
    shortCircuitLimitC,
    costs: cand.costs,
    widthM,
    thicknessM,
    barsPerPhase,
    barGapM,
    ...(acResistanceRatio !== undefined ? { acResistanceRatio } : {}),
    ...(yieldStrengthPa !== undefined ? { yieldStrengthPa } : {}),
  };
}

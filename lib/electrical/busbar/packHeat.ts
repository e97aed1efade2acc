/**
 * Steady heat balance of every bar of a bus-bar system in still air (issue 18 §3).
 *
 * Each bar is one isothermal body: copper or aluminium conducts so well that the temperature
 * differences inside a bar are a few hundredths of a kelvin across its thickness and a few tenths
 * across its width even with all the current crowded to its edges (Biot number h·t/k ≈ 3e-4 for a
 * 10 mm bar), far below the differences between bars that this model is for. Each bar loses heat
 * through its four faces:
 *
 * - a wide face facing the room: natural convection of a vertical plate (bars on edge; Churchill &
 *   Chu 1975, length scale the bar width, lib/thermal/convection.ts) or of a horizontal plate
 *   (bars laid flat; upper face 0.54Ra^¼/0.15Ra^⅓, lower face 0.52Ra^⅕, L = width/2);
 * - a wide face facing another bar across a gap (bars on edge): the vertical channel correlation
 *   of Bar-Cohen & Rohsenow (channelConvection.ts), limited to the isolated-plate value of the same
 *   face; between bars laid flat the gap is a horizontal slot open only at its sides — no published
 *   correlation is used there and no convection is credited (conservative, flagged);
 * - the narrow edges: as the vertical plate of the bar (default, as the single-bar model does) or
 *   by the horizontal-plate correlations with L = thickness/2 (bars on edge); for bars laid flat
 *   the edges are vertical plates of height = thickness;
 * - radiation: grey diffuse surfaces of one emissivity, the room black at the ambient temperature,
 *   the two-dimensional radiosity network of all faces with view factors by crossed strings
 *   (viewFactors.ts). The gap faces see each other and, through the open ends of the gap, the room.
 *
 * The air everywhere is at the ambient temperature (no enclosure); the channel correlation itself
 * accounts for the heating of the air rising through a gap.
 */
import { KELVIN_OFFSET, STEFAN_BOLTZMANN } from '../../thermal/constants';
import {
  churchillChuVerticalPlate,
  horizontalPlateLowerHot,
  horizontalPlateUpperHot,
  rayleighNumber,
  VERTICAL_PLATE_RANGE,
} from '../../thermal/convection';
import { ElectricalInputError, requireRange, requireTemperature } from '../errors';
import { channelConvection, type ChannelCorrelation } from './channelConvection';
import { solveRealGeneral } from './complexDense';
import type { BusbarFlag } from './flags';
import type { BusbarArrangement, BusbarBar } from './geometry';
import { parallelStripsViewFactor } from './viewFactors';

export interface PackHeatConditions {
  ambientC: number;
  /** Emissivity of every bar surface, 0 … 1 (painted about 0.9; bare copper far lower). */
  emissivity: number;
  /** Bars on edge: how the narrow edges convect. Default 'as-vertical-plate'. */
  edgeConvection?: 'as-vertical-plate' | 'horizontal-plate';
  channelCorrelation?: ChannelCorrelation;
  /**
   * 'per-bar' (default): every bar has its own temperature, heat passes between bars only by
   * radiation (no conduction through spacers or joints), the hottest bar governs — conservative.
   * 'per-pack': the bars of a pack share one temperature, as if bonded by perfectly conducting
   * spacers — the optimistic bound. A real pack lies between the two.
   */
  thermalNodes?: 'per-bar' | 'per-pack';
}

export interface PackHeatGeometry {
  arrangement: BusbarArrangement;
  bars: readonly BusbarBar[];
}

type SurfaceConvection =
  | { kind: 'vertical-plate'; heightM: number }
  | { kind: 'channel'; spacingM: number; heightM: number; partnerBar: number }
  | { kind: 'horizontal-up'; lengthM: number }
  | { kind: 'horizontal-down'; lengthM: number }
  | { kind: 'none' };

export type SurfaceRole = 'open-face' | 'gap-face' | 'edge';

interface Surface {
  bar: number;
  role: SurfaceRole;
  /** Area per metre of run, m²/m. */
  lengthM: number;
  convection: SurfaceConvection;
}

export interface PreparedPackHeat {
  readonly arrangement: BusbarArrangement;
  readonly barCount: number;
  readonly ambientC: number;
  readonly emissivity: number;
  readonly channelCorrelation: ChannelCorrelation;
  /** Thermal node of each bar (its own index, or its pack's). */
  readonly nodeOfBar: readonly number[];
  readonly nodeCount: number;
  readonly surfaces: readonly Surface[];
  /** Net radiation leaving bar k: Σ_j exchange[k·n + j]·σT_j⁴ + toRoom[k]·σT_room⁴, W/m. */
  readonly radiationExchange: Float64Array;
  readonly radiationRoom: Float64Array;
  readonly flags: BusbarFlag[];
}

export interface BarHeatResult {
  index: number;
  temperatureC: number;
  lossWPerM: number;
  /** Convection from the faces that face the room, W/m. */
  convectionOpenFacesWPerM: number;
  /** Convection from the faces inside gaps (channels), W/m. */
  convectionGapFacesWPerM: number;
  convectionEdgesWPerM: number;
  /** Net radiation leaving the bar (to the room and to the other bars), W/m. */
  radiationWPerM: number;
}

export interface PackHeatResult {
  bars: BarHeatResult[];
  hottestBar: number;
  hottestC: number;
  iterations: number;
  converged: boolean;
  /** |Σ loss − Σ heat out| / Σ loss. */
  energyResidual: number;
  /** Smallest and largest Ra_S·S/L of the gaps where the channel correlation governed (null if none). */
  channelModifiedRayleigh: { min: number; max: number } | null;
  flags: BusbarFlag[];
}

function addFlag(flags: BusbarFlag[], flag: BusbarFlag): void {
  if (!flags.some((f) => f.code === flag.code)) flags.push(flag);
}

function buildSurfaces(geometry: PackHeatGeometry, conditions: Required<PackHeatConditions>): { surfaces: Surface[]; view: Map<string, number> } {
  const surfaces: Surface[] = [];
  // view factor from surface i to surface j, keyed "i,j"
  const view = new Map<string, number>();
  const bars = geometry.bars;
  const link = (i: number, j: number, fij: number) => {
    view.set(`${i},${j}`, fij);
  };
  if (geometry.arrangement === 'edge') {
    const order = [...bars].sort((a, b) => a.cxM - b.cxM);
    const minus = new Map<number, number>();
    const plus = new Map<number, number>();
    for (const bar of order) {
      const edgeConvection: SurfaceConvection =
        conditions.edgeConvection === 'horizontal-plate' ? { kind: 'horizontal-up', lengthM: bar.thicknessM / 2 } : { kind: 'vertical-plate', heightM: bar.widthM };
      minus.set(bar.index, surfaces.push({ bar: bar.index, role: 'open-face', lengthM: bar.sizeYM, convection: { kind: 'vertical-plate', heightM: bar.sizeYM } }) - 1);
      plus.set(bar.index, surfaces.push({ bar: bar.index, role: 'open-face', lengthM: bar.sizeYM, convection: { kind: 'vertical-plate', heightM: bar.sizeYM } }) - 1);
      surfaces.push({ bar: bar.index, role: 'edge', lengthM: bar.sizeXM, convection: edgeConvection });
      surfaces.push({
        bar: bar.index,
        role: 'edge',
        lengthM: bar.sizeXM,
        convection: conditions.edgeConvection === 'horizontal-plate' ? { kind: 'horizontal-down', lengthM: bar.thicknessM / 2 } : edgeConvection,
      });
    }
    for (let k = 0; k + 1 < order.length; k++) {
      const left = order[k];
      const right = order[k + 1];
      const spacingM = right.cxM - right.sizeXM / 2 - (left.cxM + left.sizeXM / 2);
      const i = plus.get(left.index)!;
      const j = minus.get(right.index)!;
      const a = { lo: left.cyM - left.sizeYM / 2, hi: left.cyM + left.sizeYM / 2 };
      const b = { lo: right.cyM - right.sizeYM / 2, hi: right.cyM + right.sizeYM / 2 };
      link(i, j, parallelStripsViewFactor(spacingM, a, b));
      link(j, i, parallelStripsViewFactor(spacingM, b, a));
      const heightM = Math.min(left.sizeYM, right.sizeYM);
      surfaces[i] = { ...surfaces[i], role: 'gap-face', convection: { kind: 'channel', spacingM, heightM, partnerBar: right.index } };
      surfaces[j] = { ...surfaces[j], role: 'gap-face', convection: { kind: 'channel', spacingM, heightM, partnerBar: left.index } };
    }
    return { surfaces, view };
  }

  // Bars laid flat: packs side by side along x, the bars of a pack stacked along y.
  const packs = new Map<number, BusbarBar[]>();
  for (const bar of bars) packs.set(bar.groupIndex, [...(packs.get(bar.groupIndex) ?? []), bar]);
  const packOrder = [...packs.values()].map((p) => [...p].sort((a, b) => a.cyM - b.cyM)).sort((a, b) => a[0].cxM - b[0].cxM);
  const leftEdges: number[][] = [];
  const rightEdges: number[][] = [];
  for (const pack of packOrder) {
    const lefts: number[] = [];
    const rights: number[] = [];
    let below: number | null = null;
    pack.forEach((bar, k) => {
      const bottom = surfaces.push({ bar: bar.index, role: 'open-face', lengthM: bar.sizeXM, convection: { kind: 'horizontal-down', lengthM: bar.sizeXM / 2 } }) - 1;
      const top = surfaces.push({ bar: bar.index, role: 'open-face', lengthM: bar.sizeXM, convection: { kind: 'horizontal-up', lengthM: bar.sizeXM / 2 } }) - 1;
      lefts.push(surfaces.push({ bar: bar.index, role: 'edge', lengthM: bar.sizeYM, convection: { kind: 'vertical-plate', heightM: bar.sizeYM } }) - 1);
      rights.push(surfaces.push({ bar: bar.index, role: 'edge', lengthM: bar.sizeYM, convection: { kind: 'vertical-plate', heightM: bar.sizeYM } }) - 1);
      if (below !== null) {
        const under = pack[k - 1];
        const spacingM = bar.cyM - bar.sizeYM / 2 - (under.cyM + under.sizeYM / 2);
        const a = { lo: under.cxM - under.sizeXM / 2, hi: under.cxM + under.sizeXM / 2 };
        const b = { lo: bar.cxM - bar.sizeXM / 2, hi: bar.cxM + bar.sizeXM / 2 };
        link(below, bottom, parallelStripsViewFactor(spacingM, a, b));
        link(bottom, below, parallelStripsViewFactor(spacingM, b, a));
        surfaces[below] = { ...surfaces[below], role: 'gap-face', convection: { kind: 'none' } };
        surfaces[bottom] = { ...surfaces[bottom], role: 'gap-face', convection: { kind: 'none' } };
      }
      below = top;
    });
    leftEdges.push(lefts);
    rightEdges.push(rights);
  }
  for (let p = 0; p + 1 < packOrder.length; p++) {
    const leftPack = packOrder[p];
    const rightPack = packOrder[p + 1];
    const spacingM = rightPack[0].cxM - rightPack[0].sizeXM / 2 - (leftPack[0].cxM + leftPack[0].sizeXM / 2);
    leftPack.forEach((a, ia) =>
      rightPack.forEach((b, ib) => {
        const i = rightEdges[p][ia];
        const j = leftEdges[p + 1][ib];
        const sa = { lo: a.cyM - a.sizeYM / 2, hi: a.cyM + a.sizeYM / 2 };
        const sb = { lo: b.cyM - b.sizeYM / 2, hi: b.cyM + b.sizeYM / 2 };
        link(i, j, parallelStripsViewFactor(spacingM, sa, sb));
        link(j, i, parallelStripsViewFactor(spacingM, sb, sa));
      }),
    );
  }
  return { surfaces, view };
}

/**
 * Radiosity network, linear in the black-body emissive powers E = σT⁴ (grey, diffuse, one
 * emissivity ε, room black): J = εE + (1 − ε)(F·J + F_room·E_room), net heat leaving surface i
 * Q_i = A_i·ε·(E_i − G_i), G = F·J + F_room·E_room (Incropera §13.3, from memory). Folded per bar
 * once, so each evaluation of the heat balance costs one small matrix–vector product.
 */
function radiationNetwork(surfaces: readonly Surface[], view: Map<string, number>, barCount: number, emissivity: number) {
  const m = surfaces.length;
  const exchange = new Float64Array(barCount * barCount);
  const room = new Float64Array(barCount);
  if (emissivity === 0) return { exchange, room };
  const f = new Float64Array(m * m);
  for (const [key, value] of view) {
    const [i, j] = key.split(',').map(Number);
    f[i * m + j] = value;
  }
  const fRoom = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    let sum = 0;
    for (let j = 0; j < m; j++) sum += f[i * m + j];
    fRoom[i] = 1 - sum;
  }
  const columns = barCount + 1;
  const a = new Float64Array(m * m);
  const rhs = new Float64Array(m * columns);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) a[i * m + j] = (i === j ? 1 : 0) - (1 - emissivity) * f[i * m + j];
    rhs[i * columns + surfaces[i].bar] = emissivity;
    rhs[i * columns + barCount] = (1 - emissivity) * fRoom[i];
  }
  // J = X·[E_bars; E_room]
  const x = solveRealGeneral(m, a, rhs, columns);
  for (let i = 0; i < m; i++) {
    const k = surfaces[i].bar;
    const weight = surfaces[i].lengthM * emissivity;
    for (let c = 0; c < columns; c++) {
      // G_i coefficient of column c: Σ_j F_ij X_jc (+ F_room,i for the room column)
      let g = 0;
      for (let j = 0; j < m; j++) g += f[i * m + j] * x[j * columns + c];
      if (c === barCount) {
        room[k] += -weight * (g + fRoom[i]);
      } else {
        exchange[k * barCount + c] += weight * ((c === k ? 1 : 0) - g);
      }
    }
  }
  return { exchange, room };
}

/** Validates the conditions and builds the surfaces and the radiation network (once per geometry). */
export function preparePackHeat(geometry: PackHeatGeometry, conditions: PackHeatConditions): PreparedPackHeat {
  const ambientC = requireTemperature(conditions?.ambientC, 'ambientC');
  const emissivity = requireRange(conditions?.emissivity, 'emissivity', 0, 1);
  const edgeConvection = conditions.edgeConvection ?? 'as-vertical-plate';
  if (edgeConvection !== 'as-vertical-plate' && edgeConvection !== 'horizontal-plate') {
    throw new ElectricalInputError('edgeConvection', "must be 'as-vertical-plate' or 'horizontal-plate'");
  }
  const channelCorrelation = conditions.channelCorrelation ?? 'bar-cohen-rohsenow';
  if (channelCorrelation !== 'bar-cohen-rohsenow' && channelCorrelation !== 'elenbaas') {
    throw new ElectricalInputError('channelCorrelation', "must be 'bar-cohen-rohsenow' or 'elenbaas'");
  }
  if (geometry.bars.length === 0) throw new ElectricalInputError('bars', 'must list at least one bar');
  geometry.bars.forEach((b, i) => {
    if (b.index !== i) throw new ElectricalInputError(`bars[${i}].index`, 'must equal its position');
  });
  const thermalNodes = conditions.thermalNodes ?? 'per-bar';
  if (thermalNodes !== 'per-bar' && thermalNodes !== 'per-pack') throw new ElectricalInputError('thermalNodes', "must be 'per-bar' or 'per-pack'");
  const packIndex = [...new Set(geometry.bars.map((b) => b.groupIndex))];
  const nodeOfBar = geometry.bars.map((b) => (thermalNodes === 'per-bar' ? b.index : packIndex.indexOf(b.groupIndex)));
  const full: Required<PackHeatConditions> = { ambientC, emissivity, edgeConvection, channelCorrelation, thermalNodes };
  const { surfaces, view } = buildSurfaces(geometry, full);
  const { exchange, room } = radiationNetwork(surfaces, view, geometry.bars.length, emissivity);
  const flags: BusbarFlag[] = [
    {
      code: 'BUSBAR_BARS_ISOTHERMAL',
      severity: 'note',
      message: 'Each bar is taken at one temperature (its conduction evens it out to well under 1 K); the hottest bar governs.',
    },
  ];
  if (thermalNodes === 'per-pack') {
    flags.push({
      code: 'BUSBAR_PACK_ISOTHERMAL',
      severity: 'review',
      message: 'The bars of each pack are taken at one common temperature (perfect thermal bonding by spacers and joints): optimistic bound.',
    });
  }
  if (geometry.arrangement === 'edge') {
    flags.push({
      code: 'BUSBAR_EDGE_CONVECTION',
      severity: 'note',
      message:
        edgeConvection === 'as-vertical-plate'
          ? 'Narrow edges convect as the vertical plate of the bar (as the single-bar model lumps them).'
          : 'Narrow edges convect as horizontal plates of length thickness/2, a Rayleigh number far below the correlations’ range.',
    });
  } else if (geometry.bars.some((b) => geometry.bars.some((o) => o !== b && o.groupIndex === b.groupIndex))) {
    flags.push({
      code: 'BUSBAR_FLAT_GAP_NO_CONVECTION',
      severity: 'review',
      message: 'Bars laid flat: no convection is credited inside the horizontal gaps of a pack (no published correlation used); radiation only. Conservative.',
    });
    flags.push({
      code: 'BUSBAR_FLAT_SLOT_RADIATION_TO_ROOM',
      severity: 'note',
      message: 'Bars laid flat: radiation leaving a gap through its open sides is counted as reaching the room, also the part that meets the neighbouring pack (slightly optimistic).',
    });
  }
  return {
    arrangement: geometry.arrangement,
    barCount: geometry.bars.length,
    ambientC,
    emissivity,
    channelCorrelation,
    nodeOfBar,
    nodeCount: thermalNodes === 'per-bar' ? geometry.bars.length : packIndex.length,
    surfaces,
    radiationExchange: exchange,
    radiationRoom: room,
    flags,
  };
}

interface ConvectionTally {
  open: Float64Array;
  gap: Float64Array;
  edge: Float64Array;
  channelRange: { min: number; max: number } | null;
  channelOutOfRange: boolean;
  channelLimited: boolean;
  plateOutOfRange: boolean;
}

function plateCoefficient(heightM: number, surfaceC: number, ambientC: number): { h: number; inRange: boolean } {
  const { rayleigh, air } = rayleighNumber({ lengthM: heightM, surfaceC, ambientC });
  return {
    h: (churchillChuVerticalPlate(rayleigh, air.prandtl) * air.conductivity) / heightM,
    inRange: rayleigh >= VERTICAL_PLATE_RANGE.min && rayleigh <= VERTICAL_PLATE_RANGE.max && air.inTable,
  };
}

function convection(prepared: PreparedPackHeat, temperaturesC: ArrayLike<number>): ConvectionTally {
  const n = prepared.barCount;
  const tally: ConvectionTally = {
    open: new Float64Array(n),
    gap: new Float64Array(n),
    edge: new Float64Array(n),
    channelRange: null,
    channelOutOfRange: false,
    channelLimited: false,
    plateOutOfRange: false,
  };
  const ambient = prepared.ambientC;
  for (const s of prepared.surfaces) {
    const t = temperaturesC[s.bar];
    const excess = t - ambient;
    let h = 0;
    const c = s.convection;
    switch (c.kind) {
      case 'vertical-plate': {
        const plate = plateCoefficient(c.heightM, t, ambient);
        h = plate.h;
        if (!plate.inRange) tally.plateOutOfRange = true;
        break;
      }
      case 'channel': {
        const partnerExcess = temperaturesC[c.partnerBar] - ambient;
        const meanExcess = 0.5 * (excess + partnerExcess);
        const channel = channelConvection({ spacingM: c.spacingM, heightM: c.heightM, excessK: meanExcess, ambientC: ambient, correlation: prepared.channelCorrelation });
        const plate = plateCoefficient(c.heightM, t, ambient);
        if (channel.h >= plate.h) {
          // A gap this wide is an open plate: the channel correlation is not what governs here.
          h = plate.h;
          tally.channelLimited = true;
          if (!plate.inRange) tally.plateOutOfRange = true;
          break;
        }
        h = channel.h;
        if (!channel.inRange) tally.channelOutOfRange = true;
        const r = channel.modifiedRayleigh;
        tally.channelRange = tally.channelRange ? { min: Math.min(tally.channelRange.min, r), max: Math.max(tally.channelRange.max, r) } : { min: r, max: r };
        break;
      }
      case 'horizontal-up':
      case 'horizontal-down': {
        const { rayleigh, air } = rayleighNumber({ lengthM: c.lengthM, surfaceC: t, ambientC: ambient });
        const r = c.kind === 'horizontal-up' ? horizontalPlateUpperHot(rayleigh) : horizontalPlateLowerHot(rayleigh);
        h = (r.nusselt * air.conductivity) / c.lengthM;
        if (!r.inRange || !air.inTable) tally.plateOutOfRange = true;
        break;
      }
      case 'none':
        h = 0;
        break;
    }
    const q = h * s.lengthM * excess;
    if (s.role === 'edge') tally.edge[s.bar] += q;
    else if (s.role === 'gap-face') tally.gap[s.bar] += q;
    else tally.open[s.bar] += q;
  }
  return tally;
}

function radiation(prepared: PreparedPackHeat, temperaturesC: ArrayLike<number>): Float64Array {
  const n = prepared.barCount;
  const emissive = new Float64Array(n);
  for (let k = 0; k < n; k++) emissive[k] = STEFAN_BOLTZMANN * (temperaturesC[k] + KELVIN_OFFSET) ** 4;
  const roomEmissive = STEFAN_BOLTZMANN * (prepared.ambientC + KELVIN_OFFSET) ** 4;
  const out = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    let q = prepared.radiationRoom[k] * roomEmissive;
    for (let j = 0; j < n; j++) q += prepared.radiationExchange[k * n + j] * emissive[j];
    out[k] = q;
  }
  return out;
}

/** Heat leaving each bar at the given temperatures, W/m, with its parts. */
export function packHeatOut(prepared: PreparedPackHeat, temperaturesC: ArrayLike<number>) {
  const conv = convection(prepared, temperaturesC);
  const rad = radiation(prepared, temperaturesC);
  const total = new Float64Array(prepared.barCount);
  for (let k = 0; k < prepared.barCount; k++) total[k] = conv.open[k] + conv.gap[k] + conv.edge[k] + rad[k];
  return { total, convection: conv, radiation: rad };
}

const NEWTON_TOLERANCE_K = 1e-7;
const MAX_NEWTON_ITERATIONS = 60;
const RUNAWAY_LIMIT_C = 1000;

/**
 * Bar temperatures at which every bar's loss equals the heat it gives off. `lossesWPerM(T)` gives
 * each bar's loss per metre at the bar temperatures T (°C). Newton's method with a finite-difference
 * Jacobian (tens of bars at most), each step limited to 50 K.
 */
export function solvePackHeat(
  prepared: PreparedPackHeat,
  lossesWPerM: (temperaturesC: Float64Array) => ArrayLike<number>,
  options: { initialC?: ArrayLike<number> } = {},
): PackHeatResult {
  const n = prepared.barCount;
  const nodes = prepared.nodeCount;
  const nodeOf = prepared.nodeOfBar;
  const node = new Float64Array(nodes).fill(prepared.ambientC + 30);
  if (options.initialC) for (let k = 0; k < n; k++) node[nodeOf[k]] = options.initialC[k];
  const barTemperatures = (values: Float64Array) => {
    const temps = new Float64Array(n);
    for (let k = 0; k < n; k++) temps[k] = values[nodeOf[k]];
    return temps;
  };
  const residual = (values: Float64Array) => {
    const temps = barTemperatures(values);
    const loss = lossesWPerM(temps);
    const out = packHeatOut(prepared, temps).total;
    const r = new Float64Array(nodes);
    for (let k = 0; k < n; k++) r[nodeOf[k]] += loss[k] - out[k];
    return r;
  };
  let converged = false;
  let iterations = 0;
  for (; iterations < MAX_NEWTON_ITERATIONS; iterations++) {
    const r0 = residual(node);
    const jacobian = new Float64Array(nodes * nodes);
    const step = 1e-4;
    for (let j = 0; j < nodes; j++) {
      const shifted = node.slice();
      shifted[j] += step;
      const r1 = residual(shifted);
      for (let i = 0; i < nodes; i++) jacobian[i * nodes + j] = (r1[i] - r0[i]) / step;
    }
    const delta = solveRealGeneral(nodes, jacobian, r0.map((v) => -v));
    let largest = 0;
    for (let k = 0; k < nodes; k++) largest = Math.max(largest, Math.abs(delta[k]));
    const scale = largest > 50 ? 50 / largest : 1;
    for (let k = 0; k < nodes; k++) node[k] += scale * delta[k];
    if (node.some((v) => !Number.isFinite(v) || v > RUNAWAY_LIMIT_C)) break;
    if (largest < NEWTON_TOLERANCE_K) {
      converged = true;
      iterations++;
      break;
    }
  }
  const t = barTemperatures(node);
  const flags = [...prepared.flags];
  if (!converged) {
    addFlag(flags, {
      code: 'BUSBAR_NO_STEADY_STATE',
      severity: 'blocker',
      message: `No steady bar temperatures found below ${RUNAWAY_LIMIT_C} °C: the losses outgrow the heat the bars can give off.`,
    });
  }
  const losses = lossesWPerM(t);
  const parts = packHeatOut(prepared, t);
  const conv = parts.convection;
  if (conv.channelOutOfRange) {
    addFlag(flags, {
      code: 'BUSBAR_CHANNEL_OUT_OF_RANGE',
      severity: 'review',
      message: `Gap convection outside the measured range of the channel correlation (Ra_S·S/L from ${conv.channelRange!.min.toPrecision(3)} to ${conv.channelRange!.max.toPrecision(3)}; measured about 0.1 … 1e5).`,
    });
  }
  if (conv.channelLimited) {
    addFlag(flags, {
      code: 'BUSBAR_CHANNEL_LIMITED_TO_PLATE',
      severity: 'note',
      message: 'In at least one gap the channel correlation exceeded the isolated-plate value of the same face; the plate value was used (a gap cannot cool better than open air).',
    });
  }
  if (conv.plateOutOfRange) {
    addFlag(flags, {
      code: 'BUSBAR_PLATE_OUT_OF_RANGE',
      severity: 'review',
      message: 'A plate correlation was used outside its stated Rayleigh range (or the air table).',
    });
  }
  let lossSum = 0;
  let outSum = 0;
  const bars: BarHeatResult[] = [];
  let hottestBar = 0;
  for (let k = 0; k < n; k++) {
    lossSum += losses[k];
    outSum += parts.total[k];
    if (t[k] > t[hottestBar]) hottestBar = k;
    bars.push({
      index: k,
      temperatureC: t[k],
      lossWPerM: losses[k],
      convectionOpenFacesWPerM: conv.open[k],
      convectionGapFacesWPerM: conv.gap[k],
      convectionEdgesWPerM: conv.edge[k],
      radiationWPerM: parts.radiation[k],
    });
  }
  return {
    bars,
    hottestBar,
    hottestC: t[hottestBar],
    iterations,
    converged,
    energyResidual: lossSum > 0 ? Math.abs(lossSum - outSum) / lossSum : Math.abs(outSum),
    channelModifiedRayleigh: conv.channelRange,
    flags,
  };
}

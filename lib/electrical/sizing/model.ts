/**
 * The thermal model of one conductor (physics.md §3), built as a `lib/thermal` problem
 * (physics.md §7), and what the sizing layer reads back from a solve: limit excess, profile,
 * heat per metre and the IEC 60287-style closed form beside it.
 *
 * Cables: a solid cylinder (conductor, generating) inside its coverings; the surface goes to air
 * (convection correlation + radiation + absorbed sun, or a fixed coefficient) or, buried, to the
 * ground temperature through the IEC 60287-2-1 external resistance
 *   T₄ = ρ_soil/(2π)·ln(u + √(u² − 1)), u = 2L/D_e
 * as a surface conductance h = 1/(T₄·π·D_e).
 * Bars: a slab through the thickness; on edge both faces are vertical plates and the bar is
 * symmetric, so half of it is solved (symmetry at the mid-plane); laid flat the lower and upper
 * faces differ and the whole thickness is solved. Edges are lumped onto the faces with
 * areaFactor (w + t)/w.
 */
import {
  busBarProblem,
  buriedExternalThermalResistance,
  cableProblem,
  prepare,
  type PreparedProblem,
  type Boundary,
  type SteadyResult,
  type SurfaceBoundary,
  type SurfaceDiagnostics,
  type ThermalProblem,
} from '../../thermal';
import type { CableGroup } from './cableGroup';
import type { PreparedBar, PreparedCable, PreparedCandidate, PreparedConditions } from './prepared';
import type { GoverningLimit, HeatProfile, ProfileLayer } from './types';

/** Cells per layer while searching for the ampacity. Coverings carry no source, so the
 *  log/linear face conductances make them exact at any cell count; the conductor's own small
 *  parabola is the only discretisation error (checked against the fine mesh in the tests). */
export const COARSE_CELLS = { conductor: 12, covering: 4, bar: 12 } as const;
/** Cells per layer for the reported profile (the solver's default, physics.md §1). */
export const FINE_CELLS = { conductor: 40, covering: 40, bar: 40 } as const;

export type Mesh = 'coarse' | 'fine';

interface ModelLayer {
  name: string;
  thicknessM: number;
  conductivity: number;
  generating: boolean;
  limitC?: number;
}

/** One cooled face of the model, per metre of conductor, for the closed form. */
interface FaceInfo {
  side: 'inner' | 'outer';
  /** Exchange area per metre of conductor (m²/m), including the edge lumping. */
  exchangeAreaPerM: number;
  /** Conductance of any covering between conductor and this face, W/(m·K) per metre (Infinity if bare). */
  coveringConductance: number;
  /** Absorbed (solar) flux per m² of exchange area. */
  absorbedFlux: number;
}

export interface ThermalModel {
  geometry: 'slab' | 'cylinder';
  layers: ModelLayer[];
  /** Temperature the rise is measured from (air or ground), °C. */
  referenceC: number;
  /** Model current = conductor current × this (multi-core equivalent conductor). */
  currentScale: number;
  /** Conductor area in the model, m², and the effective ρ₂₀ = R₂₀·A. */
  areaM2: number;
  rho20: number;
  /** Multiplier from the solver's heat per unit (m or m² of face) to W per metre of conductor. */
  heatPerMetreScale: number;
  faces: FaceInfo[];
  /** External resistance T₄ of a buried cable, K·m/W. */
  buriedT4?: number;
  /** The problem at a model current and AC factor. */
  problem(modelCurrentA: number, acFactor: number, mesh: Mesh): ThermalProblem;
  /** Heat released whatever the current (a cable's dielectric loss), W/m: with it, 0 A is not "no heat". */
  fixedHeatWPerM: number;
  /** The problem on a mesh, prepared once, solved at any model current and AC factor (a cable's screen loss settled). */
  solver(mesh: Mesh): CableSolve;
  /**
   * The same conductor and coverings with a linear outer surface of its own, prepared once: a
   * buried cable of a group, whose external resistance T₄ gives h = 1/(T₄·π·D_e) and whose ground
   * is raised by its neighbours' heat (the ambient given per call).
   */
  withOuterSurface(mesh: Mesh, hWPerM2K: number): CableSolve;
}

/** A thermal problem whose geometry and surroundings are fixed, solved at many currents. */
export type PreparedSolve = CableSolve;

export function buildThermalModel(c: PreparedCandidate, k: PreparedConditions, group?: CableGroup, losses?: CableLosses): ThermalModel {
  return c.kind === 'cable' ? cableModel(c, k, group, losses) : barModel(c, k);
}

/**
 * Losses of a cable besides its conductor's (IEC 60287-1-1 §2.2–2.3), released where they arise:
 * the screen's at its mid-radius, λ₁ times the conductor's loss (λ₁ from the conductor's AC
 * resistance and the screen's temperature, for the cable's place in its circuit); the dielectric
 * loss spread over the insulation. Both are point sources of the 1-D model.
 */
export interface CableLosses {
  screen?: { radiusM: number; lambda1: (position: string, conductorAcOhmPerM: number, screenC: number) => number; worstPosition: string };
  dielectric?: { lossWPerM: number; radiiM: number[] };
  /** R_ac of the model conductor per metre at a temperature. */
  acResistanceAt: (temperatureC: number) => number;
}

/** A prepared cable problem whose screen loss follows its conductor's: solved at a current (and ambient) for a cable's place. */
export interface CableSolve {
  at(modelCurrentA: number, acFactor: number, options?: { outerAmbientC?: number; position?: string }): SteadyResult;
}

const SCREEN_LOSS_SETTLED = 1e-10;

/** Mean temperature of the generating (first) layer of a converged cylinder solve. */
function conductorMeanC(result: SteadyResult): number {
  const bound = result.layerBounds[0];
  let sum = 0;
  let count = 0;
  result.positions.forEach((x, j) => {
    if (x >= bound.from && x <= bound.to) {
      sum += result.temperatures[j];
      count++;
    }
  });
  return count > 0 ? sum / count : result.hotSpot.temperature;
}

/** Temperature at the cell nearest a radius (the screen is thin: one cell holds it). */
function temperatureNear(result: SteadyResult, radiusM: number): number {
  let best = 0;
  for (let j = 1; j < result.positions.length; j++) if (Math.abs(result.positions[j] - radiusM) < Math.abs(result.positions[best] - radiusM)) best = j;
  return result.temperatures[best];
}

/**
 * Solves with the screen loss settled: λ₁·W_c depends on the conductor loss W_c and on the
 * temperatures it produces, so the heat at the screen is updated from each solve until it moves
 * by less than 1e-10 of W_c (the coupling is weak: two or three solves).
 */
export function withCableLosses(prepared: PreparedProblem, losses: CableLosses | undefined): CableSolve {
  const points = (losses?.screen ? 1 : 0) + (losses?.dielectric?.radiiM.length ?? 0);
  if (!losses || points === 0) return { at: (current, factor, o) => prepared.at(current, factor, o?.outerAmbientC !== undefined ? { outerAmbientC: o.outerAmbientC } : undefined) };
  const dielectric = losses.dielectric ? losses.dielectric.radiiM.map(() => losses.dielectric!.lossWPerM / losses.dielectric!.radiiM.length) : [];
  const dielectricTotal = dielectric.reduce((a, b) => a + b, 0);
  return {
    at: (current, factor, o) => {
      let screenHeat = 0;
      let result: SteadyResult | null = null;
      for (let pass = 0; pass < 30; pass++) {
        const pointHeats = losses.screen ? [screenHeat, ...dielectric] : dielectric;
        result = prepared.at(current, factor, { ...(o?.outerAmbientC !== undefined ? { outerAmbientC: o.outerAmbientC } : {}), pointHeats });
        if (!result.converged || !losses.screen) return result;
        const conductorW = (result.heatGeneratedWPerM ?? 0) - screenHeat - dielectricTotal;
        const thetaC = conductorMeanC(result);
        const lambda1 = losses.screen.lambda1(o?.position ?? losses.screen.worstPosition, losses.acResistanceAt(thetaC), temperatureNear(result, losses.screen.radiusM));
        const next = lambda1 * Math.max(0, conductorW);
        if (Math.abs(next - screenHeat) <= SCREEN_LOSS_SETTLED * Math.max(conductorW, 1e-9)) return result;
        screenHeat = next;
      }
      return result!;
    },
  };
}

/** Prepared solves of the two meshes, each made on first use. */
function solversOf(coarse: ThermalProblem, fine: ThermalProblem, losses?: CableLosses): (mesh: Mesh) => CableSolve {
  let coarseSolve: CableSolve | undefined;
  let fineSolve: CableSolve | undefined;
  return (mesh) => (mesh === 'coarse' ? (coarseSolve ??= withCableLosses(prepare(coarse), losses)) : (fineSolve ??= withCableLosses(prepare(fine), losses)));
}

function jouleSourceOf(problem: ThermalProblem): { area: number; rho20: number } {
  if (problem.source.kind !== 'joule') throw new Error('the conductor model must carry a Joule source');
  return problem.source;
}

/** A problem with the same geometry and surroundings at another current and AC factor. */
function withCurrent(base: ThermalProblem, current: number, acFactor: number): ThermalProblem {
  if (base.source.kind !== 'joule') return base;
  return { ...base, source: { ...base.source, current, acFactor } };
}

/**
 * Cable: `cableProblem` from lib/thermal (single-core geometry of physics.md §3). A multi-core
 * cable enters as its equivalent conductor: diameter d_c·√n, carrying n·I with R₂₀/n, so that
 * J and the heat per metre n·I²R are those of the n loaded cores (flagged by the caller).
 */
function cableModel(c: PreparedCable, k: PreparedConditions, group?: CableGroup, losses?: CableLosses): ThermalModel {
  const airLaw = group?.model.kind === 'air' ? group.model.constants : null;
  const n = c.loadedCores;
  const dEq = c.conductorDiameterM * Math.sqrt(n);
  const De = c.outerDiameterM;
  const solarFlux = k.solar ? (k.solar.absorptivity * k.solar.irradianceWPerM2) / Math.PI : 0;
  const build = (mesh: Mesh): ThermalProblem => {
    const cells = mesh === 'coarse' ? COARSE_CELLS : FINE_CELLS;
    const outer =
      k.placement === 'buried'
        ? {
            kind: 'buried' as const,
            soilResistivityKmPerW: k.buried!.soilResistivityKmPerW,
            depthM: k.buried!.depthM,
            groundC: k.ambientC,
          }
        : {
            kind: 'air' as const,
            ambientC: k.ambientC,
            emissivity: k.surfaceCoefficientWPerM2K !== undefined ? 0 : c.emissivity,
            convection: k.windSpeedMPerS > 0 ? { kind: 'forced' as const, windMps: k.windSpeedMPerS } : { kind: 'horizontal-cylinder' as const },
            ...(k.solar ? { solarWPerM2: k.solar.irradianceWPerM2, absorptivity: k.solar.absorptivity } : {}),
          };
    const problem = cableProblem({
      conductorDiameterM: dEq,
      currentA: 0,
      // The neutral's heat under third harmonics rides on the equivalent conductor (the
      // multi-core heat path already puts it in the right core).
      r20OhmPerM: (c.r20 * (n + c.neutralHeatShare)) / (n * n),
      alpha20PerK: c.alpha20,
      acFactor: 1,
      conductorConductivity: c.constants.thermalConductivityWPerMK,
      conductorCells: cells.conductor,
      layers: c.layers.map((l) => ({ name: l.name, thicknessM: l.thicknessM, thermalResistivityKmPerW: 1 / l.conductivityWPerMK, cells: cells.covering })),
      outer,
    });
    const points = [
      ...(losses?.screen ? [{ position: losses.screen.radiusM, heat: 0 }] : []),
      ...(losses?.dielectric ? losses.dielectric.radiiM.map((position) => ({ position, heat: losses.dielectric!.lossWPerM / losses.dielectric!.radiiM.length })) : []),
    ];
    if (points.length > 0) problem.pointSources = points;
    if (k.surfaceCoefficientWPerM2K !== undefined && k.placement !== 'buried') {
      // A fixed combined coefficient replaces convection and radiation (flagged by the caller).
      const fixed: SurfaceBoundary = { kind: 'surface', ambient: k.ambientC, h: k.surfaceCoefficientWPerM2K, emissivity: 0 };
      if (solarFlux > 0) fixed.absorbedFlux = solarFlux;
      return { ...problem, outer: fixed };
    }
    if (airLaw) {
      // A group in air: the IEC 60287-2-1 free-air law of its arrangement stands for each cable's
      // convection and radiation together (still air: wind is not credited to a group).
      const law: SurfaceBoundary = { kind: 'surface', ambient: k.ambientC, emissivity: 0, convection: { kind: 'iec-60287-free-air', diameter: De, Z: airLaw.Z, E: airLaw.E, g: airLaw.g } };
      if (solarFlux > 0) law.absorbedFlux = solarFlux;
      return { ...problem, outer: law };
    }
    return problem;
  };
  const coarse = build('coarse');
  const fine = build('fine');
  const source = jouleSourceOf(coarse);
  const layers: ModelLayer[] = [
    { name: 'conductor', thicknessM: dEq / 2, conductivity: c.constants.thermalConductivityWPerMK, generating: true },
    ...c.layers.map((l) => ({ name: l.name, thicknessM: l.thicknessM, conductivity: l.conductivityWPerMK, generating: false, limitC: l.limitC })),
  ];
  let r = dEq / 2;
  let coveringResistance = 0;
  for (const l of c.layers) {
    coveringResistance += Math.log((r + l.thicknessM) / r) / (2 * Math.PI * l.conductivityWPerMK);
    r += l.thicknessM;
  }
  const buriedT4 =
    k.placement === 'buried'
      ? buriedExternalThermalResistance({ soilResistivityKmPerW: k.buried!.soilResistivityKmPerW, depthM: k.buried!.depthM, externalDiameterM: De })
      : undefined;
  return {
    geometry: 'cylinder',
    layers,
    referenceC: k.ambientC,
    currentScale: n,
    areaM2: source.area,
    rho20: source.rho20,
    heatPerMetreScale: 1,
    faces: [{ side: 'outer', exchangeAreaPerM: Math.PI * De, coveringConductance: 1 / coveringResistance, absorbedFlux: k.placement === 'buried' ? 0 : solarFlux }],
    buriedT4,
    problem: (current, acFactor, mesh) => withCurrent(mesh === 'coarse' ? coarse : fine, current, acFactor),
    fixedHeatWPerM: losses?.dielectric?.lossWPerM ?? 0,
    solver: solversOf(coarse, fine, losses),
    withOuterSurface: (mesh, hWPerM2K) => withCableLosses(prepare({ ...(mesh === 'coarse' ? coarse : fine), outer: { kind: 'surface', ambient: k.ambientC, h: hWPerM2K, emissivity: 0 } }), losses),
  };
}

/**
 * Bar: `busBarProblem` from lib/thermal — one bar as a slab through its thickness, both wide
 * faces cooled, edges lumped with areaFactor. The sizing layer passes the current of ONE bar
 * (the phase current shared over parallel runs and bars per pack). The sun (not in the builder)
 * is added as an absorbed flux: the projected width w per metre, on the upper face of a flat bar
 * or shared by the two faces of a bar on edge.
 */
function barModel(c: PreparedBar, k: PreparedConditions): ThermalModel {
  const w = c.widthM;
  const t = c.thicknessM;
  const coating = c.layers[0];
  const build = (mesh: Mesh): ThermalProblem => {
    const cells = mesh === 'coarse' ? COARSE_CELLS : FINE_CELLS;
    const problem = busBarProblem({
      widthM: w,
      thicknessM: t,
      barsPerPhase: 1,
      currentA: 0,
      r20OhmPerM: c.r20,
      alpha20PerK: c.alpha20,
      acFactor: 1,
      conductivity: c.constants.thermalConductivityWPerMK,
      ...(coating ? { coating: { thicknessM: coating.thicknessM, conductivity: coating.conductivityWPerMK, emissivity: c.emissivity } } : {}),
      orientation: k.placement === 'bar-flat' ? 'flat' : 'edge',
      ambientC: k.ambientC,
      emissivity: c.emissivity,
      ...(k.windSpeedMPerS > 0 ? { windMps: k.windSpeedMPerS } : {}),
      cellsPerLayer: cells.bar,
    });
    const areaFactor = (problem.outer as SurfaceBoundary).areaFactor ?? 1;
    const sunPerM = k.solar ? k.solar.absorptivity * k.solar.irradianceWPerM2 * w : 0;
    const flux = (side: 'inner' | 'outer') => {
      if (sunPerM === 0) return 0;
      if (k.placement === 'bar-flat') return side === 'outer' ? sunPerM / (w * areaFactor) : 0;
      return sunPerM / (2 * w * areaFactor);
    };
    const adjust = (b: Boundary, side: 'inner' | 'outer'): Boundary => {
      if (b.kind !== 'surface') return b;
      const absorbed = flux(side);
      if (k.surfaceCoefficientWPerM2K !== undefined) {
        return { kind: 'surface', ambient: k.ambientC, h: k.surfaceCoefficientWPerM2K, emissivity: 0, areaFactor, ...(absorbed > 0 ? { absorbedFlux: absorbed } : {}) };
      }
      return absorbed > 0 ? { ...b, absorbedFlux: absorbed } : b;
    };
    return { ...problem, inner: adjust(problem.inner, 'inner'), outer: adjust(problem.outer, 'outer') };
  };
  const coarse = build('coarse');
  const fine = build('fine');
  const areaFactor = (coarse.outer as SurfaceBoundary).areaFactor ?? 1;
  const fluxOf = (b: Boundary) => (b.kind === 'surface' ? b.absorbedFlux ?? 0 : 0);
  const coveringConductance = coating ? (coating.conductivityWPerMK * w) / coating.thicknessM : Number.POSITIVE_INFINITY;
  const source = jouleSourceOf(coarse);
  const bar: ModelLayer = { name: 'bar', thicknessM: t, conductivity: c.constants.thermalConductivityWPerMK, generating: true };
  const layers: ModelLayer[] = coating
    ? [
        { name: coating.name, thicknessM: coating.thicknessM, conductivity: coating.conductivityWPerMK, generating: false },
        bar,
        { name: coating.name, thicknessM: coating.thicknessM, conductivity: coating.conductivityWPerMK, generating: false },
      ]
    : [bar];
  return {
    geometry: 'slab',
    layers,
    referenceC: k.ambientC,
    currentScale: 1,
    areaM2: source.area,
    rho20: source.rho20,
    // busBarProblem reports heat per m² of wide face; the bar is w wide.
    heatPerMetreScale: w,
    faces: [
      { side: 'inner', exchangeAreaPerM: w * areaFactor, coveringConductance, absorbedFlux: fluxOf(coarse.inner) },
      { side: 'outer', exchangeAreaPerM: w * areaFactor, coveringConductance, absorbedFlux: fluxOf(coarse.outer) },
    ],
    problem: (current, acFactor, mesh) => withCurrent(mesh === 'coarse' ? coarse : fine, current, acFactor),
    fixedHeatWPerM: 0,
    solver: solversOf(coarse, fine),
    withOuterSurface: () => {
      throw new Error('a bar has no buried group surface');
    },
  };
}

// ───────────────────────────── Reading a solve ─────────────────────────────

/** Temperature of the interface at `facePosition` between two cells, weighted by the half-cell
 *  conductances (the same series resistances the solver uses, physics.md §1). */
function interfaceTemperature(
  model: ThermalModel,
  result: SteadyResult,
  facePosition: number,
  kIn: number,
  kOut: number,
): number {
  const pos = result.positions;
  const temps = result.temperatures;
  let e = pos.findIndex((x) => x > facePosition);
  if (e <= 0) e = Math.max(1, Math.min(pos.length - 1, e < 0 ? pos.length - 1 : 1));
  const p = e - 1;
  let gP: number;
  let gE: number;
  if (model.geometry === 'cylinder') {
    gP = (2 * Math.PI * kIn) / Math.log(facePosition / pos[p]);
    gE = (2 * Math.PI * kOut) / Math.log(pos[e] / facePosition);
  } else {
    gP = kIn / (facePosition - pos[p]);
    gE = kOut / (pos[e] - facePosition);
  }
  if (!Number.isFinite(gP) || !Number.isFinite(gE) || gP <= 0 || gE <= 0) return Math.max(temps[p], temps[e]);
  return (gP * temps[p] + gE * temps[e]) / (gP + gE);
}

export interface LimitReading {
  /** Largest (temperature − limit) over the constraints, K. */
  excessK: number;
  /** Rise of the governing constraint over the reference temperature, K. */
  riseK: number;
  governing: GoverningLimit;
  /** Temperature of the governing constraint, °C. */
  temperatureC: number;
  hotSpotC: number;
  hotSpotPositionM: number;
  /** Mean temperature of the generating layer, °C — for R(T) and the AC factor. */
  conductorC: number;
}

/** Reads a converged solve against the conductor's contact limit and each covering's own limit. */
export function readLimits(model: ThermalModel, result: SteadyResult, contactLimit: GoverningLimit): LimitReading {
  const hot = result.hotSpot.temperature;
  let governing = contactLimit;
  let temperatureC = hot;
  let excessK = hot - contactLimit.temperatureC;
  const bounds = result.layerBounds;
  model.layers.forEach((layer, i) => {
    if (layer.limitC === undefined || i === 0) return;
    const from = bounds[i]?.from;
    if (from === undefined) return;
    const tFace = interfaceTemperature(model, result, from, model.layers[i - 1].conductivity, layer.conductivity);
    const ex = tFace - layer.limitC;
    if (ex > excessK) {
      excessK = ex;
      temperatureC = tFace;
      governing = { temperatureC: layer.limitC, source: 'layer', layer: layer.name };
    }
  });
  let conductorC = hot;
  const genIndex = model.layers.findIndex((l) => l.generating);
  const gb = bounds[genIndex];
  if (gb) {
    let sum = 0;
    let n = 0;
    result.positions.forEach((x, j) => {
      if (x >= gb.from && x <= gb.to) {
        sum += result.temperatures[j];
        n++;
      }
    });
    if (n > 0) conductorC = sum / n;
  }
  return {
    excessK,
    riseK: temperatureC - model.referenceC,
    governing,
    temperatureC,
    hotSpotC: hot,
    hotSpotPositionM: result.hotSpot.position,
    conductorC,
  };
}

export function profileOf(model: ThermalModel, result: SteadyResult): HeatProfile {
  const layers: ProfileLayer[] = result.layerBounds.map((b, i) => {
    const l = model.layers[i];
    const entry: ProfileLayer = { name: l?.name ?? b.name ?? `layer ${i + 1}`, startM: b.from, endM: b.to, generating: l?.generating ?? false };
    if (l?.limitC !== undefined) entry.limitC = l.limitC;
    return entry;
  });
  return {
    geometry: model.geometry,
    positionsM: [...result.positions],
    temperaturesC: [...result.temperatures],
    layers,
    hotSpot: { temperatureC: result.hotSpot.temperature, positionM: result.hotSpot.position },
  };
}

/** Heat generated per metre of one conductor (W/m) from a solve. */
export function heatPerMetre(model: ThermalModel, result: SteadyResult): number {
  const perUnit = model.geometry === 'cylinder' ? result.heatGeneratedWPerM : result.heatGeneratedWPerM2;
  return (perUnit ?? 0) * model.heatPerMetreScale;
}

function surfaceOf(result: SteadyResult, side: 'inner' | 'outer'): SurfaceDiagnostics | undefined {
  return result.surface?.[side];
}

export const CLOSED_FORM_METHOD_CABLE =
  'IEC 60287-1-1 eq. (1) with W_d = 0, λ₁ = λ₂ = 0: I = √((Δθ − σD_eH·T₄)/(R(T₁ + T₄))), T₁ from the coverings, T₄ = 1/(π·D_e·h) from the same surface coefficient the solver ended with';
export const CLOSED_FORM_METHOD_BAR =
  'IEC 60287-1-1 eq. (1) structure for a bar: I = √((ΣU·Δθ − Σ(U/H)·Q)/R), faces in parallel, coating and surface (h from the solver\'s final state) in series';

export interface ClosedFormValue {
  /** Model current at the limit, A (divide by currentScale for the conductor current). */
  modelCurrentA: number;
  externalResistanceKmPerW: number;
  internalResistanceKmPerW: number;
}

/**
 * Closed-form ampacity beside the solver: conductor isothermal, coverings by their analytic
 * resistances, and each surface by the combined coefficient h = h_conv + h_rad (secant) that the
 * solver reports at its final state (exact when the coefficient is fixed). `resistanceAt(θ)`
 * gives the model's AC resistance per metre at a conductor temperature.
 */
export function closedFormCurrent(
  model: ThermalModel,
  result: SteadyResult,
  governing: GoverningLimit,
  resistanceAtC: (temperatureC: number) => number,
): ClosedFormValue | null {
  const dT = governing.temperatureC - model.referenceC;
  let sumU = 0;
  let sunTerm = 0;
  let sumH = 0;
  for (const face of model.faces) {
    const diag = surfaceOf(result, face.side);
    if (!diag) return null;
    const h = diag.hConv + diag.hRad;
    if (!(h > 0)) return null;
    const H = h * face.exchangeAreaPerM;
    const C = face.coveringConductance;
    const U = Number.isFinite(C) ? (C * H) / (C + H) : H;
    sumU += U;
    sumH += H;
    sunTerm += (U / H) * face.absorbedFlux * face.exchangeAreaPerM;
  }
  const external = 1 / sumH;
  const internal = 1 / sumU - external;
  if (governing.source !== 'layer') {
    const w = sumU * dT - sunTerm;
    if (!(w > 0)) return { modelCurrentA: 0, externalResistanceKmPerW: external, internalResistanceKmPerW: internal };
    return { modelCurrentA: Math.sqrt(w / resistanceAtC(governing.temperatureC)), externalResistanceKmPerW: external, internalResistanceKmPerW: internal };
  }
  // An outer covering's limit governs (cables only: one face). θ_L − θa = W(T_L + T₄) + Q·T₄.
  const idx = model.layers.findIndex((l) => l.name === governing.layer && !l.generating);
  if (idx < 1 || model.geometry !== 'cylinder') return null;
  let r = model.layers[0].thicknessM;
  let tInnerToL = 0;
  let tLToSurface = 0;
  model.layers.forEach((l, i) => {
    if (i === 0) return;
    const res = Math.log((r + l.thicknessM) / r) / (2 * Math.PI * l.conductivity);
    if (i < idx) tInnerToL += res;
    else tLToSurface += res;
    r += l.thicknessM;
  });
  const q = model.faces[0].absorbedFlux * model.faces[0].exchangeAreaPerM;
  const w = (dT - q * external) / (tLToSurface + external);
  if (!(w > 0)) return { modelCurrentA: 0, externalResistanceKmPerW: external, internalResistanceKmPerW: internal };
  const conductorC = governing.temperatureC + w * tInnerToL;
  return { modelCurrentA: Math.sqrt(w / resistanceAtC(conductorC)), externalResistanceKmPerW: external, internalResistanceKmPerW: internal };
}

/**
 * Validation at the edge: every number the cross-section solver touches is checked once, here,
 * and bad input becomes a ThermalInputError naming the field (cables overlapping, a cable
 * outside the domain or above the ground, a region with zero or negative resistivity, NaN …).
 * The output is a normalised problem with every default filled in.
 */
import { ThermalInputError } from '../errors';
import {
  isRecord,
  requireFinite,
  requireNonNegative,
  requirePositive,
  requirePositiveInteger,
  requireRecord,
  requireTemperature,
} from '../validate';
import { DUCT_AIR_CONSTANTS } from './ductAir';
import type { DuctAirConstants, PreconditionerKind } from './types';

export interface NormalizedRegion {
  xMin: number;
  xMax: number;
  top: number;
  bottom: number;
  conductivity: number;
}

export interface NormalizedCable {
  name?: string;
  x: number;
  depth: number;
  /** m: radius of the circle coupled to the soil (duct outer, else cable outer). */
  radius: number;
  cableOuterDiameter: number;
  current: number;
  r20: number;
  alpha20: number;
  acFactor: number;
  /** Radial resistances of the coverings, K·m/W, inside out (Incropera §3.3.1: ln(r₂/r₁)/(2πk)). */
  coveringResistances: number[];
  proportional: Array<{ factor: number; after: number }>;
  fixed: Array<{ watts: number; after: number }>;
  dielectric?: { watts: number; inCovering: number };
  duct?: { air: DuctAirConstants; wallResistance: number; preset?: string };
  limit?: number;
}

export type NormalizedSource =
  | { kind: 'line'; x: number; depth: number; watts: number }
  | { kind: 'rectangle'; xMin: number; xMax: number; top: number; bottom: number; watts: number };

export type NormalizedSurface =
  | { kind: 'isothermal'; temperature: number }
  | { kind: 'convective'; air: number; h: number };

export interface NormalizedMesh {
  cellsAcrossCable: number;
  growthRatio: number;
  maxCell: number;
  sourceCell: number;
  refinement: number;
}

export interface NormalizedOptions {
  toleranceK: number;
  energyTolerance: number;
  maxOuterIterations: number;
  cgRelativeTolerance: number;
  maxCgIterations: number;
  preconditioner: PreconditionerKind;
}

export interface NormalizedCrossSection {
  width: number;
  depth: number;
  xLeft: number;
  xRight: number;
  soilConductivity: number;
  regions: NormalizedRegion[];
  cables: NormalizedCable[];
  sources: NormalizedSource[];
  surface: NormalizedSurface;
  deepGround: number;
  mesh: NormalizedMesh;
  options: NormalizedOptions;
}

/** Touching cables (a trefoil) are allowed; an overlap deeper than this share of the radii is not. */
const TOUCH_TOLERANCE = 1e-9;

function optional<T>(value: unknown, check: (v: unknown) => T, fallback: T): T {
  return value === undefined ? fallback : check(value);
}

function optionalName(value: unknown, field: string): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw new ThermalInputError(field, 'must be a string');
  return value;
}

function requireArray(value: unknown, field: string): unknown[] {
  if (!Array.isArray(value)) throw new ThermalInputError(field, 'must be a list');
  return value;
}

function requireIndex(value: unknown, field: string, count: number): number {
  const v = requireFinite(value, field);
  if (!Number.isInteger(v) || v < 0 || v >= count) {
    throw new ThermalInputError(field, `must be the index of a covering, 0 … ${count - 1} (got ${v})`);
  }
  return v;
}

function validateRegion(raw: unknown, field: string, width: number, depth: number): NormalizedRegion {
  const r = requireRecord(raw, field);
  const left = -width / 2;
  const right = width / 2;
  const xMin = optional(r.xMinM, (v) => requireFinite(v, `${field}.xMinM`), left);
  const xMax = optional(r.xMaxM, (v) => requireFinite(v, `${field}.xMaxM`), right);
  const top = requireNonNegative(r.depthTopM, `${field}.depthTopM`);
  const bottom = requireFinite(r.depthBottomM, `${field}.depthBottomM`);
  const rho = requirePositive(r.thermalResistivityKmPerW, `${field}.thermalResistivityKmPerW`);
  if (xMin < left || xMin >= right) throw new ThermalInputError(`${field}.xMinM`, `must lie inside the domain, ${left} … ${right} m`);
  if (xMax <= xMin || xMax > right) throw new ThermalInputError(`${field}.xMaxM`, `must lie above xMinM and inside the domain (≤ ${right} m)`);
  if (top >= depth) throw new ThermalInputError(`${field}.depthTopM`, `must lie above the domain's bottom (${depth} m)`);
  if (bottom <= top || bottom > depth) throw new ThermalInputError(`${field}.depthBottomM`, `must lie below depthTopM and not below the domain (≤ ${depth} m)`);
  return { xMin, xMax, top, bottom, conductivity: 1 / rho };
}

function validateDuctAir(raw: unknown, field: string): DuctAirConstants {
  if (typeof raw === 'string') {
    const preset = (DUCT_AIR_CONSTANTS as Record<string, DuctAirConstants>)[raw];
    if (!preset) throw new ThermalInputError(field, `unknown duct kind '${raw}' (one of ${Object.keys(DUCT_AIR_CONSTANTS).join(', ')})`);
    return preset;
  }
  const c = requireRecord(raw, field);
  return {
    U: requirePositive(c.U, `${field}.U`),
    V: requireNonNegative(c.V, `${field}.V`),
    Y: requireNonNegative(c.Y, `${field}.Y`),
  };
}

function validateCable(raw: unknown, field: string): NormalizedCable {
  const c = requireRecord(raw, field);
  const x = requireFinite(c.xM, `${field}.xM`);
  const depth = requireFinite(c.depthM, `${field}.depthM`);
  const outer = requirePositive(c.outerDiameterM, `${field}.outerDiameterM`);
  const conductor = requireRecord(c.conductor, `${field}.conductor`);
  const conductorDiameter = requirePositive(conductor.diameterM, `${field}.conductor.diameterM`);
  const current = requireNonNegative(conductor.currentA, `${field}.conductor.currentA`);
  const r20 = requirePositive(conductor.r20OhmPerM, `${field}.conductor.r20OhmPerM`);
  const alpha20 = requireNonNegative(conductor.alpha20PerK, `${field}.conductor.alpha20PerK`);
  const acFactor = optional(conductor.acFactor, (v) => requirePositive(v, `${field}.conductor.acFactor`), 1);
  if (acFactor < 1) throw new ThermalInputError(`${field}.conductor.acFactor`, `must be at least 1 (R_ac ≥ R_dc), got ${acFactor}`);

  const coverings = requireArray(c.coverings, `${field}.coverings`);
  const resistances: number[] = [];
  let inner = conductorDiameter;
  coverings.forEach((rawCovering, i) => {
    const f = `${field}.coverings[${i}]`;
    const covering = requireRecord(rawCovering, f);
    const d = requirePositive(covering.outerDiameterM, `${f}.outerDiameterM`);
    const rho = requirePositive(covering.thermalResistivityKmPerW, `${f}.thermalResistivityKmPerW`);
    if (!(d > inner)) throw new ThermalInputError(`${f}.outerDiameterM`, `must be larger than the diameter inside it (${inner} m)`);
    resistances.push((rho / (2 * Math.PI)) * Math.log(d / inner));
    inner = d;
  });
  if (Math.abs(inner - outer) > 1e-9 * outer) {
    throw new ThermalInputError(`${field}.outerDiameterM`, `must equal the last covering's outer diameter (${inner} m)`);
  }
  const n = coverings.length;

  const proportional = optional(c.proportionalLosses, (v) => requireArray(v, `${field}.proportionalLosses`), []).map((rawLoss, i) => {
    const f = `${field}.proportionalLosses[${i}]`;
    const loss = requireRecord(rawLoss, f);
    optionalName(loss.name, `${f}.name`);
    return { factor: requireNonNegative(loss.factor, `${f}.factor`), after: requireIndex(loss.afterCovering, `${f}.afterCovering`, n) };
  });
  const fixed = optional(c.fixedLosses, (v) => requireArray(v, `${field}.fixedLosses`), []).map((rawLoss, i) => {
    const f = `${field}.fixedLosses[${i}]`;
    const loss = requireRecord(rawLoss, f);
    optionalName(loss.name, `${f}.name`);
    return { watts: requireNonNegative(loss.wattsPerM, `${f}.wattsPerM`), after: requireIndex(loss.afterCovering, `${f}.afterCovering`, n) };
  });
  let dielectric: NormalizedCable['dielectric'];
  if (c.dielectricLoss !== undefined) {
    const f = `${field}.dielectricLoss`;
    const d = requireRecord(c.dielectricLoss, f);
    dielectric = { watts: requireNonNegative(d.wattsPerM, `${f}.wattsPerM`), inCovering: requireIndex(d.inCovering, `${f}.inCovering`, n) };
  }

  let radius = outer / 2;
  let duct: NormalizedCable['duct'];
  if (c.duct !== undefined) {
    const f = `${field}.duct`;
    const d = requireRecord(c.duct, f);
    const di = requirePositive(d.innerDiameterM, `${f}.innerDiameterM`);
    const dout = requirePositive(d.outerDiameterM, `${f}.outerDiameterM`);
    const rho = requirePositive(d.wallThermalResistivityKmPerW, `${f}.wallThermalResistivityKmPerW`);
    if (!(di > outer)) throw new ThermalInputError(`${f}.innerDiameterM`, `must be larger than the cable (${outer} m)`);
    if (!(dout > di)) throw new ThermalInputError(`${f}.outerDiameterM`, 'must be larger than the inner diameter');
    duct = {
      air: validateDuctAir(d.air, `${f}.air`),
      wallResistance: (rho / (2 * Math.PI)) * Math.log(dout / di),
      ...(typeof d.air === 'string' ? { preset: d.air } : {}),
    };
    radius = dout / 2;
  }
  const limit = optional(c.maxConductorTemperatureC, (v) => requireTemperature(v, `${field}.maxConductorTemperatureC`), undefined);
  const name = optionalName(c.name, `${field}.name`);
  return {
    ...(name !== undefined ? { name } : {}),
    x,
    depth,
    radius,
    cableOuterDiameter: outer,
    current,
    r20,
    alpha20,
    acFactor,
    coveringResistances: resistances,
    proportional,
    fixed,
    ...(dielectric ? { dielectric } : {}),
    ...(duct ? { duct } : {}),
    ...(limit !== undefined ? { limit } : {}),
  };
}

function checkCablePlacement(cables: NormalizedCable[], width: number, depth: number): void {
  cables.forEach((cable, i) => {
    const f = `cables[${i}]`;
    if (!(cable.depth - cable.radius > 0)) throw new ThermalInputError(`${f}.depthM`, `the ${cable.duct ? 'duct' : 'cable'} reaches above the ground surface (centre ${cable.depth} m, radius ${cable.radius} m)`);
    if (!(cable.depth + cable.radius < depth)) throw new ThermalInputError(`${f}.depthM`, `the ${cable.duct ? 'duct' : 'cable'} reaches below the domain's bottom (${depth} m)`);
    if (!(Math.abs(cable.x) + cable.radius < width / 2)) throw new ThermalInputError(`${f}.xM`, `the ${cable.duct ? 'duct' : 'cable'} reaches outside the domain (±${width / 2} m)`);
  });
  for (let i = 0; i < cables.length; i++) {
    for (let j = 0; j < i; j++) {
      const a = cables[i];
      const b = cables[j];
      const distance = Math.hypot(a.x - b.x, a.depth - b.depth);
      const touching = a.radius + b.radius;
      if (distance < touching * (1 - TOUCH_TOLERANCE)) {
        throw new ThermalInputError(`cables[${i}]`, `overlaps cables[${j}] (centres ${distance} m apart, radii add up to ${touching} m)`);
      }
    }
  }
}

function rectangleMeetsCircle(r: { xMin: number; xMax: number; top: number; bottom: number }, c: NormalizedCable): boolean {
  const dx = Math.max(r.xMin - c.x, 0, c.x - r.xMax);
  const dy = Math.max(r.top - c.depth, 0, c.depth - r.bottom);
  return dx * dx + dy * dy < c.radius * c.radius;
}

function validateSource(raw: unknown, field: string, width: number, depth: number, cables: NormalizedCable[]): NormalizedSource {
  const s = requireRecord(raw, field);
  optionalName(s.name, `${field}.name`);
  const watts = requireNonNegative(s.wattsPerM, `${field}.wattsPerM`);
  if (s.kind === 'line') {
    const x = requireFinite(s.xM, `${field}.xM`);
    const d = requireFinite(s.depthM, `${field}.depthM`);
    if (!(Math.abs(x) < width / 2)) throw new ThermalInputError(`${field}.xM`, `must lie inside the domain (±${width / 2} m)`);
    if (!(d > 0 && d < depth)) throw new ThermalInputError(`${field}.depthM`, `must lie below the surface and above the domain's bottom (${depth} m)`);
    cables.forEach((c, i) => {
      if (Math.hypot(x - c.x, d - c.depth) <= c.radius) throw new ThermalInputError(`${field}.xM`, `lies inside cables[${i}]`);
    });
    return { kind: 'line', x, depth: d, watts };
  }
  if (s.kind === 'rectangle') {
    const xMin = requireFinite(s.xMinM, `${field}.xMinM`);
    const xMax = requireFinite(s.xMaxM, `${field}.xMaxM`);
    const top = requireNonNegative(s.depthTopM, `${field}.depthTopM`);
    const bottom = requireFinite(s.depthBottomM, `${field}.depthBottomM`);
    if (xMin < -width / 2) throw new ThermalInputError(`${field}.xMinM`, 'must lie inside the domain');
    if (!(xMax > xMin) || xMax > width / 2) throw new ThermalInputError(`${field}.xMaxM`, 'must lie above xMinM and inside the domain');
    if (!(bottom > top) || bottom > depth) throw new ThermalInputError(`${field}.depthBottomM`, 'must lie below depthTopM and inside the domain');
    const rect = { xMin, xMax, top, bottom };
    cables.forEach((c, i) => {
      if (rectangleMeetsCircle(rect, c)) throw new ThermalInputError(field, `overlaps cables[${i}]`);
    });
    return { kind: 'rectangle', ...rect, watts };
  }
  throw new ThermalInputError(`${field}.kind`, `must be 'line' or 'rectangle' (got ${String(s.kind)})`);
}

function validateSurface(raw: unknown): NormalizedSurface {
  const s = requireRecord(raw, 'surface');
  if (s.kind === 'isothermal') return { kind: 'isothermal', temperature: requireTemperature(s.temperatureC, 'surface.temperatureC') };
  if (s.kind === 'convective') {
    return {
      kind: 'convective',
      air: requireTemperature(s.airTemperatureC, 'surface.airTemperatureC'),
      h: requirePositive(s.heatTransferCoefficientWPerM2K, 'surface.heatTransferCoefficientWPerM2K'),
    };
  }
  throw new ThermalInputError('surface.kind', `must be 'isothermal' or 'convective' (got ${String(s.kind)})`);
}

function validateMesh(raw: unknown, width: number, depth: number): NormalizedMesh {
  const m = raw === undefined ? {} : requireRecord(raw, 'mesh');
  const cellsAcrossCable = optional(m.cellsAcrossCable, (v) => requirePositive(v, 'mesh.cellsAcrossCable'), 16);
  if (cellsAcrossCable < 4) throw new ThermalInputError('mesh.cellsAcrossCable', 'must be at least 4 (a circle needs cells inside it)');
  const growthRatio = optional(m.growthRatio, (v) => requirePositive(v, 'mesh.growthRatio'), 1.15);
  if (!(growthRatio > 1 && growthRatio <= 2)) throw new ThermalInputError('mesh.growthRatio', `must lie in (1, 2] (got ${growthRatio})`);
  const maxCell = optional(m.maxCellM, (v) => requirePositive(v, 'mesh.maxCellM'), Math.min(width, depth) / 20);
  const sourceCell = optional(m.sourceCellM, (v) => requirePositive(v, 'mesh.sourceCellM'), maxCell / 20);
  const refinement = optional(m.refinement, (v) => requirePositive(v, 'mesh.refinement'), 1);
  return { cellsAcrossCable, growthRatio, maxCell, sourceCell, refinement };
}

function validateOptions(raw: unknown): NormalizedOptions {
  const o = raw === undefined ? {} : requireRecord(raw, 'options');
  const preconditioner = o.preconditioner ?? 'amg';
  if (preconditioner !== 'amg' && preconditioner !== 'ic0' && preconditioner !== 'jacobi') {
    throw new ThermalInputError('options.preconditioner', `must be 'amg', 'ic0' or 'jacobi' (got ${String(preconditioner)})`);
  }
  return {
    toleranceK: optional(o.toleranceK, (v) => requirePositive(v, 'options.toleranceK'), 1e-6),
    energyTolerance: optional(o.energyTolerance, (v) => requirePositive(v, 'options.energyTolerance'), 1e-6),
    maxOuterIterations: optional(o.maxOuterIterations, (v) => requirePositiveInteger(v, 'options.maxOuterIterations'), 50),
    cgRelativeTolerance: optional(o.cgRelativeTolerance, (v) => requirePositive(v, 'options.cgRelativeTolerance'), 1e-10),
    maxCgIterations: optional(o.maxCgIterations, (v) => requirePositiveInteger(v, 'options.maxCgIterations'), 20000),
    preconditioner,
  };
}

export function validateCrossSection(raw: unknown): NormalizedCrossSection {
  if (!isRecord(raw)) throw new ThermalInputError('input', 'must be an object');
  const domain = requireRecord(raw.domain, 'domain');
  const width = requirePositive(domain.widthM, 'domain.widthM');
  const depth = requirePositive(domain.depthM, 'domain.depthM');
  const soil = requireRecord(raw.soil, 'soil');
  const soilConductivity = 1 / requirePositive(soil.thermalResistivityKmPerW, 'soil.thermalResistivityKmPerW');
  const regions = optional(raw.regions, (v) => requireArray(v, 'regions'), []).map((r, i) => validateRegion(r, `regions[${i}]`, width, depth));
  const cablesRaw = requireArray(raw.cables, 'cables');
  const cables = cablesRaw.map((c, i) => validateCable(c, `cables[${i}]`));
  checkCablePlacement(cables, width, depth);
  const sources = optional(raw.heatSources, (v) => requireArray(v, 'heatSources'), []).map((s, i) =>
    validateSource(s, `heatSources[${i}]`, width, depth, cables),
  );
  const surface = validateSurface(raw.surface);
  const deepGround = requireTemperature(raw.deepGroundTemperatureC, 'deepGroundTemperatureC');
  // R(T) = R₂₀[1 + α(T − 20)] must be positive at the coldest boundary, or the linear law has
  // left the range where it describes a metal.
  const coldest = Math.min(surface.kind === 'isothermal' ? surface.temperature : surface.air, deepGround);
  cables.forEach((c, i) => {
    if (!(1 + c.alpha20 * (coldest - 20) > 0)) {
      throw new ThermalInputError(`cables[${i}].conductor.alpha20PerK`, `gives a resistance ≤ 0 at ${coldest} °C`);
    }
  });
  return {
    width,
    depth,
    xLeft: -width / 2,
    xRight: width / 2,
    soilConductivity,
    regions,
    cables,
    sources,
    surface,
    deepGround,
    mesh: validateMesh(raw.mesh, width, depth),
    options: validateOptions(raw.options),
  };
}

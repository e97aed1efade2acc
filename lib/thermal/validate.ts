/**
 * Up-front validation: every number the solver will touch is checked here, once, so that bad
 * input becomes a ThermalInputError naming the field instead of a NaN deep inside a sweep.
 * The output is a normalised problem with every default filled in (its shapes: normalized.ts).
 */
import {
  ABSOLUTE_ZERO_C,
  DEFAULT_CELLS_PER_LAYER,
  DEFAULT_ENERGY_TOLERANCE,
  DEFAULT_MAX_ITERATIONS,
  DEFAULT_RELAXATION,
  DEFAULT_TEMPERATURE_LIMIT_C,
  DEFAULT_TOLERANCE_K,
} from './constants';
import { ThermalInputError } from './errors';
import type {
  NormalizedBoundary,
  NormalizedConvection,
  NormalizedGeometry,
  NormalizedLayer,
  NormalizedOptions,
  NormalizedProblem,
  NormalizedSource,
} from './normalized';
import type { ThermalFlag } from './types';

/** IEC 60287-2-1 Table 2 (from memory): single cable in free air. */
export const IEC_FREE_AIR_SINGLE_CABLE = { Z: 0.21, E: 3.94, g: 0.6 } as const;

// ---------------------------------------------------------------------------------------------
// Primitive checks
// ---------------------------------------------------------------------------------------------

export function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

export function requireRecord(value: unknown, field: string): Record<string, unknown> {
  if (!isRecord(value)) throw new ThermalInputError(field, 'must be an object');
  return value;
}

export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ThermalInputError(field, `must be a finite number (got ${String(value)})`);
  }
  return value;
}

export function requirePositive(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (!(v > 0)) throw new ThermalInputError(field, `must be greater than zero (got ${v})`);
  return v;
}

export function requireNonNegative(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (!(v >= 0)) throw new ThermalInputError(field, `must not be negative (got ${v})`);
  return v;
}

export function requireTemperature(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v < ABSOLUTE_ZERO_C) {
    throw new ThermalInputError(field, `is below absolute zero (${v} °C < ${ABSOLUTE_ZERO_C} °C)`);
  }
  return v;
}

export function requireFraction(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (v < 0 || v > 1) throw new ThermalInputError(field, `must lie in [0, 1] (got ${v})`);
  return v;
}

export function requirePositiveInteger(value: unknown, field: string): number {
  const v = requireFinite(value, field);
  if (!Number.isInteger(v) || v < 1) {
    throw new ThermalInputError(field, `must be a positive whole number (got ${v})`);
  }
  return v;
}

function optional<T>(value: unknown, check: (v: unknown) => T, fallback: T): T {
  return value === undefined ? fallback : check(value);
}

// ---------------------------------------------------------------------------------------------
// Problem parts
// ---------------------------------------------------------------------------------------------

function validateLayer(raw: unknown, field: string): NormalizedLayer {
  const layer = requireRecord(raw, field);
  const normalized: NormalizedLayer = {
    thickness: requirePositive(layer.thickness, `${field}.thickness`),
    conductivity: requirePositive(layer.conductivity, `${field}.conductivity`),
    generating: false,
    cells: optional(layer.cells, (v) => requirePositiveInteger(v, `${field}.cells`), DEFAULT_CELLS_PER_LAYER),
  };
  if (layer.generating !== undefined) {
    if (typeof layer.generating !== 'boolean') {
      throw new ThermalInputError(`${field}.generating`, 'must be true or false');
    }
    normalized.generating = layer.generating;
  }
  if (layer.density !== undefined) normalized.density = requirePositive(layer.density, `${field}.density`);
  if (layer.heatCapacity !== undefined) {
    normalized.heatCapacity = requirePositive(layer.heatCapacity, `${field}.heatCapacity`);
  }
  if (layer.name !== undefined) {
    if (typeof layer.name !== 'string') throw new ThermalInputError(`${field}.name`, 'must be a string');
    normalized.name = layer.name;
  }
  return normalized;
}

function validateGeometry(raw: unknown): NormalizedGeometry {
  const geometry = requireRecord(raw, 'geometry');
  const kind = geometry.kind;
  if (kind !== 'slab' && kind !== 'cylinder') {
    throw new ThermalInputError('geometry.kind', `must be 'slab' or 'cylinder' (got ${String(kind)})`);
  }
  let innerRadius = 0;
  if (geometry.innerRadius !== undefined) {
    innerRadius = requireNonNegative(geometry.innerRadius, 'geometry.innerRadius');
    if (kind === 'slab' && innerRadius !== 0) {
      throw new ThermalInputError('geometry.innerRadius', 'applies to cylinders only');
    }
  }
  if (!Array.isArray(geometry.layers)) {
    throw new ThermalInputError('geometry.layers', 'must be a list of layers');
  }
  if (geometry.layers.length === 0) {
    throw new ThermalInputError('geometry.layers', 'must contain at least one layer');
  }
  const layers = geometry.layers.map((layer, i) => validateLayer(layer, `geometry.layers[${i}]`));
  return { kind, innerRadius, layers };
}

/** A cylinder correlation's diameter: given, or the outer diameter where there is one. */
function convectionDiameter(c: Record<string, unknown>, field: string, defaultDiameter: number | undefined): number {
  if (c.diameter !== undefined) return requirePositive(c.diameter, `${field}.diameter`);
  if (defaultDiameter === undefined) {
    throw new ThermalInputError(
      `${field}.diameter`,
      'is required here (it defaults to the outer diameter only on the outer face of a cylinder)',
    );
  }
  return defaultDiameter;
}

function validateConvection(
  raw: unknown,
  field: string,
  defaultDiameter: number | undefined,
): NormalizedConvection {
  const c = requireRecord(raw, field);
  switch (c.kind) {
    case 'horizontal-cylinder':
      return { kind: 'horizontal-cylinder', diameter: convectionDiameter(c, field, defaultDiameter) };
    case 'vertical-plate':
      return { kind: 'vertical-plate', height: requirePositive(c.height, `${field}.height`) };
    case 'horizontal-plate': {
      if (c.facing !== 'up' && c.facing !== 'down') {
        throw new ThermalInputError(`${field}.facing`, "must be 'up' or 'down'");
      }
      return { kind: 'horizontal-plate', facing: c.facing, length: requirePositive(c.length, `${field}.length`) };
    }
    case 'forced-cylinder':
      return {
        kind: 'forced-cylinder',
        velocity: requirePositive(c.velocity, `${field}.velocity`),
        diameter: convectionDiameter(c, field, defaultDiameter),
      };
    case 'forced-plate':
      return {
        kind: 'forced-plate',
        velocity: requirePositive(c.velocity, `${field}.velocity`),
        length: requirePositive(c.length, `${field}.length`),
      };
    case 'iec-60287-free-air':
      return {
        kind: 'iec-60287-free-air',
        diameter: convectionDiameter(c, field, defaultDiameter),
        Z: optional(c.Z, (v) => requirePositive(v, `${field}.Z`), IEC_FREE_AIR_SINGLE_CABLE.Z),
        E: optional(c.E, (v) => requireNonNegative(v, `${field}.E`), IEC_FREE_AIR_SINGLE_CABLE.E),
        g: optional(c.g, (v) => requireFinite(v, `${field}.g`), IEC_FREE_AIR_SINGLE_CABLE.g),
      };
    default:
      throw new ThermalInputError(`${field}.kind`, `unknown convection kind ${String(c.kind)}`);
  }
}

function validateBoundary(
  raw: unknown,
  field: 'inner' | 'outer',
  defaultDiameter: number | undefined,
): NormalizedBoundary {
  const b = requireRecord(raw, field);
  switch (b.kind) {
    case 'temperature':
      return { kind: 'temperature', value: requireTemperature(b.value, `${field}.value`) };
    case 'flux':
      return { kind: 'flux', value: requireFinite(b.value, `${field}.value`) };
    case 'symmetry':
      return { kind: 'symmetry' };
    case 'surface': {
      const ambient = requireTemperature(b.ambient, `${field}.ambient`);
      const fixedH = optional(b.h, (v) => requireNonNegative(v, `${field}.h`), 0);
      const emissivity = optional(b.emissivity, (v) => requireFraction(v, `${field}.emissivity`), 0);
      let convection: NormalizedConvection | undefined;
      if (b.convection !== undefined) {
        if (b.h !== undefined) {
          throw new ThermalInputError(`${field}.h`, 'give either a fixed h or a convection correlation, not both');
        }
        convection = validateConvection(b.convection, `${field}.convection`, defaultDiameter);
        if (convection.kind === 'iec-60287-free-air' && emissivity > 0) {
          throw new ThermalInputError(
            `${field}.emissivity`,
            'must be 0 with the IEC 60287-2-1 free-air coefficient, which already includes radiation',
          );
        }
      }
      return {
        kind: 'surface',
        ambient,
        fixedH,
        emissivity,
        convection,
        surroundings: optional(b.surroundings, (v) => requireTemperature(v, `${field}.surroundings`), ambient),
        absorbedFlux: optional(b.absorbedFlux, (v) => requireNonNegative(v, `${field}.absorbedFlux`), 0),
        areaFactor: optional(b.areaFactor, (v) => requirePositive(v, `${field}.areaFactor`), 1),
      };
    }
    default:
      throw new ThermalInputError(`${field}.kind`, `unknown boundary kind ${String(b.kind)}`);
  }
}

function validateSource(raw: unknown): NormalizedSource {
  const s = requireRecord(raw, 'source');
  switch (s.kind) {
    case 'uniform':
      return { kind: 'uniform', q: requireFinite(s.q, 'source.q') };
    case 'joule': {
      const acFactor = optional(s.acFactor, (v) => requireFinite(v, 'source.acFactor'), 1);
      // AC resistance is never below DC resistance; a factor under 1 is a data error.
      if (acFactor < 1) throw new ThermalInputError('source.acFactor', `must be at least 1 (got ${acFactor})`);
      return {
        kind: 'joule',
        current: requireNonNegative(s.current, 'source.current'),
        area: requirePositive(s.area, 'source.area'),
        rho20: requirePositive(s.rho20, 'source.rho20'),
        alpha20: requireNonNegative(s.alpha20, 'source.alpha20'),
        acFactor,
      };
    }
    default:
      throw new ThermalInputError('source.kind', `unknown source kind ${String(s.kind)}`);
  }
}

function validateOptions(raw: unknown): NormalizedOptions {
  const o = raw === undefined ? {} : requireRecord(raw, 'options');
  const linearisation = o.linearisation ?? 'tangent';
  if (linearisation !== 'tangent' && linearisation !== 'lagged') {
    throw new ThermalInputError('options.linearisation', "must be 'tangent' or 'lagged'");
  }
  const relaxation = optional(o.relaxation, (v) => requirePositive(v, 'options.relaxation'), DEFAULT_RELAXATION);
  if (relaxation > 1) throw new ThermalInputError('options.relaxation', `must not exceed 1 (got ${relaxation})`);
  return {
    tolerance: optional(o.tolerance, (v) => requirePositive(v, 'options.tolerance'), DEFAULT_TOLERANCE_K),
    energyTolerance: optional(
      o.energyTolerance,
      (v) => requirePositive(v, 'options.energyTolerance'),
      DEFAULT_ENERGY_TOLERANCE,
    ),
    maxIterations: optional(
      o.maxIterations,
      (v) => requirePositiveInteger(v, 'options.maxIterations'),
      DEFAULT_MAX_ITERATIONS,
    ),
    linearisation,
    relaxation,
    temperatureLimit: optional(
      o.temperatureLimit,
      (v) => requireTemperature(v, 'options.temperatureLimit'),
      DEFAULT_TEMPERATURE_LIMIT_C,
    ),
  };
}

function validateAssumptions(raw: unknown): ThermalFlag[] {
  if (raw === undefined) return [];
  if (!Array.isArray(raw)) throw new ThermalInputError('assumptions', 'must be a list');
  return raw.map((flag, i) => {
    const f = requireRecord(flag, `assumptions[${i}]`);
    if (typeof f.code !== 'string' || typeof f.message !== 'string') {
      throw new ThermalInputError(`assumptions[${i}]`, 'needs a string code and message');
    }
    if (f.severity !== 'info' && f.severity !== 'warning') {
      throw new ThermalInputError(`assumptions[${i}].severity`, "must be 'info' or 'warning'");
    }
    return { code: f.code, severity: f.severity, message: f.message };
  });
}

/** A boundary that can carry heat away at a rate growing with the body's temperature. */
function canRemoveHeat(b: NormalizedBoundary, faceHasArea: boolean): boolean {
  if (!faceHasArea) return false;
  if (b.kind === 'temperature') return true;
  if (b.kind === 'surface') return b.fixedH > 0 || b.emissivity > 0 || b.convection !== undefined;
  return false;
}

/**
 * Validate a steady or transient problem. `requireHeatPath` is true for steady problems: with no
 * boundary able to take heat away a steady state does not exist (or is not unique), which is an
 * input error rather than a runaway.
 */
export function validateProblem(raw: unknown, requireHeatPath: boolean): NormalizedProblem {
  const problem = requireRecord(raw, 'problem');
  const geometry = validateGeometry(problem.geometry);
  const outerRadius = geometry.innerRadius + geometry.layers.reduce((sum, l) => sum + l.thickness, 0);
  const outerDiameter = geometry.kind === 'cylinder' ? 2 * outerRadius : undefined;
  const inner = validateBoundary(problem.inner, 'inner', undefined);
  const outer = validateBoundary(problem.outer, 'outer', outerDiameter);
  const source = validateSource(problem.source);
  const options = validateOptions(problem.options);
  const assumptions = validateAssumptions(problem.assumptions);

  const solidAxis = geometry.kind === 'cylinder' && geometry.innerRadius === 0;
  if (solidAxis && inner.kind !== 'symmetry') {
    // The inner face of a solid cylinder is the axis: a line with no area. Only symmetry
    // (zero flux) is meaningful there.
    throw new ThermalInputError('inner.kind', "must be 'symmetry' for a solid cylinder (innerRadius 0)");
  }

  const sourceActive = source.kind === 'joule' || source.q !== 0;
  if (sourceActive && !geometry.layers.some((l) => l.generating)) {
    throw new ThermalInputError(
      'geometry.layers',
      'the source has nowhere to act: mark the layer(s) that carry it with generating: true',
    );
  }

  const normalized: NormalizedProblem = { geometry, source, inner, outer, options, assumptions };
  const points = validatePointSources(problem.pointSources, geometry.innerRadius, outerRadius);
  if (points.length > 0) normalized.pointSources = points;
  if (requireHeatPath) requireSteadyHeatPath(normalized);
  return normalized;
}

/** Heat released at points of the body (types.ts pointSources): inside it, finite, not negative. */
function validatePointSources(raw: unknown, startM: number, endM: number): { position: number; heat: number }[] {
  if (raw === undefined) return [];
  if (!Array.isArray(raw)) throw new ThermalInputError('pointSources', 'must be a list');
  return raw.map((p, i) => {
    const r = requireRecord(p, `pointSources[${i}]`);
    const position = requireFinite(r.position, `pointSources[${i}].position`);
    if (position < startM || position > endM) throw new ThermalInputError(`pointSources[${i}].position`, `must lie inside the body (${startM}…${endM} m)`);
    return { position, heat: requireNonNegative(r.heat, `pointSources[${i}].heat`) };
  });
}

/**
 * A steady state needs a boundary able to take heat away; without one it does not exist (or is
 * not unique), which is an input error rather than a runaway.
 */
export function requireSteadyHeatPath(problem: NormalizedProblem): void {
  const { geometry, inner, outer } = problem;
  const solidAxis = geometry.kind === 'cylinder' && geometry.innerRadius === 0;
  if (!canRemoveHeat(inner, !solidAxis) && !canRemoveHeat(outer, true)) {
    throw new ThermalInputError(
      'outer',
      'no boundary can carry heat away (need a temperature or a surface with h, convection or emissivity): no steady state exists',
    );
  }
}

/**
 * Heat capacity of every layer, which any solve over time needs (a_P gains ρcΔV/Δt): the one
 * check, for solveTransient and for the runs over time alike.
 */
export function requireHeatCapacities(problem: NormalizedProblem): void {
  problem.geometry.layers.forEach((layer, i) => {
    if (layer.density === undefined) throw new ThermalInputError(`geometry.layers[${i}].density`, 'is required for a solve over time');
    if (layer.heatCapacity === undefined) throw new ThermalInputError(`geometry.layers[${i}].heatCapacity`, 'is required for a solve over time');
  });
}

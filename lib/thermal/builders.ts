/**
 * Problems built from catalogue-like data (physics.md §3). Pure functions: they validate their
 * own inputs (ThermalInputError naming the input field), compute derived quantities and return a
 * ThermalProblem whose `assumptions` say what was simplified.
 */
import { ThermalInputError } from './errors';
import { buriedExternalThermalResistance } from './iec60287';
import type { Boundary, ConvectionSpec, Layer, SolverOptions, ThermalFlag, ThermalProblem } from './types';
import {
  requireFraction,
  requireNonNegative,
  requirePositive,
  requirePositiveInteger,
  requireRecord,
  requireTemperature,
} from './validate';

function requireAcFactor(value: unknown): number {
  if (value === undefined) return 1;
  const f = requirePositive(value, 'acFactor');
  if (f < 1) throw new ThermalInputError('acFactor', `must be at least 1 (AC resistance is never below DC), got ${f}`);
  return f;
}

// ---------------------------------------------------------------------------------------------
// Cable
// ---------------------------------------------------------------------------------------------

export interface CableLayerInput {
  name: string;
  thicknessM: number;
  /** IEC 60287 thermal resistivity of the material, K·m/W (conductivity = 1/ρ_T). */
  thermalResistivityKmPerW: number;
  cells?: number;
}

export type CableConvectionInput =
  | { kind: 'horizontal-cylinder' }
  | { kind: 'forced'; windMps: number }
  | { kind: 'iec-60287-free-air' };

export interface CableInAir {
  kind: 'air';
  ambientC: number;
  /** Surface emissivity 0..1 (ignored, and must be 0, with the IEC coefficient). */
  emissivity: number;
  convection: CableConvectionInput;
  /** Solar irradiance on a plane normal to the rays, W/m². */
  solarWPerM2?: number;
  /** Solar absorption coefficient of the surface, 0..1 (required with solarWPerM2). */
  absorptivity?: number;
}

export interface CableBuried {
  kind: 'buried';
  soilResistivityKmPerW: number;
  /** Depth of the cable axis, m. */
  depthM: number;
  groundC: number;
}

export interface CableInput {
  /** Effective conductor diameter from the catalogue, m. */
  conductorDiameterM: number;
  currentA: number;
  /** Catalogue DC resistance at 20 °C, Ω/m (datasheet or IEC 60228 maximum). */
  r20OhmPerM: number;
  alpha20PerK: number;
  /** R_ac/R_dc (default 1). */
  acFactor?: number;
  /** Effective radial thermal conductivity of the conductor, W/(m·K) (stranding lowers it). */
  conductorConductivity: number;
  conductorCells?: number;
  /** Insulation, screens, sheaths, jacket — from the conductor outwards. */
  layers: CableLayerInput[];
  outer: CableInAir | CableBuried;
  options?: SolverOptions;
}

function cableSurface(raw: Record<string, unknown>, externalDiameterM: number, flags: ThermalFlag[]): Boundary {
  if (raw.kind === 'buried') {
    const groundC = requireTemperature(raw.groundC, 'outer.groundC');
    const t4 = buriedExternalThermalResistance({
      soilResistivityKmPerW: requirePositive(raw.soilResistivityKmPerW, 'outer.soilResistivityKmPerW'),
      depthM: requirePositive(raw.depthM, 'outer.depthM'),
      externalDiameterM,
    });
    flags.push({
      code: 'buried-constant-soil',
      severity: 'info',
      message: `Soil as the IEC 60287-2-1 external resistance T4 = ${t4.toPrecision(4)} K·m/W to ${groundC} °C, applied as a surface conductance; uniform soil, no drying out, no neighbouring cables.`,
    });
    // Per metre, the surface conductance h·πDe must equal 1/T4.
    return { kind: 'surface', ambient: groundC, h: 1 / (t4 * Math.PI * externalDiameterM) };
  }
  if (raw.kind !== 'air') throw new ThermalInputError('outer.kind', "must be 'air' or 'buried'");

  const ambient = requireTemperature(raw.ambientC, 'outer.ambientC');
  let emissivity = requireFraction(raw.emissivity, 'outer.emissivity');
  const c = requireRecord(raw.convection, 'outer.convection');
  let convection: ConvectionSpec;
  switch (c.kind) {
    case 'horizontal-cylinder':
      convection = { kind: 'horizontal-cylinder', diameter: externalDiameterM };
      break;
    case 'forced':
      convection = { kind: 'forced-cylinder', velocity: requirePositive(c.windMps, 'outer.convection.windMps'), diameter: externalDiameterM };
      flags.push({
        code: 'forced-convection-only',
        severity: 'info',
        message: 'Wind: forced convection alone (Churchill–Bernstein); natural convection is not added, which errs hot at very low wind speeds.',
      });
      break;
    case 'iec-60287-free-air':
      convection = { kind: 'iec-60287-free-air', diameter: externalDiameterM };
      if (emissivity > 0) {
        flags.push({
          code: 'iec-coefficient-includes-radiation',
          severity: 'info',
          message: 'IEC 60287-2-1 free-air coefficient (constants from memory) already includes radiation: the emissivity given was not used.',
        });
      }
      emissivity = 0;
      break;
    default:
      throw new ThermalInputError('outer.convection.kind', "must be 'horizontal-cylinder', 'forced' or 'iec-60287-free-air'");
  }
  let absorbedFlux = 0;
  if (raw.solarWPerM2 !== undefined) {
    const solar = requireNonNegative(raw.solarWPerM2, 'outer.solarWPerM2');
    if (raw.absorptivity === undefined) throw new ThermalInputError('outer.absorptivity', 'is required with solarWPerM2');
    const absorptivity = requireFraction(raw.absorptivity, 'outer.absorptivity');
    // The sun sees the projected width De per metre (IEC 60287-1-1 uses σ·De·H per metre);
    // spread over the surface πDe that is σH/π per m² of surface.
    absorbedFlux = (absorptivity * solar) / Math.PI;
    flags.push({
      code: 'solar-projected-area',
      severity: 'info',
      message: `Solar gain ${(absorptivity * solar * externalDiameterM).toPrecision(4)} W/m (absorptivity × irradiance × De), spread evenly round the surface.`,
    });
  } else if (raw.absorptivity !== undefined) {
    requireFraction(raw.absorptivity, 'outer.absorptivity');
  }
  return { kind: 'surface', ambient, emissivity, convection, ...(absorbedFlux > 0 ? { absorbedFlux } : {}) };
}

/**
 * Single-core round cable: solid conductor from the axis (generating, Joule), then each layer,
 * then air or soil. The Joule source uses the effective resistivity ρ₂₀ = R₂₀·A_c over the
 * conductor's effective area, so the heat per metre is exactly I²R(T) from the catalogue.
 */
export function cableProblem(input: CableInput): ThermalProblem {
  const raw = requireRecord(input, 'cable');
  const diameter = requirePositive(raw.conductorDiameterM, 'conductorDiameterM');
  const current = requireNonNegative(raw.currentA, 'currentA');
  const r20 = requirePositive(raw.r20OhmPerM, 'r20OhmPerM');
  const alpha20 = requireNonNegative(raw.alpha20PerK, 'alpha20PerK');
  const acFactor = requireAcFactor(raw.acFactor);
  const conductorConductivity = requirePositive(raw.conductorConductivity, 'conductorConductivity');
  const conductorCells = raw.conductorCells === undefined ? undefined : requirePositiveInteger(raw.conductorCells, 'conductorCells');
  if (!Array.isArray(raw.layers) || raw.layers.length === 0) {
    throw new ThermalInputError('layers', 'must list at least one layer (the insulation)');
  }
  const layers: Layer[] = raw.layers.map((l: unknown, i: number) => {
    const layer = requireRecord(l, `layers[${i}]`);
    if (typeof layer.name !== 'string') throw new ThermalInputError(`layers[${i}].name`, 'must be a string');
    return {
      name: layer.name,
      thickness: requirePositive(layer.thicknessM, `layers[${i}].thicknessM`),
      conductivity: 1 / requirePositive(layer.thermalResistivityKmPerW, `layers[${i}].thermalResistivityKmPerW`),
      ...(layer.cells !== undefined ? { cells: requirePositiveInteger(layer.cells, `layers[${i}].cells`) } : {}),
    };
  });
  const externalDiameterM = diameter + 2 * layers.reduce((sum, l) => sum + l.thickness, 0);
  const area = (Math.PI * diameter * diameter) / 4;
  const flags: ThermalFlag[] = [
    {
      code: 'single-isolated-cable',
      severity: 'info',
      message: 'One isolated single-core cable: no grouping, no sheath or armour losses, no dielectric losses.',
    },
  ];
  const outer = cableSurface(requireRecord(raw.outer, 'outer'), externalDiameterM, flags);
  return {
    geometry: {
      kind: 'cylinder',
      innerRadius: 0,
      layers: [
        {
          name: 'conductor',
          thickness: diameter / 2,
          conductivity: conductorConductivity,
          generating: true,
          ...(conductorCells !== undefined ? { cells: conductorCells } : {}),
        },
        ...layers,
      ],
    },
    source: { kind: 'joule', current, area, rho20: r20 * area, alpha20, acFactor },
    inner: { kind: 'symmetry' },
    outer,
    ...(raw.options !== undefined ? { options: raw.options as SolverOptions } : {}),
    assumptions: flags,
  };
}

// ---------------------------------------------------------------------------------------------
// Bus bar
// ---------------------------------------------------------------------------------------------

export interface BusBarCoating {
  thicknessM: number;
  conductivity: number;
  emissivity: number;
}

export interface BusBarInput {
  widthM: number;
  thicknessM: number;
  /** Bars in parallel per phase; the phase current is shared equally. */
  barsPerPhase: number;
  /** Phase current, A. */
  currentA: number;
  /** DC resistance at 20 °C of ONE bar, Ω/m. */
  r20OhmPerM: number;
  alpha20PerK: number;
  acFactor?: number;
  /** Bar thermal conductivity, W/(m·K). */
  conductivity: number;
  /** Paint or sleeving on both wide faces; its emissivity replaces the bare bar's. */
  coating?: BusBarCoating;
  /** 'edge': wide faces vertical (height = width); 'flat': wide faces horizontal. */
  orientation: 'edge' | 'flat';
  ambientC: number;
  /** Emissivity of the bare bar surface, 0..1. */
  emissivity: number;
  /** Air speed across the bar, m/s (omit or 0 for still air). */
  windMps?: number;
  cellsPerLayer?: number;
  options?: SolverOptions;
}

/**
 * One bar as a slab through its thickness, both wide faces cooled (physics.md §3). Results are
 * per m² of wide face: multiply heat by widthM for watts per metre of bar. The inner face
 * (position 0) is the lower face when the bar lies flat.
 */
export function busBarProblem(input: BusBarInput): ThermalProblem {
  const raw = requireRecord(input, 'busBar');
  const width = requirePositive(raw.widthM, 'widthM');
  const thickness = requirePositive(raw.thicknessM, 'thicknessM');
  const bars = requirePositiveInteger(raw.barsPerPhase, 'barsPerPhase');
  const current = requireNonNegative(raw.currentA, 'currentA');
  const r20 = requirePositive(raw.r20OhmPerM, 'r20OhmPerM');
  const alpha20 = requireNonNegative(raw.alpha20PerK, 'alpha20PerK');
  const acFactor = requireAcFactor(raw.acFactor);
  const conductivity = requirePositive(raw.conductivity, 'conductivity');
  if (raw.orientation !== 'edge' && raw.orientation !== 'flat') throw new ThermalInputError('orientation', "must be 'edge' or 'flat'");
  const ambient = requireTemperature(raw.ambientC, 'ambientC');
  let emissivity = requireFraction(raw.emissivity, 'emissivity');
  const wind = raw.windMps === undefined ? 0 : requireNonNegative(raw.windMps, 'windMps');
  const cells = raw.cellsPerLayer === undefined ? undefined : requirePositiveInteger(raw.cellsPerLayer, 'cellsPerLayer');
  const cellsField = cells !== undefined ? { cells } : {};

  const conductor: Layer = { name: 'bar', thickness, conductivity, generating: true, ...cellsField };
  let layers: Layer[] = [conductor];
  let coatingThickness = 0;
  if (raw.coating !== undefined) {
    const c = requireRecord(raw.coating, 'coating');
    coatingThickness = requirePositive(c.thicknessM, 'coating.thicknessM');
    const coating: Layer = {
      name: 'coating',
      thickness: coatingThickness,
      conductivity: requirePositive(c.conductivity, 'coating.conductivity'),
      ...cellsField,
    };
    emissivity = requireFraction(c.emissivity, 'coating.emissivity');
    layers = [coating, conductor, { ...coating }];
  }

  const outerWidth = width + 2 * coatingThickness;
  const outerThickness = thickness + 2 * coatingThickness;
  // Edges lumped onto the wide faces: per metre of bar the two faces then expose 2(w + t).
  const areaFactor = (outerWidth + outerThickness) / width;
  const flags: ThermalFlag[] = [
    {
      code: 'bar-edges-lumped',
      severity: 'info',
      message: `Narrow edges lumped onto the wide faces (area × ${areaFactor.toFixed(4)}); conduction across the width is not resolved.`,
    },
    {
      code: 'bar-results-per-square-metre',
      severity: 'info',
      message: `Heat figures are per m² of wide face: multiply by ${width} m for W per metre of bar.`,
    },
  ];
  if (bars > 1) {
    flags.push({
      code: 'multi-bar-pack',
      severity: 'warning',
      message: `${bars} bars per phase modelled as one bar with both faces free: inner faces of a pack lose less heat, and AC current sharing is unequal. The result is optimistic for the pack.`,
    });
  }

  let innerConvection: ConvectionSpec;
  let outerConvection: ConvectionSpec;
  if (wind > 0) {
    innerConvection = { kind: 'forced-plate', velocity: wind, length: outerWidth };
    outerConvection = { kind: 'forced-plate', velocity: wind, length: outerWidth };
    flags.push({
      code: 'bar-forced-flat-plate',
      severity: 'warning',
      message: 'Wind treated as parallel flow along the face width (flat-plate correlations); a bar in cross-flow separates, so this is an approximation.',
    });
  } else if (raw.orientation === 'edge') {
    innerConvection = { kind: 'vertical-plate', height: outerWidth };
    outerConvection = { kind: 'vertical-plate', height: outerWidth };
  } else {
    // L = area/perimeter of a long face of width w: w·ℓ/(2(w + ℓ)) → w/2 as ℓ → ∞.
    innerConvection = { kind: 'horizontal-plate', facing: 'down', length: outerWidth / 2 };
    outerConvection = { kind: 'horizontal-plate', facing: 'up', length: outerWidth / 2 };
    flags.push({
      code: 'bar-flat-length',
      severity: 'info',
      message: 'Bar laid flat: horizontal-plate length L = area/perimeter taken as width/2 (long bar).',
    });
  }
  const surface = (convection: ConvectionSpec): Boundary => ({ kind: 'surface', ambient, emissivity, convection, areaFactor });
  const area = width * thickness;
  return {
    geometry: { kind: 'slab', layers },
    source: { kind: 'joule', current: current / bars, area, rho20: r20 * area, alpha20, acFactor },
    inner: surface(innerConvection),
    outer: surface(outerConvection),
    ...(raw.options !== undefined ? { options: raw.options as SolverOptions } : {}),
    assumptions: flags,
  };
}

/**
 * From catalogue rows to the sizing library's Candidate (lib/electrical, physics.md §7).
 *
 * The catalogue stores values in the units of the published tables (Ω/km, mm); the library
 * works in SI (Ω/m, m). Decimal strings become numbers here, at the last moment, because the
 * solver works in floating point. Every source travels with the candidate so that a note marked
 * "from memory" raises the DATA_FROM_MEMORY assumption flag.
 */
import Decimal from 'decimal.js';
import type { BarCandidate, CableCandidate, CableLayer } from '@/lib/electrical';
import type { CoveringRow, ConductorRow, MaterialRow, BuildRow } from './schemas';

type WithId<T> = T & { id: string };

export interface CataloguePartsOfBuild {
  build: WithId<BuildRow>;
  conductor: WithId<ConductorRow>;
  material: WithId<MaterialRow>;
  /** From the conductor outwards. */
  layers: Array<{ covering: WithId<CoveringRow>; thicknessMm: string; source: string }>;
}

export interface CataloguePartsOfBar {
  conductor: WithId<ConductorRow>;
  material: WithId<MaterialRow>;
  coating?: { covering: WithId<CoveringRow>; thicknessMm: string; source: string };
}

const mmToM = (mm: string) => new Decimal(mm).div(1000).toNumber();
const ohmPerKmToOhmPerM = (ohmPerKm: string) => new Decimal(ohmPerKm).div(1000).toNumber();
const optionalNumber = (value: string | null) => (value === null ? undefined : new Decimal(value).toNumber());

export function mentionsFromMemory(notes: readonly string[]): boolean {
  return notes.some((note) => /from memory/i.test(note));
}

function layerRole(role: CoveringRow['role']): CableLayer['role'] {
  switch (role) {
    case 'insulation':
      return 'insulation';
    case 'sheath':
      return 'sheath';
    default:
      return 'other';
  }
}

function materialNotes(material: MaterialRow): string[] {
  return [
    `${material.name} ρ₂₀, α₂₀: ${material.electricalSource}`,
    `${material.name} density: ${material.thermalSource}`,
  ];
}

function costs(material: MaterialRow) {
  return {
    ...(material.pricePerKg !== null ? { conductorPricePerKg: material.pricePerKg } : {}),
    densityKgPerM3: new Decimal(material.densityKgPerM3).toNumber(),
  };
}

/** A cable build as one candidate (parallel runs per phase default to 1). */
export function cableBuildToCandidate(parts: CataloguePartsOfBuild, options: { parallel?: number; id?: string } = {}): CableCandidate {
  const { build, conductor, material, layers } = parts;
  if (conductor.shape !== 'round' || conductor.diameterMm === null) {
    throw new Error(`cable build ${build.key}: its conductor ${conductor.key} is not a round conductor with a diameter`);
  }
  const sourceNotes = [
    `${conductor.designation} R₂₀: ${conductor.resistanceSource}`,
    `${conductor.designation} diameter: ${conductor.dimensionSource}`,
    ...materialNotes(material),
  ];
  const cableLayers: CableLayer[] = layers.map(({ covering, thicknessMm, source }) => {
    sourceNotes.push(`${covering.name} thickness: ${source}`, `${covering.name} ρ_T: ${covering.resistivitySource}`, `${covering.name} limits: ${covering.limitsSource}`);
    return {
      name: covering.name,
      role: layerRole(covering.role),
      thicknessM: mmToM(thicknessMm),
      thermalResistivityKmPerW: new Decimal(covering.thermalResistivityKmPerW).toNumber(),
      ...(covering.continuousLimitC !== null ? { continuousLimitC: optionalNumber(covering.continuousLimitC) } : {}),
      ...(covering.shortCircuitLimitC !== null ? { shortCircuitLimitC: optionalNumber(covering.shortCircuitLimitC) } : {}),
    };
  });
  const outer = layers[layers.length - 1]?.covering;
  if (outer?.emissivity != null) sourceNotes.push(`${outer.name} emissivity: ${outer.emissivitySource}`);
  return {
    kind: 'cable',
    id: options.id ?? build.id,
    label: build.name,
    material: material.baseMetal,
    r20OhmPerM: ohmPerKmToOhmPerM(conductor.r20OhmPerKm),
    alpha20PerK: new Decimal(material.alpha20PerK).toNumber(),
    parallel: options.parallel ?? 1,
    sectionMm2: new Decimal(conductor.sectionMm2).toNumber(),
    conductorDiameterM: mmToM(conductor.diameterMm),
    cores: build.cores,
    layers: cableLayers,
    ...(outer?.emissivity != null ? { emissivity: new Decimal(outer.emissivity).toNumber() } : {}),
    catalogue: { conductorId: conductor.id, coveringIds: layers.map((l) => l.covering.id) },
    sourceNotes,
    dataFromMemory: mentionsFromMemory(sourceNotes),
    costs: costs(material),
  };
}

/** A rectangular bar (optionally coated) as one candidate. */
export function barToCandidate(
  parts: CataloguePartsOfBar,
  options: { barsPerPhase?: number; barGapM?: number; parallel?: number; id?: string; terminalLimitC?: number } = {},
): BarCandidate {
  const { conductor, material, coating } = parts;
  if (conductor.shape !== 'rectangular' || conductor.widthMm === null || conductor.thicknessMm === null) {
    throw new Error(`conductor ${conductor.key} is not a rectangular bar with width and thickness`);
  }
  const sourceNotes = [
    `${conductor.designation} R₂₀: ${conductor.resistanceSource}`,
    `${conductor.designation} dimensions: ${conductor.dimensionSource}`,
    ...materialNotes(material),
  ];
  // R_p0.2 in N/mm² (= MPa) → Pa for the IEC 60865-1 check; absent, the library assumes its default per metal (flagged).
  const yieldStrengthPa = conductor.yieldStrengthMpa == null ? undefined : new Decimal(conductor.yieldStrengthMpa).times(1e6).toNumber();
  if (yieldStrengthPa !== undefined) sourceNotes.push(`${conductor.designation} R_p0.2: ${conductor.yieldStrengthSource}`);
  const barShortCircuitLimitC = conductor.shortCircuitLimitC == null ? undefined : optionalNumber(conductor.shortCircuitLimitC);
  if (barShortCircuitLimitC !== undefined) sourceNotes.push(`${conductor.designation} short-circuit limit: ${conductor.shortCircuitLimitSource}`);
  if (coating) {
    sourceNotes.push(
      `${coating.covering.name} thickness: ${coating.source}`,
      `${coating.covering.name} ρ_T: ${coating.covering.resistivitySource}`,
      `${coating.covering.name} limits: ${coating.covering.limitsSource}`,
      `${coating.covering.name} emissivity: ${coating.covering.emissivitySource}`,
    );
  }
  return {
    kind: 'bar',
    id: options.id ?? conductor.id,
    label: coating ? `${conductor.designation} ${material.name} bar, ${coating.covering.name}` : `${conductor.designation} ${material.name} bar`,
    material: material.baseMetal,
    r20OhmPerM: ohmPerKmToOhmPerM(conductor.r20OhmPerKm),
    alpha20PerK: new Decimal(material.alpha20PerK).toNumber(),
    parallel: options.parallel ?? 1,
    widthM: mmToM(conductor.widthMm),
    thicknessM: mmToM(conductor.thicknessMm),
    barsPerPhase: options.barsPerPhase ?? 1,
    ...(options.barGapM !== undefined ? { barGapM: options.barGapM } : {}),
    ...(options.terminalLimitC !== undefined ? { terminalLimitC: options.terminalLimitC } : {}),
    ...(yieldStrengthPa !== undefined ? { yieldStrengthPa } : {}),
    ...(barShortCircuitLimitC !== undefined ? { shortCircuitLimitC: barShortCircuitLimitC } : {}),
    ...(coating
      ? {
          coating: {
            name: coating.covering.name,
            thicknessM: mmToM(coating.thicknessMm),
            thermalResistivityKmPerW: new Decimal(coating.covering.thermalResistivityKmPerW).toNumber(),
            ...(coating.covering.emissivity !== null ? { emissivity: new Decimal(coating.covering.emissivity).toNumber() } : {}),
            ...(coating.covering.continuousLimitC !== null ? { continuousLimitC: optionalNumber(coating.covering.continuousLimitC) } : {}),
            ...(coating.covering.shortCircuitLimitC !== null ? { shortCircuitLimitC: optionalNumber(coating.covering.shortCircuitLimitC) } : {}),
          },
        }
      : {}),
    catalogue: { conductorId: conductor.id, coveringIds: coating ? [coating.covering.id] : [] },
    sourceNotes,
    dataFromMemory: mentionsFromMemory(sourceNotes),
    costs: costs(material),
  };
}

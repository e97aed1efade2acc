/**
 * Current distribution, AC resistance and losses of every bar of a bus-bar system, by the filament
 * method (filaments.ts) over all bars of the three phases and the neutral/PE pack.
 *
 * Excitation: a balanced three-phase set (L1 = I∠0°, L2 = I∠−120°, L3 = I∠+120°: positive
 * sequence with L1, L2, L3 in order along +x; the neutral/PE carries no net current, but its bars
 * may carry equal and opposite eddy currents between them) or DC (each phase I, the current
 * divides by resistance alone).
 *
 * Per bar: R_ac/R_dc = loss / (|I_bar|²·R_dc,bar); per phase: loss / (|I_phase|²·R_dc,bar/n),
 * which includes the unequal sharing. Each bar has its own resistivity at its own temperature
 * (ρ = ρ₂₀[1 + α₂₀(θ − 20)]), so a hotter bar takes less current.
 */
import { ElectricalInputError, requireFinite, requirePositive, requireRange, requireTemperature } from '../errors';
import { MU0 } from '../materials';
import {
  meshRectangle,
  prepareFilamentSystem,
  solveFilaments,
  solvePreparedFilaments,
  type Complex,
  type Filament,
  type PreparedFilamentSystem,
} from './filaments';
import type { BusbarRectangle, PreparedBusbarSystem } from './geometry';

export interface BusbarConductorData {
  /** Effective resistivity at 20 °C, Ω·m (from the catalogue: R₂₀ per metre × bar section). */
  rho20OhmM: number;
  alpha20PerK: number;
}

export type BusbarExcitation =
  | { kind: 'three-phase'; frequencyHz: number; phaseCurrentA: number }
  | { kind: 'dc'; phaseCurrentA: number };

export interface FilamentMeshOptions {
  /** Cells across a bar's thickness. Default from the skin depth (see `defaultMesh`). */
  cellsAcrossThickness?: number;
  /** Cells along a bar's full width (the half kept by the mirror gets half of them). */
  cellsAlongWidth?: number;
  /** Grading towards the faces, 0 (uniform) … 1. Default 0.8. */
  beta?: number;
}

export interface CurrentDistributionInput {
  system: PreparedBusbarSystem;
  conductor: BusbarConductorData;
  /** One temperature for every bar, or one per bar (order of `system.bars`), °C. */
  barTemperaturesC: number | readonly number[];
  excitation: BusbarExcitation;
  mesh?: FilamentMeshOptions;
}

export interface BarCurrentResult {
  index: number;
  group: string;
  positionInPack: number;
  /** RMS magnitude, A. */
  currentA: number;
  /** Phase angle of the bar current, degrees. */
  angleDeg: number;
  /** |I_bar| / |I_phase| (the bars' shares may add up to more than 1 when their angles differ); 0 for the neutral. */
  shareOfPhase: number;
  /** Loss per metre of bar, W/m. */
  lossWPerM: number;
  /** DC resistance of the bar at its temperature, Ω/m. */
  rdcOhmPerM: number;
  /** loss / (|I|²·R_dc); null when the bar carries (almost) no current. */
  acFactor: number | null;
  temperatureC: number;
}

export interface GroupCurrentResult {
  name: string;
  /** Imposed RMS current, A. */
  currentA: number;
  lossWPerM: number;
  /** loss / (|I_phase|²·R_dc of the pack): includes the unequal sharing; null for the neutral. */
  acFactor: number | null;
  /** Of the pack's bars: the largest current over the mean current (1 = equal sharing). */
  sharingImbalance: number;
}

export interface CurrentDistributionResult {
  bars: BarCurrentResult[];
  groups: GroupCurrentResult[];
  totalLossWPerM: number;
  /** Filaments in the whole system (including the mirrored half). */
  filamentCount: number;
  /** Unknowns actually solved for (half of them, by the mirror about y = 0). */
  unknowns: number;
  mesh: Required<FilamentMeshOptions>;
  /** Skin depth at the mean bar temperature, m (Infinity at DC). */
  skinDepthM: number;
  powerBalanceResidual: number;
  method: string;
}

export const CURRENT_DISTRIBUTION_METHOD =
  'filament (partial-inductance) method: long rectangular filaments, L′ from the exact geometric mean distance of rectangles ' +
  '(Maxwell; Grover 1946; long-bar limit of Hoer & Love 1965), each phase current imposed';

export function skinDepth(rhoOhmM: number, frequencyHz: number): number {
  return frequencyHz > 0 ? Math.sqrt(rhoOhmM / (Math.PI * frequencyHz * MU0)) : Number.POSITIVE_INFINITY;
}

/**
 * Default filaments: across the thickness two cells per skin depth plus two (at least 3), along
 * the width two cells per thickness (at least 8), both graded towards the faces. The benchmark
 * (scripts/bench-busbar.ts) prints how R_ac/R_dc and the sharing move under refinement from here:
 * a few tenths of a per cent for 10 mm copper bars at 50 Hz.
 */
export function defaultMesh(widthM: number, thicknessM: number, skinDepthM: number): Required<FilamentMeshOptions> {
  const finite = Number.isFinite(skinDepthM) ? skinDepthM : 10 * thicknessM;
  const acrossThickness = Math.min(12, Math.max(3, Math.ceil((2 * thicknessM) / finite) + 2));
  const alongWidth = Math.min(64, Math.max(8, 2 * Math.ceil(widthM / thicknessM)));
  return { cellsAcrossThickness: acrossThickness, cellsAlongWidth: alongWidth, beta: 0.8 };
}

function barTemperatures(value: number | readonly number[], count: number): number[] {
  if (typeof value === 'number') {
    const t = requireTemperature(value, 'barTemperaturesC');
    return new Array(count).fill(t);
  }
  if (!Array.isArray(value) || value.length !== count) {
    throw new ElectricalInputError('barTemperaturesC', `must be one number or ${count} numbers (one per bar)`);
  }
  return value.map((t, i) => requireTemperature(t, `barTemperaturesC[${i}]`));
}

/** The part of a bar kept for the mirror about y = 0 (null when the bar lies wholly below the axis). */
function keptHalf(bar: BusbarRectangle): { rect: BusbarRectangle; cut: boolean } | null {
  const top = bar.cyM + bar.sizeYM / 2;
  const bottom = bar.cyM - bar.sizeYM / 2;
  const tolerance = 1e-12;
  if (bottom >= -tolerance) return { rect: bar, cut: false };
  if (top <= tolerance) return null;
  // Straddles the axis: geometry.ts centres such bars on y = 0 exactly.
  return { rect: { cxM: bar.cxM, cyM: top / 2, sizeXM: bar.sizeXM, sizeYM: top }, cut: true };
}

function resistivitiesAt(rho20: number, alpha20: number, temperatures: readonly number[]): number[] {
  return temperatures.map((t, i) => {
    const factor = 1 + alpha20 * (t - 20);
    if (factor <= 0) throw new ElectricalInputError(`barTemperaturesC[${i}]`, 'is below the range of the linear resistance law');
    return rho20 * factor;
  });
}

export interface PreparedCurrentDistribution {
  readonly system: PreparedBusbarSystem;
  readonly conductor: Readonly<BusbarConductorData>;
  readonly frequencyHz: number;
  readonly mesh: Required<FilamentMeshOptions>;
  /** Bar temperatures the factorisation was made at, °C. */
  readonly referenceTemperaturesC: readonly number[];
  readonly skinDepthM: number;
  readonly filaments: readonly Filament[];
  readonly cutBar: readonly boolean[];
  readonly filamentSystem: PreparedFilamentSystem;
}

/**
 * Meshes every bar and factors the filament system once, at the given bar temperatures. Solves at
 * other bar temperatures (within a few tens of kelvin) then reuse the factorisation
 * (`solveCurrentDistribution`); `computeCurrentDistribution` does both in one call.
 */
export function prepareCurrentDistribution(input: {
  system: PreparedBusbarSystem;
  conductor: BusbarConductorData;
  frequencyHz: number;
  barTemperaturesC: number | readonly number[];
  mesh?: FilamentMeshOptions;
}): PreparedCurrentDistribution {
  const { system } = input;
  const rho20 = requirePositive(input.conductor?.rho20OhmM, 'conductor.rho20OhmM');
  const alpha20 = requireRange(input.conductor?.alpha20PerK, 'conductor.alpha20PerK', 0, 0.01);
  const frequencyHz = requireRange(input.frequencyHz, 'excitation.frequencyHz', 0, 1000);
  const temperatures = barTemperatures(input.barTemperaturesC, system.bars.length);
  const resistivity = resistivitiesAt(rho20, alpha20, temperatures);
  const meanRho = resistivity.reduce((s, r) => s + r, 0) / resistivity.length;
  const delta = skinDepth(meanRho, frequencyHz);
  const auto = defaultMesh(system.barWidthM, system.barThicknessM, delta);
  const mesh: Required<FilamentMeshOptions> = {
    cellsAcrossThickness: input.mesh?.cellsAcrossThickness ?? auto.cellsAcrossThickness,
    cellsAlongWidth: input.mesh?.cellsAlongWidth ?? auto.cellsAlongWidth,
    beta: input.mesh?.beta ?? auto.beta,
  };
  if (!Number.isInteger(mesh.cellsAcrossThickness) || mesh.cellsAcrossThickness < 1 || mesh.cellsAcrossThickness > 64) {
    throw new ElectricalInputError('mesh.cellsAcrossThickness', 'must be a whole number 1 … 64');
  }
  if (!Number.isInteger(mesh.cellsAlongWidth) || mesh.cellsAlongWidth < 2 || mesh.cellsAlongWidth > 256 || mesh.cellsAlongWidth % 2 !== 0) {
    throw new ElectricalInputError('mesh.cellsAlongWidth', 'must be an even whole number 2 … 256');
  }
  requireRange(mesh.beta, 'mesh.beta', 0, 1);

  // Filaments of the kept half (y ≥ 0) of every bar.
  const filaments: Filament[] = [];
  const cutBar = system.bars.map(() => false);
  system.bars.forEach((bar, barIndex) => {
    const kept = keptHalf(bar);
    if (kept === null) return;
    cutBar[barIndex] = kept.cut;
    const cells =
      system.arrangement === 'edge'
        ? meshRectangle(kept.rect, {
            cellsX: mesh.cellsAcrossThickness,
            cellsY: Math.max(1, Math.ceil(mesh.cellsAlongWidth / 2)),
            gradingX: 'both',
            gradingY: 'high',
            beta: mesh.beta,
          })
        : meshRectangle(kept.rect, {
            cellsX: mesh.cellsAlongWidth,
            cellsY: kept.cut ? Math.max(1, Math.ceil(mesh.cellsAcrossThickness / 2)) : mesh.cellsAcrossThickness,
            gradingX: 'both',
            gradingY: kept.cut ? 'high' : 'both',
            beta: mesh.beta,
          });
    for (const c of cells) filaments.push({ ...c, resistivityOhmM: resistivity[barIndex], group: bar.groupIndex, tag: barIndex });
  });
  const filamentSystem = prepareFilamentSystem({ filaments, groupCount: system.groups.length, frequencyHz, mirror: { y: true } });
  return {
    system,
    conductor: { rho20OhmM: rho20, alpha20PerK: alpha20 },
    frequencyHz,
    mesh,
    referenceTemperaturesC: temperatures,
    skinDepthM: delta,
    filaments,
    cutBar,
    filamentSystem,
  };
}

/** The current distribution at the given bar temperatures and phase current, on a prepared system. */
export function solveCurrentDistribution(
  prepared: PreparedCurrentDistribution,
  input: { barTemperaturesC: number | readonly number[]; phaseCurrentA: number; dc?: boolean },
): CurrentDistributionResult {
  const { system, filaments } = prepared;
  const temperatures = barTemperatures(input.barTemperaturesC, system.bars.length);
  const resistivity = resistivitiesAt(prepared.conductor.rho20OhmM, prepared.conductor.alpha20PerK, temperatures);
  const phaseCurrentA = requireFinite(input.phaseCurrentA, 'excitation.phaseCurrentA');
  if (phaseCurrentA < 0) throw new ElectricalInputError('excitation.phaseCurrentA', 'must not be negative');
  const dc = prepared.frequencyHz === 0;

  const groupCurrents: Complex[] = system.groups.map((g, i) => {
    if (g.name === 'N' || g.name === 'PE') return { re: 0, im: 0 };
    if (dc) return { re: phaseCurrentA, im: 0 };
    const angle = (-2 * Math.PI * i) / 3; // L1 0°, L2 −120°, L3 −240° = +120°
    return { re: phaseCurrentA * Math.cos(angle), im: phaseCurrentA * Math.sin(angle) };
  });

  const changed = temperatures.some((t, k) => t !== prepared.referenceTemperaturesC[k]);
  const solution = solvePreparedFilaments(
    prepared.filamentSystem,
    groupCurrents,
    changed ? filaments.map((f) => resistivity[f.tag]) : undefined,
  );

  // Aggregate per bar. A bar wholly below the axis is the image of one above it (same x, −y).
  const n = system.bars.length;
  const sumRe = new Float64Array(n);
  const sumIm = new Float64Array(n);
  const loss = new Float64Array(n);
  const halfRe = new Float64Array(n);
  const halfIm = new Float64Array(n);
  const halfLoss = new Float64Array(n);
  filaments.forEach((f, i) => {
    halfRe[f.tag] += solution.currentRe[i];
    halfIm[f.tag] += solution.currentIm[i];
    halfLoss[f.tag] += solution.filamentLossWPerM[i] / 2; // the filament alone, not its image
  });
  system.bars.forEach((bar, k) => {
    const kept = keptHalf(bar);
    if (kept === null) {
      const mirror = system.bars.find((b) => b.groupIndex === bar.groupIndex && Math.abs(b.cxM - bar.cxM) < 1e-12 && Math.abs(b.cyM + bar.cyM) < 1e-12);
      if (!mirror) throw new Error('current distribution: a bar below the axis has no mirror image');
      sumRe[k] = halfRe[mirror.index];
      sumIm[k] = halfIm[mirror.index];
      loss[k] = halfLoss[mirror.index];
    } else {
      const f = prepared.cutBar[k] ? 2 : 1;
      sumRe[k] = f * halfRe[k];
      sumIm[k] = f * halfIm[k];
      loss[k] = f * halfLoss[k];
    }
  });

  const bars: BarCurrentResult[] = system.bars.map((bar, k) => {
    const currentA = Math.hypot(sumRe[k], sumIm[k]);
    const rdcOhmPerM = resistivity[k] / (bar.widthM * bar.thicknessM);
    const phase = groupCurrents[bar.groupIndex];
    const phaseMagnitude = Math.hypot(phase.re, phase.im);
    const carries = currentA > 1e-9 * Math.max(phaseCurrentA, 1e-30);
    return {
      index: k,
      group: system.groups[bar.groupIndex].name,
      positionInPack: bar.positionInPack,
      currentA,
      angleDeg: (Math.atan2(sumIm[k], sumRe[k]) * 180) / Math.PI,
      shareOfPhase: phaseMagnitude > 0 ? currentA / phaseMagnitude : 0,
      lossWPerM: loss[k],
      rdcOhmPerM,
      acFactor: carries && phaseMagnitude > 0 ? loss[k] / (currentA * currentA * rdcOhmPerM) : null,
      temperatureC: temperatures[k],
    };
  });

  const groups: GroupCurrentResult[] = system.groups.map((g, i) => {
    const members = g.barIndices.map((k) => bars[k]);
    const groupLoss = members.reduce((s, b) => s + b.lossWPerM, 0);
    const magnitude = Math.hypot(groupCurrents[i].re, groupCurrents[i].im);
    // Pack DC resistance: the bars in parallel.
    const packRdc = 1 / members.reduce((s, b) => s + 1 / b.rdcOhmPerM, 0);
    const mean = members.reduce((s, b) => s + b.currentA, 0) / members.length;
    const largest = Math.max(...members.map((b) => b.currentA));
    return {
      name: g.name,
      currentA: magnitude,
      lossWPerM: groupLoss,
      acFactor: magnitude > 0 ? groupLoss / (magnitude * magnitude * packRdc) : null,
      sharingImbalance: mean > 0 ? largest / mean : 1,
    };
  });

  return {
    bars,
    groups,
    totalLossWPerM: solution.totalLossWPerM,
    filamentCount: filaments.length * 2,
    unknowns: filaments.length,
    mesh: prepared.mesh,
    skinDepthM: prepared.skinDepthM,
    powerBalanceResidual: solution.powerBalanceResidual,
    method: CURRENT_DISTRIBUTION_METHOD,
  };
}

export function computeCurrentDistribution(input: CurrentDistributionInput): CurrentDistributionResult {
  const excitation = input.excitation;
  if (excitation?.kind !== 'three-phase' && excitation?.kind !== 'dc') {
    throw new ElectricalInputError('excitation.kind', "must be 'three-phase' or 'dc'");
  }
  const prepared = prepareCurrentDistribution({
    system: input.system,
    conductor: input.conductor,
    frequencyHz: excitation.kind === 'three-phase' ? excitation.frequencyHz : 0,
    barTemperaturesC: input.barTemperaturesC,
    mesh: input.mesh,
  });
  return solveCurrentDistribution(prepared, { barTemperaturesC: input.barTemperaturesC, phaseCurrentA: excitation.phaseCurrentA });
}

/**
 * R_ac/R_dc of ONE isolated rectangular bar (its return far away) by the same filament method,
 * with the mirrors about both axes (a quarter of the bar is solved). Replaces the plane-conductor
 * lower bound for a single bar: at 50 Hz a 100 × 10 mm copper bar at 65 °C gives about 1.165,
 * against 1.005 for the plane conductor, because the current crowds to the narrow edges.
 */
export function isolatedBarAcFactor(args: {
  widthM: number;
  thicknessM: number;
  resistivityOhmM: number;
  frequencyHz: number;
  mesh?: FilamentMeshOptions;
}): { acFactor: number; unknowns: number; mesh: Required<FilamentMeshOptions> } {
  const widthM = requirePositive(args.widthM, 'widthM');
  const thicknessM = requirePositive(args.thicknessM, 'thicknessM');
  const rho = requirePositive(args.resistivityOhmM, 'resistivityOhmM');
  const frequencyHz = requireRange(args.frequencyHz, 'frequencyHz', 0, 1000);
  const auto = defaultMesh(widthM, thicknessM, skinDepth(rho, frequencyHz));
  const mesh: Required<FilamentMeshOptions> = {
    cellsAcrossThickness: args.mesh?.cellsAcrossThickness ?? auto.cellsAcrossThickness,
    cellsAlongWidth: args.mesh?.cellsAlongWidth ?? auto.cellsAlongWidth,
    beta: args.mesh?.beta ?? auto.beta,
  };
  if (frequencyHz === 0) return { acFactor: 1, unknowns: 0, mesh };
  const cells = meshRectangle(
    { cxM: thicknessM / 4, cyM: widthM / 4, sizeXM: thicknessM / 2, sizeYM: widthM / 2 },
    { cellsX: Math.max(1, Math.ceil(mesh.cellsAcrossThickness / 2)), cellsY: Math.max(1, Math.ceil(mesh.cellsAlongWidth / 2)), gradingX: 'high', gradingY: 'high', beta: mesh.beta },
  );
  const filaments: Filament[] = cells.map((c) => ({ ...c, resistivityOhmM: rho, group: 0, tag: 0 }));
  const s = solveFilaments({ filaments, groupCurrents: [{ re: 1, im: 0 }], frequencyHz, mirror: { x: true, y: true } });
  return { acFactor: s.totalLossWPerM / (rho / (widthM * thicknessM)), unknowns: filaments.length, mesh };
}

/**
 * A sheet's buried circuit as the two-dimensional cross-section solver sees it (issue 20,
 * physics.md §9): the same candidate, the same laid-out arrangement and the same losses as the IEC
 * rating of the sheet, so that the field and the rating differ only in how the ground is solved.
 *
 * Everything comes from the sizing library's own preparation of the candidate (its `SizingContext`):
 * - positions: the group the library laid out (lib/electrical/sizing/cableGroup.ts `cableGroupOf`,
 *   which uses lib/electrical/iec60287 `placeCables`), shifted so that the domain's centre line is
 *   the middle of the cables (and of the backfill); depth = −y;
 * - each cable's radial model: the candidate's conductor (R₂₀, α₂₀; a multi-core cable as the
 *   library's equivalent conductor d_c·√n carrying n·I with R₂₀/n) and its coverings inside out;
 *   the AC factor R_ac/R_dc and the screen loss factor λ₁ from the library's functions
 *   (`acFn`, `cableLossesOf`), the dielectric loss from `cableLossesOf` as well;
 * - the currents: the circuit's cables at the design current in the library's model current
 *   (`toModelCurrent`: parallel runs and any grouping derating as the rating has them); another
 *   circuit of the same cable at its own current; another circuit given by its heat as a cable of
 *   its entered diameter that releases that heat at its surface and carries no current;
 * - the ground: the soil's resistivity and the ground temperature the library prepared (its
 *   defaults applied and flagged there), a backfill as a region of its own, each cable in its duct
 *   with the IEC 60287-2-1 duct-air constants and wall resistivity the library holds;
 * - the ground surface: isothermal at the ground temperature (the IEC assumption) or giving heat to
 *   air at the ground temperature through the sheet's coefficient; the bottom of the domain at the
 *   ground temperature, the sides adiabatic.
 *
 * Bad input is refused with the sheet's field named (ElectricalInputError). Pure TypeScript.
 */
import { ElectricalInputError } from '../electrical/errors';
import { DUCT_AIR_SPACE_CONSTANTS, DUCT_WALL_RESISTIVITY } from '../electrical/iec60287/constants';
import { middleX } from '../electrical/iec60287/arrangement';
import type { CableGroup } from '../electrical/sizing/cableGroup';
import { cableLossesOf, fromModelCurrent, toModelCurrent, type SizingContext } from '../electrical/sizing/context';
import { evaluatePrepared } from '../electrical/sizing/evaluate';
import { FlagSet } from '../electrical/sizing/flags';
import { prepareConditions } from '../electrical/sizing/prepareConditions';
import type { PreparedCable } from '../electrical/sizing/prepared';
import type { CandidateEvaluationOk, GroupResultCable } from '../electrical/sizing/types';
import { checkBound } from '../inputBounds';
import type { CrossSectionCable, CrossSectionInput, CrossSectionMeshOptions, CrossSectionRegion } from '../thermal/crossSection';
import { sheetFieldOf } from './arrangementCheck';
import type { SheetInputs } from './schema';
import { toCandidates, toConditions } from './toSizing';

// ───────────────────────────── settings ─────────────────────────────

/**
 * Meshes: 'sheet' for the browser (a worker solves it while the designer types), 'saved' for the
 * server's snapshot, coarser so that a save stays within about a second (the mesh is printed with
 * the result). Grading towards every cable as lib/thermal/crossSection/grid.ts does it.
 */
export const FIELD_MESHES = {
  sheet: { cellsAcrossCable: 16, growthRatio: 1.15, refinement: 1, words: 'the sheet’s mesh' },
  saved: { cellsAcrossCable: 12, growthRatio: 1.2, refinement: 0.7, words: 'the coarser mesh of a saved result' },
} as const;
export type FieldMeshName = keyof typeof FIELD_MESHES;

export interface FieldSettings {
  surface: 'isothermal' | 'convective';
  /** W/(m²·K); used when the surface is convective. */
  heatTransferCoefficientWPerM2K: number;
  mesh: FieldMeshName;
}

export function fieldSettingsOf(inputs: SheetInputs, mesh: FieldMeshName): FieldSettings {
  return { surface: inputs.crossSection.surface, heatTransferCoefficientWPerM2K: inputs.crossSection.heatTransferCoefficientWPerM2K, mesh };
}

/**
 * The domain below the surface is this many times the deepest cable's depth deep (at least
 * MIN_DOMAIN_DEPTH_M), and twice that wide plus the cables' own spread. With the bottom held at
 * the ground temperature, a line source at depth L between two isothermal planes H apart sees its
 * rise lowered by ρ/(2π)·ln(H/(H − L)) ≈ ρ/(2π)·L/H against the half-space of IEC 60287 (its
 * images in both planes, worked by hand): 1/50 beside the self term ρ/(2π)·ln(4L/D_e) ≈ 4.5·ρ/(2π)
 * of a cable at 0.8 m, i.e. about 0.4 % of the rise. The solver reports how much the side walls
 * warmed (CROSS_SECTION_SIDE_BOUNDARY).
 */
export const DOMAIN_DEPTH_PER_CABLE_DEPTH = 50;
export const MIN_DOMAIN_DEPTH_M = 20;

/**
 * Wall of a metallic conduit: the library takes its resistance as nil (IEC 60287-2-1), the solver
 * needs a resistivity above zero; steel's, about 0.02 K·m/W (k ≈ 50 W/(m·K), common practice, from
 * memory), which makes the wall's resistance negligible as well.
 */
export const METALLIC_DUCT_WALL_RESISTIVITY_KM_PER_W = 0.02;

/** A conductor that carries no current stands for a cable given only by its heat (any R₂₀ > 0 gives no Joule loss at 0 A). */
const NO_CURRENT_R20_OHM_PER_M = 1e-9;

// ───────────────────────────── the mapping ─────────────────────────────

export interface FieldCable {
  /** Index into the sizing library's group (`evaluation.group.cables`); the solver's cables are in the same order. */
  groupCable: number;
  role: GroupResultCable['role'];
  position: GroupResultCable['position'];
  /** Current of the model conductor before the AC factor, A (0 for a cable given by its heat). */
  modelCurrentA: number;
  /** W/m released at the surface of a cable given by its heat (0 otherwise). */
  enteredHeatWPerM: number;
}

export interface FieldMapping {
  /** The solver's input: one cable per cable of the group, in the group's order. */
  input: CrossSectionInput;
  cables: FieldCable[];
  /** Solver indices of the circuit's own cables (the cables whose ampacity the rating gives). */
  rated: number[];
  /** x of the domain's centre line in the arrangement's coordinates: x_solver = x_group − centreXM. */
  centreXM: number;
  /** The conductor limit of the rated cables, °C (what the conductor touches: the library's contact limit). */
  limitC: number;
  /** The AC factor each cable carries in `input` (R_ac/R_dc at the starting temperatures). */
  acFactors: number[];
  /** Screen loss factor λ₁ of each cable in `input` (0 without screen data). */
  lambdas: number[];
  /** λ₁ of a cable at a conductor and a screen temperature (undefined when the library includes no screen losses). */
  lambdaAt?: (cable: number, conductorC: number, screenC: number) => number;
  /** Index of the covering after which the screen loss is released (the screen itself). */
  screenCovering?: number;
  /** R_ac/R_dc of the candidate's conductor at a temperature (the library's function). */
  acFactorAt: (conductorC: number) => number;
  /** Model current of the circuit current per phase, and back (the library's conversions). */
  toModelA: (circuitA: number) => number;
  fromModelA: (modelA: number) => number;
  /** What the reviewer should know of how the field was set up, in sentences. */
  notes: string[];
}

/** The IEC side of the comparison and the library's context for the same candidate and inputs. */
export interface FieldBasis {
  candidateIndex: number;
  evaluation: CandidateEvaluationOk;
  context: SizingContext;
}

/**
 * The candidate evaluated by the sizing library from the sheet's inputs — the IEC rating the field
 * is compared with, and the context the field's cables come from. Refuses, naming the sheet's
 * field, a candidate that is not on the sheet, a bar, an installation that is not buried and
 * anything the library refuses.
 */
export function fieldBasisOf(inputs: SheetInputs, candidateId: string): FieldBasis {
  const index = inputs.candidates.findIndex((c) => c.id === candidateId);
  if (index < 0) throw new ElectricalInputError('candidateId', `no candidate "${candidateId}" on this sheet`);
  if (inputs.installation.kind !== 'buried') throw new ElectricalInputError('installation.kind', 'the cross-section is solved for buried cables only');
  if (inputs.candidates[index].kind !== 'cable') throw new ElectricalInputError(`candidates.${index}.kind`, 'a bus bar is not buried: the cross-section is solved for cables');
  let prepared;
  try {
    prepared = prepareConditions(toConditions(inputs));
  } catch (error) {
    throw asSheetFieldError(error);
  }
  const { evaluation, context } = evaluatePrepared(toCandidates(inputs)[index], prepared, index);
  if (!evaluation.ok) {
    if (evaluation.error.field) throw new ElectricalInputError(sheetFieldOf(evaluation.error.field) ?? evaluation.error.field, plain(evaluation.error.message, evaluation.error.field));
    throw new Error(`the IEC rating of ${evaluation.label} could not be computed: ${evaluation.error.message}`);
  }
  if (!context || !context.group || !evaluation.group) throw new Error(`the IEC rating of ${evaluation.label} has no cross-section`);
  return { candidateIndex: index, evaluation, context };
}

function plain(message: string, field: string): string {
  return message.startsWith(`${field}: `) ? message.slice(field.length + 2) : message;
}

function asSheetFieldError(error: unknown): unknown {
  if (error instanceof ElectricalInputError) return new ElectricalInputError(sheetFieldOf(error.field) ?? error.field, plain(error.message, error.field));
  return error;
}

/**
 * The solver's input for a sheet and one candidate (the chosen one, or the one in focus), with
 * what the field needs to settle the AC factor and screen losses and to read its results back.
 */
export function crossSectionInputOf(inputs: SheetInputs, candidateId: string, settings: FieldSettings): FieldMapping & { basis: FieldBasis } {
  const basis = fieldBasisOf(inputs, candidateId);
  return { ...fieldMappingOf(basis, settings), basis };
}

/** The mapping from a candidate the library has evaluated (see `crossSectionInputOf`). */
export function fieldMappingOf(basis: FieldBasis, settings: FieldSettings): FieldMapping {
  const { context: ctx, evaluation } = basis;
  const cand = ctx.cand as PreparedCable;
  const cond = ctx.cond;
  const group = ctx.group as CableGroup;
  const iec = evaluation.group!;
  if (settings.surface !== 'isothermal' && settings.surface !== 'convective') throw new ElectricalInputError('crossSection.surface', 'must be isothermal or convective');
  const h = settings.surface === 'convective' ? checkBound('groundSurfaceCoefficientWPerM2K', settings.heatTransferCoefficientWPerM2K, 'crossSection.heatTransferCoefficientWPerM2K') : undefined;
  const mesh = FIELD_MESHES[settings.mesh];
  if (!mesh) throw new ElectricalInputError('crossSection.mesh', `unknown mesh "${String(settings.mesh)}"`);
  const groundC = cond.ambientC;
  const buried = cond.buried!;
  const limitC = cand.contactLimit.temperatureC;
  const n = cand.loadedCores;
  const dEq = cand.conductorDiameterM * Math.sqrt(n);
  const acFactorAt = (t: number) => ctx.acFn(t).factor;
  const notes: string[] = [];

  // The candidate's coverings inside out, from the equivalent conductor (as the library's 1-D model).
  const coverings: CrossSectionCable['coverings'] = [];
  let d = dEq;
  for (const layer of cand.layers) {
    d += 2 * layer.thicknessM;
    coverings.push({ name: layer.name, outerDiameterM: d, thermalResistivityKmPerW: 1 / layer.conductivityWPerMK });
  }
  const losses = cableLossesOf(cand, cond, group, new FlagSet());
  const insulation = Math.max(0, cand.layers.findIndex((l) => l.role === 'insulation'));
  const screenCovering = losses?.screen ? cand.screenLayerIndex : undefined;
  const conductorAc = (t: number) => (cand.r20 / n) * (1 + cand.alpha20 * (t - 20)) * acFactorAt(t);

  // Where the domain's centre line lies, and how big the domain is.
  const placement = group.arrangement.placement;
  const bank = placement.kind === 'backfill' ? { ...placement.bank, centreXM: placement.bank.centreXM ?? middleX(group.layout) } : undefined;
  const duct = cond.duct;
  const xs: number[] = [];
  let deepestCentreM = 0;
  for (const c of group.cables) {
    xs.push(c.xM - c.envelopeDiameterM / 2, c.xM + c.envelopeDiameterM / 2);
    deepestCentreM = Math.max(deepestCentreM, -c.yM);
  }
  if (bank) xs.push(bank.centreXM - bank.widthM / 2, bank.centreXM + bank.widthM / 2);
  const centreXM = (Math.min(...xs) + Math.max(...xs)) / 2;
  const spreadM = Math.max(...xs) - Math.min(...xs);
  const depthM = Math.ceil(Math.max(MIN_DOMAIN_DEPTH_M, DOMAIN_DEPTH_PER_CABLE_DEPTH * deepestCentreM, bank ? 4 * (bank.centreDepthM + bank.heightM / 2) : 0));
  const widthM = Math.ceil(2 * depthM + 2 * spreadM);

  // Starting temperatures for R_ac/R_dc and λ₁: the IEC rating's (the field settles its own).
  const startC = (k: number) => iec.cables[k].conductorC ?? limitC;
  const startScreenC = (k: number) => iec.cables[k].surfaceC ?? startC(k);
  const ratedStartC = iec.governingCable !== null ? (iec.cables[iec.governingCable].conductorC ?? limitC) : limitC;

  const designModelA = toModelCurrent(ctx, cond.designCurrentA);
  const fieldCables: FieldCable[] = [];
  const acFactors: number[] = [];
  const lambdas: number[] = [];
  const cables: CrossSectionCable[] = group.cables.map((gc, k) => {
    const common = { xM: gc.xM - centreXM, depthM: -gc.yM };
    const inDuct = duct
      ? {
          duct: {
            innerDiameterM: duct.innerDiameterM,
            outerDiameterM: duct.outerDiameterM,
            wallThermalResistivityKmPerW: DUCT_WALL_RESISTIVITY[duct.material] > 0 ? DUCT_WALL_RESISTIVITY[duct.material] : METALLIC_DUCT_WALL_RESISTIVITY_KM_PER_W,
            air: { ...DUCT_AIR_SPACE_CONSTANTS[duct.material] },
          },
        }
      : {};
    if (gc.role === 'fixed') {
      const other = cond.otherCircuits[gc.circuit - cand.parallel];
      const heat = other.cable!.lossWPerM;
      fieldCables.push({ groupCable: k, role: gc.role, position: gc.position, modelCurrentA: 0, enteredHeatWPerM: heat });
      acFactors.push(1);
      lambdas.push(0);
      return {
        ...common,
        name: `cable ${k + 1} (given by its heat)`,
        outerDiameterM: gc.externalDiameterM,
        // Only its surface temperature is read: a body of the soil's resistivity releasing the entered heat at its surface.
        conductor: { diameterM: gc.externalDiameterM / 2, r20OhmPerM: NO_CURRENT_R20_OHM_PER_M, alpha20PerK: 0, currentA: 0 },
        coverings: [{ outerDiameterM: gc.externalDiameterM, thermalResistivityKmPerW: buried.soilResistivityKmPerW }],
        fixedLosses: [{ name: 'entered heat', wattsPerM: heat, afterCovering: 0 }],
        ...inDuct,
      };
    }
    const modelCurrentA = gc.role === 'rated' ? designModelA : cond.otherCircuits[gc.circuit - cand.parallel].currentA * ctx.model.currentScale;
    const factor = acFactorAt(gc.role === 'rated' ? ratedStartC : startC(k));
    const lambda = losses?.screen ? losses.screen.lambda1(gc.position, conductorAc(startC(k)), startScreenC(k)) : 0;
    fieldCables.push({ groupCable: k, role: gc.role, position: gc.position, modelCurrentA, enteredHeatWPerM: 0 });
    acFactors.push(factor);
    lambdas.push(lambda);
    return {
      ...common,
      name: `cable ${k + 1}`,
      outerDiameterM: cand.outerDiameterM,
      conductor: { diameterM: dEq, r20OhmPerM: cand.r20 / n, alpha20PerK: cand.alpha20, acFactor: factor, currentA: modelCurrentA },
      coverings,
      ...(screenCovering !== undefined ? { proportionalLosses: [{ name: 'screen', factor: lambda, afterCovering: screenCovering }] } : {}),
      ...(losses?.dielectric ? { dielectricLoss: { wattsPerM: losses.dielectric.lossWPerM, inCovering: insulation } } : {}),
      ...inDuct,
      ...(gc.role === 'rated' ? { maxConductorTemperatureC: limitC } : {}),
    };
  });

  const regions: CrossSectionRegion[] = bank
    ? [
        {
          name: 'backfill',
          xMinM: bank.centreXM - bank.widthM / 2 - centreXM,
          xMaxM: bank.centreXM + bank.widthM / 2 - centreXM,
          depthTopM: bank.centreDepthM - bank.heightM / 2,
          depthBottomM: bank.centreDepthM + bank.heightM / 2,
          thermalResistivityKmPerW: bank.resistivityKmPerW,
        },
      ]
    : [];
  const meshOptions: CrossSectionMeshOptions = { cellsAcrossCable: mesh.cellsAcrossCable, growthRatio: mesh.growthRatio, refinement: mesh.refinement };
  const input: CrossSectionInput = {
    domain: { widthM, depthM },
    soil: { thermalResistivityKmPerW: buried.soilResistivityKmPerW },
    ...(regions.length > 0 ? { regions } : {}),
    cables,
    surface: h === undefined ? { kind: 'isothermal', temperatureC: groundC } : { kind: 'convective', airTemperatureC: groundC, heatTransferCoefficientWPerM2K: h },
    deepGroundTemperatureC: groundC,
    mesh: meshOptions,
  };

  notes.push(
    `Soil of ${fmt(buried.soilResistivityKmPerW)} K·m/W meshed in finite volumes over ${fmt(widthM)} m × ${fmt(depthM)} m, its bottom held at the ground temperature ${fmt(groundC)} °C, its sides adiabatic; each cable is its own radial model (conductor, coverings${losses?.screen ? ', screen loss' : ''}${losses?.dielectric ? ', dielectric loss' : ''}) joined to the soil at its ${duct ? 'duct' : 'surface'}.`,
  );
  notes.push(
    h === undefined
      ? `Ground surface held at ${fmt(groundC)} °C, as IEC 60287 assumes it.`
      : `Ground surface giving heat to the air at ${fmt(h)} W/(m²·K), the air taken at the ground temperature ${fmt(groundC)} °C (IEC 60287 holds the surface at that temperature instead).`,
  );
  notes.push('R_ac/R_dc as in the rating: one factor for the circuit’s own cables at the governing cable’s temperature, each other circuit’s at its own.');
  if (bank) notes.push(`Backfill of ${fmt(bank.resistivityKmPerW)} K·m/W as a region of its own (IEC 60287-2-1 §4.2.7.4 corrects for it with a geometric factor instead).`);
  if (duct) {
    const c = DUCT_AIR_SPACE_CONSTANTS[duct.material];
    notes.push(
      `Duct air by the IEC 60287-2-1 constants U = ${c.U}, V = ${c.V}, Y = ${c.Y} of the library (from memory), at the mean air temperature the field gives; the wall ${DUCT_WALL_RESISTIVITY[duct.material] > 0 ? `${DUCT_WALL_RESISTIVITY[duct.material]} K·m/W` : `${METALLIC_DUCT_WALL_RESISTIVITY_KM_PER_W} K·m/W (steel, from memory; the library takes it as nil)`}.`,
    );
  }
  if (fieldCables.some((c) => c.role === 'fixed')) notes.push('Another circuit given by its heat enters as cables of its entered diameter releasing that heat at their surface; their conductors are not known.');
  if (n > 1) notes.push(`The ${cand.cores}-core cable as the rating models it: one equivalent conductor for ${n} loaded cores.`);
  if (cand.layers.some((l) => !l.contact && l.limitC !== undefined)) notes.push('The field rates the conductor against its own limit; a covering’s own limit is read from the rating only.');

  const rated = fieldCables.filter((c) => c.role === 'rated').map((c) => c.groupCable);
  return {
    input,
    cables: fieldCables,
    rated,
    centreXM,
    limitC,
    acFactors,
    lambdas,
    ...(losses?.screen && screenCovering !== undefined
      ? { lambdaAt: (k: number, conductorC: number, screenC: number) => losses.screen!.lambda1(fieldCables[k].position, conductorAc(conductorC), screenC), screenCovering }
      : {}),
    acFactorAt,
    toModelA: (a) => toModelCurrent(ctx, a),
    fromModelA: (a) => fromModelCurrent(ctx, a),
    notes,
  };
}

function fmt(v: number): string {
  return Number(v.toPrecision(4)).toString();
}

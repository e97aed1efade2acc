/**
 * Cables that heat each other (physics.md §8): the cross-section of the circuit being sized —
 * its cables, its parallel runs, the other circuits beside it — and how the solver rates it.
 *
 * In air (IEC 60287-2-1 §4.2.1): a group takes the free-air surface law h = Z/D_e^g + E of its
 * arrangement (Table 2), which stands for each cable's convection AND radiation in the group; an
 * isolated cable keeps the correlations and radiation of physics.md §2. Other circuits in air are
 * covered only when the table covers the whole row (isolated cables in one horizontal row);
 * otherwise the user's grouping factor must stand for them, or the candidate fails.
 *
 * In the ground (IEC 60287-2-1 §4.2.2–4.2.7): every cable is a line source with its image in the
 * isothermal ground surface; cable p sees the ground temperature raised by
 *   ΔT_p = Σ_k W_k·ρ/(2π)·ln(d′_pk/d_pk)
 * from the other cables, each cable's heat W_k taken at its own solved temperature, iterated
 * until the heats settle; the hottest cable of the circuit being sized governs. A touching
 * trefoil or flat row of the circuit itself takes its own part from the standard's closed forms
 * (§4.2.4: the cable surfaces as one isotherm, equal losses), exactly as the standard rates it.
 * Ducts add T₄′ (duct air, at its mean temperature) and T₄″ (wall); a backfill or bank adds the
 * §4.2.7.4 correction (ρ_e − ρ_c)/(2π)·G_b per watt of every cable.
 */
import { placeCables, type Arrangement, type ArrangementCircuit, type ArrangementLayout, type CablePosition, type Placement } from '../iec60287/arrangement';
import { parseArrangement } from '../iec60287/arrangementSchema';
import {
  buriedCableExternalResistance,
  ductAirSpaceResistance,
  ductBankGeometricFactor,
  ductWallResistance,
  flatTouchingExternalResistance,
  imageLogRatio,
  trefoilTouchingExternalResistance,
  twoFlatTouchingExternalResistance,
} from '../iec60287/buried';
import { FREE_AIR_CONSTANTS, type FreeAirArrangement } from '../iec60287/constants';
import { freeAirRowFor } from '../iec60287/freeAir';
import { ElectricalInputError } from '../errors';
import type { PreparedCable, PreparedConditions } from './prepared';
import type { GroupResult, GroupResultCable } from './types';

/** IEC 60364-5-52 (from memory, common practice): circuits in air with a clearance of at least two diameters need no grouping reduction. */
export const AIR_CLEARANCE_WITHOUT_GROUPING_RATIO = 2;

export type GroupCableRole = 'rated' | 'same-cable' | 'fixed';

export interface GroupCable {
  circuit: number;
  index: number;
  position: CablePosition;
  xM: number;
  yM: number;
  externalDiameterM: number;
  envelopeDiameterM: number;
  role: GroupCableRole;
}

/** A cable the solver solves: one of the circuit being sized, or a neighbour with the candidate's cable. */
export interface SolvedUnit {
  /** The cable whose position it stands for (its own heat flows from here). */
  cable: number;
  /** Cables whose heat is this unit's heat (a closed-form circuit: all its cables). */
  members: number[];
  rated: boolean;
  /** Conductor current of a neighbour unit, A (rated units take the search current). */
  fixedConductorA?: number;
  /** External resistance of the unit's own heat, K·m/W, without the duct air (T₄′ comes per solve). */
  ownT4: number;
  /**
   * For each member's position, ρ/(2π)·ln(d′/d) (+ the bank term) from every cable that is not a
   * member, K·m/W per W/m (0 for members, whose heat is in `ownT4`).
   */
  mutualByMember: number[][];
  /** Which rule gave its own part (for the result and the flag). */
  ownMethod: 'closed-form' | 'superposition';
}

export interface AirGroupModel {
  kind: 'air';
  /** The free-air law of the group, or null for an isolated cable (correlations and radiation). */
  constants: { Z: number; E: number; g: number } | null;
  row: FreeAirArrangement | 'isolated';
  rowText: string;
  /** Other circuits near enough to heat this one that no method here covers. */
  uncoveredNeighbours: number;
  /** The circuit's own spacing was not tabulated: rated with the closer tabulated row (cautious). */
  conservativeRow?: string;
  notes: string[];
}

export interface BuriedGroupModel {
  kind: 'buried';
  units: SolvedUnit[];
  /** Heat of every cable that is not solved (fixed neighbours), W/m; NaN where a unit gives it. */
  fixedHeatWPerM: number[];
  /** Which unit gives each cable's heat (−1 for fixed). */
  unitOfCable: number[];
  duct?: NonNullable<PreparedConditions['duct']>;
  notes: string[];
}

export interface CableGroup {
  arrangement: Arrangement;
  layout: ArrangementLayout;
  cables: GroupCable[];
  ratedCircuits: number[];
  model: AirGroupModel | BuriedGroupModel;
  /** True when the circuit is one cable alone with nothing near it (the isolated model of physics.md §3). */
  isolated: boolean;
}

/** The arrangement of one run of the circuit (formation of the prepared conditions). */
function runCircuit(cand: PreparedCable, cond: PreparedConditions): ArrangementCircuit {
  const de = cand.outerDiameterM;
  if (cand.cores > 1) return { externalDiameterM: de, formation: 'single', spacing: 'touching' };
  const cableCount: 2 | 3 = cond.phases === 3 ? 3 : 2;
  if (cond.spacingM !== undefined && cond.spacingM < de * (1 - 1e-9)) {
    throw new ElectricalInputError('conditions.installation.spacingM', `Cables overlap: axis spacing ${(cond.spacingM * 1000).toFixed(2)} mm is less than the cable diameter ${(de * 1000).toFixed(2)} mm`);
  }
  const spaced = cond.spacingM !== undefined && cond.spacingM > de * (1 + 1e-9);
  const spacing = spaced ? { spacing: 'spaced' as const, axisSpacingM: cond.spacingM } : { spacing: 'touching' as const };
  // A single-phase pair cannot lie in trefoil: it lies side by side.
  if (cond.formation === 'trefoil' && cableCount === 3) return { externalDiameterM: de, formation: 'trefoil', ...spacing };
  const formation = cond.formation === 'flat-vertical' ? 'flat-vertical' : 'flat-horizontal';
  return { externalDiameterM: de, formation, cableCount, ...spacing, ...(cond.transposed ? { transposed: true } : {}) };
}

function placementOf(cond: PreparedConditions): Placement {
  if (cond.placement !== 'buried' || !cond.buried) return { kind: 'air' };
  const depthM = cond.buried.depthM;
  if (cond.backfill) {
    const b = cond.backfill;
    return { kind: 'backfill', depthM, bank: { widthM: b.widthM, heightM: b.heightM, centreDepthM: b.centreDepthM, resistivityKmPerW: b.resistivityKmPerW }, ...(cond.duct ? { duct: cond.duct } : {}) };
  }
  if (cond.duct) return { kind: 'ducts', depthM, duct: cond.duct };
  return { kind: 'buried', depthM };
}

/** Smallest centre-to-centre step between neighbouring circuits in the row at which no two envelopes overlap. */
function touchingStep(circuits: ArrangementCircuit[], placement: Placement, direction: 'horizontal' | 'vertical'): number {
  let step = 0;
  for (let i = 0; i + 1 < circuits.length; i++) {
    const a = placeCables({ circuits: [circuits[i]], placement: { kind: 'air' } }).cables;
    const b = placeCables({ circuits: [circuits[i + 1]], placement: { kind: 'air' } }).cables;
    const envelope = (c: ArrangementCircuit) => (placement.kind === 'ducts' || (placement.kind === 'backfill' && placement.duct) ? (placement as { duct: { outerDiameterM: number } }).duct.outerDiameterM : c.externalDiameterM);
    const reach = (envelope(circuits[i]) + envelope(circuits[i + 1])) / 2;
    for (const p of a) {
      for (const q of b) {
        const across = direction === 'horizontal' ? q.yM - p.yM : q.xM - p.xM;
        const along = direction === 'horizontal' ? p.xM - q.xM : q.yM - p.yM;
        if (Math.abs(across) >= reach) continue;
        step = Math.max(step, along + Math.sqrt(reach * reach - across * across));
      }
    }
  }
  return step * (1 + 1e-9);
}

/** Lays out the circuit's runs and the other circuits for one candidate, refusing bad geometry with the field named. */
export function cableGroupOf(cand: PreparedCable, cond: PreparedConditions): CableGroup {
  const run = runCircuit(cand, cond);
  const placement = placementOf(cond);
  const circuits: ArrangementCircuit[] = [];
  for (let r = 0; r < cand.parallel; r++) circuits.push({ ...run, label: cand.parallel > 1 ? `run ${r + 1}` : 'this circuit' });
  cond.otherCircuits.forEach((o, i) => {
    const de = o.cable?.externalDiameterM ?? cand.outerDiameterM;
    circuits.push({ ...run, externalDiameterM: de, currentA: o.currentA, label: `other circuit ${i + 1}`, ...(run.spacing === 'spaced' && run.axisSpacingM !== undefined ? { axisSpacingM: Math.max(run.axisSpacingM, de) } : {}) });
  });
  const direction = cond.circuitRow;
  const arrangement: Arrangement = { circuits, placement };
  if (circuits.length > 1) {
    const step = cond.circuitSpacingM ?? touchingStep(circuits, placement, direction);
    arrangement.circuitSpacing = { direction, axisSpacingM: step };
  }
  let parsed: Arrangement;
  try {
    parsed = parseArrangement(arrangement);
  } catch (e) {
    if (e instanceof ElectricalInputError) throw new ElectricalInputError(`conditions.installation.${conditionsFieldOf(e.field)}`, e.message.replace(/^[^:]*: /, ''));
    throw e;
  }
  const layout = placeCables(parsed);
  const roleOf = (circuit: number): GroupCableRole => (circuit < cand.parallel ? 'rated' : cond.otherCircuits[circuit - cand.parallel].cable ? 'fixed' : 'same-cable');
  const cables: GroupCable[] = layout.cables.map((c) => ({ ...c, role: roleOf(c.circuit) }));
  const ratedCircuits = Array.from({ length: cand.parallel }, (_, i) => i);
  const isolated = cables.length === 1;
  const model = placement.kind === 'air' ? airModel(parsed, cables, cand, cond) : buriedModel(parsed, layout, cables, cand, cond);
  return { arrangement: parsed, layout, cables, ratedCircuits, model, isolated };
}

/** The schema's field path → the conditions' own field names. */
function conditionsFieldOf(path: string): string {
  if (path.startsWith('circuitSpacing')) return 'circuitSpacingM';
  if (path === 'placement.depthM') return 'depthM';
  if (path.startsWith('placement.duct')) return path.replace('placement.', '');
  if (path.startsWith('placement.bank')) return path.replace('placement.bank', 'backfill');
  const m = /^circuits\.(\d+)\.(.*)$/.exec(path);
  if (m) return m[2] === 'axisSpacingM' ? 'spacingM' : m[2];
  return path;
}

// ───────────────────────────── In air ─────────────────────────────

function airModel(arrangement: Arrangement, cables: GroupCable[], cand: PreparedCable, cond: PreparedConditions): AirGroupModel {
  const notes: string[] = [];
  if (cables.length === 1) return { kind: 'air', constants: null, row: 'isolated', rowText: 'an isolated cable: convection correlation and radiation', uncoveredNeighbours: 0, notes };
  const whole = freeAirRowFor(arrangement);
  if (whole.kind === 'tabulated') {
    const c = whole.constants;
    notes.push(...whole.assumptions);
    // Cables far enough apart to count as isolated (the table's footnote) are each an isolated
    // cable: the correlations and radiation of physics.md §2, as for a cable alone.
    if (whole.arrangement === 'single') {
      return { kind: 'air', constants: null, row: 'isolated', rowText: 'isolated cables (horizontal clearance ≥ 0.75·D_e, IEC 60287-2-1 Table 2 footnote, from memory): convection correlation and radiation for each', uncoveredNeighbours: 0, notes };
    }
    return { kind: 'air', constants: { Z: c.Z, E: c.E, g: c.g }, row: whole.arrangement, rowText: `${c.description} (IEC 60287-2-1 Table 2 row ${c.row}, from memory)`, uncoveredNeighbours: 0, notes };
  }
  // The circuit's own run alone, then the circuits beside it.
  const own: Arrangement = { circuits: [arrangement.circuits[0]], placement: arrangement.placement };
  const ownRow = freeAirRowFor(own);
  let row: FreeAirArrangement;
  let conservativeRow: string | undefined;
  if (ownRow.kind === 'tabulated' && ownRow.arrangement === 'single') {
    // The circuit's own cables count as isolated; only the circuits beside it are in question.
    const uncovered = uncoveredNeighboursOf(cables);
    return { kind: 'air', constants: null, row: 'isolated', rowText: 'isolated cables: convection correlation and radiation for each', uncoveredNeighbours: uncovered, notes: [...ownRow.assumptions] };
  }
  if (ownRow.kind === 'tabulated') {
    row = ownRow.arrangement;
    notes.push(...ownRow.assumptions);
  } else {
    // Not tabulated: rate as the closest tabulated arrangement that runs hotter. A trefoil spaced
    // by at least one diameter has each cable in the rising air of those below, as three cables
    // spaced D_e in a vertical row have (that row is taken); closer, or any other row, as touching.
    const c = arrangement.circuits[0];
    const n = c.formation === 'trefoil' ? 3 : c.cableCount ?? 3;
    const clearance = c.spacing === 'spaced' && c.axisSpacingM !== undefined ? (c.axisSpacingM - c.externalDiameterM) / c.externalDiameterM : 0;
    row =
      c.formation === 'trefoil'
        ? clearance >= 1 - 1e-9
          ? 'three-spaced-vertical'
          : 'trefoil-touching'
        : c.formation === 'flat-vertical'
          ? n === 2
            ? 'two-touching-vertical'
            : 'three-touching-vertical'
          : n === 2
            ? 'two-touching-horizontal'
            : 'three-touching-horizontal';
    conservativeRow = `${ownRow.reason}; rated as ${FREE_AIR_CONSTANTS[row].description}, the closest tabulated arrangement taken as a cautious stand-in (a judgement for the reviewer)`;
  }
  const uncovered = uncoveredNeighboursOf(cables);
  const others = new Set(cables.filter((k) => k.circuit !== 0).map((k) => k.circuit));
  const c = FREE_AIR_CONSTANTS[row];
  if (others.size > uncovered) notes.push(`Circuits at least ${AIR_CLEARANCE_WITHOUT_GROUPING_RATIO}·D_e clear of this one taken as not heating it (IEC 60364-5-52, from memory, common practice)`);
  return {
    kind: 'air',
    constants: { Z: c.Z, E: c.E, g: c.g },
    row,
    rowText: `${c.description} (IEC 60287-2-1 Table 2 row ${c.row}, from memory)`,
    uncoveredNeighbours: uncovered,
    ...(conservativeRow ? { conservativeRow } : {}),
    notes,
  };
}

/** Other circuits (and the circuit's other runs) in air close enough to heat the first run. */
function uncoveredNeighboursOf(cables: GroupCable[]): number {
  const runCables = cables.filter((k) => k.circuit === 0);
  let uncovered = 0;
  const others = new Set(cables.filter((k) => k.circuit !== 0).map((k) => k.circuit));
  for (const other of others) {
    const near = cables.some(
      (k) =>
        k.circuit === other &&
        runCables.some((p) => Math.hypot(p.xM - k.xM, p.yM - k.yM) - (p.externalDiameterM + k.externalDiameterM) / 2 < AIR_CLEARANCE_WITHOUT_GROUPING_RATIO * Math.max(p.externalDiameterM, k.externalDiameterM)),
    );
    if (near) uncovered++;
  }
  return uncovered;
}

// ───────────────────────────── In the ground ─────────────────────────────

function buriedModel(arrangement: Arrangement, layout: ArrangementLayout, cables: GroupCable[], cand: PreparedCable, cond: PreparedConditions): BuriedGroupModel {
  const buried = cond.buried!;
  const placement = arrangement.placement;
  const bank = placement.kind === 'backfill' ? placement.bank : undefined;
  const duct = placement.kind === 'ducts' ? placement.duct : placement.kind === 'backfill' ? placement.duct : undefined;
  // Inside a bank the cables see the bank's resistivity; the correction brings in the soil beyond it.
  const rhoNear = bank ? bank.resistivityKmPerW : buried.soilResistivityKmPerW;
  const notes: string[] = ['Ground surface isothermal at the ground temperature (the image method of IEC 60287-2-1 §4.2.3)'];
  let bankPerWatt = 0;
  if (bank) {
    const { Gb } = ductBankGeometricFactor({ widthM: bank.widthM, heightM: bank.heightM, centreDepthM: bank.centreDepthM });
    bankPerWatt = ((buried.soilResistivityKmPerW - rhoNear) / (2 * Math.PI)) * Gb;
    notes.push(`Backfill or bank: IEC 60287-2-1 §4.2.7.4 correction (ρ_soil − ρ_bank)/(2π)·G_b with G_b = ${Gb.toPrecision(4)} per watt of every cable (from memory)`);
  }
  const ductWall = duct ? ductWallResistance({ material: duct.material, innerDiameterM: duct.innerDiameterM, outerDiameterM: duct.outerDiameterM }) : 0;
  const mutual = (p: number, k: number) => (rhoNear / (2 * Math.PI)) * imageLogRatio(cables[p], cables[k], 'conditions.installation') + bankPerWatt;
  const selfT4 = (p: number) =>
    buriedCableExternalResistance({ soilResistivityKmPerW: rhoNear, depthM: -cables[p].yM, externalDiameterM: cables[p].envelopeDiameterM }) + ductWall + bankPerWatt;

  const units: SolvedUnit[] = [];
  const unitOfCable = cables.map(() => -1);
  const fixedHeatWPerM = cables.map(() => Number.NaN);
  arrangement.circuits.forEach((circuit, ci) => {
    const members = cables.map((k, j) => ({ k, j })).filter(({ k }) => k.circuit === ci);
    const role = members[0].k.role;
    if (role === 'fixed') {
      const heat = cond.otherCircuits[ci - cand.parallel].cable!.lossWPerM;
      for (const { j } of members) fixedHeatWPerM[j] = heat;
      return;
    }
    const fixedConductorA = role === 'same-cable' ? cond.otherCircuits[ci - cand.parallel].currentA : undefined;
    const closed = duct ? null : closedFormOf(circuit, -layout.circuitCentres[ci].yM, rhoNear);
    if (closed || role === 'same-cable') {
      // One unit for the whole circuit: the closed form's cable (equal losses), or a neighbour's
      // representative. Its position for the heat from others: whichever member gets the most.
      const own = closed ? closed.T4 + members.length * bankPerWatt : selfT4(members[0].j) + members.slice(1).reduce((s, { j }) => s + mutual(members[0].j, j), 0);
      const u = units.length;
      for (const { j } of members) unitOfCable[j] = u;
      units.push({ cable: members[0].j, members: members.map((m) => m.j), rated: role === 'rated', ...(fixedConductorA !== undefined ? { fixedConductorA } : {}), ownT4: own, mutualByMember: [], ownMethod: closed ? 'closed-form' : 'superposition' });
      if (closed && role === 'rated') notes.push(`This circuit's own cables by IEC 60287-2-1 §4.2.4 ${closed.name} (cable surfaces as one isotherm, equal losses; from memory)`);
      return;
    }
    for (const { j } of members) {
      unitOfCable[j] = units.length;
      units.push({ cable: j, members: [j], rated: role === 'rated', ownT4: selfT4(j), mutualByMember: [], ownMethod: 'superposition' });
    }
  });
  // Mutual coefficients, from every cable that is not a member to each member's position.
  for (const u of units) {
    u.mutualByMember = u.members.map((p) => cables.map((_, k) => (u.members.includes(k) ? 0 : mutual(p, k))));
  }
  if (duct) notes.push('Cables in ducts: T₄′ of the duct air at its mean temperature, T₄″ of the wall and T₄‴ of the ground at the duct (IEC 60287-2-1 §4.2.7, from memory)');
  if (units.some((u) => !u.rated)) notes.push('Other circuits with the same cable solved at their own current and temperature');
  return { kind: 'buried', units, fixedHeatWPerM, unitOfCable, ...(duct ? { duct } : {}), notes };
}

function closedFormOf(circuit: ArrangementCircuit, depthM: number, rho: number): { T4: number; name: string } | null {
  if (circuit.spacing !== 'touching') return null;
  const args = { soilResistivityKmPerW: rho, depthM, externalDiameterM: circuit.externalDiameterM };
  if (circuit.formation === 'trefoil') return { T4: trefoilTouchingExternalResistance(args), name: 'trefoil touching, T₄ = (1.5/π)ρ[ln(2u) − 0.630]' };
  if (circuit.formation === 'flat-horizontal' && (circuit.cableCount ?? 3) === 3) return { T4: flatTouchingExternalResistance(args), name: 'flat touching, T₄ = 0.475ρ·ln(2u) − 0.346ρ (centre cable)' };
  if (circuit.formation === 'flat-horizontal' && circuit.cableCount === 2) return { T4: twoFlatTouchingExternalResistance(args), name: 'two flat touching, T₄ = (ρ/π)[ln(2u) − 0.451]' };
  return null;
}

/**
 * The rise of a unit's surroundings above the ground from every cable's heat but its members'
 * (whose heat is in its own T₄). For a circuit rated as one unit, each member's position is
 * evaluated and the largest kept (the member that gets the most heat governs, cautious).
 */
export function externalRise(unit: SolvedUnit, heatOfCable: (k: number) => number): number {
  let worst = 0;
  for (const row of unit.mutualByMember) {
    let rise = 0;
    for (let k = 0; k < row.length; k++) if (row[k] !== 0) rise += row[k] * heatOfCable(k);
    worst = Math.max(worst, rise);
  }
  return worst;
}

/** Duct air T₄′ of a cable at the mean air temperature θ_m, K·m/W (0 without ducts). */
export function ductAirT4(model: BuriedGroupModel, cableDiameterM: number, meanAirC: number): number {
  if (!model.duct) return 0;
  return ductAirSpaceResistance({ material: model.duct.material, cableDiameterM, meanAirTemperatureC: meanAirC }).T4;
}

/** The group as the result reports it: every cable's place and, where solved, its temperatures at the design current. */
export function groupResultOf(
  group: CableGroup,
  solution: { governingCable: number; cables: Array<{ cable: number; conductorC: number | null; surfaceC: number | null; heatWPerM: number; riseFromOthersK: number | null }> } | undefined,
  representative: { conductorC: number; surfaceC: number; heatWPerM: number } | null,
): GroupResult {
  const placement = group.arrangement.placement;
  const model = group.model;
  const method =
    model.kind === 'air'
      ? model.constants
        ? `In free air, the IEC 60287-2-1 §4.2.1 law for ${model.rowText}: every cable of the circuit alike`
        : `In free air, ${model.rowText}`
      : `In the ground, superposition with images (IEC 60287-2-1 §4.2.3), each cable's heat at its own temperature${model.notes.length > 1 ? `; ${model.notes.slice(1).join('; ')}` : ''}`;
  const byCable = new Map((solution?.cables ?? []).map((c) => [c.cable, c]));
  const cables: GroupResultCable[] = group.cables.map((k, i) => {
    const solved = byCable.get(i);
    const alike = (model.kind === 'air' || group.isolated) && k.role === 'rated' ? representative : null;
    return {
      circuit: k.circuit,
      index: k.index,
      position: k.position,
      role: k.role,
      xM: k.xM,
      yM: k.yM,
      externalDiameterM: k.externalDiameterM,
      envelopeDiameterM: k.envelopeDiameterM,
      conductorC: solved?.conductorC ?? alike?.conductorC ?? null,
      surfaceC: solved?.surfaceC ?? alike?.surfaceC ?? null,
      heatWPerM: solved?.heatWPerM ?? alike?.heatWPerM ?? (k.role === 'fixed' && model.kind === 'buried' ? model.fixedHeatWPerM[i] : null),
      riseFromOthersK: solved?.riseFromOthersK ?? null,
    };
  });
  const governingCable = solution ? (solution.governingCable >= 0 ? solution.governingCable : null) : representative ? group.cables.findIndex((k) => k.role === 'rated') : null;
  const bank = placement.kind === 'backfill' ? placement.bank : undefined;
  const xs = group.cables.map((k) => k.xM);
  return {
    placement: placement.kind,
    method,
    cables,
    governingCable,
    circuitAxisSpacingM: group.layout.circuitAxisSpacingM[0] ?? null,
    circuitSpacingM: group.arrangement.circuitSpacing?.axisSpacingM ?? null,
    depthM: placement.kind === 'air' ? null : placement.depthM,
    ...(bank ? { bank: { centreXM: bank.centreXM ?? (Math.min(...xs) + Math.max(...xs)) / 2, centreDepthM: bank.centreDepthM, widthM: bank.widthM, heightM: bank.heightM } } : {}),
  };
}

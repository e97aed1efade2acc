/**
 * The rated cross-section in words, for people: which cable governs ("centre cable of this
 * circuit"), how the group was rated, the arrangement as a sentence, each cable's temperatures as
 * table rows, and the drawing's input — from the library's `GroupResult` (lib/electrical/sizing/
 * types.ts) and the sheet inputs. The sheet, the share page, the PDF, the candidate grid and the
 * schedule all take their words from here, so they cannot describe one group differently.
 *
 * SI units and unrounded numbers out, except where a sentence is built (the sentence rounds).
 * Pure TypeScript (browser and server).
 */
import type { GroupResult, GroupResultCable } from '../electrical/sizing/types';
import { formatNumber } from '../units';
import type { DrawingInput } from './crossSectionDrawing';
import type { SheetInputs } from './schema';

/** Temperatures closer than this count as "alike" (the group law gives every cable one figure). */
const ALIKE_K = 0.05;

/** The circuits of the circuit being sized (its parallel runs), by index. */
export function ratedCircuitsOf(group: GroupResult): number[] {
  return [...new Set(group.cables.filter((c) => c.role === 'rated').map((c) => c.circuit))].sort((a, b) => a - b);
}

/**
 * "this circuit", "run 2 of this circuit", "other circuit 1" or the designer's label of it.
 * `otherLabels` are the sheet's labels of the other circuits, in order (empty = not named).
 */
export function circuitWords(group: GroupResult, circuit: number, otherLabels: readonly string[] = []): string {
  const rated = ratedCircuitsOf(group);
  if (rated.includes(circuit)) return rated.length > 1 ? `run ${rated.indexOf(circuit) + 1} of this circuit` : 'this circuit';
  const other = circuit - rated.length;
  const label = otherLabels[other]?.trim();
  return label ? `other circuit ${other + 1} (${label})` : `other circuit ${other + 1}`;
}

/** Where a cable lies inside its circuit, from the coordinates (x across, y up). */
export function cablePlaceWords(group: GroupResult, cableIndex: number): string {
  const cable = group.cables[cableIndex];
  const mates = group.cables.filter((c) => c.circuit === cable.circuit);
  if (mates.length === 1) return 'cable';
  const xs = mates.map((c) => c.xM);
  const ys = mates.map((c) => c.yM);
  const near = (a: number, b: number) => Math.abs(a - b) < 1e-9 + 1e-6 * cable.externalDiameterM;
  const top = (c: GroupResultCable) => near(c.yM, Math.max(...ys));
  const bottom = (c: GroupResultCable) => near(c.yM, Math.min(...ys));
  const left = (c: GroupResultCable) => near(c.xM, Math.min(...xs));
  const right = (c: GroupResultCable) => near(c.xM, Math.max(...xs));
  if (cable.position === 'trefoil') {
    const apexUp = mates.filter(top).length === 1;
    if (apexUp && top(cable)) return 'top cable';
    if (!apexUp && bottom(cable)) return 'bottom cable';
    return `${apexUp ? 'lower' : 'upper'} ${left(cable) ? 'left' : 'right'} cable`;
  }
  const horizontal = ys.every((y) => near(y, ys[0]));
  if (cable.position === 'flat-centre') return horizontal ? 'centre cable' : 'middle cable';
  if (horizontal) return left(cable) ? 'left cable' : right(cable) ? 'right cable' : 'cable';
  return top(cable) ? 'top cable' : bottom(cable) ? 'bottom cable' : 'cable';
}

/** "centre cable of this circuit", "top cable of run 2 of this circuit". */
export function cableWords(group: GroupResult, cableIndex: number, otherLabels: readonly string[] = []): string {
  const cable = group.cables[cableIndex];
  return `${cablePlaceWords(group, cableIndex)} of ${circuitWords(group, cable.circuit, otherLabels)}`;
}

export interface GoverningCable {
  /** Index into `group.cables`. */
  cable: number;
  /** "centre cable of this circuit", or "every cable of this circuit alike" when the method gives them one figure. */
  words: string;
  /** Its conductor temperature at the design current, °C (null where not solved). */
  conductorC: number | null;
}

/** The cable that governs (the hottest against its limit), in words, or null on runaway. */
export function governingCableOf(group: GroupResult, otherLabels: readonly string[] = []): GoverningCable | null {
  const index = group.governingCable;
  if (index === null || index < 0 || index >= group.cables.length) return null;
  const cable = group.cables[index];
  const mates = group.cables.filter((c) => c.circuit === cable.circuit);
  const alike =
    mates.length > 1 &&
    cable.conductorC !== null &&
    mates.every((c) => c.conductorC !== null && Math.abs(c.conductorC - (cable.conductorC as number)) <= ALIKE_K);
  const words = alike ? `every cable of ${circuitWords(group, cable.circuit, otherLabels)} alike` : cableWords(group, index, otherLabels);
  return { cable: index, words, conductorC: cable.conductorC };
}

/** "governing: centre cable of this circuit, 88.7 °C" (temperatures in °C; a screen converts before calling the text variant). */
export function governingText(governing: GoverningCable, temperatureText: (c: number) => string = (c) => `${formatNumber(c, 3)} °C`): string {
  return `governing: ${governing.words}${governing.conductorC === null ? '' : `, ${temperatureText(governing.conductorC)}`}`;
}

/** How the group was rated, in a few words (the long sentence is `group.method`). */
export function groupMethodWords(group: GroupResult): string {
  switch (group.placement) {
    case 'air':
      if (group.cables.length === 1) return 'one cable in air: convection and radiation';
      return group.method.includes('§4.2.1 law') ? 'group in free air: IEC 60287-2-1 §4.2.1 law' : 'isolated cables in air: convection and radiation';
    case 'buried':
      return 'in the ground: superposition with images, IEC 60287-2-1 §4.2.3';
    case 'ducts':
      return 'in ducts in the ground: superposition with images, IEC 60287-2-1 §4.2.3 and §4.2.7';
    case 'backfill':
      return 'in a backfill in the ground: superposition with images, IEC 60287-2-1 §4.2.3 and §4.2.7.4';
  }
}

export interface GroupCableRow {
  cable: string;
  /** 'being sized', 'same cable, at its own current', 'given by its heat'. */
  role: string;
  xM: number;
  yM: number;
  externalDiameterM: number;
  conductorC: number | null;
  surfaceC: number | null;
  heatWPerM: number | null;
  governs: boolean;
}

const ROLE_WORDS: Record<GroupResultCable['role'], string> = {
  rated: 'being sized',
  'same-cable': 'same cable, at its own current',
  fixed: 'given by its heat',
};

/** Every cable of the group with its temperatures and heat at the design current, for tables. */
export function groupCableRows(group: GroupResult, otherLabels: readonly string[] = []): GroupCableRow[] {
  return group.cables.map((c, i) => ({
    cable: cableWords(group, i, otherLabels),
    role: ROLE_WORDS[c.role],
    xM: c.xM,
    yM: c.yM,
    externalDiameterM: c.externalDiameterM,
    conductorC: c.conductorC,
    surfaceC: c.surfaceC,
    heatWPerM: c.heatWPerM,
    governs: i === group.governingCable,
  }));
}

/** One cable's hover text on the drawing: "centre cable of this circuit: conductor 88.7 °C, surface 80.1 °C, 21.3 W/m". */
export function cableTitle(group: GroupResult, cableIndex: number, otherLabels: readonly string[] = [], temperatureText: (c: number) => string = (c) => `${formatNumber(c, 3)} °C`): string {
  const c = group.cables[cableIndex];
  const parts: string[] = [];
  if (c.conductorC !== null) parts.push(`conductor ${temperatureText(c.conductorC)}`);
  if (c.surfaceC !== null) parts.push(`surface ${temperatureText(c.surfaceC)}`);
  if (c.heatWPerM !== null) parts.push(`${formatNumber(c.heatWPerM, 3)} W/m`);
  if (parts.length === 0) parts.push(c.role === 'fixed' ? 'given by its heat only' : 'not solved');
  return `${cableWords(group, cableIndex, otherLabels)}${cableIndex === group.governingCable ? ' (governs)' : ''}: ${parts.join(', ')}`;
}

/** The drawing of the rated cross-section (lib/sheet/crossSectionDrawing.ts) from the group. */
export function drawingInputOf(group: GroupResult): DrawingInput {
  return {
    cables: group.cables.map((c) => ({ circuit: c.circuit, xM: c.xM, yM: c.yM, externalDiameterM: c.externalDiameterM, envelopeDiameterM: c.envelopeDiameterM })),
    placement: { kind: group.placement, ...(group.depthM !== null ? { depthM: group.depthM } : {}) },
    ...(group.bank ? { bank: group.bank } : {}),
    ratedCircuits: ratedCircuitsOf(group),
    ...(group.governingCable !== null ? { governingCable: group.governingCable } : {}),
    circuitAxisSpacingM: group.circuitAxisSpacingM,
    circuitSpacingM: group.circuitSpacingM,
  };
}

// ───────────────────────────── the arrangement as entered ─────────────────────────────

const DUCT_WORDS: Record<SheetInputs['installation']['duct']['material'], string> = {
  pvc: 'PVC',
  pe: 'polyethylene',
  earthenware: 'earthenware',
  'fibre-in-air': 'fibre (in air)',
  'fibre-in-concrete': 'fibre (in concrete)',
  metallic: 'metallic',
};

export const FORMATION_WORDS: Record<SheetInputs['installation']['formation'], string> = {
  trefoil: 'in trefoil',
  flat: 'flat, in a horizontal row',
  'flat-vertical': 'flat, in a vertical row',
};

const mm = (m: number) => `${formatNumber(m * 1000, 4)} mm`;
const metres = (m: number) => `${formatNumber(m, 4)} m`;

/** Does the sheet's installation lay cables (so that an arrangement applies)? */
export function laysCables(inputs: SheetInputs): boolean {
  const i = inputs.installation;
  return i.kind === 'cable-in-air' || i.kind === 'buried' || (i.kind === 'enclosure' && i.enclosureInside === 'cable-in-air');
}

/** The other circuit's own words: "EV-2, 120 A, the same cable" / "120 A, 30 mm cables giving 14 W/m each". */
export function otherCircuitWords(other: SheetInputs['installation']['otherCircuits'][number], index: number): string {
  const name = other.label.trim() ? `${other.label.trim()}` : `other circuit ${index + 1}`;
  const cable =
    other.sameCable || other.externalDiameterM === null || other.lossWPerM === null
      ? 'the same cable as the candidate, at its own current'
      : `cables of ${mm(other.externalDiameterM)} giving ${formatNumber(other.lossWPerM, 4)} W/m each (entered)`;
  return `${name}: ${formatNumber(other.currentA, 4)} A, ${cable}`;
}

/**
 * The arrangement the sheet rates, as sentences: the circuit's cables, where they lie, what lies
 * beside them, ducts and backfill. Empty for bars.
 */
export function arrangementSentences(inputs: SheetInputs): string[] {
  if (!laysCables(inputs)) return [];
  const i = inputs.installation;
  const three = inputs.circuit.phases === 3;
  const formation = three ? FORMATION_WORDS[i.formation] : i.formation === 'flat-vertical' ? 'one above the other' : 'side by side';
  const spacing = i.spacingM === null ? 'touching' : `${mm(i.spacingM)} apart, axis to axis`;
  const where =
    i.kind === 'buried' ? `buried ${metres(i.depthM)} deep to the axis` : i.kind === 'enclosure' ? 'in an enclosure' : 'in free air';
  const lines = [`${three ? 'Three' : 'Two'} single-core cables per run ${formation}, ${spacing}, ${where}.`];
  const parallel = inputs.candidates.some((c) => c.kind === 'cable' && c.parallel > 1);
  const others = i.otherCircuits.length;
  if (others > 0 || parallel) {
    const row = i.circuitRow === 'vertical' ? 'a vertical row (one below the other)' : 'a horizontal row';
    const gap = i.circuitSpacingM === null ? 'touching' : `${mm(i.circuitSpacingM)} centre to centre`;
    const what = [parallel ? 'the candidate’s parallel runs' : null, others > 0 ? `${others} other circuit${others > 1 ? 's' : ''}` : null].filter(Boolean).join(' and ');
    lines.push(`In ${row} with ${what}, ${gap}.`);
    i.otherCircuits.forEach((o, k) => lines.push(`Beside it, ${otherCircuitWords(o, k)}.`));
  } else {
    lines.push('No other circuit beside it.');
  }
  if (i.transposed && i.formation !== 'trefoil') lines.push('Phases transposed along the route.');
  if (i.kind === 'buried') {
    if (i.duct.used) lines.push(`Each cable in its own ${DUCT_WORDS[i.duct.material]} duct, ${mm(i.duct.innerDiameterM)} inside, ${mm(i.duct.outerDiameterM)} outside.`);
    if (i.backfill.used) {
      const b = i.backfill;
      lines.push(`In a backfill ${metres(b.widthM)} wide and ${metres(b.heightM)} high, centred ${metres(b.centreDepthM ?? i.depthM)} deep, of ${formatNumber(b.resistivityKmPerW, 3)} K·m/W.`);
    }
  }
  return lines;
}

/**
 * A circuit's cross-section as data: which cables lie where, so that the rating methods of
 * IEC 60287-2-1 (free-air groups, buried superposition, ducts, backfill) can be applied to the
 * arrangement that is actually built, and a drawing can show a reviewer what was rated.
 *
 * Conventions (SI):
 * - `xM` horizontal, `yM` vertical and UPWARD. For a placement in the ground the ground surface
 *   is yM = 0 and cable centres have yM < 0 (depth = −yM). In air the first circuit's centre is
 *   the origin.
 * - Spacing is always AXIS TO AXIS (the s of IEC 60287-1-1 and of the superposition), never
 *   clearance. Touching means s = the envelope diameter (the cable's D_e, or the duct's outer
 *   diameter when every cable lies in its own duct).
 * - A circuit's "centre" is the centroid of its cable centres; `placement.depthM` is the depth
 *   of the FIRST circuit's centre (for a trefoil the centre of the group, as the touching-trefoil
 *   formula of IEC 60287-2-1 measures L, from memory).
 * - Further circuits follow the first one to the right (horizontal) or downward (vertical).
 *
 * The zod schema is in ./arrangementSchema.ts and enforces the same rules; `layoutArrangement`
 * there validates and then lays out.
 */
import type { DuctMaterial } from './constants';

export const CIRCUIT_FORMATIONS = ['single', 'trefoil', 'flat-horizontal', 'flat-vertical'] as const;
export type CircuitFormation = (typeof CIRCUIT_FORMATIONS)[number];

export interface ArrangementCircuit {
  /** Free text for drawings and reports (e.g. "Feeder 2"). */
  label?: string;
  /** Catalogue reference of the cable, shared with the sheet and schedule rows (not read here). */
  cableRef?: string;
  /** Overall diameter D_e of one cable of this circuit, m. */
  externalDiameterM: number;
  /** The circuit's own current, A. Omitted for the circuit being rated (its current is the unknown). */
  currentA?: number;
  /** 'single': one cable; 'trefoil': three; flat: two or three in a row. */
  formation: CircuitFormation;
  /** For flat formations: 2 (single-phase) or 3 (three-phase). Default 3. */
  cableCount?: 2 | 3;
  spacing: 'touching' | 'spaced';
  /** Axis-to-axis spacing of this circuit's cables, m; required when `spacing` is 'spaced'. */
  axisSpacingM?: number;
  /** Trefoil only: which way the single cable of the triangle points. Default 'up'. */
  trefoilApex?: 'up' | 'down';
  /** Flat three-phase only: phases transposed regularly along the route (screen losses). */
  transposed?: boolean;
}

export interface DuctSpec {
  material: DuctMaterial;
  innerDiameterM: number;
  outerDiameterM: number;
}

/** A rectangular backfill or concrete duct bank, centred horizontally on the circuits' centroid unless `centreXM` is given. */
export interface BackfillSpec {
  widthM: number;
  heightM: number;
  /** Depth of the bank's centre below the ground surface, m. */
  centreDepthM: number;
  /** Horizontal position of the bank's centre, m (default: the middle of all cable centres). */
  centreXM?: number;
  /** Thermal resistivity of the backfill or concrete, K·m/W. */
  resistivityKmPerW: number;
}

export type Placement =
  | { kind: 'air' }
  | { kind: 'buried'; depthM: number }
  /** Every cable in its own duct, the ducts in the soil. */
  | { kind: 'ducts'; depthM: number; duct: DuctSpec }
  /** Cables (or, with `duct`, ducts: a duct bank) in a backfill of its own resistivity. */
  | { kind: 'backfill'; depthM: number; bank: BackfillSpec; duct?: DuctSpec };

export interface CircuitSpacing {
  direction: 'horizontal' | 'vertical';
  /** Distance between the centres of neighbouring circuits, m. */
  axisSpacingM: number;
}

export interface Arrangement {
  circuits: ArrangementCircuit[];
  /** Required when there is more than one circuit. */
  circuitSpacing?: CircuitSpacing;
  placement: Placement;
}

/** The role of a cable inside its circuit, which sets its screen losses (IEC 60287-1-1 §2.3). */
export type CablePosition = 'alone' | 'trefoil' | 'flat-outer' | 'flat-centre' | 'pair';

export interface PlacedCable {
  circuit: number;
  /** Index of the cable inside its circuit (flat: in order along the row; trefoil: bottom-left, bottom-right, apex for apex up). */
  index: number;
  position: CablePosition;
  xM: number;
  yM: number;
  externalDiameterM: number;
  /** Diameter that must not overlap another: the duct's outer diameter in ducts, otherwise D_e. */
  envelopeDiameterM: number;
}

export interface ArrangementLayout {
  cables: PlacedCable[];
  /** Centre (centroid) of each circuit. */
  circuitCentres: Array<{ xM: number; yM: number }>;
  /** Axis spacing actually used for each circuit (touching resolved to the envelope diameter); null for a single cable. */
  circuitAxisSpacingM: Array<number | null>;
  placement: Placement;
}

export function ductOf(placement: Placement): DuctSpec | undefined {
  if (placement.kind === 'ducts') return placement.duct;
  if (placement.kind === 'backfill') return placement.duct;
  return undefined;
}

export function cableCountOf(circuit: ArrangementCircuit): number {
  switch (circuit.formation) {
    case 'single':
      return 1;
    case 'trefoil':
      return 3;
    default:
      return circuit.cableCount ?? 3;
  }
}

/** Envelope diameter of one cable of a circuit: its duct when in ducts, otherwise itself. */
export function envelopeDiameterOf(circuit: ArrangementCircuit, placement: Placement): number {
  const duct = ductOf(placement);
  return duct ? duct.outerDiameterM : circuit.externalDiameterM;
}

/** Axis spacing inside a circuit: touching = envelope diameter. */
export function axisSpacingOf(circuit: ArrangementCircuit, placement: Placement): number | null {
  if (cableCountOf(circuit) === 1) return null;
  if (circuit.spacing === 'touching') return envelopeDiameterOf(circuit, placement);
  return circuit.axisSpacingM ?? Number.NaN;
}

/** Cable centres relative to the circuit's centroid, with each cable's role. */
function circuitPattern(circuit: ArrangementCircuit, s: number | null): Array<{ dx: number; dy: number; position: CablePosition }> {
  const n = cableCountOf(circuit);
  if (n === 1 || s === null) return [{ dx: 0, dy: 0, position: 'alone' }];
  if (circuit.formation === 'trefoil') {
    // Equilateral triangle of side s about its centroid: apex at s/√3, base at −s/(2√3).
    const sign = circuit.trefoilApex === 'down' ? -1 : 1;
    const apex = s / Math.sqrt(3);
    const base = -s / (2 * Math.sqrt(3));
    return [
      { dx: -s / 2, dy: sign * base, position: 'trefoil' },
      { dx: s / 2, dy: sign * base, position: 'trefoil' },
      { dx: 0, dy: sign * apex, position: 'trefoil' },
    ];
  }
  const offsets = n === 2 ? [-s / 2, s / 2] : [-s, 0, s];
  const roles: CablePosition[] = n === 2 ? ['pair', 'pair'] : ['flat-outer', 'flat-centre', 'flat-outer'];
  // A vertical row runs downward from the top cable.
  return offsets.map((o, i) =>
    circuit.formation === 'flat-vertical' ? { dx: 0, dy: -o, position: roles[i] } : { dx: o, dy: 0, position: roles[i] },
  );
}

/**
 * Cable centres of an arrangement WITHOUT checking it (the schema's refinement uses this to find
 * overlaps and cables above ground). Call `layoutArrangement` from ./arrangementSchema for
 * anything that comes from a user.
 */
export function placeCables(arrangement: Arrangement): ArrangementLayout {
  const placement = arrangement.placement;
  const originY = placement.kind === 'air' ? 0 : -placement.depthM;
  const cables: PlacedCable[] = [];
  const circuitCentres: Array<{ xM: number; yM: number }> = [];
  const circuitAxisSpacingM: Array<number | null> = [];
  arrangement.circuits.forEach((circuit, c) => {
    const step = c * (arrangement.circuitSpacing?.axisSpacingM ?? 0);
    const vertical = arrangement.circuitSpacing?.direction === 'vertical';
    const centre = { xM: vertical ? 0 : step, yM: vertical ? originY - step : originY };
    const s = axisSpacingOf(circuit, placement);
    circuitCentres.push(centre);
    circuitAxisSpacingM.push(s);
    circuitPattern(circuit, s).forEach((p, index) => {
      cables.push({
        circuit: c,
        index,
        position: p.position,
        xM: centre.xM + p.dx,
        yM: centre.yM + p.dy,
        externalDiameterM: circuit.externalDiameterM,
        envelopeDiameterM: envelopeDiameterOf(circuit, placement),
      });
    });
  });
  return { cables, circuitCentres, circuitAxisSpacingM, placement };
}

export interface ArrangementIssue {
  /** Path of the offending field, as zod spells it (e.g. ['circuits', 1, 'axisSpacingM']). */
  path: Array<string | number>;
  message: string;
}

/** Relative slack for "touching": touching cables must not be refused for rounding. */
const TOUCH_TOLERANCE = 1e-9;

/**
 * The geometric rules a valid arrangement must meet (the field-level ranges are in the schema):
 * spacing given where required, no two cables (or ducts) overlapping, cables fitting their ducts,
 * nothing above the ground surface, every cable inside its backfill.
 */
export function arrangementGeometryIssues(arrangement: Arrangement): ArrangementIssue[] {
  const issues: ArrangementIssue[] = [];
  const placement = arrangement.placement;
  const duct = ductOf(placement);
  const ductPath = ['placement', 'duct'];

  if (arrangement.circuits.length > 1 && !arrangement.circuitSpacing) {
    issues.push({ path: ['circuitSpacing'], message: 'Give the spacing between circuits when there is more than one circuit' });
  }
  if (duct) {
    if (!(duct.outerDiameterM > duct.innerDiameterM)) {
      issues.push({ path: [...ductPath, 'outerDiameterM'], message: 'Duct outer diameter must be larger than its inner diameter' });
    }
  }
  arrangement.circuits.forEach((circuit, c) => {
    if (circuit.formation === 'trefoil' && circuit.cableCount !== undefined && circuit.cableCount !== 3) {
      issues.push({ path: ['circuits', c, 'cableCount'], message: 'A trefoil has three cables' });
    }
    if (duct && !(circuit.externalDiameterM < duct.innerDiameterM)) {
      issues.push({ path: [...ductPath, 'innerDiameterM'], message: `Circuit ${c + 1}: the cable (D_e ${fmtMm(circuit.externalDiameterM)}) does not fit the duct` });
    }
    if (cableCountOf(circuit) > 1 && circuit.spacing === 'spaced') {
      const s = circuit.axisSpacingM;
      const envelope = envelopeDiameterOf(circuit, placement);
      if (s === undefined || !(s > 0)) {
        issues.push({ path: ['circuits', c, 'axisSpacingM'], message: 'Spaced cables need an axis-to-axis spacing greater than zero' });
      } else if (s < envelope * (1 - TOUCH_TOLERANCE)) {
        issues.push({
          path: ['circuits', c, 'axisSpacingM'],
          message: `Cables overlap: axis spacing ${fmtMm(s)} is less than the ${duct ? 'duct' : 'cable'} diameter ${fmtMm(envelope)}`,
        });
      }
    }
  });
  if (arrangement.circuitSpacing && !(arrangement.circuitSpacing.axisSpacingM > 0) && arrangement.circuits.length > 1) {
    issues.push({ path: ['circuitSpacing', 'axisSpacingM'], message: 'Circuits need a spacing greater than zero' });
  }
  // Positions only make sense once each circuit's own spacing is valid.
  if (issues.length > 0) return issues;

  const layout = placeCables(arrangement);
  const overlapReported = new Set<number>();
  for (let a = 0; a < layout.cables.length; a++) {
    for (let b = a + 1; b < layout.cables.length; b++) {
      const p = layout.cables[a];
      const q = layout.cables[b];
      if (p.circuit === q.circuit) continue; // checked above from the circuit's own spacing
      const distance = Math.hypot(p.xM - q.xM, p.yM - q.yM);
      const minimum = (p.envelopeDiameterM + q.envelopeDiameterM) / 2;
      if (distance < minimum * (1 - TOUCH_TOLERANCE) && !overlapReported.has(q.circuit)) {
        overlapReported.add(q.circuit);
        issues.push({
          path: ['circuitSpacing', 'axisSpacingM'],
          message: `Circuit ${p.circuit + 1} and circuit ${q.circuit + 1} overlap: their cables are ${fmtMm(distance)} apart, centre to centre, and need at least ${fmtMm(minimum)}`,
        });
      }
    }
  }
  if (placement.kind !== 'air') {
    const highest = layout.cables.reduce((best, k) => (k.yM + k.envelopeDiameterM / 2 > best.yM + best.envelopeDiameterM / 2 ? k : best));
    const top = highest.yM + highest.envelopeDiameterM / 2;
    if (top > 0) {
      issues.push({
        path: ['placement', 'depthM'],
        message: `A cable of circuit ${highest.circuit + 1} reaches ${fmtMm(top)} above the ground surface; a buried cable must lie wholly below ground`,
      });
    }
  }
  if (placement.kind === 'backfill') {
    const bank = placement.bank;
    if (bank.centreDepthM - bank.heightM / 2 < 0) {
      issues.push({ path: ['placement', 'bank', 'centreDepthM'], message: 'The backfill reaches above the ground surface' });
    }
    const centreX = bank.centreXM ?? middleX(layout);
    const outside = layout.cables.find(
      (k) =>
        k.xM - k.envelopeDiameterM / 2 < centreX - bank.widthM / 2 - TOUCH_TOLERANCE ||
        k.xM + k.envelopeDiameterM / 2 > centreX + bank.widthM / 2 + TOUCH_TOLERANCE ||
        -k.yM - k.envelopeDiameterM / 2 < bank.centreDepthM - bank.heightM / 2 - TOUCH_TOLERANCE ||
        -k.yM + k.envelopeDiameterM / 2 > bank.centreDepthM + bank.heightM / 2 + TOUCH_TOLERANCE,
    );
    if (outside) {
      issues.push({
        path: ['placement', 'bank'],
        message: `A cable of circuit ${outside.circuit + 1} lies partly outside the backfill; every cable must lie inside it`,
      });
    }
  }
  return issues;
}

/** Horizontal middle of all cable centres (where a backfill is centred by default). */
export function middleX(layout: ArrangementLayout): number {
  const xs = layout.cables.map((k) => k.xM);
  return (Math.min(...xs) + Math.max(...xs)) / 2;
}

function fmtMm(valueM: number): string {
  return `${(valueM * 1000).toPrecision(4)} mm`;
}

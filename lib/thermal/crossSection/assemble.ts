/**
 * Mesh and assembly of the cross-section: grid → materials → which cells are each cable's →
 * diffusion terms of every face (with nodes on the circles where a face's grid line crosses one,
 * circles.ts) → boundary terms → fixed sources. The result is the symmetric conductance matrix
 * K over the cells and the circle nodes, and each cable's circle nodes with their weights —
 * independent of the currents, so one prepared problem solves at many currents (physics.md §12).
 *
 * Unknowns are temperature rises above a reference T_ref = the lower of the surface (or air) and
 * the deep-ground temperature, so every boundary and source term on the right-hand side is ≥ 0;
 * solve.ts relies on that for its runaway test.
 *
 * Energy: every conductance adds +G to both its nodes' diagonals and −G between them, so the
 * heat one node loses is exactly what the other gains; a cable's heat goes onto its circle nodes
 * in weights that add up to one. The discrete balance closes to the accuracy of the linear solve.
 */
import { cellOwners, chord, circleAxes, trapezoidShares } from './circles';
import { centresOf, gradedFaces, type AxisSpec, type SizeTarget } from './grid';
import { ConductanceCollector, type Csr } from './sparse';
import { boundaryConductance, faceConductance, lineSourceShares, rectangleSourceShares, type BoundaryTerm } from './terms';
import type { NormalizedCrossSection } from './validate';

export interface BoundaryFaces {
  /** Node next to each boundary face (a cell, or a circle node for a cable cell on the boundary). */
  node: Int32Array;
  conductance: Float64Array;
  temperatureC: number;
}

/** A cable's nodes on its circle (circles.ts). */
export interface CableCoupling {
  /** Unknowns of the circle nodes. */
  nodes: Int32Array;
  /** Trapezoid weight of each (Σ = 1). */
  share: Float64Array;
  /** Angle of each around the centre, radians (x across, depth down). */
  angle: Float64Array;
}

export interface CrossSectionSystem {
  problem: NormalizedCrossSection;
  nx: number;
  ny: number;
  xFaces: Float64Array;
  yFaces: Float64Array;
  xc: Float64Array;
  yc: Float64Array;
  /** W/(m·K) per cell */
  conductivity: Float64Array;
  /** −1 for a soil cell, else the cable whose circle holds the cell's centre. */
  owner: Int32Array;
  /** Cells first (unknown = cell index), circle nodes after. */
  n: number;
  cells: number;
  /** K: conduction and boundary conductances, W/(K·m). */
  matrix: Csr;
  couplings: CableCoupling[];
  top: BoundaryFaces;
  bottom: BoundaryFaces;
  referenceC: number;
  /** Right-hand side of the boundaries, W/m: G·(T_B − T_ref). */
  boundaryRhs: Float64Array;
  /** Fixed heat sources per unknown, W/m. */
  fixedSources: Float64Array;
  fixedSourceTotalW: number;
  cellsInCable: number[];
}

function axisTargets(problem: NormalizedCrossSection, axis: 'x' | 'y'): SizeTarget[] {
  const targets: SizeTarget[] = problem.cables.map((c) => ({
    centre: axis === 'x' ? c.x : c.depth,
    halfWidth: 1.5 * c.radius,
    size: (2 * c.radius) / problem.mesh.cellsAcrossCable,
  }));
  for (const s of problem.sources) {
    if (s.kind === 'line') targets.push({ centre: axis === 'x' ? s.x : s.depth, halfWidth: 0, size: problem.mesh.sourceCell });
  }
  return targets;
}

export function buildAxes(problem: NormalizedCrossSection): { xFaces: Float64Array; yFaces: Float64Array } {
  const xBreaks: number[] = [];
  const yBreaks: number[] = [];
  for (const r of problem.regions) {
    xBreaks.push(r.xMin, r.xMax);
    yBreaks.push(r.top, r.bottom);
  }
  const common = { growthRatio: problem.mesh.growthRatio, maxCell: problem.mesh.maxCell, refinement: problem.mesh.refinement };
  const xSpec: AxisSpec = { lo: problem.xLeft, hi: problem.xRight, breakpoints: xBreaks, targets: axisTargets(problem, 'x'), ...common };
  const ySpec: AxisSpec = { lo: 0, hi: problem.depth, breakpoints: yBreaks, targets: axisTargets(problem, 'y'), ...common };
  return { xFaces: gradedFaces(xSpec), yFaces: gradedFaces(ySpec) };
}

function cellConductivities(problem: NormalizedCrossSection, xc: Float64Array, yc: Float64Array): Float64Array {
  const nx = xc.length;
  const k = new Float64Array(nx * yc.length).fill(problem.soilConductivity);
  // Region edges are faces, so a cell lies wholly in a region or wholly outside it.
  for (const r of problem.regions) {
    for (let j = 0; j < yc.length; j++) {
      if (yc[j] < r.top || yc[j] > r.bottom) continue;
      for (let i = 0; i < nx; i++) if (xc[i] >= r.xMin && xc[i] <= r.xMax) k[j * nx + i] = r.conductivity;
    }
  }
  return k;
}

/** A point where a grid segment crosses a circle. */
interface Crossing {
  cable: number;
  position: number;
}

/** Crossings on the segment from a node (owner oa) to a node (owner ob), in order along the axis. */
function crossings(problem: NormalizedCrossSection, axis: 'x' | 'y', oa: number, ob: number, across: number): Crossing[] {
  if (oa === ob) return [];
  const out: Crossing[] = [];
  const root = (c: number, upper: boolean): number => {
    const cable = problem.cables[c];
    const { along, across: centreAcross } = circleAxes(cable, axis);
    const r = chord(along, centreAcross, cable.radius, across);
    return upper ? r.upper : r.lower;
  };
  if (oa >= 0) out.push({ cable: oa, position: root(oa, true) });
  if (ob >= 0) out.push({ cable: ob, position: root(ob, false) });
  if (out.length === 2 && out[1].position < out[0].position) {
    // Touching circles: both crossings at (about) the contact point; keep them in order.
    const mid = 0.5 * (out[0].position + out[1].position);
    out[0].position = mid;
    out[1].position = mid;
  }
  return out;
}

export function assemble(problem: NormalizedCrossSection): CrossSectionSystem {
  const { xFaces, yFaces } = buildAxes(problem);
  const xc = centresOf(xFaces);
  const yc = centresOf(yFaces);
  const nx = xc.length;
  const ny = yc.length;
  const cells = nx * ny;
  const conductivity = cellConductivities(problem, xc, yc);
  const owner = cellOwners(problem.cables, xc, yc);
  const m = problem.cables.length;
  const cellsInCable = new Array<number>(m).fill(0);
  for (let cell = 0; cell < cells; cell++) if (owner[cell] >= 0) cellsInCable[owner[cell]]++;
  cellsInCable.forEach((count, c) => {
    if (count === 0) throw new Error(`cables[${c}]: no cell centre lies inside its circle; the mesh is too coarse`);
  });

  const k = new ConductanceCollector(cells + 16 * m * problem.mesh.cellsAcrossCable * problem.mesh.refinement, 2 * cells);
  let n = cells;
  const circleNodes = problem.cables.map(() => ({ nodes: [] as number[], angles: [] as number[] }));
  const addCircleNode = (c: number, x: number, y: number): number => {
    const cable = problem.cables[c];
    circleNodes[c].nodes.push(n);
    circleNodes[c].angles.push(Math.atan2(y - cable.depth, x - cable.x));
    return n++;
  };
  const point = (axis: 'x' | 'y', along: number, across: number): [number, number] => (axis === 'x' ? [along, across] : [across, along]);

  /**
   * The diffusion term of the face between cells a (low side) and b (high side) along `axis`:
   * one conductance, or a chain through the circle nodes where the segment crosses a circle.
   */
  const face = (axis: 'x' | 'y', a: number, b: number, nodeA: number, nodeB: number, facePos: number, across: number, length: number): void => {
    const spacing = nodeB - nodeA;
    const piece = (from: number, to: number) =>
      faceConductance(length, { start: from, end: to, face: facePos, kStart: conductivity[a], kEnd: conductivity[b], spacing });
    let previousNode = a;
    let previousPos = nodeA;
    for (const x of crossings(problem, axis, owner[a], owner[b], across)) {
      const [px, py] = point(axis, x.position, across);
      const node = addCircleNode(x.cable, px, py);
      k.connect(previousNode, node, piece(previousPos, x.position));
      previousNode = node;
      previousPos = x.position;
    }
    k.connect(previousNode, b, piece(previousPos, nodeB));
  };

  for (let j = 0; j < ny; j++) {
    const length = yFaces[j + 1] - yFaces[j];
    for (let i = 0; i + 1 < nx; i++) face('x', j * nx + i, j * nx + i + 1, xc[i], xc[i + 1], xFaces[i + 1], yc[j], length);
  }
  for (let j = 0; j + 1 < ny; j++) {
    for (let i = 0; i < nx; i++) face('y', j * nx + i, (j + 1) * nx + i, yc[j], yc[j + 1], yFaces[j + 1], xc[i], xFaces[i + 1] - xFaces[i]);
  }

  // Boundary terms: ground surface (row 0) and deep ground (last row); the sides are adiabatic.
  const topC = problem.surface.kind === 'isothermal' ? problem.surface.temperature : problem.surface.air;
  const referenceC = Math.min(topC, problem.deepGround);
  const surfaceTerm: BoundaryTerm =
    problem.surface.kind === 'isothermal'
      ? { kind: 'temperature', temperatureC: problem.surface.temperature }
      : { kind: 'convective', airC: problem.surface.air, h: problem.surface.h };
  const boundaryPairs: Array<{ node: number; conductance: number; rise: number }> = [];
  const boundaryRow = (side: 'top' | 'bottom', j: number, faceDepth: number, term: BoundaryTerm): BoundaryFaces => {
    const nodes = new Int32Array(nx);
    const conductances = new Float64Array(nx);
    const temperatureC = term.kind === 'convective' ? term.airC : term.temperatureC;
    for (let i = 0; i < nx; i++) {
      const cell = j * nx + i;
      const length = xFaces[i + 1] - xFaces[i];
      const spacing = 2 * Math.abs(faceDepth - yc[j]);
      let node = cell;
      let start = yc[j];
      if (owner[cell] >= 0) {
        // A cable cell on the boundary row: the path to the boundary leaves its circle first.
        const cable = problem.cables[owner[cell]];
        const r = chord(cable.depth, cable.x, cable.radius, xc[i]);
        const crossing = side === 'top' ? r.lower : r.upper;
        node = addCircleNode(owner[cell], xc[i], crossing);
        k.connect(cell, node, faceConductance(length, { start: Math.min(start, crossing), end: Math.max(start, crossing), face: faceDepth, kStart: conductivity[cell], kEnd: conductivity[cell], spacing }));
        start = crossing;
      }
      const b = boundaryConductance(length, Math.abs(faceDepth - start), spacing, conductivity[cell], term);
      nodes[i] = node;
      conductances[i] = b.conductance;
      k.ground(node, b.conductance);
      boundaryPairs.push({ node, conductance: b.conductance, rise: b.temperatureC - referenceC });
    }
    return { node: nodes, conductance: conductances, temperatureC };
  };
  const top = boundaryRow('top', 0, 0, surfaceTerm);
  const bottom = boundaryRow('bottom', ny - 1, problem.depth, { kind: 'temperature', temperatureC: problem.deepGround });

  const boundaryRhs = new Float64Array(n);
  for (const p of boundaryPairs) boundaryRhs[p.node] += p.conductance * p.rise;

  const couplings: CableCoupling[] = circleNodes.map((c) => ({
    nodes: Int32Array.from(c.nodes),
    share: trapezoidShares(c.angles),
    angle: Float64Array.from(c.angles),
  }));

  // Fixed sources (the circles hold soil, so a source may lie anywhere but on a cable).
  const fixedSources = new Float64Array(n);
  let fixedSourceTotalW = 0;
  for (const s of problem.sources) {
    const shares = s.kind === 'line' ? lineSourceShares(xc, yc, s.x, s.depth) : rectangleSourceShares(xFaces, yFaces, s);
    for (const sh of shares) fixedSources[sh.j * nx + sh.i] += s.watts * sh.weight;
    fixedSourceTotalW += s.watts;
  }

  const collector = k;
  return {
    problem,
    nx,
    ny,
    xFaces,
    yFaces,
    xc,
    yc,
    conductivity,
    owner,
    n,
    cells,
    matrix: collector.build(n),
    couplings,
    top,
    bottom,
    referenceC,
    boundaryRhs,
    fixedSources,
    fixedSourceTotalW,
    cellsInCable,
  };
}

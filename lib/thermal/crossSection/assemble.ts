/**
 * Mesh and assembly of the cross-section: grid → materials → which cells form each cable →
 * diffusion terms of every face → boundary terms → fixed sources. The result is the symmetric
 * conductance matrix K (soil cells plus one node per cable circle), independent of the currents,
 * so one prepared problem solves at many currents (physics.md §12).
 *
 * Unknowns are temperature rises above a reference T_ref = the lower of the surface (or air) and
 * the deep-ground temperature, so every boundary and source term on the right-hand side is ≥ 0;
 * solve.ts relies on that for its runaway test.
 *
 * Energy: every face adds +G to both nodes' diagonals and −G between them, so the heat one node
 * loses through a face is exactly the heat the other gains, and a cable's heat, put on its node,
 * enters the soil through its cut faces without loss or gain: the discrete balance closes to
 * the accuracy of the linear solve.
 */
import { cellOwners, chord, circleAxes } from './circles';
import { centresOf, gradedFaces, type AxisSpec, type SizeTarget } from './grid';
import { ConductanceCollector, type Csr } from './sparse';
import { boundaryConductance, faceConductance, lineSourceShares, rectangleSourceShares, type BoundaryTerm } from './terms';
import type { NormalizedCrossSection } from './validate';

export interface BoundaryFaces {
  node: Int32Array;
  conductance: Float64Array;
  temperatureC: number;
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
  owner: Int32Array;
  /** Unknown of each cell: its own for soil, its cable's node inside a circle. */
  unknownOfCell: Int32Array;
  soilUnknowns: number;
  /** soil unknowns + cables */
  n: number;
  /** K: conduction and boundary conductances, W/(K·m). */
  matrix: Csr;
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

/** Start of a soil path leaving the cell: its centre, or where its line leaves the owning circle. */
function pathStart(problem: NormalizedCrossSection, owner: number, axis: 'x' | 'y', node: number, across: number, towardsHigher: boolean): number {
  if (owner < 0) return node;
  const cable = problem.cables[owner];
  const { along, across: centreAcross } = circleAxes(cable, axis);
  const roots = chord(along, centreAcross, cable.radius, across);
  return towardsHigher ? roots.upper : roots.lower;
}

export function assemble(problem: NormalizedCrossSection): CrossSectionSystem {
  const { xFaces, yFaces } = buildAxes(problem);
  const xc = centresOf(xFaces);
  const yc = centresOf(yFaces);
  const nx = xc.length;
  const ny = yc.length;
  const conductivity = cellConductivities(problem, xc, yc);
  const owner = cellOwners(problem.cables, xc, yc);

  const m = problem.cables.length;
  const unknownOfCell = new Int32Array(nx * ny);
  let soil = 0;
  for (let cell = 0; cell < nx * ny; cell++) if (owner[cell] < 0) unknownOfCell[cell] = soil++;
  const cellsInCable = new Array<number>(m).fill(0);
  for (let cell = 0; cell < nx * ny; cell++) {
    if (owner[cell] >= 0) {
      unknownOfCell[cell] = soil + owner[cell];
      cellsInCable[owner[cell]]++;
    }
  }
  cellsInCable.forEach((count, c) => {
    if (count === 0) throw new Error(`cables[${c}]: no cell centre lies inside its circle; the mesh is too coarse`);
  });
  const n = soil + m;
  const k = new ConductanceCollector(n, 2 * nx * ny);

  // Diffusion terms, faces across (x) then down (depth).
  for (let j = 0; j < ny; j++) {
    const length = yFaces[j + 1] - yFaces[j];
    for (let i = 0; i + 1 < nx; i++) {
      const a = j * nx + i;
      const b = a + 1;
      if (owner[a] >= 0 && owner[a] === owner[b]) continue;
      const start = pathStart(problem, owner[a], 'x', xc[i], yc[j], true);
      const end = pathStart(problem, owner[b], 'x', xc[i + 1], yc[j], false);
      const g = faceConductance(length, { start, end, face: xFaces[i + 1], kStart: conductivity[a], kEnd: conductivity[b], spacing: xc[i + 1] - xc[i] });
      k.connect(unknownOfCell[a], unknownOfCell[b], g);
    }
  }
  for (let j = 0; j + 1 < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const a = j * nx + i;
      const b = a + nx;
      if (owner[a] >= 0 && owner[a] === owner[b]) continue;
      const length = xFaces[i + 1] - xFaces[i];
      const start = pathStart(problem, owner[a], 'y', yc[j], xc[i], true);
      const end = pathStart(problem, owner[b], 'y', yc[j + 1], xc[i], false);
      const g = faceConductance(length, { start, end, face: yFaces[j + 1], kStart: conductivity[a], kEnd: conductivity[b], spacing: yc[j + 1] - yc[j] });
      k.connect(unknownOfCell[a], unknownOfCell[b], g);
    }
  }

  // Boundary terms: ground surface (row 0) and deep ground (last row); the sides are adiabatic.
  const surfaceTerm: BoundaryTerm =
    problem.surface.kind === 'isothermal'
      ? { kind: 'temperature', temperatureC: problem.surface.temperature }
      : { kind: 'convective', airC: problem.surface.air, h: problem.surface.h };
  const topC = problem.surface.kind === 'isothermal' ? problem.surface.temperature : problem.surface.air;
  const referenceC = Math.min(topC, problem.deepGround);
  const boundaryRhs = new Float64Array(n);
  const boundaryRow = (j: number, faceDepth: number, term: BoundaryTerm, towardsHigher: boolean): BoundaryFaces => {
    const node = new Int32Array(nx);
    const conductance = new Float64Array(nx);
    let temperatureC = 0;
    for (let i = 0; i < nx; i++) {
      const cell = j * nx + i;
      const start = pathStart(problem, owner[cell], 'y', yc[j], xc[i], towardsHigher);
      const b = boundaryConductance(xFaces[i + 1] - xFaces[i], Math.abs(faceDepth - start), 2 * Math.abs(faceDepth - yc[j]), conductivity[cell], term);
      node[i] = unknownOfCell[cell];
      conductance[i] = b.conductance;
      temperatureC = b.temperatureC;
      k.ground(node[i], b.conductance);
      boundaryRhs[node[i]] += b.conductance * (b.temperatureC - referenceC);
    }
    return { node, conductance, temperatureC };
  };
  const top = boundaryRow(0, 0, surfaceTerm, false);
  const bottom = boundaryRow(ny - 1, problem.depth, { kind: 'temperature', temperatureC: problem.deepGround }, true);

  // Fixed sources.
  const fixedSources = new Float64Array(n);
  let fixedSourceTotalW = 0;
  for (const s of problem.sources) {
    const shares = s.kind === 'line' ? lineSourceShares(xc, yc, s.x, s.depth) : rectangleSourceShares(xFaces, yFaces, s);
    let soilWeight = 0;
    for (const sh of shares) if (owner[sh.j * nx + sh.i] < 0) soilWeight += sh.weight;
    for (const sh of shares) {
      const cell = sh.j * nx + sh.i;
      // A line source next to a circle whose neighbour centre falls inside it keeps its heat in
      // the soil (weights renormalised); a rectangle's corner share in a cable cell goes to that
      // cable's node. Either way the total is exactly W.
      if (s.kind === 'line' && soilWeight > 0) {
        if (owner[cell] < 0) fixedSources[unknownOfCell[cell]] += (s.watts * sh.weight) / soilWeight;
      } else {
        fixedSources[unknownOfCell[cell]] += s.watts * sh.weight;
      }
    }
    fixedSourceTotalW += s.watts;
  }

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
    unknownOfCell,
    soilUnknowns: soil,
    n,
    matrix: k.build(),
    top,
    bottom,
    referenceC,
    boundaryRhs,
    fixedSources,
    fixedSourceTotalW,
    cellsInCable,
  };
}

/**
 * The temperatures a solve measures from and starts at.
 *
 * The unknowns are rises θ = T − T_ref above a reference temperature (the ambient the heat is
 * finally given to), so that a rise of 1e-9 K keeps its digits instead of drowning in the 1e-14
 * relative round-off of a temperature near 300; the equations are unchanged by the shift.
 */
import type { NormalizedBoundary, NormalizedProblem } from './normalized';

/** Where none of the boundaries names a temperature (flux and symmetry only), °C. */
const FALLBACK_REFERENCE_C = 20;

/** The temperature a boundary refers its heat to (its air or its fixed value); none for flux or symmetry. */
export function boundaryTemperature(b: NormalizedBoundary): number | undefined {
  if (b.kind === 'temperature') return b.value;
  if (b.kind === 'surface') return b.ambient;
  return undefined;
}

/**
 * The reference of a solve: the air a bar run loses its heat to sideways, else the outer
 * boundary's temperature, else the inner's.
 */
export function referenceTemperature(problem: NormalizedProblem): number {
  if (problem.sideways) return problem.sideways.surfaces[0].ambient;
  return boundaryTemperature(problem.outer) ?? boundaryTemperature(problem.inner) ?? FALLBACK_REFERENCE_C;
}

/** Starting temperature for a steady solve: the mean of the boundaries' temperatures. */
export function steadyStart(problem: NormalizedProblem): number {
  const a = boundaryTemperature(problem.inner);
  const b = boundaryTemperature(problem.outer);
  if (a !== undefined && b !== undefined) return 0.5 * (a + b);
  return a ?? b ?? FALLBACK_REFERENCE_C;
}

/**
 * The temperature of a body with no heat input (no source, no absorbed or imposed flux) whose
 * boundaries all refer to one temperature; undefined when anything drives heat.
 */
export function undrivenTemperature(problem: NormalizedProblem): number | undefined {
  const s = problem.source;
  if ((s.kind === 'uniform' && s.q !== 0) || (s.kind === 'joule' && s.current !== 0)) return undefined;
  if (problem.pointSources?.some((p) => p.heat !== 0)) return undefined;
  const refs: number[] = [];
  for (const b of [problem.inner, problem.outer]) {
    if (b.kind === 'flux' && b.value !== 0) return undefined;
    if (b.kind === 'temperature') refs.push(b.value);
    if (b.kind === 'surface') {
      if (b.absorbedFlux !== 0) return undefined;
      refs.push(b.ambient);
      if (b.emissivity > 0) refs.push(b.surroundings);
    }
  }
  return refs.length > 0 && refs.every((t) => t === refs[0]) ? refs[0] : undefined;
}

/**
 * Ampacity in the cross-section: the common current of the rated cables at which the governing
 * conductor (the first to reach its own limit, rated or not) reaches it. One prepared problem
 * (mesh, K, preconditioner) serves every solve of the search; each solve starts from the last.
 */
import { ThermalInputError } from '../errors';
import { findLimitCurrent } from './rootFinder';
import { prepareCrossSection, solvePrepared, type PreparedCrossSection } from './solve';
import type { CrossSectionConverged, CrossSectionInput } from './types';

export interface CrossSectionAmpacityOptions {
  /** Indices of the cables that carry the sought current (default: all). Others keep theirs. */
  ratedCables?: number[];
  /** Bracket width, A (default 0.1). */
  toleranceA?: number;
  /** First current tried, A (default: the largest current given to a rated cable, else 100 A). */
  guessA?: number;
  maxEvaluations?: number;
}

export interface CrossSectionAmpacity {
  /** A; the governing conductor is at or below its limit here. */
  currentA: number;
  /** A; above the limit (or no steady state) here. */
  upperA: number;
  /** True when the limit is reached even without current in the rated cables. */
  zero: boolean;
  governing: { index: number; name?: string };
  /** The solve at `currentA`. */
  result: CrossSectionConverged;
  evaluations: number;
}

export function crossSectionAmpacity(input: CrossSectionInput | unknown, options: CrossSectionAmpacityOptions = {}): CrossSectionAmpacity {
  return ampacityOfPrepared(prepareCrossSection(input), options);
}

export function ampacityOfPrepared(prepared: PreparedCrossSection, options: CrossSectionAmpacityOptions = {}): CrossSectionAmpacity {
  const cables = prepared.system.problem.cables;
  const rated = options.ratedCables ?? cables.map((_, i) => i);
  if (rated.length === 0) throw new ThermalInputError('ratedCables', 'must name at least one cable');
  rated.forEach((index, k) => {
    if (!Number.isInteger(index) || index < 0 || index >= cables.length) {
      throw new ThermalInputError(`ratedCables[${k}]`, `must be a cable index 0 … ${cables.length - 1}`);
    }
    if (cables[index].limit === undefined) {
      throw new ThermalInputError(`cables[${index}].maxConductorTemperatureC`, 'is needed for a cable whose ampacity is sought');
    }
  });
  const toleranceA = options.toleranceA ?? 0.1;
  if (!(toleranceA > 0)) throw new ThermalInputError('toleranceA', 'must be greater than zero');
  const givenMax = Math.max(0, ...rated.map((i) => cables[i].current));
  const guessA = options.guessA ?? (givenMax > 0 ? givenMax : 100);
  const ratedSet = new Set(rated);

  const root = findLimitCurrent<CrossSectionConverged>(
    (currentA) => {
      const currents = cables.map((c, i) => (ratedSet.has(i) ? currentA : c.current));
      const result = solvePrepared(prepared, { currentsA: currents });
      if (result.converged) return { kind: 'value', excessK: -result.governing!.marginK!, payload: result };
      if (result.status === 'runaway') return { kind: 'runaway' };
      throw new Error(`the cross-section solve failed at ${currentA} A: ${result.message}`);
    },
    { guessA, toleranceA, maxEvaluations: options.maxEvaluations ?? 60 },
  );
  const g = root.payload.governing!;
  return {
    currentA: root.currentA,
    upperA: root.upperA,
    zero: root.zero,
    governing: { index: g.index, ...(g.name !== undefined ? { name: g.name } : {}) },
    result: root.payload,
    evaluations: root.evaluations,
  };
}

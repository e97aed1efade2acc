/**
 * Optional check "Inside the enclosure" (physics.md §6): the air temperature inside a closed
 * enclosure from the losses released in it — the circuit's own Joule loss over the length it runs
 * inside plus the other equipment's losses — and the candidate's hot spot in that air.
 *
 * The conductor loss grows with the air temperature (R rises with temperature), and the air
 * temperature grows with the loss, so the two are solved together by fixed-point iteration:
 * air → steady evaluation at that ambient → loss → air. Starting from the air heated by the other
 * losses alone, the iterates rise monotonically to the fixed point when there is one; when there
 * is none (the conductor and the air heat each other without bound) the iteration says so.
 */
import { ENCLOSURE_WALL_COEFFICIENTS_W_PER_M2K, enclosureAirTemperature, type EnclosureFace, type EnclosureShape, type EnclosureWall } from '../../thermal';
import { ElectricalInputError } from '../errors';
import { FlagSet, fmt, type AssumptionFlag } from './flags';
import { designPointOnly, evaluateCandidate, evaluatePrepared, markWinners, type PreparedComparison } from './evaluate';
import { prepareConditions } from './prepareConditions';
import type { Candidate, CandidateEvaluationOk, Conditions } from './types';

export const ENCLOSURE_AIR_METHOD =
  'Wall heat transfer P = k·A_e·ΔT: effective cooling surface A_e with the IEC TR 60890 surface factors, k for the wall material (common practice, from memory)';

const MAX_ITERATIONS = 50;
const TOLERANCE_K = 0.01;

export interface EnclosureAirInputs {
  shape: EnclosureShape;
  wall: EnclosureWall;
  /** Air around the enclosure, °C. */
  outsideAirC: number;
  /** Route length of the circuit inside the enclosure, m (its loss heats the air). */
  routeLengthInsideM: number;
  /** Losses of the other equipment inside, W. */
  otherLossesW: number;
}

export interface EnclosureAirCheckResult {
  method: string;
  effectiveAreaM2: number;
  faces: EnclosureFace[];
  wallCoefficientWPerM2K: number;
  /** The circuit's own loss inside, W, at the converged air temperature. */
  conductorLossesW: number;
  otherLossesW: number;
  totalLossesW: number;
  outsideAirC: number;
  airRiseK: number;
  /** Mean air temperature inside, °C. */
  insideAirC: number;
  /** The ambient the steady evaluation of the sheet used, °C. */
  sheetAmbientC: number;
  /** The candidate's hot spot with the inside air as its ambient, °C (null: no steady state). */
  hotSpotC: number | null;
  limitC: number;
  passes: boolean;
  converged: boolean;
  iterations: number;
  flags: AssumptionFlag[];
}

function requirePositive(value: number, field: string, what: string) {
  if (!(Number.isFinite(value) && value >= 0)) throw new ElectricalInputError(field, `${what} must be zero or more`);
}

export function enclosureAirCheck(
  candidate: Candidate,
  conditions: Conditions,
  inputs: EnclosureAirInputs,
  /** The candidate's evaluation under `conditions` when the caller has it (saves evaluating it again). */
  evaluated?: CandidateEvaluationOk,
): EnclosureAirCheckResult {
  if (conditions.installation.kind === 'buried') throw new ElectricalInputError('conditions.installation', 'a buried circuit is not inside an enclosure');
  if (!(inputs.wall in ENCLOSURE_WALL_COEFFICIENTS_W_PER_M2K)) throw new ElectricalInputError('enclosure.wall', 'unknown wall material');
  requirePositive(inputs.routeLengthInsideM, 'enclosure.routeLengthInsideM', 'The route length inside the enclosure');
  requirePositive(inputs.otherLossesW, 'enclosure.otherLossesW', 'The other losses inside');
  if (!Number.isFinite(inputs.outsideAirC) || inputs.outsideAirC < -60 || inputs.outsideAirC > 100) {
    throw new ElectricalInputError('enclosure.outsideAirC', 'The air around the enclosure must be between −60 and 100 °C');
  }

  const sheetEvaluation = evaluated ?? evaluateCandidate(candidate, conditions);
  if (!sheetEvaluation.ok) throw new ElectricalInputError(sheetEvaluation.error.field ?? 'candidate', sheetEvaluation.error.message);
  const air = (lossesW: number) => enclosureAirTemperature({ ...inputs.shape, wall: inputs.wall, lossesW, outsideAirC: inputs.outsideAirC });

  let insideAirC = air(inputs.otherLossesW).insideAirC;
  let conductorLossesW = 0;
  let hotSpotC: number | null = null;
  let converged = false;
  let airAtLimit = false;
  let iterations = 0;
  const limitC = sheetEvaluation.limit.temperatureC;
  while (iterations < MAX_ITERATIONS) {
    // Air at the conductor's limit already fails it (the hot spot is never below its air), and the
    // iterates only rise: stop here rather than evaluate a conductor in impossible air.
    if (insideAirC >= limitC) {
      airAtLimit = true;
      break;
    }
    iterations++;
    // Only the design point at this air temperature: the ampacity is not needed inside the loop.
    const point = designPointOnly(candidate, { ...conditions, ambientC: insideAirC });
    hotSpotC = point.hotSpotC;
    if (point.lossWPerM === null || hotSpotC === null) break; // no steady state at this air temperature
    conductorLossesW = point.lossWPerM * inputs.routeLengthInsideM;
    const next = air(conductorLossesW + inputs.otherLossesW).insideAirC;
    const change = next - insideAirC;
    insideAirC = next;
    if (Math.abs(change) < TOLERANCE_K) {
      converged = true;
      break;
    }
  }
  if (converged) {
    // The hot spot at the final air temperature, not the one before it.
    hotSpotC = designPointOnly(candidate, { ...conditions, ambientC: insideAirC }).hotSpotC;
  }

  const result = air(conductorLossesW + inputs.otherLossesW);
  const passes = converged && hotSpotC !== null && hotSpotC <= limitC;
  const flags = new FlagSet();
  flags.add(
    'ENCLOSURE_AIR_ESTIMATED',
    `Mean inside air ${fmt(result.insideAirC)} °C from ${fmt(conductorLossesW + inputs.otherLossesW)} W over A_e = ${fmt(result.effectiveAreaM2)} m² at k = ${fmt(result.wallCoefficientWPerM2K)} W/(m²·K). Air near the roof runs warmer than this mean; sealed enclosure, no sun, no ventilation. Verify the assembly by IEC 61439-1 (temperature-rise verification) or IEC TR 60890.`,
  );
  if ((converged || airAtLimit) && result.insideAirC > sheetEvaluation.ambientC + TOLERANCE_K) {
    flags.add(
      'ENCLOSURE_AIR_ABOVE_AMBIENT',
      `The room is ${fmt(sheetEvaluation.ambientC)} °C, but the air inside is estimated at ${fmt(result.insideAirC)} °C; with this check on, the sheet's result is rated in the inside air.`,
    );
  }
  if (!passes) {
    flags.add(
      'ENCLOSURE_HOT_SPOT_OVER_LIMIT',
      airAtLimit
        ? `The air inside alone reaches ${fmt(insideAirC)} °C (and still rising with the conductor's loss), at or above the ${fmt(limitC)} °C limit.`
        : !converged || hotSpotC === null
        ? 'No steady state: the conductor and the air inside heat each other without bound at the design current.'
        : `In the estimated inside air of ${fmt(result.insideAirC)} °C the hot spot reaches ${fmt(hotSpotC)} °C, above the ${fmt(limitC)} °C limit (the enclosure derating of the sheet still applied, cautious).`,
    );
  }
  return {
    method: ENCLOSURE_AIR_METHOD,
    effectiveAreaM2: result.effectiveAreaM2,
    faces: result.faces,
    wallCoefficientWPerM2K: result.wallCoefficientWPerM2K,
    conductorLossesW,
    otherLossesW: inputs.otherLossesW,
    totalLossesW: conductorLossesW + inputs.otherLossesW,
    outsideAirC: inputs.outsideAirC,
    airRiseK: result.airRiseK,
    insideAirC: result.insideAirC,
    sheetAmbientC: sheetEvaluation.ambientC,
    hotSpotC: converged ? hotSpotC : null,
    limitC,
    passes,
    converged,
    iterations,
    flags: flags.list(),
  };
}

/**
 * The comparison as it stands inside the enclosure (issue 22): each candidate rated in the air its
 * own losses and the other equipment make inside, not in the room — so the headline result, its
 * ampacity, hot spot and verdict, are the enclosure's. Where the air and the conductor have no
 * steady state together, or the air alone reaches the limit, the room figures stay with a blocker
 * saying so. A candidate that cannot be evaluated stays as it was.
 */
export function rateInsideEnclosure(prepared: PreparedComparison, candidates: readonly Candidate[], conditions: Conditions, inputs: EnclosureAirInputs): PreparedComparison {
  const contexts = new Map(prepared.contexts);
  const evaluations = prepared.comparison.evaluations.map((e) => {
    if (!e.ok) return e;
    const candidate = candidates[e.index];
    let air: EnclosureAirCheckResult;
    try {
      air = enclosureAirCheck(candidate, conditions, inputs, e);
    } catch {
      return e; // the enclosure's own inputs are refused on the check's panel, naming the field
    }
    const estimated = air.flags.filter((f) => f.code === 'ENCLOSURE_AIR_ESTIMATED');
    if (!air.converged || air.hotSpotC === null) {
      const blocker = air.flags.filter((f) => f.code === 'ENCLOSURE_HOT_SPOT_OVER_LIMIT');
      return { ...e, flags: [...e.flags, ...estimated, ...blocker], passes: false, isSmallestPassing: false, isLowestLifeCycleCostPassing: false };
    }
    if (!(air.insideAirC > e.ambientC)) return { ...e, flags: [...e.flags, ...estimated] };
    const inside = evaluatePrepared(candidate, prepareConditions({ ...conditions, ambientC: air.insideAirC }), e.index);
    if (!inside.evaluation.ok) return inside.evaluation;
    if (inside.context) contexts.set(e.index, inside.context);
    const rated = new FlagSet();
    rated.add('ENCLOSURE_AIR_RATED', `Rated in the estimated air inside the enclosure, ${fmt(air.insideAirC)} °C (the room around it ${fmt(e.ambientC)} °C), from ${fmt(air.totalLossesW)} W released inside.`, {
      insideAirC: air.insideAirC,
      roomC: e.ambientC,
    });
    return { ...inside.evaluation, flags: [...inside.evaluation.flags, ...estimated, ...rated.list()] };
  });
  return { comparison: markWinners(evaluations), contexts };
}

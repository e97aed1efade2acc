/**
 * The answers of the calculation API, computed from a request body already read (server/http/body.ts):
 * the zod schema, the library, the numbers as the API sends them, and every error as the same JSON
 * the rest of /api/v1 answers. Pure of the request: it runs in the calculation thread
 * (./offThread.ts), never on the request thread, so a long calculation cannot hold up the server.
 */
import { ampacity, compareCandidates, ElectricalInputError, SizingError } from '@/lib/electrical';
import {
  API_CAUTION,
  API_VERSION,
  ampacityConditions,
  ampacityRequestSchema,
  evaluateRequestSchema,
  toDotPath,
  toWire,
  type AmpacityResponse,
  type EvaluateResponse,
} from '@/lib/api';
import { ApiError, errorResponse } from '@/server/http/errors';

export type CalculationEndpoint = 'evaluate' | 'ampacity';

/** An answer as it crosses back from the calculation thread: its HTTP status and JSON body. */
export interface CalculationAnswer {
  status: number;
  json: string;
}

export interface CalculationTask {
  endpoint: CalculationEndpoint;
  /** The parsed JSON body, not yet checked against the endpoint's schema. */
  body: unknown;
}

/** Maps the calculation library's own errors; everything else goes to the shared mapping. */
export function calculationErrorResponse(error: unknown, fieldPrefix?: { from: string; to: string }): Response {
  if (error instanceof ElectricalInputError) {
    let fieldPath = toDotPath(error.field);
    if (fieldPrefix && fieldPath.startsWith(fieldPrefix.from)) fieldPath = fieldPrefix.to + fieldPath.slice(fieldPrefix.from.length);
    const message = error.message.startsWith(`${error.field}: `) ? error.message.slice(error.field.length + 2) : error.message;
    return Response.json(
      { error: { code: 'invalid_input', message: `${fieldPath}: ${message}`, fieldPath, issues: [{ path: fieldPath, message }] } },
      { status: 400 },
    );
  }
  if (error instanceof SizingError) {
    return Response.json({ error: { code: error.code.toLowerCase(), message: error.message } }, { status: 422 });
  }
  return errorResponse(error);
}

/**
 * The JSON answer of a calculation route, through lib/api toWire: every number to nine significant
 * digits, and never a result holding NaN or ±Infinity (JSON would turn it into null, read as "no
 * value"). That happens only at the degenerate edge of a method — a limit a hair above the starting
 * temperature, say — so the caller gets 422 naming the value, and the server log keeps the case
 * for the library's authors.
 */
export function calculationJson(answer: object): CalculationAnswer {
  const wire = toWire(answer);
  if (wire.ok) return { status: 200, json: JSON.stringify(wire.value) };
  console.warn(`ampwarden: non-finite number in a calculation result at ${wire.path}`);
  throw new ApiError(
    422,
    'no_finite_result',
    `The calculation gave no finite value for ${wire.path}; the inputs lie at the edge of the method (for example a limit equal to the starting temperature). Check them.`,
  );
}

/** Candidates + conditions → one result per candidate with its flags, and the comparison. */
function evaluateAnswer(body: unknown): CalculationAnswer {
  const request = evaluateRequestSchema.parse(body);
  const comparison = compareCandidates(request.candidates, request.conditions);
  // A candidate refused by the library for its input (a rule that spans fields, such as a cable in
  // a bar installation) is the caller's error: answer 400 naming every such field.
  const invalid = comparison.evaluations.flatMap((evaluation) =>
    !evaluation.ok && evaluation.error.code === 'INVALID_INPUT'
      ? [
          {
            path: toDotPath(evaluation.error.field ?? `candidates[${evaluation.index}]`),
            message: evaluation.error.field && evaluation.error.message.startsWith(`${evaluation.error.field}: `)
              ? `${toDotPath(evaluation.error.field)}: ${evaluation.error.message.slice(evaluation.error.field.length + 2)}`
              : evaluation.error.message,
          },
        ]
      : [],
  );
  if (invalid.length > 0) {
    const error = { code: 'invalid_input', message: invalid[0].message, fieldPath: invalid[0].path, issues: invalid };
    return { status: 400, json: JSON.stringify({ error }) };
  }
  const answer: EvaluateResponse = { apiVersion: API_VERSION, caution: API_CAUTION, ...comparison };
  return calculationJson(answer);
}

/** One candidate + conditions → its ampacity, the profile at that current and the flags. */
function ampacityAnswer(body: unknown): CalculationAnswer {
  const request = ampacityRequestSchema.parse(body);
  const answer: AmpacityResponse = { apiVersion: API_VERSION, caution: API_CAUTION, ampacity: ampacity(request.candidate, ampacityConditions(request)) };
  return calculationJson(answer);
}

/** The endpoint's field names in the library's errors (the ampacity body names its one candidate `candidate`). */
const FIELD_PREFIX: Partial<Record<CalculationEndpoint, { from: string; to: string }>> = { ampacity: { from: 'candidates.0', to: 'candidate' } };

/** The answer to one calculation request: 200 with the result, or the error as JSON with its status. */
export async function answerCalculation(task: CalculationTask): Promise<CalculationAnswer> {
  try {
    return task.endpoint === 'evaluate' ? evaluateAnswer(task.body) : ampacityAnswer(task.body);
  } catch (error) {
    const response = calculationErrorResponse(error, FIELD_PREFIX[task.endpoint]);
    return { status: response.status, json: await response.text() };
  }
}

import { compareCandidates } from '@/lib/electrical';
import { API_CAUTION, API_VERSION, MAX_REQUEST_BYTES, evaluateRequestSchema, toDotPath, type EvaluateResponse } from '@/lib/api';
import { readJsonBody } from '@/server/apiTokens/body';
import { calculationJson, tokenApiHandler } from '@/server/apiTokens/handler';

export const dynamic = 'force-dynamic';

/** Candidates + conditions → one result per candidate with its flags, and the comparison. */
export const POST = tokenApiHandler({ scope: 'calc' }, async (req) => {
  const request = evaluateRequestSchema.parse(await readJsonBody(req, MAX_REQUEST_BYTES));
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
    return Response.json(
      { error: { code: 'invalid_input', message: invalid[0].message, fieldPath: invalid[0].path, issues: invalid } },
      { status: 400 },
    );
  }
  const answer: EvaluateResponse = { apiVersion: API_VERSION, caution: API_CAUTION, ...comparison };
  return calculationJson(answer);
});


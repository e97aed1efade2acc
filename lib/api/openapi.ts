/**
 * The OpenAPI 3.1 description of the calculation API, generated from the zod schemas with zod 4's
 * own JSON Schema generator (`z.toJSONSchema`, draft 2020-12 — the dialect OpenAPI 3.1 uses). Named
 * sub-schemas (`.meta({ id })`) become `components.schemas`, so the document and the validation
 * can never disagree.
 */
import { z } from 'zod';
import { API_VERSION, DEFAULT_REQUESTS_PER_MINUTE, MAX_CANDIDATES_PER_REQUEST, MAX_REQUEST_BYTES } from './limits';
import { ampacityRequestSchema, evaluateRequestSchema } from './schemas';
import { EXAMPLE_AMPACITY_REQUEST, EXAMPLE_BURIED_GROUP_REQUEST, EXAMPLE_BUSBAR_SYSTEM_REQUEST, EXAMPLE_EVALUATE_REQUEST } from './examples';
import { ampacityResponseSchema, errorResponseSchema, evaluateResponseSchema, flagsResponseSchema } from './responses';
import { WIRE_SIGNIFICANT_DIGITS } from './finite';

type JsonObject = Record<string, unknown>;

/** Converts one schema; its named parts are hoisted into `components` and refs rewritten to point there. */
function convert(schema: z.ZodType, name: string, io: 'input' | 'output', components: JsonObject): JsonObject {
  const generated = z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'throw' }) as JsonObject;
  const rewrite = (value: unknown): unknown =>
    JSON.parse(JSON.stringify(value).replaceAll('"#/$defs/', '"#/components/schemas/'));
  const defs = (generated.$defs ?? {}) as Record<string, unknown>;
  for (const [id, def] of Object.entries(defs)) components[id] = rewrite(def);
  const { $schema: _schema, $defs: _defs, $id: _id, ...rest } = generated;
  void _schema;
  void _defs;
  void _id;
  // A schema that is itself named comes back as a bare $ref to its def.
  if (typeof rest.$ref === 'string' && Object.keys(rest).length === 1) return rewrite(rest) as JsonObject;
  components[name] = rewrite(rest);
  return { $ref: `#/components/schemas/${name}` };
}

function errorAnswers(ref: JsonObject, statuses: Record<string, string>): JsonObject {
  return Object.fromEntries(
    Object.entries(statuses).map(([status, description]) => [status, { description, content: { 'application/json': { schema: ref } } }]),
  );
}

export function buildOpenApiDocument(): JsonObject {
  const schemas: JsonObject = {};
  const evaluateRequest = convert(evaluateRequestSchema, 'EvaluateRequest', 'input', schemas);
  const ampacityRequest = convert(ampacityRequestSchema, 'AmpacityRequest', 'input', schemas);
  const evaluateResponse = convert(evaluateResponseSchema, 'EvaluateResponse', 'output', schemas);
  const ampacityResponse = convert(ampacityResponseSchema, 'AmpacityResponse', 'output', schemas);
  const flagsResponse = convert(flagsResponseSchema, 'FlagsResponse', 'output', schemas);
  const error = convert(errorResponseSchema, 'Error', 'output', schemas);

  const calcErrors = errorAnswers(error, {
    '400': 'The body is not valid JSON, or a field is wrong (fieldPath and issues name it).',
    '401': 'No API token, or an unknown, revoked or expired one.',
    '403': 'The token lacks the calc scope.',
    '413': `The body is larger than ${MAX_REQUEST_BYTES} bytes.`,
    '415': 'The body is not application/json.',
    '422': 'The inputs are valid but no honest answer exists (for example the heat balance has no steady state at any current).',
    '429': 'The token made too many requests this minute; Retry-After says when to try again.',
    '503': 'The database cannot be reached just now (tokens are checked there); try again shortly.',
  });
  const security = [{ apiToken: [] }];

  return {
    openapi: '3.1.0',
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    info: {
      title: 'Ampwarden calculation API',
      version: API_VERSION,
      description: [
        'Size bus bars and cables by their heating from your own tools: the same heat-balance solver, flags and checks as the Ampwarden sizing sheet.',
        `All quantities are SI (A, V, m, mm², °C, K·m/W, Ω/m); the unit is part of every field name. Numbers in answers carry ${WIRE_SIGNIFICANT_DIGITS} significant digits.`,
        `Authenticate with a team API token (Authorization: Bearer …) that an admin creates; the calc scope is needed for calculations. Each token has its own rate limit (default ${DEFAULT_REQUESTS_PER_MINUTE} requests per minute).`,
        `At most ${MAX_CANDIDATES_PER_REQUEST} candidates per evaluation and ${MAX_REQUEST_BYTES} bytes per body.`,
        'Every answer carries the assumption flags and a caution: results are an engineering aid and must be checked and signed by a qualified, licensed engineer.',
      ].join('\n\n'),
    },
    servers: [{ url: '/' }],
    security,
    paths: {
      '/api/v1/evaluate': {
        post: {
          operationId: 'evaluateCandidates',
          summary: 'Evaluate candidates at the design current and compare them',
          description:
            'For each candidate: hot spot at the design current, governing limit and margin, ampacity, losses, voltage drop, short-circuit check, costs when prices are given, and the assumption flags. Bars in a described system (installation.system) are rated as the packs they form, bar by bar, and with the supports and a fault the IEC 60865-1 forces are checked (forces); with a protective device (conditions.protection) the overload coordination, automatic disconnection and protective conductor are checked (protection). Marks the smallest passing candidate and the passing one with the lowest life-cycle cost.',
          requestBody: {
            required: true,
            content: {
              'application/json': {
                schema: evaluateRequest,
                examples: {
                  cablesInAir: { summary: 'Two cable sizes in free air, flat and spaced', value: EXAMPLE_EVALUATE_REQUEST },
                  buriedBesideAnotherCircuit: {
                    summary: 'A buried flat circuit beside another circuit of the same cable',
                    value: EXAMPLE_BURIED_GROUP_REQUEST,
                  },
                  busbarSystemWithProtection: {
                    summary: 'Bar packs on edge with their supports (IEC 60865-1 forces) and the breaker protecting them (coordination, disconnection)',
                    value: EXAMPLE_BUSBAR_SYSTEM_REQUEST,
                  },
                },
              },
            },
          },
          responses: {
            '200': { description: 'One result per candidate, in order.', content: { 'application/json': { schema: evaluateResponse } } },
            ...calcErrors,
          },
          security,
        },
      },
      '/api/v1/ampacity': {
        post: {
          operationId: 'ampacity',
          summary: 'Ampacity of one candidate',
          description:
            'The circuit current per phase at which the hot spot (or a covering with a limit of its own) reaches its limit, to 0.1 A from below, with the heat-balance profile at that current and the closed-form cross-check.',
          requestBody: { required: true, content: { 'application/json': { schema: ampacityRequest, example: EXAMPLE_AMPACITY_REQUEST } } },
          responses: {
            '200': { description: 'The ampacity.', content: { 'application/json': { schema: ampacityResponse } } },
            ...calcErrors,
          },
          security,
        },
      },
      '/api/v1/flags': {
        get: {
          operationId: 'listFlags',
          summary: 'The assumption flags the calculations may raise',
          description: 'Codes are stable; each has one severity: note (shown), review (a reviewer must accept it), blocker (the candidate fails). Needs the read scope.',
          responses: {
            '200': { description: 'Every flag code.', content: { 'application/json': { schema: flagsResponse } } },
            ...errorAnswers(error, {
              '401': 'No API token, or an unknown, revoked or expired one.',
              '403': 'The token lacks the read scope.',
              '429': 'Too many requests this minute.',
              '503': 'The database cannot be reached just now.',
            }),
          },
          security,
        },
      },
      '/api/v1/openapi.json': {
        get: {
          operationId: 'openApiDocument',
          summary: 'This document',
          security: [],
          responses: { '200': { description: 'OpenAPI 3.1 description of the API.', content: { 'application/json': {} } } },
        },
      },
    },
    components: {
      securitySchemes: {
        apiToken: {
          type: 'http',
          scheme: 'bearer',
          description: 'A team API token, shown once when an admin creates it (Admin → API tokens). Scopes: read, calc.',
        },
      },
      schemas,
    },
  };
}
